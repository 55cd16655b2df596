// The crystal's two angles (turn normal_deg, tilt tilt_deg), the 3-D angle between the wave
// vector and the optic axis, and setting the crystal for a process (issue 15 §1).
#include "analysis/crystal_angle.hpp"

#include <Eigen/Geometry>
#include <cmath>

#include "analysis/phase_setting.hpp"
#include "analysis/report.hpp"
#include "io/layout_writer.hpp"
#include "nonlinear/phase_matching.hpp"
#include "support/layouts.hpp"
#include "units/constants.hpp"

using rv::test::near;

namespace {

// ψ by an independent construction: the crystal's body frame turned by an Eigen rotation about
// t (a rotation by −τ about t raises n towards +z, since t × n = −z), Snell's law in the vector
// form k = d/m + (cos θt − cos θi/m) N (Hecht, Optics, 5th ed., §4.4.1, with N the unit normal on
// the side the light travels to), and ψ = acos |k · axis| between lines.
double psi_by_rotation_deg(double normal_deg, double cut_deg, bool axis_horizontal, double tilt_deg,
                           double incidence_deg, double index) {
    const double phi = rv::deg_to_rad(normal_deg), cut = rv::deg_to_rad(cut_deg), tau = rv::deg_to_rad(tilt_deg);
    const Eigen::Vector3d n(std::cos(phi), std::sin(phi), 0), t(-std::sin(phi), std::cos(phi), 0), z(0, 0, 1);
    const Eigen::Matrix3d body = Eigen::AngleAxisd(-tau, t).toRotationMatrix();
    const Eigen::Vector3d axis = body * (axis_horizontal ? Eigen::Vector3d(std::cos(cut) * n + std::sin(cut) * t)
                                                         : Eigen::Vector3d(std::cos(cut) * n + std::sin(cut) * z));
    const Eigen::Vector3d normal = body * n;
    const double a = rv::deg_to_rad(incidence_deg);
    const Eigen::Vector3d d = std::cos(a) * n + std::sin(a) * t;
    const double cos_i = d.dot(normal);
    const double cos_t = std::sqrt(1 - (1 - cos_i * cos_i) / (index * index));
    const Eigen::Vector3d k = d / index + (cos_t - cos_i / index) * normal;
    return rv::rad_to_deg(std::acos(std::abs(k.normalized().dot(axis))));
}

// The trace's direction inside for that beam: 2-D Snell at the untilted face.
rv::Vec2 inside_2d(double normal_deg, double incidence_deg, double index) {
    const rv::Vec2 n = rv::direction_deg(normal_deg), t = rv::perpendicular(n);
    const double sin_b = std::sin(rv::deg_to_rad(incidence_deg)) / index;
    return std::sqrt(1 - sin_b * sin_b) * n + sin_b * t;
}

rv::Element& element(rv::Layout& l, const std::string& id) {
    for (rv::Element& e : l.elements)
        if (e.id == id) return e;
    FAIL("no element " << id);
    return l.elements[0];
}

rv::RendezvousReport report(const rv::Layout& l) { return rv::build_report(l, rv::material_library_for(l)); }

// What the file holds: written and read back.
rv::Layout through_file(const rv::Layout& l) { return rv::test::layout_from(rv::write_layout(l)); }

}  // namespace

TEST_CASE("the 3-D angle to the optic axis, in each plane, against a rotation-matrix computation", "[crystal]") {
    struct Case { double normal_deg, cut_deg, tilt_deg, incidence_deg, index; };
    const Case cases[] = {{0, 30, 0, 0, 1.6},    {0, 30, 10, 0, 1.6},   {25, 29.2, -4, 7, 1.66},
                          {180, 47.5, 3, -12, 1.5}, {-90, 60, 20, 30, 2.2}, {12, 0, 5, -5, 1.7}};
    for (bool horizontal : {false, true})
        for (const Case& c : cases) {
            CAPTURE(horizontal, c.normal_deg, c.cut_deg, c.tilt_deg, c.incidence_deg, c.index);
            rv::Crystal x;
            x.cut_deg = c.cut_deg;
            x.tilt_deg = c.tilt_deg;
            x.optic_axis_horizontal = horizontal;
            const rv::CrystalPose pose = rv::crystal_pose(rv::direction_deg(c.normal_deg), x);
            const double psi = rv::rad_to_deg(rv::angle_to_reference_axis_rad(
                pose, inside_2d(c.normal_deg, c.incidence_deg, c.index), c.index));
            CHECK_THAT(psi, near(psi_by_rotation_deg(c.normal_deg, c.cut_deg, horizontal, c.tilt_deg,
                                                     c.incidence_deg, c.index), 1e-9));
        }
}

