// An extraordinary input's walk-off in the target crystal (issue 16 §1): the chief ray (the
// energy) drifts by ρ·z in the plane of the optic axis, and the offset at the centre, the overlap
// along the crystal and the verdict include it. Fixtures: tests/layouts/walkoff/, a type-II SFG
// of 1030 nm (o) and 780 nm (e) in 1 mm BBO (Kato 1986's set) cut for it at normal incidence,
// both beams on one line with 21 µm waists at the crystal centre, the optic axis in the vertical
// plane or in the table plane.
#include <cmath>
#include <string>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "materials/dispersion.hpp"
#include "materials/material_library.hpp"
#include "nonlinear/wave_dispersion.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

namespace {

rv::Layout fixture(const char* name) {
    const rv::LayoutReadResult r =
        rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/tests/layouts/walkoff/" + name);
    REQUIRE(r.layout.has_value());
    return *r.layout;
}

// ρ of BBO's e wave at 780 nm at θ = the cut (normal incidence): Boyd, Nonlinear Optics (3rd
// ed., 2008) §2.3, tan ρ = ½ n_e(θ)² (n_e⁻² − n_o⁻²) sin 2θ, written out here.
double tan_rho_780(const rv::Layout& l) {
    const rv::Crystal& x = std::get<rv::Crystal>(l.find("X")->kind);
    const double cut_deg = x.cut_deg;
    const rv::Material& bbo = rv::test::material(x.material.c_str());
    const double no = rv::sample_index(bbo, 780, rv::Axis::Ordinary).index;
    const double ne = rv::sample_index(bbo, 780, rv::Axis::Extraordinary).index;
    const double th = rv::deg_to_rad(cut_deg);
    const double ne_th2 = 1 / (std::pow(std::cos(th) / no, 2) + std::pow(std::sin(th) / ne, 2));
    return 0.5 * ne_th2 * (1 / (ne * ne) - 1 / (no * no)) * std::sin(2 * th);
}

// The beam radius at z (mm from the target plane along the beam) from the report's figures at
// the target: w(z) = w0 √(1 + ((z − z_w)/z_R)²) (Siegman, Lasers, 1986, ch. 17).
double radius_um(const rv::PlaneAtTarget& p, double z_mm) {
    return p.waist_um * std::sqrt(1 + std::pow((z_mm - p.waist_offset_mm) / p.rayleigh_mm, 2));
}

// The intensity overlap ∫I1 I2 / √(∫I1² ∫I2²) of two 1-D Gaussians exp(−2x²/w²) whose centres
// are d apart, by a midpoint sum over ±6 w (independent of nonlinear/overlap.hpp's closed form).
double overlap_1d(double w1, double w2, double d) {
    const double span = 6 * std::max(w1, w2) + std::abs(d);
    const int n = 1200;
    double i12 = 0, i11 = 0, i22 = 0;
    for (int k = 0; k < n; ++k) {
        const double x = -span + (k + 0.5) * 2 * span / n;
        const double a = std::exp(-2 * x * x / (w1 * w1)), b = std::exp(-2 * (x - d) * (x - d) / (w2 * w2));
        i12 += a * b, i11 += a * a, i22 += b * b;
    }
    return i12 / std::sqrt(i11 * i22);
}

// The mean over the crystal's depth ζ ∈ [−L/2, L/2] of the product of both planes' overlaps,
// the e beam (second) offset by tan ρ (ζ + L/2) in the plane of the axis (it enters on the o
// beam's line), by a midpoint sum.
double overlap_along(const rv::BeamAtTarget& o, const rv::BeamAtTarget& e, double length_mm, double tan_rho,
                     bool in_table_plane) {
    const int n = 200;
    double sum = 0;
    for (int k = 0; k < n; ++k) {
        const double z = -length_mm / 2 + (k + 0.5) * length_mm / n;
        const double d_um = 1e3 * tan_rho * (z + length_mm / 2);
        const double t = overlap_1d(radius_um(o.tangential, z), radius_um(e.tangential, z), in_table_plane ? d_um : 0);
        const double s = overlap_1d(radius_um(o.sagittal, z), radius_um(e.sagittal, z), in_table_plane ? 0 : d_um);
        sum += t * s;
    }
    return sum / n;
}

}  // namespace

