// The scan plan and map (analysis/scan.hpp) against the report's own figures and the published
// shapes of the signal along each axis.
#include "analysis/scan.hpp"

#include <algorithm>
#include <cmath>

#include "analysis/report.hpp"
#include "support/layouts.hpp"
#include "support/tolerance.hpp"
#include "units/constants.hpp"

using rv::test::near;
using rv::test::near_rel;

namespace {

rv::Layout demo() { return rv::test::bundled_layout("sfg-bbo.json"); }

rv::Element& element(rv::Layout& l, const std::string& id) {
    for (rv::Element& e : l.elements)
        if (e.id == id) return e;
    FAIL("no element " << id);
    return l.elements[0];
}

rv::Crystal& crystal(rv::Layout& l) { return std::get<rv::Crystal>(element(l, l.target).kind); }

// The demo with a thin crystal: GVM and focusing negligible (L·GVM ≪ τ, ξ ≪ 1).
rv::Layout thin_demo() {
    rv::Layout l = demo();
    crystal(l).length_mm = 0.02;
    return l;
}

// A cell's value, required finite.
double cell(const rv::ScanMap& m, size_t row, size_t column) {
    const std::optional<double>& v = m.power_mw[row * m.stage_mm.size() + column];
    REQUIRE(v.has_value());
    return *v;
}

// sinc²(x) = (sin x / x)².
double sinc2(double x) { return x == 0 ? 1.0 : std::pow(std::sin(x) / x, 2); }

// The full width at half maximum of samples y(x) around their largest value (linear
// interpolation between the samples that straddle half of it).
// The two half-maximum crossings of a single-peaked curve, by linear interpolation.
std::pair<double, double> half_maximum_crossings(const std::vector<double>& x, const std::vector<double>& y) {
    const size_t top = static_cast<size_t>(std::max_element(y.begin(), y.end()) - y.begin());
    const double half = y[top] / 2;
    double left = x.front(), right = x.back();
    for (size_t k = top; k > 0; --k)
        if (y[k - 1] < half) {
            left = x[k - 1] + (half - y[k - 1]) / (y[k] - y[k - 1]) * (x[k] - x[k - 1]);
            break;
        }
    for (size_t k = top; k + 1 < y.size(); ++k)
        if (y[k + 1] < half) {
            right = x[k] + (y[k] - half) / (y[k] - y[k + 1]) * (x[k + 1] - x[k]);
            break;
        }
    return {left, right};
}

double measured_fwhm(const std::vector<double>& x, const std::vector<double>& y) {
    const size_t k = static_cast<size_t>(std::max_element(y.begin(), y.end()) - y.begin());
    const double half = y[k] / 2;
    size_t lo = k, hi = k;
    while (lo > 0 && y[lo] > half) --lo;
    while (hi + 1 < y.size() && y[hi] > half) ++hi;
    REQUIRE(y[lo] <= half);
    REQUIRE(y[hi] <= half);
    auto at = [&](size_t a, size_t b) { return x[a] + (half - y[a]) / (y[b] - y[a]) * (x[b] - x[a]); };
    return std::abs(at(hi - 1, hi) - at(lo + 1, lo));
}

}  // namespace

TEST_CASE("scan peak sits at the report's phase-matched setting and zero delay", "[scan]") {
    const rv::Layout l = demo();
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::RendezvousReport rep = rv::build_report(l, lib);
    const rv::ScanResult r = rv::plan_scan(l, lib);
    REQUIRE_FALSE(r.refusal);
    REQUIRE(rep.stage);
    REQUIRE(rep.generated);
    const rv::PhaseMatchingReport& pm = rep.phase_matching.front();
    // One evaluation: the plan's centre is the report's zero-delay position and its turn to θ_pm.
    CHECK(r.plan.stage == rep.stage->id);
    CHECK_THAT(r.plan.stage_mm.centre, near(rep.stage->zero_delay_mm, 1e-12));
    CHECK_THAT(r.plan.rotation_deg.centre, near(pm.rotate_by_deg, 1e-12));
    CHECK_THAT(r.plan.stage_mm.present, near(rep.stage->position_mm, 1e-12));
    CHECK_THAT(r.map.present_mw, near_rel(rep.generated->average_mw_now, 1e-12));
    // The peak within one grid spacing of zero delay, and within a quarter of the acceptance of
    // θ_pm (the focused optimum σ_m lies slightly off Δk = 0: Boyd & Kleinman 1968).
    const double spacing = r.map.stage_mm[1] - r.map.stage_mm[0];
    CHECK(std::abs(r.map.peak_stage_mm - rep.stage->zero_delay_mm) <= spacing * (1 + 1e-9));
    CHECK(std::abs(r.map.peak_rotation_deg - pm.rotate_by_deg) <= r.plan.rotation_deg.fwhm / 4);
    // Never above the report's best (focused optimum, zero delay), and near it at the peak.
    CHECK(r.map.peak_mw <= rep.generated->average_mw_best * (1 + 1e-9));
    CHECK(r.map.peak_mw >= 0.9 * rep.generated->average_mw_best);
}

