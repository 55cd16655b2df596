#pragma once
// The crystal setting that phase-matches: the external turn (in the table plane) or tilt (about
// the horizontal axis across the beam) that brings the angle ψ between the wave vector inside
// and the crystal's reference axis to the phase-matching angle, for a beam arriving along a
// fixed direction (trace/crystal_axes.hpp for the geometry and signs).

#include <optional>

#include "trace/crystal_axes.hpp"

namespace rv {

// How the crystal is turned: Turn about the vertical axis (+ = clockwise seen from above, so
// normal_deg decreases by it), Tilt about the horizontal axis across the beam (+ = the face
// normal rises, tilt_deg grows by it).
enum class CrystalRotation { Turn, Tilt };

// The range searched: a turn of up to ±60° in the table plane; a tilt within ±45° (the file's
// range for tilt_deg: beyond it the face lies nearly along the beam).
constexpr double kMaxCrystalTurn_deg = 60.0;
constexpr double kMaxCrystalTilt_deg = 45.0;

// The change of the setting nearest to the present one (within ±max_change_deg, and for a tilt
// keeping |tilt| ≤ max_tilt_deg) that makes ψ = psi_wanted_rad, for a wave along `outside`
// with `index` inside. None when no setting in that range reaches it.
std::optional<double> rotation_to_angle_deg(const CrystalPose& pose, CrystalRotation how, const Vec2& outside,
                                            double index, double psi_wanted_rad, double max_change_deg,
                                            double max_tilt_deg = 45.0);

// The pose after such a change.
CrystalPose rotated_pose(const CrystalPose& pose, CrystalRotation how, double change_deg);

}  // namespace rv
