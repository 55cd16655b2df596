// d_eff of the bundled crystals: the closed forms of nonlinear/nonlinear_coefficients.hpp against
// the tensor contraction d_eff = ê3 · d : ê1 ê2 computed here from the d matrix of each point
// group and the field unit vectors of the o and e waves.
#include "nonlinear/nonlinear_coefficients.hpp"

#include <array>
#include <cmath>

#include "materials/material_library.hpp"
#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

namespace {

using Vec = std::array<double, 3>;
using Tensor = std::array<std::array<std::array<double, 3>, 3>, 3>;

// The full d_ijk from a 3×6 contracted matrix (Voigt: 1=xx 2=yy 3=zz 4=yz 5=zx 6=xy;
// Boyd, Nonlinear Optics, 3rd ed., §1.5).
Tensor from_voigt(const std::array<std::array<double, 6>, 3>& d) {
    const int voigt[3][3] = {{0, 5, 4}, {5, 1, 3}, {4, 3, 2}};
    Tensor t{};
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j)
            for (int k = 0; k < 3; ++k) t[i][j][k] = d[i][voigt[j][k]];
    return t;
}

double contract(const Tensor& d, const Vec& e3, const Vec& e1, const Vec& e2) {
    double s = 0;
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j)
            for (int k = 0; k < 3; ++k) s += e3[i] * d[i][j][k] * e1[j] * e2[k];
    return s;
}

// Point group 3m with the mirror plane normal to x (Dmitriev et al., Handbook of Nonlinear
// Optical Crystals, 1999, Table of d_il forms; Kleinman: d15 = d31, d16 = d21 = −d22).
Tensor trigonal_3m(double d22, double d31, double d33) {
    return from_voigt({{{0, 0, 0, 0, d31, -d22}, {-d22, d22, 0, d31, 0, 0}, {d31, d31, d33, 0, 0, 0}}});
}
// Point group mm2 with the two-fold axis along z (same table; Kleinman: d15 = d31, d24 = d32).
Tensor mm2_polar_z(double d31, double d32, double d33) {
    return from_voigt({{{0, 0, 0, 0, d31, 0}, {0, 0, 0, d32, 0, 0}, {d31, d32, d33, 0, 0, 0}}});
}
// LBO: the crystallographic mm2 tensor (two-fold axis c) on the optical frame X‖a, Y‖c, Z‖b.
Tensor mm2_polar_y(double d31, double d32, double d33) {
    const Tensor c = mm2_polar_z(d31, d32, d33);
    const int to_optical[3] = {0, 2, 1};  // a → X, b → Z, c → Y
    Tensor t{};
    for (int i = 0; i < 3; ++i)
        for (int j = 0; j < 3; ++j)
            for (int k = 0; k < 3; ++k) t[to_optical[i]][to_optical[j]][to_optical[k]] = c[i][j][k];
    return t;
}

struct Fields {
    Vec a, b;  // the A (ordinary) and B (extraordinary) field directions, ⊥ k
};
// Uniaxial: k = (sinθ cosφ, sinθ sinφ, cosθ); o ⊥ (k, z), e in the (k, z) plane ⊥ k.
Fields uniaxial(double theta, double phi) {
    return {{std::sin(phi), -std::cos(phi), 0},
            {std::cos(theta) * std::cos(phi), std::cos(theta) * std::sin(phi), -std::sin(theta)}};
}
// Biaxial principal planes (phase_matching.hpp): the A wave along the axis normal to the plane.
Fields biaxial(rv::PrincipalPlane plane, double angle) {
    const double c = std::cos(angle), s = std::sin(angle);
    switch (plane) {
        case rv::PrincipalPlane::XY: return {{0, 0, 1}, {-s, c, 0}};  // k = (cosφ, sinφ, 0)
        case rv::PrincipalPlane::YZ: return {{1, 0, 0}, {0, c, -s}};  // k = (0, sinθ, cosθ)
        case rv::PrincipalPlane::XZ: return {{0, 1, 0}, {c, 0, -s}};  // k = (sinθ, 0, cosθ)
    }
    return {};
}

double contraction_for(const Tensor& d, const Fields& f, rv::MixingType type) {
    const rv::WavePolarities w = rv::polarities(type);
    auto field = [&](rv::Polarity p) { return p == rv::Polarity::A ? f.a : f.b; };
    return contract(d, field(w.wave3), field(w.wave1), field(w.wave2));
}

constexpr rv::MixingType kTypes[] = {rv::MixingType::TypeI,      rv::MixingType::TypeI_BBA,
                                     rv::MixingType::TypeII_ABB, rv::MixingType::TypeII_BAB,
                                     rv::MixingType::TypeII_ABA, rv::MixingType::TypeII_BAA};

}  // namespace

TEST_CASE("BBO closed forms equal the tensor contraction", "[d-eff]") {
    const rv::NonlinearCoefficients* c = rv::nonlinear_coefficients("BBO");
    REQUIRE(c);
    const Tensor d = trigonal_3m(c->d22_pm_v, c->d31_pm_v, 0.0);
    for (double theta_deg : {5.0, 22.8, 29.2, 47.0, 80.0})
        for (double phi_deg : {0.0, 17.0, 30.0, 61.0, 90.0}) {
            CAPTURE(theta_deg, phi_deg);
            const Fields f = uniaxial(rv::deg_to_rad(theta_deg), rv::deg_to_rad(phi_deg));
            for (rv::MixingType t : kTypes) {
                CAPTURE(static_cast<int>(t));
                const double closed = rv::d_eff_closed_form_pm_v(*c, rv::PrincipalPlane::XY, rv::b_wave_count(t),
                                                                 rv::deg_to_rad(theta_deg), rv::deg_to_rad(phi_deg));
                CHECK_THAT(std::abs(closed), near(std::abs(contraction_for(d, f, t)), 1e-12));
            }
        }
}

