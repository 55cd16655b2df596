#include "ui/goals_panel.hpp"

#include <imgui.h>

#include <algorithm>
#include <cstdio>

#include "layout/enum_names.hpp"

namespace rv::ui {

namespace {

struct Panel {
    edit::Document& doc;
    GoalsState& st;
    bool any_active = false;

    bool apply_due = false;

    // Asks for the scratch goals to become one edit once the panel is drawn (apply_now).
    void apply() { apply_due = true; }
    // The edit; a refusal keeps the document and shows the reader's message.
    void apply_now() {
        if (!apply_due) return;
        Layout next = doc.layout();
        next.goals = st.scratch;
        const bool differs = next.goals != doc.layout().goals;
        const unsigned before = doc.revision();
        doc.edit(std::move(next));
        if (doc.revision() == before && differs) st.error = doc.last_refusal();
        else st.error.clear();
        st.scratch = doc.layout().goals;
    }

    void record(const std::string& key) {
        st.field_rects[key] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
        if (ImGui::IsItemActive()) any_active = true;
    }

    // A number: applied when the field is left after a change (Enter, Tab, a click elsewhere).
    void number(const std::string& key, const char* label, double* value, float width_px = 110) {
        ImGui::SetNextItemWidth(width_px);
        ImGui::InputDouble(label, value, 0, 0, "%g", ImGuiInputTextFlags_AutoSelectAll);
        record(key);
        if (ImGui::IsItemDeactivatedAfterEdit()) apply();
    }
    // A number the file may leave out: 0 removes it.
    void optional_number(const std::string& key, const char* label, std::optional<double>* value) {
        double shown = value->value_or(0);
        ImGui::SetNextItemWidth(110);
        if (ImGui::InputDouble(label, &shown, 0, 0, "%g", ImGuiInputTextFlags_AutoSelectAll))
            *value = shown == 0 ? std::nullopt : std::optional<double>(shown);
        record(key);
        if (ImGui::IsItemDeactivatedAfterEdit()) apply();
    }
    bool checkbox(const std::string& key, const char* label, bool* value) {
        const bool changed = ImGui::Checkbox(label, value);
        record(key);
        return changed;
    }
};

void waist_goals(Panel& p, const Layout& l) {
    ImGui::TextDisabled("goals.waist_um: the waist radius wanted at the target (0: none)");
    for (const BeamSource& b : l.beams) {
        auto& goals = p.st.scratch.waist_um;
        auto it = std::find_if(goals.begin(), goals.end(), [&](const auto& g) { return g.first == b.id; });
        std::optional<double> value;
        if (it != goals.end()) value = it->second;
        const std::optional<double> before = value;
        ImGui::PushID(b.id.c_str());
        p.optional_number("waist " + b.id, (b.id + " waist_um").c_str(), &value);
        ImGui::PopID();
        if (value != before) {  // typed this frame: into the scratch goals
            if (it != goals.end() && value) it->second = *value;
            else if (it != goals.end()) goals.erase(it);
            else if (value) goals.emplace_back(b.id, *value);
        }
    }
}

void solve_goals(Panel& p, const Layout& l) {
    bool present = p.st.scratch.solve.has_value();
    if (p.checkbox("solve", "goals.solve in the file (else the default)", &present)) {
        if (present) p.st.scratch.solve = SolveGoals{};
        else p.st.scratch.solve.reset();
        p.apply();
    }
    if (!p.st.scratch.solve) return;
    SolveGoals& s = *p.st.scratch.solve;
    int aim = 0;
    for (size_t i = 0; i < kSolveAimNames.size(); ++i)
        if (kSolveAimNames[i].value == s.aim) aim = static_cast<int>(i);
    const char* aims[kSolveAimNames.size()];
    for (size_t i = 0; i < kSolveAimNames.size(); ++i) aims[i] = kSolveAimNames[i].text.data();
    ImGui::SetNextItemWidth(140);
    if (ImGui::Combo("aim", &aim, aims, static_cast<int>(kSolveAimNames.size()))) {
        s.aim = kSolveAimNames[static_cast<size_t>(aim)].value;
        p.apply();
    }
    p.record("aim");
    ImGui::TextDisabled("moves: min_mm to max_mm along the beam from where it stands");
    for (size_t i = 0; i < s.move.size(); ++i) {
        auto& [id, range] = s.move[i];
        ImGui::PushID(static_cast<int>(i));
        ImGui::TextUnformatted(id.c_str());
        ImGui::SameLine(90);
        p.number("move " + id + " min", "##min_mm", &range.first, 70);
        ImGui::SameLine();
        p.number("move " + id + " max", "mm##max_mm", &range.second, 70);
        ImGui::SameLine();
        const bool remove = ImGui::SmallButton("remove");
        p.record("move " + id + " remove");
        ImGui::PopID();
        if (remove) {
            s.move.erase(s.move.begin() + static_cast<std::ptrdiff_t>(i));
            p.apply();
            return;
        }
    }
    ImGui::SetNextItemWidth(140);
    if (ImGui::BeginCombo("##new move", p.st.new_move.empty() ? "(an optic)" : p.st.new_move.c_str())) {
        for (const Element& e : l.elements)
            if (!std::holds_alternative<Stage>(e.kind) && ImGui::Selectable(e.id.c_str(), e.id == p.st.new_move))
                p.st.new_move = e.id;
        ImGui::EndCombo();
    }
    p.record("new move");
    ImGui::SameLine();
    const bool add = ImGui::SmallButton("add a move of ±25 mm");
    p.record("add move");
    if (add && !p.st.new_move.empty()) {
        s.move.emplace_back(p.st.new_move, std::make_pair(-25.0, 25.0));
        p.apply();
    }
    ImGui::TextDisabled("swaps: lenses the catalog may replace");
    for (const Element& e : l.elements) {
        if (!std::holds_alternative<Lens>(e.kind)) continue;
        bool on = std::find(s.swap.begin(), s.swap.end(), e.id) != s.swap.end();
        if (p.checkbox("swap " + e.id, ("swap " + e.id).c_str(), &on)) {
            if (on) s.swap.push_back(e.id);
            else s.swap.erase(std::remove(s.swap.begin(), s.swap.end(), e.id), s.swap.end());
            p.apply();
        }
    }
    p.number("min_spacing_mm", "min_spacing_mm", &s.min_spacing_mm);
    p.number("table_margin_mm", "table_margin_mm", &s.table_margin_mm);
    p.optional_number("max_path_mm", "max_path_mm (0: none)", &s.max_path_mm);
}

void tolerance_goals(Panel& p) {
    Tolerances& t = p.st.scratch.tolerance;
    p.number("position_mm", "position_mm (±)", &t.position_mm);
    p.number("angle_mrad", "angle_mrad (±)", &t.angle_mrad);
    p.number("focal_length_fraction", "focal_length_fraction (±)", &t.focal_length_fraction);
    p.number("stage_mm", "stage_mm (±)", &t.stage_mm);
}

void verdict_goals(Panel& p) {
    VerdictThresholds& v = p.st.scratch.verdict;
    p.number("max_waist_offset_rayleigh", "max_waist_offset_rayleigh", &v.max_waist_offset_rayleigh);
    p.number("max_waist_ratio", "max_waist_ratio", &v.max_waist_ratio);
    p.number("max_lateral_offset_radius", "max_lateral_offset_radius", &v.max_lateral_offset_radius);
    p.number("max_delay_xcorr", "max_delay_xcorr", &v.max_delay_xcorr);
    p.number("min_phase_factor", "min_phase_factor", &v.min_phase_factor);
    p.number("max_goal_waist_error", "max_goal_waist_error", &v.max_goal_waist_error);
}

}  // namespace

void draw_goals_panel(edit::Document& doc, GoalsState& st) {
    if (!st.editing) st.scratch = doc.layout().goals;
    Panel p{doc, st};
    const bool open = ImGui::CollapsingHeader("Goals");
    st.field_rects["goals"] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
    if (open) {
        ImGui::PushID("goals");
        waist_goals(p, doc.layout());
        const bool solve_open = ImGui::TreeNode("solve (goals.solve)");
        st.field_rects["solve"] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
        if (solve_open) {
            solve_goals(p, doc.layout());
            ImGui::TreePop();
        }
        const bool tolerance_open = ImGui::TreeNode("tolerance (goals.tolerance)");
        st.field_rects["tolerance"] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
        if (tolerance_open) {
            tolerance_goals(p);
            ImGui::TreePop();
        }
        const bool verdict_open = ImGui::TreeNode("verdict thresholds (goals.verdict)");
        st.field_rects["verdict"] = {ImGui::GetItemRectMin(), ImGui::GetItemRectMax()};
        if (verdict_open) {
            verdict_goals(p);
            ImGui::TreePop();
        }
        if (!st.error.empty()) {
            ImGui::PushStyleColor(ImGuiCol_Text, IM_COL32(200, 30, 30, 255));
            ImGui::TextWrapped("not applied: %s", st.error.c_str());
            ImGui::PopStyleColor();
        }
        ImGui::PopID();
    }
    st.editing = p.any_active;
    p.apply_now();
}

}  // namespace rv::ui
