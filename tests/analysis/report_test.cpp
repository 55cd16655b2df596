// The report: its advice, applied to the layout, must give what it promises.
#include "analysis/report.hpp"

#include "analysis/calibrate.hpp"
#include "analysis/phase_setting.hpp"
#include "materials/dispersion.hpp"
#include "nonlinear/phase_matching.hpp"
#include "report/report_words.hpp"
#include "report/verdict_words.hpp"
#include "units/constants.hpp"

#include <cmath>
#include <cstdio>

#include "support/layouts.hpp"

using rv::test::layout_from;
using rv::test::near;

namespace {
rv::Layout demo() { return rv::test::bundled_layout("sfg-bbo.json"); }
rv::RendezvousReport report(const rv::Layout& l) { return rv::build_report(l, rv::material_library_for(l)); }
rv::Element& element(rv::Layout& l, const std::string& id) {
    for (rv::Element& e : l.elements)
        if (e.id == id) return e;
    FAIL("no element " << id);
    return l.elements[0];
}
}  // namespace

TEST_CASE("moving the stage to the reported zero leaves no delay", "[report][stage]") {
    // The stage figure is a retroreflector double pass: 2 n_g,air/c per mm (docs/physics.md §7,
    // 6.673 ps/mm at 800 nm; here 1030 nm in the moving arm).
    rv::Layout l = demo();
    const rv::RendezvousReport r = report(l);
    REQUIRE(r.stage);
    CHECK(r.stage->id == "S1");
    CHECK(r.stage->beam == "pump");
    CHECK_THAT(std::abs(r.stage->delay_per_mm_fs), near(6673.1, 0.5));
    CHECK(r.stage->zero_in_travel);
    CHECK_FALSE(r.verdict.time.met);
    std::get<rv::Stage>(element(l, "S1").kind).position_mm = r.stage->zero_delay_mm;
    const rv::RendezvousReport after = report(l);
    CHECK(std::abs(after.mismatch->delay_fs) < 1.0);  // solver issue's criterion: |delay| < 1 fs
    CHECK(after.verdict.time.met);
    REQUIRE(after.overlap->temporal);
    CHECK_THAT(*after.overlap->temporal, near(1.0, 1e-6));
}

TEST_CASE("a measured zero reading gives the emission offset the model lacks", "[report][stage]") {
    // The offset is the model's delay with the stage at the reading: checked by a second trace
    // with the stage moved there.
    rv::Layout l = demo();
    const double reading = report(l).stage->zero_delay_mm + 0.5;
    std::get<rv::Stage>(element(l, "S1").kind).measured_zero_mm = reading;
    const rv::RendezvousReport r = report(l);
    REQUIRE(r.stage->emission_offset_fs);
    rv::Layout at_reading = l;
    std::get<rv::Stage>(element(at_reading, "S1").kind).position_mm = reading;
    CHECK_THAT(*r.stage->emission_offset_fs, near(report(at_reading).mismatch->delay_fs, 1e-3));
}

namespace {
// The angle between a wave vector and the optic axis of a crystal whose axis lies in the table
// plane at `cut` counter-clockwise from its face normal, by plain vector geometry.
double geometric_theta_deg(const rv::Element& x, double cut_deg, const rv::Vec2& k) {
    const double nd = rv::deg_to_rad(x.normal_deg), c = rv::deg_to_rad(cut_deg);
    const rv::Vec2 n(std::cos(nd), std::sin(nd)), t(-n.y(), n.x());
    const rv::Vec2 axis = std::cos(c) * n + std::sin(c) * t;
    return rv::rad_to_deg(std::acos(std::abs(k.normalized().dot(axis))));
}
}  // namespace

