// The chief-ray trace against hand-computed geometry and published formulas.
#include "trace/trace.hpp"

#include <cmath>

#include "materials/dispersion.hpp"
#include "optics/tilted_plate.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::layout_from;
using rv::test::layout_json;
using rv::test::near;

namespace {
std::vector<rv::Path> trace(const rv::Layout& l) { return rv::trace_layout(l, rv::material_library_for(l)); }
double angle_deg(const rv::Vec2& d) { return rv::rad_to_deg(std::atan2(d.y(), d.x())); }
bool has_finding(const rv::Path& p, rv::Finding::Kind k) {
    for (const rv::Finding& f : p.findings)
        if (f.kind == k) return true;
    return false;
}
const char* kBeam1064 =
    R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 0], "direction_deg": 0, "waist_um": 500})";
const char* kBeam1064At500 =
    R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 500})";
}  // namespace

TEST_CASE("folded path: path length and exit angle by hand", "[trace]") {
    // Hand geometry (common practice: law of reflection, direction angle α' = 2ν − α + 180°
    // for a mirror with normal angle ν): two 45° folds, 100 + 50 + 100 mm to the target.
    const rv::Layout l = layout_from(layout_json(kBeam1064,
        R"({"id": "M1", "type": "mirror", "at_mm": [100, 0], "normal_deg": 135},
           {"id": "M2", "type": "mirror", "at_mm": [100, 50], "normal_deg": -45},
           {"id": "T", "type": "target", "at_mm": [200, 50]})", "T"));
    const rv::Path p = trace(l)[0];
    REQUIRE(p.target_hit);
    REQUIRE(p.hits.size() == 3);
    CHECK_THAT(p.hits[0].s_mm, near(100, 1e-9));
    CHECK_THAT(p.hits[1].s_mm, near(150, 1e-9));
    CHECK_THAT(p.hits[2].s_mm, near(250, 1e-9));
    CHECK_THAT(angle_deg(p.hits[0].direction_out), near(90, 1e-9));
    CHECK_THAT(angle_deg(p.hits[2].direction_in), near(0, 1e-9));
    CHECK_THAT(rv::rad_to_deg(p.hits[0].aoi_rad()), near(45, 1e-9));

    // A 30° deviation: normal at 165° turns a beam going along 0° to 2·165 − 0 + 180 = 150°.
    const rv::Layout l2 = layout_from(layout_json(kBeam1064,
        R"({"id": "M", "type": "mirror", "at_mm": [100, 0], "normal_deg": 165},
           {"id": "T", "type": "target", "at_mm": [13.397459621556, 50], "normal_deg": 150})", "T"));
    const rv::Path q = trace(l2)[0];
    REQUIRE(q.target_hit);
    CHECK_THAT(angle_deg(q.hits[0].direction_out), near(150, 1e-9));
    CHECK_THAT(q.hits[1].s_mm, near(200, 1e-9));  // 100 mm, then 100 mm at 150° to (13.4, 50)
}

TEST_CASE("dichroic routing by wavelength", "[trace][dichroic]") {
    // Edge 800 nm, reflects shorter: 532 nm turns by 90°, 1064 nm crosses the 3 mm fused-silica
    // substrate at 45° and is displaced by t sinθ [1 − cosθ/√(n² − sin²θ)] (plate formula,
    // docs/physics.md §2.1) with n(1064) of Malitson 1965.
    const rv::Layout l = layout_from(layout_json(
        std::string(kBeam1064At500) + R"(, {"id": "g", "wavelength_nm": 532, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 500})",
        R"({"id": "DM", "type": "dichroic", "at_mm": [100, 500], "normal_deg": 135, "edge_nm": 800, "reflects": "shorter", "substrate": {"glass": "fused-silica", "thickness_mm": 3}},
           {"id": "T1", "type": "target", "at_mm": [100, 600], "normal_deg": 90},
           {"id": "T", "type": "target", "at_mm": [200, 500]})", "T"));
    const std::vector<rv::Path> p = trace(l);
    REQUIRE(p[0].target_hit);
    const rv::TraceHit& ir = p[0].hits[*p[0].target_hit];
    const double n = 1.449631, th = rv::kPi / 4;
    const double shift = 3 * std::sin(th) * (1 - std::cos(th) / std::sqrt(n * n - std::sin(th) * std::sin(th)));
    CHECK_THAT(ir.point_mm.y(), near(500 - shift, 2e-6));  // n above is rounded to 6 decimals
    CHECK_THAT(angle_deg(ir.direction_in), near(0, 1e-9));
    REQUIRE(p[1].hits.size() >= 2);
    CHECK(l.elements[p[1].hits[0].element].id == "DM");
    CHECK(p[1].hits[0].interaction == rv::Interaction::Reflect);
    CHECK_THAT(angle_deg(p[1].hits[0].direction_out), near(90, 1e-9));
    CHECK(l.elements[p[1].hits[1].element].id == "T1");
    CHECK(has_finding(p[1], rv::Finding::Kind::NoTarget));
}

TEST_CASE("a decentred thin lens steers the ray by -h/f", "[trace][lens]") {
    // Paraxial thin-lens ray matrix (Kogelnik & Li 1966): θ' = θ − h/f; a ray parallel to the
    // axis at h = 2 mm through f = 50 mm crosses the axis in the focal plane.
    const rv::Layout l = layout_from(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 2], "direction_deg": 0, "waist_um": 500})",
        R"({"id": "L", "type": "lens", "at_mm": [100, 0], "focal_length_mm": 50},
           {"id": "T", "type": "target", "at_mm": [150, 0]})", "T"));
    const rv::Path p = trace(l)[0];
    REQUIRE(p.target_hit);
    const rv::Vec2 d = p.hits[0].direction_out;
    CHECK_THAT(d.y() / d.x(), near(-2.0 / 50.0, 1e-12));
    CHECK_THAT(p.hits[1].point_mm.y(), near(0.0, 1e-12));
}

