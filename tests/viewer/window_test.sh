#!/bin/sh
# A real window under Xvfb: start the viewer on the demo, take a screenshot of the X screen with
# ImageMagick's import, and check that it is not blank and that both beams' colours appear.
# Usage: window_test.sh RENDEZVOUS_BINARY LAYOUT COLOUR_1030 COLOUR_780 (hex, as in
# tests/viewer/scene_test.cpp, which pins them)
set -eu
bin=$1
layout=$2
dir=$(mktemp -d)
trap 'rm -rf "$dir"' EXIT
export XDG_CONFIG_HOME="$dir/config"   # the recent-files list goes here, not into the user's config
# The viewer closes itself after 400 frames; the screenshot is taken while it is open.
# Started from an empty folder: the window's own settings must not land in it.
mkdir "$dir/cwd"
cd "$dir/cwd"
xvfb-run -a -s '-screen 0 1280x800x24' sh -c "
  \"$bin\" view \"$layout\" --quit-after-frames 400 &
  pid=\$!
  sleep 4
  import -window root \"$dir/shot.png\"
  wait \$pid
"
test -s "$dir/shot.png"
test -z "$(ls -A "$dir/cwd")" || { echo "the viewer left files in the folder it was started from:"; ls -A "$dir/cwd"; exit 1; }
# Colours present in the screenshot, as hex (ImageMagick's own convert, not a stand-in).
/usr/bin/convert "$dir/shot.png" -depth 8 -format %c histogram:info:- > "$dir/colours.txt"
colours=$(wc -l < "$dir/colours.txt")
echo "distinct colours: $colours"
test "$colours" -gt 50   # not blank
# Each beam's colour (near it: lines are anti-aliased) must cover some pixels: recolour the
# pixels within 12 % of it to pure green and count them.
for colour in "$3" "$4"; do
  n=$(/usr/bin/convert "$dir/shot.png" -fuzz 12% -fill '#00FF00' -opaque "$colour" -depth 8 -format %c histogram:info:- |
      grep -i '#00FF00' | sed 's/:.*//' | tr -d ' ')
  echo "pixels near $colour: ${n:-0}"
  test "${n:-0}" -gt 50 || { echo "beam colour $colour not found on screen"; exit 1; }
done
echo "window shows the table and both beams"
