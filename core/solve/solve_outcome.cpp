#include "solve/solve_outcome.hpp"

#include <algorithm>
#include <cmath>

namespace rv {

std::vector<BeamOutcome> beam_outcomes(const Layout& layout, const RendezvousReport& r) {
    std::vector<BeamOutcome> out;
    for (const ReportBeam& b : r.beams) {
        if (!b.at_target.reached) continue;
        BeamOutcome o;
        o.beam = b.id;
        o.waist_offset_mm = (b.at_target.tangential.waist_offset_mm + b.at_target.sagittal.waist_offset_mm) / 2;
        o.offset_rayleigh = o.waist_offset_mm / std::min(b.at_target.tangential.rayleigh_mm, b.at_target.sagittal.rayleigh_mm);
        o.waist_um = (b.at_target.tangential.waist_um + b.at_target.sagittal.waist_um) / 2;
        for (const auto& [id, goal] : layout.goals.waist_um)
            if (id == b.id) o.goal_um = goal;
        out.push_back(o);
    }
    return out;
}

std::vector<std::string> moves_at_range_end(const SolveGoals& goals, const TelescopeSolution& s) {
    std::vector<std::string> out;
    for (const auto& [id, move] : s.moves_mm)
        for (const auto& [gid, range] : goals.move)
            if (gid == id && (std::abs(move - range.first) < 0.01 || std::abs(move - range.second) < 0.01))
                out.push_back(id);
    return out;
}

}  // namespace rv
