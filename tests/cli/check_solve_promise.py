#!/usr/bin/env python3
"""Apply solve's answer as a user would and check that it keeps its word: on every bundled
layout, `solve --json --write OUT` promises a verdict and each beam's waist offset for the layout
it writes; `report OUT --json` must give exactly that verdict and those offsets.
Usage: check_solve_promise.py RENDEZVOUS SOURCE_DIR"""
import glob
import json
import os
import subprocess
import sys
import tempfile

rv, top = sys.argv[1], sys.argv[2]
failures = 0
checked = 0
with tempfile.TemporaryDirectory() as d:
    for layout in sorted(glob.glob(os.path.join(top, "layouts", "*.json"))):
        if os.path.basename(layout) in ("lenses.json", "schema.json"):
            continue
        out = os.path.join(d, os.path.basename(layout))
        solve = json.loads(subprocess.run([rv, "solve", layout, "--json", "--write", out],
                                          capture_output=True, text=True, check=True).stdout)
        report = json.loads(subprocess.run([rv, "report", out, "--json"], capture_output=True, text=True,
                                           check=True).stdout)
        best = solve["best"]
        name = os.path.basename(layout)
        for line in ("space", "time", "phase"):
            if best["verdict"][line] != report["verdict"][line]["met"]:
                print(f"FAIL {name}: solve promised {line} {best['verdict'][line]}, "
                      f"the report of what it wrote says {report['verdict'][line]['met']}")
                failures += 1
        for b in best["beams"]:
            t = report["beams"][b["beam"]]["target"]["waist_offset_mm"]
            judged = (t["tangential"] + t["sagittal"]) / 2
            if abs(judged - b["waist_offset_mm"]) > 1e-9:
                print(f"FAIL {name}: {b['beam']} waist offset promised {b['waist_offset_mm']}, judged {judged}")
                failures += 1
        checked += 1
print(f"{checked - failures} passed, {failures} failed")
sys.exit(1 if failures or checked == 0 else 0)
