// The verdict: whether the two colours meet in space, in time and in phase at the target, the
// figures behind each line and what to change, as data (analysis/verdict_line.hpp; the words:
// report/verdict_words.hpp). The limits are layout.goals.verdict
// (docs/user-guide.md, "Verdict"); whether a line is met is decided by analysis/verdict_rules.hpp
// (the tolerance run's test too); each action is chosen by comparing a figure with its limit.
#include <algorithm>
#include <cmath>

#include "analysis/report_sections.hpp"
#include "analysis/verdict_rules.hpp"
#include "materials/dispersion.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

namespace {

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

// Each waist goal (goals.waist_um) a beam at the target misses.
std::vector<VerdictAction> waist_goal_misses(const Layout& layout, const RendezvousReport& r) {
    const VerdictThresholds& t = layout.goals.verdict;
    std::vector<VerdictAction> goal_misses;
    for (const auto& [id, goal] : layout.goals.waist_um)
        for (const ReportBeam& b : r.beams) {
            if (b.id != id || !b.at_target.reached) continue;
            const double w = mean_waist_um(b.at_target);
            if (!waist_goal_met(w, goal, t))
                goal_misses.push_back(verdict_action::MeetWaistGoal{id, w, goal});
        }
    return goal_misses;
}

void space_line(const Layout& layout, const RendezvousReport& r, Verdict& v) {
    const VerdictThresholds& t = layout.goals.verdict;
    const std::vector<VerdictAction> goal_misses = waist_goal_misses(layout, r);
    const bool both = both_reach(r.beams);
    std::vector<VerdictAction>& acts = v.space.actions;
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
        v.space.reading = verdict_reading::TwoBeams{mm.waist_offset_mm, frac, ratio, mm.lateral_um};
        if (frac > t.max_waist_offset_rayleigh)
            acts.push_back(verdict_action::BringWaistsTogether{b.id, a.id, mm.waist_offset_mm});
        if (ratio > t.max_waist_ratio) acts.push_back(verdict_action::MatchWaistSizes{ratio});
        if (lateral > t.max_lateral_offset_radius)
            acts.push_back(verdict_action::OverlapChiefRays{mm.lateral_um});
        acts.insert(acts.end(), goal_misses.begin(), goal_misses.end());
    } else if (!r.beams.empty() && r.beams[0].at_target.reached && r.beams.size() == 1) {
        const ReportBeam& a = r.beams[0];
        const double off =
            (a.at_target.tangential.waist_offset_mm + a.at_target.sagittal.waist_offset_mm) / 2;
        const double zr =
            std::min(a.at_target.tangential.rayleigh_mm, a.at_target.sagittal.rayleigh_mm);
        v.space.met = single_beam_offset_met(single_beam_offset_rayleigh(a.at_target), t) &&
                      goal_misses.empty();
        v.space.reading = verdict_reading::OneBeamFocus{off, std::abs(off) / zr};
        if (!v.space.met) {
            if (std::abs(off) / zr > t.max_waist_offset_rayleigh)
                acts.push_back(verdict_action::MoveFocus{off});
            acts.insert(acts.end(), goal_misses.begin(), goal_misses.end());
        }
    } else {
        v.space.reading = verdict_reading::BeamMissesTarget{};
        acts.push_back(verdict_action::FixTraceFindings{});
    }
}

