#pragma once
// The elements of a layout as the tracer meets them: each where its stage (if any) has moved
// it, turned, with its surfaces, its bounding circle and its material. Placing is once per
// trace; a retrace places anew only what changed (trace_cache.hpp).

#include <optional>
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

#include "layout/layout.hpp"
#include "materials/material.hpp"
#include "materials/material_library.hpp"
#include "trace/path.hpp"

namespace rv {

// A surface of an element: a segment through `centre` perpendicular to `normal`, of the
// element's aperture.
struct Surface {
    Face face = Face::Only;
    Vec2 centre{0, 0};
    Vec2 normal{1, 0};
};

struct PlacedOptic {
    Vec2 at{0, 0};
    Vec2 normal{1, 0};
    double half_aperture = 0;
    bool traced = true;        // false for stages (no surface)
    bool aim_pending = false;  // an aim_at mirror no beam has reached yet (the first one turns it)
    std::optional<size_t> aim_target;
    Surface surfaces[3];
    int surface_count = 0;
    double reach = 0;  // radius of a circle about `at` that holds every surface segment
    const Material* material = nullptr;  // slab, substrate or lens glass (owned by the cache's library)
    // Turn the element to `n` (an aim_at mirror when a beam first reaches it, or as a kept
    // step of a retrace had turned it).
    void turn_to(const ElementKind& kind, const Vec2& n);
};

// The surfaces of a placed element into out (at most 3), their count. Plates and crystals:
// faces at ±t/2 along the normal (Front on the +normal side), crystals also their centre plane;
// dichroics: the coated face at `at` (Front) and the back face t behind it; stages: none; every
// other kind one surface at `at`.
int surfaces_of(const ElementKind& kind, const Vec2& at, const Vec2& normal, Surface out[3]);

// The thickness along the normal of a slab (plate, crystal, dichroic substrate), 0 otherwise.
double slab_thickness(const ElementKind& kind);

// The name of the material an element is made of (a slab, a substrate, a lens glass), if any.
const std::string* material_name(const ElementKind& kind);

// What placing remembers per element so that an unchanged one costs no lookup or trigonometry:
// the elements a stage carries, an aim_at mirror's target and the material, resolved by name
// (checked against the layout's names on every use); the unit normal of the last normal_deg
// seen; the bounding radius of the last aperture and thickness seen.
struct PlacementMemo {
    struct Resolved {
        std::vector<std::pair<std::string, size_t>> carried;
        std::optional<std::pair<std::string, size_t>> aim_target;
        std::string material_name;
        const Material* material = nullptr;
        double normal_deg = std::numeric_limits<double>::quiet_NaN();
        Vec2 normal{1, 0};
        double reach_half_aperture_mm = -1, reach_thickness_mm = -1, reach_mm = 0;
    };
    std::vector<Resolved> resolved;
    std::vector<Vec2> stage_offset_mm, stage_offset_before_mm;  // how far stages move each element
    std::vector<size_t> aim_mirrors;  // the mirrors with a resolved aim_at
};

// Ids to element indices, built on the first lookup (once per placement), so that resolving
// every stage's and aim_at mirror's ids is linear in the layout, not a search each (issue 19
// §3: a 100 000-element aim_at chain took minutes). The first element of an id wins, as the
// search did.
class IdLookup {
public:
    explicit IdLookup(const Layout& layout) : layout_(layout) {}
    std::optional<size_t> find(const std::string& id);

private:
    const Layout& layout_;
    std::unordered_map<std::string_view, size_t> index_;
    bool built_ = false;
};

// An element id looked up through a cached slot: the cached index while the element there
// still has that id, else a search (through `lookup` when given; the slot then holds what it
// found).
std::optional<size_t> resolve_id(const Layout& layout, const std::string& id,
                                 std::optional<std::pair<std::string, size_t>>& slot,
                                 IdLookup* lookup = nullptr);

// Every element where stages have moved it, into `placed` (once per trace of the layout).
// With `changed` (a retrace): only the elements flagged there, those a stage now moves by
// another amount (flagged too) and the aim_at mirrors (the tracer turns them) are placed anew;
// the others keep the placement of the previous trace. `links_same`: no stage, name or aim_at
// changed since the previous retrace, so every stage moves what it did by as much and every
// aim_at mirror aims where it did; then only the elements in `changed_list` are placed and the
// unchanged aim_at mirrors have their turn undone.
void place_elements(const Layout& layout, const MaterialLibrary& library, PlacementMemo& memo,
                    std::vector<PlacedOptic>& placed, std::vector<uint8_t>* changed = nullptr,
                    bool links_same = false, const std::vector<size_t>* changed_list = nullptr);

}  // namespace rv
