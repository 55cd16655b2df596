#include "io/layout_reader.hpp"

#include <cctype>
#include <cmath>
#include <fstream>
#include <functional>
#include <limits>
#include <map>
#include <sstream>
#include <string_view>
#include <unordered_map>

#include "io/bounded_read.hpp"
#include "io/closest_name.hpp"
#include "io/field_reader.hpp"
#include "layout/element_kinds.hpp"
#include "layout/enum_names.hpp"
#include "layout/lens_shape.hpp"
#include "layout/process_text.hpp"
#include "materials/dispersion.hpp"
#include "materials/thermo_optic.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

using nlohmann::json;
using Keys = std::vector<std::string>;

const Keys kCommonKeys = {"id", "type", "at_mm", "normal_deg", "aperture_mm", "transmission"};

DamageThreshold read_damage(FieldReader& f) {
    DamageThreshold d;
    d.fluence_j_cm2 = f.number("damage_fluence_j_cm2", Need::Optional,
                               positive_within(limits::kSmallestPositive, limits::kMaxFluence_j_cm2, "J/cm²"));
    d.intensity_gw_cm2 = f.number("damage_intensity_gw_cm2", Need::Optional,
                                  positive_within(limits::kSmallestPositive, limits::kMaxIntensity_gw_cm2, "GW/cm²"));
    return d;
}

Keys with_common(const Keys& own) {
    Keys k = kCommonKeys;
    k.insert(k.end(), own.begin(), own.end());
    return k;
}


class Reader {
public:
    explicit Reader(Diagnostics& out) : out_(out) {}

    std::optional<Layout> read(const json& doc);

private:
    void read_table(const json& v, Layout& layout);
    void read_materials(const json& v, Layout& layout);
    void read_beam(const json& v, const std::string& ptr, Layout& layout);
    void read_element(const json& v, const std::string& ptr, Layout& layout);
    std::optional<ElementKind> read_kind(const std::string& type, FieldReader& f,
                                         const std::string& ptr);
    bool read_fields(Lens& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Mirror& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Dichroic& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Plate& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Retroreflector& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Stage& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Crystal& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Target& kind, FieldReader& f, const std::string& ptr);
    bool read_fields(Dump& kind, FieldReader& f, const std::string& ptr);
    std::optional<Lens> read_lens(FieldReader& f);
    std::optional<std::string> material_name(FieldReader& f, const std::string& key);
    bool real_index_for_beams(FieldReader& f, const std::string& key, const Material& material);
    ToleranceAdjusters read_adjusters(const json& v);
    void check_adjusters(const Layout& layout, const std::function<std::string(const std::string&)>& no_element,
                         const std::function<const Element*(const std::string&)>& find);
    void check_references(const json& doc, Layout& layout);

    void error(const std::string& pointer, const std::string& message) {
        out_.push_back({Diagnostic::Severity::Error, pointer, 0, 0, message});
    }

    Diagnostics& out_;
    MaterialLibrary library_ = MaterialLibrary::builtin();
    std::map<std::string, std::string> element_pointers_;  // id → pointer of its "id"
    std::vector<std::pair<std::string, double>> beam_wavelengths_nm_;  // each beam read: id, λ
};

std::optional<Layout> Reader::read(const json& doc) {
    if (!doc.is_object()) {
        error("", "expected a layout object, found " + describe_json_type(doc));
        return std::nullopt;
    }
    FieldReader root(doc, "", "a layout", out_);
    if (const auto format = root.string("format", Need::Required); format &&
                                                                   *format != "rendezvous-layout")
        root.error("format", "expected \"rendezvous-layout\", found \"" + *format + "\"");
    if (const auto version = root.number("version", Need::Required); version && *version != 1.0) {
        std::ostringstream s;
        s << "unsupported version " << *version << "; this program reads version 1";
        root.error("version", s.str());
    }
    Layout layout;
    layout.name = root.string("name", Need::Optional).value_or("");
    if (const json* t = root.object("table", Need::Optional)) read_table(*t, layout);
    if (const json* m = root.array("materials", Need::Optional)) read_materials(*m, layout);
    if (const json* beams = root.array("beams", Need::Required)) {
        if (beams->empty() || beams->size() > 2)
            root.error("beams", "expected one or two beams, found " + std::to_string(beams->size()));
        for (size_t i = 0; i < beams->size(); ++i)
            read_beam((*beams)[i], child_pointer("/beams", i), layout);
    }
    if (const json* elements = root.array("elements", Need::Required))
        for (size_t i = 0; i < elements->size(); ++i)
            read_element((*elements)[i], child_pointer("/elements", i), layout);
    layout.target = root.string("target", Need::Required).value_or("");
    if (const json* goals = root.object("goals", Need::Optional)) {
        FieldReader g(*goals, "/goals", "the goals", out_);
        if (const json* w = g.object("waist_um", Need::Optional)) {
            for (const auto& item : w->items()) {
                FieldReader wr(*w, "/goals/waist_um", "the waist goals", out_);
                if (const auto v = wr.number(item.key(), Need::Required,
                                             positive_within(limits::kMinWaist_um, limits::kMaxWaist_um, "µm")))
                    layout.goals.waist_um.emplace_back(item.key(), *v);
            }
        }
        if (const json* v = g.object("verdict", Need::Optional)) {
            FieldReader vr(*v, "/goals/verdict", "the verdict thresholds", out_);
            VerdictThresholds& t = layout.goals.verdict;
            t.max_waist_offset_rayleigh = vr.number("max_waist_offset_rayleigh", Need::Optional, positive()).value_or(t.max_waist_offset_rayleigh);
            t.max_waist_ratio = vr.number("max_waist_ratio", Need::Optional, at_least(1.0)).value_or(t.max_waist_ratio);
            t.max_lateral_offset_radius = vr.number("max_lateral_offset_radius", Need::Optional, positive()).value_or(t.max_lateral_offset_radius);
            t.max_delay_xcorr = vr.number("max_delay_xcorr", Need::Optional, positive()).value_or(t.max_delay_xcorr);
            t.min_phase_factor = vr.number("min_phase_factor", Need::Optional, between(0, 1)).value_or(t.min_phase_factor);
            t.max_goal_waist_error = vr.number("max_goal_waist_error", Need::Optional, positive()).value_or(t.max_goal_waist_error);
            vr.finish({"max_waist_offset_rayleigh", "max_waist_ratio", "max_lateral_offset_radius",
                       "max_delay_xcorr", "min_phase_factor", "max_goal_waist_error"});
        }
        if (const json* sv = g.object("solve", Need::Optional)) {
            FieldReader sr(*sv, "/goals/solve", "the solver goals", out_);
            SolveGoals sg;
            if (const auto aim = sr.choice("aim", Need::Optional, texts_of(kSolveAimNames)))
                sg.aim = value_named(kSolveAimNames, *aim).value_or(SolveGoals::Aim::Waist);
            if (const json* mv = sr.object("move", Need::Optional)) {
                FieldReader mr(*mv, "/goals/solve/move", "the moves", out_);
                for (const auto& item : mv->items())
                    // A range of ±1e308 mm once wrote "at_mm": [null, null] (issue 19).
                    if (const auto range = mr.interval(item.key(), Need::Required, length_mm())) sg.move.emplace_back(item.key(), *range);
            }
            sg.swap = sr.strings("swap", Need::Optional).value_or(std::vector<std::string>{});
            sg.min_spacing_mm = sr.number("min_spacing_mm", Need::Optional, between(0, limits::kMaxLength_mm)).value_or(sg.min_spacing_mm);
            sg.table_margin_mm = sr.number("table_margin_mm", Need::Optional, between(0, limits::kMaxLength_mm)).value_or(sg.table_margin_mm);
            sg.max_path_mm = sr.number("max_path_mm", Need::Optional, positive_length_mm());
            sr.finish({"aim", "move", "swap", "min_spacing_mm", "table_margin_mm", "max_path_mm"});
            layout.goals.solve = sg;
        }
        if (const json* tv = g.object("tolerance", Need::Optional)) {
            FieldReader tr(*tv, "/goals/tolerance", "the tolerances", out_);
            Tolerances& t = layout.goals.tolerance;
            t.position_mm = tr.number("position_mm", Need::Optional, between(0, limits::kMaxLength_mm)).value_or(t.position_mm);
            t.angle_mrad = tr.number("angle_mrad", Need::Optional, between(0, 1e3 * deg_to_rad(limits::kMaxAngle_deg))).value_or(t.angle_mrad);
            t.focal_length_fraction = tr.number("focal_length_fraction", Need::Optional, between(0, 0.5)).value_or(t.focal_length_fraction);
            t.stage_mm = tr.number("stage_mm", Need::Optional, between(0, limits::kMaxLength_mm)).value_or(t.stage_mm);
            if (const json* av = tr.object("adjust", Need::Optional)) t.adjust = read_adjusters(*av);
            tr.finish({"position_mm", "angle_mrad", "focal_length_fraction", "stage_mm", "adjust"});
        }
        g.finish({"waist_um", "verdict", "solve", "tolerance"});
    }
    root.finish({"format", "version", "name", "table", "materials", "beams", "elements", "target",
                 "goals"});
    check_references(doc, layout);
    if (has_errors(out_)) return std::nullopt;
    return layout;
}

