// Beam colours of one drawing differ by at least kMinBeamDeltaE76 (CIE 1976 ΔE*ab). The check
// converts sRGB to CIELAB with the published formulas written out here, independently of
// scene/beam_palette.cpp: IEC 61966-2-1 (sRGB transfer curve and the D65 RGB → XYZ matrix) and
// CIE 15:2004 §8.2.1 (CIELAB with the D65 white 0.95047, 1, 1.08883).
#include "scene/beam_palette.hpp"

#include <catch2/catch.hpp>
#include <cmath>
#include <filesystem>
#include <random>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "scene/scene.hpp"
#include "support/tolerance.hpp"

using rv::test::near;

namespace {

struct LabRef {
    double l, a, b;
};

LabRef reference_lab(const rv::scene::Colour& c) {
    auto lin = [](int v8) {
        const double v = v8 / 255.0;
        return v <= 0.04045 ? v / 12.92 : std::pow((v + 0.055) / 1.055, 2.4);
    };
    const double r = lin(c.r), g = lin(c.g), b = lin(c.b);
    const double x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
    const double y = (0.2126 * r + 0.7152 * g + 0.0722 * b) / 1.0;
    const double z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
    auto f = [](double t) { return t > 216.0 / 24389.0 ? std::cbrt(t) : (24389.0 / 27.0 * t + 16) / 116; };
    return {116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))};
}

double reference_delta_e(const rv::scene::Colour& p, const rv::scene::Colour& q) {
    const LabRef a = reference_lab(p), b = reference_lab(q);
    return std::sqrt(std::pow(a.l - b.l, 2) + std::pow(a.a - b.a, 2) + std::pow(a.b - b.b, 2));
}

void check_distinct(const std::vector<rv::scene::BeamStyle>& styles, const std::string& what) {
    for (size_t i = 0; i < styles.size(); ++i)
        for (size_t j = 0; j < i; ++j) {
            INFO(what << ": colours " << j << " and " << i);
            // The reference uses the 4-digit matrix of IEC 61966-2-1, the code 7 digits: 0.2 apart at most.
            CHECK(reference_delta_e(styles[i].colour, styles[j].colour) >= rv::scene::kMinBeamDeltaE76 - 0.2);
        }
}

}  // namespace

TEST_CASE("sRGB to CIELAB matches the published primaries and white", "[colour]") {
    // sRGB primaries in CIELAB (D65), from memory: red 53.24 80.09 67.20, green 87.73 -86.18
    // 83.18, blue 32.30 79.19 -107.86; white 100 0 0 by definition of the white point.
    struct Row {
        rv::scene::Colour c;
        double l, a, b;
    };
    for (const Row& row : {Row{{255, 0, 0, 255}, 53.24, 80.09, 67.20}, Row{{0, 255, 0, 255}, 87.73, -86.18, 83.18},
                           Row{{0, 0, 255, 255}, 32.30, 79.19, -107.86}, Row{{255, 255, 255, 255}, 100, 0, 0}}) {
        const rv::scene::Lab lab = rv::scene::srgb_to_lab(row.c);
        CHECK_THAT(lab.l, near(row.l, 0.05));
        CHECK_THAT(lab.a, near(row.a, 0.05));
        CHECK_THAT(lab.b, near(row.b, 0.05));
        const LabRef ref = reference_lab(row.c);
        CHECK_THAT(ref.l, near(row.l, 0.05));
        CHECK_THAT(ref.a, near(row.a, 0.1));
        CHECK_THAT(ref.b, near(row.b, 0.1));
    }
}

TEST_CASE("640 nm and 775 nm beams get colours far apart", "[colour]") {
    // Issue 17: the two were near-identical pinks. The wavelength colours alone are closer
    // than the limit, so the test can fail if the palette stops separating them.
    check_distinct(rv::scene::distinct_beam_styles({640, 775}), "640 / 775");
    // Two near-infrared beams 20 nm apart: their false colours alone are closer than the
    // limit, so this fails if the palette stops separating them.
    const rv::scene::Colour own_780 = rv::scene::beam_style(780).colour, own_800 = rv::scene::beam_style(800).colour;
    CHECK(reference_delta_e(own_780, own_800) < rv::scene::kMinBeamDeltaE76);
    const std::vector<rv::scene::BeamStyle> styles = rv::scene::distinct_beam_styles({780, 800});
    check_distinct(styles, "780 / 800");
    // The first keeps its wavelength's colour; the invisible second stays dashed.
    CHECK(styles[0].colour.r == own_780.r);
    CHECK(styles[0].colour.g == own_780.g);
    CHECK_FALSE(styles[1].visible);
    // Far apart already (532 nm green, 405 nm violet): both keep their own colours.
    const std::vector<rv::scene::BeamStyle> apart = rv::scene::distinct_beam_styles({532, 405});
    CHECK(apart[1].colour.b == rv::scene::beam_style(405).colour.b);
    CHECK(apart[1].colour.r == rv::scene::beam_style(405).colour.r);
}

TEST_CASE("any beams of a drawing differ by the stated colour difference", "[colour]") {
    // Every bundled layout's beams and generated waves as the scene draws them...
    for (const auto& entry : std::filesystem::directory_iterator(std::string(RV_SOURCE_DIR) + "/layouts")) {
        const std::string name = entry.path().filename().string();
        if (entry.path().extension() != ".json" || name == "lenses.json" || name == "schema.json") continue;
        const rv::LayoutReadResult r = rv::read_layout_file(entry.path().string());
        REQUIRE(r.layout);
        const rv::RendezvousReport report = rv::build_report(*r.layout, rv::material_library_for(*r.layout));
        check_distinct(rv::scene::report_beam_styles(report), name);
        // ...and the legend shows each beam's wavelength.
        const rv::scene::Scene s = rv::scene::build_scene(*r.layout, report);
        for (const rv::ReportBeam& b : report.beams) {
            const std::string nm = std::to_string(static_cast<long>(std::lround(b.wavelength_nm))) + " nm";
            bool listed = false;
            for (const rv::scene::LegendEntry& e : s.legend) listed = listed || e.text.find(nm) != std::string::npos;
            CHECK(listed);
        }
    }
    // ...and random sets of two to five wavelengths from 250 nm to 2000 nm.
    std::mt19937 rng(17);
    std::uniform_real_distribution<double> nm(250, 2000);
    for (int trial = 0; trial < 300; ++trial) {
        std::vector<double> set(2 + trial % 4);
        for (double& w : set) w = nm(rng);
        check_distinct(rv::scene::distinct_beam_styles(set), "random set " + std::to_string(trial));
    }
}
