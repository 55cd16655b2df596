// The report's JSON is the model's numbers: every bundled layout's report converted to JSON,
// written out as text and read back, holds the model's values under the keys
// docs/schemas/report.schema.json names (no expected value here is typed in: each is the
// model's own). The text and Markdown formatters print each verdict line, finding and caution.
#include <catch2/catch.hpp>
#include <nlohmann/json.hpp>

#include "analysis/report.hpp"
#include "findings/finding.hpp"
#include "report/report_json.hpp"
#include "report/verdict_words.hpp"
#include "report/report_markdown.hpp"
#include "report/report_words.hpp"
#include "report/report_text.hpp"
#include "report/safety_cautions.hpp"
#include "support/layouts.hpp"

namespace {

using nlohmann::json;

const char* const kBundled[] = {"sfg-bbo.json", "pump-probe.json", "shg-single.json",
                                "two-beam-microscope.json"};

// A JSON number read back equals the model's double exactly (nlohmann writes the shortest text
// that reads back to the same double).
void check_planes(const json& j, double tangential, double sagittal) {
    CHECK(j.at("tangential").get<double>() == tangential);
    CHECK(j.at("sagittal").get<double>() == sagittal);
}

void check_optional(const json& j, const std::optional<double>& v) {
    if (v)
        CHECK(j.get<double>() == *v);
    else
        CHECK(j.is_null());
}

void check_line(const json& j, const rv::VerdictLine& l) {
    CHECK(j.at("applies").get<bool>() == l.applies);
    if (l.applies)
        CHECK(j.at("met").get<bool>() == l.met);
    else
        CHECK(j.at("met").is_null());
    CHECK(j.at("summary").get<std::string>() == rv::verdict_reading_text(l.reading));
    const std::string action = rv::verdict_actions_text(l);
    if (action.empty())
        CHECK(j.at("action").is_null());
    else
        CHECK(j.at("action").get<std::string>() == action);
    // The same as data: a code for the reading, one entry with a code per action.
    CHECK(j.at("reading").at("code").is_string());
    REQUIRE(j.at("actions").size() == l.actions.size());
    for (const json& a : j.at("actions")) CHECK(a.at("code").is_string());
}

void check_beam(const json& j, const rv::ReportBeam& b, const rv::Layout& layout) {
    CHECK(j.at("wavelength_nm").get<double>() == b.wavelength_nm);
    CHECK(j.at("reaches_target").get<bool>() == b.at_target.reached);
    const json& elements = j.at("elements");
    REQUIRE(elements.size() == b.path.hits.size());
    for (size_t i = 0; i < b.path.hits.size(); ++i) {
        // The id straight from the layout, not from the report's copy of it.
        CHECK(elements[i].at("id").get<std::string>() ==
              layout.elements[b.path.hits[i].element].id);
        CHECK(elements[i].at("s_mm").get<double>() == b.path.hits[i].s_mm);
        CHECK(elements[i].at("clipping").get<double>() == b.caustic.at_hits[i].clipped_fraction);
        check_planes(elements[i].at("radius_um"), b.caustic.at_hits[i].radius_tangential_um,
                     b.caustic.at_hits[i].radius_sagittal_um);
    }
    if (const std::optional<double> source_mw = layout.beams[b.path.beam].power_mw)
        CHECK(j.at("power").at("source_mw").get<double>() == *source_mw);
    else
        CHECK(j.at("power").at("source_mw").is_null());
    CHECK(j.at("power").at("losses").size() == b.power.losses.size());
    if (!b.at_target.reached) {
        CHECK_FALSE(j.contains("target"));
        return;
    }
    const rv::BeamAtTarget& t = b.at_target;
    CHECK(j.at("path_mm").get<double>() == t.path_mm);
    CHECK(j.at("arrival_fs").get<double>() == t.arrival_fs);
    const json& at = j.at("target");
    check_planes(at.at("radius_um"), t.tangential.radius_um, t.sagittal.radius_um);
    check_planes(at.at("waist_um"), t.tangential.waist_um, t.sagittal.waist_um);
    check_planes(at.at("waist_offset_mm"), t.tangential.waist_offset_mm,
                 t.sagittal.waist_offset_mm);
    check_planes(at.at("rayleigh_mm"), t.tangential.rayleigh_mm, t.sagittal.rayleigh_mm);
    check_planes(at.at("confocal_mm"), b.confocal_tangential_mm, b.confocal_sagittal_mm);
    CHECK(at.at("hit_mm")[0].get<double>() == t.hit_mm.x());
    CHECK(at.at("hit_mm")[1].get<double>() == t.hit_mm.y());
    CHECK(at.at("angle_deg").get<double>() == b.crossing_angle_deg);
    CHECK(at.at("index").get<double>() == t.index);
    check_optional(at.at("power_mw"), b.target_power_mw);
    if (b.power.reached) CHECK(at.at("power_fraction").get<double>() == b.power.at_target[0]);
    if (b.pulse_at_target)
        CHECK(at.at("peak_intensity_w_cm2").get<double>() ==
              b.pulse_at_target->peak_intensity_w_cm2);
    CHECK(at.at("vertical_offset_mm").get<double>() == t.vertical_mm);
    const json& pulse = at.at("pulse");
    CHECK(pulse.at("gdd_fs2").get<double>() == t.pulse.gdd_fs2);
    CHECK(pulse.at("tod_fs3").get<double>() == t.pulse.tod_fs3);
    check_optional(pulse.at("fwhm_fs"), t.pulse.fwhm_fs);
    CHECK(pulse.at("compensation_gdd_fs2").get<double>() == -t.pulse.gdd_fs2);
}

void check_process(const json& j, const rv::PhaseMatchingReport& p) {
    // The words from the data: the beams by id, the mixing type's label.
    CHECK(j.at("process").get<std::string>() ==
          (p.beams.sum_frequency ? "SFG of " + p.beams.first_beam + " + " + p.beams.second_beam
                                 : "SHG of " + p.beams.first_beam));
    CHECK(j.at("type").get<std::string>() == rv::mixing_type_label(p.mixing));
    CHECK(j.at("output_nm").get<double>() == p.output_nm);
    CHECK(j.at("phase_matchable").get<bool>() == p.phase_matchable);
    CHECK(j.at("theta_now_deg").get<double>() == p.theta_now_deg);
    CHECK(j.at("rotation").get<std::string>() ==
          (p.rotation == rv::CrystalRotation::Turn ? "turn" : "tilt"));
    if (!p.outside_index_data) {
        CHECK(j.at("delta_k_l").get<double>() == p.delta_k_l);
        CHECK(j.at("sinc2_now").get<double>() == p.sinc2_now);
    }
    if (p.phase_matchable) {
        CHECK(j.at("theta_pm_deg").get<double>() == p.theta_pm_deg);
        CHECK(j.at("walkoff_mrad").get<double>() == p.walkoff_mrad);
        CHECK(j.at("angular_acceptance_mrad").at("internal_fwhm").get<double>() ==
              p.angular_acceptance_internal_mrad);
        CHECK(j.at("spectral_acceptance_fwhm_nm").get<double>() == p.spectral_acceptance_nm);
    } else {
        CHECK(j.at("theta_pm_deg").is_null());
    }
    if (p.phase_matchable && p.rotation_found)
        CHECK(j.at("rotate_by_deg").get<double>() == p.rotate_by_deg);
    else
        CHECK(j.at("rotate_by_deg").is_null());
    REQUIRE(j.at("gvm").size() == p.gvm.size());
    for (size_t k = 0; k < p.gvm.size(); ++k) {
        CHECK(j.at("gvm")[k].at("between").get<std::string>() == rv::gvm_pair_text(p, p.gvm[k]));
        CHECK(j.at("gvm")[k].at("fs_per_mm").get<double>() == p.gvm[k].fs_per_mm);
        check_optional(j.at("gvm")[k].at("walk_apart_mm"), p.gvm[k].walk_apart_mm);
    }
    CHECK(j.at("polarizations_suit").get<bool>() == p.polarizations_suit);
    if (p.temperature) {
        CHECK(j.at("temperature").at("now_c").get<double>() == p.temperature->now_c);
        check_optional(j.at("temperature").at("phase_matching_c"), p.temperature->phase_matching_c);
        check_optional(j.at("temperature").at("acceptance_fwhm_c"), p.temperature->acceptance_fwhm_c);
    } else {
        CHECK(j.at("temperature").is_null());
    }
}

// The report of one layout through JSON text and back: every key equals the model's value.
void check_report_json(const rv::Layout& layout) {
    const rv::RendezvousReport r = rv::build_report(layout, rv::material_library_for(layout));
    const json j = json::parse(json(r).dump(2));  // through text, as the command prints it
    CHECK(j.at("layout").get<std::string>() == r.layout_name);
    CHECK(j.at("target").get<std::string>() == r.target);
    check_line(j.at("verdict").at("space"), r.verdict.space);
    check_line(j.at("verdict").at("time"), r.verdict.time);
    check_line(j.at("verdict").at("phase"), r.verdict.phase);
    REQUIRE(j.at("beams").size() == r.beams.size());
    for (const rv::ReportBeam& b : r.beams) check_beam(j.at("beams").at(b.id), b, layout);
    CHECK(j.contains("mismatch") == r.mismatch.has_value());
    if (r.mismatch) {
        const json& m = j.at("mismatch");
        CHECK(m.at("waist_offset_mm").get<double>() == r.mismatch->waist_offset_mm);
        CHECK(m.at("waist_ratio").get<double>() == r.mismatch->waist_ratio);
        CHECK(m.at("lateral_um").get<double>() == r.mismatch->lateral_um);
        check_planes(m.at("lateral_planes_um"), r.mismatch->lateral_tangential_um, r.mismatch->lateral_sagittal_um);
        CHECK(m.at("angle_mrad").get<double>() == r.mismatch->angle_mrad);
        CHECK(m.at("delay_fs").get<double>() == r.mismatch->delay_fs);
        check_optional(m.at("confocal_ratio"), r.confocal_ratio);
    }
    CHECK(j.contains("overlap") == r.overlap.has_value());
    if (r.overlap) {
        CHECK(j.at("overlap").at("spatial").get<double>() == r.overlap->spatial);
        CHECK(j.at("overlap").at("combined").get<double>() == r.overlap->combined);
        check_optional(j.at("overlap").at("temporal"), r.overlap->temporal);
        if (r.target_is_crystal)
            CHECK(j.at("overlap").at("spatial_along_crystal").get<double>() ==
                  r.overlap->spatial_along_crystal);
        else
            CHECK(j.at("overlap").at("spatial_along_crystal").is_null());
    }
    CHECK(j.contains("stage") == r.stage.has_value());
    if (r.stage) {
        CHECK(j.at("stage").at("id").get<std::string>() == r.stage->id);
        CHECK(j.at("stage").at("zero_delay_mm").get<double>() == r.stage->zero_delay_mm);
        CHECK(j.at("stage").at("delay_per_mm_fs").get<double>() == r.stage->delay_per_mm_fs);
        CHECK(j.at("stage").at("zero_in_travel").get<bool>() == r.stage->zero_in_travel);
        check_optional(j.at("stage").at("emission_offset_fs"), r.stage->emission_offset_fs);
    }
    CHECK(j.contains("phase_matching") == !r.phase_matching.empty());
    if (!r.phase_matching.empty()) {
        check_process(j.at("phase_matching"), r.phase_matching.front());
        REQUIRE(j.at("phase_matching").at("processes").size() == r.phase_matching.size());
        for (size_t k = 0; k < r.phase_matching.size(); ++k)
            check_process(j.at("phase_matching").at("processes")[k], r.phase_matching[k]);
    }
    REQUIRE(j.at("polarization").size() == r.polarization.size());
    for (size_t k = 0; k < r.polarization.size(); ++k) {
        CHECK(j.at("polarization")[k].at("beam").get<std::string>() == r.polarization[k].beam);
        CHECK(j.at("polarization")[k].at("useful_fraction").get<double>() ==
              r.polarization[k].useful_fraction);
        check_optional(j.at("polarization")[k].at("plate_best_deg"),
                       r.polarization[k].plate_best_deg);
    }
    REQUIRE(j.at("focusing").size() == r.focusing.size());
    for (size_t k = 0; k < r.focusing.size(); ++k) {
        CHECK(j.at("focusing")[k].at("xi").get<double>() == r.focusing[k].xi);
        CHECK(j.at("focusing")[k].at("h_m").get<double>() == r.focusing[k].h_m);
    }
    REQUIRE(j.at("warnings").size() == r.findings.size());
    for (size_t k = 0; k < r.findings.size(); ++k)
        CHECK(j.at("warnings")[k].at("code").get<std::string>() ==
              rv::finding_code(r.findings[k].kind));
    REQUIRE(j.at("safety").at("invisible").size() == r.invisible.size());
    for (size_t k = 0; k < r.invisible.size(); ++k)
        CHECK(j.at("safety").at("invisible")[k] == rv::invisible_light_text(r.invisible[k]));
    CHECK(j.at("safety").at("cautions").get<std::vector<std::string>>() == rv::safety_cautions());
    CHECK(j.at("safety").at("unconverted").size() == r.beams.size());
}

// Fixtures whose reports take other branches (findings, a material used outside its formula's
// range, a wave plate before the crystal), so the nulls are checked too.
const char* const kFixtures[] = {"findings/clipped-unterminated.json", "findings/missed-aim.json",
                                 "findings/stray-cube.json", "warn/zhang-at-532.json",
                                 "solve/plate-before-crystal.json", "temperature/lbo-oven-1064.json"};

}  // namespace

