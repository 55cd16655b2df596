#include "edit/recovery_claim.hpp"

#include <fcntl.h>
#include <sys/file.h>
#include <unistd.h>

#include <algorithm>
#include <atomic>
#include <cerrno>
#include <system_error>

namespace rv::edit {

namespace {

// Claims made by this process so far: the counter of the next token.
std::atomic<unsigned> g_next_claim{1};

// A token is what the claim writes between base and suffix: digits and '-' only, so that a
// file of another layout ("bench.json.recovery-1.json" of "bench.json.recovery") never matches.
bool is_token(const std::string& t) {
    return !t.empty() && std::all_of(t.begin(), t.end(), [](char c) { return (c >= '0' && c <= '9') || c == '-'; });
}

// The token of `name` if it is BASE-TOKEN.SUFFIX; "" for the lockless BASE.json of earlier
// versions (suffix ".json" only); nullopt for any other name.
std::optional<std::string> token_of(const std::string& name, const std::string& base, const std::string& suffix) {
    if (suffix == ".json" && name == base + ".json") return std::string();
    const std::string prefix = base + "-";
    if (name.size() <= prefix.size() + suffix.size() || name.compare(0, prefix.size(), prefix) != 0 ||
        name.compare(name.size() - suffix.size(), suffix.size(), suffix) != 0)
        return std::nullopt;
    std::string token = name.substr(prefix.size(), name.size() - prefix.size() - suffix.size());
    if (!is_token(token)) return std::nullopt;
    return token;
}

// Whether some open file description holds the lock file now (a live window).
bool lock_held(const std::filesystem::path& lock) {
    const int fd = ::open(lock.c_str(), O_RDWR | O_CLOEXEC | O_NOFOLLOW);
    if (fd < 0) return false;  // missing: its window is gone
    const bool held = ::flock(fd, LOCK_EX | LOCK_NB) != 0;
    ::close(fd);  // releases the probe's lock, if it got one
    return held;
}

}  // namespace

RecoveryClaim::RecoveryClaim(const std::optional<std::filesystem::path>& layout_path) {
    folder_ = layout_path ? layout_path->parent_path() : std::filesystem::path();
    base_ = "." + (layout_path ? layout_path->filename().string() : std::string("demo")) + ".recovery";
    const std::string pid = std::to_string(::getpid());
    // Bounded: past this many names in use, the claim goes unlocked (autosave still works).
    for (int attempt = 0; attempt < 1000; ++attempt) {
        token_ = pid + "-" + std::to_string(g_next_claim++);
        recovery_ = folder_ / (base_ + "-" + token_ + ".json");
        lock_ = folder_ / (base_ + "-" + token_ + ".lock");
        std::error_code ec;
        if (std::filesystem::exists(recovery_, ec)) continue;  // a dead window's, with a reused pid
        const int fd = ::open(lock_.c_str(), O_RDWR | O_CREAT | O_EXCL | O_CLOEXEC | O_NOFOLLOW, 0600);
        if (fd < 0) {
            if (errno == EEXIST) continue;
            break;  // the folder takes no file: unlocked
        }
        if (::flock(fd, LOCK_EX | LOCK_NB) != 0) {
            ::close(fd);
            continue;
        }
        fd_ = fd;
        return;
    }
    lock_.clear();
}

RecoveryClaim::~RecoveryClaim() {
    if (fd_ < 0) return;
    ::unlink(lock_.c_str());  // before the close: nobody can take a lock we still hold
    ::close(fd_);
}

std::vector<std::filesystem::path> RecoveryClaim::orphans() const {
    std::vector<std::pair<std::filesystem::file_time_type, std::filesystem::path>> found;
    std::error_code ec;
    const std::filesystem::path where = folder_.empty() ? std::filesystem::path(".") : folder_;
    for (const auto& entry : std::filesystem::directory_iterator(where, ec)) {
        const std::string name = entry.path().filename().string();
        const std::optional<std::string> token = token_of(name, base_, ".json");
        if (!token || *token == token_) continue;
        if (!token->empty() && lock_held(folder_ / (base_ + "-" + *token + ".lock"))) continue;
        std::error_code tec;
        found.emplace_back(entry.last_write_time(tec), folder_ / name);
    }
    std::sort(found.begin(), found.end());
    std::vector<std::filesystem::path> out;
    for (auto& f : found) out.push_back(std::move(f.second));
    return out;
}

int RecoveryClaim::other_windows() const {
    int n = 0;
    std::error_code ec;
    const std::filesystem::path where = folder_.empty() ? std::filesystem::path(".") : folder_;
    for (const auto& entry : std::filesystem::directory_iterator(where, ec)) {
        const std::string name = entry.path().filename().string();
        const std::optional<std::string> token = token_of(name, base_, ".lock");
        if (token && *token != token_ && lock_held(entry.path())) ++n;
    }
    return n;
}

bool RecoveryClaim::remove_orphan(const std::filesystem::path& orphan) const {
    const std::filesystem::path where = orphan.has_parent_path() ? orphan.parent_path() : std::filesystem::path();
    std::error_code ec;
    if (where.lexically_normal() != folder_.lexically_normal() &&
        !std::filesystem::equivalent(where.empty() ? "." : where, folder_.empty() ? "." : folder_, ec))
        return false;
    const std::optional<std::string> token = token_of(orphan.filename().string(), base_, ".json");
    if (!token || *token == token_) return false;
    if (token->empty()) return std::filesystem::remove(orphan, ec);  // no lock in earlier versions
    const std::filesystem::path lock = folder_ / (base_ + "-" + *token + ".lock");
    // Taken before anything is removed, and held until both are gone.
    const int fd = ::open(lock.c_str(), O_RDWR | O_CREAT | O_CLOEXEC | O_NOFOLLOW, 0600);
    if (fd < 0) return false;
    if (::flock(fd, LOCK_EX | LOCK_NB) != 0) {
        ::close(fd);
        return false;  // a live window's
    }
    const bool removed = std::filesystem::remove(orphan, ec);
    ::unlink(lock.c_str());
    ::close(fd);
    return removed;
}

}  // namespace rv::edit
