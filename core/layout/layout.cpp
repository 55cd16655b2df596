#include "layout/layout.hpp"

namespace rv {

const char* type_name(const ElementKind& kind) {
    struct Names {
        const char* operator()(const Lens&) const { return "lens"; }
        const char* operator()(const Mirror&) const { return "mirror"; }
        const char* operator()(const Dichroic&) const { return "dichroic"; }
        const char* operator()(const Plate&) const { return "plate"; }
        const char* operator()(const Retroreflector&) const { return "retroreflector"; }
        const char* operator()(const Stage&) const { return "stage"; }
        const char* operator()(const Crystal&) const { return "crystal"; }
        const char* operator()(const Target&) const { return "target"; }
        const char* operator()(const Dump&) const { return "dump"; }
    };
    return std::visit(Names{}, kind);
}

const Element* Layout::find(const std::string& id) const {
    for (const Element& e : elements)
        if (e.id == id) return &e;
    return nullptr;
}

}  // namespace rv
