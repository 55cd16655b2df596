#!/usr/bin/env python3
"""rendezvous scan: the CSV parses (RFC 4180, Python's csv module) with units in the header and
holds the grid the text states (N x M cells, the peak's value and place); the PNG has the size
asked for (its IHDR chunk, PNG specification §11.2.2); bad arguments exit 2 with a message.

usage: check_scan.py RENDEZVOUS LAYOUTS_DIR
"""
import csv
import json
import io
import os
import re
import struct
import subprocess
import sys
import tempfile

rv, layouts = sys.argv[1], sys.argv[2]
sfg = os.path.join(layouts, "sfg-bbo.json")
shg = os.path.join(layouts, "shg-single.json")
failures = []


def check(ok, what):
    if not ok:
        failures.append(what)


def run(*args):
    return subprocess.run([rv, *args], capture_output=True)


with tempfile.TemporaryDirectory() as d:
    # CSV on stdout, plan on stderr; a 7 x 5 grid.
    p = run("scan", sfg, "--csv", "-", "--points", "7x5")
    check(p.returncode == 0, f"scan --csv - exit {p.returncode}: {p.stderr.decode()}")
    text = p.stderr.decode()
    rows = list(csv.reader(io.StringIO(p.stdout.decode(), newline="")))
    header, body = rows[0], rows[1:]
    # The crystal's rotation is named by how it turns (a tilt about the table's normal or a turn
    # about the beam); the text's plan line says which.
    how = re.search(r"crystal X (tilt|turn):", text)
    check(how is not None, "the text names the crystal's rotation: " + text)
    rotation = how.group(1) if how else "tilt"
    check(header == ["S1_position_mm", f"X_{rotation}_deg", "delay_fs", "power_mw"], f"header {header}")
    check(all(re.search(r"_(mm|deg|fs|mw)$", h) for h in header), f"units in header {header}")
    check(len(body) == 35, f"{len(body)} rows, expected 7 x 5 = 35")
    check(f"map: 7 × 5 cells" in text, "the text states the grid")
    values = [float(r[3]) for r in body]
    check(all(v >= 0 for v in values), "every cell a number")
    check("nan" not in p.stdout.decode().lower() and "inf" not in p.stdout.decode().lower(), "no NaN/inf")
    m = re.search(r"peak on the map ([0-9.e+-]+) mW at stage ([0-9.+-]+) mm, " + rotation + r" ([0-9.+-]+) deg", text)
    check(m is not None, "the text gives the peak and where: " + text)
    if m:
        best = max(body, key=lambda r: float(r[3]))
        check(abs(float(best[3]) - float(m.group(1))) <= 1e-3 * float(m.group(1)), f"peak {best} vs {m.groups()}")
        check(abs(float(best[0]) - float(m.group(2))) < 1e-3 and abs(float(best[1]) - float(m.group(3))) < 1e-3,
              f"peak place {best} vs {m.groups()}")
    stages = sorted({float(r[0]) for r in body})
    turns = sorted({float(r[1]) for r in body})
    check(len(stages) == 7 and len(turns) == 5, f"{len(stages)} stages x {len(turns)} turns")

    # The advice applied as a user would: set the stage and the crystal to the plan's predicted
    # peak, re-run the report, and the time and phase lines are met, with the generated power the
    # scan promised (within 2 %: the map keeps the beams as traced, and turning the crystal also
    # moves them a little).
    p = run("scan", sfg)
    check(p.returncode == 0, f"scan exit {p.returncode}: {p.stderr.decode()}")
    plan_text = p.stdout.decode() + p.stderr.decode()
    peak = re.search(r"peak on the map ([0-9.e+-]+) mW at stage ([0-9.+-]+) mm, tilt ([0-9.+-]+) deg", plan_text)
    check(peak is not None, "the plan names its peak as a stage position and a tilt: " + plan_text)
    if peak:
        peak_mw, stage_mm, tilt_deg = (float(g) for g in peak.groups())
        with open(sfg) as f:
            doc = json.load(f)
        for e in doc["elements"]:
            if e["type"] == "stage":
                e["position_mm"] = stage_mm
            if e["type"] == "crystal":
                e["tilt_deg"] = e.get("tilt_deg", 0) + tilt_deg  # "tilt from now": + = the face normal rises
        applied = os.path.join(d, "applied.json")
        with open(applied, "w") as f:
            json.dump(doc, f)
        p = run("report", applied, "--json")
        check(p.returncode == 0, f"report of the applied plan: exit {p.returncode}: {p.stderr.decode()}")
        report = json.loads(p.stdout.decode())
        check(report["verdict"]["time"]["met"] is True and report["verdict"]["phase"]["met"] is True,
              f"the applied plan meets time and phase: {report['verdict']}")
        now_mw = report["generated"]["now"]["average_mw"]
        check(abs(now_mw - peak_mw) <= 0.02 * peak_mw, f"generated {now_mw} mW against the scan's {peak_mw} mW")

    # Files: CSV and PNG of a stated size, through the atomic writer (a file each).
    png = os.path.join(d, "m.png")
    csvf = os.path.join(d, "m.csv")
    p = run("scan", sfg, "--png", png, "--csv", csvf, "--size", "640x480", "--points", "21x21")
    check(p.returncode == 0, f"scan --png exit {p.returncode}: {p.stderr.decode()}")
    with open(png, "rb") as f:
        head = f.read(24)
    check(head[:8] == b"\x89PNG\r\n\x1a\n", "PNG signature")
    w, h = struct.unpack(">II", head[16:24])
    check((w, h) == (640, 480), f"PNG size {w}x{h}")
    with open(csvf, newline="") as f:
        check(len(list(csv.reader(f))) == 1 + 21 * 21, "CSV file rows")
    check("points to scan before giving up:" in p.stdout.decode(), "plan text")

    # SHG of one beam: no stage column values.
    p = run("scan", shg, "--csv", "-")
    check(p.returncode == 0, f"shg scan exit {p.returncode}: {p.stderr.decode()}")
    shg_rows = list(csv.reader(io.StringIO(p.stdout.decode(), newline="")))
    check(all(r[0] == "" and r[2] == "" for r in shg_rows[1:]), "SHG: no stage, no delay")

    # The input is never overwritten.
    copy = os.path.join(d, "in.json")
    with open(sfg) as f, open(copy, "w") as g:
        g.write(f.read())
    p = run("scan", copy, "--csv", copy)
    check(p.returncode == 2, f"scan over its input: exit {p.returncode}")

    # Bad arguments: exit 2 with a message naming the option or the place.
    for args, word in [
        (["--points", "1001x5"], "--points"),
        (["--points", "7"], "--points"),
        (["--points", "0x3"], "--points"),
        (["--size", "10x10"], "--size"),
        (["--size", "axb"], "--size"),
        (["--csv", "-", "--png", "-"], "standard output"),
    ]:
        p = run("scan", sfg, *args)
        check(p.returncode == 2 and word in p.stderr.decode(), f"{args}: exit {p.returncode}, {p.stderr.decode()!r}")
    nostage = os.path.join(d, "nostage.json")
    with open(sfg) as f:
        src = f.read()
    src = "\n".join(l for l in src.splitlines() if '"type": "stage"' not in l)
    with open(nostage, "w") as f:
        f.write(src)
    p = run("scan", nostage)
    check(p.returncode == 2 and "/elements" in p.stderr.decode() and "stage" in p.stderr.decode(),
          f"no stage: exit {p.returncode}, {p.stderr.decode()!r}")
    p = run("scan", os.path.join(d, "missing.json"))
    check(p.returncode == 2, f"missing file: exit {p.returncode}")

for f in failures:
    print("FAIL:", f)
sys.exit(1 if failures else 0)
