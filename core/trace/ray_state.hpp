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

// The phase index (for the Gaussian beam; 1 in air, docs/physics.md §0.3) and the absolute
// group index (for timing; air by Ciddor 1996) of the medium the ray runs in.
struct Medium {
    double index = 1, group_index = 1;
    bool operator==(const Medium&) const = default;
};

struct RayState {
    Vec2 p_mm{0, 0};   // position in the table plane
    Vec2 d{1, 0};      // unit direction
    double s_mm = 0;   // geometric path length from the beam's start
    double delay_fs = 0;  // group delay from the start, the last hit's lumped glass included
    Medium medium{};
    std::optional<size_t> inside;  // the slab (plate, crystal, dichroic substrate) it runs in
    std::optional<std::pair<size_t, Face>> last_surface;  // the surface it left last
    std::optional<size_t> expect;  // the element the last aim_at mirror sent it to, judged at the next hit
    bool operator==(const RayState&) const = default;
};

}  // namespace rv