// goals.tolerance.adjust: the shapes here; which elements the ids name, in check_adjusters.
ToleranceAdjusters Reader::read_adjusters(const json& v) {
    FieldReader f(v, "/goals/tolerance/adjust", "the adjusters", out_);
    ToleranceAdjusters a;
    a.stage = f.id("stage", Need::Optional);
    a.crystal = f.id("crystal", Need::Optional);
    a.refocus = f.strings("refocus", Need::Optional).value_or(std::vector<std::string>{});
    if (const json* walk = f.array("walk", Need::Optional)) {
        for (size_t i = 0; i < walk->size(); ++i) {
            const json& pair = (*walk)[i];
            const std::string ptr = child_pointer(f.pointer("walk"), i);
            bool ok = pair.is_array() && !pair.empty() && pair.size() <= 2;
            for (size_t k = 0; ok && k < pair.size(); ++k) ok = pair[k].is_string();
            if (!ok) {
                error(ptr, "expected one or two mirror ids of one beam's path, as [\"M1\", \"M2\"], found " +
                               describe_json_type(pair) +
                               (pair.is_array() ? " of " + std::to_string(pair.size()) + " entries" : ""));
                continue;
            }
            std::vector<std::string> ids;
            for (const json& id : pair) ids.push_back(id.get<std::string>());
            a.walk.push_back(std::move(ids));
        }
    }
    f.finish({"stage", "walk", "refocus", "crystal"});
    return a;
}

void Reader::read_table(const json& v, Layout& layout) {
    FieldReader f(v, "/table", "the table", out_);
    if (f.has("size_mm")) {
        // A table of 1e-9 mm or 1e6 mm once crashed the drawing (issue 19): [1 cm, 100 m].
        if (const auto size = f.numbers("size_mm", Need::Required,
                                        positive_within(limits::kMinTable_mm, limits::kMaxTable_mm, "mm"))) {
            if (size->size() != 2) f.error("size_mm", "expected [width, height] in mm");
            else layout.table.width_mm = (*size)[0], layout.table.height_mm = (*size)[1];
        }
    }
    if (const auto grid = f.number("grid_mm", Need::Optional)) {
        if (*grid != 25.0 && *grid != 25.4) {
            std::ostringstream s;
            s << "expected 25 (metric) or 25.4 (imperial), found " << *grid;
            f.error("grid_mm", s.str());
        } else {
            layout.table.grid_mm = *grid;
        }
    }
    f.finish({"size_mm", "grid_mm"});
}

