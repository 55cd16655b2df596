// Polarization, power and peak intensity along a layout, against textbook laws and published
// quartz dispersion.
#include <cmath>

#include "analysis/pulse_intensity.hpp"
#include "analysis/report.hpp"
#include "materials/dispersion.hpp"
#include "polarization/polarization_model.hpp"
#include "report/report_words.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::layout_from;
using rv::test::layout_json;
using rv::test::near;
using rv::test::near_rel;

namespace {

// A 1030 nm beam through a half-wave plate (ideal, design 1030 nm) at `hwp_deg` and a polarizing
// cube, to a target; the cube's reflected port goes to a dump.
std::string hwp_cube(double hwp_deg, const std::string& extra_plate = "", double extinction = 1e9) {
    return layout_json(
        R"({"id": "b", "wavelength_nm": 1030, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 800, "power_mw": 1000,
            "repetition_rate_khz": 1, "pulse_fwhm_fs": 100})",
        R"({"id": "HWP", "type": "plate", "at_mm": [100, 500], "role": "half-wave", "material": "fused-silica",
            "thickness_mm": 1, "fast_axis_deg": )" + std::to_string(hwp_deg) + R"(, "design_nm": 1030},
           {"id": "PBS", "type": "plate", "at_mm": [200, 500], "role": "polarizing-cube", "material": "N-BK7",
            "thickness_mm": 12.7, "extinction_ratio": )" + std::to_string(extinction) + R"(},
           {"id": "DP", "type": "dump", "at_mm": [200, 600], "normal_deg": 270},)" + extra_plate + R"(
           {"id": "T", "type": "target", "at_mm": [500, 500]})",
        "T");
}

const rv::ReportBeam& beam0(const rv::RendezvousReport& r) { return r.beams.at(0); }

rv::RendezvousReport report(const rv::Layout& l) { return rv::build_report(l, rv::material_library_for(l)); }

}  // namespace

TEST_CASE("Malus's law through a rotated half-wave plate and a polarizing cube", "[polarization]") {
    // Malus's law (Hecht, Optics, 5th ed., §8.2): a half-wave plate at θ turns horizontal light
    // by 2θ, so the cube passes cos²(2θ) of it and reflects the rest (here into a dump).
    for (double deg : {0.0, 10.0, 22.5, 30.0, 45.0, 67.5}) {
        INFO("HWP at " << deg << "°");
        const rv::RendezvousReport r = report(layout_from(hwp_cube(deg)));
        const rv::ReportBeam& b = beam0(r);
        REQUIRE(b.power.reached);
        const double expected = std::pow(std::cos(2 * rv::deg_to_rad(deg)), 2);
        CHECK_THAT(b.power.at_target[0], near(expected, 1e-8));
        REQUIRE(b.target_power_mw.has_value());
        CHECK_THAT(*b.target_power_mw, near(1000 * expected, 1e-5));
        // The reflected part is accounted for and ends in the dump.
        double reflected = 0;
        for (const rv::PowerLoss& loss : b.power.losses)
            if (loss.what == "reflected by the cube") {
                reflected += loss.fraction;
                CHECK(loss.goes_to == "into DP (dump)");
            }
        CHECK_THAT(reflected, near(1 - expected, 1e-8));
    }
}

TEST_CASE("a quarter-wave plate at 45 degrees makes horizontal light circular", "[polarization]") {
    // Hecht, Optics, §8.7: a quarter-wave plate with its axes at 45° to linear light gives
    // circular light (S3 = ±S0, ellipticity angle ±45°); at 0° it leaves the light unchanged.
    const rv::Layout l = layout_from(layout_json(
        R"({"id": "b", "wavelength_nm": 800, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 800})",
        R"({"id": "QWP", "type": "plate", "at_mm": [100, 500], "role": "quarter-wave", "material": "fused-silica",
            "thickness_mm": 1, "fast_axis_deg": 45, "design_nm": 800},
           {"id": "T", "type": "target", "at_mm": [500, 500]})",
        "T"));
    const rv::RendezvousReport b_report = report(l);
    const rv::ReportBeam& b = beam0(b_report);
    const rv::PolarizationState s = b.at_target_polarization;
    CHECK_THAT(std::abs(b.power.at_target[3]), near(1.0, 1e-12));
    CHECK_THAT(std::abs(s.ellipticity_deg), near(45.0, 1e-9));
    CHECK_THAT(s.h, near(0.5, 1e-12));
    CHECK(rv::describe_text(s).rfind("circular", 0) == 0);
    const rv::PolarizationState straight =
        rv::describe(rv::mueller_from_jones(rv::retarder_jones(rv::kPi / 2, 0)) * rv::Stokes(1, 1, 0, 0));
    CHECK_THAT(straight.h, near(1.0, 1e-12));
}

