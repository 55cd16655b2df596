#pragma once
// The table scene as an SVG drawing at true scale (1 user unit = 1 mm; printed at 100 % the
// breadboard is its real size), with a title block, legend and scale bar.
#include <string>

#include "scene/scene.hpp"

namespace rv::scene {

std::string write_svg(const Scene& scene);

}  // namespace rv::scene
