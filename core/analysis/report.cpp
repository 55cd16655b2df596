// build_report: the sections of the report (analysis/report_sections.hpp, one file each) in the
// order they depend on each other; the words for the model's states (verdict lines,
// polarization advice, the light after the target).
#include "analysis/report.hpp"

#include "analysis/report_sections.hpp"
#include "layout/process_text.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

std::string fmt(const char* format, double a) {
    return format_number(format, a);
}

}  // namespace

RendezvousReport build_report(const Layout& layout, const MaterialLibrary& library) {
    namespace s = report_sections;
    RendezvousReport r;
    r.layout_name = layout.name;
    r.target = layout.target;
    const s::TargetElement target = s::target_element(layout);
    r.target_is_crystal = target.crystal != nullptr;
    if (target.crystal) r.crystal_length_mm = target.crystal->length_mm;
    r.beams = s::trace_beams(layout, library, true);
    r.findings = s::report_findings(layout, r.beams, target);
    r.invisible = s::invisible_beams(r.beams);
    s::add_target_figures(layout, r);
    r.stage = s::stage_of(layout, library, r.beams);
    if (s::nonlinear_material(library, target)) {
        s::add_phase_matching(layout, library, target, r);
        for (std::string& line : s::invisible_outputs(r.phase_matching))
            r.invisible.push_back(std::move(line));
        r.polarization = s::polarization_advice(layout, library, *target.crystal, r);
        r.focusing = s::focusing(*target.crystal, r);
    }
    r.verdict = s::verdict(layout, library, target, r);
    return r;
}

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

std::string after_target_text(const ReportBeam& b) {
    if (!b.absorbed_in.empty()) return "absorbed in dump " + b.absorbed_in;
    if (b.end_after_target) return finding_text(*b.end_after_target);
    return "stops after the target";
}

std::string process_key(const Layout& layout, const PhaseMatchingReport& p) {
    // A computed process is never Auto, so the text always exists.
    return *format_process_text(
        p.sum_frequency ? Crystal::Process::SumFrequency : Crystal::Process::SecondHarmonic,
        layout.beams[p.first_beam].id);
}

const char* verdict_state_text(const VerdictLine& l) {
    if (!l.applies) return "n/a";
    return l.met ? "met" : "NOT MET";
}

std::string verdict_line_text(const VerdictLine& l) {
    return std::string(verdict_state_text(l)) + (l.applies ? "  " : " — ") + l.summary;
}

bool verdict_passes(const VerdictLine& l) {
    return !l.applies || l.met;
}

}  // namespace rv