void time_line(const Layout& layout, const MaterialLibrary& library, const RendezvousReport& r,
               Verdict& v) {
    const VerdictThresholds& t = layout.goals.verdict;
    const bool both = both_reach(r.beams);
    if (both && r.overlap && r.overlap->temporal) {
        // The pulse lengths at the target (analysis/pulse_at_target.hpp), as the overlap's.
        const double t1 = r.beams[0].at_target.pulse.fwhm_fs.value(),
                     t2 = r.beams[1].at_target.pulse.fwhm_fs.value();
        const double xcorr = cross_correlation_fwhm_fs(t1, t2);
        const double d = r.mismatch->delay_fs;
        v.time.met = delay_met(d, xcorr, t);
        add_figure(v, "delay / cross-correlation", std::abs(d) / xcorr, t.max_delay_xcorr, false,
                   "|arrival of beam 1 − beam 2| over sqrt(τ1² + τ2²), the FWHM of the two pulses' "
                   "cross-correlation");
        v.time.reading = verdict_reading::Delay{d, xcorr};
        if (!v.time.met) {
            if (r.stage && r.stage->zero_in_travel) {
                v.time.actions.push_back(verdict_action::MoveStage{
                    r.stage->id, r.stage->move_mm, r.stage->zero_delay_mm});
            } else {
                const size_t early = d > 0 ? 1 : 0;  // the beam that arrives first needs the path
                const double ng_air =
                    sample_index(*library.find("air"), r.beams[early].wavelength_nm).group_index;
                const double path_mm = std::abs(d) * kSpeedOfLight_mm_per_fs / ng_air;
                if (r.stage)
                    v.time.actions.push_back(
                        verdict_action::StageOutOfTravel{r.stage->id, r.stage->zero_delay_mm});
                v.time.actions.push_back(verdict_action::AddAirPath{r.beams[early].id, path_mm});
            }
        }
    } else if (both) {
        v.time.met = false;
        v.time.reading = verdict_reading::PulsesNotGiven{};
    } else if (r.beams.size() == 1) {
        v.time.applies = false;
        v.time.reading = verdict_reading::OneBeamNoDelay{};
    } else {
        v.time.reading = verdict_reading::BeamMissesTarget{};
    }
}

void phase_line(const Layout& layout, const TargetElement& target, const RendezvousReport& r,
                Verdict& v) {
    const VerdictThresholds& t = layout.goals.verdict;
    const Crystal* crystal = target.crystal;
    std::vector<VerdictAction>& acts = v.phase.actions;
    if (r.chosen_process_missing) {
        v.phase.met = false;
        const bool shg = crystal && crystal->process == Crystal::Process::SecondHarmonic;
        v.phase.reading = verdict_reading::ProcessBeamsMissing{
            {!shg, shg ? crystal->process_beam.value_or("") : std::string(), std::string()}};
        acts.push_back(verdict_action::BringBeamsToCrystal{});
    } else if (!r.phase_matching.empty()) {
        const PhaseMatchingReport& p = r.phase_matching.front();
        const ProcessBeams& process = p.beams;
        v.phase.met = phase_met(p.phase_matchable, p.sinc2_now, p.polarizations_suit, t);
        // A crystal in an oven is tuned by its temperature, not turned: the advice sets the
        // oven when a temperature in the span phase-matches at the angle now.
        std::optional<verdict_action::SetCrystalTemperature> oven_setting;
        if (crystal && crystal->temperature_c && p.temperature && p.temperature->phase_matching_c && target.element)
            oven_setting = verdict_action::SetCrystalTemperature{target.element->id, *p.temperature->phase_matching_c,
                                                                 process_key(layout, p)};
        if (!p.outside_index_data)
            add_figure(
                v, "phase factor sinc²", p.sinc2_now, t.min_phase_factor, true,
                "sinc²(Δk·L/2) of the first process with the crystal as it is (1 = phase-matched)");
        if (p.outside_index_data) {
            v.phase.reading = verdict_reading::OutsideIndexData{process, *p.outside_index_data};
            acts.push_back(verdict_action::ChooseTransparentCrystal{});
        } else if (!p.phase_matchable) {
            v.phase.reading = verdict_reading::NotPhaseMatchable{process, p.mixing};
            if (oven_setting) acts.push_back(*oven_setting);
            else acts.push_back(verdict_action::ChooseAnotherCrystalOrType{});
        } else {
            v.phase.reading = verdict_reading::PhaseAngles{process, p.mixing, p.theta_pm_deg,
                                                           p.theta_now_deg, p.sinc2_now};
            if (p.sinc2_now < t.min_phase_factor && oven_setting)
                acts.push_back(*oven_setting);
            else if (p.sinc2_now < t.min_phase_factor && p.rotation_found)
                acts.push_back(verdict_action::RotateCrystal{p.rotation, p.rotate_by_deg,
                                                             process_key(layout, p)});
            else if (p.sinc2_now < t.min_phase_factor)
                acts.push_back(verdict_action::CutNearer{p.rotation, p.theta_pm_deg});
            if (!p.polarizations_suit) acts.push_back(p.polarization_need);
        }
    } else if (r.target_is_crystal) {
        v.phase.reading = verdict_reading::IsotropicOrMissed{};
    } else {
        v.phase.applies = false;
        v.phase.reading = verdict_reading::TargetNotCrystal{};
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
