"""Honest labels (issue 14 items 6 and 7) through the real program, with their exact texts:
the phase verdict of a target that is not a crystal is n/a (text, Markdown, JSON
{"applies": false, "met": null}) and does not fail `report --check`; "along the crystal" only
for a crystal; no "" stands for an absent value in `report --json`; circular light has a null
azimuth; delays above 10 ps print in ps; sweep prints every row of a range past the stage's
travel and marks those outside; a mistyped sweep id or field gets the closest one; no number in
the sweep or tolerance tables prints as a residue, "-0" or nan.
Usage: check_labels.py BINARY LAYOUTS_FOLDER"""
import json
import os
import re
import subprocess
import sys
import tempfile

binary, layouts = os.path.abspath(sys.argv[1]), os.path.abspath(sys.argv[2])
sfg = os.path.join(layouts, "sfg-bbo.json")
microscope = os.path.join(layouts, "two-beam-microscope.json")
scratch = tempfile.mkdtemp(prefix="rv-labels-")
failures = []


def check(ok, what):
    if not ok:
        failures.append(what)


def run(*args):
    return subprocess.run([binary, *args], capture_output=True, text=True)


def report_json(path):
    r = run("report", path, "--json")
    check(r.returncode == 0, f"report {path} --json exits 0 (got {r.returncode}: {r.stderr})")
    return json.loads(r.stdout) if r.returncode == 0 else {}


def write_layout(name, doc):
    path = os.path.join(scratch, name)
    with open(path, "w", encoding="utf-8") as f:
        json.dump(doc, f)
    return path


def load(path):
    with open(path, encoding="utf-8") as f:
        return json.load(f)


# --- Phase for a target that is not a crystal: n/a, everywhere.
text = run("report", microscope).stdout
check("\n  phase  n/a — the target is not a crystal\n" in text, "text: phase n/a line")
check("phase  met" not in text, "text: phase not 'met'")
markdown = run("report", microscope, "--markdown").stdout
check("| phase | n/a | the target is not a crystal |  |\n" in markdown, "markdown: phase n/a row")
phase = report_json(microscope).get("verdict", {}).get("phase")
check(phase == {"applies": False, "met": None, "summary": "the target is not a crystal", "action": None,
                "reading": {"code": "target_not_crystal"}, "actions": []},
      f"json: verdict.phase (got {phase})")
sfg_report = report_json(sfg)
sfg_phase = sfg_report.get("verdict", {}).get("phase", {})
check(sfg_phase.get("applies") is True and isinstance(sfg_phase.get("met"), bool),
      "json: a crystal's phase verdict applies and is true or false")

# --- report --check: a line that does not apply does not fail. One beam into a plain target,
# waist well inside its Rayleigh range: space met, time and phase n/a, so the check passes.
one_beam = {"format": "rendezvous-layout", "version": 1, "table": {"size_mm": [1000, 1000]},
            "beams": [{"id": "b", "wavelength_nm": 800, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 800,
                       "polarization": "circular-right"}],
            "elements": [{"id": "M", "type": "mirror", "at_mm": [300, 500], "normal_deg": 135},
                         {"id": "T", "type": "target", "at_mm": [300, 700], "normal_deg": 90}],
            "target": "T"}
one_path = write_layout("one-beam.json", one_beam)
check_run = run("report", one_path, "--check")
check(check_run.returncode == 0, f"report --check passes with time and phase n/a (got {check_run.returncode})")
check("\n  time   n/a — one beam: no delay to match\n" in check_run.stdout, "text: time n/a line for one beam")
one = report_json(one_path)
check(one.get("verdict", {}).get("space", {}).get("met") is True, "the one-beam layout meets space (test premise)")
check(run("report", sfg, "--check").returncode == 3, "report --check still fails a real NOT MET")

# --- Circular light: no azimuth (after a mirror it is still circular, of the other hand).
pol = one.get("beams", {}).get("b", {}).get("target", {}).get("polarization", {})
check(pol.get("state") == "circular (left)", f"circular light state (got {pol.get('state')})")
check("azimuth_deg" in pol and pol["azimuth_deg"] is None, f"circular light: azimuth_deg null (got {pol})")
linear = sfg_report.get("beams", {}).get("pump", {}).get("target", {}).get("polarization", {})
check(isinstance(linear.get("azimuth_deg"), (int, float)), "linear light keeps its azimuth")

# --- Overlap wording.
check("Overlap  spatial " in text and " at the target plane  temporal " in text and "along the crystal" not in text,
      "text: overlap at the target plane for a plain target")
check(", along the crystal" not in markdown and " at the target plane, temporal " in markdown,
      "markdown: overlap at the target plane for a plain target")
check(report_json(microscope).get("overlap", {}).get("spatial_along_crystal", 0) is None,
      "json: spatial_along_crystal null")
sfg_text = run("report", sfg).stdout
check("  along the crystal " in sfg_text, "text: a crystal keeps 'along the crystal'")

# --- No "" for an absent value in any bundled layout's report.
def empty_strings(node, where=""):
    if node == "":
        yield where
    elif isinstance(node, dict):
        for k, v in node.items():
            yield from empty_strings(v, where + "." + k)
    elif isinstance(node, list):
        for i, v in enumerate(node):
            yield from empty_strings(v, f"{where}[{i}]")


for name in sorted(os.listdir(layouts)):
    if name.endswith(".json") and name not in ("schema.json", "lenses.json"):
        for where in empty_strings(report_json(os.path.join(layouts, name))):
            failures.append(f"{name}: report --json has \"\" at {where}")

