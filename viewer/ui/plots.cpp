#include "ui/plots.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <optional>
#include <string>

#include "scene/beam_palette.hpp"
#include "ui/plot_axes.hpp"
#include "units/number_text.hpp"

namespace rv::ui {

namespace {
// Pulses farther apart than this many times the sum of their lengths get a broken time axis.
constexpr double kBrokenAxisPulses = 4;
// Beam k's colour as the table view draws it (scene/beam_palette.hpp).
ImU32 beam_colour(const RendezvousReport& r, size_t k, int alpha = 255) {
    const std::vector<scene::BeamStyle> styles = scene::report_beam_styles(r);
    const scene::Colour c = k < styles.size() ? styles[k].colour : scene::Colour{};
    return IM_COL32(c.r, c.g, c.b, alpha);
}

// A beam's tangential and sagittal radii at z mm from the target plane, interpolated between
// the envelope samples around it.
std::optional<std::pair<double, double>> radius_at(const ReportBeam& b, double z) {
    const std::vector<EnvelopeSample>& e = b.caustic.envelope;
    const double s = b.at_target.path_mm + z;
    for (size_t i = 0; i + 1 < e.size(); ++i)
        if (e[i].s_mm <= s && s <= e[i + 1].s_mm && e[i + 1].s_mm > e[i].s_mm) {
            const double f = (s - e[i].s_mm) / (e[i + 1].s_mm - e[i].s_mm);
            return std::make_pair(e[i].radius_tangential_um + f * (e[i + 1].radius_tangential_um - e[i].radius_tangential_um),
                                  e[i].radius_sagittal_um + f * (e[i + 1].radius_sagittal_um - e[i].radius_sagittal_um));
        }
    return std::nullopt;
}
}  // namespace

void draw_caustic_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const RendezvousReport& r) {
    double range = 0, top = 0;
    for (const ReportBeam& b : r.beams)
        if (b.at_target.reached) range = std::max(range, 3 * std::max(b.at_target.tangential.rayleigh_mm, b.at_target.sagittal.rayleigh_mm));
    if (range <= 0) {
        draw_axes(draw, origin, size, -1, 1, 0, 1, "mm from the target", "radius um", "Caustic: no beam reaches the target");
        return;
    }
    range = std::max(range, r.crystal_length_mm);
    for (const ReportBeam& b : r.beams) {
        if (!b.at_target.reached) continue;
        for (const EnvelopeSample& e : b.caustic.envelope)
            if (std::abs(e.s_mm - b.at_target.path_mm) <= range)
                top = std::max({top, e.radius_tangential_um, e.radius_sagittal_um});
    }
    const PlotAxes a = draw_axes(draw, origin, size, -range, range, 0, 1.1 * top, "mm from the target centre",
                                 "radius um", "Caustic near the target (t solid, s dashed)");
    draw->PushClipRect(a.min_px, a.max_px, true);
    if (r.target_is_crystal) {
        const ImVec2 p0 = a.to_screen(-r.crystal_length_mm / 2, 1.1 * top), p1 = a.to_screen(r.crystal_length_mm / 2, 0);
        draw->AddRectFilled(p0, p1, IM_COL32(250, 215, 150, 110));
    }
    for (const ReportBeam& b : r.beams) {
        if (!b.at_target.reached) continue;
        for (int plane = 0; plane < 2; ++plane) {
            std::vector<ImVec2> pts;
            for (const EnvelopeSample& e : b.caustic.envelope) {
                const double z = e.s_mm - b.at_target.path_mm;
                if (std::abs(z) <= range) pts.push_back(a.to_screen(z, plane ? e.radius_sagittal_um : e.radius_tangential_um));
            }
            if (plane == 0) {
                draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), beam_colour(r, static_cast<size_t>(&b - r.beams.data())), ImDrawFlags_None, 2.0f);
            } else {
                for (size_t i = 0; i + 1 < pts.size(); i += 2) draw->AddLine(pts[i], pts[i + 1], beam_colour(r, static_cast<size_t>(&b - r.beams.data())), 1.5f);
            }
        }
        // Waist markers and the Rayleigh range around each (tangential plane).
        const PlaneAtTarget& t = b.at_target.tangential;
        const ImVec2 w = a.to_screen(t.waist_offset_mm, t.waist_um);
        draw->AddCircleFilled(w, 4, beam_colour(r, static_cast<size_t>(&b - r.beams.data())));
        const ImVec2 l = a.to_screen(t.waist_offset_mm - t.rayleigh_mm, t.waist_um * std::sqrt(2.0));
        const ImVec2 rr = a.to_screen(t.waist_offset_mm + t.rayleigh_mm, t.waist_um * std::sqrt(2.0));
        draw->AddLine(l, rr, beam_colour(r, static_cast<size_t>(&b - r.beams.data()), 140), 1.0f);
    }
    draw->PopClipRect();
    // Hover readout: both beams' radii at the cursor's position along the beam.
    const ImVec2 mouse = ImGui::GetIO().MousePos;
    if (mouse.x < a.min_px.x || mouse.x > a.max_px.x || mouse.y < a.min_px.y || mouse.y > a.max_px.y) return;
    const double z = a.x0 + (mouse.x - a.min_px.x) / (a.max_px.x - a.min_px.x) * (a.x1 - a.x0);
    draw->AddLine(ImVec2(mouse.x, a.min_px.y), ImVec2(mouse.x, a.max_px.y), IM_COL32(90, 90, 90, 160), 1.0f);
    std::string text = "z " + std::to_string(z).substr(0, z < 0 ? 6 : 5) + " mm";
    for (const ReportBeam& b : r.beams) {
        if (!b.at_target.reached) continue;
        const std::optional<std::pair<double, double>> w = radius_at(b, z);
        if (!w) continue;
        char line[96];
        std::snprintf(line, sizeof line, "\n%s %.1f / %.1f µm", b.id.c_str(), w->first, w->second);
        text += line;
    }
    const ImVec2 box(mouse.x + 8, a.min_px.y + 4);
    const ImVec2 extent = ImGui::CalcTextSize(text.c_str());
    draw->AddRectFilled(box, ImVec2(box.x + extent.x + 8, box.y + extent.y + 6), IM_COL32(255, 255, 255, 230));
    draw->AddText(ImVec2(box.x + 4, box.y + 3), IM_COL32(30, 30, 30, 255), text.c_str());
}

