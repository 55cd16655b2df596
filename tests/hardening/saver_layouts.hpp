#pragma once
// The two layouts the saver alternates between: random valid layouts of clearly different
// sizes (so that a file cut short or mixed from both is caught), read through the real reader.
#include <stdexcept>

#include "hardening/random_layout.hpp"
#include "io/layout_reader.hpp"

namespace rv::hardening {

inline Layout saver_layout(int which) {
    RandomLayoutOptions options;
    options.allow_single_beam = false;
    options.max_folds = which == 0 ? 1 : 6;
    options.max_inline_per_leg = which == 0 ? 1 : 6;
    const LayoutReadResult r = read_layout(random_layout(which == 0 ? 11 : 12, options).dump());
    if (!r.layout) throw std::logic_error("a saver layout does not read");
    return *r.layout;
}

}  // namespace rv::hardening
