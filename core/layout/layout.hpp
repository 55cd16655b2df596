#pragma once
// The table layout: an immutable value read from a layout file (format "rendezvous-layout",
// version 1). Units as in the file: mm, nm, µm, fs, degrees; angles counter-clockwise from +x
// in the table plane (x right, y up, top view).
//
// Geometry conventions (docs/physics.md §0.2):
// * at_mm is an element's reference point, normal_deg the direction of its surface normal
//   (for a lens or target: its axis, either sign). The aperture is a segment of aperture_mm
//   centred on at_mm, perpendicular to the normal.
// * Mirror: reflects from the side its normal points to (light arriving from behind is a
//   finding); radius_of_curvature_mm > 0 is concave towards the side
//   its normal points to. aim_at replaces normal_deg by the normal that sends the incoming
//   chief ray to that element's at_mm.
// * Dichroic: at_mm on the coated face, the normal points out of it; the substrate lies behind.
// * Slabs (plate, crystal) are centred on at_mm and extend ±thickness/2 along the normal.
// * An element carried by a stage sits at at_mm + position_mm·(cos axis_deg, sin axis_deg).
// * Thick lens: the front face (R1) is the one on the −normal side, met first by light that
//   travels along +normal; light travelling the other way meets the faces in reverse.

#include <Eigen/Core>
#include <cmath>
#include <optional>
#include <string>
#include <type_traits>
#include <utility>
#include <variant>
#include <vector>

#include "nonlinear/phase_matching.hpp"

