#pragma once
// What a file that is not a regular file is, in words, for the refusals of the safe writer and
// the bounded reader ("a directory", "a FIFO (named pipe)", …).
#include <sys/stat.h>

namespace rv {

inline const char* file_kind_text(mode_t mode) {
    if (S_ISDIR(mode)) return "a directory";
    if (S_ISCHR(mode)) return "a character device";
    if (S_ISBLK(mode)) return "a block device";
    if (S_ISFIFO(mode)) return "a FIFO (named pipe)";
    if (S_ISSOCK(mode)) return "a socket";
    return "a special file";
}

}  // namespace rv
