#include "ui/frame.hpp"

#include "render/export.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <filesystem>

#include "trace/poses.hpp"

#include "edit/recent_files.hpp"
#include "edit/templates.hpp"
#include "ui/actions.hpp"
#include "ui/add_menu.hpp"
#include "ui/canvas_readouts.hpp"
#include "ui/help_window.hpp"
#include "ui/status_bar.hpp"
#include "ui/plots.hpp"
#include "ui/report_panel.hpp"
#include "ui/table_view.hpp"

namespace rv::ui {

namespace {

// Pan and zoom through an invisible button over the canvas (the Dear ImGui canvas idiom).
View interact(const View& fitted, ViewerState& state) {
    View v = state.view.value_or(fitted);
    v.origin_px = fitted.origin_px;
    v.size_px = fitted.size_px;
    ImGui::SetCursorScreenPos(v.origin_px);
    ImGui::InvisibleButton("canvas", v.size_px, ImGuiButtonFlags_MouseButtonLeft | ImGuiButtonFlags_MouseButtonRight);
    const ImGuiIO& io = ImGui::GetIO();
    const bool editing = state.doc && edit_on_canvas(*state.doc, state.editor, v);
    if (!editing && ImGui::IsItemActive() && (io.MouseDelta.x != 0 || io.MouseDelta.y != 0)) {
        v.centre_mm += Vec2(-io.MouseDelta.x / v.px_per_mm, io.MouseDelta.y / v.px_per_mm);
        state.view = v;
    }
    if (ImGui::IsItemHovered() && io.MouseWheel != 0) {
        const Vec2 anchor = v.to_table(io.MousePos);  // the table point under the cursor stays put
        v.px_per_mm *= std::pow(1.2, io.MouseWheel);
        const Vec2 moved = v.to_table(io.MousePos);
        v.centre_mm += anchor - moved;
        state.view = v;
    }
    if (!editing && ImGui::IsItemHovered() && ImGui::IsMouseDoubleClicked(ImGuiMouseButton_Left)) {
        state.view.reset();
        v = fitted;
    }
    // The status bar's readout: the table point under the cursor (the view as it is now).
    // After keys have worked a menu, ImGui reports no item hovered until the mouse moves; the
    // cursor still stands over the table, and Shift+A adds there.
    const bool over_table = ImGui::IsItemHovered() || ImGui::IsItemActive() ||
                            (ImGui::IsWindowHovered() && ImGui::IsMouseHoveringRect(ImGui::GetItemRectMin(), ImGui::GetItemRectMax()));
    if (over_table) state.cursor_mm = v.to_table(io.MousePos);
    else state.cursor_mm.reset();
    return v;
}

// A ring around the selected element.
void draw_selection(ImDrawList* draw, const edit::Document& doc, size_t element, const View& view) {
    std::vector<Path> paths;
    for (const ReportBeam& b : doc.report().beams) paths.push_back(b.path);
    const ElementPose pose = element_poses(doc.layout(), paths)[element];
    const float r = std::max(10.0f, static_cast<float>(doc.layout().elements[element].aperture_mm / 2 * view.px_per_mm) + 4);
    draw->AddCircle(view.to_screen(pose.at_mm), r, IM_COL32(255, 140, 0, 255), 32, 2.0f);
}

void draw_menu_bar(ViewerState& st) {
    edit::Document& doc = *st.doc;
    EditorState& ed = st.editor;
    if (!ImGui::BeginMenuBar()) return;
    const bool free = !ed.locked;  // a previewed solution blocks saving and editing
    if (ImGui::BeginMenu("File")) {
        // Save without a file yet (a new layout) asks for one, as Save As.
        if (ImGui::MenuItem("Save", keys_of(Action::Save).c_str(), false, free)) perform(Action::Save, st);
        if (ImGui::MenuItem("Save As...", keys_of(Action::SaveAs).c_str(), false, free)) perform(Action::SaveAs, st);
        if (ImGui::MenuItem("Open...", keys_of(Action::Open).c_str(), false, free)) perform(Action::Open, st);
        if (ImGui::BeginMenu("New from a template", free)) {
            const std::vector<edit::LayoutTemplate>& templates = edit::layout_templates();
            for (size_t k = 0; k < templates.size(); ++k)
                if (ImGui::MenuItem(templates[k].name.c_str())) st.template_request = k;
            ImGui::EndMenu();
        }
        if (ImGui::MenuItem("Export PNG or SVG...")) st.export_dialog = true;
        if (ImGui::MenuItem("Build sheet...")) st.sheet_dialog = true;
        if (ImGui::BeginMenu("Open Recent", free && !st.recent.empty())) {
            for (const std::string& f : st.recent)
                if (ImGui::MenuItem(f.c_str())) st.open_request = f;
            ImGui::EndMenu();
        }
        ImGui::Separator();
        if (ImGui::MenuItem("Quit", keys_of(Action::Quit).c_str())) perform(Action::Quit, st);
        ImGui::EndMenu();
    }
    if (ImGui::BeginMenu("Edit")) {
        // The keys shown are the shortcut table's (ui/shortcuts.hpp), as the help window's.
        if (ImGui::MenuItem("Undo", keys_of(Action::Undo).c_str(), false, free && doc.can_undo())) perform(Action::Undo, st);
        if (ImGui::MenuItem("Redo", keys_of(Action::Redo).c_str(), false, free && doc.can_redo())) perform(Action::Redo, st);
        ImGui::Separator();
        const bool any = free && ed.selected.has_value();
        if (ImGui::MenuItem("Rotate +15°", keys_of(Action::RotateForward).c_str(), false, any)) perform(Action::RotateForward, st);
        if (ImGui::MenuItem("Rotate −15°", keys_of(Action::RotateBack).c_str(), false, any)) perform(Action::RotateBack, st);
        if (ImGui::MenuItem("Duplicate", keys_of(Action::Duplicate).c_str(), false, any)) perform(Action::Duplicate, st);
        if (ImGui::MenuItem("Delete", keys_of(Action::Delete).c_str(), false, any)) perform(Action::Delete, st);
        ImGui::Separator();
        if (ImGui::MenuItem("Select the next optic", keys_of(Action::SelectNext).c_str())) perform(Action::SelectNext, st);
        if (ImGui::MenuItem("Snap to the breadboard holes", keys_of(Action::ToggleSnap).c_str(), ed.snap))
            perform(Action::ToggleSnap, st);
        ImGui::EndMenu();
    }
    draw_add_menu(st, free);
    if (ImGui::BeginMenu("View")) {
        if (ImGui::MenuItem("Fit the table", keys_of(Action::FitView).c_str())) perform(Action::FitView, st);
        if (ImGui::MenuItem("Measure distances", keys_of(Action::ToggleMeasure).c_str(), ed.measuring))
            perform(Action::ToggleMeasure, st);
        ImGui::EndMenu();
    }
    if (ImGui::BeginMenu("Help")) {
        if (ImGui::MenuItem("Shortcuts", keys_of(Action::Help).c_str(), st.show_help)) perform(Action::Help, st);
        ImGui::EndMenu();
    }
    ImGui::EndMenuBar();
    if (st.recovery_offer) ImGui::OpenPopup("Recover unsaved edits");
    if (ImGui::BeginPopupModal("Recover unsaved edits", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) {
        ImGui::Text("Edits of a session that ended without saving are in\n%s", st.recovery_offer->c_str());
        // After one is handled the next orphan (another dead window's) is offered, never the same again.
        auto next_offer = [&](const std::string& handled) {
            st.recovery_offer.reset();
            for (const std::filesystem::path& o : doc.orphaned_recoveries())
                if (o.string() != handled) {
                    st.recovery_offer = o.string();
                    break;
                }
        };
        if (ImGui::Button("Restore them")) {
            const std::string handled = *st.recovery_offer;
            ed.status = doc.restore_from(handled) ? "restored the unsaved edits (not saved yet)"
                                                  : "the recovery file does not read as a layout";
            next_offer(handled);
            ImGui::CloseCurrentPopup();
        }
        ImGui::SameLine();
        if (ImGui::Button("Discard them")) {
            const std::string handled = *st.recovery_offer;
            if (!doc.discard_recovery(handled)) ed.status = "not discarded: another open window holds " + handled;
            next_offer(handled);
            ImGui::CloseCurrentPopup();
        }
        ImGui::EndPopup();
    }
    if (st.close_requested) ImGui::OpenPopup("Unsaved changes");
    if (ImGui::BeginPopupModal("Unsaved changes", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) {
        ImGui::Text("%s has unsaved changes.", doc.title().c_str());
        if (ImGui::Button("Save and quit", ImVec2(0, 0))) {
            std::string error;
            if (doc.save(error)) st.quit = true;
            else ed.status = error;
            st.close_requested = false;
            ImGui::CloseCurrentPopup();
        }
        ImGui::SameLine();
        if (ImGui::Button("Quit without saving")) quit_without_saving(st);
        ImGui::SameLine();
        if (ImGui::Button("Cancel")) {
            st.close_requested = false;
            ImGui::CloseCurrentPopup();
        }
        ImGui::EndPopup();
    }
    if (st.export_dialog) {
        ImGui::OpenPopup("Export");
        st.export_dialog = false;
    }
    if (ImGui::BeginPopupModal("Export", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) {
        ImGui::InputText("file", st.export_path, sizeof st.export_path);
        ImGui::TextDisabled("PNG: the whole frame at 1600 x 1000; SVG: the table at true scale");
        if (ImGui::Button("PNG")) {
            st.export_request = ViewerState::ExportRequest{st.export_path, false};
            ImGui::CloseCurrentPopup();
        }
        ImGui::SameLine();
        if (ImGui::Button("SVG")) {
            st.export_request = ViewerState::ExportRequest{st.export_path, true};
            ImGui::CloseCurrentPopup();
        }
        ImGui::SameLine();
        if (ImGui::Button("Cancel")) ImGui::CloseCurrentPopup();
        ImGui::EndPopup();
    }
    if (st.sheet_dialog) {
        ImGui::OpenPopup("Build sheet");
        st.sheet_dialog = false;
    }
    if (ImGui::BeginPopupModal("Build sheet", nullptr, ImGuiWindowFlags_AlwaysAutoResize)) {
        ImGui::InputText("file", st.sheet_path, sizeof st.sheet_path);
        ImGui::TextDisabled("the table at 1:1 on A4 pages (NAME.svg, NAME-2.svg, ...) with the hole grid,\n"
                            "and the parts list and placements as NAME.md beside it");
        if (ImGui::Button("Write")) {
            std::string wrote;
            const std::string error = render::export_build_sheet(doc, st.sheet_path, &wrote);
            ed.status = error.empty() ? "wrote the build sheet: " + wrote : error;
            ImGui::CloseCurrentPopup();
        }
        ImGui::SameLine();
        if (ImGui::Button("Cancel")) ImGui::CloseCurrentPopup();
        ImGui::EndPopup();
    }
    draw_add_here_popup(st);
    // File ▸ Open and Save As: Open hands the path to the window (open_layout), Save As saves
    // here; a failure comes back in the dialog with the whole message.
    if (const std::optional<std::string> chosen = draw_file_dialog(st.file_dialog, st.recent)) {
        if (st.file_dialog.mode == FileDialogState::Mode::Open) {
            st.open_request = *chosen;
        } else {
            std::string error;
            if (doc.save_as(*chosen, error)) {
                ed.status = "saved " + *chosen;
                st.recent = edit::with_recent(st.recent, *chosen);
            } else {
                reopen_with_error(st.file_dialog, error);
            }
        }
    }
}

}  // namespace

void draw_document_frame(ViewerState& state) {
    draw_frame(state.doc->layout(), state.doc->report(), state.doc->scene(), &state);
}

void draw_frame(const Layout& layout, const RendezvousReport& report, const scene::Scene& scene, ViewerState* state) {
    const ImGuiViewport* vp = ImGui::GetMainViewport();
    ImGui::SetNextWindowPos(vp->Pos);
    ImGui::SetNextWindowSize(vp->Size);
    edit::Document* doc = state ? state->doc : nullptr;
    ImGui::Begin("Rendezvous", nullptr,
                 ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoSavedSettings |
                     ImGuiWindowFlags_NoBringToFrontOnFocus | (doc ? ImGuiWindowFlags_MenuBar : 0));
    float status_bar = 0;
    if (doc) {
        update_status_line(*state);
        draw_menu_bar(*state);
        state->editor.locked = state->tools.previewing.has_value();
        sync_selection(*doc, state->editor);
        dispatch_shortcuts(*state);
        update_status_line(*state);  // a message the menus or a shortcut just set
        ImGui::Text("%s", doc->title().c_str());
        status_bar = status_bar_height(*state, ImGui::GetContentRegionAvail().x);
    } else {
        ImGui::Text("%s", scene.title.c_str());
    }
    const float panel = 380;
    const ImVec2 avail = ImGui::GetContentRegionAvail();
    ImGui::BeginGroup();
    const float plots = std::floor((avail.y - status_bar) * 0.3f);
    ImGui::BeginChild("table", ImVec2(avail.x - panel, avail.y - status_bar - plots), true);
    const ImVec2 origin = ImGui::GetCursorScreenPos();
    const ImVec2 size = ImGui::GetContentRegionAvail();
    const View fitted = fit_view(origin, size, scene.width_mm, scene.height_mm);
    const View view = state ? interact(fitted, *state) : fitted;
    if (state) state->last_view = view;
    draw_table(ImGui::GetWindowDrawList(), scene, view);
    if (doc && state->editor.selected && *state->editor.selected < layout.elements.size())
        draw_selection(ImGui::GetWindowDrawList(), *doc, *state->editor.selected, view);
    if (doc && state->editor.ruler) draw_ruler_along_beams(ImGui::GetWindowDrawList(), *doc, *state->editor.ruler, view);
    if (doc) draw_hover_readout(ImGui::GetWindowDrawList(), *doc, state->editor, view, state->cursor_mm);
    ImGui::EndChild();
    ImGui::BeginChild("plots", ImVec2(avail.x - panel, -status_bar), true);
    const ImVec2 p0 = ImGui::GetCursorScreenPos();
    const ImVec2 ps = ImGui::GetContentRegionAvail();
    const float half = std::floor(ps.x / 2);
    draw_caustic_plot(ImGui::GetWindowDrawList(), p0, ImVec2(half - 4, ps.y), report);
    draw_timing_plot(ImGui::GetWindowDrawList(), ImVec2(p0.x + half + 4, p0.y), ImVec2(ps.x - half - 4, ps.y), layout, report);
    ImGui::EndChild();
    if (doc) {  // under the table and the plots, wrapped to their width
        ImGui::PushTextWrapPos(ImGui::GetCursorPosX() + avail.x - panel);
        draw_status_bar(*state);
        ImGui::PopTextWrapPos();
    }
    ImGui::EndGroup();
    ImGui::SameLine();
    ImGui::BeginChild("report", ImVec2(0, avail.y), true);
    if (doc) {
        draw_inspector(*doc, state->editor, state->inspector);
        draw_tools_panel(*doc, state->tools);
        draw_scan_panel(*doc, state->scan);
    }
    draw_report_panel(report, layout, doc ? &state->editor.selected : nullptr, state ? &state->finding_rects : nullptr);
    if (doc) draw_goals_panel(*doc, state->goals);  // below the report, whose findings stay in view
    ImGui::EndChild();
    ImGui::End();
    if (doc) draw_help_window(*state);
}

}  // namespace rv::ui
