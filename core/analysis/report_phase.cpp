// Phase matching of each process the crystal can run (nonlinear/phase_matching.hpp): the
// mixing type the beams' polarizations suit, θ_pm against the angle the beams have now (Δk
// with the crystal as placed: analysis/phase_now.hpp, shared with the tolerance run), the turn
// or tilt that reaches θ_pm (analysis/crystal_angle.hpp), walk-off, acceptances and GVM.
#include <algorithm>
#include <cmath>

#include "analysis/crystal_angle.hpp"
#include "analysis/crystal_waves.hpp"
#include "analysis/phase_now.hpp"
#include "analysis/report_sections.hpp"
#include "analysis/verdict_rules.hpp"
#include "materials/dispersion.hpp"
#include "nonlinear/phase_matching.hpp"
#include "trace/crystal_axes.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

namespace {

// The crystal's type allows several polarity triples; take the first that phase-matches,
// preferring one the beams' polarizations suit (a1, a2: fraction of each beam in the A wave).
MixingType mixing_type(const Material& m, const Crystal& c, double l1, double l2, double a1,
                       double a2) {
    using M = MixingType;
    const std::vector<M> candidates =
        c.phase_matching == Crystal::PhaseMatching::TypeI
            ? std::vector<M>{M::TypeI, M::TypeI_BBA}
            : std::vector<M>{M::TypeII_ABB, M::TypeII_BAB, M::TypeII_ABA, M::TypeII_BAA};
    auto fits = [&](M t) {
        const WavePolarities w = polarities(t);
        return ((w.wave1 == Polarity::A) == (a1 >= 0.5)) &&
               ((w.wave2 == Polarity::A) == (a2 >= 0.5));
    };
    std::optional<M> first;
    for (M t : candidates) {
        if (!phase_matching_angle_rad(m, l1, l2, t, c.principal_plane)) continue;
        if (!first) first = t;
        if (l1 != l2 && fits(t)) return t;
    }
    return first.value_or(candidates.front());
}

// The fraction of a beam's power at the target in the crystal's A (ordinary) wave: from the
// traced polarization when the power trace ran, else from the source's.
double a_fraction_at_target(const ReportBeam& b, const BeamSource& src, const Crystal& xc) {
    const PolarizationState& s = b.at_target_polarization;
    if (!b.power.reached || !(s.power > 0))
        return a_wave_fraction(src.polarization, xc.optic_axis_horizontal);
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
    r.beams = {!shg, b1.id, shg ? std::string() : b2.id};
    r.sum_frequency = !shg;
    r.first_beam = i;
    r.second_beam = j;
    r.output_nm = sum_frequency_nm(l1, l2);
    const double a1 = a_fraction_at_target(beams[i], b1, xc);
    const double a2 = a_fraction_at_target(beams[j], b2, xc);
    const PrincipalPlane plane = xc.principal_plane;
    const MixingType type = mixing_type(m, xc, l1, l2, a1, a2);
    r.mixing = type;
    const WavePolarities w = polarities(type);
    r.first_needs_a = w.wave1 == Polarity::A;
    r.second_needs_a = w.wave2 == Polarity::A;
    auto suits = [](Polarity need, double a) { return need == Polarity::A ? a >= 0.9 : a <= 0.1; };
    // Type-II SHG takes both waves from one beam: it needs equal o and e parts.
    const bool equal_parts = shg && type != MixingType::TypeI && type != MixingType::TypeI_BBA;
    r.polarizations_suit = equal_parts ? a1 >= 0.4 && a1 <= 0.6 : suits(w.wave1, a1) && suits(w.wave2, a2);
    r.polarization_need = {b1.id, shg ? std::string() : b2.id, equal_parts, w.wave1 == Polarity::A,
                           w.wave2 == Polarity::A, xc.optic_axis_horizontal};
    std::optional<double> pm = phase_matching_angle_rad(m, l1, l2, type, plane);
    // Geometry (trace/crystal_axes.hpp): the first beam's wave-vector direction inside at the
    // crystal's centre plane and the index it was refracted with give the 3-D wave vector and ψ.
    const CrystalPose pose = crystal_pose(direction_deg(xe.normal_deg), xc);
    const Path& path = beams[i].path;
    const bool at_centre = path.target_hit.has_value();
    const Vec2 d = at_centre ? path.hits[*path.target_hit].wave_direction_in() : pose.face_normal;
    const double index_here = at_centre ? path.hits[*path.target_hit].index_after : 1.0;
    const PhaseNow now =
        phase_now(m, l1, l2, type, xe, xc, d, index_here);  // the tolerance run's too
    r.theta_now_deg = rad_to_deg(now.theta_now_rad);
    const double length = xc.length_mm;
    const double dk = now.delta_k_per_mm;
    if (!std::isfinite(dk)) {
        IndexGap gap{m.name, std::nullopt, m.min_wavelength_nm, m.max_wavelength_nm};
        for (double l : {l1, l2, r.output_nm})
            if (!std::isfinite(wave_index(m, l, Polarity::A, 0, plane).index +
                               wave_index(m, l, Polarity::B, kPi / 4, plane).index))
                gap.wavelength_nm = l;
        r.outside_index_data = gap;
        return r;
    }
    r.delta_k_l = dk * length;
    r.sinc2_now = phase_factor(r.delta_k_l);
    // By temperature, at the angle the beams have now (also where no angle phase-matches: a
    // crystal cut for non-critical matching above its matching temperature).
    r.temperature = temperature_tuning(m, l1, l2, type, now.theta_now_rad, length, plane);
    // Above its matching temperature a crystal cut for non-critical matching has no angle that
    // phase-matches, yet a temperature does: the angle is then the one the beams have.
    if (!pm && r.temperature && r.temperature->phase_matching_c) pm = now.theta_now_rad;
    // The outside direction in the table plane (Snell at the untilted face).
    const Vec2 t = perpendicular(pose.face_normal);
    const double sin_out = std::clamp(index_here * d.dot(t), -1.0, 1.0);
    const Vec2 outside = std::copysign(std::sqrt(1 - sin_out * sin_out), d.dot(pose.face_normal)) *
                             pose.face_normal +
                         sin_out * t;
    const bool turn = xc.optic_axis_horizontal;
    r.rotation = turn ? CrystalRotation::Turn : CrystalRotation::Tilt;
    r.incidence_now_deg =
        turn ? rad_to_deg(std::atan2(sin_out, std::abs(outside.dot(pose.face_normal))))
             : xc.tilt_deg;
    r.incidence_needed_deg = r.incidence_now_deg;
    if (!pm) return r;
    r.phase_matchable = true;
    r.theta_pm_deg = rad_to_deg(*pm);
    // The first input's index at θ_pm: exact where ψ = θ_pm, which is what is solved for.
    const double n_1 = wave_index(m, l1, w.wave1, *pm, plane).index;
    const std::optional<double> change = rotation_to_angle_deg(
        pose, r.rotation, outside, n_1, *pm, turn ? kMaxCrystalTurn_deg : 2 * kMaxCrystalTilt_deg,
        kMaxCrystalTilt_deg);
    r.rotation_found = change.has_value();
    if (change) {
        r.rotate_by_deg = *change;
        r.incidence_needed_deg = r.incidence_now_deg + *change;
    }
    // Walk-off of the angle-dependent (B) wave: the output, or the input B wave when the
    // output is an A wave.
    const double b_lambda =
        w.wave3 == Polarity::B ? r.output_nm : (w.wave1 == Polarity::B ? l1 : l2);
    r.walkoff_mrad = 1e3 * std::abs(walkoff_rad(m, b_lambda, *pm, plane));
    // Boyd–Kleinman's B (report_focusing.cpp): the e input's walk-off when an input is e (type
    // II, type I eeo), else the generated e wave's (type I ooe).
    const double focus_lambda =
        w.wave1 == Polarity::B ? l1 : (w.wave2 == Polarity::B ? l2 : r.output_nm);
    r.focusing_walkoff_mrad = 1e3 * std::abs(walkoff_rad(m, focus_lambda, *pm, plane));
    const Acceptance acc = acceptance(m, l1, l2, type, *pm, length, plane);
    r.angular_acceptance_internal_mrad = acc.angular_internal_fwhm_mrad;
    r.angular_acceptance_external_mrad = acc.angular_internal_fwhm_mrad * n_1;
    r.spectral_acceptance_nm = acc.spectral_fwhm_nm;
    // acceptance() tunes wave 1 (the first input) and holds wave 2 for SFG; for SHG both inputs
    // are the fundamental, so the harmonic follows.
    r.spectral_tuned_beam = b1.id;
    r.spectral_held_beam = shg ? std::nullopt : std::optional<std::string>(b2.id);
    // Group-velocity mismatch of every pair of the three waves: the generated wave against each
    // input, and the inputs against each other. For SHG of type I the two inputs are one wave
    // (one pair); for type II they are the o and e parts of the beam (three pairs).
    auto walk = [](std::optional<double> tau_fs, double gvm) -> std::optional<double> {
        if (!tau_fs || gvm == 0) return std::nullopt;
        return *tau_fs / std::abs(gvm);
    };
    const bool two_inputs = !shg || w.wave1 != w.wave2;
    const Polarity pols[3] = {w.wave1, w.wave2, w.wave3};
    // The pulses as they enter the crystal (analysis/pulse_at_target.hpp).
    const std::optional<double> taus[3] = {beams[i].at_target.pulse.fwhm_fs, beams[j].at_target.pulse.fwhm_fs,
                                           std::nullopt};
    auto add_pair = [&](int a, int b) {
        GroupVelocityMismatch g;
        g.first_wave = a;
        g.second_wave = b;
        g.first_polarity = pols[a - 1];
        g.second_polarity = pols[b - 1];
        g.fs_per_mm = group_velocity_mismatch_fs_per_mm(m, l1, l2, type, *pm, a, b, plane);
        // The generated pulse walks through the input's; two inputs: the shorter one.
        std::optional<double> tau = taus[b - 1];
        if (a != 3 && taus[a - 1] && tau) tau = std::min(*taus[a - 1], *tau);
        g.walk_apart_mm = walk(tau, g.fs_per_mm);
        r.gvm.push_back(g);
    };
    add_pair(3, 1);
    if (two_inputs) {
        add_pair(3, 2);
        add_pair(1, 2);
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
            case Crystal::Process::Auto:
                return k;
            case Crystal::Process::SumFrequency:
                if (p.sum_frequency) return k;
                break;
            case Crystal::Process::SecondHarmonic:
                if (!p.sum_frequency && layout.beams[p.first_beam].id == xc.process_beam.value_or("")) return k;
                break;
        }
    }
    return std::nullopt;
}

}  // namespace

