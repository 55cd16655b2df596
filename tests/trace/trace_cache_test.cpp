// A trace with a cache kept between calls gives exactly the paths of a fresh trace: the
// cache's candidate lists (trace/trace_cache.hpp) must never skip an element a full search
// would meet first. Exact equality, because both take the same arithmetic on the same values.
#include <random>

#include "support/layouts.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace {

void require_same_paths(const std::vector<rv::Path>& a, const std::vector<rv::Path>& b) {
    REQUIRE(a.size() == b.size());
    for (size_t p = 0; p < a.size(); ++p) {
        REQUIRE(a[p].hits.size() == b[p].hits.size());
        REQUIRE(a[p].segments.size() == b[p].segments.size());
        REQUIRE(a[p].findings.size() == b[p].findings.size());
        REQUIRE(a[p].target_hit == b[p].target_hit);
        for (size_t k = 0; k < a[p].hits.size(); ++k) {
            const rv::TraceHit &x = a[p].hits[k], &y = b[p].hits[k];
            REQUIRE(x.element == y.element);
            REQUIRE(x.face == y.face);
            REQUIRE(x.point_mm == y.point_mm);
            REQUIRE(x.direction_in == y.direction_in);
            REQUIRE(x.direction_out == y.direction_out);
            REQUIRE(x.aoi_rad() == y.aoi_rad());
            REQUIRE(x.height_mm == y.height_mm);
            REQUIRE(x.index_before == y.index_before);
            REQUIRE(x.lens_index == y.lens_index);
            REQUIRE(x.s_mm == y.s_mm);
            REQUIRE(x.index_after == y.index_after);
            REQUIRE(x.focal_length_mm == y.focal_length_mm);
            REQUIRE(x.lumped_group_index == y.lumped_group_index);
        }
        for (size_t k = 0; k < a[p].segments.size(); ++k)
            REQUIRE(a[p].segments[k].group_index == b[p].segments[k].group_index);
        for (size_t k = 0; k < a[p].findings.size(); ++k) REQUIRE(a[p].findings[k].message == b[p].findings[k].message);
    }
}

}  // namespace

TEST_CASE("a cached trace equals a fresh trace under random moves of every optic", "[trace][cache]") {
    for (const char* file : {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        INFO(file);
        const rv::Layout base = rv::test::bundled_layout(file);
        const rv::MaterialLibrary library = rv::material_library_for(base);
        rv::TraceCache cache;
        std::mt19937 rng(7);
        // Mostly small moves (the tolerance analysis), sometimes large ones (the solver), so
        // that both the replay and the full search run.
        std::uniform_real_distribution<double> small(-0.8, 0.8), large(-12, 12), turn(-0.3, 0.3);
        for (int trial = 0; trial < 300; ++trial) {
            rv::Layout l = base;
            for (rv::Element& e : l.elements) {
                const bool big = rng() % 10 == 0;
                e.at_mm += rv::Vec2(big ? large(rng) : small(rng), big ? large(rng) : small(rng));
                e.normal_deg += turn(rng);
                if (auto* stage = std::get_if<rv::Stage>(&e.kind)) stage->position_mm += small(rng);
            }
            require_same_paths(rv::trace_layout(l, library, &cache), rv::trace_layout(l, library));
        }
        CHECK(cache.replayed_steps > 0);
        CHECK(cache.searched_steps > 0);
    }
}

TEST_CASE("a cache follows a changed glass and wavelength", "[trace][cache]") {
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::MaterialLibrary library = rv::material_library_for(l);
    rv::TraceCache cache;
    rv::trace_layout(l, library, &cache);
    for (rv::Element& e : l.elements)
        if (auto* plate = std::get_if<rv::Plate>(&e.kind)) plate->slab.material = "N-SF11";
    l.beams[0].wavelength_nm = 1064;
    require_same_paths(rv::trace_layout(l, library, &cache), rv::trace_layout(l, library));
}

// The solvers' lean evaluation (a trace into reused storage, then propagate_to_target) must
// give the numbers of the full pipeline (a fresh trace, then propagate_path) exactly.
TEST_CASE("the lean evaluation gives the full pipeline's numbers at the target", "[trace][cache][propagate]") {
    for (const char* file : {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        INFO(file);
        const rv::Layout base = rv::test::bundled_layout(file);
        const rv::MaterialLibrary library = rv::material_library_for(base);
        rv::TraceCache cache;
        std::vector<rv::Path> reused;
        std::mt19937 rng(11);
        std::uniform_real_distribution<double> move(-1.5, 1.5), turn(-0.2, 0.2);
        for (int trial = 0; trial < 60; ++trial) {
            rv::Layout l = base;
            for (rv::Element& e : l.elements) {
                e.at_mm += rv::Vec2(move(rng), move(rng));
                e.normal_deg += turn(rng);
            }
            rv::trace_layout(l, library, cache, reused);
            const std::vector<rv::Path> fresh = rv::trace_layout(l, library);
            require_same_paths(reused, fresh);
            for (size_t b = 0; b < fresh.size(); ++b) {
                const rv::Caustic full = rv::propagate_path(l, fresh[b]);
                const rv::BeamsAtTargetPlane lean = rv::propagate_to_target(l, reused[b]);
                REQUIRE(lean.reached == full.reaches_target);
                if (!lean.reached) continue;
                CHECK(lean.tangential.q_mm == full.target_tangential.q_mm);
                CHECK(lean.sagittal.q_mm == full.target_sagittal.q_mm);
                CHECK(lean.tangential.index == full.target_tangential.index);
                CHECK(lean.waist_offset_tangential_mm == full.target_waist_offset_tangential_mm);
                CHECK(lean.waist_offset_sagittal_mm == full.target_waist_offset_sagittal_mm);
            }
        }
    }
}
