#include <cmath>

#include "trace/interact.hpp"

namespace rv {

Finding& add_finding(Path& path, const Layout& layout, Finding::Kind kind, size_t e, const Vec2& where,
                     double amount) {
    Finding& f = path.findings.emplace_back();
    f.kind = kind;
    if (e < layout.elements.size()) f.element = layout.elements[e].id;
    f.where_mm = where;
    f.amount = amount;
    return f;
}

void HitContext::note_out_of_range(const Material& m) const {
    for (size_t e : noted)
        if (e == element) return;
    noted.push_back(element);
    Finding& f = finding(Finding::Kind::MaterialOutOfRange, element, placed[element].at);
    f.material = m.name;
    f.wavelength_nm = beam.wavelength_nm;
    f.range_min_nm = m.min_wavelength_nm;
    f.range_max_nm = m.max_wavelength_nm;
}

void HitContext::no_real_index(const Vec2& where) const {
    Finding& f = finding(Finding::Kind::NoRealIndex, element, where);
    const Material* m = placed[element].material;
    f.material = m ? m->name : std::string();
    f.wavelength_nm = beam.wavelength_nm;
}

std::optional<Vec2> refract(const Vec2& d, const Vec2& surface_normal, double n1, double n2) {
    const Vec2 m = d.dot(surface_normal) < 0 ? surface_normal : Vec2(-surface_normal);
    const double cos_i = -m.dot(d);
    const double r = n1 / n2;
    const double sin2_t = r * r * (1.0 - cos_i * cos_i);
    if (sin2_t > 1.0) return std::nullopt;
    const double cos_t = std::sqrt(1.0 - sin2_t);
    return Vec2(r * d + (r * cos_i - cos_t) * m).normalized();
}

}  // namespace rv
