// The report names the dispersion data set of every material it used (issue 16 §7).
#include "analysis/report_materials.hpp"

#include <algorithm>

#include "materials/material_library.hpp"
#include "support/layouts.hpp"

namespace {

const rv::MaterialDataReport* set_named(const rv::RendezvousReport& r, const std::string& name) {
    const auto it = std::find_if(r.materials.begin(), r.materials.end(),
                                 [&](const rv::MaterialDataReport& m) { return m.name == name; });
    return it == r.materials.end() ? nullptr : &*it;
}

}  // namespace

TEST_CASE("the report names every data set it used with its range", "[report][materials]") {
    const rv::Layout l = rv::test::bundled_layout("sfg-bbo.json");
    const rv::MaterialLibrary& library = rv::material_library_for(l);
    const rv::RendezvousReport r = rv::build_report(l, library);
    // Every element a beam meets that carries a material appears under its resolved set, with
    // the set's own range (the library's, which each set's comment ties to its paper).
    for (const rv::ReportBeam& b : r.beams)
        for (const std::string& id : b.element_ids)
            for (const rv::Element& e : l.elements)
                if (e.id == id)
                    if (const auto* x = std::get_if<rv::Crystal>(&e.kind)) {
                        const rv::Material* m = library.find(x->material);
                        REQUIRE(m != nullptr);
                        const rv::MaterialDataReport* d = set_named(r, m->name);
                        REQUIRE(d != nullptr);
                        CHECK(d->min_wavelength_nm == m->min_wavelength_nm);
                        CHECK(d->max_wavelength_nm == m->max_wavelength_nm);
                        CHECK(d->source == m->source);
                        CHECK(std::find(d->used_by.begin(), d->used_by.end(), id) != d->used_by.end());
                    }
    // The air of the paths is a data set too; each set is listed once.
    const rv::Material* air = library.find("air");
    REQUIRE(air != nullptr);
    REQUIRE(set_named(r, air->name) != nullptr);
    for (const rv::MaterialDataReport& m : r.materials)
        CHECK(std::count_if(r.materials.begin(), r.materials.end(),
                            [&](const rv::MaterialDataReport& o) { return o.name == m.name; }) == 1);
    // The demo's lenses are glass: at least one glass set besides air and the crystal.
    CHECK(r.materials.size() >= 3);
}
