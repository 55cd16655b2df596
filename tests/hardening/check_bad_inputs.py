"""Every hostile input exits with status 2 and says why: each fixture of tests/layouts/bad
through `check`, `report --json` and `trace`. A negative status (a signal: a crash, an abort, a
sanitizer's kill) or 0 fails, and so does a refusal without a located "error:" line.

usage: check_bad_inputs.py RENDEZVOUS FOLDER
"""
import os
import subprocess
import sys


def main():
    rv, folder = sys.argv[1], sys.argv[2]
    fixtures = sorted(f for f in os.listdir(folder) if f.endswith(".json"))
    failures = []
    for name in fixtures:
        path = os.path.join(folder, name)
        for command in (["check", path], ["report", path, "--json"], ["trace", path]):
            p = subprocess.run([rv] + command, stdout=subprocess.PIPE, stderr=subprocess.PIPE,
                               timeout=60)
            err = p.stderr.decode("utf-8", errors="replace")
            what = "%s %s" % (command[0], name)
            if p.returncode < 0:
                failures.append("%s: killed by signal %d" % (what, -p.returncode))
            elif p.returncode != 2:
                failures.append("%s: exit status %d, expected 2" % (what, p.returncode))
            elif not any(l.startswith(path + ":") and " error: " in l for l in err.splitlines()):
                failures.append("%s: no error line naming the file: %r" % (what, err[:200]))
            elif p.stdout:
                failures.append("%s: printed %d bytes on stdout besides the error" % (what, len(p.stdout)))
    for f in failures:
        print("FAIL:", f)
    print("%d hostile fixtures x 3 commands" % len(fixtures))
    if len(fixtures) < 30:
        print("FAIL: expected at least 30 fixtures in", folder)
        return 1
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
