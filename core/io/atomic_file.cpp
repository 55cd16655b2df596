#include "io/atomic_file.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>
#include <stdexcept>
#include <string>

namespace rv {

namespace {
[[noreturn]] void fail(const std::filesystem::path& path, const char* what, int err) {
    throw std::runtime_error("cannot save " + path.string() + ": " + what + ": " +
                             std::strerror(err));
}
// Temporary files of earlier saves of `path` that were killed before their rename.
void remove_stale_temporaries(const std::filesystem::path& folder, const std::filesystem::path& path) {
    const std::string prefix = "." + path.filename().string() + ".tmp-";
    std::error_code ec;
    const auto now = std::filesystem::file_time_type::clock::now();
    for (const auto& entry : std::filesystem::directory_iterator(folder, ec)) {
        const std::string name = entry.path().filename().string();
        if (name.size() != prefix.size() + 6 || name.compare(0, prefix.size(), prefix) != 0) continue;
        const auto modified = entry.last_write_time(ec);
        if (!ec && now - modified > kStaleTemporary) std::filesystem::remove(entry.path(), ec);
    }
}

}  // namespace

void write_file_atomically(const std::filesystem::path& path, std::string_view content) {
    const std::filesystem::path folder =
        path.has_parent_path() ? path.parent_path() : std::filesystem::path(".");
    remove_stale_temporaries(folder, path);
    std::string temp = (folder / ("." + path.filename().string() + ".tmp-XXXXXX")).string();
    const int fd = ::mkstemp(temp.data());
    if (fd < 0) fail(path, "creating a temporary file", errno);
    size_t written = 0;
    while (written < content.size()) {
        const ssize_t n = ::write(fd, content.data() + written, content.size() - written);
        if (n < 0) {
            if (errno == EINTR) continue;
            const int err = errno;
            ::close(fd);
            ::unlink(temp.c_str());
            fail(path, "writing", err);
        }
        written += static_cast<size_t>(n);
    }
    if (::fsync(fd) != 0 || ::fchmod(fd, 0644) != 0) {
        const int err = errno;
        ::close(fd);
        ::unlink(temp.c_str());
        fail(path, "flushing", err);
    }
    ::close(fd);
    if (::rename(temp.c_str(), path.c_str()) != 0) {
        const int err = errno;
        ::unlink(temp.c_str());
        fail(path, "renaming the temporary file", err);
    }
    // Make the rename itself durable.
    const int dir = ::open(folder.c_str(), O_RDONLY | O_DIRECTORY);
    if (dir >= 0) {
        ::fsync(dir);
        ::close(dir);
    }
}

}  // namespace rv
