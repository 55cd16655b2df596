// The report's phase-matching figures that name their waves (issue 16 §7): every pair's
// group-velocity mismatch for type II (the o and e parts of one beam included), and the wave
// the SFG spectral acceptance tunes. Checked against an independent computation written here
// from the published Sellmeier formula of BBO (Tamošauskas et al., Opt. Mater. Express 8, 1410
// (2018), the default BBO set): n² − 1 = Σ B_i λ²/(λ² − C_i), λ in µm.
#include <cmath>
#include <nlohmann/json.hpp>

#include "analysis/report.hpp"
#include "report/report_json.hpp"
#include "report/report_words.hpp"
#include "support/layouts.hpp"
#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

namespace {

// Tamošauskas et al. 2018, Table 2 (the coefficients as the paper prints them).
double n_o(double um) {
    const double l2 = um * um;
    return std::sqrt(1 + 0.90291 * l2 / (l2 - 0.003926) + 0.83155 * l2 / (l2 - 0.018786) +
                     0.76536 * l2 / (l2 - 60.01));
}
double n_e_principal(double um) {
    const double l2 = um * um;
    return std::sqrt(1 + 1.151075 * l2 / (l2 - 0.007142) + 0.21803 * l2 / (l2 - 0.02259) +
                     0.656 * l2 / (l2 - 263));
}
// Index ellipse of a uniaxial crystal (Boyd, Nonlinear Optics, 3rd ed., §2.3):
// 1/n_e(θ)² = cos²θ/n_o² + sin²θ/n_e².
double n_e(double um, double theta) {
    const double c = std::cos(theta), s = std::sin(theta);
    return 1 / std::sqrt(c * c / (n_o(um) * n_o(um)) + s * s / (n_e_principal(um) * n_e_principal(um)));
}
// Group index n_g = n − λ dn/dλ at fixed θ (Diels & Rudolph 2006, ch. 1), by a central
// difference of 1e-4 µm.
template <class N>
double group_index(N n, double um) {
    const double h = 1e-4;
    return n(um) - um * (n(um + h) - n(um - h)) / (2 * h);
}
constexpr double kC_mm_per_fs = 2.99792458e-4;  // c, exact

rv::RendezvousReport report(const rv::Layout& l) { return rv::build_report(l, rv::material_library_for(l)); }

}  // namespace

TEST_CASE("type-II SHG lists the GVM of all three waves against group indices", "[report][phase][gvm]") {
    // The SHG demo's crystal made type II (oee: the o and e parts of 1030 nm give an e harmonic).
    rv::Layout l = rv::test::bundled_layout("shg-single.json");
    for (rv::Element& e : l.elements)
        if (auto* x = std::get_if<rv::Crystal>(&e.kind)) {
            REQUIRE(x->material == "BBO");
            x->phase_matching = rv::Crystal::PhaseMatching::TypeII;
        }
    const rv::RendezvousReport r = report(l);
    REQUIRE(!r.phase_matching.empty());
    const rv::PhaseMatchingReport& p = r.phase_matching.front();
    REQUIRE(p.phase_matchable);
    REQUIRE_FALSE(p.sum_frequency);
    const rv::WavePolarities w = rv::polarities(p.mixing);
    REQUIRE(w.wave1 != w.wave2);  // one o and one e input
    const double theta = rv::deg_to_rad(p.theta_pm_deg);
    const double l1 = r.beams[p.first_beam].wavelength_nm / 1000, l3 = l1 / 2;
    // Our own phase-matching condition at the report's θ_pm: n3/λ3 = n1/λ1 + n2/λ2 (o and e at
    // λ1, e at λ3), zero to 1e-6 in n.
    auto n_at = [&](rv::Polarity pol, double um) { return pol == rv::Polarity::A ? n_o(um) : n_e(um, theta); };
    CHECK_THAT(n_at(w.wave3, l3) / l3 - n_at(w.wave1, l1) / l1 - n_at(w.wave2, l1) / l1, near(0.0, 1e-5));
    auto group_index_of = [&](rv::Polarity pol, double um) {
        return group_index([&](double x) { return n_at(pol, x); }, um);
    };
    const double ng[3] = {group_index_of(w.wave1, l1), group_index_of(w.wave2, l1), group_index_of(w.wave3, l3)};
    const rv::Polarity pols[3] = {w.wave1, w.wave2, w.wave3};
    REQUIRE(p.gvm.size() == 3);
    int pairs_seen = 0;
    for (const rv::GroupVelocityMismatch& g : p.gvm) {
        CAPTURE(rv::gvm_pair_text(p, g), g.first_wave, g.second_wave);
        REQUIRE(g.first_wave >= 1);
        REQUIRE(g.first_wave <= 3);
        REQUIRE(g.second_wave >= 1);
        REQUIRE(g.second_wave <= 3);
        CHECK(g.first_polarity == pols[g.first_wave - 1]);
        CHECK(g.second_polarity == pols[g.second_wave - 1]);
        // GVM = 1/v_g,i − 1/v_g,j = (n_g,i − n_g,j)/c.
        const double expected = (ng[g.first_wave - 1] - ng[g.second_wave - 1]) / kC_mm_per_fs;
        CHECK_THAT(g.fs_per_mm, near(expected, 0.05));
        pairs_seen |= 1 << (g.first_wave * 3 + g.second_wave);
    }
    // The three pairs: harmonic–o, harmonic–e and the inputs' o–e (the one a single pair missed).
    CHECK(pairs_seen == ((1 << (3 * 3 + 1)) | (1 << (3 * 3 + 2)) | (1 << (1 * 3 + 2))));
    // The o–e pair of the fundamental is not zero: BBO's o and e group indices differ at 1030 nm.
    CHECK(std::abs(p.gvm[2].fs_per_mm) > 10);
    // JSON carries the pairs as data.
    const nlohmann::json j = p;
    REQUIRE(j.at("gvm").size() == 3);
    for (size_t k = 0; k < 3; ++k) {
        CHECK(j.at("gvm")[k].at("waves")[0].get<int>() == p.gvm[k].first_wave);
        CHECK(j.at("gvm")[k].at("polarities")[1].get<std::string>() ==
              (p.gvm[k].second_polarity == rv::Polarity::A ? "o" : "e"));
    }
    CHECK(j.at("spectral_acceptance_holds").is_null());
    CHECK(j.at("spectral_acceptance_tunes").get<std::string>() == r.beams[p.first_beam].id);
}