TEST_CASE("the report's JSON read back holds the model's numbers", "[report][json]") {
    for (const char* file : kBundled) {
        CAPTURE(file);
        check_report_json(rv::test::bundled_layout(file));
    }
    for (const char* file : kFixtures) {
        CAPTURE(file);
        const rv::LayoutReadResult read =
            rv::read_layout_file(std::string(RV_SOURCE_DIR) + "/tests/layouts/" + file);
        REQUIRE(read.layout.has_value());
        check_report_json(*read.layout);
    }
}

TEST_CASE("the text and Markdown reports print every verdict line finding and caution",
          "[report][text]") {
    for (const char* file : kBundled) {
        CAPTURE(file);
        const rv::Layout layout = rv::test::bundled_layout(file);
        const rv::RendezvousReport r = rv::build_report(layout, rv::material_library_for(layout));
        const std::string text = rv::report_text(r), markdown = rv::report_markdown(r);
        for (const rv::VerdictLine* l : {&r.verdict.space, &r.verdict.time, &r.verdict.phase}) {
            const std::string summary = rv::verdict_reading_text(l->reading);
            CHECK(text.find(summary) != std::string::npos);
            CHECK(markdown.find(summary) != std::string::npos);
            CHECK(text.find(rv::verdict_actions_text(*l)) != std::string::npos);
        }
        for (const rv::Finding& f : r.findings) {
            CHECK(text.find(rv::finding_line(f)) != std::string::npos);
            CHECK(markdown.find(rv::finding_line(f)) != std::string::npos);
        }
        for (const std::string& c : rv::safety_cautions()) {
            CHECK(text.find(c) != std::string::npos);
            CHECK(markdown.find(c) != std::string::npos);
        }
        for (const rv::ReportBeam& b : r.beams) CHECK(text.find(b.id) != std::string::npos);
        // The text's verdict block is the shared verdict_text, with the actions.
        CHECK(text.find("Verdict\n" + rv::verdict_text(r.verdict, true)) != std::string::npos);
    }
}

