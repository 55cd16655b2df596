#include "analysis/crystal_angle.hpp"

#include <cmath>

#include "units/constants.hpp"

namespace rv {

CrystalPose rotated_pose(const CrystalPose& pose, CrystalRotation how, double change_deg) {
    CrystalPose p = pose;
    const double c = deg_to_rad(change_deg);
    if (how == CrystalRotation::Turn) {
        // Clockwise seen from above: the normal turns by −c in the table plane.
        const Vec2& n = pose.face_normal;
        p.face_normal = Vec2(std::cos(c) * n.x() + std::sin(c) * n.y(), -std::sin(c) * n.x() + std::cos(c) * n.y());
    } else {
        p.tilt_rad += c;
    }
    return p;
}

std::optional<double> rotation_to_angle_deg(const CrystalPose& pose, CrystalRotation how, const Vec2& outside,
                                            double index, double psi_wanted_rad, double max_change_deg,
                                            double max_tilt_deg) {
    auto miss = [&](double change_deg) {
        const CrystalPose p = rotated_pose(pose, how, change_deg);
        return angle_to_reference_axis_rad(p, wave_vector_from_outside(p, outside, index)) - psi_wanted_rad;
    };
    auto allowed = [&](double change_deg) {
        return how == CrystalRotation::Turn || std::abs(rad_to_deg(pose.tilt_rad) + change_deg) <= max_tilt_deg;
    };
    // Bisection between two settings whose misses differ in sign.
    auto refine = [&](double a, double b) {
        double fa = miss(a);
        for (int it = 0; it < 60; ++it) {
            const double m = (a + b) / 2, fm = miss(m);
            if ((fm < 0) == (fa < 0)) a = m, fa = fm;
            else b = m;
        }
        return (a + b) / 2;
    };
    const double f0 = miss(0);
    if (f0 == 0) return 0.0;
    // Walk outward from the present setting in 0.25° steps, both ways; the first sign change
    // is the nearest setting (ψ changes by less than a step's worth between samples).
    constexpr double kStep_deg = 0.25;
    double prev_up = f0, prev_down = f0;
    for (double x = kStep_deg; x <= max_change_deg + 1e-9; x += kStep_deg) {
        std::optional<double> up, down;
        if (allowed(x)) {
            const double f = miss(x);
            if ((f < 0) != (prev_up < 0) || f == 0) up = refine(x - kStep_deg, x);
            prev_up = f;
        }
        if (allowed(-x)) {
            const double f = miss(-x);
            if ((f < 0) != (prev_down < 0) || f == 0) down = refine(-x + kStep_deg, -x);
            prev_down = f;
        }
        if (up && down) return std::abs(*up) <= std::abs(*down) ? up : down;
        if (up) return up;
        if (down) return down;
    }
    return std::nullopt;
}

}  // namespace rv
