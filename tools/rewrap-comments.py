#!/usr/bin/env python3
"""Re-wraps long `//` and `///` comment lines in C# files to the house limit (120 characters).

Usage:
  tools/rewrap-comments.py [--max N] [--check] PATH ...

Only lines longer than the limit change, with as little else as possible:
- A comment line (nothing but indentation and `//` or `///` before the text) is broken at the last space that keeps
  it within the limit; the words that do not fit are carried to the start of the next line when that line continues
  the same comment (same indentation and marker, not blank, not an XML tag or list item of its own), otherwise onto
  a new line after it. A line that grows past the limit by the carried words is broken again in the same way.
- A code line that ends with a `//` comment (outside strings) moves that comment onto its own line(s) above it, at
  the code's indentation, when the line is over the limit and the comment is what makes it so or the code alone
  fits; the code itself is left as it is.
- A one-line `/// <summary>...</summary>` becomes a block: `<summary>` and `</summary>` on lines of their own.
- Never breaks inside an XML tag (`<see cref="X"/>`) or a `code span`; a single word longer than the line stays
  whole. Lines inside raw strings (\"\"\") spanning lines are not touched.
Characters are counted as code points. --check prints what would change and exits 1 if anything would. Review the
diff after a run: the words are unchanged, only where lines break moves.
"""
import argparse
import os
import re
import sys

COMMENT = re.compile(r'^(?P<indent>[ \t]*)(?P<marker>///?)(?P<space> ?)(?P<text>.*)$')


def tokens(text):
    """Splits comment text into words at spaces that are outside <...> tags and `...` spans."""
    words, cur, depth, tick = [], "", 0, False
    for ch in text:
        if ch == "<" and not tick:
            depth += 1
        elif ch == ">" and depth and not tick:
            depth -= 1
        elif ch == "`":
            tick = not tick
        if ch == " " and depth == 0 and not tick:
            if cur:
                words.append(cur)
            cur = ""
        else:
            cur += ch
    if cur:
        words.append(cur)
    return words


def fill(prefix, words, limit):
    """Greedy fill: the longest first line within the limit, the rest of the words returned."""
    line = prefix
    used = 0
    for w in words:
        candidate = line + (" " if used else "") + w
        if len(candidate) > limit and used:
            break
        line = candidate
        used += 1
    return line, words[used:]


def continues(m, indent, marker):
    """Whether a comment line can take words carried from the line before it."""
    if not m or m.group("indent") != indent or m.group("marker") != marker:
        return False
    text = m.group("text").strip()
    if not text or text.startswith("<") or re.match(r"^([-*•]|\d+[.)])\s", text):
        return False
    return True


def code_end_comment(line):
    """Index of a trailing // comment outside strings and chars, or -1. Gives up (-1) on raw strings."""
    i, n = 0, len(line)
    while i < n:
        c = line[i]
        if line.startswith('"""', i):
            return -1
        if c == "/" and line.startswith("//", i):
            return i
        if c == "/" and line.startswith("/*", i):
            return -1
        if c == "'":
            j = i + 1
            while j < n and line[j] != "'":
                j += 2 if line[j] == "\\" else 1
            i = j + 1
            continue
        if c == '"':
            verbatim = i > 0 and line[i - 1] == "@" or i > 1 and line[i - 2:i] in ("@$", "$@")
            interpolated = i > 0 and line[i - 1] == "$" or i > 1 and line[i - 2:i] in ("@$", "$@")
            j, depth = i + 1, 0
            while j < n:
                ch = line[j]
                if interpolated and ch == "{":
                    if line.startswith("{{", j) and depth == 0:
                        j += 2
                        continue
                    depth += 1
                elif interpolated and ch == "}" and depth:
                    depth -= 1
                elif depth == 0 and not verbatim and ch == "\\":
                    j += 2
                    continue
                elif depth == 0 and ch == '"':
                    if verbatim and line.startswith('""', j):
                        j += 2
                        continue
                    break
                j += 1
            if j >= n:
                return -1  # a string that goes on past the line
            i = j + 1
            continue
        i += 1
    return -1


