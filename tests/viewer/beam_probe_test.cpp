// What the cursor reads on the table (scene/beam_probe): the nearest point of a beam, its path
// length, both radii and the arrival time there, an optic's summary and the ruler along a beam.
#include "scene/beam_probe.hpp"

#include <cmath>

#include "analysis/report.hpp"
#include "materials/dispersion.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::layout_from;
using rv::test::layout_json;
using rv::test::near;
using rv::test::near_rel;

namespace {

// One beam from (0, 500) along +x, turned to +y by a 45° mirror at (300, 500), crossing a
// target plane at (300, 800) and leaving the 1000 mm table at y = 1000.
struct Folded {
    rv::Layout layout;
    rv::RendezvousReport report;
};
Folded folded(double waist_um = 200, double wavelength_nm = 1064) {
    rv::Layout l = layout_from(layout_json(
        R"({"id": "b", "wavelength_nm": )" + std::to_string(wavelength_nm) +
            R"(, "start_mm": [0, 500], "direction_deg": 0, "waist_um": )" + std::to_string(waist_um) + "}",
        R"({"id": "M", "type": "mirror", "at_mm": [300, 500], "normal_deg": 135},
           {"id": "T", "type": "target", "at_mm": [300, 800], "normal_deg": -90, "aperture_mm": 50})",
        "T"));
    rv::RendezvousReport r = rv::build_report(l, rv::material_library_for(l));
    return {std::move(l), std::move(r)};
}

}  // namespace

TEST_CASE("the nearest beam point lies on the chief ray with its path length from the start", "[probe]") {
    const Folded f = folded();
    // Hand computation: the foot of the perpendicular from (150, 510) on the first leg is
    // (150, 500), 10 mm away, 150 mm from the start; from (305, 650) on the second leg it is
    // (300, 650), 300 + 150 mm from the start.
    const auto a = rv::scene::nearest_beam_point(f.report, rv::Vec2(150, 510), 12);
    REQUIRE(a);
    CHECK(a->segment == 0);
    CHECK_THAT(a->at_mm.x(), near(150, 1e-9));
    CHECK_THAT(a->at_mm.y(), near(500, 1e-9));
    CHECK_THAT(a->distance_mm, near(10, 1e-9));
    CHECK_THAT(a->s_mm, near(150, 1e-9));
    const auto b = rv::scene::nearest_beam_point(f.report, rv::Vec2(305, 650), 12);
    REQUIRE(b);
    CHECK(b->segment == 1);
    CHECK_THAT(b->s_mm, near(450, 1e-9));
    CHECK_THAT(b->into_mm, near(150, 1e-9));
    // Farther than the limit from every leg: nothing.
    CHECK_FALSE(rv::scene::nearest_beam_point(f.report, rv::Vec2(150, 530), 12));
    // Beyond the end of the drawn path the nearest point is its end (clamped), here the table's
    // edge at (300, 1000), 300 + 500 mm from the start.
    const auto end = rv::scene::nearest_beam_point(f.report, rv::Vec2(300, 1004), 12);
    REQUIRE(end);
    CHECK_THAT(end->s_mm, near(800, 1e-6));
}

TEST_CASE("the radii read at a point follow the Gaussian spreading law", "[probe]") {
    // Siegman, Lasers (1986) ch. 17: w(z) = w0 sqrt(1 + (z/z_R)^2), z_R = pi w0^2 / lambda, in
    // air taken as index 1 for the beam (docs/physics.md §0.3); a round beam, both planes alike.
    const double w0_um = 200, lambda_mm = 1064e-6;
    const Folded f = folded(w0_um, 1064);
    const double z_r_mm = rv::kPi * std::pow(w0_um * 1e-3, 2) / lambda_mm;
    for (const double s_mm : {37.3, 401.3, 612.9}) {
        CAPTURE(s_mm);
        const rv::Vec2 p = s_mm < 300 ? rv::Vec2(s_mm, 503) : rv::Vec2(297, 500 + s_mm - 300);
        const auto point = rv::scene::nearest_beam_point(f.report, p, 5);
        REQUIRE(point);
        const rv::scene::BeamReadout r = rv::scene::read_beam_at(f.layout, f.report, *point);
        const double expected_um = w0_um * std::sqrt(1 + std::pow(s_mm / z_r_mm, 2));
        REQUIRE(r.radius_tangential_um);
        REQUIRE(r.radius_sagittal_um);
        // Linear between envelope samples 5 mm apart: within 0.2 % of the law here.
        CHECK_THAT(*r.radius_tangential_um, near_rel(expected_um, 2e-3));
        CHECK_THAT(*r.radius_sagittal_um, near_rel(expected_um, 2e-3));
    }
}