TEST_CASE("an extraordinary input walks off out of the table plane by rho L", "[walkoff][trace]") {
    const rv::Layout l = fixture("type2-vertical-axis.json");
    const rv::RendezvousReport r = rv::build_report(l, rv::MaterialLibrary::builtin());
    REQUIRE(r.beams.size() == 2);
    const rv::BeamAtTarget &o = r.beams[0].at_target, &e = r.beams[1].at_target;
    REQUIRE(o.reached);
    REQUIRE(e.reached);
    const double tan_rho = tan_rho_780(l);
    CAPTURE(tan_rho);
    CHECK(tan_rho > 0.06);  // a few degrees (from memory: BBO walks off about 4° near 40°)
    // The optic axis rises from the face normal by the cut: the e energy runs away from it,
    // downwards, by (L/2) tan ρ at the centre and L tan ρ at the exit; the o beam stays.
    CHECK_THAT(e.vertical_mm, near(-0.5 * tan_rho, 1e-9));
    CHECK_THAT(e.vertical_slope, near(-tan_rho, 1e-12));
    CHECK(o.vertical_mm == 0);
    CHECK(o.vertical_slope == 0);
    // The drawn trace stays on its line in the table plane.
    CHECK_THAT(e.hit_mm.y(), near(200, 1e-9));
    REQUIRE(r.mismatch);
    CHECK_THAT(r.mismatch->lateral_sagittal_um, near(500 * tan_rho, 1e-6));
    CHECK_THAT(r.mismatch->lateral_tangential_um, near(0, 1e-6));
    CHECK_THAT(r.mismatch->lateral_um, near(500 * tan_rho, 1e-6));
    // Past the crystal the beam leaves parallel to the table, displaced by L tan ρ.
    const rv::Path& p = r.beams[1].path;
    REQUIRE(p.hits.size() > *p.target_hit + 2);
    const rv::TraceHit& exit = p.hits[*p.target_hit + 1];
    const rv::TraceHit& dump = p.hits[*p.target_hit + 2];
    CHECK_THAT(exit.vertical_mm, near(-tan_rho, 1e-9));
    CHECK(dump.vertical_slope_in == 0);
    CHECK_THAT(dump.vertical_mm, near(-tan_rho, 1e-9));
    // The overlap along the crystal against the independent one (to 1 %), far below the
    // overlap without walk-off (both beams alike: above 0.99).
    REQUIRE(r.overlap);
    const double expected = overlap_along(o, e, 1.0, tan_rho, false);
    CAPTURE(expected);
    CHECK(expected < 0.5);
    CHECK_THAT(r.overlap->spatial_along_crystal, near_rel(expected, 0.01));
    // The verdict's space line: √(w1² + w2²) ≈ 30 µm against (L/2) tan ρ ≈ 38 µm apart at the centre.
    CHECK_FALSE(r.verdict.space.met);
}