# --- Delays above 10 ps in ps, with their unit. The microscope's pulses (100 and 600 ps) give a
# cross-correlation width of 608.276 ps; a 52 ps emission offset gives a delay in ps.
check("of the cross-correlation width (608.276 ps)" in text, "text: cross-correlation width in ps")
late = load(sfg)
late["beams"][0]["emit_time_fs"] = late["beams"][0].get("emit_time_fs", 0) + 52000
late_path = write_layout("late.json", late)
delay_fs = report_json(late_path).get("mismatch", {}).get("delay_fs", 0)
shown = "%+.3f ps" % (delay_fs / 1000)
late_text = run("report", late_path).stdout
check(f"  time   NOT MET  delay {shown} = " in late_text, f"text: time verdict delay {shown}")
check(f"  delay (pump − signal) {shown}\n" in late_text, f"text: mismatch delay {shown}")
check(f"Delay (pump − signal): {shown}. " in run("report", late_path, "--markdown").stdout, "markdown: delay in ps")

# --- sweep past the stage travel: every row, the ones outside marked, a note.
sweep = run("sweep", sfg, "--vary", "S1.position_mm", "--from", "40", "--to", "60", "--steps", "3")
check(sweep.returncode == 0, f"sweep past the travel exits 0 (got {sweep.returncode}: {sweep.stderr})")
lines = sweep.stdout.splitlines()
check(len(lines) == 5 and lines[0].startswith("S1.position_mm  ") and lines[0].endswith("  sinc2_now  in_travel"),
      f"sweep header with in_travel (got {lines[:1]})")
check([l.split()[0] + " " + l.split()[-1] for l in lines[1:4]] == ["40 yes", "50 yes", "60 no"],
      f"sweep rows marked (got {lines[1:4]})")
note = ("in_travel no: beyond S1's travel [0, 50] mm, which the stage cannot reach; "
        "those rows are the model's figures as if it could")
check(lines[-1:] == [note], f"sweep note (got {lines[-1:]})")
csv = run("sweep", sfg, "--vary", "S1.position_mm", "--from", "40", "--to", "60", "--steps", "3", "--csv")
check(csv.stdout.splitlines()[3].endswith(",no") and len(csv.stdout.splitlines()) == 4 and csv.stderr == note + "\n",
      f"sweep --csv: the table on stdout, the note on stderr (got {csv.stdout!r} {csv.stderr!r})")
inside = run("sweep", sfg, "--vary", "S1.position_mm", "--from", "29", "--to", "31", "--steps", "3")
check("in_travel no" not in inside.stdout and inside.stdout.splitlines()[1].endswith("  yes"), "no note inside the travel")
other = run("sweep", sfg, "--vary", "X.at_mm[0]", "--from", "755", "--to", "757", "--steps", "2")
check("in_travel" not in other.stdout, "no in_travel column for another field")

# --- sweep: the closest id or field.
bad_id = run("sweep", sfg, "--vary", "S2.position_mm", "--from", "0", "--to", "1")
check(bad_id.returncode == 2 and bad_id.stderr == f'{sfg}: error: no beam or element has id "S2"; did you mean "S1"?\n',
      f"sweep: closest id (got {bad_id.stderr!r})")
bad_field = run("sweep", sfg, "--vary", "L2_P.focal_lenght_mm", "--from", "90", "--to", "110")
ids = [e["id"] for e in load(sfg)["elements"]]
expected = (f'{sfg}: error: /elements/{ids.index("L2_P")}/focal_lenght_mm (L2_P): "L2_P" has no "focal_lenght_mm" '
            'in the layout; did you mean "focal_length_mm"?\n')
check(bad_field.returncode == 2 and bad_field.stderr == expected, f"sweep: closest field (got {bad_field.stderr!r})")

# --- The shared number rule in the tables: no rounding residue, no "-0", no nan. The swept
# value 0.1 + (-0.2 - 0.1) * 1/3 is -1.4e-17 in double arithmetic: it is taken as 0, so it prints
# 0 and lies inside the travel [0, 50].
residue = run("sweep", sfg, "--vary", "S1.position_mm", "--from", "0.1", "--to", "-0.2", "--steps", "4")
rows = residue.stdout.splitlines()[1:5]
check([r.split()[0] for r in rows] == ["0.1", "0", "-0.1", "-0.2"], f"sweep values (got {[r.split()[:1] for r in rows]})")
check([r.split()[-1] for r in rows] == ["yes", "yes", "no", "no"], "sweep below the travel marked")
tolerance = run("tolerance", sfg, "--samples", "200", "--seed", "3").stdout
no_pulse = load(sfg)
for b in no_pulse["beams"]:
    b.pop("pulse_fwhm_fs", None)
no_pulse_sweep = run("sweep", write_layout("no-pulse.json", no_pulse), "--vary", "S1.position_mm",
                     "--from", "29", "--to", "31", "--steps", "2").stdout
check(no_pulse_sweep.splitlines()[1].split()[-4] == "n/a", "sweep: an absent temporal overlap prints n/a")
for name, out in [("sweep", residue.stdout + no_pulse_sweep), ("tolerance", tolerance)]:
    for token in re.findall(r"[-+]?[0-9.]+(?:e[-+]?[0-9]+)?|nan|inf", out, re.IGNORECASE):
        if re.fullmatch(r"[-+]?(nan|inf)", token, re.IGNORECASE):
            failures.append(f"{name}: prints {token}")
        elif re.fullmatch(r"-0(\.0*)?", token):
            failures.append(f"{name}: prints {token}")
        elif "e-" in token.lower() and int(token.lower().split("e-")[1]) >= 10:
            failures.append(f"{name}: prints the residue {token}")

if failures:
    sys.exit("\n".join(failures))
print("labels, delays, sweep marks and numbers as the issue asks")
