#pragma once
// The report's parts on what the crystal gives and what the light does to the optics (issue 16
// §3, §5): the generated light, the B-integral of each beam, and the damage threshold the
// damage finding is judged against. Computed in analysis/report_output.cpp; the definitions
// are in docs/user-guide.md (The report, "Generated light", "B-integral", "Damage threshold").
// Numbers and states only; the words (the assumptions printed beside the power among them) are
// the formatters'.

#include <optional>
#include <string>

#include "materials/typical_damage.hpp"

namespace rv {

// The light the crystal's process (the report's first phase-matching entry) generates, in the
// undepleted-pump limit for focused Gaussian beams and Gaussian pulses
// (nonlinear/generated_power.hpp). "now": the crystal and the delay as they are; "best": the
// crystal angle at the focused optimum (σ_m) and zero delay, the beams as they are.
struct GeneratedLightReport {
    double output_nm = 0;
    double d_eff_pm_v = 0;
    std::optional<double> azimuth_deg;  // a uniaxial crystal's cut azimuth φ taken (largest |d_eff|)
    std::string d_eff_formula;          // the closed form used ("d31 sinθ − d22 cosθ sin3φ")
    std::string coefficients_source;    // of the d coefficients
    // The inputs at the target in the polarizations the process needs (SHG type I: both the
    // same beam; type II: its o and e parts), average powers, and the pulses used.
    double input1_mw = 0, input2_mw = 0;
    bool one_field = false;  // the SHG of one field (type I): input2 is input1
    double pulse1_fwhm_fs = 0, pulse2_fwhm_fs = 0;
    double repetition_rate_khz = 0;  // the lower of the two beams' (pulses meet at it)
    double spatial_overlap = 1;      // the report's overlap along the crystal (1 for SHG)
    double xi = 0;                   // L / mean confocal parameter
    double walkoff_parameter = 0;    // B of the process's walk-off, in h
    double h_now = 0, h_best = 0;    // Boyd–Kleinman h at σ now and at its optimum σ_m
    double pulse_factor_now = 0;     // G: delay and GVM now (1: coincident pulses, no walk)
    double pulse_factor_best = 0;    // G at zero delay
    double average_mw_now = 0, energy_nj_now = 0, efficiency_now = 0;
    double average_mw_best = 0, energy_nj_best = 0, efficiency_best = 0;
    // efficiency_best above 10 %: the undepleted-pump figure overestimates (pump depletion).
    bool beyond_undepleted = false;
    // SHG of one field: the best figure with pump depletion by the plane-wave law
    // η = tanh²(√η0) (Boyd, Nonlinear Optics, 3rd ed., §2.7; Armstrong et al., Phys. Rev. 127,
    // 1918 (1962)), η0 the undepleted efficiency; a rough guide only for focused pulses.
    std::optional<double> average_mw_depleted;
};

// The B-integral of one beam through one medium: the target crystal, or the thickest glass on
// the beam's path before it (nonlinear/b_integral.hpp). Self-phase only (each beam alone).
struct BIntegralReport {
    std::string beam, element, material;
    bool in_crystal = false;          // the target crystal (else the thickest glass)
    double length_mm = 0;             // the path inside
    double peak_intensity_w_cm2 = 0;  // on axis, the largest along the path inside
    double n2_cm2_per_w = 0;
    std::string n2_source;
    double b_rad = 0;
};

// The damage threshold the damage finding of a beam at the target uses: the file's, or, when it
// gives none, a typical published figure for the crystal's material at the beam's pulse length.
struct DamageThresholdReport {
    std::string beam, element, material;
    std::optional<double> fluence_j_cm2, intensity_gw_cm2;
    bool typical = false;  // the typical figure (the file gives none)
    // With typical: the regime of the beam's pulse, the published figure's pulse and
    // wavelength, whether it was scaled by √τ, and its source.
    PulseRegime regime = PulseRegime::Femtosecond;
    double reference_pulse_fs = 0, reference_wavelength_nm = 0;
    bool scaled = false;
    std::string source;
};

}  // namespace rv
