#include "nonlinear/nonlinear_coefficients.hpp"

#include <array>
#include <cmath>

#include "units/constants.hpp"

namespace rv {

namespace {

// At 1064 nm (SHG of Nd:YAG), |d| in pm/V. The relative signs do not enter |d_eff| for the
// planes and cuts used here (the uniaxial azimuth is chosen for the largest |d_eff|).
constexpr std::array<NonlinearCoefficients, 3> kCoefficients{{
    // β-BaB2O4, point group 3m. Dmitriev, Gurzadyan & Nikogosyan, Handbook of Nonlinear Optical
    // Crystals (3rd ed., 1999): d22 = 2.2 pm/V (Shoji et al., J. Opt. Soc. Am. B 14, 2268
    // (1997)), d31 = 0.08 pm/V. The numbers appear so in two public crystal tables that cite the
    // handbook; the attribution of d22 to Shoji et al. is from memory.
    {"BBO", TensorForm::Trigonal3m, 2.2, 0.08, 0.0, 0.0,
     "Dmitriev, Gurzadyan & Nikogosyan, Handbook of Nonlinear Optical Crystals (1999); d22 after "
     "Shoji et al., JOSA B 14, 2268 (1997); 1064 nm"},
    // LiB3O5, point group mm2, two-fold axis c along the optical Y. Handbook (1999):
    // d31 = −0.67, d32 = 0.85, d33 = 0.04 pm/V (crystallographic indices; as tabulated by a
    // public crystal table citing the handbook).
    {"LBO", TensorForm::Mm2PolarY, 0.0, 0.67, 0.85, 0.04,
     "Dmitriev, Gurzadyan & Nikogosyan, Handbook of Nonlinear Optical Crystals (1999); 1064 nm"},
    // KTiOPO4 (hydrothermal), point group mm2, two-fold axis c along Z. Handbook (1999):
    // d31 = 1.95, d32 = 3.9, d33 = 15.3 pm/V (as tabulated by a public crystal table citing it).
    {"KTP", TensorForm::Mm2PolarZ, 0.0, 1.95, 3.9, 15.3,
     "Dmitriev, Gurzadyan & Nikogosyan, Handbook of Nonlinear Optical Crystals (1999); 1064 nm"},
}};

const char* formula_text(TensorForm form, PrincipalPlane plane, int b_waves) {
    const bool one = b_waves == 1;
    switch (form) {
        case TensorForm::Trigonal3m:
            return one ? "d31 sinθ − d22 cosθ sin3φ" : "d22 cos²θ cos3φ";
        case TensorForm::Mm2PolarZ:
            switch (plane) {
                case PrincipalPlane::XY: return one ? "0 (XY plane)" : "d31 sin²φ + d32 cos²φ";
                case PrincipalPlane::YZ: return one ? "d31 sinθ" : "0 (YZ plane)";
                case PrincipalPlane::XZ: return one ? "d32 sinθ" : "0 (XZ plane)";
            }
            break;
        case TensorForm::Mm2PolarY:
            switch (plane) {
                case PrincipalPlane::XY: return one ? "d32 cosφ" : "0 (XY plane)";
                case PrincipalPlane::YZ: return one ? "d31 cosθ" : "0 (YZ plane)";
                case PrincipalPlane::XZ: return one ? "0 (XZ plane)" : "d31 cos²θ + d32 sin²θ";
            }
            break;
    }
    return "";
}

}  // namespace

const NonlinearCoefficients* nonlinear_coefficients(std::string_view family) {
    for (const NonlinearCoefficients& c : kCoefficients)
        if (c.family == family) return &c;
    return nullptr;
}

int b_wave_count(MixingType type) {
    const WavePolarities w = polarities(type);
    return (w.wave1 == Polarity::B) + (w.wave2 == Polarity::B) + (w.wave3 == Polarity::B);
}

double d_eff_closed_form_pm_v(const NonlinearCoefficients& c, PrincipalPlane plane, int b_waves,
                              double a, double phi) {
    const bool one = b_waves == 1;
    switch (c.form) {
        case TensorForm::Trigonal3m:
            return one ? c.d31_pm_v * std::sin(a) - c.d22_pm_v * std::cos(a) * std::sin(3 * phi)
                       : c.d22_pm_v * std::cos(a) * std::cos(a) * std::cos(3 * phi);
        case TensorForm::Mm2PolarZ:
            switch (plane) {
                case PrincipalPlane::XY:
                    return one ? 0.0
                               : c.d31_pm_v * std::sin(a) * std::sin(a) +
                                     c.d32_pm_v * std::cos(a) * std::cos(a);
                case PrincipalPlane::YZ: return one ? c.d31_pm_v * std::sin(a) : 0.0;
                case PrincipalPlane::XZ: return one ? c.d32_pm_v * std::sin(a) : 0.0;
            }
            break;
        case TensorForm::Mm2PolarY:
            switch (plane) {
                case PrincipalPlane::XY: return one ? c.d32_pm_v * std::cos(a) : 0.0;
                case PrincipalPlane::YZ: return one ? c.d31_pm_v * std::cos(a) : 0.0;
                case PrincipalPlane::XZ:
                    return one ? 0.0
                               : c.d31_pm_v * std::cos(a) * std::cos(a) +
                                     c.d32_pm_v * std::sin(a) * std::sin(a);
            }
            break;
    }
    return 0.0;
}

std::optional<EffectiveNonlinearity> effective_nonlinearity(const Material& crystal, MixingType type,
                                                            double angle_rad, PrincipalPlane plane) {
    const NonlinearCoefficients* c = nonlinear_coefficients(crystal.family);
    if (!c) return std::nullopt;
    const int b = b_wave_count(type);
    EffectiveNonlinearity e;
    e.source = c->source;
    e.formula = formula_text(c->form, plane, b);
    if (c->form == TensorForm::Trigonal3m) {
        // The azimuth of the cut: one B wave, sin 3φ = ∓1 adds the two terms' magnitudes
        // (φ = 90°, the usual type-I cut; the coefficients' relative sign then decides only
        // whether φ = 90° or 30°, with the same |d_eff|); two B waves, cos 3φ = 1 (φ = 0°).
        const double phi_deg = b == 1 ? 90.0 : 0.0;
        e.azimuth_deg = phi_deg;
        e.d_eff_pm_v = b == 1 ? std::abs(c->d31_pm_v) * std::sin(angle_rad) +
                                    std::abs(c->d22_pm_v) * std::cos(angle_rad)
                              : std::abs(d_eff_closed_form_pm_v(*c, plane, b, angle_rad, 0.0));
        return e;
    }
    e.d_eff_pm_v = std::abs(d_eff_closed_form_pm_v(*c, plane, b, angle_rad));
    return e;
}

}  // namespace rv
