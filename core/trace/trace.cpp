#include "trace/trace.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <numeric>
#include <utility>

#include "materials/dispersion.hpp"
#include "nonlinear/phase_matching.hpp"
#include "optics/thick_lens.hpp"
#include "trace/crystal_axes.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

constexpr double kEps_mm = 1e-9;
constexpr double kInf = std::numeric_limits<double>::infinity();


using Surface = TraceCache::Surface;
using Placed = TraceCache::Placed;

int surfaces_of(const ElementKind& kind, const Vec2& at, const Vec2& normal, Surface out[3]);
double slab_thickness(const ElementKind& kind);

const std::string* material_name(const ElementKind& kind) {
    if (const auto* p = std::get_if<Plate>(&kind)) return &p->slab.material;
    if (const auto* d = std::get_if<Dichroic>(&kind)) return &d->substrate.material;
    if (const auto* c = std::get_if<Crystal>(&kind)) return &c->material;
    if (const auto* l = std::get_if<Lens>(&kind)) {
        if (const auto* t = std::get_if<ThickLens>(&l->model)) return &t->glass;
        if (const auto* t = std::get_if<ThinChromaticLens>(&l->model)) return &t->glass;
    }
    return nullptr;
}

std::optional<size_t> index_of(const Layout& layout, const std::string& id) {
    for (size_t i = 0; i < layout.elements.size(); ++i)
        if (layout.elements[i].id == id) return i;
    return std::nullopt;
}

// An id looked up through the cache: the cached index while the element there still has it.
std::optional<size_t> resolve(const Layout& layout, const std::string& id,
                              std::optional<std::pair<std::string, size_t>>& slot) {
    if (!slot || slot->first != id || slot->second >= layout.elements.size() ||
        layout.elements[slot->second].id != id) {
        const std::optional<size_t> i = index_of(layout, id);
        if (!i) {
            slot.reset();
            return std::nullopt;
        }
        slot = std::make_pair(id, *i);
    }
    return slot->second;
}

