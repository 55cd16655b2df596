#include "io/layout_writer.hpp"

#include <cmath>
#include <nlohmann/json.hpp>
#include <stdexcept>

#include "io/atomic_file.hpp"
#include "io/layout_reader.hpp"
#include "layout/enum_names.hpp"
#include "layout/process_text.hpp"
#include "layout/visit.hpp"

namespace rv {

namespace {

using ojson = nlohmann::ordered_json;

ojson num(double v) {
    if (v == std::floor(v) && std::abs(v) < 1e15) return static_cast<long long>(v);
    return v;
}
ojson pair(double a, double b) { return ojson::array({num(a), num(b)}); }
ojson point(const Vec2& p) { return pair(p.x(), p.y()); }
ojson plane_pair(const PlanePair& p) {
    return p.round() ? num(p.tangential) : pair(p.tangential, p.sagittal);
}

ojson beam_json(const BeamSource& b) {
    ojson j;
    j["id"] = b.id;
    j["wavelength_nm"] = num(b.wavelength_nm);
    j["start_mm"] = point(b.start_mm);
    j["direction_deg"] = num(b.direction_deg);
    j["waist_um"] = plane_pair(b.waist_um);
    if (!(b.waist_at_mm == PlanePair{})) j["waist_at_mm"] = plane_pair(b.waist_at_mm);
    if (!(b.m2 == PlanePair{1, 1})) j["m2"] = plane_pair(b.m2);
    if (b.pulse_fwhm_fs) j["pulse_fwhm_fs"] = num(*b.pulse_fwhm_fs);
    if (b.input_gdd_fs2) j["input_gdd_fs2"] = num(*b.input_gdd_fs2);
    if (b.emit_time_fs != 0) j["emit_time_fs"] = num(b.emit_time_fs);
    if (b.polarization.kind != Polarization::Kind::Horizontal)  // the default, left out
        j["polarization"] = text_of(kPolarizationNames, b.polarization.kind);
    if (b.polarization.kind == Polarization::Kind::Linear)
        j["polarization_angle_deg"] = num(b.polarization.angle_deg);
    if (b.polarized_fraction != 1.0) j["polarized_fraction"] = num(b.polarized_fraction);
    if (b.power_mw) j["power_mw"] = num(*b.power_mw);
    if (b.repetition_rate_khz) j["repetition_rate_khz"] = num(*b.repetition_rate_khz);
    return j;
}

struct KindWriter {
    ojson& j;
    void operator()(const Lens& lens) const {
        if (lens.part) j["part"] = *lens.part;
        std::visit(overloaded{
                       [&](const IdealLens& ideal) { j["focal_length_mm"] = num(ideal.focal_length_mm); },
                       [&](const ThinChromaticLens& thin) {
                           j["focal_length_mm"] = num(thin.focal_length_mm);
                           j["glass"] = thin.glass;
                           if (thin.design_wavelength_nm != 587.6)
                               j["design_wavelength_nm"] = num(thin.design_wavelength_nm);
                       },
                       [&](const ThickLens& t) {
                           if (t.shape) {
                               j["shape"] = *t.shape;
                               j["focal_length_mm"] = num(t.focal_length_mm);
                           } else {
                               if (std::isfinite(t.front_radius_mm)) j["front_radius_mm"] = num(t.front_radius_mm);
                               if (std::isfinite(t.back_radius_mm)) j["back_radius_mm"] = num(t.back_radius_mm);
                           }
                           j["center_thickness_mm"] = num(t.center_thickness_mm);
                           j["glass"] = t.glass;
                           if (t.shape && t.design_wavelength_nm != 587.6)
                               j["design_wavelength_nm"] = num(t.design_wavelength_nm);
                       },
                   },
                   lens.model);
    }
    void operator()(const Mirror& m) const {
        if (m.radius_of_curvature_mm) j["radius_of_curvature_mm"] = num(*m.radius_of_curvature_mm);
        if (m.aim_at) j["aim_at"] = *m.aim_at;
        if (m.retardance_deg != 0) j["retardance_deg"] = num(m.retardance_deg);
    }
    void operator()(const Dichroic& d) const {
        j["edge_nm"] = num(d.edge_nm);
        j["reflects"] = text_of(kDichroicReflectsNames, d.reflects_shorter);
        j["substrate"] = {{"glass", d.substrate.material},
                          {"thickness_mm", num(d.substrate.thickness_mm)}};
        if (d.retardance_deg != 0) j["retardance_deg"] = num(d.retardance_deg);
    }
    void operator()(const Plate& p) const {
        using R = Plate::Role;
        if (p.role != R::Window) j["role"] = text_of(kPlateRoleNames, p.role);
        j["material"] = p.slab.material;
        j["thickness_mm"] = num(p.slab.thickness_mm);
        if (p.fast_axis_deg != 0) j["fast_axis_deg"] = num(p.fast_axis_deg);
        if (p.design_nm) j["design_nm"] = num(*p.design_nm);
        if (p.retarder_material) j["retarder_material"] = *p.retarder_material;
        if (p.order != 0) j["order"] = p.order;
        if (p.retarder_thickness_um) j["retarder_thickness_um"] = num(*p.retarder_thickness_um);
        if ((p.role == R::PolarizingCube || p.role == R::Polarizer) && p.extinction_ratio != 1000)
            j["extinction_ratio"] = num(p.extinction_ratio);
        if (p.role == R::PolarizingCube && !p.reflects_left) j["reflects"] = text_of(kCubeReflectsNames, false);
    }
    void operator()(const Retroreflector&) const {}
    void operator()(const Stage& s) const {
        j["carries"] = s.carries;
        j["axis_deg"] = num(s.axis_deg);
        if (s.position_mm != 0) j["position_mm"] = num(s.position_mm);
        j["travel_mm"] = pair(s.travel_min_mm, s.travel_max_mm);
        if (s.measured_zero_mm) j["measured_zero_mm"] = num(*s.measured_zero_mm);
    }
    void operator()(const Crystal& c) const {
        j["material"] = c.material;
        j["length_mm"] = num(c.length_mm);
        j["cut_deg"] = num(c.cut_deg);
        j["phase_matching"] = text_of(kPhaseMatchingNames, c.phase_matching);
        if (c.optic_axis_horizontal) j["optic_axis"] = text_of(kOpticAxisNames, true);
        if (c.principal_plane != PrincipalPlane::XY) j["principal_plane"] = text_of(kPrincipalPlaneNames, c.principal_plane);
        if (c.tilt_deg != 0) j["tilt_deg"] = num(c.tilt_deg);
        if (c.temperature_c) j["temperature_c"] = num(*c.temperature_c);
        if (const auto process = format_process_text(c.process, c.process_beam.value_or(""))) j["process"] = *process;
        damage(c.damage);
    }
    void damage(const DamageThreshold& d) const {
        if (d.fluence_j_cm2) j["damage_fluence_j_cm2"] = num(*d.fluence_j_cm2);
        if (d.intensity_gw_cm2) j["damage_intensity_gw_cm2"] = num(*d.intensity_gw_cm2);
    }
    void operator()(const Target& t) const { damage(t.damage); }
    void operator()(const Dump&) const {}
};

ojson element_json(const Element& e) {
    ojson j;
    j["id"] = e.id;
    j["type"] = type_name(e.kind);
    if (!std::holds_alternative<Stage>(e.kind)) {
        j["at_mm"] = point(e.at_mm);
        const auto* mirror = std::get_if<Mirror>(&e.kind);
        if (e.normal_deg != 0 && !(mirror && mirror->aim_at)) j["normal_deg"] = num(e.normal_deg);
        if (e.aperture_mm != kDefaultAperture_mm) j["aperture_mm"] = num(e.aperture_mm);
        if (e.transmission != 1.0) j["transmission"] = num(e.transmission);
    }
    std::visit(KindWriter{j}, e.kind);
    return j;
}

// Inline JSON with a space after ':' and ',' (nlohmann's compact dump has none).
std::string inline_text(const ojson& v) {
    if (v.is_object()) {
        std::string s = "{";
        bool first = true;
        for (const auto& item : v.items()) {
            s += (first ? "" : ", ") + ojson(item.key()).dump() + ": " + inline_text(item.value());
            first = false;
        }
        return s + "}";
    }
    if (v.is_array()) {
        std::string s = "[";
        for (size_t i = 0; i < v.size(); ++i) s += (i ? ", " : "") + inline_text(v[i]);
        return s + "]";
    }
    return v.dump();
}

// The layout as a JSON tree, keys in the documented order.
ojson layout_json(const Layout& layout) {
    ojson root;
    root["format"] = "rendezvous-layout";
    root["version"] = 1;
    if (!layout.name.empty()) root["name"] = layout.name;
    root["table"] = {{"size_mm", pair(layout.table.width_mm, layout.table.height_mm)},
                     {"grid_mm", num(layout.table.grid_mm)}};
    if (!layout.materials.empty()) {
        ojson materials = ojson::array();
        for (const UserMaterial& m : layout.materials) {
            ojson j;
            j["id"] = m.id;
            ojson b = ojson::array(), c = ojson::array();
            for (double x : m.b) b.push_back(num(x));
            for (double x : m.c_um2) c.push_back(num(x));
            j["sellmeier"] = {{"b", b}, {"c_um2", c}};
            j["range_nm"] = pair(m.min_wavelength_nm, m.max_wavelength_nm);
            if (!m.source.empty()) j["source"] = m.source;
            materials.push_back(j);
        }
        root["materials"] = materials;
    }
    ojson beams = ojson::array();
    for (const BeamSource& b : layout.beams) beams.push_back(beam_json(b));
    root["beams"] = beams;
    ojson elements = ojson::array();
    for (const Element& e : layout.elements) elements.push_back(element_json(e));
    root["elements"] = elements;
    root["target"] = layout.target;
    ojson goals = ojson::object();
    if (!layout.goals.waist_um.empty()) {
        ojson w = ojson::object();
        for (const auto& [id, v] : layout.goals.waist_um) w[id] = num(v);
        goals["waist_um"] = w;
    }
    // Thresholds and tolerances: only the keys that differ from their defaults.
    auto unless_default = [](ojson& j, const char* key, double value, double fallback) {
        if (value != fallback) j[key] = num(value);
    };
    const VerdictThresholds& t = layout.goals.verdict;
    const VerdictThresholds d;
    ojson v = ojson::object();
    unless_default(v, "max_waist_offset_rayleigh", t.max_waist_offset_rayleigh, d.max_waist_offset_rayleigh);
    unless_default(v, "max_waist_ratio", t.max_waist_ratio, d.max_waist_ratio);
    unless_default(v, "max_lateral_offset_radius", t.max_lateral_offset_radius, d.max_lateral_offset_radius);
    unless_default(v, "max_delay_xcorr", t.max_delay_xcorr, d.max_delay_xcorr);
    unless_default(v, "min_phase_factor", t.min_phase_factor, d.min_phase_factor);
    unless_default(v, "max_goal_waist_error", t.max_goal_waist_error, d.max_goal_waist_error);
    if (!v.empty()) goals["verdict"] = v;
    const Tolerances& tol = layout.goals.tolerance;
    const Tolerances tol0;
    ojson tj = ojson::object();
    unless_default(tj, "position_mm", tol.position_mm, tol0.position_mm);
    unless_default(tj, "angle_mrad", tol.angle_mrad, tol0.angle_mrad);
    unless_default(tj, "focal_length_fraction", tol.focal_length_fraction, tol0.focal_length_fraction);
    unless_default(tj, "stage_mm", tol.stage_mm, tol0.stage_mm);
    if (tol.adjust) {  // present, even empty ({}: no adjuster), unlike absent (the defaults)
        const ToleranceAdjusters& a = *tol.adjust;
        ojson aj = ojson::object();
        if (a.stage) aj["stage"] = *a.stage;
        if (!a.walk.empty()) {
            ojson w = ojson::array();
            for (const std::vector<std::string>& ids : a.walk) w.push_back(ids);
            aj["walk"] = w;
        }
        if (!a.refocus.empty()) aj["refocus"] = a.refocus;
        if (a.crystal) aj["crystal"] = *a.crystal;
        tj["adjust"] = aj;
    }
    if (!tj.empty()) goals["tolerance"] = tj;
    if (layout.goals.solve) {
        const SolveGoals& sg = *layout.goals.solve;
        ojson j = ojson::object();
        if (sg.aim != SolveGoals::Aim::Waist) j["aim"] = text_of(kSolveAimNames, sg.aim);
        if (!sg.move.empty()) {
            ojson m = ojson::object();
            for (const auto& [id, r] : sg.move) m[id] = pair(r.first, r.second);
            j["move"] = m;
        }
        if (!sg.swap.empty()) j["swap"] = sg.swap;
        const SolveGoals sg0;
        unless_default(j, "min_spacing_mm", sg.min_spacing_mm, sg0.min_spacing_mm);
        unless_default(j, "table_margin_mm", sg.table_margin_mm, sg0.table_margin_mm);
        if (sg.max_path_mm) j["max_path_mm"] = *sg.max_path_mm;
        goals["solve"] = j;
    }
    if (!goals.empty()) root["goals"] = goals;
    return root;
}

// The JSON pointer of the first number in `v` that is NaN or infinite, or "".
std::string first_non_finite(const ojson& v, const std::string& pointer) {
    if (v.is_number_float() && !std::isfinite(v.get<double>()))
        return pointer.empty() ? "/" : pointer;
    if (v.is_object())
        for (const auto& item : v.items())
            if (std::string p = first_non_finite(item.value(), pointer + "/" + item.key());
                !p.empty())
                return p;
    if (v.is_array())
        for (size_t i = 0; i < v.size(); ++i)
            if (std::string p = first_non_finite(v[i], pointer + "/" + std::to_string(i));
                !p.empty())
                return p;
    return "";
}

}  // namespace

std::string write_layout(const Layout& layout) {
    const ojson root = layout_json(layout);
    std::string out = "{\n";
    size_t i = 0;
    for (const auto& item : root.items()) {
        out += "  " + ojson(item.key()).dump() + ": ";
        const ojson& v = item.value();
        if (v.is_array() && !v.empty() && v[0].is_object()) {
            out += "[\n";
            for (size_t k = 0; k < v.size(); ++k)
                out += "    " + inline_text(v[k]) + (k + 1 < v.size() ? ",\n" : "\n");
            out += "  ]";
        } else {
            out += inline_text(v);
        }
        out += ++i < root.size() ? ",\n" : "\n";
    }
    return out + "}\n";
}

std::string unwritable_reason(const Layout& layout) {
    const std::string pointer = first_non_finite(layout_json(layout), "");
    if (pointer.empty()) return "";
    return "the layout holds a value that is not a finite number (NaN or infinity) at " + pointer +
           ", which a layout file cannot hold";
}

std::string unreadable_reason(std::string_view text) {
    const LayoutReadResult r = read_layout(text);
    for (const Diagnostic& d : r.diagnostics)
        if (d.severity == Diagnostic::Severity::Error)
            return printable_text((d.pointer.empty() ? "" : d.pointer + ": ") + d.message,
                                  kMaxShownChars);
    return r.layout ? "" : "it is not a layout";
}

void save_layout(const Layout& layout, const std::filesystem::path& path, SafeWriteRules rules) {
    if (const std::string why = unwritable_reason(layout); !why.empty())
        throw std::runtime_error("cannot write " + path.string() + ": " + why);
    rules.check_read_back = unreadable_reason;
    write_file_safely(path, write_layout(layout), rules);
}

}  // namespace rv
