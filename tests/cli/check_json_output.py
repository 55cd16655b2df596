"""Runs a rendezvous command and checks that its standard output is one JSON object holding the
given keys (dotted paths). Usage: check_json_output.py BINARY KEY [KEY ...] -- ARGS..."""
import json
import subprocess
import sys

sep = sys.argv.index("--")
binary, keys, args = sys.argv[1], sys.argv[2:sep], sys.argv[sep + 1:]
run = subprocess.run([binary, *args], capture_output=True, text=True)
if run.returncode != 0:
    sys.exit(f"exit status {run.returncode}: {run.stderr}")
doc = json.loads(run.stdout)
for key in keys:
    node = doc
    for part in key.split("."):
        if not isinstance(node, dict) or part not in node:
            sys.exit(f"missing key {key}")
        node = node[part]
print(f"{len(keys)} keys present")
