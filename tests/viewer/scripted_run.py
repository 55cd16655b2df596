"""A scripted session in the real window over X (issue 17, done means), every input sent by
xdotool as a user's would be, every key a tap far shorter than a frame (xdotool holds it under
a millisecond). Keys of a sequence follow each other KEY_GAP_MS apart: GLFW's X11 input drops a
press of a key that carries the same X timestamp, to the millisecond, as that key's previous
press (a filter for its input method), which no hand can type (with no gap, Down*14 arrives as
fewer presses); 2 ms apart, several presses still fall into one frame:

1. the window opens pump-probe.json; Ctrl+O opens the file dialog, the typed path of a copy of
   shg-single.json and Enter open it (the title names it);
2. every line of add_by_keys.txt: Shift+A over the table and that line's keys add one of each
   element kind and a beam (the title gains the unsaved mark); Ctrl+S saves, and the saved file
   holds every kind the reader knows and two beams;
3. a drag with snapping on, from the hole where all was added to a few pixels off another hole
   of the table's 25.4 mm grid (centres at 12.7 + 25.4 n mm; where the table is drawn is read
   from a screenshot), puts one of them exactly on that hole, saved; Ctrl+Z undoes it, saved
   again: it is back;
4. a plain click selects an optic and Delete removes it, saved;
5. Ctrl+Q quits (nothing unsaved) with status 0.

Runs under `xvfb-run -s '-screen 0 1600x1000x24'` (the window's own size).
usage: scripted_run.py RENDEZVOUS SOURCE_DIR
"""
import json
import os
import shutil
import subprocess
import sys
import tempfile
import time

failures = []
TICKS_PER_S = os.sysconf("SC_CLK_TCK")


def cpu_ticks(pid):
    fields = open("/proc/%d/stat" % pid).read().rsplit(")", 1)[1].split()
    return int(fields[11]) + int(fields[12])  # utime + stime


def settle(pid, quiet_s=0.3, timeout_s=20):
    """Waits until the window has drawn what the input asked for and waits for events again: no
    CPU time used over quiet_s (at rest it uses none; each queued key takes a frame or two)."""
    end = time.monotonic() + timeout_s
    before = cpu_ticks(pid)
    while time.monotonic() < end:
        time.sleep(quiet_s)
        now = cpu_ticks(pid)
        if now == before:
            return
        before = now
    failures.append("the window did not come to rest within %d s" % timeout_s)


KEY_GAP_MS = "2"


def xdo(*args):
    return subprocess.run(["xdotool", *args], capture_output=True, text=True, timeout=20).stdout.strip()


def keyed_choices(source):
    """The lines of add_by_keys.txt as (type, key names)."""
    out = []
    for line in open(os.path.join(source, "tests", "viewer", "add_by_keys.txt")):
        if not line.strip() or line.startswith("#"):
            continue
        what, keys = line.split(":", 1)
        names = []
        for k in keys.split():
            name, _, times = k.partition("*")
            names += [{"Down": "Down", "Up": "Up", "Right": "Right", "Space": "space"}[name]] * int(times or 1)
        out.append((what.split()[0], names))
    return out


def shot(name):
    """With RV_SHOTS=FOLDER, a screenshot there (for looking into a failure)."""
    folder = os.environ.get("RV_SHOTS")
    if folder:
        subprocess.run(["import", "-window", "root", os.path.join(folder, "%02d-%s.png" % (len(os.listdir(folder)), name))])


TABLE_RGB = bytes((236, 238, 240))  # the breadboard's fill (viewer/scene/scene.hpp, table_colour)


