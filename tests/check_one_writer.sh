#!/bin/bash
# One writer (issue 19 §6): every file the program writes goes through write_file_safely
# (core/io/atomic_file.cpp), so that each save keeps the file's mode and owner, writes through
# links, refuses hard-linked and special files and reads back before its rename.
#
# Fails when any C++ file of core/ or viewer/ other than the writer itself opens a file for
# writing another way: an output or read-write C++ stream, stdio's fopen or fwrite, a POSIX open
# for writing or creating, a rename, or the standard library's file copy. The one exception is
# viewer/edit/recovery_claim.cpp, which creates empty lock files (never content) to hold an
# flock on; its open calls are allowed there and only there.
#
# Usage: check_one_writer.sh [REPOSITORY_ROOT]   (default: the current directory)
set -u
export LC_ALL=C
root=${1:-.}
cd "$root" || { echo "no such directory: $root" >&2; exit 2; }
# Spelt in pieces so that this file does not match itself.
streams='std::(o|)fstream'
stdio='\b(fopen|fdopen|freopen|fwrite)\s*\('
posix='O_(WRONLY|RDWR|CREAT|TRUNC|APPEND)'
moves='(::rename|std::rename|filesystem::rename|filesystem::copy|fs::rename|fs::copy)\s*\('
found=$(grep -rnE --include='*.cpp' --include='*.hpp' "$streams|$stdio|$posix|$moves" core viewer |
        grep -v '^core/io/atomic_file\.cpp:' |
        grep -vE '^viewer/edit/recovery_claim\.cpp:[0-9]+:.*::open\(lock' )
if [ -n "$found" ]; then
    echo "files written outside core/io/atomic_file.cpp (write_file_safely):"
    echo "$found"
    exit 1
fi
echo "one writer: no other file writes in core/ or viewer/"
