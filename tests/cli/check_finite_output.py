"""No NaN or infinity as a number (issue 19 §1), through the command line: the reproducers of
the issue, each with its exit status and exact message, within 2 s each.

- `sweep` over a range whose width overflows (±1e308) used to say "found null (at position_mm
  = -nan)": the command line now refuses the bound at the door (viewer/cli/number_option.hpp),
  with the range it takes and the value as typed.
- `solve` with a ±1e308 move range used to print "move L2_P by -nan mm" (the range's half
  width overflowed): whatever it then does, it prints no NaN or infinity and writes no null.
- No output of either holds "nan", "-nan", "inf" or "infinity" as a word.

usage: check_finite_output.py RENDEZVOUS SFG_BBO_LAYOUT
"""
import json
import os
import re
import subprocess
import sys
import tempfile
import time

NOT_FINITE = re.compile(r"(?<![A-Za-z])[-+]?(nan|inf|infinity)(?![A-Za-z])", re.IGNORECASE)
failures = []


def run(rv, *args, timeout_s=30):
    start = time.monotonic()
    p = subprocess.run([rv, *args], stdout=subprocess.PIPE, stderr=subprocess.PIPE, timeout=timeout_s)
    return p.returncode, p.stdout.decode("utf-8", "replace"), p.stderr.decode("utf-8", "replace"), time.monotonic() - start


def no_non_finite(label, *texts):
    for t in texts:
        m = NOT_FINITE.search(t)
        if m:
            failures.append("%s: prints a non-finite number: ...%s..." % (label, t[max(0, m.start() - 60):m.end() + 20]))


def main():
    rv, sfg = sys.argv[1], sys.argv[2]
    label = "sweep S1.position_mm over ±1e308"
    status, out, err, took_s = run(rv, "sweep", sfg, "--vary", "S1.position_mm", "--from", "-1e308", "--to", "1e308",
                                   "--steps", "3", "--csv")
    if status != 2:
        failures.append("%s: exit status %d, expected 2" % (label, status))
    wanted = ('rendezvous: error: --from: expected a number between -1000000000000 and 1000000000000 '
              '(in the field\'s unit), got "-1e308"')
    if wanted not in err:
        failures.append("%s: expected %r in stderr, got %r" % (label, wanted, err[:400]))
    if took_s > 2:
        failures.append("%s: took %.1f s, more than 2 s" % (label, took_s))
    no_non_finite(label, out, err)

    with tempfile.TemporaryDirectory() as folder:
        with open(sfg) as f:
            layout = json.load(f)
        layout["goals"]["solve"]["move"] = {"L2_P": [-1e308, 1e308], "L2_S": [-1e308, 1e308]}
        layout["goals"]["solve"].pop("swap", None)
        src = os.path.join(folder, "huge-moves.json")
        with open(src, "w") as f:
            json.dump(layout, f)
        dest = os.path.join(folder, "solved.json")
        label = "solve with ±1e308 moves"
        status, out, err, took_s = run(rv, "solve", src, "--write", dest)
        no_non_finite(label, out, err)
        if status == 0:
            with open(dest) as f:
                written = f.read()
            if "null" in written or NOT_FINITE.search(written):
                failures.append("%s: wrote a null or non-finite value" % label)
        elif status != 2:
            failures.append("%s: exit status %d, expected 0 or 2 (stderr %r)" % (label, status, err[:300]))
        elif os.path.exists(dest):
            failures.append("%s: exit 2 but %s was written" % (label, dest))

    if failures:
        print("\n".join(failures))
        return 1
    print("no NaN or infinity printed or written by the reproducers")
    return 0


if __name__ == "__main__":
    sys.exit(main())
