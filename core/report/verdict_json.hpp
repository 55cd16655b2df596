#pragma once
// A verdict line's reading and actions as JSON data (the report's `verdict.*.reading` and
// `verdict.*.actions`): a `code` naming the case and its beams, elements and numbers, so a
// script can act on the advice without reading its words (docs/schemas/report.schema.json).
#include <nlohmann/json.hpp>

#include "analysis/verdict_line.hpp"

namespace rv {

nlohmann::json verdict_reading_json(const VerdictReading& reading);
nlohmann::json verdict_action_json(const VerdictAction& action);

}  // namespace rv
