// Gaussian beams along traced paths: against Self's equation, mirror astigmatism, plate
// matrices and the aperture formula.
#include "trace/propagate.hpp"

#include <cmath>

#include "materials/dispersion.hpp"
#include "optics/tilted_plate.hpp"
#include "support/layouts.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

using rv::test::layout_from;
using rv::test::layout_json;
using rv::test::near;
using rv::test::near_rel;

namespace {
struct Traced {
    rv::Layout layout;
    rv::Path path;
    rv::Caustic caustic;
};
Traced run(const std::string& json) {
    Traced t{layout_from(json), {}, {}};
    const rv::MaterialLibrary lib = rv::material_library_for(t.layout);
    t.path = rv::trace_layout(t.layout, lib)[0];
    t.caustic = rv::propagate_path(t.layout, t.path);
    return t;
}
// Self 1983 (Appl. Opt. 22, 658): image distance and waist after a thin lens.
std::pair<double, double> self(double w0_mm, double s, double f, double lambda_mm, double m2 = 1) {
    const double zr = rv::kPi * w0_mm * w0_mm / (m2 * lambda_mm);
    const double a = s / f - 1, den = a * a + (zr / f) * (zr / f);
    return {f * (1 + a / den), w0_mm / std::sqrt(den)};
}
}  // namespace

TEST_CASE("a straight layout agrees with Self's equation", "[propagate][self]") {
    // docs/physics.md §1.3 example A (Self 1983): 1064 nm, w0 = 1 mm, s = 500 mm, f = 100 mm →
    // waist 100.45 mm after the lens, 33.562 µm.
    const Traced t = run(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 0], "direction_deg": 0, "waist_um": 1000})",
        R"({"id": "L", "type": "lens", "at_mm": [500, 0], "focal_length_mm": 100},
           {"id": "T", "type": "target", "at_mm": [600, 0]})", "T"));
    REQUIRE(t.caustic.reaches_target);
    const auto [image_mm, waist_mm] = self(1.0, 500, 100, 1064e-6);
    CHECK_THAT(100 + t.caustic.target_waist_offset_tangential_mm, near_rel(image_mm, 1e-9));
    CHECK_THAT(rv::waist_radius_um(t.caustic.target_sagittal) * 1e-3, near_rel(waist_mm, 1e-9));
    CHECK_THAT(100 + t.caustic.target_waist_offset_sagittal_mm, near(100.45, 0.005));
    CHECK_THAT(rv::waist_radius_um(t.caustic.target_tangential), near(33.562, 0.0005));
}

TEST_CASE("curved-mirror astigmatism from the traced angle", "[propagate][mirror]") {
    // Kogelnik et al., IEEE JQE 8, 373 (1972): f_t = R cos θ/2, f_s = R/(2 cos θ). The mirror's
    // normal at 160° meets the beam at 20°, so each plane focuses as a thin lens of its own f
    // (Self 1983 for the waist positions).
    const double R = 400, th = rv::deg_to_rad(20);
    const double out = rv::deg_to_rad(140);
    const rv::Vec2 target = rv::Vec2(300, 0) + 200 * rv::Vec2(std::cos(out), std::sin(out));
    const Traced t = run(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 0], "direction_deg": 0, "waist_um": 300})",
        R"({"id": "M", "type": "mirror", "at_mm": [300, 0], "normal_deg": 160, "radius_of_curvature_mm": 400},
           {"id": "T", "type": "target", "normal_deg": 140, "at_mm": [)" + std::to_string(target.x()) + ", " +
            std::to_string(target.y()) + "]}", "T"));
    REQUIRE(t.caustic.reaches_target);
    CHECK_THAT(t.path.hits[0].aoi_rad(), near(th, 1e-12));
    const auto [st, wt] = self(0.3, 300, R * std::cos(th) / 2, 1064e-6);
    const auto [ss, ws] = self(0.3, 300, R / (2 * std::cos(th)), 1064e-6);
    CHECK_THAT(200 + t.caustic.target_waist_offset_tangential_mm, near_rel(st, 1e-6));
    CHECK_THAT(200 + t.caustic.target_waist_offset_sagittal_mm, near_rel(ss, 1e-6));
    CHECK_THAT(rv::waist_radius_um(t.caustic.target_tangential) * 1e-3, near_rel(wt, 1e-9));
    CHECK_THAT(rv::waist_radius_um(t.caustic.target_sagittal) * 1e-3, near_rel(ws, 1e-9));
}

