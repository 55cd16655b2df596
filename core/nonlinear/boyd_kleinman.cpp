// Boyd–Kleinman h(σ, B, ξ) as a one-dimensional integral (boyd_kleinman.hpp gives the model).
//
// With s = τ − τ' the double integral becomes
//   h = (1/(4ξ)) ∫_{−2ξ}^{2ξ} ds e^{iσs − (B²/ξ)s²} G(s),
//   G(s) = ∫ dτ / ((1 + iτ)(1 + is − iτ))  over the τ where both τ and τ − s lie in [−ξ, ξ].
// Swapping τ and τ' conjugates the integrand, so K(−s) = conj K(s) and
//   h = (1/(2ξ)) Re ∫_0^{2ξ} ds e^{iσs − (B²/ξ)s²} G(s).
// For s ≥ 0 the τ range is [s − ξ, ξ]. Partial fractions,
//   1/((1 + iτ)(1 + is − iτ)) = (1/(1 + iτ) + 1/(1 + is − iτ)) / (2 + is),
// integrate to logarithms whose arguments have real part 1 (never crossing the principal
// branch cut), giving G(s) = −2i [ln(1 + iξ) − ln(1 + i(s − ξ))] / (2 + is); G(0) = 2 atan ξ.
//
// G is analytic near the real axis except for the pole at s = 2i and the branch point at
// s = ξ + i: the s range is cut at ξ and panels grow geometrically away from 0 and ξ, each with
// a 16-point Gauss–Legendre rule, no longer than the σ oscillation and the walk-off Gaussian
// allow; the Gaussian's tail beyond 7 widths (e^{−49}) is dropped. For one (ξ, B) the weighted
// G is kept, so each σ costs one complex exponential per node.
//
// Walk-off as a smoothing: e^{−a s²} (a = B²/ξ) is the Fourier transform of a Gaussian of
// standard deviation √(2a) in σ, so h(·, B, ξ) is h(·, 0, ξ) smoothed by that Gaussian. h(·, 0, ξ)
// is concentrated on 0 ≤ σ ≲ 1.5 (its integral over τ tends to 2π e^{−σ} for σ > 0 and to 0 for
// σ < 0; the remainder is bounded by 2/(σξ) by closing the contour), so the global maximum lies
// in [0, σ_hi] with σ_hi = 3 + 3√(2a) (1 + 3√(2a) for ξ > 30, where the bound above already
// excludes σ > 1). The search evaluates a grid on [0, σ_hi], a second one on [0, 12/ξ] (for
// large ξ the peak lies near σ = π/ξ, narrower than the first grid's step) and one on
// [0, 6√(2a)], and refines the best point between its neighbours.
#include "nonlinear/boyd_kleinman.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <complex>
#include <vector>

#include "units/constants.hpp"

