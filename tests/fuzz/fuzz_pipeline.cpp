// libFuzzer target: every layout that reads is traced, propagated and reported without a crash,
// and every number the report gives is finite or absent (issue: "never print a NaN"); and the
// retrace under a few random sparse edits gives exactly a fresh trace's paths and numbers
// (support/retrace_check.hpp, the differential check the unit tests run on fixed layouts).
#include <cmath>
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <string_view>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "support/retrace_check.hpp"

namespace {
void require_finite(double v) {
    if (!std::isfinite(v)) __builtin_trap();
}
}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const rv::LayoutReadResult r = rv::read_layout(std::string_view(reinterpret_cast<const char*>(data), size));
    if (!r.layout) return 0;
    const rv::RendezvousReport rep = rv::build_report(*r.layout, rv::material_library_for(*r.layout));
    for (const rv::ReportBeam& b : rep.beams) {
        if (!b.at_target.reached) continue;
        require_finite(b.at_target.path_mm);
        require_finite(b.at_target.arrival_fs);
        require_finite(b.at_target.tangential.waist_um);
        require_finite(b.at_target.sagittal.waist_offset_mm);
    }
    if (rep.overlap) {
        require_finite(rep.overlap->combined);
        if (rep.overlap->combined < 0 || rep.overlap->combined > 1 + 1e-9) __builtin_trap();
    }
    // A few edits from a seed taken from the input, so that a reproducer replays the same run.
    const std::uint32_t seed = static_cast<std::uint32_t>(size * 2654435761u);
    const rv::test::RetraceRun run = rv::test::check_retraces(*r.layout, rv::material_library_for(*r.layout), seed, 4);
    if (run.difference) {
        std::fprintf(stderr, "retrace differs from a fresh trace: %s\n", run.difference->c_str());
        __builtin_trap();
    }
    return 0;
}
