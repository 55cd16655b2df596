"""CSV fields are quoted per RFC 4180 (issue 19 item 4): with a beam id, the stage's id and the
crystal's id each holding a comma and a double quote, every row of `caustic --csv`, `sweep --csv`
and `scan --csv` still has as many fields as its header, and the ids read back whole.
Usage: check_csv_quoting.py BINARY SFG_LAYOUT"""
import csv
import io
import json
import os
import subprocess
import sys
import tempfile

binary, sfg = os.path.abspath(sys.argv[1]), sys.argv[2]
awkward = 'pump, "main"'
layout = json.load(open(sfg))
for beam in layout["beams"]:
    if beam["id"] == "pump":
        beam["id"] = awkward
waists = layout.get("goals", {}).get("waist_um", {})
if "pump" in waists:
    waists[awkward] = waists.pop("pump")
# The stage and the crystal, whose ids name `scan`'s first two columns.
awkward_stage, awkward_crystal = 'S1, "delay"', 'X, "bbo"'
for element in layout["elements"]:
    if element["id"] == "S1":
        element["id"] = awkward_stage
    elif element["id"] == "X":
        element["id"] = awkward_crystal
if layout.get("target") == "X":
    layout["target"] = awkward_crystal
path = os.path.join(tempfile.mkdtemp(prefix="rv-csv-"), "awkward.json")
json.dump(layout, open(path, "w"))
failures = []


def table(*args):
    done = subprocess.run([binary, *args], capture_output=True, text=True)
    if done.returncode != 0:
        failures.append(f"{args[0]} exited {done.returncode}: {done.stderr.strip()}")
        return []
    return list(csv.reader(io.StringIO(done.stdout)))


caustic = table("caustic", path, "--csv")
if caustic:
    widths = {len(row) for row in caustic}
    if widths != {4}:
        failures.append(f"caustic rows of {sorted(widths)} fields, expected 4")
    if awkward not in {row[0] for row in caustic[1:]}:
        failures.append(f"caustic: no row names the beam {awkward!r}")

sweep = table("sweep", path, "--vary", awkward_stage + ".position_mm", "--from", "29", "--to", "31", "--steps", "3", "--csv")
if sweep:
    widths = {len(row) for row in sweep}
    if len(widths) != 1:
        failures.append(f"sweep rows of {sorted(widths)} fields, expected one width")
    if awkward + "_waist_um" not in sweep[0]:
        failures.append(f"sweep header {sweep[0]} lacks {awkward + '_waist_um'!r}")

scan = table("scan", path, "--csv", "-", "--points", "5x3")
if scan:
    widths = {len(row) for row in scan}
    if widths != {4}:
        failures.append(f"scan rows of {sorted(widths)} fields, expected 4")
    want = [awkward_stage + "_position_mm", awkward_crystal + "_tilt_deg", "delay_fs", "power_mw"]
    if scan[0] != want:
        failures.append(f"scan header {scan[0]}, expected {want}")
    if len(scan) != 1 + 5 * 3:
        failures.append(f"scan: {len(scan) - 1} rows, expected 15")

for f in failures:
    print("FAIL:", f)
sys.exit(1 if failures else 0)
