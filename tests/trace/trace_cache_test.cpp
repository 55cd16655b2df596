// A trace with a cache kept between calls gives exactly the paths of a fresh trace: the
// cache's candidate lists (trace/trace_cache.hpp) must never skip an element a full search
// would meet first. Exact equality, because both take the same arithmetic on the same values.
#include <numeric>
#include <random>

#include "analysis/target_summary.hpp"
#include "findings/finding_json.hpp"
#include "hardening/random_layout.hpp"
#include "support/layouts.hpp"
#include "support/retrace_check.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace {

// The paths agree (support/retrace_check.hpp, path_difference).
void require_same_paths(const std::vector<rv::Path>& a, const std::vector<rv::Path>& b) {
    const std::optional<std::string> difference = rv::test::path_difference(a, b);
    INFO(difference.value_or(""));
    REQUIRE_FALSE(difference);
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
        CHECK(cache.counters.replayed_steps > 0);
        CHECK(cache.counters.searched_steps > 0);
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

// retrace_layout keeps the leading steps of the previous retrace that no changed element comes
// near. Under random sparse edits (support/retrace_check.hpp) its paths and the evaluation
// built on them must equal a fresh trace and the full pipeline exactly: on the bundled layouts
// and on seeded random layouts (tests/hardening/random_layout.hpp), each way of the retrace
// taken (steps kept, paths ended at the target and completed past it, kept steps not tested).
TEST_CASE("a retrace keeps only unchanged steps and equals a fresh trace", "[trace][cache][retrace]") {
    rv::test::RetraceRun all;
    for (const char* file : {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        INFO(file);
        const rv::Layout base = rv::test::bundled_layout(file);
        const rv::test::RetraceRun run = rv::test::check_retraces(base, rv::material_library_for(base), 23, 400);
        INFO(run.difference.value_or(""));
        REQUIRE_FALSE(run.difference);
        CHECK(run.kept_hits > 0);  // the retrace did keep steps
        all.ended_at_target += run.ended_at_target;
        all.traced_past_target += run.traced_past_target;
        all.reference_skips += run.reference_skips;
    }
    // Both ways of the evaluation ran: paths ended at the target, and paths completed past it
    // for a waist downstream of the target plane.
    CHECK(all.ended_at_target > 0);
    CHECK(all.traced_past_target > 0);
    CHECK(all.reference_skips > 0);  // and kept steps were taken without a test
}

TEST_CASE("a retrace equals a fresh trace on random layouts", "[trace][cache][retrace][random]") {
    rv::test::RetraceRun all;
    for (std::uint64_t seed = 1; seed <= 200; ++seed) {
        INFO("random layout " << seed);
        const rv::Layout base = rv::test::layout_from(rv::hardening::random_layout(seed).dump());
        const rv::test::RetraceRun run =
            rv::test::check_retraces(base, rv::material_library_for(base), static_cast<std::uint32_t>(seed), 100);
        INFO(run.difference.value_or(""));
        REQUIRE_FALSE(run.difference);
        all.kept_hits += run.kept_hits;
        all.ended_at_target += run.ended_at_target;
        all.traced_past_target += run.traced_past_target;
    }
    CHECK(all.kept_hits > 0);
    CHECK(all.ended_at_target > 0);
}

// A solver's retrace ends a path at the target, but not where the rest of it would turn an
// aim_at mirror that a later beam meets. Here beam A crosses the target T and then turns M
// towards the dump E; beam B, coming later, meets M from behind as A left it. Had A stopped at
// T, B would have turned M itself and been sent on to E.
TEST_CASE("a path ends at the target only where no later beam depends on the rest", "[trace][cache][retrace]") {
    const rv::Layout l = rv::test::layout_from(rv::test::layout_json(
        R"({"id": "A", "wavelength_nm": 800, "start_mm": [100, 500], "direction_deg": 0, "waist_um": 500},
           {"id": "B", "wavelength_nm": 1000, "start_mm": [700, 300], "direction_deg": 135, "waist_um": 500})",
        R"({"id": "T", "type": "target", "at_mm": [300, 500], "aperture_mm": 20},
           {"id": "M", "type": "mirror", "at_mm": [500, 500], "aperture_mm": 25, "aim_at": "E"},
           {"id": "E", "type": "dump", "at_mm": [500, 900], "normal_deg": 270, "aperture_mm": 50})",
        "T"));
    const rv::MaterialLibrary library = rv::material_library_for(l);
    const std::vector<rv::Path> fresh = rv::trace_layout(l, library);
    REQUIRE(fresh[1].hits.size() == 1);  // B meets the back of M as A turned it
    CHECK(fresh[1].findings.front().kind == rv::Finding::Kind::HitBackOfOptic);
    rv::TraceCache cache;
    for (int k = 0; k < 3; ++k) {  // the first retrace and two that keep every step
        const std::vector<rv::Path>& paths = rv::retrace_layout(l, library, cache, {.stop_at_target = true});
        CHECK_FALSE(paths[0].ends_at_target);  // A went on: M was still to be turned
        require_same_paths(paths, fresh);
    }
    // The last beam, and a beam after which no aim_at mirror is left to turn, may stop.
    const rv::Layout one = rv::test::layout_from(rv::test::layout_json(
        R"({"id": "A", "wavelength_nm": 800, "start_mm": [100, 500], "direction_deg": 0, "waist_um": 500})",
        R"({"id": "T", "type": "target", "at_mm": [300, 500], "aperture_mm": 20},
           {"id": "M", "type": "mirror", "at_mm": [500, 500], "aperture_mm": 25, "aim_at": "E"},
           {"id": "E", "type": "dump", "at_mm": [500, 900], "normal_deg": 270, "aperture_mm": 50})",
        "T"));
    rv::TraceCache single;
    const std::vector<rv::Path>& ended = rv::retrace_layout(one, library, single, {.stop_at_target = true});
    CHECK(ended[0].ends_at_target);
    CHECK(ended[0].hits.size() == 1);
    // Completed, it is the full trace.
    rv::trace_past_target(one, single, 0);
    require_same_paths(single.paths, rv::trace_layout(one, library));
    CHECK_FALSE(single.paths[0].ends_at_target);
}

