// Solutions that differ only by a lens's diameter are one: the smallest that does not clip.
#include "solve/diameter_choice.hpp"

#include <cmath>

#include "analysis/report.hpp"
#include "io/layout_writer.hpp"
#include "solve/telescope.hpp"
#include "support/layouts.hpp"

using rv::test::layout_from;
using rv::test::near_rel;

namespace {

// A collimated 1064 nm beam of waist radius `waist_um` through one swapped, movable lens at
// x = 100 mm, to a target at x = 300 mm; aim "focus" (the waist at the target).
rv::Layout one_lens(double waist_um) {
    return layout_from(
        R"({"format": "rendezvous-layout", "version": 1, "table": {"size_mm": [1000, 1000]},
      "beams": [{"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": )" +
        std::to_string(waist_um) + R"(}],
      "elements": [{"id": "L", "type": "lens", "at_mm": [100, 500], "focal_length_mm": 150},
                   {"id": "T", "type": "target", "at_mm": [300, 500]}],
      "target": "T",
      "goals": {"solve": {"aim": "focus", "move": {"L": [-50, 50]}, "swap": ["L"]}}})");
}

rv::CatalogLens ideal(const std::string& id, double f_mm, double diameter_mm) {
    return {id, f_mm, diameter_mm, rv::Lens{rv::IdealLens{f_mm}}};
}

// The same focal length (200 mm) in two diameters, and a lens that cannot focus on the target
// within the move (f = 300 mm from x ≥ 50 mm puts the waist at x ≥ 350 mm).
const std::vector<rv::CatalogLens> kCatalog = {
    ideal("f200-d25.4", 200, 25.4), ideal("f200-d12.7", 200, 12.7), ideal("f300-d25.4", 300, 25.4)};

}  // namespace

TEST_CASE("one focal length in two diameters gives one solution naming the smaller") {
    // A 1 mm beam: the 12.7 mm lens passes it (exp(−2a²/w²) = exp(−80.6), far below the 1 %
    // warning level), so it is the one kept and the 25.4 mm lens is named beside it.
    const rv::Layout l = one_lens(1000);
    const rv::SolveResult r = rv::solve_telescopes(l, rv::material_library_for(l), kCatalog);
    REQUIRE(r.error.empty());
    CHECK(r.combinations == 3);
    REQUIRE(r.solutions.size() == 2);  // the f = 200 mm family once, and f = 300 mm
    const rv::TelescopeSolution& best = r.solutions[0];
    REQUIRE(best.swaps.size() == 1);
    CHECK(best.swaps[0].second == "f200-d12.7");
    CHECK_FALSE(best.clipped_fraction.has_value());
    REQUIRE(best.also.size() == 1);
    REQUIRE(best.also[0].swaps.size() == 1);
    CHECK(best.also[0].swaps[0] == std::pair<std::string, std::string>("L", "f200-d25.4"));
    CHECK(best.also[0].diameters_mm == std::vector<double>{25.4});
    CHECK_FALSE(best.also[0].clipped_fraction.has_value());
    CHECK(r.solutions[1].swaps[0].second == "f300-d25.4");
    CHECK(r.solutions[1].also.empty());
    // The kept lens is in the layout, with its diameter as the aperture and its id as part.
    const rv::Element* lens = best.layout.find("L");
    REQUIRE(lens != nullptr);
    CHECK(lens->aperture_mm == 12.7);
    CHECK(std::get<rv::Lens>(lens->kind).part == "f200-d12.7");
}

