// build_report: the sections of the report (analysis/report_sections.hpp, one file each) in the
// order they depend on each other.
#include "analysis/report.hpp"

#include "analysis/report_materials.hpp"
#include "analysis/report_sections.hpp"
#include "layout/process_text.hpp"

namespace rv {

RendezvousReport build_report(const Layout& layout, const MaterialLibrary& library) {
    namespace s = report_sections;
    RendezvousReport r;
    r.layout_name = layout.name;
    r.target = layout.target;
    const s::TargetElement target = s::target_element(layout);
    r.target_is_crystal = target.crystal != nullptr;
    if (target.crystal) r.crystal_length_mm = target.crystal->length_mm;
    r.beams = s::trace_beams(layout, library, true);
    r.materials = materials_used(layout, library, r.beams);
    r.findings = s::report_findings(layout, r.beams, target);
    for (const ReportBeam& b : r.beams)
        if (b.at_target.reached)
            if (std::optional<DamageThresholdReport> d = s::damage_threshold_for(layout, b, target))
                r.damage_thresholds.push_back(std::move(*d));
    r.b_integral = s::b_integrals(layout, library, target, r.beams);
    for (Finding& f : s::b_integral_findings(r.b_integral)) r.findings.push_back(std::move(f));
    r.invisible = s::invisible_beams(r.beams);
    s::add_target_figures(layout, r);
    r.stage = s::stage_of(layout, library, r.beams);
    if (s::nonlinear_material(library, target)) {
        s::add_phase_matching(layout, library, target, r);
        for (InvisibleLight& light : s::invisible_outputs(r)) r.invisible.push_back(std::move(light));
        r.polarization = s::polarization_advice(layout, library, *target.crystal, r);
        r.focusing = s::focusing(*target.crystal, r);
        r.generated = s::generated_light(layout, library, target, r);
    }
    r.verdict = s::verdict(layout, library, target, r);
    return r;
}

std::string process_key(const Layout& layout, const PhaseMatchingReport& p) {
    // A computed process is never Auto, so the text always exists.
    return *format_process_text(
        p.sum_frequency ? Crystal::Process::SumFrequency : Crystal::Process::SecondHarmonic,
        layout.beams[p.first_beam].id);
}

bool verdict_passes(const VerdictLine& l) {
    return !l.applies || l.met;
}

}  // namespace rv
