#include "report/verdict_words.hpp"

#include <cmath>

#include "layout/visit.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

// Every number by the shared rule (units/number_text.hpp): no "-0", "n/a" for NaN.
std::string fmt(const char* format, double a) { return format_number(format, a); }

const char* wave_name(bool o) { return o ? "o" : "e"; }

const char* rotation_verb(CrystalRotation r) { return r == CrystalRotation::Turn ? "turn" : "tilt"; }

}  // namespace

std::string process_beams_text(const ProcessBeams& p) {
    return p.sum_frequency ? "SFG of " + p.first_beam + " + " + p.second_beam
                           : "SHG of " + p.first_beam;
}

const char* crystal_rotation_axis_text(CrystalRotation rotation) {
    return rotation == CrystalRotation::Turn
               ? "vertical axis (+ = clockwise seen from above)"
               : "horizontal axis across the beam (+ = the face normal rises)";
}

std::string verdict_reading_text(const VerdictReading& reading) {
    namespace vr = verdict_reading;
    return std::visit(
        overloaded{
            [](const vr::TwoBeams& s) {
                return "waists " + fmt("%.3f", std::abs(s.waist_offset_mm)) + " mm apart = " +
                       fmt("%.2f", s.offset_rayleigh) +
                       " of the shorter Rayleigh range; waist ratio " + fmt("%.3f", s.waist_ratio) +
                       "; chief rays " + fmt("%.1f", s.lateral_um) + " µm apart";
            },
            [](const vr::OneBeamFocus& s) {
                return "waist " + fmt("%.3f", std::abs(s.waist_offset_mm)) + " mm " +
                       (s.waist_offset_mm > 0 ? "after" : "before") + " the target centre = " +
                       fmt("%.2f", s.offset_rayleigh) + " of its Rayleigh range";
            },
            [](const vr::BeamMissesTarget&) -> std::string {
                return "a beam does not reach the target";
            },
            [](const vr::Delay& s) {
                return "delay " + format_duration_fs(s.delay_fs, true) + " = " +
                       fmt("%.2f", std::abs(s.delay_fs) / s.xcorr_fs) +
                       " of the cross-correlation width (" + format_duration_fs(s.xcorr_fs) + ")";
            },
            [](const vr::PulsesNotGiven&) -> std::string {
                return "not evaluated: give pulse_fwhm_fs for both beams";
            },
            [](const vr::OneBeamNoDelay&) -> std::string { return "one beam: no delay to match"; },
            [](const vr::ProcessBeamsMissing& s) {
                const bool shg = !s.process.sum_frequency;
                return (shg ? "SHG of " + s.process.first_beam : std::string("SFG")) +
                       " (the crystal's process): its beam" + (shg ? " does" : "s do") +
                       " not reach the crystal";
            },
            [](const vr::OutsideIndexData& s) {
                return process_beams_text(s.process) + ": " + index_gap_text(s.gap);
            },
            [](const vr::NotPhaseMatchable& s) {
                return process_beams_text(s.process) + ": no " + mixing_type_label(s.mixing) +
                       " phase matching in this crystal";
            },
            [](const vr::PhaseAngles& s) {
                return process_beams_text(s.process) + " " + mixing_type_label(s.mixing) +
                       ": θ_pm " + fmt("%.2f", s.theta_pm_deg) + "°, now " +
                       fmt("%.2f", s.theta_now_deg) + "°, sinc² = " + fmt("%.3f", s.sinc2);
            },
            [](const vr::IsotropicOrMissed&) -> std::string {
                return "the crystal's material is isotropic or the beams miss it";
            },
            [](const vr::TargetNotCrystal&) -> std::string { return "the target is not a crystal"; },
        },
        reading);
}

