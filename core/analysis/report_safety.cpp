// Safety figures of the report: the peak intensity and fluence against the damage threshold
// the file gives for its target (the maker's figure; analysis/pulse_intensity.hpp for the
// formulas), and which wavelengths are invisible. Never an exposure limit.
#include <cmath>
#include <optional>

#include "analysis/report_sections.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

namespace {

// The band of a wavelength the eye does not see (InvisibleLight), none inside 400–700 nm.
std::optional<InvisibleLight::Band> invisible_band(double nm) {
    if (nm < 400) return InvisibleLight::Band::Ultraviolet;
    if (nm > 1400) return InvisibleLight::Band::Infrared;
    if (nm > 700) return InvisibleLight::Band::NearInfrared;
    return std::nullopt;
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

std::vector<InvisibleLight> invisible_beams(const std::vector<ReportBeam>& beams) {
    std::vector<InvisibleLight> out;
    for (const ReportBeam& b : beams)
        if (const auto band = invisible_band(b.wavelength_nm))
            out.push_back({*band, b.wavelength_nm, b.id, std::nullopt});
    return out;
}

std::vector<InvisibleLight> invisible_outputs(const RendezvousReport& r) {
    std::vector<InvisibleLight> out;
    for (const PhaseMatchingReport& p : r.phase_matching)
        if (const auto band = invisible_band(p.output_nm))
            out.push_back({*band, p.output_nm, std::string(), p.beams});
    return out;
}

}  // namespace rv::report_sections
