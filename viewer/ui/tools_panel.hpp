#pragma once
// The solvers from the viewer, over the open document: delay balancing (one undoable edit),
// the telescope search of goals.solve (ranked solutions; clicking one previews it on the table,
// Apply makes it one undoable edit), the tolerance analysis, and a sweep of one field plotted
// against the combined overlap and the phase factor.
#include <string>
#include <vector>

#include "edit/document.hpp"
#include "io/lens_catalog.hpp"
#include "solve/solve_outcome.hpp"
#include "solve/telescope.hpp"
#include "solve/tolerance.hpp"
#include "ui/plots.hpp"

namespace rv::ui {

struct ToolsState {
    std::vector<CatalogLens> catalog;      // the lens catalog for the search (set by the window)
    SolveResult solve;                     // the last search
    // Per solution of the last search, judged as it would be applied (solve/solve_outcome.hpp).
    struct SolutionSummary {
        Verdict verdict;
        std::vector<BeamOutcome> beams;
        std::vector<std::string> at_range_end;
    };
    std::vector<SolutionSummary> summaries;
    bool solved_with_default_goals = false;
    std::optional<size_t> previewing;      // the solution shown on the table (a Document gesture)
    edit::Document::Gesture preview_gesture = 0;
    std::optional<ToleranceReport> tolerance;
    char sweep_field[64] = "S1.position_mm";
    double sweep_from = 0, sweep_to = 40;
    SweepCurves sweep;  // the last sweep's figures (empty before one)
    std::string message;
};

void draw_tools_panel(edit::Document& doc, ToolsState& state);

}  // namespace rv::ui
