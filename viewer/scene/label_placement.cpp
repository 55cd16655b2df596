#include "scene/label_placement.hpp"

#include <algorithm>
#include <cmath>

#include "units/constants.hpp"

namespace rv::scene {

namespace {

constexpr int kDirections = 16;
constexpr int kRings = 14;
constexpr int kRingsWithoutLeader = 2;

Box bounds(const std::vector<Vec2>& pts) {
    Box b{pts.front(), pts.front()};
    for (const Vec2& p : pts) b.min = b.min.cwiseMin(p), b.max = b.max.cwiseMax(p);
    return b;
}

// Even–odd rule.
bool inside_polygon(const std::vector<Vec2>& poly, const Vec2& p) {
    bool in = false;
    for (size_t i = 0, j = poly.size() - 1; i < poly.size(); j = i++) {
        const Vec2 &a = poly[i], &b = poly[j];
        if ((a.y() > p.y()) != (b.y() > p.y()) && p.x() < (b.x() - a.x()) * (p.y() - a.y()) / (b.y() - a.y()) + a.x())
            in = !in;
    }
    return in;
}

// A mark cut into pieces of at most 8 segments, each with its bounds, so that a long beam is
// tested only where a box is near it.
struct Piece {
    const Polyline* mark;
    size_t first, last;  // points first..last
    Box bounds;
};

std::vector<Piece> pieces_of(const Scene& s) {
    std::vector<Piece> out;
    for (const Polyline& p : s.shapes) {
        if (p.band || p.points_mm.size() < 2) continue;
        if (p.closed) {  // small closed marks whole (the inside test needs all of it)
            out.push_back({&p, 0, p.points_mm.size() - 1, bounds(p.points_mm)});
            continue;
        }
        for (size_t i = 0; i + 1 < p.points_mm.size(); i += 8) {
            const size_t last = std::min(i + 8, p.points_mm.size() - 1);
            std::vector<Vec2> part(p.points_mm.begin() + i, p.points_mm.begin() + last + 1);
            out.push_back({&p, i, last, bounds(part)});
        }
    }
    return out;
}

bool piece_meets(const Box& box, const Piece& piece) {
    if (!boxes_overlap(box, piece.bounds)) return false;
    const std::vector<Vec2>& pts = piece.mark->points_mm;
    if (piece.mark->closed) return box_meets_mark(box, *piece.mark);
    for (size_t i = piece.first; i < piece.last; ++i)
        if (clip_segment(pts[i], pts[i + 1], box)) return true;
    return false;
}

Vec2 nearest_point(const Box& b, const Vec2& p) { return p.cwiseMax(b.min).cwiseMin(b.max); }

}  // namespace

bool boxes_overlap(const Box& a, const Box& b) {
    return a.min.x() < b.max.x() && b.min.x() < a.max.x() && a.min.y() < b.max.y() && b.min.y() < a.max.y();
}

bool box_meets_mark(const Box& box, const Polyline& mark) {
    if (mark.band || mark.points_mm.size() < 2) return false;
    const std::vector<Vec2>& pts = mark.points_mm;
    const size_t n = pts.size();
    for (size_t i = 0; i + 1 < n + (mark.closed ? 1 : 0); ++i)
        if (clip_segment(pts[i], pts[(i + 1) % n], box)) return true;
    return mark.closed && inside_polygon(pts, (box.min + box.max) / 2);
}

std::vector<PlacedLabel> place_labels(const Scene& s, const std::function<LabelSizeMm(const Label&)>& size_of,
                                      double gap_mm, const std::vector<Box>& keep_out_mm) {
    const std::vector<Piece> pieces = pieces_of(s);
    const Box table{{0, 0}, {s.width_mm, s.height_mm}};
    std::vector<PlacedLabel> out;
    std::vector<Box> taken = keep_out_mm;  // placed boxes, grown by the gap, and the keep-outs
    out.reserve(s.labels.size());
    for (const Label& l : s.labels) {
        const LabelSizeMm size = size_of(l);
        const double w = std::max(size.width_mm, 0.0), h = std::max(size.height_mm, 0.0);
        const Vec2 anchor = l.anchor_mm.allFinite() ? l.anchor_mm : Vec2(0, 0);
        Vec2 prefer = l.at_mm - anchor;
        prefer = prefer.allFinite() && prefer.norm() > 1e-12 ? Vec2(prefer / prefer.norm()) : Vec2(0, 1);
        const double base_angle = std::atan2(prefer.y(), prefer.x());
        const double step = std::max(h, 1e-6);
        const double reach = std::max(l.clear_mm, 0.0) + gap_mm + kRings * step + w + h;
        // The marks near enough to matter for this label.
        const Box region{anchor - Vec2(reach, reach), anchor + Vec2(reach, reach)};
        std::vector<const Piece*> near;
        for (const Piece& p : pieces)
            if (boxes_overlap(region, p.bounds)) near.push_back(&p);
        auto meets = [&](const Box& b) {
            const Box grown_box = grown(b, gap_mm);
            int count = 0;
            for (const Piece* p : near) count += piece_meets(grown_box, *p);
            for (const Box& t : taken) count += boxes_overlap(grown_box, t);
            return count;
        };
        std::optional<PlacedLabel> chosen;
        PlacedLabel least_bad;
        int least = -1;
        for (int pass = 0; pass < 2 && !chosen; ++pass)
            for (int ring = 0; ring < kRings && !chosen; ++ring) {
                const double d = std::max(l.clear_mm, 0.0) + gap_mm + ring * step;
                for (int k = 0; k < kDirections && !chosen; ++k) {
                    // 0, +1, −1, +2, −2, … steps of 22.5° from the preferred side
                    const int turn = (k + 1) / 2 * (k % 2 ? 1 : -1);
                    const double a = base_angle + turn * 2 * kPi / kDirections;
                    const Vec2 u(std::cos(a), std::sin(a));
                    // The box just outside the ring in direction u (its near edge or corner at d).
                    const Vec2 centre = anchor + d * u + Vec2(u.x() * w / 2, u.y() * h / 2);
                    const Box b{centre - Vec2(w / 2, h / 2), centre + Vec2(w / 2, h / 2)};
                    const bool on_table = b.min.x() >= table.min.x() && b.min.y() >= table.min.y() &&
                                          b.max.x() <= table.max.x() && b.max.y() <= table.max.y();
                    if (pass == 0 && !on_table) continue;
                    PlacedLabel candidate{b, std::nullopt, true};
                    if (ring >= kRingsWithoutLeader)
                        candidate.leader = std::pair{anchor + std::max(l.clear_mm, 0.0) * u, nearest_point(b, anchor)};
                    const int n = meets(b);
                    if (n == 0) chosen = candidate;
                    else if (least < 0 || n < least) least = n, least_bad = candidate;
                }
            }
        if (!chosen) {
            least_bad.clear = false;
            chosen = least_bad;
        }
        taken.push_back(grown(chosen->box_mm, gap_mm));
        out.push_back(*chosen);
    }
    return out;
}

}  // namespace rv::scene
