#include "scene/beam_palette.hpp"

#include <algorithm>
#include <cmath>

namespace rv::scene {

namespace {

double linear(std::uint8_t v8) {  // IEC 61966-2-1 inverse transfer curve
    const double v = v8 / 255.0;
    return v <= 0.04045 ? v / 12.92 : std::pow((v + 0.055) / 1.055, 2.4);
}

double lab_f(double t) {  // CIE 15:2004, the cube root with its linear toe
    constexpr double d = 6.0 / 29.0;
    return t > d * d * d ? std::cbrt(t) : t / (3 * d * d) + 4.0 / 29.0;
}

// HSV (h in degrees, s and v in [0, 1]) to an 8-bit colour: the candidates' generator.
Colour from_hsv(double h_deg, double s, double v) {
    const double c = v * s, hp = std::fmod(h_deg, 360.0) / 60.0, x = c * (1 - std::abs(std::fmod(hp, 2.0) - 1));
    double r = 0, g = 0, b = 0;
    if (hp < 1) r = c, g = x;
    else if (hp < 2) r = x, g = c;
    else if (hp < 3) g = c, b = x;
    else if (hp < 4) g = x, b = c;
    else if (hp < 5) r = x, b = c;
    else r = c, b = x;
    const double m = v - c;
    auto byte = [m](double u) { return static_cast<std::uint8_t>(std::lround(std::clamp(u + m, 0.0, 1.0) * 255)); };
    return {byte(r), byte(g), byte(b), 255};
}

const std::vector<Colour>& candidates() {
    static const std::vector<Colour> set = [] {
        std::vector<Colour> out;
        const Colour table{236, 238, 240, 255};  // scene.hpp's table colour: a beam must show on it
        for (const auto& [s, v] : {std::pair{0.9, 0.85}, std::pair{0.9, 0.5}, std::pair{0.45, 0.95}})
            for (int k = 0; k < 24; ++k)
                if (const Colour c = from_hsv(15.0 * k, s, v); delta_e76(c, table) >= kMinBeamDeltaE76) out.push_back(c);
        return out;
    }();
    return set;
}

}  // namespace

Lab srgb_to_lab(const Colour& c) {
    const double r = linear(c.r), g = linear(c.g), b = linear(c.b);
    const double x = 0.4124564 * r + 0.3575761 * g + 0.1804375 * b;
    const double y = 0.2126729 * r + 0.7151522 * g + 0.0721750 * b;
    const double z = 0.0193339 * r + 0.1191920 * g + 0.9503041 * b;
    const double fx = lab_f(x / 0.95047), fy = lab_f(y / 1.0), fz = lab_f(z / 1.08883);
    return {116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)};
}

double delta_e76(const Colour& a, const Colour& b) {
    const Lab p = srgb_to_lab(a), q = srgb_to_lab(b);
    return std::sqrt((p.l - q.l) * (p.l - q.l) + (p.a - q.a) * (p.a - q.a) + (p.b - q.b) * (p.b - q.b));
}

std::vector<BeamStyle> distinct_beam_styles(const std::vector<double>& wavelengths_nm) {
    std::vector<BeamStyle> out;
    auto far_from_all = [&out](const Colour& c) {
        return std::all_of(out.begin(), out.end(), [&c](const BeamStyle& s) { return delta_e76(c, s.colour) >= kMinBeamDeltaE76; });
    };
    for (const double nm : wavelengths_nm) {
        BeamStyle style = beam_style(nm);
        if (!far_from_all(style.colour)) {
            const Colour own = style.colour;
            const Colour* best = nullptr;
            double best_d = 0;
            for (const Colour& c : candidates())
                if (far_from_all(c) && (!best || delta_e76(c, own) < best_d)) best = &c, best_d = delta_e76(c, own);
            if (best) style.colour = *best;  // none only beyond dozens of beams: then it stays
        }
        out.push_back(style);
    }
    return out;
}

bool legend_lists_generated(const RendezvousReport& report, const PhaseMatchingReport& p) {
    return p.sum_frequency || report.beams.size() == 1;
}

std::vector<double> drawn_wavelengths_nm(const RendezvousReport& report) {
    std::vector<double> out;
    for (const ReportBeam& b : report.beams) out.push_back(b.wavelength_nm);
    for (const PhaseMatchingReport& p : report.phase_matching)
        if (legend_lists_generated(report, p)) out.push_back(p.output_nm);
    return out;
}

}  // namespace rv::scene
