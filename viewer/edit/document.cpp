#include "edit/document.hpp"

#include <system_error>

#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"

namespace rv::edit {

Document::Document(Layout layout, std::optional<std::filesystem::path> path)
    : layout_(std::move(layout)), path_(std::move(path)), claim_(std::make_unique<RecoveryClaim>(path_)) {
    refresh();
}

std::string Document::title() const {
    return (path_ ? path_->filename().string() : std::string("demo")) + (dirty_ ? " •" : "");
}

void Document::refresh() {
    ++revision_;
    report_ = build_report(layout_, material_library_for(layout_));
    scene_ = scene::build_scene(layout_, report_);
}

bool Document::acceptable(const Layout& layout, std::string& why) {
    const LayoutReadResult r = read_layout(write_layout(layout));
    for (const Diagnostic& d : r.diagnostics)
        if (d.severity == Diagnostic::Severity::Error) {
            why = (d.pointer.empty() ? "" : d.pointer + ": ") + d.message;
            return false;
        }
    return r.layout.has_value();
}

void Document::edit(Layout next) {
    finish_open_gesture();  // an edit ends any gesture (one step each)
    if (next == layout_) return;
    if (!acceptable(next, last_refusal_)) return;
    undo_.push_back(std::move(layout_));
    redo_.clear();
    layout_ = std::move(next);
    dirty_ = true;
    refresh();
}

Document::Gesture Document::begin_gesture() {
    finish_open_gesture();
    gesture_start_ = layout_;
    gesture_ = next_gesture_++;
    dirty_before_gesture_ = dirty_;
    return gesture_;
}

void Document::preview(Layout next) {
    if (next == layout_) return;
    if (!acceptable(next, last_refusal_)) return;
    last_refusal_.clear();
    layout_ = std::move(next);
    dirty_ = true;
    refresh();
}

void Document::finish_gesture(Gesture g) {
    if (!in_gesture(g)) return;
    Layout start = std::move(*gesture_start_);
    gesture_start_.reset();
    if (start == layout_) {
        dirty_ = dirty_before_gesture_;
        return;
    }
    undo_.push_back(std::move(start));
    redo_.clear();
    dirty_ = true;
}

void Document::cancel_gesture(Gesture g) {
    if (!in_gesture(g)) return;
    const bool changed = *gesture_start_ != layout_;
    layout_ = std::move(*gesture_start_);
    gesture_start_.reset();
    dirty_ = dirty_before_gesture_;
    if (changed) refresh();
}

void Document::undo() {
    finish_open_gesture();
    if (undo_.empty()) return;
    redo_.push_back(std::move(layout_));
    layout_ = std::move(undo_.back());
    undo_.pop_back();
    dirty_ = true;
    refresh();
}

void Document::redo() {
    finish_open_gesture();
    if (redo_.empty()) return;
    undo_.push_back(std::move(layout_));
    layout_ = std::move(redo_.back());
    redo_.pop_back();
    dirty_ = true;
    refresh();
}

bool Document::save(std::string& error) {
    if (!path_) {
        error = "the built-in demo has no file yet: use Save As";
        return false;
    }
    return save_as(*path_, error);
}

bool Document::save_as(const std::filesystem::path& path, std::string& error) {
    finish_open_gesture();  // what is saved is what is shown, as one step
    try {
        save_layout(layout_, path);  // through a link to its target; never over the link itself
    } catch (const std::exception& e) {
        error = e.what();  // "cannot write PATH: REASON"
        return false;
    }
    std::error_code ignored;
    std::filesystem::remove(recovery_path(), ignored);  // this window's, never another's
    if (path_ != path) claim_ = std::make_unique<RecoveryClaim>(path);  // the new name's
    path_ = path;
    dirty_ = false;
    return true;
}

bool Document::autosave(std::string& error) {
    if (!dirty_) return true;
    try {
        // Checked like a save: a recovery file always reads back.
        save_layout(layout_, recovery_path());
    } catch (const std::exception& e) {
        error = std::string("the recovery file: ") + e.what();
        return false;
    }
    return true;
}

bool Document::restore_from(const std::filesystem::path& recovery) {
    const LayoutReadResult r = read_layout_file(recovery);
    if (!r.layout) return false;
    if (*r.layout == layout_) {  // nothing to restore: an orphan that says nothing new goes
        if (recovery != recovery_path()) claim_->remove_orphan(recovery);
        return true;
    }
    const unsigned before = revision_;
    edit(*r.layout);
    if (revision_ == before) return false;
    // Another window's orphan: its edits are this window's now, kept in its own recovery file
    // before the orphan goes (a crash in between leaves both, never neither).
    std::string ignored;
    if (recovery != recovery_path() && autosave(ignored)) claim_->remove_orphan(recovery);
    return true;
}

}  // namespace rv::edit
