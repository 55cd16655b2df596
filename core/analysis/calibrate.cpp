#include "analysis/calibrate.hpp"

#include <stdexcept>

#include "analysis/report.hpp"

namespace rv {

CalibrationResult calibrate_time_zero(const Layout& layout, const MaterialLibrary& library,
                                      double measured_zero_mm) {
    const RendezvousReport r = build_report(layout, library);
    if (!r.stage) throw std::invalid_argument("the layout has no stage that changes the delay between two beams that reach the target");
    // delay(x) = delay(p) + slope·(x − p); the true delay at the reading is zero.
    const double offset = r.mismatch->delay_fs + r.stage->delay_per_mm_fs * (measured_zero_mm - r.stage->position_mm);
    CalibrationResult out{layout, offset, r.stage->id};
    out.layout.beams[0].emit_time_fs -= offset;  // delay = arrival(beam 1) − arrival(beam 2)
    for (Element& e : out.layout.elements)
        if (e.id == r.stage->id) std::get<Stage>(e.kind).measured_zero_mm = measured_zero_mm;
    return out;
}

}  // namespace rv
