#include "io/atomic_file.hpp"

#include <fcntl.h>
#include <sys/stat.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>
#include <fstream>
#include <stdexcept>
#include <string>

#include "io/file_kind.hpp"

namespace rv {

namespace {

// Symbolic links followed before giving up: the kernel's own limit for a path (ELOOP).
constexpr int kMaxLinkHops = 40;

// Every refusal and failure is one line naming the file the caller gave.
struct Failure {
    std::string name;
    [[noreturn]] void operator()(const std::string& reason) const {
        throw std::runtime_error("cannot write " + name + ": " + reason);
    }
    [[noreturn]] void system(const std::string& doing, int err) const {
        (*this)(doing + ": " + std::strerror(err));
    }
};

// The name the rename must replace: `path` followed through its symbolic links one at a time
// (a relative link is relative to the folder holding it). The first name that is not a link, or
// does not exist, ends the chain, so a dangling link is written through to the file it names.
std::filesystem::path final_target(const std::filesystem::path& path, const Failure& fail) {
    std::filesystem::path p = path;
    for (int hop = 0; hop <= kMaxLinkHops; ++hop) {
        struct stat st {};
        if (::lstat(p.c_str(), &st) != 0 || !S_ISLNK(st.st_mode)) return p;
        std::error_code ec;
        const std::filesystem::path next = std::filesystem::read_symlink(p, ec);
        if (ec) fail.system("reading the symbolic link " + p.string(), ec.value());
        p = next.is_absolute() ? next : p.parent_path() / next;
    }
    fail("more than " + std::to_string(kMaxLinkHops) + " symbolic links in a row");
}

// The process's umask, read without changing it: umask(2) can only set it, and setting and
// restoring it would race with other threads creating files. Linux shows it in
// /proc/self/status; elsewhere the common 022.
mode_t current_umask() {
    std::ifstream status("/proc/self/status");
    for (std::string line; std::getline(status, line);)
        if (line.rfind("Umask:", 0) == 0)
            return static_cast<mode_t>(std::stoul(line.substr(6), nullptr, 8));
    return 022;
}

// Temporary files of earlier saves of `target` that were killed before their rename.
void remove_stale_temporaries(const std::filesystem::path& folder,
                              const std::filesystem::path& target) {
    const std::string prefix = "." + target.filename().string() + ".tmp-";
    std::error_code ec;
    const auto now = std::filesystem::file_time_type::clock::now();
    for (const auto& entry : std::filesystem::directory_iterator(folder, ec)) {
        const std::string name = entry.path().filename().string();
        if (name.size() != prefix.size() + 6 || name.compare(0, prefix.size(), prefix) != 0) continue;
        const auto modified = entry.last_write_time(ec);
        if (!ec && now - modified > kStaleTemporary) std::filesystem::remove(entry.path(), ec);
    }
}

// The temporary file of one save: closed, and removed unless it was renamed into place.
struct Temporary {
    std::string path;
    int fd = -1;
    bool renamed = false;
    ~Temporary() {
        if (fd >= 0) ::close(fd);
        if (!renamed && !path.empty()) ::unlink(path.c_str());
    }
};

// 0, or the errno of the failed write.
int write_all(int fd, std::string_view content) {
    size_t written = 0;
    while (written < content.size()) {
        const ssize_t n = ::write(fd, content.data() + written, content.size() - written);
        if (n < 0 && errno == EINTR) continue;
        if (n < 0) return errno;
        written += static_cast<size_t>(n);
    }
    return 0;
}

// The whole file from its start, or -1 with errno set.
ssize_t read_all(int fd, std::string& out) {
    out.clear();
    char buffer[1 << 16];
    for (off_t at = 0;;) {
        const ssize_t n = ::pread(fd, buffer, sizeof buffer, at);
        if (n < 0 && errno == EINTR) continue;
        if (n <= 0) return n < 0 ? -1 : static_cast<ssize_t>(out.size());
        out.append(buffer, static_cast<size_t>(n));
        at += n;
    }
}

// What is at `path` and whether it may be replaced, decided before anything is written.
struct Destination {
    std::filesystem::path target;  // the name the rename replaces (links followed)
    std::filesystem::path folder;  // where the temporary file goes
    bool exists = false;
    struct stat old {};
};

Destination examine(const std::filesystem::path& path, const SafeWriteRules& rules, Failure& fail) {
    Destination d;
    d.target = final_target(path, fail);
    // What is there now decides whether it may be replaced, before anything is written. stat
    // follows the links as the kernel does, /proc's links to pipes and terminals included
    // (/dev/stdout → /proc/self/fd/1 → "pipe:[N]", which names no file).
    struct stat& old = d.old;
    d.exists = ::stat(path.c_str(), &old) == 0;
    const bool exists = d.exists;
    if (!exists && errno != ENOENT) fail.system("examining it", errno);
    struct stat at_target {};
    if (d.target != path && (!exists || ::lstat(d.target.c_str(), &at_target) == 0))
        fail.name += " (a link to " + d.target.string() + ")";
    if (exists) {
        if (!S_ISREG(old.st_mode)) fail(std::string("it is ") + file_kind_text(old.st_mode) + ", not a regular file");
        if (old.st_nlink > 1)
            fail("it has " + std::to_string(old.st_nlink) +
                 " hard links, and replacing it would part it from the others, which would keep "
                 "the old content (write to another name, or remove the other links first)");
        struct stat input {};
        if (!rules.must_not_be.empty() && ::stat(rules.must_not_be.c_str(), &input) == 0 &&
            input.st_dev == old.st_dev && input.st_ino == old.st_ino)
            fail("it is the input file " + rules.must_not_be.string() +
                 (rules.how_to_replace_it.empty() ? "" : "; " + rules.how_to_replace_it));
    }
    d.folder = d.target.has_parent_path() ? d.target.parent_path() : std::filesystem::path(".");
    return d;
}

// A private (0600) temporary file in the destination's folder, for `target`.
void make_temporary(Temporary& temp, const Destination& d, const Failure& fail) {
    std::string name = (d.folder / ("." + d.target.filename().string() + ".tmp-XXXXXX")).string();
    temp.fd = ::mkstemp(name.data());
    if (temp.fd < 0) fail.system("creating a temporary file in " + d.folder.string(), errno);
    temp.path = name;
}

}  // namespace

void check_file_writable(const std::filesystem::path& path, const SafeWriteRules& rules) {
    Failure fail{path.string()};
    const Destination d = examine(path, rules, fail);
    Temporary temp;  // removed again when it goes out of scope
    make_temporary(temp, d, fail);
}

void write_file_safely(const std::filesystem::path& path, std::string_view content,
                       const SafeWriteRules& rules) {
    Failure fail{path.string()};
    const Destination d = examine(path, rules, fail);
    const std::filesystem::path& target = d.target;
    const std::filesystem::path& folder = d.folder;
    const bool exists = d.exists;
    const struct stat& old = d.old;
    remove_stale_temporaries(folder, target);
    Temporary temp;
    make_temporary(temp, d, fail);  // private (0600) while it is written

    if (const int err = write_all(temp.fd, content)) fail.system("writing", err);
    if (exists) {
        // Only root may give a file away; anyone may try to keep its group (a member of it may).
        // Before the chmod: a chown clears the set-user-id and set-group-id bits.
        const bool root = ::geteuid() == 0;
        if (::fchown(temp.fd, root ? old.st_uid : static_cast<uid_t>(-1), old.st_gid) != 0 && root)
            fail.system("giving the new file the old owner and group", errno);
    }
    const mode_t mode = exists ? old.st_mode & 07777 : 0666 & ~current_umask();
    if (::fchmod(temp.fd, mode) != 0) fail.system("setting the permissions", errno);
    if (::fsync(temp.fd) != 0) fail.system("flushing to disk", errno);

    // What the file holds now, not what was meant to go in: a short or failed write, or bytes
    // the caller's check refuses, never replace the destination.
    std::string back;
    if (read_all(temp.fd, back) < 0) fail.system("reading the temporary file back", errno);
    if (back != content) fail("the temporary file does not read back as written");
    if (rules.check_read_back) {
        if (const std::string why = rules.check_read_back(back); !why.empty())
            fail("what was written does not read back: " + why);
    }

    if (::rename(temp.path.c_str(), target.c_str()) != 0)
        fail.system("renaming the temporary file over it", errno);
    temp.renamed = true;
    // Make the rename itself durable.
    const int dir = ::open(folder.c_str(), O_RDONLY | O_DIRECTORY);
    if (dir >= 0) {
        ::fsync(dir);
        ::close(dir);
    }
}

}  // namespace rv
