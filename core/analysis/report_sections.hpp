#pragma once
// The sections build_report (report.cpp) assembles, one concern per file. Internal to the
// report: front ends call build_report and read RendezvousReport, never these.
//
//   report_beams.cpp         each beam traced, propagated and described at the target
//   report_findings.cpp      the findings of the trace, the propagation and the report
//   report_safety.cpp        damage against the file's thresholds, invisible wavelengths
//   report_target.cpp        the two beams against each other at the target: mismatch, overlap
//   report_timing.cpp        the delay stage: delay per mm, zero, emission offset
//   report_phase.cpp         phase matching of each process of the crystal
//   report_polarization.cpp  the polarization each input needs, and the wave plate to turn
//   report_focusing.cpp      Boyd–Kleinman focusing of each beam in the crystal
//   report_output.cpp        the generated light, the B-integral, the damage threshold used
//   report_verdict.cpp       the space, time and phase lines (limits: layout.goals.verdict,
//                            tests: verdict_rules.hpp)

#include <optional>
#include <string>
#include <vector>

#include "analysis/report.hpp"

namespace rv::report_sections {

// The layout's target and, when it is one, its crystal (null otherwise).
struct TargetElement {
    const Element* element = nullptr;
    const Crystal* crystal = nullptr;
};
TargetElement target_element(const Layout& layout);

// Both of the first two beams reach the target (the two-colour figures apply).
bool both_reach(const std::vector<ReportBeam>& beams);

// report_beams.cpp: every arriving wave traced and propagated; with_power adds power,
// polarization and pulse figures (the stage's second trace needs only the arrival).
std::vector<ReportBeam> trace_beams(const Layout& layout, const MaterialLibrary& library,
                                    bool with_power);

// report_safety.cpp: peak intensity and fluence against the target's damage threshold; the
// beams' invisible wavelengths and the processes' invisible outputs.
std::vector<Finding> damage_findings(const Layout& layout, const ReportBeam& beam,
                                     const TargetElement& target);
std::vector<InvisibleLight> invisible_beams(const std::vector<ReportBeam>& beams);
std::vector<InvisibleLight> invisible_outputs(const RendezvousReport& r);

// report_findings.cpp: coincident optics, then each beam's trace and propagation findings and
// the report's own (paraxial, unterminated, stray, damage), then thin lenses in the timing.
std::vector<Finding> report_findings(const Layout& layout, const std::vector<ReportBeam>& beams,
                                     const TargetElement& target);

// report_target.cpp: fills mismatch, confocal_ratio and overlap when both beams reach.
void add_target_figures(const Layout& layout, RendezvousReport& r);

// report_timing.cpp: the first stage that carries an optic of a beam, when both reach.
std::optional<StageReport> stage_of(const Layout& layout, const MaterialLibrary& library,
                                    const std::vector<ReportBeam>& beams);

// report_phase.cpp: the target crystal's material when it is anisotropic (it can phase-match),
// else null; fills phase_matching (the crystal's set process first) and
// chosen_process_missing, for an anisotropic crystal target.
const Material* nonlinear_material(const MaterialLibrary& library, const TargetElement& target);
void add_phase_matching(const Layout& layout, const MaterialLibrary& library,
                        const TargetElement& target, RendezvousReport& r);

// report_polarization.cpp: the advice for each input of the first process.
std::vector<PolarizationAdvice> polarization_advice(const Layout& layout,
                                                    const MaterialLibrary& library,
                                                    const Crystal& crystal,
                                                    const RendezvousReport& r);

// report_focusing.cpp: each beam reaching the crystal, with the first process's walk-off.
std::vector<FocusingReport> focusing(const Crystal& crystal, const RendezvousReport& r);

// report_output.cpp: the damage threshold a beam at the target is judged against (the file's,
// else a typical published figure for the crystal's material at the beam's pulse length; none
// when neither exists); the generated light of the crystal's first process (when the powers,
// pulse lengths and repetition rates are given and d_eff is known); the B-integral of each beam
// in the target crystal and the thickest glass before it, and its findings.
std::optional<DamageThresholdReport> damage_threshold_for(const Layout& layout, const ReportBeam& beam,
                                                          const TargetElement& target);
std::optional<GeneratedLightReport> generated_light(const Layout& layout, const MaterialLibrary& library,
                                                    const TargetElement& target, const RendezvousReport& r);
std::vector<BIntegralReport> b_integrals(const Layout& layout, const MaterialLibrary& library,
                                         const TargetElement& target, const std::vector<ReportBeam>& beams);
std::vector<Finding> b_integral_findings(const std::vector<BIntegralReport>& entries);

// report_verdict.cpp: the three lines and the figures behind them.
Verdict verdict(const Layout& layout, const MaterialLibrary& library, const TargetElement& target,
                const RendezvousReport& r);

}  // namespace rv::report_sections
