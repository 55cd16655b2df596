#pragma once
#include <iosfwd>
#include <optional>
#include <string>

#include "layout/layout.hpp"

namespace rv::cli {

// Reads a layout file; prints every diagnostic to `err` as "FILE: error: POINTER: MESSAGE".
// Returns the layout when there is no error.
std::optional<Layout> load_layout(const std::string& path, std::ostream& err);

// Saves a layout atomically; on failure prints "rendezvous: error: …" and returns false.
bool save_layout_or_report(const Layout& layout, const std::string& path, std::ostream& err);

// The SFG demo (layouts/sfg-bbo.json) built into the program.
Layout demo_layout();
const char* demo_layout_text();

// layouts/lenses.json, built into the program: the solver's default catalog.
const char* lens_catalog_text();

}  // namespace rv::cli
