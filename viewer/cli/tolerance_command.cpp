// rendezvous tolerance: sensitivities and a Monte Carlo run of the build tolerances.
#include <chrono>
#include <cstdio>
#include <ostream>
#include <thread>

#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/layout_reader.hpp"
#include "solve/tolerance.hpp"

namespace rv::cli {

int run_tolerance(const ToleranceOptions& o, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    const int threads = static_cast<int>(std::max(1u, std::thread::hardware_concurrency()));
    const auto t0 = std::chrono::steady_clock::now();
    const ToleranceReport r = analyse_tolerances(*layout, material_library_for(*layout), o.samples, o.seed, threads);
    const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    if (!r.nominal.valid) {
        err << o.layout << ": error: a beam does not reach the target; fix the trace findings first\n";
        return 2;
    }
    const Tolerances& t = layout->goals.tolerance;
    char line[256];
    std::snprintf(line, sizeof line, "Tolerances (uniform, ±): position %.3g mm, angle %.3g mrad, focal length %.3g %%, stage %.3g mm\n\n",
                  t.position_mm, t.angle_mrad, 100 * t.focal_length_fraction, t.stage_mm);
    out << line;
    out << "Sensitivity (per mm, per mrad, or per unit fraction of focal length)\n"
        << "  perturbation                 tol       d waist offset  d waist ratio  d lateral um  d delay fs   d overlap\n";
    for (const SensitivityRow& s : r.sensitivity) {
        std::snprintf(line, sizeof line, "  %-28s %-9.3g %+-15.4g %+-14.4g %+-13.4g %+-12.4g %+.4g\n", s.label.c_str(),
                      s.tolerance, s.per_unit.waist_offset_mm, s.per_unit.waist_ratio, s.per_unit.lateral_um,
                      s.per_unit.delay_fs, s.per_unit.overlap);
        out << line;
    }
    std::snprintf(line, sizeof line, "\nMonte Carlo: %zu samples (seed %llu), %zu missed the target, %.2f s on %d threads\n",
                  r.samples, static_cast<unsigned long long>(o.seed), r.failed, seconds, threads);
    out << line << "  figure             nominal      5 %          50 %         95 %\n";
    auto row = [&](const char* name, double nominal, const Spread& s) {
        std::snprintf(line, sizeof line, "  %-18s %-12.4g %-12.4g %-12.4g %-12.4g\n", name, nominal, s.p5, s.p50, s.p95);
        out << line;
    };
    row("waist offset mm", r.nominal.waist_offset_mm, r.waist_offset_mm);
    row("waist ratio", r.nominal.waist_ratio, r.waist_ratio);
    row("lateral um", r.nominal.lateral_um, r.lateral_um);
    row("delay fs", r.nominal.delay_fs, r.delay_fs);
    row("overlap", r.nominal.overlap, r.overlap);
    std::snprintf(line, sizeof line, "\nPut on a fine adjustment: %s (%.0f %% of the waist-offset and lateral variance, linearized)\n",
                  r.most_sensitive.c_str(), 100 * r.most_sensitive_share);
    out << line;
    return 0;
}

}  // namespace rv::cli
