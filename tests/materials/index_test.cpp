// Refractive indices of the built-in dispersion sets.
#include "materials/dispersion.hpp"
#include "materials/material_library.hpp"
#include "support/layouts.hpp"

using rv::test::near;

namespace {
using rv::test::material;
double n_at(const char* name, double nm, rv::Axis axis = rv::Axis::X) {
    return rv::sample_index(material(name), nm, axis).index;
}
}  // namespace

TEST_CASE("glass indices against the catalogue n_d", "[materials]") {
    // SCHOTT data sheet N-BK7: n_d = 1.5168 (d line, 587.56 nm); refractiveindex.info.
    CHECK_THAT(n_at("N-BK7", 587.56), near(1.5168, 5e-5));
    // Fused silica (Malitson 1965): n_d = 1.45846 (refractiveindex.info).
    CHECK_THAT(n_at("fused-silica", 587.56), near(1.45846, 1e-5));
    // SCHOTT data sheet N-SF11: n_d = 1.78472.
    CHECK_THAT(n_at("N-SF11", 587.56), near(1.78472, 1e-5));
}

TEST_CASE("indices against the tabulated values", "[materials]") {
    // docs/physics.md §3.2, computed from the coefficients of §3.1 (refractiveindex.info
    // database files of each source), to ±1e-5.
    struct Row { const char* name; double n588, n633, n800, n1064; };
    for (const Row& r : {Row{"N-BK7", 1.516800, 1.515089, 1.510776, 1.506635},
                         Row{"N-SF11", 1.784720, 1.778602, 1.764620, 1.753896},
                         Row{"fused-silica", 1.458464, 1.457018, 1.453317, 1.449631},
                         Row{"CaF2:Malitson1963", 1.433849, 1.432886, 1.430529, 1.428478}}) {
        CAPTURE(r.name);
        CHECK_THAT(n_at(r.name, 587.56), near(r.n588, 1e-5));
        CHECK_THAT(n_at(r.name, 632.8), near(r.n633, 1e-5));
        CHECK_THAT(n_at(r.name, 800), near(r.n800, 1e-5));
        CHECK_THAT(n_at(r.name, 1064), near(r.n1064, 1e-5));
    }
    // H. H. Li 1980 CaF2 (docs/physics.md §3.2).
    CHECK_THAT(n_at("CaF2:Li1980", 587.56), near(1.433880, 1e-5));
    CHECK_THAT(n_at("CaF2:Li1980", 800), near(1.430572, 1e-5));
    CHECK_THAT(n_at("CaF2:Li1980", 1064), near(1.428528, 1e-5));
}

TEST_CASE("standard air: Ciddor 1996 and Peck & Reeder 1972", "[materials][air]") {
    // docs/physics.md §3.2, (n − 1)·1e8, computed from Ciddor, Appl. Opt. 35, 1566 (1996)
    // and Peck & Reeder, JOSA 62, 958 (1972).
    struct Row { double nm, ciddor, peck; };
    for (const Row& r : {Row{587.56, 27717.5, 27716.0}, Row{632.8, 27653.3, 27651.8},
                         Row{800, 27504.8, 27503.4}, Row{1064, 27398.4, 27397.1}}) {
        CAPTURE(r.nm);
        CHECK_THAT((n_at("air", r.nm) - 1) * 1e8, near(r.ciddor, 0.1));
        CHECK_THAT((n_at("air:PeckReeder1972", r.nm) - 1) * 1e8, near(r.peck, 0.1));
    }
}

