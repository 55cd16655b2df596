#pragma once
// The rendezvous report: for a layout, how far the two colours are from meeting in space, in
// time and in phase at the target, and what to change. Everything a front end prints comes
// from here; the definitions are in docs/user-guide.md ("The report").

#include <optional>
#include <string>
#include <vector>

#include "analysis/power_budget.hpp"
#include "analysis/report_output.hpp"
#include "analysis/pulse_intensity.hpp"
#include "analysis/target_summary.hpp"
#include "analysis/verdict_line.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"
#include "analysis/crystal_angle.hpp"
#include "nonlinear/phase_matching.hpp"
#include "nonlinear/temperature_tuning.hpp"
#include "trace/path.hpp"
#include "trace/propagate.hpp"

namespace rv {

struct ReportBeam {
    std::string id;
    double wavelength_nm = 0;
    Path path;
    std::vector<std::string> element_ids;  // the id of each of path.hits' elements, in order
    Caustic caustic;
    BeamAtTarget at_target;
    double confocal_tangential_mm = 0, confocal_sagittal_mm = 0;  // 2 z_R in the medium
    double crossing_angle_deg = 0;  // chief ray to the target's normal at the target plane
    // Where the light goes after the target: absorbed in a dump (its id), ended by a finding
    // (it leaves the table, meets the back of a mirror …), or neither (the trace stops there).
    std::string absorbed_in;
    std::optional<Finding> end_after_target;
    // Power and polarization along the path (analysis/power_budget.hpp), fractions of the
    // source power; absolute figures where the file gives power_mw (and the pulse figures
    // where it also gives repetition_rate_khz and pulse_fwhm_fs).
    BeamPower power;
    std::optional<double> source_power_mw;     // the file's power_mw, when it gives one
    PolarizationState at_target_polarization;  // h, v, power: fractions of the source power
    std::optional<double> target_power_mw;
    std::optional<PulseFigures> pulse_at_target;  // with the radii at the target plane
    std::optional<PulseFigures> pulse_at_waist;   // with the waist radii
};

// Whether each beam reaching the crystal has the polarization the phase matching needs, and
// which way to turn a wave plate when it has not.
struct PolarizationAdvice {
    std::string beam;
    bool needs_a = true;           // the crystal's A (ordinary) wave, else its B (extraordinary) wave
    bool needs_horizontal = true;  // which is horizontal (else vertical) as the crystal is set
    double useful_fraction = 0;    // of the power at the target, in the needed polarization
    std::optional<double> useful_mw;
    enum class Advice {
        None,              // the polarization suits (or nothing on the path can change it)
        TurnPlate,         // turn `plate` from plate_now_deg to plate_best_deg
        AddHalfWavePlate,  // no wave plate to turn: add one (after `after_polarizer`, if any)
    } advice = Advice::None;
    std::optional<std::string> plate;  // TurnPlate: the wave plate to turn
    std::optional<double> plate_now_deg, plate_best_deg;
    std::optional<double> useful_fraction_best;  // with the plate at plate_best_deg (of the power at the target then)
    std::optional<double> useful_mw_best;
    std::optional<std::string> after_polarizer;  // AddHalfWavePlate: the last polarizer or cube before the target
    // Every wave plate on the beam's path before the target: its angle now, and the angle that
    // gives the most power in the needed polarization at the target (fractions of the source).
    struct PlateSetting {
        std::string plate;
        double now_deg = 0, best_deg = 0;
        double useful_now = 0, useful_best = 0;
    };
    std::vector<PlateSetting> plates;
};

// The overlap at the target: the one definition the solvers and the tolerance run use too
// (analysis/target_summary.hpp, overlap_at_target).
using OverlapReport = OverlapFigures;

struct StageReport {
    std::string id;
    std::string beam;            // the beam whose path it changes
    double position_mm = 0;
    double delay_per_mm_fs = 0;  // d(delay)/d(position)
    double zero_delay_mm = 0;    // position for zero delay
    bool zero_in_travel = false;
    double move_mm = 0;          // zero_delay − position
    std::optional<double> measured_zero_mm;
    std::optional<double> emission_offset_fs;  // model delay at the measured zero (docs/user-guide.md, Time zero)
};

struct GroupVelocityMismatch {
    // The pair as data (words: report/report_words.hpp, gvm_pair_text, "SFG–pump" …): waves 1 and 2 are the inputs (first_beam, second_beam of the process),
    // 3 the generated wave; fs_per_mm = 1/v_g(first_wave) − 1/v_g(second_wave), each wave at its
    // own polarity (type II: the o and e parts of one beam are two waves).
    int first_wave = 3, second_wave = 1;
    Polarity first_polarity = Polarity::B, second_polarity = Polarity::A;
    double fs_per_mm = 0;
    std::optional<double> walk_apart_mm;  // pulse length / |GVM|, when the pulse length is known
};

struct PhaseMatchingReport {
    ProcessBeams beams;       // the beams by id (words: report/verdict_words.hpp, process_beams_text)
    bool sum_frequency = false;   // SFG of the two beams, else the SHG of first_beam
    size_t first_beam = 0, second_beam = 0;  // indices into the report's beams (equal for SHG)
    MixingType mixing = MixingType::TypeI;
    double output_nm = 0;
    bool phase_matchable = false;
    // Internal phase-matching angle; for a crystal with no such angle at its temperature that a
    // temperature in the span phase-matches (non-critical, above T_pm), the angle now.
    double theta_pm_deg = 0;
    double theta_now_deg = 0;       // internal angle the beams have now
    // How the crystal is rotated to phase-match (analysis/crystal_angle.hpp): a Turn about the
    // vertical axis (optic axis in the table plane) or a Tilt about the horizontal axis across
    // the beam (optic axis in the vertical plane).
    CrystalRotation rotation = CrystalRotation::Turn;
    // Turn: the external angle of the beam to the face normal in the table plane, now and
    // needed. Tilt: the crystal's tilt_deg now and needed.
    double incidence_now_deg = 0;
    double incidence_needed_deg = 0;
    // The change to make: Turn, + = clockwise seen from above (normal_deg decreases by it);
    // Tilt, + = the face normal rises (tilt_deg grows by it). Only when rotation_found: a
    // setting within the searched range reaches θ_pm.
    double rotate_by_deg = 0;
    bool rotation_found = false;  // the axis in words: report/verdict_words.hpp, crystal_rotation_axis_text
    double delta_k_l = 0;           // Δk·L now (rad)
    double sinc2_now = 0;           // sinc²(ΔkL/2) now
    // Set when a wave's wavelength lies where the crystal's index formula has no real value
    // (far outside its range): then nothing above is computed (Δk·L and sinc² stay 0 and are
    // printed as unknown).
    std::optional<IndexGap> outside_index_data;
    bool first_needs_a = true, second_needs_a = true;  // the inputs' polarities for the type
    double walkoff_mrad = 0;        // of the generated (B) wave at θ_pm
    double focusing_walkoff_mrad = 0;  // the ρ of Boyd–Kleinman's B (report_focusing.cpp)
    double angular_acceptance_internal_mrad = 0;  // FWHM, internal
    double angular_acceptance_external_mrad = 0;  // ≈ n × internal
    double spectral_acceptance_nm = 0;            // FWHM of wave 1
    // Which input the spectral acceptance tunes (the id of the first beam) and, for SFG, the
    // input held at its wavelength (the second beam's id); SHG holds none (the harmonic
    // follows the fundamental).
    std::string spectral_tuned_beam;
    std::optional<std::string> spectral_held_beam;
    std::vector<GroupVelocityMismatch> gvm;
    // A set with thermo-optic data: the crystal's temperature, the one that phase-matches at
    // the beams' angle now, and the temperature acceptance (nonlinear/temperature_tuning.hpp).
    std::optional<TemperatureTuning> temperature;
    bool polarizations_suit = false;
    // What the inputs' polarizations must be for the type, as the action that sets them (its
    // words: report/verdict_words.hpp, verdict_action_text; the verdict advises it when the
    // polarizations do not suit).
    verdict_action::SetPolarizations polarization_need;
};

struct FocusingReport {
    std::string beam;
    double xi = 0, h_m = 0, sigma_m = 0;  // Boyd–Kleinman, no walk-off, focus at the centre
    double walkoff_parameter = 0;         // B = ρ √(L k1)/2 (ρ: report_focusing.cpp says which)
    double h_m_walkoff = 0, sigma_m_walkoff = 0;  // h_m(ξ, B): with the crystal's walk-off
    double xi_optimum = 0, h_mm = 0;              // the best focusing for this B
    double confocal_optimum_mm = 0;               // L/ξ_m, in the crystal
    double waist_now_um = 0, waist_optimum_um = 0;  // w0 = √(b λ/(2π n))
    double focal_length_scale = 0;  // w0(optimum)/w0(now): the focusing lens's f scales by it
};

// What `report --check` asks of each line (analysis/verdict_line.hpp): met, or not applicable.
// (The words for a line: report/verdict_words.hpp; for an advice and the light after the
// target: report/report_words.hpp.)
bool verdict_passes(const VerdictLine& l);

// One figure behind the verdict with its limit (goals.verdict): met within the limit, near
// within 1.5 × the limit (or, for a minimum, above limit/1.5), not met beyond.
struct VerdictFigure {
    std::string name;        // "waist offset / z_R" …
    double value = 0, limit = 0;
    bool is_minimum = false; // the value must be at least the limit (sinc²)
    std::string definition;  // one sentence, for a tooltip
    enum class State { Met, Near, NotMet } state = State::NotMet;
};

struct Verdict {
    VerdictLine space, time, phase;
    std::vector<VerdictFigure> figures;
};

// A dispersion data set the report used (analysis/report_materials.hpp).
struct MaterialDataReport {
    std::string name;    // the set, e.g. "BBO:Kato1986"
    std::string source;  // its citation
    double min_wavelength_nm = 0, max_wavelength_nm = 0;  // the range of its fit
    std::vector<std::string> used_by;  // the element ids ("air": the beams' paths)
};

// Light the eye does not see, for the safety block (its words: report/report_words.hpp).
// Outside 400–700 nm the eye does not see the beam; 700–1400 nm still reaches the retina
// (IEC 60825-1's retinal hazard region, common practice).
struct InvisibleLight {
    enum class Band { Ultraviolet, NearInfrared, Infrared };
    Band band = Band::Infrared;
    double wavelength_nm = 0;
    std::string beam;                     // a beam's id; empty for a generated wave
    std::optional<ProcessBeams> process;  // the process that generates it
};

struct RendezvousReport {
    std::string layout_name, target;
    bool target_is_crystal = false;
    double crystal_length_mm = 0;
    std::vector<ReportBeam> beams;
    std::optional<Mismatch> mismatch;
    std::optional<double> confocal_ratio;  // b(beam 1)/b(beam 2), mean of the planes
    std::optional<OverlapReport> overlap;
    std::optional<StageReport> stage;
    // The crystal's processes, the one it is set for first (Crystal::process).
    std::vector<PhaseMatchingReport> phase_matching;
    bool chosen_process_missing = false;  // the set process's beams do not reach the crystal
    std::vector<FocusingReport> focusing;
    std::vector<MaterialDataReport> materials;  // every data set behind the indices
    std::vector<PolarizationAdvice> polarization;
    // What the crystal's process generates, and the nonlinear-optics safety figures: the
    // B-integral of each beam and the damage threshold each beam at the target is judged
    // against (analysis/report_output.hpp).
    std::optional<GeneratedLightReport> generated;
    std::vector<BIntegralReport> b_integral;
    std::vector<DamageThresholdReport> damage_thresholds;
    Verdict verdict;
    // Every finding of the trace, the propagation and the report, each with its beam (JSON
    // `warnings`, the command `check` and the viewer's list all show exactly these).
    std::vector<Finding> findings;
    std::vector<InvisibleLight> invisible;  // beams first, then the generated waves
};

RendezvousReport build_report(const Layout& layout, const MaterialLibrary& library);

// The file's and the command line's name of a process: "sfg" or "shg:BEAM".
std::string process_key(const Layout& layout, const PhaseMatchingReport& p);

}  // namespace rv