TEST_CASE("turning the crystal as advised phase-matches it", "[report][phase]") {
    // Optic axis in the table plane, vertically polarized (ordinary) inputs: the advice is a
    // turn about the vertical axis, + = clockwise seen from above (normal_deg decreases). The
    // result is checked by geometry and Δk computed here, not by the report itself.
    for (double start_deg : {0.0, 3.0, -4.0, 180.0}) {
        CAPTURE(start_deg);
        rv::Layout l = demo();
        for (rv::BeamSource& b : l.beams) b.polarization.kind = rv::Polarization::Kind::Vertical;
        for (rv::Element& e : l.elements)  // no polarizing optics: the beams arrive as they start
            if (auto* p = std::get_if<rv::Plate>(&e.kind)) {
                rv::Plate plain;
                plain.slab = p->slab;
                *p = plain;
            }
        auto& x = std::get<rv::Crystal>(element(l, "X").kind);
        x.optic_axis_horizontal = true;
        element(l, "X").normal_deg = start_deg;
        const rv::RendezvousReport r = report(l);
        REQUIRE(!r.phase_matching.empty());
        const rv::PhaseMatchingReport& p = r.phase_matching.front();
        CHECK(p.polarizations_suit);
        element(l, "X").normal_deg -= p.rotate_by_deg;
        const rv::RendezvousReport after = report(l);
        const rv::ReportBeam& pump = after.beams[0];
        REQUIRE(pump.at_target.reached);
        const rv::Vec2 k = pump.path.hits[*pump.path.target_hit].direction_in;
        const double theta = geometric_theta_deg(element(l, "X"), x.cut_deg, k);
        CHECK_THAT(theta, near(p.theta_pm_deg, 2e-3));
        const rv::Material& bbo = *rv::MaterialLibrary::builtin().find("BBO");
        const double dkl = rv::delta_k_per_mm(bbo, 1030, 780, rv::MixingType::TypeI, rv::deg_to_rad(theta)) * x.length_mm;
        // sinc²(ΔkL/2), 1 at ΔkL = 0 exactly (the default set's closed form can land there).
        const double half_dkl = dkl / 2;
        CHECK((half_dkl == 0 ? 1.0 : std::pow(std::sin(half_dkl) / half_dkl, 2)) > 0.999);
        CHECK(after.verdict.phase.met);
    }
}

TEST_CASE("the extraordinary index in the trace follows the geometric angle", "[report][crystal]") {
    // Index ellipsoid 1/n² = cos²θ/n_o² + sin²θ/n_e² (Boyd, Nonlinear Optics §2.3) at the angle
    // the traced ray makes with the optic axis: a horizontally polarized beam, axis in the table
    // plane, the crystal turned so the ray refracts.
    rv::Layout l = demo();
    auto& x = std::get<rv::Crystal>(element(l, "X").kind);
    x.optic_axis_horizontal = true;
    element(l, "X").normal_deg = 8;
    const rv::RendezvousReport r = report(l);
    const rv::ReportBeam& pump = r.beams[0];
    REQUIRE(pump.at_target.reached);
    const rv::TraceHit& hit = pump.path.hits[*pump.path.target_hit];
    // The wave vector's direction (the drawn ray is the energy's, turned by the walk-off).
    const double theta = rv::deg_to_rad(geometric_theta_deg(element(l, "X"), x.cut_deg, hit.wave_direction_in()));
    const rv::Material& bbo = *rv::MaterialLibrary::builtin().find("BBO");
    const double no = rv::sample_index(bbo, 1030, rv::Axis::Ordinary).index;
    const double ne = rv::sample_index(bbo, 1030, rv::Axis::Extraordinary).index;
    const double expected = 1 / std::sqrt(std::pow(std::cos(theta) / no, 2) + std::pow(std::sin(theta) / ne, 2));
    CHECK_THAT(hit.index_before, near(expected, 1e-9));
}

