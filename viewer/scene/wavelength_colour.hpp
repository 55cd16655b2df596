#pragma once
// The display colour of a beam from its wavelength.
//
// Visible light (400–700 nm): the CIE 1931 2° colour-matching functions by the multi-lobe
// analytic fit of Wyman, Sloan & Shirley, "Simple Analytic Approximations to the CIE XYZ Color
// Matching Functions", JCGT 2(2), 2013; XYZ → linear sRGB by the IEC 61966-2-1 matrix;
// spectral colours lie outside the sRGB gamut, so negative components are lifted by adding
// white and the result scaled to a maximum of 1; then the sRGB transfer curve.
// Invisible light gets a false colour and a dash pattern, so it never looks like a safe
// visible beam (common practice: dark red for the near infrared, violet for the ultraviolet).

#include <cstdint>

namespace rv::scene {

struct Colour {
    std::uint8_t r = 0, g = 0, b = 0, a = 255;
};

struct Xyz {
    double x, y, z;
};
Xyz cie1931_xyz(double wavelength_nm);

struct BeamStyle {
    Colour colour;
    bool visible = true;  // false: draw dashed
};
BeamStyle beam_style(double wavelength_nm);

}  // namespace rv::scene
