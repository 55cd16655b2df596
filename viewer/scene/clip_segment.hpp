#pragma once
// A line segment clipped to an axis-aligned box, in doubles, before anything is drawn of it.
//
// Why: a stage at 1e300 mm or a table of 1e-9 mm puts a segment's ends far beyond any canvas;
// converted to float screen coordinates they become ±inf, and a dash pattern stepped along a
// length of 1e15 px never ends. Clipped first, a segment is never longer than the box's diagonal.
//
// Method: Liang–Barsky (parametric clipping against the four slabs of the box): the segment
// a + t·(b − a), t ∈ [0, 1], keeps the t where every coordinate lies inside. A segment with a
// non-finite end is dropped (nothing honest can be drawn of it).

#include <cmath>
#include <optional>
#include <utility>

#include "layout/layout.hpp"

namespace rv::scene {

struct Box {
    Vec2 min{0, 0}, max{0, 0};
};

inline std::optional<std::pair<Vec2, Vec2>> clip_segment(const Vec2& a, const Vec2& b,
                                                         const Box& box) {
    if (!a.allFinite() || !b.allFinite()) return std::nullopt;
    const Vec2 d = b - a;
    if (!d.allFinite()) return std::nullopt;  // ends of opposite sign near the largest double
    double t0 = 0, t1 = 1;
    for (int axis = 0; axis < 2; ++axis) {
        if (d[axis] == 0) {
            if (a[axis] < box.min[axis] || a[axis] > box.max[axis]) return std::nullopt;
            continue;
        }
        double lo = (box.min[axis] - a[axis]) / d[axis], hi = (box.max[axis] - a[axis]) / d[axis];
        if (lo > hi) std::swap(lo, hi);
        t0 = std::max(t0, lo);
        t1 = std::min(t1, hi);
        if (!(t0 <= t1)) return std::nullopt;
    }
    return std::pair{a + t0 * d, a + t1 * d};
}

// A box `margin` beyond `box` on every side.
inline Box grown(const Box& box, double margin) {
    return {box.min - Vec2(margin, margin), box.max + Vec2(margin, margin)};
}

}  // namespace rv::scene
