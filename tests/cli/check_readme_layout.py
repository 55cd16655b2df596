"""The README's layout to start from is a working layout: the one ```json block of README.md
reads with no problem or warning (`check`), its verdict is met (`report --check`, the waist goal
of 65 µm), its waist at the target is the hand value below, and it is in canonical form
(`format -o -` gives it back byte for byte, less the trailing newline of the block).

Hand computation (Self 1983, docs/physics.md §1.3: a waist w0 at distance d before a thin lens f
is imaged to w0' = w0 / √((1 − d/f)² + (z_R/f)²), z_R = π w0²/λ): w0 = 1 mm, λ = 1.03 µm,
d = 125 mm, f = 200 mm: z_R = 3050.1 mm, w0' = 1000 µm / √(0.140625 + 232.58) = 65.552 µm.
Usage: check_readme_layout.py BINARY REPOSITORY_ROOT"""
import json
import math
import os
import re
import subprocess
import sys
import tempfile

binary, top = sys.argv[1], sys.argv[2]
readme = open(os.path.join(top, "README.md"), encoding="utf-8").read()
blocks = re.findall(r"```json\n(.*?)```", readme, re.S)
if len(blocks) != 1:
    sys.exit(f"expected one ```json block in README.md, found {len(blocks)}")
layout = blocks[0]

with tempfile.TemporaryDirectory() as scratch:
    path = os.path.join(scratch, "start.json")
    with open(path, "w", encoding="utf-8") as f:
        f.write(layout)

    def run(*args):
        return subprocess.run([binary, *args], capture_output=True, text=True)

    check = run("check", path)
    if check.returncode != 0 or "0 problem(s), 0 warning(s)" not in check.stdout:
        sys.exit(f"check: exit {check.returncode}\n{check.stdout}{check.stderr}")
    report = run("report", path, "--check")
    if report.returncode != 0:
        sys.exit(f"report --check: exit {report.returncode} (verdict not met?)\n{report.stdout}{report.stderr}")
    z_r_mm = math.pi * 1.0 ** 2 / 1.03e-3
    hand_um = 1000.0 / math.sqrt((1 - 125 / 200) ** 2 + (z_r_mm / 200) ** 2)
    waist = json.loads(run("report", path, "--json").stdout)["beams"]["laser"]["target"]["waist_um"]
    for plane in ("tangential", "sagittal"):
        if abs(waist[plane] - hand_um) > 1e-4 * hand_um:
            sys.exit(f"{plane} waist {waist[plane]} µm, hand value {hand_um:.4f} µm")
    formatted = run("format", path, "-o", "-")
    if formatted.returncode != 0 or formatted.stdout.rstrip("\n") != layout.rstrip("\n"):
        sys.exit("the README's layout is not in canonical form; `rendezvous format` writes:\n" + formatted.stdout)
print("the README's layout reads, meets its verdict and is canonical")
