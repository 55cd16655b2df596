#pragma once
// The dispersion data sets a report used (issue 16 §7, every figure names its data): each
// material of an element a beam meets, and the air of the paths, as the library resolves it.
#include <vector>

#include "analysis/report.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

std::vector<MaterialDataReport> materials_used(const Layout& layout, const MaterialLibrary& library,
                                               const std::vector<ReportBeam>& beams);

}  // namespace rv
