#pragma once
// Boyd–Kleinman focusing function without walk-off, focus at the crystal centre:
//   h(σ, ξ) = (1/(4ξ)) |∫_{−ξ}^{+ξ} e^{iστ}/(1 + iτ) dτ|²,   h_m(ξ) = max over σ,
// with ξ = L/b the crystal length over the confocal parameter b = 2 z_R (in the crystal) and
// σ = b Δk/2. Walk-off parameter B = ρ √(L k1)/2.
// Reference: G. D. Boyd and D. A. Kleinman, J. Appl. Phys. 39, 3597 (1968); optimum
// ξ = 2.84, h_m = 1.068 (docs/physics.md §5; our integration reproduces it).

namespace rv {

double boyd_kleinman_h(double sigma, double xi);

struct BoydKleinmanOptimum {
    double h_m, sigma_m;
};
BoydKleinmanOptimum boyd_kleinman_optimum(double xi);

double walkoff_parameter(double walkoff_rad, double length_mm, double k1_per_mm);

}  // namespace rv
