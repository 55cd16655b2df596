#pragma once
// The layout open in the viewer, with what editing needs around it: the file it came from,
// undo and redo (snapshots of the whole layout, one per finished edit, without limit), the
// unsaved-changes mark, atomic saving, a recovery file written periodically while there are
// unsaved changes, and the report and scene of the current layout, rebuilt after every change.
// No ImGui here: the interface tests drive it directly and through the window's frame code.

#include <filesystem>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "edit/recovery_claim.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "scene/scene.hpp"

namespace rv::edit {

class Document {
public:
    // A document for a layout, from a file (path) or built in (no path: "save" asks for one).
    explicit Document(Layout layout, std::optional<std::filesystem::path> path = std::nullopt);

    const Layout& layout() const { return layout_; }
    const RendezvousReport& report() const { return report_; }
    const scene::Scene& scene() const { return scene_; }
    const std::optional<std::filesystem::path>& path() const { return path_; }
    bool dirty() const { return dirty_; }
    std::string title() const;  // the file name (or "demo"), with " •" when unsaved

    // Whether a layout is one the file format accepts (written and read back; the first
    // problem in `why`). Edits and previews of layouts it refuses are not applied.
    static bool acceptable(const Layout& layout, std::string& why);
    const std::string& last_refusal() const { return last_refusal_; }

    // One finished edit: the old layout goes onto the undo stack, redo is cleared.
    void edit(Layout next);
    // A gesture (a drag, a field being typed in, a previewed solution): previews change the
    // layout without undo steps; finishing makes the whole gesture one undo step (none when
    // nothing changed), cancelling restores the start. One gesture at a time: beginning one
    // finishes any other first, and finish/cancel act only on the gesture they were given (the
    // number begin_gesture returned). A preview marks the document unsaved until it is cancelled.
    using Gesture = int;
    Gesture begin_gesture();
    void preview(Layout next);
    void finish_gesture(Gesture g);
    void cancel_gesture(Gesture g);
    bool in_gesture() const { return gesture_start_.has_value(); }
    bool in_gesture(Gesture g) const { return gesture_start_.has_value() && gesture_ == g; }
    // Counts every change of the layout (edits, previews, undo, redo, cancels).
    unsigned revision() const { return revision_; }

    bool can_undo() const { return !undo_.empty(); }
    bool can_redo() const { return !redo_.empty(); }
    void undo();
    void redo();

    // Saves through core/io/atomic_file.hpp (atomic, through links, read back); false with `error`
    // set when the file cannot be written.
    bool save(std::string& error);
    bool save_as(const std::filesystem::path& path, std::string& error);

    // This window's recovery file, its own (edit/recovery_claim.hpp): ".NAME.recovery-TOKEN.json"
    // beside the layout (the demo's in the working folder), claimed with a lock for as long as
    // the document lives. Written by autosave while there are unsaved changes, removed on save.
    std::filesystem::path recovery_path() const { return claim_->recovery_path(); }
    bool autosave(std::string& error);
    // Recovery files of this layout left by windows that are gone (offered at start, oldest
    // first), and how many other windows have the layout open now.
    std::vector<std::filesystem::path> orphaned_recoveries() const { return claim_->orphans(); }
    int other_windows() const { return claim_->other_windows(); }
    // Replace the layout by the recovery file's (one undo step, marked unsaved); false when it
    // is missing or does not read as a layout. An orphan's edits then go to this window's own
    // recovery file at once and the orphan is removed.
    bool restore_from(const std::filesystem::path& recovery);
    // Removes an orphaned recovery file ("Discard them"); false when it is not one (another
    // window that is still open holds it: never removed).
    bool discard_recovery(const std::filesystem::path& recovery) { return claim_->remove_orphan(recovery); }

private:
    // Finishes the gesture in progress, if any (an edit, undo, redo or save ends it as one step).
    void finish_open_gesture() { finish_gesture(gesture_); }
    void refresh();

    Layout layout_;
    std::optional<std::filesystem::path> path_;
    bool dirty_ = false;
    std::vector<Layout> undo_, redo_;
    std::optional<Layout> gesture_start_;
    Gesture gesture_ = 0, next_gesture_ = 1;
    bool dirty_before_gesture_ = false;
    unsigned revision_ = 0;
    std::string last_refusal_;
    RendezvousReport report_;
    scene::Scene scene_;
    std::unique_ptr<RecoveryClaim> claim_;  // for path_: a new one when Save As renames
};

}  // namespace rv::edit
