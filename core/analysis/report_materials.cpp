// The data sets behind the report's indices: the air of every path (the trace's group delay in
// air) first, then each material of an element on a beam's path in the order the beams meet
// them: a lens's glass, a plate's or a dichroic's substrate, a retarder's birefringent
// material, a crystal. A name the library resolves to a set (a family alias such as "BBO")
// is reported under the set's own name, with its citation and the range of its fit.
#include "analysis/report_materials.hpp"

#include <algorithm>
#include <string>
#include <type_traits>
#include <variant>

namespace rv {
namespace {

// Every material name an element's kind carries (whatever kind: a member named material,
// glass, slab, substrate or retarder_material, and a lens model's glass).
void names_of(const Element& e, std::vector<std::string>& out) {
    auto slab = [&](const auto& k) {
        if constexpr (requires { k.material; }) {
            using M = std::decay_t<decltype(k.material)>;
            if constexpr (std::is_same_v<M, std::string>) out.push_back(k.material);
        }
        if constexpr (requires { k.glass; }) out.push_back(k.glass);
        if constexpr (requires { k.slab.material; }) out.push_back(k.slab.material);
        if constexpr (requires { k.substrate.material; }) out.push_back(k.substrate.material);
        if constexpr (requires { k.retarder_material; })
            if (k.retarder_material) out.push_back(*k.retarder_material);
        if constexpr (requires { k.model; })
            std::visit(
                [&](const auto& m) {
                    if constexpr (requires { m.glass; }) out.push_back(m.glass);
                },
                k.model);
    };
    std::visit(slab, e.kind);
}

}  // namespace

std::vector<MaterialDataReport> materials_used(const Layout& layout, const MaterialLibrary& library,
                                               const std::vector<ReportBeam>& beams) {
    std::vector<MaterialDataReport> out;
    auto add = [&](const std::string& name, const std::string& user) {
        if (name.empty()) return;
        const Material* m = library.find(name);
        if (!m) return;  // the reader has already refused an unknown name
        auto it = std::find_if(out.begin(), out.end(),
                               [&](const MaterialDataReport& d) { return d.name == m->name; });
        if (it == out.end()) {
            out.push_back({m->name, m->source, m->min_wavelength_nm, m->max_wavelength_nm, {}});
            it = out.end() - 1;
        }
        if (std::find(it->used_by.begin(), it->used_by.end(), user) == it->used_by.end())
            it->used_by.push_back(user);
    };
    if (!beams.empty()) add("air", "air");
    for (const ReportBeam& b : beams)
        for (const std::string& id : b.element_ids) {
            const auto e = std::find_if(layout.elements.begin(), layout.elements.end(),
                                        [&](const Element& x) { return x.id == id; });
            if (e == layout.elements.end()) continue;
            std::vector<std::string> names;
            names_of(*e, names);
            for (const std::string& n : names) add(n, id);
        }
    return out;
}

}  // namespace rv
