// rendezvous solve: stock lenses and positions for the goals, ranked; the best as a new layout.
#include <chrono>
#include <cmath>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>

#include "analysis/report.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "cli/progress_bar.hpp"
#include "io/layout_reader.hpp"
#include "io/lens_parts.hpp"
#include "report/report_json.hpp"
#include "report/report_words.hpp"
#include "solve/default_solve_goals.hpp"
#include "solve/solve_outcome.hpp"
#include "solve/telescope.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

namespace {

// The best solution as the file will hold it: without the default goals when they were used.
Layout as_written(const TelescopeSolution& s, bool default_goals) {
    Layout l = s.layout;
    if (default_goals) l.goals.solve.reset();
    return l;
}

}  // namespace

int run_solve(const SolveCommandOptions& o, std::ostream& out, std::ostream& err) {
    if (o.json && o.output == "-") {
        err << "rendezvous: --json and --write - would both print to standard output; write the layout to a file\n";
        return 2;
    }
    std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    const MaterialLibrary library = material_library_for(*layout);
    // Without goals.solve, the documented default (solve/default_solve_goals.hpp).
    const bool default_goals = !layout->goals.solve;
    if (default_goals) layout->goals.solve = default_solve_goals(*layout, library);
    const SolveGoals& goals = *layout->goals.solve;
    if (goals.move.empty() && goals.swap.empty()) {
        err << o.layout << ": error: nothing to solve: no goals.solve, and no lens or curved mirror lies on one beam's own path\n";
        return 2;
    }
    const CatalogReadResult catalog = o.catalog.empty() ? parse_lens_catalog(lens_catalog_text(), library)
                                                        : read_lens_catalog(o.catalog, library);
    if (has_errors(catalog.diagnostics)) {
        for (const Diagnostic& d : catalog.diagnostics)
            err << format_diagnostic(d, o.catalog.empty() ? "lenses.json (built in)" : o.catalog) << "\n";
        return 2;
    }
    // A lens's part must name a lens of this catalog with the lens's own numbers (the lenses it
    // may swap excepted: their part is replaced by its choice).
    const Diagnostics parts = check_lens_parts(*layout, catalog.lenses, goals.swap);
    for (const Diagnostic& d : parts) err << format_diagnostic(d, o.layout) << "\n";
    if (has_errors(parts)) return 2;
    // A destination it could never write is refused before the search, not after it.
    if (!o.output.empty() && !destination_writable_or_report(o.output, keep_input(o.layout), err)) return 2;
    SolveOptions options;
    options.keep = static_cast<size_t>(o.top);
    ProgressBar bar("solving");
    options.progress = [&bar](size_t done, size_t total) { bar.update(done, total); };
    const auto t0 = std::chrono::steady_clock::now();
    const SolveResult r = solve_telescopes(*layout, library, catalog.lenses, options);
    const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    if (!r.error.empty()) {
        err << o.layout << ": error: " << r.error << "\n";
        return 2;
    }
    if (o.json) {
        using nlohmann::json;
        if (!o.output.empty() && !r.solutions.empty() &&
            !save_layout_or_report(as_written(r.solutions.front(), default_goals), o.output, keep_input(o.layout), out, err))
            return 2;
        json best = nullptr;
        if (!r.solutions.empty()) {
            const Layout written = as_written(r.solutions.front(), default_goals);
            const RendezvousReport report = build_report(written, library);
            json beams = json::array();
            for (const BeamOutcome& b : beam_outcomes(written, report))
                beams.push_back({{"beam", b.beam}, {"waist_offset_mm", b.waist_offset_mm}, {"waist_offset_rayleigh", b.offset_rayleigh},
                                 {"waist_um", b.waist_um}, {"goal_um", b.goal_um ? json(*b.goal_um) : json(nullptr)}});
            best = {{"verdict", verdict_met_json(report.verdict)},
                    {"beams", beams},
                    {"moves_at_range_end", moves_at_range_end(goals, r.solutions.front())}};
        }
        json solutions = json::array();
        for (const TelescopeSolution& s : r.solutions) {
            json swaps = json::array(), moves = json::array();
            for (const auto& [id, lens] : s.swaps) swaps.push_back({{"element", id}, {"part", lens}});
            json also = json::array();
            for (const DiameterAlternative& a : s.also) {
                json differs = json::array();
                for (size_t k = 0; k < a.swaps.size(); ++k)
                    differs.push_back({{"element", a.swaps[k].first}, {"part", a.swaps[k].second}, {"diameter_mm", a.diameters_mm[k]}});
                also.push_back({{"swaps", differs}, {"clipped_fraction", a.clipped_fraction ? json(*a.clipped_fraction) : json(nullptr)}});
            }
            for (const auto& [id, move] : s.moves_mm) moves.push_back({{"element", id}, {"move_mm", move}});
            solutions.push_back({{"residual", s.residual},
                                 {"sensitivity_mm_per_mm", s.sensitivity_mm_per_mm},
                                 {"total_move_mm", s.total_move_mm},
                                 {"swaps", swaps},
                                 {"moves", moves},
                                 {"violations", s.violations},
                                 {"clipped_fraction", s.clipped_fraction ? json(*s.clipped_fraction) : json(nullptr)},
                                 {"also", also}});
        }
        out << json{{"layout", o.layout},
                    {"goals", default_goals ? "default" : "file"},
                    {"best", best},
                    {"combinations", r.combinations},
                    {"solutions", solutions},
                    {"wrote", o.output.empty() || r.solutions.empty() ? json(nullptr) : json(o.output)}}
                   .dump(2)
            << "\n";
        return 0;
    }
    // With --write -, standard output holds the layout alone: the ranking goes to stderr.
    std::ostream& say = o.output == "-" ? err : out;
    if (default_goals) {
        say << "no goals.solve in the file: using the default, every lens and curved mirror on one beam's own path moving ±"
            << format_number("%g", kDefaultMoveRange_mm) << " mm along its beam (";
        for (size_t i = 0; i < goals.move.size(); ++i) say << (i ? ", " : "") << goals.move[i].first;
        say << "), aim focus\n";
    }
    char line[256];
    std::snprintf(line, sizeof line, "%zu combination(s) searched in %.2f s; best %zu:\n", r.combinations, seconds,
                  r.solutions.size());
    say << line;
    for (size_t i = 0; i < r.solutions.size(); ++i) {
        const TelescopeSolution& s = r.solutions[i];
        std::snprintf(line, sizeof line, "%2zu. residual %.3g, sensitivity %.3g mm/mm, total move %.2f mm:", i + 1,
                      s.residual, s.sensitivity_mm_per_mm, s.total_move_mm);
        say << line;
        for (const auto& [id, lens] : s.swaps) say << " " << id << " = " << lens << ";";
        for (const auto& [id, move] : s.moves_mm) {
            std::snprintf(line, sizeof line, " move %s by %+.3f mm;", id.c_str(), move);
            say << line;
        }
        say << "\n";
        for (const std::string& v : s.violations) say << "      breaks a constraint: " << v << "\n";
        if (s.clipped_fraction)
            say << "      clips: " << format_number("%.3g", 100 * *s.clipped_fraction)
                << " % of the power falls outside a swapped lens's aperture, and no other diameter of it passes more\n";
        if (!s.also.empty()) {
            say << "      " << (s.clipped_fraction ? "also solved:" : "the smallest diameter that does not clip; also:");
            for (size_t k = 0; k < s.also.size(); ++k) {
                const DiameterAlternative& a = s.also[k];
                say << (k ? ";" : "");
                for (size_t j = 0; j < a.swaps.size(); ++j) say << (j ? "," : "") << " " << a.swaps[j].first << " = " << a.swaps[j].second;
                if (a.clipped_fraction) say << " (clips " << format_number("%.3g", 100 * *a.clipped_fraction) << " %)";
            }
            say << "\n";
        }
    }
    if (!r.solutions.empty()) {
        // What the user gets: the verdict of the layout it would write, each beam's residual in
        // mm and Rayleigh ranges, and the moves that want a wider range.
        const Layout written = as_written(r.solutions.front(), default_goals);
        const RendezvousReport report = build_report(written, library);
        say << "the best solution, as it would be written: space " << verdict_state_text(report.verdict.space)
            << ", time " << verdict_state_text(report.verdict.time) << ", phase "
            << verdict_state_text(report.verdict.phase) << "\n";
        for (const BeamOutcome& b : beam_outcomes(written, report)) {
            say << "  " << b.beam << ": waist " << format_number("%.3f", std::abs(b.waist_offset_mm)) << " mm "
                << (b.waist_offset_mm >= 0 ? "after" : "before") << " the target centre ("
                << format_number("%.3f", std::abs(b.offset_rayleigh)) << " of its Rayleigh range), "
                << format_number("%.2f", b.waist_um) << " µm";
            if (b.goal_um)
                say << " (goal " << format_number("%.2f", *b.goal_um) << " µm, "
                    << format_number("%+.1f", 100 * (b.waist_um / *b.goal_um - 1)) << " %)";
            say << "\n";
        }
        for (const std::string& id : moves_at_range_end(goals, r.solutions.front()))
            say << "  " << id << " sits at the end of its range: widen goals.solve.move." << id << " to let it go further\n";
    }
    if (!o.output.empty() && !r.solutions.empty()) {
        if (!save_layout_or_report(as_written(r.solutions.front(), default_goals), o.output, keep_input(o.layout), out,
                                   err))
            return 2;
        if (o.output != "-") say << "wrote the best solution to " << o.output << "\n";
    }
    return 0;
}

}  // namespace rv::cli
