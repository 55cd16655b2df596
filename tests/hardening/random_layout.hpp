#pragma once
// Seeded random layouts that a correct reader must accept: our own invented two-arm tables.
//
// Each beam starts at the left edge of its half of a 3000 × 2000 mm table and runs through a
// chain of fold mirrors (normals on the bisector of the wanted fold, so the chief ray through a
// mirror's centre turns by the wanted angle), with lenses (ideal, thin chromatic, thick from a
// named shape or from radii) and tilted plates between them; its last mirror sends it to the
// shared target (a plain target or a birefringent crystal). Plates shift the ray sideways and
// lenses then deflect it, so some beams miss later optics: a miss is a finding, not an error.
// Every number lies inside the range the format documents (docs/file-format.md, "Layout file format").
//
// The generator uses its own uniform draws from std::mt19937_64 (whose output sequence the
// standard fixes), not std::uniform_real_distribution, so a seed gives the same layouts with
// any standard library.

#include <cmath>
#include <cstdint>
#include <functional>
#include <optional>
#include <nlohmann/json.hpp>
#include <random>
#include <string>
#include <vector>

namespace rv::hardening {

class Random {
  public:
    explicit Random(std::uint64_t seed) : engine_(seed) {}
    double uniform(double lo, double hi) {
        const double u = static_cast<double>(engine_() >> 11) * 0x1.0p-53;  // [0, 1)
        return lo + (hi - lo) * u;
    }
    int integer(int lo, int hi) {  // inclusive
        return lo + static_cast<int>(engine_() % static_cast<std::uint64_t>(hi - lo + 1));
    }
    bool chance(double p) { return uniform(0, 1) < p; }
    template <class T>
    const T& pick(const std::vector<T>& options) {
        return options[static_cast<size_t>(integer(0, static_cast<int>(options.size()) - 1))];
    }
    // A number magnitude in [lo, hi] drawn evenly in its logarithm, with a random sign.
    double signed_log(double lo, double hi) {
        const double m = std::exp(uniform(std::log(lo), std::log(hi)));
        return chance(0.5) ? m : -m;
    }

