"""Every command that writes a file goes through the one safe writer (core/io/atomic_file.hpp).
Checks, in a scratch folder, through the real program: a symbolic link (relative, into another
folder) is written through and stays a link; a device, a FIFO, a socket and a directory are
refused with exit status 2 and one line naming the path, and left unchanged; the input layout
is refused as the output (also through a link) except with format --in-place; a 0600 file stays
0600; a hard-linked file is refused; `-o -` and `--write -` print the layout; a layout holding
NaN is refused.
Usage: check_writers.py BINARY LAYOUT"""
import json
import os
import shutil
import socket
import stat
import subprocess
import sys
import tempfile

binary, layout = os.path.abspath(sys.argv[1]), os.path.abspath(sys.argv[2])
failures = []
scratch = tempfile.mkdtemp(prefix="rv-writers-")


def check(ok, what):
    if not ok:
        failures.append(what)


def run(*args):
    # In the scratch folder, so that a stray relative write ("-") lands there.
    return subprocess.run([binary, *args], capture_output=True, text=True, cwd=scratch)


def text(path):
    with open(path, encoding="utf-8") as f:
        return f.read()


def refused(result, path, reason, what):
    """Exit 2, and one line on stderr: "rendezvous: cannot write PATH...: REASON"."""
    lines = result.stderr.splitlines()
    check(result.returncode == 2, f"{what}: exit status {result.returncode}, expected 2")
    check(len(lines) == 1 and lines[0].startswith(f"rendezvous: cannot write {path}") and reason in lines[0],
          f"{what}: expected one line naming {path} with '{reason}', got {result.stderr!r}")


