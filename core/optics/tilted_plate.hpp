#pragma once
// A plane-parallel plate (window, dichroic substrate, wave plate) crossed at an angle, in air.
//
// Model: the plate of thickness t and index n is hit at angle of incidence θ; inside, the ray
// runs at θ' with sin θ' = sin θ / n over the glass path L = t / cos θ'. Built from the
// tilted-interface matrices of abcd.hpp, the plate is a free-space section of effective length
//   sagittal   L_s = t / (n cos θ')
//   tangential L_t = t cos²θ / (n cos³θ')
// and it shifts the ray sideways by d = t sin θ [1 − cos θ / √(n² − sin²θ)].
// References: Kogelnik, Ippen, Dienes & Shank, IEEE JQE 8, 373 (1972) (Brewster plates);
// Hanna, IEEE JQE 5, 483 (1969); displacement: standard plate formula, e.g. Smith,
// "Modern Optical Engineering", plate aberrations.

#include "optics/abcd.hpp"

namespace rv {

struct TiltedPlate {
    double lateral_shift_mm;           // displacement of the outgoing ray, ⟂ to it
    double tangential_length_mm;       // effective free-space length in the table plane
    double sagittal_length_mm;         // effective free-space length out of the table plane
    double glass_path_mm;              // geometric length of the ray inside the plate
    double replaced_air_path_mm;       // air path along the original direction it replaces,
                                       //   L cos(θ − θ')
    double internal_angle_rad;         // θ'
};

TiltedPlate tilted_plate(double thickness_mm, double index, double aoi_rad);

// The plate's matrix in one plane: the product of both interfaces and the glass section.
RayMatrix tilted_plate_matrix(double thickness_mm, double index, double aoi_rad, Plane plane);

}  // namespace rv