TEST_CASE("BBO ordinary and extraordinary indices in four published sets", "[materials][bbo]") {
    // docs/physics.md §3.2 (computed from Eimerl 1987, Kato 1986, Zhang 2000, Tamošauskas 2018);
    // Wikipedia "Beta barium borate" gives n_o = 1.65, n_e = 1.54 at 1064 nm.
    struct Row { const char* set; double no532, ne532, no1064, ne1064; };
    for (const Row& r : {Row{"BBO:Eimerl1987", 1.67497, 1.55551, 1.65513, 1.54256},
                         Row{"BBO:Kato1986", 1.67421, 1.55466, 1.65452, 1.53919},
                         Row{"BBO:Zhang2000", 1.67413, 1.55457, 1.65432, 1.53899},
                         Row{"BBO:Tamosauskas2018", 1.67411, 1.55471, 1.65436, 1.54208}}) {
        CAPTURE(r.set);
        CHECK_THAT(n_at(r.set, 532, rv::Axis::Ordinary), near(r.no532, 1e-5));
        CHECK_THAT(n_at(r.set, 532, rv::Axis::Extraordinary), near(r.ne532, 1e-5));
        CHECK_THAT(n_at(r.set, 1064, rv::Axis::Ordinary), near(r.no1064, 1e-5));
        CHECK_THAT(n_at(r.set, 1064, rv::Axis::Extraordinary), near(r.ne1064, 1e-5));
        CHECK_THAT(n_at(r.set, 1064, rv::Axis::Ordinary), near(1.65, 0.006));
        CHECK_THAT(n_at(r.set, 1064, rv::Axis::Extraordinary), near(1.54, 0.006));
    }
    // The family name selects Tamošauskas 2018 by default: its published range (0.188–5.2 µm)
    // covers the common lines and their harmonics (issue 16 §7), where Kato 1986 (to 1.06 µm)
    // leaves 1064 nm outside.
    const rv::Material& bbo = *rv::MaterialLibrary::builtin().find("BBO");
    CHECK(bbo.name == "BBO:Tamosauskas2018");
    for (double nm : {213.0, 266.0, 400.0, 515.0, 532.0, 800.0, 1030.0, 1064.0, 1550.0, 2000.0})
        CHECK(rv::covers(bbo, nm));
    CHECK_FALSE(rv::covers(material("BBO:Kato1986"), 1064.0));
}

TEST_CASE("LBO and KTP principal indices at 1064 nm", "[materials]") {
    // docs/physics.md §3.2: LBO (Chen 1989 / Hanson & Dick 1991) 1.56555, 1.59063, 1.60558;
    // KTP (Kato & Takaoka 2002) 1.73793, 1.74547, 1.82967, and a vendor sheet
    // 1.7377, 1.7453, 1.8297 within 2e-4.
    CHECK_THAT(n_at("LBO", 1064, rv::Axis::X), near(1.56555, 1e-5));
    CHECK_THAT(n_at("LBO", 1064, rv::Axis::Y), near(1.59063, 1e-5));
    CHECK_THAT(n_at("LBO", 1064, rv::Axis::Z), near(1.60558, 1e-5));
    CHECK_THAT(n_at("KTP", 1064, rv::Axis::X), near(1.73793, 1e-5));
    CHECK_THAT(n_at("KTP", 1064, rv::Axis::Y), near(1.74547, 1e-5));
    CHECK_THAT(n_at("KTP", 1064, rv::Axis::Z), near(1.82967, 1e-5));
    CHECK_THAT(n_at("KTP", 1064, rv::Axis::Z), near(1.8297, 2e-4));
}

TEST_CASE("a wavelength outside the range of a set is flagged and not hidden", "[materials]") {
    // Ranges as published: Zhang 2000 fits 0.64–3.18 µm; Eimerl 1987 0.22–1.06 µm
    // (Weber, Handbook of Optical Materials); SCHOTT N-BK7 0.3–2.5 µm.
    CHECK_FALSE(rv::sample_index(material("BBO:Zhang2000"), 532).in_valid_range);
    CHECK(rv::sample_index(material("BBO:Zhang2000"), 1550).in_valid_range);
    CHECK_FALSE(rv::sample_index(material("BBO:Eimerl1987"), 1064).in_valid_range);
    CHECK(rv::sample_index(material("BBO:Eimerl1987"), 1030).in_valid_range);
    CHECK_FALSE(rv::sample_index(material("N-BK7"), 250).in_valid_range);
}

TEST_CASE("user-defined Sellmeier material", "[materials]") {
    // A user material in the SCHOTT form with N-BK7's own coefficients must give N-BK7's n_d
    // (SCHOTT data sheet: 1.5168).
    const rv::MaterialLibrary lib = rv::MaterialLibrary::builtin().with(rv::user_sellmeier_material(
        "my-glass", {1.03961212, 0.231792344, 1.01046945},
        {0.00600069867, 0.0200179144, 103.560653}, 300, 2500, "user"));
    REQUIRE(lib.find("my-glass") != nullptr);
    CHECK_THAT(rv::sample_index(*lib.find("my-glass"), 587.56).index, near(1.5168, 5e-5));
    CHECK(rv::MaterialLibrary::builtin().find("my-glass") == nullptr);
    CHECK(rv::MaterialLibrary::builtin().find("unobtainium") == nullptr);
}
