#pragma once
// The report as JSON (`rendezvous report --json`, docs/schemas/report.schema.json): one
// nlohmann `to_json` per part of the model (analysis/report.hpp), so `json j = part;` works for
// each and the whole report is `json j = report;`. Conventions: a figure that does not apply is
// null, never 0; absent text is null, never ""; planes are {tangential, sagittal}.

#include <nlohmann/json.hpp>

#include "analysis/report.hpp"

namespace rv {

// {applies, met (null when it does not apply), summary, action (null when none), reading,
// actions (the same as data, report/verdict_json.hpp)}.
void to_json(nlohmann::json& j, const VerdictLine& l);
// {space, time, phase}, each a VerdictLine.
void to_json(nlohmann::json& j, const Verdict& v);
void to_json(nlohmann::json& j, const GroupVelocityMismatch& g);
// One process; the figures of the phase-matching angle are null without phase matching, and
// everything but the geometry is null outside the index data.
void to_json(nlohmann::json& j, const PhaseMatchingReport& p);
void to_json(nlohmann::json& j, const StageReport& s);
void to_json(nlohmann::json& j, const PolarizationAdvice& a);
void to_json(nlohmann::json& j, const FocusingReport& f);
// One beam: its elements, at the target (when it reaches it), power and where it goes after.
void to_json(nlohmann::json& j, const ReportBeam& b);
// The whole report.
void to_json(nlohmann::json& j, const RendezvousReport& r);

// The verdict in the short forms other commands print: {space, time, phase} each "met",
// "NOT MET" or "n/a" (tolerance), or each true, false or null when it does not apply (solve).
nlohmann::json verdict_states_json(const Verdict& v);
nlohmann::json verdict_met_json(const Verdict& v);

}  // namespace rv
