#pragma once
// A verdict line as data: whether its question arises, whether it is met, what it read (the
// figures behind it) and what to change (its actions, each with the beam or element it names and
// its numbers). Nothing here is words: report/verdict_words.hpp says them, in every format and in
// the viewer alike. The figures are chosen in analysis/report_verdict.cpp, judged by
// analysis/verdict_rules.hpp.
#include <optional>
#include <string>
#include <variant>
#include <vector>

#include "analysis/crystal_angle.hpp"
#include "nonlinear/phase_matching.hpp"

namespace rv {

// Where a crystal's index formula has no real value (a wavelength far outside its range): the
// set, the wave's wavelength when one is found, and the range the formula covers.
// (Words: report/verdict_words.hpp, index_gap_text.)
struct IndexGap {
    std::string material;
    std::optional<double> wavelength_nm;
    double covers_min_nm = 0, covers_max_nm = 0;
};

// The process a phase line is about: the SFG of two beams or the SHG of one.
struct ProcessBeams {
    bool sum_frequency = false;
    std::string first_beam, second_beam;  // second_beam empty for SHG
};

// What a line read. Signs: an offset along the beam is + downstream.
namespace verdict_reading {
struct TwoBeams {  // space, both beams at the target
    double waist_offset_mm = 0;  // the second beam's waist from the first's, + downstream
    double offset_rayleigh = 0;  // |offset| over the shorter Rayleigh range
    double waist_ratio = 0;      // larger over smaller, mean of the planes
    double lateral_um = 0;       // between the chief-ray crossings of the target plane
};
struct OneBeamFocus {  // space, a single beam
    double waist_offset_mm = 0;  // the waist from the target centre, + after it
    double offset_rayleigh = 0;  // |offset| over the beam's Rayleigh range
};
struct BeamMissesTarget {};  // space or time: a beam does not reach the target
struct Delay {               // time
    double delay_fs = 0;     // arrival of beam 1 − beam 2
    double xcorr_fs = 0;     // the cross-correlation FWHM of the pulses at the target
};
struct PulsesNotGiven {};    // time: a beam has no pulse_fwhm_fs
struct OneBeamNoDelay {};    // time does not apply
struct ProcessBeamsMissing { ProcessBeams process; };  // the crystal's set process
struct OutsideIndexData {    // the crystal's index formula has no value at a wave
    ProcessBeams process;
    IndexGap gap;
};
struct NotPhaseMatchable { ProcessBeams process; MixingType mixing = MixingType::TypeI; };
struct PhaseAngles {
    ProcessBeams process;
    MixingType mixing = MixingType::TypeI;
    double theta_pm_deg = 0, theta_now_deg = 0;  // internal
    double sinc2 = 0;
};
struct IsotropicOrMissed {};  // a crystal target with no process to judge
struct TargetNotCrystal {};   // phase does not apply
}  // namespace verdict_reading

using VerdictReading =
    std::variant<verdict_reading::TwoBeams, verdict_reading::OneBeamFocus,
                 verdict_reading::BeamMissesTarget, verdict_reading::Delay,
                 verdict_reading::PulsesNotGiven, verdict_reading::OneBeamNoDelay,
                 verdict_reading::ProcessBeamsMissing, verdict_reading::OutsideIndexData,
                 verdict_reading::NotPhaseMatchable, verdict_reading::PhaseAngles,
                 verdict_reading::IsotropicOrMissed, verdict_reading::TargetNotCrystal>;

// What to change, one step each.
namespace verdict_action {
struct BringWaistsTogether {
    std::string beam, reference;  // beam's waist lies offset_mm from reference's
    double offset_mm = 0;         // + downstream
};
struct MatchWaistSizes { double waist_ratio = 0; };
struct OverlapChiefRays { double lateral_um = 0; };
struct MeetWaistGoal { std::string beam; double waist_um = 0, goal_um = 0; };  // goals.waist_um
struct MoveFocus { double waist_offset_mm = 0; };  // + : the waist is after the centre, move it upstream
struct FixTraceFindings {};
struct MoveStage { std::string stage; double move_mm = 0, to_mm = 0; };
struct StageOutOfTravel { std::string stage; double zero_delay_mm = 0; };
struct AddAirPath { std::string beam; double path_mm = 0; };  // beam: the one that arrives first
struct BringBeamsToCrystal {};
struct ChooseTransparentCrystal {};
struct ChooseAnotherCrystalOrType {};
struct RotateCrystal {
    CrystalRotation rotation = CrystalRotation::Turn;
    double by_deg = 0;            // external; sign convention: PhaseMatchingReport::rotate_by_deg
    std::string process_key;      // for `rendezvous phase --process`
};
// A crystal in an oven (temperature_c given) whose set has thermo-optic data: the temperature
// at which the process phase-matches at the beams' angle now (PhaseMatchingReport::temperature).
struct SetCrystalTemperature {
    std::string crystal;
    double to_c = 0;
    std::string process_key;  // for `rendezvous phase --process`
};
struct CutNearer { CrystalRotation rotation = CrystalRotation::Turn; double theta_pm_deg = 0; };
// The inputs' polarizations the process needs (PhaseMatchingReport::polarizations_suit false).
struct SetPolarizations {
    std::string first_beam, second_beam;  // second_beam empty for SHG
    bool equal_components = false;  // type-II SHG: the one beam needs equal o and e parts
    bool first_o = true, second_o = true;  // the o (ordinary) wave, else e
    bool o_vertical = true;  // an o wave is polarized vertically as the crystal is set
};
}  // namespace verdict_action

using VerdictAction =
    std::variant<verdict_action::BringWaistsTogether, verdict_action::MatchWaistSizes,
                 verdict_action::OverlapChiefRays, verdict_action::MeetWaistGoal,
                 verdict_action::MoveFocus, verdict_action::FixTraceFindings,
                 verdict_action::MoveStage, verdict_action::StageOutOfTravel,
                 verdict_action::AddAirPath, verdict_action::BringBeamsToCrystal,
                 verdict_action::ChooseTransparentCrystal,
                 verdict_action::ChooseAnotherCrystalOrType, verdict_action::RotateCrystal,
                 verdict_action::SetCrystalTemperature, verdict_action::CutNearer,
                 verdict_action::SetPolarizations>;

struct VerdictLine {
    bool applies = true;  // false when the question does not arise (phase without a crystal)
    bool met = false;     // only when it applies
    VerdictReading reading;
    std::vector<VerdictAction> actions;  // empty when met or not applicable
};

}  // namespace rv
