#pragma once
// The words and JSON of the report's generated light, B-integral and damage-threshold parts
// (analysis/report_output.hpp): nothing computed here. report_json, report_text and
// report_markdown call these for their part of the report.

#include <nlohmann/json.hpp>
#include <ostream>
#include <string>
#include <utility>
#include <vector>

#include "analysis/report.hpp"

namespace rv {

void to_json(nlohmann::json& j, const GeneratedLightReport& g);
void to_json(nlohmann::json& j, const BIntegralReport& b);
void to_json(nlohmann::json& j, const DamageThresholdReport& d);

// The assumptions behind the generated-light figure, each as a stable code and its sentence
// ("undepleted-pump", "the pump is not depleted …"), the conditional ones when they apply.
std::vector<std::pair<std::string, std::string>> generated_light_assumptions(const GeneratedLightReport& g);

const char* pulse_regime_name(PulseRegime regime);  // "femtosecond", "picosecond", "nanosecond"

// The text report's "Generated light" block and the B-integral / damage-threshold lines of its
// Safety block; the Markdown summary's line for the generated light.
void write_generated_light_text(const RendezvousReport& r, std::ostream& out);
void write_nonlinear_safety_text(const RendezvousReport& r, std::ostream& out);
void write_generated_light_markdown(const RendezvousReport& r, std::ostream& out);

}  // namespace rv
