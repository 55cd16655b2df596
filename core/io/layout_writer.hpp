#pragma once
// Writing a layout: one canonical text for a layout value. Keys in the documented order, a key
// left out when it holds its default, integral numbers without a decimal point, other numbers
// in the shortest form that reads back to the same double; one beam, element or material a
// line. Reading that text gives an equal layout, and writing it again gives the same bytes.

#include <filesystem>
#include <string>
#include <string_view>

#include "io/atomic_file.hpp"
#include "layout/layout.hpp"

namespace rv {

// A value that is NaN or infinite comes out as null (JSON has neither): check
// unwritable_reason first wherever the text leaves the program.
std::string write_layout(const Layout& layout);

// Why the layout cannot be written ("" when it can): the JSON pointer of a value that is not a
// finite number.
std::string unwritable_reason(const Layout& layout);

// Why `text` does not read back as a layout ("" when it does): the first error of read_layout.
std::string unreadable_reason(std::string_view text);

// Writes through write_file_safely (io/atomic_file.hpp) with `rules`, refusing a layout
// unwritable_reason refuses and checking that the bytes read back are a layout
// (unreadable_reason) before they replace the file. Throws std::runtime_error, one line naming
// the path, on a refusal or failure; nothing is written then.
void save_layout(const Layout& layout, const std::filesystem::path& path,
                 SafeWriteRules rules = {});

}  // namespace rv
