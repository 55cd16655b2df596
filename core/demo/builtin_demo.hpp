#pragma once
// The demo built into the program, so the main job runs from any folder. It is our own
// scenario (not taken from any course or product): a 1030 nm pump and a 780 nm signal, each
// collimated by its own arm, focused together by one N-BK7 plano-convex singlet into the
// crystal of a sum-frequency stage. Until layout files are read, the demo is this value.

#include "analysis/chromatic_focus.hpp"

namespace rv {

ChromaticFocusCase builtin_demo_focus_case();

}  // namespace rv
