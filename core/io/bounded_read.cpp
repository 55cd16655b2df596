#include "io/bounded_read.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <algorithm>
#include <cerrno>
#include <string>

#include "io/file_kind.hpp"

namespace rv {

namespace {

std::string not_regular(mode_t mode) {
    return std::string("not read: it is ") + file_kind_text(mode) + ", not a regular file";
}

std::string limit_text(std::size_t max_bytes) {
    constexpr std::size_t kMiB = std::size_t{1} << 20;
    std::string text = std::to_string(max_bytes);
    if (max_bytes >= kMiB && max_bytes % kMiB == 0)
        text += " (" + std::to_string(max_bytes / kMiB) + " MiB)";
    return text;
}

// The message the size-limit tests pin (tests/io/layout_reader_test.cpp, check_huge_file.py).
std::string too_large(const std::string& bytes, std::size_t max_bytes, std::string_view what) {
    return "the file has " + bytes + " bytes; " + std::string(what) + " may have at most " +
           limit_text(max_bytes);
}

// Closes the descriptor on every return.
struct Fd {
    int fd;
    ~Fd() {
        if (fd >= 0) ::close(fd);
    }
};

}  // namespace

BoundedRead read_file_bounded(const std::filesystem::path& path, std::size_t max_bytes,
                              std::string_view what) {
    BoundedRead out;
    struct stat st {};
    if (::stat(path.c_str(), &st) != 0) {
        out.error = "cannot open the file for reading";
        return out;
    }
    if (!S_ISREG(st.st_mode)) {
        out.error = not_regular(st.st_mode);
        return out;
    }
    // Refused unread when its size already says so (memory stays bounded either way).
    if (static_cast<std::uintmax_t>(st.st_size) > max_bytes) {
        out.error = too_large(std::to_string(st.st_size), max_bytes, what);
        return out;
    }
    // O_NONBLOCK: if the name became a FIFO since stat, open must not wait for a writer.
    const Fd file{::open(path.c_str(), O_RDONLY | O_CLOEXEC | O_NONBLOCK | O_NOCTTY)};
    if (file.fd < 0) {
        out.error = "cannot open the file for reading";
        return out;
    }
    if (::fstat(file.fd, &st) != 0 || !S_ISREG(st.st_mode)) {
        out.error = not_regular(st.st_mode);
        return out;
    }
    // At most max_bytes + 1: one byte past the limit proves the file grew beyond it.
    const std::size_t cap_bytes = max_bytes + 1;
    std::string text;
    text.resize(std::min<std::size_t>(cap_bytes, static_cast<std::size_t>(st.st_size) + 4096));
    std::size_t used = 0;
    while (used < cap_bytes) {
        if (used == text.size()) text.resize(std::min(cap_bytes, text.size() * 2));
        const ssize_t n = ::read(file.fd, text.data() + used, text.size() - used);
        if (n < 0 && errno == EINTR) continue;
        if (n < 0) {
            out.error = "cannot read the file";
            return out;
        }
        if (n == 0) break;
        used += static_cast<std::size_t>(n);
    }
    if (used > max_bytes) {
        out.error = too_large("more than " + std::to_string(max_bytes), max_bytes, what);
        return out;
    }
    text.resize(used);
    out.text = std::move(text);
    return out;
}

}  // namespace rv
