#include "scene/wavelength_colour.hpp"

#include <algorithm>
#include <cmath>

namespace rv::scene {

namespace {

// The piecewise Gaussian of the fit: σ1 below the centre μ, σ2 above.
double lobe(double l, double mu, double s1, double s2) {
    const double t = (l - mu) / (l < mu ? s1 : s2);
    return std::exp(-0.5 * t * t);
}

std::uint8_t encode_srgb(double linear) {
    const double c = std::clamp(linear, 0.0, 1.0);
    const double v = c <= 0.0031308 ? 12.92 * c : 1.055 * std::pow(c, 1 / 2.4) - 0.055;
    return static_cast<std::uint8_t>(std::lround(v * 255));
}

}  // namespace

Xyz cie1931_xyz(double l) {
    return {1.056 * lobe(l, 599.8, 37.9, 31.0) + 0.362 * lobe(l, 442.0, 16.0, 26.7) -
                0.065 * lobe(l, 501.1, 20.4, 26.2),
            0.821 * lobe(l, 568.8, 46.9, 40.5) + 0.286 * lobe(l, 530.9, 16.3, 31.1),
            1.217 * lobe(l, 437.0, 11.8, 36.0) + 0.681 * lobe(l, 459.0, 26.0, 13.8)};
}

BeamStyle beam_style(double nm) {
    if (nm < 400) return {{148, 0, 211, 255}, false};  // ultraviolet: violet, dashed
    if (nm > 700) {
        // Infrared: dark false colours running from magenta-red at 700 nm through brown at
        // 1050 nm to olive at 1400 nm and beyond, so that two infrared beams differ; dashed.
        const double t = std::clamp((nm - 700) / 700, 0.0, 1.0);
        auto mix = [t](double a, double b, double c) {
            return static_cast<std::uint8_t>(std::lround(t < 0.5 ? a + (b - a) * 2 * t : b + (c - b) * (2 * t - 1)));
        };
        return {{mix(200, 150, 90), mix(0, 45, 80), mix(120, 0, 20), 255}, false};
    }
    const Xyz c = cie1931_xyz(nm);
    double r = 3.2404542 * c.x - 1.5371385 * c.y - 0.4985314 * c.z;
    double g = -0.9692660 * c.x + 1.8760108 * c.y + 0.0415560 * c.z;
    double b = 0.0556434 * c.x - 0.2040259 * c.y + 1.0572252 * c.z;
    const double lift = -std::min({r, g, b, 0.0});
    r += lift, g += lift, b += lift;
    const double top = std::max({r, g, b});
    if (top > 0) r /= top, g /= top, b /= top;
    return {{encode_srgb(r), encode_srgb(g), encode_srgb(b), 255}, true};
}

}  // namespace rv::scene
