#include "analysis/report.hpp"

#include <algorithm>
#include <cmath>

#include "analysis/crystal_waves.hpp"
#include "analysis/phase_now.hpp"
#include "analysis/plate_angle_search.hpp"
#include "analysis/verdict_rules.hpp"
#include "layout/process_text.hpp"
#include "materials/dispersion.hpp"
#include "nonlinear/boyd_kleinman.hpp"
#include "analysis/coincident_optics.hpp"
#include "nonlinear/phase_matching.hpp"
#include "trace/crystal_axes.hpp"
#include "trace/trace.hpp"
#include "units/constants.hpp"
#include "units/number_text.hpp"

namespace rv {

namespace {

// Every number of the report's sentences by the shared rule (units/number_text.hpp): no "-0",
// no residue such as 1e-13 for a zero, "n/a" for NaN.
std::string fmt(const char* format, double a) { return format_number(format, a); }


std::vector<ReportBeam> trace_beams(const Layout& layout, const MaterialLibrary& library,
                                    bool envelope) {
    PropagationOptions options;
    options.sample_envelope = envelope;
    std::vector<ReportBeam> beams;
    for (const Path& p : trace_arriving_waves(layout, library)) {
        ReportBeam b;
        b.id = layout.beams[p.beam].id;
        b.wavelength_nm = layout.beams[p.beam].wavelength_nm;
        b.path = p;
        b.element_ids.reserve(p.hits.size());
        for (const TraceHit& h : p.hits) b.element_ids.push_back(layout.elements[h.element].id);
        if (layout.beams[p.beam].power_mw > 0) b.source_power_mw = layout.beams[p.beam].power_mw;
        b.caustic = propagate_path(layout, p, options);
        b.at_target = beam_at_target(layout, p, b.caustic);
        b.confocal_tangential_mm = 2 * b.at_target.tangential.rayleigh_mm;
        b.confocal_sagittal_mm = 2 * b.at_target.sagittal.rayleigh_mm;
        if (p.target_hit) b.crossing_angle_deg = rad_to_deg(p.hits[*p.target_hit].aoi_rad());
        // Where the light goes after the target.
        if (!p.hits.empty() && p.hits.back().interaction == Interaction::Absorb)
            b.absorbed_in = layout.elements[p.hits.back().element].id;
        // What ended the trace past the target: its last finding there, if any (the trace stops
        // at the first finding that ends a ray).
        if (p.target_hit)
            for (const Finding& f : p.findings)
                if (f.kind != Finding::Kind::MaterialOutOfRange && f.kind != Finding::Kind::NoTarget &&
                    f.kind != Finding::Kind::MissedOptic)
                    b.end_after_target = f;
        if (envelope) {  // the full report: power, polarization and pulse figures as well
            const BeamSource& src = layout.beams[p.beam];
            b.power = trace_power(layout, library, p, b.caustic);
            b.at_target_polarization = describe(b.power.at_target);
            if (src.power_mw > 0 && b.power.reached) {
                b.target_power_mw = src.power_mw * b.power.at_target[0];
                b.pulse_at_target = pulse_figures(*b.target_power_mw, src.repetition_rate_khz, src.pulse_fwhm_fs,
                                                  b.at_target.tangential.radius_um, b.at_target.sagittal.radius_um);
                b.pulse_at_waist = pulse_figures(*b.target_power_mw, src.repetition_rate_khz, src.pulse_fwhm_fs,
                                                 b.at_target.tangential.waist_um, b.at_target.sagittal.waist_um);
            }
        }
        beams.push_back(std::move(b));
    }
    return beams;
}

double delay_of(const std::vector<ReportBeam>& b) {
    return b[0].at_target.arrival_fs - b[1].at_target.arrival_fs;
}

std::optional<OverlapReport> overlap_of(const Layout& layout, const std::vector<ReportBeam>& b) {
    if (b.size() < 2 || !b[0].at_target.reached || !b[1].at_target.reached) return std::nullopt;
    return overlap_at_target(b[0].at_target, b[1].at_target, layout.beams[0].pulse_fwhm_fs, layout.beams[1].pulse_fwhm_fs);
}

std::optional<StageReport> stage_of(const Layout& layout, const MaterialLibrary& library,
                                    const std::vector<ReportBeam>& beams) {
    if (beams.size() < 2 || !beams[0].at_target.reached || !beams[1].at_target.reached)
        return std::nullopt;
    for (size_t e = 0; e < layout.elements.size(); ++e) {
        const auto* s = std::get_if<Stage>(&layout.elements[e].kind);
        if (!s) continue;
        std::string beam;
        for (const ReportBeam& b : beams)
            for (const TraceHit& h : b.path.hits)
                for (const std::string& c : s->carries)
                    if (layout.elements[h.element].id == c && beam.empty()) beam = b.id;
        if (beam.empty()) continue;
        // The delay is linear in the stage position: evaluate it 1 mm further on.
        Layout moved = layout;
        std::get<Stage>(moved.elements[e].kind).position_mm += 1.0;
        const std::vector<ReportBeam> after = trace_beams(moved, library, false);
        if (!after[0].at_target.reached || !after[1].at_target.reached) continue;
        StageReport r;
        r.id = layout.elements[e].id;
        r.beam = beam;
        r.position_mm = s->position_mm;
        const double delay = delay_of(beams);
        r.delay_per_mm_fs = delay_of(after) - delay;
        if (r.delay_per_mm_fs == 0) continue;
        r.zero_delay_mm = s->position_mm - delay / r.delay_per_mm_fs;
        r.zero_in_travel = r.zero_delay_mm >= s->travel_min_mm && r.zero_delay_mm <= s->travel_max_mm;
        r.move_mm = r.zero_delay_mm - s->position_mm;
        if (s->measured_zero_mm) {
            r.measured_zero_mm = s->measured_zero_mm;
            r.emission_offset_fs = delay + r.delay_per_mm_fs * (*s->measured_zero_mm - s->position_mm);
        }
        return r;
    }
    return std::nullopt;
}

// The crystal's type allows several polarity triples; take the first that phase-matches,
// preferring one the beams' polarizations suit (a1, a2: fraction of each beam in the A wave).
MixingType mixing_type(const Material& m, const Crystal& c, double l1, double l2, double a1, double a2) {
    using M = MixingType;
    const std::vector<M> candidates = c.phase_matching == Crystal::PhaseMatching::TypeI
                                          ? std::vector<M>{M::TypeI, M::TypeI_BBA}
                                          : std::vector<M>{M::TypeII_ABB, M::TypeII_BAB, M::TypeII_ABA, M::TypeII_BAA};
    auto fits = [&](M t) {
        const WavePolarities w = polarities(t);
        return ((w.wave1 == Polarity::A) == (a1 >= 0.5)) && ((w.wave2 == Polarity::A) == (a2 >= 0.5));
    };
    std::optional<M> first;
    for (M t : candidates) {
        if (!phase_matching_angle_rad(m, l1, l2, t, c.principal_plane)) continue;
        if (!first) first = t;
        if (l1 != l2 && fits(t)) return t;
    }
    return first.value_or(candidates.front());
}

const char* type_text(MixingType t) {
    switch (t) {
        case MixingType::TypeI: return "type-I (ooe)";
        case MixingType::TypeI_BBA: return "type-I (eeo)";
        case MixingType::TypeII_ABB: return "type-II (oee)";
        case MixingType::TypeII_BAB: return "type-II (eoe)";
        case MixingType::TypeII_ABA: return "type-II (oeo)";
        case MixingType::TypeII_BAA: return "type-II (eoo)";
    }
    return "";
}

// The fraction of a beam's power at the target in the crystal's A (ordinary) wave: from the
// traced polarization when the power trace ran, else from the source's.
double a_fraction_at_target(const ReportBeam& b, const BeamSource& src, const Crystal& xc) {
    const PolarizationState& s = b.at_target_polarization;
    if (!b.power.reached || !(s.power > 0)) return a_wave_fraction(src.polarization, xc.optic_axis_horizontal);
    return (xc.optic_axis_horizontal ? s.v : s.h) / s.power;
}

PhaseMatchingReport phase_matching_of(const Layout& layout, const Element& xe, const Crystal& xc,
                                      const Material& m, const std::vector<ReportBeam>& beams,
                                      size_t i, size_t j) {
    const bool shg = i == j;
    const BeamSource& b1 = layout.beams[i];
    const BeamSource& b2 = layout.beams[j];
    const double l1 = b1.wavelength_nm, l2 = b2.wavelength_nm;
    PhaseMatchingReport r;
    r.process = shg ? "SHG of " + b1.id : "SFG of " + b1.id + " + " + b2.id;
    r.sum_frequency = !shg;
    r.first_beam = i;
    r.second_beam = j;
    r.output_nm = sum_frequency_nm(l1, l2);
    const double a1 = a_fraction_at_target(beams[i], b1, xc);
    const double a2 = a_fraction_at_target(beams[j], b2, xc);
    const PrincipalPlane plane = xc.principal_plane;
    const MixingType type = mixing_type(m, xc, l1, l2, a1, a2);
    r.mixing = type;
    r.type = type_text(type);
    const WavePolarities w = polarities(type);
    r.first_needs_a = w.wave1 == Polarity::A;
    r.second_needs_a = w.wave2 == Polarity::A;
    auto suits = [](Polarity need, double a) { return need == Polarity::A ? a >= 0.9 : a <= 0.1; };
    if (shg && type != MixingType::TypeI && type != MixingType::TypeI_BBA) {
        r.polarizations_suit = a1 >= 0.4 && a1 <= 0.6;
        r.polarization_note = b1.id + " needs equal o and e components (linear at 45° to the axes)";
    } else {
        r.polarizations_suit = suits(w.wave1, a1) && suits(w.wave2, a2);
        auto name = [](Polarity p) { return p == Polarity::A ? "o" : "e"; };
        r.polarization_note = b1.id + " must be " + name(w.wave1) + (shg ? "" : ", " + b2.id + " " + name(w.wave2)) +
                              " (an o wave is polarized " +
                              (xc.optic_axis_horizontal ? "vertically" : "horizontally") + " as the crystal is set)";
    }
    const std::optional<double> pm = phase_matching_angle_rad(m, l1, l2, type, plane);
    // Geometry (trace/crystal_axes.hpp): the first beam's direction inside at the crystal's
    // centre plane and the index it was refracted with give the 3-D wave vector and ψ.
    const CrystalPose pose = crystal_pose(direction_deg(xe.normal_deg), xc);
    const Path& path = beams[i].path;
    const bool at_centre = path.target_hit.has_value();
    const Vec2 d = at_centre ? path.hits[*path.target_hit].direction_in : pose.face_normal;
    const double index_here = at_centre ? path.hits[*path.target_hit].index_after : 1.0;
    const PhaseNow now = phase_now(m, l1, l2, type, xe, xc, d, index_here);  // the tolerance run's too
    r.theta_now_deg = rad_to_deg(now.theta_now_rad);
    const double length = xc.length_mm;
    const double dk = now.delta_k_per_mm;
    if (!std::isfinite(dk)) {
        std::string where;
        for (double l : {l1, l2, r.output_nm})
            if (!std::isfinite(wave_index(m, l, Polarity::A, 0, plane).index + wave_index(m, l, Polarity::B, kPi / 4, plane).index))
                where = fmt("%.1f", l) + " nm";
        r.outside_index_data = m.name + " has no real index at " + (where.empty() ? "a wave of this process" : where) +
                               " (its formula covers " + fmt("%.0f", m.min_wavelength_nm) + "–" +
                               fmt("%.0f", m.max_wavelength_nm) + " nm): no phase-matching figures";
        return r;
    }
    r.delta_k_l = dk * length;
    r.sinc2_now = phase_factor(r.delta_k_l);
    // The outside direction in the table plane (Snell at the untilted face).
    const Vec2 t = perpendicular(pose.face_normal);
    const double sin_out = std::clamp(index_here * d.dot(t), -1.0, 1.0);
    const Vec2 outside = std::copysign(std::sqrt(1 - sin_out * sin_out), d.dot(pose.face_normal)) * pose.face_normal + sin_out * t;
    const bool turn = xc.optic_axis_horizontal;
    r.rotation = turn ? CrystalRotation::Turn : CrystalRotation::Tilt;
    r.incidence_now_deg = turn ? rad_to_deg(std::atan2(sin_out, std::abs(outside.dot(pose.face_normal)))) : xc.tilt_deg;
    r.incidence_needed_deg = r.incidence_now_deg;
    if (!pm) return r;
    r.phase_matchable = true;
    r.theta_pm_deg = rad_to_deg(*pm);
    // The first input's index at θ_pm: exact where ψ = θ_pm, which is what is solved for.
    const double n_1 = wave_index(m, l1, w.wave1, *pm, plane).index;
    // The optic axis in the table plane is reached by a turn about the vertical axis; in the
    // vertical plane by a tilt about the horizontal axis across the beam.
    r.rotation_axis = turn ? "vertical axis (+ = clockwise seen from above)"
                           : "horizontal axis across the beam (+ = the face normal rises)";
    const std::optional<double> change =
        rotation_to_angle_deg(pose, r.rotation, outside, n_1, *pm, turn ? kMaxCrystalTurn_deg : 2 * kMaxCrystalTilt_deg,
                              kMaxCrystalTilt_deg);
    r.rotation_found = change.has_value();
    if (change) {
        r.rotate_by_deg = *change;
        r.incidence_needed_deg = r.incidence_now_deg + *change;
    }
    // Walk-off of the angle-dependent (B) wave: the output, or the input B wave when the
    // output is an A wave.
    const double b_lambda = w.wave3 == Polarity::B ? r.output_nm : (w.wave1 == Polarity::B ? l1 : l2);
    r.walkoff_mrad = 1e3 * std::abs(walkoff_rad(m, b_lambda, *pm, plane));
    const Acceptance acc = acceptance(m, l1, l2, type, *pm, length, plane);
    r.angular_acceptance_internal_mrad = acc.angular_internal_fwhm_mrad;
    r.angular_acceptance_external_mrad = acc.angular_internal_fwhm_mrad * n_1;
    r.spectral_acceptance_nm = acc.spectral_fwhm_nm;
    const std::string out = shg ? "SHG" : "SFG";
    auto walk = [](double tau, double gvm) -> std::optional<double> {
        if (tau <= 0 || gvm == 0) return std::nullopt;
        return tau / std::abs(gvm);
    };
    const double g31 = group_velocity_mismatch_fs_per_mm(m, l1, l2, type, *pm, 3, 1, plane);
    r.gvm.push_back({out + "–" + b1.id, g31, walk(b1.pulse_fwhm_fs, g31)});
    if (!shg) {
        const double g32 = group_velocity_mismatch_fs_per_mm(m, l1, l2, type, *pm, 3, 2, plane);
        const double g12 = group_velocity_mismatch_fs_per_mm(m, l1, l2, type, *pm, 1, 2, plane);
        r.gvm.push_back({out + "–" + b2.id, g32, walk(b2.pulse_fwhm_fs, g32)});
        const double shorter = std::min(b1.pulse_fwhm_fs, b2.pulse_fwhm_fs);
        r.gvm.push_back({b1.id + "–" + b2.id, g12, walk(shorter, g12)});
    }
    return r;
}

// The crystal's process among the computed ones (SFG first when both beams reach, then the SHG
// of each beam that reaches): Auto takes the first.
std::optional<size_t> chosen_process_index(const Layout& layout, const Crystal& xc,
                                           const std::vector<PhaseMatchingReport>& processes) {
    for (size_t k = 0; k < processes.size(); ++k) {
        const PhaseMatchingReport& p = processes[k];
        switch (xc.process) {
            case Crystal::Process::Auto: return k;
            case Crystal::Process::SumFrequency:
                if (p.sum_frequency) return k;
                break;
            case Crystal::Process::SecondHarmonic:
                if (!p.sum_frequency && layout.beams[p.first_beam].id == xc.process_beam) return k;
                break;
        }
    }
    return std::nullopt;
}

std::string invisible_kind(double nm) {
    if (nm < 400) return "ultraviolet";
    if (nm > 1400) return "infrared";
    if (nm > 700) return "near infrared, reaches the retina";
    return "";
}

}  // namespace

void add_figure(Verdict& v, std::string name, double value, double limit, bool is_minimum, std::string definition) {
    VerdictFigure f{std::move(name), value, limit, is_minimum, std::move(definition)};
    using S = VerdictFigure::State;
    if (is_minimum) f.state = value >= limit ? S::Met : value >= limit / 1.5 ? S::Near : S::NotMet;
    else f.state = value <= limit ? S::Met : value <= 1.5 * limit ? S::Near : S::NotMet;
    v.figures.push_back(std::move(f));
}

// Polarization advice for one beam at the crystal (see PolarizationAdvice): the wave plate to
// turn is the last one on the path after the last polarizer or cube before the target (turning
// it changes the polarization without changing the power), its best angle found by a 0.5° scan
// and a golden-section refinement of the power in the needed polarization.
PolarizationAdvice advise_polarization(const Layout& layout, const MaterialLibrary& library, const ReportBeam& b,
                                       const Crystal& xc, bool needs_a) {
    PolarizationAdvice a;
    a.beam = b.id;
    const bool needs_h = needs_a != xc.optic_axis_horizontal;  // A = o is H when the axis plane is vertical
    a.needs_a = needs_a;
    a.needs_horizontal = needs_h;
    const PolarizationState& s = b.at_target_polarization;
    auto useful = [&](const Stokes& st) { return needs_h ? (st[0] + st[1]) / 2 : (st[0] - st[1]) / 2; };
    a.useful_fraction = s.power > 0 ? useful(b.power.at_target) / s.power : 0;
    const double src_mw = layout.beams[b.path.beam].power_mw;
    if (src_mw > 0) a.useful_mw = src_mw * useful(b.power.at_target);
    // The angle of a plate that gives the most useful power: a 1° scan over 180°, then golden
    // section over ±1°.
    auto best_angle = [&](size_t plate) {
        auto power_in_need = [&](double deg) {
            return useful(target_stokes_with_plate(layout, library, b.path, b.caustic, plate, deg));
        };
        double best = 0, best_value = -1;
        for (int k = 0; k < 180; ++k)
            if (const double v = power_in_need(k); v > best_value) best_value = v, best = k;
        const double angle =
            refine_plate_angle_deg([&](double deg) { return -power_in_need(deg); }, best, 1.0, 40);
        return std::make_pair(angle, power_in_need(angle));
    };
    const size_t before_target = b.path.target_hit.value_or(b.path.hits.size());
    for (const WavePlatePass& pass : b.power.plates) {
        bool before = false;
        for (size_t k = 0; k < before_target; ++k) before = before || b.path.hits[k].element == pass.element;
        if (!before) continue;
        const auto [angle, value] = best_angle(pass.element);
        a.plates.push_back({pass.id, pass.fast_axis_deg, angle, useful(b.power.at_target), value});
    }
    if (a.useful_fraction >= 0.99) return a;
    // The candidate plate.
    const size_t end = b.path.target_hit.value_or(b.path.hits.size());
    constexpr size_t kNone = SIZE_MAX;
    size_t plate = kNone;
    std::optional<size_t> last_polarizer;
    for (size_t k = 0; k < end; ++k) {
        const Element& e = layout.elements[b.path.hits[k].element];
        if (const auto* p = std::get_if<Plate>(&e.kind)) {
            if (p->role == Plate::Role::PolarizingCube || p->role == Plate::Role::Polarizer) {
                last_polarizer = b.path.hits[k].element;
                plate = kNone;
            } else if (p->role == Plate::Role::HalfWave || p->role == Plate::Role::QuarterWave) {
                plate = b.path.hits[k].element;
            }
        }
    }
    if (plate == kNone) {
        a.advice = PolarizationAdvice::Advice::AddHalfWavePlate;
        if (last_polarizer) a.after_polarizer = layout.elements[*last_polarizer].id;
        return a;
    }
    const Plate& p = std::get<Plate>(layout.elements[plate].kind);
    a.advice = PolarizationAdvice::Advice::TurnPlate;
    a.plate = layout.elements[plate].id;
    a.plate_now_deg = p.fast_axis_deg;
    a.plate_best_deg = best_angle(plate).first;
    const Stokes at_best = target_stokes_with_plate(layout, library, b.path, b.caustic, plate, *a.plate_best_deg);
    a.useful_fraction_best = at_best[0] > 0 ? useful(at_best) / at_best[0] : 0;
    if (src_mw > 0) a.useful_mw_best = src_mw * useful(at_best);
    return a;
}

std::string needed_polarization_text(const PolarizationAdvice& a) {
    return std::string(a.needs_a ? "o" : "e") + (a.needs_horizontal ? " (horizontal)" : " (vertical)");
}

std::string polarization_advice_text(const PolarizationAdvice& a) {
    const std::string needs = needed_polarization_text(a);
    switch (a.advice) {
        case PolarizationAdvice::Advice::None: return "";
        case PolarizationAdvice::Advice::AddHalfWavePlate:
            return "add a half-wave plate" + (a.after_polarizer ? " after " + *a.after_polarizer : std::string()) +
                   ": only " + fmt("%.0f", 100 * a.useful_fraction) + " % of " + a.beam + " is " + needs;
        case PolarizationAdvice::Advice::TurnPlate:
            return "turn " + a.plate.value_or("") + "'s fast axis from " + fmt("%.1f", a.plate_now_deg.value_or(0)) +
                   "° to " + fmt("%.1f", a.plate_best_deg.value_or(0)) + "°: " + fmt("%.0f", 100 * a.useful_fraction) +
                   " % → " + fmt("%.0f", 100 * a.useful_fraction_best.value_or(0)) + " % of " + a.beam + " in " + needs;
    }
    return "";
}

std::string after_target_text(const ReportBeam& b) {
    if (!b.absorbed_in.empty()) return "absorbed in dump " + b.absorbed_in;
    if (b.end_after_target) return finding_text(*b.end_after_target);
    return "stops after the target";
}

RendezvousReport build_report(const Layout& layout, const MaterialLibrary& library) {
    RendezvousReport r;
    r.layout_name = layout.name;
    r.target = layout.target;
    r.beams = trace_beams(layout, library, true);
    const Element* target = layout.find(layout.target);
    const Crystal* crystal = target ? std::get_if<Crystal>(&target->kind) : nullptr;
    r.target_is_crystal = crystal != nullptr;
    if (crystal) r.crystal_length_mm = crystal->length_mm;
    const bool both = r.beams.size() >= 2 && r.beams[0].at_target.reached && r.beams[1].at_target.reached;
    {
        std::vector<const Path*> paths;
        for (const ReportBeam& b : r.beams) paths.push_back(&b.path);
        for (Finding& f : coincident_optics(layout, paths)) r.findings.push_back(std::move(f));
    }

    for (const ReportBeam& b : r.beams) {
        auto add = [&](Finding f) {
            f.beam = b.id;
            r.findings.push_back(std::move(f));
        };
        // Light that leaves the table after the target is said once, as `unterminated` below.
        const bool leaves_after_target = b.end_after_target && b.end_after_target->kind == Finding::Kind::LeftTable;
        for (const Finding& f : b.path.findings)
            if (!(leaves_after_target && f.kind == Finding::Kind::LeftTable)) add(f);
        for (const Finding& f : b.caustic.findings) add(f);
        const double w0 = std::min(b.at_target.tangential.waist_um, b.at_target.sagittal.waist_um);
        const double two_wavelengths_um = 2 * nm_to_um(b.wavelength_nm);
        if (b.at_target.reached && w0 < two_wavelengths_um) {
            Finding f{Finding::Kind::Paraxial, layout.target};
            f.amount = w0;
            f.limit = two_wavelengths_um;
            add(f);
        }
        if (leaves_after_target) {
            Finding f{Finding::Kind::Unterminated};
            f.where_mm = b.end_after_target->where_mm;
            add(f);
        }
        if (const std::string kind = invisible_kind(b.wavelength_nm); !kind.empty())
            r.invisible.push_back(fmt("%.0f nm", b.wavelength_nm) + " (" + b.id + "): " + kind);
        for (const PowerLoss& loss : b.power.losses)
            if (loss.leaves_table && loss.fraction > 1e-3) {
                Finding f{Finding::Kind::StrayBeam, loss.element};
                f.amount = loss.fraction;
                f.where_mm = loss.exit_mm;
                add(f);
            }
        // Damage: the peak intensity and fluence at the target plane, and at the waist when the
        // waist lies inside the crystal, against the maker's threshold given in the file.
        const DamageThreshold* damage = nullptr;
        if (target) {
            if (const auto* c = std::get_if<Crystal>(&target->kind)) damage = &c->damage;
            if (const auto* t = std::get_if<Target>(&target->kind)) damage = &t->damage;
        }
        if (damage && b.pulse_at_target) {
            PulseFigures worst = *b.pulse_at_target;
            const double offset = std::abs(b.at_target.tangential.waist_offset_mm + b.at_target.sagittal.waist_offset_mm) / 2;
            if (b.pulse_at_waist && crystal && offset <= crystal->length_mm / 2) worst = *b.pulse_at_waist;
            const double threshold_w_cm2 = damage->intensity_gw_cm2 * 1e9;
            if (damage->intensity_gw_cm2 > 0 && worst.peak_intensity_w_cm2 > threshold_w_cm2) {
                Finding f{Finding::Kind::DamageIntensity, layout.target};
                f.amount = worst.peak_intensity_w_cm2;
                f.limit = threshold_w_cm2;
                add(f);
            }
            if (damage->fluence_j_cm2 > 0 && worst.peak_fluence_j_cm2 > damage->fluence_j_cm2) {
                Finding f{Finding::Kind::DamageFluence, layout.target};
                f.amount = worst.peak_fluence_j_cm2;
                f.limit = damage->fluence_j_cm2;
                add(f);
            }
        }
    }
    // Thin glass lenses carry no thickness, so their glass is missing from the timing
    // (about 1.5–1.8 ps per mm, docs/physics.md §7): say so where it matters, with two pulsed beams.
    if (both && layout.beams[0].pulse_fwhm_fs > 0 && layout.beams[1].pulse_fwhm_fs > 0)
        for (const Element& e : layout.elements)
            if (const auto* lens = std::get_if<Lens>(&e.kind); lens && std::holds_alternative<ThinChromaticLens>(lens->model))
                r.findings.push_back({Finding::Kind::ThinLensTiming, e.id});
    if (both) {
        r.mismatch = mismatch_at_target(r.beams[0].at_target, r.beams[1].at_target);
        const double b1 = r.beams[0].confocal_tangential_mm + r.beams[0].confocal_sagittal_mm;
        const double b2 = r.beams[1].confocal_tangential_mm + r.beams[1].confocal_sagittal_mm;
        r.confocal_ratio = b1 / b2;
        r.overlap = overlap_of(layout, r.beams);
        r.stage = stage_of(layout, library, r.beams);
    }

    if (crystal) {
        const Material* m = library.find(crystal->material);
        if (m && m->symmetry != Symmetry::Isotropic) {
            if (r.beams.size() >= 2 && both)
                r.phase_matching.push_back(phase_matching_of(layout, *target, *crystal, *m, r.beams, 0, 1));
            for (size_t i = 0; i < r.beams.size(); ++i)
                if (r.beams[i].at_target.reached)
                    r.phase_matching.push_back(phase_matching_of(layout, *target, *crystal, *m, r.beams, i, i));
            // The process the crystal is set for goes first (the verdict and the polarization
            // advice judge the first); absent when its beams do not reach the crystal.
            const std::optional<size_t> chosen = chosen_process_index(layout, *crystal, r.phase_matching);
            r.chosen_process_missing = !chosen;
            if (chosen) std::rotate(r.phase_matching.begin(), r.phase_matching.begin() + *chosen,
                                    r.phase_matching.begin() + *chosen + 1);
            for (const PhaseMatchingReport& p : r.phase_matching)
                if (const std::string kind = invisible_kind(p.output_nm); !kind.empty())
                    r.invisible.push_back(fmt("%.1f nm", p.output_nm) + " (" + p.process + "): " + kind);
            // Polarization of each input, for the first process (SFG, or the SHG of one beam).
            if (!r.phase_matching.empty() && r.phase_matching.front().outside_index_data.empty()) {
                const PhaseMatchingReport& first = r.phase_matching.front();
                const bool sfg = first.sum_frequency;
                const bool type_ii_shg = !sfg && first.mixing != MixingType::TypeI && first.mixing != MixingType::TypeI_BBA;
                if (!type_ii_shg)
                    for (size_t i = 0; i < r.beams.size(); ++i)
                    if (sfg ? i < 2 : i == first.first_beam)
                        if (r.beams[i].at_target.reached && r.beams[i].power.reached)
                            r.polarization.push_back(advise_polarization(
                                layout, library, r.beams[i], *crystal,
                                i == first.first_beam ? first.first_needs_a : first.second_needs_a));
            }
            // Boyd–Kleinman for each beam, with the walk-off of the first process's output.
            const double rho = r.phase_matching.empty() ? 0 : r.phase_matching.front().walkoff_mrad * 1e-3;
            for (const ReportBeam& b : r.beams) {
                if (!b.at_target.reached) continue;
                const double conf = (b.confocal_tangential_mm + b.confocal_sagittal_mm) / 2;
                const double xi = crystal->length_mm / conf;
                const BoydKleinmanOptimum o = boyd_kleinman_optimum(xi);
                const double k1 = 2 * kPi * b.at_target.index / nm_to_mm(b.wavelength_nm);
                r.focusing.push_back({b.id, xi, o.h_m, o.sigma_m, walkoff_parameter(rho, crystal->length_mm, k1)});
            }
        }
    }

    // The verdict. Thresholds: layout.goals.verdict (docs/user-guide.md, "Verdict").
    const VerdictThresholds& t = layout.goals.verdict;
    Verdict& v = r.verdict;
    std::vector<std::string> goal_misses;
    for (const auto& [id, goal] : layout.goals.waist_um) {
        for (const ReportBeam& b : r.beams) {
            if (b.id != id || !b.at_target.reached) continue;
            const double w = mean_waist_um(b.at_target);
            if (!waist_goal_met(w, goal, t))
                goal_misses.push_back(id + " waist " + fmt("%.1f", w) + " µm, goal " + fmt("%.1f", goal) + " µm");
        }
    }
    if (both) {
        const Mismatch& mm = *r.mismatch;
        const ReportBeam& a = r.beams[0];
        const ReportBeam& b = r.beams[1];
        // The figures and their test: analysis/verdict_rules.hpp (the tolerance run's too).
        const SpaceFigures sf = space_figures(a.at_target, b.at_target, mm);
        const double frac = sf.waist_offset_rayleigh, ratio = sf.waist_ratio, lateral = sf.lateral_radius;
        v.space.met = space_figures_met(sf, t) && goal_misses.empty();
        add_figure(v, "waist offset / z_R", frac, t.max_waist_offset_rayleigh, false,
                   "distance between the two waists along the beam, over the shorter Rayleigh range at the target");
        add_figure(v, "waist ratio", ratio, t.max_waist_ratio, false, "larger over smaller waist radius (mean of the planes)");
        add_figure(v, "lateral / radius", lateral, t.max_lateral_offset_radius, false,
                   "distance between the chief-ray crossings of the target plane over sqrt(w1² + w2²) "
                   "(0.23 keeps 90 % of the overlap)");
        v.space.summary = "waists " + fmt("%.3f", std::abs(mm.waist_offset_mm)) + " mm apart = " + fmt("%.2f", frac) +
                          " of the shorter Rayleigh range; waist ratio " + fmt("%.3f", ratio) + "; chief rays " +
                          fmt("%.1f", mm.lateral_um) + " µm apart";
        std::vector<std::string> acts;
        if (frac > t.max_waist_offset_rayleigh)
            acts.push_back("bring the waists together: " + b.id + "'s lies " + fmt("%.3f", std::abs(mm.waist_offset_mm)) +
                           " mm " + (mm.waist_offset_mm > 0 ? "downstream" : "upstream") + " of " + a.id + "'s");
        if (ratio > t.max_waist_ratio) acts.push_back("match the waist sizes (ratio " + fmt("%.2f", ratio) + ")");
        if (lateral > t.max_lateral_offset_radius) acts.push_back("overlap the chief rays (" + fmt("%.1f", mm.lateral_um) + " µm apart)");
        for (const std::string& g : goal_misses) acts.push_back(g);
        for (size_t i = 0; i < acts.size(); ++i) v.space.action += (i ? "; " : "") + acts[i];
    } else if (!r.beams.empty() && r.beams[0].at_target.reached && r.beams.size() == 1) {
        const ReportBeam& a = r.beams[0];
        const double off = (a.at_target.tangential.waist_offset_mm + a.at_target.sagittal.waist_offset_mm) / 2;
        const double zr = std::min(a.at_target.tangential.rayleigh_mm, a.at_target.sagittal.rayleigh_mm);
        v.space.met = single_beam_offset_met(single_beam_offset_rayleigh(a.at_target), t) && goal_misses.empty();
        v.space.summary = "waist " + fmt("%.3f", std::abs(off)) + " mm " + (off > 0 ? "after" : "before") +
                          " the target centre = " + fmt("%.2f", std::abs(off) / zr) + " of its Rayleigh range";
        if (!v.space.met) {
            v.space.action = std::abs(off) / zr > t.max_waist_offset_rayleigh
                                 ? "move the focus " + fmt("%.3f", std::abs(off)) + " mm " + (off > 0 ? "upstream" : "downstream")
                                 : "";
            for (const std::string& g : goal_misses) v.space.action += (v.space.action.empty() ? "" : "; ") + g;
        }
    } else {
        v.space.summary = "a beam does not reach the target";
        v.space.action = "fix the trace findings first";
    }

    if (both && r.overlap && r.overlap->temporal) {
        const double t1 = layout.beams[0].pulse_fwhm_fs, t2 = layout.beams[1].pulse_fwhm_fs;
        const double xcorr = cross_correlation_fwhm_fs(t1, t2);
        const double d = r.mismatch->delay_fs;
        v.time.met = delay_met(d, xcorr, t);
        add_figure(v, "delay / cross-correlation", std::abs(d) / xcorr, t.max_delay_xcorr, false,
                   "|arrival of beam 1 − beam 2| over sqrt(τ1² + τ2²), the FWHM of the two pulses' cross-correlation");
        v.time.summary = "delay " + format_duration_fs(d, true) + " = " + fmt("%.2f", std::abs(d) / xcorr) +
                         " of the cross-correlation width (" + format_duration_fs(xcorr) + ")";
        if (!v.time.met) {
            if (r.stage && r.stage->zero_in_travel)
                v.time.action = "move stage " + r.stage->id + " by " + fmt("%+.3f", r.stage->move_mm) + " mm (to " +
                                fmt("%.3f", r.stage->zero_delay_mm) + " mm)";
            else {
                const size_t early = d > 0 ? 1 : 0;  // the beam that arrives first needs the path
                const double ng_air = sample_index(*library.find("air"), r.beams[early].wavelength_nm).group_index;
                const double path_mm = std::abs(d) * kSpeedOfLight_mm_per_fs / ng_air;
                const std::string later = r.beams[early].id;
                v.time.action = (r.stage ? "stage " + r.stage->id + " would need " + fmt("%.3f", r.stage->zero_delay_mm) +
                                               " mm, outside its travel; " : std::string()) +
                                "add " + fmt("%.2f", path_mm) + " mm of air path to " + later;
            }
        }
    } else if (both) {
        v.time.met = false;
        v.time.summary = "not evaluated: give pulse_fwhm_fs for both beams";
    } else if (r.beams.size() == 1) {
        v.time.applies = false;
        v.time.summary = "one beam: no delay to match";
    } else {
        v.time.summary = "a beam does not reach the target";
    }

    if (r.chosen_process_missing) {
        v.phase.met = false;
        v.phase.summary = std::string(crystal && crystal->process == Crystal::Process::SecondHarmonic
                                          ? "SHG of " + crystal->process_beam
                                          : "SFG") +
                          " (the crystal's process): its beam" +
                          (crystal && crystal->process == Crystal::Process::SecondHarmonic ? " does" : "s do") +
                          " not reach the crystal";
        v.phase.action = "bring the beams to the crystal first (see the space line)";
    } else if (!r.phase_matching.empty()) {
        const PhaseMatchingReport& p = r.phase_matching.front();
        v.phase.met = phase_met(p.phase_matchable, p.sinc2_now, p.polarizations_suit, t);
        if (p.outside_index_data.empty())
            add_figure(v, "phase factor sinc²", p.sinc2_now, t.min_phase_factor, true,
                       "sinc²(Δk·L/2) of the first process with the crystal as it is (1 = phase-matched)");
        if (!p.outside_index_data.empty()) {
            v.phase.summary = p.process + ": " + p.outside_index_data;
            v.phase.action = "choose a crystal that is transparent at these wavelengths";
        } else if (!p.phase_matchable) {
            v.phase.summary = p.process + ": no " + p.type + " phase matching in this crystal";
            v.phase.action = "choose another crystal or type";
        } else {
            v.phase.summary = p.process + " " + p.type + ": θ_pm " + fmt("%.2f", p.theta_pm_deg) + "°, now " +
                              fmt("%.2f", p.theta_now_deg) + "°, sinc² = " + fmt("%.3f", p.sinc2_now);
            if (p.sinc2_now < t.min_phase_factor && p.rotation_found)
                v.phase.action = std::string(p.rotation == CrystalRotation::Turn ? "turn" : "tilt") +
                                 " the crystal by " + fmt("%+.3f", p.rotate_by_deg) + "° (external) about the " +
                                 p.rotation_axis + " (rendezvous phase --process " + process_key(layout, p) +
                                 " --write NEW.json)";
            else if (p.sinc2_now < t.min_phase_factor)
                v.phase.action = std::string("no ") + (p.rotation == CrystalRotation::Turn ? "turn" : "tilt") +
                                 " within the mount's range reaches θ_pm: use a crystal cut nearer " +
                                 fmt("%.2f", p.theta_pm_deg) + "°";
            if (!p.polarizations_suit)
                v.phase.action += (v.phase.action.empty() ? "" : "; ") + p.polarization_note;
        }
    } else if (r.target_is_crystal) {
        v.phase.summary = "the crystal's material is isotropic or the beams miss it";
    } else {
        v.phase.applies = false;
        v.phase.summary = "the target is not a crystal";
    }
    return r;
}

std::string process_key(const Layout& layout, const PhaseMatchingReport& p) {
    // A computed process is never Auto, so the text always exists.
    return *format_process_text(p.sum_frequency ? Crystal::Process::SumFrequency : Crystal::Process::SecondHarmonic,
                                layout.beams[p.first_beam].id);
}

const char* verdict_state_text(const VerdictLine& l) {
    if (!l.applies) return "n/a";
    return l.met ? "met" : "NOT MET";
}

std::string verdict_line_text(const VerdictLine& l) {
    return std::string(verdict_state_text(l)) + (l.applies ? "  " : " — ") + l.summary;
}

bool verdict_passes(const VerdictLine& l) { return !l.applies || l.met; }

}  // namespace rv
