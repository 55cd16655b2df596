// A trace with a cache kept between calls gives exactly the paths of a fresh trace: the
// cache's candidate lists (trace/trace_cache.hpp) must never skip an element a full search
// would meet first. Exact equality, because both take the same arithmetic on the same values.
#include <numeric>
#include <random>

#include "analysis/target_summary.hpp"
#include "findings/finding_json.hpp"
#include "support/layouts.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"

namespace {

// A path of a that ended at the target must be b's path up to its target crossing, with the
// findings made up to there; one of b may end there only where a's does.
void require_same_paths(const std::vector<rv::Path>& a, const std::vector<rv::Path>& b) {
    REQUIRE(a.size() == b.size());
    for (size_t p = 0; p < a.size(); ++p) {
        REQUIRE(a[p].target_hit == b[p].target_hit);
        if (b[p].ends_at_target) {
            REQUIRE(a[p].ends_at_target);
            REQUIRE(a[p].findings.size() == b[p].findings.size());
        }
        if (a[p].ends_at_target) {
            REQUIRE(a[p].target_hit);
            REQUIRE(a[p].hits.size() == *a[p].target_hit + 1);
            REQUIRE(a[p].segments.size() == a[p].hits.size());
            REQUIRE(a[p].findings.size() <= b[p].findings.size());
        } else {
            REQUIRE(a[p].hits.size() == b[p].hits.size());
            REQUIRE(a[p].segments.size() == b[p].segments.size());
            REQUIRE(a[p].findings.size() == b[p].findings.size());
        }
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
            REQUIRE(x.group_delay_fs == y.group_delay_fs);
            REQUIRE(x.index_after == y.index_after);
            REQUIRE(x.focal_length_mm == y.focal_length_mm);
            REQUIRE(x.lumped_group_index == y.lumped_group_index);
        }
        for (size_t k = 0; k < a[p].segments.size(); ++k)
            REQUIRE(a[p].segments[k].group_index == b[p].segments[k].group_index);
        for (size_t k = 0; k < a[p].findings.size(); ++k) REQUIRE(rv::finding_json(a[p].findings[k]) == rv::finding_json(b[p].findings[k]));
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

// retrace_layout keeps the leading steps of the previous retrace that no changed element comes
// near. Under random sparse edits (the solvers' pattern: one or two optics moved, turned or
// given another focal length, a stage moved, sometimes a beam or the table changed, sometimes
// another kind of trace in between) its paths and the evaluation built on them must equal a
// fresh trace and the full pipeline exactly.
TEST_CASE("a retrace keeps only unchanged steps and equals a fresh trace", "[trace][cache][retrace]") {
    size_t ended_at_target = 0, traced_past_target = 0, reference_skips = 0;
    for (const char* file : {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        INFO(file);
        const rv::Layout base = rv::test::bundled_layout(file);
        const rv::MaterialLibrary library = rv::material_library_for(base);
        rv::TraceCache cache, plain_cache, named_cache;
        rv::Layout l = base;
        std::mt19937 rng(23);
        std::uniform_real_distribution<double> small(-0.6, 0.6), large(-10, 10), unit(0, 1);
        size_t kept = 0;
        std::vector<size_t> edited;  // what a solver would name (it may name more)
        for (int trial = 0; trial < 400; ++trial) {
            INFO("trial " << trial);
            // Now and then a solver's pattern: the same optics moved a little again; else new edits.
            const bool again = !edited.empty() && unit(rng) < 0.3;
            if (again)
                for (size_t i : edited) l.elements[i].at_mm += 0.5 * rv::Vec2(small(rng), small(rng));
            const int edits = again ? 0 : 1 + static_cast<int>(rng() % 2);
            if (!again) edited.clear();
            if (!again && unit(rng) < 0.2) edited.push_back(rng() % l.elements.size());
            for (int k = 0; k < edits; ++k) {
                edited.push_back(rng() % l.elements.size());
                rv::Element& e = l.elements[edited.back()];
                switch (rng() % 8) {
                    case 0: e.at_mm += rv::Vec2(small(rng), small(rng)); break;
                    case 5: e.at_mm += small(rng) * rv::direction_deg(e.normal_deg); break;  // along its axis
                    case 1: e.at_mm += rv::Vec2(large(rng), large(rng)); break;
                    case 2: e.normal_deg += small(rng); break;
                    case 3: e.aperture_mm = std::max(1.0, e.aperture_mm + small(rng)); break;
                    case 4:
                        if (auto* lens = std::get_if<rv::Lens>(&e.kind)) {
                            if (auto* i = std::get_if<rv::IdealLens>(&lens->model)) i->focal_length_mm *= 1 + 0.05 * small(rng);
                            if (auto* c = std::get_if<rv::ThinChromaticLens>(&lens->model)) c->focal_length_mm *= 1 + 0.05 * small(rng);
                            if (auto* t = std::get_if<rv::ThickLens>(&lens->model)) {
                                const double scale = 1 + 0.05 * small(rng);  // both radii (one may be flat)
                                t->front_radius_mm *= scale;
                                t->back_radius_mm *= scale;
                            }
                        }
                        if (auto* stage = std::get_if<rv::Stage>(&e.kind)) stage->position_mm += 5 * small(rng);
                        break;
                    case 6:  // what links elements: a mirror's aim_at, an element's name
                        if (auto* m = std::get_if<rv::Mirror>(&e.kind)) {
                            const auto& was = std::get<rv::Mirror>(base.elements[edited.back()].kind).aim_at;
                            m->aim_at = m->aim_at ? std::nullopt : was;
                        } else if (unit(rng) < 0.3) {
                            e.id += "'";
                        }
                        break;
                    default: break;  // nothing changed
                }
            }
            const double what = unit(rng);
            if (what < 0.03) l.beams[0].waist_um.tangential *= 1.01;
            else if (what < 0.06) l.beams.back().direction_deg += 0.01;
            else if (what < 0.08) l.table.width_mm += 1;
            else if (what < 0.12) {  // another kind of trace between
                rv::trace_layout(l, library, &cache);
                rv::trace_layout(l, library, &named_cache);
            }
            if (unit(rng) < 0.02) {  // back to the start: everything changes at once
                l = base;
                edited.resize(l.elements.size());
                std::iota(edited.begin(), edited.end(), size_t{0});
            }

            const std::vector<rv::BeamAtTarget> lean = rv::evaluate_beams_at_target(l, library, &cache);
            // The Monte Carlo's way, without the retrace's comparison, gives the same numbers.
            const std::vector<rv::BeamAtTarget> plain = rv::evaluate_beams_at_target(l, library, &plain_cache, false);
            REQUIRE(plain.size() == lean.size());
            for (size_t b = 0; b < lean.size(); ++b) {
                CHECK(plain[b].arrival_fs == lean[b].arrival_fs);
                CHECK(plain[b].tangential.waist_offset_mm == lean[b].tangential.waist_offset_mm);
                CHECK(plain[b].sagittal.radius_um == lean[b].sagittal.radius_um);
            }
            // Told which elements were edited, the retrace compares only those: the same numbers.
            const std::vector<rv::BeamAtTarget> named = rv::evaluate_beams_at_target(l, library, named_cache, edited);
            REQUIRE(named.size() == lean.size());
            for (size_t b = 0; b < lean.size(); ++b) {
                REQUIRE(named[b].reached == lean[b].reached);
                CHECK(named[b].arrival_fs == lean[b].arrival_fs);
                CHECK(named[b].path_mm == lean[b].path_mm);
                CHECK(named[b].tangential.waist_offset_mm == lean[b].tangential.waist_offset_mm);
                CHECK(named[b].sagittal.waist_offset_mm == lean[b].sagittal.waist_offset_mm);
                CHECK(named[b].tangential.waist_um == lean[b].tangential.waist_um);
                CHECK(named[b].sagittal.radius_um == lean[b].sagittal.radius_um);
                CHECK(named[b].hit_mm == lean[b].hit_mm);
                CHECK(named[b].direction == lean[b].direction);
            }
            require_same_paths(named_cache.paths, cache.paths);
            for (const rv::TraceCache::Beam& b : cache.beams) kept += b.kept_hits;
            for (const rv::Path& p : cache.paths) ended_at_target += p.ends_at_target;
            const std::vector<rv::Path> fresh = rv::trace_layout(l, library);
            require_same_paths(cache.paths, fresh);
            REQUIRE(lean.size() == fresh.size());
            for (size_t b = 0; b < fresh.size(); ++b) {
                const rv::BeamAtTarget full = rv::beam_at_target(l, fresh[b], rv::propagate_path(l, fresh[b]));
                REQUIRE(lean[b].reached == full.reached);
                CHECK(lean[b].arrival_fs == full.arrival_fs);
                CHECK(lean[b].tangential.waist_offset_mm == full.tangential.waist_offset_mm);
                CHECK(lean[b].sagittal.waist_offset_mm == full.sagittal.waist_offset_mm);
                CHECK(lean[b].tangential.radius_um == full.tangential.radius_um);
                CHECK(lean[b].sagittal.waist_um == full.sagittal.waist_um);
                CHECK(lean[b].hit_mm == full.hit_mm);
            }
        }
        CHECK(kept > 0);  // the retrace did keep steps
        traced_past_target += cache.traced_past_target;
        reference_skips += cache.reference_skips;
    }
    // Both ways of the evaluation ran: paths ended at the target, and paths completed past it
    // for a waist downstream of the target plane.
    CHECK(ended_at_target > 0);
    CHECK(traced_past_target > 0);
    CHECK(reference_skips > 0);  // and kept steps were taken without a test
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
        skips = cache.reference_skips;
        rv::retrace_layout(l, library, cache, {.edited = &edited});
        require_same_paths(cache.paths, rv::trace_layout(l, library));
    }
    CHECK(cache.reference_skips > skips);  // the last retrace did skip the test
    CHECK(cache.paths[0].hits.front().element == 0);  // and the beam meets the lens
}
