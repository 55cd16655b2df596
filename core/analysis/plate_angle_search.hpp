#pragma once
// Searching a wave plate's fast-axis angle: everything a plate does repeats every 180°, so an
// angle is searched on [0°, 180°) by a coarse scan and then refined by golden-section search
// (Kiefer 1953; Press et al., "Numerical Recipes", 3rd ed., §10.2) inside one scan step either
// side of a scan point. Used by the report's wave-plate advice and by `rendezvous polarize`.

#include <functional>

namespace rv {

// An angle in degrees brought into [0, 180).
double plate_angle_deg(double angle_deg);

// The minimum of cost within ±half_width_deg of centre_deg, by golden-section search
// (`iterations` steps shrink the bracket by 0.618 each), as an angle in [0, 180).
double refine_plate_angle_deg(const std::function<double(double)>& cost, double centre_deg, double half_width_deg,
                              int iterations = 50);

}  // namespace rv
