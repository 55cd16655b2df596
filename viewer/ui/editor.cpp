#include "ui/editor.hpp"

#include <imgui.h>

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "analysis/breadboard_holes.hpp"
#include "edit/new_elements.hpp"
#include "layout/element_kinds.hpp"
#include "trace/poses.hpp"
#include "units/constants.hpp"

namespace rv::ui {

namespace {

std::vector<Path> paths_of(const RendezvousReport& report) {
    std::vector<Path> paths;
    for (const ReportBeam& b : report.beams) paths.push_back(b.path);
    return paths;
}


}  // namespace

Vec2 snapped_to_hole(const Table& table, const Vec2& p_mm) {
    const std::optional<HoleLocation> hole = hole_of(table, p_mm);
    return hole ? hole->hole_mm : p_mm;
}

std::optional<size_t> element_at(const edit::Document& doc, const Vec2& p, double px_per_mm) {
    const Layout& l = doc.layout();
    const std::vector<ElementPose> poses = element_poses(l, paths_of(doc.report()));
    std::optional<size_t> best;
    double best_d = 0;
    for (size_t i = 0; i < l.elements.size(); ++i) {
        if (std::holds_alternative<Stage>(l.elements[i].kind)) continue;  // a stage has no symbol
        const double d = (poses[i].at_mm - p).norm();
        const double reach = std::max(l.elements[i].aperture_mm / 2, 8.0 / px_per_mm);
        if (d <= reach && (!best || d < best_d)) best = i, best_d = d;
    }
    return best;
}

std::string ruler_text(const EditorState::Ruler& r) {
    const Vec2 d = r.to_mm - r.from_mm;
    char text[64];
    std::snprintf(text, sizeof text, "%.1f mm at %.1f°", d.norm(), rad_to_deg(std::atan2(d.y(), d.x())));
    return text;
}

namespace {

// A table point, caught by the nearest optic's centre within 8 px.
Vec2 caught(const edit::Document& doc, const Vec2& p, double px_per_mm) {
    const std::vector<ElementPose> poses = element_poses(doc.layout(), paths_of(doc.report()));
    Vec2 best = p;
    double best_d = 8.0 / px_per_mm;
    for (size_t i = 0; i < poses.size(); ++i)
        if (!std::holds_alternative<Stage>(doc.layout().elements[i].kind) && (poses[i].at_mm - p).norm() < best_d)
            best = poses[i].at_mm, best_d = (poses[i].at_mm - p).norm();
    return best;
}

bool measure_on_canvas(const edit::Document& doc, EditorState& s, const View& view) {
    const ImGuiIO& io = ImGui::GetIO();
    const Vec2 cursor = caught(doc, view.to_table(io.MousePos), view.px_per_mm);
    if (ImGui::IsItemActivated() && ImGui::IsMouseClicked(ImGuiMouseButton_Left)) {
        s.ruler = EditorState::Ruler{cursor, cursor, true};
        return true;
    }
    if (s.ruler && s.ruler->active) {
        s.ruler->to_mm = cursor;
        if (!io.MouseDown[ImGuiMouseButton_Left]) {
            s.ruler->active = false;
            s.status = "measured " + ruler_text(*s.ruler);
        }
        return true;
    }
    return false;
}

}  // namespace

bool edit_on_canvas(edit::Document& doc, EditorState& s, const View& view) {
    if (s.measuring) return measure_on_canvas(doc, s, view);
    const ImGuiIO& io = ImGui::GetIO();
    const Vec2 cursor = view.to_table(io.MousePos);
    if (ImGui::IsItemActivated() && ImGui::IsMouseClicked(ImGuiMouseButton_Left)) {
        select(doc, s, element_at(doc, cursor, view.px_per_mm));
        if (s.selected && !s.locked) {
            // The element keeps its offset from the cursor (a stage's offset stays on top of it).
            const Element& e = doc.layout().elements[*s.selected];
            s.drag = EditorState::Drag{*s.selected, e.at_mm - cursor, e.at_mm, doc.begin_gesture()};
        }
    }
    if (s.drag) {
        if (!doc.in_gesture(s.drag->gesture)) {  // something else ended it
            s.drag.reset();
            return false;
        }
        if (!io.MouseDown[ImGuiMouseButton_Left]) {
            doc.finish_gesture(s.drag->gesture);
            s.drag.reset();
            return true;
        }
        // A click is not a move: nothing moves (or snaps) until the cursor has left the press
        // point by ImGui's drag threshold.
        if (!ImGui::IsMouseDragging(ImGuiMouseButton_Left) && doc.layout().elements[s.drag->element].at_mm == s.drag->start_mm)
            return true;
        Vec2 at = cursor + s.drag->grab_offset_mm;
        if (s.snap && !io.KeyAlt) at = snapped_to_hole(doc.layout().table, at);
        if (at != doc.layout().elements[s.drag->element].at_mm) {
            Layout next = doc.layout();
            next.elements[s.drag->element].at_mm = at;
            doc.preview(std::move(next));
        }
        return true;
    }
    return false;
}

void delete_selected(edit::Document& doc, EditorState& s) {
    if (!s.selected || *s.selected >= doc.layout().elements.size()) return;
    Layout next = doc.layout();
    const std::string id = next.elements[*s.selected].id;
    if (id == next.target) {
        s.status = id + " is the layout's target: choose another target before deleting it";
        return;
    }
    next.elements.erase(next.elements.begin() + static_cast<std::ptrdiff_t>(*s.selected));
    // References to it go with it: a stage no longer carries it, a mirror no longer aims at it.
    for (Element& e : next.elements) {
        if (auto* st = std::get_if<Stage>(&e.kind))
            st->carries.erase(std::remove(st->carries.begin(), st->carries.end(), id), st->carries.end());
        if (auto* m = std::get_if<Mirror>(&e.kind); m && m->aim_at == id) m->aim_at.reset();
    }
    const unsigned before = doc.revision();
    doc.edit(std::move(next));
    if (doc.revision() == before) {
        s.status = "cannot delete " + id + ": " + doc.last_refusal();
        return;
    }
    s.status = "deleted " + id;
    select(doc, s, std::nullopt);
}

void duplicate_selected(edit::Document& doc, EditorState& s) {
    if (!s.selected || *s.selected >= doc.layout().elements.size()) return;
    Layout next = doc.layout();
    Element copy = next.elements[*s.selected];
    if (std::holds_alternative<Stage>(copy.kind)) std::get<Stage>(copy.kind).carries.clear();
    copy.id = edit::suffixed_id(next, copy.id);
    copy.at_mm += Vec2(next.table.grid_mm, next.table.grid_mm);
    next.elements.push_back(copy);
    doc.edit(std::move(next));
    select(doc, s, doc.layout().elements.size() - 1);
    s.status = "duplicated as " + copy.id;
}

void rotate_selected(edit::Document& doc, EditorState& s, double degrees) {
    if (!s.selected || *s.selected >= doc.layout().elements.size()) return;
    Layout next = doc.layout();
    Element& e = next.elements[*s.selected];
    if (auto* m = std::get_if<Mirror>(&e.kind); m && m->aim_at) {
        s.status = e.id + " aims at " + *m->aim_at + "; turning it drops the aim";
        m->aim_at.reset();
    }
    e.normal_deg = std::remainder(e.normal_deg + degrees, 360.0);
    doc.edit(std::move(next));
}

std::vector<std::string> addable_element_types() {
    std::vector<std::string> out;
    for (const edit::NewElementChoice& c : edit::new_element_choices(Layout{}))
        if (std::find(out.begin(), out.end(), c.type) == out.end()) out.push_back(c.type);
    out.push_back("stage");  // through add_stage, once its optics are chosen
    // In ElementKind's order, as the reader lists the types.
    std::vector<std::string> ordered;
    for (const std::string& type : element_type_names())
        if (std::find(out.begin(), out.end(), type) != out.end()) ordered.push_back(type);
    return ordered;
}

bool add_new_element(edit::Document& doc, EditorState& s, Element e, const Vec2& at_mm) {
    Layout next = doc.layout();
    if (!std::holds_alternative<Stage>(e.kind)) e.at_mm = snapped_to_hole(next.table, at_mm);
    e.id = edit::numbered_id(next, e.id);
    next.elements.push_back(e);
    const unsigned before = doc.revision();
    doc.edit(std::move(next));
    if (doc.revision() == before) {
        s.status = "cannot add " + e.id + ": " + doc.last_refusal();
        return false;
    }
    select(doc, s, doc.layout().elements.size() - 1);
    s.status = "added " + e.id;
    return true;
}

bool add_stage(edit::Document& doc, EditorState& s, std::vector<std::string> carries) {
    if (carries.empty()) {
        s.status = "a stage carries at least one optic: choose what it carries";
        return false;
    }
    return add_new_element(doc, s, edit::new_stage(std::move(carries)), {0, 0});
}

bool add_beam(edit::Document& doc, EditorState& s, const Vec2& at_mm) {
    Layout next = doc.layout();
    next.beams.push_back(edit::new_beam(next, snapped_to_hole(next.table, at_mm)));
    const std::string id = next.beams.back().id;
    const unsigned before = doc.revision();
    doc.edit(std::move(next));
    if (doc.revision() == before) {
        s.status = "cannot add " + id + ": " + doc.last_refusal();
        return false;
    }
    s.status = "added " + id;
    return true;
}

void add_element(edit::Document& doc, EditorState& s, const std::string& type, const Vec2& at_mm) {
    if (type == "stage") {  // carrying the selected optic, when it can
        const std::vector<std::string> free = edit::carriable_ids(doc.layout());
        if (s.selected && *s.selected < doc.layout().elements.size() &&
            std::count(free.begin(), free.end(), doc.layout().elements[*s.selected].id)) {
            add_stage(doc, s, {doc.layout().elements[*s.selected].id});
            return;
        }
        s.status = "cannot add a stage from the window without an optic to carry: select one first";
        return;
    }
    for (edit::NewElementChoice& c : edit::new_element_choices(doc.layout()))
        if (c.type == type) {
            add_new_element(doc, s, std::move(c.element), at_mm);
            return;
        }
    s.status = "cannot add a " + type + " from the window";
}

void select(const edit::Document& doc, EditorState& s, std::optional<size_t> element) {
    s.selected = element && *element < doc.layout().elements.size() ? element : std::nullopt;
    s.selected_id = s.selected ? doc.layout().elements[*s.selected].id : std::string();
    s.selection_revision = doc.revision();
}

void sync_selection(const edit::Document& doc, EditorState& s) {
    const auto& elements = doc.layout().elements;
    if (doc.revision() != s.selection_revision && !s.selected_id.empty()) {
        std::optional<size_t> found;
        for (size_t i = 0; i < elements.size(); ++i)
            if (elements[i].id == s.selected_id) found = i;
        s.selected = found;  // the same element where it is now, or none when it is gone
    }
    if (s.selected && *s.selected >= elements.size()) s.selected.reset();
    // A selection made since (a click, a finding) is recorded by its id.
    s.selected_id = s.selected ? elements[*s.selected].id : std::string();
    s.selection_revision = doc.revision();
}

bool cancel_drag(edit::Document& doc, EditorState& s) {
    if (!s.drag) return false;
    doc.cancel_gesture(s.drag->gesture);
    s.drag.reset();
    s.status = "move cancelled";
    return true;
}

void select_next(const edit::Document& doc, EditorState& s, int step) {
    const auto& elements = doc.layout().elements;
    const long n = static_cast<long>(elements.size());
    if (n == 0) return;
    long i = s.selected ? static_cast<long>(*s.selected) : (step > 0 ? -1 : n);
    for (long k = 0; k < n; ++k) {  // stages have no symbol: skipped, as a click skips them
        i = ((i + step) % n + n) % n;
        if (!std::holds_alternative<Stage>(elements[static_cast<size_t>(i)].kind)) {
            select(doc, s, static_cast<size_t>(i));
            return;
        }
    }
}

}  // namespace rv::ui
