#include "io/lens_parts.hpp"

#include <algorithm>
#include <cmath>

#include "io/closest_name.hpp"
#include "io/field_reader.hpp"
#include "layout/visit.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

bool same_number(double a, double b) {
    if (a == b) return true;  // infinities (flat faces) included
    return std::abs(a - b) <= 1e-9 * std::max(std::abs(a), std::abs(b));
}

const char* model_name(const Lens& lens) {
    return std::visit(overloaded{
                          [](const IdealLens&) { return "an ideal thin lens"; },
                          [](const ThinChromaticLens&) { return "a thin lens of a glass"; },
                          [](const ThickLens&) { return "a thick singlet"; },
                      },
                      lens.model);
}

struct Differences {
    std::vector<std::string> out;
    // A face radius may be infinite (flat): said as "flat", never printed as a number.
    static std::string value(double v, const char* unit) {
        return std::isfinite(v) ? format_number("%.6g", v) + " " + unit : std::string("flat");
    }
    void number(const char* what, double catalog, double here, const char* unit) {
        if (!same_number(catalog, here))
            out.push_back(std::string(what) + " " + value(catalog, unit) + " in the catalog, " +
                          value(here, unit) + " here");
    }
    void text(const char* what, const std::string& catalog, const std::string& here) {
        if (catalog != here)
            out.push_back(std::string(what) + " \"" + catalog + "\" in the catalog, \"" + here +
                          "\" here");
    }
};

}  // namespace

std::vector<std::string> part_differences(const CatalogLens& part, const Element& element) {
    Differences d;
    const Lens& here = std::get<Lens>(element.kind);
    if (part.lens.model.index() != here.model.index()) {
        d.out.push_back(std::string(model_name(part.lens)) + " in the catalog, " +
                        model_name(here) + " here");
    } else {
        // The same model on both sides (the indices agree): compare its numbers.
        std::visit(overloaded{
                       [&](const IdealLens& a) {
                           d.number("focal length", a.focal_length_mm, std::get<IdealLens>(here.model).focal_length_mm, "mm");
                       },
                       [&](const ThinChromaticLens& a) {
                           const auto& b = std::get<ThinChromaticLens>(here.model);
                           d.number("focal length", a.focal_length_mm, b.focal_length_mm, "mm");
                           d.text("glass", a.glass, b.glass);
                           d.number("design wavelength", a.design_wavelength_nm, b.design_wavelength_nm, "nm");
                       },
                       [&](const ThickLens& a) {
                           const auto& b = std::get<ThickLens>(here.model);
                           if (a.shape && b.shape) d.text("shape", *a.shape, *b.shape);  // radii decide otherwise
                           d.number("front radius", a.front_radius_mm, b.front_radius_mm, "mm");
                           d.number("back radius", a.back_radius_mm, b.back_radius_mm, "mm");
                           d.number("centre thickness", a.center_thickness_mm, b.center_thickness_mm, "mm");
                           d.text("glass", a.glass, b.glass);
                           d.number("design wavelength", a.design_wavelength_nm, b.design_wavelength_nm, "nm");
                       },
                   },
                   part.lens.model);
    }
    d.number("diameter (aperture_mm)", part.diameter_mm, element.aperture_mm, "mm");
    return d.out;
}

Diagnostics check_lens_parts(const Layout& layout, const std::vector<CatalogLens>& catalog,
                             const std::vector<std::string>& skip) {
    Diagnostics out;
    std::vector<std::string> ids;
    for (const CatalogLens& c : catalog) ids.push_back(c.id);
    for (size_t i = 0; i < layout.elements.size(); ++i) {
        const Element& e = layout.elements[i];
        const auto* lens = std::get_if<Lens>(&e.kind);
        if (!lens || !lens->part || std::find(skip.begin(), skip.end(), e.id) != skip.end())
            continue;
        const std::string pointer = child_pointer(child_pointer("/elements", i), "part");
        const auto found = std::find_if(catalog.begin(), catalog.end(),
                                        [&](const CatalogLens& c) { return c.id == *lens->part; });
        if (found == catalog.end()) {
            std::string m = "no lens of the catalog has id \"" + *lens->part + "\"";
            if (const auto near = closest_name(*lens->part, ids))
                m += "; did you mean \"" + *near + "\"?";
            m += " (remove \"part\", or use the catalog it came from)";
            out.push_back({Diagnostic::Severity::Error, pointer, 0, 0, m, e.id});
            continue;
        }
        const std::vector<std::string> diff = part_differences(*found, e);
        if (diff.empty()) continue;
        std::string m = "the catalog's \"" + *lens->part + "\" is not this lens: ";
        for (size_t k = 0; k < diff.size(); ++k) m += (k ? "; " : "") + diff[k];
        m += " (remove \"part\" if the lens is not that stock lens, or give it the catalog's "
             "numbers)";
        out.push_back({Diagnostic::Severity::Error, pointer, 0, 0, m, e.id});
    }
    return out;
}

}  // namespace rv
