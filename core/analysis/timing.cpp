#include "analysis/timing.hpp"

namespace rv {

double arrival_time_fs(const Layout& layout, const Path& path, size_t hit_index) {
    return layout.beams[path.beam].emit_time_fs + path.hits[hit_index].group_delay_fs;
}

}  // namespace rv
