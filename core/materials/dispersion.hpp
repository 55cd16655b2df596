#pragma once
// Index, group index, group-velocity dispersion and group delay of a material.
//
//   n_g = n − λ dn/dλ
//   GVD = d²k/dω² = λ³/(2π c²) · d²n/dλ²                       (fs²/mm)
//   TOD = d³k/dω³ = −λ⁴/(4π² c³) · (3 d²n/dλ² + λ d³n/dλ³)      (fs³/mm)
//   group delay τ_g = n_g L / c
// Reference: Diels & Rudolph, "Ultrashort Laser Pulse Phenomena" (2nd ed., 2006), ch. 1;
// H. Abramczyk, "Introduction to Laser Spectroscopy" (2005), p. 107 for the GVD form.

#include "materials/dispersion_formula.hpp"
#include "materials/material.hpp"
#include "units/constants.hpp"

namespace rv {

struct IndexSample {
    double index;             // n, as the data set gives it (relative to air for glasses)
    double group_index;       // n_g
    double gvd_fs2_per_mm;    // group-velocity dispersion
    double tod_fs3_per_mm;    // third-order dispersion
    bool in_valid_range;      // false: the wavelength lies outside the set's fitted range
};

IndexSample sample_index(const Material& material, double wavelength_nm, Axis axis = Axis::X);

// The sample from an index and its λ-derivatives (λ in µm), by the formulas above.
IndexSample sample_from_derivatives(const IndexDerivatives& derivatives, double wavelength_um, bool in_range);

// The same sample with the index made absolute (vacuum-referenced): for a set given relative
// to air, n_abs = n_rel · n_air, with all derivatives by the product rule; otherwise unchanged.
IndexSample absolute_index(const Material& material, const Material& air, double wavelength_nm,
                           Axis axis = Axis::X);

// Group delay of a pulse over length_mm of the medium for a given group index, fs (inline:
// the timing sums it over every segment of every evaluation).
inline double group_delay_fs(double group_index, double length_mm) {
    return group_index * length_mm / kSpeedOfLight_mm_per_fs;
}

}  // namespace rv
