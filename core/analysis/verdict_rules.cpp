#include "analysis/verdict_rules.hpp"

#include <algorithm>
#include <cmath>

namespace rv {

SpaceFigures space_figures(const BeamAtTarget& a, const BeamAtTarget& b, const Mismatch& m) {
    const double shorter = std::min({a.tangential.rayleigh_mm, a.sagittal.rayleigh_mm, b.tangential.rayleigh_mm,
                                     b.sagittal.rayleigh_mm});
    SpaceFigures f;
    f.waist_offset_rayleigh = std::abs(m.waist_offset_mm) / shorter;
    f.waist_ratio = std::max(m.waist_ratio, 1 / m.waist_ratio);
    // Per plane, as the overlap's exponent adds them: exp(−2 (d_t²/Σw_t² + d_s²/Σw_s²)).
    f.lateral_radius = std::hypot(m.lateral_tangential_um / std::hypot(a.tangential.radius_um, b.tangential.radius_um),
                                  m.lateral_sagittal_um / std::hypot(a.sagittal.radius_um, b.sagittal.radius_um));
    return f;
}

bool space_figures_met(const SpaceFigures& f, const VerdictThresholds& t) {
    return f.waist_offset_rayleigh <= t.max_waist_offset_rayleigh && f.waist_ratio <= t.max_waist_ratio &&
           f.lateral_radius <= t.max_lateral_offset_radius;
}

double single_beam_offset_rayleigh(const BeamAtTarget& a) {
    const double off = (a.tangential.waist_offset_mm + a.sagittal.waist_offset_mm) / 2;
    return std::abs(off) / std::min(a.tangential.rayleigh_mm, a.sagittal.rayleigh_mm);
}

bool single_beam_offset_met(double offset_rayleigh, const VerdictThresholds& t) {
    return offset_rayleigh <= t.max_waist_offset_rayleigh;
}

double mean_waist_um(const BeamAtTarget& a) { return (a.tangential.waist_um + a.sagittal.waist_um) / 2; }

bool waist_goal_met(double waist_um, double goal_um, const VerdictThresholds& t) {
    return std::abs(waist_um - goal_um) <= t.max_goal_waist_error * goal_um;
}

bool waist_goals_met(const Layout& layout, const std::vector<BeamAtTarget>& at) {
    for (const auto& [id, goal] : layout.goals.waist_um)
        for (size_t b = 0; b < layout.beams.size() && b < at.size(); ++b)
            if (layout.beams[b].id == id && at[b].reached && !waist_goal_met(mean_waist_um(at[b]), goal, layout.goals.verdict))
                return false;
    return true;
}

double cross_correlation_fwhm_fs(double first_fwhm_fs, double second_fwhm_fs) {
    return std::hypot(first_fwhm_fs, second_fwhm_fs);
}

bool delay_met(double delay_fs, double cross_correlation_fs, const VerdictThresholds& t) {
    return std::abs(delay_fs) <= t.max_delay_xcorr * cross_correlation_fs;
}

double phase_factor(double delta_k_l) {
    const double x = delta_k_l / 2;
    return x == 0 ? 1 : std::pow(std::sin(x) / x, 2);
}

bool phase_met(bool phase_matchable, double sinc2, bool polarizations_suit, const VerdictThresholds& t) {
    return phase_matchable && sinc2 >= t.min_phase_factor && polarizations_suit;
}

}  // namespace rv
