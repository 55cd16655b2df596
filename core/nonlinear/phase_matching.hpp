#pragma once
// Collinear phase matching of three waves (λ1 + λ2 → λ3, 1/λ3 = 1/λ1 + 1/λ2; SHG: λ1 = λ2)
// in a birefringent crystal, in one plane of propagation.
//
// Model: in the plane of propagation one polarization sees an index that does not depend on
// the angle ("A" wave) and the other one that does ("B" wave):
//   1/n_B(ψ)² = cos²ψ/p² + sin²ψ/q².
// Uniaxial crystal (BBO): A = ordinary (n_o), B = extraordinary, ψ = θ the angle to the optic
// axis, p = n_o, q = n_e. Biaxial crystal (LBO, KTP, n_x < n_y < n_z) in a principal plane:
//   XY: A polarized along Z (n_z), ψ = φ from X, p = n_y, q = n_x;
//   YZ: A polarized along X (n_x), ψ = θ from Z, p = n_y, q = n_z;
//   XZ: A polarized along Y (n_y), ψ = θ from Z, p = n_x, q = n_z.
// A type names the polarity of waves 1, 2 and 3: type I = A + A → B ("ooe") or B + B → A
// ("eeo"); type II = A + B → B, B + A → B, A + B → A or B + A → A.
// Relations (Dmitriev, Gurzadyan & Nikogosyan, Handbook of Nonlinear Optical Crystals, 1999;
// Boyd, Nonlinear Optics, 2008):
//   phase matching n3/λ3 = n1/λ1 + n2/λ2; type I closed form
//   sin²ψ = (N⁻² − p3⁻²)/(q3⁻² − p3⁻²), N = λ3 (n_A1/λ1 + n_A2/λ2); type II by root finding;
//   Δk = 2π (n3/λ3 − n1/λ1 − n2/λ2); walk-off of a B wave tan ρ = ½ n_B² (q⁻² − p⁻²) sin 2ψ;
//   acceptance: FWHM of sinc²(ΔkL/2) at ΔkL = 5.5662 (docs/physics.md §0.1), so
//   Δψ_int = 5.5662/(L |∂Δk/∂ψ|) and Δλ1 = 5.5662/(L |∂Δk/∂λ1|) (SHG: λ3 = λ1/2 follows;
//   SFG: λ2 fixed);  GVM_ij = (n_g,i − n_g,j)/c.
// Wavelengths in nm, lengths in mm, angles in radians.

#include <optional>
#include <string>

#include "materials/dispersion_formula.hpp"
#include "materials/material.hpp"

namespace rv {

// The full width of sinc²(ΔkL/2) at half its height, in ΔkL (rad): every acceptance is this
// over L |∂Δk/∂x| (docs/physics.md §0.1).
inline constexpr double kSincHalfWidth = 5.566229;

enum class Polarity { A, B };  // angle-independent or angle-dependent wave (see above)

enum class MixingType { TypeI, TypeI_BBA, TypeII_ABB, TypeII_BAB, TypeII_ABA, TypeII_BAA };

enum class PrincipalPlane { XY, YZ, XZ };  // for biaxial crystals; uniaxial ones ignore it

// The three waves' polarities for a type.
struct WavePolarities {
    Polarity wave1, wave2, wave3;
};
WavePolarities polarities(MixingType type);
// The trade's name of a type with its polarity triple (o = A, e = B; inputs, then the output):
// "type-I (ooe)", "type-II (eoe)" …
const char* mixing_type_label(MixingType type);

double sum_frequency_nm(double lambda1_nm, double lambda2_nm);

// Index and group index of a wave of the given polarity at angle ψ.
struct WaveIndex {
    double index, group_index;
    bool in_valid_range;
};
WaveIndex wave_index(const Material& crystal, double wavelength_nm, Polarity p, double angle_rad,
                     PrincipalPlane plane = PrincipalPlane::XY);

// The A index and the (p, q) pair of a crystal at one wavelength with their λ-derivatives
// (λ in µm): evaluated once, they give the index of either wave at any angle in a few
// multiplications (the trace keeps one per crystal and beam).
struct CrystalIndices {
    IndexDerivatives a, p, q;
    double wavelength_um;
    bool in_range;
};
CrystalIndices crystal_indices(const Material& crystal, double wavelength_nm,
                               PrincipalPlane plane = PrincipalPlane::XY);
WaveIndex wave_index(const CrystalIndices& indices, Polarity p, double angle_rad);

// Phase-matching angle ψ in (0, π/2), or nullopt when the type cannot phase-match.
std::optional<double> phase_matching_angle_rad(const Material& crystal, double lambda1_nm,
                                               double lambda2_nm, MixingType type,
                                               PrincipalPlane plane = PrincipalPlane::XY);

// Δk at angle ψ, per mm (n3/λ3 − n1/λ1 − n2/λ2, times 2π).
double delta_k_per_mm(const Material& crystal, double lambda1_nm, double lambda2_nm,
                      MixingType type, double angle_rad, PrincipalPlane plane = PrincipalPlane::XY);

// Spatial (Poynting) walk-off angle of a B wave at angle ψ.
double walkoff_rad(const Material& crystal, double wavelength_nm, double angle_rad,
                   PrincipalPlane plane = PrincipalPlane::XY);

struct Acceptance {
    double angular_internal_fwhm_mrad;  // for the given length
    double spectral_fwhm_nm;            // of wave 1 (SHG: the fundamental)
};
Acceptance acceptance(const Material& crystal, double lambda1_nm, double lambda2_nm,
                      MixingType type, double angle_rad, double length_mm,
                      PrincipalPlane plane = PrincipalPlane::XY);

// Group-velocity mismatch 1/v_g,i − 1/v_g,j in fs/mm of waves i, j ∈ {1, 2, 3} at angle ψ.
double group_velocity_mismatch_fs_per_mm(const Material& crystal, double lambda1_nm,
                                         double lambda2_nm, MixingType type, double angle_rad,
                                         int i, int j, PrincipalPlane plane = PrincipalPlane::XY);

}  // namespace rv
