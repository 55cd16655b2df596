#!/usr/bin/env python3
"""Follow every suggestion as a user would (issue 15, "Done means"): on the bundled SFG demo,
`solve --write`, then `balance --write`, then `phase --process sfg --write` give a layout whose
`report --check` exits 0 (space, time and phase met). The report's own phase advice names the
command that applies it: running that command must leave the phase line met. A second `phase`
on its own output turns nothing. A bad process exits 2 and writes nothing.
Usage: check_follow_the_advice.py RENDEZVOUS SOURCE_DIR"""
import json
import os

import jsonschema
import subprocess
import sys
import tempfile

rv, top = sys.argv[1], sys.argv[2]
demo = os.path.join(top, "layouts", "sfg-bbo.json")
failures = []


def run(*args, expect=0):
    r = subprocess.run([rv, *args], capture_output=True, text=True)
    if r.returncode != expect:
        failures.append(f"{' '.join(args)}: exit {r.returncode}, expected {expect}\n{r.stdout}{r.stderr}")
    return r


with tempfile.TemporaryDirectory() as d:
    solved, balanced, phased = (os.path.join(d, n) for n in ("solved.json", "balanced.json", "phased.json"))
    run("solve", demo, "--write", solved)
    run("balance", solved, "--write", balanced)
    run("phase", balanced, "--process", "sfg", "--write", phased)
    run("report", phased, "--check")
    verdict = json.loads(run("report", phased, "--json").stdout)["verdict"]
    for line in ("space", "time", "phase"):
        if verdict[line]["met"] is not True:
            failures.append(f"after solve, balance and phase: {line} not met: {verdict[line]['summary']}")

    # The written layout, with its crystal's tilt_deg and process, is one the file schema accepts.
    phased_layout = json.load(open(phased))
    crystal = [e for e in phased_layout["elements"] if e["id"] == phased_layout["target"]][0]
    if "tilt_deg" not in crystal or crystal.get("process") != "sfg":
        failures.append(f"the phased crystal lacks tilt_deg or process: {crystal}")
    try:
        jsonschema.validate(phased_layout, json.load(open(os.path.join(top, "layouts", "schema.json"))))
    except jsonschema.ValidationError as e:
        failures.append(f"the phased layout does not validate against layouts/schema.json: {e.message}")

    # The phase advice on the unbalanced demo names its command; follow it literally.
    action = json.loads(run("report", demo, "--json").stdout)["verdict"]["phase"]["action"]
    if "rendezvous phase --process sfg --write NEW.json" not in (action or ""):
        failures.append(f"the phase advice does not name the command that applies it: {action!r}")
    advised = os.path.join(d, "NEW.json")
    run("phase", demo, "--process", "sfg", "--write", advised)
    if json.loads(run("report", advised, "--json").stdout)["verdict"]["phase"]["met"] is not True:
        failures.append("the advised phase command did not meet the phase line")

    again = json.loads(run("phase", phased, "--process", "sfg", "--json").stdout)
    if abs(again["change_deg"]) > 0.0015:
        failures.append(f"phase on its own output turned the crystal again by {again['change_deg']}°")

    # Each process of the one crystal, and back.
    for process in ("shg:pump", "shg:signal", "sfg"):
        out = os.path.join(d, process.replace(":", "-") + ".json")
        j = json.loads(run("phase", phased, "--process", process, "--json", "--write", out).stdout)
        r = json.loads(run("report", out, "--json").stdout)
        if r["verdict"]["phase"]["met"] is not True or j["sinc2"]["after"] < 0.99:
            failures.append(f"--process {process}: phase not met after setting it ({r['verdict']['phase']['summary']})")

    bad = os.path.join(d, "bad.json")
    r = run("phase", demo, "--process", "shg:pmup", "--write", bad, expect=2)
    if "no beam has id \"pmup\"" not in r.stderr:
        failures.append(f"bad process message: {r.stderr!r}")
    if os.path.exists(bad):
        failures.append("a refused phase command wrote its output")

for f in failures:
    print("FAIL", f)
print("ok" if not failures else f"{len(failures)} failures")
sys.exit(1 if failures else 0)
