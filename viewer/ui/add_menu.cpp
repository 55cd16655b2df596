#include "ui/add_menu.hpp"

#include <imgui.h>

#include "edit/new_elements.hpp"
#include "layout/visit.hpp"

namespace rv::ui {

namespace {

bool is_singlet(const CatalogLens& c) {
    return std::visit(overloaded{[](const IdealLens&) { return false; }, [](const ThinChromaticLens&) { return false; },
                                 [](const ThickLens&) { return true; }},
                      c.lens.model);
}

// The choices, each adding at `at` (a stage carries; it has no place of its own); true once one
// is chosen.
bool draw_add_items(ViewerState& st, const Vec2& at) {
    bool chosen = false;
    edit::Document& doc = *st.doc;
    std::string kind_before;
    for (edit::NewElementChoice& c : edit::new_element_choices(doc.layout())) {
        if (!kind_before.empty() && c.type != kind_before) ImGui::Separator();
        kind_before = c.type;
        if (ImGui::MenuItem(c.label.c_str())) chosen = true, add_new_element(doc, st.editor, std::move(c.element), at);
        if (c.type == "lens" && ImGui::BeginMenu("lens (thick singlet from the catalog)", !st.tools.catalog.empty())) {
            for (const CatalogLens& lens : st.tools.catalog)
                if (is_singlet(lens) && ImGui::MenuItem(lens.id.c_str()))
                    chosen = true, add_new_element(doc, st.editor, edit::new_catalog_lens(lens), at);
            ImGui::EndMenu();
        }
    }
    ImGui::Separator();
    const std::vector<std::string> free = edit::carriable_ids(doc.layout());
    if (ImGui::BeginMenu("stage carrying", !free.empty())) {
        for (const std::string& id : free)
            if (ImGui::MenuItem(id.c_str())) chosen = true, add_stage(doc, st.editor, {id});
        ImGui::EndMenu();
    }
    ImGui::Separator();
    // A layout has one or two beams (the reader's rule).
    if (ImGui::MenuItem("beam", nullptr, false, doc.layout().beams.size() < 2)) chosen = true, add_beam(doc, st.editor, at);
    return chosen;
}

}  // namespace

void draw_add_menu(ViewerState& st, bool enabled) {
    if (!ImGui::BeginMenu("Add", enabled)) return;
    draw_add_items(st, st.last_view.centre_mm);  // the middle of the table view
    ImGui::EndMenu();
}

void draw_add_here_popup(ViewerState& st) {
    constexpr const char* kId = "add here";
    if (!st.add_here_mm) return;
    if (!st.add_here_shown) {  // opened once: a menu ImGui closed (a click outside) stays closed
        ImGui::OpenPopup(kId);
        st.add_here_shown = true;
    }
    if (!ImGui::BeginPopup(kId)) {  // closed by a click outside
        st.add_here_mm.reset();
        st.add_here_shown = false;
        return;
    }
    ImGui::TextDisabled("add at x %.1f mm, y %.1f mm", st.add_here_mm->x(), st.add_here_mm->y());
    // A choice made or Esc: the menu closes and is not opened again next frame.
    if (draw_add_items(st, *st.add_here_mm) || ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Escape), false)) {
        ImGui::CloseCurrentPopup();
        st.add_here_mm.reset();
        st.add_here_shown = false;
    }
    ImGui::EndPopup();
}

}  // namespace rv::ui
