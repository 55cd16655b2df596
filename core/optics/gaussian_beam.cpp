#include "optics/gaussian_beam.hpp"

#include <cmath>
#include <limits>

#include "units/constants.hpp"

namespace rv {

namespace {
// M² λ0 / (π n), in mm: the "effective local wavelength over π" that links q to the radius.
double effective_lambda_over_pi_mm(const GaussianBeam& beam) {
    return beam.m2 * nm_to_mm(beam.wavelength_nm) / (kPi * beam.index);
}
}  // namespace

GaussianBeam beam_from_waist(const Waist& waist) {
    GaussianBeam beam{{0.0, 0.0}, waist.wavelength_nm, waist.index, waist.m2};
    const double w0_mm = um_to_mm(waist.waist_um);
    const double z_r_mm = w0_mm * w0_mm / effective_lambda_over_pi_mm(beam);
    beam.q_mm = {-waist.distance_to_waist_mm, z_r_mm};
    return beam;
}

GaussianBeam propagate(const GaussianBeam& beam, const RayMatrix& m, double index_after) {
    GaussianBeam out = beam;
    // (A q + B)/(C q + D), dividing by multiplying with the conjugate: q never lies on the real
    // axis (Im q = z_R > 0), so the inf/NaN care of std::complex's division (__divdc3) is not
    // needed, and this is the hot loop of tracing and solving.
    const std::complex<double> num = m(0, 0) * beam.q_mm + m(0, 1);
    const std::complex<double> den = m(1, 0) * beam.q_mm + m(1, 1);
    const double den_norm = std::norm(den);
    out.q_mm = {(num.real() * den.real() + num.imag() * den.imag()) / den_norm,
                (num.imag() * den.real() - num.real() * den.imag()) / den_norm};
    out.index = index_after;
    return out;
}

GaussianBeam propagate(const GaussianBeam& beam, const RayMatrix& m) {
    return propagate(beam, m, beam.index);
}

double radius_um(const GaussianBeam& beam) {
    // Im(1/q) = −M² λ0 / (π n W²), and Im(1/q) = −Im q/|q|², so W² = (M²λ0/πn)·|q|²/Im q.
    return mm_to_um(std::sqrt(effective_lambda_over_pi_mm(beam) * std::norm(beam.q_mm) / std::imag(beam.q_mm)));
}

double waist_radius_um(const GaussianBeam& beam) {
    return mm_to_um(std::sqrt(effective_lambda_over_pi_mm(beam) * rayleigh_range_mm(beam)));
}

double distance_to_waist_mm(const GaussianBeam& beam) { return -std::real(beam.q_mm); }

double rayleigh_range_mm(const GaussianBeam& beam) { return std::imag(beam.q_mm); }

double wavefront_radius_mm(const GaussianBeam& beam) {
    // Re(1/q) = Re q/|q|²
    if (std::real(beam.q_mm) == 0.0) return std::numeric_limits<double>::infinity();
    return std::norm(beam.q_mm) / std::real(beam.q_mm);
}

double gouy_phase_rad(const GaussianBeam& beam) {
    return std::atan2(std::real(beam.q_mm), std::imag(beam.q_mm));
}

double divergence_rad(const GaussianBeam& beam) {
    return effective_lambda_over_pi_mm(beam) / um_to_mm(waist_radius_um(beam));
}

}  // namespace rv