namespace rv {

using Vec2 = Eigen::Vector2d;

// The unit vector at angle_deg counter-clockwise from +x, and a vector turned by +90°.
inline Vec2 direction_deg(double angle_deg) {
    const double a = angle_deg * 3.14159265358979323846 / 180.0;
    return {std::cos(a), std::sin(a)};
}
inline Vec2 perpendicular(const Vec2& v) { return {-v.y(), v.x()}; }

inline constexpr double kDefaultAperture_mm = 25.4;

// Per-plane value given in a file as one number or as [tangential, sagittal].
struct PlanePair {
    double tangential = 0.0, sagittal = 0.0;
    bool operator==(const PlanePair&) const = default;
    bool round() const { return tangential == sagittal; }
};

struct Polarization {
    enum class Kind { Horizontal, Vertical, Linear, CircularLeft, CircularRight };
    Kind kind = Kind::Horizontal;
    double angle_deg = 0.0;  // for Linear: angle from the table plane
    bool operator==(const Polarization&) const = default;
};

struct BeamSource {
    std::string id;
    double wavelength_nm = 0.0;
    Vec2 start_mm{0, 0};
    double direction_deg = 0.0;
    PlanePair waist_um;           // second-moment waist radius
    PlanePair waist_at_mm;        // waist position along the beam from start, + downstream
    PlanePair m2{1.0, 1.0};
    std::optional<double> pulse_fwhm_fs;  // not given: no temporal overlap
    // The chirp (GDD, fs²) the pulse leaves the source with; pulse_fwhm_fs is then the length
    // of its transform-limited form. Not given: transform-limited (analysis/pulse_at_target.hpp).
    std::optional<double> input_gdd_fs2;
    double emit_time_fs = 0.0;
    Polarization polarization;
    double polarized_fraction = 1.0;  // degree of polarization; the rest is unpolarized
    std::optional<double> power_mw;             // average power at the start
    std::optional<double> repetition_rate_khz;  // not given: no pulse energy or peak intensity
    bool operator==(const BeamSource&) const = default;
};

// ---- elements -------------------------------------------------------------------------

struct IdealLens {  // thin, no dispersion
    double focal_length_mm = 0.0;
    bool operator==(const IdealLens&) const = default;
};
struct ThinChromaticLens {  // thin, focal length given at a design wavelength for a glass
    double focal_length_mm = 0.0;
    std::string glass;
    double design_wavelength_nm = 587.6;
    bool operator==(const ThinChromaticLens&) const = default;
};
struct ThickLens {  // singlet from radii (or a named shape solved at the design wavelength)
    double front_radius_mm = 0.0;  // R1; infinity = flat
    double back_radius_mm = 0.0;   // R2
    double center_thickness_mm = 0.0;
    std::string glass;
    std::optional<std::string> shape;  // the named shape it came from; absent when given by radii
    double focal_length_mm = 0.0;  // with a named shape: the focal length asked for
    double design_wavelength_nm = 587.6;
    bool operator==(const ThickLens&) const = default;
};
#ifdef RV_TEST_EXTRA_ELEMENT_KIND
// Test only, as TestOnlyKind below: a lens model nothing handles.
struct TestOnlyLensModel {
    bool operator==(const TestOnlyLensModel&) const = default;
};
#define RV_TEST_ONLY_LENS_MODEL , TestOnlyLensModel
#else
#define RV_TEST_ONLY_LENS_MODEL
#endif
struct Lens {
    // Handled with a std::visit (layout/visit.hpp) wherever each model matters.
    std::variant<IdealLens, ThinChromaticLens, ThickLens RV_TEST_ONLY_LENS_MODEL> model;
    // The catalog id of the stock lens this is ("part" in the file; absent when none): what the
    // build sheet's parts list names and what solve writes for each lens it chose. The optics
    // are the model's and the element's aperture, never looked up from the id;
    // io/lens_parts.hpp checks the id and those numbers against a catalog where one is known.
    std::optional<std::string> part;
    Lens() = default;
    template <class Model>
        requires(!std::is_same_v<std::decay_t<Model>, Lens>)
    explicit Lens(Model m, std::optional<std::string> part_id = std::nullopt)
        : model(std::move(m)), part(std::move(part_id)) {}
    bool operator==(const Lens&) const = default;
};

struct Mirror {
    std::optional<double> radius_of_curvature_mm;  // absent: flat
    std::optional<std::string> aim_at;             // element id; replaces normal_deg
    double retardance_deg = 0.0;  // phase of s (vertical) relative to p on reflection (coating)
    bool operator==(const Mirror&) const = default;
};

struct Slab {  // a plate of a material
    std::string material;
    double thickness_mm = 0.0;
    bool operator==(const Slab&) const = default;
};

struct Dichroic {
    double edge_nm = 0.0;
    bool reflects_shorter = true;  // "reflects": "shorter" | "longer"
    Slab substrate;
    double retardance_deg = 0.0;  // phase of s relative to p on reflection (coating)
    bool operator==(const Dichroic&) const = default;
};

// A plate: a slab of `slab.material` for the trace, and in its role a retarder or a polarizer.
// Angles of axes are measured looking along the beam from the table plane (horizontal, "H")
// towards the vertical ("V") (polarization/polarization_model.hpp).
struct Plate {
    enum class Role { Window, HalfWave, QuarterWave, PolarizingCube, Polarizer };
    Role role = Role::Window;
    Slab slab;
    double fast_axis_deg = 0.0;  // wave plates: the fast axis; polarizers: the transmission axis
    // Wave plates: the nominal retardance (½ or ¼ wave, plus `order` whole waves) holds at
    // design_nm. With a birefringent retarder_material (quartz, MgF2) the retardance at another
    // wavelength follows from its published n_e − n_o; without one (an ideal plate) it scales as
    // design_nm/λ. retarder_thickness_um gives the birefringent thickness itself instead.
    // Wave plates only: the reader requires design_nm unless a thickness is given.
    std::optional<double> design_nm;
    std::optional<std::string> retarder_material;
    int order = 0;
    std::optional<double> retarder_thickness_um;
    // Polarizing cubes (transmit H, reflect V) and polarizers: power extinction ratio.
    double extinction_ratio = 1000.0;
    bool reflects_left = true;  // cubes: the reflected beam leaves 90° to the left of travel
    bool operator==(const Plate&) const = default;
};

struct Retroreflector {
    bool operator==(const Retroreflector&) const = default;
};

struct Stage {
    std::vector<std::string> carries;
    double axis_deg = 0.0;
    double position_mm = 0.0;
    double travel_min_mm = 0.0, travel_max_mm = 0.0;
    std::optional<double> measured_zero_mm;  // a stage reading where the pulses were found to overlap
    bool operator==(const Stage&) const = default;
};

// A damage threshold of a crystal or sample, as given by its maker (either or both).
struct DamageThreshold {
    std::optional<double> fluence_j_cm2;
    std::optional<double> intensity_gw_cm2;
    bool operator==(const DamageThreshold&) const = default;
};

struct Crystal {
    enum class PhaseMatching { TypeI, TypeII };
    std::string material;
    double length_mm = 0.0;
    double cut_deg = 0.0;  // angle between the optic axis and the face normal
    PhaseMatching phase_matching = PhaseMatching::TypeI;
    // The plane that holds the optic axis and the face normal: "horizontal" = the table plane
    // (horizontally polarized light is extraordinary), "vertical" (it is ordinary).
    bool optic_axis_horizontal = false;
    // Biaxial crystals: the principal plane the beams travel in; cut_deg is then the angle in
    // it (φ from X in XY, θ from Z in YZ and XZ). The plane holding the tuning angle is set on
    // the table like a uniaxial crystal's optic-axis plane (optic_axis).
    PrincipalPlane principal_plane = PrincipalPlane::XY;
    // The tilt about the horizontal axis across the beam (the table-plane line perpendicular to
    // the face normal): + raises the face normal towards +z (up), and carries the optic axis with
    // the crystal. normal_deg is the other angle, the turn in the table plane. The trace stays in
    // the table plane; the tilt enters through the 3-D wave vector inside (trace/crystal_axes.hpp).
    double tilt_deg = 0.0;
    // The crystal's temperature (an oven), for a set with thermo-optic data
    // (materials/thermo_optic.hpp); absent: the set's reference temperature.
    std::optional<double> temperature_c;
    // The process the crystal is set for (the verdict's phase line judges it): the SFG of the two
    // beams, or the SHG of one beam (process_beam). Auto: SFG when both beams reach the crystal,
    // else the SHG of the first that does.
    enum class Process { Auto, SumFrequency, SecondHarmonic };
    Process process = Process::Auto;
    std::optional<std::string> process_beam;  // beam id, with SecondHarmonic only
    DamageThreshold damage;
    bool operator==(const Crystal&) const = default;
};

struct Target {
    DamageThreshold damage;
    bool operator==(const Target&) const = default;
};
struct Dump {
    bool operator==(const Dump&) const = default;
};

#ifdef RV_TEST_EXTRA_ELEMENT_KIND
// Test only (tests/kinds/check_exhaustive.cmake): a kind nothing handles, appended to
// ElementKind, so that every visit that must handle each kind fails to compile.
struct TestOnlyKind {
    bool operator==(const TestOnlyKind&) const = default;
};
#define RV_TEST_ONLY_KIND , TestOnlyKind
#else
#define RV_TEST_ONLY_KIND
#endif

// Handle kinds with a std::visit (layout/visit.hpp), never a get_if chain with a default.
using ElementKind = std::variant<Lens, Mirror, Dichroic, Plate, Retroreflector, Stage, Crystal,
                                 Target, Dump RV_TEST_ONLY_KIND>;

struct Element {
    std::string id;
    Vec2 at_mm{0, 0};
    double normal_deg = 0.0;
    double aperture_mm = kDefaultAperture_mm;
    double transmission = 1.0;  // fraction of the power it passes on (coating losses); 1: lossless
    ElementKind kind;
    // The retrace's test of what changed uses this equality (trace/retrace_memo.cpp); a field
    // that ties elements together must also be flagged as a link there, as id and aim_at are.
    bool operator==(const Element&) const = default;
};

// The file's type name of an element kind ("lens", "mirror", …).
const char* type_name(const ElementKind& kind);

// The damage threshold a kind carries (crystals and targets), else nullptr.
const DamageThreshold* damage_threshold_of(const ElementKind& kind);
// Whether turning the optic walks the beam it reflects (mirrors and dichroics: a tolerance
// run's "walk" adjuster).
bool walks_reflected_beam(const ElementKind& kind);
// Whether the kind can be the layout's target, where the beams are judged (crystals, targets).
bool can_be_target(const ElementKind& kind);

struct UserMaterial {  // SCHOTT-form Sellmeier: n² − 1 = Σ B λ²/(λ² − C), λ in µm, C in µm²
    std::string id;
    std::vector<double> b;
    std::vector<double> c_um2;
    double min_wavelength_nm = 0.0, max_wavelength_nm = 0.0;
    std::string source;
    bool operator==(const UserMaterial&) const = default;
};

struct Table {
    double width_mm = 900.0, height_mm = 600.0;
    double grid_mm = 25.0;  // 25 (metric M6) or 25.4 (imperial 1/4-20)
    bool operator==(const Table&) const = default;
};

// When the report calls space, time and phase "met" (goals.verdict in the file).
struct VerdictThresholds {
    double max_waist_offset_rayleigh = 0.3;  // |waist separation| / shorter Rayleigh range
    double max_waist_ratio = 1.2;            // larger / smaller waist radius
    double max_lateral_offset_radius = 0.23; // lateral offset / √(w1² + w2²) (90 % overlap)
    double max_delay_xcorr = 0.2;            // |delay| / cross-correlation FWHM (90 % overlap)
    double min_phase_factor = 0.9;           // sinc²(ΔkL/2) with the crystal as it is
    double max_goal_waist_error = 0.1;       // |waist − goal| / goal
    bool operator==(const VerdictThresholds&) const = default;
};

// What `rendezvous solve` may change and what it aims at (goals.solve in the file).
struct SolveGoals {
    // All aims put each waist at the target centre; waist: also goals.waist_um per beam;
    // equal-confocal: also b1 = b2; focus: nothing more.
    enum class Aim { Waist, EqualConfocal, Focus };
    Aim aim = Aim::Waist;
    // Elements that may move along the beam at them, with the range of the move in mm
    // (relative to where they are now).
    std::vector<std::pair<std::string, std::pair<double, double>>> move;
    std::vector<std::string> swap;  // lenses that may be replaced by any lens of the catalog
    // Constraints on the solutions: a moved optic's centre stays this far from every other
    // optic's centre (room for the mounts), and half its aperture plus this margin inside the
    // table's edge; each beam's path from its start to the target is at most max_path_mm.
    double min_spacing_mm = 20.0;
    double table_margin_mm = 10.0;
    std::optional<double> max_path_mm;
    bool operator==(const SolveGoals&) const = default;
};

// What the lab adjusts on a built table before it is judged (goals.tolerance.adjust; the
// tolerance run aligns every sample with these, solve/alignment.hpp):
// * stage: re-zeroed, set so that the pulses coincide (within its travel);
// * walk: per beam one or two of the mirrors (or dichroics) that beam reflects from, turned so
//   that its chief ray crosses the target centre (two: also along its direction as designed);
// * refocus: lenses on translation mounts, moved along the beam to put the waists of the beams
//   through them back at the target centre;
// * crystal: the target crystal's angle re-peaked for sinc² (normal_deg when its optic axis
//   lies in the table plane, tilt_deg when it lies in the vertical plane).
struct ToleranceAdjusters {
    std::optional<std::string> stage;
    std::vector<std::vector<std::string>> walk;   // each one or two element ids
    std::vector<std::string> refocus;             // lens ids
    std::optional<std::string> crystal;           // the target crystal's id
    bool operator==(const ToleranceAdjusters&) const = default;
};

// Build tolerances for `rendezvous tolerance` (goals.tolerance in the file): each perturbation
// is drawn uniformly from [−t, +t].
struct Tolerances {
    double position_mm = 0.5;           // every optic along the beam at it
    double angle_mrad = 0.5;            // every optic's rotation in the table plane
    double focal_length_fraction = 0.01;  // every lens's focal length (catalogue ±1 %)
    double stage_mm = 0.001;            // stage repeatability
    // Absent: the defaults (the stage that changes the delay, and for each beam the aim_at
    // mirrors on its path, the last two, as its walk); present and empty: no adjuster.
    std::optional<ToleranceAdjusters> adjust;
    bool operator==(const Tolerances&) const = default;
};

struct Goals {
    std::vector<std::pair<std::string, double>> waist_um;  // beam id → wanted waist radius
    VerdictThresholds verdict;
    Tolerances tolerance;
    std::optional<SolveGoals> solve;
    bool operator==(const Goals&) const = default;
};

struct Layout {
    std::string name;
    Table table;
    std::vector<UserMaterial> materials;
    std::vector<BeamSource> beams;
    std::vector<Element> elements;
    std::string target;  // element id
    Goals goals;
    bool operator==(const Layout&) const = default;

    const Element* find(const std::string& id) const;
};

// How far a stage moves what it carries: position_mm along axis_deg.
Vec2 stage_shift_mm(const Stage& stage);
// Where every element sits once the stages that carry it have moved it (at_mm plus the shift
// of each stage that names it).
std::vector<Vec2> placed_positions_mm(const Layout& layout);

}  // namespace rv
