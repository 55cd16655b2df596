#pragma once
// What the chief-ray tracer carries from one step to the next (trace.hpp): where the ray is,
// where it goes, how far and how long it has run, the medium around it, and the few facts
// that decide which surface may come next. One value: a step takes it and gives it back
// changed; a retrace restarts a path from one kept at the start of a step.

#include <cstddef>
#include <optional>
#include <utility>

#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv {

// The phase index (for the Gaussian beam; 1 in air, docs/physics.md §0.3), the absolute group
// index (for timing; air by Ciddor 1996) and the group-velocity and third-order dispersion (for
// the pulse at the target, materials/dispersion.hpp) of the medium the ray runs in. The last
// three are per mm of the ray's own path: for a wave whose energy walks off its wave vector in
// the table plane by ρ they carry cos ρ, since the pulse advances along k by cos ρ of the
// energy's path (a slab's delay and dispersion are those of its thickness along k).
struct Medium {
    double index = 1, group_index = 1;
    double gvd_fs2_per_mm = 0, tod_fs3_per_mm = 0;
    bool operator==(const Medium&) const = default;
};

struct RayState {
    Vec2 p_mm{0, 0};   // position in the table plane
    Vec2 d{1, 0};      // unit direction
    double s_mm = 0;   // geometric path length from the beam's start
    double delay_fs = 0;  // group delay from the start, the last hit's lumped glass included
    Medium medium{};
    // An extraordinary (B) wave's walk-off in a crystal (trace/crystal_axes.hpp, walkoff_turn):
    // d is the energy's direction, turned by walkoff_rad (counter-clockwise +) from the wave
    // vector; out of the table plane the energy rises by vertical_slope per mm, and vertical_mm
    // is the height the chief ray has reached above the beam's table plane (kept after the
    // crystal: the beam leaves displaced, parallel to the table).
    double walkoff_rad = 0;
    double vertical_slope = 0;
    double vertical_mm = 0;
    std::optional<size_t> inside;  // the slab (plate, crystal, dichroic substrate) it runs in
    std::optional<std::pair<size_t, Face>> last_surface;  // the surface it left last
    std::optional<size_t> expect;  // the element the last aim_at mirror sent it to, judged at the next hit
    bool operator==(const RayState&) const = default;
};

}  // namespace rv
