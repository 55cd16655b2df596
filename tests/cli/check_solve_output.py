#!/usr/bin/env python3
"""What `rendezvous solve` writes and refuses, through the real program:
1. A destination it could never write (a missing folder, a directory, a path through a file, the
   input itself) is refused with exit 2 before the search: nothing on stdout (the ranking is
   printed before the layout is written), one "cannot write" line, nothing created, the input
   unchanged. The same with --json.
2. On every bundled layout (globbed, so a new one is covered): every two-beam layout carries its
   own goals.solve; solve exits 0 and writes a layout whose moved positions are written with at
   most three decimals (0.001 mm, no 99.9999999999999) and whose swapped lenses hold their
   catalog id as "part"; no two of its solutions differ only by a lens's diameter (the bundled
   catalog's ids name the diameter: "plano-convex-25.4mm-f100"); solve runs again on what it wrote
   (the parts agree with the catalog); the build sheet's parts list names each chosen lens by
   its part.
3. A lens whose part the catalog does not hold is refused with the lens's pointer and id, exit 2,
   nothing written.
Usage: check_solve_output.py RENDEZVOUS SOURCE_DIR"""
import glob
import json
import os
import re
import shutil
import subprocess
import sys
import tempfile

rv, top = os.path.abspath(sys.argv[1]), sys.argv[2]
failures = []


def check(ok, what):
    if not ok:
        failures.append(what)


def run(*args):
    return subprocess.run([rv, *args], capture_output=True, text=True)


def decimals(literal):
    """Digits after the point of a number as the file spells it (1e-3 style counts its exponent)."""
    m = re.fullmatch(r"-?\d+(?:\.(\d+))?(?:[eE]([-+]?\d+))?", literal)
    if not m:
        return 99
    return max(0, len(m.group(1) or "") - int(m.group(2) or 0))


def literal_json(path):
    """The layout with every number kept as the text it was written as."""
    with open(path, encoding="utf-8") as f:
        return json.loads(f.read(), parse_float=str, parse_int=str)


def family(part):
    return re.sub(r"-\d+(\.\d+)?mm-", "-", part)


