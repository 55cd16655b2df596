#pragma once
// The element kinds by their file names ("lens", "mirror", …): one list, derived from
// ElementKind's alternatives and type_name (layout.hpp), so that the reader's dispatch, its
// "expected one of …" message and the viewer's Add menu can never miss a kind.

#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "layout/layout.hpp"

namespace rv {

// Every kind's type name, in ElementKind's order.
const std::vector<std::string>& element_type_names();

// A default-constructed kind for a type name; nullopt for a name that is no kind.
std::optional<ElementKind> element_kind_named(std::string_view type);

// "lens, mirror, …, dump": the names for an "expected one of" message.
std::string element_type_list();

}  // namespace rv
