// Safety figures of the report: the peak intensity and fluence against the damage threshold
// the file gives for its target (the maker's figure; analysis/pulse_intensity.hpp for the
// formulas), and which wavelengths are invisible. Never an exposure limit.
#include <cmath>

#include "analysis/report_sections.hpp"
#include "units/constants.hpp"
#include "units/number_text.hpp"

namespace rv::report_sections {

namespace {

// Outside 400–700 nm the eye does not see the beam; 700–1400 nm still reaches the retina
// (IEC 60825-1's retinal hazard region, common practice).
std::string invisible_kind(double nm) {
    if (nm < 400) return "ultraviolet";
    if (nm > 1400) return "infrared";
    if (nm > 700) return "near infrared, reaches the retina";
    return "";
}

}  // namespace

std::vector<Finding> damage_findings(const Layout& layout, const ReportBeam& b,
                                     const TargetElement& target) {
    std::vector<Finding> found;
    // The file's threshold, else a typical published one (analysis/report_output.cpp).
    const std::optional<DamageThresholdReport> damage = damage_threshold_for(layout, b, target);
    if (!damage || !b.pulse_at_target) return found;
    // At the target plane, and at the waist when the waist lies inside the crystal.
    PulseFigures worst = *b.pulse_at_target;
    const double offset_mm =
        std::abs(b.at_target.tangential.waist_offset_mm + b.at_target.sagittal.waist_offset_mm) / 2;
    if (b.pulse_at_waist && target.crystal && offset_mm <= target.crystal->length_mm / 2)
        worst = *b.pulse_at_waist;
    if (const std::optional<double> threshold_gw_cm2 = damage->intensity_gw_cm2;
        threshold_gw_cm2 && worst.peak_intensity_w_cm2 > gw_to_w(*threshold_gw_cm2)) {
        Finding f{Finding::Kind::DamageIntensity, layout.target};
        f.amount = worst.peak_intensity_w_cm2;
        f.limit = gw_to_w(*threshold_gw_cm2);
        f.typical_threshold = damage->typical;
        f.material = damage->typical ? damage->material : "";
        found.push_back(f);
    }
    if (damage->fluence_j_cm2 && worst.peak_fluence_j_cm2 > *damage->fluence_j_cm2) {
        Finding f{Finding::Kind::DamageFluence, layout.target};
        f.amount = worst.peak_fluence_j_cm2;
        f.limit = *damage->fluence_j_cm2;
        f.typical_threshold = damage->typical;
        f.material = damage->typical ? damage->material : "";
        found.push_back(f);
    }
    return found;
}

std::vector<std::string> invisible_beams(const std::vector<ReportBeam>& beams) {
    std::vector<std::string> out;
    for (const ReportBeam& b : beams)
        if (const std::string kind = invisible_kind(b.wavelength_nm); !kind.empty())
            out.push_back(format_number("%.0f nm", b.wavelength_nm) + " (" + b.id + "): " + kind);
    return out;
}

std::vector<std::string> invisible_outputs(const std::vector<PhaseMatchingReport>& processes) {
    std::vector<std::string> out;
    for (const PhaseMatchingReport& p : processes)
        if (const std::string kind = invisible_kind(p.output_nm); !kind.empty())
            out.push_back(format_number("%.1f nm", p.output_nm) + " (" + p.process + "): " + kind);
    return out;
}

}  // namespace rv::report_sections
