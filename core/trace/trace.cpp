#include "trace/trace.hpp"

#include <cmath>
#include <limits>
#include <utility>
#include <variant>

#include "materials/dispersion.hpp"
#include "trace/interact.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

constexpr double kEps_mm = 1e-9;
constexpr double kInf = std::numeric_limits<double>::infinity();

// Distance along the ray to the surface's line, and the signed height of the crossing.
bool cross_line(const Vec2& p, const Vec2& d, const Surface& s, double& dist, double& height) {
    const double dn = d.dot(s.normal);
    if (std::abs(dn) < 1e-12) return false;
    dist = (s.centre - p).dot(s.normal) / dn;
    height = (p + dist * d - s.centre).dot(perpendicular(s.normal));
    return true;
}

// How a trace goes.
struct TraceMode {
    bool record = true;           // keep the steps for a later trace (only with a caller's cache)
    bool retrace = false;         // keep the steps no change can have altered (retrace_layout)
    bool stop_at_target = false;  // end the path at the target where that changes no other beam
    bool go_on = false;           // go on from where the previous retrace of this beam stopped
};

// One beam's trace: from its start (or where a retrace restarts it) one step at a time, each
// step finding the next surface and letting that element act on the ray (interact.hpp).
class BeamTracer {
public:
    BeamTracer(const Layout& layout, size_t beam, TraceCache& cache, TraceMode mode, Path& out);
    void run();

private:
    RayState resume();
    // One step of the ray: the next surface met (or the table edge), the segment to it, the
    // hit and what its element does. False: the path ends here.
    bool step(RayState& ray, size_t count);
    std::optional<SurfaceCrossing> nearest(const RayState& ray, double max_dist) const;
    // Hot (every step): inlined into the step search.
    [[gnu::always_inline]] void consider(size_t element, const RayState& ray, double max_dist,
                                         SurfaceCrossing& best) const;
    [[gnu::always_inline]] void consider_surfaces(size_t element, const Surface* surfaces, int count,
                                                  const RayState& ray, double max_dist, SurfaceCrossing& best) const;
    double table_exit(const Vec2& p, const Vec2& d) const;
    // The group delay once past a hit: its own plus its lumped glass (a thick singlet's centre
    // thickness at the glass's group index less the air's).
    double delay_after(const TraceHit& hit) const {
        return hit.lumped_glass_mm > 0 ? hit.group_delay_fs + group_delay_fs(hit.lumped_group_index - air_.group_index,
                                                                               hit.lumped_glass_mm)
                                       : hit.group_delay_fs;
    }
    bool may_stop_at_target() const;
    Finding& finding(Finding::Kind kind, size_t element, const Vec2& where, double amount = 0);
    // An aim_at mirror sent the ray towards `want`; the ray from p along d, about to meet
    // `next` (none: it leaves the table) at distance next_dist, decides whether it got there.
    void check_aim(RayState& ray, size_t want, const Vec2& p, const Vec2& d, std::optional<size_t> next,
                   double next_dist, bool passes_on);

    const Layout& layout_;
    const size_t beam_index_;
    TraceCache& cache_;
    std::vector<PlacedOptic>& placed_;
    const BeamSource& beam_;
    const Polarization wave_polarization_;  // what picks its wave in a birefringent crystal
    TraceCache::Beam& memo_;  // this beam's samples, accelerator and steps
    Path& path_;
    const bool record_;   // keep the steps for a later trace (only with a caller's cache)
    const bool retrace_;  // keep the steps no change can have altered (retrace_layout)
    const bool go_on_;    // keep every step of a path that stopped at the target, and go on
    const bool stop_at_target_;
    const bool last_beam_;
    Medium air_;  // the air at this beam's wavelength
    std::optional<size_t> target_;
};

