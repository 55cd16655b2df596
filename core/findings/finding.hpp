#pragma once
// A finding: something the trace, the propagation or the report found wrong with a layout, or a
// reason to trust a figure less, as data: a stable code, the beam and element it concerns and
// its numbers. The words are made only where it is printed (finding_text); no decision anywhere
// reads them. The codes are a contract (docs/user-guide.md, "Findings"): add new ones, never rename one.

#include <optional>
#include <string>
#include <utility>
#include <vector>

#include "layout/layout.hpp"

namespace rv {

struct Finding {
    enum class Kind {
        MissedOptic,             // an aim_at mirror's aim not reached: amount = mm beyond its aperture,
                                 // crossing_mm = where the ray crosses its plane (none: never does)
        LeftTable,               // the ray left the table; where_mm = the edge crossing
        TotalInternalReflection,
        HitBackOfOptic,          // a mirror or retroreflector met from behind
        LeftThroughEdge,         // left a slab through its side
        NoTarget,                // the layout's target was never crossed (element = the target)
        TooManyHits,             // amount = the number of hits at which the trace stopped
        MaterialOutOfRange,      // a wavelength outside a material's fitted range (index extrapolated)
        NoRealIndex,             // the material's formula has no real index at the wavelength: the ray stops
        Clipping,                // set by propagation: amount = fraction of the power outside the aperture
        Paraxial,                // the report: amount = the waist (µm), limit = two wavelengths (µm)
        Unterminated,            // the report: light after the target leaves the table at where_mm
        StrayBeam,               // the report: amount = fraction of the source power that `element`
                                 // reflects out of the beam, leaving the table at where_mm
        DamageIntensity,         // the report: amount = peak intensity (W/cm²), limit = the threshold
        DamageFluence,           // the report: amount = peak fluence (J/cm²), limit = the threshold
        ThinLensTiming,          // the report: a thin glass lens adds no glass to the delay
        CoincidentOptics,        // the report: `element` and other_element lie within 0.1 mm
                                 // (amount = their distance, mm); the trace meets only one of them
        BIntegral,               // the report: amount = B (rad) of the beam in `element` (material),
                                 // limit = 1 rad (self-phase modulation, spectral broadening)
        BIntegralBreakUp,        // the report: amount = B (rad), limit = π (beam break-up, damage risk)
        NotFinite,               // set by propagation: the Gaussian beam stopped being a finite number
                                 // at `element` (where_mm = the hit); no figure of it is given after
    };
    enum class Severity {
        Problem,  // the layout does not work as drawn (light lost, missing, or a risk to the optics)
        Warning,  // the layout works, but a figure is less certain than printed
    };

    Kind kind = Kind::NoTarget;
    std::string element = {};  // element id, "" when none
    Vec2 where_mm{0, 0};
    double amount = 0;       // by kind, see above
    double limit = 0;        // by kind, see above
    std::optional<double> crossing_mm = {};  // MissedOptic
    std::string material = {};  // MaterialOutOfRange, NoRealIndex: the material's name
    double wavelength_nm = 0;                        // MaterialOutOfRange, NoRealIndex
    double range_min_nm = 0, range_max_nm = 0;       // MaterialOutOfRange
    std::string element_type = {};  // HitBackOfOptic: the element's type name ("mirror", …)
    std::string other_element = {};  // CoincidentOptics: the other optic's id
    std::string beam = {};     // the beam's id; set by the report (a path knows its beam by index)
    bool typical_threshold = false;  // DamageIntensity/Fluence: a typical figure for `material`, not the file's
};

// The stable code printed and written for each kind ("missed-optic", …), and its severity.
const char* finding_code(Finding::Kind kind);
Finding::Severity finding_severity(Finding::Kind kind);
const char* severity_name(Finding::Severity severity);
// Every kind, in the order of the enum (for the user guide's table and tests).
std::vector<Finding::Kind> all_finding_kinds();

// One plain sentence, without the beam's id ("misses M2 by 3.00 mm (…)"); the line printed in
// lists: the beam's id (or, for a finding of no beam, the element's) before it.
std::string finding_text(const Finding& f);
std::string finding_line(const Finding& f);

// The numbers of a finding by name, with their units in the names, for JSON.
std::vector<std::pair<const char*, double>> finding_numbers(const Finding& f);

}  // namespace rv
