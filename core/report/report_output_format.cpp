#include "report/report_output_format.hpp"

#include "units/number_text.hpp"

namespace rv {

namespace {

using nlohmann::json;

json optional_number(const std::optional<double>& v) { return v ? json(*v) : json(nullptr); }
std::string fmt(const char* format, double v) { return format_number(format, v); }

// An energy in the unit that reads best: nJ below 1 µJ, else µJ.
std::string energy_text(double nj) { return nj < 1e3 ? fmt("%.3g", nj) + " nJ" : fmt("%.3g", nj * 1e-3) + " µJ"; }

std::string threshold_text(const DamageThresholdReport& d) {
    std::string s;
    if (d.fluence_j_cm2) s += fmt("%.3g", *d.fluence_j_cm2) + " J/cm²";
    if (d.intensity_gw_cm2) s += (s.empty() ? "" : ", ") + fmt("%.3g", *d.intensity_gw_cm2) + " GW/cm²";
    return s;
}

}  // namespace

const char* pulse_regime_name(PulseRegime regime) {
    switch (regime) {
        case PulseRegime::Femtosecond: return "femtosecond";
        case PulseRegime::Picosecond: return "picosecond";
        case PulseRegime::Nanosecond: return "nanosecond";
    }
    return "";
}

std::vector<std::pair<std::string, std::string>> generated_light_assumptions(const GeneratedLightReport& g) {
    std::vector<std::pair<std::string, std::string>> a = {
        {"undepleted-pump", "the inputs are not depleted by the conversion"},
        {"no-absorption", "no absorption in the crystal"},
        {"gaussian-space-time", "Gaussian beams (TEM00 formula with the traced radii) and Gaussian pulses"},
        {"pulses-at-target", "each pulse at its length at the crystal (the source's, lengthened by its arm's GDD), mixed as intensity envelopes (the chirp's phase ignored)"},
        {"focus-at-centre", "focus at the crystal's centre, equal confocal parameters (their mean)"},
    };
    if (g.beyond_undepleted)
        a.emplace_back("beyond-undepleted", "above 10 % conversion the undepleted-pump figure overestimates");
    return a;
}

void to_json(json& j, const GeneratedLightReport& g) {
    json assumptions = json::array();
    for (const auto& [code, words] : generated_light_assumptions(g)) assumptions.push_back(code);
    j = {{"output_nm", g.output_nm},
         {"d_eff_pm_v", g.d_eff_pm_v},
         {"azimuth_deg", optional_number(g.azimuth_deg)},
         {"d_eff_formula", g.d_eff_formula},
         {"coefficients_source", g.coefficients_source},
         {"input_mw", {g.input1_mw, g.input2_mw}},
         {"pulse_fwhm_fs", {g.pulse1_fwhm_fs, g.pulse2_fwhm_fs}},
         {"repetition_rate_khz", g.repetition_rate_khz},
         {"spatial_overlap", g.spatial_overlap},
         {"xi", g.xi},
         {"walkoff_parameter", g.walkoff_parameter},
         {"h_now", g.h_now},
         {"h_best", g.h_best},
         {"pulse_factor_now", g.pulse_factor_now},
         {"pulse_factor_best", g.pulse_factor_best},
         {"now", {{"average_mw", g.average_mw_now}, {"energy_nj", g.energy_nj_now}, {"efficiency", g.efficiency_now}}},
         {"best", {{"average_mw", g.average_mw_best}, {"energy_nj", g.energy_nj_best}, {"efficiency", g.efficiency_best}}},
         {"beyond_undepleted", g.beyond_undepleted},
         {"depleted_average_mw", optional_number(g.average_mw_depleted)},
         {"assumptions", assumptions}};
}

void to_json(json& j, const BIntegralReport& b) {
    j = {{"beam", b.beam},
         {"element", b.element},
         {"material", b.material},
         {"in_crystal", b.in_crystal},
         {"length_mm", b.length_mm},
         {"peak_intensity_w_cm2", b.peak_intensity_w_cm2},
         {"n2_cm2_per_w", b.n2_cm2_per_w},
         {"n2_source", b.n2_source},
         {"b_rad", b.b_rad}};
}

void to_json(json& j, const DamageThresholdReport& d) {
    j = {{"beam", d.beam},
         {"element", d.element},
         {"material", d.material.empty() ? json(nullptr) : json(d.material)},
         {"fluence_j_cm2", optional_number(d.fluence_j_cm2)},
         {"intensity_gw_cm2", optional_number(d.intensity_gw_cm2)},
         {"typical", d.typical}};
    if (d.typical) {
        j["regime"] = pulse_regime_name(d.regime);
        j["reference_pulse_fs"] = d.reference_pulse_fs;
        j["reference_wavelength_nm"] = d.reference_wavelength_nm;
        j["scaled"] = d.scaled;
        j["source"] = d.source;
    } else {
        j["regime"] = nullptr;
        j["reference_pulse_fs"] = nullptr;
        j["reference_wavelength_nm"] = nullptr;
        j["scaled"] = nullptr;
        j["source"] = nullptr;
    }
}

void write_generated_light_text(const RendezvousReport& r, std::ostream& out) {
    if (!r.generated) return;
    const GeneratedLightReport& g = *r.generated;
    out << "\nGenerated light at " << fmt("%.1f", g.output_nm) << " nm (estimate)\n"
        << "  now:  " << fmt("%.3g", g.average_mw_now) << " mW, " << energy_text(g.energy_nj_now) << " per pulse, "
        << fmt("%.3g", 100 * g.efficiency_now) << " % of the inputs\n"
        << "  best: " << fmt("%.3g", g.average_mw_best) << " mW, " << energy_text(g.energy_nj_best)
        << " per pulse, " << fmt("%.3g", 100 * g.efficiency_best) << " % (crystal angle peaked, zero delay)\n";
    if (g.beyond_undepleted && g.average_mw_depleted)
        out << "  with pump depletion (plane-wave tanh² law): about " << fmt("%.3g", *g.average_mw_depleted)
            << " mW\n";
    out
        << "  d_eff " << fmt("%.3f", g.d_eff_pm_v) << " pm/V = " << g.d_eff_formula;
    if (g.azimuth_deg) out << " at φ = " << fmt("%.0f", *g.azimuth_deg) << "° (the cut assumed)";
    out << " (" << g.coefficients_source << ")\n"
        << "  input " << fmt("%.1f", g.input1_mw)
        << (g.one_field ? std::string() : " + " + fmt("%.1f", g.input2_mw)) << " mW in the needed polarization"
        << (g.one_field ? "" : "s") << "; ξ = " << fmt("%.3f", g.xi) << ", B = " << fmt("%.2f", g.walkoff_parameter)
        << ", h now " << fmt("%.3f", g.h_now) << " (best " << fmt("%.3f", g.h_best) << "); spatial overlap "
        << fmt("%.3f", g.spatial_overlap) << "; pulse factor now " << fmt("%.3f", g.pulse_factor_now) << " (best "
        << fmt("%.3f", g.pulse_factor_best) << ")\n"
        << "  assumes:";
    const auto assumptions = generated_light_assumptions(g);
    for (size_t k = 0; k < assumptions.size(); ++k) out << (k ? "; " : " ") << assumptions[k].second;
    out << "\n";
}

void write_nonlinear_safety_text(const RendezvousReport& r, std::ostream& out) {
    for (const BIntegralReport& b : r.b_integral)
        out << "  B-integral, " << b.beam << " in " << b.element << " (" << b.material << ", "
            << fmt("%.2f", b.length_mm) << " mm, peak " << fmt("%.3g", b.peak_intensity_w_cm2 * 1e-9)
            << " GW/cm²): " << fmt("%.2g", b.b_rad) << " rad (n₂ " << fmt("%.3g", b.n2_cm2_per_w * 1e16) << "e-16 cm²/W, "
            << b.n2_source << ")\n";
    for (const DamageThresholdReport& d : r.damage_thresholds) {
        out << "  damage threshold for " << d.beam << " in " << d.element << ": " << threshold_text(d);
        if (d.typical)
            out << " — typical " << pulse_regime_name(d.regime) << " figure for " << d.material << " ("
                << fmt("%.3g", d.reference_pulse_fs) << " fs, " << fmt("%.0f", d.reference_wavelength_nm) << " nm"
                << (d.scaled ? ", scaled by √τ" : "") << "; " << d.source << "), not the maker's: give yours in the file";
        else
            out << " (from the file)";
        out << "\n";
    }
}

void write_generated_light_markdown(const RendezvousReport& r, std::ostream& out) {
    if (!r.generated) return;
    const GeneratedLightReport& g = *r.generated;
    out << "\nGenerated light (" << fmt("%.1f", g.output_nm) << " nm, estimate): now " << fmt("%.3g", g.average_mw_now)
        << " mW (" << energy_text(g.energy_nj_now) << " per pulse), best " << fmt("%.3g", g.average_mw_best)
        << " mW; d_eff " << fmt("%.3f", g.d_eff_pm_v) << " pm/V. Assumes:";
    const auto assumptions = generated_light_assumptions(g);
    for (size_t k = 0; k < assumptions.size(); ++k) out << (k ? "; " : " ") << assumptions[k].second;
    out << ".\n";
}

}  // namespace rv
