#pragma once
// What the cursor points at on the table, without any UI: the nearest point of a traced beam
// (its path length from the beam's start), what the core computed there (both Gaussian radii
// from the propagation's envelope, the pulse's arrival time from the trace's group delays),
// the summary of an optic, and the path length along one beam between two of its points (the
// ruler that measures along a beam). Lengths in table mm, radii in µm, times in fs.

#include <optional>
#include <string>

#include "analysis/report.hpp"
#include "layout/layout.hpp"

namespace rv::scene {

struct BeamPoint {
    size_t beam = 0;         // index into RendezvousReport::beams
    size_t segment = 0;      // index into that beam's path.segments
    double into_mm = 0;      // from the segment's start
    double s_mm = 0;         // path length from the beam's start
    Vec2 at_mm{0, 0};        // the point on the chief ray
    double distance_mm = 0;  // from the probed point to at_mm
};

// The point of any beam's chief ray (only_beam: of that beam) nearest to p_mm, if one lies
// within within_mm; of two equally near, the first beam's and earliest segment's. Complete
// paths only (a report's paths are).
std::optional<BeamPoint> nearest_beam_point(const RendezvousReport& report, const Vec2& p_mm, double within_mm,
                                            std::optional<size_t> only_beam = std::nullopt);

struct BeamReadout {
    std::string beam_id;
    double wavelength_nm = 0;
    double s_mm = 0;
    // Linear between the propagation's envelope samples around s (Caustic::envelope: 5 mm
    // apart, denser near the target); none where the beam was not sampled.
    std::optional<double> radius_tangential_um, radius_sagittal_um;
    double arrival_fs = 0;  // analysis/timing's arrival_time_along_fs
};
BeamReadout read_beam_at(const Layout& layout, const RendezvousReport& report, const BeamPoint& point);

// "s1 (1550 nm): 312.4 mm from its start · w 812.3 / 801.9 µm (t / s) · arrives 1 042.6 ps"
std::string beam_readout_text(const BeamReadout& readout);

// The path length between two points of the same beam (none for points of different beams).
std::optional<double> path_length_between_mm(const BeamPoint& a, const BeamPoint& b);

// An optic's summary: "L1_P (lens) at x 100.0, y 250.0 mm, normal 0.0°, aperture 25.4 mm" and
// one line per pass of a beam (its radii arriving, from Caustic::at_hits, and its arrival time).
std::string optic_summary_text(const Layout& layout, const RendezvousReport& report, size_t element);

}  // namespace rv::scene
