// rendezvous sweep: one field of the layout against the report's figures.
#include <cmath>
#include <cstdio>
#include <ostream>

#include "analysis/sweep.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"

namespace rv::cli {

int run_sweep(const SweepOptions& o, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    const size_t dot = o.vary.find('.');
    if (dot == std::string::npos || dot == 0 || dot + 1 == o.vary.size()) {
        err << "rendezvous: error: --vary expects ID.FIELD, as in L2_P.at_mm[0] (got \"" << o.vary << "\")\n";
        return 2;
    }
    const SweepResult r = sweep_field(*layout, o.vary.substr(0, dot), o.vary.substr(dot + 1), o.from, o.to, o.steps);
    if (!r.diagnostics.empty()) {
        for (const Diagnostic& d : r.diagnostics) err << format_diagnostic(d, o.layout) << "\n";
        return 2;
    }
    const char* sep = o.csv ? "," : "  ";
    out << o.vary;
    for (const BeamSource& b : layout->beams)
        out << sep << b.id << "_waist_um" << sep << b.id << "_waist_offset_mm";
    out << sep << "waist_offset_mm" << sep << "waist_ratio" << sep << "lateral_um" << sep << "delay_fs" << sep
        << "overlap_spatial" << sep << "overlap_temporal" << sep << "overlap_combined" << sep << "sinc2_now\n";
    for (const SweepPoint& p : r.points) {
        char buf[64];
        auto put = [&](double v) {
            std::snprintf(buf, sizeof buf, "%.6g", v);
            out << sep << buf;
        };
        std::snprintf(buf, sizeof buf, "%.6g", p.value);
        out << buf;
        for (const ReportBeam& b : p.report.beams) {
            put(b.at_target.reached ? (b.at_target.tangential.waist_um + b.at_target.sagittal.waist_um) / 2 : NAN);
            put(b.at_target.reached ? (b.at_target.tangential.waist_offset_mm + b.at_target.sagittal.waist_offset_mm) / 2 : NAN);
        }
        const bool m = p.report.mismatch.has_value();
        put(m ? p.report.mismatch->waist_offset_mm : NAN);
        put(m ? p.report.mismatch->waist_ratio : NAN);
        put(m ? p.report.mismatch->lateral_um : NAN);
        put(m ? p.report.mismatch->delay_fs : NAN);
        const bool ov = p.report.overlap.has_value();
        put(ov ? p.report.overlap->spatial_along_crystal : NAN);
        put(ov && p.report.overlap->temporal ? *p.report.overlap->temporal : NAN);
        put(ov ? p.report.overlap->combined : NAN);
        put(p.report.phase_matching.empty() ? NAN : p.report.phase_matching.front().sinc2_now);
        out << "\n";
    }
    return 0;
}

}  // namespace rv::cli
