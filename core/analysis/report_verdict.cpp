// The verdict: whether the two colours meet in space, in time and in phase at the target, the
// number behind each line and what to change. The limits are layout.goals.verdict
// (docs/user-guide.md, "Verdict"); whether a line is met is decided by analysis/verdict_rules.hpp
// (the tolerance run's test too); each action is chosen by comparing a figure with its limit.
#include <algorithm>
#include <cmath>

#include "analysis/report_sections.hpp"
#include "analysis/verdict_rules.hpp"
#include "materials/dispersion.hpp"
#include "units/constants.hpp"
#include "units/number_text.hpp"

namespace rv::report_sections {

namespace {

std::string fmt(const char* format, double a) {
    return format_number(format, a);
}

// A figure with its state: met within the limit, near within 1.5 × the limit (for a minimum,
// above limit/1.5), not met beyond.
void add_figure(Verdict& v, std::string name, double value, double limit, bool is_minimum,
                std::string definition) {
    VerdictFigure f{std::move(name), value, limit, is_minimum, std::move(definition)};
    using S = VerdictFigure::State;
    if (is_minimum)
        f.state = value >= limit ? S::Met : value >= limit / 1.5 ? S::Near : S::NotMet;
    else
        f.state = value <= limit ? S::Met : value <= 1.5 * limit ? S::Near : S::NotMet;
    v.figures.push_back(std::move(f));
}

// Each waist goal (goals.waist_um) a beam at the target misses, as the action's words.
std::vector<std::string> waist_goal_misses(const Layout& layout, const RendezvousReport& r) {
    const VerdictThresholds& t = layout.goals.verdict;
    std::vector<std::string> goal_misses;
    for (const auto& [id, goal] : layout.goals.waist_um)
        for (const ReportBeam& b : r.beams) {
            if (b.id != id || !b.at_target.reached) continue;
            const double w = mean_waist_um(b.at_target);
            if (!waist_goal_met(w, goal, t))
                goal_misses.push_back(id + " waist " + fmt("%.1f", w) + " µm, goal " +
                                      fmt("%.1f", goal) + " µm");
        }
    return goal_misses;
}

void space_line(const Layout& layout, const RendezvousReport& r, Verdict& v) {
    const VerdictThresholds& t = layout.goals.verdict;
    const std::vector<std::string> goal_misses = waist_goal_misses(layout, r);
    const bool both = both_reach(r.beams);
    if (both) {
        const Mismatch& mm = *r.mismatch;
        const ReportBeam& a = r.beams[0];
        const ReportBeam& b = r.beams[1];
        // The figures and their test: analysis/verdict_rules.hpp (the tolerance run's too).
        const SpaceFigures sf = space_figures(a.at_target, b.at_target, mm);
        const double frac = sf.waist_offset_rayleigh, ratio = sf.waist_ratio,
                     lateral = sf.lateral_radius;
        v.space.met = space_figures_met(sf, t) && goal_misses.empty();
        add_figure(v, "waist offset / z_R", frac, t.max_waist_offset_rayleigh, false,
                   "distance between the two waists along the beam, over the shorter Rayleigh "
                   "range at the target");
        add_figure(v, "waist ratio", ratio, t.max_waist_ratio, false,
                   "larger over smaller waist radius (mean of the planes)");
        add_figure(
            v, "lateral / radius", lateral, t.max_lateral_offset_radius, false,
            "distance between the chief-ray crossings of the target plane over sqrt(w1² + w2²) "
            "(0.23 keeps 90 % of the overlap)");
        v.space.summary = "waists " + fmt("%.3f", std::abs(mm.waist_offset_mm)) +
                          " mm apart = " + fmt("%.2f", frac) +
                          " of the shorter Rayleigh range; waist ratio " + fmt("%.3f", ratio) +
                          "; chief rays " + fmt("%.1f", mm.lateral_um) + " µm apart";
        std::vector<std::string> acts;
        if (frac > t.max_waist_offset_rayleigh)
            acts.push_back("bring the waists together: " + b.id + "'s lies " +
                           fmt("%.3f", std::abs(mm.waist_offset_mm)) + " mm " +
                           (mm.waist_offset_mm > 0 ? "downstream" : "upstream") + " of " + a.id +
                           "'s");
        if (ratio > t.max_waist_ratio)
            acts.push_back("match the waist sizes (ratio " + fmt("%.2f", ratio) + ")");
        if (lateral > t.max_lateral_offset_radius)
            acts.push_back("overlap the chief rays (" + fmt("%.1f", mm.lateral_um) + " µm apart)");
        for (const std::string& g : goal_misses) acts.push_back(g);
        for (size_t i = 0; i < acts.size(); ++i) v.space.action += (i ? "; " : "") + acts[i];
    } else if (!r.beams.empty() && r.beams[0].at_target.reached && r.beams.size() == 1) {
        const ReportBeam& a = r.beams[0];
        const double off =
            (a.at_target.tangential.waist_offset_mm + a.at_target.sagittal.waist_offset_mm) / 2;
        const double zr =
            std::min(a.at_target.tangential.rayleigh_mm, a.at_target.sagittal.rayleigh_mm);
        v.space.met = single_beam_offset_met(single_beam_offset_rayleigh(a.at_target), t) &&
                      goal_misses.empty();
        v.space.summary =
            "waist " + fmt("%.3f", std::abs(off)) + " mm " + (off > 0 ? "after" : "before") +
            " the target centre = " + fmt("%.2f", std::abs(off) / zr) + " of its Rayleigh range";
        if (!v.space.met) {
            v.space.action = std::abs(off) / zr > t.max_waist_offset_rayleigh
                                 ? "move the focus " + fmt("%.3f", std::abs(off)) + " mm " +
                                       (off > 0 ? "upstream" : "downstream")
                                 : "";
            for (const std::string& g : goal_misses)
                v.space.action += (v.space.action.empty() ? "" : "; ") + g;
        }
    } else {
        v.space.summary = "a beam does not reach the target";
        v.space.action = "fix the trace findings first";
    }
}

void time_line(const Layout& layout, const MaterialLibrary& library, const RendezvousReport& r,
               Verdict& v) {
    const VerdictThresholds& t = layout.goals.verdict;
    const bool both = both_reach(r.beams);
    if (both && r.overlap && r.overlap->temporal) {
        // The pulse lengths at the target (analysis/pulse_at_target.hpp), as the overlap's.
        const double t1 = r.beams[0].at_target.pulse.fwhm_fs.value(), t2 = r.beams[1].at_target.pulse.fwhm_fs.value();
        const double xcorr = cross_correlation_fwhm_fs(t1, t2);
        const double d = r.mismatch->delay_fs;
        v.time.met = delay_met(d, xcorr, t);
        add_figure(v, "delay / cross-correlation", std::abs(d) / xcorr, t.max_delay_xcorr, false,
                   "|arrival of beam 1 − beam 2| over sqrt(τ1² + τ2²), the FWHM of the two pulses' "
                   "cross-correlation");
        v.time.summary = "delay " + format_duration_fs(d, true) + " = " +
                         fmt("%.2f", std::abs(d) / xcorr) + " of the cross-correlation width (" +
                         format_duration_fs(xcorr) + ")";
        if (!v.time.met) {
            if (r.stage && r.stage->zero_in_travel)
                v.time.action = "move stage " + r.stage->id + " by " +
                                fmt("%+.3f", r.stage->move_mm) + " mm (to " +
                                fmt("%.3f", r.stage->zero_delay_mm) + " mm)";
            else {
                const size_t early = d > 0 ? 1 : 0;  // the beam that arrives first needs the path
                const double ng_air =
                    sample_index(*library.find("air"), r.beams[early].wavelength_nm).group_index;
                const double path_mm = std::abs(d) * kSpeedOfLight_mm_per_fs / ng_air;
                const std::string later = r.beams[early].id;
                v.time.action =
                    (r.stage ? "stage " + r.stage->id + " would need " +
                                   fmt("%.3f", r.stage->zero_delay_mm) + " mm, outside its travel; "
                             : std::string()) +
                    "add " + fmt("%.2f", path_mm) + " mm of air path to " + later;
            }
        }
    } else if (both) {
        v.time.met = false;
        v.time.summary = "not evaluated: give pulse_fwhm_fs for both beams";
    } else if (r.beams.size() == 1) {
        v.time.applies = false;
        v.time.summary = "one beam: no delay to match";
    } else {
        v.time.summary = "a beam does not reach the target";
    }
}

void phase_line(const Layout& layout, const TargetElement& target, const RendezvousReport& r,
                Verdict& v) {
    const VerdictThresholds& t = layout.goals.verdict;
    const Crystal* crystal = target.crystal;
    if (r.chosen_process_missing) {
        v.phase.met = false;
        v.phase.summary =
            std::string(crystal && crystal->process == Crystal::Process::SecondHarmonic
                            ? "SHG of " + crystal->process_beam.value_or("")
                            : "SFG") +
            " (the crystal's process): its beam" +
            (crystal && crystal->process == Crystal::Process::SecondHarmonic ? " does" : "s do") +
            " not reach the crystal";
        v.phase.action = "bring the beams to the crystal first (see the space line)";
    } else if (!r.phase_matching.empty()) {
        const PhaseMatchingReport& p = r.phase_matching.front();
        v.phase.met = phase_met(p.phase_matchable, p.sinc2_now, p.polarizations_suit, t);
        if (p.outside_index_data.empty())
            add_figure(
                v, "phase factor sinc²", p.sinc2_now, t.min_phase_factor, true,
                "sinc²(Δk·L/2) of the first process with the crystal as it is (1 = phase-matched)");
        if (!p.outside_index_data.empty()) {
            v.phase.summary = p.process + ": " + p.outside_index_data;
            v.phase.action = "choose a crystal that is transparent at these wavelengths";
        } else if (!p.phase_matchable) {
            v.phase.summary = p.process + ": no " + p.type + " phase matching in this crystal";
            v.phase.action = "choose another crystal or type";
        } else {
            v.phase.summary = p.process + " " + p.type + ": θ_pm " + fmt("%.2f", p.theta_pm_deg) +
                              "°, now " + fmt("%.2f", p.theta_now_deg) +
                              "°, sinc² = " + fmt("%.3f", p.sinc2_now);
            if (p.sinc2_now < t.min_phase_factor && p.rotation_found)
                v.phase.action =
                    std::string(p.rotation == CrystalRotation::Turn ? "turn" : "tilt") +
                    " the crystal by " + fmt("%+.3f", p.rotate_by_deg) + "° (external) about the " +
                    p.rotation_axis + " (rendezvous phase --process " + process_key(layout, p) +
                    " --write NEW.json)";
            else if (p.sinc2_now < t.min_phase_factor)
                v.phase.action =
                    std::string("no ") + (p.rotation == CrystalRotation::Turn ? "turn" : "tilt") +
                    " within the mount's range reaches θ_pm: use a crystal cut nearer " +
                    fmt("%.2f", p.theta_pm_deg) + "°";
            if (!p.polarizations_suit)
                v.phase.action += (v.phase.action.empty() ? "" : "; ") + p.polarization_note;
        }
    } else if (r.target_is_crystal) {
        v.phase.summary = "the crystal's material is isotropic or the beams miss it";
    } else {
        v.phase.applies = false;
        v.phase.summary = "the target is not a crystal";
    }
}

}  // namespace

Verdict verdict(const Layout& layout, const MaterialLibrary& library, const TargetElement& target,
                const RendezvousReport& r) {
    Verdict v;
    space_line(layout, r, v);
    time_line(layout, library, r, v);
    phase_line(layout, target, r, v);
    return v;
}

}  // namespace rv::report_sections
