"""One child run with what the kernel counted for it (the hardening scripts' shared helper):
exit status, standard output and error, CPU seconds and peak memory (kB), from wait4 (no shell,
no /usr/bin/time), so that a busy machine does not fail a budget. A child still running after
timeout_s of wall time is killed and the run is None."""
import os
import signal
import subprocess
import tempfile
import time


def run_measured(args, timeout_s):
    with tempfile.TemporaryFile() as out, tempfile.TemporaryFile() as err:
        p = subprocess.Popen(args, stdout=out, stderr=err)
        start = time.monotonic()
        while True:
            pid, status, usage = os.wait4(p.pid, os.WNOHANG)
            if pid == p.pid:
                break
            if time.monotonic() - start > timeout_s:
                p.send_signal(signal.SIGKILL)
                os.wait4(p.pid, 0)
                return None
            time.sleep(0.01)
        out.seek(0)
        err.seek(0)
        return (os.waitstatus_to_exitcode(status), out.read().decode("utf-8", "replace"),
                err.read().decode("utf-8", "replace"), usage.ru_utime + usage.ru_stime, usage.ru_maxrss)