TEST_CASE("quartz indices match the published values", "[polarization][materials]") {
    // G. Ghosh, Opt. Commun. 163, 95 (1999), as rounded to 3 decimals in the Crystran handbook
    // (5th ed., 2023) table: n_o, n_e at 532, 633, 1064 and 1550 nm.
    const rv::Material& q = rv::test::material("quartz");
    const double table[][3] = {{532, 1.547, 1.556}, {633, 1.543, 1.552}, {1064, 1.534, 1.543}, {1550, 1.528, 1.536}};
    for (const auto& row : table) {
        INFO(row[0] << " nm");
        CHECK_THAT(rv::sample_index(q, row[0], rv::Axis::Ordinary).index, near(row[1], 5e-4));
        CHECK_THAT(rv::sample_index(q, row[0], rv::Axis::Extraordinary).index, near(row[2], 5e-4));
    }
    // Two published sets (Ghosh 1999 and Radhakrishnan 1951) agree on n to about 1e-4.
    const rv::Material& r = rv::test::material("quartz:Radhakrishnan1951");
    for (double nm : {400.0, 800.0, 1550.0}) {
        CHECK_THAT(rv::sample_index(r, nm, rv::Axis::Ordinary).index,
                   near(rv::sample_index(q, nm, rv::Axis::Ordinary).index, 2e-4));
        CHECK_THAT(rv::sample_index(r, nm, rv::Axis::Extraordinary).index,
                   near(rv::sample_index(q, nm, rv::Axis::Extraordinary).index, 2e-4));
    }
}

TEST_CASE("a zero-order quartz half-wave plate at two wavelengths", "[polarization]") {
    // Retardance Γ = (n_e − n_o) d / λ waves (Hecht, Optics, §8.7), with d set by Γ = ½ at the
    // design wavelength 1030 nm; n from Ghosh's formula (Opt. Commun. 163, 95 (1999)),
    // evaluated here from the published coefficients independently of the library.
    auto ghosh = [](double nm, bool extraordinary) {
        const double l2 = std::pow(nm * 1e-3, 2);
        return extraordinary ? std::sqrt(1.28851804 + 1.09509924 * l2 / (l2 - 1.02101864e-2) + 1.15662475 * l2 / (l2 - 100))
                             : std::sqrt(1.28604141 + 1.07044083 * l2 / (l2 - 1.00585997e-2) + 1.10202242 * l2 / (l2 - 100));
    };
    auto dn = [&](double nm) { return ghosh(nm, true) - ghosh(nm, false); };
    const double thickness_nm = 0.5 * 1030 / dn(1030);
    rv::Plate p;
    p.role = rv::Plate::Role::HalfWave;
    p.design_nm = 1030;
    p.retarder_material = "quartz";
    const rv::MaterialLibrary& lib = rv::MaterialLibrary::builtin();
    CHECK_THAT(*rv::retardance_waves(p, 1030, lib), near(0.5, 1e-12));
    CHECK_THAT(*rv::retardance_waves(p, 780, lib), near_rel(dn(780) * thickness_nm / 780, 1e-9));
    CHECK_THAT(*rv::retardance_waves(p, 515, lib), near_rel(dn(515) * thickness_nm / 515, 1e-9));
    // Common practice: the zero-order plate for 1030 nm is about 59 µm of quartz, and at 780 nm
    // it is a 0.67-wave retarder (not a half-wave plate for the other colour).
    CHECK_THAT(thickness_nm * 1e-3, near(58.8, 0.2));
    CHECK_THAT(*rv::retardance_waves(p, 780, lib), near(0.672, 0.002));
    // A multi-order plate (order 5) is also ½ wave at its design wavelength but changes faster.
    rv::Plate m = p;
    m.order = 5;
    CHECK_THAT(std::remainder(*rv::retardance_waves(m, 1030, lib), 1.0), near(0.5 - 1.0, 1e-9));
    CHECK(std::abs(*rv::retardance_waves(m, 1040, lib) - 5.5) > std::abs(*rv::retardance_waves(p, 1040, lib) - 0.5));
}