std::string verdict_action_text(const VerdictAction& action) {
    namespace va = verdict_action;
    return std::visit(
        overloaded{
            [](const va::BringWaistsTogether& a) {
                return "bring the waists together: " + a.beam + "'s lies " +
                       fmt("%.3f", std::abs(a.offset_mm)) + " mm " +
                       (a.offset_mm > 0 ? "downstream" : "upstream") + " of " + a.reference + "'s";
            },
            [](const va::MatchWaistSizes& a) {
                return "match the waist sizes (ratio " + fmt("%.2f", a.waist_ratio) + ")";
            },
            [](const va::OverlapChiefRays& a) {
                return "overlap the chief rays (" + fmt("%.1f", a.lateral_um) + " µm apart)";
            },
            [](const va::MeetWaistGoal& a) {
                return a.beam + " waist " + fmt("%.1f", a.waist_um) + " µm, goal " +
                       fmt("%.1f", a.goal_um) + " µm";
            },
            [](const va::MoveFocus& a) {
                return "move the focus " + fmt("%.3f", std::abs(a.waist_offset_mm)) + " mm " +
                       (a.waist_offset_mm > 0 ? "upstream" : "downstream");
            },
            [](const va::FixTraceFindings&) -> std::string { return "fix the trace findings first"; },
            [](const va::MoveStage& a) {
                return "move stage " + a.stage + " by " + fmt("%+.3f", a.move_mm) + " mm (to " +
                       fmt("%.3f", a.to_mm) + " mm)";
            },
            [](const va::StageOutOfTravel& a) {
                return "stage " + a.stage + " would need " + fmt("%.3f", a.zero_delay_mm) +
                       " mm, outside its travel";
            },
            [](const va::AddAirPath& a) {
                return "add " + fmt("%.2f", a.path_mm) + " mm of air path to " + a.beam;
            },
            [](const va::BringBeamsToCrystal&) -> std::string {
                return "bring the beams to the crystal first (see the space line)";
            },
            [](const va::ChooseTransparentCrystal&) -> std::string {
                return "choose a crystal that is transparent at these wavelengths";
            },
            [](const va::ChooseAnotherCrystalOrType&) -> std::string {
                return "choose another crystal or type";
            },
            [](const va::RotateCrystal& a) {
                return std::string(rotation_verb(a.rotation)) + " the crystal by " +
                       fmt("%+.3f", a.by_deg) + "° (external) about the " +
                       crystal_rotation_axis_text(a.rotation) + " (rendezvous phase --process " +
                       a.process_key + " --write NEW.json)";
            },
            [](const va::SetCrystalTemperature& a) {
                return "set the oven of " + a.crystal + " to " + fmt("%.2f", a.to_c) +
                       " °C (temperature_c; rendezvous phase --process " + a.process_key + " --write NEW.json)";
            },
            [](const va::CutNearer& a) {
                return std::string("no ") + rotation_verb(a.rotation) +
                       " within the mount's range reaches θ_pm: use a crystal cut nearer " +
                       fmt("%.2f", a.theta_pm_deg) + "°";
            },
            [](const va::SetPolarizations& a) {
                if (a.equal_components)
                    return a.first_beam + " needs equal o and e components (linear at 45° to the axes)";
                return a.first_beam + " must be " + wave_name(a.first_o) +
                       (a.second_beam.empty() ? std::string()
                                              : ", " + a.second_beam + " " + wave_name(a.second_o)) +
                       " (an o wave is polarized " + (a.o_vertical ? "vertically" : "horizontally") +
                       " as the crystal is set)";
            },
        },
        action);
}

std::string verdict_actions_text(const VerdictLine& line) {
    std::string text;
    for (const VerdictAction& a : line.actions) text += (text.empty() ? "" : "; ") + verdict_action_text(a);
    return text;
}

std::string index_gap_text(const IndexGap& gap) {
    return gap.material + " has no real index at " +
           (gap.wavelength_nm ? fmt("%.1f", *gap.wavelength_nm) + " nm" : std::string("a wave of this process")) +
           " (its formula covers " + fmt("%.0f", gap.covers_min_nm) + "–" + fmt("%.0f", gap.covers_max_nm) +
           " nm): no phase-matching figures";
}

}  // namespace rv
