#pragma once
// Writing a layout: one canonical text for a layout value. Keys in the documented order, a key
// left out when it holds its default, integral numbers without a decimal point, other numbers
// in the shortest form that reads back to the same double; one beam, element or material a
// line. Reading that text gives an equal layout, and writing it again gives the same bytes.

#include <filesystem>
#include <string>

#include "layout/layout.hpp"

namespace rv {

std::string write_layout(const Layout& layout);

// Writes atomically (io/atomic_file.hpp). Throws std::runtime_error naming the path on failure.
void save_layout(const Layout& layout, const std::filesystem::path& path);

}  // namespace rv