TEST_CASE("scan cells equal the report of the layout with the stage moved and the crystal turned", "[scan]") {
    // One evaluation: build_report of the layout as it would be set up (stage at the cell's
    // position, crystal rotated by the cell's setting) gives the cell's power. The map keeps the
    // beams as traced, so the crystal's refraction shift is the only difference: within 1 %.
    const rv::Layout l = demo();
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::ScanResult r = rv::plan_scan(l, lib, rv::ScanRequest{.stage_points = 9, .rotation_points = 9});
    REQUIRE_FALSE(r.refusal);
    for (const auto& [row, column] : {std::pair<size_t, size_t>{4, 4}, {4, 2}, {3, 4}, {2, 6}, {5, 5}}) {
        rv::Layout set = l;
        std::get<rv::Stage>(element(set, r.plan.stage).kind).position_mm = r.map.stage_mm[column];
        const double c = r.map.rotation_deg[row];
        if (r.plan.rotation == rv::CrystalRotation::Turn) element(set, set.target).normal_deg -= c;
        else crystal(set).tilt_deg += c;
        const rv::RendezvousReport rep = rv::build_report(set, lib);
        REQUIRE(rep.generated);
        INFO("row " << row << " column " << column);
        CHECK_THAT(cell(r.map, row, column), near_rel(rep.generated->average_mw_now, 1e-2));
    }
}

TEST_CASE("scan along the delay follows the Gaussian cross-correlation", "[scan]") {
    // Two Gaussian pulses of FWHM τ1, τ2, I_i ∝ exp(−a_i t²) with a_i = 4 ln2/τ_i²: by hand,
    // ∫exp(−a1 t²) exp(−a2 (t − Δ)²) dt ∝ exp(−a1 a2 Δ²/(a1 + a2)) = exp(−4 ln2 Δ²/(τ1² + τ2²)),
    // a Gaussian of FWHM sqrt(τ1² + τ2²) (the published overlap integral of two Gaussians, the
    // intensity cross-correlation). The demo's pulses are 250 fs (pump) and 120 fs (signal) in
    // layouts/sfg-bbo.json at the source; the thin crystal makes the GVM walk negligible.
    const rv::Layout l = thin_demo();
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::ScanResult r = rv::plan_scan(l, lib, rv::ScanRequest{.stage_points = 41, .rotation_points = 5});
    REQUIRE_FALSE(r.refusal);
    // The pulses the report's generated light uses (the sources' lengthened by the glass on the
    // way, analysis/pulse_at_target.hpp): a little above 250 and 120 fs.
    const rv::RendezvousReport rep = rv::build_report(l, lib);
    REQUIRE(rep.generated);
    const double tau1_fs = rep.generated->pulse1_fwhm_fs, tau2_fs = rep.generated->pulse2_fwhm_fs;
    CHECK(tau1_fs >= 250);
    CHECK(tau2_fs >= 120);
    const double tau_cc_fs = std::sqrt(tau1_fs * tau1_fs + tau2_fs * tau2_fs);
    CHECK_THAT(r.plan.cross_correlation_fs, near(tau_cc_fs, 1e-9));
    const size_t mid_row = 2, mid = 20;  // the grid's centre: θ_pm's setting and zero delay
    const double at_zero = cell(r.map, mid_row, mid);
    for (size_t k = 0; k < r.map.stage_mm.size(); ++k) {
        const double delay_fs = r.plan.delay_per_mm_fs * (r.map.stage_mm[k] - r.plan.stage_mm.centre);
        const double expected = std::exp(-4 * std::log(2.0) * delay_fs * delay_fs / (tau_cc_fs * tau_cc_fs));
        INFO("stage " << r.map.stage_mm[k] << " mm, delay " << delay_fs << " fs");
        CHECK_THAT(cell(r.map, mid_row, k) / at_zero, near(expected, 2e-3));
    }
}

