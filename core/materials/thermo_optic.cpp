#include "materials/thermo_optic.hpp"

namespace rv {

Material at_temperature(const Material& material, double temperature_c) {
    if (!material.thermo_optic) return material;
    const ThermoOptic& t = *material.thermo_optic;
    Material m = material;
    const double dt_k = temperature_c - t.reference_temperature_c;
    for (size_t i = 0; i < m.axes.size() && i < t.axes.size(); ++i) {
        m.axes[i].shift_constant = t.axes[i].per_k * dt_k;
        m.axes[i].shift_per_um = t.axes[i].per_k_per_um * dt_k;
    }
    m.temperature_c = temperature_c;
    return m;
}

}  // namespace rv
