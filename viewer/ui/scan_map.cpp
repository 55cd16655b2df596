#include "ui/scan_map.hpp"

#include <algorithm>
#include <cmath>

#include "ui/plot_axes.hpp"
#include "units/number_text.hpp"

namespace rv::ui {

namespace {

const char* rotation_word(const ScanResult& r) { return r.plan.rotation == CrystalRotation::Turn ? "turn" : "tilt"; }

std::string axis_line(const char* name, const ScanAxisPlan& a, const char* unit, const char* fmt) {
    auto n = [&](double v) { return format_number(fmt, v); };
    return std::string(name) + ": centre " + n(a.centre) + " " + unit + " (now " + n(a.present) + "), range ±" +
           n(a.half_range) + " " + unit + ", step " + n(a.step) + " " + unit + ", " + std::to_string(a.points) +
           " points (signal FWHM " + n(a.fwhm) + " " + unit + ", uncertainty σ " + n(a.sigma) + " " + unit + ")";
}

}  // namespace

std::string scan_refusal_text(const ScanRefusal& f) {
    const std::string where = f.pointer.empty() ? "" : " (at " + f.pointer + (f.element.empty() ? "" : ", " + f.element) + ")";
    switch (f.kind) {
        case ScanRefusal::Kind::NoCrystalTarget:
            return "cannot scan: the target" + where + " is not an anisotropic crystal; expected the id of a crystal element";
        case ScanRefusal::Kind::NoProcess:
            return "cannot scan: the crystal" + where + " has no phase-matchable process with its beams";
        case ScanRefusal::Kind::NoGeneratedLight:
            return "cannot scan: no generated light is predicted" + where +
                   "; expected power_mw, pulse_fwhm_fs and repetition_rate_khz on both beams of the process";
        case ScanRefusal::Kind::NoStage:
            return "cannot scan: no delay stage" + where +
                   " carries an optic of either beam; expected a stage element whose carries lists an optic on a path";
        case ScanRefusal::Kind::NoRotation:
            return "cannot scan: no setting of the crystal" + where + " within the searched range reaches the phase-matching angle";
        case ScanRefusal::Kind::TooManyPoints:
            return "cannot scan: --points asks for " + std::to_string(f.points) + " points along an axis; expected at most " +
                   std::to_string(kMaxScanPoints);
    }
    return "cannot scan";
}

std::string scan_stage_axis_label(const ScanResult& r) {
    if (!r.plan.stage_applies) return "no delay axis (SHG of one beam)";
    return "stage " + r.plan.stage + " position (mm)";
}

std::string scan_rotation_axis_label(const ScanResult& r) {
    return "crystal " + r.plan.crystal + " " + rotation_word(r) + " from now (deg)";
}

std::vector<std::string> scan_plan_lines(const ScanResult& r) {
    const ScanPlan& p = r.plan;
    const ScanMap& m = r.map;
    std::vector<std::string> out;
    out.push_back("Scan plan for the generated " + format_number("%.1f", m.output_nm) + " nm light (predicted average power)");
    if (p.stage_applies)
        out.push_back(axis_line(("stage " + p.stage).c_str(), p.stage_mm, "mm", "%.4f") + "; delay " +
                      format_number("%.2f", p.delay_per_mm_fs) + " fs per mm, cross-correlation FWHM " +
                      format_number("%.1f", p.cross_correlation_fs) + " fs, delay σ " +
                      format_number("%.1f", p.delay_sigma_fs) + " fs");
    else
        out.push_back("stage: none scanned (the SHG of one beam does not depend on a delay)");
    out.push_back(axis_line(("crystal " + p.crystal + " " + rotation_word(r)).c_str(), p.rotation_deg, "deg", "%.4f") +
                  "; internal acceptance FWHM " + format_number("%.3f", p.acceptance_internal_mrad) + " mrad, " +
                  format_number("%.3f", p.dpsi_per_deg_mrad) + " mrad inside per deg, angle σ " +
                  format_number("%.3f", p.psi_sigma_mrad) + " mrad");
    out.push_back("ranges: ±" + format_number("%.0f", kScanCoverageSigmas) +
                  "σ of the tolerance run's errors (" + std::to_string(p.perturbations) +
                  " perturbations, linear, each uniform in ±its tolerance, unaligned), at least ±1 FWHM");
    out.push_back("points to scan before giving up: " + std::to_string(p.plan_points) + " (" +
                  std::to_string(p.stage_mm.points) + " × " + std::to_string(p.rotation_deg.points) + ")");
    out.push_back("map: " + std::to_string(m.stage_mm.size()) + " × " + std::to_string(m.rotation_deg.size()) + " cells" +
                  (m.non_finite ? ", " + std::to_string(m.non_finite) + " without a finite value" : std::string()));
    out.push_back("predicted now: " + format_number("%.4g", m.present_mw) + " mW; peak on the map " +
                  format_number("%.4g", m.peak_mw) + " mW at " +
                  (p.stage_applies ? "stage " + format_number("%.4f", m.peak_stage_mm) + " mm, " : std::string()) +
                  rotation_word(r) + " " + format_number("%+.4f", m.peak_rotation_deg) + " deg (best focused estimate " +
                  format_number("%.4g", m.best_mw) + " mW)");
    out.push_back("the map holds the beams as traced: turning the crystal changes the phase mismatch only");
    return out;
}

ImU32 scan_colour(double f) {
    // Our ramp: five stops, linear between them.
    static const float stops[5][3] = {{20, 24, 82}, {30, 100, 140}, {40, 160, 120}, {150, 200, 60}, {250, 230, 40}};
    const double x = std::clamp(std::isfinite(f) ? f : 0.0, 0.0, 1.0) * 4;
    const int i = std::min(3, static_cast<int>(x));
    const double u = x - i;
    auto mix = [&](int c) { return static_cast<int>(stops[i][c] + u * (stops[i + 1][c] - stops[i][c]) + 0.5); };
    return IM_COL32(mix(0), mix(1), mix(2), 255);
}

void draw_scan_map(ImDrawList* draw, ImVec2 origin, ImVec2 size, const ScanResult& r) {
    const ImU32 ink = IM_COL32(40, 40, 50, 255);
    draw->AddRectFilled(origin, ImVec2(origin.x + size.x, origin.y + size.y), IM_COL32(255, 255, 255, 255));
    const ScanMap& m = r.map;
    if (r.refusal || m.stage_mm.empty() || m.rotation_deg.empty()) {
        draw->AddText(ImVec2(origin.x + 8, origin.y + 8), ink, r.refusal ? scan_refusal_text(*r.refusal).c_str() : "no map");
        return;
    }
    const size_t nx = m.stage_mm.size(), ny = m.rotation_deg.size();
    // The data rectangle: margins for tick labels (left, bottom), the title (top), the bar (right).
    const ImVec2 lo(origin.x + 70, origin.y + 28), hi(origin.x + size.x - 110, origin.y + size.y - 48);
    if (hi.x - lo.x < 10 || hi.y - lo.y < 10) return;
    // Cell edges: half a spacing beyond the first and last values.
    auto edges = [](const std::vector<double>& v) {
        if (v.size() == 1) return std::pair(v[0] - 0.5, v[0] + 0.5);
        const double h = (v.back() - v.front()) / (v.size() - 1) / 2;
        return std::pair(v.front() - h, v.back() + h);
    };
    const auto [x0, x1] = edges(m.stage_mm);
    const auto [y0, y1] = edges(m.rotation_deg);
    auto sx = [&](double x) { return static_cast<float>(lo.x + (x - x0) / (x1 - x0) * (hi.x - lo.x)); };
    auto sy = [&](double y) { return static_cast<float>(hi.y - (y - y0) / (y1 - y0) * (hi.y - lo.y)); };
    const double top = m.peak_mw > 0 ? m.peak_mw : 1;
    const float cw = (hi.x - lo.x) / nx, ch = (hi.y - lo.y) / ny;
    for (size_t j = 0; j < ny; ++j)
        for (size_t i = 0; i < nx; ++i) {
            const std::optional<double>& v = m.power_mw[j * nx + i];
            const ImU32 c = v ? scan_colour(*v / top) : IM_COL32(160, 160, 160, 255);
            const ImVec2 a(lo.x + i * cw, hi.y - (j + 1) * ch);
            draw->AddRectFilled(a, ImVec2(a.x + cw, a.y + ch), c);
        }
    draw->AddRect(lo, hi, ink);
    char buf[48];
    // Ticks: round values (ui/plot_axes.hpp's steps).
    if (r.plan.stage_applies) {
        const double step = nice_step(x1 - x0, 6);
        for (const long long k : tick_indices(x0, x1, step)) {
            const float px = sx(k * step);
            draw->AddLine(ImVec2(px, hi.y), ImVec2(px, hi.y + 5), ink);
            std::snprintf(buf, sizeof buf, "%g", k == 0 ? 0.0 : k * step);
            draw->AddText(ImVec2(px - 14, hi.y + 7), ink, buf);
        }
    }
    {
        const double step = nice_step(y1 - y0, 5);
        for (const long long k : tick_indices(y0, y1, step)) {
            const float py = sy(k * step);
            draw->AddLine(ImVec2(lo.x - 5, py), ImVec2(lo.x, py), ink);
            std::snprintf(buf, sizeof buf, "%g", k == 0 ? 0.0 : k * step);
            draw->AddText(ImVec2(origin.x + 6, py - 8), ink, buf);
        }
    }
    const std::string xl = scan_stage_axis_label(r), yl = scan_rotation_axis_label(r);
    draw->AddText(ImVec2((lo.x + hi.x) / 2 - 3.5f * xl.size(), hi.y + 26), ink, xl.c_str());
    draw->AddText(ImVec2(origin.x + 6, origin.y + 6), ink, ("↑ " + yl + "   predicted generated power").c_str());
    // Colour bar with its unit.
    const ImVec2 bl(hi.x + 22, lo.y), bh(hi.x + 40, hi.y);
    constexpr int kBands = 64;
    for (int b = 0; b < kBands; ++b) {
        const float ya = bh.y - (b + 1) * (bh.y - bl.y) / kBands, yb = bh.y - b * (bh.y - bl.y) / kBands;
        draw->AddRectFilled(ImVec2(bl.x, ya), ImVec2(bh.x, yb + 1), scan_colour((b + 0.5) / kBands));
    }
    draw->AddRect(bl, bh, ink);
    const double bstep = nice_step(top, 4);
    for (const long long k : tick_indices(0, top, bstep)) {
        const float py = static_cast<float>(bh.y - k * bstep / top * (bh.y - bl.y));
        draw->AddLine(ImVec2(bh.x, py), ImVec2(bh.x + 4, py), ink);
        std::snprintf(buf, sizeof buf, "%g", k * bstep);
        draw->AddText(ImVec2(bh.x + 6, py - 8), ink, buf);
    }
    draw->AddText(ImVec2(bl.x - 4, bh.y + 8), ink, "mW");
    // The present setting (a cross) and the predicted peak (a ring), clipped to the map.
    draw->PushClipRect(lo, hi, true);
    const ImVec2 now(sx(r.plan.stage_applies ? r.plan.stage_mm.present : m.stage_mm.front()), sy(0));
    draw->AddLine(ImVec2(now.x - 7, now.y - 7), ImVec2(now.x + 7, now.y + 7), IM_COL32(255, 255, 255, 255), 2);
    draw->AddLine(ImVec2(now.x - 7, now.y + 7), ImVec2(now.x + 7, now.y - 7), IM_COL32(255, 255, 255, 255), 2);
    const ImVec2 peak(sx(m.peak_stage_mm), sy(m.peak_rotation_deg));
    draw->AddCircle(peak, 8, IM_COL32(230, 30, 60, 255), 24, 2);
    draw->PopClipRect();
    const bool now_on_map = now.x >= lo.x && now.x <= hi.x && now.y >= lo.y && now.y <= hi.y;
    draw->AddText(ImVec2(hi.x - 230, origin.y + 6), ink, now_on_map ? "x now   o predicted peak" : "x now (off the map)   o predicted peak");
}

}  // namespace rv::ui
