#include "ui/report_panel.hpp"

#include <imgui.h>

namespace rv::ui {

namespace {

void verdict_line(const char* name, const VerdictLine& l) {
    const ImVec4 colour = l.met ? ImVec4(0.10f, 0.55f, 0.20f, 1) : ImVec4(0.80f, 0.15f, 0.10f, 1);
    ImGui::TextColored(colour, "%-6s %s", name, l.met ? "met" : "NOT MET");
    ImGui::TextWrapped("%s", l.summary.c_str());
    if (!l.action.empty()) ImGui::TextWrapped("-> %s", l.action.c_str());
    ImGui::Spacing();
}

}  // namespace

void draw_report_panel(const RendezvousReport& r) {
    ImGui::TextUnformatted("Verdict");
    ImGui::Separator();
    verdict_line("space", r.verdict.space);
    verdict_line("time", r.verdict.time);
    verdict_line("phase", r.verdict.phase);
    ImGui::TextUnformatted("At the target");
    ImGui::Separator();
    if (ImGui::BeginTable("beams", 4, ImGuiTableFlags_Borders | ImGuiTableFlags_RowBg)) {
        ImGui::TableSetupColumn("beam");
        ImGui::TableSetupColumn("waist um");
        ImGui::TableSetupColumn("offset mm");
        ImGui::TableSetupColumn("z_R mm");
        ImGui::TableHeadersRow();
        for (const ReportBeam& b : r.beams) {
            ImGui::TableNextRow();
            ImGui::TableNextColumn();
            ImGui::Text("%s (%.0f nm)", b.id.c_str(), b.wavelength_nm);
            if (!b.at_target.reached) {
                ImGui::TableNextColumn();
                ImGui::TextUnformatted("misses");
                continue;
            }
            ImGui::TableNextColumn();
            ImGui::Text("%.2f", b.at_target.tangential.waist_um);
            ImGui::TableNextColumn();
            ImGui::Text("%+.3f", b.at_target.tangential.waist_offset_mm);
            ImGui::TableNextColumn();
            ImGui::Text("%.3f", b.at_target.tangential.rayleigh_mm);
        }
        ImGui::EndTable();
    }
    if (r.mismatch) ImGui::Text("delay %+.1f fs", r.mismatch->delay_fs);
    if (r.overlap) ImGui::Text("overlap %.3f (spatial %.3f)", r.overlap->combined, r.overlap->spatial_along_crystal);
    if (!r.phase_matching.empty()) {
        const PhaseMatchingReport& p = r.phase_matching.front();
        ImGui::Text("%s: %.2f nm", p.process.c_str(), p.output_nm);
        ImGui::Text("theta_pm %.3f deg, now %.3f deg", p.theta_pm_deg, p.theta_now_deg);
    }
    if (!r.warnings.empty()) {
        ImGui::Spacing();
        ImGui::TextUnformatted("Findings");
        ImGui::Separator();
        for (const ReportWarning& w : r.warnings) ImGui::TextWrapped("[%s] %s", w.code.c_str(), w.message.c_str());
    }
    ImGui::Spacing();
    ImGui::TextWrapped("Planning aid only: no exposure limits. Follow your laser safety officer, "
                       "IEC 60825-1 and ANSI Z136.1.");
}

}  // namespace rv::ui
