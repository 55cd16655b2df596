#include "demo/builtin_demo.hpp"

namespace rv {

ChromaticFocusCase builtin_demo_focus_case() {
    ChromaticFocusCase c;
    c.name = "SFG of 1030 nm and 780 nm in BBO (built-in demo)";
    // Plano-convex, convex side first: R1 = 77.5 mm, flat back, 4 mm thick (f ≈ 150 mm at d).
    c.lens = {"L_focus", "N-BK7", {77.5, kFlat, 4.0}};
    c.beams = {
        {"pump", 1030.0, 1100.0, 420.0, 1.1},
        {"signal", 780.0, 900.0, 560.0, 1.2},
    };
    return c;
}

}  // namespace rv
