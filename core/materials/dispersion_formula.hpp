#pragma once
// Dispersion formulas: the refractive index as a function of the vacuum wavelength λ in µm.
//
// Every published form we carry reduces to one of two shapes of a single function F(λ):
//   IndexSquared:  n²    = F(λ)
//   IndexMinusOne: n − 1 = F(λ)
// with  F(λ) = a + Σ s_i / (λ² − c_i) + Σ p_k λ^e_k   (c_i in µm², e_k even integers).
// A Sellmeier term B λ²/(λ² − C) equals B + B·C/(λ² − C), and an air term k/(c − λ⁻²) equals
// 1/c·k + (k/c²)/(λ² − 1/c), so both fold into the same poles exactly (no approximation).
// Builders below take the coefficients as printed in the sources and do that folding.
// F is evaluated with its first three derivatives in closed form, which gives the group index
// and GVD without finite differences.

#include <vector>

namespace rv {

struct PoleTerm {
    double strength;  // s, in the unit of F times µm²
    double pole_um2;  // c, µm²
};

struct PowerTerm {
    double coefficient;  // p
    int exponent;        // e (even, may be negative)
};

enum class FormulaShape { IndexSquared, IndexMinusOne };

struct DispersionFormula {
    FormulaShape shape = FormulaShape::IndexSquared;
    double constant = 0.0;
    std::vector<PoleTerm> poles;
    std::vector<PowerTerm> powers;
    // An offset added to n after the shape: n += shift_constant + shift_per_um·λ. Zero for a
    // set at its reference temperature; the thermo-optic shift of a set taken to another
    // temperature (materials/thermo_optic.hpp), which the published forms give in n, not n².
    double shift_constant = 0.0;
    double shift_per_um = 0.0;
};

// n and its first three derivatives with respect to λ (µm⁻¹, µm⁻², µm⁻³).
struct IndexDerivatives {
    double n, dn, d2n, d3n;
};

IndexDerivatives evaluate(const DispersionFormula& formula, double wavelength_um);

// Builders, in the forms the sources print (λ in µm).
// n² − 1 = Σ B_i λ²/(λ² − C_i), C_i in µm² (SCHOTT catalogue form; Tamošauskas 2018).
DispersionFormula sellmeier_squared_poles(const std::vector<double>& b,
                                          const std::vector<double>& c_um2,
                                          double extra_constant = 0.0);
// n² − 1 = Σ B_i λ²/(λ² − λ_i²), λ_i in µm (Malitson form; H. H. Li 1980 with a constant).
DispersionFormula sellmeier_resonances(const std::vector<double>& b,
                                       const std::vector<double>& resonance_um,
                                       double extra_constant = 0.0);
// n² = A + B/(λ² − C) + Σ p_k λ^e_k (the crystal form used for BBO, LBO; Zhang adds λ⁴, λ⁶).
DispersionFormula crystal_form(double a, double b, double c_um2,
                               const std::vector<PowerTerm>& powers);
// n² = A + Σ B_i/(λ² − C_i) (Kato & Takaoka 2002 form for KTP).
DispersionFormula two_pole_form(double a, const std::vector<double>& b,
                                const std::vector<double>& c_um2);
// n − 1 = Σ k_i/(c_i − λ⁻²), c_i in µm⁻² (Ciddor 1996, Peck & Reeder 1972 add a constant).
DispersionFormula inverse_square_poles(const std::vector<double>& k,
                                       const std::vector<double>& c_per_um2,
                                       double constant = 0.0);

}  // namespace rv
