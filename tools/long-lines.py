#!/usr/bin/env python3
"""Lists lines longer than the house limit (120 characters, counted as characters, not bytes).

Usage:
  tools/long-lines.py [--max N] [--list] [--ext cs,md,...] [PATH ...]

With no PATH, scans src/, tests/ and bench/ under the repository root. Prints one line per folder that holds long
lines ("count  longest  folder"), then the total. --list prints every long line as "file:line: N chars" instead
(the form an editor or the build's RCS0056 error points at). bin/ and obj/ are skipped. Exits 1 when a long line
was found, 0 otherwise.
"""
import argparse
import os
import sys
from collections import defaultdict

ROOT = os.path.dirname(os.path.dirname(os.path.abspath(__file__)))
SKIP = {"bin", "obj", ".git"}


def files(paths, exts):
    for p in paths:
        if os.path.isfile(p):
            yield p
            continue
        for d, subdirs, names in os.walk(p):
            subdirs[:] = sorted(s for s in subdirs if s not in SKIP)
            for n in sorted(names):
                if n.rsplit(".", 1)[-1] in exts:
                    yield os.path.join(d, n)


def main():
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("paths", nargs="*")
    ap.add_argument("--max", type=int, default=120)
    ap.add_argument("--list", action="store_true")
    ap.add_argument("--ext", default="cs")
    a = ap.parse_args()
    paths = a.paths or [os.path.join(ROOT, d) for d in ("src", "tests", "bench")]
    exts = set(a.ext.split(","))
    per_folder = defaultdict(lambda: [0, 0])
    total = 0
    for f in files(paths, exts):
        with open(f, encoding="utf-8") as fh:
            for i, line in enumerate(fh, 1):
                n = len(line.rstrip("\r\n"))
                if n > a.max:
                    total += 1
                    rel = os.path.relpath(f)
                    if a.list:
                        print(f"{rel}:{i}: {n} chars")
                    c = per_folder[os.path.dirname(rel)]
                    c[0] += 1
                    c[1] = max(c[1], n)
    if not a.list:
        for folder in sorted(per_folder):
            count, longest = per_folder[folder]
            print(f"{count:6d}  {longest:4d}  {folder}")
    sys.stdout.flush()
    print(f"{total} lines over {a.max} characters", file=sys.stderr if a.list else sys.stdout)
    return 1 if total else 0


if __name__ == "__main__":
    sys.exit(main())
