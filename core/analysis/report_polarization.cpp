// The polarization each input of the crystal's first process needs (o or e, horizontal or
// vertical as the crystal is set), how much of it arrives so, and the wave plate to turn (or
// that a half-wave plate is missing), from the power trace (analysis/power_budget.hpp).
#include <cstdint>

#include "analysis/plate_angle_search.hpp"
#include "analysis/report_sections.hpp"

namespace rv::report_sections {

namespace {

// Polarization advice for one beam at the crystal (see PolarizationAdvice): the wave plate to
// turn is the last one on the path after the last polarizer or cube before the target (turning
// it changes the polarization without changing the power), its best angle found by a 0.5° scan
// and a golden-section refinement of the power in the needed polarization.
PolarizationAdvice advise_polarization(const Layout& layout, const MaterialLibrary& library,
                                       const ReportBeam& b, const Crystal& xc, bool needs_a) {
    PolarizationAdvice a;
    a.beam = b.id;
    const bool needs_h =
        needs_a != xc.optic_axis_horizontal;  // A = o is H when the axis plane is vertical
    a.needs_a = needs_a;
    a.needs_horizontal = needs_h;
    const PolarizationState& s = b.at_target_polarization;
    auto useful = [&](const Stokes& st) {
        return needs_h ? (st[0] + st[1]) / 2 : (st[0] - st[1]) / 2;
    };
    a.useful_fraction = s.power > 0 ? useful(b.power.at_target) / s.power : 0;
    const std::optional<double> src_mw = layout.beams[b.path.beam].power_mw;
    if (src_mw) a.useful_mw = *src_mw * useful(b.power.at_target);
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
        for (size_t k = 0; k < before_target; ++k)
            before = before || b.path.hits[k].element == pass.element;
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
    const Stokes at_best =
        target_stokes_with_plate(layout, library, b.path, b.caustic, plate, *a.plate_best_deg);
    a.useful_fraction_best = at_best[0] > 0 ? useful(at_best) / at_best[0] : 0;
    if (src_mw) a.useful_mw_best = *src_mw * useful(at_best);
    return a;
}

}  // namespace

std::vector<PolarizationAdvice> polarization_advice(const Layout& layout,
                                                    const MaterialLibrary& library,
                                                    const Crystal& crystal,
                                                    const RendezvousReport& r) {
    std::vector<PolarizationAdvice> out;
    if (r.phase_matching.empty() || r.phase_matching.front().outside_index_data)
        return out;
    const PhaseMatchingReport& first = r.phase_matching.front();
    const bool sfg = first.sum_frequency;
    // A type-II SHG needs both polarizations from one beam: no single wave to advise for.
    const bool type_ii_shg =
        !sfg && first.mixing != MixingType::TypeI && first.mixing != MixingType::TypeI_BBA;
    if (type_ii_shg) return out;
    for (size_t i = 0; i < r.beams.size(); ++i)
        if ((sfg ? i < 2 : i == first.first_beam) && r.beams[i].at_target.reached &&
            r.beams[i].power.reached)
            out.push_back(advise_polarization(
                layout, library, r.beams[i], crystal,
                i == first.first_beam ? first.first_needs_a : first.second_needs_a));
    return out;
}

}  // namespace rv::report_sections
