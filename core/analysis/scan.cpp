// The scan plan and map (analysis/scan.hpp for the model, the axes and the plan's rules).
// Every figure is the report's: build_report once, then its generated_light section with the
// phase mismatch and the delay of each grid line; the uncertainty from the tolerance run's
// perturbations through evaluate_beams_at_target and phase_now.
#include "analysis/scan.hpp"

#include <algorithm>
#include <cmath>

#include "analysis/phase_now.hpp"
#include "analysis/report.hpp"
#include "analysis/report_sections.hpp"
#include "analysis/target_summary.hpp"
#include "analysis/verdict_rules.hpp"
#include "nonlinear/phase_matching.hpp"
#include "solve/tolerance.hpp"
#include "trace/crystal_axes.hpp"
#include "units/constants.hpp"

namespace rv {

namespace {

namespace s = report_sections;

// Half a range covered by steps: 2·ceil(half/step) + 1 points (one when there is no width).
int points_for(double half_range, double step) {
    if (!(step > 0) || !(half_range > 0)) return 1;
    const double n = 2 * std::ceil(half_range / step - 1e-9) + 1;
    return n > 1e9 ? 1000000000 : static_cast<int>(n);
}

std::vector<double> axis_values(double centre, double half_range, int points) {
    std::vector<double> v;
    if (points <= 1) return {centre};
    for (int k = 0; k < points; ++k) v.push_back(centre - half_range + 2 * half_range * k / (points - 1));
    return v;
}

int grid_points(int requested, int planned) {
    if (requested > 0) return requested;
    return std::clamp(planned, 3, kDefaultMapPoints);
}

}  // namespace

ScanResult plan_scan(const Layout& layout, const MaterialLibrary& library, const ScanRequest& request) {
    ScanResult out;
    auto refuse = [&](ScanRefusal::Kind kind, std::string pointer, std::string element, int points = 0) {
        out.refusal = ScanRefusal{kind, std::move(pointer), std::move(element), points};
        return out;
    };
    for (int n : {request.stage_points, request.rotation_points})
        if (n > kMaxScanPoints) return refuse(ScanRefusal::Kind::TooManyPoints, "", "", n);

    const s::TargetElement target = s::target_element(layout);
    const Material* material = s::nonlinear_material(library, target);
    if (!target.crystal || !material) return refuse(ScanRefusal::Kind::NoCrystalTarget, "/target", layout.target);
    const size_t crystal_index = static_cast<size_t>(target.element - layout.elements.data());
    const std::string crystal_pointer = "/elements/" + std::to_string(crystal_index);
    const Crystal& xc = *target.crystal;
    out.plan.crystal = target.element->id;

    const RendezvousReport report = build_report(layout, library);
    if (report.phase_matching.empty() || report.chosen_process_missing)
        return refuse(ScanRefusal::Kind::NoProcess, crystal_pointer, target.element->id);
    const PhaseMatchingReport& pm = report.phase_matching.front();
    if (!pm.phase_matchable || pm.outside_index_data)
        return refuse(ScanRefusal::Kind::NoProcess, crystal_pointer, target.element->id);
    if (!report.generated) return refuse(ScanRefusal::Kind::NoGeneratedLight, "/beams", "");
    if (!pm.rotation_found) return refuse(ScanRefusal::Kind::NoRotation, crystal_pointer, target.element->id);
    const bool delay_applies = pm.sum_frequency;
    if (delay_applies && (!report.stage || !report.mismatch))
        return refuse(ScanRefusal::Kind::NoStage, "/elements", "");
    const GeneratedLightReport& g = *report.generated;

    // ψ after a rotation c of the crystal (deg), for the first input arriving as traced.
    const CrystalPose pose = crystal_pose(direction_deg(target.element->normal_deg), xc);
    const Path& path = report.beams[pm.first_beam].path;
    const Vec2 inside = path.target_hit ? path.hits[*path.target_hit].wave_direction_in() : pose.face_normal;
    const double index = path.target_hit ? path.hits[*path.target_hit].index_after : 1.0;
    // Its outside direction: Snell at the untilted face (trace/crystal_axes.hpp's convention).
    const Vec2 t = perpendicular(pose.face_normal);
    const double sin_out = std::clamp(index * inside.dot(t), -1.0, 1.0);
    const Vec2 outside =
        std::copysign(std::sqrt(1 - sin_out * sin_out), inside.dot(pose.face_normal)) * pose.face_normal + sin_out * t;
    const double l1 = layout.beams[pm.first_beam].wavelength_nm, l2 = layout.beams[pm.second_beam].wavelength_nm;
    const CrystalRotation how = pm.rotation;
    auto psi_rad = [&](double change_deg) {
        const CrystalPose p = rotated_pose(pose, how, change_deg);
        return angle_to_reference_axis_rad(p, wave_vector_from_outside(p, outside, index));
    };
    auto delta_k_l = [&](double change_deg) {
        return delta_k_per_mm(*material, l1, l2, pm.mixing, psi_rad(change_deg), xc.principal_plane) * xc.length_mm;
    };

    // Widths and steps.
    ScanPlan& plan = out.plan;
    plan.rotation = how;
    plan.acceptance_internal_mrad = pm.angular_acceptance_internal_mrad;
    constexpr double kSlopeStep_deg = 0.01;
    plan.dpsi_per_deg_mrad =
        1e3 * std::abs(psi_rad(pm.rotate_by_deg + kSlopeStep_deg) - psi_rad(pm.rotate_by_deg - kSlopeStep_deg)) /
        (2 * kSlopeStep_deg);
    ScanAxisPlan& rot = plan.rotation_deg;
    rot.present = 0;
    rot.centre = pm.rotate_by_deg;
    rot.fwhm = plan.dpsi_per_deg_mrad > 0 ? plan.acceptance_internal_mrad / plan.dpsi_per_deg_mrad : 0;
    rot.step = rot.fwhm / 2;
    plan.cross_correlation_fs = cross_correlation_fwhm_fs(g.pulse1_fwhm_fs, g.pulse2_fwhm_fs);
    plan.stage_applies = delay_applies;
    ScanAxisPlan& st = plan.stage_mm;
    if (delay_applies) {
        plan.stage = report.stage->id;
        plan.delay_per_mm_fs = report.stage->delay_per_mm_fs;
        st.present = report.stage->position_mm;
        st.centre = report.stage->zero_delay_mm;
        st.fwhm = plan.cross_correlation_fs / std::abs(plan.delay_per_mm_fs);
        st.step = st.fwhm / 2;
    } else if (report.stage) {
        st.present = st.centre = report.stage->position_mm;
    }

    // The model's uncertainty: the tolerance run's perturbations at ±their tolerances.
    const size_t first = pm.first_beam;
    auto figures_of = [&](const Layout& l, double& delay_fs, double& psi) {
        const std::vector<BeamAtTarget> at = evaluate_beams_at_target(l, library);
        if (first >= at.size() || !at[first].reached) return false;
        if (delay_applies) {
            if (at.size() < 2 || !at[0].reached || !at[1].reached) return false;
            delay_fs = mismatch_at_target(at[0], at[1]).delay_fs;
        }
        const Element& xe = l.elements[crystal_index];
        const Crystal* c = std::get_if<Crystal>(&xe.kind);
        if (!c) return false;
        psi = phase_now(*material, l1, l2, pm.mixing, xe, *c, at[first].wave_direction, at[first].index).theta_now_rad;
        return std::isfinite(psi) && std::isfinite(delay_fs);
    };
    double delay_var = 0, psi_var = 0;
    for (const Perturbation& p : perturbations(layout, library)) {
        double d_plus = 0, d_minus = 0, psi_plus = 0, psi_minus = 0;
        if (!figures_of(perturbed(layout, p, p.tolerance), d_plus, psi_plus) ||
            !figures_of(perturbed(layout, p, -p.tolerance), d_minus, psi_minus))
            continue;
        ++plan.perturbations;
        // The change at +tolerance (linear); a uniform error in ±tol has variance Δ²/3.
        const double dd = (d_plus - d_minus) / 2, dpsi = (psi_plus - psi_minus) / 2;
        delay_var += dd * dd / 3;
        psi_var += dpsi * dpsi / 3;
    }
    plan.delay_sigma_fs = std::sqrt(delay_var);
    plan.psi_sigma_mrad = 1e3 * std::sqrt(psi_var);
    rot.sigma = plan.dpsi_per_deg_mrad > 0 ? plan.psi_sigma_mrad / plan.dpsi_per_deg_mrad : 0;
    rot.half_range = std::max(kScanCoverageSigmas * rot.sigma, rot.fwhm);
    rot.points = points_for(rot.half_range, rot.step);
    if (delay_applies) {
        st.sigma = plan.delay_sigma_fs / std::abs(plan.delay_per_mm_fs);
        st.half_range = std::max(kScanCoverageSigmas * st.sigma, st.fwhm);
        st.points = points_for(st.half_range, st.step);
    }
    plan.plan_points = static_cast<long long>(st.points) * rot.points;

    // The map.
    ScanMap& map = out.map;
    map.output_nm = g.output_nm;
    map.present_mw = g.average_mw_now;
    map.best_mw = g.average_mw_best;
    map.rotation_deg = axis_values(rot.centre, rot.half_range, grid_points(request.rotation_points, rot.points));
    map.stage_mm = delay_applies ? axis_values(st.centre, st.half_range, grid_points(request.stage_points, st.points))
                                 : std::vector<double>{st.present};
    // One working copy of the report: the section reads the process's Δk·L and the delay.
    RendezvousReport work = report;
    PhaseMatchingReport& wpm = work.phase_matching.front();
    auto light = [&](double dkl, double delay_fs) {
        wpm.delta_k_l = dkl;
        if (work.mismatch) work.mismatch->delay_fs = delay_fs;
        return s::generated_light(layout, library, target, work);
    };
    const double delay_now = report.mismatch ? report.mismatch->delay_fs : 0;
    // G(s)/G(0) along the stage axis (1 without a stage).
    std::vector<std::optional<double>> column(map.stage_mm.size(), 1.0);
    if (delay_applies)
        for (size_t k = 0; k < map.stage_mm.size(); ++k) {
            const double delay = delay_now + plan.delay_per_mm_fs * (map.stage_mm[k] - st.present);
            const std::optional<GeneratedLightReport> at = light(pm.delta_k_l, delay);
            column[k] = at && at->pulse_factor_best > 0 && std::isfinite(at->pulse_factor_now)
                            ? std::optional(at->pulse_factor_now / at->pulse_factor_best)
                            : std::nullopt;
        }
    map.power_mw.assign(map.rotation_deg.size() * map.stage_mm.size(), std::nullopt);
    bool any = false;
    for (size_t r = 0; r < map.rotation_deg.size(); ++r) {
        const double dkl = delta_k_l(map.rotation_deg[r]);
        // P(c, delay 0): the delay at which G is G(0) is zero.
        const std::optional<GeneratedLightReport> at =
            std::isfinite(dkl) ? light(dkl, 0.0) : std::nullopt;
        for (size_t k = 0; k < map.stage_mm.size(); ++k) {
            std::optional<double>& cell = map.power_mw[r * map.stage_mm.size() + k];
            // SFG: the call is at zero delay, so average_mw_now = C·h(c)·G(0); SHG ignores the delay.
            const double value = at ? at->average_mw_now : NAN;
            if (column[k] && std::isfinite(value) && value >= 0) cell = value * *column[k];
            if (!cell) {
                ++map.non_finite;
                continue;
            }
            if (!any || *cell > map.peak_mw) {
                map.peak_mw = *cell;
                map.peak_stage_mm = map.stage_mm[k];
                map.peak_rotation_deg = map.rotation_deg[r];
                any = true;
            }
        }
    }
    return out;
}

}  // namespace rv
