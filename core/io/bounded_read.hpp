#pragma once
// The one way the program reads a whole file (layouts, lens catalogs, the recovery file, the
// recent-files list): a regular file of at most max_bytes, or a sentence saying why not.
//
// Why: an ifstream reads /dev/zero or a pipe until memory runs out, and a size checked before
// reading does not bound a file that grows while it is read. So the file's type is checked
// before it is opened (opening a FIFO would wait for a writer), checked again on the open file
// (the name may have been replaced in between), and at most max_bytes + 1 bytes are ever read.

#include <cstddef>
#include <filesystem>
#include <string>
#include <string_view>

namespace rv {

struct BoundedRead {
    std::string text;   // the whole file, when error is empty
    std::string error;  // why it was not read: a sentence without the path (the caller names it)
    bool ok() const { return error.empty(); }
};

// `what` names the file's role in the size refusal ("a layout", "a lens catalog").
BoundedRead read_file_bounded(const std::filesystem::path& path, std::size_t max_bytes,
                              std::string_view what = "a file");

}  // namespace rv
