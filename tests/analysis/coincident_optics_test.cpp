// Two optics in one place (issue 19 §4): a finding, not a silent skip.
#include "analysis/coincident_optics.hpp"

#include "analysis/report.hpp"
#include "support/layouts.hpp"

namespace {
rv::Element copy_of(const rv::Layout& l, const std::string& id, const std::string& new_id) {
    for (const rv::Element& e : l.elements)
        if (e.id == id) {
            rv::Element c = e;
            c.id = new_id;
            return c;
        }
    FAIL("no element " << id);
    return {};
}
std::vector<rv::Finding> coincident(const rv::RendezvousReport& r) {
    std::vector<rv::Finding> out;
    for (const rv::Finding& f : r.findings)
        if (f.kind == rv::Finding::Kind::CoincidentOptics) out.push_back(f);
    return out;
}
}  // namespace

TEST_CASE("two optics within 0.1 mm of each other on a beam's path are a finding", "[report][findings]") {
    const rv::Layout demo = rv::test::bundled_layout("sfg-bbo.json");
    CHECK(coincident(rv::build_report(demo, rv::material_library_for(demo))).empty());
    for (double apart_mm : {0.0, 0.05, 0.099}) {
        CAPTURE(apart_mm);
        rv::Layout l = demo;
        rv::Element twin = copy_of(l, "L_F", "L_F2");
        twin.at_mm.y() += apart_mm;
        l.elements.push_back(twin);
        const auto found = coincident(rv::build_report(l, rv::material_library_for(l)));
        REQUIRE(found.size() == 1);  // one per pair, though both beams pass it
        CHECK(found[0].element == "L_F");
        CHECK(found[0].other_element == "L_F2");
        CHECK(found[0].amount == Approx(apart_mm).margin(1e-12));
        CHECK(rv::finding_severity(found[0].kind) == rv::Finding::Severity::Problem);
        CHECK(rv::finding_text(found[0]).find("L_F2") != std::string::npos);
    }
    rv::Layout l = demo;
    rv::Element apart = copy_of(l, "L_F", "L_F2");
    apart.at_mm.x() += 0.2;  // two lenses 0.2 mm apart: a choice, not a finding
    l.elements.push_back(apart);
    CHECK(coincident(rv::build_report(l, rv::material_library_for(l))).empty());
}

TEST_CASE("the coincidence search finds the one close pair among 20 000 optics", "[report][findings]") {
    // 20 000 optics on a line 1 mm apart, one beam through them (each hit looks in 9 grid cells of
    // the centre hash, so this runs in milliseconds; a pairwise search would compare 2·10⁸ pairs).
    rv::Layout l;
    l.beams.push_back(rv::BeamSource{});
    l.beams[0].id = "b";
    rv::Path path;
    path.beam = 0;
    for (int i = 0; i < 20000; ++i) {
        rv::Element e;
        e.id = "W" + std::to_string(i);
        e.at_mm = rv::Vec2(i * 1.0, 0);
        e.kind = rv::Target{};
        l.elements.push_back(e);
        rv::TraceHit h;
        h.element = static_cast<size_t>(i);
        path.hits.push_back(h);
    }
    l.elements[7].at_mm = l.elements[8].at_mm + rv::Vec2(0, 0.03);
    const auto found = rv::coincident_optics(l, {&path});
    REQUIRE(found.size() == 1);
    CHECK(found[0].element == "W7");
    CHECK(found[0].other_element == "W8");
}
