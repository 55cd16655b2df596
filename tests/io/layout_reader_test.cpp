// Reading layout files: every kind of bad input gets its exact located message.
#include "io/layout_reader.hpp"
#include "io/lens_catalog.hpp"

#include <filesystem>
#include <fstream>

#include "support/tolerance.hpp"

namespace {
const std::filesystem::path kBad = std::filesystem::path(RV_SOURCE_DIR) / "tests/layouts/bad";

std::vector<std::string> messages(const std::string& fixture) {
    const rv::LayoutReadResult r = rv::read_layout_file(kBad / fixture);
    std::vector<std::string> out;
    for (const rv::Diagnostic& d : r.diagnostics) out.push_back(rv::format_diagnostic(d, fixture));
    CHECK_FALSE(r.layout.has_value());
    return out;
}
}  // namespace

TEST_CASE("each bad fixture gets its exact message", "[reader]") {
    struct Case { const char* file; std::vector<std::string> expected; };
    const Case cases[] = {
        {"syntax-error.json", {"syntax-error.json:5:16: error: syntax error: unexpected string literal; expected '}'"}},
        {"empty.json", {"empty.json:1:1: error: syntax error: unexpected end of input; expected '[', '{', or a literal"}},
        {"not-an-object.json", {"not-an-object.json: error: expected a layout object, found an array"}},
        {"missing-key.json", {"missing-key.json: error: /beams/0 (b): missing \"waist_um\", required for a beam"}},
        {"wrong-type.json", {"wrong-type.json: error: /beams/0/wavelength_nm (b): expected a number, found a string (\"1064\")"}},
        {"unknown-key.json", {"unknown-key.json: error: /elements/0/focal_lenght_mm (L): unknown key for a lens; did you mean \"focal_length_mm\"?",
                              "unknown-key.json: error: /elements/0 (L): missing \"focal_length_mm\", required for a lens"}},
        {"unknown-type.json", {"unknown-type.json: error: /elements/0/type (L): unknown element type \"lense\"; did you mean \"lens\"?"}},
        {"zero-focal-length.json", {"zero-focal-length.json: error: /elements/0/focal_length_mm (L): must be non-zero (got 0)"}},
        {"negative-aperture.json", {"negative-aperture.json: error: /elements/1/aperture_mm (T): must be positive (got -5)"}},
        {"m2-below-one.json", {"m2-below-one.json: error: /beams/0/m2/1 (b): must be between 1 and 1000 (got 0.9)"}},
        {"duplicate-id.json", {"duplicate-id.json: error: /elements/1/id (L): duplicate id \"L\" (first used at /elements/0/id)",
                               "duplicate-id.json: error: /target: no element has id \"T\""}},
        {"aim-at-missing.json", {"aim-at-missing.json: error: /elements/1/aim_at (M): no element has id \"M9\"; did you mean \"M\"?"}},
        {"aim-at-stage.json", {"aim-at-stage.json: error: /elements/1/aim_at (M): \"S\" is a stage, which has no position to aim at"}},
        {"aim-and-normal.json", {"aim-and-normal.json: error: /elements/1/normal_deg (M): not allowed together with \"aim_at\""}},
        {"stage-carries-itself.json", {"stage-carries-itself.json: error: /elements/2/carries/0 (S): a stage cannot carry itself"}},
        {"stage-carries-stage.json", {"stage-carries-stage.json: error: /elements/2/carries/0 (S): a stage cannot carry another stage (\"S2\")"}},
        {"stage-outside-travel.json", {"stage-outside-travel.json: error: /elements/2/position_mm (S): must lie within the travel [0, 25] (got 30)"}},
        {"target-missing.json", {"target-missing.json: error: /target: no element has id \"X\""}},
        {"target-not-a-target.json", {"target-not-a-target.json: error: /target: expected the id of a crystal or a target, found the lens \"L\""}},
        {"unknown-material.json", {"unknown-material.json: error: /elements/0/glass (L): unknown material \"N-BK8\"; did you mean \"N-BK7\"?"}},
        {"unsupported-version.json", {"unsupported-version.json: error: /version: unsupported version 2; this program reads version 1"}},
        {"wrong-format.json", {"wrong-format.json: error: /format: expected \"rendezvous-layout\", found \"some-other-layout\""}},
        {"bad-grid.json", {"bad-grid.json: error: /table/grid_mm: expected 25 (metric) or 25.4 (imperial), found 24"}},
        {"angle-without-linear.json", {"angle-without-linear.json: error: /beams/0/polarization_angle_deg (b): only allowed with \"polarization\": \"linear\""}},
        {"shape-and-radius.json", {"shape-and-radius.json: error: /elements/0/front_radius_mm (L): not allowed together with \"shape\""}},
        {"no-beams.json", {"no-beams.json: error: /beams: expected one or two beams, found 0"}},
        {"point-not-pair.json", {"point-not-pair.json: error: /elements/1/at_mm (T): expected [x, y] in mm, found an array ([200])"}},
        {"convex-negative-f.json", {"convex-negative-f.json: error: /elements/0/focal_length_mm (L): no plano-convex lens has this focal length: a convex shape needs a positive focal length"}},
        {"temperature-without-thermo-optic.json", {"temperature-without-thermo-optic.json: error: /elements/1/temperature_c (OVEN): LBO:Chen1989 has no temperature dependence; sets with one: LBO:Kato2018"}},
        {"temperature-two-ovens.json", {"temperature-two-ovens.json: error: /elements/2/temperature_c (OVEN2): crystal \"OVEN\" of the same set LBO:Kato2018 is at 120 °C; one set has one temperature in a layout"}},
        {"plane-on-uniaxial.json", {"plane-on-uniaxial.json: error: /elements/1/principal_plane (T): only for biaxial crystals; BBO:Tamosauskas2018 is not biaxial"}},
        // Found by fuzzing (fuzz_pipeline, seed 5): nlohmann reports an overflowing number as
        // out_of_range, which once escaped as an uncaught exception.
        {"number-overflow.json", {"number-overflow.json: error: a number does not fit a double: '1e999'"}},
        // Found by a hand-made hostile input: 200 000 nested arrays overflowed the stack when a
        // message dumped the value; nesting is now limited while parsing.
        {"deep-nesting.json", {"deep-nesting.json: error: the file nests deeper than 64 levels; a layout needs at most 5"}},
        // Hostile inputs (issue #7). Binary bytes: a syntax error at 1:1; the message quotes
        // the offending byte as it is (0x89, not UTF-8).
        // A byte that is not UTF-8 is shown as \xNN, not written raw to the terminal.
        {"binary-garbage.json", {"binary-garbage.json:1:1: error: syntax error: invalid literal; last read: '\\x89'"}},
        // Positive sizes below the smallest real one (denormals pass "> 0"): a waist of at least
        // 0.1 µm, a length of at least 1e-6 mm (layout/input_limits.hpp).
        {"denormal-waist.json", {"denormal-waist.json: error: /beams/0/waist_um (pump): must be between 0.1 and 1000000 µm (got 9.99988867182683e-321)"}},
        {"denormal-lengths.json", {"denormal-lengths.json: error: /beams/0/waist_um (pump): must be between 0.1 and 1000000 µm (got 9.99988867182683e-321)",
                                   "denormal-lengths.json: error: /elements/0/thickness_mm (P): must be between 1e-06 and 100000 mm (got 4.94065645841247e-324)",
                                   "denormal-lengths.json: error: /elements/1/aperture_mm (T): must be between 1e-06 and 100000 mm (got 9.99999999999997e-311)"}},
        // Bounded numbers at the door (issue 19 §1): values no real table has, with the range.
        {"lengths-out-of-range.json",
         {"lengths-out-of-range.json: error: /elements/0/at_mm/0 (L1): must lie within ±100000 mm (100 m) (got 1e+300)",
          "lengths-out-of-range.json: error: /elements/0/focal_length_mm (L1): must be non-zero, between 1e-06 and 100000 mm either way (got 1e-07)",
          "lengths-out-of-range.json: error: /elements/1/radius_of_curvature_mm (M1): must be non-zero, between 1e-06 and 100000 mm either way (got 200000)",
          "lengths-out-of-range.json: error: /elements/2/position_mm (S): must lie within ±100000 mm (100 m) (got 1e+300)",
          "lengths-out-of-range.json: error: /elements/2/travel_mm/0 (S): must lie within ±100000 mm (100 m) (got -1e+300)",
          "lengths-out-of-range.json: error: /elements/2/travel_mm/1 (S): must lie within ±100000 mm (100 m) (got 1e+300)",
          "lengths-out-of-range.json: error: /elements/3/thickness_mm (P): must be between 1e-06 and 100000 mm (got 1e-07)",
          "lengths-out-of-range.json: error: /elements/4/aperture_mm (T): must be between 1e-06 and 100000 mm (got 1000000)"}},
        {"table-out-of-range.json", {"table-out-of-range.json: error: /table/size_mm/0: must be between 10 and 100000 mm (got 1e-09)",
                                     "table-out-of-range.json: error: /table/size_mm/1: must be between 10 and 100000 mm (got 1000000)"}},
        {"source-out-of-range.json",
         {"source-out-of-range.json: error: /beams/0/direction_deg (pump): must be an angle within ±360 degrees (got 1e+300)",
          "source-out-of-range.json: error: /beams/0/waist_um/0 (pump): must be between 0.1 and 1000000 µm (got 0.05)",
          "source-out-of-range.json: error: /beams/0/waist_um/1 (pump): must be between 0.1 and 1000000 µm (got 2000000)",
          "source-out-of-range.json: error: /beams/0/m2 (pump): must be between 1 and 1000 (got 2000)",
          "source-out-of-range.json: error: /beams/0/pulse_fwhm_fs (pump): must be between 0.1 and 1000000000 fs (got 1000000000000)",
          "source-out-of-range.json: error: /beams/0/emit_time_fs (pump): must be between -1000000000 and 1000000000 fs (got -1e+300)",
          "source-out-of-range.json: error: /beams/0/power_mw (pump): must be between 1e-09 and 100000000 mW (got 1000000000000)",
          "source-out-of-range.json: error: /beams/0/repetition_rate_khz (pump): must be between 1e-06 and 100000000 kHz (got 9.99988867182683e-321)",
          "source-out-of-range.json: error: /beams/1/waist_um (probe): must be between 0.1 and 1000000 µm (got 9.99988867182683e-321)",
          "source-out-of-range.json: error: /elements/0/damage_fluence_j_cm2 (T): must be between 1e-09 and 1000000 J/cm² (got 1e+300)"}},
        // A beam on a pole of a dispersion formula: the user's n² = 1 + 0.64/(0.64 - 0.65) is
        // negative at 800 nm (hand computation); N-BK7's third Schott-form pole lies at
        // sqrt(103.56 µm²) = 10.18 µm (Schott N-BK7 datasheet C3 = 103.560653 µm²), so just
        // below it at 10 µm its n² is negative too.
        {"sellmeier-pole.json",
         {"sellmeier-pole.json: error: /elements/0/material (W): my-glass has no real index at 800 nm (beam \"pump\"): its dispersion formula gives no finite n, near a pole; expected an index of at least 1",
          "sellmeier-pole.json: error: /elements/1/glass (L): N-BK7 has no real index at 10000 nm (beam \"mid\"): its dispersion formula gives no finite n, near a pole; expected an index of at least 1"}},
        {"move-range-huge.json", {"move-range-huge.json: error: /goals/solve/move/L1/0: must lie within ±100000 mm (100 m) (got -1e+308)",
                                  "move-range-huge.json: error: /goals/solve/move/L1/1: must lie within ±100000 mm (100 m) (got 1e+308)"}},
        // Messages that say how to fix it (issue 14): the closest id, the material as the
        // catalogue spells it, the unit a wavelength was written in.
        {"id-typo.json", {"id-typo.json: error: /elements/0/aim_at (FOLD_1): no element has id \"FOLD_22\"; did you mean \"FOLD_2\"?",
                          "id-typo.json: error: /target: no element has id \"SAMPEL\"; did you mean \"SAMPLE\"?"}},
        {"material-without-prefix.json", {"material-without-prefix.json: error: /elements/0/glass (L): unknown material \"BK7\"; did you mean \"N-BK7\"?",
                                          "material-without-prefix.json: error: /elements/1/material (X): unknown material \"bbo\"; did you mean \"BBO\"?"}},
        {"wavelength-unit-slip.json", {"wavelength-unit-slip.json: error: /beams/0/wavelength_nm (pump): must be a wavelength between 150 and 20000 nm (got 0.8 — micrometres? 0.8 µm is 800 nm)",
                                       "wavelength-unit-slip.json: error: /beams/1/wavelength_nm (probe): must be a wavelength between 150 and 20000 nm (got 1550000 — picometres? 1550000 pm is 1550 nm)",
                                       "wavelength-unit-slip.json: error: /elements/0/edge_nm (DM): must be a wavelength between 150 and 20000 nm (got 25000)"}},
        {"truncated.json", {"truncated.json:3:85: error: syntax error: unexpected end of input; expected '}'"}},
        {"wrong-types.json", {"wrong-types.json: error: /version: expected a number, found a string (\"1\")",
                              "wrong-types.json: error: /name: expected a string, found a number (7)",
                              "wrong-types.json: error: /table/size_mm: expected an array of numbers, found a string (\"900x600\")",
                              "wrong-types.json: error: /beams/0/start_mm/1 (pump): expected a number, found a string (\"300\")",
                              "wrong-types.json: error: /beams/0/direction_deg (pump): expected a number, found null (null)",
                              "wrong-types.json: error: /beams/0/waist_um/0 (pump): expected a number, found a boolean (true)",
                              "wrong-types.json: error: /beams/0/m2 (pump): expected one number or [tangential, sagittal], found an object ({})",
                              "wrong-types.json: error: /elements/0/focal_length_mm (L1): expected a number, found a string (\"150\")",
                              "wrong-types.json: error: /elements/1/id: expected a string, found a number (5)",
                              "wrong-types.json: error: /elements/2/aperture_mm (T): expected a number, found a boolean (false)",
                              "wrong-types.json: error: /target: expected a string, found an array ([\"T\"])"}},
        // JSON has no NaN or Infinity: each spelling is a syntax error at its line and column.
        {"nan-literal.json", {"nan-literal.json:2:104: error: syntax error: invalid literal; last read: '\"waist_um\": N'"}},
        {"infinity-literal.json", {"infinity-literal.json:2:104: error: syntax error: invalid literal; last read: '\"waist_um\": I'"}},
        {"minus-infinity-literal.json", {"minus-infinity-literal.json:2:104: error: syntax error: invalid number; expected digit after '-'; last read: '-I'"}},
        // A 1 MiB id as the target: the message repeats the whole id (it is not shortened).
        // A 1 MiB id: the message keeps its first 200 and last 75 bytes (1 048 596 in all).
        {"long-id.json", {"long-id.json: error: /target: no element has id \"" + std::string(181, 'x') +
                          " … (1048321 bytes left out) … " + std::string(74, 'x') + "\""}},
        // Every problem of a file in one pass.
        {"three-errors.json", {"three-errors.json: error: /beams/0/wavelength_nm (b): must be positive (got -1)",
                               "three-errors.json: error: /elements/0/apperture_mm (L): unknown key for a lens; did you mean \"aperture_mm\"?",
                               "three-errors.json: error: /target: no element has id \"nowhere\""}},
        // Each repeated key at the repeat, with where the first stands: no value silently wins.
        {"duplicate-key.json", {"duplicate-key.json:7:23: error: /beams/0/wavelength_nm (pump): duplicate key \"wavelength_nm\" (the first stands at line 6, column 20)",
                                "duplicate-key.json:13:3: error: /target: duplicate key \"target\" (the first stands at line 12, column 3)"}},
        {"swap-twice.json", {"swap-twice.json: error: /goals/solve/swap/2: \"L1\" is listed twice (first at /goals/solve/swap/0)"}},
        // A lens moved twice is a repeated key of the move object: refused at the second.
        {"move-twice.json", {"move-twice.json:13:49: error: /goals/solve/move/L1: duplicate key \"L1\" (the first stands at line 13, column 32)"}},
        // goals.tolerance.adjust: each entry checked for its shape, its element's kind and repeats.
        {"adjust-errors.json",
         {"adjust-errors.json: error: /goals/tolerance/adjust/walk/1: expected one or two mirror ids of one beam's path, as [\"M1\", \"M2\"], found an array of 3 entries",
          "adjust-errors.json: error: /goals/tolerance/adjust/tilt: unknown key for the adjusters; expected one of \"stage\", \"walk\", \"refocus\" or \"crystal\"",
          "adjust-errors.json: error: /goals/tolerance/adjust/stage: \"L1\" is a lens; expected a stage (re-zeroed for zero delay)",
          "adjust-errors.json: error: /goals/tolerance/adjust/crystal: \"T\" is a target; expected the target crystal (its angle re-peaked)",
          "adjust-errors.json: error: /goals/tolerance/adjust/refocus/0: \"M2\" is a mirror; expected a lens (refocused on a translation mount)",
          "adjust-errors.json: error: /goals/tolerance/adjust/refocus/2: \"L1\" is listed twice among the adjusters (first at /goals/tolerance/adjust/refocus/1)",
          "adjust-errors.json: error: /goals/tolerance/adjust/walk/0/1: no element has id \"M3\"; did you mean \"M1\"?"}},
        // Counted in characters: "µ" is two bytes but one character.
        {"control-character-id.json", {"control-character-id.json: error: /materials/0/id: an id must be printable: character 3 is a control character (\\x09)",
                                       "control-character-id.json: error: /beams/0/id (pµ\\x1B[2Jmp): an id must be printable: character 3 is a control character (\\x1B)",
                                       "control-character-id.json: error: /elements/0/id (L\\x00x): an id must be printable: character 2 is a control character (\\x00)"}},
    };
    size_t fixtures = 0;
    for (const auto& entry : std::filesystem::directory_iterator(kBad)) fixtures += entry.path().extension() == ".json";
    // Every fixture in the folder has its expectation here.
    CHECK(fixtures == std::size(cases));
    for (const Case& c : cases) {
        CAPTURE(c.file);
        CHECK(messages(c.file) == c.expected);
    }
}