try:
    canonical = run("format", layout).stdout
    check(canonical.startswith("{"), "format prints the layout")

    def fresh_input(name="in.json"):
        path = os.path.join(scratch, name)
        shutil.copyfile(layout, path)
        return path

    src = fresh_input()

    # 1. A relative link in the same folder, and a relative link into another folder: the link
    # stays a link, its target holds the new layout, no file is left beside the link.
    os.makedirs(os.path.join(scratch, "a"))
    os.makedirs(os.path.join(scratch, "b"))
    with open(os.path.join(scratch, "b", "real.json"), "w") as f:
        f.write("old")
    os.symlink("../b/real.json", os.path.join(scratch, "a", "link.json"))
    r = run("format", src, "-o", os.path.join(scratch, "a", "link.json"))
    check(r.returncode == 0, f"format -o a link: {r.stderr}")
    check(os.path.islink(os.path.join(scratch, "a", "link.json")), "the link into b/ is still a link")
    check(text(os.path.join(scratch, "b", "real.json")) == canonical, "the link's target holds the layout")
    check(sorted(os.listdir(os.path.join(scratch, "a"))) == ["link.json"], "nothing new beside the link")
    with open(os.path.join(scratch, "near-target.json"), "w") as f:
        f.write("old")
    os.symlink("near-target.json", os.path.join(scratch, "near.json"))
    r = run("balance", src, "--write", os.path.join(scratch, "near.json"))
    check(r.returncode == 0, f"balance --write a relative link: {r.stderr}")
    check(os.path.islink(os.path.join(scratch, "near.json")), "the relative link is still a link")
    check(run("check", os.path.join(scratch, "near-target.json")).returncode == 0,
          "the relative link's target holds a layout")
    # format --in-place through a link: the link stays, the file it names is rewritten.
    messy = os.path.join(scratch, "messy.json")
    with open(messy, "w") as f:
        json.dump(json.loads(canonical), f)  # valid, not canonical
    os.symlink("messy.json", os.path.join(scratch, "messy-link.json"))
    r = run("format", os.path.join(scratch, "messy-link.json"), "--in-place")
    check(r.returncode == 0, f"format --in-place through a link: {r.stderr}")
    check(os.path.islink(os.path.join(scratch, "messy-link.json")), "--in-place keeps the link")
    check(text(messy) == canonical, "--in-place rewrote the link's target")

    # 2. Devices, a FIFO, a socket and a directory: refused before anything is written.
    # As root a broken writer could replace the system's /dev/null or /dev/stdout: aim at a private
    # node of the same device (1, 3) and a private link like /dev/stdout's then. Anyone else may
    # not replace /dev/null, so it is safe to aim at.
    null_device = "/dev/null"
    if os.geteuid() == 0:
        null_device = os.path.join(scratch, "null")
        os.mknod(null_device, 0o666 | stat.S_IFCHR, os.makedev(1, 3))
    r = run("format", src, "-o", null_device)
    refused(r, null_device, "it is a character device, not a regular file", "format -o /dev/null")
    check(stat.S_ISCHR(os.lstat(null_device).st_mode), "/dev/null is still a device")
    stdout_link = os.path.join(scratch, "stdout")
    os.symlink("/proc/self/fd/1", stdout_link)  # what /dev/stdout is; stdout is a pipe here
    r = run("format", src, "-o", stdout_link)
    refused(r, stdout_link, "it is a FIFO (named pipe), not a regular file", "format -o /dev/stdout")
    check(os.path.islink(stdout_link), "the link to stdout is still a link")
    fifo = os.path.join(scratch, "pipe")
    os.mkfifo(fifo)
    r = run("calibrate", src, "--zero", "30", "--write", fifo)
    refused(r, fifo, "it is a FIFO (named pipe), not a regular file", "calibrate --write FIFO")
    check(stat.S_ISFIFO(os.lstat(fifo).st_mode), "the FIFO is still a FIFO")
    sock_path = os.path.join(scratch, "sock")
    sock = socket.socket(socket.AF_UNIX, socket.SOCK_STREAM)
    sock.bind(sock_path)
    r = run("render", src, "--svg", sock_path)
    refused(r, sock_path, "it is a socket, not a regular file", "render --svg socket")
    sock.close()
    folder = os.path.join(scratch, "folder")
    os.makedirs(folder)
    r = run("render", src, "--png", folder, "--size", "64x64")
    refused(r, folder, "it is a directory, not a regular file", "render --png directory")
    r = run("polarize", src, "--plate", "HWP_P", "--write", folder)
    refused(r, folder, "it is a directory, not a regular file", "polarize --write directory")
    check(os.listdir(folder) == [], "the directory is unchanged")

    # 3. The input as the output: refused with how to do it on purpose, also through a link and
    # another spelling; format says --in-place.
    before = text(src)
    os.symlink("in.json", os.path.join(scratch, "in-link.json"))
    for spelling in [src, os.path.join(scratch, ".", "in.json"), os.path.join(scratch, "in-link.json")]:
        r = run("balance", src, "--write", spelling)
        refused(r, spelling, "it is the input file", f"balance --write {spelling}")
        check("write elsewhere and then move" in r.stderr, f"the refusal says how to replace it: {r.stderr!r}")
        check("wrote" not in r.stdout, "nothing said to be written")
    r = run("calibrate", src, "--zero", "30", "--write", os.path.join(scratch, "in-link.json"))
    refused(r, os.path.join(scratch, "in-link.json"), "it is the input file", "calibrate --write input")
    r = run("format", src, "-o", os.path.join(scratch, "in-link.json"))
    refused(r, os.path.join(scratch, "in-link.json"), "use --in-place", "format -o input")
    r = run("render", src, "--svg", src)
    refused(r, src, "it is the input file", "render --svg input")
    check(text(src) == before, "the input is unchanged")
    check(os.path.islink(os.path.join(scratch, "in-link.json")), "the link to the input is still a link")

    # 4. Permission bits kept: a 0600 file stays 0600.
    private = fresh_input("private.json")
    os.chmod(private, 0o600)
    r = run("format", private, "--in-place")
    check(r.returncode == 0, f"format --in-place a 0600 file: {r.stderr}")
    check(stat.S_IMODE(os.stat(private).st_mode) == 0o600,
          f"mode {oct(stat.S_IMODE(os.stat(private).st_mode))}, expected 0o600")

    # 5. A file with two hard links: refused (the rename would part it from the other name).
    shared = fresh_input("shared.json")
    os.link(shared, os.path.join(scratch, "shared-too.json"))
    before = text(shared)
    r = run("format", shared, "--in-place")
    refused(r, shared, "it has 2 hard links", "format --in-place a hard-linked file")
    check(text(shared) == before and os.stat(shared).st_nlink == 2, "the hard-linked file is unchanged")

    # 6. "-": the layout on standard output, the summary on standard error.
    r = run("format", src, "-o", "-")
    check(r.returncode == 0 and r.stdout == canonical, "format -o - prints the canonical layout")
    r = run("balance", src, "--write", "-")
    check(r.returncode == 0, f"balance --write -: {r.stderr}")
    try:
        printed = json.loads(r.stdout)
    except ValueError:
        printed = {}
    check(printed.get("format") == "rendezvous-layout", "balance --write - prints only the layout")
    check("delay now" in r.stderr, "balance --write - says its summary on stderr")
    check(not os.path.exists(os.path.join(scratch, "-")), "no file named '-'")

    # 7. Infinity: --zero 1e308 once overflowed the layout's emission time; it is now refused at
    # the door (a stage reading within ±100 m, issue 19 §1), nothing written or printed. The
    # writer's own refusal of NaN and infinity is safe_write_test's.
    out = os.path.join(scratch, "nan.json")
    r = run("calibrate", src, "--zero", "1e308", "--write", out)
    check(r.returncode == 2 and 'expected a number between -100000 and 100000 mm, got "1e308"' in r.stderr,
          f"calibrate --zero 1e308 refused at the door: {r.stderr!r}")
    check(not os.path.exists(out), "no infinite layout written")
    r = run("calibrate", src, "--zero", "1e308", "--write", "-")
    check(r.returncode == 2 and r.stdout == "", "no infinite layout printed")
    r = run("calibrate", src, "--zero", "nan", "--write", out)
    check(r.returncode == 2 and "expected a finite number" in r.stderr and not os.path.exists(out),
          f"calibrate --zero nan refused at the door: {r.stderr!r}")

    # Nothing left behind: no temporary file in any folder.
    for root, _, files in os.walk(scratch):
        for name in files:
            check(".tmp-" not in name, f"a temporary file was left: {os.path.join(root, name)}")
finally:
    shutil.rmtree(scratch)

for f in failures:
    print("FAIL:", f)
sys.exit(1 if failures else 0)
