"""No unbounded loop or allocation (issue 19 item 2), through the command line: each fixture of
tests/hardening/runaway (valid layouts whose numbers once made a loop or an allocation run away:
a Rayleigh range of 1e-13 mm, tables of 1e-9, 1e5 and 1e6 mm, a stage at 1e300 mm) through
every command that samples, draws or writes it.

Each run must
- exit with its expected status (0: the layout is valid, the output honest; 2 for the three the
  reader now refuses at the door, issue 19 §1, nothing drawn or written),
- print its expected lines (the findings, or the note that the holes are not drawn),
- use at most 2 s of CPU and 500 MB of memory (measured by the kernel for the child, so a busy
  machine does not fail it: the bug was a loop that never ended, not a slow one),
- print no NaN or infinity where a number belongs ("nan", "inf" as words) and, in JSON, no null
  except where the report may leave a figure out (check_cli_random.MAY_BE_NULL).

usage: check_runaway_inputs.py RENDEZVOUS FOLDER
"""
import json

import measured_run
import os
import re
import sys
import tempfile

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from check_cli_random import walk, reject_constant  # noqa: E402

MAX_CPU_S = 2.0
MAX_RSS_KB = 500 * 1024
WALL_TIMEOUT_S = 60  # a run away loop is stopped here and fails

# Words a non-finite number prints as; "inf" inside "infrared" is not one.
NOT_FINITE = re.compile(r"(?<![A-Za-z])[-+]?(nan|inf|infinity)(?![A-Za-z])", re.IGNORECASE)

NOTE_HOLES_1E5 = "the mounting holes are not drawn: 16000000 of them, more than 250000"
NOTE_HOLES_1E6 = "the mounting holes are not drawn: 1600000000 of them, more than 250000"
PARAXIAL = "warning: /elements/17 (X): [paraxial] signal: the waist (0.00 µm) is below two wavelengths; the paraxial Gaussian model is unreliable there"

# fixture → lines `check` must print (besides its summary), and a line the SVG run must print.
# Since the reader bounds numbers at the door (issue 19 §1: tables within [10 mm, 100 m], lengths
# within ±100 m), three of them are refused by every command (status 2) with these lines.
TABLE = "error: /table/size_mm/%d: must be between 10 and 100000 mm (got %s)"
EXPECT = {
    "tiny-focal-length.json": {"check": [PARAXIAL], "svg": None},
    "thick-lens-1um-radii.json": {"check": [PARAXIAL], "svg": None},
    "table-1e-9mm.json": {"status": 2, "check": [TABLE % (0, "1e-09"), TABLE % (1, "1e-09")], "svg": None},
    "table-1e5mm.json": {"check": ["2 beam(s), 19 element(s), 0 problem(s), 4 warning(s)"], "svg": NOTE_HOLES_1E5},
    "table-1e6mm.json": {"status": 2, "check": [TABLE % (0, "1000000"), TABLE % (1, "1000000")], "svg": None},
    "stage-at-1e300mm.json": {"status": 2, "check": [
        "error: /elements/7/position_mm (S1): must lie within ±100000 mm (100 m) (got 1e+300)",
        "error: /elements/7/travel_mm/1 (S1): must lie within ±100000 mm (100 m) (got 1e+300)"], "svg": None},
}

failures = []


def run_measured(args):
    return measured_run.run_measured(args, WALL_TIMEOUT_S)


def check_run(label, args, want_status=0):
    got = run_measured(args)
    if got is None:
        failures.append("%s: no answer within %d s" % (label, WALL_TIMEOUT_S))
        return None
    status, out, err, cpu_s, rss_kb = got
    if status < 0:
        failures.append("%s: killed by signal %d" % (label, -status))
    elif status != want_status:
        failures.append("%s: exit status %d, expected %d (stderr %r)" % (label, status, want_status, err[:300]))
    if cpu_s > MAX_CPU_S:
        failures.append("%s: %.2f s of CPU, more than %.1f" % (label, cpu_s, MAX_CPU_S))
    if rss_kb > MAX_RSS_KB:
        failures.append("%s: %d MB of memory, more than %d" % (label, rss_kb // 1024, MAX_RSS_KB // 1024))
    return status, out, err


def no_non_finite(label, text):
    m = NOT_FINITE.search(text)
    if m:
        start = max(0, m.start() - 60)
        failures.append("%s: a non-finite number printed: %r" % (label, text[start:m.end() + 20]))


def main():
    rv, folder = sys.argv[1], sys.argv[2]
    fixtures = sorted(f for f in os.listdir(folder) if f.endswith(".json"))
    if sorted(EXPECT) != fixtures:
        failures.append("fixtures %s but expectations for %s" % (fixtures, sorted(EXPECT)))
    with tempfile.TemporaryDirectory() as out_dir:
        for name in fixtures:
            path = os.path.join(folder, name)
            want = EXPECT.get(name, {"check": [], "svg": None})
            status = want.get("status", 0)
            got = check_run("check " + name, [rv, "check", path], status)
            if got:
                for line in want["check"]:
                    if not any(l.endswith(line) for l in (got[1] + got[2]).splitlines()):
                        failures.append("check %s: no line ending %r in %r" % (name, line, got[1][:600]))
                no_non_finite("check " + name, got[1] + got[2])
            for command in (["report"], ["report", "--markdown"], ["trace"], ["caustic", "--csv"]):
                label = " ".join(command) + " " + name
                got = check_run(label, [rv, command[0], path] + command[1:], status)
                if got:
                    no_non_finite(label, got[1] + got[2])
            got = check_run("report --json " + name, [rv, "report", path, "--json"], status)
            if got and got[0] == 0:
                try:
                    problems = []
                    walk(json.loads(got[1], parse_constant=reject_constant), [], problems)
                    failures.extend("report --json %s: %s" % (name, p) for p in problems)
                except ValueError as e:
                    failures.append("report --json %s: not strict JSON: %s" % (name, e))
            png = os.path.join(out_dir, name + ".png")
            svg = os.path.join(out_dir, name + ".svg")
            check_run("render --png " + name, [rv, "render", path, "--png", png, "--size", "400x250"], status)
            got = check_run("render --svg " + name, [rv, "render", path, "--svg", svg], status)
            if status != 0:
                for written in (png, svg):
                    if os.path.exists(written):
                        failures.append("render %s: wrote %s though it refused the layout" % (name, written))
            elif got:
                lines = got[1].splitlines()
                if lines[:1] != ["wrote " + svg]:
                    failures.append("render --svg %s: expected 'wrote %s' first, got %r" % (name, svg, got[1][:300]))
                if want["svg"] and want["svg"] not in lines:
                    failures.append("render --svg %s: no line %r in %r" % (name, want["svg"], got[1][:300]))
                if not want["svg"] and len(lines) != 1:
                    failures.append("render --svg %s: expected one line, got %r" % (name, got[1][:300]))
                if os.path.exists(svg):
                    size = os.path.getsize(svg)
                    if size > 4 << 20:
                        failures.append("render --svg %s: %d bytes of SVG" % (name, size))
                    with open(svg, encoding="utf-8") as f:
                        no_non_finite("the SVG of " + name, f.read())
    for f in failures:
        print("FAIL:", f)
    print("%d runaway fixtures, %d failure(s)" % (len(fixtures), len(failures)))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
