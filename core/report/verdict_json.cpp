#include "report/verdict_json.hpp"

#include "layout/visit.hpp"

namespace rv {

using nlohmann::json;

namespace {

json process_json(const ProcessBeams& p) {
    json j = {{"kind", p.sum_frequency ? "sfg" : "shg"}, {"beams", json::array({p.first_beam})}};
    if (p.sum_frequency) j["beams"].push_back(p.second_beam);
    return j;
}

const char* rotation_code(CrystalRotation r) { return r == CrystalRotation::Turn ? "turn" : "tilt"; }

const char* wave_code(bool o) { return o ? "o" : "e"; }

}  // namespace

json verdict_reading_json(const VerdictReading& reading) {
    namespace vr = verdict_reading;
    return std::visit(
        overloaded{
            [](const vr::TwoBeams& s) -> json {
                return {{"code", "two_beams"},
                        {"waist_offset_mm", s.waist_offset_mm},
                        {"offset_rayleigh", s.offset_rayleigh},
                        {"waist_ratio", s.waist_ratio},
                        {"lateral_um", s.lateral_um}};
            },
            [](const vr::OneBeamFocus& s) -> json {
                return {{"code", "one_beam_focus"},
                        {"waist_offset_mm", s.waist_offset_mm},
                        {"offset_rayleigh", s.offset_rayleigh}};
            },
            [](const vr::BeamMissesTarget&) -> json { return {{"code", "beam_misses_target"}}; },
            [](const vr::Delay& s) -> json {
                return {{"code", "delay"}, {"delay_fs", s.delay_fs}, {"xcorr_fs", s.xcorr_fs}};
            },
            [](const vr::PulsesNotGiven&) -> json { return {{"code", "pulses_not_given"}}; },
            [](const vr::OneBeamNoDelay&) -> json { return {{"code", "one_beam"}}; },
            [](const vr::ProcessBeamsMissing& s) -> json {
                json j = {{"code", "process_beams_missing"}, {"process", process_json(s.process)}};
                if (s.process.sum_frequency) j["process"]["beams"] = json::array();
                return j;
            },
            [](const vr::OutsideIndexData& s) -> json {
                return {{"code", "outside_index_data"}, {"process", process_json(s.process)}};
            },
            [](const vr::NotPhaseMatchable& s) -> json {
                return {{"code", "not_phase_matchable"},
                        {"process", process_json(s.process)},
                        {"type", mixing_type_label(s.mixing)}};
            },
            [](const vr::PhaseAngles& s) -> json {
                return {{"code", "phase_angles"},
                        {"process", process_json(s.process)},
                        {"type", mixing_type_label(s.mixing)},
                        {"theta_pm_deg", s.theta_pm_deg},
                        {"theta_now_deg", s.theta_now_deg},
                        {"sinc2", s.sinc2}};
            },
            [](const vr::IsotropicOrMissed&) -> json { return {{"code", "isotropic_or_missed"}}; },
            [](const vr::TargetNotCrystal&) -> json { return {{"code", "target_not_crystal"}}; },
        },
        reading);
}

json verdict_action_json(const VerdictAction& action) {
    namespace va = verdict_action;
    return std::visit(
        overloaded{
            [](const va::BringWaistsTogether& a) -> json {
                return {{"code", "bring_waists_together"},
                        {"beam", a.beam},
                        {"reference", a.reference},
                        {"offset_mm", a.offset_mm}};
            },
            [](const va::MatchWaistSizes& a) -> json {
                return {{"code", "match_waist_sizes"}, {"waist_ratio", a.waist_ratio}};
            },
            [](const va::OverlapChiefRays& a) -> json {
                return {{"code", "overlap_chief_rays"}, {"lateral_um", a.lateral_um}};
            },
            [](const va::MeetWaistGoal& a) -> json {
                return {{"code", "meet_waist_goal"},
                        {"beam", a.beam},
                        {"waist_um", a.waist_um},
                        {"goal_um", a.goal_um}};
            },
            [](const va::MoveFocus& a) -> json {
                return {{"code", "move_focus"}, {"waist_offset_mm", a.waist_offset_mm}};
            },
            [](const va::FixTraceFindings&) -> json { return {{"code", "fix_trace_findings"}}; },
            [](const va::MoveStage& a) -> json {
                return {{"code", "move_stage"}, {"stage", a.stage}, {"move_mm", a.move_mm}, {"to_mm", a.to_mm}};
            },
            [](const va::StageOutOfTravel& a) -> json {
                return {{"code", "stage_out_of_travel"},
                        {"stage", a.stage},
                        {"zero_delay_mm", a.zero_delay_mm}};
            },
            [](const va::AddAirPath& a) -> json {
                return {{"code", "add_air_path"}, {"beam", a.beam}, {"path_mm", a.path_mm}};
            },
            [](const va::BringBeamsToCrystal&) -> json { return {{"code", "bring_beams_to_crystal"}}; },
            [](const va::ChooseTransparentCrystal&) -> json {
                return {{"code", "choose_transparent_crystal"}};
            },
            [](const va::ChooseAnotherCrystalOrType&) -> json {
                return {{"code", "choose_another_crystal_or_type"}};
            },
            [](const va::RotateCrystal& a) -> json {
                return {{"code", "rotate_crystal"},
                        {"rotation", rotation_code(a.rotation)},
                        {"by_deg", a.by_deg},
                        {"process", a.process_key}};
            },
            [](const va::SetCrystalTemperature& a) -> json {
                return {{"code", "set_crystal_temperature"},
                        {"crystal", a.crystal},
                        {"to_c", a.to_c},
                        {"process", a.process_key}};
            },
            [](const va::CutNearer& a) -> json {
                return {{"code", "cut_nearer"},
                        {"rotation", rotation_code(a.rotation)},
                        {"theta_pm_deg", a.theta_pm_deg}};
            },
            [](const va::SetPolarizations& a) -> json {
                json waves = {{a.first_beam, a.equal_components ? "o+e" : wave_code(a.first_o)}};
                if (!a.second_beam.empty()) waves[a.second_beam] = wave_code(a.second_o);
                return {{"code", "set_polarizations"},
                        {"waves", waves},
                        {"o_polarized", a.o_vertical ? "vertical" : "horizontal"}};
            },
        },
        action);
}

}  // namespace rv
