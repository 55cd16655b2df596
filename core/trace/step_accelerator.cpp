#include "trace/step_accelerator.hpp"

#include <cmath>

#include "trace/segment_distance.hpp"

namespace rv {

void StepAccelerator::record(const std::vector<StepTaken>& taken, const std::vector<PlacedOptic>& placed) {
    steps_.resize(taken.size());
    for (size_t k = 0; k < taken.size(); ++k) {
        Step& step = steps_[k];
        step.from_mm = taken[k].from_mm;
        step.to_mm = taken[k].to_mm;
        step.candidates.clear();
        // The element met comes first, so that it usually gives the search its nearest
        // distance before the others are tried.
        if (taken[k].met) step.candidates.push_back(*taken[k].met);
        for (size_t i = 0; i < placed.size(); ++i)
            if (placed[i].traced && i != taken[k].met &&
                std::sqrt(squared_distance_to_segment(placed[i].at, step.from_mm, step.to_mm)) <= placed[i].reach + kTraceMargin_mm)
                step.candidates.push_back(static_cast<uint32_t>(i));
    }
    moved2_mm2_ = grown_mm_ = 0;  // nothing has moved since this recording
    moved_known_ = true;
    placed_at_mm_.resize(placed.size());
    placed_reach_mm_.resize(placed.size());
    for (size_t i = 0; i < placed.size(); ++i) {
        placed_at_mm_[i] = placed[i].at;
        placed_reach_mm_[i] = placed[i].reach;
    }
}

}  // namespace rv
