#!/usr/bin/env python3
"""rendezvous sheet --svg: every page file it names exists, is read by rsvg-convert (exit 0),
and converts at 25.4 dpi (one pixel per mm) to an A4-sized image, so the SVG's physical size is
the paper's; no other file is written. Usage: check_sheet_svg.py RENDEZVOUS LAYOUT"""
import json
import os
import struct
import subprocess
import sys
import tempfile


def png_size(path):
    with open(path, "rb") as f:
        head = f.read(24)
    if head[:8] != b"\x89PNG\r\n\x1a\n":
        raise SystemExit(f"{path}: not a PNG")
    return struct.unpack(">II", head[16:24])


def main():
    rv, layout = sys.argv[1], sys.argv[2]
    with tempfile.TemporaryDirectory() as d:
        first = os.path.join(d, "sheet.svg")
        run = subprocess.run([rv, "sheet", layout, "--svg", first, "--json"], capture_output=True, text=True)
        if run.returncode != 0:
            raise SystemExit(f"sheet exited {run.returncode}: {run.stderr}")
        doc = json.loads(run.stdout)
        pages = doc["svg"]["pages"]
        expected = doc["svg"]["columns"] * doc["svg"]["rows"]
        if len(pages) != expected or pages[0] != first:
            raise SystemExit(f"{len(pages)} pages named, {expected} expected, first {pages[0]}")
        written = sorted(os.listdir(d))
        if sorted(os.path.basename(p) for p in pages) != written:
            raise SystemExit(f"files written {written} differ from the pages named {pages}")
        for k, page in enumerate(pages, start=1):
            png = os.path.join(d, f"page{k}.png")
            conv = subprocess.run(["rsvg-convert", "--dpi-x", "25.4", "--dpi-y", "25.4", "-o", png, page],
                                  capture_output=True, text=True)
            if conv.returncode != 0:
                raise SystemExit(f"rsvg-convert {page} exited {conv.returncode}: {conv.stderr}")
            size = png_size(png)
            if sorted(size) != [210, 297]:
                raise SystemExit(f"{page}: {size[0]} x {size[1]} px at 1 px/mm, expected A4 (210 x 297)")
    print(f"{len(pages)} pages read by rsvg-convert at A4 size")


if __name__ == "__main__":
    main()
