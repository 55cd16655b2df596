#pragma once
// A finding as one JSON object: {code, severity, beam, element, message, <its numbers>}; an
// absent beam or element is null. The same object in `report --json` (`warnings`) and
// `check --json` (`findings`).

#include <nlohmann/json.hpp>

#include "findings/finding.hpp"

namespace rv {

nlohmann::json finding_json(const Finding& f);

}  // namespace rv
