// What the crystal gives and what the light does to the optics (analysis/report_output.hpp):
// the generated light of the crystal's process (nonlinear/generated_power.hpp with d_eff from
// nonlinear/nonlinear_coefficients.hpp and h from nonlinear/boyd_kleinman.hpp), the B-integral
// of each beam in the crystal and in the thickest glass on its way (nonlinear/b_integral.hpp),
// and the damage threshold each beam is judged against (the file's, else
// materials/typical_damage.hpp). Inputs are the report's own figures: the beams at the target,
// the power trace, the overlap, the phase matching and the delay.
#include <algorithm>
#include <cmath>

#include "analysis/report_sections.hpp"
#include "layout/visit.hpp"
#include "nonlinear/b_integral.hpp"
#include "nonlinear/boyd_kleinman.hpp"
#include "nonlinear/generated_power.hpp"
#include "nonlinear/nonlinear_coefficients.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

namespace {

// A layout number that is "not given" (std::optional in layout.hpp).
std::optional<double> given(const std::optional<double>& v) { return v; }

// Above this conversion the undepleted-pump figure overestimates noticeably (common practice).
constexpr double kUndepletedLimit = 0.1;

// The power (mW) at the target in the wave of polarity p: the projection of the arriving Stokes
// vector on H or V (the A wave is horizontal when the optic-axis plane is vertical), the same
// projection the polarization advice reports as useful_mw.
std::optional<double> power_in_wave_mw(const Layout& layout, const ReportBeam& b, const Crystal& xc, Polarity p) {
    const std::optional<double> src_mw = given(layout.beams[b.path.beam].power_mw);
    if (!src_mw || !b.power.reached) return std::nullopt;
    const bool horizontal = (p == Polarity::A) != xc.optic_axis_horizontal;
    const Stokes& s = b.power.at_target;
    return *src_mw * (horizontal ? (s[0] + s[1]) / 2 : (s[0] - s[1]) / 2);
}

// Peak power of a Gaussian pulse (analysis/pulse_intensity.hpp's factor), W.
double peak_power_w(double average_mw, double rate_khz, double fwhm_fs) {
    return kGaussianPeakFactor * mw_to_w(average_mw) / khz_to_hz(rate_khz) / fs_to_s(fwhm_fs);
}

double mean_confocal_mm(const ReportBeam& b) { return (b.confocal_tangential_mm + b.confocal_sagittal_mm) / 2; }

// The maker's damage threshold a kind carries in the file: a crystal's or a target's.
const DamageThreshold* file_damage(const ElementKind& kind) {
    using D = const DamageThreshold*;
    return std::visit(overloaded{[](const Crystal& c) -> D { return &c.damage; },
                                 [](const Target& t) -> D { return &t.damage; },
                                 [](const Lens&) -> D { return nullptr; }, [](const Mirror&) -> D { return nullptr; },
                                 [](const Dichroic&) -> D { return nullptr; }, [](const Plate&) -> D { return nullptr; },
                                 [](const Retroreflector&) -> D { return nullptr; },
                                 [](const Stage&) -> D { return nullptr; }, [](const Dump&) -> D { return nullptr; }},
                      kind);
}

// The material of a slab a beam travels inside (a plate, a dichroic's substrate, a crystal);
// empty for a kind a beam is not traced through.
std::string slab_material(const ElementKind& kind) {
    using S = std::string;
    return std::visit(overloaded{[](const Plate& p) -> S { return p.slab.material; },
                                 [](const Dichroic& d) -> S { return d.substrate.material; },
                                 [](const Crystal& c) -> S { return c.material; },
                                 [](const Lens&) -> S { return {}; }, [](const Mirror&) -> S { return {}; },
                                 [](const Retroreflector&) -> S { return {}; }, [](const Stage&) -> S { return {}; },
                                 [](const Target&) -> S { return {}; }, [](const Dump&) -> S { return {}; }},
                      kind);
}

}  // namespace

