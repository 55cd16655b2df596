"""CSV fields are quoted per RFC 4180 (issue 19 item 4): with a beam id holding a comma and a
double quote, every row of `caustic --csv` and `sweep --csv` still has as many fields as its
header, and the id reads back whole.
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

sweep = table("sweep", path, "--vary", "S1.position_mm", "--from", "29", "--to", "31", "--steps", "3", "--csv")
if sweep:
    widths = {len(row) for row in sweep}
    if len(widths) != 1:
        failures.append(f"sweep rows of {sorted(widths)} fields, expected one width")
    if awkward + "_waist_um" not in sweep[0]:
        failures.append(f"sweep header {sweep[0]} lacks {awkward + '_waist_um'!r}")

for f in failures:
    print("FAIL:", f)
sys.exit(1 if failures else 0)
