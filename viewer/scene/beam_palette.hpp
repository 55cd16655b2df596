#pragma once
// The colours of the beams of one drawing, distinct by at least kMinBeamDeltaE76.
//
// Colour difference: CIE 1976 ΔE*ab, the Euclidean distance in CIELAB (CIE 15:2004 §8.2.1),
// from sRGB by IEC 61966-2-1 (transfer curve, then the linear-RGB → XYZ matrix for D65) and
// CIELAB with the D65 white (X_n, Y_n, Z_n) = (0.95047, 1, 1.08883). About 2.3 is a just
// noticeable difference (Sharma & Trussell, 1997); 25 is far beyond it: two beams read as two
// colours at a glance (our choice).
//
// Each beam keeps its wavelength's colour (wavelength_colour.hpp) unless that lies within the
// limit of a colour an earlier beam (or generated wave) was given; then it takes, of a fixed
// set of candidates (24 hues at three strengths), the one nearest its own colour that is far
// enough from every earlier one. The legend names each beam's wavelength, so the colour need
// not carry it alone.

#include <vector>

#include "analysis/report.hpp"
#include "scene/wavelength_colour.hpp"

namespace rv::scene {

inline constexpr double kMinBeamDeltaE76 = 25.0;

struct Lab {
    double l, a, b;
};
Lab srgb_to_lab(const Colour& c);
double delta_e76(const Colour& a, const Colour& b);

// One style per wavelength, in order; each style's `visible` (dashed or not) stays its own.
std::vector<BeamStyle> distinct_beam_styles(const std::vector<double>& wavelengths_nm);

// A drawing's colours: the report's beams in order, then each generated wave the legend lists
// (a sum frequency, or the second harmonic of a one-beam layout), as the scene and the plots
// draw them.
std::vector<double> drawn_wavelengths_nm(const RendezvousReport& report);
inline std::vector<BeamStyle> report_beam_styles(const RendezvousReport& report) {
    return distinct_beam_styles(drawn_wavelengths_nm(report));
}
// Whether the legend lists a phase-matching entry's generated wave.
bool legend_lists_generated(const RendezvousReport& report, const PhaseMatchingReport& p);

}  // namespace rv::scene