namespace {

// Both pulses (Gaussian intensity of their FWHM) over the axes' time range, each beam's colour.
void draw_pulses(ImDrawList* draw, const PlotAxes& a, const RendezvousReport& r, const double arrivals_fs[2],
                 const double taus_fs[2]) {
    draw->PushClipRect(a.min_px, a.max_px, true);
    for (int k = 0; k < 2; ++k) {
        std::vector<ImVec2> pts;
        for (int i = 0; i <= 400; ++i) {
            const double t = a.x0 + (a.x1 - a.x0) * i / 400;
            const double x = (t - arrivals_fs[k]) / taus_fs[k];
            pts.push_back(a.to_screen(t, std::exp(-4 * std::log(2.0) * x * x)));
        }
        draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), beam_colour(r, static_cast<size_t>(k)), ImDrawFlags_None, 2.0f);
    }
    draw->PopClipRect();
}

}  // namespace

void draw_timing_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const Layout& layout, const RendezvousReport& r) {
    if (r.beams.size() < 2 || !r.mismatch || !layout.beams[0].pulse_fwhm_fs || !layout.beams[1].pulse_fwhm_fs) {
        draw_axes(draw, origin, size, -1, 1, 0, 1, "fs", "", "Timing: two pulsed beams at the target needed");
        return;
    }
    const double d = r.mismatch->delay_fs;  // beam 1 − beam 2: beam 2 arrives at t0 − d
    const double tau1 = *layout.beams[0].pulse_fwhm_fs, tau2 = *layout.beams[1].pulse_fwhm_fs;
    const double arrivals[2] = {0, -d};
    const double taus[2] = {tau1, tau2};
    char title[160];
    if (std::abs(d) <= kBrokenAxisPulses * (tau1 + tau2)) {  // both on one axis
        const double span = std::max(2 * std::hypot(tau1, tau2), std::abs(d) + 1.5 * std::max(tau1, tau2));
        const double centre = -d / 2;
        std::snprintf(title, sizeof title, "Pulses at the target: delay %s", format_duration_fs(d, true).c_str());
        const PlotAxes a = draw_axes(draw, origin, size, centre - span, centre + span, 0, 1.1,
                                     "fs from the first beam's arrival", "intensity", title);
        draw_pulses(draw, a, r, arrivals, taus);
        return;
    }
    // Far apart: a broken time axis, each pulse on its own panel around its own arrival (the
    // earlier one on the left), and an arrow across the break with the delay between them.
    const int first = arrivals[0] <= arrivals[1] ? 0 : 1, second = 1 - first;
    const double half_fs = 2.0 * std::max(tau1, tau2);
    const float gap = 44, panel = std::floor((size.x - gap) / 2);
    // Each panel's time from its own pulse's arrival (labels of ±2τ, not of the whole delay).
    std::snprintf(title, sizeof title, "%s first", r.beams[first].id.c_str());
    const PlotAxes left = draw_axes(draw, origin, ImVec2(panel, size.y), -half_fs, half_fs, 0, 1.1,
                                    "fs, own peak", "intensity", title);
    // A narrow panel: the delay to 0.1 ps (the report and the time line give it in full).
    const std::string later = std::abs(d) > 1e4 ? format_number("+%.1f ps", std::abs(d) * 1e-3)
                                                : format_duration_fs(std::abs(d), true);
    std::snprintf(title, sizeof title, "%s %s", r.beams[second].id.c_str(), later.c_str());
    const PlotAxes right = draw_axes(draw, ImVec2(origin.x + panel + gap, origin.y), ImVec2(size.x - panel - gap, size.y),
                                     -half_fs, half_fs, 0, 1.1, "fs, own peak", "", title);
    const double from_first[2] = {arrivals[0] - arrivals[first], arrivals[1] - arrivals[first]};
    const double from_second[2] = {arrivals[0] - arrivals[second], arrivals[1] - arrivals[second]};
    draw_pulses(draw, left, r, from_first, taus);
    draw_pulses(draw, right, r, from_second, taus);
    // The break: two slanted strokes on the axis line, and the arrow between the panels.
    const ImU32 ink = IM_COL32(40, 40, 50, 255);
    const float y = left.max_px.y, x0 = left.max_px.x + 6, x1 = right.min_px.x - 6;
    for (const float x : {x0 + 4.0f, x1 - 4.0f}) draw->AddLine(ImVec2(x - 4, y + 6), ImVec2(x + 4, y - 6), ink, 1.5f);
    const float ay = (left.min_px.y + left.max_px.y) / 2;
    draw->AddLine(ImVec2(x0, ay), ImVec2(x1, ay), ink, 1.5f);
    draw->AddTriangleFilled(ImVec2(x1, ay), ImVec2(x1 - 7, ay - 4), ImVec2(x1 - 7, ay + 4), ink);
    draw->AddText(ImVec2(x0, ay + 4), ink, "axis");
    draw->AddText(ImVec2(x0, ay + 18), ink, "broken");
}

