#pragma once
// A material taken to another temperature: each principal axis's index shifted by its set's
// thermo-optic slope (materials/material.hpp, ThermoOptic), the dispersion shape unchanged.
//   Δn(λ) = (a + b·λ) · (T − T_ref)
// enters the formula as an offset linear in λ (DispersionFormula::shift_*), so the group
// index and GVD follow it exactly (dΔn/dλ = b·(T − T_ref); higher derivatives vanish).

#include "materials/material.hpp"

namespace rv {

// The temperatures a layout may give a crystal, which are also the span the report searches
// for the phase-matching temperature: ovens run from room temperature to about 200 °C
// (common practice); the span leaves room on both sides.
constexpr double kMinCrystalTemperature_c = -40.0;
constexpr double kMaxCrystalTemperature_c = 250.0;

// The material at temperature_c. The shift replaces any earlier one: a set taken to 150 °C
// and then to 40 °C is the set at 40 °C. Unchanged when the set has no thermo-optic data.
Material at_temperature(const Material& material, double temperature_c);

}  // namespace rv