const Material* nonlinear_material(const MaterialLibrary& library, const TargetElement& target) {
    if (!target.crystal) return nullptr;
    const Material* m = library.find(target.crystal->material);
    return m && m->symmetry != Symmetry::Isotropic ? m : nullptr;
}

void add_phase_matching(const Layout& layout, const MaterialLibrary& library,
                        const TargetElement& target, RendezvousReport& r) {
    const Material* m = nonlinear_material(library, target);
    if (!m) return;
    const Crystal& crystal = *target.crystal;
    // SFG first when both beams reach, then the SHG of each beam that reaches.
    if (both_reach(r.beams))
        r.phase_matching.push_back(
            phase_matching_of(layout, *target.element, crystal, *m, r.beams, 0, 1));
    for (size_t i = 0; i < r.beams.size(); ++i)
        if (r.beams[i].at_target.reached)
            r.phase_matching.push_back(
                phase_matching_of(layout, *target.element, crystal, *m, r.beams, i, i));
    // The process the crystal is set for goes first (the verdict and the polarization advice
    // judge the first); absent when its beams do not reach the crystal.
    const std::optional<size_t> chosen = chosen_process_index(layout, crystal, r.phase_matching);
    r.chosen_process_missing = !chosen;
    if (chosen)
        std::rotate(r.phase_matching.begin(), r.phase_matching.begin() + *chosen,
                    r.phase_matching.begin() + *chosen + 1);
}

}  // namespace rv::report_sections
