#include "ui/inspector.hpp"

#include <cstdio>

namespace rv::ui {

namespace {

// One numeric field: label with its unit; live preview while typing, one undo step on leaving.
void field(const char* key, const char* label, double* value, const char* format, edit::Document& doc,
           InspectorState& st) {
    ImGui::SetNextItemWidth(120);
    const bool changed = ImGui::InputDouble(label, value, 0, 0, format, ImGuiInputTextFlags_AutoSelectAll);
    st.field_rects[key] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
    if (ImGui::IsItemActivated()) {
        st.editing = true;
        doc.begin_gesture();
    }
    if (changed && std::isfinite(*value)) doc.preview(st.scratch);
    if (ImGui::IsItemDeactivated()) {
        st.editing = false;
        doc.finish_gesture();
    }
}

}  // namespace

void draw_inspector(edit::Document& doc, EditorState& editor, InspectorState& st) {
    if (!editor.selected || *editor.selected >= doc.layout().elements.size()) {
        ImGui::TextDisabled("Click an optic to inspect it; drag it to move it.");
        return;
    }
    if (!st.editing) st.scratch = doc.layout();
    Element& e = st.scratch.elements[*editor.selected];
    ImGui::Text("%s", e.id.c_str());
    ImGui::PushID(static_cast<int>(*editor.selected));
    field("x", "x (mm)", &e.at_mm.x(), "%.3f", doc, st);
    field("y", "y (mm)", &e.at_mm.y(), "%.3f", doc, st);
    if (!std::holds_alternative<Stage>(e.kind)) {
        field("normal", "normal (deg)", &e.normal_deg, "%.3f", doc, st);
        field("aperture", "aperture (mm)", &e.aperture_mm, "%.2f", doc, st);
    }
    if (auto* lens = std::get_if<Lens>(&e.kind)) {
        if (auto* ideal = std::get_if<IdealLens>(&lens->model)) field("f", "focal length (mm)", &ideal->focal_length_mm, "%.2f", doc, st);
        if (auto* thin = std::get_if<ThinChromaticLens>(&lens->model)) field("f", "focal length (mm)", &thin->focal_length_mm, "%.2f", doc, st);
        if (auto* thick = std::get_if<ThickLens>(&lens->model)) {
            field("r1", "front radius (mm)", &thick->front_radius_mm, "%.2f", doc, st);
            field("r2", "back radius (mm)", &thick->back_radius_mm, "%.2f", doc, st);
            field("ct", "centre thickness (mm)", &thick->center_thickness_mm, "%.2f", doc, st);
        }
    } else if (auto* stage = std::get_if<Stage>(&e.kind)) {
        field("position", "position (mm)", &stage->position_mm, "%.3f", doc, st);
        field("axis", "axis (deg)", &stage->axis_deg, "%.2f", doc, st);
    } else if (auto* crystal = std::get_if<Crystal>(&e.kind)) {
        field("length", "length (mm)", &crystal->length_mm, "%.3f", doc, st);
        field("cut", "cut angle (deg)", &crystal->cut_deg, "%.3f", doc, st);
    } else if (auto* plate = std::get_if<Plate>(&e.kind)) {
        field("thickness", "thickness (mm)", &plate->slab.thickness_mm, "%.3f", doc, st);
    } else if (auto* dichroic = std::get_if<Dichroic>(&e.kind)) {
        field("edge", "edge (nm)", &dichroic->edge_nm, "%.1f", doc, st);
        field("thickness", "substrate (mm)", &dichroic->substrate.thickness_mm, "%.3f", doc, st);
    }
    ImGui::PopID();
    ImGui::Separator();
}

}  // namespace rv::ui
