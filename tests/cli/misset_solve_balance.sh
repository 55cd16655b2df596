#!/bin/sh
# The solver issue's end-to-end case: the SFG demo with its signal telescope deliberately
# mis-set (second lens 8 mm too far), then `solve` and `balance`; the final report's verdict must
# be met in space and in time, and `tolerance` must name an optic for a fine mount.
# Usage: misset_solve_balance.sh RENDEZVOUS_BINARY SFG_LAYOUT
set -eu
bin=$1
dir=$(mktemp -d)
trap 'rm -rf "$dir"' EXIT
# The demo's own goals.solve replaced, not preceded by a second "solve" (a repeated key is an error).
/usr/bin/python3 - "$2" "$dir/misset.json" <<'PY'
import json, sys
layout = json.load(open(sys.argv[1]))
lens = next(e for e in layout["elements"] if e["id"] == "L2_S")
assert lens["at_mm"] == [310, 500], lens["at_mm"]
lens["at_mm"] = [318, 500]
layout["goals"]["solve"] = {"aim": "focus", "move": {"L2_S": [-20, 20], "X": [-10, 10]}}
json.dump(layout, open(sys.argv[2], "w"), indent=2)
PY
"$bin" report "$dir/misset.json" --json > "$dir/before.json"
"$bin" solve "$dir/misset.json" --write "$dir/solved.json" > /dev/null
"$bin" balance "$dir/solved.json" --write "$dir/balanced.json" > /dev/null
"$bin" report "$dir/balanced.json" --json > "$dir/after.json"
/usr/bin/python3 - "$dir/before.json" "$dir/after.json" <<'PY'
import json, sys
before, after = (json.load(open(p)) for p in sys.argv[1:3])
assert not before["verdict"]["space"]["met"], "the mis-set layout should fail in space"
assert after["verdict"]["space"]["met"], after["verdict"]["space"]
assert after["verdict"]["time"]["met"], after["verdict"]["time"]
print("space and time met after solve and balance")
PY
"$bin" tolerance "$dir/balanced.json" --samples 200 | grep -q "Put on a fine adjustment: .* position"