TEST_CASE("polarizations that do not suit the type are flagged", "[report][phase]") {
    // Type I (ooe) needs both inputs ordinary; with the optic axis in the vertical plane the
    // ordinary wave is horizontally polarized (index ellipsoid; Boyd, Nonlinear Optics §2.3).
    // The demo's cubes pass horizontal light: with the axis plane turned horizontal, the beams
    // arrive extraordinary.
    rv::Layout l = demo();
    std::get<rv::Crystal>(element(l, "X").kind).optic_axis_horizontal = true;
    const rv::RendezvousReport r = report(l);
    CHECK_FALSE(r.phase_matching.front().polarizations_suit);
    CHECK_FALSE(r.verdict.phase.met);
}

TEST_CASE("the safety block names the invisible beams and where the light ends", "[report][safety]") {
    const rv::RendezvousReport r = report(demo());
    // 1030 and 780 nm are near infrared (common practice: 700–1400 nm reaches the retina);
    // the 390 nm second harmonic of the signal is ultraviolet.
    REQUIRE(r.invisible.size() == 3);
    CHECK(r.invisible[0].band == rv::InvisibleLight::Band::NearInfrared);
    CHECK(r.invisible[0].beam == "pump");
    CHECK(r.invisible[2].band == rv::InvisibleLight::Band::Ultraviolet);
    REQUIRE(r.invisible[2].process);
    CHECK_THAT(r.invisible[2].wavelength_nm, near(390.0, 1e-9));
    CHECK(rv::invisible_light_text(r.invisible[0]) == "1030 nm (pump): near infrared, reaches the retina");
    CHECK(rv::invisible_light_text(r.invisible[2]) == "390.0 nm (SHG of signal): ultraviolet");
    for (const rv::ReportBeam& b : r.beams) CHECK(rv::after_target_text(b) == "absorbed in dump D1");
}

TEST_CASE("a waist below two wavelengths is a paraxial warning", "[report]") {
    // Practice.md need 11 (common practice): the paraxial Gaussian model fails for w0 ≲ λ.
    const rv::LayoutReadResult r = rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/layouts/two-beam-microscope.json");
    REQUIRE(r.layout);
    const rv::RendezvousReport rep = report(*r.layout);
    size_t paraxial = 0;
    for (const rv::Finding& f : rep.findings) paraxial += f.kind == rv::Finding::Kind::Paraxial;
    CHECK(paraxial == 2);
}

TEST_CASE("calibrating time zero predicts the new zero after a window is added", "[report][stage]") {
    // The lab finds overlap at a reading 0.4 mm from the model's zero; after calibration the
    // model agrees there. Adding 2 mm of fused silica at normal incidence to the pump arm then
    // moves the zero by the glass's extra group delay t (n_g − n_g,air)/c divided by the
    // stage's delay per mm (docs/physics.md §7).
    const rv::Layout l = demo();
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const double model_zero = report(l).stage->zero_delay_mm;
    const rv::CalibrationResult c = rv::calibrate_time_zero(l, lib, model_zero + 0.4);
    const rv::RendezvousReport calibrated = report(c.layout);
    CHECK_THAT(calibrated.stage->zero_delay_mm, near(model_zero + 0.4, 1e-6));
    CHECK_THAT(*calibrated.stage->emission_offset_fs, near(0.0, 1e-6));

    rv::Layout changed = c.layout;
    rv::Element window;
    window.id = "W";
    window.at_mm = {140, 300};
    rv::Plate glass;
    glass.slab = {"fused-silica", 2.0};
    window.kind = glass;
    changed.elements.push_back(window);
    const rv::RendezvousReport after = report(changed);
    const double ng = rv::absolute_index(*lib.find("fused-silica"), *lib.find("air"), 1030).group_index;
    const double ng_air = rv::sample_index(*lib.find("air"), 1030).group_index;
    const double extra_fs = rv::group_delay_fs(ng - ng_air, 2.0);
    CHECK_THAT(after.stage->zero_delay_mm - calibrated.stage->zero_delay_mm,
               near(extra_fs / -after.stage->delay_per_mm_fs, 1e-6));
}

