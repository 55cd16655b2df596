// Properties of the report over seeded random valid layouts (random_layout.hpp): every layout
// reads, writes back equal, and reports with finite numbers; no traced path is shorter than the
// straight line it spans; overlaps are fractions; listing the beams the other way round flips
// the delay and leaves the other mismatch figures as they were.
#include <algorithm>
#include <cmath>
#include <regex>

#include "analysis/report.hpp"
#include "hardening/random_layout.hpp"
#include "hardening/report_numbers.hpp"
#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"
#include "report/report_words.hpp"
#include "report/verdict_words.hpp"
#include "support/tolerance.hpp"

namespace {

constexpr std::uint64_t kFirstSeed = 20270101;
constexpr int kLayouts = 200;

rv::Layout read_clean(const nlohmann::json& doc) {
    const rv::LayoutReadResult r = rv::read_layout(doc.dump());
    for (const rv::Diagnostic& d : r.diagnostics) UNSCOPED_INFO(rv::format_diagnostic(d, "random"));
    REQUIRE(r.layout.has_value());
    return *r.layout;
}

rv::RendezvousReport report_of(const rv::Layout& layout) {
    return rv::build_report(layout, rv::material_library_for(layout));
}

// Each random layout read once and reported once (with its beams in the file's order and, for
// two beams, swapped), shared by the test cases of one process; the swapped reports are made
// only when a test asks for them (each test case runs in its own process under CTest).
struct Case {
    nlohmann::json doc;
    rv::Layout layout;
    rv::RendezvousReport report;
    std::optional<rv::RendezvousReport> swapped;
};

std::vector<Case>& cases(bool with_swapped = false) {
    static std::vector<Case> all = [] {
        std::vector<Case> out;
        for (int i = 0; i < kLayouts; ++i) {
            Case c;
            c.doc = rv::hardening::random_layout(kFirstSeed + i);
            c.layout = read_clean(c.doc);
            c.report = report_of(c.layout);
            out.push_back(std::move(c));
        }
        return out;
    }();
    static bool swapped_done = false;
    if (with_swapped && !swapped_done) {
        for (Case& c : all)
            if (c.doc["beams"].size() == 2)
                c.swapped = report_of(read_clean(rv::hardening::with_beams_swapped(c.doc)));
        swapped_done = true;
    }
    return all;
}


// "nan", "inf", "-nan", "infinity" as a word: what printf or a stream writes for a non-finite
// number ("infrared" does not match).
bool has_non_finite_text(const std::string& s) {
    static const std::regex word(R"((^|[^A-Za-z])[-+]?(nan|inf|infinity)([^A-Za-z]|$))",
                                 std::regex::icase);
    return std::regex_search(s, word);
}

std::vector<std::string> report_texts(const rv::RendezvousReport& r) {
    std::vector<std::string> t;
    for (const rv::VerdictLine* l : {&r.verdict.space, &r.verdict.time, &r.verdict.phase}) {
        t.push_back(rv::verdict_reading_text(l->reading));
        t.push_back(rv::verdict_actions_text(*l));
    }
    for (const rv::Finding& f : r.findings) t.push_back(rv::finding_line(f));
    for (const rv::ReportBeam& b : r.beams) t.push_back(rv::after_target_text(b));
    for (const rv::PhaseMatchingReport& p : r.phase_matching) t.push_back(rv::verdict_action_text(p.polarization_need));
    for (const rv::InvisibleLight& s : r.invisible) t.push_back(rv::invisible_light_text(s));
    return t;
}

// Both beams reached the target in this report.
bool both_reach(const rv::RendezvousReport& r) {
    return r.beams.size() == 2 && r.beams[0].at_target.reached && r.beams[1].at_target.reached;
}

}  // namespace

TEST_CASE("random valid layouts read and write back equal", "[hardening][random]") {
    for (int i = 0; i < kLayouts; ++i) {
        const nlohmann::json doc = rv::hardening::random_layout(kFirstSeed + i);
        CAPTURE(i);
        const rv::Layout layout = read_clean(doc);
        const rv::LayoutReadResult again = rv::read_layout(rv::write_layout(layout));
        REQUIRE(again.layout.has_value());
        CHECK(*again.layout == layout);
    }
}