TEST_CASE("the verdict's actions in the JSON carry the numbers to apply", "[report][json][verdict]") {
    // A script reads `verdict.time.actions[0]` of the demo and finds the stage and where to set
    // it: the report's own stage figures (one evaluation), no sentence to parse.
    const rv::Layout layout = rv::test::bundled_layout("sfg-bbo.json");
    const rv::RendezvousReport r = rv::build_report(layout, rv::material_library_for(layout));
    REQUIRE(r.stage);
    const json j = json::parse(json(r).dump());
    const json& time = j.at("verdict").at("time");
    CHECK(time.at("reading").at("code") == "delay");
    CHECK(time.at("reading").at("delay_fs").get<double>() == r.mismatch->delay_fs);
    REQUIRE(time.at("actions").size() == 1);
    const json& move = time.at("actions")[0];
    CHECK(move.at("code") == "move_stage");
    CHECK(move.at("stage") == r.stage->id);
    CHECK(move.at("to_mm").get<double>() == r.stage->zero_delay_mm);
    CHECK(move.at("move_mm").get<double>() == r.stage->move_mm);
    const json& phase = j.at("verdict").at("phase");
    CHECK(phase.at("reading").at("code") == "phase_angles");
    CHECK(phase.at("reading").at("process").at("beams") == json::array({"pump", "signal"}));
}