std::string unit_of_key(const std::string& key) {
    const std::string name = key.substr(0, key.find('['));
    static const std::pair<const char*, const char*> kUnits[] = {
        {"_mm", "mm"}, {"_um", "µm"}, {"_nm", "nm"}, {"_fs", "fs"}, {"_deg", "°"}, {"_c", "°C"},
        {"_mw", "mW"}, {"_uj", "µJ"}, {"_khz", "kHz"}, {"_gw_cm2", "GW/cm²"}, {"_j_cm2", "J/cm²"}};
    for (const auto& [suffix, unit] : kUnits) {
        const std::string s = suffix;
        if (name.size() > s.size() && name.compare(name.size() - s.size(), s.size(), s) == 0) return unit;
    }
    return "";
}

void draw_sweep_plot(ImDrawList* draw, ImVec2 origin, ImVec2 size, const SweepCurves& c) {
    const std::string key = c.field.substr(c.field.find('.') + 1), unit = unit_of_key(key);
    const std::string x_label = c.field + (unit.empty() ? "" : " / " + unit);
    if (c.values.size() < 2 || !(c.values.back() != c.values.front())) {
        draw_axes(draw, origin, size, 0, 1, 0, 1, x_label, "", "Sweep: no values");
        return;
    }
    const double lo = std::min(c.values.front(), c.values.back()), hi = std::max(c.values.front(), c.values.back());
    const PlotAxes a = draw_axes(draw, origin, size, lo, hi, 0, 1.05, x_label, "0 to 1",
                                 "Sweep: overlap (blue), sinc² (orange)");
    const ImU32 ink[2] = {IM_COL32(40, 90, 200, 255), IM_COL32(230, 120, 0, 255)};
    const std::vector<double>* curves[2] = {&c.overlap, &c.sinc2};
    draw->PushClipRect(a.min_px, a.max_px, true);
    for (int k = 0; k < 2; ++k) {
        std::vector<ImVec2> pts;
        for (size_t i = 0; i < c.values.size() && i < curves[k]->size(); ++i) pts.push_back(a.to_screen(c.values[i], (*curves[k])[i]));
        draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), ink[k], ImDrawFlags_None, 2.0f);
    }
    draw->PopClipRect();
}

}  // namespace rv::ui
