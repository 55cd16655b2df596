#pragma once
// Balancing the delay: where to put the stage for zero delay, and when that lies outside its
// travel, how much fixed air path to add to which arm (single pass, n_g of standard air).

#include <optional>
#include <string>

#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

struct BalanceResult {
    Layout layout;                 // the stage set to the zero (or to the nearest travel end)
    std::string stage;             // "" when the layout has no stage in either arm
    double delay_before_fs = 0;    // arrival of beam 1 − beam 2 as the layout is
    double zero_delay_mm = 0;      // stage position for zero delay
    bool zero_in_travel = false;
    double stage_set_mm = 0;       // where the new layout puts the stage
    double residual_delay_fs = 0;  // delay left with the stage there
    double add_path_mm = 0;        // fixed air path that removes the residual (0 when none)
    std::string add_path_to;       // the beam that arrives early and needs it
};

// Throws std::invalid_argument when the layout does not have two beams that reach the target.
BalanceResult balance_delay(const Layout& layout, const MaterialLibrary& library);

}  // namespace rv
