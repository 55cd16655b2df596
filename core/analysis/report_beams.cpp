// The report's beams: each arriving wave traced (trace/trace.hpp), propagated in both planes
// (trace/propagate.hpp) and described at the target (analysis/target_summary.hpp); with the
// power trace, its power, polarization and pulse figures there (analysis/power_budget.hpp,
// pulse_intensity.hpp).
#include "analysis/crystal_waves.hpp"
#include "analysis/report_sections.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

TargetElement target_element(const Layout& layout) {
    TargetElement t;
    t.element = layout.find(layout.target);
    t.crystal = t.element ? std::get_if<Crystal>(&t.element->kind) : nullptr;
    return t;
}

bool both_reach(const std::vector<ReportBeam>& beams) {
    return beams.size() >= 2 && beams[0].at_target.reached && beams[1].at_target.reached;
}

std::vector<ReportBeam> trace_beams(const Layout& layout, const MaterialLibrary& library,
                                    bool with_power) {
    PropagationOptions options;
    options.sample_envelope = with_power;
    std::vector<ReportBeam> beams;
    for (const Path& p : trace_arriving_waves(layout, library)) {
        ReportBeam b;
        const BeamSource& src = layout.beams[p.beam];
        b.id = src.id;
        b.wavelength_nm = src.wavelength_nm;
        b.path = p;
        b.element_ids.reserve(p.hits.size());
        for (const TraceHit& h : p.hits) b.element_ids.push_back(layout.elements[h.element].id);
        b.source_power_mw = src.power_mw;
        b.caustic = propagate_path(layout, p, options);
        b.at_target = beam_at_target(layout, p, b.caustic);
        b.confocal_tangential_mm = 2 * b.at_target.tangential.rayleigh_mm;
        b.confocal_sagittal_mm = 2 * b.at_target.sagittal.rayleigh_mm;
        if (p.target_hit) b.crossing_angle_deg = rad_to_deg(p.hits[*p.target_hit].aoi_rad());
        // Where the light goes after the target.
        if (!p.hits.empty() && p.hits.back().interaction == Interaction::Absorb)
            b.absorbed_in = layout.elements[p.hits.back().element].id;
        // What ended the trace past the target: its last finding there, if any (the trace stops
        // at the first finding that ends a ray).
        if (p.target_hit)
            for (const Finding& f : p.findings)
                if (f.kind != Finding::Kind::MaterialOutOfRange &&
                    f.kind != Finding::Kind::NoTarget && f.kind != Finding::Kind::MissedOptic)
                    b.end_after_target = f;
        if (with_power) {
            b.power = trace_power(layout, library, p, b.caustic);
            b.at_target_polarization = describe(b.power.at_target);
            if (src.power_mw && b.power.reached) {
                b.target_power_mw = *src.power_mw * b.power.at_target[0];
                if (src.repetition_rate_khz && b.at_target.pulse.fwhm_fs) {
                    PulseInputs at{.power_mw = *b.target_power_mw,
                                   .repetition_rate_khz = *src.repetition_rate_khz,
                                   .fwhm_fs = *b.at_target.pulse.fwhm_fs,  // the length at the target
                                   .radius_tangential_um = b.at_target.tangential.radius_um,
                                   .radius_sagittal_um = b.at_target.sagittal.radius_um};
                    b.pulse_at_target = pulse_figures(at);
                    at.radius_tangential_um = b.at_target.tangential.waist_um;
                    at.radius_sagittal_um = b.at_target.sagittal.waist_um;
                    b.pulse_at_waist = pulse_figures(at);
                }
            }
        }
        beams.push_back(std::move(b));
    }
    return beams;
}

}  // namespace rv::report_sections
