#!/usr/bin/env python3
"""Compares two sifter-results/1 files value for value: same keys, same texts, numbers equal
within a relative tolerance (default 1e-12). The order of keys and the layout do not matter.

Usage: compare_results.py BEFORE.json AFTER.json [--rel 1e-12]
Exit 0 when they agree, 1 with the first differences listed otherwise.
"""
import argparse
import json
import sys


def walk(a, b, where, rel, out):
    if len(out) >= 20:
        return
    if isinstance(a, bool) or isinstance(b, bool) or a is None or b is None:
        if a is not b and a != b or type(a) is not type(b):
            out.append("%s: %r != %r" % (where, a, b))
    elif isinstance(a, (int, float)) and isinstance(b, (int, float)):
        if abs(a - b) > rel * max(abs(a), abs(b)):
            out.append("%s: %r != %r" % (where, a, b))
    elif isinstance(a, dict) and isinstance(b, dict):
        if set(a) != set(b):
            out.append("%s: keys differ: %s" % (where, sorted(set(a) ^ set(b))))
        for k in a:
            if k in b:
                walk(a[k], b[k], where + "/" + k, rel, out)
    elif isinstance(a, list) and isinstance(b, list):
        if len(a) != len(b):
            out.append("%s: %d items != %d items" % (where, len(a), len(b)))
        for i, (x, y) in enumerate(zip(a, b)):
            walk(x, y, "%s/%d" % (where, i), rel, out)
    elif a != b:
        out.append("%s: %r != %r" % (where, a, b))


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("before")
    ap.add_argument("after")
    ap.add_argument("--rel", type=float, default=1e-12)
    args = ap.parse_args()
    with open(args.before) as f:
        before = json.load(f)
    with open(args.after) as f:
        after = json.load(f)
    out = []
    walk(before, after, "", args.rel, out)
    for line in out:
        print(line)
    print("%s: %s" % (args.after, "same values" if not out else "DIFFERENT"))
    return 1 if out else 0


if __name__ == "__main__":
    sys.exit(main())
