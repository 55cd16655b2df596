#pragma once
// Re-finding time zero: a lab measures the stage reading at which the pulses overlap. The
// model's delay there is the emission-time offset it does not know (unequal pulse departure,
// cable, oscillator-amplifier delay…). Calibrating writes that offset into the first beam's
// emit_time_fs and records the reading on the stage, so that after any later change to the
// layout (a window added, a lens swapped) the report's zero-delay position is the predicted
// new zero, and its distance from the recorded reading is the move to make.

#include <string>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

struct CalibrationResult {
    Layout layout;              // emit_time_fs of beam 1 corrected, stage.measured_zero_mm set
    double emission_offset_fs;  // the model's delay at the reading, before the correction
    std::string stage;
};

// Throws std::invalid_argument with a plain sentence when the layout has no stage that
// changes the delay or a beam misses the target.
CalibrationResult calibrate_time_zero(const Layout& layout, const MaterialLibrary& library,
                                      double measured_zero_mm);

}  // namespace rv
