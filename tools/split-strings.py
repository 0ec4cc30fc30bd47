#!/usr/bin/env python3
"""Splits long C# string literals into concatenations of the same value, so the line keeps within the house limit.

Usage:
  tools/split-strings.py [--max N] FILE ...

For each line over the limit (characters), the regular ("...") or interpolated ($"...") literal that crosses the
limit is cut after a "\\n" escape near the limit, else at a space (or, failing one, anywhere outside an escape and
an interpolation hole), ending the line with `" +` and going on with `"` on the next line: at the literal's column
when the literal starts the line, else four spaces further in than the line. The parts of an interpolated literal
keep `$` only where they hold a hole. The value is the same ("a" + "b" is a constant where "ab" was). Verbatim and
raw literals are left alone, and so are literals shorter than 30 characters and lines of a list of literals
(break those at the commas). A long literal that follows other arguments first moves to a line of its own. Review the diff: this
is mechanical.
"""
import argparse
import sys


def literals(line):
    """(start, content_start, end, interpolated, hole_depth_at) for each regular or interpolated literal on a line."""
    out, i, n = [], 0, len(line)
    while i < n:
        c = line[i]
        if line.startswith("//", i):
            break
        if c == "'":
            j = i + 1
            while j < n and line[j] != "'":
                j += 2 if line[j] == "\\" else 1
            i = j + 1
            continue
        if c == '"':
            if line.startswith('"""', i):
                return out  # raw literal: leave the line
            interp = i > 0 and line[i - 1] == "$"
            verbatim = i > 0 and line[i - 1] == "@" or i > 1 and line[i - 2:i] in ("@$", "$@")
            start = i - 1 if interp else i
            j, depth, safe = i + 1, 0, set()
            while j < n:
                ch = line[j]
                if depth == 0 and not verbatim:
                    safe.add(j)
                if verbatim:
                    if ch == '"' and line.startswith('""', j):
                        j += 2
                        continue
                    if ch == '"':
                        break
                    j += 1
                    continue
                if interp and ch == "{":
                    if depth == 0 and line.startswith("{{", j):
                        j += 2
                        continue
                    depth += 1
                elif interp and ch == "}" and depth:
                    depth -= 1
                elif depth > 0 and ch == '"':
                    k = j + 1  # a literal nested in a hole
                    while k < n and line[k] != '"':
                        k += 2 if line[k] == "\\" else 1
                    j = k + 1
                    continue
                elif depth == 0 and ch == "\\":
                    j += 2
                    continue
                elif depth == 0 and interp and ch == "}" and line.startswith("}}", j):
                    j += 2
                    continue
                elif depth == 0 and ch == '"':
                    break
                j += 1
            if j >= n:
                return out
            if not verbatim:
                out.append((start, i + 1, j, interp, safe))
            i = j + 1
            continue
        i += 1
    return out


def prefix(interp, content):
    return "$" if interp and ("{" in content or "}" in content) else ""


def split(line, limit):
    """Returns the lines a long line becomes, or None when it has no literal to cut."""
    if len(line) <= limit:
        return None
    indent = len(line) - len(line.lstrip())
    if line.lstrip().startswith(('"', '$"')) and len(literals(line)) >= 3:
        return None  # a line of a list of literals: break it at its commas by hand
    found = [l for l in literals(line) if l[2] - l[1] >= 30 and l[0] < limit - 14]  # short ones: list items
    crossing = [l for l in found if l[0] < limit - 2 <= l[2]]
    if not crossing and not found:
        return None
    start, cstart, end, interp, safe = (crossing or found)[-1]
    before = line[:start].rstrip()
    if before.endswith(",") and start > indent + 24 and line[:start].strip():
        # An argument after others: it starts a line of its own first.
        tail = " " * (indent + 4) + line[start:]
        return [before] + (split(tail, limit) or [tail])
    lo, hi = cstart + 12, min(end - 1, limit - 3)  # cut c: line[:c] and '" +' within the limit
    if hi <= lo:
        return None
    cut = None
    for c in range(hi, max(lo, hi - 40), -1):  # after a "\\n" escape, when one is near the limit
        if c - 2 in safe and line[c - 2:c] == "\\n":
            cut = c
            break
    for c in range(hi, lo, -1):
        if cut is not None:
            break
        if c in safe and line[c - 1] == " ":
            cut = c
            break
    if cut is None:
        for c in range(hi, lo, -1):
            if c in safe and line[c - 1] != "\\" and line[c] not in "{}":
                cut = c
                break
    if cut is None:
        return None
    first_content = line[cstart:cut]
    rest_content = line[cut:end]
    cont = start if line[:start].strip() == "" else indent + 4
    head = line[:start] + prefix(interp, first_content) + '"' + first_content + '" +'
    tail = " " * cont + prefix(interp, rest_content) + '"' + rest_content + line[end:]
    more = split(tail, limit)
    return [head] + (more or [tail])


def main():
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("files", nargs="+")
    ap.add_argument("--max", type=int, default=120)
    a = ap.parse_args()
    for f in a.files:
        with open(f, encoding="utf-8", newline="") as fh:
            lines = fh.read().split("\n")
        out, changed, in_raw = [], 0, False
        for line in lines:
            # A line inside a multi-line raw string ("""...""") is text, not code: never split it.
            opens = line.count('"""') % 2 == 1
            new = None if in_raw or opens else split(line, a.max)
            in_raw ^= opens
            if new:
                changed += 1
                out += new
            else:
                out.append(line)
        if changed:
            print(f"{f}: {changed} line(s) split")
            with open(f, "w", encoding="utf-8", newline="") as fh:
                fh.write("\n".join(out))
    return 0


if __name__ == "__main__":
    sys.exit(main())