  private:
    std::mt19937_64 engine_;
};

constexpr double kPi = 3.14159265358979323846;
inline double deg_of(double rad) {
    return rad * 180.0 / kPi;
}

struct Point {
    double x_mm, y_mm;
};

struct RandomLayoutOptions {
    int max_folds = 4;              // fold mirrors per arm before the last one
    int max_inline_per_leg = 3;     // lenses and plates between two mirrors
    bool allow_single_beam = true;  // some layouts have one beam only
};

// The elements of one arm, from its start to its last mirror, appended to `elements`.
inline void add_arm(Random& rng, const std::string& prefix, Point start, double y_lo_mm,
                    double y_hi_mm, Point last_mirror, Point target, const RandomLayoutOptions& o,
                    nlohmann::json& elements) {
    std::vector<Point> way = {start};
    const int folds = rng.integer(0, o.max_folds);
    const double span_mm = last_mirror.x_mm - start.x_mm;
    for (int i = 0; i < folds; ++i) {
        const double x = start.x_mm + span_mm * (i + 1) / (folds + 1) + rng.uniform(-40, 40);
        way.push_back({x, rng.uniform(y_lo_mm, y_hi_mm)});
    }
    way.push_back(last_mirror);
    way.push_back(target);
    int serial = 0;
    auto next_id = [&](const char* kind) { return prefix + kind + std::to_string(serial++); };
    for (size_t leg = 0; leg + 1 < way.size(); ++leg) {
        const Point a = way[leg], b = way[leg + 1];
        const double dx = b.x_mm - a.x_mm, dy = b.y_mm - a.y_mm;
        const double length_mm = std::hypot(dx, dy);
        const double axis_deg = deg_of(std::atan2(dy, dx));
        // Inline optics on this leg (none on the last one, into the target).
        const int inline_count = leg + 2 < way.size() ? rng.integer(0, o.max_inline_per_leg) : 0;
        for (int k = 0; k < inline_count; ++k) {
            const double t = (k + 1.0) / (inline_count + 1.0) + rng.uniform(-0.05, 0.05);
            if (length_mm * t < 30 || length_mm * (1 - t) < 30) continue;
            const nlohmann::json at = {a.x_mm + t * dx, a.y_mm + t * dy};
            nlohmann::json e;
            const int kind = rng.integer(0, 5);
            if (kind <= 3) {
                e = {{"id", next_id("L")}, {"type", "lens"}, {"at_mm", at}};
                e["normal_deg"] = axis_deg + (rng.chance(0.5) ? 0.0 : 180.0) + rng.uniform(-3, 3);
                if (kind == 0) {
                    e["focal_length_mm"] = rng.signed_log(60, 2000);
                } else if (kind == 1) {
                    e["focal_length_mm"] = rng.signed_log(60, 2000);
                    e["glass"] = rng.pick<std::string>({"N-BK7", "fused-silica", "CaF2", "N-SF11"});
                    e["design_wavelength_nm"] = rng.uniform(450, 1100);
                } else if (kind == 2) {
                    const bool convex = rng.chance(0.6);
                    e["shape"] =
                        convex ? rng.pick<std::string>({"plano-convex", "convex-plano", "biconvex"})
                               : rng.pick<std::string>(
                                     {"plano-concave", "concave-plano", "biconcave"});
                    e["focal_length_mm"] = (convex ? 1 : -1) * rng.uniform(80, 1000);
                    e["center_thickness_mm"] = rng.uniform(2, 6);
                    e["glass"] = rng.pick<std::string>({"N-BK7", "fused-silica"});
                } else {
                    e["front_radius_mm"] = rng.signed_log(80, 3000);
                    if (rng.chance(0.7)) e["back_radius_mm"] = rng.signed_log(80, 3000);
                    e["center_thickness_mm"] = rng.uniform(2, 8);
                    e["glass"] = rng.pick<std::string>({"N-BK7", "CaF2"});
                }
                if (rng.chance(0.3)) e["aperture_mm"] = rng.uniform(12, 50);
            } else {
                e = {{"id", next_id("P")}, {"type", "plate"}, {"at_mm", at}};
                e["normal_deg"] = axis_deg + rng.uniform(-35, 35);
                e["material"] = rng.pick<std::string>({"N-BK7", "fused-silica", "CaF2", "N-SF11"});
                e["thickness_mm"] = rng.uniform(0.3, 12);
                std::string role;
                if (rng.chance(0.4)) role = rng.pick<std::string>({"half-wave", "quarter-wave", "polarizing-cube"});
                std::optional<double> fast_axis_deg;
                if (rng.chance(0.3)) fast_axis_deg = rng.uniform(0, 90);
                // The polarization fields from a generator of their own (seeded by the id), so
                // that the geometry drawn from `rng` stays what it was.
                Random extra(std::hash<std::string>{}(e["id"].get<std::string>()));
                if (role == "polarizing-cube" && extra.chance(0.3)) role = "polarizer";
                if (!role.empty()) e["role"] = role;
                if (role == "half-wave" || role == "quarter-wave") {
                    e["design_nm"] = extra.uniform(400, 1600);
                    if (extra.chance(0.5)) e["retarder_material"] = extra.pick<std::string>({"quartz", "MgF2"});
                    if (extra.chance(0.3)) e["order"] = static_cast<int>(extra.uniform(0, 8));
                } else if (!role.empty()) {
                    e["extinction_ratio"] = extra.uniform(10, 1e5);
                    if (role == "polarizing-cube" && extra.chance(0.5)) e["reflects"] = "right";
                }
                if (fast_axis_deg && role != "polarizing-cube" && !role.empty()) e["fast_axis_deg"] = *fast_axis_deg;
                if (extra.chance(0.2)) e["transmission"] = extra.uniform(0.5, 1);
            }
            elements.push_back(e);
        }
        // The mirror at the end of this leg (the last leg ends at the target).
        if (leg + 2 < way.size()) {
            const Point c = way[leg + 2];
            const double in_x = dx / length_mm, in_y = dy / length_mm;
            const double ox = c.x_mm - b.x_mm, oy = c.y_mm - b.y_mm, ol = std::hypot(ox, oy);
            const double nx = ox / ol - in_x, ny = oy / ol - in_y;
            nlohmann::json m = {{"id", next_id("M")},
                                {"type", "mirror"},
                                {"at_mm", {b.x_mm, b.y_mm}},
                                {"normal_deg", deg_of(std::atan2(ny, nx))}};
            if (rng.chance(0.3)) m["radius_of_curvature_mm"] = rng.signed_log(200, 5000);
            if (rng.chance(0.3)) m["aperture_mm"] = rng.uniform(15, 50);
            elements.push_back(m);
        }
    }
}

inline nlohmann::json random_beam(Random& rng, const std::string& id, Point start,
                                  double direction_deg) {
    nlohmann::json b = {{"id", id},
                        {"wavelength_nm", rng.uniform(420, 1600)},
                        {"start_mm", {start.x_mm, start.y_mm}},
                        {"direction_deg", direction_deg}};
    if (rng.chance(0.5))
        b["waist_um"] = rng.uniform(150, 2500);
    else
        b["waist_um"] = {rng.uniform(150, 2500), rng.uniform(150, 2500)};
    if (rng.chance(0.5)) b["waist_at_mm"] = rng.uniform(-800, 800);
    if (rng.chance(0.5)) b["m2"] = {rng.uniform(1, 1.8), rng.uniform(1, 1.8)};
    if (rng.chance(0.8)) b["pulse_fwhm_fs"] = rng.uniform(15, 800);
    if (rng.chance(0.5)) b["emit_time_fs"] = rng.uniform(-2000, 2000);
    const std::string pol = rng.pick<std::string>(
        {"horizontal", "vertical", "linear", "circular-left", "circular-right"});
    b["polarization"] = pol;
    if (pol == "linear") b["polarization_angle_deg"] = rng.uniform(0, 180);
    if (rng.chance(0.3)) b["power_mw"] = rng.uniform(0.1, 5000);
    return b;
}

// One random valid layout as a JSON document. Beams are named "A" and "B" (in that order).
inline nlohmann::json random_layout(std::uint64_t seed, const RandomLayoutOptions& o = {}) {
    Random rng(seed);
    const Point target = {2500, 1000};
    nlohmann::json elements = nlohmann::json::array();
    nlohmann::json beams = nlohmann::json::array();
    const bool two = !o.allow_single_beam || rng.chance(0.9);
    // Arm A in the lower half, arm B in the upper; each arrives at 6–16° to the table's x.
    for (int arm = 0; arm < (two ? 2 : 1); ++arm) {
        const double sign = arm == 0 ? -1 : 1;
        const Point start = {rng.uniform(20, 200), 1000 + sign * rng.uniform(150, 850)};
        const double approach_rad = sign * rng.uniform(6, 16) * kPi / 180;
        const double distance_mm = rng.uniform(180, 450);
        const Point last = {target.x_mm - distance_mm * std::cos(approach_rad),
                            target.y_mm + distance_mm * std::sin(approach_rad)};
        const double y_lo = arm == 0 ? 120 : 1150, y_hi = arm == 0 ? 850 : 1880;
        // The beam leaves its start towards the first waypoint: add_arm draws the waypoints,
        // so aim the beam afterwards at the first element or mirror it placed.
        const size_t first = elements.size();
        const std::string id = arm == 0 ? "A" : "B";
        add_arm(rng, id + "_", start, y_lo, y_hi, last, target, o, elements);
        // The first optic of the arm lies on the first leg: the direction to it is the leg's.
        const auto& at = elements[first]["at_mm"];
        const double direction_deg =
            deg_of(std::atan2(at[1].get<double>() - start.y_mm, at[0].get<double>() - start.x_mm));
        beams.push_back(random_beam(rng, id, start, direction_deg));
    }
    nlohmann::json t;
    if (rng.chance(0.5)) {
        t = {{"id", "X"},
             {"type", "crystal"},
             {"at_mm", {target.x_mm, target.y_mm}},
             {"normal_deg", rng.uniform(-8, 8)},
             {"material", rng.pick<std::string>({"BBO", "BBO:Eimerl1987", "LBO", "KTP"})},
             {"length_mm", rng.uniform(0.2, 8)},
             {"cut_deg", rng.uniform(0, 90)},
             {"phase_matching", rng.chance(0.5) ? "type-I" : "type-II"},
             {"optic_axis", rng.chance(0.5) ? "horizontal" : "vertical"}};
        if (t["material"] != "BBO" && t["material"] != "BBO:Eimerl1987" && rng.chance(0.5))
            t["principal_plane"] = rng.pick<std::string>({"XY", "YZ", "XZ"});
        if (rng.chance(0.3)) t["aperture_mm"] = rng.uniform(3, 20);
        // Half the LBO crystals (by their length) take the set with temperature, in an oven
        // between −40 and 250 °C (by their cut): from values already drawn, so the random
        // sequence, and every other layout of a seed, stays as it was.
        if (t["material"] == "LBO" && t["length_mm"].get<double>() > 4.1) {
            t["material"] = "LBO:Kato2018";
            t["temperature_c"] = -40 + 290 * t["cut_deg"].get<double>() / 90;
        }
    } else {
        t = {{"id", "X"},
             {"type", "target"},
             {"at_mm", {target.x_mm, target.y_mm}},
             {"normal_deg", rng.uniform(-10, 10)}};
    }
    elements.push_back(t);
    if (rng.chance(0.5))
        elements.push_back({{"id", "D"},
                            {"type", "dump"},
                            {"at_mm", {2900, 1000}},
                            {"normal_deg", 180},
                            {"aperture_mm", 200}});
    // A stage carrying the first optic of arm A, moved within its travel.
    if (rng.chance(0.3)) {
        const double lo = rng.uniform(-20, 0), hi = rng.uniform(1, 30);
        elements.push_back({{"id", "S"},
                            {"type", "stage"},
                            {"carries", {elements[0]["id"]}},
                            {"axis_deg", rng.uniform(0, 360)},
                            {"position_mm", rng.uniform(lo, hi)},
                            {"travel_mm", {lo, hi}}});
    }
    nlohmann::json doc = {{"format", "rendezvous-layout"},
                          {"version", 1},
                          {"name", "random " + std::to_string(seed)},
                          {"table", {{"size_mm", {3000, 2000}}}},
                          {"beams", beams},
                          {"elements", elements},
                          {"target", "X"}};
    return doc;
}

// The same layout with its beams listed in the other order.
inline nlohmann::json with_beams_swapped(nlohmann::json doc) {
    if (doc["beams"].size() == 2) std::swap(doc["beams"][0], doc["beams"][1]);
    return doc;
}

}  // namespace rv::hardening
