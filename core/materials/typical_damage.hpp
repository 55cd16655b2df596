#pragma once
// Typical published laser-damage thresholds of the bundled crystals and glasses, used for the
// report's damage finding when a layout gives no threshold of its own (the maker's figure for
// the actual part is always better: coatings, polish and inclusions dominate real thresholds).
//
// Two regimes are bundled per material: a sub-picosecond figure (fluence, nearly independent of
// the pulse length there) and a nanosecond figure at 10 ns, 1064 nm. Between them the trade's
// scaling rule is applied to the nanosecond figure: fluence ∝ √τ (equivalently intensity ∝
// 1/√τ), valid from about 10 ps to 100 ns (B. C. Stuart et al., Phys. Rev. Lett. 74, 2248
// (1995), who also show it fails below ~10 ps); the result is never taken below the
// sub-picosecond figure. Pulse regimes: femtosecond < 1 ps ≤ picosecond < 1 ns ≤ nanosecond.
// These are estimates for comparison only — never an exposure limit.

#include <optional>
#include <string_view>

namespace rv {

enum class PulseRegime { Femtosecond, Picosecond, Nanosecond };
PulseRegime pulse_regime(double pulse_fwhm_fs);

struct TypicalDamage {
    PulseRegime regime = PulseRegime::Femtosecond;
    // The figure that applies at the pulse length asked for: a fluence, or (for materials whose
    // nanosecond figure is published as an intensity) an intensity.
    std::optional<double> fluence_j_cm2, intensity_gw_cm2;
    double reference_pulse_fs = 0;     // the pulse length of the published figure used
    double reference_wavelength_nm = 0;
    bool scaled = false;               // scaled by √τ from the nanosecond figure
    std::string_view source;
};

// The typical threshold of a material family for pulses of the given length, or nullopt when
// none is bundled.
std::optional<TypicalDamage> typical_damage(std::string_view family, double pulse_fwhm_fs);

}  // namespace rv
