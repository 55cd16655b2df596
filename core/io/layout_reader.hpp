#pragma once
// Reading a layout file: JSON syntax, then every key and value, then the references between
// them, all reported in one pass as located diagnostics. A layout comes back only when there
// is no error (warnings may stand beside it).

#include <filesystem>
#include <optional>
#include <string_view>

#include "io/diagnostic.hpp"
#include "layout/layout.hpp"
#include "materials/material_library.hpp"

namespace rv {

// Larger inputs are refused unread (a table of thousands of optics is far below this).
inline constexpr std::size_t kMaxLayoutBytes = 16u << 20;
inline constexpr int kMaxLayoutDepth = 64;  // JSON nesting levels

struct LayoutReadResult {
    std::optional<Layout> layout;
    Diagnostics diagnostics;
};

LayoutReadResult read_layout(std::string_view text);

// Reads a file; an unreadable file is one diagnostic naming it.
LayoutReadResult read_layout_file(const std::filesystem::path& path);

// The built-in materials plus the layout's own.
MaterialLibrary material_library_for(const Layout& layout);

}  // namespace rv