TEST_CASE("the power budget adds up to the source power", "[polarization]") {
    // Conservation (no source given: the fractions must add to 1 over what reaches the end and
    // every named loss), for every bundled layout and beam.
    for (const char* file : {"sfg-bbo.json", "pump-probe.json", "two-beam-microscope.json", "shg-single.json"}) {
        const rv::Layout l = rv::test::bundled_layout(file);
        for (const rv::ReportBeam& b : report(l).beams) {
            INFO(file << " " << b.id);
            double sum = b.power.end_fraction;
            for (const rv::PowerLoss& loss : b.power.losses) sum += loss.fraction;
            CHECK_THAT(sum, near(1.0, 1e-12));
        }
    }
    // A coating loss of 4 % on a window shows as such.
    const rv::Layout lossy = layout_from(hwp_cube(0, R"({"id": "W", "type": "plate", "at_mm": [300, 500],
        "material": "fused-silica", "thickness_mm": 2, "transmission": 0.96},)"));
    const rv::RendezvousReport b_report = report(lossy);
    const rv::ReportBeam& b = beam0(b_report);
    CHECK_THAT(b.power.at_target[0], near(0.96, 1e-8));
    // A lossy cube met by light that it splits, and a lossy crystal (its transmission counts
    // once, not again at its centre plane): the budget still adds up to 1.
    const rv::Layout split = layout_from(layout_json(
        R"({"id": "b", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 500,
            "polarization": "linear", "polarization_angle_deg": 30})",
        R"({"id": "PBS", "type": "plate", "at_mm": [100, 500], "role": "polarizing-cube", "material": "N-BK7",
            "thickness_mm": 10, "transmission": 0.98},
           {"id": "X", "type": "crystal", "at_mm": [400, 500], "material": "BBO", "length_mm": 2, "cut_deg": 22.8,
            "phase_matching": "type-I", "transmission": 0.9},
           {"id": "D", "type": "dump", "at_mm": [600, 500], "normal_deg": 180})",
        "X"));
    const rv::RendezvousReport c_report = report(split);
    const rv::ReportBeam& c = beam0(c_report);
    double sum = c.power.end_fraction;
    for (const rv::PowerLoss& loss : c.power.losses) sum += loss.fraction;
    CHECK_THAT(sum, near(1.0, 1e-12));
    const double through_cube = 0.98 * (std::pow(std::cos(rv::deg_to_rad(30)), 2) + std::pow(std::sin(rv::deg_to_rad(30)), 2) / 1000);
    // Malus through the cube, then the crystal's loss, counted once where the beam enters it.
    CHECK_THAT(c.power.at_target[0], near(0.9 * through_cube, 1e-9));
    double crystal_loss = 0;
    for (const rv::PowerLoss& loss : c.power.losses)
        if (loss.element == "X") crystal_loss += loss.fraction;
    CHECK_THAT(crystal_loss, near(0.1 * through_cube, 1e-9));
}

TEST_CASE("peak intensity and fluence of a Gaussian pulse", "[polarization][intensity]") {
    // Textbook: E = P/f; P_peak = 0.94 E/τ for a Gaussian pulse (common practice, the factor
    // 2√(ln 2/π)); I_peak = 2 P_peak/(π w²) (Siegman, Lasers, 1986). 1 W at 1 kHz, 100 fs,
    // w = 100 µm: 1 mJ, 9.39 GW, 5.98e13 W/cm², 6.37 J/cm².
    const auto f = rv::pulse_figures({.power_mw = 1000, .repetition_rate_khz = 1, .fwhm_fs = 100,
                                      .radius_tangential_um = 100, .radius_sagittal_um = 100});
    REQUIRE(f);
    CHECK_THAT(f->energy_uj, near_rel(1000, 1e-12));
    CHECK_THAT(f->peak_power_w, near_rel(0.94 * 1e-3 / 100e-15, 1e-3));
    CHECK_THAT(f->peak_intensity_w_cm2, near_rel(2 * f->peak_power_w / (rv::kPi * 1e-4), 1e-12));
    CHECK_THAT(f->peak_intensity_w_cm2, near_rel(5.98e13, 1e-3));
    CHECK_THAT(f->peak_fluence_j_cm2, near_rel(2 * 1e-3 / (rv::kPi * 1e-4), 1e-12));
    CHECK_FALSE(rv::pulse_figures({.power_mw = 1000, .repetition_rate_khz = 0, .fwhm_fs = 100,
                                   .radius_tangential_um = 100, .radius_sagittal_um = 100}));  // no repetition rate: no pulse figures
}

