#pragma once
// Lenses in air: the thin chromatic lens and the thick singlet.
//
// Sign convention as in abcd.hpp: light travels to +z; a surface radius is positive when its
// centre of curvature lies downstream (biconvex: R1 > 0, R2 < 0); an infinite radius is flat.
// Distances of focal points and principal planes are measured along +z from the named vertex.
// The lens sits in air taken as n = 1 (catalogue glass indices are relative to air).
// Reference: lensmaker's equation, e.g. Hecht, "Optics", 4th ed., §6.2;
// Siegman, "Lasers" (1986), §15.1 for the matrix product.

#include <limits>

#include "optics/abcd.hpp"

namespace rv {

// Thin lens whose focal length is known at a design wavelength, where the glass has index
// index_design; at another wavelength where it has index index_now, by the lensmaker's
// formula 1/f = (n − 1)(1/R1 − 1/R2): f(λ) = f(λ0)·(n(λ0) − 1)/(n(λ) − 1).
double chromatic_focal_length_mm(double focal_length_design_mm, double index_design,
                                 double index_now);

struct ThickSinglet {
    double front_radius_mm;       // R1; std::numeric_limits<double>::infinity() for flat
    double back_radius_mm;        // R2
    double center_thickness_mm;   // t > 0
};

inline constexpr double kFlat = std::numeric_limits<double>::infinity();

// Matrix from the front vertex to the back vertex for glass of index n in air:
// S2 · T(t) · S1, with S1 = interface(1 → n, R1), S2 = interface(n → 1, R2).
RayMatrix thick_singlet_matrix(const ThickSinglet& lens, double index);

struct ThickLensProperties {
    double effective_focal_length_mm;  // EFL = −1/C
    double back_focal_distance_mm;     // back vertex → rear focal point, −A/C
    double front_focal_distance_mm;    // front focal point → front vertex, −D/C
    double front_principal_plane_mm;   // front vertex → H, (D − 1)/C (+ = inside the lens)
    double rear_principal_plane_mm;    // back vertex → H', (1 − A)/C (− = inside the lens)
};

ThickLensProperties thick_lens_properties(const ThickSinglet& lens, double index);

// The lensmaker's equation for a thick lens in air:
// 1/f = (n − 1)[1/R1 − 1/R2 + (n − 1) t / (n R1 R2)].
double lensmaker_focal_length_mm(const ThickSinglet& lens, double index);

}  // namespace rv