TEST_CASE("type-I SHG lists one GVM pair", "[report][phase][gvm]") {
    // Type I: both inputs are one o wave, so only the harmonic against it.
    const rv::RendezvousReport r = report(rv::test::bundled_layout("shg-single.json"));
    REQUIRE(!r.phase_matching.empty());
    REQUIRE(r.phase_matching.front().gvm.size() == 1);
    CHECK(r.phase_matching.front().gvm[0].first_wave == 3);
    CHECK(r.phase_matching.front().gvm[0].second_wave == 1);
}

TEST_CASE("the SFG spectral acceptance tunes the first beam with the second held", "[report][phase]") {
    // The SFG demo (type I ooe, 1030 + 780 nm): the FWHM of sinc²(ΔkL/2) in λ1 with λ2 fixed,
    // Δλ1 = 5.5662/(L |∂Δk/∂λ1|) (docs/physics.md §0.1), by a central difference here. Tuning
    // the other beam gives a different width, so the named wave is the one computed.
    const rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::RendezvousReport r = report(l);
    REQUIRE(!r.phase_matching.empty());
    const rv::PhaseMatchingReport& p = r.phase_matching.front();
    REQUIRE(p.sum_frequency);
    REQUIRE(p.phase_matchable);
    REQUIRE(p.mixing == rv::MixingType::TypeI);
    const std::string first = r.beams[p.first_beam].id, second = r.beams[p.second_beam].id;
    CHECK(p.spectral_tuned_beam == first);
    REQUIRE(p.spectral_held_beam.has_value());
    CHECK(*p.spectral_held_beam == second);
    const double theta = rv::deg_to_rad(p.theta_pm_deg), length_mm = r.crystal_length_mm;
    REQUIRE(length_mm > 0);
    // Δk in 1/mm with λ in nm (k = 2π n/λ).
    auto dk = [&](double l1_nm, double l2_nm) {
        const double l3_nm = 1 / (1 / l1_nm + 1 / l2_nm);
        return 2 * rv::kPi * 1e6 *
               (n_e(l3_nm / 1000, theta) / l3_nm - n_o(l1_nm / 1000) / l1_nm - n_o(l2_nm / 1000) / l2_nm);
    };
    const double l1 = r.beams[p.first_beam].wavelength_nm, l2 = r.beams[p.second_beam].wavelength_nm;
    const double h = 1e-3;
    const double tune_first = 5.566229 / (length_mm * std::abs((dk(l1 + h, l2) - dk(l1 - h, l2)) / (2 * h)));
    const double tune_second = 5.566229 / (length_mm * std::abs((dk(l1, l2 + h) - dk(l1, l2 - h)) / (2 * h)));
    CHECK_THAT(p.spectral_acceptance_nm, near_rel(tune_first, 1e-3));
    CHECK(std::abs(tune_first - tune_second) > 0.05 * tune_first);
    const nlohmann::json j = p;
    CHECK(j.at("spectral_acceptance_tunes").get<std::string>() == first);
    CHECK(j.at("spectral_acceptance_holds").get<std::string>() == second);
}