TEST_CASE("a tilted plate in the path acts as its effective lengths", "[propagate][plate]") {
    // docs/physics.md §2.1: between its faces the plate is free space of L_t = t cos²θ/(n cos³θ')
    // tangentially and L_s = t/(n cosθ') sagittally (tilted_plate_matrix, checked against
    // those formulas in optics/tilted_plate_test.cpp). A converging beam crosses N-BK7 3 mm at 45°.
    const Traced t = run(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 40, "waist_at_mm": 120})",
        R"({"id": "P", "type": "plate", "at_mm": [60, 500], "normal_deg": 135, "material": "N-BK7", "thickness_mm": 3},
           {"id": "T", "type": "target", "at_mm": [150, 500]})", "T"));
    REQUIRE(t.caustic.reaches_target);
    const double n = rv::sample_index(*rv::MaterialLibrary::builtin().find("N-BK7"), 1064).index;
    const double before = t.path.hits[0].s_mm;
    const double after = t.path.hits[2].s_mm - t.path.hits[1].s_mm;
    for (rv::Plane plane : {rv::Plane::Tangential, rv::Plane::Sagittal}) {
        const rv::GaussianBeam q = rv::propagate(
            rv::beam_from_waist({.waist_um = 40, .distance_to_waist_mm = 120, .wavelength_nm = 1064}),
            rv::free_space(after) * rv::tilted_plate_matrix(3, n, rv::kPi / 4, plane) * rv::free_space(before));
        const rv::GaussianBeam& got = plane == rv::Plane::Tangential ? t.caustic.target_tangential
                                                                      : t.caustic.target_sagittal;
        CHECK_THAT(got.q_mm.real(), near(q.q_mm.real(), 1e-9));
        CHECK_THAT(got.q_mm.imag(), near(q.q_mm.imag(), 1e-9));
    }
    // The astigmatic split of the waists equals L_s − L_t (docs/physics.md §2.1).
    const rv::TiltedPlate p = rv::tilted_plate(3, n, rv::kPi / 4);
    CHECK_THAT(t.caustic.target_waist_offset_tangential_mm - t.caustic.target_waist_offset_sagittal_mm,
               near(p.sagittal_length_mm - p.tangential_length_mm, 1e-9));
}

TEST_CASE("clipping at an aperture", "[propagate][clipping]") {
    // Power outside a circular aperture of radius a: exp(−2a²/w²) (docs/physics.md §1.6; docs/practice.md §2.1:
    // D = 2w transmits 86.5 %). At 45° the aperture seen in the table plane shrinks by cos 45°.
    // The aperture at normal incidence is a lens of negligible power (f = 1e5 mm, the largest the reader takes: over 100 mm it changes a 1 mm beam by far less than the tolerances below).
    const Traced t = run(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 1000, "waist_at_mm": 100})",
        R"({"id": "A", "type": "lens", "at_mm": [100, 500], "focal_length_mm": 1e5, "aperture_mm": 2},
           {"id": "T", "type": "target", "at_mm": [200, 500]})", "T"));
    REQUIRE(!t.caustic.at_hits.empty());
    CHECK_THAT(t.caustic.at_hits[0].clipped_fraction, near(std::exp(-2.0), 1e-12));
    CHECK_THAT(1 - t.caustic.at_hits[0].clipped_fraction, near(0.865, 0.0005));
    REQUIRE(!t.caustic.findings.empty());
    CHECK(rv::finding_text(t.caustic.findings[0]) == "clipped at A: 13.5 % of the power falls outside its aperture");

    const Traced tilted = run(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 1000, "waist_at_mm": 100})",
        R"({"id": "A", "type": "mirror", "at_mm": [100, 500], "normal_deg": 135, "aperture_mm": 2},
           {"id": "T", "type": "target", "at_mm": [100, 550], "normal_deg": 90})", "T"));
    CHECK_THAT(tilted.caustic.at_hits[0].clipped_fraction, near(std::exp(-1.0), 1e-12));
}

TEST_CASE("the envelope is sampled along the path and densely near the target", "[propagate]") {
    const Traced t = run(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 0], "direction_deg": 0, "waist_um": 1000})",
        R"({"id": "L", "type": "lens", "at_mm": [500, 0], "focal_length_mm": 100},
           {"id": "T", "type": "target", "at_mm": [600, 0]})", "T"));
    REQUIRE(t.caustic.envelope.size() > 300);
    CHECK(std::is_sorted(t.caustic.envelope.begin(), t.caustic.envelope.end(),
                         [](const rv::EnvelopeSample& a, const rv::EnvelopeSample& b) { return a.s_mm < b.s_mm; }));
    size_t near_target = 0;
    for (const rv::EnvelopeSample& e : t.caustic.envelope) near_target += std::abs(e.s_mm - 600) < 3 * 3.3258;
    CHECK(near_target >= 100);
}