TEST_CASE("the arrival time at a point is the emission plus the path at the group index of air", "[probe]") {
    // Diels & Rudolph (2006) ch. 1: group delay n_g L / c; standard air at 800 nm has
    // n_g = 1.000 27997 (Ciddor 1996, as in the stage test of timing_test.cpp). Hand values:
    // 150 mm → 500 486.2 fs, 450 mm (past the mirror) → 1 501 458.7 fs, 700 mm (past the target
    // plane, on the leg to the table's edge that ends at no hit) → 2 335 602.4 fs.
    const Folded f = folded(500, 800);
    struct Row {
        rv::Vec2 at_mm;
        double s_mm, expected_fs;
    };
    for (const Row& row : {Row{{150, 501}, 150, 500486.2}, Row{{301, 650}, 450, 1501458.7}, Row{{299, 900}, 700, 2335602.4}}) {
        CAPTURE(row.s_mm);
        const auto point = rv::scene::nearest_beam_point(f.report, row.at_mm, 3);
        REQUIRE(point);
        const rv::scene::BeamReadout r = rv::scene::read_beam_at(f.layout, f.report, *point);
        CHECK_THAT(r.s_mm, near(row.s_mm, 1e-9));
        CHECK_THAT(r.arrival_fs, near(row.expected_fs, 1.0));
        // The same figure from the trace's own group index of the air.
        const double ng = rv::sample_index(*rv::MaterialLibrary::builtin().find("air"), 800).group_index;
        CHECK_THAT(r.arrival_fs, near_rel(ng * row.s_mm / rv::kSpeedOfLight_mm_per_fs, 1e-12));
    }
}

TEST_CASE("the ruler along a beam gives the path length between two of its points", "[probe]") {
    const Folded f = folded();
    // Hand computation: (100, 500) is 100 mm from the start, (300, 700) is 300 + 200 mm; along
    // the beam 400 mm apart, although only 282.8 mm apart in a straight line.
    const auto a = rv::scene::nearest_beam_point(f.report, rv::Vec2(100, 502), 5);
    const auto b = rv::scene::nearest_beam_point(f.report, rv::Vec2(302, 700), 5);
    REQUIRE(a);
    REQUIRE(b);
    const auto along = rv::scene::path_length_between_mm(*a, *b);
    REQUIRE(along);
    CHECK_THAT(*along, near(400, 1e-9));
    CHECK_THAT(*rv::scene::path_length_between_mm(*b, *a), near(400, 1e-9));
    rv::scene::BeamPoint other = *b;
    other.beam = 1;  // a point of another beam: no length along one beam
    CHECK_FALSE(rv::scene::path_length_between_mm(*a, other));
}

TEST_CASE("an optic's summary names it and each beam's pass with its path length", "[probe]") {
    const Folded f = folded();
    size_t mirror = 0;
    while (f.layout.elements[mirror].id != "M") ++mirror;
    const std::string text = rv::scene::optic_summary_text(f.layout, f.report, mirror);
    CAPTURE(text);
    CHECK(text.find("M (mirror) at x 300.0, y 500.0 mm") != std::string::npos);
    // The mirror is met once, 300 mm from the start (hand computation).
    CHECK(text.find("\nb: 300.0 mm from its start") != std::string::npos);
    CHECK(text.find("arrives") != std::string::npos);
}

TEST_CASE("a beam readout never prints a non-finite number", "[probe]") {
    rv::scene::BeamReadout r;
    r.beam_id = "b";
    r.wavelength_nm = 800;
    r.s_mm = std::nan("");
    r.arrival_fs = INFINITY;
    const std::string text = rv::scene::beam_readout_text(r);
    CAPTURE(text);
    CHECK(text.find("nan") == std::string::npos);
    CHECK(text.find("inf") == std::string::npos);
}
