#pragma once
// Phase matching by temperature: for a crystal set with thermo-optic data
// (materials/thermo_optic.hpp), Δk at a fixed angle as a function of the temperature T.
//   the phase-matching temperature: Δk(T) = 0, searched over the span a layout may set
//     (kMinCrystalTemperature_c … kMaxCrystalTemperature_c), the root nearest the temperature now;
//   the temperature acceptance (FWHM of sinc²(ΔkL/2)): ΔT = 5.5662 / (L |∂Δk/∂T|), the same
//     width rule as the angular and spectral acceptances (nonlinear/phase_matching.hpp).
// Non-critical phase matching (θ or φ = 0° or 90°) is the usual case: the angle acceptance is
// wide there and the temperature is what a user tunes.

#include <optional>

#include "materials/material.hpp"
#include "nonlinear/phase_matching.hpp"

namespace rv {

struct TemperatureTuning {
    double now_c = 0;                           // the temperature the material is at
    std::optional<double> phase_matching_c;     // Δk = 0 at the angle given; none in the span
    std::optional<double> acceptance_fwhm_c;    // none when Δk does not change with T
};

// Nullopt for a set without thermo-optic data. `crystal` may already be taken to a
// temperature (its temperature_c is the one now).
std::optional<TemperatureTuning> temperature_tuning(const Material& crystal, double lambda1_nm,
                                                    double lambda2_nm, MixingType type,
                                                    double angle_rad, double length_mm,
                                                    PrincipalPlane plane = PrincipalPlane::XY);

}  // namespace rv
