// One evaluation: the report, the solvers and the tolerance run judge a layout through the same
// pipeline (the same wave in the crystal, the same overlap), so their figures agree exactly.
#include <cmath>

#include "analysis/report.hpp"
#include "analysis/target_summary.hpp"
#include "solve/telescope.hpp"
#include "solve/tolerance.hpp"
#include "support/layouts.hpp"

using rv::test::bundled_layout;
using rv::test::layout_from;
using rv::test::near;

namespace {

// A horizontally polarized 1064 nm beam, turned vertical by a half-wave plate at 45° (Hecht,
// Optics, §8.7: linear light at 0° leaves at 2θ), focused by L into a 10 mm BBO whose optic-axis
// plane is horizontal: the light that arrives is the ordinary wave, the source's polarization
// alone would give the extraordinary one. goals.solve moves L to put the waist at the centre.
const char* kPlateBeforeCrystal = R"({"format": "rendezvous-layout", "version": 1,
  "table": {"size_mm": [800, 400]},
  "beams": [{"id": "f", "wavelength_nm": 1064, "start_mm": [0, 200], "direction_deg": 0, "waist_um": 600,
             "polarization": "horizontal"}],
  "elements": [
    {"id": "HWP", "type": "plate", "at_mm": [100, 200], "role": "half-wave", "material": "fused-silica",
     "thickness_mm": 1, "fast_axis_deg": 45, "design_nm": 1064},
    {"id": "L", "type": "lens", "at_mm": [300, 200], "focal_length_mm": 200},
    {"id": "X", "type": "crystal", "at_mm": [510, 200], "normal_deg": 3, "material": "BBO", "length_mm": 10,
     "cut_deg": 22.8, "phase_matching": "type-I", "optic_axis": "horizontal"},
    {"id": "D", "type": "dump", "at_mm": [700, 200], "normal_deg": 180, "aperture_mm": 50}],
  "target": "X",
  "goals": {"solve": {"aim": "focus", "move": {"L": [-25, 25]}}}})";

}  // namespace

TEST_CASE("the solver optimizes the wave the report then judges", "[one-evaluation][solve]") {
    const rv::Layout start = layout_from(kPlateBeforeCrystal);
    const rv::MaterialLibrary lib = rv::material_library_for(start);
    const rv::SolveResult r = rv::solve_telescopes(start, lib, {});
    REQUIRE(r.error.empty());
    REQUIRE_FALSE(r.solutions.empty());
    const rv::Layout& solved = r.solutions.front().layout;

    // The solver's own evaluation of its answer and the report of the layout it writes agree.
    const std::vector<rv::BeamAtTarget> lean = rv::evaluate_beams_at_target(solved, lib);
    const rv::RendezvousReport report = rv::build_report(solved, lib);
    REQUIRE(lean.size() == 1);
    REQUIRE(lean[0].reached);
    const rv::BeamAtTarget& judged = report.beams.at(0).at_target;
    CHECK_THAT(lean[0].tangential.waist_offset_mm, near(judged.tangential.waist_offset_mm, 1e-9));
    CHECK_THAT(lean[0].sagittal.waist_offset_mm, near(judged.sagittal.waist_offset_mm, 1e-9));
    CHECK_THAT(lean[0].tangential.rayleigh_mm, near(judged.tangential.rayleigh_mm, 1e-9));
    CHECK_THAT(lean[0].index, near(judged.index, 1e-12));
    // …and the report finds the focus where the solver put it: at the crystal's centre, to
    // within what rounding the lens position to 0.001 mm for the file moves it.
    CHECK(std::abs(judged.tangential.waist_offset_mm + judged.sagittal.waist_offset_mm) / 2 < 2e-3);

    // The case is one where the wave matters: traced with the source's polarization (the
    // extraordinary wave) the same layout puts the waist measurably elsewhere.
    rv::TraceCache source_wave;
    source_wave.crystal_polarization_known = true;  // no arriving-wave correction
    const std::vector<rv::BeamAtTarget> as_source = rv::evaluate_beams_at_target(solved, lib, &source_wave);
    REQUIRE(as_source[0].reached);
    CHECK(std::abs(as_source[0].tangential.waist_offset_mm - judged.tangential.waist_offset_mm) > 0.01);
}

TEST_CASE("the tolerance run's nominal figures are the report's on every bundled layout", "[one-evaluation][tolerance]") {
    for (const char* name : {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        CAPTURE(name);
        const rv::Layout l = bundled_layout(name);
        const rv::MaterialLibrary lib = rv::material_library_for(l);
        const rv::ToleranceReport t = rv::analyse_tolerances(l, lib, 10, 1);
        // The run's nominal is the layout aligned with its adjusters (solve/alignment.hpp).
        const rv::RendezvousReport r = rv::build_report(t.aligned, lib);
        REQUIRE(t.nominal.valid);
        if (r.beams.size() == 1) {
            const rv::BeamAtTarget& b = r.beams[0].at_target;
            CHECK_THAT(t.nominal.waist_offset_mm,
                       near((b.tangential.waist_offset_mm + b.sagittal.waist_offset_mm) / 2, 1e-9));
            continue;
        }
        REQUIRE(r.mismatch);
        REQUIRE(r.overlap);
        CHECK_THAT(t.nominal.waist_offset_mm, near(r.mismatch->waist_offset_mm, 1e-9));
        CHECK_THAT(t.nominal.waist_ratio, near(r.mismatch->waist_ratio, 1e-12));
        CHECK_THAT(t.nominal.lateral_um, near(r.mismatch->lateral_um, 1e-9));
        CHECK_THAT(t.nominal.delay_fs, near(r.mismatch->delay_fs, 1e-6));
        CHECK_THAT(t.nominal.overlap, near(r.overlap->combined, 1e-12));
    }
}
