#pragma once
// Radii of a thick singlet of a named shape that has a given focal length at its design
// wavelength, from the thick-lens lensmaker's equation (Hecht, "Optics", §6.2):
//   1/f = (n − 1)[1/R1 − 1/R2 + (n − 1) t/(n R1 R2)].
// Plano shapes: the curved face alone sets f (f = R/(n − 1), exact for any thickness).
// Symmetric shapes (R1 = −R2 = R): R = (n − 1) f [1 + √(1 − t/(n f))].
// Radius signs as in optics/thick_lens.hpp (centre of curvature downstream is positive).

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rv {

struct ShapeRadii {
    double front_radius_mm, back_radius_mm;  // infinity for a flat face
};

const std::vector<std::string>& lens_shape_names();

// nullopt with a reason when the shape cannot have that focal length (a convex shape with
// f < 0, a biconvex lens too thick for its focal length, an unknown shape).
std::optional<ShapeRadii> radii_for_shape(std::string_view shape, double focal_length_mm,
                                          double center_thickness_mm, double index,
                                          std::string* why_not);

}  // namespace rv
