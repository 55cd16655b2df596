// A fixed number of viewer steps (frame_cases.hpp), for callgrind's instruction count, which
// varies less than times on a shared machine (tests/benchmarks/check_budgets):
//   valgrind --tool=callgrind build/release/tests/benchmarks/frame_loop raster 13
//   valgrind --tool=callgrind build/release/tests/benchmarks/frame_loop raster 3
// The difference of the two totals over 10 is the count per step; `drag` for a drag step.
#include <cstdio>
#include <cstdlib>
#include <cstring>

#include "benchmarks/frame_cases.hpp"

namespace {

template <class Case>
unsigned run(Case& c, long steps) {
    unsigned sum = 0;
    for (long k = 0; k < steps; ++k) {
        c.step();
        sum += c.pixels()[4 * (800 + 1600 * 500)];  // keeps the work observable
    }
    return sum;
}

}  // namespace

int main(int argc, char** argv) {
    if (argc != 3 || (std::strcmp(argv[1], "raster") != 0 && std::strcmp(argv[1], "drag") != 0)) {
        std::fprintf(stderr, "usage: frame_loop raster|drag STEPS\n");
        return 2;
    }
    const long steps = std::atol(argv[2]);
    unsigned sum = 0;
    if (std::strcmp(argv[1], "raster") == 0) {
        rv::bench::RasterCase c(1);
        sum = run(c, steps);
    } else {
        rv::bench::DragCase c;
        sum = run(c, steps);
    }
    std::printf("%ld %s steps, pixel sum %u\n", steps, argv[1], sum);
}
