// The delay stage: which beam it delays, the delay per mm of travel, where the delay is zero
// and, with a measured zero reading, the emission offset the model does not know
// (docs/user-guide.md, Time zero). The delay is linear in the stage position, so one more trace
// with the stage 1 mm further on gives its slope.
#include "analysis/report_sections.hpp"

namespace rv::report_sections {

namespace {

double delay_fs(const std::vector<ReportBeam>& b) {
    return b[0].at_target.arrival_fs - b[1].at_target.arrival_fs;
}

// The beam whose path the stage changes: the first with an optic the stage carries.
std::string carried_beam(const Layout& layout, const Stage& s,
                         const std::vector<ReportBeam>& beams) {
    for (const ReportBeam& b : beams)
        for (const TraceHit& h : b.path.hits)
            for (const std::string& c : s.carries)
                if (layout.elements[h.element].id == c) return b.id;
    return "";
}

}  // namespace

std::optional<StageReport> stage_of(const Layout& layout, const MaterialLibrary& library,
                                    const std::vector<ReportBeam>& beams) {
    if (!both_reach(beams)) return std::nullopt;
    for (size_t e = 0; e < layout.elements.size(); ++e) {
        const auto* s = std::get_if<Stage>(&layout.elements[e].kind);
        if (!s) continue;
        const std::string beam = carried_beam(layout, *s, beams);
        if (beam.empty()) continue;
        Layout moved = layout;
        std::get<Stage>(moved.elements[e].kind).position_mm += 1.0;
        const std::vector<ReportBeam> after = trace_beams(moved, library, false);
        if (!both_reach(after)) continue;
        StageReport r;
        r.id = layout.elements[e].id;
        r.beam = beam;
        r.position_mm = s->position_mm;
        const double delay = delay_fs(beams);
        r.delay_per_mm_fs = delay_fs(after) - delay;
        if (r.delay_per_mm_fs == 0) continue;
        r.zero_delay_mm = s->position_mm - delay / r.delay_per_mm_fs;
        r.zero_in_travel =
            r.zero_delay_mm >= s->travel_min_mm && r.zero_delay_mm <= s->travel_max_mm;
        r.move_mm = r.zero_delay_mm - s->position_mm;
        if (s->measured_zero_mm) {
            r.measured_zero_mm = s->measured_zero_mm;
            r.emission_offset_fs =
                delay + r.delay_per_mm_fs * (*s->measured_zero_mm - s->position_mm);
        }
        return r;
    }
    return std::nullopt;
}

}  // namespace rv::report_sections
