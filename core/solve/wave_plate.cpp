#include "solve/wave_plate.hpp"

#include <algorithm>
#include <cmath>
#include <vector>

#include "analysis/plate_angle_search.hpp"
#include "analysis/power_budget.hpp"
#include "analysis/report.hpp"

namespace rv {

WavePlateResult set_wave_plate(const Layout& layout, const MaterialLibrary& library, const WavePlateGoal& goal) {
    WavePlateResult out;
    out.layout = layout;
    size_t plate = layout.elements.size();
    for (size_t i = 0; i < layout.elements.size(); ++i)
        if (layout.elements[i].id == goal.plate) plate = i;
    const Plate* p = plate < layout.elements.size() ? std::get_if<Plate>(&layout.elements[plate].kind) : nullptr;
    if (!p || (p->role != Plate::Role::HalfWave && p->role != Plate::Role::QuarterWave)) {
        out.error = "\"" + goal.plate + "\" is not a half- or quarter-wave plate of the layout";
        return out;
    }
    const RendezvousReport report = build_report(layout, library);
    const ReportBeam* beam = nullptr;
    for (const ReportBeam& b : report.beams) {
        bool passes = false;
        for (const TraceHit& h : b.path.hits) passes = passes || h.element == plate;
        if (!passes || (!goal.beam.empty() && b.id != goal.beam)) continue;
        if (beam) {
            out.error = "both beams pass " + goal.plate + "; name one with --beam";
            return out;
        }
        beam = &b;
    }
    if (!beam) {
        out.error = goal.beam.empty() ? "no beam passes " + goal.plate : goal.beam + " does not pass " + goal.plate;
        return out;
    }
    if (!beam->power.reached) {
        out.error = beam->id + " does not reach the target";
        return out;
    }
    const double source_mw = layout.beams[beam->path.beam].power_mw.value_or(0);
    if (goal.power_mw && !layout.beams[beam->path.beam].power_mw) {
        out.error = beam->id + " has no power_mw in the layout to set a power from";
        return out;
    }
    out.beam = beam->id;
    // The polarization the crystal needs for this beam, if the report knows it.
    std::optional<bool> needs_h;
    for (const PolarizationAdvice& a : report.polarization)
        if (a.beam == beam->id) needs_h = a.needs_horizontal;
    out.crystal_needs_known = needs_h.has_value();
    const double scale = source_mw > 0 ? source_mw : 1.0;
    auto at = [&](double deg) { return target_stokes_with_plate(layout, library, beam->path, beam->caustic, plate, deg); };
    auto useful = [&](const Stokes& s) { return needs_h ? scale * (*needs_h ? (s[0] + s[1]) / 2 : (s[0] - s[1]) / 2) : 0.0; };
    // What to make small: the distance to the wanted power, or minus the useful power.
    auto cost = [&](double deg) {
        const Stokes s = at(deg);
        return goal.power_mw ? std::abs(scale * s[0] - *goal.power_mw) : -(needs_h ? useful(s) : scale * s[0]);
    };
    // Every local minimum of the scan, refined; of those as good as the best, the one nearest
    // the plate's present angle (a half-wave plate has several equivalent settings).
    constexpr int kSteps = 720;
    std::vector<double> scan(kSteps);
    for (int k = 0; k < kSteps; ++k) scan[static_cast<size_t>(k)] = cost(0.25 * k);
    std::vector<std::pair<double, double>> minima;  // angle, cost
    for (int k = 0; k < kSteps; ++k) {
        const double c = scan[static_cast<size_t>(k)];
        if (c <= scan[static_cast<size_t>((k + kSteps - 1) % kSteps)] && c <= scan[static_cast<size_t>((k + 1) % kSteps)]) {
            const double a = refine_plate_angle_deg(cost, 0.25 * k, 0.25);
            minima.emplace_back(a, cost(a));
        }
    }
    double best_cost = minima.front().second;
    for (const auto& m : minima) best_cost = std::min(best_cost, m.second);
    auto distance = [&](double a) { return std::abs(std::remainder(a - p->fast_axis_deg, 180.0)); };
    double angle = minima.front().first;
    bool have = false;
    for (const auto& [a, c] : minima)
        if (c <= best_cost + 1e-6 * scale && (!have || distance(a) < distance(angle))) angle = a, have = true;
    out.angle_before_deg = p->fast_axis_deg;
    out.angle_deg = angle;
    const Stokes before = beam->power.at_target, after = at(angle);
    out.power_before_mw = scale * before[0];
    out.power_mw = scale * after[0];
    out.useful_before_mw = useful(before);
    out.useful_mw = useful(after);
    if (goal.power_mw) out.reached = std::abs(out.power_mw - *goal.power_mw) <= 1e-3 * std::max(*goal.power_mw, 1e-9);
    std::get<Plate>(out.layout.elements[plate].kind).fast_axis_deg = angle;
    return out;
}

}  // namespace rv