TEST_CASE("scan along the crystal angle follows sinc2 of the phase mismatch", "[scan]") {
    // Loosely focused (ξ ≪ 1) the generated power follows sinc²(ΔkL/2) (Boyd & Kleinman 1968,
    // h → ξ sinc²(ΔkL/2)); its FWHM in the internal angle is the report's acceptance, so
    // ΔkL/2 = 1.39156 · (ψ − θ_pm)/(Δψ_FWHM/2) near θ_pm (sinc²(1.39156) = 1/2, from memory).
    // A 0.2 mm crystal: ξ ≈ 0.03, and an acceptance narrow enough for Δk linear in ψ over it.
    rv::Layout l = demo();
    crystal(l).length_mm = 0.2;
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::RendezvousReport rep = rv::build_report(l, lib);
    const rv::ScanResult r = rv::plan_scan(l, lib, rv::ScanRequest{.stage_points = 3, .rotation_points = 61});
    REQUIRE_FALSE(r.refusal);
    REQUIRE(rep.generated);
    CHECK(rep.generated->xi < 0.05);
    const rv::PhaseMatchingReport& pm = rep.phase_matching.front();
    // dψ/dc by Snell's law at the face (hand derivation): sin α_out = n sin α_in, so
    // dα_in/dα_out = cos α_out / (n cos α_in), at the incidence that phase-matches. A tilt τ of
    // a crystal met at normal incidence in the table plane turns the axis by τ and the wave
    // inside by τ − α_in, so ψ = cut + α_in(τ): the same slope with α_out = τ (the demo's
    // optic axis is vertical; incidence_needed_deg is then the tilt that phase-matches).
    const double n = rep.beams[pm.first_beam].at_target.index;
    const double a_out = rv::deg_to_rad(pm.incidence_needed_deg);
    const double a_in = std::asin(std::sin(a_out) / n);
    const double slope_mrad_per_deg = 1e3 * rv::deg_to_rad(1.0) * std::cos(a_out) / (n * std::cos(a_in));
    CHECK_THAT(r.plan.dpsi_per_deg_mrad, near_rel(slope_mrad_per_deg, 1e-2));
    // The curve through the map: ψ − ψ_centre (mrad) and the signal.
    const size_t column = 1;
    std::vector<double> psi_mrad, signal;
    for (size_t j = 0; j < r.map.rotation_deg.size(); ++j) {
        psi_mrad.push_back(slope_mrad_per_deg * (r.map.rotation_deg[j] - r.plan.rotation_deg.centre));
        signal.push_back(cell(r.map, j, column));
    }
    const double peak = *std::max_element(signal.begin(), signal.end());
    const auto [left_mrad, right_mrad] = half_maximum_crossings(psi_mrad, signal);
    const double fwhm_mrad = right_mrad - left_mrad, middle_mrad = (left_mrad + right_mrad) / 2;
    // The peak sits off the plan's centre (where Δk = 0) by the Gouy phase of the focus: for
    // ξ ≪ 1, Boyd & Kleinman's H(σ, ξ) = |∫ e^{iστ}/(1 + iτ) dτ|²/4ξ over |τ| ≤ ξ has
    // 1/(1 + iτ) ≈ e^{−iτ}, so its maximum is at σ = 1, i.e. Δk·L = 2ξ (hand expansion). With
    // ΔkL/2 = 1.39156 at the half maximum, that is ψ shifted by ξ/1.39156 of the half width.
    const double gouy_shift_mrad = rep.generated->xi / 1.39156 * (pm.angular_acceptance_internal_mrad / 2);
    INFO("middle " << middle_mrad << " mrad, Gouy shift " << gouy_shift_mrad << " mrad, xi " << rep.generated->xi);
    CHECK_THAT(std::abs(middle_mrad), near(gouy_shift_mrad, 0.25 * gouy_shift_mrad + 0.002 * fwhm_mrad));
    // The shape about its middle: Boyd & Kleinman's H(σ, B, ξ) = (1/4ξ) ∬ e^{iσ(τ−τ')}
    // e^{−B²(τ−τ')²/ξ} / ((1 + iτ)(1 − iτ')) dτ dτ' for ξ ≪ 1, with the Gouy factor taken out as
    // the shift above and u = (τ − τ')/ξ: ∝ ∫_{−2}^{2} (2 − |u|) cos(x u) e^{−B²ξu²} du, x = ΔkL/2
    // from the middle. B = 0 gives 4 sinc²(x); here B²ξ is not small (ρL is half the radius), so
    // walk-off widens the curve and fills its wings. Simpson's rule, written here.
    const double b2xi = rep.generated->walkoff_parameter * rep.generated->walkoff_parameter * rep.generated->xi;
    auto thin_crystal_h = [](double x, double b2xi) {
        constexpr int n = 2000;
        double sum = 0;
        for (int k = 0; k <= n; ++k) {
            const double u = -2.0 + 4.0 * k / n;
            const double w = (k == 0 || k == n) ? 1 : (k % 2 ? 4 : 2);
            sum += w * (2 - std::abs(u)) * std::cos(x * u) * std::exp(-b2xi * u * u);
        }
        return sum * (4.0 / n) / 3;
    };
    CHECK_THAT(thin_crystal_h(1.0, 0) / 4, near(sinc2(1.0), 1e-6));  // the integral without walk-off
    const double x_per_mrad = 1.39156 / (pm.angular_acceptance_internal_mrad / 2);
    for (size_t j = 0; j < signal.size(); ++j) {
        const double from_middle_mrad = psi_mrad[j] - middle_mrad;
        if (std::abs(from_middle_mrad) > pm.angular_acceptance_internal_mrad) continue;  // ±1 FWHM
        INFO("setting " << r.map.rotation_deg[j] << " deg, B²ξ " << b2xi);
        CHECK_THAT(signal[j] / peak, near(thin_crystal_h(x_per_mrad * from_middle_mrad, b2xi) / thin_crystal_h(0, b2xi), 0.01));
    }
}