TEST_CASE("a Rayleigh range below the spacing of doubles at the target keeps the envelope bounded", "[propagate][hardening]") {
    // Issue 19: the samples near the target were stepped x += step, which never passes the
    // window's end once step < the spacing of doubles there; this allocated until bad_alloc.
    // Hand computation (thin lens, f ≪ z_R, so w0' = λf/(πw) at the lens's focus): the source's
    // z_R = π·(1 mm)²/1.064e-3 mm = 2952.6 mm, so at the lens w = √(1 + (500/2952.6)²) mm =
    // 1.01424 mm; w0' = 1.064e-3 · 1e-4 / (π · 1.01424) mm = 3.3393e-8 mm; z_R' = πw0'²/λ =
    // 3.2925e-12 mm. The window ±3 z_R' in 200 steps gives 9.9e-14 mm, below the spacing of
    // doubles at 600 mm (1.14e-13).
    const Traced t = run(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 0], "direction_deg": 0, "waist_um": 1000})",
        R"({"id": "L", "type": "lens", "at_mm": [500, 0], "focal_length_mm": 1e-4},
           {"id": "T", "type": "target", "at_mm": [600, 0]})", "T"));
    REQUIRE(t.caustic.reaches_target);
    const double zr_mm = rv::rayleigh_range_mm(t.caustic.target_tangential);
    CHECK_THAT(zr_mm * 1e12, near_rel(3.2925, 1e-3));
    const double spacing_mm = std::nextafter(600.0, 1e9) - 600.0;
    REQUIRE(6 * zr_mm / 200 < spacing_mm);  // the case that used to loop
    // At most 401 samples per segment (2 segments) and 201 near the target, plus one per segment.
    CHECK(t.caustic.envelope.size() <= 2 * 401 + 201 + 2);
    for (const rv::EnvelopeSample& e : t.caustic.envelope) {
        CHECK(std::isfinite(e.s_mm));
        CHECK(std::isfinite(e.radius_tangential_um));
    }
}

TEST_CASE("two colours through one N-BK7 lens focus apart by the chromatic shift", "[propagate][chromatic]") {
    // docs/physics.md §1.5 (computed from it): a thin N-BK7 lens with f(1064) = 100 mm (so
    // f(587.6) = 100·(n(1064) − 1)/(n_d − 1)); collimated beams, w0 = 1.000 mm at the lens:
    // 1064 nm → waist at 99.8854 mm, 33.8488 µm, z_R 3.3829 mm;
    // 532 nm → f 97.5287 mm, waist at 97.5021 mm, 16.5133 µm, z_R 1.6103 mm.
    const rv::MaterialLibrary& lib = rv::MaterialLibrary::builtin();
    const double n1064 = rv::sample_index(*lib.find("N-BK7"), 1064).index;
    const double n_d = rv::sample_index(*lib.find("N-BK7"), 587.6).index;
    const double f_design = 100 * (n1064 - 1) / (n_d - 1);
    const std::string lens = R"({"id": "L", "type": "lens", "at_mm": [100, 500], "glass": "N-BK7", "focal_length_mm": )" +
                             std::to_string(f_design) + "}";
    struct Row { double nm, waist_at, waist_um, zr; };
    for (const Row& r : {Row{1064, 99.8854, 33.8488, 3.3829}, Row{532, 97.5021, 16.5133, 1.6103}}) {
        CAPTURE(r.nm);
        const Traced t = run(layout_json(
            R"({"id": "b", "wavelength_nm": )" + std::to_string(r.nm) +
                R"(, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 1000, "waist_at_mm": 100})",
            lens + R"(, {"id": "T", "type": "target", "at_mm": [200, 500]})", "T"));
        REQUIRE(t.caustic.reaches_target);
        CHECK_THAT(100 + t.caustic.target_waist_offset_tangential_mm, near(r.waist_at, 2e-4));
        CHECK_THAT(rv::waist_radius_um(t.caustic.target_tangential), near(r.waist_um, 1e-3));
        CHECK_THAT(rv::rayleigh_range_mm(t.caustic.target_tangential), near(r.zr, 1e-4));
    }
}