std::optional<DamageThresholdReport> damage_threshold_for(const Layout& layout, const ReportBeam& b,
                                                          const TargetElement& target) {
    if (!target.element) return std::nullopt;
    DamageThresholdReport d;
    d.beam = b.id;
    d.element = target.element->id;
    if (target.crystal) d.material = target.crystal->material;
    const DamageThreshold* file = file_damage(target.element->kind);
    if (file && (given(file->fluence_j_cm2) || given(file->intensity_gw_cm2))) {
        d.fluence_j_cm2 = given(file->fluence_j_cm2);
        d.intensity_gw_cm2 = given(file->intensity_gw_cm2);
        return d;
    }
    // No threshold in the file: the typical figure of the crystal's material family (the
    // built-in library names it; a user's material has none) at the beam's pulse length.
    const std::optional<double> tau_fs = given(layout.beams[b.path.beam].pulse_fwhm_fs);
    if (!target.crystal || !tau_fs) return std::nullopt;
    const Material* m = MaterialLibrary::builtin().find(target.crystal->material);
    if (!m) return std::nullopt;
    const std::optional<TypicalDamage> t = typical_damage(m->family, *tau_fs);
    if (!t) return std::nullopt;
    d.fluence_j_cm2 = t->fluence_j_cm2;
    d.intensity_gw_cm2 = t->intensity_gw_cm2;
    d.typical = true;
    d.regime = t->regime;
    d.reference_pulse_fs = t->reference_pulse_fs;
    d.reference_wavelength_nm = t->reference_wavelength_nm;
    d.scaled = t->scaled;
    d.source = std::string(t->source);
    return d;
}

