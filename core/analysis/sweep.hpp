#pragma once
// Sweeping one numeric field of a layout (a beam's or an element's key, as in the file) and
// reporting the figures at each value. The field is changed in the layout's canonical JSON and
// the layout read again, so every key a file can hold can be swept and checked as a file is.

#include <optional>
#include <string>
#include <vector>

#include "analysis/report.hpp"
#include "io/diagnostic.hpp"
#include "layout/layout.hpp"

namespace rv {

struct SweepPoint {
    double value;
    RendezvousReport report;
    // A stage position beyond the stage's travel: evaluated all the same, as if the stage could
    // reach it, and marked so (the travel itself is not swept past its position).
    bool outside_travel = false;
};

struct SweepResult {
    std::vector<SweepPoint> points;
    Diagnostics diagnostics;  // a bad id or field, or a value the layout refuses
};

// `field` is a key of the beam or element `id`, optionally with an index into an array value
// ("at_mm[1]", "waist_um[0]"); `steps` ≥ 2 values from `from` to `to` inclusive.
SweepResult sweep_field(const Layout& layout, const std::string& id, const std::string& field,
                        double from, double to, int steps);

}  // namespace rv
