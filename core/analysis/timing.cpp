#include "analysis/timing.hpp"

#include <algorithm>

#include "materials/dispersion.hpp"

namespace rv {

double arrival_time_fs(const Layout& layout, const Path& path, size_t hit_index) {
    return layout.beams[path.beam].emit_time_fs + path.hits[hit_index].group_delay_fs;
}

double arrival_time_along_fs(const Layout& layout, const Path& path, size_t segment, double into_mm) {
    const TraceSegment& seg = path.segments[segment];
    const double into = std::clamp(into_mm, 0.0, seg.length_mm);
    const double emit_fs = layout.beams[path.beam].emit_time_fs;
    if (segment < path.hits.size())
        return emit_fs + path.hits[segment].group_delay_fs - group_delay_fs(seg.group_index, seg.length_mm - into);
    double start_fs = 0;  // the beam's start when the path has no hit
    if (segment > 0) {
        const TraceHit& before = path.hits[segment - 1];
        start_fs = before.group_delay_fs + group_delay_fs(before.lumped_group_index - seg.group_index, before.lumped_glass_mm);
    }
    return emit_fs + start_fs + group_delay_fs(seg.group_index, into);
}

}  // namespace rv