namespace rv {
namespace {

using Complex = std::complex<double>;

constexpr int kOrder = 16;              // Gauss–Legendre points per panel
constexpr double kPanelPhase_rad = 8;   // σ_hi × panel length: the rule's error ≈ 4³²/32! ≈ 1e-16
constexpr double kXiSmall = 1e-6, kXiLarge = 1e5;

struct GaussLegendre {
    std::array<double, kOrder> x{}, w{};  // on [−1, 1]
};

// Nodes and weights by Newton's iteration on P_n (Abramowitz & Stegun 25.4.29 / the standard
// recurrence (n+1)P_{n+1} = (2n+1) x P_n − n P_{n−1}).
const GaussLegendre& gauss_legendre() {
    static const GaussLegendre rule = [] {
        GaussLegendre g;
        for (int i = 0; i < kOrder; ++i) {
            double x = std::cos(kPi * (i + 0.75) / (kOrder + 0.5)), dp = 1;
            for (int iter = 0; iter < 100; ++iter) {
                double p0 = 1, p1 = x;
                for (int n = 1; n < kOrder; ++n) {
                    const double p2 = ((2 * n + 1) * x * p1 - n * p0) / (n + 1);
                    p0 = p1, p1 = p2;
                }
                dp = kOrder * (x * p1 - p0) / (x * x - 1);
                const double dx = p1 / dp;
                x -= dx;
                if (std::abs(dx) < 1e-16) break;
            }
            g.x[i] = x;
            g.w[i] = 2 / ((1 - x * x) * dp * dp);
        }
        return g;
    }();
    return rule;
}

double width_in_sigma(double b, double xi) { return b * std::sqrt(2 / xi); }  // √(2a)

double sigma_search_limit(double b, double xi) {
    return (xi > 30 ? 1.0 : 3.0) + 3 * width_in_sigma(b, xi);
}

// ln(1 + ix) for real x: real part 1, so the principal branch throughout.
Complex log_one_plus_i(double x) { return {0.5 * std::log1p(x * x), std::atan(x)}; }

// Breakpoints from x0 towards x1 (either direction), panels growing from 0.5 at x0 by half the
// distance travelled plus one (singularities lie at distance ≥ 1 from the real axis), at most cap.
void graded(double x0, double x1, double cap, std::vector<double>& out) {
    const double span = std::abs(x1 - x0), dir = x1 > x0 ? 1 : -1;
    for (double t = 0; t < span;) {
        t = std::min(span, t + std::min(cap, 0.5 * (t + 1)));
        out.push_back(x0 + dir * t);
    }
}

// The weighted kernel of one (ξ, B): h(σ) = (1/(2ξ)) Re Σ c_k e^{iσ s_k}.
class Kernel {
public:
    Kernel(double xi, double b, double sigma_hi) : xi_(xi) {
        const double a = b * b / xi;
        const double s_end = a > 0 ? std::min(2 * xi, 7 / std::sqrt(a)) : 2 * xi;
        double cap = kPanelPhase_rad / std::max(sigma_hi, 1e-300);
        if (a > 0) cap = std::min(cap, 3 / std::sqrt(a));
        std::vector<double> edges{0};
        const double first_end = std::min(xi, s_end);
        // [0, min(ξ, s_end)]: graded from both ends (pole at 2i, branch point at ξ + i).
        std::vector<double> left, right;
        graded(0, first_end / 2, cap, left);
        graded(first_end, first_end / 2, cap, right);
        edges.insert(edges.end(), left.begin(), left.end());
        edges.insert(edges.end(), right.rbegin() + 1, right.rend());
        edges.push_back(first_end);
        if (s_end > xi) graded(xi, s_end, cap, edges);
        const GaussLegendre& g = gauss_legendre();
        const Complex log_xi = log_one_plus_i(xi);
        for (size_t p = 0; p + 1 < edges.size(); ++p) {
            const double lo = edges[p], hi = edges[p + 1];
            if (!(hi > lo)) continue;
            const double half = (hi - lo) / 2, mid = (hi + lo) / 2;
            for (int i = 0; i < kOrder; ++i) {
                const double s = mid + half * g.x[i];
                const Complex big_g =
                    Complex(0, -2) * (log_xi - log_one_plus_i(s - xi)) / Complex(2, s);
                s_.push_back(s);
                c_.push_back(half * g.w[i] * std::exp(-a * s * s) * big_g);
            }
        }
    }
    double h(double sigma) const {
        double sum = 0;
        for (size_t k = 0; k < s_.size(); ++k) {
            const double phase = sigma * s_[k];
            sum += c_[k].real() * std::cos(phase) - c_[k].imag() * std::sin(phase);
        }
        return std::max(0.0, sum / (2 * xi_));
    }
    // h at σ = j·step, j = 0 … count − 1: e^{i j step s} by repeated multiplication (one sine
    // and cosine per node for the whole grid).
    std::vector<double> h_grid(double step, int count) const {
        std::vector<Complex> sum(count, 0.0);
        for (size_t k = 0; k < s_.size(); ++k) {
            const Complex turn = std::polar(1.0, step * s_[k]);
            Complex term = c_[k];
            for (int j = 0; j < count; ++j) sum[j] += term, term *= turn;
        }
        std::vector<double> out(count);
        for (int j = 0; j < count; ++j) out[j] = std::max(0.0, sum[j].real() / (2 * xi_));
        return out;
    }

private:
    double xi_;
    std::vector<double> s_;
    std::vector<Complex> c_;
};

// Brent's method for a maximum of f on [a, b] (R. P. Brent, Algorithms for Minimization without
// Derivatives, 1973, ch. 5: golden section with parabolic steps).
template <class F>
std::pair<double, double> brent_max(F f, double a, double b, double tol) {
    const double golden = 0.3819660112501051;
    double x = a + golden * (b - a), w = x, v = x;
    double fx = -f(x), fw = fx, fv = fx;
    double d = 0, e = 0;
    for (int iter = 0; iter < 100; ++iter) {
        const double m = 0.5 * (a + b), tol1 = tol * std::abs(x) + 1e-12, tol2 = 2 * tol1;
        if (std::abs(x - m) <= tol2 - 0.5 * (b - a)) break;
        bool parabolic = false;
        if (std::abs(e) > tol1) {
            double r = (x - w) * (fx - fv), q = (x - v) * (fx - fw), p = (x - v) * q - (x - w) * r;
            q = 2 * (q - r);
            if (q > 0) p = -p;
            q = std::abs(q);
            if (std::abs(p) < std::abs(0.5 * q * e) && p > q * (a - x) && p < q * (b - x)) {
                e = d, d = p / q, parabolic = true;
                const double u = x + d;
                if (u - a < tol2 || b - u < tol2) d = x < m ? tol1 : -tol1;
            }
        }
        if (!parabolic) e = (x < m ? b : a) - x, d = golden * e;
        const double u = std::abs(d) >= tol1 ? x + d : x + (d > 0 ? tol1 : -tol1);
        const double fu = -f(u);
        if (fu <= fx) {
            (u < x ? b : a) = x;
            v = w, fv = fw, w = x, fw = fx, x = u, fx = fu;
        } else {
            (u < x ? a : b) = u;
            if (fu <= fw || w == x) {
                v = w, fv = fw, w = u, fw = fu;
            } else if (fu <= fv || v == x || v == w) {
                v = u, fv = fu;
            }
        }
    }
    return {x, -fx};
}

// Loose focusing, ξ → 0 (1 + iτ → 1, σ_m = 0): h = (1/(2ξ)) ∫_0^{2ξ} (2ξ − s) e^{−a s²} ds.
double loose_focus_limit(double b, double xi) {
    const double a = b * b / xi;
    if (a * xi * xi < 1e-12) return xi;
    const double r = std::sqrt(a), t = 2 * xi * r;
    return (2 * xi * std::sqrt(kPi) / (2 * r) * std::erf(t) - (1 - std::exp(-t * t)) / (2 * a)) /
           (2 * xi);
}

BoydKleinmanOptimum search_sigma(const Kernel& kernel, double b, double xi, int grid_points,
                                 double tol) {
    const double sigma_hi = sigma_search_limit(b, xi), width = width_in_sigma(b, xi);
    std::vector<std::pair<double, double>> grid;  // (σ, h)
    auto add_grid = [&](double end, int intervals) {
        const std::vector<double> h = kernel.h_grid(end / intervals, intervals + 1);
        for (int j = 0; j <= intervals; ++j) grid.push_back({end * j / intervals, h[j]});
    };
    add_grid(sigma_hi, grid_points);
    if (xi > 4) add_grid(12 / xi, grid_points);
    if (width > 0 && 6 * width < sigma_hi) add_grid(6 * width, grid_points / 2);
    std::sort(grid.begin(), grid.end());
    size_t best = 0;
    for (size_t j = 0; j < grid.size(); ++j)
        if (grid[j].second > grid[best].second) best = j;
    const double best_h = grid[best].second;
    size_t below = best, above = best;
    while (below > 0 && grid[below].first >= grid[best].first) --below;
    while (above + 1 < grid.size() && grid[above].first <= grid[best].first) ++above;
    const double lo = grid[below].first, hi = grid[above].first;
    if (!(hi > lo)) return {best_h, grid[best].first};
    const auto [sigma, h] = brent_max([&](double s) { return kernel.h(s); }, lo, hi, tol);
    return h >= best_h ? BoydKleinmanOptimum{h, sigma} : BoydKleinmanOptimum{best_h, grid[best].first};
}

}  // namespace

double boyd_kleinman_h(double sigma, double walkoff_b, double xi) {
    if (!(xi > 0) || !std::isfinite(xi) || !std::isfinite(sigma) || !std::isfinite(walkoff_b))
        return 0;
    const double b = std::abs(walkoff_b);
    if (xi < kXiSmall) return loose_focus_limit(b, xi);
    // Beyond the validity range: the strong-focusing residue form π² e^{−2σ}/ξ (σ > 0).
    if (xi > kXiLarge) return kPi * kPi * std::exp(-2 * std::max(sigma, 0.0)) / xi;
    return Kernel(xi, b, std::max(std::abs(sigma), 1e-3)).h(sigma);
}

BoydKleinmanOptimum boyd_kleinman_optimum(double xi, double walkoff_b) {
    if (!(xi > 0) || !std::isfinite(xi) || !std::isfinite(walkoff_b)) return {0, 0};
    const double b = std::abs(walkoff_b);
    if (xi < kXiSmall) return {loose_focus_limit(b, xi), 0};
    if (xi > kXiLarge) {
        // Outside the validity range: h_m scales as 1/ξ for ξ → ∞; the value at ξ = 10⁵ scaled
        // (exact in that law for B = 0, where h_m ξ → (π + 2 Si(π))²/4; for B > 0, h_m ξ creeps
        // up towards π² and this stays a lower figure).
        const BoydKleinmanOptimum at_limit = boyd_kleinman_optimum(kXiLarge, b);
        return {at_limit.h_m * kXiLarge / xi, at_limit.sigma_m * kXiLarge / xi};
    }
    const Kernel kernel(xi, b, sigma_search_limit(b, xi));
    return search_sigma(kernel, b, xi, 48, 1e-9);
}

BoydKleinmanBest boyd_kleinman_best_focus(double walkoff_b) {
    if (!std::isfinite(walkoff_b)) return {};
    const double b = std::abs(walkoff_b);
    // ξ_m lies between 1.39 (B → ∞) and 2.84 (B = 0): search log ξ on [ln 0.5, ln 6].
    BoydKleinmanOptimum inner;
    const auto h_of_log_xi = [&](double log_xi) {
        const double xi = std::exp(log_xi);
        const Kernel kernel(xi, b, sigma_search_limit(b, xi));
        inner = search_sigma(kernel, b, xi, 16, 1e-6);
        return inner.h_m;
    };
    const auto [log_xi, h_mm] = brent_max(h_of_log_xi, std::log(0.5), std::log(6.0), 1e-5);
    const double xi = std::exp(log_xi);
    const BoydKleinmanOptimum at = boyd_kleinman_optimum(xi, b);
    return {xi, std::max(h_mm, at.h_m), at.sigma_m};
}

double walkoff_parameter(double walkoff_rad, double length_mm, double k1_per_mm) {
    return walkoff_rad * std::sqrt(length_mm * k1_per_mm) / 2;
}

}  // namespace rv
