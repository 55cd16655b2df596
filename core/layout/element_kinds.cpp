#include "layout/element_kinds.hpp"

#include <utility>

namespace rv {

namespace {

template <size_t... I>
std::vector<ElementKind> every_kind(std::index_sequence<I...>) {
    return {ElementKind(std::in_place_index<I>)...};
}

const std::vector<ElementKind>& default_kinds() {
    static const std::vector<ElementKind> kinds =
        every_kind(std::make_index_sequence<std::variant_size_v<ElementKind>>{});
    return kinds;
}

}  // namespace

const std::vector<std::string>& element_type_names() {
    static const std::vector<std::string> names = [] {
        std::vector<std::string> n;
        for (const ElementKind& k : default_kinds()) n.emplace_back(type_name(k));
        return n;
    }();
    return names;
}

std::optional<ElementKind> element_kind_named(std::string_view type) {
    for (const ElementKind& k : default_kinds())
        if (type == type_name(k)) return k;
    return std::nullopt;
}

std::string element_type_list() {
    std::string list;
    for (const std::string& n : element_type_names()) list += (list.empty() ? "" : ", ") + n;
    return list;
}

}  // namespace rv
