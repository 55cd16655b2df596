#pragma once
// Polarization carried along a traced path: Stokes vectors and Mueller matrices built from the
// elements' Jones matrices (exact for the non-depolarizing elements here, and able to carry a
// partly polarized beam, which a Jones vector alone cannot).
//
// Basis, looking along the beam: H = in the table plane (perpendicular(direction), 90° to the
// left of travel), V = vertical (out of the table). Angles of axes and of linear polarization run
// from H towards V. Time dependence e^{i(kz − ωt)}: a wave delayed by Γ gains e^{iΓ}.
// Stokes (Born & Wolf; Goldstein, Polarized Light, 2003) from a Jones vector (a, b) = (E_H, E_V):
//   S0 = |a|² + |b|², S1 = |a|² − |b|², S2 = 2 Re(a b*), S3 = 2 Im(a b*);
// M = A (J ⊗ J*) A⁻¹ with A = [1 0 0 1; 1 0 0 −1; 0 1 1 0; 0 −i i 0].
// With (H, V, direction) right-handed, S3 > 0 is right-handed light in Born & Wolf's sense (the
// field turns clockwise seen facing the source): E = (1, −i)/√2 has the real field
// (cos ωt, −sin ωt). "circular-right" in a file is S3 = +1, "circular-left" S3 = −1.
// Elements (Jones, before the power factors):
// * wave plate, fast axis θ, retardance Γ: R(−θ) diag(1, e^{iΓ}) R(θ), R(θ) = [c s; −s c];
// * polarizer, transmission axis θ, power extinction ratio ER: R(−θ) diag(1, 1/√ER) R(θ);
// * polarizing cube: transmits H (diag(1, 1/√ER)), reflects V (diag(0, √(1 − 1/ER)));
// * mirror and dichroic reflection: diag(−1, e^{iδ}) — the in-plane axis is mirrored (the
//   handedness of circular light flips), δ the coating's s − p phase (retardance_deg);
// * lenses, windows, dichroic transmission, retroreflectors (a hollow roof: two reflections)
//   and crystals before their centre: unchanged.
// Every element then multiplies the power by its `transmission`.

#include <complex>
#include <optional>
#include <string>

#include <Eigen/Dense>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

using Stokes = Eigen::Vector4d;
using Mueller = Eigen::Matrix4d;
using JonesMatrix = Eigen::Matrix2cd;

// A source's Stokes vector for unit power (polarized_fraction of it polarized).
Stokes source_stokes(const Polarization& p, double polarized_fraction);

Mueller mueller_from_jones(const JonesMatrix& j);
JonesMatrix retarder_jones(double retardance_rad, double fast_axis_rad);
JonesMatrix polarizer_jones(double extinction_ratio, double axis_rad);
JonesMatrix mirror_jones(double retardance_rad);

// A wave plate's retardance at a wavelength, in waves (½ for a perfect half-wave plate); nullopt
// for a plate that is not a wave plate or whose retarder material has no index there.
std::optional<double> retardance_waves(const Plate& plate, double wavelength_nm, const MaterialLibrary& library);

// The state a Stokes vector describes: power in H and V, degree of polarization, azimuth of
// the polarization ellipse (from H towards V, in (−90°, 90°]) and ellipticity angle χ (±45°
// circular). Circular light has no azimuth: none is given for |χ| ≥ kCircularEllipticityDeg
// (44°: axes within tan 44° = 0.966 of each other, common practice for "circular"), nor for
// light polarized less than kUnpolarizedDegree (5 %).
inline constexpr double kCircularEllipticityDeg = 44;
inline constexpr double kUnpolarizedDegree = 0.05;
struct PolarizationState {
    double power = 0, h = 0, v = 0;
    double degree = 0;
    std::optional<double> azimuth_deg;
    double ellipticity_deg = 0;
};
PolarizationState describe(const Stokes& s);
std::string describe_text(const PolarizationState& p);  // "linear at 22.5°", "circular (right)", …

}  // namespace rv