void Reader::read_materials(const json& v, Layout& layout) {
    for (size_t i = 0; i < v.size(); ++i) {
        const std::string ptr = child_pointer("/materials", i);
        FieldReader f(v[i], ptr, "a user material", out_);
        if (!v[i].is_object()) {
            error(ptr, "expected a material object, found " + describe_json_type(v[i]));
            continue;
        }
        UserMaterial m;
        const auto id = f.id("id", Need::Required);
        const auto range = f.interval("range_nm", Need::Required);
        std::optional<std::vector<double>> b, c;
        if (const json* s = f.object("sellmeier", Need::Required)) {
            FieldReader sf(*s, ptr + "/sellmeier", "Sellmeier coefficients", out_);
            b = sf.numbers("b", Need::Required, between(-limits::kMaxSellmeierB, limits::kMaxSellmeierB));
            c = sf.numbers("c_um2", Need::Required, between(-limits::kMaxSellmeierC_um2, limits::kMaxSellmeierC_um2));
            if (b && c && (b->size() != c->size() || b->empty())) {
                sf.error("c_um2", "expected as many C as B coefficients (" +
                                      std::to_string(b->size()) + "), found " +
                                      std::to_string(c->size()));
                c.reset();
            }
            sf.finish({"b", "c_um2"});
        }
        m.source = f.string("source", Need::Optional).value_or("");
        f.finish({"id", "sellmeier", "range_nm", "source"});
        if (range && range->first <= 0) {
            f.error("range_nm", "wavelengths must be positive");
            continue;
        }
        if (!id || !range || !b || !c) continue;
        if (library_.find(*id)) {
            f.error("id", "\"" + *id + "\" is already a material name");
            continue;
        }
        m.id = *id;
        m.b = *b;
        m.c_um2 = *c;
        m.min_wavelength_nm = range->first;
        m.max_wavelength_nm = range->second;
        library_ = library_.with(user_sellmeier_material(m.id, m.b, m.c_um2, m.min_wavelength_nm,
                                                         m.max_wavelength_nm, m.source));
        layout.materials.push_back(std::move(m));
    }
}

void Reader::read_beam(const json& v, const std::string& ptr, Layout& layout) {
    if (!v.is_object()) {
        error(ptr, "expected a beam object, found " + describe_json_type(v));
        return;
    }
    FieldReader f(v, ptr, "a beam", out_);
    BeamSource b;
    b.id = f.id("id", Need::Required).value_or("");
    b.wavelength_nm = f.wavelength_nm("wavelength_nm", Need::Required).value_or(0);
    b.start_mm = f.point("start_mm", Need::Required).value_or(Vec2(0, 0));
    b.direction_deg = f.number("direction_deg", Need::Required, angle_deg()).value_or(0);
    // A waist of 1e-320 µm or 1e300 µm once made the caustic sampler run away (issue 19).
    b.waist_um = f.plane_pair("waist_um", Need::Required,
                              positive_within(limits::kMinWaist_um, limits::kMaxWaist_um, "µm"))
                     .value_or(PlanePair{});
    b.waist_at_mm = f.plane_pair("waist_at_mm", Need::Optional, length_mm()).value_or(PlanePair{});
    b.m2 = f.plane_pair("m2", Need::Optional, between(1.0, limits::kMaxM2)).value_or(PlanePair{1, 1});
    b.pulse_fwhm_fs = f.number("pulse_fwhm_fs", Need::Optional,
                               positive_within(limits::kMinPulse_fs, limits::kMaxPulse_fs, "fs"));
    // The source's chirp, either sign; bounded so that the stretched length stays finite.
    b.input_gdd_fs2 = f.number("input_gdd_fs2", Need::Optional, between(-1e9, 1e9, "fs²"));
    b.emit_time_fs = f.number("emit_time_fs", Need::Optional, between(-limits::kMaxTime_fs, limits::kMaxTime_fs, "fs")).value_or(0);
    b.power_mw = f.number("power_mw", Need::Optional, positive_within(limits::kMinPower_mw, limits::kMaxPower_mw, "mW"));
    b.repetition_rate_khz = f.number("repetition_rate_khz", Need::Optional,
                                     positive_within(limits::kMinRepetitionRate_khz, limits::kMaxRepetitionRate_khz, "kHz"));
    b.polarized_fraction = f.number("polarized_fraction", Need::Optional, between(0, 1)).value_or(1.0);
    using K = Polarization::Kind;
    if (const auto pol = f.choice("polarization", Need::Optional, texts_of(kPolarizationNames)))
        b.polarization.kind = value_named(kPolarizationNames, *pol).value_or(K::Horizontal);
    if (b.polarization.kind == K::Linear)
        b.polarization.angle_deg = f.number("polarization_angle_deg", Need::Required, angle_deg()).value_or(0);
    else if (f.has("polarization_angle_deg"))
        f.error("polarization_angle_deg", "only allowed with \"polarization\": \"linear\"");
    f.finish({"id", "wavelength_nm", "start_mm", "direction_deg", "waist_um", "waist_at_mm", "m2",
              "pulse_fwhm_fs", "input_gdd_fs2", "emit_time_fs", "polarization", "polarization_angle_deg",
              "power_mw", "repetition_rate_khz", "polarized_fraction"});
    if (!b.id.empty()) {
        if (element_pointers_.count(b.id))
            error(ptr + "/id", "duplicate id \"" + b.id + "\" (first used at " +
                                   element_pointers_[b.id] + ")");
        else
            element_pointers_[b.id] = ptr + "/id";
    }
    if (b.wavelength_nm > 0) beam_wavelengths_nm_.emplace_back(b.id, b.wavelength_nm);
    layout.beams.push_back(std::move(b));
}

std::optional<std::string> Reader::material_name(FieldReader& f, const std::string& key) {
    const auto name = f.string(key, Need::Required);
    if (!name) return std::nullopt;
    if (const Material* m = library_.find(*name)) return real_index_for_beams(f, key, *m) ? name : std::nullopt;
    std::string message = "unknown material \"" + *name + "\"";
    if (const auto near = closest_catalogue_name(*name, library_.names()))
        message += "; did you mean \"" + *near + "\"?";
    f.error(key, message);
    return std::nullopt;
}

// A dispersion formula has poles (Sellmeier: n² = 1 + Σ B λ²/(λ² − C) is infinite at λ² = C
// and negative just below): a beam's wavelength on or next to one gives no real index, and the
// propagation NaN or a Rayleigh range of 1e-13 mm (issue 19). Each principal axis is asked at
// the wavelength of each beam (either may meet the element; which one does is the trace's), and
// an index that is not finite or below 1, or a group index that is not finite, is refused.
bool Reader::real_index_for_beams(FieldReader& f, const std::string& key, const Material& material) {
    const int axes = material.symmetry == Symmetry::Isotropic ? 1 : material.symmetry == Symmetry::Uniaxial ? 2 : 3;
    for (const auto& [beam, wavelength_nm] : beam_wavelengths_nm_)
        for (int a = 0; a < axes; ++a) {
            const IndexSample s = sample_index(material, wavelength_nm, static_cast<Axis>(a));
            if (std::isfinite(s.index) && s.index >= 1 && std::isfinite(s.group_index)) continue;
            std::ostringstream m;
            m.precision(6);
            m << material.name << " has no real index at " << wavelength_nm << " nm (beam \"" << beam
              << "\"): its dispersion formula gives ";
            if (std::isfinite(s.index)) m << "n = " << s.index;
            else m << "no finite n";
            m << ", near a pole; expected an index of at least 1";
            f.error(key, m.str());
            return false;
        }
    return true;
}

