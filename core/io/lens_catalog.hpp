#pragma once
// The lens catalog (layouts/lenses.json, format "rendezvous-lens-catalog"): stock lenses the
// solver may choose from. Singlets become thick lenses of their shape and centre thickness
// (radii from the lensmaker's equation at their design wavelength); achromats ideal thin lenses
// (no chromatic shift to first order); mirrors are not lenses and are left out.

#include <filesystem>
#include <string>
#include <string_view>
#include <vector>

#include "io/diagnostic.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

struct CatalogLens {
    std::string id;
    double focal_length_mm = 0;
    double diameter_mm = 0;
    Lens lens;  // the model as an element would hold it
};

struct CatalogReadResult {
    std::vector<CatalogLens> lenses;
    Diagnostics diagnostics;
};

CatalogReadResult read_lens_catalog(const std::filesystem::path& path, const MaterialLibrary& library);
CatalogReadResult parse_lens_catalog(std::string_view text, const MaterialLibrary& library);

}  // namespace rv
