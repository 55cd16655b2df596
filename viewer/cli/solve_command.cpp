// rendezvous solve: stock lenses and positions for the goals, ranked; the best as a new layout.
#include <chrono>
#include <cstdio>
#include <nlohmann/json.hpp>
#include <ostream>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "cli/progress_bar.hpp"
#include "io/layout_reader.hpp"
#include "solve/telescope.hpp"

namespace rv::cli {

int run_solve(const SolveCommandOptions& o, std::ostream& out, std::ostream& err) {
    if (o.json && o.output == "-") {
        err << "rendezvous: --json and --write - would both print to standard output; write the layout to a file\n";
        return 2;
    }
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    const MaterialLibrary library = material_library_for(*layout);
    const CatalogReadResult catalog = o.catalog.empty() ? parse_lens_catalog(lens_catalog_text(), library)
                                                        : read_lens_catalog(o.catalog, library);
    if (has_errors(catalog.diagnostics)) {
        for (const Diagnostic& d : catalog.diagnostics)
            err << format_diagnostic(d, o.catalog.empty() ? "lenses.json (built in)" : o.catalog) << "\n";
        return 2;
    }
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
            !save_layout_or_report(r.solutions.front().layout, o.output, keep_input(o.layout), out, err))
            return 2;
        json solutions = json::array();
        for (const TelescopeSolution& s : r.solutions) {
            json swaps = json::array(), moves = json::array();
            for (const auto& [id, lens] : s.swaps) swaps.push_back({{"element", id}, {"part", lens}});
            for (const auto& [id, move] : s.moves_mm) moves.push_back({{"element", id}, {"move_mm", move}});
            solutions.push_back({{"residual", s.residual},
                                 {"sensitivity_mm_per_mm", s.sensitivity_mm_per_mm},
                                 {"total_move_mm", s.total_move_mm},
                                 {"swaps", swaps},
                                 {"moves", moves},
                                 {"violations", s.violations}});
        }
        out << json{{"layout", o.layout},
                    {"combinations", r.combinations},
                    {"solutions", solutions},
                    {"wrote", o.output.empty() || r.solutions.empty() ? json(nullptr) : json(o.output)}}
                   .dump(2)
            << "\n";
        return 0;
    }
    // With --write -, standard output holds the layout alone: the ranking goes to stderr.
    std::ostream& say = o.output == "-" ? err : out;
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
    }
    if (!o.output.empty() && !r.solutions.empty()) {
        if (!save_layout_or_report(r.solutions.front().layout, o.output, keep_input(o.layout), out,
                                   err))
            return 2;
        if (o.output != "-") say << "wrote the best solution to " << o.output << "\n";
    }
    return 0;
}

}  // namespace rv::cli
