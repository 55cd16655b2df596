// rendezvous sweep: one field of the layout against the report's figures.
#include <cmath>
#include <nlohmann/json.hpp>
#include <ostream>

#include "analysis/sweep.hpp"
#include "cli/commands.hpp"
#include "cli/load.hpp"
#include "io/csv.hpp"
#include "units/number_text.hpp"

namespace rv::cli {

namespace {

// The figures of one point, in the order of the header; NaN where a figure does not exist.
std::vector<double> figures_of(const SweepPoint& p) {
    std::vector<double> row{p.value};
    for (const ReportBeam& b : p.report.beams) {
        row.push_back(b.at_target.reached ? (b.at_target.tangential.waist_um + b.at_target.sagittal.waist_um) / 2 : NAN);
        row.push_back(b.at_target.reached ? (b.at_target.tangential.waist_offset_mm + b.at_target.sagittal.waist_offset_mm) / 2 : NAN);
    }
    const std::optional<Mismatch>& m = p.report.mismatch;
    row.push_back(m ? m->waist_offset_mm : NAN);
    row.push_back(m ? m->waist_ratio : NAN);
    row.push_back(m ? m->lateral_um : NAN);
    row.push_back(m ? m->delay_fs : NAN);
    const std::optional<OverlapReport>& ov = p.report.overlap;
    row.push_back(ov ? ov->spatial_along_crystal : NAN);
    row.push_back(ov && ov->temporal ? *ov->temporal : NAN);
    row.push_back(ov ? ov->combined : NAN);
    row.push_back(p.report.phase_matching.empty() ? NAN : p.report.phase_matching.front().sinc2_now);
    return row;
}

// The stage whose position the sweep varies, if it does.
const Stage* swept_stage(const Layout& layout, const std::string& id, const std::string& field) {
    const Element* e = layout.find(id);
    return e && field == "position_mm" ? std::get_if<Stage>(&e->kind) : nullptr;
}

}  // namespace

int run_sweep(const SweepOptions& o, std::ostream& out, std::ostream& err) {
    const std::optional<Layout> layout = load_layout(o.layout, err);
    if (!layout) return 2;
    const size_t dot = o.vary.find('.');
    if (dot == std::string::npos || dot == 0 || dot + 1 == o.vary.size()) {
        err << "rendezvous: error: --vary expects ID.FIELD, as in L2_P.at_mm[0] (got \"" << o.vary << "\")\n";
        return 2;
    }
    const std::string id = o.vary.substr(0, dot), field = o.vary.substr(dot + 1);
    const SweepResult r = sweep_field(*layout, id, field, o.from, o.to, o.steps);
    if (!r.diagnostics.empty()) {
        for (const Diagnostic& d : r.diagnostics) err << format_diagnostic(d, o.layout) << "\n";
        return 2;
    }
    const Stage* stage = swept_stage(*layout, id, field);
    if (o.json) {
        using nlohmann::json;
        // The same figures as the table's columns, by name; null where a figure does not exist.
        std::vector<std::string> names;
        for (const BeamSource& b : layout->beams) {
            names.push_back(b.id + "_waist_um");
            names.push_back(b.id + "_waist_offset_mm");
        }
        for (const char* n : {"waist_offset_mm", "waist_ratio", "lateral_um", "delay_fs", "overlap_spatial",
                              "overlap_temporal", "overlap_combined", "sinc2_now"})
            names.push_back(n);
        json points = json::array();
        for (const SweepPoint& p : r.points) {
            const std::vector<double> row = figures_of(p);
            json point = {{"value", row[0]}, {"in_travel", stage ? json(!p.outside_travel) : json(nullptr)}};
            for (size_t c = 1; c < row.size(); ++c) point[names[c - 1]] = std::isfinite(row[c]) ? json(row[c]) : json(nullptr);
            points.push_back(std::move(point));
        }
        out << json{{"layout", o.layout}, {"vary", o.vary}, {"points", points}}.dump(2) << "\n";
        return 0;
    }
    const char* sep = o.csv ? "," : "  ";
    // The header names hold ids, which may hold a comma or a quote: quoted in the CSV.
    auto name = [&o](const std::string& text) { return o.csv ? csv_field(text) : text; };
    out << name(o.vary);
    for (const BeamSource& b : layout->beams)
        out << sep << name(b.id + "_waist_um") << sep << name(b.id + "_waist_offset_mm");
    out << sep << "waist_offset_mm" << sep << "waist_ratio" << sep << "lateral_um" << sep << "delay_fs" << sep
        << "overlap_spatial" << sep << "overlap_temporal" << sep << "overlap_combined" << sep << "sinc2_now"
        << (stage ? std::string(sep) + "in_travel" : "") << "\n";
    std::vector<std::vector<double>> rows;
    for (const SweepPoint& p : r.points) rows.push_back(figures_of(p));
    // Each column's scale, for the shared zero rule (units/number_text.hpp).
    std::vector<double> scale(rows.front().size());
    for (size_t c = 0; c < scale.size(); ++c) {
        std::vector<double> column;
        for (const std::vector<double>& row : rows) column.push_back(row[c]);
        scale[c] = column_scale(column);
    }
    bool any_outside = false;
    for (size_t i = 0; i < rows.size(); ++i) {
        for (size_t c = 0; c < rows[i].size(); ++c) out << (c ? sep : "") << format_number("%.6g", rows[i][c], scale[c]);
        if (stage) out << sep << (r.points[i].outside_travel ? "no" : "yes");
        out << "\n";
        any_outside = any_outside || r.points[i].outside_travel;
    }
    if (any_outside) {
        // With --csv the note goes to stderr, so that standard output stays one table.
        (o.csv ? err : out) << "in_travel no: beyond " << id << "'s travel [" << format_number("%g", stage->travel_min_mm)
                            << ", " << format_number("%g", stage->travel_max_mm)
                            << "] mm, which the stage cannot reach; those rows are the model's figures as if it could\n";
    }
    return 0;
}

}  // namespace rv::cli
