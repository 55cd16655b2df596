#pragma once
// The words for the report model's states, shared by its formats (report_json, report_text,
// report_markdown) and the viewer's panels: a verdict line's state, the polarization a crystal
// needs and the advice for it, where a beam's light goes after the target.
#include <string>

#include "analysis/report.hpp"

namespace rv {

// "met", "NOT MET" or "n/a".
const char* verdict_state_text(const VerdictLine& l);
// The state and the summary in one line: "met  θ_pm …", "n/a — the target is not a crystal".
std::string verdict_line_text(const VerdictLine& l);

// "o (horizontal)" …, and the advice in words ("" when none).
std::string needed_polarization_text(const PolarizationAdvice& a);
std::string polarization_advice_text(const PolarizationAdvice& a);

// "1030 nm (pump): near infrared, reaches the retina", "257.5 nm (SFG of pump + signal): ultraviolet".
std::string invisible_light_text(const InvisibleLight& light);

// The pair of waves of a group-velocity mismatch: "SFG–pump", "pump–signal", and for type-II
// SHG, whose two inputs are the o and e parts of one beam, "nd (o)–nd (e)".
std::string gvm_pair_text(const PhaseMatchingReport& p, const GroupVelocityMismatch& g);

// "at 20.0 °C; Δk = 0 at 148.9 °C at this angle; acceptance 5.23 °C (FWHM)".
std::string temperature_tuning_text(const TemperatureTuning& t);

// Where a beam's light goes after the target, in words ("absorbed in dump D1", …).
std::string after_target_text(const ReportBeam& beam);

}  // namespace rv