TEST_CASE("every number of the report of a random layout is finite", "[hardening][random]") {
    size_t numbers = 0, reached_both = 0, with_findings = 0;
    for (const Case& c : cases()) {
        CAPTURE(c.layout.name);
        const rv::RendezvousReport& r = c.report;
        for (const auto& [name, value] : rv::hardening::report_numbers(r)) {
            ++numbers;
            if (!std::isfinite(value)) FAIL_CHECK(name << " = " << value);
        }
        for (const std::string& text : report_texts(r))
            if (has_non_finite_text(text)) FAIL_CHECK("non-finite number in text: " << text);
        reached_both += both_reach(r);
        with_findings += !r.findings.empty();
    }
    // The generator must give both kinds of layout, or the properties below test little.
    CHECK(reached_both >= kLayouts / 4);
    CHECK(with_findings >= kLayouts / 10);
    CHECK(numbers > 1000u * kLayouts);
}

TEST_CASE("no traced path is shorter than the straight line from its start to its end",
          "[hardening][random]") {
    for (const Case& c : cases()) {
        CAPTURE(c.layout.name);
        for (const rv::ReportBeam& b : c.report.beams) {
            CAPTURE(b.id);
            const rv::Path& p = b.path;
            REQUIRE_FALSE(p.segments.empty());
            const rv::Vec2 start = c.layout.beams[p.beam].start_mm;
            double geometric_mm = 0, optical_mm = 0;
            for (size_t k = 0; k < p.segments.size(); ++k) {
                const rv::TraceSegment& s = p.segments[k];
                // Each segment is as long as the distance between its ends and starts where
                // the previous one ended (no retroreflector in these layouts).
                CHECK_THAT(s.length_mm,
                           rv::test::near((s.to_mm - s.from_mm).norm(), 1e-9 * (1 + s.length_mm)));
                if (k > 0) CHECK((s.from_mm - p.segments[k - 1].to_mm).norm() < 1e-9);
                CHECK(s.index >= 1.0);
                geometric_mm += s.length_mm;
                optical_mm += s.index * s.length_mm;
            }
            const double straight_mm = (p.segments.back().to_mm - start).norm();
            CHECK(geometric_mm >= straight_mm * (1 - 1e-12));
            CHECK(optical_mm >= straight_mm * (1 - 1e-12));
            if (b.at_target.reached) {
                const double to_target_mm = (b.at_target.hit_mm - start).norm();
                CHECK(b.at_target.path_mm >= to_target_mm * (1 - 1e-12));
            }
            for (size_t k = 1; k < p.hits.size(); ++k) CHECK(p.hits[k].s_mm >= p.hits[k - 1].s_mm);
        }
    }
}

TEST_CASE("overlap factors and other fractions of a random layout lie in 0 to 1",
          "[hardening][random]") {
    size_t overlaps = 0;
    auto fraction = [](double v) { return v >= 0.0 && v <= 1.0; };
    for (const Case& c : cases()) {
        CAPTURE(c.layout.name);
        const rv::RendezvousReport& r = c.report;
        if (r.overlap) {
            ++overlaps;
            CHECK(fraction(r.overlap->spatial));
            CHECK(fraction(r.overlap->spatial_along_crystal));
            if (r.overlap->temporal) CHECK(fraction(*r.overlap->temporal));
            CHECK(fraction(r.overlap->combined));
        }
        for (const rv::PhaseMatchingReport& p : r.phase_matching)
            CHECK(fraction(p.sinc2_now));
        for (const rv::ReportBeam& b : r.beams)
            for (const rv::BeamAtHit& w : b.caustic.at_hits) CHECK(fraction(w.clipped_fraction));
    }
    CHECK(overlaps >= kLayouts / 4);
}