TEST_CASE("a verdict line that does not apply says n/a and passes the check", "[report][verdict]") {
    // Issue 14 item 7: phase for a target that is not a crystal is not "met"; time with one beam
    // has no delay to match.
    const rv::RendezvousReport microscope = report(rv::test::bundled_layout("two-beam-microscope.json"));
    const rv::VerdictLine& phase = microscope.verdict.phase;
    CHECK_FALSE(phase.applies);
    CHECK(std::string(rv::verdict_state_text(phase)) == "n/a");
    CHECK(rv::verdict_line_text(phase) == "n/a — the target is not a crystal");
    CHECK(phase.actions.empty());
    CHECK(std::holds_alternative<rv::verdict_reading::TargetNotCrystal>(phase.reading));
    CHECK(rv::verdict_passes(phase));
    CHECK(microscope.verdict.time.applies);

    const rv::Layout one_beam = layout_from(rv::test::layout_json(
        R"({"id": "b", "wavelength_nm": 800, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 800})",
        R"({"id": "T", "type": "target", "at_mm": [500, 500]})", "T"));
    const rv::RendezvousReport single = report(one_beam);
    CHECK(rv::verdict_line_text(single.verdict.time) == "n/a — one beam: no delay to match");
    CHECK(rv::verdict_passes(single.verdict.time));

    // A crystal target keeps a real phase verdict.
    const rv::RendezvousReport sfg = report(demo());
    CHECK(sfg.verdict.phase.applies);
    CHECK(std::string(rv::verdict_state_text(sfg.verdict.phase)) == (sfg.verdict.phase.met ? "met" : "NOT MET"));
    rv::VerdictLine failing;
    CHECK_FALSE(rv::verdict_passes(failing));
}

TEST_CASE("a delay above 10 ps is said in ps in the time verdict", "[report][verdict]") {
    // Issue 14 item 7: 52 ps reads "+52.xxx ps", not "+52345.6 fs".
    rv::Layout l = demo();
    const double before_fs = report(l).mismatch->delay_fs;
    l.beams[0].emit_time_fs += 52000;  // beam 0 arrives 52 ps later
    const rv::RendezvousReport r = report(l);
    const double delay_fs = r.mismatch->delay_fs;
    CHECK_THAT(delay_fs - before_fs, near(52000, 1e-6));
    char expected[64];
    std::snprintf(expected, sizeof expected, "delay %+.3f ps = ", delay_fs * 1e-3);
    const std::string summary = rv::verdict_reading_text(r.verdict.time.reading);
    CHECK(summary.rfind(expected, 0) == 0);
    CHECK(summary.find(" fs = ") == std::string::npos);
}

TEST_CASE("applying the verdict's actions, read as data, meets the time and phase lines",
          "[report][verdict]") {
    // Findings are data: a program can follow the advice without reading its words. The demo's
    // time line asks for a stage move and its phase line for a crystal tilt; doing exactly what
    // the actions say must meet both lines on the re-run.
    rv::Layout l = demo();
    const rv::RendezvousReport r = report(l);
    REQUIRE_FALSE(r.verdict.time.met);
    REQUIRE_FALSE(r.verdict.phase.met);
    REQUIRE(r.verdict.time.actions.size() == 1);
    const auto* move = std::get_if<rv::verdict_action::MoveStage>(&r.verdict.time.actions[0]);
    REQUIRE(move);
    auto& stage = std::get<rv::Stage>(element(l, move->stage).kind);
    CHECK_THAT(move->to_mm - stage.position_mm, near(move->move_mm, 1e-9));
    stage.position_mm = move->to_mm;
    bool turned = false;
    for (const rv::VerdictAction& a : r.verdict.phase.actions)
        if (const auto* turn = std::get_if<rv::verdict_action::RotateCrystal>(&a)) {
            CHECK(turn->process_key == "sfg");
            if (turn->rotation == rv::CrystalRotation::Turn)
                element(l, r.target).normal_deg -= turn->by_deg;
            else  // a tilt of + by_deg raises the face normal: tilt_deg grows by it
                std::get<rv::Crystal>(element(l, r.target).kind).tilt_deg += turn->by_deg;
            turned = true;
        }
    REQUIRE(turned);
    const rv::RendezvousReport after = report(l);
    CHECK(after.verdict.time.met);
    CHECK(after.verdict.phase.met);
    CHECK(after.verdict.time.actions.empty());
    CHECK(after.verdict.phase.actions.empty());
    // The reading carries the figures the line is judged by.
    const auto* delay = std::get_if<rv::verdict_reading::Delay>(&after.verdict.time.reading);
    REQUIRE(delay);
    CHECK(delay->delay_fs == after.mismatch->delay_fs);
    const auto* angles = std::get_if<rv::verdict_reading::PhaseAngles>(&after.verdict.phase.reading);
    REQUIRE(angles);
    CHECK(angles->sinc2 == after.phase_matching.front().sinc2_now);
    CHECK(angles->process.first_beam == "pump");
    CHECK(angles->process.second_beam == "signal");
}

