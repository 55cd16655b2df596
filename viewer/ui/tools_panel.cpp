#include "ui/tools_panel.hpp"

#include <algorithm>

#include <imgui.h>

#include "analysis/balance.hpp"
#include "analysis/sweep.hpp"
#include "io/diagnostic.hpp"
#include "io/layout_reader.hpp"
#include "report/report_words.hpp"
#include "solve/default_solve_goals.hpp"
#include "units/number_text.hpp"

namespace rv::ui {

namespace {

void end_preview(edit::Document& doc, ToolsState& st) {
    if (st.previewing) doc.cancel_gesture(st.preview_gesture);
    st.previewing.reset();
}

void solve_section(edit::Document& doc, ToolsState& st) {
    const bool default_goals = !doc.layout().goals.solve;
    if (default_goals)
        ImGui::TextWrapped("No goals.solve in the file: the search uses the default (every lens and curved mirror on "
                           "one beam's own path moving ±%g mm along its beam, aim focus).", kDefaultMoveRange_mm);
    if (ImGui::Button("Search the catalog")) {
        end_preview(doc, st);
        Layout problem = doc.layout();
        const MaterialLibrary library = material_library_for(problem);
        if (default_goals) problem.goals.solve = default_solve_goals(problem, library);
        st.solve = {};
        st.summaries.clear();
        st.solved_with_default_goals = default_goals;
        if (problem.goals.solve->move.empty() && problem.goals.solve->swap.empty()) {
            st.message = "nothing to solve: no lens or curved mirror lies on one beam's own path";
            return;
        }
        st.solve = solve_telescopes(problem, library, st.catalog, SolveOptions{});
        st.message = st.solve.error.empty() ? std::to_string(st.solve.combinations) + " combination(s) searched"
                                            : st.solve.error;
        // Each solution as it would be applied (without the default goals), judged by the report.
        for (TelescopeSolution& s : st.solve.solutions) {
            if (default_goals) s.layout.goals.solve.reset();
            const RendezvousReport r = build_report(s.layout, library);
            st.summaries.push_back({r.verdict, beam_outcomes(s.layout, r), moves_at_range_end(*problem.goals.solve, s)});
        }
    }
    for (size_t k = 0; k < st.solve.solutions.size(); ++k) {
        const TelescopeSolution& s = st.solve.solutions[k];
        const ToolsState::SolutionSummary& sum = st.summaries[k];
        std::string label = std::to_string(k + 1) + ". space " + verdict_state_text(sum.verdict.space) + ", time " +
                            verdict_state_text(sum.verdict.time) + ", phase " + verdict_state_text(sum.verdict.phase) + ":";
        for (const auto& [id, lens] : s.swaps) label += " " + id + "=" + lens;
        for (const auto& [id, move] : s.moves_mm) label += " " + id + " " + format_number("%+.3f", move) + " mm";
        if (!s.violations.empty()) label += " (breaks a constraint)";
        if (ImGui::Selectable(label.c_str(), st.previewing == k)) {
            end_preview(doc, st);
            st.preview_gesture = doc.begin_gesture();
            doc.preview(s.layout);
            st.previewing = k;
        }
    }
    if (!st.solve.solutions.empty()) {
        // What the shown (or best) solution leaves, and what binds it.
        const size_t k = st.previewing.value_or(0);
        const TelescopeSolution& s = st.solve.solutions[k];
        const ToolsState::SolutionSummary& sum = st.summaries[k];
        ImGui::Text("solution %zu, as it would be applied:", k + 1);
        for (const BeamOutcome& b : sum.beams)
            ImGui::BulletText("%s: waist %s mm %s the target centre (%s Rayleigh ranges), %s µm%s", b.beam.c_str(),
                              format_number("%.3f", std::abs(b.waist_offset_mm)).c_str(),
                              b.waist_offset_mm >= 0 ? "after" : "before",
                              format_number("%.3f", std::abs(b.offset_rayleigh)).c_str(),
                              format_number("%.2f", b.waist_um).c_str(),
                              b.goal_um ? (" (goal " + format_number("%.2f", *b.goal_um) + " µm, " +
                                           format_number("%+.1f", 100 * (b.waist_um / *b.goal_um - 1)) + " %)").c_str()
                                        : "");
        for (const std::string& id : sum.at_range_end)
            ImGui::BulletText("%s sits at the end of its range: widen goals.solve.move.%s", id.c_str(), id.c_str());
        for (const std::string& v : s.violations) ImGui::BulletText("breaks a constraint: %s", v.c_str());
        if (s.clipped_fraction)
            ImGui::BulletText("clips %s %% at a swapped lens", format_number("%.3g", 100 * *s.clipped_fraction).c_str());
        for (const DiameterAlternative& a : s.also) {
            std::string t = "also solved:";
            for (const auto& [id, lens] : a.swaps) t += " " + id + "=" + lens;
            ImGui::BulletText("%s", t.c_str());
        }
    }
    if (st.previewing) {
        if (ImGui::Button("Apply")) {
            doc.finish_gesture(st.preview_gesture);
            st.previewing.reset();
            st.message = "applied the solution (Ctrl+Z undoes it)";
        }
        ImGui::SameLine();
        if (ImGui::Button("Back to the layout")) end_preview(doc, st);
    }
}

void sweep_section(edit::Document& doc, ToolsState& st) {
    ImGui::SetNextItemWidth(160);
    ImGui::InputText("ID.FIELD", st.sweep_field, sizeof st.sweep_field);
    ImGui::SetNextItemWidth(80);
    ImGui::InputDouble("from", &st.sweep_from);
    ImGui::SameLine();
    ImGui::SetNextItemWidth(80);
    ImGui::InputDouble("to", &st.sweep_to);
    if (ImGui::Button("Sweep 41 values")) {
        const std::string spec = st.sweep_field;
        const size_t dot = spec.find('.');
        st.sweep = SweepCurves{spec, {}, {}, {}};
        if (dot == std::string::npos) {
            st.message = "expected ID.FIELD, such as S1.position_mm";
        } else {
            const SweepResult r = sweep_field(doc.layout(), spec.substr(0, dot), spec.substr(dot + 1), st.sweep_from, st.sweep_to, 41);
            if (!r.diagnostics.empty()) st.message = format_diagnostic(r.diagnostics.front(), "sweep");
            for (const SweepPoint& p : r.points) {
                st.sweep.values.push_back(p.value);
                st.sweep.overlap.push_back(p.report.overlap ? p.report.overlap->combined : 0.0);
                st.sweep.sinc2.push_back(p.report.phase_matching.empty() ? 0.0 : p.report.phase_matching.front().sinc2_now);
            }
        }
    }
    if (!st.sweep.values.empty()) {
        const ImVec2 size(std::max(ImGui::GetContentRegionAvail().x, 240.0f), 170);
        draw_sweep_plot(ImGui::GetWindowDrawList(), ImGui::GetCursorScreenPos(), size, st.sweep);
        ImGui::Dummy(size);
    }
}

}  // namespace

void draw_tools_panel(edit::Document& doc, ToolsState& st) {
    if (st.previewing && !doc.in_gesture(st.preview_gesture)) st.previewing.reset();  // ended elsewhere
    if (!ImGui::CollapsingHeader("Solvers")) return;
    if (ImGui::Button("Balance the delay")) {
        end_preview(doc, st);
        const BalanceResult b = balance_delay(doc.layout(), material_library_for(doc.layout()));
        if (b.stage.empty()) {
            st.message = "no stage in either arm";
        } else {
            doc.edit(b.layout);
            st.message = "stage " + b.stage + " set to " + std::to_string(b.stage_set_mm).substr(0, 7) + " mm" +
                         (b.add_path_mm != 0 ? "; add " + std::to_string(b.add_path_mm).substr(0, 6) + " mm of path to " + b.add_path_to
                                             : std::string());
        }
    }
    ImGui::SameLine();
    if (ImGui::Button("Tolerances")) {
        end_preview(doc, st);
        st.tolerance = analyse_tolerances(doc.layout(), material_library_for(doc.layout()), 2000, 1, 2);
    }
    if (st.tolerance) {
        // The same analysis as `rendezvous tolerance` (solve/tolerance.hpp), 2000 aligned builds.
        const ToleranceReport& t = *st.tolerance;
        if (!t.error.empty()) {
            ImGui::TextWrapped("%s: %s", t.error_pointer.c_str(), t.error.c_str());
        } else {
            if (!t.nominal_passes)
                ImGui::TextWrapped("The layout as given does not meet its verdict (space %s, time %s, phase %s); aligned "
                                   "with its adjusters: %s.",
                                   verdict_state_text(t.nominal_verdict.space), verdict_state_text(t.nominal_verdict.time),
                                   verdict_state_text(t.nominal_verdict.phase), t.aligned_passes ? "met" : "still not met");
            ImGui::Text("%zu builds, aligned: pass rate %.3f (space %.3f, time %.3f, phase %.3f)", t.samples, t.pass_rate,
                        t.space_rate, t.time_rate, t.phase_rate);
            ImGui::Text("overlap after alignment %.3f / %.3f / %.3f (5/50/95 %%)", t.overlap.p5, t.overlap.p50, t.overlap.p95);
            if (!t.limiting_error.empty())
                ImGui::TextWrapped("limiting error: %s (%.0f %% of the failing builds pass without it)", t.limiting_error.c_str(),
                                   100 * t.limiting_share);
            if (t.recommendation)
                ImGui::TextWrapped("would help most: %s, pass rate %.3f (%.3f as it is, on %zu builds)",
                                   change_text(*t.recommendation, doc.layout()).c_str(), t.recommendation->pass_rate,
                                   t.checked_pass_rate, t.checked);
            ImGui::TextWrapped("fine adjustment: %s", t.most_sensitive.c_str());
        }
    }
    solve_section(doc, st);
    sweep_section(doc, st);
    if (!st.message.empty()) ImGui::TextWrapped("%s", st.message.c_str());
}

}  // namespace rv::ui
