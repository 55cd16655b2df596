#include "trace/retrace_memo.hpp"

#include <algorithm>
#include <numeric>
#include <stdexcept>

#include "trace/segment_distance.hpp"

namespace rv {

// An element as it was at the previous retrace, now: noted as changed when it differs at all
// (Element's own equality); a change of what links elements (an id, a stage, an aim_at) is
// noted as such, since it can move or turn other elements.
void RetraceMemo::compare(const Element& now, size_t i) {
    Element& then = seen_elements_[i];
    if (now == then) return;
    changed_flag_[i] = 1;
    changed_.push_back(i);
    const auto* mirror_now = std::get_if<Mirror>(&now.kind);
    const auto* mirror_then = std::get_if<Mirror>(&then.kind);
    if (now.id != then.id || std::holds_alternative<Stage>(now.kind) ||
        (mirror_now && mirror_then && mirror_now->aim_at != mirror_then->aim_at))
        links_changed_ = true;
    then = now;
}

void RetraceMemo::begin(const Layout& layout, const std::vector<size_t>* edited) {
    const size_t n = layout.elements.size();
    changed_flag_.assign(n, 0);
    changed_.clear();
    links_changed_ = false;
    if (!valid_ || seen_elements_.size() != n || !(seen_table_ == layout.table) || seen_target_ != layout.target) {
        valid_ = false;
        seen_elements_ = layout.elements;
        seen_table_ = layout.table;
        seen_target_ = layout.target;
        changed_flag_.assign(n, 1);
        changed_.resize(n);
        std::iota(changed_.begin(), changed_.end(), size_t{0});
        return;
    }
    if (!edited) {
        for (size_t i = 0; i < n; ++i) compare(layout.elements[i], i);
        return;
    }
    for (size_t i : *edited)
        if (i < n) compare(layout.elements[i], i);
#ifdef RV_VERIFY_EDITED_LISTS
    // The caller's promise, checked: every element it did not name is as it was.
    for (size_t i = 0; i < n; ++i)
        if (!(layout.elements[i] == seen_elements_[i]))
            throw std::logic_error("retrace: element '" + layout.elements[i].id + "' (index " + std::to_string(i) +
                                   ") changed but the caller's edited list does not name it");
#endif
}

void RetraceMemo::list_changes(const std::vector<PlacedOptic>& placed, const std::vector<size_t>& aim_mirrors) {
    if (links_same()) {
        for (size_t m : aim_mirrors)
            if (!changed_flag_[m] && changed_flag_[*placed[m].aim_target]) changed_.push_back(m);
    } else {
        changed_.clear();
        for (size_t i = 0; i < placed.size(); ++i)
            if (changed_flag_[i] || (placed[i].aim_target && changed_flag_[*placed[i].aim_target]))
                changed_.push_back(i);
    }
    change_circles_.clear();
    circles_within_reference_ = false;
    if (!valid_) {
        reference_circles_.reset();
        return;
    }
    for (size_t i : changed_) {
        const double then = seen_reach_mm_[i] + 1e-6, now = placed[i].reach + 1e-6;
        change_circles_.push_back({placed[i].at, now});
        if (seen_at_mm_[i] != placed[i].at || then != now) change_circles_.push_back({seen_at_mm_[i], then});
    }
    // Each of this retrace's circles inside one of the reference circles, widened as they were tested?
    if (reference_circles_) {
        circles_within_reference_ = true;
        for (const Circle& k : change_circles_) {
            bool inside = false;
            for (const Circle& w : *reference_circles_)
                inside = inside || (k.centre_mm - w.centre_mm).norm() + k.radius_mm <= w.radius_mm + kChangeSlack_mm;
            circles_within_reference_ = circles_within_reference_ && inside;
        }
    }
    if (!circles_within_reference_) reference_circles_ = change_circles_;  // tested from the start now
}

void RetraceMemo::end(const std::vector<PlacedOptic>& placed) {
    // After a retrace compared with the previous one, only the changed elements were placed anew.
    auto see = [&](size_t i) {
        seen_at_mm_[i] = placed[i].at;
        seen_reach_mm_[i] = placed[i].reach;
    };
    if (valid_) {
        for (size_t i : changed_) see(i);
    } else {
        seen_at_mm_.resize(placed.size());
        seen_reach_mm_.resize(placed.size());
        for (size_t i = 0; i < placed.size(); ++i) see(i);
    }
    valid_ = true;
    ++retraces_;
}

// Whether every aim_at mirror is as it was when this beam started in the previous retrace
// (still to be turned, or its normal); the memo then takes the present state.
bool RetraceMemo::aims_as_before(Beam& b, const std::vector<PlacedOptic>& placed,
                                 const std::vector<size_t>& aim_mirrors) {
    bool same = true;
    size_t k = 0;
    for (size_t i : aim_mirrors) {
        const std::pair<bool, Vec2> now(placed[i].aim_pending, placed[i].normal);
        if (k < b.aims.size()) {
            same = same && b.aims[k] == now;
            b.aims[k] = now;
        } else {
            same = false;
            b.aims.push_back(now);
        }
        ++k;
    }
    if (k != b.aims.size()) same = false;
    b.aims.resize(k);
    return same;
}

// Whether a changed element comes near the step, where it was then or where it is now (a box
// test first). The circles are tested widened by kChangeSlack_mm (a stricter test, so still
// safe), which lets later retraces skip the steps kept here while their circles lie within these.
bool RetraceMemo::touched_by_change(const StepTaken& step) const {
    const Vec2 lo = step.from_mm.cwiseMin(step.to_mm), hi = step.from_mm.cwiseMax(step.to_mm);
    for (const Circle& k : change_circles_) {
        const Vec2& c = k.centre_mm;
        const double r = k.radius_mm + kChangeSlack_mm;
        if (c.x() < lo.x() - r || c.x() > hi.x() + r || c.y() < lo.y() - r || c.y() > hi.y() + r) continue;
        if (squared_distance_to_segment(c, step.from_mm, step.to_mm) <= r * r) return true;
    }
    return false;
}

size_t RetraceMemo::steps_to_keep(size_t beam, const BeamSource& source, const Polarization& wave,
                                  const std::vector<PlacedOptic>& placed, const std::vector<size_t>& aim_mirrors,
                                  const Path& path, const std::vector<StepTaken>& taken, TraceCounters& counters) {
    Beam& b = beams_[beam];
    size_t keep = 0;
    const bool aims_same = aims_as_before(b, placed, aim_mirrors);
    const bool comparable = valid_ && aims_same && b.source && *b.source == source && b.wave == wave &&
                            path.hits.size() + 1 >= b.starts.size() && taken.size() + 1 >= b.starts.size();
    const bool skip = comparable && circles_within_reference_ && b.reference_keep + 1 <= b.starts.size();
    if (skip) {
        keep = b.reference_keep;
        ++counters.reference_skips;
    }
    // The last step of the previous trace is always taken again (it ended the path).
    while (comparable && keep + 1 < b.starts.size() && !touched_by_change(taken[keep])) ++keep;
    if (!comparable) {
        b.source = source;
        b.wave = wave;
    }
    if (!skip) b.reference_keep = keep;  // tested from the start (or nothing kept)
    b.kept_hits = keep;
    return keep;
}

size_t RetraceMemo::propagation_restart(size_t beam) {
    Beam& b = beams_[beam];
    const size_t unchanged = b.propagated_at + 1 == retraces_ ? b.kept_hits : 0;
    b.propagated_at = retraces_;
    return unchanged;
}

}  // namespace rv
