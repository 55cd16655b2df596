#!/usr/bin/env python3
"""The README's window section shows every bundled layout (issue 17, done means): for each
layout in layouts/ (the lens catalog and the schema aside) docs/images/NAME.png exists, is a PNG
of the size the README's command makes, is at most 200 KB, and the README links it. Usage:
check_screenshots.py SOURCE_DIR."""
import os
import struct
import sys

LIMIT_BYTES = 200 * 1024
SIZE = (1000, 625)


def main():
    root = sys.argv[1]
    readme = open(os.path.join(root, "README.md"), encoding="utf-8").read()
    failures = []
    layouts = sorted(f[:-5] for f in os.listdir(os.path.join(root, "layouts"))
                     if f.endswith(".json") and f not in ("lenses.json", "schema.json"))
    if len(layouts) < 4:
        failures.append("expected the four bundled layouts, found %d" % len(layouts))
    for name in layouts:
        rel = "docs/images/%s.png" % name
        path = os.path.join(root, rel)
        if not os.path.exists(path):
            failures.append("%s: no screenshot %s" % (name, rel))
            continue
        data = open(path, "rb").read()
        if len(data) > LIMIT_BYTES:
            failures.append("%s: %d bytes, over %d" % (rel, len(data), LIMIT_BYTES))
        if data[:8] != b"\x89PNG\r\n\x1a\n" or data[12:16] != b"IHDR":
            failures.append("%s: not a PNG" % rel)
        elif struct.unpack(">II", data[16:24]) != SIZE:
            failures.append("%s: %dx%d, expected %dx%d" % ((rel,) + struct.unpack(">II", data[16:24]) + SIZE))
        if "](%s)" % rel not in readme:
            failures.append("README.md does not link %s" % rel)
    for f in failures:
        print("FAIL:", f)
    print("%d bundled layouts, %d screenshot problems" % (len(layouts), len(failures)))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
