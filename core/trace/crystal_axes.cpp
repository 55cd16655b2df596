#include "trace/crystal_axes.hpp"

#include <algorithm>
#include <cmath>

#include "units/constants.hpp"

namespace rv {

namespace {

struct Frame {
    Vec3 n, t, z;
};
Frame frame_of(const CrystalPose& pose) {
    const Vec2 t2 = perpendicular(pose.face_normal);
    return {Vec3(pose.face_normal.x(), pose.face_normal.y(), 0), Vec3(t2.x(), t2.y(), 0), Vec3(0, 0, 1)};
}

}  // namespace

CrystalPose crystal_pose(const Vec2& face_normal, const Crystal& crystal) {
    return CrystalPose{face_normal, deg_to_rad(crystal.cut_deg), crystal.optic_axis_horizontal,
                       deg_to_rad(crystal.tilt_deg)};
}

Vec3 wave_vector_from_outside(const CrystalPose& pose, const Vec2& outside_2d, double index) {
    const Frame f = frame_of(pose);
    const double m = std::isfinite(index) && index > 0 ? index : 1.0;
    const Vec3 outside = Vec3(outside_2d.x(), outside_2d.y(), 0).normalized();
    // Snell's law in vector form at the tilted face: the part along the face over the index,
    // the rest along the normal on the side the wave travels to.
    const Vec3 n_tilted = std::cos(pose.tilt_rad) * f.n + std::sin(pose.tilt_rad) * f.z;
    const double normal_part = outside.dot(n_tilted);
    const Vec3 along_face = (outside - normal_part * n_tilted) / m;
    const double rest = std::sqrt(std::max(0.0, 1 - along_face.squaredNorm()));
    return (along_face + std::copysign(rest, normal_part) * n_tilted).normalized();
}

Vec3 wave_vector_inside(const CrystalPose& pose, const Vec2& k_inside, double index) {
    const Frame f = frame_of(pose);
    const double along_t = k_inside.dot(perpendicular(pose.face_normal)), along_n = k_inside.dot(pose.face_normal);
    if (pose.tilt_rad == 0) return along_n * f.n + along_t * f.t;  // no tilt: the trace's own direction
    const double m = std::isfinite(index) && index > 0 ? index : 1.0;
    // The outside direction in the table plane (Snell at the untilted face, k's side kept).
    const double sin_a = std::clamp(m * along_t, -1.0, 1.0);
    const double cos_a = std::copysign(std::sqrt(1 - sin_a * sin_a), along_n);
    return wave_vector_from_outside(pose, cos_a * pose.face_normal + sin_a * perpendicular(pose.face_normal), m);
}

Vec3 reference_axis(const CrystalPose& pose) {
    const Frame f = frame_of(pose);
    const double cut = pose.cut_rad, tau = pose.tilt_rad;
    return pose.axis_in_table_plane
               ? Vec3(std::cos(cut) * (std::cos(tau) * f.n + std::sin(tau) * f.z) + std::sin(cut) * f.t)
               : Vec3(std::cos(cut + tau) * f.n + std::sin(cut + tau) * f.z);
}

double angle_to_reference_axis_rad(const CrystalPose& pose, const Vec3& k) {
    return std::acos(std::clamp(std::abs(k.dot(reference_axis(pose))), 0.0, 1.0));
}

Vec3 away_from_axis(const CrystalPose& pose, const Vec3& k) {
    Vec3 c = reference_axis(pose);
    if (k.dot(c) < 0) c = -c;  // the axis line's direction on k's side: cos ψ = k·c ≥ 0
    // k = cos ψ c + sin ψ (−u)… written for u: the part of k across the axis, turned to point
    // away from it (c = cos ψ k − sin ψ u, so u = (cos ψ k − c)/sin ψ).
    const Vec3 across = k.dot(c) * k - c;
    const double len = across.norm();
    return len > 1e-12 ? Vec3(across / len) : Vec3::Zero();
}

WalkoffTurn walkoff_turn(const CrystalPose& pose, const Vec2& k_inside, double index, double walkoff_rad) {
    if (walkoff_rad == 0) return {};
    const Vec3 k = wave_vector_inside(pose, k_inside, index);
    const Vec3 u = away_from_axis(pose, k);
    const Vec2 side = perpendicular(k_inside);
    const double s = std::sin(walkoff_rad), c = std::cos(walkoff_rad);
    const double across = s * (u.x() * side.x() + u.y() * side.y());  // in the table plane, ⟂ k
    return {std::atan2(across, c), s * u.z() / std::hypot(c, across)};
}

double angle_to_reference_axis_rad(const CrystalPose& pose, const Vec2& k_inside, double index) {
    return angle_to_reference_axis_rad(pose, wave_vector_inside(pose, k_inside, index));
}

double a_wave_fraction(const Polarization& p, bool horizontal_axis) {
    using K = Polarization::Kind;
    double horizontal = 0.5;  // circular
    if (p.kind == K::Horizontal) horizontal = 1;
    if (p.kind == K::Vertical) horizontal = 0;
    if (p.kind == K::Linear) horizontal = std::pow(std::cos(deg_to_rad(p.angle_deg)), 2);
    return horizontal_axis ? 1 - horizontal : horizontal;
}

}  // namespace rv
