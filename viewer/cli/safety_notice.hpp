#pragma once
#include <string>

namespace rv::cli {

// The laser-safety reminder printed with every report (text form, one caution a line).
std::string safety_notice_text();

}  // namespace rv::cli
