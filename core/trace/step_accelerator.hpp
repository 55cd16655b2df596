#pragma once
// The search for the next surface a ray meets, made fast for a layout traced again and again
// with a few optics moved (the solvers, the tolerance run).
//
// It keeps one beam's steps of the last recorded trace, each with the elements whose bounding
// circle comes within kTraceMargin_mm of it (the candidates). A later trace searches only a
// step's candidates when the new step lies within the margin of the recorded one, after
// allowing for how far any element has moved since the recording (δ): with ε the larger
// distance between the new and the recorded step's end points, every point of the new step
// lies within ε of the recorded step, so an element that is not a candidate keeps at least
// kTraceMargin_mm − ε − δ > 0 clear of it and cannot be met first (δ also counts how much any
// bounding circle has grown: a larger aperture or a thicker slab). The result is the same as a
// full search (tests/trace/trace_cache_test.cpp compares them); when the condition fails the
// step is searched among all elements and the steps are recorded again.

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <limits>
#include <optional>
#include <vector>

#include "trace/path.hpp"
#include "trace/placed_optics.hpp"

namespace rv {

inline constexpr double kTraceMargin_mm = 5.0;

// A surface crossing found by the search; dist = ∞ until one is found.
struct SurfaceCrossing {
    size_t element = SIZE_MAX;
    Face face = Face::Only;
    Vec2 normal{1, 0};
    double dist = std::numeric_limits<double>::infinity(), height = 0;
    bool found() const { return element != SIZE_MAX; }
};

// One step of a trace: from where to where, and the element met at its end (none: the table
// edge).
struct StepTaken {
    Vec2 from_mm{0, 0}, to_mm{0, 0};
    std::optional<uint32_t> met;
};

// How the searches of a cache's traces went (for tests and benchmarks).
struct TraceCounters {
    size_t replayed_steps = 0, searched_steps = 0;
    size_t traced_past_target = 0;  // paths that ended at the target and were completed
    size_t reference_skips = 0;     // beams whose kept steps needed no test (retrace_memo.hpp)
};

class StepAccelerator {
public:
    // Before a trace: how far any element can have moved since the recording. In a retrace
    // (`since_last`: the previous trace with this cache was a retrace of the same layout) only
    // the elements in `changed` can have moved since then, so the bound kept from then is
    // raised by theirs (it may stay larger than needed: still a bound).
    void begin(const std::vector<PlacedOptic>& placed, bool since_last, const std::vector<size_t>& changed);

    // The nearest crossing from the ray at p along d within max_dist, for the trace's step
    // number `step`: among the recorded step's candidates while the new step stays within the
    // margin, else `search_all()`. consider(i, best) offers element i's surfaces to `best`.
    template <class Consider, class SearchAll>
    std::optional<SurfaceCrossing> next(const Vec2& p, const Vec2& d, double max_dist, size_t step,
                                        Consider&& consider, SearchAll&& search_all, TraceCounters& counters);

    // This trace's steps, for the next trace (`repeated`: they are the recorded ones again,
    // nothing to do) — and the last recording's are replaced.
    void record(const std::vector<StepTaken>& taken, const std::vector<PlacedOptic>& placed);

    // Every step so far lay within the recorded steps' margin.
    bool replaying() const { return replaying_; }
    size_t recorded_steps() const { return steps_.size(); }

private:
    struct Step {
        Vec2 from_mm{0, 0}, to_mm{0, 0};
        std::vector<uint32_t> candidates;  // the element met first (if any) comes first
    };
    std::vector<Step> steps_;
    std::vector<Vec2> placed_at_mm_;      // element positions when it was recorded
    std::vector<double> placed_reach_mm_;  // and their bounding-circle radii
    // The largest move (squared) and bounding-circle growth of any element since the
    // recording, as last computed (moved_known: computed since the recording at all).
    double moved2_mm2_ = 0, grown_mm_ = 0;
    bool moved_known_ = false;
    double moved_mm_ = 0;  // this trace's bound δ
    bool replaying_ = false;
};

inline void StepAccelerator::begin(const std::vector<PlacedOptic>& placed, bool since_last,
                            const std::vector<size_t>& changed) {
    replaying_ = !steps_.empty();
    if (!replaying_) return;
    since_last = since_last && moved_known_;
    double moved2 = since_last ? moved2_mm2_ : 0, grown = since_last ? grown_mm_ : 0;
    auto widen = [&](size_t i) {
        moved2 = std::max(moved2, (placed[i].at - placed_at_mm_[i]).squaredNorm());
        grown = std::max(grown, placed[i].reach - placed_reach_mm_[i]);
    };
    if (since_last) {
        for (size_t i : changed) widen(i);
    } else {
        for (size_t i = 0; i < placed.size(); ++i) widen(i);
    }
    moved2_mm2_ = moved2;
    grown_mm_ = grown;
    moved_known_ = true;
    moved_mm_ = std::sqrt(moved2) + grown;
}

template <class Consider, class SearchAll>
std::optional<SurfaceCrossing> StepAccelerator::next(const Vec2& p, const Vec2& d, double max_dist, size_t step,
                                                     Consider&& consider, SearchAll&& search_all,
                                                     TraceCounters& counters) {
    if (replaying_ && step < steps_.size()) {
        const Step& recorded = steps_[step];
        // |a| + δ < margin, compared as |a|² < (margin − δ)² (no square roots in the loop).
        const double slack = kTraceMargin_mm - moved_mm_;
        const double slack2 = slack > 0 ? slack * slack : -1.0;
        if ((p - recorded.from_mm).squaredNorm() < slack2) {
            SurfaceCrossing best;
            for (uint32_t i : recorded.candidates) consider(i, best);
            const double reach = best.found() ? best.dist : max_dist;
            if (std::isfinite(reach) && (p + reach * d - recorded.to_mm).squaredNorm() < slack2) {
                ++counters.replayed_steps;
                return best.found() ? std::optional<SurfaceCrossing>(best) : std::nullopt;
            }
        }
    }
    replaying_ = false;
    ++counters.searched_steps;
    return search_all();
}

}  // namespace rv
