#pragma once
// An optical material: one dispersion formula per principal axis, with its source and the
// wavelength range the source fitted. Outside that range the formula is still evaluated (a
// caller may need a number) but every result says so, and callers turn it into a warning.

#include <optional>
#include <string>
#include <vector>

#include "materials/dispersion_formula.hpp"

namespace rv {

enum class Symmetry { Isotropic, Uniaxial, Biaxial };

// A set's temperature dependence, in the linear form the sources print per principal axis:
//   n(λ, T) = n(λ, T_ref) + (dn/dT)(λ) · (T − T_ref),  dn/dT = a + b·λ  (per K, λ in µm).
struct ThermoOptic {
    double reference_temperature_c = 20.0;  // where the axes' formulas apply unshifted
    struct Slope {
        double per_k = 0.0;        // a
        double per_k_per_um = 0.0; // b
    };
    std::vector<Slope> axes;  // one per principal axis, as Material::axes
    std::string source;       // citation of the thermo-optic coefficients
};

// Index of a principal axis in Material::axes. Uniaxial: ordinary, extraordinary.
// Biaxial: x, y, z with n_x < n_y < n_z (LBO's α, β, γ).
enum class Axis { Ordinary = 0, Extraordinary = 1, X = 0, Y = 1, Z = 2 };

struct Material {
    std::string name;      // unique, e.g. "BBO:Kato1986", "N-BK7", or a user id
    std::string family;    // "BBO", "N-BK7", …: what a file names to get the default set
    std::string source;    // citation of the coefficients
    Symmetry symmetry = Symmetry::Isotropic;
    std::vector<DispersionFormula> axes;  // 1 (isotropic), 2 (uniaxial: o, e) or 3 (biaxial)
    double min_wavelength_nm = 0.0;       // valid range of the fit
    double max_wavelength_nm = 0.0;
    bool relative_to_air = false;  // index given relative to standard air (glass catalogues)
    std::optional<ThermoOptic> thermo_optic;  // absent: the set has no temperature dependence
    // The temperature the axes' formulas stand for now: the reference one, or the one a layout
    // set (materials/thermo_optic.hpp, at_temperature). Absent for a set without thermo_optic.
    std::optional<double> temperature_c;
};

inline bool covers(const Material& m, double wavelength_nm) {
    return wavelength_nm >= m.min_wavelength_nm && wavelength_nm <= m.max_wavelength_nm;
}

}  // namespace rv
