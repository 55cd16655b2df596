// A fixed number of solver evaluations of the SFG demo with DemoEvaluateCached's edit (the
// signal arm's first lens moved ±0.3 mm, the crystal turned ±0.2 mrad), for counting
// instructions, which vary less than times on a shared machine:
//   valgrind --tool=callgrind build/release/tests/benchmarks/evaluation_loop 2200
//   valgrind --tool=callgrind build/release/tests/benchmarks/evaluation_loop 200
// The difference of the two totals over 2000 is the count per evaluation.
#include <cstdio>
#include <cstdlib>

#include "analysis/target_summary.hpp"
#include "io/layout_reader.hpp"

int main(int argc, char** argv) {
    const int evaluations = argc > 1 ? std::atoi(argv[1]) : 1000;
    rv::Layout layout = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    const rv::MaterialLibrary library = rv::material_library_for(layout);
    rv::TraceCache cache;
    rv::Element& lens = const_cast<rv::Element&>(*layout.find("L1_S"));
    rv::Element& crystal = const_cast<rv::Element&>(*layout.find("X"));
    const rv::Vec2 lens_at = lens.at_mm;
    const double crystal_deg = crystal.normal_deg;
    double delay_sum_fs = 0;
    for (int k = 0; k < evaluations; ++k) {
        const double sign = (k & 1) ? 1.0 : -1.0;
        lens.at_mm = lens_at + rv::Vec2(0.3 * sign, 0);
        crystal.normal_deg = crystal_deg + sign * 0.2e-3 * 180 / 3.141592653589793;
        const std::vector<rv::BeamAtTarget> at = rv::evaluate_beams_at_target(layout, library, &cache);
        delay_sum_fs += rv::mismatch_at_target(at[0], at[1]).delay_fs;
    }
    std::printf("%d evaluations, kept hits %zu + %zu, delay sum %.6g fs\n", evaluations, cache.beams[0].kept_hits,
                cache.beams[1].kept_hits, delay_sum_fs);
}