BeamTracer::BeamTracer(const Layout& layout, size_t beam, TraceCache& cache, TraceMode mode, Path& out)
    : layout_(layout), beam_index_(beam), cache_(cache), placed_(cache.placed), beam_(layout.beams[beam]),
      wave_polarization_(beam < cache.crystal_polarization.size() && cache.crystal_polarization[beam]
                             ? *cache.crystal_polarization[beam]
                             : layout.beams[beam].polarization),
      memo_(cache.beams[beam]), path_(out), record_(mode.record), retrace_(mode.retrace || mode.go_on),
      go_on_(mode.go_on), stop_at_target_(mode.stop_at_target && !mode.go_on),
      last_beam_(beam + 1 == layout.beams.size()) {
    path_.beam = beam;
    air_ = memo_.air_medium;
    // The target's index holds while the layout's elements keep their names (a retrace
    // compared the target's name and the names of the changed elements).
    if (retrace_ && cache.retrace.links_same() && cache.target)
        target_ = cache.target->second;
    else
        target_ = resolve_id(layout, layout.target, cache.target);
    memo_.accelerator.begin(placed_, retrace_ && cache.retrace.valid(), cache.retrace.changed());
}

Finding& BeamTracer::finding(Finding::Kind kind, size_t element, const Vec2& where, double amount) {
    return add_finding(path_, layout_, kind, element, where, amount);
}

inline void BeamTracer::consider(size_t i, const RayState& ray, double max_dist, SurfaceCrossing& best) const {
    const PlacedOptic& pl = placed_[i];
    if (!pl.traced) return;
    if (ray.inside) {
        if (*ray.inside != i) return;  // inside a slab only its own faces count
    } else {
        // The element just left (in air): all its surfaces are planes parallel to the one left,
        // and the ray leaves on the side away from every one of them, so none lies ahead.
        if (ray.last_surface && ray.last_surface->first == i) return;
        // Cheap rejection: a ray that passes the element's bounding circle, or whose circle lies
        // behind it, cannot meet its surfaces (inside a slab the faces are unbounded).
        const Vec2 to_centre = pl.at - ray.p_mm;
        const double along = to_centre.dot(ray.d);
        const double across = to_centre.x() * ray.d.y() - to_centre.y() * ray.d.x();
        if (std::abs(across) > pl.reach || along < -pl.reach) return;
        // Every crossing lies at least along − reach down the ray: none nearer than the best.
        if (along - pl.reach > best.dist) return;
    }
    if (pl.aim_pending) {
        // Provisional orientation: the one that would send this ray, arriving at the centre,
        // to the aimed-at element's centre.
        Surface provisional[3];
        const Vec2 to_target = (placed_[*pl.aim_target].at - pl.at).normalized();
        const int n = surfaces_of(layout_.elements[i].kind, pl.at, (to_target - ray.d).normalized(), provisional);
        consider_surfaces(i, provisional, n, ray, max_dist, best);
    } else {
        consider_surfaces(i, pl.surfaces, pl.surface_count, ray, max_dist, best);
    }
}

inline void BeamTracer::consider_surfaces(size_t i, const Surface* s, int n, const RayState& ray, double max_dist,
                                          SurfaceCrossing& best) const {
    for (int k = 0; k < n; ++k) {
        if (ray.last_surface && ray.last_surface->first == i && ray.last_surface->second == s[k].face) continue;
        if (s[k].face == Face::Centre && !ray.inside) continue;  // the centre plane is inside the crystal
        double dist = 0, height = 0;
        if (!cross_line(ray.p_mm, ray.d, s[k], dist, height)) continue;
        if (dist <= kEps_mm || dist > max_dist + 1e-6) continue;  // on the edge counts
        if (!ray.inside && std::abs(height) > placed_[i].half_aperture) continue;
        if (dist < best.dist) best = SurfaceCrossing{i, s[k].face, s[k].normal, dist, height};
    }
}

