#include "analysis/timing.hpp"

#include "materials/dispersion.hpp"

namespace rv {

double arrival_time_fs(const Layout& layout, const Path& path, size_t hit_index) {
    double t = layout.beams[path.beam].emit_time_fs;
    double air_group_index = 1.0;
    for (size_t i = 0; i <= hit_index && i < path.segments.size(); ++i) {
        const TraceSegment& seg = path.segments[i];
        t += group_delay_fs(seg.group_index, seg.length_mm);
        if (!seg.inside) air_group_index = seg.group_index;
    }
    for (size_t i = 0; i < hit_index && i < path.hits.size(); ++i) {
        const TraceHit& h = path.hits[i];
        if (h.lumped_glass_mm > 0)
            t += group_delay_fs(h.lumped_group_index - air_group_index, h.lumped_glass_mm);
    }
    return t;
}

}  // namespace rv
