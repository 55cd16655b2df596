#include "trace/placed_optics.hpp"

#include <cmath>
#include <variant>

#include "layout/visit.hpp"

namespace rv {

double slab_thickness(const ElementKind& kind) {
    return std::visit(overloaded{[](const Plate& p) { return p.slab.thickness_mm; },
                                 [](const Crystal& c) { return c.length_mm; },
                                 [](const Dichroic& d) { return d.substrate.thickness_mm; },
                                 [](const Lens&) { return 0.0; }, [](const Mirror&) { return 0.0; },
                                 [](const Retroreflector&) { return 0.0; }, [](const Stage&) { return 0.0; },
                                 [](const Target&) { return 0.0; }, [](const Dump&) { return 0.0; }},
                      kind);
}

const std::string* material_name(const ElementKind& kind) {
    using Name = const std::string*;
    const auto lens_glass = [](const Lens& l) {
        return std::visit(overloaded{[](const IdealLens&) -> Name { return nullptr; },
                                     [](const ThinChromaticLens& t) -> Name { return &t.glass; },
                                     [](const ThickLens& t) -> Name { return &t.glass; }},
                          l.model);
    };
    return std::visit(overloaded{[](const Plate& p) -> Name { return &p.slab.material; },
                                 [](const Dichroic& d) -> Name { return &d.substrate.material; },
                                 [](const Crystal& c) -> Name { return &c.material; }, lens_glass,
                                 [](const Mirror&) -> Name { return nullptr; },
                                 [](const Retroreflector&) -> Name { return nullptr; },
                                 [](const Stage&) -> Name { return nullptr; },
                                 [](const Target&) -> Name { return nullptr; },
                                 [](const Dump&) -> Name { return nullptr; }},
                      kind);
}

int surfaces_of(const ElementKind& kind, const Vec2& at, const Vec2& normal, Surface out[3]) {
    const auto slab = [&](double thickness, bool centre_plane) {
        const double half = thickness / 2.0;
        out[0] = {Face::Front, at + half * normal, normal};
        out[1] = {Face::Back, at - half * normal, normal};
        if (!centre_plane) return 2;
        out[2] = {Face::Centre, at, normal};
        return 3;
    };
    const auto one = [&] {
        out[0] = {Face::Only, at, normal};
        return 1;
    };
    return std::visit(overloaded{[&](const Dichroic& d) {
                                     out[0] = {Face::Front, at, normal};
                                     out[1] = {Face::Back, at - d.substrate.thickness_mm * normal, normal};
                                     return 2;
                                 },
                                 [&](const Plate& p) { return slab(p.slab.thickness_mm, false); },
                                 [&](const Crystal& c) { return slab(c.length_mm, true); },
                                 [](const Stage&) { return 0; }, [&](const Lens&) { return one(); },
                                 [&](const Mirror&) { return one(); }, [&](const Retroreflector&) { return one(); },
                                 [&](const Target&) { return one(); }, [&](const Dump&) { return one(); }},
                      kind);
}

void PlacedOptic::turn_to(const ElementKind& kind, const Vec2& n) {
    normal = n;
    aim_pending = false;
    surface_count = surfaces_of(kind, at, normal, surfaces);
}

namespace {
std::optional<size_t> index_of(const Layout& layout, const std::string& id) {
    for (size_t i = 0; i < layout.elements.size(); ++i)
        if (layout.elements[i].id == id) return i;
    return std::nullopt;
}
}  // namespace

std::optional<size_t> IdLookup::find(const std::string& id) {
    if (!built_) {
        index_.reserve(layout_.elements.size());
        for (size_t i = 0; i < layout_.elements.size(); ++i) index_.try_emplace(layout_.elements[i].id, i);
        built_ = true;
    }
    const auto it = index_.find(id);
    return it == index_.end() ? std::nullopt : std::optional<size_t>(it->second);
}

std::optional<size_t> resolve_id(const Layout& layout, const std::string& id,
                                 std::optional<std::pair<std::string, size_t>>& slot, IdLookup* lookup) {
    if (!slot || slot->first != id || slot->second >= layout.elements.size() ||
        layout.elements[slot->second].id != id) {
        const std::optional<size_t> i = lookup ? lookup->find(id) : index_of(layout, id);
        if (!i) {
            slot.reset();
            return std::nullopt;
        }
        slot = std::make_pair(id, *i);
    }
    return slot->second;
}

namespace {

// One element where its stage (if any) has moved it by offset: normal, surfaces, bounding
// circle, material (the normal and the bounding radius recomputed only when their inputs changed).
void place_one(const Layout& layout, const MaterialLibrary& library, PlacementMemo& memo, PlacedOptic& pl,
               size_t i, const Vec2& offset, IdLookup& lookup) {
    const Element& e = layout.elements[i];
    const ElementKind& kind = e.kind;
    PlacementMemo::Resolved& r = memo.resolved[i];
    if (!(r.normal_deg == e.normal_deg)) {
        r.normal_deg = e.normal_deg;
        r.normal = direction_deg(e.normal_deg);
    }
    pl.at = e.at_mm + offset;
    pl.normal = r.normal;
    pl.half_aperture = e.aperture_mm / 2.0;
    pl.traced = !std::holds_alternative<Stage>(kind);
    pl.aim_pending = false;
    pl.aim_target.reset();
    pl.material = nullptr;
    if (const auto* m = std::get_if<Mirror>(&kind); m && m->aim_at) {
        pl.aim_target = resolve_id(layout, *m->aim_at, r.aim_target, &lookup);
        pl.aim_pending = pl.aim_target.has_value();
    }
    pl.surface_count = surfaces_of(kind, pl.at, pl.normal, pl.surfaces);
    const double thickness = slab_thickness(kind);
    if (r.reach_half_aperture_mm != pl.half_aperture || r.reach_thickness_mm != thickness) {
        r.reach_half_aperture_mm = pl.half_aperture;
        r.reach_thickness_mm = thickness;
        r.reach_mm = std::hypot(pl.half_aperture, thickness) + 1e-6;
    }
    pl.reach = r.reach_mm;
    if (const std::string* name = material_name(kind)) {
        if (r.material_name != *name || !r.material) {
            r.material_name = *name;
            r.material = library.find(*name);
        }
        pl.material = r.material;
    }
}

}  // namespace

void place_elements(const Layout& layout, const MaterialLibrary& library, PlacementMemo& memo,
                    std::vector<PlacedOptic>& placed, std::vector<uint8_t>* changed, bool links_same,
                    const std::vector<size_t>* changed_list) {
    const size_t n = layout.elements.size();
    placed.resize(n);
    memo.resolved.resize(n);
    std::vector<Vec2>& offset = memo.stage_offset_mm;  // where each element's stage moves it
    std::vector<Vec2>& before = memo.stage_offset_before_mm;
    IdLookup lookup(layout);  // built only if a cached slot misses
    if (changed && links_same && changed_list) {
        for (size_t i : *changed_list) place_one(layout, library, memo, placed[i], i, offset[i], lookup);
        for (size_t i : memo.aim_mirrors) {
            if ((*changed)[i]) continue;
            PlacedOptic& pl = placed[i];
            pl.turn_to(layout.elements[i].kind, memo.resolved[i].normal);
            pl.aim_pending = true;
        }
        return;
    }
    std::swap(offset, before);
    offset.assign(n, Vec2(0, 0));
    for (size_t k = 0; k < n; ++k) {
        if (const auto* s = std::get_if<Stage>(&layout.elements[k].kind)) {
            auto& carried = memo.resolved[k].carried;
            carried.resize(s->carries.size());
            for (size_t c = 0; c < s->carries.size(); ++c) {
                std::optional<std::pair<std::string, size_t>> slot;
                if (!carried[c].first.empty()) slot = carried[c];
                if (auto i = resolve_id(layout, s->carries[c], slot, &lookup)) {
                    offset[*i] += stage_shift_mm(*s);
                    carried[c] = *slot;
                }
            }
        }
    }
    for (size_t i = 0; i < n; ++i) {
        if (changed) {
            if (before.size() != n || offset[i] != before[i]) (*changed)[i] = 1;
            const auto* m = std::get_if<Mirror>(&layout.elements[i].kind);
            if (!(*changed)[i] && !(m && m->aim_at)) continue;
        }
        place_one(layout, library, memo, placed[i], i, offset[i], lookup);
    }
    memo.aim_mirrors.clear();
    for (size_t i = 0; i < n; ++i)
        if (placed[i].aim_target) memo.aim_mirrors.push_back(i);
}

}  // namespace rv