std::optional<SurfaceCrossing> BeamTracer::nearest(const RayState& ray, double max_dist) const {
    SurfaceCrossing best;
    if (ray.inside) {
        consider(*ray.inside, ray, max_dist, best);
    } else {
        for (size_t i = 0; i < layout_.elements.size(); ++i) consider(i, ray, max_dist, best);
    }
    return best.found() ? std::optional<SurfaceCrossing>(best) : std::nullopt;
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

void BeamTracer::check_aim(RayState& ray, size_t want, const Vec2& p, const Vec2& d, std::optional<size_t> next,
                           double next_dist, bool passes_on) {
    if (next && *next == want) return;
    const Surface& s0 = placed_[want].surfaces[0];
    double dist = 0, height = 0;
    const bool crosses = placed_[want].surface_count > 0 && cross_line(p, d, s0, dist, height) && dist > 0;
    // An optic the light passes through (a lens, a plate, a transmitting dichroic) before the
    // aimed-at element's plane: the aim is judged on the ray that leaves it.
    if (next && passes_on && !(crosses && dist < next_dist)) {
        ray.expect = want;
        return;
    }
    if (crosses) {
        const double beyond = std::abs(height) - placed_[want].half_aperture;
        finding(Finding::Kind::MissedOptic, want, p + dist * d, beyond).crossing_mm = std::abs(height);
    } else {
        finding(Finding::Kind::MissedOptic, want, placed_[want].at);
    }
}

// Whether this beam, having crossed the target, may end its path there: when the steps after
// the target could turn no aim_at mirror that a later beam would meet (none is still unturned,
// or no beam comes after this one); a beam's path thus never depends on where another stopped.
bool BeamTracer::may_stop_at_target() const {
    if (last_beam_) return true;
    for (size_t i : cache_.placement.aim_mirrors)
        if (placed_[i].aim_pending) return false;
    return true;
}

// Where this trace starts: at the beam's source, or (retrace) after the previous path's leading
// steps that no change can have altered, with the tracer's state as it was there.
RayState BeamTracer::resume() {
    RetraceMemo& retrace = cache_.retrace;
    size_t keep = 0;
    if (go_on_) {
        keep = retrace.starts(beam_index_) == 0 ? 0 : retrace.starts(beam_index_) - 1;
    } else if (retrace_) {
        keep = retrace.steps_to_keep(beam_index_, beam_, wave_polarization_, placed_, cache_.placement.aim_mirrors,
                                     path_, memo_.taken, cache_.counters);
    }
    retrace.set_kept_hits(beam_index_, keep);
    path_.ends_at_target = false;
    if (keep == 0) {
        path_.segments.clear();
        path_.hits.clear();
        path_.findings.clear();
        path_.target_hit.reset();
        memo_.taken.clear();
        memo_.noted.clear();
        retrace.truncate(beam_index_, 0);
        RayState start;
        start.p_mm = beam_.start_mm;
        start.d = direction_deg(beam_.direction_deg);
        start.medium = air_;
        return start;
    }
    const StepStart st = retrace.start(beam_index_, keep);
    // The aim_at mirrors the kept steps turned, turned as then.
    retrace.for_each_kept_turn(beam_index_, keep, [&](size_t e, const Vec2& normal) {
        placed_[e].turn_to(layout_.elements[e].kind, normal);
    });
    path_.segments.resize(keep);
    path_.hits.resize(keep);
    path_.findings.resize(st.findings);
    if (path_.target_hit && *path_.target_hit >= keep) path_.target_hit.reset();
    memo_.taken.resize(keep);
    memo_.noted.resize(st.noted);
    retrace.truncate(beam_index_, keep);
    return st.ray;
}

bool BeamTracer::step(RayState& ray, size_t count) {
    const Vec2 p = ray.p_mm, d = ray.d;  // where and how the step starts
    const double exit = ray.inside ? kInf : table_exit(p, d);
    const std::optional<SurfaceCrossing> c = memo_.accelerator.next(
        p, d, exit, count, [&](size_t i, SurfaceCrossing& best) { consider(i, ray, exit, best); },
        [&] { return nearest(ray, exit); }, cache_.counters);
    if (c || std::isfinite(exit))
        memo_.taken.push_back({p, p + (c ? c->dist : exit) * d,
                               c ? std::optional<uint32_t>(static_cast<uint32_t>(c->element)) : std::nullopt});
    if (!c) {
        if (ray.inside) {
            finding(Finding::Kind::LeftThroughEdge, *ray.inside, p);
            return false;
        }
        if (const std::optional<size_t> want = std::exchange(ray.expect, std::nullopt))
            check_aim(ray, *want, p, d, std::nullopt, 0, false);
        const Vec2 q = p + exit * d;
        path_.segments.push_back({p, q, exit, std::nullopt, 1.0, air_.group_index, air_.gvd_fs2_per_mm, air_.tod_fs3_per_mm});
        finding(Finding::Kind::LeftTable, SIZE_MAX, q);
        return false;
    }
    if (ray.inside && std::abs(c->height) > placed_[*ray.inside].half_aperture) {
        finding(Finding::Kind::LeftThroughEdge, *ray.inside, p + c->dist * d);
        return false;
    }
    // The element the last aim_at mirror sent the ray to, judged once this hit is known.
    const std::optional<size_t> aimed = std::exchange(ray.expect, std::nullopt);
    const Vec2 h = p + c->dist * d;
    path_.segments.push_back({p, h, c->dist, ray.inside, ray.medium.index, ray.medium.group_index,
                              ray.medium.gvd_fs2_per_mm, ray.medium.tod_fs3_per_mm});
    ray.s_mm += c->dist;
    ray.vertical_mm += ray.vertical_slope * c->dist;
    ray.delay_fs += group_delay_fs(ray.medium.group_index, c->dist);
    const size_t e = c->element;
    const ElementKind& kind = layout_.elements[e].kind;
    PlacedOptic& pl = placed_[e];
    if (pl.aim_pending) {  // the first beam to reach an aim_at mirror fixes its orientation
        pl.turn_to(kind, c->normal);
        if (retrace_) cache_.retrace.note_turn(beam_index_, e, pl.normal);
    }
    const Vec2& n = c->normal;
    TraceHit& hit = path_.hits.emplace_back();  // taken back where the element refuses it
    hit.element = e;
    hit.face = c->face;
    hit.point_mm = h;
    hit.direction_in = d;
    hit.s_mm = ray.s_mm;
    hit.group_delay_fs = ray.delay_fs;
    hit.cos_aoi = std::min(1.0, std::abs(d.dot(n)));
    hit.sin_aoi = std::min(1.0, std::abs(d.x() * n.y() - d.y() * n.x()));
    hit.height_mm = c->height;
    hit.half_aperture_mm = pl.half_aperture;
    hit.index_before = ray.medium.index;
    hit.walkoff_in_rad = ray.walkoff_rad;
    hit.vertical_slope_in = ray.vertical_slope;
    hit.vertical_mm = ray.vertical_mm;
    ray.last_surface = std::make_pair(e, c->face);

    const HitContext context{layout_,    placed_,      beam_, wave_polarization_, *cache_.air, air_,
                             memo_.samples, path_, memo_.noted, e,     *c};
    const HitOutcome outcome =
        std::visit([&](const auto& element_kind) { return interact(element_kind, context, ray, hit); }, kind);
    if (outcome == HitOutcome::Refused) {
        path_.hits.pop_back();
        return false;
    }
    hit.direction_out = ray.d;
    hit.index_after = ray.medium.index;
    if (aimed) {
        const Interaction i = hit.interaction;
        const bool passes_on = outcome != HitOutcome::Stop && (i == Interaction::ThinLens || i == Interaction::Refract ||
                                                                i == Interaction::TargetPlane);
        check_aim(ray, *aimed, p, d, e, c->dist, passes_on);
    }
    if (target_ && e == *target_ && hit.interaction == Interaction::TargetPlane && !path_.target_hit)
        path_.target_hit = path_.hits.size() - 1;
    ray.delay_fs = delay_after(hit);
    if (outcome == HitOutcome::Stop) return false;
    if (outcome == HitOutcome::GoOn) ray.p_mm = h;
    return true;
}

void BeamTracer::run() {
    RayState ray = resume();
    for (size_t count = path_.hits.size();; ++count) {
        if (retrace_) cache_.retrace.record_start(beam_index_, {ray, path_.findings.size(), memo_.noted.size(), {}});
        if (stop_at_target_ && path_.target_hit && *path_.target_hit + 1 == path_.hits.size() && may_stop_at_target()) {
            path_.ends_at_target = true;  // the start just noted is where go_on continues
            break;
        }
        if (count >= kMaxHitsPerBeam) {
            finding(Finding::Kind::TooManyHits, SIZE_MAX, ray.p_mm, static_cast<double>(kMaxHitsPerBeam));
            break;
        }
        if (!step(ray, count)) break;
    }
    if (!path_.target_hit)
        finding(Finding::Kind::NoTarget, target_.value_or(SIZE_MAX), ray.p_mm).element = layout_.target;
    // A path that ended at the target while replaying repeated a prefix of the recorded steps.
    const StepAccelerator& a = memo_.accelerator;
    const bool repeated = a.replaying() && (memo_.taken.size() == a.recorded_steps() ||
                                            (path_.ends_at_target && memo_.taken.size() < a.recorded_steps()));
    if (record_ && !repeated) memo_.accelerator.record(memo_.taken, placed_);
}

void trace_layout(const Layout& layout, const MaterialLibrary& library, TraceCache& c, std::vector<Path>& paths,
                  TraceMode mode, const std::vector<size_t>* edited = nullptr) {
    const bool retrace = mode.retrace;
    // Start afresh when the cache was made for another list of elements or beams, or with
    // another material library.
    const size_t n = layout.elements.size();
    const std::shared_ptr<const void> storage = library.storage();
    bool same = c.library == storage && c.element_kinds.size() == n && c.beams.size() == layout.beams.size();
    if (same && retrace && edited && c.retrace.valid()) {  // the others are vouched for
        for (size_t i : *edited) same = same && (i >= n || c.element_kinds[i] == layout.elements[i].kind.index());
    } else {
        for (size_t i = 0; same && i < n; ++i) same = c.element_kinds[i] == layout.elements[i].kind.index();
    }
    if (!same) {
        std::vector<Path> kept_storage = std::move(c.paths);
        std::vector<std::optional<Polarization>> waves = std::move(c.crystal_polarization);
        const bool waves_known = c.crystal_polarization_known;
        c = TraceCache{};
        c.paths = std::move(kept_storage);
        c.crystal_polarization = std::move(waves);  // the caller's, not a trace's memory
        c.crystal_polarization_known = waves_known;
        c.library = storage;
        c.air = library.find("air");
        for (const Element& e : layout.elements) c.element_kinds.push_back(e.kind.index());
        c.beams.resize(layout.beams.size());
        c.retrace.resize_beams(layout.beams.size());
    }
    for (size_t b = 0; b < layout.beams.size(); ++b) {
        TraceCache::Beam& beam = c.beams[b];
        if (beam.wavelength_nm == layout.beams[b].wavelength_nm && beam.samples.slab.size() == n) continue;
        beam = TraceCache::Beam{};
        c.retrace.reset_beam(b);
        beam.wavelength_nm = layout.beams[b].wavelength_nm;
        const IndexSample air = sample_index(*c.air, beam.wavelength_nm);
        beam.air_medium = Medium{1.0, air.group_index, air.gvd_fs2_per_mm, air.tod_fs3_per_mm};
        beam.samples.resize(n);
    }
    if (retrace) {
        c.retrace.begin(layout, edited);
        const bool links_same = c.retrace.links_same();
        place_elements(layout, library, c.placement, c.placed, &c.retrace.changed_flags(), links_same,
                       &c.retrace.changed());
        c.retrace.list_changes(c.placed, c.placement.aim_mirrors);
    } else {
        c.retrace.forget();
        place_elements(layout, library, c.placement, c.placed);
    }
    paths.resize(layout.beams.size());
    for (size_t b = 0; b < layout.beams.size(); ++b) BeamTracer(layout, b, c, mode, paths[b]).run();
    if (retrace) c.retrace.end(c.placed);
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
        ++cache.counters.traced_past_target;
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
