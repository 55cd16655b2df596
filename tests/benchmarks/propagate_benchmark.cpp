// Propagating q through a 20-element chain: the inner loop of every trace and solver step.
//
// Reproduce the docs/performance.md figure:
//   build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter=Chain20
//     --benchmark_repetitions=15 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>

#include <vector>

#include "optics/gaussian_beam.hpp"
#include "optics/thick_lens.hpp"
#include "optics/tilted_plate.hpp"

namespace {

// Ten optics separated by ten gaps: lenses, a thick singlet, mirrors at an angle, a tilted
// plate; an invented arm (not a measured set-up).
std::vector<rv::RayMatrix> chain20(rv::Plane plane) {
    std::vector<rv::RayMatrix> m;
    const double gaps_mm[] = {120, 80, 95, 60, 150, 45, 210, 70, 130, 99.5};
    for (int i = 0; i < 10; ++i) {
        m.push_back(rv::free_space(gaps_mm[i]));
        switch (i % 5) {
            case 0: m.push_back(rv::thin_lens(i % 2 ? -50.0 : 100.0)); break;
            case 1: m.push_back(rv::thick_singlet_matrix({77.5, rv::kFlat, 4.0}, 1.507)); break;
            case 2: m.push_back(rv::spherical_mirror(400.0, 0.05, plane)); break;
            case 3: m.push_back(rv::tilted_plate_matrix(3.0, 1.45, 0.785, plane)); break;
            default: m.push_back(rv::thin_lens(250.0)); break;
        }
    }
    return m;
}

void Chain20PropagateBothPlanes(benchmark::State& state) {
    const std::vector<rv::RayMatrix> t = chain20(rv::Plane::Tangential);
    const std::vector<rv::RayMatrix> s = chain20(rv::Plane::Sagittal);
    const rv::GaussianBeam start = rv::beam_from_waist({.waist_um = 900, .distance_to_waist_mm = -200, .wavelength_nm = 1030, .index = 1.0, .m2 = 1.1});
    for (auto _ : state) {
        rv::GaussianBeam bt = start, bs = start;
        for (size_t i = 0; i < t.size(); ++i) {
            bt = rv::propagate(bt, t[i]);
            bs = rv::propagate(bs, s[i]);
        }
        benchmark::DoNotOptimize(bt.q_mm);
        benchmark::DoNotOptimize(bs.q_mm);
    }
}
BENCHMARK(Chain20PropagateBothPlanes);

void Chain20BuildAndPropagate(benchmark::State& state) {
    const rv::GaussianBeam start = rv::beam_from_waist({.waist_um = 900, .distance_to_waist_mm = -200, .wavelength_nm = 1030, .index = 1.0, .m2 = 1.1});
    for (auto _ : state) {
        const std::vector<rv::RayMatrix> t = chain20(rv::Plane::Tangential);
        rv::GaussianBeam b = start;
        for (const rv::RayMatrix& m : t) b = rv::propagate(b, m);
        benchmark::DoNotOptimize(b.q_mm);
    }
}
BENCHMARK(Chain20BuildAndPropagate);

}  // namespace