TEST_CASE("swapping the two beams flips the delay and keeps the other mismatch figures",
          "[hardening][random]") {
    // The report's first beam is the first in the file (build_report keeps trace_layout's
    // order, layout.beams); the mismatch is beam 2 relative to beam 1 and the delay is
    // arrival 1 − arrival 2 (analysis/target_summary.hpp). These layouts have no aim_at
    // mirror, the one place where the order of the beams changes a trace.
    size_t compared = 0;
    for (const Case& c : cases(true)) {
        if (!c.swapped) continue;
        CAPTURE(c.layout.name);
        const rv::RendezvousReport& ab = c.report;
        const rv::RendezvousReport& ba = *c.swapped;
        REQUIRE(ba.beams.size() == 2);
        CHECK(ab.beams[0].id == ba.beams[1].id);
        CHECK(both_reach(ab) == both_reach(ba));
        if (!both_reach(ab) || !ab.mismatch || !ba.mismatch) continue;
        ++compared;
        const rv::Mismatch& m = *ab.mismatch;
        const rv::Mismatch& s = *ba.mismatch;
        auto flipped = [](double original) {
            return rv::test::near(-original, 1e-9 * (1 + std::abs(original)));
        };
        auto same = [](double original) {
            return rv::test::near(original, 1e-9 * (1 + std::abs(original)));
        };
        CHECK_THAT(s.delay_fs, flipped(m.delay_fs));
        CHECK_THAT(s.waist_offset_mm, flipped(m.waist_offset_mm));
        CHECK_THAT(s.waist_offset_tangential_mm, flipped(m.waist_offset_tangential_mm));
        CHECK_THAT(s.waist_offset_sagittal_mm, flipped(m.waist_offset_sagittal_mm));
        CHECK_THAT(s.waist_ratio, rv::test::near_rel(1 / m.waist_ratio, 1e-9));
        CHECK_THAT(s.lateral_um, same(m.lateral_um));
        CHECK_THAT(s.angle_mrad, same(m.angle_mrad));
        REQUIRE(ab.confocal_ratio);
        REQUIRE(ba.confocal_ratio);
        CHECK_THAT(*ba.confocal_ratio, rv::test::near_rel(1 / *ab.confocal_ratio, 1e-9));
        // The temporal overlap depends only on |delay|.
        REQUIRE(ab.overlap);
        REQUIRE(ba.overlap);
        CHECK(ab.overlap->temporal.has_value() == ba.overlap->temporal.has_value());
        if (ab.overlap->temporal) CHECK_THAT(*ba.overlap->temporal, same(*ab.overlap->temporal));
        // Each beam's own figures do not depend on where it is listed.
        for (size_t k = 0; k < 2; ++k) {
            const rv::BeamAtTarget& x = ab.beams[k].at_target;
            const rv::BeamAtTarget& y = ba.beams[1 - k].at_target;
            CHECK(x.path_mm == y.path_mm);
            CHECK(x.arrival_fs == y.arrival_fs);
            CHECK(x.tangential.waist_um == y.tangential.waist_um);
            CHECK(x.sagittal.waist_offset_mm == y.sagittal.waist_offset_mm);
        }
    }
    CHECK(compared >= kLayouts / 4);
}

// A process whose output lies where the crystal's index formula has no real value (SHG of
// 427 nm in KTP: 213.5 nm, below its 430 nm range) is said so, with no NaN in the report.
TEST_CASE("a process outside the crystal's index formula gives no NaN", "[hardening]") {
    const rv::LayoutReadResult r = rv::read_layout_file(
        std::string(RV_SOURCE_DIR) + "/tests/hardening/repro/ktp-shg-outside-range.json");
    REQUIRE(r.layout);
    const rv::RendezvousReport report = report_of(*r.layout);
    REQUIRE_FALSE(report.phase_matching.empty());
    for (const rv::PhaseMatchingReport& p : report.phase_matching) {
        CAPTURE(p.beams.first_beam, p.beams.second_beam);
        CHECK(std::isfinite(p.delta_k_l));
        CHECK(std::isfinite(p.sinc2_now));
        REQUIRE(p.outside_index_data);
        REQUIRE(p.outside_index_data->wavelength_nm);
        CHECK_THAT(*p.outside_index_data->wavelength_nm, Catch::Matchers::WithinAbs(213.5, 0.05));
        CHECK(rv::index_gap_text(*p.outside_index_data).find("has no real index at 213.5 nm") != std::string::npos);
        CHECK_FALSE(p.phase_matchable);
    }
    CHECK_FALSE(report.verdict.phase.met);
    for (const std::string& text : report_texts(report)) CHECK_FALSE(has_non_finite_text(text));
}

// The spatial overlap is measured across the bisector of the two chief rays and along the mean
// of their paths through the crystal, so it does not depend on which beam is listed first.
TEST_CASE("the spatial overlap does not depend on the order of the beams", "[hardening][random]") {
    for (const Case& c : cases(true)) {
        if (!c.swapped || !c.report.overlap || !c.swapped->overlap) continue;
        CAPTURE(c.layout.name);
        CHECK_THAT(c.swapped->overlap->spatial, rv::test::near(c.report.overlap->spatial, 1e-9));
        CHECK_THAT(c.swapped->overlap->spatial_along_crystal,
                   rv::test::near(c.report.overlap->spatial_along_crystal, 1e-9));
    }
}

