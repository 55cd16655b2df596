#!/usr/bin/env python3
"""`check --json` lists exactly the findings of `report --json` (same codes, beams, elements, in
the same order) on every bundled layout and every test fixture that has findings; each finding
object carries its code, severity, beam, element and message; the fixtures in
tests/layouts/findings/ each have at least one finding of severity "problem"."""
import glob
import json
import os
import subprocess
import sys

rv, top = sys.argv[1], sys.argv[2]
files = [f for f in sorted(glob.glob(os.path.join(top, "layouts", "*.json")))
         if os.path.basename(f) not in ("lenses.json", "schema.json")]
fixtures = sorted(glob.glob(os.path.join(top, "tests", "layouts", "findings", "*.json")))
files += fixtures
files += sorted(glob.glob(os.path.join(top, "tests", "layouts", "warn", "*.json")))
files += sorted(glob.glob(os.path.join(top, "tests", "hardening", "repro", "*.json")))
assert fixtures, "no fixtures in tests/layouts/findings"

failures = []
def run(*args):
    p = subprocess.run([rv, *args], capture_output=True, text=True)
    if p.returncode != 0:
        failures.append(f"{' '.join(args)}: exit {p.returncode}: {p.stderr.strip()}")
        return None
    return json.loads(p.stdout)

def key(f):
    return (f["code"], f["beam"], f["element"], f["message"])

compared = 0
for f in files:
    report = run("report", f, "--json")
    check = run("check", f, "--json")
    if report is None or check is None:
        continue
    r = [key(w) for w in report["warnings"]]
    c = [key(w) for w in check["findings"]]
    if r != c:
        failures.append(f"{f}: report lists {r}, check lists {c}")
    for w in check["findings"]:
        for k in ("code", "severity", "beam", "element", "message"):
            if k not in w:
                failures.append(f"{f}: a finding has no {k!r}: {w}")
        if w["severity"] not in ("problem", "warning"):
            failures.append(f"{f}: severity {w['severity']!r}")
    if f in fixtures and not any(w["severity"] == "problem" for w in check["findings"]):
        failures.append(f"{f}: a findings fixture with no problem found")
    if check["problems"] + check["warnings"] != len(check["findings"]):
        failures.append(f"{f}: the counts do not add up")
    compared += 1

for line in failures:
    print("FAIL:", line)
print(f"{compared} layouts compared, {len(failures)} failed")
sys.exit(1 if failures else 0)
