#pragma once
// What `solve` varies when the layout names nothing (no goals.solve): every focusing optic (a
// lens, or a mirror with a radius of curvature) that lies on one beam's own path before the
// target (not one both beams share) may move ±25 mm along its beam, and the aim is "focus" (each
// waist at the target centre). A starting point a user can run at once and then narrow in the
// file.
#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

inline constexpr double kDefaultMoveRange_mm = 25.0;

SolveGoals default_solve_goals(const Layout& layout, const MaterialLibrary& library);

}  // namespace rv
