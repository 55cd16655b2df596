// Phase matching by temperature (issue 16 §8): the LBO set with thermo-optic data
// (LBO:Kato2018: K. Kato, IEEE JQE 30, 2950 (1994) at 20 °C, with the dn/dT of Kato, Grechin &
// Umemura, Laser Phys. 28, 095403 (2018)), the shift a temperature makes, the non-critical
// temperature of the SHG of 1064 nm, and the temperature acceptance.
#include <cmath>

#include "io/layout_reader.hpp"
#include "materials/dispersion.hpp"
#include "materials/material_library.hpp"
#include "materials/thermo_optic.hpp"
#include "nonlinear/temperature_tuning.hpp"
#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;

namespace {

const rv::Material& kato() {
    const rv::Material* m = rv::MaterialLibrary::builtin().find("LBO:Kato2018");
    REQUIRE(m);
    return *m;
}

// sinc²(x/2), written here from its definition.
double sinc2_half(double x) {
    const double h = x / 2;
    return h == 0 ? 1 : (std::sin(h) / h) * (std::sin(h) / h);
}

}  // namespace

TEST_CASE("a temperature shifts each principal index by (a + bλ)·ΔT and the group index by a·ΔT",
          "[temperature]") {
    // The linear form the source prints: n(λ, T) = n(λ, 20 °C) + (a + bλ)(T − 20). The group
    // index n − λ dn/dλ then moves by a·ΔT alone (the bλ part cancels): an exact consequence.
    const rv::Material& cold = kato();
    const rv::Material hot = rv::at_temperature(cold, 150);
    REQUIRE(hot.temperature_c);
    CHECK(*hot.temperature_c == 150);
    const double a[3] = {0.2300e-5, -1.9318e-5, -1.1569e-5}, b[3] = {-0.3760e-5, 0.5779e-5, 0.4073e-5};
    for (int axis = 0; axis < 3; ++axis) {
        for (double nm : {532.0, 800.0, 1064.0}) {
            const auto ax = static_cast<rv::Axis>(axis);
            const rv::IndexSample c = rv::sample_index(cold, nm, ax), h = rv::sample_index(hot, nm, ax);
            CHECK_THAT(h.index - c.index, near((a[axis] + b[axis] * nm / 1000) * 130, 1e-12));
            CHECK_THAT(h.group_index - c.group_index, near(a[axis] * 130, 1e-9));
            CHECK_THAT(h.gvd_fs2_per_mm, near(c.gvd_fs2_per_mm, 1e-9));
        }
    }
    // Taken to 150 °C and back to 20 °C is the set at 20 °C: the shift replaces, it does not add.
    const rv::Material back = rv::at_temperature(hot, 20);
    CHECK(rv::sample_index(back, 1064, rv::Axis::Z).index == rv::sample_index(cold, 1064, rv::Axis::Z).index);
}

TEST_CASE("the SHG of 1064 nm in LBO along X phase-matches near 148 °C, type I in the XY plane",
          "[temperature]") {
    // Published: non-critical type-I SHG of 1.064 µm in LBO (propagation along X: θ = 90°,
    // φ = 0°, the angle ψ = 0 of the XY plane here) at about 148 °C — from memory (Kato's 1994 paper and makers'
    // sheets quote 148–149 °C); we allow ±2 °C for the recollection and the 1064.0/1064.2 nm line.
    const std::optional<rv::TemperatureTuning> t =
        rv::temperature_tuning(kato(), 1064, 1064, rv::MixingType::TypeI, 0.0, 15.0, rv::PrincipalPlane::XY);
    REQUIRE(t);
    CHECK(t->now_c == 20);
    REQUIRE(t->phase_matching_c);
    CHECK_THAT(*t->phase_matching_c, near(148.5, 2.0));
    // There Δk vanishes (the root itself, by the set's own Δk).
    const rv::Material at_pm = rv::at_temperature(kato(), *t->phase_matching_c);
    CHECK_THAT(rv::delta_k_per_mm(at_pm, 1064, 1064, rv::MixingType::TypeI, 0.0, rv::PrincipalPlane::XY), near(0, 1e-6));
    // At 20 °C the same set phase-matches by angle at φ ≈ 11.6° in XY, the handbook's room-
    // temperature angle for this process (from memory: Dmitriev et al., Handbook of Nonlinear
    // Optical Crystals, lists φ = 11.4–11.6°).
    const std::optional<double> phi =
        rv::phase_matching_angle_rad(kato(), 1064, 1064, rv::MixingType::TypeI, rv::PrincipalPlane::XY);
    REQUIRE(phi);
    CHECK_THAT(rv::rad_to_deg(*phi), near(11.5, 0.3));
}

TEST_CASE("the temperature acceptance is the FWHM of sinc²(ΔkL/2) in temperature", "[temperature]") {
    // Independent of the code's slope rule: sinc² at T_pm ± ΔT/2 from the set's own Δk is 1/2.
    const double length_mm = 15;
    const rv::Material hot = rv::at_temperature(kato(), 149);
    const std::optional<rv::TemperatureTuning> t =
        rv::temperature_tuning(hot, 1064, 1064, rv::MixingType::TypeI, 0.0, length_mm, rv::PrincipalPlane::XY);
    REQUIRE(t);
    CHECK(t->now_c == 149);
    REQUIRE(t->acceptance_fwhm_c);
    REQUIRE(t->phase_matching_c);
    for (double side : {-0.5, 0.5}) {
        const rv::Material m = rv::at_temperature(kato(), *t->phase_matching_c + side * *t->acceptance_fwhm_c);
        const double dk = rv::delta_k_per_mm(m, 1064, 1064, rv::MixingType::TypeI, 0.0, rv::PrincipalPlane::XY);
        CHECK_THAT(sinc2_half(dk * length_mm), near(0.5, 0.01));
    }
    // Makers quote about 4–6 °C·cm for this process (from memory); the product here, in °C·cm:
    CHECK_THAT(*t->acceptance_fwhm_c * length_mm / 10, near(5, 1.5));
}

TEST_CASE("a set without thermo-optic data has no temperature tuning", "[temperature]") {
    const rv::Material* chen = rv::MaterialLibrary::builtin().find("LBO:Chen1989");
    REQUIRE(chen);
    CHECK_FALSE(rv::temperature_tuning(*chen, 1064, 1064, rv::MixingType::TypeI, 0.0, 10).has_value());
    CHECK(rv::at_temperature(*chen, 150).axes[0].shift_constant == 0);
}

TEST_CASE("a layout's oven takes the crystal's set to its temperature for every figure", "[temperature]") {
    const rv::LayoutReadResult r =
        rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/tests/layouts/temperature/lbo-oven-1064.json");
    REQUIRE(r.layout);
    const rv::MaterialLibrary lib = rv::material_library_for(*r.layout);
    const rv::Material* m = lib.find("LBO:Kato2018");
    REQUIRE(m);
    REQUIRE(m->temperature_c);
    CHECK(*m->temperature_c == 120);
    CHECK_THAT(rv::sample_index(*m, 1064, rv::Axis::Z).index - rv::sample_index(kato(), 1064, rv::Axis::Z).index,
               near((-1.1569e-5 + 0.4073e-5 * 1.064) * 100, 1e-12));
    // The built-in library is untouched.
    CHECK(*kato().temperature_c == 20);
}