TEST_CASE("scan steps are at most half the widths of the signal", "[scan]") {
    // Measured on a fine map through the peak (with the demo's GVM and focusing, not the
    // formulas the steps come from).
    const rv::Layout l = demo();
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::ScanResult plan = rv::plan_scan(l, lib);
    REQUIRE_FALSE(plan.refusal);
    const rv::ScanResult fine = rv::plan_scan(l, lib, rv::ScanRequest{.stage_points = 401, .rotation_points = 401});
    const rv::ScanMap& m = fine.map;
    const size_t pr = static_cast<size_t>(std::find(m.rotation_deg.begin(), m.rotation_deg.end(), m.peak_rotation_deg) -
                                          m.rotation_deg.begin());
    const size_t pc =
        static_cast<size_t>(std::find(m.stage_mm.begin(), m.stage_mm.end(), m.peak_stage_mm) - m.stage_mm.begin());
    std::vector<double> along_stage, along_rotation;
    for (size_t k = 0; k < m.stage_mm.size(); ++k) along_stage.push_back(cell(m, pr, k));
    for (size_t j = 0; j < m.rotation_deg.size(); ++j) along_rotation.push_back(cell(m, j, pc));
    const double stage_fwhm_mm = measured_fwhm(m.stage_mm, along_stage);
    const double rotation_fwhm_deg = measured_fwhm(m.rotation_deg, along_rotation);
    CHECK(plan.plan.stage_mm.step > 0);
    CHECK(plan.plan.rotation_deg.step > 0);
    CHECK(plan.plan.stage_mm.step <= stage_fwhm_mm / 2 * (1 + 1e-2));
    CHECK(plan.plan.rotation_deg.step <= rotation_fwhm_deg / 2 * (1 + 1e-2));
    // The ranges: ±3σ, at least ±1 FWHM; the count covers them.
    for (const rv::ScanAxisPlan* a : {&plan.plan.stage_mm, &plan.plan.rotation_deg}) {
        CHECK(a->half_range >= 3 * a->sigma * (1 - 1e-12));
        CHECK(a->half_range >= a->fwhm * (1 - 1e-12));
        CHECK((a->points - 1) / 2 * a->step >= a->half_range * (1 - 1e-9));
        CHECK(a->points % 2 == 1);
    }
    CHECK(plan.plan.perturbations > 0);
    CHECK(plan.plan.delay_sigma_fs > 0);
    // The demo's optic axis is vertical: table-plane angle errors leave ψ unchanged to first
    // order (cos ψ = |cos α| cos(cut), trace/crystal_axes.hpp), so its angle σ may be 0.
    CHECK(plan.plan.psi_sigma_mrad >= 0);
    CHECK(plan.plan.plan_points == static_cast<long long>(plan.plan.stage_mm.points) * plan.plan.rotation_deg.points);
}

