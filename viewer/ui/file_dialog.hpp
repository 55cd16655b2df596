#pragma once
// The Open / Save As dialog, drawn with Dear ImGui: the folder's entries (edit/folder_listing:
// folders first, then *.json), its parent, a typed path with Tab completion, and for Open the
// recent files. The path field has the keyboard focus when the dialog opens; Enter confirms
// (a folder typed or chosen is entered instead), Esc cancels. A failed attempt reopens it with
// the whole error under the path.
#include <optional>
#include <string>
#include <vector>

#include "edit/folder_listing.hpp"

namespace rv::ui {

struct FileDialogState {
    enum class Mode { Open, SaveAs };
    Mode mode = Mode::Open;
    bool visible = false;       // shown (its popup opens on the next frame it is drawn)
    bool focus_path = false;    // give the path field the keyboard focus (until it has it)
    bool cursor_to_end = false; // put its cursor after the text once it has it
    char path[1024] = {};
    edit::FolderListing listing;
    std::vector<std::string> candidates;  // the names the last Tab matched, when several
    std::string error;          // the last failed attempt, in full
    // The file an Open confirmed, while the window opens it: a failure shows here again.
    std::optional<std::string> pending_open;
};

// Shows the dialog for `mode`, its path field holding `start_path` (a file or a folder; empty:
// the working folder) and its listing that folder's.
void show_file_dialog(FileDialogState& state, FileDialogState::Mode mode, const std::string& start_path);

// Shows the dialog again after a failed attempt, with `error` (every line of it).
void reopen_with_error(FileDialogState& state, const std::string& error);

// Draws the dialog while it is visible; returns the path the user confirmed (Enter, the
// button, or a double click on a file), once.
std::optional<std::string> draw_file_dialog(FileDialogState& state, const std::vector<std::string>& recent);

}  // namespace rv::ui
