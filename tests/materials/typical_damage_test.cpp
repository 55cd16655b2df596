// Typical damage thresholds (materials/typical_damage.hpp): the regimes and the √τ rule.
#include "materials/typical_damage.hpp"

#include <cmath>

#include "support/tolerance.hpp"

using rv::test::near_rel;

TEST_CASE("pulse regimes", "[damage]") {
    CHECK(rv::pulse_regime(300) == rv::PulseRegime::Femtosecond);
    CHECK(rv::pulse_regime(999) == rv::PulseRegime::Femtosecond);
    CHECK(rv::pulse_regime(1000) == rv::PulseRegime::Picosecond);
    CHECK(rv::pulse_regime(5e5) == rv::PulseRegime::Picosecond);
    CHECK(rv::pulse_regime(1e6) == rv::PulseRegime::Nanosecond);
}

TEST_CASE("typical damage thresholds follow the square-root rule", "[damage]") {
    // Sub-picosecond: the bundled fluence, unscaled.
    const auto fs = rv::typical_damage("fused-silica", 150);
    REQUIRE(fs);
    CHECK(fs->regime == rv::PulseRegime::Femtosecond);
    REQUIRE(fs->fluence_j_cm2);
    CHECK_FALSE(fs->scaled);
    // 10 ns: the published nanosecond figure itself.
    const auto ns = rv::typical_damage("fused-silica", 1e7);
    REQUIRE(ns);
    REQUIRE(ns->fluence_j_cm2);
    CHECK_FALSE(ns->scaled);
    // Fluence ∝ √τ (Stuart et al., Phys. Rev. Lett. 74, 2248 (1995), for τ ≳ 10 ps):
    // 1 ns gets √(1/10) of the 10 ns fluence.
    const auto one_ns = rv::typical_damage("fused-silica", 1e6);
    REQUIRE(one_ns);
    REQUIRE(one_ns->fluence_j_cm2);
    CHECK(one_ns->scaled);
    CHECK_THAT(*one_ns->fluence_j_cm2, near_rel(*ns->fluence_j_cm2 * std::sqrt(0.1), 1e-12));
    // An intensity figure (BBO at 10 ns) scales as 1/√τ: 100 ps gets √100 = 10 times it.
    const auto bbo_ns = rv::typical_damage("BBO", 1e7), bbo_ps = rv::typical_damage("BBO", 1e5);
    REQUIRE(bbo_ns);
    REQUIRE(bbo_ps);
    REQUIRE(bbo_ns->intensity_gw_cm2);
    REQUIRE(bbo_ps->intensity_gw_cm2);
    CHECK(bbo_ps->regime == rv::PulseRegime::Picosecond);
    CHECK_THAT(*bbo_ps->intensity_gw_cm2, near_rel(10 * *bbo_ns->intensity_gw_cm2, 1e-12));
    // Never below the sub-picosecond figure: a 2 ps pulse falls back to it.
    const auto short_ps = rv::typical_damage("fused-silica", 2000);
    REQUIRE(short_ps);
    REQUIRE(short_ps->fluence_j_cm2);
    CHECK_THAT(*short_ps->fluence_j_cm2, near_rel(*fs->fluence_j_cm2, 1e-12));
    // Nothing bundled for a user's material.
    CHECK_FALSE(rv::typical_damage("my-glass", 100));
}