TEST_CASE("an unreadable file is one diagnostic", "[reader]") {
    const rv::LayoutReadResult r = rv::read_layout_file("/nonexistent/folder/layout.json");
    REQUIRE(r.diagnostics.size() == 1);
    CHECK(rv::format_diagnostic(r.diagnostics[0], "layout.json") ==
          "layout.json: error: cannot open the file for reading");
}

TEST_CASE("a thick lens from a named shape gets radii from the lensmaker equation", "[reader]") {
    // Lensmaker (Hecht §6.2): a convex-plano singlet has f = R1/(n − 1) for any thickness; a
    // symmetric biconvex R = (n − 1) f [1 + √(1 − t/(n f))]. N-BK7 n_d = 1.5168 (SCHOTT).
    const rv::LayoutReadResult r = rv::read_layout(R"({"format": "rendezvous-layout", "version": 1,
      "beams": [{"id": "b", "wavelength_nm": 587.56, "start_mm": [0, 0], "direction_deg": 0, "waist_um": 500}],
      "elements": [{"id": "A", "type": "lens", "at_mm": [10, 0], "shape": "convex-plano", "focal_length_mm": 100, "center_thickness_mm": 4, "glass": "N-BK7"},
                   {"id": "B", "type": "lens", "at_mm": [20, 0], "shape": "biconvex", "focal_length_mm": 50, "center_thickness_mm": 6, "glass": "N-BK7"},
                   {"id": "T", "type": "target", "at_mm": [30, 0]}],
      "target": "T"})");
    REQUIRE(r.layout);
    const auto& a = std::get<rv::ThickLens>(std::get<rv::Lens>(r.layout->elements[0].kind).model);
    const auto& b = std::get<rv::ThickLens>(std::get<rv::Lens>(r.layout->elements[1].kind).model);
    CHECK_THAT(a.front_radius_mm, rv::test::near(100 * 0.5168, 5e-3));
    CHECK(std::isinf(a.back_radius_mm));
    const double n = 1.5168;
    CHECK_THAT(b.front_radius_mm, rv::test::near((n - 1) * 50 * (1 + std::sqrt(1 - 6 / (n * 50))), 5e-3));
    CHECK_THAT(b.back_radius_mm, rv::test::near(-b.front_radius_mm, 1e-12));
}