TEST_CASE("KTP and LBO principal-plane closed forms equal the tensor contraction", "[d-eff]") {
    using P = rv::PrincipalPlane;
    for (const char* family : {"KTP", "LBO"}) {
        const rv::NonlinearCoefficients* c = rv::nonlinear_coefficients(family);
        REQUIRE(c);
        const Tensor d = c->form == rv::TensorForm::Mm2PolarZ ? mm2_polar_z(c->d31_pm_v, c->d32_pm_v, c->d33_pm_v)
                                                               : mm2_polar_y(c->d31_pm_v, c->d32_pm_v, c->d33_pm_v);
        for (P plane : {P::XY, P::YZ, P::XZ})
            for (double angle_deg : {0.0, 11.4, 23.0, 42.0, 71.0, 90.0}) {
                CAPTURE(family, static_cast<int>(plane), angle_deg);
                const Fields f = biaxial(plane, rv::deg_to_rad(angle_deg));
                for (rv::MixingType t : kTypes) {
                    CAPTURE(static_cast<int>(t));
                    const double closed =
                        rv::d_eff_closed_form_pm_v(*c, plane, rv::b_wave_count(t), rv::deg_to_rad(angle_deg));
                    CHECK_THAT(std::abs(closed), near(std::abs(contraction_for(d, f, t)), 1e-12));
                }
            }
    }
}

TEST_CASE("the BBO cut azimuth gives the largest d_eff", "[d-eff]") {
    const rv::Material* bbo = rv::MaterialLibrary::builtin().find("BBO");
    REQUIRE(bbo);
    const rv::NonlinearCoefficients* c = rv::nonlinear_coefficients("BBO");
    const Tensor d = trigonal_3m(c->d22_pm_v, c->d31_pm_v, 0.0);
    for (rv::MixingType t : {rv::MixingType::TypeI, rv::MixingType::TypeII_ABB}) {
        const double theta = rv::deg_to_rad(t == rv::MixingType::TypeI ? 23.4 : 32.9);
        const auto e = rv::effective_nonlinearity(*bbo, t, theta);
        REQUIRE(e);
        // The largest |contraction| over the azimuth, searched here on a 0.1° grid.
        double best = 0;
        for (int i = 0; i <= 3600; ++i)
            best = std::max(best, std::abs(contraction_for(d, uniaxial(theta, rv::deg_to_rad(i * 0.1)), t)));
        CHECK_THAT(e->d_eff_pm_v, near_rel(best, 1e-6));
        REQUIRE(e->azimuth_deg);
        CHECK_THAT(std::abs(contraction_for(d, uniaxial(theta, rv::deg_to_rad(*e->azimuth_deg)), t)),
                   near_rel(best, 1e-6));
    }
}

TEST_CASE("d_eff of common SHG cuts", "[d-eff]") {
    const rv::MaterialLibrary& lib = rv::MaterialLibrary::builtin();
    // BBO type I SHG of 1064 nm at θ = 22.8°: d31 sinθ + d22 cosθ = 0.08·0.3875 + 2.2·0.9219
    // = 2.059 pm/V (hand computation); about 2.0 pm/V is the figure makers quote (from memory).
    const auto bbo = rv::effective_nonlinearity(*lib.find("BBO"), rv::MixingType::TypeI, rv::deg_to_rad(22.8));
    REQUIRE(bbo);
    CHECK_THAT(bbo->d_eff_pm_v, near(0.08 * std::sin(rv::deg_to_rad(22.8)) + 2.2 * std::cos(rv::deg_to_rad(22.8)), 1e-9));
    CHECK_THAT(bbo->d_eff_pm_v, near(2.06, 0.01));
    // LBO type I SHG of 1064 nm in the XY plane at φ = 11.4°: d32 cos φ = 0.85·0.9803 = 0.833 pm/V
    // (hand computation; makers quote about 0.83 pm/V, from memory).
    const auto lbo = rv::effective_nonlinearity(*lib.find("LBO"), rv::MixingType::TypeI, rv::deg_to_rad(11.4),
                                                rv::PrincipalPlane::XY);
    REQUIRE(lbo);
    CHECK_THAT(lbo->d_eff_pm_v, near(0.833, 0.001));
    // KTP type II SHG of 1064 nm in the XY plane at φ = 23.5°: d31 sin²φ + d32 cos²φ
    // = 1.95·0.1590 + 3.9·0.8410 = 3.59 pm/V (hand computation).
    const auto ktp = rv::effective_nonlinearity(*lib.find("KTP"), rv::MixingType::TypeII_ABB, rv::deg_to_rad(23.5),
                                                rv::PrincipalPlane::XY);
    REQUIRE(ktp);
    CHECK_THAT(ktp->d_eff_pm_v, near(3.59, 0.01));
    // No coefficients bundled for a glass or a wave-plate crystal.
    CHECK_FALSE(rv::effective_nonlinearity(*lib.find("N-BK7"), rv::MixingType::TypeI, 0.3));
    CHECK_FALSE(rv::effective_nonlinearity(*lib.find("quartz"), rv::MixingType::TypeI, 0.3));
}
