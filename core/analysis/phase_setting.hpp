#pragma once
// Setting a crystal for a process: the lab turns (or tilts) one crystal between the SHG of either
// beam and their SFG. set_crystal_for_process records the process in the crystal and turns or
// tilts it to that process's phase-matching angle (analysis/crystal_angle.hpp), judged by the
// report's own evaluation before and after. A crystal in an oven (temperature_c given, a set
// with thermo-optic data) keeps its angle and is set to the temperature that phase-matches.

#include <optional>
#include <string>

#include "analysis/report.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

struct PhaseSetting {
    Layout layout;                 // the crystal's process set, turned or tilted, angles at 0.001°
    std::string crystal;           // the crystal's id
    ProcessBeams process;          // its beams (words: report/verdict_words.hpp, process_beams_text)
    CrystalRotation rotation = CrystalRotation::Turn;
    double change_deg = 0;         // external; sign as PhaseMatchingReport::rotate_by_deg
    double normal_before_deg = 0, normal_after_deg = 0;
    double tilt_before_deg = 0, tilt_after_deg = 0;
    bool by_temperature = false;   // the oven was set, not the angle (change_deg stays 0)
    std::optional<double> temperature_before_c, temperature_after_c;
    double sinc2_before = 0, sinc2_after = 0;
    double theta_pm_deg = 0, theta_after_deg = 0;
};

// `process_key`: "sfg" or "shg:BEAM". Throws std::invalid_argument, with the reason, when the
// target is not a birefringent crystal, the key names no process of this layout, the process's
// beams do not reach the crystal, it has no phase matching, or no turn or tilt in range reaches it.
PhaseSetting set_crystal_for_process(const Layout& layout, const MaterialLibrary& library,
                                     const std::string& process_key);

}  // namespace rv
