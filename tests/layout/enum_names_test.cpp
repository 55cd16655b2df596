// One table per enum ↔ file text (layout/enum_names.hpp, layout/element_kinds.hpp, the lens
// shapes): each equals, in order, the enum its key has in the layout file's schema
// (layouts/schema.json), so the reader, the writer, the inspector and the schema cannot drift.
#include <catch2/catch.hpp>

#include <fstream>
#include <nlohmann/json.hpp>

#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"
#include "layout/element_kinds.hpp"
#include "layout/enum_names.hpp"
#include "layout/lens_shape.hpp"

namespace {

const nlohmann::json& schema() {
    static const nlohmann::json s = [] {
        std::ifstream in(RV_SOURCE_DIR "/layouts/schema.json");
        return nlohmann::json::parse(in);
    }();
    return s;
}

std::vector<std::string> schema_enum(const char* pointer) {
    const nlohmann::json& at = schema().at(nlohmann::json::json_pointer(pointer));
    return at.at("enum").get<std::vector<std::string>>();
}

}  // namespace

TEST_CASE("Each enum table equals the schema's enum for its key") {
    CHECK(rv::texts_of(rv::kPolarizationNames) == schema_enum("/$defs/beam/properties/polarization"));
    CHECK(rv::texts_of(rv::kPlateRoleNames) == schema_enum("/$defs/plate/properties/role"));
    CHECK(rv::texts_of(rv::kCubeReflectsNames) == schema_enum("/$defs/plate/properties/reflects"));
    CHECK(rv::texts_of(rv::kDichroicReflectsNames) == schema_enum("/$defs/dichroic/properties/reflects"));
    CHECK(rv::texts_of(rv::kPhaseMatchingNames) == schema_enum("/$defs/crystal/properties/phase_matching"));
    CHECK(rv::texts_of(rv::kOpticAxisNames) == schema_enum("/$defs/crystal/properties/optic_axis"));
    CHECK(rv::texts_of(rv::kPrincipalPlaneNames) == schema_enum("/$defs/crystal/properties/principal_plane"));
    CHECK(rv::texts_of(rv::kSolveAimNames) == schema_enum("/$defs/goals/properties/solve/properties/aim"));
    CHECK(rv::element_type_names() == schema_enum("/$defs/element/properties/type"));
    CHECK(rv::lens_shape_names() == schema_enum("/$defs/lens/properties/shape"));
}

TEST_CASE("Enum tables parse what they format and refuse other texts") {
    for (const auto& n : rv::kPlateRoleNames) CHECK(rv::value_named(rv::kPlateRoleNames, n.text) == n.value);
    for (const auto& n : rv::kPolarizationNames) CHECK(rv::text_of(rv::kPolarizationNames, n.value) == n.text);
    CHECK_FALSE(rv::value_named(rv::kPlateRoleNames, "Half-wave").has_value());  // case counts
    CHECK_FALSE(rv::value_named(rv::kSolveAimNames, "").has_value());
    CHECK(rv::position_in(rv::kOpticAxisNames, false) == 1);
}

TEST_CASE("Every plate role and polarization survives a write and a read") {
    // The writer and the reader use the same tables: each value written reads back the same.
    rv::Layout l = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    size_t plate = l.elements.size();
    for (size_t i = 0; i < l.elements.size(); ++i)
        if (std::holds_alternative<rv::Plate>(l.elements[i].kind)) plate = i;
    REQUIRE(plate < l.elements.size());
    for (const auto& role : rv::kPlateRoleNames) {
        rv::Plate& p = std::get<rv::Plate>(l.elements[plate].kind);
        p = rv::Plate{};
        p.role = role.value;
        p.slab = {"fused-silica", 2.0};
        if (role.value == rv::Plate::Role::HalfWave || role.value == rv::Plate::Role::QuarterWave) p.design_nm = 800;
        for (const auto& pol : rv::kPolarizationNames) {
            l.beams.front().polarization.kind = pol.value;
            INFO(role.text << " " << pol.text);
            const auto back = rv::read_layout(rv::write_layout(l));
            REQUIRE(back.layout);
            CHECK(std::get<rv::Plate>(back.layout->elements[plate].kind).role == role.value);
            CHECK(back.layout->beams.front().polarization.kind == pol.value);
        }
    }
}
