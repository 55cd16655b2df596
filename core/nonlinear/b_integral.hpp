#pragma once
// The B-integral: the nonlinear phase a pulse's peak picks up on axis through a medium of
// nonlinear index n₂ (the Kerr effect, n = n0 + n₂ I):
//   B = (2π/λ) ∫ n₂ I(z) dz
// (e.g. W. Koechner, Solid-State Laser Engineering, 6th ed., 2006, §4.5; A. E. Siegman, Lasers,
// 1986, on small-scale self-focusing). For a Gaussian beam with its waist inside or near the
// slab, the on-axis peak intensity falls as I(z) = I0 · w0t w0s/(wt(z) ws(z)) with
// w(z) = w0 √(1 + ((z − z_w)/z_R)²) per plane; for one round beam the integral is
//   B = (2π/λ) n₂ I0 z_R [atan((L/2 − z_w)/z_R) + atan((L/2 + z_w)/z_R)].
// Levels of common practice (the trade's rules of thumb, e.g. Koechner §4.5 for laser
// amplifier chains): B ≈ 1 rad brings visible self-phase modulation and spectral broadening;
// beyond about π, small-scale self-focusing (beam break-up) and damage become likely.
// Units: λ nm, lengths mm, intensity W/cm², n₂ cm²/W.

#include <optional>
#include <string_view>

namespace rv {

inline constexpr double kBIntegralSpectralRad = 1.0;                  // self-phase modulation
inline constexpr double kBIntegralBreakUpRad = 3.14159265358979323846;  // π: beam break-up risk

struct KerrIndex {
    double n2_cm2_per_w = 0;
    std::string_view source;  // with the wavelength it was measured at
};

// The bundled n₂ of a material family (glasses and crystals), or nullopt when none is bundled.
std::optional<KerrIndex> kerr_index(std::string_view family);

// One plane of the beam in the slab: waist radius (µm), waist position from the slab's centre
// along the beam (mm, + downstream) and Rayleigh range in the slab (mm).
struct SlabPlane {
    double waist_um = 0, waist_from_centre_mm = 0, rayleigh_mm = 0;
};

// B through a slab of length L (mm) for an on-axis peak intensity I0 at the waist.
double b_integral_rad(double wavelength_nm, double n2_cm2_per_w, double peak_intensity_at_waist_w_cm2,
                      const SlabPlane& tangential, const SlabPlane& sagittal, double length_mm);

// B for a constant intensity along the length ((2π/λ) n₂ I L).
double b_integral_uniform_rad(double wavelength_nm, double n2_cm2_per_w, double intensity_w_cm2,
                              double length_mm);

}  // namespace rv
