#pragma once
// When a pulse reaches a point of its path: emission time plus the group delay of every
// segment (length × absolute group index / c; air by Ciddor 1996, glass and crystals by their
// own dispersion, the extraordinary wave at its angle) plus, for each thick singlet met as one
// plane, its centre thickness × (n_g,glass − n_g,air)/c. Thin lenses add no glass.
// Reference: group delay τ_g = n_g L / c, Diels & Rudolph (2006) ch. 1; c exact (BIPM).

#include "layout/layout.hpp"
#include "trace/path.hpp"

namespace rv {

// Arrival time at hit `hit_index` (inclusive of the segments that end there), fs: the trace
// sums the group delays as it goes (TraceHit::group_delay_fs).
double arrival_time_fs(const Layout& layout, const Path& path, size_t hit_index);

// Arrival time at a point `into_mm` from the start of segment `segment` (clamped to the
// segment), fs: the delay where the segment ends less the rest of it at its group index; a
// segment with no hit at its end (the last, to the table's edge) counts from its start, the
// previous hit's delay plus that hit's lumped glass (against this segment's medium, air).
double arrival_time_along_fs(const Layout& layout, const Path& path, size_t segment, double into_mm);

}  // namespace rv
