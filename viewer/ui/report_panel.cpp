#include "ui/report_panel.hpp"

#include <imgui.h>

#include <optional>
#include <string>

#include "polarization/polarization_model.hpp"
#include "report/report_words.hpp"
#include "report/safety_cautions.hpp"
#include "report/verdict_words.hpp"
#include "units/number_text.hpp"

namespace rv::ui {

namespace {

const ImVec4 kMet(0.10f, 0.55f, 0.20f, 1), kNear(0.80f, 0.55f, 0.05f, 1), kNotMet(0.80f, 0.15f, 0.10f, 1),
    kNotApplicable(0.45f, 0.45f, 0.50f, 1);

void verdict_line(const char* name, const VerdictLine& l) {
    const ImVec4 colour = !l.applies ? kNotApplicable : l.met ? kMet : kNotMet;
    if (!l.applies) {  // "phase  n/a — the target is not a crystal": the reason is the line
        ImGui::TextColored(colour, "%-6s %s", name, verdict_line_text(l).c_str());
        ImGui::Spacing();
        return;
    }
    ImGui::TextColored(colour, "%-6s %s", name, verdict_state_text(l));
    ImGui::TextWrapped("%s", verdict_reading_text(l.reading).c_str());
    const std::string action = verdict_actions_text(l);
    if (!action.empty()) ImGui::TextWrapped("-> %s", action.c_str());
    ImGui::Spacing();
}

// Text in a table cell wraps at the cell's edge instead of running under the next column.
void cell_text(const std::string& text, std::optional<ImVec4> colour = std::nullopt) {
    if (colour) ImGui::PushStyleColor(ImGuiCol_Text, *colour);
    ImGui::TextWrapped("%s", text.c_str());
    if (colour) ImGui::PopStyleColor();
}

// Stretched columns sized by their headers' weights: the long first column (figure or beam
// names) wraps within its share of the panel.
constexpr ImGuiTableFlags kTableFlags = ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg | ImGuiTableFlags_SizingStretchProp;

void figures_table(const Verdict& v) {
    if (v.figures.empty() || !ImGui::BeginTable("figures", 3, kTableFlags)) return;
    ImGui::TableSetupColumn("figure", ImGuiTableColumnFlags_WidthStretch, 2.0f);
    ImGui::TableSetupColumn("value", ImGuiTableColumnFlags_WidthStretch, 1.0f);
    ImGui::TableSetupColumn("limit", ImGuiTableColumnFlags_WidthStretch, 1.0f);
    ImGui::TableHeadersRow();
    for (const VerdictFigure& f : v.figures) {
        ImGui::TableNextRow();
        ImGui::TableNextColumn();
        using S = VerdictFigure::State;
        const ImVec4 c = f.state == S::Met ? kMet : f.state == S::Near ? kNear : kNotMet;
        cell_text(std::string(f.state == S::Met ? "met " : f.state == S::Near ? "near " : "NOT ") + f.name, c);
        if (ImGui::IsItemHovered()) ImGui::SetTooltip("%s", f.definition.c_str());
        ImGui::TableNextColumn();
        cell_text(format_number("%.3g", f.value));
        ImGui::TableNextColumn();
        cell_text(format_number(f.is_minimum ? ">= %.3g" : "<= %.3g", f.limit));
    }
    ImGui::EndTable();
}

}  // namespace

void draw_report_panel(const RendezvousReport& r, const Layout& layout, std::optional<size_t>* select,
                       std::vector<std::pair<ImVec2, ImVec2>>* finding_rects) {
    if (finding_rects) finding_rects->clear();
    ImGui::TextUnformatted("Verdict");
    ImGui::Separator();
    verdict_line("space", r.verdict.space);
    verdict_line("time", r.verdict.time);
    verdict_line("phase", r.verdict.phase);
    figures_table(r.verdict);
    ImGui::Spacing();
    ImGui::TextUnformatted("At the target");
    ImGui::Separator();
    if (ImGui::BeginTable("beams", 4, kTableFlags)) {
        ImGui::TableSetupColumn("beam", ImGuiTableColumnFlags_WidthStretch, 2.0f);
        ImGui::TableSetupColumn("waist µm");
        ImGui::TableSetupColumn("offset mm");
        ImGui::TableSetupColumn("z_R mm");
        ImGui::TableHeadersRow();
        for (const ReportBeam& b : r.beams) {
            ImGui::TableNextRow();
            ImGui::TableNextColumn();
            cell_text(b.id + format_number(" (%.0f nm)", b.wavelength_nm));
            if (!b.at_target.reached) {
                ImGui::TableNextColumn();
                ImGui::TextUnformatted("misses");
                continue;
            }
            ImGui::TableNextColumn();
            ImGui::Text("%.2f", b.at_target.tangential.waist_um);
            if (ImGui::IsItemHovered()) ImGui::SetTooltip("second-moment waist radius, tangential plane");
            ImGui::TableNextColumn();
            ImGui::Text("%+.3f", b.at_target.tangential.waist_offset_mm);
            if (ImGui::IsItemHovered()) ImGui::SetTooltip("waist position minus the target centre, + = downstream");
            ImGui::TableNextColumn();
            ImGui::Text("%.3f", b.at_target.tangential.rayleigh_mm);
            if (ImGui::IsItemHovered()) ImGui::SetTooltip("Rayleigh range in the medium at the target");
        }
        ImGui::EndTable();
    }
    if (r.mismatch) ImGui::Text("delay %s", format_duration_fs(r.mismatch->delay_fs, true).c_str());
    if (r.overlap) ImGui::Text("overlap %.3f (spatial %.3f)", r.overlap->combined, r.overlap->spatial_along_crystal);
    if (!r.phase_matching.empty()) {
        const PhaseMatchingReport& p = r.phase_matching.front();
        ImGui::Text("%s: %.2f nm", process_beams_text(p.beams).c_str(), p.output_nm);
        if (!p.outside_index_data) ImGui::Text("θ_pm %.3f°, now %.3f°", p.theta_pm_deg, p.theta_now_deg);
        else ImGui::TextWrapped("%s", index_gap_text(*p.outside_index_data).c_str());
    }
    ImGui::Spacing();
    ImGui::TextUnformatted("Power and polarization");
    ImGui::Separator();
    for (const ReportBeam& b : r.beams) {
        if (!b.power.reached) continue;
        if (b.target_power_mw) ImGui::Text("%s: %.1f mW (%.1f %%)", b.id.c_str(), *b.target_power_mw, 100 * b.power.at_target[0]);
        else ImGui::Text("%s: %.1f %% of the source", b.id.c_str(), 100 * b.power.at_target[0]);
        ImGui::TextWrapped("  %s", describe_text(b.at_target_polarization).c_str());
        if (b.pulse_at_target) {
            ImGui::Text("  peak %.3g GW/cm², %.3g mJ/cm²", b.pulse_at_target->peak_intensity_w_cm2 * 1e-9,
                        b.pulse_at_target->peak_fluence_j_cm2 * 1e3);
            if (ImGui::IsItemHovered())
                ImGui::SetTooltip("I = 2 P_peak/(π w_t w_s), P_peak = 0.94 E/τ, at the target plane; "
                                  "an estimate for damage, never an exposure limit");
        }
    }
    for (const PolarizationAdvice& a : r.polarization)
        if (const std::string action = polarization_advice_text(a); !action.empty()) ImGui::TextWrapped("-> %s", action.c_str());
    if (!r.findings.empty()) {
        ImGui::Spacing();
        ImGui::TextUnformatted("Findings (click one to select its element)");
        ImGui::Separator();
        for (size_t k = 0; k < r.findings.size(); ++k) {
            const Finding& f = r.findings[k];
            const std::string line = finding_line(f);
            ImGui::PushID(static_cast<int>(k));
            // A selectable row as tall as the finding's text wrapped to the panel (a Selectable's
            // own label does not wrap), with the text drawn over it.
            const std::string text = "[" + std::string(finding_code(f.kind)) + "] " + line;
            const float wrap_px = ImGui::GetContentRegionAvail().x;
            const ImVec2 row = ImGui::CalcTextSize(text.c_str(), nullptr, false, wrap_px);
            const ImVec2 top = ImGui::GetCursorScreenPos();
            const bool clicked = ImGui::Selectable("##finding", false, ImGuiSelectableFlags_None, ImVec2(0, row.y));
            if (clicked && select) {
                if (const Element* e = layout.find(f.element)) *select = static_cast<size_t>(e - layout.elements.data());
            }
            if (finding_rects) finding_rects->emplace_back(ImGui::GetItemRectMin(), ImGui::GetItemRectMax());
            const ImVec2 after = ImGui::GetCursorScreenPos();
            ImGui::GetWindowDrawList()->AddText(ImGui::GetFont(), ImGui::GetFontSize(), top, ImGui::GetColorU32(ImGuiCol_Text),
                                                text.c_str(), nullptr, wrap_px);
            ImGui::SetCursorScreenPos(after);
            ImGui::PopID();
        }
    }
    ImGui::Spacing();
    ImGui::TextWrapped("%s", safety_short_notice().c_str());
}

}  // namespace rv::ui
