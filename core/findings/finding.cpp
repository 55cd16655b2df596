#include "findings/finding.hpp"

#include "units/number_text.hpp"

namespace rv {

namespace {

// Every number through the shared rule (units/number_text.hpp): no residue, no -0, no NaN.
std::string printf_text(const char* format, double v) { return format_number(format, v); }
std::string mm2(double v) { return printf_text("%.2f", v); }
std::string point_text(const Vec2& p) { return "(" + mm2(p.x()) + ", " + mm2(p.y()) + ") mm"; }
std::string shortest(double v) { return printf_text("%.6g", v); }
// A damage threshold that is a typical published figure, not the file's (analysis/report_output).
std::string typical_note(const Finding& f) {
    return f.typical_threshold ? " (a typical published figure for " + f.material + "; give the maker's in the file)" : "";
}

}  // namespace

const char* finding_code(Finding::Kind k) {
    using K = Finding::Kind;
    switch (k) {
        case K::MissedOptic: return "missed-optic";
        case K::LeftTable: return "left-table";
        case K::TotalInternalReflection: return "total-internal-reflection";
        case K::HitBackOfOptic: return "back-of-optic";
        case K::LeftThroughEdge: return "left-through-edge";
        case K::NoTarget: return "no-target";
        case K::TooManyHits: return "too-many-hits";
        case K::MaterialOutOfRange: return "material-range";
        case K::NoRealIndex: return "no-real-index";
        case K::Clipping: return "clipping";
        case K::Paraxial: return "paraxial";
        case K::Unterminated: return "unterminated";
        case K::StrayBeam: return "stray-beam";
        case K::DamageIntensity:
        case K::DamageFluence: return "damage";  // one code since the first release; the numbers tell which
        case K::ThinLensTiming: return "thin-lens-timing";
        case K::CoincidentOptics: return "coincident-optics";
        case K::BIntegral: return "b-integral";
        case K::BIntegralBreakUp: return "b-integral-break-up";
        case K::NotFinite: return "not-finite";
    }
    return "finding";
}

Finding::Severity finding_severity(Finding::Kind k) {
    using K = Finding::Kind;
    switch (k) {
        case K::MaterialOutOfRange:
        case K::Paraxial:
        case K::ThinLensTiming:
        case K::BIntegral: return Finding::Severity::Warning;
        case K::CoincidentOptics: return Finding::Severity::Problem;
        default: return Finding::Severity::Problem;
    }
}

const char* severity_name(Finding::Severity s) { return s == Finding::Severity::Warning ? "warning" : "problem"; }

std::vector<Finding::Kind> all_finding_kinds() {
    std::vector<Finding::Kind> kinds;
    for (int k = 0; k <= static_cast<int>(Finding::Kind::NotFinite); ++k) kinds.push_back(static_cast<Finding::Kind>(k));
    return kinds;
}

std::string finding_text(const Finding& f) {
    using K = Finding::Kind;
    const std::string& e = f.element;
    switch (f.kind) {
        case K::MissedOptic:
            if (!f.crossing_mm) return "never reaches " + e + ", which the previous mirror aims at";
            return "misses " + e + " by " + mm2(f.amount) + " mm (crosses its plane " + mm2(*f.crossing_mm) +
                   " mm from its centre)";
        case K::LeftTable: return "leaves the table at " + point_text(f.where_mm);
        case K::TotalInternalReflection: return "total internal reflection in " + e;
        case K::HitBackOfOptic: return "meets the back of " + f.element_type + " " + e;
        case K::LeftThroughEdge: return "leaves " + e + " through its edge";
        case K::NoTarget: return "never reaches the target " + e;
        case K::TooManyHits: return "stopped after " + printf_text("%.0f", f.amount) + " hits";
        case K::MaterialOutOfRange:
            return shortest(f.wavelength_nm) + " nm lies outside the range of " + f.material + " (" +
                   shortest(f.range_min_nm) + "–" + shortest(f.range_max_nm) + " nm); its index is extrapolated";
        case K::NoRealIndex:
            return "the index of " + f.material + " is not a real number at " + mm2(f.wavelength_nm) +
                   " nm (its formula fails there); the ray stops at " + e;
        case K::Clipping:
            return "clipped at " + e + ": " + printf_text("%.3g", 100 * f.amount) + " % of the power falls outside its aperture";
        case K::Paraxial:
            return "the waist (" + mm2(f.amount) + " µm) is below two wavelengths; the paraxial Gaussian model is unreliable there";
        case K::Unterminated:
            return "light after the target leaves the table at " + point_text(f.where_mm) + "; put a beam dump in its path";
        case K::StrayBeam:
            return printf_text("%.1f", 100 * f.amount) + " % reflected by " + e + " leaves the table at " +
                   point_text(f.where_mm) + "; put a beam dump in its path";
        case K::DamageIntensity:
            return "peak intensity " + printf_text("%.3g", f.amount * 1e-9) + " GW/cm² in " + e +
                   " exceeds its damage threshold " + printf_text("%.3g", f.limit * 1e-9) + " GW/cm²" + typical_note(f);
        case K::DamageFluence:
            return "peak fluence " + printf_text("%.3g", f.amount) + " J/cm² in " + e + " exceeds its damage threshold " +
                   printf_text("%.3g", f.limit) + " J/cm²" + typical_note(f);
        case K::ThinLensTiming:
            return "a thin lens adds no glass to the delay; give its radii and centre thickness to count it";
        case K::CoincidentOptics:
            return "lies " + printf_text("%.3f", f.amount) + " mm from " + f.other_element +
                   ": two optics in one place, the trace meets only one of them; move one";
        case K::BIntegral:
            return "B-integral " + printf_text("%.2g", f.amount) + " rad in " + e + " (" + f.material +
                   ") reaches " + printf_text("%.2g", f.limit) +
                   " rad: self-phase modulation broadens the spectrum; lower the intensity or the length";
        case K::BIntegralBreakUp:
            return "B-integral " + printf_text("%.2g", f.amount) + " rad in " + e + " (" + f.material +
                   ") exceeds π: self-focusing can break up the beam and damage " + e + "; lower the intensity";
        case K::NotFinite:
            return "the Gaussian beam is no longer a finite number at " + e +
                   " (its size or curvature overflows there): no figure of the beam is given from there on; check " + e +
                   "'s numbers";
    }
    return finding_code(f.kind);
}

std::vector<std::pair<const char*, double>> finding_numbers(const Finding& f) {
    using K = Finding::Kind;
    switch (f.kind) {
        case K::MissedOptic:
            if (f.crossing_mm) return {{"beyond_aperture_mm", f.amount}, {"crossing_mm", *f.crossing_mm}};
            return {};
        case K::LeftTable:
        case K::Unterminated: return {{"x_mm", f.where_mm.x()}, {"y_mm", f.where_mm.y()}};
        case K::TooManyHits: return {{"hits", f.amount}};
        case K::MaterialOutOfRange:
            return {{"wavelength_nm", f.wavelength_nm}, {"range_min_nm", f.range_min_nm}, {"range_max_nm", f.range_max_nm}};
        case K::NoRealIndex: return {{"wavelength_nm", f.wavelength_nm}};
        case K::Clipping: return {{"lost_fraction", f.amount}};
        case K::Paraxial: return {{"waist_um", f.amount}, {"two_wavelengths_um", f.limit}};
        case K::StrayBeam: return {{"fraction", f.amount}, {"x_mm", f.where_mm.x()}, {"y_mm", f.where_mm.y()}};
        case K::DamageIntensity: return {{"peak_intensity_w_cm2", f.amount}, {"threshold_w_cm2", f.limit}};
        case K::DamageFluence: return {{"peak_fluence_j_cm2", f.amount}, {"threshold_j_cm2", f.limit}};
        case K::CoincidentOptics: return {{"distance_mm", f.amount}};
        case K::BIntegral:
        case K::BIntegralBreakUp: return {{"b_integral_rad", f.amount}, {"level_rad", f.limit}};
        default: return {};
    }
}

std::string finding_line(const Finding& f) {
    const std::string& who = f.beam.empty() ? f.element : f.beam;
    return (who.empty() ? "" : who + ": ") + finding_text(f);
}

}  // namespace rv

