// The report's findings, in the order every front end lists them: coincident optics, then for
// each beam its trace's and propagation's findings and the report's own (a waist too small for
// the paraxial model, light leaving the table after the target, stray reflections leaving the
// table, damage), then thin glass lenses missing from the timing. Decided on kinds and numbers.
#include <algorithm>

#include "analysis/coincident_optics.hpp"
#include "analysis/report_sections.hpp"
#include "units/constants.hpp"

namespace rv::report_sections {

namespace {

// The paraxial Gaussian model needs a waist of at least two wavelengths (common practice).
constexpr double kParaxialWaistWavelengths = 2;
// A stray reflection leaving the table is a finding from 0.1 % of the beam's power.
constexpr double kStrayFraction = 1e-3;

void add_beam_findings(const Layout& layout, const ReportBeam& b, const TargetElement& target,
                       std::vector<Finding>& out) {
    auto add = [&](Finding f) {
        f.beam = b.id;
        out.push_back(std::move(f));
    };
    // Light that leaves the table after the target is said once, as `unterminated` below.
    const bool leaves_after_target =
        b.end_after_target && b.end_after_target->kind == Finding::Kind::LeftTable;
    for (const Finding& f : b.path.findings)
        if (!(leaves_after_target && f.kind == Finding::Kind::LeftTable)) add(f);
    for (const Finding& f : b.caustic.findings) add(f);
    const double w0_um = std::min(b.at_target.tangential.waist_um, b.at_target.sagittal.waist_um);
    const double limit_um = kParaxialWaistWavelengths * nm_to_um(b.wavelength_nm);
    if (b.at_target.reached && w0_um < limit_um) {
        Finding f{Finding::Kind::Paraxial, layout.target};
        f.amount = w0_um;
        f.limit = limit_um;
        add(f);
    }
    if (leaves_after_target) {
        Finding f{Finding::Kind::Unterminated};
        f.where_mm = b.end_after_target->where_mm;
        add(f);
    }
    for (const PowerLoss& loss : b.power.losses)
        if (loss.leaves_table && loss.fraction > kStrayFraction) {
            Finding f{Finding::Kind::StrayBeam, loss.element};
            f.amount = loss.fraction;
            f.where_mm = loss.exit_mm;
            add(f);
        }
    for (Finding& f : damage_findings(layout, b, target)) add(std::move(f));
}

}  // namespace

std::vector<Finding> report_findings(const Layout& layout, const std::vector<ReportBeam>& beams,
                                     const TargetElement& target) {
    std::vector<const Path*> paths;
    for (const ReportBeam& b : beams) paths.push_back(&b.path);
    std::vector<Finding> out = coincident_optics(layout, paths);
    for (const ReportBeam& b : beams) add_beam_findings(layout, b, target, out);
    // Thin glass lenses carry no thickness, so their glass is missing from the timing (about
    // 1.5–1.8 ps per mm, docs/physics.md §7): say so where it matters, with two pulsed beams.
    if (both_reach(beams) && layout.beams[0].pulse_fwhm_fs && layout.beams[1].pulse_fwhm_fs)
        for (const Element& e : layout.elements)
            if (const auto* lens = std::get_if<Lens>(&e.kind);
                lens && std::holds_alternative<ThinChromaticLens>(lens->model))
                out.push_back({Finding::Kind::ThinLensTiming, e.id});
    return out;
}

}  // namespace rv::report_sections
