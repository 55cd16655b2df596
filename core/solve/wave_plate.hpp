#pragma once
// Setting a wave plate: the fast-axis angle that gives one beam a wanted power at the target
// (a half-wave plate before a polarizer or cube is the usual attenuator), or the most power in
// the polarization the crystal's phase matching needs. A scan of the angle in 0.25° steps over
// 0–180° and a golden-section refinement around the best step (the power is a smooth function
// of the angle, periodic in 180°). The layout is never changed; the result carries a new one.

#include <optional>
#include <string>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

struct WavePlateGoal {
    std::string plate;                 // element id of a half- or quarter-wave plate
    std::string beam;                  // "" = the one beam that passes the plate
    std::optional<double> power_mw;    // wanted power at the target; none: the most useful power
};

struct WavePlateResult {
    std::string error;        // non-empty: nothing was set, and why
    std::string beam;
    double angle_before_deg = 0, angle_deg = 0;
    double power_before_mw = 0, power_mw = 0;        // at the target
    double useful_before_mw = 0, useful_mw = 0;      // in the polarization the crystal needs (0 without one)
    bool crystal_needs_known = false;                 // the report knows that polarization (useful_* apply)
    bool reached = true;                              // the wanted power is within 0.1 % (or no power asked)
    Layout layout;                                    // with the plate turned
};

WavePlateResult set_wave_plate(const Layout& layout, const MaterialLibrary& library, const WavePlateGoal& goal);

}  // namespace rv
