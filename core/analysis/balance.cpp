#include "analysis/balance.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include "analysis/report.hpp"
#include "materials/dispersion.hpp"
#include "units/constants.hpp"

namespace rv {

BalanceResult balance_delay(const Layout& layout, const MaterialLibrary& library) {
    const RendezvousReport r = build_report(layout, library);
    if (!r.mismatch) throw std::invalid_argument("balancing needs two beams that both reach the target");
    BalanceResult out{layout, "", r.mismatch->delay_fs, 0, false, 0, r.mismatch->delay_fs, 0, ""};
    if (r.stage) {
        out.stage = r.stage->id;
        out.zero_delay_mm = r.stage->zero_delay_mm;
        out.zero_in_travel = r.stage->zero_in_travel;
        for (Element& e : out.layout.elements) {
            if (e.id != r.stage->id) continue;
            Stage& s = std::get<Stage>(e.kind);
            s.position_mm = std::clamp(r.stage->zero_delay_mm, s.travel_min_mm, s.travel_max_mm);
            out.stage_set_mm = s.position_mm;
        }
        out.residual_delay_fs = build_report(out.layout, library).mismatch->delay_fs;
    }
    if (std::abs(out.residual_delay_fs) > 0.01) {
        // The earlier beam needs more path: delay > 0 means beam 1 arrives later.
        const double ng_air = sample_index(*library.find("air"), layout.beams[out.residual_delay_fs > 0 ? 1 : 0].wavelength_nm).group_index;
        out.add_path_mm = std::abs(out.residual_delay_fs) * kSpeedOfLight_mm_per_fs / ng_air;
        out.add_path_to = layout.beams[out.residual_delay_fs > 0 ? 1 : 0].id;
    }
    return out;
}

}  // namespace rv
