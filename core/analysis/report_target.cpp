// The two beams against each other at the target (analysis/target_summary.hpp): the mismatch
// of beam 2 relative to beam 1, the ratio of their confocal parameters b = 2 z_R (mean of the
// planes) and the overlap (the solvers' definition, overlap_at_target, with the pulse lengths at
// the target).
#include "analysis/report_sections.hpp"

namespace rv::report_sections {

void add_target_figures(const Layout&, RendezvousReport& r) {
    if (!both_reach(r.beams)) return;
    const ReportBeam& a = r.beams[0];
    const ReportBeam& b = r.beams[1];
    r.mismatch = mismatch_at_target(a.at_target, b.at_target);
    r.confocal_ratio = (a.confocal_tangential_mm + a.confocal_sagittal_mm) /
                       (b.confocal_tangential_mm + b.confocal_sagittal_mm);
    r.overlap = overlap_at_target(a.at_target, b.at_target);
}

}  // namespace rv::report_sections
