// A lens's `part`: read as a printable id, written back, checked against a catalog where one is
// known, and named by the parts list.
#include "io/lens_parts.hpp"

#include "analysis/parts_list.hpp"
#include "io/layout_writer.hpp"
#include "support/layouts.hpp"

using rv::test::layout_from;

namespace {

std::string with_lens(const std::string& lens_keys) {
    return R"({"format": "rendezvous-layout", "version": 1, "table": {"size_mm": [1000, 1000]},
      "beams": [{"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 500}],
      "elements": [{"id": "T", "type": "target", "at_mm": [600, 500]},
                   {"id": "L1", "type": "lens", "at_mm": [100, 500], )" +
           lens_keys + R"(}],
      "target": "T"})";
}

rv::CatalogLens ideal(const std::string& id, double f_mm, double diameter_mm) {
    return {id, f_mm, diameter_mm, rv::Lens{rv::IdealLens{f_mm}}};
}

}  // namespace

TEST_CASE("a lens's part reads and writes back") {
    const rv::Layout l =
        layout_from(with_lens(R"("part": "ideal-f100-d25.4", "focal_length_mm": 100)"));
    const auto& lens = std::get<rv::Lens>(l.find("L1")->kind);
    CHECK(lens.part == "ideal-f100-d25.4");
    const std::string text = rv::write_layout(l);
    CHECK(text.find("\"part\": \"ideal-f100-d25.4\"") != std::string::npos);
    const rv::LayoutReadResult back = rv::read_layout(text);
    REQUIRE(back.layout.has_value());
    CHECK(*back.layout == l);
    // Without it, the writer writes none.
    const rv::Layout plain = layout_from(with_lens(R"("focal_length_mm": 100)"));
    CHECK_FALSE(std::get<rv::Lens>(plain.find("L1")->kind).part.has_value());
    CHECK(rv::write_layout(plain).find("\"part\"") == std::string::npos);
}

TEST_CASE("a part that is empty or not printable is a located error") {
    const rv::LayoutReadResult empty =
        rv::read_layout(with_lens(R"("part": "", "focal_length_mm": 100)"));
    CHECK_FALSE(empty.layout.has_value());
    REQUIRE(empty.diagnostics.size() == 1);
    CHECK(empty.diagnostics[0].pointer == "/elements/1/part");
    CHECK(empty.diagnostics[0].message == "must not be empty");
    const rv::LayoutReadResult control =
        rv::read_layout(with_lens(R"("part": "f100\u001b[2J", "focal_length_mm": 100)"));
    CHECK_FALSE(control.layout.has_value());
    REQUIRE(control.diagnostics.size() == 1);
    CHECK(control.diagnostics[0].pointer == "/elements/1/part");
    CHECK(control.diagnostics[0].message ==
          "an id must be printable: character 5 is a control character (\\x1B)");
    const rv::LayoutReadResult number =
        rv::read_layout(with_lens(R"("part": 100, "focal_length_mm": 100)"));
    CHECK_FALSE(number.layout.has_value());
}

TEST_CASE("a part the catalog does not hold is an error at the lens") {
    const rv::Layout l =
        layout_from(with_lens(R"("part": "ideal-f100-d25", "focal_length_mm": 100)"));
    const std::vector<rv::CatalogLens> catalog = {ideal("ideal-f100-d25.4", 100, 25.4),
                                                  ideal("ideal-f200-d25.4", 200, 25.4)};
    const rv::Diagnostics d = rv::check_lens_parts(l, catalog);
    REQUIRE(d.size() == 1);
    CHECK(d[0].severity == rv::Diagnostic::Severity::Error);
    CHECK(d[0].pointer == "/elements/1/part");
    CHECK(d[0].subject == "L1");
    CHECK(d[0].message ==
          "no lens of the catalog has id \"ideal-f100-d25\"; did you mean \"ideal-f100-d25.4\"? "
          "(remove \"part\", or use "
          "the catalog it came from)");
    // A lens the solver may swap is not checked: its part is replaced.
    CHECK(rv::check_lens_parts(l, catalog, {"L1"}).empty());
}

TEST_CASE("a part whose numbers disagree with the catalog is an error naming both") {
    const std::vector<rv::CatalogLens> catalog = {ideal("ideal-f100-d25.4", 100, 25.4)};
    // The default aperture is 25.4 mm: the same lens agrees.
    CHECK(rv::check_lens_parts(
              layout_from(with_lens(R"("part": "ideal-f100-d25.4", "focal_length_mm": 100)")),
              catalog)
              .empty());
    const rv::Layout other = layout_from(
        with_lens(R"("part": "ideal-f100-d25.4", "focal_length_mm": 120, "aperture_mm": 12.7)"));
    const rv::Diagnostics d = rv::check_lens_parts(other, catalog);
    REQUIRE(d.size() == 1);
    CHECK(d[0].pointer == "/elements/1/part");
    CHECK(d[0].subject == "L1");
    CHECK(d[0].message ==
          "the catalog's \"ideal-f100-d25.4\" is not this lens: focal length 100 mm in the "
          "catalog, 120 mm here; diameter "
          "(aperture_mm) 25.4 mm in the catalog, 12.7 mm here (remove \"part\" if the lens is not "
          "that stock lens, or give "
          "it the catalog's numbers)");
    const rv::Layout thick = layout_from(with_lens(
        R"("part": "ideal-f100-d25.4", "shape": "convex-plano", "focal_length_mm": 100, "glass": "N-BK7", "center_thickness_mm": 3)"));
    const rv::Diagnostics k = rv::check_lens_parts(thick, catalog);
    REQUIRE(k.size() == 1);
    CHECK(k[0].message.find("an ideal thin lens in the catalog, a thick singlet here") !=
          std::string::npos);
}

TEST_CASE("the bundled catalog's singlets agree with themselves as written lenses") {
    // What solve writes for a catalog singlet reads back as a lens the catalog check accepts.
    const rv::MaterialLibrary lib = rv::MaterialLibrary::builtin();
    const rv::CatalogReadResult c =
        rv::read_lens_catalog(std::string(RV_SOURCE_DIR) + "/layouts/lenses.json", lib);
    REQUIRE(c.lenses.size() > 10);
    rv::Layout l = layout_from(with_lens(R"("focal_length_mm": 100)"));
    for (const rv::CatalogLens& lens : c.lenses) {
        rv::Element& e = l.elements[1];
        e.kind = rv::Lens(lens.lens.model, lens.id);
        e.aperture_mm = lens.diameter_mm;
        const rv::LayoutReadResult back = rv::read_layout(rv::write_layout(l));
        REQUIRE(back.layout.has_value());
        INFO(lens.id);
        CHECK(rv::check_lens_parts(*back.layout, c.lenses).empty());
    }
}

TEST_CASE("the parts list names a lens by its part") {
    const rv::Layout a =
        layout_from(with_lens(R"("part": "ideal-f100-d25.4", "focal_length_mm": 100)"));
    const rv::Layout b = layout_from(with_lens(R"("focal_length_mm": 100)"));
    const rv::PartSpec with = rv::part_spec(a.elements[1]);
    const rv::PartSpec without = rv::part_spec(b.elements[1]);
    CHECK(with.part == "ideal-f100-d25.4");
    CHECK_FALSE(without.part.has_value());
    CHECK(with.fields == without.fields);  // the specification stays beside the id
    CHECK_FALSE(with == without);          // and the id makes it another part
}
