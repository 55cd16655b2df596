#include "analysis/phase_setting.hpp"

#include <cmath>
#include <stdexcept>

#include "layout/process_text.hpp"
#include "report/verdict_words.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

double round_to_thousandth(double x) { return std::round(x * 1e3) / 1e3; }
double round_to_hundredth(double x) { return std::round(x * 1e2) / 1e2; }

// The oven's way: the crystal's temperature set where the process phase-matches at the angle
// now, the crystal's set taken there in the library, judged by the report again.
void set_oven(PhaseSetting& s, Crystal& crystal, const MaterialLibrary& library, const PhaseMatchingReport& p) {
    s.by_temperature = true;
    s.temperature_before_c = crystal.temperature_c;
    s.process = p.beams;
    s.rotation = p.rotation;
    s.sinc2_before = p.sinc2_now;
    s.theta_pm_deg = p.theta_pm_deg;
    crystal.temperature_c = round_to_hundredth(*p.temperature->phase_matching_c);
    s.temperature_after_c = crystal.temperature_c;
    const RendezvousReport after = build_report(s.layout, library.with_temperature(crystal.material, *crystal.temperature_c));
    s.sinc2_after = after.phase_matching.empty() ? 0 : after.phase_matching.front().sinc2_now;
    s.theta_after_deg = after.phase_matching.empty() ? 0 : after.phase_matching.front().theta_now_deg;
}

}  // namespace

PhaseSetting set_crystal_for_process(const Layout& layout, const MaterialLibrary& library,
                                     const std::string& process_key) {
    PhaseSetting s;
    s.layout = layout;
    Element* target = nullptr;
    for (Element& e : s.layout.elements)
        if (e.id == layout.target) target = &e;
    Crystal* crystal = target ? std::get_if<Crystal>(&target->kind) : nullptr;
    if (!crystal) throw std::invalid_argument("the target \"" + layout.target + "\" is not a crystal");
    s.crystal = target->id;
    const std::optional<ProcessChoice> choice = parse_process_text(process_key);
    if (!choice)
        throw std::invalid_argument("unknown process \"" + process_key + "\": expected sfg or shg:BEAM");
    if (choice->process == Crystal::Process::SumFrequency && layout.beams.size() < 2)
        throw std::invalid_argument("sfg needs two beams; the layout has one");
    if (choice->process == Crystal::Process::SecondHarmonic) {
        bool known = false;
        for (const BeamSource& b : layout.beams) known = known || b.id == choice->beam;
        if (!known)
            throw std::invalid_argument("no beam has id \"" + choice->beam + "\" (expected shg:BEAM with a beam's id)");
    }
    crystal->process = choice->process;
    crystal->process_beam = choice->process == Crystal::Process::SecondHarmonic
                                ? std::optional<std::string>(choice->beam)
                                : std::nullopt;
    s.normal_before_deg = target->normal_deg;
    s.tilt_before_deg = crystal->tilt_deg;
    // Turn or tilt to the process's angle, judged by the report; a second pass takes up what the
    // turn changed in the trace (the refraction in the table plane) and the rounding.
    bool first = true;
    for (int pass = 0; pass < 3; ++pass) {
        const RendezvousReport r = build_report(s.layout, library);
        if (r.chosen_process_missing) throw std::invalid_argument("the process's beams do not reach the crystal");
        if (r.phase_matching.empty()) throw std::invalid_argument("the crystal's material is isotropic or the beams miss it");
        const PhaseMatchingReport& p = r.phase_matching.front();
        if (p.outside_index_data) throw std::invalid_argument(index_gap_text(*p.outside_index_data));
        if (first && crystal->temperature_c && p.temperature && p.temperature->phase_matching_c) {
            set_oven(s, *crystal, library, p);
            break;
        }
        if (!p.phase_matchable) throw std::invalid_argument(std::string("no ") + mixing_type_label(p.mixing) + " phase matching in this crystal");
        if (first) {
            s.process = p.beams;
            s.rotation = p.rotation;
            s.sinc2_before = p.sinc2_now;
            s.theta_pm_deg = p.theta_pm_deg;
            first = false;
        }
        s.sinc2_after = p.sinc2_now;
        s.theta_after_deg = p.theta_now_deg;
        if (p.sinc2_now >= 0.9999) break;
        if (!p.rotation_found)
            throw std::invalid_argument("no " + std::string(p.rotation == CrystalRotation::Turn ? "turn" : "tilt") +
                                        " within the mount's range reaches θ_pm " + format_number("%.3f", p.theta_pm_deg) +
                                        "°: use a crystal cut nearer it");
        if (p.rotation == CrystalRotation::Turn)
            target->normal_deg = round_to_thousandth(target->normal_deg - p.rotate_by_deg);
        else
            crystal->tilt_deg = round_to_thousandth(crystal->tilt_deg + p.rotate_by_deg);
        if (pass == 2) {
            const RendezvousReport last = build_report(s.layout, library);
            s.sinc2_after = last.phase_matching.front().sinc2_now;
            s.theta_after_deg = last.phase_matching.front().theta_now_deg;
        }
    }
    s.normal_after_deg = target->normal_deg;
    s.tilt_after_deg = crystal->tilt_deg;
    s.change_deg = s.rotation == CrystalRotation::Turn ? s.normal_before_deg - s.normal_after_deg
                                                       : s.tilt_after_deg - s.tilt_before_deg;
    return s;
}

}  // namespace rv