// The retrace tests its kept steps against the changed optics' circles widened by
// kChangeSlack_mm, so that a later retrace whose circles lie within those may keep the same
// steps untested. Here a lens passes 0.5 mm clear of the beam, then 0.6 mm, then moves into it:
// the last retrace skips the test (its circles lie within the second's, widened) and must still
// see the beam meet the lens.
TEST_CASE("a retrace that skips the test of kept steps still sees an optic moved into the beam", "[trace][cache][retrace]") {
    rv::Layout l = rv::test::layout_from(rv::test::layout_json(
        R"({"id": "A", "wavelength_nm": 800, "start_mm": [100, 500], "direction_deg": 0, "waist_um": 500})",
        R"({"id": "L", "type": "lens", "at_mm": [300, 505.5], "aperture_mm": 10, "focal_length_mm": 100},
           {"id": "T", "type": "target", "at_mm": [600, 500], "aperture_mm": 40})",
        "T"));
    const rv::MaterialLibrary library = rv::material_library_for(l);
    rv::TraceCache cache;
    const std::vector<size_t> edited{0};
    size_t skips = 0;
    for (const double y_mm : {505.5, 505.6, 504.9}) {
        INFO("lens at y = " << y_mm);
        l.elements[0].at_mm.y() = y_mm;
        skips = cache.counters.reference_skips;
        rv::retrace_layout(l, library, cache, {.edited = &edited});
        require_same_paths(cache.paths, rv::trace_layout(l, library));
    }
    CHECK(cache.counters.reference_skips > skips);  // the last retrace did skip the test
    CHECK(cache.paths[0].hits.front().element == 0);  // and the beam meets the lens
}

// A caller's list of edited elements is a promise; builds that hunt bugs (sanitizers, fuzzing,
// Debug) check it on every retrace and refuse one that left a change out. (Compiled only there:
// elsewhere the caller's word is taken.)
#ifdef RV_VERIFY_EDITED_LISTS
TEST_CASE("a retrace refuses an edited list that leaves a change out, where lists are checked", "[trace][cache][retrace]") {
    const rv::Layout base = rv::test::bundled_layout("sfg-bbo.json");
    const rv::MaterialLibrary library = rv::material_library_for(base);
    rv::TraceCache cache;
    rv::Layout l = base;
    const std::vector<size_t> first{0};
    rv::retrace_layout(l, library, cache, {.edited = &first});
    rv::retrace_layout(l, library, cache, {.edited = &first});  // compared with the previous now
    l.elements[1].at_mm += rv::Vec2(0.5, 0);                    // changed, but not listed
    CHECK_THROWS_WITH(rv::retrace_layout(l, library, cache, {.edited = &first}),
                      Catch::Contains(l.elements[1].id) && Catch::Contains("edited list"));
}
#endif

// The cache keeps pointers to the materials of the library it traced with. A library rebuilt
// in the same object (the viewer rebuilds its library on each refresh) with another glass of
// the same name must be sampled anew, and the old materials must stay valid while the cache
// holds them (the sanitizer build would report a read of freed memory).
TEST_CASE("a cache outlives the library it traced with and follows a rebuilt one", "[trace][cache]") {
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    for (rv::Element& e : l.elements)
        if (auto* plate = std::get_if<rv::Plate>(&e.kind); plate && e.id == "PBS_P") plate->slab.material = "G1";
    // Two user glasses named G1 (SCHOTT form, B and C of our own choosing): n ≈ 1.5 and n ≈ 1.7.
    auto library_with_g1 = [](double b1) {
        return rv::MaterialLibrary::builtin().with(
            rv::user_sellmeier_material("G1", {b1, 0, 0}, {0.01, 0, 0}, 300, 2500, "test glass"));
    };
    rv::TraceCache cache;
    auto library = std::make_unique<rv::MaterialLibrary>(library_with_g1(1.2));
    const std::vector<rv::Path> first = rv::trace_layout(l, *library, &cache);
    *library = library_with_g1(1.85);  // the same object, new materials; the old ones freed but for the cache's share
    require_same_paths(rv::trace_layout(l, *library, &cache), rv::trace_layout(l, *library));
    // The glass did change what the beam does in it (so the comparison above could fail).
    const std::vector<rv::Path> second = rv::trace_layout(l, *library);
    bool differs = false;
    for (size_t p = 0; p < first.size(); ++p)
        for (size_t k = 0; k < std::min(first[p].hits.size(), second[p].hits.size()); ++k)
            differs = differs || first[p].hits[k].index_after != second[p].hits[k].index_after;
    CHECK(differs);
    library.reset();  // and the cache outlives the library altogether
    const rv::MaterialLibrary again = library_with_g1(1.85);
    require_same_paths(rv::trace_layout(l, again, &cache), rv::trace_layout(l, again));
}
