#include "cli/safety_notice.hpp"

namespace rv::cli {

std::string safety_notice_text() {
    return "Laser safety (planning aid only; this program computes no exposure limits):\n"
           "  - Follow your local rules and your laser safety officer; see IEC 60825-1 and\n"
           "    ANSI Z136.1. Class 3B and 4 work needs authorisation.\n"
           "  - Near-IR beams (e.g. 780 nm, 1030 nm) are invisible and reach the retina: check\n"
           "    them with an IR card or viewer, never by eye; the blink reflex does not protect.\n"
           "  - Eyewear must have adequate optical density at every wavelength present, the\n"
           "    generated second-harmonic and sum-frequency light included.\n"
           "  - Align at the lowest practical power; terminate unconverted light, dichroic\n"
           "    leaks and surface reflections in beam dumps; keep beams below eye level.\n"
           "  - Tight foci reach damaging intensities on crystal and lens surfaces.\n";
}

}  // namespace rv::cli