TEST_CASE("setting the oven as the verdict says, read as data, meets the phase line",
          "[report][verdict][temperature]") {
    // A crystal cut for non-critical matching (LBO along X, in an oven at 120 °C, below its
    // matching temperature): the advice is a temperature, not a turn; applying it meets the line.
    const rv::LayoutReadResult read =
        rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/tests/layouts/temperature/lbo-oven-1064.json");
    REQUIRE(read.layout);
    rv::Layout l = *read.layout;
    const rv::RendezvousReport r = report(l);
    REQUIRE_FALSE(r.verdict.phase.met);
    REQUIRE(r.phase_matching.front().temperature);
    const rv::verdict_action::SetCrystalTemperature* oven = nullptr;
    for (const rv::VerdictAction& a : r.verdict.phase.actions) {
        CHECK_FALSE(std::holds_alternative<rv::verdict_action::RotateCrystal>(a));
        if (const auto* o = std::get_if<rv::verdict_action::SetCrystalTemperature>(&a)) oven = o;
    }
    REQUIRE(oven);
    CHECK(oven->crystal == "OVEN");
    CHECK(oven->process_key == "shg:nd");
    CHECK(oven->to_c == *r.phase_matching.front().temperature->phase_matching_c);
    std::get<rv::Crystal>(element(l, oven->crystal).kind).temperature_c = oven->to_c;
    const rv::RendezvousReport after = report(l);
    CHECK(after.verdict.phase.met);
    CHECK(after.verdict.phase.actions.empty());
    CHECK(after.phase_matching.front().sinc2_now > 0.999);
    CHECK_THAT(after.phase_matching.front().temperature->now_c, near(oven->to_c, 1e-12));
}

TEST_CASE("`phase` on a crystal in an oven sets its temperature and keeps its angle",
          "[report][phase][temperature]") {
    const rv::LayoutReadResult read =
        rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/tests/layouts/temperature/lbo-oven-1064.json");
    REQUIRE(read.layout);
    const rv::PhaseSetting s = rv::set_crystal_for_process(*read.layout, rv::material_library_for(*read.layout), "shg:nd");
    CHECK(s.by_temperature);
    REQUIRE(s.temperature_before_c);
    REQUIRE(s.temperature_after_c);
    CHECK(*s.temperature_before_c == 120);
    CHECK_THAT(*s.temperature_after_c, near(149, 2));
    CHECK(s.change_deg == 0);
    CHECK(s.tilt_after_deg == s.tilt_before_deg);
    CHECK(s.sinc2_before < 0.01);
    CHECK(s.sinc2_after > 0.999);
    // The layout it returns, read as a user's file would be, gives the same verdict.
    CHECK(report(s.layout).verdict.phase.met);
}