TEST_CASE("scan uncertainty grows with the tolerances", "[scan]") {
    // σ from the tolerance run's perturbations is linear in the tolerances: doubling every
    // position and angle tolerance doubles both σ (within the linearization).
    rv::Layout l = demo();
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    const rv::ScanResult a = rv::plan_scan(l, lib, rv::ScanRequest{.stage_points = 3, .rotation_points = 3});
    l.goals.tolerance.position_mm *= 2;
    l.goals.tolerance.angle_mrad *= 2;
    l.goals.tolerance.focal_length_fraction *= 2;
    l.goals.tolerance.stage_mm *= 2;
    const rv::ScanResult b = rv::plan_scan(l, lib, rv::ScanRequest{.stage_points = 3, .rotation_points = 3});
    REQUIRE_FALSE(a.refusal);
    REQUIRE_FALSE(b.refusal);
    CHECK_THAT(b.plan.delay_sigma_fs, near_rel(2 * a.plan.delay_sigma_fs, 0.05));
    CHECK(a.plan.delay_sigma_fs > 0);
    CHECK_THAT(b.plan.psi_sigma_mrad, near(2 * a.plan.psi_sigma_mrad, 0.05 * a.plan.psi_sigma_mrad + 1e-9));
}

TEST_CASE("scan map values are finite and never above the best estimate", "[scan]") {
    for (const char* file : {"sfg-bbo.json", "shg-single.json"}) {
        INFO(file);
        const rv::Layout l = rv::test::bundled_layout(file);
        const rv::MaterialLibrary lib = rv::material_library_for(l);
        const rv::ScanResult r = rv::plan_scan(l, lib);
        REQUIRE_FALSE(r.refusal);
        CHECK(r.map.non_finite == 0);
        REQUIRE(r.map.power_mw.size() == r.map.stage_mm.size() * r.map.rotation_deg.size());
        for (const std::optional<double>& v : r.map.power_mw) {
            REQUIRE(v.has_value());
            CHECK(std::isfinite(*v));
            CHECK(*v >= 0);
            CHECK(*v <= r.map.best_mw * (1 + 1e-9));
        }
    }
}

TEST_CASE("scan of one beam's SHG has no delay axis", "[scan]") {
    const rv::Layout l = rv::test::bundled_layout("shg-single.json");
    const rv::ScanResult r = rv::plan_scan(l, rv::material_library_for(l));
    REQUIRE_FALSE(r.refusal);
    CHECK_FALSE(r.plan.stage_applies);
    CHECK(r.map.stage_mm.size() == 1);
    CHECK(r.plan.stage_mm.points == 1);
    CHECK(r.map.rotation_deg.size() >= 3);
    CHECK(r.plan.rotation_deg.step > 0);
}

TEST_CASE("scan refuses a layout or a grid it cannot plan", "[scan]") {
    using K = rv::ScanRefusal::Kind;
    const rv::MaterialLibrary lib = rv::material_library_for(demo());
    SECTION("SFG with no stage") {
        rv::Layout l = demo();
        std::erase_if(l.elements, [](const rv::Element& e) { return std::holds_alternative<rv::Stage>(e.kind); });
        const rv::ScanResult r = rv::plan_scan(l, lib);
        REQUIRE(r.refusal);
        CHECK(r.refusal->kind == K::NoStage);
        CHECK(r.refusal->pointer == "/elements");
    }
    SECTION("a target that is no crystal") {
        rv::Layout l = demo();
        l.target = "D1";
        const rv::ScanResult r = rv::plan_scan(l, lib);
        REQUIRE(r.refusal);
        CHECK(r.refusal->kind == K::NoCrystalTarget);
        CHECK(r.refusal->pointer == "/target");
        CHECK(r.refusal->element == "D1");
    }
    SECTION("no power given") {
        rv::Layout l = demo();
        l.beams[0].power_mw.reset();
        const rv::ScanResult r = rv::plan_scan(l, lib);
        REQUIRE(r.refusal);
        CHECK(r.refusal->kind == K::NoGeneratedLight);
    }
    SECTION("a grid above the bound") {
        const rv::ScanResult r =
            rv::plan_scan(demo(), lib, rv::ScanRequest{.stage_points = rv::kMaxScanPoints + 1, .rotation_points = 3});
        REQUIRE(r.refusal);
        CHECK(r.refusal->kind == K::TooManyPoints);
        CHECK(r.refusal->points == rv::kMaxScanPoints + 1);
    }
}
