#pragma once
#include <string>
#include <vector>

namespace rv::cli {

// The usual laser-safety cautions, one sentence each; this program computes no exposure limits.
const std::vector<std::string>& safety_cautions();

// The cautions as an indented text block, for the text report.
std::string safety_notice_text();

}  // namespace rv::cli