TEST_CASE("a beam that clips the small lens picks the larger") {
    // A 5 mm collimated beam (z_R = π w²/λ ≈ 74 m, so still 5 mm at the lens): through the
    // 12.7 mm lens a fraction exp(−2a²/w²) = exp(−2·6.35²/5²) = 0.0397 of the power falls outside
    // (power through a centred circular aperture, Siegman, Lasers, 1986, §17.1), above the 1 %
    // warning level; through the 25.4 mm lens exp(−12.9) ≈ 2.5e-6. The 25.4 mm lens is kept and
    // the 12.7 mm one named with its loss.
    const rv::Layout l = one_lens(5000);
    const rv::SolveResult r = rv::solve_telescopes(l, rv::material_library_for(l), kCatalog);
    REQUIRE(r.error.empty());
    REQUIRE(r.solutions.size() == 2);
    const rv::TelescopeSolution& best = r.solutions[0];
    CHECK(best.swaps[0].second == "f200-d25.4");
    CHECK_FALSE(best.clipped_fraction.has_value());
    REQUIRE(best.also.size() == 1);
    CHECK(best.also[0].swaps[0].second == "f200-d12.7");
    REQUIRE(best.also[0].clipped_fraction.has_value());
    CHECK_THAT(*best.also[0].clipped_fraction, near_rel(std::exp(-2 * 6.35 * 6.35 / 25.0), 1e-3));
    // One evaluation: the report of the 12.7 mm layout has exactly that clipping finding at L.
    rv::Layout small = best.layout;
    rv::Element& lens = small.elements[0];
    REQUIRE(lens.id == "L");
    lens.kind = rv::Lens(rv::IdealLens{200}, "f200-d12.7");
    lens.aperture_mm = 12.7;
    const rv::RendezvousReport report = rv::build_report(small, rv::material_library_for(small));
    int clipping = 0;
    for (const rv::Finding& f : report.findings)
        if (f.kind == rv::Finding::Kind::Clipping && f.element == "L") {
            ++clipping;
            CHECK_THAT(f.amount, near_rel(*best.also[0].clipped_fraction, 1e-9));
        }
    CHECK(clipping == 1);
    // and the kept layout's report has none there.
    for (const rv::Finding& f :
         rv::build_report(best.layout, rv::material_library_for(best.layout)).findings)
        CHECK_FALSE((f.kind == rv::Finding::Kind::Clipping && f.element == "L"));
}

TEST_CASE("when every diameter clips the one that loses least is kept and says so") {
    // A 12 mm beam clips both: exp(−2·6.35²/12²) = 0.571 and exp(−2·12.7²/12²) = 0.107 (the
    // circular-aperture formula above); the 25.4 mm lens loses less.
    const rv::Layout l = one_lens(12000);
    const rv::SolveResult r = rv::solve_telescopes(l, rv::material_library_for(l), kCatalog);
    REQUIRE(r.error.empty());
    REQUIRE_FALSE(r.solutions.empty());
    const rv::TelescopeSolution& best = r.solutions[0];
    CHECK(best.swaps[0].second == "f200-d25.4");
    REQUIRE(best.clipped_fraction.has_value());
    CHECK_THAT(*best.clipped_fraction, near_rel(std::exp(-2 * 12.7 * 12.7 / 144.0), 1e-3));
    REQUIRE(best.also.size() == 1);
    REQUIRE(best.also[0].clipped_fraction.has_value());
    CHECK_THAT(*best.also[0].clipped_fraction, near_rel(std::exp(-2 * 6.35 * 6.35 / 144.0), 1e-3));
}

TEST_CASE("the written solution holds each chosen lens's part and reads back equal") {
    const rv::Layout l = one_lens(1000);
    const rv::SolveResult r = rv::solve_telescopes(l, rv::material_library_for(l), kCatalog);
    REQUIRE(!r.solutions.empty());
    const rv::Layout& solved = r.solutions[0].layout;
    const std::string text = rv::write_layout(solved);
    CHECK(text.find("\"part\": \"f200-d12.7\"") != std::string::npos);
    const rv::LayoutReadResult back = rv::read_layout(text);
    REQUIRE(back.layout.has_value());
    CHECK(*back.layout == solved);
    CHECK(rv::write_layout(*back.layout) == text);
}

TEST_CASE("diameter families: the same catalog lens but for its size") {
    // Ideal lenses: the focal length decides; singlets also glass, shape and design wavelength
    // (their centre thickness follows the diameter).
    const rv::CatalogLens a = ideal("a", 100, 12.7), b = ideal("b", 100, 50.8),
                          c = ideal("c", 125, 12.7);
    rv::CatalogLens s1{
        "s1", 100, 12.7,
        rv::Lens{rv::ThickLens{60, INFINITY, 3, "N-BK7", "convex-plano", 100, 587.6}}};
    rv::CatalogLens s2{
        "s2", 100, 25.4,
        rv::Lens{rv::ThickLens{61, INFINITY, 6, "N-BK7", "convex-plano", 100, 587.6}}};
    rv::CatalogLens s3{
        "s3", 100, 25.4,
        rv::Lens{rv::ThickLens{61, INFINITY, 6, "N-SF11", "convex-plano", 100, 587.6}}};
    CHECK(rv::same_but_diameter({&a}, {&b}));
    CHECK_FALSE(rv::same_but_diameter({&a}, {&c}));
    CHECK_FALSE(rv::same_but_diameter({&a}, {&s1}));
    CHECK(rv::same_but_diameter({&s1}, {&s2}));
    CHECK_FALSE(rv::same_but_diameter({&s2}, {&s3}));
    CHECK(rv::same_but_diameter({&a, &s1}, {&b, &s2}));
    CHECK_FALSE(rv::same_but_diameter({&a, &s1}, {&c, &s2}));
}
