#pragma once
// What a solution gives, in a user's words: each beam's waist against the target centre and its
// goal in the layout the solution writes, and the moves that sit at an end of their range (the
// ranges to widen). Shared by `rendezvous solve` and the window's Solvers panel.
#include <optional>
#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "solve/telescope.hpp"

namespace rv {

// Each beam at the target: the waist's distance from the target centre (mm and in Rayleigh
// ranges, + downstream) and its size against the goal (goals.waist_um), means of the planes.
struct BeamOutcome {
    std::string beam;
    double waist_offset_mm = 0, offset_rayleigh = 0, waist_um = 0;
    std::optional<double> goal_um;
};
std::vector<BeamOutcome> beam_outcomes(const Layout& layout, const RendezvousReport& report);

// The moves of a solution that sit at an end of their range (within 0.01 mm).
std::vector<std::string> moves_at_range_end(const SolveGoals& goals, const TelescopeSolution& s);

}  // namespace rv
