#pragma once
// The solver step the evaluation benchmarks repeat on the SFG demo: the signal arm's first
// telescope lens moved by ±0.3 mm along the table's x and the crystal turned by ±0.2 mrad,
// alternately, so that each evaluation sees two changed optics.
#include "io/layout_reader.hpp"

namespace rv::bench {

struct DemoSolverEdit {
    Layout layout = *read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    size_t lens = index_of("L1_S"), crystal = index_of("X");
    Vec2 lens_at_mm = layout.elements[lens].at_mm;
    double crystal_deg = layout.elements[crystal].normal_deg;
    std::vector<size_t> edited{lens, crystal};  // what a solver making this edit would list

    size_t index_of(const char* id) const { return static_cast<size_t>(layout.find(id) - layout.elements.data()); }

    // Apply the edit of evaluation number k.
    void apply(long k) {
        const double sign = (k & 1) ? 1.0 : -1.0;
        layout.elements[lens].at_mm = lens_at_mm + Vec2(0.3 * sign, 0);
        layout.elements[crystal].normal_deg = crystal_deg + sign * 0.2e-3 * 180 / 3.141592653589793;
    }
};

}  // namespace rv::bench
