#include "ui/actions.hpp"

#include <imgui.h>

#include <filesystem>
#include <system_error>

namespace rv::ui {

namespace {

bool edits(Action a) {
    for (const Shortcut& s : shortcuts())
        if (s.action == a) return s.edits;
    return true;
}

}  // namespace

void quit_without_saving(ViewerState& st) {
    std::error_code ignored;
    if (st.doc) std::filesystem::remove(st.doc->recovery_path(), ignored);
    st.close_requested = false;
    st.quit = true;
}

void request_quit(ViewerState& st) {
    if (st.doc && st.doc->dirty()) st.close_requested = true;
    else st.quit = true;
}

void perform(Action action, ViewerState& st) {
    edit::Document& doc = *st.doc;
    EditorState& ed = st.editor;
    if (ed.drag && action != Action::Escape) return;
    if (ed.locked && edits(action)) return;
    st.last_action = action;
    switch (action) {
    case Action::Undo: doc.undo(); break;
    case Action::Redo: doc.redo(); break;
    case Action::Duplicate: duplicate_selected(doc, ed); break;
    case Action::Save: {
        if (!doc.path()) {  // a new layout has no file yet: ask for one
            show_file_dialog(st.file_dialog, FileDialogState::Mode::SaveAs, "");
            break;
        }
        std::string error;
        ed.status = doc.save(error) ? "saved " + doc.path()->string() : error;
        break;
    }
    case Action::Open:
        show_file_dialog(st.file_dialog, FileDialogState::Mode::Open, doc.path() ? doc.path()->parent_path().string() : "");
        break;
    case Action::SaveAs:
        show_file_dialog(st.file_dialog, FileDialogState::Mode::SaveAs, doc.path() ? doc.path()->string() : "");
        break;
    case Action::AddHere:
        st.add_here_mm = st.cursor_mm.value_or(st.last_view.centre_mm);
        st.add_here_shown = false;  // (again) at the cursor
        break;
    case Action::Quit: request_quit(st); break;
    case Action::RotateForward: rotate_selected(doc, ed, 15.0); break;
    case Action::RotateBack: rotate_selected(doc, ed, -15.0); break;
    case Action::ToggleMeasure:
        ed.measuring = !ed.measuring;
        ed.status = ed.measuring ? "measuring: drag on the table (M again to edit)" : "editing";
        break;
    case Action::ToggleSnap:
        ed.snap = !ed.snap;
        ed.status = ed.snap ? "snapping to the breadboard holes" : "free placement (no snapping)";
        break;
    case Action::Delete: delete_selected(doc, ed); break;
    case Action::Escape:
        if (!cancel_drag(doc, ed)) {
            select(doc, ed, std::nullopt);
            ed.ruler.reset();
        }
        break;
    case Action::FitView: st.view.reset(); break;
    case Action::SelectNext: select_next(doc, ed, +1); break;
    case Action::SelectPrevious: select_next(doc, ed, -1); break;
    case Action::Help: st.show_help = !st.show_help; break;
    }
}

void dispatch_shortcuts(ViewerState& st) {
    // A drag whose button came up this frame is over before the keys of the same frame act
    // (a quick click then a key: the canvas would end it only later in the frame).
    if (st.editor.drag && !ImGui::GetIO().MouseDown[ImGuiMouseButton_Left]) {
        st.doc->finish_gesture(st.editor.drag->gesture);
        st.editor.drag.reset();
    }
    if (st.file_dialog.visible) return;  // keys belong to the Open / Save As dialog while it is up
    if (const std::optional<Action> a = pressed_action(ImGui::GetIO())) perform(*a, st);
}

}  // namespace rv::ui
