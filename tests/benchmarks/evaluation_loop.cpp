// A fixed number of evaluations of the SFG demo with the benchmarks' solver edit
// (demo_solver_edit.hpp), for counting instructions, which vary less than times on a shared
// machine:
//   valgrind --tool=callgrind build/release/tests/benchmarks/evaluation_loop 2200 edited
//   valgrind --tool=callgrind build/release/tests/benchmarks/evaluation_loop 200 edited
// The difference of the two totals over 2000 is the count per evaluation. With `edited` it
// evaluates as the solvers do (DemoEvaluateEdited: the edited optics named to the retrace),
// without it as DemoEvaluateCached (every element compared).
#include <cstdio>
#include <cstdlib>
#include <cstring>

#include "analysis/target_summary.hpp"
#include "benchmarks/demo_solver_edit.hpp"

int main(int argc, char** argv) {
    const long evaluations = argc > 1 ? std::atol(argv[1]) : 1000;
    const bool named = argc > 2 && std::strcmp(argv[2], "edited") == 0;
    rv::bench::DemoSolverEdit edit;
    const rv::MaterialLibrary library = rv::material_library_for(edit.layout);
    rv::TraceCache cache;
    double delay_sum_fs = 0;
    for (long k = 0; k < evaluations; ++k) {
        edit.apply(k);
        const std::vector<rv::BeamAtTarget> at = named ? rv::evaluate_beams_at_target(edit.layout, library, cache, edit.edited)
                                                       : rv::evaluate_beams_at_target(edit.layout, library, &cache);
        delay_sum_fs += rv::mismatch_at_target(at[0], at[1]).delay_fs;
    }
    std::printf("%ld evaluations, kept hits %zu + %zu, delay sum %.6g fs\n", evaluations, cache.kept_hits(0),
                cache.kept_hits(1), delay_sum_fs);
}
