#pragma once
// Second-order nonlinear coefficients of the bundled crystals and the effective coefficient
// d_eff of a process at its phase-matching angle.
//
// Definition: d_eff = ê3 · d : ê1 ê2, the contraction of the d tensor (d_ijk = χ⁽²⁾_ijk/2,
// Kleinman symmetry) with the unit field vectors of the three waves, each perpendicular to the
// wave vector (walk-off of the field direction, ρ ≲ 4°, neglected: cos ρ ≥ 0.998).
// Field vectors in the crystal's optical frame (X, Y, Z), wave vector
// k = (sin θ cos φ, sin θ sin φ, cos θ):
//   A wave (ordinary, angle-independent index): ê = (sin φ, −cos φ, 0)          (uniaxial)
//   B wave (extraordinary):                     ê = (cos θ cos φ, cos θ sin φ, −sin θ)
// Biaxial crystals in a principal plane (phase_matching.hpp): the A wave is polarized along the
// axis normal to the plane (XY: Z, YZ: X, XZ: Y), the B wave in the plane, perpendicular to k.
//
// Under Kleinman symmetry the contraction depends only on how many of the three waves are B
// waves (one: type I A+A→B and type II A+B→A, B+A→A; two: type I B+B→A and type II A+B→B,
// B+A→B). Closed forms (Dmitriev, Gurzadyan & Nikogosyan, Handbook of Nonlinear Optical
// Crystals, 3rd ed., Springer 1999, §2 and the crystals' sections; for the biaxial principal
// planes also D. A. Roberts, IEEE J. Quantum Electron. 28, 2057 (1992)):
//   3m (BBO):       one B:  d31 sin θ − d22 cos θ sin 3φ      two B:  d22 cos²θ cos 3φ
//   mm2, polar Z (KTP: X‖a, Y‖b, Z‖c):
//     XY (φ):       one B:  0                                   two B:  d31 sin²φ + d32 cos²φ
//     YZ (θ):       one B:  d31 sin θ                           two B:  0
//     XZ (θ):       one B:  d32 sin θ                           two B:  0
//   mm2, polar Y (LBO: X‖a, Y‖c, Z‖b; the crystallographic d31 = d_cAA, d32 = d_cBB):
//     XY (φ):       one B:  d32 cos φ                           two B:  0
//     YZ (θ):       one B:  d31 cos θ                           two B:  0
//     XZ (θ):       one B:  0                                   two B:  d31 cos²θ + d32 sin²θ
// (each checked against the contraction in tests/nonlinear/nonlinear_coefficients_test.cpp).
// A uniaxial crystal's azimuth φ is not part of the layout: it is taken as the cut that
// maximises |d_eff| for the type (common practice: BBO type I is cut at φ = 90°, type II at
// φ = 0°), and reported.
// Units: pm/V; angles in radians.

#include <optional>
#include <string>
#include <string_view>

#include "materials/material.hpp"
#include "nonlinear/phase_matching.hpp"

namespace rv {

// The point-group form of a crystal's d tensor in its optical frame.
enum class TensorForm {
    Trigonal3m,   // uniaxial, optic axis Z; nonzero d22 (= −d21 = −d16), d31 (= d15 = d24), d33
    Mm2PolarZ,    // biaxial, two-fold axis along Z: d31 = d15, d32 = d24, d33
    Mm2PolarY,    // biaxial, two-fold axis along Y: crystallographic d31, d32, d33 on (X, Z, Y)
};

struct NonlinearCoefficients {
    std::string_view family;  // the material family they belong to ("BBO")
    TensorForm form;
    double d22_pm_v = 0, d31_pm_v = 0, d32_pm_v = 0, d33_pm_v = 0;
    std::string_view source;  // where the numbers come from, with the wavelength they hold at
};

// The coefficients bundled for a material family, or null (isotropic materials, wave-plate
// crystals whose nonlinearity is not bundled).
const NonlinearCoefficients* nonlinear_coefficients(std::string_view family);

// How many of the type's three waves are B waves (1 or 2).
int b_wave_count(MixingType type);

// The closed forms above. angle_rad is θ (uniaxial, YZ, XZ) or φ (XY); azimuth_rad is the
// uniaxial φ (ignored for biaxial crystals).
double d_eff_closed_form_pm_v(const NonlinearCoefficients& c, PrincipalPlane plane, int b_waves,
                              double angle_rad, double azimuth_rad = 0);

struct EffectiveNonlinearity {
    double d_eff_pm_v = 0;             // |d_eff|
    std::optional<double> azimuth_deg;  // uniaxial: the φ taken (the cut with the largest |d_eff|)
    std::string formula;                // the closed form used, e.g. "d31 sinθ − d22 cosθ sin3φ"
    std::string_view source;            // of the coefficients
};

// d_eff of a process in `crystal` at its phase-matching angle, or nullopt when no coefficients
// are bundled for its family.
std::optional<EffectiveNonlinearity> effective_nonlinearity(const Material& crystal, MixingType type,
                                                            double angle_rad,
                                                            PrincipalPlane plane = PrincipalPlane::XY);

}  // namespace rv