def table_rect(width_px=1600, height_px=1000):
    """The breadboard's rectangle on screen, (left, top, right, bottom) in pixels, from a
    screenshot: the bounding box of the pixels of its fill colour."""
    raw = subprocess.run(["import", "-window", "root", "-depth", "8", "rgb:-"], capture_output=True, timeout=20).stdout
    rows = []
    for y in range(height_px):
        row = raw[3 * width_px * y: 3 * width_px * (y + 1)]
        first = row.find(TABLE_RGB)
        while first >= 0 and first % 3:
            first = row.find(TABLE_RGB, first + 1)
        last = row.rfind(TABLE_RGB)
        while last >= 0 and last % 3:
            last = row.rfind(TABLE_RGB, 0, last)
        if first >= 0 and last - first > 300:  # a row across the table, not a stray pixel
            rows.append((y, first // 3, last // 3))
    if not rows:
        return None
    return min(r[1] for r in rows), rows[0][0], max(r[2] for r in rows), rows[-1][0]


def wait_for(predicate, what, timeout_s=10):
    end = time.monotonic() + timeout_s
    while time.monotonic() < end:
        if predicate():
            return True
        time.sleep(0.1)
    failures.append("timed out waiting for " + what)
    return False


def main():
    rv, source = os.path.abspath(sys.argv[1]), sys.argv[2]
    scratch = tempfile.mkdtemp(prefix="rv-scripted-")
    env = dict(os.environ, XDG_CONFIG_HOME=os.path.join(scratch, "config"))
    first, second = os.path.join(scratch, "first.json"), os.path.join(scratch, "second.json")
    shutil.copy(os.path.join(source, "layouts", "pump-probe.json"), first)
    shutil.copy(os.path.join(source, "layouts", "shg-single.json"), second)
    start = json.load(open(second))
    viewer = subprocess.Popen([rv, "view", first], cwd=scratch, env=env)
    try:
        window = ""
        for _ in range(100):
            window = xdo("search", "--onlyvisible", "--pid", str(viewer.pid))
            if window:
                break
            time.sleep(0.1)
        if not window:
            failures.append("no window appeared")
            return
        window = window.split()[0]
        title = lambda: xdo("getwindowname", window)  # noqa: E731
        time.sleep(1.0)
        # Until the other layout is open, anywhere over its table.
        table_point = ("850", "600")
        xdo("mousemove", "--window", window, *table_point)

        # 1. Open through the dialog, typing the path (Ctrl+A first: the field holds the folder).
        xdo("key", "--delay", "0", "ctrl+o")
        settle(viewer.pid)
        xdo("key", "--delay", "0", "ctrl+a")
        xdo("type", "--delay", KEY_GAP_MS, second)
        xdo("key", "--delay", "0", "Return")
        if not wait_for(lambda: "second.json" in title(), "the title to name second.json"):
            return

        # Where the breadboard is drawn, from a screenshot, gives every table point's pixel: the
        # one hole where all is added and the one a drag should snap onto.
        settle(viewer.pid)
        rect = table_rect()
        if rect is None:
            failures.append("no breadboard found on the screen")
            return
        pitch = start["table"].get("grid_mm", 25)
        width_mm, height_mm = start["table"]["size_mm"]

        def pixel(x_mm, y_mm):
            left, top, right, bottom = rect
            return (round(left + x_mm / width_mm * (right - left)), round(bottom - y_mm / height_mm * (bottom - top)))

        def hole(column, row):
            return (pitch / 2 + column * pitch, pitch / 2 + row * pitch)

        here_mm, there_mm = hole(17, 2), hole(14, 4)  # empty parts of shg-single's table
        table_point = tuple(str(v) for v in pixel(*here_mm))

        # 2. Every kind from the keyboard menu at the cursor.
        for kind, keys in keyed_choices(source):
            xdo("mousemove", "--window", window, *table_point)
            xdo("key", "--delay", "0", "shift+a")
            settle(viewer.pid)
            xdo("key", "--delay", KEY_GAP_MS, *keys)
            settle(viewer.pid)
            shot(kind)
        if "\u2022" not in title():
            failures.append("after the additions the title %r has no unsaved mark" % title())
        xdo("key", "--delay", "0", "ctrl+s")
        if not wait_for(lambda: "\u2022" not in title(), "the save to clear the unsaved mark"):
            return
        added = json.load(open(second))
        types = {e["type"] for e in added["elements"][len(start["elements"]):]}
        kinds = {"lens", "mirror", "dichroic", "plate", "retroreflector", "stage", "crystal", "target", "dump"}
        if types != kinds:
            failures.append("added kinds %s, expected %s" % (sorted(types), sorted(kinds)))
        if len(added["beams"]) != 2:
            failures.append("%d beams after adding one, expected 2" % len(added["beams"]))
        n_added = len(added["elements"]) - len(start["elements"])
        if n_added != 15:
            failures.append("%d elements added, expected 15" % n_added)

        # 3. Drag one of the things added from their hole to a few pixels off another, with
        # snapping on: it lands on that hole. The hand comes to the hole first (after keys worked
        # a menu, ImGui takes no hover for an item until the mouse moves).
        x, y = int(table_point[0]), int(table_point[1])
        xdo("mousemove", "--window", window, str(x + 40), str(y + 30))
        settle(viewer.pid)
        xdo("mousemove", "--window", window, str(x), str(y))
        settle(viewer.pid)
        xdo("mousedown", "1")
        tx, ty = pixel(*there_mm)
        tx, ty = tx + 5, ty - 4
        for k in range(1, 9):
            xdo("mousemove", "--window", window, str(x + (tx - x) * k // 8), str(y + (ty - y) * k // 8))
        xdo("mouseup", "1")
        settle(viewer.pid)
        shot("dragged")
        xdo("key", "--delay", "0", "ctrl+s")
        wait_for(lambda: "\u2022" not in title(), "the save after the drag")
        dragged = json.load(open(second))

        # The optics and the new beam's start all stand on the one hole; the drag takes one.
        def places(layout):
            return [(e["id"], e.get("at_mm")) for e in layout["elements"]] + [(b["id"], b["start_mm"]) for b in layout["beams"]]
        moved = [(a, b) for a, b in zip(places(added), places(dragged)) if a != b]
        if len(moved) != 1:
            failures.append("the drag moved %d things, expected 1" % len(moved))
        else:
            name, at = moved[0][1]
            if abs(at[0] - there_mm[0]) > 1e-6 or abs(at[1] - there_mm[1]) > 1e-6:
                failures.append("%s dragged to %s, expected the hole at %s" % (name, at, list(there_mm)))
        xdo("key", "--delay", "0", "ctrl+z")
        settle(viewer.pid)
        xdo("key", "--delay", "0", "ctrl+s")
        settle(viewer.pid)
        undone = json.load(open(second))
        if undone["elements"] != added["elements"]:
            failures.append("Ctrl+Z after the drag did not put the optic back")

        # 4. A plain click on the optics there selects one; Delete removes it.
        xdo("mousemove", "--window", window, str(x + 40), str(y + 30))
        settle(viewer.pid)
        xdo("mousemove", "--window", window, *table_point)
        settle(viewer.pid)
        xdo("click", "1")
        settle(viewer.pid)
        xdo("key", "--delay", "0", "Delete")
        settle(viewer.pid)
        xdo("key", "--delay", "0", "ctrl+s")
        settle(viewer.pid)
        deleted = json.load(open(second))
        if len(places(deleted)) != len(places(added)) - 1:
            failures.append("click and Delete: %d optics and beams, expected %d" % (len(places(deleted)), len(places(added)) - 1))

        # 5. Quit.
        xdo("key", "--delay", "0", "ctrl+q")
        try:
            status = viewer.wait(timeout=10)
            if status != 0:
                failures.append("the window exited with status %d" % status)
        except subprocess.TimeoutExpired:
            failures.append("Ctrl+Q did not quit the window")
    finally:
        if viewer.poll() is None:
            viewer.kill()
            viewer.wait()
        shutil.rmtree(scratch, ignore_errors=True)


if __name__ == "__main__":
    main()
    for f in failures:
        print("FAIL:", f)
    print("scripted window run: %d failure(s)" % len(failures))
    sys.exit(1 if failures else 0)