std::optional<Lens> Reader::read_lens(FieldReader& f) {
    const bool thick = f.has("center_thickness_mm") || f.has("front_radius_mm") ||
                       f.has("back_radius_mm") || f.has("shape");
    if (!thick) {
        const auto focal = f.number("focal_length_mm", Need::Required, non_zero_length_mm());
        if (!f.has("glass")) {
            if (f.has("design_wavelength_nm"))
                f.error("design_wavelength_nm", "needs \"glass\" (an ideal lens has no dispersion)");
            return focal ? std::optional<Lens>(Lens{IdealLens{*focal}}) : std::nullopt;
        }
        const auto glass = material_name(f, "glass");
        const double design = f.wavelength_nm("design_wavelength_nm", Need::Optional).value_or(587.6);
        if (!focal || !glass) return std::nullopt;
        return Lens{ThinChromaticLens{*focal, *glass, design}};
    }
    ThickLens t;
    const auto glass = material_name(f, "glass");
    const auto thickness = f.number("center_thickness_mm", Need::Required, positive_length_mm());
    t.design_wavelength_nm = f.wavelength_nm("design_wavelength_nm", Need::Optional).value_or(587.6);
    constexpr double flat = std::numeric_limits<double>::infinity();
    if (f.has("shape")) {
        f.forbid_together("front_radius_mm", "shape");
        f.forbid_together("back_radius_mm", "shape");
        const auto shape = f.choice("shape", Need::Required, lens_shape_names());
        const auto focal = f.number("focal_length_mm", Need::Required, non_zero_length_mm());
        if (!glass || !thickness || !shape || !focal) return std::nullopt;
        const double n = sample_index(*library_.find(*glass), t.design_wavelength_nm).index;
        std::string why;
        const auto radii = radii_for_shape(*shape, *focal, *thickness, n, &why);
        if (!radii) {
            f.error("focal_length_mm", "no " + *shape + " lens has this focal length: " + why);
            return std::nullopt;
        }
        t.front_radius_mm = radii->front_radius_mm;
        t.back_radius_mm = radii->back_radius_mm;
        t.shape = *shape;
        t.focal_length_mm = *focal;
    } else {
        if (f.has("focal_length_mm"))
            f.error("focal_length_mm", "not allowed with radii (the radii set the focal length)");
        if (f.has("design_wavelength_nm"))
            f.error("design_wavelength_nm", "only used with \"shape\"");
        const auto r1 = f.number("front_radius_mm", Need::Optional, non_zero_length_mm());
        const auto r2 = f.number("back_radius_mm", Need::Optional, non_zero_length_mm());
        if (!f.has("front_radius_mm") && !f.has("back_radius_mm"))
            f.error("", "a thick lens needs \"front_radius_mm\", \"back_radius_mm\" or \"shape\"");
        if (!glass || !thickness || (f.has("front_radius_mm") && !r1) ||
            (f.has("back_radius_mm") && !r2))
            return std::nullopt;
        t.front_radius_mm = r1.value_or(flat);
        t.back_radius_mm = r2.value_or(flat);
    }
    t.glass = *glass;
    t.center_thickness_mm = *thickness;
    return Lens{t};
}

bool Reader::read_fields(Lens& lens, FieldReader& f, const std::string&) {
    f.finish(with_common({"part", "focal_length_mm", "glass", "design_wavelength_nm",
                          "center_thickness_mm", "front_radius_mm", "back_radius_mm", "shape"}));
    // A catalog id, printable like every id; whether a catalog holds it is checked where a
    // catalog is known (io/lens_parts.hpp), not here.
    const std::optional<std::string> part = f.id("part", Need::Optional);
    auto read = read_lens(f);
    if (!read) return false;
    lens = std::move(*read);
    lens.part = part;
    return true;
}

bool Reader::read_fields(Mirror& m, FieldReader& f, const std::string&) {
    m.radius_of_curvature_mm = f.number("radius_of_curvature_mm", Need::Optional, non_zero_length_mm());
    m.aim_at = f.string("aim_at", Need::Optional);
    m.retardance_deg = f.number("retardance_deg", Need::Optional, angle_deg()).value_or(0);
    f.forbid_together("normal_deg", "aim_at");
    f.finish(with_common({"radius_of_curvature_mm", "aim_at", "retardance_deg"}));
    return true;
}

bool Reader::read_fields(Dichroic& d, FieldReader& f, const std::string& ptr) {
    d.edge_nm = f.wavelength_nm("edge_nm", Need::Required).value_or(0);
    if (const auto reflects = f.choice("reflects", Need::Required, texts_of(kDichroicReflectsNames)))
        d.reflects_shorter = value_named(kDichroicReflectsNames, *reflects).value_or(true);
    if (const json* s = f.object("substrate", Need::Required)) {
        FieldReader sf(*s, ptr + "/substrate", "a dichroic substrate", out_);
        d.substrate.material = material_name(sf, "glass").value_or("");
        d.substrate.thickness_mm = sf.number("thickness_mm", Need::Required, positive_length_mm()).value_or(0);
        sf.finish({"glass", "thickness_mm"});
    }
    d.retardance_deg = f.number("retardance_deg", Need::Optional, angle_deg()).value_or(0);
    f.finish(with_common({"edge_nm", "reflects", "substrate", "retardance_deg"}));
    return true;
}