std::optional<GeneratedLightReport> generated_light(const Layout& layout, const MaterialLibrary& library,
                                                    const TargetElement& target, const RendezvousReport& r) {
    if (!target.crystal || r.phase_matching.empty() || r.chosen_process_missing) return std::nullopt;
    const PhaseMatchingReport& pm = r.phase_matching.front();
    const Material* m = nonlinear_material(library, target);
    if (!m || !pm.phase_matchable || pm.outside_index_data) return std::nullopt;
    const Crystal& xc = *target.crystal;
    const PrincipalPlane plane = xc.principal_plane;
    const double theta_rad = deg_to_rad(pm.theta_pm_deg);
    const std::optional<EffectiveNonlinearity> deff = effective_nonlinearity(*m, pm.mixing, theta_rad, plane);
    if (!deff) return std::nullopt;
    const ReportBeam& b1 = r.beams[pm.first_beam];
    const ReportBeam& b2 = r.beams[pm.second_beam];
    const BeamSource& s1 = layout.beams[pm.first_beam];
    const BeamSource& s2 = layout.beams[pm.second_beam];
    if (!b1.at_target.reached || !b2.at_target.reached) return std::nullopt;
    // The pulses as they reach the crystal's centre: each source's length lengthened by its
    // arm's GDD (BeamAtTarget::pulse, analysis/pulse_at_target.hpp), the same lengths the
    // temporal overlap and the peak intensity use.
    const std::optional<double> tau1 = b1.at_target.pulse.fwhm_fs, tau2 = b2.at_target.pulse.fwhm_fs;
    const std::optional<double> rate1 = given(s1.repetition_rate_khz), rate2 = given(s2.repetition_rate_khz);
    if (!tau1 || !tau2 || !rate1 || !rate2) return std::nullopt;
    const WavePolarities w = polarities(pm.mixing);
    const std::optional<double> p1 = power_in_wave_mw(layout, b1, xc, w.wave1);
    const std::optional<double> p2 = power_in_wave_mw(layout, b2, xc, w.wave2);
    if (!p1 || !p2) return std::nullopt;
    GeneratedLightReport g;
    g.output_nm = pm.output_nm;
    g.d_eff_pm_v = deff->d_eff_pm_v;
    g.azimuth_deg = deff->azimuth_deg;
    g.d_eff_formula = deff->formula;
    g.coefficients_source = std::string(deff->source);
    g.input1_mw = *p1;
    g.input2_mw = *p2;
    g.pulse1_fwhm_fs = *tau1;
    g.pulse2_fwhm_fs = *tau2;
    g.repetition_rate_khz = std::min(*rate1, *rate2);
    // The SHG of one field (type I, or any SHG whose two inputs are the same wave).
    const bool one_field = !pm.sum_frequency && w.wave1 == w.wave2;
    g.one_field = one_field;
    // Coupling of the three waves at θ_pm (nonlinear/generated_power.hpp).
    MixingWaves waves;
    waves.d_eff_pm_v = g.d_eff_pm_v;
    waves.length_mm = xc.length_mm;
    waves.lambda3_nm = pm.output_nm;
    waves.n1 = wave_index(*m, b1.wavelength_nm, w.wave1, theta_rad, plane).index;
    waves.n2 = wave_index(*m, b2.wavelength_nm, w.wave2, theta_rad, plane).index;
    waves.n3 = wave_index(*m, pm.output_nm, w.wave3, theta_rad, plane).index;
    waves.one_field = one_field;
    // Spatial: the overlap area factor at the waists with the report's overlap along the
    // crystal (the beam with itself for SHG), and Boyd–Kleinman's h/ξ with ξ = L/b̄.
    g.spatial_overlap = pm.sum_frequency && r.overlap ? r.overlap->spatial_along_crystal : 1.0;
    const double area_per_cm2 =
        overlap_area_factor_per_cm2(b1.at_target.tangential.waist_um, b1.at_target.sagittal.waist_um,
                                    b2.at_target.tangential.waist_um, b2.at_target.sagittal.waist_um, g.spatial_overlap);
    const double b_mm = (mean_confocal_mm(b1) + mean_confocal_mm(b2)) / 2;
    if (!(b_mm > 0) || !(area_per_cm2 > 0)) return std::nullopt;
    g.xi = xc.length_mm / b_mm;
    const double k_per_mm = kPi * (b1.at_target.index / nm_to_mm(b1.wavelength_nm) +
                                   b2.at_target.index / nm_to_mm(b2.wavelength_nm));  // mean of 2πn/λ
    // B with the same ρ as the focusing report (report_focusing.cpp): the e input's for type II
    // and eeo, the generated e wave's walk-off from the o inputs for type I ooe.
    g.walkoff_parameter = walkoff_parameter(mrad_to_rad(pm.focusing_walkoff_mrad), xc.length_mm, k_per_mm);
    // σ = b ΔK/2 with Boyd & Kleinman's ΔK = k1 + k2 − k3, the opposite sign of the report's Δk.
    const double sigma_now = -b_mm * (pm.delta_k_l / xc.length_mm) / 2;
    g.h_now = boyd_kleinman_h(sigma_now, g.walkoff_parameter, g.xi);
    g.h_best = boyd_kleinman_optimum(g.xi, g.walkoff_parameter).h_m;
    // Temporal: the pulses' overlap with the delay now (SFG) and the GVM of each input against
    // the generated wave along the crystal.
    const double gvm1 = group_velocity_mismatch_fs_per_mm(*m, b1.wavelength_nm, b2.wavelength_nm, pm.mixing, theta_rad,
                                                          3, 1, plane);
    const double gvm2 = group_velocity_mismatch_fs_per_mm(*m, b1.wavelength_nm, b2.wavelength_nm, pm.mixing, theta_rad,
                                                          3, 2, plane);
    const double delay_fs = pm.sum_frequency && r.mismatch ? r.mismatch->delay_fs : 0.0;
    g.pulse_factor_now = gvm_overlap_factor(g.pulse1_fwhm_fs, g.pulse2_fwhm_fs, delay_fs, gvm1, gvm2, xc.length_mm);
    g.pulse_factor_best = gvm_overlap_factor(g.pulse1_fwhm_fs, g.pulse2_fwhm_fs, 0, gvm1, gvm2, xc.length_mm);
    // Energy per pulse: coupling · ∫P1P2 dt at the lower repetition rate.
    const double pk1_w = peak_power_w(g.input1_mw, g.repetition_rate_khz, g.pulse1_fwhm_fs);
    const double pk2_w = peak_power_w(g.input2_mw, g.repetition_rate_khz, g.pulse2_fwhm_fs);
    const double time_fs = pulse_overlap_integral_fs(g.pulse1_fwhm_fs, g.pulse2_fwhm_fs, 0, 0, 0, xc.length_mm);
    const double inputs_mw = one_field ? g.input1_mw : g.input1_mw + g.input2_mw;
    auto fill = [&](double h, double pulse_factor, double& average_mw, double& energy_nj, double& efficiency) {
        const double peak_w = generated_peak_power_w(waves, pk1_w, pk2_w, area_per_cm2, h / g.xi);
        const double energy_j = peak_w * fs_to_s(time_fs) * pulse_factor;
        energy_nj = energy_j * 1e9;
        average_mw = energy_j * khz_to_hz(g.repetition_rate_khz) * 1e3;
        efficiency = inputs_mw > 0 ? average_mw / inputs_mw : 0;
    };
    fill(g.h_now, g.pulse_factor_now, g.average_mw_now, g.energy_nj_now, g.efficiency_now);
    fill(g.h_best, g.pulse_factor_best, g.average_mw_best, g.energy_nj_best, g.efficiency_best);
    g.beyond_undepleted = g.efficiency_best > kUndepletedLimit;
    if (one_field) g.average_mw_depleted = inputs_mw * std::pow(std::tanh(std::sqrt(g.efficiency_best)), 2);
    return g;
}