scratch = tempfile.mkdtemp(prefix="rv-solve-out-")
try:
    demo = os.path.join(top, "layouts", "sfg-bbo.json")
    src = os.path.join(scratch, "in.json")
    shutil.copyfile(demo, src)
    with open(src, "rb") as f:
        original = f.read()
    blocker = os.path.join(scratch, "a-file")
    with open(blocker, "w") as f:
        f.write("x")
    os.makedirs(os.path.join(scratch, "a-folder"))

    # 1. Refused before the search.
    for dest, why in ((os.path.join(scratch, "missing", "out.json"), "missing folder"),
                      (os.path.join(scratch, "a-folder"), "a directory"),
                      (os.path.join(blocker, "out.json"), "a path through a file"),
                      (src, "the input")):
        for extra in ([], ["--json"]):
            r = run("solve", src, "--write", dest, *extra)
            what = f"solve --write {why} {' '.join(extra)}".strip()
            lines = r.stderr.splitlines()
            check(r.returncode == 2, f"{what}: exit {r.returncode}, expected 2")
            check(r.stdout == "", f"{what}: printed {r.stdout[:200]!r} (it searched before refusing)")
            check(len(lines) == 1 and lines[0].startswith(f"rendezvous: cannot write {dest}"),
                  f"{what}: expected one 'cannot write {dest}' line, got {r.stderr!r}")
    check(not os.path.exists(os.path.join(scratch, "missing")), "a missing folder was created")
    check(sorted(os.listdir(scratch)) == ["a-file", "a-folder", "in.json"],
          f"the scratch folder holds {sorted(os.listdir(scratch))}")
    check(os.listdir(os.path.join(scratch, "a-folder")) == [], "something was written into the directory")
    with open(src, "rb") as f:
        check(f.read() == original, "the input changed")

    # 2. Every bundled layout.
    layouts = [p for p in sorted(glob.glob(os.path.join(top, "layouts", "*.json")))
               if os.path.basename(p) not in ("lenses.json", "schema.json")]
    check(len(layouts) >= 4, f"only {len(layouts)} bundled layouts found")
    for layout in layouts:
        name = os.path.basename(layout)
        with open(layout, encoding="utf-8") as f:
            given = json.load(f)
        if len(given["beams"]) == 2:
            check("solve" in given.get("goals", {}), f"{name}: a two-beam layout without its own goals.solve")
        out = os.path.join(scratch, "solved-" + name)
        r = run("solve", layout, "--json", "--write", out)
        check(r.returncode == 0, f"{name}: solve exit {r.returncode}: {r.stderr}")
        if r.returncode != 0:
            continue
        result = json.loads(r.stdout)
        written = literal_json(out)
        before = {e["id"]: e for e in literal_json(layout)["elements"]}
        for e in written["elements"]:
            old = before.get(e["id"], {})
            for key in ("at_mm", "normal_deg"):
                if key in e and e[key] != old.get(key):
                    values = e[key] if isinstance(e[key], list) else [e[key]]
                    bad = [v for v in values if decimals(v) > 3]
                    check(not bad, f"{name}: {e['id']}.{key} written as {bad}, more than 0.001")
        best = result["solutions"][0] if result["solutions"] else None
        if best:
            parts = {e["id"]: e.get("part") for e in written["elements"]}
            for s in best["swaps"]:
                check(parts.get(s["element"]) == s["part"],
                      f"{name}: {s['element']} written with part {parts.get(s['element'])}, chose {s['part']}")
            seen = [tuple(family(s["part"]) for s in sol["swaps"]) for sol in result["solutions"]]
            check(len(seen) == len(set(seen)), f"{name}: solutions that differ only by diameter: {seen}")
            for sol in result["solutions"]:
                for a in sol["also"]:
                    for s in a["swaps"]:
                        chosen = {x["element"]: x["part"] for x in sol["swaps"]}[s["element"]]
                        check(family(s["part"]) == family(chosen) and s["part"] != chosen,
                              f"{name}: 'also' names {s['part']} beside {chosen}")
            # The build sheet's parts list names each chosen lens by its part.
            sheet = run("sheet", out, "--json")
            check(sheet.returncode == 0, f"{name}: sheet of what solve wrote: exit {sheet.returncode}")
            if sheet.returncode == 0:
                listed = {i: p["part"] for p in json.loads(sheet.stdout)["parts"] for i in p["ids"]}
                for s in best["swaps"]:
                    check(listed.get(s["element"]) == s["part"],
                          f"{name}: the sheet lists {s['element']} as {listed.get(s['element'])}, not {s['part']}")
        again = run("solve", out)
        check(again.returncode == 0, f"{name}: solve on what it wrote: exit {again.returncode}: {again.stderr}")

    # 3. A part the catalog does not hold.
    with open(demo, encoding="utf-8") as f:
        bad = json.load(f)
    index = next(i for i, e in enumerate(bad["elements"]) if e["type"] == "lens" and e["id"] not in bad["goals"]["solve"].get("swap", []))
    lens_id = bad["elements"][index]["id"]
    bad["elements"][index]["part"] = "no-such-lens"
    bad_path = os.path.join(scratch, "bad-part.json")
    with open(bad_path, "w", encoding="utf-8") as f:
        json.dump(bad, f)
    out = os.path.join(scratch, "bad-out.json")
    r = run("solve", bad_path, "--write", out)
    check(r.returncode == 2, f"unknown part: exit {r.returncode}, expected 2")
    check(f"error: /elements/{index}/part ({lens_id}): no lens of the catalog has id \"no-such-lens\"" in r.stderr,
          f"unknown part: message {r.stderr!r}")
    check(not os.path.exists(out), "unknown part: a layout was written")
finally:
    shutil.rmtree(scratch, ignore_errors=True)

for f in failures:
    print("FAIL", f)
print(f"{len(failures)} failure(s)")
sys.exit(1 if failures else 0)