TEST_CASE("at normal incidence a tilt moves the internal angle by asin(sin τ / n)", "[crystal]") {
    // Hand computation, beam along the untilted normal: inside, the wave leans from the tilted
    // normal by τ_int = asin(sin τ / n) towards the beam. Axis in the vertical plane (it turns
    // with the tilt): ψ = cut + τ_int. Axis in the table plane: cos ψ = cos(cut) · cos(τ_int).
    const double n = 1.655, tau = rv::deg_to_rad(3.0), cut = rv::deg_to_rad(29.2);
    const double tau_int = std::asin(std::sin(tau) / n);
    rv::Crystal x;
    x.cut_deg = 29.2;
    x.tilt_deg = 3.0;
    const rv::Vec2 k(1, 0);
    x.optic_axis_horizontal = false;
    CHECK_THAT(rv::angle_to_reference_axis_rad(rv::crystal_pose({1, 0}, x), k, 1.0) /* outside = inside */,
               near(cut + std::asin(std::sin(tau) / 1.0), 1e-12));
    CHECK_THAT(rv::angle_to_reference_axis_rad(rv::crystal_pose({1, 0}, x), rv::wave_vector_from_outside(rv::crystal_pose({1, 0}, x), k, n)),
               near(cut + tau_int, 1e-12));
    x.optic_axis_horizontal = true;
    CHECK_THAT(std::cos(rv::angle_to_reference_axis_rad(rv::crystal_pose({1, 0}, x),
                                                        rv::wave_vector_from_outside(rv::crystal_pose({1, 0}, x), k, n))),
               near(std::cos(cut) * std::cos(tau_int), 1e-12));
}

TEST_CASE("the advised tilt, applied to the file, phase-matches", "[crystal][phase]") {
    // The bundled SFG layout holds its optic axis in the vertical plane: the advice is a tilt.
    // Applied through the file and judged by Δk computed here from the angle in the trace.
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::PhaseMatchingReport p = report(l).phase_matching.front();
    REQUIRE(p.phase_matchable);
    REQUIRE(p.rotation_found);
    CHECK(p.rotation == rv::CrystalRotation::Tilt);
    CHECK(p.sinc2_now < 0.5);
    auto& x = std::get<rv::Crystal>(element(l, "X").kind);
    x.tilt_deg += std::round(p.rotate_by_deg * 1e3) / 1e3;
    const rv::Layout tilted = through_file(l);
    const rv::RendezvousReport after = report(tilted);
    const rv::PhaseMatchingReport& q = after.phase_matching.front();
    const rv::Material& bbo = rv::test::material("BBO");
    const double dkl = rv::delta_k_per_mm(bbo, 1030, 780, rv::MixingType::TypeI, rv::deg_to_rad(q.theta_now_deg)) * x.length_mm;
    CHECK(std::pow(std::sin(dkl / 2) / (dkl / 2), 2) >= 0.99);
    CHECK(q.sinc2_now >= 0.99);
    CHECK(after.verdict.phase.met);
}

TEST_CASE("the advised turn of a tilted crystal, applied to the file, phase-matches", "[crystal][phase]") {
    // Optic axis in the table plane with a tilt already set: the turn must account for it.
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    for (rv::BeamSource& b : l.beams) b.polarization.kind = rv::Polarization::Kind::Vertical;
    for (rv::Element& e : l.elements)  // no polarizing optics: the beams arrive as they start
        if (auto* plate = std::get_if<rv::Plate>(&e.kind)) {
            rv::Plate plain;
            plain.slab = plate->slab;
            *plate = plain;
        }
    for (double tilt : {0.0, 4.0, -6.0}) {
        CAPTURE(tilt);
        rv::Layout t = l;
        auto& x = std::get<rv::Crystal>(element(t, "X").kind);
        x.optic_axis_horizontal = true;
        x.tilt_deg = tilt;
        const rv::PhaseMatchingReport p = report(t).phase_matching.front();
        REQUIRE(p.rotation_found);
        CHECK(p.rotation == rv::CrystalRotation::Turn);
        element(t, "X").normal_deg -= std::round(p.rotate_by_deg * 1e3) / 1e3;
        const rv::RendezvousReport after = report(through_file(t));
        CHECK(after.phase_matching.front().sinc2_now >= 0.99);
        CHECK(after.verdict.phase.met);
    }
}

