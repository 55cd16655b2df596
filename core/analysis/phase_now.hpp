#pragma once
// The phase mismatch of a process with the crystal as it is placed now: ψ, the angle between
// the first input's wave vector inside and the crystal's reference axis (trace/crystal_axes.hpp:
// from its table-plane direction inside at the crystal's centre plane and the index it was
// refracted with, through the crystal's turn and tilt), and Δk at ψ
// (nonlinear/phase_matching.hpp). The report's phase line and the tolerance run's judgement
// of every build take it from here.

#include "layout/layout.hpp"
#include "materials/material.hpp"
#include "nonlinear/phase_matching.hpp"

namespace rv {

struct PhaseNow {
    double theta_now_rad = 0;
    double delta_k_per_mm = 0;  // not finite where an index formula has no real value
};

PhaseNow phase_now(const Material& material, double first_nm, double second_nm, MixingType type,
                   const Element& crystal_element, const Crystal& crystal, const Vec2& direction_inside,
                   double index_inside);

}  // namespace rv
