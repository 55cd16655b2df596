#include "layout/layout.hpp"

#include <string_view>
#include <unordered_map>

#include "layout/visit.hpp"

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

const DamageThreshold* damage_threshold_of(const ElementKind& kind) {
    struct Damage {
        const DamageThreshold* operator()(const Lens&) const { return nullptr; }
        const DamageThreshold* operator()(const Mirror&) const { return nullptr; }
        const DamageThreshold* operator()(const Dichroic&) const { return nullptr; }
        const DamageThreshold* operator()(const Plate&) const { return nullptr; }
        const DamageThreshold* operator()(const Retroreflector&) const { return nullptr; }
        const DamageThreshold* operator()(const Stage&) const { return nullptr; }
        const DamageThreshold* operator()(const Crystal& c) const { return &c.damage; }
        const DamageThreshold* operator()(const Target& t) const { return &t.damage; }
        const DamageThreshold* operator()(const Dump&) const { return nullptr; }
    };
    return std::visit(Damage{}, kind);
}

bool walks_reflected_beam(const ElementKind& kind) {
    return std::visit(overloaded{[](const Lens&) { return false; }, [](const Mirror&) { return true; },
                                 [](const Dichroic&) { return true; }, [](const Plate&) { return false; },
                                 [](const Retroreflector&) { return false; },  // returns it parallel
                                 [](const Stage&) { return false; }, [](const Crystal&) { return false; },
                                 [](const Target&) { return false; }, [](const Dump&) { return false; }},
                      kind);
}

bool can_be_target(const ElementKind& kind) {
    return std::visit(overloaded{[](const Lens&) { return false; }, [](const Mirror&) { return false; },
                                 [](const Dichroic&) { return false; }, [](const Plate&) { return false; },
                                 [](const Retroreflector&) { return false; }, [](const Stage&) { return false; },
                                 [](const Crystal&) { return true; }, [](const Target&) { return true; },
                                 [](const Dump&) { return false; }},
                      kind);
}

const Element* Layout::find(const std::string& id) const {
    for (const Element& e : elements)
        if (e.id == id) return &e;
    return nullptr;
}

Vec2 stage_shift_mm(const Stage& stage) { return stage.position_mm * direction_deg(stage.axis_deg); }

std::vector<Vec2> placed_positions_mm(const Layout& layout) {
    std::vector<Vec2> at(layout.elements.size());
    for (size_t i = 0; i < layout.elements.size(); ++i) at[i] = layout.elements[i].at_mm;
    // Ids to indices once (issue 19 §3: a search per carried id was quadratic). Every element
    // of an id moves with the stage, as the search did (the reader refuses a repeated id).
    std::unordered_multimap<std::string_view, size_t> index;
    index.reserve(layout.elements.size());
    for (size_t i = 0; i < layout.elements.size(); ++i) index.emplace(layout.elements[i].id, i);
    for (const Element& e : layout.elements)
        if (const auto* s = std::get_if<Stage>(&e.kind))
            for (const std::string& id : s->carries) {
                const auto [first, last] = index.equal_range(id);
                for (auto it = first; it != last; ++it) at[it->second] += stage_shift_mm(*s);
            }
    return at;
}

}  // namespace rv