TEST_CASE("setting the crystal for each process phase-matches that process", "[crystal][phase]") {
    // The lab turns one crystal between the SHG of either beam and their SFG: each setting,
    // through the file, gives the verdict's phase line for that process, met.
    const rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    for (const char* key : {"sfg", "shg:pump", "shg:signal"}) {
        CAPTURE(key);
        const rv::PhaseSetting s = rv::set_crystal_for_process(l, rv::material_library_for(l), key);
        CHECK(s.rotation == rv::CrystalRotation::Tilt);
        CHECK_THAT(s.tilt_after_deg - s.tilt_before_deg, near(s.change_deg, 1e-12));
        const rv::RendezvousReport r = report(through_file(s.layout));
        const rv::PhaseMatchingReport& p = r.phase_matching.front();
        CHECK(rv::process_key(s.layout, p) == key);
        CHECK_THAT(p.theta_now_deg, near(p.theta_pm_deg, 0.01));
        CHECK(p.sinc2_now >= 0.99);
        CHECK(r.verdict.phase.met);
    }
    // The SHG angles of BBO, type I (Nikogosyan, Nonlinear Optical Crystals (2005), BBO table,
    // from memory: 1030 nm → 23.3°, 780 nm → 29.9°), near what the setting reaches.
    const auto pump = rv::set_crystal_for_process(l, rv::material_library_for(l), "shg:pump");
    CHECK_THAT(pump.theta_pm_deg, near(23.3, 0.1));
    const auto signal = rv::set_crystal_for_process(l, rv::material_library_for(l), "shg:signal");
    CHECK_THAT(signal.theta_pm_deg, near(29.9, 0.1));
}

TEST_CASE("a bad process is refused with the reason", "[crystal][phase]") {
    const rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    CHECK_THROWS_WITH(rv::set_crystal_for_process(l, lib, "shg:pmup"),
                      Catch::Matchers::Contains("no beam has id \"pmup\""));
    CHECK_THROWS_WITH(rv::set_crystal_for_process(l, lib, "thg"), Catch::Matchers::Contains("expected sfg or shg:BEAM"));
    rv::Layout cut_far = l;
    std::get<rv::Crystal>(element(cut_far, "X").kind).cut_deg = 80;  // θ_pm 26° is 54° away: beyond ±45° of tilt
    CHECK_THROWS_WITH(rv::set_crystal_for_process(cut_far, lib, "sfg"), Catch::Matchers::Contains("no tilt within"));
}

TEST_CASE("the crystal's tilt and process are read, checked and written back", "[crystal][reader]") {
    rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    auto& x = std::get<rv::Crystal>(element(l, "X").kind);
    x.tilt_deg = -2.125;
    x.process = rv::Crystal::Process::SecondHarmonic;
    x.process_beam = "signal";
    const std::string text = rv::write_layout(l);
    CHECK(text.find("\"tilt_deg\": -2.125") != std::string::npos);
    CHECK(text.find("\"process\": \"shg:signal\"") != std::string::npos);
    CHECK(rv::test::layout_from(text) == l);
    auto first_error = [](std::string t) {
        const rv::LayoutReadResult r = rv::read_layout(t);
        return r.diagnostics.empty() ? std::string() : rv::format_diagnostic(r.diagnostics.front(), "f");
    };
    auto replaced = [&](const std::string& from, const std::string& to) {
        std::string t = text;
        t.replace(t.find(from), from.size(), to);
        return t;
    };
    CHECK(first_error(replaced("\"tilt_deg\": -2.125", "\"tilt_deg\": 60")).find("tilt_deg (X): must be between -45 and 45") !=
          std::string::npos);
    CHECK(first_error(replaced("\"shg:signal\"", "\"shg:signl\"")) ==
          "f: error: /elements/" + std::to_string(&element(l, "X") - l.elements.data()) +
              "/process (X): no beam has id \"signl\"; did you mean \"shg:signal\"?");
    CHECK(first_error(replaced("\"shg:signal\"", "\"sum\"")).find("expected \"sfg\" or \"shg:BEAM\"") != std::string::npos);
}
