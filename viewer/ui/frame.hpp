#pragma once
// One frame of the viewer: the table view on the left, the report panel on the right. The
// window (later) and the headless renderer both call this between NewFrame and Render.
#include <filesystem>
#include <memory>
#include <optional>
#include <string>

#include "analysis/report.hpp"
#include "edit/document.hpp"
#include "scene/scene.hpp"
#include "ui/editor.hpp"
#include "ui/file_dialog.hpp"
#include "ui/goals_panel.hpp"
#include "ui/inspector.hpp"
#include "ui/shortcuts.hpp"
#include "ui/scan_panel.hpp"
#include "ui/tools_panel.hpp"
#include "ui/view.hpp"

namespace rv::ui {

// What the window remembers between frames (not part of the layout): the view of the table
// once the user has panned or zoomed (none: fit the table).
struct ViewerState {
    std::optional<View> view;
    View last_view;                  // the table view as last drawn
    edit::Document* doc = nullptr;   // set: the frame edits this document
    EditorState editor;
    InspectorState inspector;
    ToolsState tools;
    ScanState scan;                  // the Scan plan panel (ui/scan_panel.hpp)
    std::vector<std::pair<ImVec2, ImVec2>> finding_rects;  // last frame's finding rows
    std::vector<std::string> recent;  // recent files, newest first
    std::optional<std::string> open_request;  // File ▸ Open or a recent file: the window opens it
    struct ExportRequest {
        std::string path;
        bool svg = false;  // else PNG of the whole frame
    };
    std::optional<ExportRequest> export_request;  // File ▸ Export: the window writes it after the frame
    bool export_dialog = false;
    char export_path[1024] = "layout.png";
    bool sheet_dialog = false;  // File ▸ Build sheet: its dialog opens next frame
    char sheet_path[1024] = "build-sheet.svg";
    FileDialogState file_dialog;  // File ▸ Open and Save As (ui/file_dialog.hpp)
    // File ▸ New: the template (edit/templates.hpp) the window makes the document next.
    std::optional<size_t> template_request;
    GoalsState goals;                // the Goals panel (ui/goals_panel.hpp)
    std::optional<Vec2> add_here_mm;  // Shift+A: the Add menu opens at the cursor, adding there
    bool add_here_shown = false;      // that menu has been opened (ui/add_menu.cpp)
    // A recovery file found at start: offered once (restore or discard).
    std::optional<std::string> recovery_offer;
    // The window asked to close with unsaved changes: ask; quit once answered.
    bool close_requested = false, quit = false;
    bool show_help = false;              // the help window (F1, Help ▸ Shortcuts)
    std::optional<Action> last_action;   // the last shortcut performed (interface tests read it)
    struct StatusLine {                  // the status bar's message (ui/status_bar.hpp)
        std::string text;
        double since_s = 0;              // ImGui's clock when it was shown
        unsigned revision = 0;           // the document's revision then
    } status_line;
    std::optional<Vec2> cursor_mm;       // the table point under the cursor, while over the table
};

// Puts every panel in the state a fresh window has for state.doc (after File ▸ Open): the
// selection, drag, ruler, inspector, solver results and messages, the view, the dialogs; the
// sweep field names the new layout's first stage. Kept: the lens catalog, the recent files,
// snapping on or off, the help window.
void reset_panels(ViewerState& state);

// File ▸ Open and Open Recent: reads the file; on success it becomes the document (`doc` owns
// it), every panel is reset and the file heads the recent list (saved to `recent_file` when
// given). Refused with the whole reason in the status line when there are unsaved changes or
// the file does not read (every diagnostic); nothing changes then.
bool open_layout(ViewerState& state, std::unique_ptr<edit::Document>& doc, const std::string& file,
                 const std::filesystem::path* recent_file = nullptr);

// File ▸ New: the template's layout becomes the document (no file yet: Save asks for one), every
// panel reset; refused like open_layout when there are unsaved changes.
bool new_from_template(ViewerState& state, std::unique_ptr<edit::Document>& doc, size_t template_index);

// The window's title: "Rendezvous — NAME", with the document's unsaved mark.
std::string window_title(const edit::Document& doc);

// Draws one frame; with a state, the table view pans (drag on empty table), zooms about the
// cursor (wheel) and fits again on F or a double click; with a document as well, a menu bar,
// editing on the table (ui/editor.hpp), the inspector above the report, and a status line.
void draw_frame(const Layout& layout, const RendezvousReport& report, const scene::Scene& scene,
                ViewerState* state = nullptr);
// The same for the state's document.
void draw_document_frame(ViewerState& state);

}  // namespace rv::ui
