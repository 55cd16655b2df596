#pragma once
// The squared distance from a point to a segment, for the trace's tests of what a step comes
// near (the accelerator's candidates, the retrace's changed circles).
#include <algorithm>

#include "layout/layout.hpp"

namespace rv {

inline double squared_distance_to_segment(const Vec2& c, const Vec2& a, const Vec2& b) {
    const Vec2 ab = b - a;
    const double len2 = ab.squaredNorm();
    const double t = len2 > 0 ? std::clamp((c - a).dot(ab) / len2, 0.0, 1.0) : 0.0;
    return (a + t * ab - c).squaredNorm();
}

}  // namespace rv
