#pragma once
#include <iosfwd>
#include <optional>
#include <string>

#include "io/atomic_file.hpp"
#include "layout/layout.hpp"

namespace rv::cli {

// Reads a layout file; prints every diagnostic to `err` as "FILE: error: POINTER: MESSAGE".
// Returns the layout when there is no error.
std::optional<Layout> load_layout(const std::string& path, std::ostream& err);

// Where a command's layout goes: "-" is standard output (`out`), any other path a file written
// by rv::save_layout with `rules` (io/atomic_file.hpp: through links, never over a device, a
// directory or a hard-linked file, read back before it replaces anything). A layout holding NaN
// or infinity goes nowhere. On failure prints "rendezvous: cannot write PATH: REASON" and returns
// false (the command then exits 2).
bool save_layout_or_report(const Layout& layout, const std::string& path,
                           const SafeWriteRules& rules, std::ostream& out, std::ostream& err);

// Before a long computation: whether `path` ("-" always can) could be written with `rules`, by
// rv::check_file_writable; prints "rendezvous: cannot write PATH: REASON" and returns false when
// not (the command then exits 2 before it computes anything).
bool destination_writable_or_report(const std::string& path, const SafeWriteRules& rules, std::ostream& err);

// The rules of a command that reads `input` and writes a new layout: the new layout must not
// replace the input, however its path is spelled.
SafeWriteRules keep_input(const std::string& input);

// The SFG demo (layouts/sfg-bbo.json) built into the program.
Layout demo_layout();
const char* demo_layout_text();

// layouts/lenses.json, built into the program: the solver's default catalog.
const char* lens_catalog_text();

}  // namespace rv::cli
