#pragma once
// One recovery file per window (issue 19 §5). Two windows on one layout used to write the same
// ".NAME.recovery.json" in turn, so only the last one's edits survived a crash, and Discard or
// Save in one deleted the other's.
//
// Now each open document claims its own name beside the layout:
//   .NAME.recovery-TOKEN.json   its unsaved edits (written by autosave)
//   .NAME.recovery-TOKEN.lock   held with flock(LOCK_EX) for as long as the document lives
// TOKEN is the process id and a counter ("4711-1"); the claim takes the first counter whose
// lock file it can create exclusively (O_EXCL) and whose recovery file does not exist, so a
// reused process id never takes over a dead window's file. The kernel drops the lock when the
// process ends, however it ends (SIGKILL included), so:
//   - a recovery file whose lock is held belongs to a live window: nobody else offers,
//     restores or deletes it;
//   - a recovery file whose lock is free (or missing) was left by a window that is gone: the
//     next window on the layout offers it (an "orphan"), and removes it only once it has taken
//     the lock itself;
//   - a lock held by someone else tells a new window that another one has the layout open.
// The name ".NAME.recovery.json" of earlier versions has no lock and is always an orphan.
// flock locks belong to an open file description, so two documents in one process exclude
// each other as two processes do (the unit tests rely on it).

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

namespace rv::edit {

class RecoveryClaim {
public:
    // Claims a fresh name for the layout at `layout_path` (nullopt: the built-in demo, whose
    // files live in the working folder as ".demo.recovery-TOKEN.json"). If no lock can be made
    // (a read-only folder), the claim still names a recovery file, unlocked: autosave will say
    // why it cannot write there.
    explicit RecoveryClaim(const std::optional<std::filesystem::path>& layout_path);
    ~RecoveryClaim();  // releases and removes the lock file; the recovery file stays
    RecoveryClaim(const RecoveryClaim&) = delete;
    RecoveryClaim& operator=(const RecoveryClaim&) = delete;

    const std::filesystem::path& recovery_path() const { return recovery_; }
    bool locked() const { return fd_ >= 0; }

    // Recovery files of the same layout left by windows that are gone, oldest first.
    std::vector<std::filesystem::path> orphans() const;
    // How many other windows (of any process) hold a claim on the same layout now.
    int other_windows() const;
    // Removes an orphan (and its lock file) after taking its lock; false, with nothing removed,
    // when it is not an orphan of this layout (a live window holds it, or it is another file).
    bool remove_orphan(const std::filesystem::path& orphan) const;

private:
    std::filesystem::path folder_;
    std::string base_;  // ".NAME.recovery"
    std::string token_;
    std::filesystem::path recovery_, lock_;
    int fd_ = -1;
};

}  // namespace rv::edit