std::vector<BIntegralReport> b_integrals(const Layout& layout, const MaterialLibrary& library,
                                         const TargetElement& target, const std::vector<ReportBeam>& beams) {
    std::vector<BIntegralReport> out;
    // An entry when the material's family has a bundled n₂.
    auto add = [&](BIntegralReport e, auto b_of_n2) {
        const Material* mat = library.find(e.material);
        const std::optional<KerrIndex> kerr = mat ? kerr_index(mat->family) : std::nullopt;
        if (!kerr) return;
        e.n2_cm2_per_w = kerr->n2_cm2_per_w;
        e.n2_source = std::string(kerr->source);
        e.b_rad = b_of_n2(e.n2_cm2_per_w);
        out.push_back(std::move(e));
    };
    for (const ReportBeam& b : beams) {
        const BeamSource& src = layout.beams[b.path.beam];
        const std::optional<double> power_mw = given(src.power_mw), tau_fs = given(src.pulse_fwhm_fs),
                                    rate_khz = given(src.repetition_rate_khz);
        if (!power_mw || !tau_fs || !rate_khz || !b.power.reached) continue;
        // The thickest glass before the target: the longest run inside a slab that is not the
        // target (from its entrance hit to its exit hit), or a thick singlet's centre thickness
        // (one hit). The intensity at the smaller beam of its faces, with the power entering it.
        struct Glass {
            double length_mm = 0;
            size_t entrance = 0, exit = 0;  // hits
            std::string material;
        };
        std::optional<Glass> thickest;
        const size_t end = std::min(b.path.target_hit.value_or(b.path.hits.size()), b.caustic.at_hits.size());
        for (size_t k = 0; k < end; ++k) {
            const TraceHit& h = b.path.hits[k];
            auto consider = [&](Glass g) {
                if (!g.material.empty() && (!thickest || g.length_mm > thickest->length_mm)) thickest = g;
            };
            if (h.lumped_glass_mm > 0)
                if (const auto* lens = std::get_if<Lens>(&layout.elements[h.element].kind))
                    if (const auto* thick = std::get_if<ThickLens>(&lens->model))
                        consider({h.lumped_glass_mm, k, k, thick->glass});
            if (k == 0 || k >= b.path.segments.size()) continue;
            const TraceSegment& seg = b.path.segments[k];  // ends at hits[k], starts at hits[k − 1]
            if (!seg.inside || (target.element && &layout.elements[*seg.inside] == target.element)) continue;
            const Element& slab = layout.elements[*seg.inside];
            consider({seg.length_mm, k - 1, k, slab_material(slab.kind)});
        }
        if (thickest) {
            const BeamAtHit& in = b.caustic.at_hits[thickest->entrance];
            const BeamAtHit& out_face = b.caustic.at_hits[thickest->exit];
            const double fraction = thickest->entrance > 0 ? b.power.fraction_after_hit[thickest->entrance - 1] : 1.0;
            const std::optional<PulseFigures> pulse = pulse_figures(PulseInputs{
                .power_mw = *power_mw * fraction,
                .repetition_rate_khz = *rate_khz,
                .fwhm_fs = *tau_fs,
                .radius_tangential_um = std::min(in.radius_tangential_um, out_face.radius_tangential_um),
                .radius_sagittal_um = std::min(in.radius_sagittal_um, out_face.radius_sagittal_um)});
            if (pulse) {
                BIntegralReport e;
                e.beam = b.id;
                e.element = layout.elements[b.path.hits[thickest->entrance].element].id;
                e.material = thickest->material;
                e.length_mm = thickest->length_mm;
                e.peak_intensity_w_cm2 = pulse->peak_intensity_w_cm2;
                add(e, [&](double n2) {
                    return b_integral_uniform_rad(b.wavelength_nm, n2, e.peak_intensity_w_cm2, e.length_mm);
                });
            }
        }
        // The target crystal, along the beam's caustic inside it (waist offsets and Rayleigh
        // ranges of the beam at the target, which lie in the crystal).
        if (target.crystal && b.pulse_at_waist && b.at_target.reached) {
            BIntegralReport e;
            e.beam = b.id;
            e.element = target.element->id;
            e.material = target.crystal->material;
            e.in_crystal = true;
            e.length_mm = b.at_target.half_crystal_path_mm > 0 ? 2 * b.at_target.half_crystal_path_mm
                                                              : target.crystal->length_mm;
            const PlaneAtTarget& t = b.at_target.tangential;
            const PlaneAtTarget& s = b.at_target.sagittal;
            const SlabPlane tp{t.waist_um, t.waist_offset_mm, t.rayleigh_mm};
            const SlabPlane sp{s.waist_um, s.waist_offset_mm, s.rayleigh_mm};
            // The largest on-axis intensity inside: at a waist that lies inside, else at a face.
            auto ratio = [](const SlabPlane& p, double z) {
                return p.rayleigh_mm > 0 ? std::sqrt(1 + std::pow((z - p.waist_from_centre_mm) / p.rayleigh_mm, 2)) : 1.0;
            };
            const double half = e.length_mm / 2;
            double smallest = HUGE_VAL;
            for (double z : {-half, half, std::clamp(t.waist_offset_mm, -half, half), std::clamp(s.waist_offset_mm, -half, half)})
                smallest = std::min(smallest, ratio(tp, z) * ratio(sp, z));
            const double i0_w_cm2 = b.pulse_at_waist->peak_intensity_w_cm2;
            e.peak_intensity_w_cm2 = i0_w_cm2 / smallest;
            add(e, [&](double n2) {
                return b_integral_rad(b.wavelength_nm, n2, i0_w_cm2, tp, sp, e.length_mm);
            });
        }
    }
    return out;
}

std::vector<Finding> b_integral_findings(const std::vector<BIntegralReport>& entries) {
    std::vector<Finding> out;
    for (const BIntegralReport& e : entries) {
        if (e.b_rad < kBIntegralSpectralRad) continue;
        const bool break_up = e.b_rad > kBIntegralBreakUpRad;
        Finding f{break_up ? Finding::Kind::BIntegralBreakUp : Finding::Kind::BIntegral, e.element};
        f.amount = e.b_rad;
        f.limit = break_up ? kBIntegralBreakUpRad : kBIntegralSpectralRad;
        f.material = e.material;
        f.beam = e.beam;
        out.push_back(f);
    }
    return out;
}

}  // namespace rv::report_sections