TEST_CASE("a file over 16 MiB is refused before it is read", "[reader]") {
    const std::filesystem::path big = std::filesystem::temp_directory_path() / "rv-big-layout.json";
    {
        std::ofstream out(big, std::ios::binary);
        out << "{\"format\": \"rendezvous-layout\", \"name\": \"";
        const std::string block(1 << 20, 'x');
        for (int i = 0; i < 17; ++i) out << block;
        out << "\"}";
    }
    const rv::LayoutReadResult r = rv::read_layout_file(big);
    std::filesystem::remove(big);
    REQUIRE(r.diagnostics.size() == 1);
    CHECK_FALSE(r.layout);
    CHECK(rv::format_diagnostic(r.diagnostics[0], "big.json") ==
          "big.json: error: the file has 17825835 bytes; a layout may have at most 16777216 (16 MiB)");
}

TEST_CASE("a lens catalog with a repeated key is refused at the repeat", "[reader]") {
    const rv::CatalogReadResult r = rv::parse_lens_catalog(
        "{\"format\": \"rendezvous-lens-catalog\", \"lenses\": [\n"
        "  {\"id\": \"A\", \"kind\": \"achromat\", \"focal_length_mm\": 100, \"diameter_mm\": 25,\n"
        "   \"focal_length_mm\": -100}]}",
        rv::MaterialLibrary::builtin());
    REQUIRE(r.diagnostics.size() == 1);
    CHECK(rv::format_diagnostic(r.diagnostics[0], "lenses.json") ==
          "lenses.json:3:4: error: /lenses/0/focal_length_mm: duplicate key \"focal_length_mm\" (the first stands at line 2, column 35)");
    CHECK(r.lenses.empty());
}
