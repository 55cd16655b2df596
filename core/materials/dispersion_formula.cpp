#include "materials/dispersion_formula.hpp"

#include <cassert>
#include <cmath>

namespace rv {

namespace {

struct Jet3 {  // a value and its first three derivatives in λ
    double v = 0, d1 = 0, d2 = 0, d3 = 0;
};

// 1/(λ² − c) and its derivatives; with D = λ² − c:
//   p' = −2λ/D², p'' = −2/D² + 8λ²/D³, p''' = 24λ/D³ − 48λ³/D⁴.
Jet3 pole(double l, double c) {
    const double d = l * l - c;
    const double d2 = d * d, d3 = d2 * d, d4 = d3 * d;
    return {1.0 / d, -2.0 * l / d2, -2.0 / d2 + 8.0 * l * l / d3,
            24.0 * l / d3 - 48.0 * l * l * l / d4};
}

// λ^e and its derivatives.
Jet3 power(double l, int e) {
    const double fe = e;
    return {std::pow(l, e), fe * std::pow(l, e - 1), fe * (fe - 1) * std::pow(l, e - 2),
            fe * (fe - 1) * (fe - 2) * std::pow(l, e - 3)};
}

Jet3 evaluate_f(const DispersionFormula& f, double l) {
    Jet3 sum{f.constant, 0, 0, 0};
    auto add = [&sum](double k, const Jet3& t) {
        sum.v += k * t.v;
        sum.d1 += k * t.d1;
        sum.d2 += k * t.d2;
        sum.d3 += k * t.d3;
    };
    for (const PoleTerm& t : f.poles) add(t.strength, pole(l, t.pole_um2));
    for (const PowerTerm& t : f.powers) add(t.coefficient, power(l, t.exponent));
    return sum;
}

}  // namespace

IndexDerivatives evaluate(const DispersionFormula& formula, double wavelength_um) {
    const Jet3 f = evaluate_f(formula, wavelength_um);
    const double shift = formula.shift_constant + formula.shift_per_um * wavelength_um;
    if (formula.shape == FormulaShape::IndexMinusOne)
        return {1.0 + f.v + shift, f.d1 + formula.shift_per_um, f.d2, f.d3};
    // n = √F: from F = n², F' = 2nn', F'' = 2n'² + 2nn'', F''' = 6n'n'' + 2nn'''.
    const double n = std::sqrt(f.v);
    const double n1 = f.d1 / (2.0 * n);
    const double n2 = (f.d2 - 2.0 * n1 * n1) / (2.0 * n);
    const double n3 = (f.d3 - 6.0 * n1 * n2) / (2.0 * n);
    return {n + shift, n1 + formula.shift_per_um, n2, n3};
}

DispersionFormula sellmeier_squared_poles(const std::vector<double>& b,
                                          const std::vector<double>& c_um2,
                                          double extra_constant) {
    assert(b.size() == c_um2.size());
    DispersionFormula f{FormulaShape::IndexSquared, 1.0 + extra_constant, {}, {}};
    for (size_t i = 0; i < b.size(); ++i) {
        f.constant += b[i];                        // B λ²/(λ² − C) = B + B C/(λ² − C)
        f.poles.push_back({b[i] * c_um2[i], c_um2[i]});
    }
    return f;
}

DispersionFormula sellmeier_resonances(const std::vector<double>& b,
                                       const std::vector<double>& resonance_um,
                                       double extra_constant) {
    std::vector<double> c;
    for (double r : resonance_um) c.push_back(r * r);
    return sellmeier_squared_poles(b, c, extra_constant);
}

DispersionFormula crystal_form(double a, double b, double c_um2,
                               const std::vector<PowerTerm>& powers) {
    return {FormulaShape::IndexSquared, a, {{b, c_um2}}, powers};
}

DispersionFormula two_pole_form(double a, const std::vector<double>& b,
                                const std::vector<double>& c_um2) {
    assert(b.size() == c_um2.size());
    DispersionFormula f{FormulaShape::IndexSquared, a, {}, {}};
    for (size_t i = 0; i < b.size(); ++i) f.poles.push_back({b[i], c_um2[i]});
    return f;
}

DispersionFormula inverse_square_poles(const std::vector<double>& k,
                                       const std::vector<double>& c_per_um2, double constant) {
    assert(k.size() == c_per_um2.size());
    DispersionFormula f{FormulaShape::IndexMinusOne, constant, {}, {}};
    for (size_t i = 0; i < k.size(); ++i) {
        // k/(c − λ⁻²) = k λ²/(c λ² − 1) = k/c + (k/c²)/(λ² − 1/c)
        const double c = c_per_um2[i];
        f.constant += k[i] / c;
        f.poles.push_back({k[i] / (c * c), 1.0 / c});
    }
    return f;
}

}  // namespace rv
