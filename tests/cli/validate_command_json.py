#!/usr/bin/env python3
"""Every command that speaks JSON prints one object that validates against its JSON Schema in
docs/schemas/ (Debian's python3-jsonschema, draft 2020-12), on every bundled layout and on the
test fixtures with findings. Usage: validate_command_json.py RENDEZVOUS SOURCE_DIR"""
import glob
import json
import os
import subprocess
import sys

import jsonschema

rv, top = sys.argv[1], sys.argv[2]
schemas_dir = os.path.join(top, "docs", "schemas")
store = {}
for path in glob.glob(os.path.join(schemas_dir, "*.schema.json")):
    with open(path) as f:
        schema = json.load(f)
    jsonschema.Draft202012Validator.check_schema(schema)
    store[schema["$id"]] = schema

layouts = [f for f in sorted(glob.glob(os.path.join(top, "layouts", "*.json")))
           if os.path.basename(f) not in ("lenses.json", "schema.json")]
layouts += sorted(glob.glob(os.path.join(top, "tests", "layouts", "findings", "*.json")))

def layout_file(*parts):
    return os.path.join(top, *parts)

# (arguments, schema): every command that speaks JSON, on every layout it applies to.
RUNS = []
for layout in layouts:
    RUNS += [(["report", layout, "--json"], "report.schema.json"),
             (["check", layout, "--json"], "check.schema.json"),
             (["trace", layout, "--json"], "trace.schema.json")]
for name in ("sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"):
    RUNS.append((["tolerance", layout_file("layouts", name), "--samples", "300", "--json"], "tolerance.schema.json"))
for name in ("sfg-bbo.json", "pump-probe.json"):
    RUNS.append((["balance", layout_file("layouts", name), "--json"], "balance.schema.json"))
for process in ("sfg", "shg:pump", "shg:signal"):
    RUNS.append((["phase", layout_file("layouts", "sfg-bbo.json"), "--process", process, "--json"], "phase.schema.json"))
RUNS.append((["phase", layout_file("layouts", "shg-single.json"), "--process", "shg:fundamental", "--json"], "phase.schema.json"))
RUNS += [
    (["polarize", layout_file("layouts", "sfg-bbo.json"), "--plate", "HWP_P", "--json"], "polarize.schema.json"),
    (["polarize", layout_file("layouts", "shg-single.json"), "--plate", "HWP", "--power-mw", "1000", "--json"], "polarize.schema.json"),
    (["sweep", layout_file("layouts", "sfg-bbo.json"), "--vary", "S1.position_mm", "--from", "-5", "--to", "32", "--steps", "5", "--json"], "sweep.schema.json"),
    (["sweep", layout_file("layouts", "shg-single.json"), "--vary", "X.normal_deg", "--from", "-82", "--to", "-78", "--steps", "3", "--json"], "sweep.schema.json"),
    (["solve", layout_file("tests", "layouts", "solve", "plate-before-crystal.json"), "--json"], "solve.schema.json"),
    (["solve", layout_file("layouts", "sfg-bbo.json"), "--json"], "solve.schema.json"),
    (["solve", layout_file("layouts", "shg-single.json"), "--json"], "solve.schema.json"),
]

failures = 0
runs = 0
for args, schema_id in RUNS:
    schema = store[schema_id]
    resolver = jsonschema.RefResolver(base_uri="", referrer=schema, store=store)
    validator = jsonschema.Draft202012Validator(schema, resolver=resolver)
    p = subprocess.run([rv, *args], capture_output=True, text=True, timeout=120)
    runs += 1
    name = " ".join(os.path.basename(a) for a in args)
    if p.returncode != 0:
        print(f"FAIL {name}: exit {p.returncode}: {p.stderr.strip()}")
        failures += 1
        continue
    try:
        doc = json.loads(p.stdout)
    except json.JSONDecodeError as e:
        print(f"FAIL {name}: not one JSON object: {e}")
        failures += 1
        continue
    errors = sorted(validator.iter_errors(doc), key=lambda e: list(e.path))
    for e in errors[:5]:
        print(f"FAIL {name}: /{'/'.join(map(str, e.path))}: {e.message[:200]}")
    failures += bool(errors)
used = {schema_id for _, schema_id in RUNS} | {"finding.schema.json"}
for unused in sorted(set(store) - used):
    print(f"FAIL docs/schemas/{unused} is validated by no run")
    failures += 1

# The schemas can fail: documents with one mistake each are rejected.
report_validator = jsonschema.Draft202012Validator(
    store["report.schema.json"], resolver=jsonschema.RefResolver(base_uri="", referrer=store["report.schema.json"], store=store))
good = json.loads(subprocess.run([rv, "report", "--demo", "--json"], capture_output=True, text=True).stdout)
assert report_validator.is_valid(good), "the demo's report must validate"
def broken(change):
    doc = json.loads(json.dumps(good))
    change(doc)
    return doc
mistakes = {
    "no verdict": lambda d: d.pop("verdict"),
    "an overlap above 1": lambda d: d["overlap"].update(spatial=1.5),
    "a finding with an unknown code": lambda d: d["warnings"].append(
        {"code": "nonsense", "severity": "problem", "beam": None, "element": None, "message": "x"}),
    "a finding without severity": lambda d: d["warnings"].append(
        {"code": "clipping", "beam": None, "element": None, "message": "x"}),
    "an empty plate id": lambda d: d["polarization"].append(
        {"beam": "b", "needs": "o", "useful_fraction": 0.5, "plate": "", "plate_now_deg": None,
         "plate_best_deg": None, "useful_fraction_best": None, "action": None}),
}
for what, change in mistakes.items():
    runs += 1
    if report_validator.is_valid(broken(change)):
        print(f"FAIL the report schema accepts {what}")
        failures += 1
print(f"{runs - failures} passed, {failures} failed")
sys.exit(1 if failures else 0)
