"""Bounded reads and counted combinations (issue 19 item 2), through the command line.

- `check` of /dev/zero, of a FIFO and of a directory exits 2 at once with the file's type:
  nothing is read (a FIFO with no writer would block an ordinary open; /dev/zero never ends).
- `solve --catalog` with a catalog over 16 MiB is refused with the limit.
- `solve` with a catalog of 20 000 lenses and two swapped lenses is refused with the count
  before any combination is built (it used to build 400 million and run out of memory).
- `polarize --power-mw nan` and `inf` exit 2: no numeric option takes a non-finite number.

Each run has a timeout of a few seconds: a read that does not stop fails the test.

usage: check_bounded_reads.py RENDEZVOUS SFG_BBO_LAYOUT
"""
import json
import os
import subprocess
import sys
import tempfile

failures = []


def run(rv, *args, timeout_s=10):
    try:
        p = subprocess.run([rv, *args], stdout=subprocess.PIPE, stderr=subprocess.PIPE, timeout=timeout_s)
    except subprocess.TimeoutExpired:
        failures.append("%s: no answer within %d s" % (" ".join(args), timeout_s))
        return None
    return p.returncode, p.stderr.decode("utf-8", errors="replace")


def expect(rv, args, wanted, timeout_s=10):
    got = run(rv, *args, timeout_s=timeout_s)
    if got is None:
        return
    status, err = got
    label = " ".join(os.path.basename(a) if os.sep in a else a for a in args)
    if status != 2:
        failures.append("%s: exit status %d, expected 2 (stderr %r)" % (label, status, err[:300]))
    if wanted not in err:
        failures.append("%s: expected %r in stderr, got %r" % (label, wanted, err[:300]))


def lens(i):
    return {"id": "f%d" % i, "kind": "achromat", "focal_length_mm": 50 + i * 0.01, "diameter_mm": 25.4}


def main():
    rv, sfg = sys.argv[1], sys.argv[2]
    expect(rv, ["check", "/dev/zero"], "/dev/zero: error: not read: it is a character device, not a regular file",
           timeout_s=5)
    with tempfile.TemporaryDirectory() as folder:
        fifo = os.path.join(folder, "layout.json")
        os.mkfifo(fifo)
        expect(rv, ["check", fifo], fifo + ": error: not read: it is a FIFO (named pipe), not a regular file",
               timeout_s=5)
        expect(rv, ["check", folder], folder + ": error: not read: it is a directory, not a regular file",
               timeout_s=5)

        # Two lenses on the pump's own path swapped: both choices come from the one catalog.
        with open(sfg) as f:
            layout = json.load(f)
        layout["goals"]["solve"]["swap"] = ["L1_P", "L2_P"]
        two_swaps = os.path.join(folder, "two-swaps.json")
        with open(two_swaps, "w") as f:
            json.dump(layout, f)

        catalog = {"format": "rendezvous-lens-catalog", "version": 1, "name": "generated",
                   "lenses": [lens(i) for i in range(20000)]}
        many = os.path.join(folder, "many.json")
        with open(many, "w") as f:
            json.dump(catalog, f)
        expect(rv, ["solve", two_swaps, "--catalog", many],
               "20000 catalog lenses for 2 swapped lenses make 400000000 combinations, more than the maximum of 50000")

        # Over 16 MiB: a long name, so the size alone decides.
        big = os.path.join(folder, "big.json")
        with open(big, "w") as f:
            f.write('{"format": "rendezvous-lens-catalog", "version": 1, "name": "' + "x" * (17 << 20) + '", "lenses": []}')
        size = os.path.getsize(big)
        expect(rv, ["solve", sfg, "--catalog", big],
               "%s: error: the file has %d bytes; a lens catalog may have at most 16777216 (16 MiB)" % (big, size))

    for value in ["nan", "inf", "-inf", "1e999"]:
        expect(rv, ["polarize", sfg, "--plate", "HWP_P", "--power-mw", value],
               'expected a finite number, got "%s"' % value)
    expect(rv, ["sweep", sfg, "--vary", "S1.position_mm", "--from", "nan", "--to", "1"],
           'expected a finite number, got "nan"')
    expect(rv, ["calibrate", sfg, "--zero", "inf"], 'expected a finite number, got "inf"')

    for f in failures:
        print("FAIL:", f)
    print("%d failure(s)" % len(failures))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
