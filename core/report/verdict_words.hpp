#pragma once
// The words of a verdict line (analysis/verdict_line.hpp): what it read and each action, the
// same in the text, the Markdown, the JSON's `summary` and `action`, and the viewer.
#include <string>

#include "analysis/verdict_line.hpp"

namespace rv {

// "waists 0.120 mm apart = 0.35 of the shorter Rayleigh range; …", "the target is not a crystal".
std::string verdict_reading_text(const VerdictReading& reading);
// "move stage S1 by +0.250 mm (to 12.250 mm)" …
std::string verdict_action_text(const VerdictAction& action);

// "BBO:Eimerl1987 has no real index at 213.5 nm (its formula covers 220–1060 nm): no
// phase-matching figures".
std::string index_gap_text(const IndexGap& gap);
// A line's actions joined by "; " ("" when it has none).
std::string verdict_actions_text(const VerdictLine& line);

// The name of a phase-matching process: "SFG of pump + signal", "SHG of pump".
std::string process_beams_text(const ProcessBeams& p);
// The axis a crystal turns or tilts about, with the sign of the angle.
const char* crystal_rotation_axis_text(CrystalRotation rotation);

}  // namespace rv