bool Reader::read_fields(Plate& p, FieldReader& f, const std::string&) {
    using R = Plate::Role;
    if (const auto role = f.choice("role", Need::Optional, texts_of(kPlateRoleNames)))
        p.role = value_named(kPlateRoleNames, *role).value_or(R::Window);
    p.slab.material = material_name(f, "material").value_or("");
    p.slab.thickness_mm = f.number("thickness_mm", Need::Required, positive_length_mm()).value_or(0);
    const bool wave = p.role == R::HalfWave || p.role == R::QuarterWave;
    const bool polarizing = p.role == R::PolarizingCube || p.role == R::Polarizer;
    auto only = [&](const char* key, bool allowed, const char* what) {
        if (f.has(key) && !allowed) f.error(key, std::string("only for ") + what);
    };
    only("fast_axis_deg", wave || p.role == R::Polarizer, "wave plates and polarizers");
    only("design_nm", wave, "wave plates");
    only("retarder_material", wave, "wave plates");
    only("order", wave, "wave plates");
    only("retarder_thickness_um", wave, "wave plates");
    only("extinction_ratio", polarizing, "polarizing cubes and polarizers");
    only("reflects", p.role == R::PolarizingCube, "polarizing cubes");
    p.fast_axis_deg = f.number("fast_axis_deg", Need::Optional, angle_deg()).value_or(0);
    if (wave) {
        p.retarder_thickness_um = f.number("retarder_thickness_um", Need::Optional,
                                           positive_within(1e3 * limits::kMinNonZeroLength_mm, 1e3 * limits::kMaxLength_mm, "µm"));
        p.design_nm = f.wavelength_nm("design_nm", p.retarder_thickness_um ? Need::Optional : Need::Required);
        if (f.has("retarder_material")) {
            p.retarder_material = material_name(f, "retarder_material");
            const Material* m = p.retarder_material ? library_.find(*p.retarder_material) : nullptr;
            if (m && m->symmetry != Symmetry::Uniaxial)
                f.error("retarder_material", "must be a uniaxial crystal (quartz, MgF2); " + m->name + " is not");
        } else if (p.retarder_thickness_um) {
            f.error("retarder_thickness_um", "needs \"retarder_material\" (the birefringence comes from it)");
        }
        p.order = static_cast<int>(f.number("order", Need::Optional, between(0, 1000)).value_or(0));
    }
    if (polarizing) p.extinction_ratio = f.number("extinction_ratio", Need::Optional, at_least(1)).value_or(1000);
    if (p.role == R::PolarizingCube)
        if (const auto reflects = f.choice("reflects", Need::Optional, texts_of(kCubeReflectsNames)))
            p.reflects_left = value_named(kCubeReflectsNames, *reflects).value_or(true);
    f.finish(with_common({"role", "material", "thickness_mm", "fast_axis_deg", "design_nm", "retarder_material",
                          "order", "retarder_thickness_um", "extinction_ratio", "reflects"}));
    return true;
}

bool Reader::read_fields(Retroreflector&, FieldReader& f, const std::string&) {
    f.finish(kCommonKeys);
    return true;
}

bool Reader::read_fields(Stage& s, FieldReader& f, const std::string&) {
    s.carries = f.strings("carries", Need::Required).value_or(std::vector<std::string>{});
    if (f.has("carries") && f.object_at("carries").is_array() && f.object_at("carries").empty())
        f.error("carries", "expected at least one element id");
    s.axis_deg = f.number("axis_deg", Need::Required, angle_deg()).value_or(0);
    // A stage at 1e300 mm once crashed the drawing (issue 19): every reading within ±100 m.
    s.position_mm = f.number("position_mm", Need::Optional, length_mm()).value_or(0);
    if (const auto travel = f.interval("travel_mm", Need::Required, length_mm())) {
        s.travel_min_mm = travel->first;
        s.travel_max_mm = travel->second;
        if (s.position_mm < s.travel_min_mm || s.position_mm > s.travel_max_mm) {
            std::ostringstream m;
            m << "must lie within the travel [" << s.travel_min_mm << ", " << s.travel_max_mm
              << "] (got " << s.position_mm << ")";
            f.error("position_mm", m.str());
        }
    }
    s.measured_zero_mm = f.number("measured_zero_mm", Need::Optional, length_mm());
    for (const char* key : {"at_mm", "normal_deg", "aperture_mm", "transmission"})
        if (f.has(key)) f.error(key, "a stage has no position of its own; it moves what it carries");
    f.finish({"id", "type", "carries", "axis_deg", "position_mm", "travel_mm",
              "measured_zero_mm", "at_mm", "normal_deg", "aperture_mm", "transmission"});
    return true;
}

bool Reader::read_fields(Crystal& c, FieldReader& f, const std::string&) {
    c.material = material_name(f, "material").value_or("");
    c.length_mm = f.number("length_mm", Need::Required, positive_length_mm()).value_or(0);
    c.cut_deg = f.number("cut_deg", Need::Required, between(0, 90)).value_or(0);
    if (const auto type = f.choice("phase_matching", Need::Required, texts_of(kPhaseMatchingNames)))
        c.phase_matching = value_named(kPhaseMatchingNames, *type).value_or(Crystal::PhaseMatching::TypeI);
    if (const auto axis = f.choice("optic_axis", Need::Optional, texts_of(kOpticAxisNames)))
        c.optic_axis_horizontal = value_named(kOpticAxisNames, *axis).value_or(false);
    if (const auto plane = f.choice("principal_plane", Need::Optional, texts_of(kPrincipalPlaneNames))) {
        c.principal_plane = value_named(kPrincipalPlaneNames, *plane).value_or(PrincipalPlane::XY);
        const Material* m = library_.find(c.material);
        if (m && m->symmetry != Symmetry::Biaxial)
            f.error("principal_plane", "only for biaxial crystals; " + m->name + " is not biaxial");
    }
    // A tilt beyond ±45° would put the face nearly along the beam (common practice: a few
    // degrees of tilt on a mount).
    c.tilt_deg = f.number("tilt_deg", Need::Optional, between(-45, 45)).value_or(0);
    // Crystal ovens run from room temperature to about 200 °C (common practice); the range
    // leaves room on both sides.
    c.temperature_c = f.number("temperature_c", Need::Optional, between(kMinCrystalTemperature_c, kMaxCrystalTemperature_c));
    if (c.temperature_c) {
        const Material* m = library_.find(c.material);
        if (m && !m->thermo_optic) {
            std::string with;
            for (const Material& s : library_.materials())
                if (s.thermo_optic) with += (with.empty() ? "" : ", ") + s.name;
            f.error("temperature_c", m->name + " has no temperature dependence" +
                                         (with.empty() ? std::string() : "; sets with one: " + with));
        }
    }
    if (const auto process = f.string("process", Need::Optional)) {
        // "sfg", or "shg:BEAM" (the beam's id is checked with the other references).
        if (const auto choice = parse_process_text(*process)) {
            c.process = choice->process;
            if (choice->process == Crystal::Process::SecondHarmonic) c.process_beam = choice->beam;
        } else {
            f.error("process", "expected " + std::string(kProcessTextForms));
        }
    }
    c.damage = read_damage(f);
    f.finish(with_common({"material", "length_mm", "cut_deg", "phase_matching", "optic_axis",
                          "principal_plane", "tilt_deg", "temperature_c", "process", "damage_fluence_j_cm2",
                          "damage_intensity_gw_cm2"}));
    return true;
}

