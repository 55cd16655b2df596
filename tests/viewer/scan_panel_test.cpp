// The Scan plan panel (ui/scan_panel.hpp) driven headless: a click opens it, it shows the plan
// of the document (analysis/scan.hpp, the command's), follows an edit, and never edits.
#include <imgui.h>

#include <catch2/catch.hpp>

#include "edit/document.hpp"
#include "io/layout_reader.hpp"
#include "support/tolerance.hpp"
#include "ui/frame.hpp"
#include "viewer/viewer_session.hpp"

TEST_CASE("a click opens the Scan plan panel on the document's plan and it follows an edit", "[viewer][scan]") {
    rv::edit::Document doc(*rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout);
    rv::test::Session s(doc);
    CHECK_FALSE(s.state.scan.open);
    CHECK_FALSE(s.state.scan.result);
    const ImVec2 c((s.state.scan.header_min.x + s.state.scan.header_max.x) / 2,
                   (s.state.scan.header_min.y + s.state.scan.header_max.y) / 2);
    REQUIRE(s.state.scan.header_max.y > s.state.scan.header_min.y);
    s.mouse(c, true);
    s.mouse(c, false);
    s.frame();
    CHECK(s.state.scan.open);
    REQUIRE(s.state.scan.result);
    REQUIRE_FALSE(s.state.scan.result->refusal);
    const unsigned before = doc.revision();
    // The plan is the report's: its stage centre is the report's zero delay.
    REQUIRE(doc.report().stage);
    CHECK_THAT(s.state.scan.result->plan.stage_mm.centre, rv::test::near(doc.report().stage->zero_delay_mm, 1e-9));
    CHECK(doc.revision() == before);  // read-only
    // An edit (the stage moved 1 mm) gives a new plan: the present position follows.
    rv::Layout moved = doc.layout();
    std::get<rv::Stage>(moved.elements[rv::test::index_of(moved, "S1")].kind).position_mm += 1;
    doc.edit(moved);
    s.frame();
    REQUIRE(s.state.scan.result);
    CHECK(s.state.scan.result->plan.stage_mm.present == std::get<rv::Stage>(moved.elements[rv::test::index_of(moved, "S1")].kind).position_mm);
    CHECK(s.state.scan.revision == doc.revision());
}
