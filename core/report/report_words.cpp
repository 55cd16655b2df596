#include "report/report_words.hpp"

#include "findings/finding.hpp"
#include "materials/thermo_optic.hpp"
#include "report/verdict_words.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

// Every number by the shared rule (units/number_text.hpp): no "-0", "n/a" for NaN.
std::string fmt(const char* format, double a) { return format_number(format, a); }

}  // namespace

std::string needed_polarization_text(const PolarizationAdvice& a) {
    return std::string(a.needs_a ? "o" : "e") +
           (a.needs_horizontal ? " (horizontal)" : " (vertical)");
}

std::string polarization_advice_text(const PolarizationAdvice& a) {
    const std::string needs = needed_polarization_text(a);
    switch (a.advice) {
        case PolarizationAdvice::Advice::None:
            return "";
        case PolarizationAdvice::Advice::AddHalfWavePlate:
            return "add a half-wave plate" +
                   (a.after_polarizer ? " after " + *a.after_polarizer : std::string()) +
                   ": only " + fmt("%.0f", 100 * a.useful_fraction) + " % of " + a.beam + " is " +
                   needs;
        case PolarizationAdvice::Advice::TurnPlate:
            return "turn " + a.plate.value_or("") + "'s fast axis from " +
                   fmt("%.1f", a.plate_now_deg.value_or(0)) + "° to " +
                   fmt("%.1f", a.plate_best_deg.value_or(0)) +
                   "°: " + fmt("%.0f", 100 * a.useful_fraction) + " % → " +
                   fmt("%.0f", 100 * a.useful_fraction_best.value_or(0)) + " % of " + a.beam +
                   " in " + needs;
    }
    return "";
}

std::string invisible_light_text(const InvisibleLight& light) {
    const char* band = light.band == InvisibleLight::Band::Ultraviolet    ? "ultraviolet"
                       : light.band == InvisibleLight::Band::NearInfrared ? "near infrared, reaches the retina"
                                                                          : "infrared";
    // A beam's wavelength is the file's (whole nm in practice); a generated one has a decimal.
    return light.process ? fmt("%.1f nm", light.wavelength_nm) + " (" + process_beams_text(*light.process) + "): " + band
                         : fmt("%.0f nm", light.wavelength_nm) + " (" + light.beam + "): " + band;
}

std::string after_target_text(const ReportBeam& b) {
    if (!b.absorbed_in.empty()) return "absorbed in dump " + b.absorbed_in;
    if (b.end_after_target) return finding_text(*b.end_after_target);
    return "stops after the target";
}

const char* verdict_state_text(const VerdictLine& l) {
    if (!l.applies) return "n/a";
    return l.met ? "met" : "NOT MET";
}

std::string verdict_line_text(const VerdictLine& l) {
    return std::string(verdict_state_text(l)) + (l.applies ? "  " : " — ") + verdict_reading_text(l.reading);
}

std::string temperature_tuning_text(const TemperatureTuning& t) {
    std::string s = "at " + format_number("%.1f", t.now_c) + " °C; ";
    s += t.phase_matching_c ? "Δk = 0 at " + format_number("%.1f", *t.phase_matching_c) + " °C at this angle"
                            : "no temperature from " + format_number("%.0f", kMinCrystalTemperature_c) + " to " +
                                  format_number("%.0f", kMaxCrystalTemperature_c) + " °C phase-matches at this angle";
    if (t.acceptance_fwhm_c) s += "; acceptance " + format_number("%.2f", *t.acceptance_fwhm_c) + " °C (FWHM)";
    return s;
}

std::string gvm_pair_text(const PhaseMatchingReport& p, const GroupVelocityMismatch& g) {
    const WavePolarities w = polarities(p.mixing);
    const bool parts_of_one_beam = !p.sum_frequency && w.wave1 != w.wave2;
    auto wave = [&](int k, Polarity polarity) {
        if (k == 3) return std::string(p.sum_frequency ? "SFG" : "SHG");
        const std::string& id = k == 1 || !p.sum_frequency ? p.beams.first_beam : p.beams.second_beam;
        return parts_of_one_beam ? id + (polarity == Polarity::A ? " (o)" : " (e)") : id;
    };
    return wave(g.first_wave, g.first_polarity) + "–" + wave(g.second_wave, g.second_polarity);
}

}  // namespace rv
