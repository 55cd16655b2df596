#include "io/lens_catalog.hpp"

#include <nlohmann/json.hpp>

#include "io/bounded_read.hpp"
#include "io/field_reader.hpp"
#include "io/layout_reader.hpp"
#include "layout/lens_shape.hpp"
#include "materials/dispersion.hpp"

namespace rv {

CatalogReadResult read_lens_catalog(const std::filesystem::path& path, const MaterialLibrary& library) {
    CatalogReadResult out;
    // The same bound as a layout's (a catalog of thousands of lenses is far below it).
    const BoundedRead file = read_file_bounded(path, kMaxLayoutBytes, "a lens catalog");
    if (!file.ok()) {
        out.diagnostics.push_back({Diagnostic::Severity::Error, "", 0, 0, file.error});
        return out;
    }
    return parse_lens_catalog(file.text, library);
}

CatalogReadResult parse_lens_catalog(std::string_view text, const MaterialLibrary& library) {
    CatalogReadResult out;
    nlohmann::json doc;
    Diagnostics duplicates;
    try {
        doc = parse_json_limited(text, 16, duplicates);
    } catch (const JsonTooDeep&) {
        out.diagnostics.push_back({Diagnostic::Severity::Error, "", 0, 0, "the catalog nests deeper than 16 levels"});
        return out;
    } catch (const nlohmann::json::exception& e) {  // parse errors and out-of-range numbers
        out.diagnostics.push_back({Diagnostic::Severity::Error, "", 0, 0, std::string("cannot read the catalog: ") + e.what()});
        return out;
    }
    if (!duplicates.empty()) {  // which of the values was meant is unknown: no catalog
        out.diagnostics = std::move(duplicates);
        return out;
    }
    FieldReader root(doc, "", "a lens catalog", out.diagnostics);
    if (const auto f = root.string("format", Need::Required); f && *f != "rendezvous-lens-catalog")
        root.error("format", "expected \"rendezvous-lens-catalog\", found \"" + *f + "\"");
    const nlohmann::json* lenses = root.array("lenses", Need::Required);
    if (!lenses) return out;
    for (size_t i = 0; i < lenses->size(); ++i) {
        const nlohmann::json& item = (*lenses)[i];
        FieldReader f(item, child_pointer("/lenses", i), "a catalog lens", out.diagnostics);
        const auto id = f.id("id", Need::Required);
        const auto kind = f.choice("kind", Need::Required, {"singlet", "achromat", "concave-mirror"});
        const auto focal = f.number("focal_length_mm", Need::Required, non_zero_length_mm());
        const auto diameter = f.number("diameter_mm", Need::Required, positive_length_mm());
        if (!id || !kind || !focal || !diameter || *kind == "concave-mirror") continue;
        CatalogLens c{*id, *focal, *diameter, Lens{IdealLens{*focal}}};
        if (*kind == "singlet") {
            const auto glass = f.string("glass", Need::Required);
            const auto shape = f.choice("shape", Need::Required, lens_shape_names());
            const auto t = f.number("center_thickness_mm", Need::Required, positive_length_mm());
            const double design = f.wavelength_nm("design_wavelength_nm", Need::Optional).value_or(587.6);
            const Material* g = glass ? library.find(*glass) : nullptr;
            if (!g || !shape || !t) {
                if (glass && !g) f.error("glass", "unknown material \"" + *glass + "\"");
                continue;
            }
            std::string why;
            const auto radii = radii_for_shape(*shape, *focal, *t, sample_index(*g, design).index, &why);
            if (!radii) {
                f.error("focal_length_mm", "no " + *shape + " lens has this focal length: " + why);
                continue;
            }
            c.lens = Lens{ThickLens{radii->front_radius_mm, radii->back_radius_mm, *t, *glass, *shape, *focal, design}};
        }
        out.lenses.push_back(std::move(c));
    }
    return out;
}

}  // namespace rv
