#pragma once
// What a retrace (trace.hpp, retrace_layout) remembers of the previous one so that it re-traces
// each beam only from the first step a change can have altered: the elements as they were
// (and where they were placed), which of them changed since, the circles they occupy now and
// then, and per beam the tracer's state at the start of each step, its source, and the aim_at
// mirrors' state when it began.
//
// A step that no changed element comes near (its bounding circle, widened by kChangeSlack_mm,
// within reach of the step's segment) started the same way and met the same surfaces, so it
// repeats: the retrace keeps the leading steps up to the first such one and restarts there.
// While a retrace's circles lie inside the circles of the last retrace that tested each path
// from its start (the reference), widened as they were tested, the steps kept then stay clear
// of them and are kept without a test.

#include <cstdint>
#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "layout/layout.hpp"
#include "trace/path.hpp"
#include "trace/placed_optics.hpp"
#include "trace/propagate.hpp"
#include "trace/ray_state.hpp"
#include "trace/step_accelerator.hpp"

namespace rv {

// The tracer's state at the start of one step of the previous retrace.
struct StepStart {
    RayState ray;
    size_t findings = 0, noted = 0;  // the path's findings and the noted materials then
    std::optional<std::pair<size_t, Vec2>> aimed;  // an aim_at mirror this step's hit turned, and how
};

class RetraceMemo {
public:
    static constexpr double kChangeSlack_mm = 1.0;

    // The layout: which elements differ from the previous retrace's (all when there is none to
    // compare with, or the table or target changed). With `edited`, only the elements listed
    // there are compared: the caller vouches for the others (builds with
    // RV_VERIFY_EDITED_LISTS compare them all and throw std::logic_error naming one that
    // changed unlisted).
    void begin(const Layout& layout, const std::vector<size_t>* edited);
    // There is a previous retrace of this layout to keep steps from.
    bool valid() const { return valid_; }
    // Valid, and no stage, element id or mirror's aim_at changed (every stage moves what it did).
    bool links_same() const { return valid_ && !links_changed_; }
    std::vector<uint8_t>& changed_flags() { return changed_flag_; }
    const std::vector<size_t>& changed() const { return changed_; }
    // After placing: the changed elements completed (an aim_at mirror whose target changed)
    // and the circles they occupy, now and at the previous retrace.
    void list_changes(const std::vector<PlacedOptic>& placed, const std::vector<size_t>& aim_mirrors);
    // After tracing every beam: this retrace is the one the next compares with.
    void end(const std::vector<PlacedOptic>& placed);
    // Any other trace with the cache: the next retrace starts from the sources.
    void forget() { valid_ = false; }
    uint64_t retraces() const { return retraces_; }

    // One beam. The number of leading steps of its previous retrace this one keeps, given the
    // beam's source and wave now, the placed optics, the aim_at mirrors, and what the previous
    // retrace left (its path and steps); it notes the source and the mirrors' state for the next.
    size_t steps_to_keep(size_t beam, const BeamSource& source, const Polarization& wave,
                         const std::vector<PlacedOptic>& placed, const std::vector<size_t>& aim_mirrors,
                         const Path& path, const std::vector<StepTaken>& taken, TraceCounters& counters);
    // Where the kept steps end: the start of step `keep` (< starts(beam)).
    const StepStart& start(size_t beam, size_t keep) const { return beams_[beam].starts[keep]; }
    size_t starts(size_t beam) const { return beams_[beam].starts.size(); }
    // The aim_at mirrors the kept steps turned, with their turn then.
    template <class F>
    void for_each_kept_turn(size_t beam, size_t keep, F&& f) const {
        for (size_t j = 0; j < keep; ++j)
            if (const auto& a = beams_[beam].starts[j].aimed) f(a->first, a->second);
    }
    void truncate(size_t beam, size_t keep) { beams_[beam].starts.resize(keep); }
    void record_start(size_t beam, const StepStart& start) { beams_[beam].starts.push_back(start); }
    void note_turn(size_t beam, size_t element, const Vec2& normal) {
        beams_[beam].starts.back().aimed = std::make_pair(element, normal);
    }
    size_t kept_hits(size_t beam) const { return beams_[beam].kept_hits; }
    // A trace that keeps nothing (or, going on past the target, everything): its count.
    void set_kept_hits(size_t beam, size_t keep) { beams_[beam].kept_hits = keep; }

    // Propagation of the retrace's path to the target restarts after the hits it kept, but only
    // when the memo followed the previous retrace's path: the number of hits whose propagation
    // is still valid (0: from the start), and the memo to propagate with.
    size_t propagation_restart(size_t beam);
    TargetPropagationMemo& propagation(size_t beam) { return beams_[beam].propagation; }

    void resize_beams(size_t n) { beams_.resize(n); }
    void reset_beam(size_t beam) { beams_[beam] = Beam{}; }

private:
    struct Circle {
        Vec2 centre_mm{0, 0};
        double radius_mm = 0;
    };
    struct Beam {
        std::vector<StepStart> starts;
        std::optional<BeamSource> source;
        Polarization wave{};  // the crystal wave it was traced with
        std::vector<std::pair<bool, Vec2>> aims;  // the aim_at mirrors: still to turn, normal
        size_t kept_hits = 0;
        size_t reference_keep = 0;  // the steps kept when the reference circles were tested
        TargetPropagationMemo propagation;
        uint64_t propagated_at = 0;  // the retrace whose path `propagation` followed
    };
    bool aims_as_before(Beam& b, const std::vector<PlacedOptic>& placed, const std::vector<size_t>& aim_mirrors);
    bool touched_by_change(const StepTaken& step) const;
    void compare(const Element& now, size_t i);

    bool valid_ = false;
    uint64_t retraces_ = 0;
    std::vector<Element> seen_elements_;
    std::vector<Vec2> seen_at_mm_;
    std::vector<double> seen_reach_mm_;
    Table seen_table_;
    std::string seen_target_;
    std::vector<uint8_t> changed_flag_;  // per element, this retrace
    bool links_changed_ = false;
    std::vector<size_t> changed_;
    std::vector<Circle> change_circles_;
    std::optional<std::vector<Circle>> reference_circles_;
    bool circles_within_reference_ = false;
    std::vector<Beam> beams_;
};

}  // namespace rv