TEST_CASE("a damage threshold below the peak intensity is a warning", "[polarization][intensity]") {
    std::string json = hwp_cube(0);
    json.replace(json.find(R"({"id": "T", "type": "target", "at_mm": [500, 500]})"),
                 std::string(R"({"id": "T", "type": "target", "at_mm": [500, 500]})").size(),
                 R"({"id": "T", "type": "target", "at_mm": [500, 500], "damage_intensity_gw_cm2": 0.01})");
    const rv::RendezvousReport r = report(layout_from(json));
    bool warned = false;
    for (const rv::Finding& f : r.findings) warned = warned || f.kind == rv::Finding::Kind::DamageIntensity;
    CHECK(warned);
    const rv::RendezvousReport safe = report(layout_from(hwp_cube(0)));
    for (const rv::Finding& f : safe.findings) CHECK(f.kind != rv::Finding::Kind::DamageIntensity);
}

TEST_CASE("the report says which way to turn a wave plate for the crystal's polarization", "[polarization]") {
    // Type-I SHG of 1064 nm in BBO needs the fundamental ordinary: horizontal with the optic axis
    // in the vertical plane. A half-wave plate after the cube turns it; at 22.5° only half of it
    // is o (Malus: cos² 45°); the advice is to turn the plate to 0° (or 90°), for all of it.
    const rv::Layout l = layout_from(layout_json(
        R"({"id": "f", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 500, "power_mw": 100})",
        R"({"id": "PBS", "type": "plate", "at_mm": [100, 500], "role": "polarizing-cube", "material": "N-BK7",
            "thickness_mm": 10, "extinction_ratio": 1e9},
           {"id": "DP", "type": "dump", "at_mm": [100, 600], "normal_deg": 270},
           {"id": "HWP", "type": "plate", "at_mm": [200, 500], "role": "half-wave", "material": "fused-silica",
            "thickness_mm": 1, "fast_axis_deg": 22.5, "design_nm": 1064},
           {"id": "X", "type": "crystal", "at_mm": [500, 500], "material": "BBO", "length_mm": 2, "cut_deg": 22.8,
            "phase_matching": "type-I"})",
        "X"));
    const rv::RendezvousReport r = report(l);
    REQUIRE(r.polarization.size() == 1);
    const rv::PolarizationAdvice& a = r.polarization.front();
    CHECK(rv::needed_polarization_text(a) == "o (horizontal)");
    CHECK_THAT(a.useful_fraction, near(0.5, 1e-6));
    CHECK(a.advice == rv::PolarizationAdvice::Advice::TurnPlate);
    CHECK(a.plate == "HWP");
    REQUIRE(a.plate_best_deg);
    CHECK_THAT(std::remainder(*a.plate_best_deg, 90.0), near(0.0, 0.01));
    REQUIRE(a.useful_fraction_best);
    CHECK_THAT(*a.useful_fraction_best, near(1.0, 1e-6));
    CHECK(rv::polarization_advice_text(a).find("turn HWP's fast axis from 22.5°") == 0);
    CHECK_FALSE(r.verdict.phase.met);  // half of the fundamental is e: the polarizations do not suit
}

TEST_CASE("the crystal's index follows the polarization that arrives", "[polarization][crystal]") {
    // A horizontally polarized source turned vertical by a half-wave plate at 45° (Hecht, §8.7:
    // linear light at 0° leaves at 2θ); with the optic axis plane horizontal the vertical wave is
    // the ordinary one, so inside the crystal the chief ray sees n_o (BBO, Kato 1986) whatever its
    // angle, not the extraordinary index the source polarization would give.
    const rv::Layout l = layout_from(layout_json(
        R"({"id": "f", "wavelength_nm": 1064, "start_mm": [0, 500], "direction_deg": 0, "waist_um": 500})",
        R"({"id": "HWP", "type": "plate", "at_mm": [200, 500], "role": "half-wave", "material": "fused-silica",
            "thickness_mm": 1, "fast_axis_deg": 45, "design_nm": 1064},
           {"id": "X", "type": "crystal", "at_mm": [500, 500], "normal_deg": 5, "material": "BBO", "length_mm": 2,
            "cut_deg": 22.8, "phase_matching": "type-I", "optic_axis": "horizontal"})",
        "X"));
    const rv::RendezvousReport r = report(l);
    const rv::ReportBeam& b = beam0(r);
    REQUIRE(b.at_target.reached);
    CHECK(b.at_target_polarization.v > 0.999);
    const double no = rv::sample_index(rv::test::material("BBO"), 1064, rv::Axis::Ordinary).index;
    CHECK_THAT(b.path.hits[*b.path.target_hit].index_before, near(no, 1e-12));
    CHECK(r.phase_matching.front().polarizations_suit);
}

