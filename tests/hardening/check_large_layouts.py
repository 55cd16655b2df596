"""Linear time (issue 19 §3), through the command line: a layout of 100 000 elements, in each of
the four shapes that once took quadratic time (every id lookup, stage placement and reference
check scanned all elements), is read, traced and reported within 2 s of CPU and 500 MB.

The layouts are made here, in a temporary folder (no 100 000-element file is committed):
- scattered: 100 000 dumps off the beam's line, one beam to a target;
- aim-chain: 100 000 mirrors off the line, each aiming at the next (the last at the target);
- one-stage: one stage carrying 99 999 dumps;
- many-stages: 49 999 stages, each carrying one of 50 000 dumps (with the target, 100 000).

Each of `check`, `trace` and `report --json` must exit 0 within the bounds (CPU time and peak
memory as the kernel counts them for the child, from wait4, so that a busy machine does not
fail it). With --figures it prints each run's CPU time and peak memory (docs/performance.md).

usage: check_large_layouts.py RENDEZVOUS [--figures]
"""
import json

import measured_run
import os
import sys
import tempfile

ELEMENTS = 100_000
MAX_CPU_S = 2.0
MAX_RSS_KB = 500 * 1024
WALL_TIMEOUT_S = 120


def base(name):
    # A 100 m square table (the largest the reader takes); the beam runs along y = 50 mm.
    return {
        "format": "rendezvous-layout", "version": 1, "name": name,
        "table": {"size_mm": [100000, 100000]},
        "beams": [{"id": "pump", "wavelength_nm": 1030, "start_mm": [10, 50], "direction_deg": 0,
                   "waist_um": 500}],
        "elements": [],
        "target": "T",
    }


def off_line(i):
    # Element i on a grid well above the beam's line: 320 per row, 300 mm apart (inside the table).
    return [100 + 300 * (i % 320), 1000 + 300 * (i // 320)]


def target():
    return {"id": "T", "type": "target", "at_mm": [500, 50]}


def scattered():
    doc = base("scattered optics")
    doc["elements"] = [{"id": "D%d" % i, "type": "dump", "at_mm": off_line(i)} for i in range(ELEMENTS - 1)]
    doc["elements"].append(target())
    return doc


def aim_chain():
    doc = base("an aim_at chain")
    n = ELEMENTS - 1
    doc["elements"] = [{"id": "M%d" % i, "type": "mirror", "at_mm": off_line(i),
                        "aim_at": "M%d" % (i + 1) if i + 1 < n else "T"} for i in range(n)]
    doc["elements"].append(target())
    return doc


def one_stage():
    doc = base("one stage carrying all")
    n = ELEMENTS - 2
    doc["elements"] = [{"id": "D%d" % i, "type": "dump", "at_mm": off_line(i)} for i in range(n)]
    doc["elements"].append({"id": "S", "type": "stage", "carries": ["D%d" % i for i in range(n)],
                            "axis_deg": 90, "position_mm": 5, "travel_mm": [0, 25]})
    doc["elements"].append(target())
    return doc


def many_stages():
    doc = base("49 999 stages")
    n = ELEMENTS // 2 - 1
    doc["elements"] = [{"id": "D%d" % i, "type": "dump", "at_mm": off_line(i)} for i in range(n + 1)]
    doc["elements"] += [{"id": "S%d" % i, "type": "stage", "carries": ["D%d" % i], "axis_deg": 90,
                         "position_mm": 5, "travel_mm": [0, 25]} for i in range(n)]
    doc["elements"].append(target())
    return doc


SHAPES = [("scattered", scattered), ("aim-chain", aim_chain), ("one-stage", one_stage),
          ("many-stages", many_stages)]


def run_measured(args):
    """Exit status, CPU seconds and peak memory (kB) of the child, and its stderr."""
    got = measured_run.run_measured(args, WALL_TIMEOUT_S)
    if got is None:
        return None
    status, _, err, cpu_s, rss_kb = got
    return status, cpu_s, rss_kb, err

def main():
    rv = sys.argv[1]
    figures = "--figures" in sys.argv[2:]
    failures = []
    with tempfile.TemporaryDirectory() as folder:
        for name, make in SHAPES:
            doc = make()
            count = len(doc["elements"])
            if count != ELEMENTS:
                failures.append("%s: %d elements, expected %d" % (name, count, ELEMENTS))
            path = os.path.join(folder, name + ".json")
            with open(path, "w", encoding="utf-8") as f:
                json.dump(doc, f)
            for command in (["check"], ["trace"], ["report", "--json"]):
                label = "%s %s" % (" ".join(command), name)
                got = run_measured([rv, command[0], path] + command[1:])
                if got is None:
                    failures.append("%s: no answer within %d s" % (label, WALL_TIMEOUT_S))
                    continue
                status, cpu_s, rss_kb, err = got
                if figures:
                    print("%-24s %6.2f s CPU %6d MB" % (label, cpu_s, rss_kb // 1024))
                if status != 0:
                    failures.append("%s: exit status %d (stderr %r)" % (label, status, err[:300]))
                if cpu_s > MAX_CPU_S:
                    failures.append("%s: %.2f s of CPU, more than %.1f" % (label, cpu_s, MAX_CPU_S))
                if rss_kb > MAX_RSS_KB:
                    failures.append("%s: %d MB, more than %d" % (label, rss_kb // 1024, MAX_RSS_KB // 1024))
    for f in failures:
        print("FAIL:", f)
    print("%d layouts of %d elements, %d failure(s)" % (len(SHAPES), ELEMENTS, len(failures)))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
