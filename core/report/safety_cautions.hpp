#pragma once
// The laser-safety cautions every report carries (text, Markdown, JSON `safety.cautions`, the
// viewer's report panel). Words only: this program computes no exposure limits.
#include <string>
#include <vector>

namespace rv {

// The usual laser-safety cautions, one sentence each.
const std::vector<std::string>& safety_cautions();

// The one-line form the viewer's report panel ends with.
const std::string& safety_short_notice();

}  // namespace rv