TEST_CASE("circular handedness follows the rotation of the real field", "[polarization]") {
    // Born & Wolf, Principles of Optics, §1.4.2: light is right-handed when, looking towards the
    // source, the field turns clockwise. With e^{i(kz − ωt)}, E(t) = Re[J e^{−iωt}] in the (H, V)
    // plane seen facing the source (H to the right, V up): clockwise means E(0) × E(T/8) < 0.
    // Checked for the Jones output of a quarter-wave plate at ±45° on horizontal light, against
    // the handedness the Stokes description gives.
    for (double axis_deg : {45.0, -45.0}) {
        INFO("fast axis " << axis_deg);
        const rv::JonesMatrix q = rv::retarder_jones(rv::kPi / 2, rv::deg_to_rad(axis_deg));
        const Eigen::Vector2cd e = q * Eigen::Vector2cd(1, 0);
        auto field = [&](double phase) {
            const std::complex<double> w = std::polar(1.0, -phase);
            return Eigen::Vector2d((e[0] * w).real(), (e[1] * w).real());
        };
        const Eigen::Vector2d e0 = field(0), e1 = field(rv::kPi / 4);
        const bool clockwise = e0.x() * e1.y() - e0.y() * e1.x() < 0;
        const rv::PolarizationState s = rv::describe(rv::mueller_from_jones(q) * rv::Stokes(1, 1, 0, 0));
        CHECK(std::abs(s.ellipticity_deg) > 44.9);
        CHECK(rv::describe_text(s) == (clockwise ? "circular (right)" : "circular (left)"));
    }
    // A file's circular-right source is right-handed by the same reading.
    CHECK(rv::describe_text(rv::describe(rv::source_stokes({rv::Polarization::Kind::CircularRight, 0}, 1))) ==
          "circular (right)");
}

TEST_CASE("circular light is described with no azimuth", "[polarization]") {
    // Issue 14 item 7: the azimuth of a circle means nothing. The threshold |χ| ≥ 44° (axes
    // within tan 44° = 0.966 of each other) is our stated choice (common practice).
    auto state = [](double ellipticity_deg, double azimuth_deg, double degree) {
        const double c = rv::deg_to_rad(2 * ellipticity_deg), a = rv::deg_to_rad(2 * azimuth_deg);
        return rv::describe(rv::Stokes(1, degree * std::cos(c) * std::cos(a), degree * std::cos(c) * std::sin(a),
                                       degree * std::sin(c)));
    };
    const rv::PolarizationState right = state(45, 0, 1);
    CHECK_FALSE(right.azimuth_deg.has_value());
    CHECK(rv::describe_text(right) == "circular (right)");
    const rv::PolarizationState nearly = state(-44.5, 30, 1);
    CHECK_FALSE(nearly.azimuth_deg.has_value());
    CHECK(rv::describe_text(nearly) == "circular (left)");
    CHECK(rv::describe_text(state(44.5, 30, 0.5)) == "partly polarized, circular (right)");
    const rv::PolarizationState elliptical = state(43, 30, 1);
    REQUIRE(elliptical.azimuth_deg.has_value());
    CHECK_THAT(*elliptical.azimuth_deg, near(30.0, 1e-9));
    CHECK(rv::describe_text(elliptical) == "elliptical, axis 30.0°, ellipticity 43.0°");
    CHECK(rv::describe_text(state(0, 22.5, 1)) == "linear at 22.5°");
    // Unpolarized light has no azimuth either.
    const rv::PolarizationState unpolarized = rv::describe(rv::Stokes(1, 0.01, 0, 0));
    CHECK_FALSE(unpolarized.azimuth_deg.has_value());
    CHECK(rv::describe_text(unpolarized) == "unpolarized");
}
