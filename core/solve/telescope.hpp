#pragma once
// Telescope design: which catalog lenses to put where so that each beam's waist at the target
// has its goal size (or the two confocal parameters match) and lies at the target centre.
//
// The free variables come from the layout's goals.solve: elements that may move along the beam
// at them (within a range), and lenses that may be swapped for any catalog lens. For every
// combination of catalog choices the moves are optimized by Levenberg–Marquardt (Eigen's
// unsupported NonLinearOptimization module, numerical Jacobian) on the residuals
//   aim "waist":          (W − W_goal)/W_goal and (waist offset)/z_R, per beam and plane
//   aim "equal-confocal": (b1 − b2)/(b1 + b2) per plane, and the waist offsets/z_R
//   aim "focus":          the waist offsets/z_R only
// with each move kept in its range by x = mid + half·sin(u). Solutions are ranked by the residual
// norm; ties by the sensitivity (how far the waists move per mm of move) and the total move.
// Constraints (goals.solve.min_spacing_mm, table_margin_mm, max_path_mm) enter the optimization
// as penalties of 1 per mm of violation; a solution that still breaks one lists it in
// `violations` and ranks after every solution that breaks none.
// When the aim is per beam (waist or focus) and every swapped or moved element lies on one
// beam's path only, the arms are searched apart and their best choices combined (exact for
// such problems: the joint residual² is the sum of the arms'); otherwise every combination.
// Solutions that differ only by a swapped lens's diameter are returned as one, the smallest
// diameter that passes the beam without clipping, the others named (solve/diameter_choice.hpp);
// `keep` counts those.

#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "io/lens_catalog.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

// The same solution with other diameters of its swapped lenses (solve/diameter_choice.hpp).
struct DiameterAlternative {
    std::vector<std::pair<std::string, std::string>> swaps;  // where it differs: lens id → catalog lens id
    std::vector<double> diameters_mm;                        // of those catalog lenses
    // The most power lost at one of its swapped lenses (the report's clipping finding); none: no
    // swapped lens clips above the warning level.
    std::optional<double> clipped_fraction;
};

struct TelescopeSolution {
    Layout layout;                        // the layout with the choices and moves applied
    std::vector<std::pair<std::string, std::string>> swaps;  // lens id → catalog lens id
    std::vector<std::pair<std::string, double>> moves_mm;    // element id → move along the beam
    double residual = 0;                  // norm of the residual vector
    double sensitivity_mm_per_mm = 0;     // largest |d(waist offset)/d(move)|
    double total_move_mm = 0;
    std::vector<std::string> violations;  // broken constraints (goals.solve); ranked after those with none
    // The most power lost at one of the swapped lenses, from the report's clipping finding; none:
    // no swapped lens clips above the warning level.
    std::optional<double> clipped_fraction;
    // The other diameters of the same lenses that were solved too, smallest first: this solution
    // is the smallest that does not clip (solve/diameter_choice.hpp).
    std::vector<DiameterAlternative> also;
};

struct SolveOptions {
    size_t keep = 5;            // solutions returned, best first
    size_t max_combinations = 50000;
    int threads = 2;
    // Search each arm alone when the problem separates (see solve_telescopes); off: every
    // combination of every arm's choices (the same best solutions, slower).
    bool separate_arms = true;
    // Called now and then with the combinations done and the total (from one thread at a time).
    std::function<void(size_t done, size_t total)> progress;
};

struct SolveResult {
    std::vector<TelescopeSolution> solutions;
    size_t combinations = 0;
    std::string error;  // non-empty: nothing was solved, and why
};

SolveResult solve_telescopes(const Layout& layout, const MaterialLibrary& library,
                             const std::vector<CatalogLens>& catalog, const SolveOptions& options = {});

}  // namespace rv