TEST_CASE("a retroreflector on a stage changes the path by twice the motion", "[trace][stage]") {
    // Double pass of a retroreflector delay line (docs/physics.md §7; docs/practice.md §2.5).
    auto path_for = [](double position) {
        const std::string stage = std::to_string(position);
        const rv::Layout l = layout_from(layout_json(kBeam1064,
            R"({"id": "M1", "type": "mirror", "at_mm": [100, 0], "normal_deg": 135},
               {"id": "RR", "type": "retroreflector", "at_mm": [110, 200], "normal_deg": -90, "aperture_mm": 50.8},
               {"id": "S", "type": "stage", "carries": ["RR"], "axis_deg": 90, "position_mm": )" + stage +
            R"(, "travel_mm": [-25, 25]},
               {"id": "T", "type": "target", "at_mm": [120, 50], "normal_deg": 90})", "T"));
        const rv::Path p = trace(l)[0];
        REQUIRE(p.target_hit);
        return p.hits[*p.target_hit].s_mm;
    };
    // Hand geometry at position 0: 100 mm, up 200 mm, folded across the axis, down 150 mm.
    CHECK_THAT(path_for(0), near(450, 1e-9));
    CHECK_THAT(path_for(7.5) - path_for(0), near(15.0, 1e-9));
    CHECK_THAT(path_for(-12.5) - path_for(0), near(-25.0, 1e-9));
}

TEST_CASE("a tilted plate shifts the ray as the published formula says", "[trace][plate]") {
    // d = t sinθ [1 − cosθ/√(n² − sin²θ)] (docs/physics.md §2.1); N-BK7 3 mm at 30°, n(1064) from
    // the SCHOTT Sellmeier set: the transmitted ray is parallel and displaced by d.
    const rv::Layout l = layout_from(layout_json(kBeam1064At500,
        R"({"id": "P", "type": "plate", "at_mm": [50, 500], "normal_deg": 150, "material": "N-BK7", "thickness_mm": 3},
           {"id": "T", "type": "target", "at_mm": [200, 500]})", "T"));
    const rv::Path p = trace(l)[0];
    REQUIRE(p.target_hit);
    const double n = rv::sample_index(*rv::MaterialLibrary::builtin().find("N-BK7"), 1064).index;
    const rv::TiltedPlate plate = rv::tilted_plate(3, n, rv::deg_to_rad(30));
    CHECK_THAT(std::abs(p.hits[*p.target_hit].point_mm.y() - 500), near(plate.lateral_shift_mm, 1e-12));
    CHECK_THAT(angle_deg(p.hits[*p.target_hit].direction_in), near(0, 1e-12));
    CHECK_THAT((p.hits[1].point_mm - p.hits[0].point_mm).norm(), near(plate.glass_path_mm, 1e-12));
}

TEST_CASE("findings are data: leaving the table, too many hits, the back of a mirror", "[trace][findings]") {
    {
        const rv::Layout l = layout_from(layout_json(kBeam1064,
            R"({"id": "T", "type": "target", "at_mm": [200, 50]})", "T"));
        const rv::Path p = trace(l)[0];
        REQUIRE(p.findings.size() == 2);
        CHECK(p.findings[0].kind == rv::Finding::Kind::LeftTable);
        CHECK(rv::finding_text(p.findings[0]) == "leaves the table at (1000.00, 0.00) mm");
        CHECK(rv::finding_text(p.findings[1]) == "never reaches the target T");
    }
    {  // Two mirrors face to face: the ray bounces until the hit limit.
        const rv::Layout l = layout_from(layout_json(
            R"({"id": "b", "wavelength_nm": 1064, "start_mm": [50, 0], "direction_deg": 0, "waist_um": 500})",
            R"({"id": "A", "type": "mirror", "at_mm": [100, 0], "normal_deg": 180},
               {"id": "B", "type": "mirror", "at_mm": [0, 0], "normal_deg": 0},
               {"id": "T", "type": "target", "at_mm": [50, 300], "normal_deg": 90})", "T"));
        const rv::Path p = trace(l)[0];
        CHECK(p.hits.size() == rv::kMaxHitsPerBeam);
        CHECK(has_finding(p, rv::Finding::Kind::TooManyHits));
    }
    {
        const rv::Layout l = layout_from(layout_json(kBeam1064,
            R"({"id": "M", "type": "mirror", "at_mm": [100, 0], "normal_deg": 0},
               {"id": "T", "type": "target", "at_mm": [200, 0]})", "T"));
        const rv::Path p = trace(l)[0];
        REQUIRE(!p.findings.empty());
        CHECK(rv::finding_text(p.findings[0]) == "meets the back of mirror M");
    }
}

TEST_CASE("an aimed mirror hit off centre misses a small optic and says by how much", "[trace][findings]") {
    // aim_at orients M for a ray at its centre; this beam meets M 4 mm off centre, so the fold
    // sends it parallel to the aim line, 4 mm aside (45° fold: offset stays 4 mm); X's aperture
    // is 2 mm wide, so it misses by 4 − 1 = 3 mm (hand geometry).
    const rv::Layout l = layout_from(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 4], "direction_deg": 0, "waist_um": 500})",
        R"({"id": "M", "type": "mirror", "at_mm": [100, 0], "aim_at": "X"},
           {"id": "X", "type": "target", "at_mm": [100, 100], "normal_deg": 90, "aperture_mm": 2})", "X"));
    const rv::Path p = trace(l)[0];
    REQUIRE(!p.findings.empty());
    CHECK(p.findings[0].kind == rv::Finding::Kind::MissedOptic);
    CHECK_THAT(p.findings[0].amount, near(3.0, 1e-9));
    CHECK(rv::finding_text(p.findings[0]) == "misses X by 3.00 mm (crosses its plane 4.00 mm from its centre)");
}

TEST_CASE("a wavelength outside a crystal's Sellmeier range is a finding", "[trace][findings]") {
    // Zhang 2000 BBO fits 0.64–3.18 µm (Opt. Commun. 184, 485).
    const rv::Layout l = layout_from(layout_json(
        R"({"id": "g", "wavelength_nm": 532, "start_mm": [0, 0], "direction_deg": 0, "waist_um": 500})",
        R"({"id": "X", "type": "crystal", "at_mm": [100, 0], "material": "BBO:Zhang2000", "length_mm": 2, "cut_deg": 30, "phase_matching": "type-I"})", "X"));
    const rv::Path p = trace(l)[0];
    REQUIRE(p.target_hit);
    REQUIRE(has_finding(p, rv::Finding::Kind::MaterialOutOfRange));
    CHECK(rv::finding_text(p.findings[0]) ==
          "532 nm lies outside the range of BBO:Zhang2000 (640–3180 nm); its index is extrapolated");
}

TEST_CASE("every bundled layout loads and traces and both beams reach the target", "[trace][layouts]") {
    for (const char* name : {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        CAPTURE(name);
        const rv::LayoutReadResult r = rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/layouts/" + name);
        REQUIRE(r.layout);
        for (const rv::Path& p : trace(*r.layout)) {
            CAPTURE(r.layout->beams[p.beam].id);
            CHECK(p.target_hit.has_value());
            for (const rv::Finding& f : p.findings) UNSCOPED_INFO(rv::finding_text(f));
            CHECK(p.findings.empty());
        }
    }
}

namespace {
// A fold mirror M1 at (100, 0) aims at M2 at (100, 200), which sends the light on to T; `between`
// adds optics on the leg from M1 to M2.
rv::Path aimed_fold_with(const std::string& between) {
    const rv::Layout l = layout_from(layout_json(kBeam1064,
        R"({"id": "M1", "type": "mirror", "at_mm": [100, 0], "aim_at": "M2"},)" + between +
        R"({"id": "M2", "type": "mirror", "at_mm": [100, 200], "normal_deg": -45},
           {"id": "T", "type": "target", "at_mm": [300, 200]})", "T"));
    return trace(l)[0];
}
bool reaches(const rv::Path& p, const std::string& id, const rv::Layout& l) {
    for (const rv::TraceHit& h : p.hits)
        if (l.elements[h.element].id == id) return true;
    return false;
}
}  // namespace

TEST_CASE("optics between an aim_at mirror and its aim are no miss", "[trace][aim]") {
    // Geometry by hand: M1 turns the beam by 90° onto the line x = 100; every optic below sits on
    // that line, centred and square to it, so the ray meets M2 at its centre.
    const char* cases[] = {
        R"({"id": "L", "type": "lens", "at_mm": [100, 100], "normal_deg": 90, "focal_length_mm": 150},)",
        R"({"id": "W", "type": "plate", "at_mm": [100, 100], "normal_deg": 90, "material": "fused-silica", "thickness_mm": 5},)",
        R"({"id": "L1", "type": "lens", "at_mm": [100, 60], "normal_deg": 90, "focal_length_mm": 100},
           {"id": "L2", "type": "lens", "at_mm": [100, 140], "normal_deg": 90, "focal_length_mm": -50},)",
        R"({"id": "L", "type": "lens", "at_mm": [100, 80], "normal_deg": 90, "focal_length_mm": 150},
           {"id": "S", "type": "stage", "carries": ["L"], "axis_deg": 90, "position_mm": 20, "travel_mm": [0, 50]},)",
    };
    for (const char* between : cases) {
        INFO(between);
        const rv::Path p = aimed_fold_with(between);
        CHECK_FALSE(has_finding(p, rv::Finding::Kind::MissedOptic));
        REQUIRE(p.target_hit);
        // The chief ray meets M2 at its centre (hit two before the target).
        const rv::TraceHit& m2 = p.hits[*p.target_hit - 1];
        CHECK_THAT(m2.height_mm, near(0, 1e-9));
    }
}

TEST_CASE("a lens that steers the beam off its aim is a miss", "[trace][aim]") {
    // A lens decentred by 5 mm with f = 20 mm deflects the ray by 5/20 rad (thin-lens ray
    // matrix, common practice); after 100 mm it crosses M2's plane about 25 mm off centre,
    // beyond M2's 12.7 mm half aperture.
    const rv::Layout l = layout_from(layout_json(kBeam1064,
        R"({"id": "M1", "type": "mirror", "at_mm": [100, 0], "aim_at": "M2"},
           {"id": "L", "type": "lens", "at_mm": [105, 100], "normal_deg": 90, "focal_length_mm": 20},
           {"id": "M2", "type": "mirror", "at_mm": [100, 200], "normal_deg": -45},
           {"id": "T", "type": "target", "at_mm": [300, 200]})", "T"));
    const rv::Path p = trace(l)[0];
    CHECK_FALSE(reaches(p, "M2", l));
    bool named = false;
    for (const rv::Finding& f : p.findings)
        if (f.kind == rv::Finding::Kind::MissedOptic && f.element == "M2") {
            named = true;
            CHECK(f.amount > 5);
        }
    CHECK(named);
}
