#pragma once
// Replacing a file so that a crash at any moment leaves either the old or the new content:
// write a temporary file in the same folder, flush it to disk, rename it over the target
// (atomic on POSIX file systems), then flush the folder. A save killed before its rename leaves
// its temporary file (".NAME.tmp-XXXXXX"); the next save of NAME removes those older than
// kStaleTemporary (a save in progress elsewhere is far younger).

#include <chrono>
#include <filesystem>
#include <string_view>

namespace rv {

inline constexpr std::chrono::minutes kStaleTemporary{10};

// Throws std::runtime_error naming the path and the system's reason on failure; the
// temporary file is removed then.
void write_file_atomically(const std::filesystem::path& path, std::string_view content);

}  // namespace rv
