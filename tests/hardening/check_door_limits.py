"""Bounded numbers at the door (issue 19 §1) and no silent ambiguity (§4), through the command
line: each reproducer of the issue exits with status 2 and its exact located message within 2 s
of CPU and 500 MB, and writes nothing.

- numbers on the command line (one validator, viewer/cli/number_option.hpp, with the bounds of
  core/layout/input_limits.hpp): `polarize --power-mw nan` and 1e12, `calibrate --zero 1e308`,
  `sweep --from -1e308 --to 1e308`;
- numbers in the file (the reader, the same bounds): a solve move range of ±1e308 mm, the
  same lens given two move ranges (a duplicate key), a table of 1e-9 by 1e6 mm;
- two optics 0.05 mm apart on a beam's path: not refused, but a located finding that `check`
  prints (it once skipped one of them silently).

usage: check_door_limits.py RENDEZVOUS SOURCE_DIR
"""
import measured_run
import os
import sys
import tempfile

MAX_CPU_S = 2.0
MAX_RSS_KB = 500 * 1024
WALL_TIMEOUT_S = 60

failures = []


def run_measured(args):
    return measured_run.run_measured(args, WALL_TIMEOUT_S)


def refused(label, args, expected_stderr, written=None):
    """Exit 2, stderr exactly `expected_stderr` (a list of lines), nothing on stdout, nothing written."""
    got = run_measured(args)
    if got is None:
        failures.append("%s: no answer within %d s" % (label, WALL_TIMEOUT_S))
        return
    status, out, err, cpu_s, rss_kb = got
    if status != 2:
        failures.append("%s: exit status %d, expected 2 (stderr %r)" % (label, status, err[:300]))
    if err.splitlines() != expected_stderr:
        failures.append("%s: stderr\n  %r\nexpected\n  %r" % (label, err.splitlines(), expected_stderr))
    if out:
        failures.append("%s: printed on stdout: %r" % (label, out[:200]))
    if cpu_s > MAX_CPU_S:
        failures.append("%s: %.2f s of CPU, more than %.1f" % (label, cpu_s, MAX_CPU_S))
    if rss_kb > MAX_RSS_KB:
        failures.append("%s: %d MB, more than %d" % (label, rss_kb // 1024, MAX_RSS_KB // 1024))
    if written and os.path.exists(written):
        failures.append("%s: wrote %s" % (label, written))


def found(label, args, expected_line):
    """Exit 0 with `expected_line` among the lines on stdout."""
    got = run_measured(args)
    if got is None:
        failures.append("%s: no answer within %d s" % (label, WALL_TIMEOUT_S))
        return
    status, out, err, cpu_s, rss_kb = got
    if status != 0:
        failures.append("%s: exit status %d, expected 0 (stderr %r)" % (label, status, err[:300]))
    if expected_line not in out.splitlines():
        failures.append("%s: no line %r in %r" % (label, expected_line, out[:600]))
    if cpu_s > MAX_CPU_S or rss_kb > MAX_RSS_KB:
        failures.append("%s: %.2f s CPU, %d MB" % (label, cpu_s, rss_kb // 1024))


def option_error(option, message):
    return ["rendezvous: error: %s: %s (see rendezvous --help)" % (option, message)]


def main():
    rv, source = sys.argv[1], sys.argv[2]
    sfg = os.path.join(source, "layouts", "sfg-bbo.json")
    bad = os.path.join(source, "tests", "layouts", "bad")
    with tempfile.TemporaryDirectory() as scratch:
        out = os.path.join(scratch, "out.json")
        # The command line's numbers.
        for value in ("nan", "-inf"):
            refused("polarize --power-mw " + value,
                    [rv, "polarize", sfg, "--plate", "HWP_P", "--power-mw", value, "--write", out],
                    option_error("--power-mw", 'expected a finite number, got "%s"' % value), out)
        refused("polarize --power-mw 1e12",
                [rv, "polarize", sfg, "--plate", "HWP_P", "--power-mw", "1e12", "--write", out],
                option_error("--power-mw", 'expected a number between 0 and 100000000 mW, got "1e12"'), out)
        # Once destroyed the user's file: 1e308 overflowed the emission time into null.
        refused("calibrate --zero 1e308",
                [rv, "calibrate", sfg, "--zero", "1e308", "--write", out],
                option_error("--zero", 'expected a number between -100000 and 100000 mm, got "1e308"'), out)
        refused("calibrate --zero 2e5",
                [rv, "calibrate", sfg, "--zero", "2e5", "--write", out],
                option_error("--zero", 'expected a number between -100000 and 100000 mm, got "2e5"'), out)
        # Once printed "found null (at position_mm = -nan)": (to - from) overflowed.
        refused("sweep --from -1e308 --to 1e308",
                [rv, "sweep", sfg, "--vary", "S1.position_mm", "--from", "-1e308", "--to", "1e308"],
                option_error("--from", 'expected a number between -1000000000000 and 1000000000000 '
                                       '(in the field\'s unit), got "-1e308"'))
        # The file's numbers, through the commands that once wrote or printed nonsense from them.
        huge = os.path.join(bad, "move-range-huge.json")
        refused("solve with a move range of ±1e308 mm", [rv, "solve", huge, "--write", out],
                [huge + ": error: /goals/solve/move/L1/0: must lie within ±100000 mm (100 m) (got -1e+308)",
                 huge + ": error: /goals/solve/move/L1/1: must lie within ±100000 mm (100 m) (got 1e+308)"], out)
        twice = os.path.join(bad, "move-twice.json")
        refused("solve with a lens given two move ranges", [rv, "solve", twice, "--write", out],
                [twice + ":13:49: error: /goals/solve/move/L1: duplicate key \"L1\" (the first stands at line 13, column 32)"],
                out)
        table = os.path.join(bad, "table-out-of-range.json")
        png = os.path.join(scratch, "t.png")
        refused("render a table of 1e-9 by 1e6 mm", [rv, "render", table, "--png", png],
                [table + ": error: /table/size_mm/0: must be between 10 and 100000 mm (got 1e-09)",
                 table + ": error: /table/size_mm/1: must be between 10 and 100000 mm (got 1000000)"], png)
    coincident = os.path.join(source, "tests", "layouts", "findings", "coincident-lenses.json")
    found("two lenses 0.05 mm apart", [rv, "check", coincident],
          coincident + ": problem: /elements/0 (L1): [coincident-optics] probe: lies 0.050 mm from L1_copy: "
          "two optics in one place, the trace meets only one of them; move one")
    for f in failures:
        print("FAIL:", f)
    print("door limits: %d failure(s)" % len(failures))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
