"""A layout file over 100 MB, made at test time in a temporary folder (never committed):
`rendezvous check FILE` exits 2 with the size refusal and stays within a memory bound, so the
file is refused before it is read (io/layout_reader.hpp: kMaxLayoutBytes).

Peak memory is the child's maximum resident set size from getrusage (ru_maxrss, KiB on
Linux), not a virtual-memory limit: `ulimit -v` would also break the AddressSanitizer build,
which reserves terabytes of address space.

usage: check_huge_file.py RENDEZVOUS BYTES MAX_RSS_MB
"""
import os
import re
import resource
import subprocess
import sys
import tempfile


def main():
    rv, size, max_rss_mb = sys.argv[1], int(sys.argv[2]), int(sys.argv[3])
    with tempfile.TemporaryDirectory() as folder:
        path = os.path.join(folder, "huge.json")
        head = b'{"format": "rendezvous-layout", "version": 1, "name": "'
        tail = b'"}\n'
        block = b"x" * (1 << 20)
        with open(path, "wb") as f:
            f.write(head)
            left = size - len(head) - len(tail)
            while left > 0:
                f.write(block[:min(left, len(block))])
                left -= len(block)
            f.write(tail)
        actual = os.path.getsize(path)
        p = subprocess.run([rv, "check", path], stdout=subprocess.PIPE, stderr=subprocess.PIPE,
                           timeout=60)
        peak_mb = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss / 1024
    err = p.stderr.decode("utf-8", errors="replace")
    failures = []
    if p.returncode != 2:
        failures.append("exit status %d, expected 2" % p.returncode)
    want = "%s: error: the file has %d bytes; a layout may have at most 16777216 (16 MiB)" % (path, actual)
    if want not in err:
        failures.append("expected the refusal %r, got %r" % (want, err[:300]))
    if peak_mb > max_rss_mb:
        failures.append("peak resident memory %.0f MB, over %d MB" % (peak_mb, max_rss_mb))
    for f in failures:
        print("FAIL:", f)
    print("%d-byte file: exit %d, peak RSS %.1f MB" % (actual, p.returncode, peak_mb))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
