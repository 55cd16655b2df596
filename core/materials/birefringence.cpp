#include "materials/birefringence.hpp"

#include <cmath>

#include "units/constants.hpp"

namespace rv {

IndexSample extraordinary_index(const Material& m, double wavelength_nm, double angle_rad) {
    const double l = nm_to_um(wavelength_nm);
    const IndexDerivatives o = evaluate(m.axes[0], l);
    const IndexDerivatives e = evaluate(m.axes[1], l);
    const double c2 = std::cos(angle_rad) * std::cos(angle_rad);
    const double s2 = 1.0 - c2;
    const double inv_n2 = c2 / (o.n * o.n) + s2 / (e.n * e.n);
    const double n = 1.0 / std::sqrt(inv_n2);
    const double dn = n * n * n * (c2 * o.dn / (o.n * o.n * o.n) + s2 * e.dn / (e.n * e.n * e.n));
    return {n, n - l * dn, 0.0, 0.0, covers(m, wavelength_nm)};
}

}  // namespace rv