bool Reader::read_fields(Target& t, FieldReader& f, const std::string&) {
    t.damage = read_damage(f);
    f.finish(with_common({"damage_fluence_j_cm2", "damage_intensity_gw_cm2"}));
    return true;
}

bool Reader::read_fields(Dump&, FieldReader& f, const std::string&) {
    f.finish(kCommonKeys);
    return true;
}

std::optional<ElementKind> Reader::read_kind(const std::string& type, FieldReader& f,
                                             const std::string& ptr) {
    std::optional<ElementKind> kind = element_kind_named(type);
    if (!kind) return std::nullopt;  // read_element has said which names there are
    // One read_fields per kind: a kind without its own fails to compile here.
    const bool read = std::visit([&](auto& k) { return read_fields(k, f, ptr); }, *kind);
    return read ? kind : std::nullopt;
}

void Reader::read_element(const json& v, const std::string& ptr, Layout& layout) {
    if (!v.is_object()) {
        error(ptr, "expected an element object, found " + describe_json_type(v));
        return;
    }
    FieldReader f(v, ptr, "an element", out_);
    const auto type = f.string("type", Need::Required);
    if (!type) return;
    if (!element_kind_named(*type)) {
        std::string message = "unknown element type \"" + *type + "\"";
        if (const auto near = closest_name(*type, element_type_names()))
            message += "; did you mean \"" + *near + "\"?";
        else
            message += "; expected one of " + element_type_list();
        f.error("type", message);
        return;
    }
    FieldReader typed(v, ptr, "a " + *type, out_);
    Element e;
    e.id = typed.id("id", Need::Required).value_or("");
    if (*type != "stage") {
        e.at_mm = typed.point("at_mm", Need::Required).value_or(Vec2(0, 0));
        e.normal_deg = typed.number("normal_deg", Need::Optional, angle_deg()).value_or(0);
        e.aperture_mm = typed.number("aperture_mm", Need::Optional, positive_length_mm()).value_or(kDefaultAperture_mm);
        e.transmission = typed.number("transmission", Need::Optional, between(0, 1)).value_or(1.0);
    }
    std::optional<ElementKind> kind = read_kind(*type, typed, ptr);
    if (!e.id.empty()) {
        if (element_pointers_.count(e.id))
            error(ptr + "/id", "duplicate id \"" + e.id + "\" (first used at " +
                                   element_pointers_[e.id] + ")");
        else
            element_pointers_[e.id] = ptr + "/id";
    }
    if (!kind) return;
    e.kind = std::move(*kind);
    layout.elements.push_back(std::move(e));
}

