#pragma once
// One wave of a birefringent crystal at a fixed angle ψ to its reference axis: its index with
// three λ-derivatives (for the group index, the GVD and the TOD, materials/dispersion.hpp), and
// the walk-off of its energy from its wave vector.
//
// Index (phase_matching.hpp): the A wave has p_A(λ); the B wave 1/n_B² = u = cos²ψ/p² + sin²ψ/q²,
// so at fixed ψ, with f = p⁻² (and q⁻² alike):
//   f' = −2p⁻³p',  f'' = 6p⁻⁴p'² − 2p⁻³p'',  f''' = −24p⁻⁵p'³ + 18p⁻⁴p'p'' − 2p⁻³p''',
//   n = u^(−1/2),  n' = −½u^(−3/2)u',  n'' = ¾u^(−5/2)u'² − ½u^(−3/2)u'',
//   n''' = −15/8 u^(−7/2)u'³ + 9/4 u^(−5/2)u'u'' − ½u^(−3/2)u'''        (chain rule).
// Walk-off (Poynting vector against wave vector) of the B wave, from the index ellipse:
//   tan ρ = ½ n_B² (q⁻² − p⁻²) sin 2ψ,
// ρ > 0 turning the energy away from the reference axis (Boyd, Nonlinear Optics, 3rd ed. 2008,
// §2.3 for the uniaxial case p = n_o, q = n_e; Dmitriev, Gurzadyan & Nikogosyan, Handbook of
// Nonlinear Optical Crystals, 1999, §1 for the principal planes of biaxial crystals). The A
// wave does not walk off. λ in µm, as CrystalIndices holds it.

#include "materials/dispersion.hpp"
#include "nonlinear/phase_matching.hpp"

namespace rv {

IndexDerivatives wave_derivatives(const CrystalIndices& indices, Polarity polarity, double angle_rad);

// Index, group index, GVD and TOD of the wave (IndexSample, the crystal's set as it is given).
IndexSample wave_sample(const CrystalIndices& indices, Polarity polarity, double angle_rad);

// The walk-off angle ρ of the wave (0 for the A wave).
double walkoff_rad(const CrystalIndices& indices, Polarity polarity, double angle_rad);

}  // namespace rv
