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
        st.gesture = doc.begin_gesture();
    }
    if (ImGui::IsItemActive()) st.active_this_frame = true;
    if (changed && std::isfinite(*value) && doc.in_gesture(st.gesture)) doc.preview(st.scratch);
    if (ImGui::IsItemDeactivated()) {
        st.editing = false;
        doc.finish_gesture(st.gesture);
    }
}

// A name field (a material or glass): applied as one edit when the field is left after typing;
// a name the library does not know is refused with the reader's message.
void name_field(const char* key, const char* label, std::string* value, edit::Document& doc, InspectorState& st) {
    char buffer[128];
    const std::string& shown = st.text.count(key) ? st.text[key] : *value;
    std::snprintf(buffer, sizeof buffer, "%s", shown.c_str());
    ImGui::SetNextItemWidth(120);
    ImGui::InputText(label, buffer, sizeof buffer);
    st.field_rects[key] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
    if (ImGui::IsItemActive()) st.text[key] = buffer;
    if (ImGui::IsItemDeactivatedAfterEdit()) {
        *value = buffer;
        doc.edit(st.scratch);
    }
    if (!ImGui::IsItemActive()) st.text.erase(key);
}

// A plate's role from a list; one edit on a choice.
void role_field(Plate& plate, edit::Document& doc, InspectorState& st) {
    static const char* const names[] = {"window", "half-wave", "quarter-wave", "polarizing-cube", "polarizer"};
    int role = static_cast<int>(plate.role);
    ImGui::SetNextItemWidth(120);
    if (ImGui::Combo("role", &role, names, 5)) {
        using R = Plate::Role;
        plate.role = static_cast<R>(role);
        const bool wave = plate.role == R::HalfWave || plate.role == R::QuarterWave;
        // Keys of the old role that the new one does not take go back to their defaults.
        if (!wave) plate.design_nm = 0, plate.retarder_material.clear(), plate.order = 0, plate.retarder_thickness_um = 0;
        if (wave && plate.design_nm <= 0) plate.design_nm = 1000;  // a round design wavelength to edit
        if (!wave && plate.role != R::Polarizer) plate.fast_axis_deg = 0;
        if (plate.role != R::PolarizingCube && plate.role != R::Polarizer) plate.extinction_ratio = 1000;
        if (plate.role != R::PolarizingCube) plate.reflects_left = true;
        doc.edit(st.scratch);
    }
}

}  // namespace

// A field edit ends when its field is no longer active, or when something else (a drag, an
// undo, another selection) has taken over: its gesture is finished then.
void end_stale_edit(edit::Document& doc, const EditorState& editor, InspectorState& st) {
    const bool same_element = editor.selected && *editor.selected < doc.layout().elements.size() &&
                              doc.layout().elements[*editor.selected].id == st.element;
    if (st.editing && (!doc.in_gesture(st.gesture) || !same_element)) {
        doc.finish_gesture(st.gesture);
        st.editing = false;
    }
}

void draw_inspector(edit::Document& doc, EditorState& editor, InspectorState& st) {
    end_stale_edit(doc, editor, st);
    if (!editor.selected || *editor.selected >= doc.layout().elements.size()) {
        ImGui::TextDisabled("Click an optic to inspect it; drag it to move it (M: measure).");
        return;
    }
    if (editor.locked) {
        ImGui::TextWrapped("%s: a solution is previewed; Apply it or go back to edit.",
                           doc.layout().elements[*editor.selected].id.c_str());
        return;
    }
    if (!st.editing) {
        st.scratch = doc.layout();
        st.element = doc.layout().elements[*editor.selected].id;
    }
    st.active_this_frame = false;
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
        if (auto* thin = std::get_if<ThinChromaticLens>(&lens->model)) {
            field("f", "focal length (mm)", &thin->focal_length_mm, "%.2f", doc, st);
            name_field("glass", "glass", &thin->glass, doc, st);
        }
        if (auto* thick = std::get_if<ThickLens>(&lens->model)) {
            name_field("glass", "glass", &thick->glass, doc, st);
            field("r1", "front radius (mm)", &thick->front_radius_mm, "%.2f", doc, st);
            field("r2", "back radius (mm)", &thick->back_radius_mm, "%.2f", doc, st);
            field("ct", "centre thickness (mm)", &thick->center_thickness_mm, "%.2f", doc, st);
        }
    } else if (auto* stage = std::get_if<Stage>(&e.kind)) {
        field("position", "position (mm)", &stage->position_mm, "%.3f", doc, st);
        field("axis", "axis (deg)", &stage->axis_deg, "%.2f", doc, st);
    } else if (auto* crystal = std::get_if<Crystal>(&e.kind)) {
        name_field("material", "material", &crystal->material, doc, st);
        field("length", "length (mm)", &crystal->length_mm, "%.3f", doc, st);
        field("cut", "cut angle (deg)", &crystal->cut_deg, "%.3f", doc, st);
    } else if (auto* plate = std::get_if<Plate>(&e.kind)) {
        role_field(*plate, doc, st);
        name_field("material", "material", &plate->slab.material, doc, st);
        field("thickness", "thickness (mm)", &plate->slab.thickness_mm, "%.3f", doc, st);
        using R = Plate::Role;
        if (plate->role == R::HalfWave || plate->role == R::QuarterWave || plate->role == R::Polarizer)
            field("fast_axis", plate->role == R::Polarizer ? "transmission axis (deg)" : "fast axis (deg)",
                  &plate->fast_axis_deg, "%.2f", doc, st);
        if (plate->role == R::HalfWave || plate->role == R::QuarterWave)
            field("design", "design wavelength (nm)", &plate->design_nm, "%.1f", doc, st);
        if (plate->role == R::PolarizingCube || plate->role == R::Polarizer)
            field("extinction", "extinction ratio", &plate->extinction_ratio, "%.0f", doc, st);
    } else if (auto* dichroic = std::get_if<Dichroic>(&e.kind)) {
        field("edge", "edge (nm)", &dichroic->edge_nm, "%.1f", doc, st);
        name_field("glass", "substrate glass", &dichroic->substrate.material, doc, st);
        field("thickness", "substrate (mm)", &dichroic->substrate.thickness_mm, "%.3f", doc, st);
    }
    if (!std::holds_alternative<Stage>(e.kind)) field("transmission", "transmission", &e.transmission, "%.4f", doc, st);
    // The polarization of each beam after this element (first pass), from the report.
    for (const ReportBeam& b : doc.report().beams)
        for (size_t k = 0; k < b.path.hits.size() && k < b.power.stokes_after_hit.size(); ++k)
            if (b.path.hits[k].element == *editor.selected) {
                ImGui::TextWrapped("%s after it: %.1f %%, %s", b.id.c_str(), 100 * b.power.fraction_after_hit[k],
                                   describe_text(describe(b.power.stokes_after_hit[k])).c_str());
                break;
            }
    ImGui::PopID();
    if (st.editing && !st.active_this_frame) {  // the field lost focus without a deactivation
        doc.finish_gesture(st.gesture);
        st.editing = false;
    }
    if (!doc.last_refusal().empty()) ImGui::TextColored(ImVec4(0.8f, 0.15f, 0.1f, 1), "not applied: %s", doc.last_refusal().c_str());
    ImGui::Separator();
}

}  // namespace rv::ui
