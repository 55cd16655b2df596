// rendezvous tolerance: sensitivities, and a Monte Carlo run of builds aligned with the
// layout's adjusters and judged with the report's verdict (pass rate, what limits, what helps).
#include <chrono>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>
#include <thread>
#include <vector>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/diagnostic.hpp"
#include "io/layout_reader.hpp"
#include "report/report_json.hpp"
#include "report/report_text.hpp"
#include "solve/tolerance.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

int run_tolerance(const ToleranceOptions& o, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    const int threads = static_cast<int>(std::max(1u, std::thread::hardware_concurrency()));
    const auto t0 = std::chrono::steady_clock::now();
    const ToleranceReport r = analyse_tolerances(*layout, material_library_for(*layout), o.samples, o.seed, threads);
    const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    if (!r.error.empty()) {
        err << format_diagnostic({Diagnostic::Severity::Error, r.error_pointer, 0, 0, r.error}, o.layout) << "\n";
        return 2;
    }
    if (!r.nominal.valid) {
        err << o.layout << ": error: a beam does not reach the target; fix the trace findings first\n";
        return 2;
    }
    const Tolerances& t = layout->goals.tolerance;
    if (o.json) {
        using nlohmann::json;
        auto figures = [](const Figures& f) {
            return json{{"waist_offset_mm", f.waist_offset_mm}, {"waist_ratio", f.waist_ratio},
                        {"lateral_um", f.lateral_um}, {"delay_fs", f.delay_fs}, {"overlap", f.overlap}};
        };
        auto spread = [](const Spread& s) { return json{{"p5", s.p5}, {"p50", s.p50}, {"p95", s.p95}}; };
        json sensitivity = json::array();
        for (const SensitivityRow& s : r.sensitivity)
            sensitivity.push_back({{"perturbation", s.label}, {"tolerance", s.tolerance}, {"per_unit", figures(s.per_unit)}});
        json moves = json::array();
        for (const auto& [what, by] : r.alignment_moves) moves.push_back({{"setting", what}, {"change", by}});
        auto change = [&](const ToleranceChange& c) {
            static const char* kinds[] = {"stage", "walk", "refocus", "crystal", "tighter"};
            return json{{"kind", kinds[static_cast<int>(c.kind)]},
                        {"elements", c.elements},
                        {"perturbation", c.kind == ToleranceChange::Kind::Tighter ? json(c.perturbation) : json(nullptr)},
                        {"beam", c.kind == ToleranceChange::Kind::Walk ? json(c.perturbation) : json(nullptr)},
                        {"tolerance", c.kind == ToleranceChange::Kind::Tighter ? json(c.tolerance) : json(nullptr)},
                        {"text", change_text(c, *layout)},
                        {"pass_rate", c.pass_rate},
                        {"subset_pass_rate", c.subset_pass_rate}};
        };
        out << json{{"layout", o.layout},
                    {"nominal_verdict", verdict_states_json(r.nominal_verdict)},
                    {"nominal_passes", r.nominal_passes},
                    {"adjusters", r.adjusters},
                    {"alignment", moves},
                    {"aligned_verdict", verdict_states_json(r.aligned_verdict)},
                    {"aligned_passes", r.aligned_passes},
                    {"pass_rate", r.pass_rate},
                    {"line_pass_rates", {{"space", r.space_rate}, {"time", r.time_rate}, {"phase", r.phase_rate}}},
                    {"limiting_error", r.limiting_error.empty() ? json(nullptr)
                                                                : json{{"perturbation", r.limiting_error},
                                                                       {"share", r.limiting_share},
                                                                       {"examined", r.limiting_examined}}},
                    {"recommendation", r.recommendation ? change(*r.recommendation) : json(nullptr)},
                    {"compared_on", {{"samples", r.subset}, {"pass_rate", r.subset_pass_rate}}},
                    {"recommendation_checked_on", {{"samples", r.checked}, {"pass_rate", r.checked_pass_rate}}},
                    {"tolerances", {{"position_mm", t.position_mm}, {"angle_mrad", t.angle_mrad},
                                    {"focal_length_fraction", t.focal_length_fraction}, {"stage_mm", t.stage_mm}}},
                    {"nominal", figures(r.nominal)},
                    {"sensitivity", sensitivity},
                    {"monte_carlo", {{"samples", r.samples}, {"seed", o.seed}, {"missed_target", r.failed},
                                     {"waist_offset_mm", spread(r.waist_offset_mm)}, {"waist_ratio", spread(r.waist_ratio)},
                                     {"lateral_um", spread(r.lateral_um)}, {"delay_fs", spread(r.delay_fs)},
                                     {"overlap", spread(r.overlap)}}},
                    {"fine_adjustment", r.most_sensitive.empty() ? json(nullptr) : json(r.most_sensitive)},
                    {"fine_adjustment_share", r.most_sensitive.empty() ? json(nullptr) : json(r.most_sensitive_share)}}
                   .dump(2)
            << "\n";
        return 0;
    }
    char line[512];
    auto verdict_lines = [&](const Verdict& v) { out << verdict_text(v, false); };
    if (!r.nominal_passes) {
        out << "The layout as given does not meet its verdict:\n";
        verdict_lines(r.nominal_verdict);
        out << "so the tolerances are analysed around it aligned with its adjusters.\n\n";
    }
    out << "Adjusters (goals.tolerance.adjust" << (layout->goals.tolerance.adjust ? "" : ", the defaults") << "): ";
    if (r.adjusters.empty()) out << "none";
    for (size_t i = 0; i < r.adjusters.size(); ++i) out << (i ? "; " : "") << r.adjusters[i];
    out << "\n";
    if (!r.alignment_moves.empty()) {
        out << "Aligning the nominal:";
        for (size_t i = 0; i < r.alignment_moves.size(); ++i)
            out << (i ? "," : "") << " " << r.alignment_moves[i].first << " "
                << format_number("%+.4g", r.alignment_moves[i].second);
        out << "\n";
    }
    out << "Verdict of the aligned nominal:\n";
    verdict_lines(r.aligned_verdict);
    out << "\n";
    std::snprintf(line, sizeof line, "Tolerances (uniform, ±): position %.3g mm, angle %.3g mrad, focal length %.3g %%, stage %.3g mm\n\n",
                  t.position_mm, t.angle_mrad, 100 * t.focal_length_fraction, t.stage_mm);
    out << line;
    out << "Sensitivity (per mm, per mrad, or per unit fraction of focal length)\n"
        << "  perturbation                 tol       d waist offset  d waist ratio  d lateral um  d delay fs   d overlap\n";
    // Each sensitivity column's scale, for the shared zero rule (units/number_text.hpp): a
    // finite difference of a figure that does not change prints 0, not its rounding residue.
    const auto figure_columns = {&Figures::waist_offset_mm, &Figures::waist_ratio, &Figures::lateral_um,
                                 &Figures::delay_fs, &Figures::overlap};
    std::vector<double> scale;
    for (double Figures::*figure : figure_columns) {
        std::vector<double> column;
        for (const SensitivityRow& s : r.sensitivity) column.push_back(s.per_unit.*figure);
        scale.push_back(column_scale(column));
    }
    for (const SensitivityRow& s : r.sensitivity) {
        std::vector<std::string> cells;
        size_t c = 0;
        for (double Figures::*figure : figure_columns) cells.push_back(format_number("%+.4g", s.per_unit.*figure, scale[c++]));
        std::snprintf(line, sizeof line, "  %-28s %-9s %-15s %-14s %-13s %-12s %s\n", s.label.c_str(),
                      format_number("%.3g", s.tolerance).c_str(), cells[0].c_str(), cells[1].c_str(), cells[2].c_str(),
                      cells[3].c_str(), cells[4].c_str());
        out << line;
    }
    std::snprintf(line, sizeof line,
                  "\nMonte Carlo: %zu builds (seed %llu), each aligned with the adjusters, %zu missed the target, %.2f s on %d threads\n",
                  r.samples, static_cast<unsigned long long>(o.seed), r.failed, seconds, threads);
    out << line;
    std::snprintf(line, sizeof line, "  pass rate %.3f (space %.3f, time %.3f, phase %.3f): builds meeting space, time and phase after alignment\n",
                  r.pass_rate, r.space_rate, r.time_rate, r.phase_rate);
    out << line;
    out << "  figure after alignment  nominal      5 %          50 %         95 %\n";
    auto row = [&](const char* name, double nominal, const Spread& s) {
        const double row_scale = column_scale({nominal, s.p5, s.p50, s.p95});
        auto cell = [&](double v) { return format_number("%.4g", v, row_scale); };
        std::snprintf(line, sizeof line, "  %-23s %-12s %-12s %-12s %-12s\n", name, cell(nominal).c_str(),
                      cell(s.p5).c_str(), cell(s.p50).c_str(), cell(s.p95).c_str());
        out << line;
    };
    row("waist offset mm", r.nominal.waist_offset_mm, r.waist_offset_mm);
    row("waist ratio", r.nominal.waist_ratio, r.waist_ratio);
    row("lateral um", r.nominal.lateral_um, r.lateral_um);
    row("delay fs", r.nominal.delay_fs, r.delay_fs);
    row("combined overlap", r.nominal.overlap, r.overlap);
    out << "\n";
    if (r.pass_rate < 1) {
        if (!r.limiting_error.empty())
            std::snprintf(line, sizeof line,
                          "Limiting error: %s (without it %.0f %% of the %zu failing builds examined pass)\n",
                          r.limiting_error.c_str(), 100 * r.limiting_share, r.limiting_examined);
        else if (!r.aligned_passes)
            std::snprintf(line, sizeof line, "Limiting error: none looked for: the aligned nominal fails its verdict, so no build can pass\n");
        else
            std::snprintf(line, sizeof line, "Limiting error: none alone (removing any one error passes none of the %zu failing builds examined)\n",
                          r.limiting_examined);
        out << line;
        if (r.recommendation)
            std::snprintf(line, sizeof line, "Would help most: %s: pass rate %.3f on the first %zu builds (%.3f as it is; the changes compared on the first %zu)\n",
                          change_text(*r.recommendation, *layout).c_str(), r.recommendation->pass_rate, r.checked,
                          r.checked_pass_rate, r.subset);
        else
            std::snprintf(line, sizeof line, "Would help most: no single adjuster or halved tolerance raises the pass rate (compared on %zu builds)\n",
                          r.subset);
        out << line;
    }
    std::snprintf(line, sizeof line, "Put on a fine adjustment: %s (%.0f %% of the waist-offset and lateral variance, linearized)\n",
                  r.most_sensitive.c_str(), 100 * r.most_sensitive_share);
    out << line;
    return 0;
}

}  // namespace rv::cli
