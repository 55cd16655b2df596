#include "materials/dispersion.hpp"

#include "units/constants.hpp"

namespace rv {

IndexSample sample_from_derivatives(const IndexDerivatives& d, double wavelength_um, bool in_range) {
    const double l = wavelength_um, c = kSpeedOfLight_um_per_fs;
    IndexSample s{};
    s.index = d.n;
    s.group_index = d.n - l * d.dn;
    // λ³/(2π c²) n'' is in fs²/µm (λ in µm, c in µm/fs), given per mm.
    s.gvd_fs2_per_mm = per_um_to_per_mm(l * l * l / (2.0 * kPi * c * c) * d.d2n);
    s.tod_fs3_per_mm = per_um_to_per_mm(-l * l * l * l / (4.0 * kPi * kPi * c * c * c) * (3.0 * d.d2n + l * d.d3n));
    s.in_valid_range = in_range;
    return s;
}

namespace {

IndexDerivatives derivatives(const Material& m, double wavelength_nm, Axis axis) {
    const size_t i = static_cast<size_t>(axis) < m.axes.size() ? static_cast<size_t>(axis) : 0;
    return evaluate(m.axes[i], nm_to_um(wavelength_nm));
}

}  // namespace

IndexSample sample_index(const Material& material, double wavelength_nm, Axis axis) {
    return sample_from_derivatives(derivatives(material, wavelength_nm, axis), nm_to_um(wavelength_nm),
                            covers(material, wavelength_nm));
}

IndexSample absolute_index(const Material& material, const Material& air, double wavelength_nm,
                           Axis axis) {
    IndexDerivatives g = derivatives(material, wavelength_nm, axis);
    bool in_range = covers(material, wavelength_nm);
    if (material.relative_to_air) {
        const IndexDerivatives a = derivatives(air, wavelength_nm, Axis::X);
        g = {g.n * a.n, g.dn * a.n + g.n * a.dn, g.d2n * a.n + 2 * g.dn * a.dn + g.n * a.d2n,
             g.d3n * a.n + 3 * g.d2n * a.dn + 3 * g.dn * a.d2n + g.n * a.d3n};
        in_range = in_range && covers(air, wavelength_nm);
    }
    return sample_from_derivatives(g, nm_to_um(wavelength_nm), in_range);
}

}  // namespace rv
