#include "ui/inspector.hpp"

#include <array>
#include <cmath>
#include <cstdio>
#include <optional>
#include <stdexcept>
#include <vector>

#include "report/verdict_words.hpp"
#include "analysis/phase_setting.hpp"
#include "io/layout_reader.hpp"
#include "layout/enum_names.hpp"
#include "layout/process_text.hpp"
#include "layout/visit.hpp"

namespace rv::ui {

namespace {

// One numeric field: label with its unit; live preview while typing, one undo step on leaving.
// `store` puts a changed value where it belongs before the preview (for a value edited through a
// stand-in, as an optional's).
template <class Store>
void field_through(const char* key, const char* label, double* value, const char* format, edit::Document& doc,
                   InspectorState& st, Store store) {
    ImGui::SetNextItemWidth(120);
    const bool changed = ImGui::InputDouble(label, value, 0, 0, format, ImGuiInputTextFlags_AutoSelectAll);
    if (changed) store();
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

void field(const char* key, const char* label, double* value, const char* format, edit::Document& doc,
           InspectorState& st) {
    field_through(key, label, value, format, doc, st, [] {});
}

// A field for a value the file may leave out: shown as 0 when absent, and 0 typed removes it.
void optional_field(const char* key, const char* label, std::optional<double>* value, const char* format,
                    edit::Document& doc, InspectorState& st) {
    double shown = value->value_or(0);
    field_through(key, label, &shown, format, doc, st,
                  [&] { *value = shown == 0 ? std::nullopt : std::optional<double>(shown); });
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

// A name the file may leave out: an empty field removes it.
void optional_name_field(const char* key, const char* label, std::optional<std::string>* value, edit::Document& doc,
                         InspectorState& st) {
    std::string shown = value->value_or("");
    const std::string before = shown;
    name_field(key, label, &shown, doc, st);
    if (shown == before) return;
    *value = shown.empty() ? std::nullopt : std::optional<std::string>(shown);
    doc.edit(st.scratch);
}

// A choice among names (one edit on a choice).
bool choice_field(const char* label, int* value, const char* const* names, int count) {
    ImGui::SetNextItemWidth(120);
    return ImGui::Combo(label, value, names, count);
}

// A choice among a table's values, labelled with their file texts (layout/enum_names.hpp); true
// when the user chose another one (then *value is it).
template <class Value, size_t N>
bool table_field(const char* label, Value* value, const std::array<NamedValue<Value>, N>& table) {
    std::array<std::string, N> texts;
    std::array<const char*, N> names{};
    for (size_t i = 0; i < N; ++i) texts[i] = std::string(table[i].text), names[i] = texts[i].c_str();
    int at = static_cast<int>(position_in(table, *value));
    if (!choice_field(label, &at, names.data(), static_cast<int>(N))) return false;
    *value = table[static_cast<size_t>(at)].value;
    return true;
}

// A plate's role from a list; one edit on a choice.
void role_field(Plate& plate, edit::Document& doc, InspectorState& st) {
    if (table_field("role", &plate.role, kPlateRoleNames)) {
        using R = Plate::Role;
        const bool wave = plate.role == R::HalfWave || plate.role == R::QuarterWave;
        // Keys of the old role that the new one does not take go back to their defaults.
        if (!wave) plate.design_nm.reset(), plate.retarder_material.reset(), plate.order = 0, plate.retarder_thickness_um.reset();
        if (wave && !plate.design_nm) plate.design_nm = 1000;  // a round design wavelength to edit
        if (!wave && plate.role != R::Polarizer) plate.fast_axis_deg = 0;
        if (plate.role != R::PolarizingCube && plate.role != R::Polarizer) plate.extinction_ratio = 1000;
        if (plate.role != R::PolarizingCube) plate.reflects_left = true;
        doc.edit(st.scratch);
    }
}

// The process the target crystal is set for: one button per process (the SFG of the two beams,
// the SHG of each); a click sets the crystal for it and turns or tilts it to phase-match
// (analysis/phase_setting.hpp), one undo step. Below: the set process's angle now and needed.
void process_buttons(edit::Document& doc, InspectorState& st) {
    const Layout& layout = doc.layout();
    const Element* target = layout.find(layout.target);
    const auto* crystal = target ? std::get_if<Crystal>(&target->kind) : nullptr;
    if (!crystal || target->id != st.element) return;
    std::vector<std::pair<std::string, std::string>> processes;  // key, label
    if (layout.beams.size() >= 2)
        processes.emplace_back(*format_process_text(Crystal::Process::SumFrequency, {}), "SFG");
    for (const BeamSource& b : layout.beams)
        processes.emplace_back(*format_process_text(Crystal::Process::SecondHarmonic, b.id), "SHG " + b.id);
    const RendezvousReport& r = doc.report();
    const std::string now = r.phase_matching.empty() ? "" : process_key(layout, r.phase_matching.front());
    ImGui::TextUnformatted("set for");
    for (const auto& [key, label] : processes) {
        ImGui::SameLine();
        const bool current = key == now;
        if (current) ImGui::PushStyleColor(ImGuiCol_Button, ImGui::GetStyleColorVec4(ImGuiCol_ButtonActive));
        const bool clicked = ImGui::SmallButton(label.c_str());
        st.field_rects["process:" + key] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
        if (current) ImGui::PopStyleColor();
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("set the crystal for %s and turn or tilt it to phase-match", key.c_str());
        if (clicked) {
            try {
                doc.edit(set_crystal_for_process(layout, material_library_for(layout), key).layout);
                st.process_error.clear();
            } catch (const std::invalid_argument& e) {
                st.process_error = e.what();
            }
            return;  // the layout changed under the references above
        }
    }
    if (!st.process_error.empty()) ImGui::TextWrapped("%s", st.process_error.c_str());
    if (r.phase_matching.empty()) return;
    const PhaseMatchingReport& p = r.phase_matching.front();
    if (p.outside_index_data || !p.phase_matchable) return;
    const bool turn = p.rotation == CrystalRotation::Turn;
    ImGui::Text("%s: sinc² %.3f", process_beams_text(p.beams).c_str(), p.sinc2_now);
    if (p.rotation_found && std::abs(p.rotate_by_deg) >= 0.0005)
        ImGui::Text("%s by %+.3f° (external) to phase-match", turn ? "turn" : "tilt", p.rotate_by_deg);
}

// A field edit ends when its field is no longer active, or when something else (a drag, an
// undo, another selection) has taken over: its gesture is finished then.
void end_stale_edit(edit::Document& doc, const EditorState& editor, InspectorState& st) {
    if (!st.editing) return;
    bool owner_there = false;
    if (st.editing_beam) {
        for (const BeamSource& b : doc.layout().beams) owner_there = owner_there || b.id == st.element;
    } else {
        owner_there = editor.selected && *editor.selected < doc.layout().elements.size() &&
                      doc.layout().elements[*editor.selected].id == st.element;
    }
    if (!doc.in_gesture(st.gesture) || !owner_there || st.scratch.elements.size() != doc.layout().elements.size()) {
        doc.finish_gesture(st.gesture);
        st.editing = false;
    }
}

void element_fields(edit::Document& doc, const EditorState& editor, InspectorState& st) {
    Element& e = st.scratch.elements[*editor.selected];
    if (!st.editing) {
        st.element = e.id;
        st.editing_beam = false;
    }
    ImGui::Text("%s (%s)", e.id.c_str(), type_name(e.kind));
    ImGui::PushID(static_cast<int>(*editor.selected));
    field("x", "x (mm)", &e.at_mm.x(), "%.3f", doc, st);
    field("y", "y (mm)", &e.at_mm.y(), "%.3f", doc, st);
    const double aperture_before_mm = e.aperture_mm;
    if (!std::holds_alternative<Stage>(e.kind)) {
        field("normal", "normal (deg)", &e.normal_deg, "%.3f", doc, st);
        field("aperture", "aperture (mm)", &e.aperture_mm, "%.2f", doc, st);
    }
    // One set of fields per kind (a visit: a new kind must say what it shows).
    std::visit(
        overloaded{
            [&](Lens& lens) {
                const auto model_before = lens.model;
                std::visit(overloaded{
                               [&](IdealLens& ideal) {
                                   field("f", "focal length (mm)", &ideal.focal_length_mm, "%.2f", doc, st);
                               },
                               [&](ThinChromaticLens& thin) {
                                   field("f", "focal length (mm)", &thin.focal_length_mm, "%.2f", doc, st);
                                   name_field("glass", "glass", &thin.glass, doc, st);
                                   field("design", "design wavelength (nm)", &thin.design_wavelength_nm, "%.1f", doc, st);
                               },
                               [&](ThickLens& thick) {
                                   name_field("glass", "glass", &thick.glass, doc, st);
                                   if (!thick.shape) {
                                       field("r1", "front radius (mm)", &thick.front_radius_mm, "%.2f", doc, st);
                                       field("r2", "back radius (mm)", &thick.back_radius_mm, "%.2f", doc, st);
                                   } else {
                                       ImGui::Text("shape: %s", thick.shape->c_str());
                                       field("f", "focal length (mm)", &thick.focal_length_mm, "%.2f", doc, st);
                                   }
                                   field("ct", "centre thickness (mm)", &thick.center_thickness_mm, "%.2f", doc, st);
                               },
                           },
                           lens.model);
                // A lens whose numbers or diameter were edited is no longer its catalog part: the id
                // goes (io/lens_parts.hpp would refuse the disagreement), within the same edit.
                if (lens.part) {
                    ImGui::Text("part: %s", lens.part->c_str());
                    if (!(lens.model == model_before) || e.aperture_mm != aperture_before_mm) {
                        lens.part.reset();
                        if (st.editing) doc.preview(st.scratch);
                        else doc.edit(st.scratch);
                    }
                }
            },
            [&](Mirror& mirror) {
                optional_field("roc", "radius of curvature (mm, 0 flat)", &mirror.radius_of_curvature_mm, "%.1f",
                               doc, st);
                field("retardance", "s - p phase (deg)", &mirror.retardance_deg, "%.2f", doc, st);
                if (mirror.aim_at) ImGui::Text("aims at %s", mirror.aim_at->c_str());
            },
            [&](Stage& stage) {
                field("position", "position (mm)", &stage.position_mm, "%.3f", doc, st);
                field("axis", "axis (deg)", &stage.axis_deg, "%.2f", doc, st);
                field("travel_min", "travel from (mm)", &stage.travel_min_mm, "%.2f", doc, st);
                field("travel_max", "travel to (mm)", &stage.travel_max_mm, "%.2f", doc, st);
                std::string carries;
                for (const std::string& c : stage.carries) carries += (carries.empty() ? "" : ", ") + c;
                ImGui::TextWrapped("carries %s", carries.c_str());
            },
            [&](Crystal& crystal) {
                name_field("material", "material", &crystal.material, doc, st);
                field("length", "length (mm)", &crystal.length_mm, "%.3f", doc, st);
                field("cut", "cut angle (deg)", &crystal.cut_deg, "%.3f", doc, st);
                if (table_field("phase matching", &crystal.phase_matching, kPhaseMatchingNames)) doc.edit(st.scratch);
                if (table_field("optic axis plane", &crystal.optic_axis_horizontal, kOpticAxisNames)) doc.edit(st.scratch);
                field("tilt", "tilt (deg, + = face normal up)", &crystal.tilt_deg, "%.3f", doc, st);
                // An oven: only for a set with thermo-optic data (the reader refuses others
                // with its message); 0 °C is a temperature, so presence is its own switch.
                bool oven = crystal.temperature_c.has_value();
                if (ImGui::Checkbox("in an oven", &oven)) {
                    crystal.temperature_c = oven ? std::optional<double>(20.0) : std::nullopt;
                    doc.edit(st.scratch);
                }
                if (crystal.temperature_c)
                    field("temperature", "temperature (°C)", &*crystal.temperature_c, "%.2f", doc, st);
                process_buttons(doc, st);
                optional_field("damage_i", "damage (GW/cm², 0 none)", &crystal.damage.intensity_gw_cm2, "%.1f", doc, st);
            },
            [&](Plate& plate) {
                role_field(plate, doc, st);
                name_field("material", "material", &plate.slab.material, doc, st);
                field("thickness", "thickness (mm)", &plate.slab.thickness_mm, "%.3f", doc, st);
                using R = Plate::Role;
                if (plate.role == R::HalfWave || plate.role == R::QuarterWave || plate.role == R::Polarizer)
                    field("fast_axis", plate.role == R::Polarizer ? "transmission axis (deg)" : "fast axis (deg)",
                          &plate.fast_axis_deg, "%.2f", doc, st);
                if (plate.role == R::HalfWave || plate.role == R::QuarterWave) {
                    optional_field("design", "design wavelength (nm)", &plate.design_nm, "%.1f", doc, st);
                    optional_name_field("retarder", "retarder material (empty: ideal)", &plate.retarder_material, doc, st);
                }
                if (plate.role == R::PolarizingCube || plate.role == R::Polarizer)
                    field("extinction", "extinction ratio", &plate.extinction_ratio, "%.0f", doc, st);
                if (plate.role == R::PolarizingCube) {
                    if (table_field("reflects to", &plate.reflects_left, kCubeReflectsNames)) doc.edit(st.scratch);
                }
            },
            [&](Dichroic& dichroic) {
                field("edge", "edge (nm)", &dichroic.edge_nm, "%.1f", doc, st);
                if (table_field("reflects", &dichroic.reflects_shorter, kDichroicReflectsNames)) doc.edit(st.scratch);
                name_field("glass", "substrate glass", &dichroic.substrate.material, doc, st);
                field("thickness", "substrate (mm)", &dichroic.substrate.thickness_mm, "%.3f", doc, st);
            },
            [&](Target& target) {
                optional_field("damage_i", "damage (GW/cm², 0 none)", &target.damage.intensity_gw_cm2, "%.1f", doc, st);
            },
            [](Retroreflector&) {},  // no fields of its own
            [](Dump&) {},
        },
        e.kind);
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
}

// The beams' numeric fields (key prefix "beam ID "), under a header.
void beam_fields(edit::Document& doc, InspectorState& st) {
    const bool open = ImGui::CollapsingHeader("Beams");
    st.field_rects["beams"] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
    if (!open) return;
    for (size_t i = 0; i < st.scratch.beams.size(); ++i) {
        BeamSource& b = st.scratch.beams[i];
        ImGui::PushID(1000 + static_cast<int>(i));
        ImGui::Text("%s", b.id.c_str());
        const std::string owner = "beam " + b.id;
        auto claim = [&] {
            if (!st.editing) {
                st.element = b.id;
                st.editing_beam = true;
            }
        };
        auto f = [&](const char* key, const char* label, double* value, const char* format) {
            claim();
            field((owner + " " + key).c_str(), label, value, format, doc, st);
        };
        auto given = [&](const char* key, const char* label, std::optional<double>* value, const char* format) {
            claim();
            optional_field((owner + " " + key).c_str(), label, value, format, doc, st);
        };
        f("wavelength", "wavelength (nm)", &b.wavelength_nm, "%.2f");
        f("x", "start x (mm)", &b.start_mm.x(), "%.2f");
        f("y", "start y (mm)", &b.start_mm.y(), "%.2f");
        f("direction", "direction (deg)", &b.direction_deg, "%.3f");
        f("waist_t", "waist t (µm)", &b.waist_um.tangential, "%.1f");
        f("waist_s", "waist s (µm)", &b.waist_um.sagittal, "%.1f");
        f("waist_at_t", "waist at, t (mm)", &b.waist_at_mm.tangential, "%.1f");
        f("waist_at_s", "waist at, s (mm)", &b.waist_at_mm.sagittal, "%.1f");
        given("pulse", "pulse FWHM (fs, 0 none)", &b.pulse_fwhm_fs, "%.1f");
        f("emit", "emission time (fs)", &b.emit_time_fs, "%.1f");
        given("power", "power (mW, 0 none)", &b.power_mw, "%.1f");
        given("rate", "repetition rate (kHz, 0 none)", &b.repetition_rate_khz, "%.1f");
        if (b.polarization.kind == Polarization::Kind::Linear) f("pol", "polarization (deg)", &b.polarization.angle_deg, "%.1f");
        ImGui::PopID();
    }
}

}  // namespace

void draw_inspector(edit::Document& doc, EditorState& editor, InspectorState& st) {
    end_stale_edit(doc, editor, st);
    if (editor.locked) {
        ImGui::TextWrapped("A solution is previewed: Apply it or go back to edit.");
        return;
    }
    if (!st.editing) st.scratch = doc.layout();
    st.active_this_frame = false;
    if (editor.selected && *editor.selected < st.scratch.elements.size()) element_fields(doc, editor, st);
    else ImGui::TextDisabled("Click an optic to inspect it; drag it to move it (M: measure).");
    beam_fields(doc, st);
    if (st.editing && !st.active_this_frame) {  // the field lost focus without a deactivation
        doc.finish_gesture(st.gesture);
        st.editing = false;
    }
    if (!doc.last_refusal().empty()) ImGui::TextColored(ImVec4(0.8f, 0.15f, 0.1f, 1), "not applied: %s", doc.last_refusal().c_str());
    ImGui::Separator();
}

}  // namespace rv::ui
