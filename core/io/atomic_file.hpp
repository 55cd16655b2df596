#pragma once
// The one way the project writes a file (every save, export, recovery file and list of recent
// files goes through write_file_safely), so that no save loses data at the edges:
//
// - Crash safety: the bytes go to a temporary file in the destination's folder, are flushed to
//   disk and read back, then renamed over the destination (atomic on POSIX file systems), and
//   the folder is flushed. A crash at any moment leaves the old or the new content. A save
//   killed before its rename leaves its temporary file (".NAME.tmp-XXXXXX"); the next save of
//   NAME removes those older than kStaleTemporary (a save in progress elsewhere is far younger).
// - A symbolic link is written through: the chain is followed to its final target, the
//   temporary file is made in the target's folder and renamed over the target, so the link stays
//   a link and the target holds the new content.
// - Only a regular file (or a name that does not exist yet) is replaced. A directory, device,
//   FIFO or socket is refused before anything is written: renaming over /dev/stdout, say,
//   would replace the system's link with a plain file.
// - A file with more than one hard link is refused: the rename would part it from its other
//   names, which would keep the old content.
// - The replaced file keeps its permission bits and, where the process may set them (as root),
//   its owner and group. A new file gets 0666 less the process's umask, as open(2) would.
// - SafeWriteRules adds a command's own rules: a file the destination must not be (its input)
//   and a check of the bytes read back (a layout must parse).

#include <chrono>
#include <filesystem>
#include <functional>
#include <string>
#include <string_view>

namespace rv {

inline constexpr std::chrono::minutes kStaleTemporary{10};

struct SafeWriteRules {
    // A file the destination must not be, compared by device and inode so that a link to it or
    // another spelling of its path counts too (a command's input layout). Empty: no such rule.
    std::filesystem::path must_not_be;
    // Appended to that refusal: how to replace the file on purpose.
    std::string how_to_replace_it;
    // Checks the bytes read back from the temporary file before the rename; returns why they
    // must not replace the destination, or "" when they may.
    std::function<std::string(std::string_view)> check_read_back;
};

// Replaces `path` by `content` as described above. Throws std::runtime_error with one line,
// "cannot write PATH: REASON", on a refusal or failure; nothing is changed then (the temporary
// file is removed).
void write_file_safely(const std::filesystem::path& path, std::string_view content,
                       const SafeWriteRules& rules = {});

// The refusals write_file_safely would give `path` before it writes (the kind of file there,
// hard links, the input rule, a folder that takes no new file), checked now: for a command that
// works long before it writes (solve), so that a destination it could never write is refused
// first. Nothing is changed: the temporary file it makes in the destination's folder to prove
// the folder takes one is removed at once. Throws as write_file_safely does ("cannot write
// PATH: REASON"). A later write can still fail (a full disk, a folder changed meanwhile).
void check_file_writable(const std::filesystem::path& path, const SafeWriteRules& rules = {});

}  // namespace rv