// One element where its stage (if any) has moved it by offset: normal, surfaces, bounding
// circle, material (the normal and the bounding radius recomputed only when their inputs changed).
void place_one(const Layout& layout, const MaterialLibrary& library, TraceCache& cache, size_t i, const Vec2& offset) {
    const Element& e = layout.elements[i];
    const ElementKind& kind = e.kind;
    TraceCache::Resolved& r = cache.resolved[i];
    Placed& pl = cache.placed[i];
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
        pl.aim_target = resolve(layout, *m->aim_at, r.aim_target);
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

// Every element where stages have moved it, into cache.placed (once per trace of the layout).
// With `changed` (a retrace): only the elements flagged there, those a stage now moves by
// another amount (flagged too) and the aim_at mirrors (the tracer turns them) are placed anew;
// the others keep the placement of the previous trace. `links_same`: no stage, name or aim_at
// changed since the previous retrace, so every stage moves what it did by as much, every aim_at
// mirror aims where it did, and an unchanged one only needs its turn undone; the changed
// elements are those listed in cache.changed.
void place(const Layout& layout, const MaterialLibrary& library, TraceCache& cache,
           std::vector<uint8_t>* changed = nullptr, bool links_same = false) {
    const size_t n = layout.elements.size();
    cache.placed.resize(n);
    cache.resolved.resize(n);
    std::vector<Vec2>& offset = cache.stage_offset_mm;  // where each element's stage moves it
    std::vector<Vec2>& before = cache.stage_offset_before_mm;
    if (changed && links_same) {
        for (size_t i : cache.changed) place_one(layout, library, cache, i, offset[i]);
        for (size_t i : cache.aim_mirrors) {
            if ((*changed)[i]) continue;
            Placed& pl = cache.placed[i];
            pl.normal = cache.resolved[i].normal;
            pl.aim_pending = true;
            pl.surface_count = surfaces_of(layout.elements[i].kind, pl.at, pl.normal, pl.surfaces);
        }
        return;
    }
    std::swap(offset, before);
    offset.assign(n, Vec2(0, 0));
    for (size_t k = 0; k < n; ++k) {
        if (const auto* s = std::get_if<Stage>(&layout.elements[k].kind)) {
            auto& carried = cache.resolved[k].carried;
            carried.resize(s->carries.size());
            for (size_t c = 0; c < s->carries.size(); ++c) {
                std::optional<std::pair<std::string, size_t>> slot;
                if (!carried[c].first.empty()) slot = carried[c];
                if (auto i = resolve(layout, s->carries[c], slot)) {
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
        place_one(layout, library, cache, i, offset[i]);
    }
    cache.aim_mirrors.clear();
    for (size_t i = 0; i < n; ++i)
        if (cache.placed[i].aim_target) cache.aim_mirrors.push_back(i);
}

double slab_thickness(const ElementKind& kind) {
    if (const auto* p = std::get_if<Plate>(&kind)) return p->slab.thickness_mm;
    if (const auto* c = std::get_if<Crystal>(&kind)) return c->length_mm;
    if (const auto* d = std::get_if<Dichroic>(&kind)) return d->substrate.thickness_mm;
    return 0;
}

bool is_slab(const ElementKind& k) {
    return std::holds_alternative<Plate>(k) || std::holds_alternative<Crystal>(k) ||
           std::holds_alternative<Dichroic>(k);
}

// The surfaces of a placed element. Plates and crystals: faces at ±t/2 along the normal
// (Front on the +normal side), crystals also their centre plane; dichroics: the coated face at
// at_mm (Front) and the back face t behind it.
int surfaces_of(const ElementKind& kind, const Vec2& at, const Vec2& normal, Surface out[3]) {
    if (std::holds_alternative<Stage>(kind)) return 0;
    if (const auto* d = std::get_if<Dichroic>(&kind)) {
        out[0] = {Face::Front, at, normal};
        out[1] = {Face::Back, at - d->substrate.thickness_mm * normal, normal};
        return 2;
    }
    if (std::holds_alternative<Plate>(kind) || std::holds_alternative<Crystal>(kind)) {
        const double half = slab_thickness(kind) / 2.0;
        out[0] = {Face::Front, at + half * normal, normal};
        out[1] = {Face::Back, at - half * normal, normal};
        if (std::holds_alternative<Crystal>(kind)) {
            out[2] = {Face::Centre, at, normal};
            return 3;
        }
        return 2;
    }
    out[0] = {Face::Only, at, normal};
    return 1;
}

// Distance along the ray to the surface's line, and the signed height of the crossing.
bool cross_line(const Vec2& p, const Vec2& d, const Surface& s, double& dist, double& height) {
    const double dn = d.dot(s.normal);
    if (std::abs(dn) < 1e-12) return false;
    dist = (s.centre - p).dot(s.normal) / dn;
    height = (p + dist * d - s.centre).dot(perpendicular(s.normal));
    return true;
}

// Snell's law in vector form; nullopt on total internal reflection.
std::optional<Vec2> refract(const Vec2& d, const Vec2& surface_normal, double n1, double n2) {
    const Vec2 m = d.dot(surface_normal) < 0 ? surface_normal : Vec2(-surface_normal);
    const double cos_i = -m.dot(d);
    const double r = n1 / n2;
    const double sin2_t = r * r * (1.0 - cos_i * cos_i);
    if (sin2_t > 1.0) return std::nullopt;
    const double cos_t = std::sqrt(1.0 - sin2_t);
    return Vec2(r * d + (r * cos_i - cos_t) * m).normalized();
}

Vec2 reflect(const Vec2& d, const Vec2& n) { return d - 2.0 * d.dot(n) * n; }

using Medium = TraceCache::Medium;

// A sample from the cache when it was taken of the same material, else a fresh one.
template <class T, class Make>
T& cached(TraceCache::Tagged<T>& slot, const Material* material, int variant, Make make) {
    if (!slot.value || slot.material != material || slot.variant != variant) {
        slot.material = material;
        slot.variant = variant;
        slot.value = make();
    }
    return *slot.value;
}

// Distance from point c to the segment [a, b], squared.
double squared_distance_to_segment(const Vec2& c, const Vec2& a, const Vec2& b) {
    const Vec2 ab = b - a;
    const double len2 = ab.squaredNorm();
    const double t = len2 > 0 ? std::clamp((c - a).dot(ab) / len2, 0.0, 1.0) : 0.0;
    return (a + t * ab - c).squaredNorm();
}
double distance_to_segment(const Vec2& c, const Vec2& a, const Vec2& b) {
    return std::sqrt(squared_distance_to_segment(c, a, b));
}

// How a trace goes.
struct TraceMode {
    bool record = true;           // keep the steps for a later trace (only with a caller's cache)
    bool retrace = false;         // keep the steps no change can have altered (retrace_layout)
    bool stop_at_target = false;  // end the path at the target where that changes no other beam
    bool go_on = false;           // go on from where the previous retrace of this beam stopped
};

class BeamTracer {
public:
    // retrace: `out` holds this beam's path from the previous retrace, whose unchanged steps are
    // kept (see retrace_layout).
    BeamTracer(const Layout& layout, size_t beam, TraceCache& cache, TraceMode mode, Path& out)
        : layout_(layout), placed_(cache.placed), beam_(layout.beams[beam]),
          wave_polarization_(beam < cache.crystal_polarization.size() && cache.crystal_polarization[beam]
                                 ? *cache.crystal_polarization[beam]
                                 : layout.beams[beam].polarization),
          cache_(cache),
          memo_(cache.beams[beam]), air_(cache.air), path_(out), steps_(memo_.new_steps), record_(mode.record),
          retrace_(mode.retrace || mode.go_on), go_on_(mode.go_on),
          stop_at_target_(mode.stop_at_target && !mode.go_on), last_beam_(beam + 1 == layout.beams.size()) {
        path_.beam = beam;
        air_group_index_ = memo_.air_group_index;
        // The target's index holds while the layout's elements keep their names (a retrace
        // compared the target's name and the names of the changed elements).
        if (retrace_ && cache.retrace_valid && !cache.links_changed && cache.target)
            target_ = cache.target->second;
        else
            target_ = resolve(layout, layout.target, cache.target);
        // How far any element has moved since the steps were recorded (see trace_cache.hpp),
        // bounded from above by the largest move plus the largest growth of a bounding circle.
        // In a retrace only the changed elements can have moved since the previous one, so the
        // bound kept from then is raised by theirs (it may stay larger than needed: still a bound).
        replaying_ = !memo_.steps.empty();
        if (replaying_) {
            const bool since_last = retrace_ && cache.retrace_valid && memo_.moved_known;
            double moved2 = since_last ? memo_.moved2_mm2 : 0, grown = since_last ? memo_.grown_mm : 0;
            auto widen = [&](size_t i) {
                moved2 = std::max(moved2, (placed_[i].at - memo_.placed_at_mm[i]).squaredNorm());
                grown = std::max(grown, placed_[i].reach - memo_.placed_reach_mm[i]);
            };
            if (since_last) {
                for (size_t i : cache.changed) widen(i);
            } else {
                for (size_t i = 0; i < placed_.size(); ++i) widen(i);
            }
            memo_.moved2_mm2 = moved2;
            memo_.grown_mm = grown;
            memo_.moved_known = true;
            moved_mm_ = std::sqrt(moved2) + grown;
        }
    }

    void run();

private:
    struct Resumed {
        size_t step = 0;
        Vec2 p{0, 0}, d{1, 0};
        double s_mm = 0;
        Medium medium{};
    };
    Resumed resume();
    // The group delay once past a hit: its own plus its lumped glass (a thick singlet's centre
    // thickness at the glass's group index less the air's).
    double delay_after(const TraceHit& hit) const {
        return hit.lumped_glass_mm > 0
                   ? hit.group_delay_fs + group_delay_fs(hit.lumped_group_index - air_group_index_, hit.lumped_glass_mm)
                   : hit.group_delay_fs;
    }
    bool aims_as_before();
    bool may_stop_at_target() const;
    bool touched_by_change(const TraceCache::StepTaken& step) const;

    struct Candidate {  // a surface crossing; dist = ∞ until one is found
        size_t element = SIZE_MAX;
        Face face = Face::Only;
        Vec2 normal{1, 0};
        double dist = kInf, height = 0;
        bool found() const { return element != SIZE_MAX; }
    };
    // Hot (every step): inlined into the step search.
    [[gnu::always_inline]] void consider(size_t element, const Vec2& p, const Vec2& d, double max_dist, Candidate& best) const;
    [[gnu::always_inline]] void consider_surfaces(size_t element, const Surface* surfaces, int count, const Vec2& p, const Vec2& d,
                           double max_dist, Candidate& best) const;
    std::optional<Candidate> nearest(const Vec2& p, const Vec2& d, double max_dist) const;
    std::optional<Candidate> next_hit(const Vec2& p, const Vec2& d, double max_dist, size_t step);
    void record_steps();
    double table_exit(const Vec2& p, const Vec2& d) const;
    // direction_inside: refracted at the element's face with index `refracted_with` (1: the
    // outside direction, the first guess).
    Medium slab_medium(size_t element, const Vec2& direction_inside, double refracted_with);
    bool index_follows_direction(size_t element) const;
    // A finding (once per element) when the beam's wavelength lies outside the material's range.
    void note_material(size_t element, const Material& m) {
        if (!covers(m, beam_.wavelength_nm)) note_out_of_range(element, m);
    }
    void note_out_of_range(size_t element, const Material& m);
    // A finding about `element` (SIZE_MAX: none); the caller fills in the kind's numbers.
    Finding& finding(Finding::Kind kind, size_t element, const Vec2& where, double amount = 0) {
        Finding& f = path_.findings.emplace_back();
        f.kind = kind;
        if (element < layout_.elements.size()) f.element = layout_.elements[element].id;
        f.where_mm = where;
        f.amount = amount;
        return f;
    }
    const std::string& id(size_t e) const { return layout_.elements[e].id; }
    // An aim_at mirror sent the ray towards `want`; the ray from p along d, about to meet
    // `next` (none: it leaves the table) at distance next_dist, decides whether it got there.
    void check_aim(size_t want, const Vec2& p, const Vec2& d, std::optional<size_t> next, double next_dist,
                   bool passes_on);

    const Layout& layout_;
    std::vector<Placed>& placed_;
    const BeamSource& beam_;
    const Polarization wave_polarization_;  // what picks its wave in a birefringent crystal
    TraceCache& cache_;
    TraceCache::Beam& memo_;  // this beam's material samples and recorded steps
    const Material* air_ = nullptr;
    Path& path_;
    std::vector<TraceCache::StepTaken>& steps_;  // this trace's steps
    bool replaying_ = false;  // every step so far lay within the recorded steps' margin
    bool record_ = true;      // keep the steps for a later trace (only with a caller's cache)
    bool retrace_ = false;    // keep the steps no change can have altered (retrace_layout)
    bool go_on_ = false;      // keep every step of a path that stopped at the target, and go on
    bool stop_at_target_ = false;
    bool last_beam_ = false;
    double moved_mm_ = 0;
    double air_group_index_ = 1.0;
    std::optional<size_t> target_;
    std::optional<size_t> inside_;
    std::optional<std::pair<size_t, Face>> last_surface_;
    std::optional<size_t> expect_;  // the element an aim_at mirror sent the ray to
};

inline void BeamTracer::consider(size_t i, const Vec2& p, const Vec2& d, double max_dist, Candidate& best) const {
    const Placed& pl = placed_[i];
    if (!pl.traced) return;
    if (inside_) {
        if (*inside_ != i) return;  // inside a slab only its own faces count
    } else {
        // The element just left (in air): all its surfaces are planes parallel to the one left,
        // and the ray leaves on the side away from every one of them, so none lies ahead.
        if (last_surface_ && last_surface_->first == i) return;
        // Cheap rejection: a ray that passes the element's bounding circle, or whose circle lies
        // behind it, cannot meet its surfaces (inside a slab the faces are unbounded).
        const Vec2 to_centre = pl.at - p;
        const double along = to_centre.dot(d);
        const double across = to_centre.x() * d.y() - to_centre.y() * d.x();
        if (std::abs(across) > pl.reach || along < -pl.reach) return;
        // Every crossing lies at least along − reach down the ray: none nearer than the best.
        if (along - pl.reach > best.dist) return;
    }
    if (pl.aim_pending) {
        // Provisional orientation: the one that would send this ray, arriving at the centre,
        // to the aimed-at element's centre.
        Surface provisional[3];
        const Vec2 to_target = (placed_[*pl.aim_target].at - pl.at).normalized();
        const int n = surfaces_of(layout_.elements[i].kind, pl.at, (to_target - d).normalized(), provisional);
        consider_surfaces(i, provisional, n, p, d, max_dist, best);
    } else {
        consider_surfaces(i, pl.surfaces, pl.surface_count, p, d, max_dist, best);
    }
}

inline void BeamTracer::consider_surfaces(size_t i, const Surface* s, int n, const Vec2& p, const Vec2& d,
                                   double max_dist, Candidate& best) const {
    for (int k = 0; k < n; ++k) {
        if (last_surface_ && last_surface_->first == i && last_surface_->second == s[k].face) continue;
        if (s[k].face == Face::Centre && !inside_) continue;  // the centre plane is inside the crystal
        double dist = 0, height = 0;
        if (!cross_line(p, d, s[k], dist, height)) continue;
        if (dist <= kEps_mm || dist > max_dist + 1e-6) continue;  // on the edge counts
        if (!inside_ && std::abs(height) > placed_[i].half_aperture) continue;
        if (dist < best.dist) best = Candidate{i, s[k].face, s[k].normal, dist, height};
    }
}

std::optional<BeamTracer::Candidate> BeamTracer::nearest(const Vec2& p, const Vec2& d,
                                                         double max_dist) const {
    Candidate best;
    if (inside_) {
        consider(*inside_, p, d, max_dist, best);
    } else {
        for (size_t i = 0; i < layout_.elements.size(); ++i) consider(i, p, d, max_dist, best);
    }
    return best.found() ? std::optional<Candidate>(best) : std::nullopt;
}

// The next hit: among the recorded step's candidates while the new step stays within the
// margin (trace_cache.hpp), else among all elements.
std::optional<BeamTracer::Candidate> BeamTracer::next_hit(const Vec2& p, const Vec2& d,
                                                          double max_dist, size_t step) {
    if (replaying_ && step < memo_.steps.size()) {
        const TraceCache::Step& recorded = memo_.steps[step];
        // |a| + δ < margin, compared as |a|² < (margin − δ)² (no square roots in the loop).
        const double slack = kTraceMargin_mm - moved_mm_;
        const double slack2 = slack > 0 ? slack * slack : -1.0;
        if ((p - recorded.from_mm).squaredNorm() < slack2) {
            Candidate best;
            for (uint32_t i : recorded.candidates) consider(i, p, d, max_dist, best);
            const double reach = best.found() ? best.dist : max_dist;
            if (std::isfinite(reach) && (p + reach * d - recorded.to_mm).squaredNorm() < slack2) {
                ++cache_.replayed_steps;
                return best.found() ? std::optional<Candidate>(best) : std::nullopt;
            }
        }
    }
    replaying_ = false;
    ++cache_.searched_steps;
    return nearest(p, d, max_dist);
}

// Keep this trace's steps with their candidates for the next trace.
void BeamTracer::record_steps() {
    memo_.steps.resize(steps_.size());
    for (size_t k = 0; k < steps_.size(); ++k) {
        TraceCache::Step& step = memo_.steps[k];
        step.from_mm = steps_[k].from_mm;
        step.to_mm = steps_[k].to_mm;
        step.candidates.clear();
        // The element met comes first, so that it usually gives `consider` its nearest
        // distance before the others are tried.
        if (steps_[k].met) step.candidates.push_back(*steps_[k].met);
        for (size_t i = 0; i < placed_.size(); ++i)
            if (placed_[i].traced && i != steps_[k].met &&
                distance_to_segment(placed_[i].at, step.from_mm, step.to_mm) <= placed_[i].reach + kTraceMargin_mm)
                step.candidates.push_back(static_cast<uint32_t>(i));
    }
    memo_.moved2_mm2 = memo_.grown_mm = 0;  // nothing has moved since this recording
    memo_.moved_known = true;
    memo_.placed_at_mm.resize(placed_.size());
    memo_.placed_reach_mm.resize(placed_.size());
    for (size_t i = 0; i < placed_.size(); ++i) {
        memo_.placed_at_mm[i] = placed_[i].at;
        memo_.placed_reach_mm[i] = placed_[i].reach;
    }
}

double BeamTracer::table_exit(const Vec2& p, const Vec2& d) const {
    const double w = layout_.table.width_mm, h = layout_.table.height_mm;
    if (p.x() < 0 || p.x() > w || p.y() < 0 || p.y() > h) return 0;
    double s = kInf;
    if (d.x() > 0) s = std::min(s, (w - p.x()) / d.x());
    if (d.x() < 0) s = std::min(s, -p.x() / d.x());
    if (d.y() > 0) s = std::min(s, (h - p.y()) / d.y());
    if (d.y() < 0) s = std::min(s, -p.y() / d.y());
    return s;
}

void BeamTracer::note_out_of_range(size_t element, const Material& m) {
    for (size_t e : memo_.noted)
        if (e == element) return;
    memo_.noted.push_back(element);
    Finding& f = finding(Finding::Kind::MaterialOutOfRange, element, placed_[element].at);
    f.material = m.name;
    f.wavelength_nm = beam_.wavelength_nm;
    f.range_min_nm = m.min_wavelength_nm;
    f.range_max_nm = m.max_wavelength_nm;
}

// Phase and group index of the beam inside a slab, for a ray running along direction_inside.
Medium BeamTracer::slab_medium(size_t element, const Vec2& dir, double refracted_with) {
    const ElementKind& kind = layout_.elements[element].kind;
    const Material& m = *placed_[element].material;
    const double nm = beam_.wavelength_nm;
    if (const auto* c = std::get_if<Crystal>(&kind); c && m.symmetry != Symmetry::Isotropic) {
        // Birefringent: the A (ordinary) wave when most of the beam's power is in it, else the
        // B wave at its angle ψ to the reference axis (trace/crystal_axes.hpp).
        const CrystalIndices& x = cached(memo_.crystal[element], &m, static_cast<int>(c->principal_plane),
                                         [&] { return crystal_indices(m, nm, c->principal_plane); });
        const bool a_wave = a_wave_fraction(wave_polarization_, c->optic_axis_horizontal) >= 0.5;
        const double psi = a_wave ? 0.0
                                  : angle_to_reference_axis_rad(crystal_pose(placed_[element].normal, *c), dir,
                                                                refracted_with);
        const WaveIndex w = wave_index(x, a_wave ? Polarity::A : Polarity::B, psi);
        return Medium{w.index, w.group_index};
    }
    return cached(memo_.slab[element], &m, 0, [&] {
        return Medium{sample_index(m, nm, Axis::X).index, absolute_index(m, *air_, nm, Axis::X).group_index};
    });
}

// Whether the beam's index in a slab depends on its direction there: the B wave of a
// birefringent crystal (slab_medium's choice); the A wave's index does not.
bool BeamTracer::index_follows_direction(size_t element) const {
    const auto* c = std::get_if<Crystal>(&layout_.elements[element].kind);
    return c && placed_[element].material->symmetry != Symmetry::Isotropic &&
           a_wave_fraction(wave_polarization_, c->optic_axis_horizontal) < 0.5;
}

void BeamTracer::check_aim(size_t want, const Vec2& p, const Vec2& d, std::optional<size_t> next,
                           double next_dist, bool passes_on) {
    if (next && *next == want) return;
    const Surface& s0 = placed_[want].surfaces[0];
    double dist = 0, height = 0;
    const bool crosses = placed_[want].surface_count > 0 && cross_line(p, d, s0, dist, height) && dist > 0;
    // An optic the light passes through (a lens, a plate, a transmitting dichroic) before the
    // aimed-at element's plane: the aim is judged on the ray that leaves it.
    if (next && passes_on && !(crosses && dist < next_dist)) {
        expect_ = want;
        return;
    }
    if (crosses) {
        const double beyond = std::abs(height) - placed_[want].half_aperture;
        finding(Finding::Kind::MissedOptic, want, p + dist * d, beyond).crossing_mm = std::abs(height);
    } else {
        finding(Finding::Kind::MissedOptic, want, placed_[want].at);
    }
}

// Whether every aim_at mirror is as it was when this beam started in the previous retrace
// (still to be turned, or its normal); the memo then takes the present state.
bool BeamTracer::aims_as_before() {
    bool same = true;
    size_t k = 0;
    for (size_t i : cache_.aim_mirrors) {
        const Placed& pl = placed_[i];
        const std::pair<bool, Vec2> now(pl.aim_pending, pl.normal);
        if (k < memo_.aims.size()) {
            same = same && memo_.aims[k] == now;
            memo_.aims[k] = now;
        } else {
            same = false;
            memo_.aims.push_back(now);
        }
        ++k;
    }
    if (k != memo_.aims.size()) same = false;
    memo_.aims.resize(k);
    return same;
}

// Whether this beam, having crossed the target, may end its path there: when the steps after
// the target could turn no aim_at mirror that a later beam would meet (none is still unturned,
// or no beam comes after this one); a beam's path thus never depends on where another stopped.
bool BeamTracer::may_stop_at_target() const {
    if (last_beam_) return true;
    for (size_t i : cache_.aim_mirrors)
        if (placed_[i].aim_pending) return false;
    return true;
}

// Whether an element changed since the previous retrace comes near a step of it, where it was
// then or where it is now: its bounding circle within reach of the step's segment. A step no
// changed element comes near started the same way and met the same surfaces, so it repeats.
// The circles are tested widened by kChangeSlack_mm (a stricter test, so still safe), which
// lets later retraces skip the steps kept here while their circles lie within these (see
// list_changes).
bool BeamTracer::touched_by_change(const TraceCache::StepTaken& step) const {
    // A circle comes within reach of the segment [a, b]; a box test first.
    const Vec2 lo = step.from_mm.cwiseMin(step.to_mm), hi = step.from_mm.cwiseMax(step.to_mm);
    for (const TraceCache::Circle& k : cache_.change_circles) {
        const Vec2& c = k.centre_mm;
        const double r = k.radius_mm + TraceCache::kChangeSlack_mm;
        if (c.x() < lo.x() - r || c.x() > hi.x() + r || c.y() < lo.y() - r || c.y() > hi.y() + r) continue;
        if (squared_distance_to_segment(c, step.from_mm, step.to_mm) <= r * r) return true;
    }
    return false;
}

// Where this trace starts: at the beam's source, or (retrace) after the previous path's leading
// steps that no change can have altered, with the tracer's state as it was there.
BeamTracer::Resumed BeamTracer::resume() {
    size_t keep = 0;
    if (go_on_) {
        keep = memo_.starts.empty() ? 0 : memo_.starts.size() - 1;
    } else if (retrace_) {
        const bool aims_same = aims_as_before();
        const bool comparable = cache_.retrace_valid && aims_same && memo_.source && *memo_.source == beam_ &&
                                memo_.wave_polarization == wave_polarization_ &&
                                path_.hits.size() + 1 >= memo_.starts.size() && steps_.size() + 1 >= memo_.starts.size();
        // The steps kept when the reference circles were tested lie clear of them, widened; while
        // they hold this retrace's circles, those steps lie clear of these too and need no test.
        const bool skip =
            comparable && cache_.circles_within_reference && memo_.reference_keep + 1 <= memo_.starts.size();
        if (skip) {
            keep = memo_.reference_keep;
            ++cache_.reference_skips;
        }
        // The last step of the previous trace is always taken again (it ended the path).
        while (comparable && keep + 1 < memo_.starts.size() && !touched_by_change(steps_[keep])) ++keep;
        if (!comparable) {
            memo_.source = beam_;
            memo_.wave_polarization = wave_polarization_;
        }
        if (!skip) memo_.reference_keep = keep;  // tested from the start (or nothing kept)
    }
    memo_.kept_hits = keep;
    path_.ends_at_target = false;
    if (keep == 0) {
        path_.segments.clear();
        path_.hits.clear();
        path_.findings.clear();
        path_.target_hit.reset();
        steps_.clear();
        memo_.starts.clear();
        memo_.noted.clear();
        return Resumed{0, beam_.start_mm, direction_deg(beam_.direction_deg), 0, Medium{1.0, air_group_index_}};
    }
    const TraceCache::StepStart& st = memo_.starts[keep];
    for (size_t j = 0; j < keep; ++j)
        if (const auto& a = memo_.starts[j].aimed) {  // the turn of an aim_at mirror, as then
            Placed& pl = placed_[a->first];
            pl.normal = a->second;
            pl.aim_pending = false;
            pl.surface_count = surfaces_of(layout_.elements[a->first].kind, pl.at, pl.normal, pl.surfaces);
        }
    path_.segments.resize(keep);
    path_.hits.resize(keep);
    path_.findings.resize(st.findings);
    if (path_.target_hit && *path_.target_hit >= keep) path_.target_hit.reset();
    steps_.resize(keep);
    memo_.noted.resize(st.noted);
    inside_ = st.inside;
    last_surface_ = st.last_surface;
    expect_ = st.expect;
    const Resumed r{keep, st.p_mm, st.d, st.s_mm, st.medium};
    memo_.starts.resize(keep);
    return r;
}

void BeamTracer::run() {
    const Resumed from = resume();
    Vec2 p = from.p;
    Vec2 d = from.d;
    double s_total = from.s_mm;
    // Group delay from the start (trace/path.hpp, TraceHit::group_delay_fs): after the kept
    // steps, that of the last kept hit and its lumped glass.
    double delay_fs = from.step > 0 ? delay_after(path_.hits[from.step - 1]) : 0.0;
    Medium medium = from.medium;
    const double wavelength = beam_.wavelength_nm;

    for (size_t count = from.step;; ++count) {
        if (retrace_)
            memo_.starts.emplace_back(p, d, s_total, medium, inside_, last_surface_, expect_, path_.findings.size(),
                                      memo_.noted.size(), std::nullopt);
        if (stop_at_target_ && path_.target_hit && *path_.target_hit + 1 == path_.hits.size() && may_stop_at_target()) {
            path_.ends_at_target = true;  // the start just noted is where go_on continues
            break;
        }
        if (count >= kMaxHitsPerBeam) {
            finding(Finding::Kind::TooManyHits, SIZE_MAX, p, static_cast<double>(kMaxHitsPerBeam));
            break;
        }
        const double exit = inside_ ? kInf : table_exit(p, d);
        const std::optional<Candidate> c = next_hit(p, d, exit, count);
        if (c || std::isfinite(exit))
            steps_.push_back({p, p + (c ? c->dist : exit) * d,
                              c ? std::optional<uint32_t>(static_cast<uint32_t>(c->element)) : std::nullopt});
        if (!c) {
            if (inside_) {
                finding(Finding::Kind::LeftThroughEdge, *inside_, p);
                break;
            }
            if (const std::optional<size_t> want = std::exchange(expect_, std::nullopt))
                check_aim(*want, p, d, std::nullopt, 0, false);
            const Vec2 q = p + exit * d;
            path_.segments.push_back({p, q, exit, std::nullopt, 1.0, air_group_index_});
            finding(Finding::Kind::LeftTable, SIZE_MAX, q);
            break;
        }
        if (inside_ && std::abs(c->height) > placed_[*inside_].half_aperture) {
            finding(Finding::Kind::LeftThroughEdge, *inside_, p + c->dist * d);
            break;
        }
        // The element the last aim_at mirror sent the ray to, judged once this hit is known.
        const std::optional<size_t> aimed = std::exchange(expect_, std::nullopt);
        const Vec2 d_in = d;
        const Vec2 h = p + c->dist * d;
        path_.segments.push_back({p, h, c->dist, inside_, medium.index, medium.group_index});
        s_total += c->dist;
        delay_fs += group_delay_fs(medium.group_index, c->dist);
        const size_t e = c->element;
        const ElementKind& kind = layout_.elements[e].kind;
        Placed& pl = placed_[e];
        if (pl.aim_pending) {  // the first beam to reach an aim_at mirror fixes its orientation
            pl.normal = c->normal;
            pl.aim_pending = false;
            pl.surface_count = surfaces_of(kind, pl.at, pl.normal, pl.surfaces);
            if (retrace_) memo_.starts.back().aimed = std::make_pair(e, pl.normal);
        }
        const Vec2 n = c->normal;
        TraceHit& hit = path_.hits.emplace_back();  // taken back where the ray stops before it
        hit.element = e;
        hit.face = c->face;
        hit.point_mm = h;
        hit.direction_in = d;
        hit.s_mm = s_total;
        hit.group_delay_fs = delay_fs;
        hit.cos_aoi = std::min(1.0, std::abs(d.dot(n)));
        hit.sin_aoi = std::min(1.0, std::abs(d.x() * n.y() - d.y() * n.x()));
        hit.height_mm = c->height;
        hit.half_aperture_mm = pl.half_aperture;
        hit.index_before = medium.index;
        last_surface_ = std::make_pair(e, c->face);
        bool stop = false;

        if (const auto* lens = std::get_if<Lens>(&kind)) {
            hit.interaction = Interaction::ThinLens;
            // The focal length at this beam's wavelength, from the glass samples in the cache.
            double f = 0, glass_index = 1, glass_group_index = 1;
            if (const auto* ideal = std::get_if<IdealLens>(&lens->model)) {
                f = ideal->focal_length_mm;
            } else if (const auto* thin = std::get_if<ThinChromaticLens>(&lens->model)) {
                TraceCache::Tagged<TraceCache::LensGlass>& slot = memo_.lens[e];
                if (slot.value && slot.value->design_wavelength_nm != thin->design_wavelength_nm) slot.value.reset();
                const auto& g = cached(slot, pl.material, 1, [&] {
                    return TraceCache::LensGlass{thin->design_wavelength_nm, sample_index(*pl.material, wavelength).index,
                                                 sample_index(*pl.material, thin->design_wavelength_nm).index, 1};
                });
                glass_index = g.index;
                f = chromatic_focal_length_mm(thin->focal_length_mm, g.design_index, g.index);
            } else {
                const auto& t = std::get<ThickLens>(lens->model);
                auto& g = cached(memo_.lens[e], pl.material, 2, [&] {
                    return TraceCache::LensGlass{0, sample_index(*pl.material, wavelength).index, 1,
                                                 absolute_index(*pl.material, *air_, wavelength).group_index};
                });
                glass_index = g.index;
                glass_group_index = g.group_index;
                const std::array<double, 3> shape{t.front_radius_mm, t.back_radius_mm, t.center_thickness_mm};
                if (g.efl_shape != shape) {  // the EFL at this glass index, kept for this shape
                    g.efl_shape = shape;
                    g.efl_mm = thick_lens_properties({shape[0], shape[1], shape[2]}, g.index).effective_focal_length_mm;
                }
                f = g.efl_mm;
            }
            if (!(std::isfinite(f) && f != 0)) {
                Finding& f = finding(Finding::Kind::NoRealIndex, e, h);
                f.material = pl.material ? pl.material->name : std::string();
                f.wavelength_nm = wavelength;
                path_.hits.pop_back();
                break;
            }
            hit.focal_length_mm = f;
            hit.lens_index = glass_index;
            const Vec2 t = perpendicular(n);
            const double along = d.dot(n);
            const double slope = d.dot(t) / std::abs(along) - c->height / f;
            d = (std::copysign(1.0, along) * n + slope * t).normalized();
            if (const auto* thick = std::get_if<ThickLens>(&lens->model)) {
                note_material(e, *pl.material);
                hit.lumped_glass_mm = thick->center_thickness_mm;
                hit.lumped_group_index = glass_group_index;
            } else if (std::holds_alternative<ThinChromaticLens>(lens->model)) {
                note_material(e, *pl.material);
            }
        } else if (const auto* mirror = std::get_if<Mirror>(&kind)) {
            if (d.dot(n) >= 0) {
                finding(Finding::Kind::HitBackOfOptic, e, h).element_type = type_name(kind);
                stop = true;
            } else {
                hit.interaction = Interaction::Reflect;
                Vec2 local = n;
                if (mirror->radius_of_curvature_mm)
                    local = (n - (c->height / *mirror->radius_of_curvature_mm) * perpendicular(n)).normalized();
                d = reflect(d, local);
                if (mirror->aim_at) expect_ = pl.aim_target;
            }
        } else if (std::holds_alternative<Retroreflector>(kind)) {
            if (d.dot(n) >= 0) {
                finding(Finding::Kind::HitBackOfOptic, e, h).element_type = type_name(kind);
                stop = true;
            } else {
                hit.interaction = Interaction::Retroreflect;
                if (aimed) check_aim(*aimed, p, d_in, e, c->dist, false);
                d = -d;
                p = pl.at - c->height * perpendicular(n);  // mirrored across the axis
                hit.direction_out = d;
                hit.index_after = medium.index;
                continue;
            }
        } else if (std::holds_alternative<Target>(kind)) {
            hit.interaction = Interaction::TargetPlane;
        } else if (std::holds_alternative<Dump>(kind)) {
            hit.interaction = Interaction::Absorb;
            stop = true;
        } else if (is_slab(kind)) {
            const auto* dichroic = std::get_if<Dichroic>(&kind);
            const bool reflects_here =
                dichroic && c->face == Face::Front &&
                (dichroic->reflects_shorter ? wavelength < dichroic->edge_nm
                                            : wavelength > dichroic->edge_nm);
            const bool coming_from_front = d.dot(n) < 0;
            if (c->face == Face::Centre) {
                hit.interaction = Interaction::TargetPlane;
            } else if (reflects_here && (inside_.has_value() != coming_from_front)) {
                // Coated face: reflected from outside (front) or inside (from the substrate).
                hit.interaction = Interaction::Reflect;
                d = reflect(d, n);
            } else {
                hit.interaction = Interaction::Refract;
                const bool entering = !inside_.has_value();
                Medium next{1.0, air_group_index_};
                std::optional<Vec2> out;
                if (entering) {
                    // Guess the medium from the straight-on index, refine the direction for an
                    // index that depends on it (extraordinary wave): a few fixed-point steps.
                    next = slab_medium(e, d, 1.0);
                    if (!(std::isfinite(next.index) && next.index > 0)) {
                        Finding& f = finding(Finding::Kind::NoRealIndex, e, h);
                        f.material = placed_[e].material->name;
                        f.wavelength_nm = wavelength;
                        path_.hits.pop_back();
                        break;
                    }
                    const int refinements = index_follows_direction(e) ? 4 : 0;
                    for (int it = 0; it < refinements; ++it) {
                        out = refract(d, n, 1.0, next.index);
                        if (!out) break;
                        next = slab_medium(e, *out, next.index);
                    }
                    out = refract(d, n, 1.0, next.index);
                } else {
                    out = refract(d, n, medium.index, 1.0);
                }
                if (!out) {
                    finding(Finding::Kind::TotalInternalReflection, e, h);
                    stop = true;
                } else {
                    d = *out;
                    medium = next;
                    if (entering) {
                        inside_ = e;
                        note_material(e, *pl.material);
                    } else {
                        inside_.reset();
                    }
                }
            }
        }
        hit.direction_out = d;
        hit.index_after = medium.index;
        if (aimed) {
            const Interaction i = hit.interaction;
            const bool passes_on = !stop && (i == Interaction::ThinLens || i == Interaction::Refract ||
                                             i == Interaction::TargetPlane);
            check_aim(*aimed, p, d_in, e, c->dist, passes_on);
        }
        if (target_ && e == *target_ && hit.interaction == Interaction::TargetPlane &&
            !path_.target_hit)
            path_.target_hit = path_.hits.size() - 1;
        delay_fs = delay_after(hit);
        if (stop) break;
        p = h;
    }
    if (!path_.target_hit)
        finding(Finding::Kind::NoTarget, target_.value_or(SIZE_MAX), p).element = layout_.target;
    // A path that ended at the target while replaying repeated a prefix of the recorded steps.
    const bool repeated = replaying_ && (steps_.size() == memo_.steps.size() ||
                                         (path_.ends_at_target && steps_.size() < memo_.steps.size()));
    if (record_ && !repeated) record_steps();
}

// Which elements differ from the previous retrace's (flags in c.changed_flag, indices in
// c.changed; all when there is no previous retrace to compare with, or the table or target
// changed). With `edited`, only the elements listed there are compared: the caller vouches for
// the others.
void compare_elements(const Layout& layout, TraceCache& c, const std::vector<size_t>* edited) {
    const size_t n = layout.elements.size();
    c.changed_flag.assign(n, 0);
    c.changed.clear();
    c.links_changed = false;
    if (!c.retrace_valid || c.seen_elements.size() != n || !(c.seen_table == layout.table) ||
        c.seen_target != layout.target) {
        c.retrace_valid = false;
        c.seen_elements = layout.elements;
        c.seen_table = layout.table;
        c.seen_target = layout.target;
        c.changed_flag.assign(n, 1);
        c.changed.resize(n);
        std::iota(c.changed.begin(), c.changed.end(), size_t{0});
        return;
    }
    auto compare = [&](size_t i) {
        const Element& now = layout.elements[i];
        Element& then = c.seen_elements[i];
        // Element's operator== field by field; an element only moved or turned (the solvers'
        // and the Monte Carlo's edits) is noted without copying it whole.
        const bool same_otherwise = now.aperture_mm == then.aperture_mm && now.transmission == then.transmission &&
                                    now.kind == then.kind && now.id == then.id;
        if (same_otherwise && now.at_mm == then.at_mm && now.normal_deg == then.normal_deg) return;
        c.changed_flag[i] = 1;
        c.changed.push_back(i);
        const auto* mirror_now = std::get_if<Mirror>(&now.kind);
        const auto* mirror_then = std::get_if<Mirror>(&then.kind);
        if (now.id != then.id || std::holds_alternative<Stage>(now.kind) ||
            (mirror_now && mirror_then && mirror_now->aim_at != mirror_then->aim_at))
            c.links_changed = true;
        if (same_otherwise) {
            then.at_mm = now.at_mm;
            then.normal_deg = now.normal_deg;
        } else {
            then = now;
        }
    };
    if (edited) {
        for (size_t i : *edited)
            if (i < n) compare(i);
    } else {
        for (size_t i = 0; i < n; ++i) compare(i);
    }
}

// The changed elements' indices (cache.changed), after placing: the flagged ones (listed by
// compare_elements where `links_same`, see place), and an aim_at mirror whose target is one;
// and the circles they occupy, now and at the previous retrace (when that is there to compare
// with).
void list_changes(TraceCache& c, bool links_same) {
    if (links_same) {
        for (size_t m : c.aim_mirrors)
            if (!c.changed_flag[m] && c.changed_flag[*c.placed[m].aim_target]) c.changed.push_back(m);
    } else {
        c.changed.clear();
        for (size_t i = 0; i < c.placed.size(); ++i)
            if (c.changed_flag[i] || (c.placed[i].aim_target && c.changed_flag[*c.placed[i].aim_target]))
                c.changed.push_back(i);
    }
    c.change_circles.clear();
    c.circles_within_reference = false;
    if (!c.retrace_valid) {
        c.reference_circles.reset();
        return;
    }
    for (size_t i : c.changed) {
        const double then = c.seen_reach_mm[i] + 1e-6, now = c.placed[i].reach + 1e-6;
        c.change_circles.push_back({c.placed[i].at, now});
        if (c.seen_at_mm[i] != c.placed[i].at || then != now) c.change_circles.push_back({c.seen_at_mm[i], then});
    }
    // The reference: the circles of the last retrace that tested each path from its start
    // (resume). Each of this retrace's circles inside one of them, widened as they were tested?
    if (c.reference_circles) {
        c.circles_within_reference = true;
        for (const TraceCache::Circle& k : c.change_circles) {
            bool inside = false;
            for (const TraceCache::Circle& w : *c.reference_circles)
                inside = inside || (k.centre_mm - w.centre_mm).norm() + k.radius_mm <= w.radius_mm + TraceCache::kChangeSlack_mm;
            c.circles_within_reference = c.circles_within_reference && inside;
        }
    }
    if (!c.circles_within_reference) c.reference_circles = c.change_circles;  // tested from the start now
}

void trace_layout(const Layout& layout, const MaterialLibrary& library, TraceCache& c, std::vector<Path>& paths,
                  TraceMode mode, const std::vector<size_t>* edited = nullptr) {
    const bool retrace = mode.retrace;
    // Start afresh when the cache was made for another list of elements or beams, or with
    // another material library.
    const size_t n = layout.elements.size();
    bool same = c.library == &library && c.element_kinds.size() == n && c.beams.size() == layout.beams.size();
    if (same && retrace && edited && c.retrace_valid) {  // the others are vouched for
        for (size_t i : *edited) same = same && (i >= n || c.element_kinds[i] == layout.elements[i].kind.index());
    } else {
        for (size_t i = 0; same && i < n; ++i) same = c.element_kinds[i] == layout.elements[i].kind.index();
    }
    if (!same) {
        std::vector<Path> storage = std::move(c.paths);
        std::vector<std::optional<Polarization>> waves = std::move(c.crystal_polarization);
        const bool waves_known = c.crystal_polarization_known;
        c = TraceCache{};
        c.paths = std::move(storage);
        c.crystal_polarization = std::move(waves);  // the caller's, not a trace's memory
        c.crystal_polarization_known = waves_known;
        c.library = &library;
        c.air = library.find("air");
        for (const Element& e : layout.elements) c.element_kinds.push_back(e.kind.index());
        c.beams.resize(layout.beams.size());
    }
    for (size_t b = 0; b < layout.beams.size(); ++b) {
        TraceCache::Beam& beam = c.beams[b];
        if (beam.wavelength_nm == layout.beams[b].wavelength_nm && beam.slab.size() == n) continue;
        beam = TraceCache::Beam{};
        beam.wavelength_nm = layout.beams[b].wavelength_nm;
        beam.air_group_index = sample_index(*c.air, beam.wavelength_nm).group_index;
        beam.slab.resize(n);
        beam.crystal.resize(n);
        beam.lens.resize(n);
    }
    if (retrace) {
        compare_elements(layout, c, edited);
        const bool links_same = c.retrace_valid && !c.links_changed;
        place(layout, library, c, &c.changed_flag, links_same);
        list_changes(c, links_same);
    } else {
        c.retrace_valid = false;
        place(layout, library, c);
    }
    paths.resize(layout.beams.size());
    for (size_t b = 0; b < layout.beams.size(); ++b) BeamTracer(layout, b, c, mode, paths[b]).run();
    if (retrace) {
        // After a retrace compared with the previous one, only the changed elements were placed anew.
        auto see = [&](size_t i) {
            c.seen_at_mm[i] = c.placed[i].at;
            c.seen_reach_mm[i] = c.placed[i].reach;
        };
        if (c.retrace_valid) {
            for (size_t i : c.changed) see(i);
        } else {
            c.seen_at_mm.resize(n);
            c.seen_reach_mm.resize(n);
            for (size_t i = 0; i < n; ++i) see(i);
        }
        c.retrace_valid = true;
        ++c.retraces;
    }
}

}  // namespace

void trace_layout(const Layout& layout, const MaterialLibrary& library, TraceCache& cache, std::vector<Path>& paths) {
    trace_layout(layout, library, cache, paths, TraceMode{});
}

const std::vector<Path>& retrace_layout(const Layout& layout, const MaterialLibrary& library, TraceCache& cache,
                                       const RetraceOptions& options) {
    trace_layout(layout, library, cache, cache.paths,
                 TraceMode{.record = true, .retrace = true, .stop_at_target = options.stop_at_target}, options.edited);
    return cache.paths;
}

const Path& trace_past_target(const Layout& layout, TraceCache& cache, size_t beam) {
    Path& path = cache.paths.at(beam);
    if (path.ends_at_target) {
        BeamTracer(layout, beam, cache, TraceMode{.record = true, .retrace = true, .go_on = true}, path).run();
        ++cache.traced_past_target;
    }
    return path;
}

std::vector<Path> trace_layout(const Layout& layout, const MaterialLibrary& library, TraceCache* cache) {
    std::vector<Path> paths;
    if (cache) {
        trace_layout(layout, library, *cache, paths, TraceMode{});
    } else {
        TraceCache local;
        trace_layout(layout, library, local, paths, TraceMode{.record = false});
    }
    return paths;
}

}  // namespace rv
