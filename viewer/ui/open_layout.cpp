// Switching the window to another layout file: reading it, and a fresh state for every panel.
#include <imgui.h>

#include <cstdio>
#include <filesystem>

#include "edit/recent_files.hpp"
#include "edit/templates.hpp"
#include "io/layout_reader.hpp"
#include "ui/frame.hpp"

namespace rv::ui {

void reset_panels(ViewerState& st) {
    const bool snap = st.editor.snap;
    st.editor = {};
    st.editor.snap = snap;
    st.inspector = {};
    std::vector<CatalogLens> catalog = std::move(st.tools.catalog);
    st.tools = {};
    st.tools.catalog = std::move(catalog);
    if (st.doc) {  // the sweep field names this layout's stage, not the previous file's
        for (const Element& e : st.doc->layout().elements)
            if (std::holds_alternative<Stage>(e.kind)) {
                std::snprintf(st.tools.sweep_field, sizeof st.tools.sweep_field, "%s.position_mm", e.id.c_str());
                break;
            }
    }
    st.view.reset();
    st.finding_rects.clear();
    st.export_dialog = st.sheet_dialog = false;
    st.file_dialog = {};
    st.template_request.reset();
    st.goals = {};
    st.add_here_mm.reset();
    st.add_here_shown = false;
    st.export_request.reset();
    st.open_request.reset();
    st.recovery_offer.reset();
    st.close_requested = false;
    st.last_action.reset();
    st.status_line = {};
    st.cursor_mm.reset();
}

bool open_layout(ViewerState& st, std::unique_ptr<edit::Document>& doc, const std::string& file,
                 const std::filesystem::path* recent_file) {
    if (doc && doc->dirty()) {
        st.editor.status = "not opened " + file + ": unsaved changes; save or undo them first";
        if (st.file_dialog.pending_open == file) reopen_with_error(st.file_dialog, st.editor.status);
        return false;
    }
    const LayoutReadResult r = read_layout_file(file);
    if (!r.layout) {
        std::string why;
        for (const Diagnostic& d : r.diagnostics) why += (why.empty() ? "" : "\n") + format_diagnostic(d, file);
        st.editor.status = why.empty() ? "cannot read " + file : why;
        // Opened from the dialog: it comes back with the whole message and the path typed.
        if (st.file_dialog.pending_open == file) reopen_with_error(st.file_dialog, st.editor.status);
        return false;
    }
    doc = std::make_unique<edit::Document>(*r.layout, std::filesystem::path(file));
    st.doc = doc.get();
    reset_panels(st);
    st.recent = edit::with_recent(st.recent, file);
    if (recent_file) edit::save_recent(*recent_file, st.recent);
    if (const auto orphans = doc->orphaned_recoveries(); !orphans.empty()) st.recovery_offer = orphans.front().string();
    st.editor.status = "opened " + file;
    if (const int others = doc->other_windows(); others > 0)
        st.editor.status += " (also open in " + std::to_string(others) + " other window" + (others > 1 ? "s" : "") +
                            "; each keeps its own recovery file)";
    return true;
}

bool new_from_template(ViewerState& st, std::unique_ptr<edit::Document>& doc, size_t template_index) {
    const std::vector<edit::LayoutTemplate>& list = edit::layout_templates();
    if (template_index >= list.size()) return false;
    if (doc && doc->dirty()) {
        st.editor.status = "no new layout: unsaved changes; save or undo them first";
        return false;
    }
    doc = std::make_unique<edit::Document>(edit::layout_of(list[template_index]));
    st.doc = doc.get();
    reset_panels(st);
    st.editor.status = "new layout: " + list[template_index].name + " (File > Save As to keep it)";
    return true;
}

std::string window_title(const edit::Document& doc) { return "Rendezvous — " + doc.title(); }

}  // namespace rv::ui