void Reader::check_references(const json& doc, Layout& layout) {
    // Pointers by element index in the file (elements that failed to read are absent from
    // layout.elements, so walk the document for the positions).
    std::map<std::string, size_t> index_of;
    if (doc.contains("elements") && doc["elements"].is_array()) {
        const json& arr = doc["elements"];
        for (size_t i = 0; i < arr.size(); ++i)
            if (arr[i].is_object() && arr[i].contains("id") && arr[i]["id"].is_string())
                index_of.emplace(arr[i]["id"].get<std::string>(), i);
    }
    auto pointer_of = [&](const std::string& id, const std::string& key) {
        return child_pointer(child_pointer("/elements", index_of[id]), key);
    };
    // The elements read, by id, once (issue 19 §3: layout.find per reference was quadratic).
    std::unordered_map<std::string_view, const Element*> element_of;
    element_of.reserve(layout.elements.size());
    for (const Element& e : layout.elements) element_of.try_emplace(e.id, &e);
    auto find = [&](const std::string& id) -> const Element* {
        const auto it = element_of.find(id);
        return it == element_of.end() ? nullptr : it->second;
    };
    auto is_element = [&](const std::string& id) { return find(id) != nullptr; };
    // "no element has id …", with the closest id when it looks like a typo.
    std::vector<std::string> ids;
    for (const auto& [id, i] : index_of) ids.push_back(id);
    size_t suggestions = 0;  // a hostile file's thousands of bad references get no search each
    auto no_element = [&](const std::string& id) {
        std::string m = "no element has id \"" + id + "\"";
        if (id.size() <= 64 && ++suggestions <= 20)
            if (const auto near = closest_name(id, ids)) m += "; did you mean \"" + *near + "\"?";
        return m;
    };
    std::unordered_map<std::string, std::string> carried_by;
    std::map<std::string, std::pair<std::string, double>> temperature_of_set;  // set → crystal, °C
    for (const Element& e : layout.elements) {
        if (const auto* m = std::get_if<Mirror>(&e.kind); m && m->aim_at) {
            if (!index_of.count(*m->aim_at))
                error(pointer_of(e.id, "aim_at"), no_element(*m->aim_at));
            else if (*m->aim_at == e.id)
                error(pointer_of(e.id, "aim_at"), "a mirror cannot aim at itself");
            else if (is_element(*m->aim_at) && std::holds_alternative<Stage>(find(*m->aim_at)->kind))
                error(pointer_of(e.id, "aim_at"), "\"" + *m->aim_at + "\" is a stage, which has no position to aim at");
        }
        if (const auto* c = std::get_if<Crystal>(&e.kind); c && c->temperature_c) {
            // One library entry per set (material_library_for): two temperatures of one set
            // cannot both hold.
            const Material* m = library_.find(c->material);
            if (m && m->thermo_optic) {
                const auto [at, fresh] = temperature_of_set.emplace(m->name, std::make_pair(e.id, *c->temperature_c));
                if (!fresh && at->second.second != *c->temperature_c)
                    error(pointer_of(e.id, "temperature_c"),
                          "crystal \"" + at->second.first + "\" of the same set " + m->name + " is at " +
                              format_number("%g", at->second.second) +
                              " °C; one set has one temperature in a layout");
            }
        }
        if (const auto* c = std::get_if<Crystal>(&e.kind); c && c->process == Crystal::Process::SecondHarmonic) {
            bool found = false;
            std::vector<std::string> beam_ids;
            const std::string beam = c->process_beam.value_or("");
            for (const BeamSource& b : layout.beams) found = found || b.id == beam, beam_ids.push_back(b.id);
            if (!found) {
                std::string m = "no beam has id \"" + beam + "\"";
                if (const auto near = closest_name(beam, beam_ids))
                    m += "; did you mean \"shg:" + *near + "\"?";
                error(pointer_of(e.id, "process"), m);
            }
        }
        if (const auto* s = std::get_if<Stage>(&e.kind)) {
            for (size_t i = 0; i < s->carries.size(); ++i) {
                const std::string& c = s->carries[i];
                const std::string ptr = child_pointer(pointer_of(e.id, "carries"), i);
                if (c == e.id) {
                    error(ptr, "a stage cannot carry itself");
                } else if (!index_of.count(c)) {
                    error(ptr, no_element(c));
                } else if (is_element(c) && std::holds_alternative<Stage>(find(c)->kind)) {
                    error(ptr, "a stage cannot carry another stage (\"" + c + "\")");
                } else if (carried_by.count(c)) {
                    error(ptr, "\"" + c + "\" is already carried by stage \"" + carried_by[c] + "\"");
                } else {
                    carried_by[c] = e.id;
                }
            }
        }
    }
    if (!layout.target.empty()) {
        if (!index_of.count(layout.target)) {
            error("/target", no_element(layout.target));
        } else if (const Element* t = layout.find(layout.target);
                   t && !can_be_target(t->kind)) {
            error("/target", "expected the id of a crystal or a target, found the " +
                                 std::string(type_name(t->kind)) + " \"" + layout.target + "\"");
        }
    }
    if (layout.goals.solve) {
        for (const auto& [id, range] : layout.goals.solve->move) {
            (void)range;
            const std::string ptr = child_pointer("/goals/solve/move", id);
            if (!index_of.count(id)) error(ptr, no_element(id));
            else if (is_element(id) && std::holds_alternative<Stage>(find(id)->kind))
                error(ptr, "\"" + id + "\" is a stage; move it with its position_mm");
        }
        std::map<std::string, size_t> first_swap;  // a lens swapped twice gives two answers
        for (size_t i = 0; i < layout.goals.solve->swap.size(); ++i) {
            const std::string& id = layout.goals.solve->swap[i];
            const std::string ptr = child_pointer("/goals/solve/swap", i);
            if (const auto [first, is_new] = first_swap.try_emplace(id, i); !is_new)
                error(ptr, "\"" + id + "\" is listed twice (first at " +
                               child_pointer("/goals/solve/swap", first->second) + ")");
            else if (!index_of.count(id)) error(ptr, no_element(id));
            else if (is_element(id) && !std::holds_alternative<Lens>(find(id)->kind))
                error(ptr, "\"" + id + "\" is not a lens; only lenses can be swapped");
        }
    }
    check_adjusters(layout, no_element, find);
    for (const auto& [beam, waist] : layout.goals.waist_um) {
        (void)waist;
        bool found = false;
        for (const BeamSource& b : layout.beams) found = found || b.id == beam;
        if (!found) error(child_pointer("/goals/waist_um", beam), "no beam has id \"" + beam + "\"");
    }
}

// Each adjuster names an element of the right kind, and no element adjusts twice.
void Reader::check_adjusters(const Layout& layout, const std::function<std::string(const std::string&)>& no_element,
                             const std::function<const Element*(const std::string&)>& find) {
    if (!layout.goals.tolerance.adjust) return;
    const ToleranceAdjusters& a = *layout.goals.tolerance.adjust;
    const std::string base = "/goals/tolerance/adjust";
    // The element's kind in words when it is not the one wanted ("" when it is, or unknown).
    auto kind_error = [&](const std::string& id, auto is_wanted, const std::string& wanted) -> std::string {
        const Element* e = find(id);
        if (!e) return no_element(id);
        if (is_wanted(*e)) return "";
        return "\"" + id + "\" is a " + type_name(e->kind) + "; expected " + wanted;
    };
    if (a.stage)
        if (const std::string m = kind_error(*a.stage, [](const Element& e) { return std::holds_alternative<Stage>(e.kind); },
                                             "a stage (re-zeroed for zero delay)");
            !m.empty())
            error(base + "/stage", m);
    if (a.crystal) {
        const std::string m = kind_error(*a.crystal, [](const Element& e) { return std::holds_alternative<Crystal>(e.kind); },
                                         "the target crystal (its angle re-peaked)");
        if (!m.empty()) error(base + "/crystal", m);
        else if (*a.crystal != layout.target)
            error(base + "/crystal", "\"" + *a.crystal + "\" is not the target (\"" + layout.target +
                                         "\"); only the target crystal's angle is re-peaked");
    }
    std::map<std::string, std::string> first;  // id → where it was first listed
    auto once = [&](const std::string& id, const std::string& ptr) {
        const auto [it, is_new] = first.try_emplace(id, ptr);
        if (!is_new) error(ptr, "\"" + id + "\" is listed twice among the adjusters (first at " + it->second + ")");
        return is_new;
    };
    for (size_t i = 0; i < a.refocus.size(); ++i) {
        const std::string ptr = child_pointer(base + "/refocus", i);
        if (!once(a.refocus[i], ptr)) continue;
        if (const std::string m = kind_error(a.refocus[i], [](const Element& e) { return std::holds_alternative<Lens>(e.kind); },
                                             "a lens (refocused on a translation mount)");
            !m.empty())
            error(ptr, m);
    }
    for (size_t i = 0; i < a.walk.size(); ++i)
        for (size_t k = 0; k < a.walk[i].size(); ++k) {
            const std::string ptr = child_pointer(child_pointer(base + "/walk", i), k);
            if (!once(a.walk[i][k], ptr)) continue;
            if (const std::string m = kind_error(
                    a.walk[i][k],
                    [](const Element& e) { return walks_reflected_beam(e.kind); },
                    "a mirror or a dichroic (turned to walk the beam)");
                !m.empty())
                error(ptr, m);
        }
}

