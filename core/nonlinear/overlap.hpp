#pragma once
// Overlap factors of two beams of different colours (the fields do not interfere, so these
// are intensity-product overlaps), each 0..1.
//
// Transverse, per plane (1-D Gaussians of 1/e² radii w1, w2 and centre offset d):
//   √(2 w1 w2/(w1² + w2²)) · exp(−2 d²/(w1² + w2²)),
// so that for round beams the product of both planes is ∫I1I2/√(∫I1² ∫I2²) = 2w1w2/(w1²+w2²)
// times the offset factor exp(−2d²/(w1²+w2²)) (docs/physics.md §6.2, consistent with Boulanger &
// Zyss, International Tables for Crystallography D, §1.7.3.3).
// Temporal, Gaussian pulses of intensity FWHM τ1, τ2 delayed by Δt (cross-correlation):
//   exp(−4 ln2 Δt²/(τ1² + τ2²)).

namespace rv {

double transverse_overlap_1d(double w1_um, double w2_um, double offset_um);

double temporal_overlap(double fwhm1_fs, double fwhm2_fs, double delay_fs);

}  // namespace rv
