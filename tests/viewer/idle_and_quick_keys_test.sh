#!/bin/sh
# Issue 17 §1 under Xvfb: the window at rest uses under 2 % of one core (its CPU time from
# /proc/PID/stat, utime + stime, over 5 s), and a key tap shorter than a frame is seen: xdotool
# sends Ctrl+Q down and up with no delay, and the window must quit by itself with status 0.
# Usage: idle_and_quick_keys_test.sh RENDEZVOUS_BINARY LAYOUT
set -eu
bin=$1
layout=$2
dir=$(mktemp -d)
trap 'rm -rf "$dir"' EXIT
export XDG_CONFIG_HOME="$dir/config"
cd "$dir"
xvfb-run -a -s '-screen 0 1600x1000x24' sh -c "
  \"$bin\" view \"$layout\" & pid=\$!
  sleep 4
  a=\$(awk '{print \$14 + \$15}' /proc/\$pid/stat)
  sleep 5
  b=\$(awk '{print \$14 + \$15}' /proc/\$pid/stat)
  limit=\$(( \$(getconf CLK_TCK) * 5 * 2 / 100 ))
  echo \"CPU ticks at rest over 5 s: \$((b - a)) (limit \$limit)\"
  test \$((b - a)) -lt \$limit || { kill \$pid; exit 1; }
  xdotool mousemove 200 200 key --delay 0 ctrl+q
  for k in 1 2 3 4 5 6 7 8 9 10; do kill -0 \$pid 2>/dev/null || break; sleep 0.5; done
  if kill -0 \$pid 2>/dev/null; then echo 'Ctrl+Q tapped was not seen'; kill \$pid; exit 1; fi
  wait \$pid
"
echo "idle under 2 % and a quick Ctrl+Q quits"