// "[json.exception.parse_error.101] parse error at line 3, column 5: syntax error while
// parsing object - unexpected '}'; expected string literal" → the part after the location.
std::string syntax_message(const std::string& what) {
    const size_t at = what.find(": ", what.find("column"));
    std::string m = at == std::string::npos ? what : what.substr(at + 2);
    const size_t dash = m.find(" - ");
    if (dash != std::string::npos) m = m.substr(0, m.find(" while parsing")) + ": " + m.substr(dash + 3);
    return m;
}

// nlohmann's byte count points at the last character read, the end of the offending token;
// step back to the token's first character so the column points where the reader looks.
size_t token_start(std::string_view text, size_t byte) {
    size_t i = std::min(byte > 0 ? byte - 1 : 0, text.size());
    if (i >= text.size() || i == 0) return i;
    if (text[i] == '"') {
        size_t j = i;
        while (j > 0) {
            --j;
            if (text[j] == '"' && (j == 0 || text[j - 1] != '\\')) return j;
        }
        return i;
    }
    auto in_literal = [](char c) {
        return std::isalnum(static_cast<unsigned char>(c)) || c == '.' || c == '-' || c == '+';
    };
    while (i > 0 && in_literal(text[i]) && in_literal(text[i - 1])) --i;
    return i;
}

void line_and_column(std::string_view text, size_t byte, int& line, int& column) {
    line = 1;
    column = 1;
    const size_t end = token_start(text, byte);
    for (size_t i = 0; i < end; ++i) {
        if (text[i] == '\n') {
            ++line;
            column = 1;
        } else {
            ++column;
        }
    }
}

// Each diagnostic inside /elements/N or /beams/N names that element's or beam's id (when it has
// a string id), so that "/elements/5" reads "/elements/5 (L2_S)".
void name_subjects(const json& doc, Diagnostics& diagnostics) {
    if (!doc.is_object()) return;
    for (Diagnostic& d : diagnostics) {
        for (const char* list : {"elements", "beams"}) {
            const std::string prefix = std::string("/") + list + "/";
            if (d.pointer.rfind(prefix, 0) != 0) continue;
            const size_t end = d.pointer.find('/', prefix.size());
            const std::string index = d.pointer.substr(prefix.size(), end == std::string::npos ? std::string::npos : end - prefix.size());
            if (index.empty() || index.size() > 9 || index.find_first_not_of("0123456789") != std::string::npos) continue;
            const auto it = doc.find(list);
            const size_t i = std::stoul(index);
            if (it == doc.end() || !it->is_array() || i >= it->size()) continue;
            const json& item = (*it)[i];
            if (item.is_object() && item.contains("id") && item["id"].is_string()) d.subject = item["id"].get<std::string>();
        }
    }
}

std::string too_large(std::uintmax_t bytes) {
    return "the file has " + std::to_string(bytes) + " bytes; a layout may have at most " +
           std::to_string(kMaxLayoutBytes) + " (16 MiB)";
}

}  // namespace

LayoutReadResult read_layout(std::string_view text) {
    LayoutReadResult result;
    if (text.size() > kMaxLayoutBytes) {
        result.diagnostics.push_back({Diagnostic::Severity::Error, "", 0, 0, too_large(text.size())});
        return result;
    }
    json doc;
    Diagnostics duplicates;
    try {
        doc = parse_json_limited(text, kMaxLayoutDepth, duplicates);
    } catch (const JsonTooDeep&) {
        result.diagnostics.push_back({Diagnostic::Severity::Error, "", 0, 0,
                                      "the file nests deeper than " + std::to_string(kMaxLayoutDepth) +
                                          " levels; a layout needs at most 5"});
        return result;
    } catch (const json::parse_error& e) {
        Diagnostic d{Diagnostic::Severity::Error, "", 0, 0, syntax_message(e.what())};
        line_and_column(text, e.byte, d.line, d.column);
        result.diagnostics.push_back(d);
        return result;
    } catch (const json::exception& e) {
        // Found by fuzzing: a number too large for a double ("1e999") is out_of_range.406, not a
        // parse error; it carries no position, only the number.
        std::string what = e.what();
        const size_t quote = what.find('\'');
        result.diagnostics.push_back({Diagnostic::Severity::Error, "", 0, 0,
                                      "a number does not fit a double" +
                                          (quote == std::string::npos ? std::string() : ": " + what.substr(quote))});
        return result;
    }
    if (!duplicates.empty()) {  // which of the values was meant is unknown: no layout
        result.diagnostics = std::move(duplicates);
        name_subjects(doc, result.diagnostics);
        return result;
    }
    Reader reader(result.diagnostics);
    result.layout = reader.read(doc);
    name_subjects(doc, result.diagnostics);
    return result;
}

LayoutReadResult read_layout_file(const std::filesystem::path& path) {
    // Bounded whatever the file is: devices, FIFOs and directories are refused by their type.
    const BoundedRead file = read_file_bounded(path, kMaxLayoutBytes, "a layout");
    if (!file.ok()) return {std::nullopt, {{Diagnostic::Severity::Error, "", 0, 0, file.error}}};
    return read_layout(file.text);
}

MaterialLibrary material_library_for(const Layout& layout) {
    MaterialLibrary lib = MaterialLibrary::builtin();
    for (const UserMaterial& m : layout.materials)
        lib = lib.with(user_sellmeier_material(m.id, m.b, m.c_um2, m.min_wavelength_nm,
                                               m.max_wavelength_nm, m.source));
    // A crystal in an oven: its set taken to that temperature, for every figure (the reader
    // allows one temperature per set and only sets with thermo-optic data).
    for (const Element& e : layout.elements)
        if (const auto* c = std::get_if<Crystal>(&e.kind); c && c->temperature_c)
            lib = lib.with_temperature(c->material, *c->temperature_c);
    return lib;
}

}  // namespace rv
