#include "report/safety_cautions.hpp"

namespace rv {

const std::vector<std::string>& safety_cautions() {
    static const std::vector<std::string> cautions = {
        "Planning aid only: this program computes no exposure limits, hazard zones or eyewear "
        "densities. Follow your local rules and your laser safety officer; see IEC 60825-1 and "
        "ANSI Z136.1. Class 3B and 4 work needs authorisation.",
        "Near-infrared beams (700–1400 nm) are invisible and reach the retina; the blink reflex "
        "does not protect. Check them with an IR card or viewer, never by eye.",
        "Eyewear must have adequate optical density at every wavelength present, the generated "
        "second-harmonic and sum-frequency light included.",
        "Align at the lowest practical power; most injuries happen during alignment.",
        "Terminate unconverted light, dichroic leaks and surface reflections in beam dumps; keep "
        "beams horizontal and below eye level.",
        "Tight foci reach damaging intensities on crystal and lens surfaces.",
    };
    return cautions;
}

const std::string& safety_short_notice() {
    static const std::string notice =
        "Planning aid only: no exposure limits. Follow your laser safety officer, IEC 60825-1 and "
        "ANSI Z136.1.";
    return notice;
}

}  // namespace rv