TEST_CASE("an extraordinary input walks off in the table plane and the drawn ray turns by rho", "[walkoff][trace]") {
    const rv::Layout l = fixture("type2-table-axis.json");
    const rv::RendezvousReport r = rv::build_report(l, rv::MaterialLibrary::builtin());
    REQUIRE(r.beams.size() == 2);
    const rv::BeamAtTarget &o = r.beams[0].at_target, &e = r.beams[1].at_target;
    REQUIRE(o.reached);
    REQUIRE(e.reached);
    const double tan_rho = tan_rho_780(l);
    // The axis points at +cut from the face normal (+x) towards +y: the e energy runs towards −y.
    CHECK_THAT(e.hit_mm.y(), near(200 - 0.5 * tan_rho, 1e-9));
    CHECK_THAT(o.hit_mm.y(), near(200, 1e-9));
    CHECK_THAT(e.direction.y() / e.direction.x(), near(-tan_rho, 1e-12));
    CHECK_THAT(e.wave_direction.x(), near(1, 1e-12));  // the wave vector along the normal
    CHECK(e.vertical_mm == 0);
    REQUIRE(r.mismatch);
    CHECK_THAT(r.mismatch->lateral_tangential_um, near(500 * tan_rho, 1e-6));
    CHECK_THAT(r.mismatch->lateral_sagittal_um, near(0, 1e-9));
    CHECK_THAT(r.mismatch->angle_mrad, near(1e3 * std::atan(tan_rho), 1e-6));
    // The drawn segment inside the crystal and the exit: parallel to the input, L tan ρ aside.
    const rv::Path& p = r.beams[1].path;
    REQUIRE(p.hits.size() > *p.target_hit + 2);
    const rv::TraceHit& exit = p.hits[*p.target_hit + 1];
    CHECK_THAT(exit.point_mm.y(), near(200 - tan_rho, 1e-9));
    CHECK_THAT(exit.direction_out.x(), near(1, 1e-12));
    CHECK_THAT(exit.direction_out.y(), near(0, 1e-12));
    // The phase matching reads the wave vector, not the energy: θ now is the cut.
    REQUIRE_FALSE(r.phase_matching.empty());
    CHECK_THAT(r.phase_matching.front().theta_now_deg, near(41.2, 1e-9));
    // The fixture is cut for the SFG (θ_pm of BBO type II oee, 1030 + 780 nm, about 41.2°).
    CHECK(r.phase_matching.front().sinc2_now > 0.9);
    REQUIRE(r.overlap);
    const double expected = overlap_along(o, e, 1.0, tan_rho, true);
    CAPTURE(expected);
    CHECK(expected < 0.5);
    CHECK_THAT(r.overlap->spatial_along_crystal, near_rel(expected, 0.01));
    CHECK_FALSE(r.verdict.space.met);
}

TEST_CASE("the walk-off is the same in either plane of the optic axis", "[walkoff][trace]") {
    // The two fixtures are one another turned about the beam by 90°: the same drift, in the
    // other plane (the energy's path differs only by its cos ρ in the delay's length).
    const rv::RendezvousReport v =
        rv::build_report(fixture("type2-vertical-axis.json"), rv::MaterialLibrary::builtin());
    const rv::RendezvousReport t = rv::build_report(fixture("type2-table-axis.json"), rv::MaterialLibrary::builtin());
    REQUIRE(v.mismatch);
    REQUIRE(t.mismatch);
    CHECK_THAT(v.mismatch->lateral_um, near(t.mismatch->lateral_um, 1e-6));
    REQUIRE(v.overlap);
    REQUIRE(t.overlap);
    CHECK_THAT(v.overlap->spatial_along_crystal, near_rel(t.overlap->spatial_along_crystal, 0.01));
    // The delay through the crystal is that of its thickness along k in both (cos ρ, Medium).
    CHECK_THAT(v.mismatch->delay_fs, near(t.mismatch->delay_fs, 1e-6));
    // So is the e input's dispersion: air to the entrance plus (L/2) k''_e(θ) to the centre,
    // k''_e at θ = the cut from the crystal's own set (nonlinear/wave_dispersion.hpp).
    const rv::BeamAtTarget &ev = v.beams[1].at_target, &et = t.beams[1].at_target;
    CHECK_THAT(ev.pulse.gdd_fs2, near(et.pulse.gdd_fs2, 1e-6));
    CHECK_THAT(ev.pulse.tod_fs3, near(et.pulse.tod_fs3, 1e-6));
    const rv::Material& bbo = rv::test::material("BBO:Kato1986");
    const double inside =
        0.5 * rv::wave_sample(rv::crystal_indices(bbo, 780), rv::Polarity::B, rv::deg_to_rad(41.2)).gvd_fs2_per_mm;
    const rv::Path& p = v.beams[1].path;
    double air = 0;
    for (size_t k = 0; k + 1 < p.segments.size() && k < *p.target_hit; ++k) air += p.segments[k].length_mm * p.segments[k].gvd_fs2_per_mm;
    CHECK_THAT(ev.pulse.gdd_fs2, near(air + inside, 1e-9));
    // Between L/2 times the ordinary and the principal extraordinary GVD of the set.
    const double go = rv::sample_index(bbo, 780, rv::Axis::Ordinary).gvd_fs2_per_mm;
    const double ge = rv::sample_index(bbo, 780, rv::Axis::Extraordinary).gvd_fs2_per_mm;
    CHECK(inside < 0.5 * std::max(go, ge));
    CHECK(inside > 0.5 * std::min(go, ge));
}