def rewrap(lines, limit):
    out = list(lines)
    i = 0
    changed = 0
    while i < len(out):
        line = out[i]
        if len(line) <= limit:
            i += 1
            continue
        m = COMMENT.match(line)
        if m:
            indent, marker = m.group("indent"), m.group("marker")
            prefix = indent + marker + " "
            summary = re.match(r"^<summary>(.*)</summary>$", m.group("text").strip())
            if marker == "///" and summary:
                # A one-line summary becomes a block: the tags on lines of their own, the text filled between them.
                new, words = [prefix + "<summary>"], tokens(summary.group(1))
                while words:
                    filled, words = fill(prefix, words, limit)
                    new.append(filled)
                out[i:i + 1] = new + [prefix + "</summary>"]
                changed += 1
                i += len(new) + 1
                continue
            words = tokens(m.group("text"))
            first, rest = fill(prefix, words, limit)
            if not rest:
                i += 1
                continue
            out[i] = first
            changed += 1
            j = i + 1
            nxt = COMMENT.match(out[j]) if j < len(out) else None
            if continues(nxt, indent, marker):
                out[j] = prefix + " ".join(rest + tokens(nxt.group("text")))
            else:
                out.insert(j, prefix + " ".join(rest))
            i += 1  # the next line is checked in its turn (it may now be long)
            continue
        at = code_end_comment(line)
        if at > 0 and line[:at].strip():
            code = line[:at].rstrip()
            comment = line[at:]
            indent = line[: len(line) - len(line.lstrip())]
            text = comment[2:].lstrip("/").strip()
            marker = "///" if comment.startswith("///") else "//"
            new, words = [], tokens(text)
            while words:
                filled, words = fill(indent + marker + " ", words, limit)
                new.append(filled)
            out[i:i + 1] = new + [code]
            changed += 1
            i += len(new) + 1  # the code line is left as it is, even if still long
            continue
        i += 1
    return out, changed


def raw_string_lines(lines):
    """Indexes of lines inside multi-line raw (\"\"\") or verbatim (@\"...) strings, which are left alone."""
    inside, skip = False, set()
    for k, line in enumerate(lines):
        if inside:
            skip.add(k)
        if line.count('"""') % 2 == 1:
            inside = not inside
    return skip


def main():
    ap = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    ap.add_argument("paths", nargs="+")
    ap.add_argument("--max", type=int, default=120)
    ap.add_argument("--check", action="store_true")
    a = ap.parse_args()
    total = 0
    for p in a.paths:
        targets = [p] if os.path.isfile(p) else [
            os.path.join(d, n) for d, s, ns in os.walk(p) if not {"bin", "obj"} & set(d.split(os.sep))
            for n in ns if n.endswith(".cs")]
        for f in sorted(targets):
            with open(f, encoding="utf-8", newline="") as fh:
                src = fh.read()
            lines = src.split("\n")
            new, changed = restore(lines, raw_string_lines(lines), a.max)
            if not changed:
                continue
            total += changed
            print(f"{os.path.relpath(f)}: {changed} comment line(s) re-wrapped")
            if not a.check:
                with open(f, "w", encoding="utf-8", newline="") as fh:
                    fh.write("\n".join(new))
    return 1 if a.check and total else 0


def restore(lines, skip, limit):
    """Re-wraps each run of lines outside multi-line raw strings on its own and joins them back in order."""
    out, changed, run = [], 0, []
    for k, line in enumerate(lines):
        if k in skip:
            if run:
                new, c = rewrap(run, limit)
                out += new
                changed += c
                run = []
            out.append(line)
        else:
            run.append(line)
    if run:
        new, c = rewrap(run, limit)
        out += new
        changed += c
    return out, changed


if __name__ == "__main__":
    sys.exit(main())
