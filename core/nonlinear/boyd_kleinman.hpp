#pragma once
// Boyd–Kleinman focusing function with walk-off, focus at the crystal centre (μ = 0), no
// absorption (G. D. Boyd and D. A. Kleinman, J. Appl. Phys. 39, 3597 (1968), their h(σ, B, ξ)):
//
//   h(σ, B, ξ) = (1/(4ξ)) ∫_{−ξ}^{ξ}∫_{−ξ}^{ξ} dτ dτ' e^{iσ(τ−τ')} e^{−(B²/ξ)(τ−τ')²}
//                                                  / ((1 + iτ)(1 − iτ')),
//
// with ξ = L/b the crystal length over the confocal parameter b = 2 z_R (in the crystal),
// σ = b Δk/2 the phase-mismatch parameter and B = ρ √(L k1)/2 the walk-off parameter (ρ the
// Poynting walk-off angle of the wave that walks off, k1 its wave number in the crystal).
// h_m(ξ, B) = max over σ; h_mm(B) = max over ξ of h_m, reached at ξ_m(B). B = 0: ξ_m = 2.84,
// h_mm = 1.068 (BK 1968); ξ_m falls towards 1.39 as B grows (boyd_kleinman.cpp derives it).
//
// Valid (checked by tests/nonlinear/boyd_kleinman_test.cpp) for 0.01 ≤ ξ ≤ 10⁴ and 0 ≤ B ≤ 30;
// outside ξ ∈ [10⁻⁶, 10⁵] the limiting forms are returned (see boyd_kleinman.cpp).

namespace rv {

// h(σ, B, ξ); 0 for a non-finite argument or ξ ≤ 0. B < 0 counts as |B|.
double boyd_kleinman_h(double sigma, double walkoff_b, double xi);

struct BoydKleinmanOptimum {
    double h_m = 0, sigma_m = 0;  // the global maximum over σ and where it lies
};
// max over σ of h(σ, B, ξ) (the global maximum: a grid dense near σ = 0, then refinement).
BoydKleinmanOptimum boyd_kleinman_optimum(double xi, double walkoff_b = 0);

struct BoydKleinmanBest {
    double xi_m = 0, h_mm = 0, sigma_m = 0;  // the optimum focusing for one B
};
// max over ξ (and σ) of h for a given walk-off parameter B.
BoydKleinmanBest boyd_kleinman_best_focus(double walkoff_b);

// B = ρ √(L k1)/2 (BK 1968 eq. for the double-refraction parameter), ρ in rad, L in mm, k1 in
// rad/mm.
double walkoff_parameter(double walkoff_rad, double length_mm, double k1_per_mm);

}  // namespace rv
