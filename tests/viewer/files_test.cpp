// The window's files, elements, goals and state (issue 17 §2, §4, §7): the folder listing and
// completion of the Open / Save As dialog on a temporary folder, the dialog driven by keys, the
// templates of File ▸ New read back and checked by `rendezvous check`, every Add choice added to
// a template and read back, the Goals panel's edits as the reader validates them, and the state
// a File ▸ Open, a status message, Quit without saving and the title leave.
#include <imgui.h>

#include <catch2/catch.hpp>
#include <array>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <memory>
#include <set>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>
#include <sstream>

#include "analysis/breadboard_holes.hpp"
#include "edit/folder_listing.hpp"
#include "edit/new_elements.hpp"
#include "edit/templates.hpp"
#include "io/layout_reader.hpp"
#include "io/layout_writer.hpp"
#include "io/lens_catalog.hpp"
#include "layout/element_kinds.hpp"
#include "materials/material_library.hpp"
#include "ui/actions.hpp"
#include "ui/add_menu.hpp"
#include "ui/editor.hpp"
#include "ui/file_dialog.hpp"
#include "ui/keys.hpp"
#include "ui/status_bar.hpp"
#include "viewer/viewer_session.hpp"

namespace fs = std::filesystem;
using rv::test::index_of;
using rv::test::Session;

namespace {

rv::Layout demo() { return *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout; }

// A fresh temporary folder, removed at the end of the test.
struct TempFolder {
    fs::path path;
    explicit TempFolder(const std::string& name) : path(fs::temp_directory_path() / name) {
        fs::remove_all(path);
        fs::create_directories(path);
    }
    ~TempFolder() {
        std::error_code ignored;
        fs::remove_all(path, ignored);
    }
    void touch(const std::string& name, const std::string& text = "{}") const { std::ofstream(path / name) << text; }
};

std::string read_text(const fs::path& p) {
    std::ifstream in(p);
    return std::string((std::istreambuf_iterator<char>(in)), std::istreambuf_iterator<char>());
}

// `rendezvous check FILE`: its exit status and what it printed.
std::pair<int, std::string> run_check(const fs::path& file) {
    const fs::path out = file.string() + ".check.txt";
    const std::string command = std::string("\"") + RV_PROGRAM + "\" check \"" + file.string() + "\" > \"" +
                                out.string() + "\" 2>&1";
    const int status = std::system(command.c_str());
    const std::string text = read_text(out);
    fs::remove(out);
    return {WIFEXITED(status) ? WEXITSTATUS(status) : -1, text};
}

std::vector<rv::CatalogLens> catalog() {
    const rv::Layout l = demo();
    return rv::read_lens_catalog(RV_SOURCE_DIR "/layouts/lenses.json", rv::material_library_for(l)).lenses;
}

void press_enter(Session& s) { s.key(ImGui::GetKeyIndex(ImGuiKey_Enter)); }

}  // namespace

TEST_CASE("the folder listing shows folders first then layouts and hides the rest", "[viewer][files]") {
    TempFolder dir("rv-listing-test");
    fs::create_directories(dir.path / "beta");
    fs::create_directories(dir.path / "Alpha");
    fs::create_directories(dir.path / ".hidden");
    dir.touch("z-last.json");
    dir.touch("a-first.JSON");
    dir.touch("notes.txt");
    dir.touch(".bench.recovery.json");  // a recovery file stays out of the listing
    const rv::edit::FolderListing l = rv::edit::list_folder(dir.path);
    CHECK(l.error.empty());
    CHECK(l.folder == dir.path.lexically_normal());
    const std::vector<rv::edit::FolderEntry> expected{
        {"Alpha", true}, {"beta", true}, {"a-first.JSON", false}, {"z-last.json", false}};
    CHECK(l.entries == expected);
    const rv::edit::FolderListing missing = rv::edit::list_folder(dir.path / "nowhere");
    CHECK(missing.entries.empty());
    CHECK(missing.error.find("cannot list " + (dir.path / "nowhere").string()) == 0);
}

TEST_CASE("Tab completion extends a typed path to what the matches share", "[viewer][files]") {
    TempFolder dir("rv-completion-test");
    dir.touch("pump-arm.json");
    dir.touch("pump-both.json");
    fs::create_directories(dir.path / "probe");
    const std::string base = dir.path.string() + "/";
    // Two files share "pump-": the text stops there and both are offered.
    const rv::edit::Completion two = rv::edit::complete_path(base + "pu", "/");
    CHECK(two.text == base + "pump-");
    CHECK(two.candidates == std::vector<std::string>{"pump-arm.json", "pump-both.json"});
    // One folder: completed with its slash; one file: completed whole.
    CHECK(rv::edit::complete_path(base + "pr", "/").text == base + "probe/");
    CHECK(rv::edit::complete_path(base + "pump-b", "/").text == base + "pump-both.json");
    CHECK(rv::edit::complete_path(base + "pump-b", "/").candidates.empty());
    // Nothing matches: unchanged. A relative path completes against the base folder.
    CHECK(rv::edit::complete_path(base + "x", "/").text == base + "x");
    CHECK(rv::edit::complete_path("pump-a", dir.path).text == "pump-arm.json");
    // The folder a typed path shows: itself, else its parent.
    CHECK(rv::edit::folder_of_typed(base + "probe", "/") == dir.path / "probe");
    CHECK(rv::edit::folder_of_typed(base + "new-name.json", "/") == dir.path);
}

TEST_CASE("the file dialog takes a typed path with Enter and Esc cancels it", "[viewer][files]") {
    TempFolder dir("rv-dialog-test");
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", dir.path / "bench.json");
    rv::edit::Document doc(demo());
    Session s(doc);
    rv::ui::show_file_dialog(s.state.file_dialog, rv::ui::FileDialogState::Mode::Open, dir.path.string());
    s.settle();
    CHECK(ImGui::GetIO().WantTextInput);  // the path field has the keyboard focus on opening
    CHECK(s.state.file_dialog.listing.entries == std::vector<rv::edit::FolderEntry>{{"bench.json", false}});
    CHECK(std::string(s.state.file_dialog.path) == dir.path.string() + "/");
    // Delete while the dialog is up is typing, not the shortcut that deletes the selection.
    s.state.editor.selected = 0;
    const size_t n = doc.layout().elements.size();
    s.type("bench.json");
    s.key(rv::ui::keys::kDelete);
    CHECK(doc.layout().elements.size() == n);
    press_enter(s);
    REQUIRE(s.state.open_request.has_value());
    CHECK(*s.state.open_request == (dir.path / "bench.json").string());
    CHECK_FALSE(s.state.file_dialog.visible);
    // Again, and Esc: closed, nothing requested.
    s.state.open_request.reset();
    rv::ui::show_file_dialog(s.state.file_dialog, rv::ui::FileDialogState::Mode::Open, dir.path.string());
    s.settle();
    s.type("bench.json");
    s.key(ImGui::GetKeyIndex(ImGuiKey_Escape));
    CHECK_FALSE(s.state.file_dialog.visible);
    CHECK_FALSE(s.state.open_request.has_value());
    s.frame();
    CHECK_FALSE(ImGui::IsPopupOpen("###file-dialog", ImGuiPopupFlags_AnyPopupId));
}

TEST_CASE("Tab in the dialog's path field completes the file name", "[viewer][files]") {
    TempFolder dir("rv-dialog-tab-test");
    dir.touch("signal-arm.json");
    rv::edit::Document doc(demo());
    Session s(doc);
    rv::ui::show_file_dialog(s.state.file_dialog, rv::ui::FileDialogState::Mode::Open, dir.path.string());
    s.settle();
    s.type("sig");
    s.key(ImGui::GetKeyIndex(ImGuiKey_Tab));
    CHECK(std::string(s.state.file_dialog.path) == dir.path.string() + "/signal-arm.json");
}

TEST_CASE("a failed open keeps the document and shows every diagnostic in the dialog", "[viewer][files]") {
    TempFolder dir("rv-failed-open-test");
    // Two errors in one file: a negative waist and an unknown element type.
    std::string text = read_text(RV_SOURCE_DIR "/layouts/sfg-bbo.json");
    text.replace(text.find("\"waist_um\": 1000"), 16, "\"waist_um\": -1000");
    text.replace(text.find("\"type\": \"dump\""), 14, "\"type\": \"dumpp\"");
    dir.touch("broken.json", text);
    const fs::path broken = dir.path / "broken.json";
    auto doc = std::make_unique<rv::edit::Document>(demo());
    rv::edit::Document* before = doc.get();
    Session s(*doc);
    s.state.editor.selected = index_of(doc->layout(), "L2_S");
    s.state.file_dialog.pending_open = broken.string();  // as the dialog leaves it on Enter
    CHECK_FALSE(rv::ui::open_layout(s.state, doc, broken.string()));
    CHECK(doc.get() == before);                 // the same document, unchanged
    CHECK(doc->layout() == demo());
    CHECK_FALSE(doc->dirty());
    CHECK(s.state.editor.selected == index_of(doc->layout(), "L2_S"));  // no panel reset either
    // The whole reason: every diagnostic of the file, each located, in the dialog, which is up
    // again with the path as typed.
    const rv::LayoutReadResult r = rv::read_layout_file(broken);
    REQUIRE(r.diagnostics.size() >= 2);
    std::string all;
    for (const rv::Diagnostic& d : r.diagnostics) all += (all.empty() ? "" : "\n") + rv::format_diagnostic(d, broken.string());
    CHECK(s.state.file_dialog.visible);
    CHECK(s.state.file_dialog.error == all);
    CHECK(all.find("/beams/0/waist_um") != std::string::npos);
    CHECK(all.find("dumpp") != std::string::npos);
    s.frame();  // drawn with the message; nothing else changed
    CHECK(doc->layout() == demo());
}

TEST_CASE("Save As from the dialog writes the file and a failure stays in the dialog", "[viewer][files]") {
    TempFolder dir("rv-save-as-test");
    rv::edit::Document doc(demo());
    Session s(doc);
    rv::ui::show_file_dialog(s.state.file_dialog, rv::ui::FileDialogState::Mode::SaveAs, dir.path.string());
    s.settle();
    s.type("saved.json");
    press_enter(s);
    s.frame();
    CHECK_FALSE(s.state.file_dialog.visible);
    REQUIRE(fs::exists(dir.path / "saved.json"));
    CHECK(*rv::read_layout_file(dir.path / "saved.json").layout == doc.layout());
    CHECK(doc.path() == dir.path / "saved.json");
    // A folder that does not exist: not saved, the dialog up again with the writer's message.
    rv::ui::show_file_dialog(s.state.file_dialog, rv::ui::FileDialogState::Mode::SaveAs, dir.path.string());
    s.settle();
    s.type("missing-folder/x.json");
    press_enter(s);
    s.frame();
    CHECK(s.state.file_dialog.visible);
    CHECK_FALSE(s.state.file_dialog.error.empty());
    CHECK_FALSE(fs::exists(dir.path / "missing-folder"));
    CHECK(doc.path() == dir.path / "saved.json");
}

TEST_CASE("every template stands on its grid's holes and passes rendezvous check", "[viewer][files]") {
    TempFolder dir("rv-templates-test");
    REQUIRE(rv::edit::layout_templates().size() == 4);
    int k = 0;
    for (const rv::edit::LayoutTemplate& t : rv::edit::layout_templates()) {
        CAPTURE(t.name);
        const rv::Layout l = rv::edit::layout_of(t);
        CHECK(l.beams.size() == (t.two_beams ? 2u : 1u));
        // Metric M6 boards: 25 mm pitch; imperial 1/4-20 boards: 1 inch = 25.4 mm (common practice).
        CHECK(l.table.grid_mm == (t.imperial ? 25.4 : 25.0));
        // Holes at (n + 1/2) × pitch: the first at 12.5 mm (metric) or 12.7 mm (imperial), by hand.
        CHECK(l.beams[0].start_mm.x() == (t.imperial ? 12.7 : 12.5));
        for (const rv::Element& e : l.elements) {
            CAPTURE(e.id);
            const std::optional<rv::HoleLocation> hole = rv::hole_of(l.table, e.at_mm);
            REQUIRE(hole.has_value());
            CHECK((hole->hole_mm - e.at_mm).norm() < 1e-9);
        }
        // Written, read back by the reader, and checked by the command: no problem.
        const fs::path file = dir.path / ("template-" + std::to_string(k++) + ".json");
        std::ofstream(file) << rv::write_layout(l);
        const rv::LayoutReadResult r = rv::read_layout_file(file);
        REQUIRE(r.layout.has_value());
        CHECK(*r.layout == l);
        const auto [status, out] = run_check(file);
        CAPTURE(out);
        CHECK(status == 0);
        CHECK(out.find(" 0 problem(s)") != std::string::npos);
        // The beams reach the target (the report's target section has every beam).
        const rv::RendezvousReport report = rv::build_report(l, rv::material_library_for(l));
        for (const rv::ReportBeam& b : report.beams)
            CHECK(std::count(b.element_ids.begin(), b.element_ids.end(), l.target) == 1);
    }
}

TEST_CASE("every Add choice goes onto a template and the layout reads back and passes check", "[viewer][files]") {
    TempFolder dir("rv-add-every-kind-test");
    const rv::edit::LayoutTemplate t = rv::edit::layout_templates()[1];  // two beams, metric
    const std::vector<rv::CatalogLens> lenses = catalog();
    std::vector<rv::Element> made;
    for (const rv::edit::NewElementChoice& c : rv::edit::new_element_choices(rv::edit::layout_of(t)))
        made.push_back(c.element);
    for (const rv::CatalogLens& c : lenses)
        if (std::holds_alternative<rv::ThickLens>(c.lens.model)) {
            made.push_back(rv::edit::new_catalog_lens(c));
            break;
        }
    // Every kind has a choice (the stage's through add_stage, below).
    std::vector<std::string> kinds{"stage"};
    for (const rv::edit::NewElementChoice& c : rv::edit::new_element_choices(rv::edit::layout_of(t)))
        kinds.push_back(c.type);
    for (const std::string& type : rv::element_type_names())
        CHECK(std::count(kinds.begin(), kinds.end(), type) >= 1);
    int k = 0;
    auto written_and_checked = [&](const rv::edit::Document& doc) {
        const fs::path file = dir.path / ("added-" + std::to_string(k++) + ".json");
        std::ofstream(file) << rv::write_layout(doc.layout());
        const rv::LayoutReadResult r = rv::read_layout_file(file);
        REQUIRE(r.layout.has_value());
        CHECK(*r.layout == doc.layout());
        const auto [status, out] = run_check(file);
        CAPTURE(out);
        CHECK(status == 0);
        return out;
    };
    for (const rv::Element& e : made) {
        CAPTURE(e.id);
        rv::edit::Document doc(rv::edit::layout_of(t));
        rv::ui::EditorState ed;
        // Off the beam line (row 9, column 4 of the board): it changes no beam's path.
        REQUIRE(rv::ui::add_new_element(doc, ed, e, {112.5, 237.5}));
        CHECK(ed.status == "added " + doc.layout().elements.back().id);
        CHECK(doc.layout().elements.back().at_mm == rv::Vec2(112.5, 237.5));
        CHECK(written_and_checked(doc).find(" 0 problem(s)") != std::string::npos);
    }
    {  // A stage carrying the lens: at 0 in its travel it moves nothing.
        rv::edit::Document doc(rv::edit::layout_of(t));
        rv::ui::EditorState ed;
        const std::vector<std::string> free = rv::edit::carriable_ids(doc.layout());
        REQUIRE(std::count(free.begin(), free.end(), "L1") == 1);
        REQUIRE(rv::ui::add_stage(doc, ed, {"L1"}));
        CHECK(std::get<rv::Stage>(doc.layout().elements.back().kind).carries == std::vector<std::string>{"L1"});
        CHECK(written_and_checked(doc).find(" 0 problem(s)") != std::string::npos);
        const std::vector<std::string> after = rv::edit::carriable_ids(doc.layout());
        CHECK(std::count(after.begin(), after.end(), "L1") == 0);  // carried now
        CHECK_FALSE(rv::ui::add_stage(doc, ed, {}));
    }
    {  // A second beam on the one-beam template, of a colour it has not got (1030 nm is taken: 800).
        rv::edit::Document doc(rv::edit::layout_of(rv::edit::layout_templates()[0]));
        rv::ui::EditorState ed;
        REQUIRE(rv::ui::add_beam(doc, ed, {112.5, 237.5}));
        REQUIRE(doc.layout().beams.size() == 2);
        CHECK(doc.layout().beams.back().id == "beam_2");
        CHECK(doc.layout().beams.back().wavelength_nm == 800);
        CHECK(doc.layout().beams.back().start_mm == rv::Vec2(112.5, 237.5));
        written_and_checked(doc);  // its findings (where it goes) are its own; the file reads and checks
        // A third: the reader's rule (one or two beams) refuses it, with its message.
        CHECK_FALSE(rv::ui::add_beam(doc, ed, {112.5, 237.5}));
        CHECK(ed.status == "cannot add beam_3: /beams: expected one or two beams, found 3");
        CHECK(doc.layout().beams.size() == 2);
    }
}

TEST_CASE("numbered ids skip the ones taken", "[viewer][files]") {
    rv::Layout l = rv::edit::layout_of(rv::edit::layout_templates()[0]);  // has L1
    CHECK(rv::edit::numbered_id(l, "L") == "L2");
    CHECK(rv::edit::numbered_id(l, "M") == "M1");
    CHECK(rv::edit::suffixed_id(l, "L1") == "L1_2");
}

TEST_CASE("the Goals panel edits the verdict thresholds and shows the reader's refusal", "[viewer][goals]") {
    rv::edit::Document doc(demo());
    Session s(doc, ImVec2(1600, 2400));  // tall enough for the whole report column
    s.click_field_of(s.state.goals.field_rects, "goals");
    s.frame();
    s.click_field_of(s.state.goals.field_rects, "verdict");
    s.frame();
    auto type_into = [&](const char* key, const std::string& text) {
        s.click_field_of(s.state.goals.field_rects, key);
        s.key(ImGui::GetKeyIndex(ImGuiKey_A), true);
        s.type(text);
        press_enter(s);
    };
    type_into("max_waist_ratio", "1.5");
    CHECK(doc.layout().goals.verdict.max_waist_ratio == 1.5);
    CHECK(s.state.goals.error.empty());
    s.key(rv::ui::keys::kZ, true);
    CHECK(doc.layout().goals.verdict.max_waist_ratio == 1.2);
    // A value the reader refuses: not applied, and the panel shows the reader's message for the
    // same layout, located by its pointer.
    type_into("max_waist_ratio", "0.5");
    CHECK(doc.layout().goals.verdict.max_waist_ratio == 1.2);
    rv::Layout refused = doc.layout();
    refused.goals.verdict.max_waist_ratio = 0.5;
    std::string why;
    REQUIRE_FALSE(rv::edit::Document::acceptable(refused, why));
    CHECK(s.state.goals.error == why);
    CHECK(why.find("/goals/verdict/max_waist_ratio") == 0);
}

TEST_CASE("the Goals panel edits waist goals tolerances and the solver's moves and swaps", "[viewer][goals]") {
    rv::edit::Document doc(demo());
    Session s(doc, ImVec2(1600, 2400));
    auto& rects = s.state.goals.field_rects;
    s.click_field_of(rects, "goals");
    s.frame();
    auto type_into = [&](const std::string& key, const std::string& text) {
        s.click_field_of(rects, key);
        s.key(ImGui::GetKeyIndex(ImGuiKey_A), true);
        s.type(text);
        press_enter(s);
    };
    type_into("waist pump", "30");
    REQUIRE(doc.layout().goals.waist_um.size() == 2);
    CHECK(doc.layout().goals.waist_um[0] == std::make_pair(std::string("pump"), 30.0));
    type_into("waist signal", "0");  // 0 removes the goal
    CHECK(doc.layout().goals.waist_um.size() == 1);
    s.click_field_of(rects, "tolerance");
    s.frame();
    type_into("position_mm", "0.25");
    CHECK(doc.layout().goals.tolerance.position_mm == 0.25);
    s.click_field_of(rects, "solve");
    s.frame();
    REQUIRE(doc.layout().goals.solve.has_value());
    type_into("move L2_P min", "-10");
    CHECK(doc.layout().goals.solve->move[0] == std::make_pair(std::string("L2_P"), std::make_pair(-10.0, 25.0)));
    s.click_field_of(rects, "swap L2_S");  // unticked: L2_S is no longer swapped
    s.frame();
    CHECK(doc.layout().goals.solve->swap == std::vector<std::string>{"L2_P"});
    // A move of an element that is no optic of the layout is the reader's to refuse; a move
    // range the wrong way round likewise.
    type_into("move L2_P max", "-20");
    CHECK(doc.layout().goals.solve->move[0].second.second == 25.0);
    CHECK(s.state.goals.error.find("/goals/solve/move/L2_P") == 0);
    s.click_field_of(rects, "move L2_S remove");
    s.frame();
    CAPTURE(s.state.goals.error);
    CHECK(doc.layout().goals.solve->move.size() == 1);
    const size_t undo_steps = 5;  // waist ×2, tolerance, move, swap, remove: all undoable
    for (size_t i = 0; i <= undo_steps; ++i) s.key(rv::ui::keys::kZ, true);
    CHECK(doc.layout().goals == demo().goals);
}

TEST_CASE("File > Open resets every panel and keeps the catalog the recent files and snapping", "[viewer][state]") {
    TempFolder dir("rv-open-reset-test");
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", dir.path / "bench.json");
    auto doc = std::make_unique<rv::edit::Document>(demo());
    Session s(*doc);
    rv::ui::ViewerState& st = s.state;
    st.tools.catalog = catalog();
    const size_t catalog_size = st.tools.catalog.size();
    // Every panel in use: a selection and a ruler, a moved view, the solver's message, a goals
    // error, the dialogs, a status message, snapping off, a recent file.
    st.editor.selected = index_of(doc->layout(), "L2_S");
    st.editor.ruler = rv::ui::EditorState::Ruler{{0, 0}, {10, 0}, false};
    st.editor.measuring = true;
    st.editor.snap = false;
    st.view = st.last_view;
    st.tools.message = "3 combination(s) searched";
    st.goals.error = "refused";
    st.export_dialog = st.sheet_dialog = true;
    st.editor.status = "saved somewhere";
    s.frame();
    REQUIRE_FALSE(st.status_line.text.empty());
    st.recent = {"/lab/old.json"};
    REQUIRE(rv::ui::open_layout(st, doc, (dir.path / "bench.json").string()));
    s.frame();
    CHECK(st.doc == doc.get());
    CHECK_FALSE(st.editor.selected.has_value());
    CHECK_FALSE(st.editor.ruler.has_value());
    CHECK_FALSE(st.editor.measuring);
    CHECK_FALSE(st.view.has_value());
    CHECK(st.tools.message.empty());
    CHECK(st.goals.error.empty());
    CHECK_FALSE(st.export_dialog);
    CHECK_FALSE(st.sheet_dialog);
    CHECK_FALSE(st.file_dialog.visible);
    CHECK(st.status_line.text == "opened " + (dir.path / "bench.json").string());
    // The sweep field names the new layout's stage.
    CHECK(std::string(st.tools.sweep_field) == "S1.position_mm");
    // Kept: the catalog, snapping off, the recent files with the new one first.
    CHECK(st.tools.catalog.size() == catalog_size);
    CHECK_FALSE(st.editor.snap);
    CHECK(st.recent == std::vector<std::string>{(dir.path / "bench.json").string(), "/lab/old.json"});
}

TEST_CASE("the status line clears after the next change or its time", "[viewer][state]") {
    rv::edit::Document doc(demo());
    Session s(doc);
    s.key(rv::ui::keys::kG);  // snapping off: a message
    CHECK(s.state.status_line.text == "free placement (no snapping)");
    s.frame();
    CHECK(s.state.status_line.text == "free placement (no snapping)");  // still shown
    // The next change of the layout clears it.
    s.state.editor.selected = index_of(doc.layout(), "HWP_P");
    s.key(rv::ui::keys::kR);  // rotate: an edit without a message
    CHECK(s.state.status_line.text.empty());
    // A message left alone goes after kStatusSeconds of ImGui's clock.
    s.key(rv::ui::keys::kG);
    REQUIRE_FALSE(s.state.status_line.text.empty());
    ImGui::GetIO().DeltaTime = static_cast<float>(rv::ui::kStatusSeconds + 0.5);
    s.frame();
    ImGui::GetIO().DeltaTime = 1.0f / 60.0f;
    s.frame();
    CHECK(s.state.status_line.text.empty());
}

TEST_CASE("Quit without saving removes the recovery file and the title shows the unsaved mark", "[viewer][state]") {
    TempFolder dir("rv-quit-test");
    const fs::path file = dir.path / "bench.json";
    fs::copy_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json", file);
    rv::edit::Document doc(*rv::read_layout_file(file).layout, file);
    Session s(doc);
    CHECK(rv::ui::window_title(doc) == "Rendezvous — bench.json");
    s.state.editor.selected = index_of(doc.layout(), "HWP_P");
    s.key(rv::ui::keys::kR);  // an unsaved edit
    CHECK(rv::ui::window_title(doc) == "Rendezvous — bench.json •");
    std::string error;
    REQUIRE(doc.autosave(error));
    REQUIRE(fs::exists(doc.recovery_path()));
    s.key(rv::ui::keys::kQ, true);  // Ctrl+Q with unsaved changes asks first
    CHECK(s.state.close_requested);
    CHECK_FALSE(s.state.quit);
    CHECK(ImGui::IsPopupOpen("Unsaved changes", ImGuiPopupFlags_AnyPopupId));
    rv::ui::quit_without_saving(s.state);  // the dialog's "Quit without saving"
    CHECK(s.state.quit);
    CHECK_FALSE(fs::exists(doc.recovery_path()));
    CHECK(*rv::read_layout_file(file).layout != doc.layout());  // the file kept as it was saved
    // Saved: the mark goes.
    REQUIRE(doc.save(error));
    CHECK(rv::ui::window_title(doc) == "Rendezvous — bench.json");
}

TEST_CASE("File > New makes the template the document and refuses over unsaved changes", "[viewer][state]") {
    auto doc = std::make_unique<rv::edit::Document>(demo());
    Session s(*doc);
    REQUIRE(rv::ui::new_from_template(s.state, doc, 1));
    CHECK(doc->layout() == rv::edit::layout_of(rv::edit::layout_templates()[1]));
    CHECK_FALSE(doc->path().has_value());  // Save asks for a file
    CHECK_FALSE(doc->dirty());
    s.frame();
    // An unsaved edit: another New is refused and keeps the document.
    s.state.editor.selected = index_of(doc->layout(), "L1");
    s.key(rv::ui::keys::kR);
    REQUIRE(doc->dirty());
    rv::edit::Document* before = doc.get();
    CHECK_FALSE(rv::ui::new_from_template(s.state, doc, 0));
    CHECK(doc.get() == before);
    CHECK(s.state.editor.status == "no new layout: unsaved changes; save or undo them first");
}

TEST_CASE("Shift+A opens the Add menu at the cursor and Ctrl+O the Open dialog", "[viewer][files]") {
    rv::edit::Document doc(demo());
    Session s(doc);
    const rv::Vec2 empty_mm(450, 420);  // no optic there
    s.mouse(s.state.last_view.to_screen(empty_mm), false);
    REQUIRE(s.state.cursor_mm.has_value());
    s.key(rv::ui::keys::kA, false, true);
    REQUIRE(s.state.add_here_mm.has_value());
    CHECK((*s.state.add_here_mm - empty_mm).norm() < 1.0 / s.state.last_view.px_per_mm);
    CHECK(ImGui::IsPopupOpen("", ImGuiPopupFlags_AnyPopupId));
    s.key(ImGui::GetKeyIndex(ImGuiKey_Escape));  // closes the menu, adds nothing
    s.frame();
    CHECK_FALSE(s.state.add_here_mm.has_value());
    CHECK(doc.layout() == demo());
    s.key(rv::ui::keys::kO, true);
    CHECK(s.state.file_dialog.visible);
    CHECK(s.state.file_dialog.mode == rv::ui::FileDialogState::Mode::Open);
}

namespace {
// One line of tests/viewer/add_by_keys.txt: what it adds and the keys that add it.
struct KeyedChoice {
    std::string type, must_hold, line;
    std::vector<std::string> keys;  // Down, Up, Right, Space, repeats spelt out
};
std::vector<KeyedChoice> keyed_choices() {
    std::ifstream in(RV_SOURCE_DIR "/tests/viewer/add_by_keys.txt");
    std::vector<KeyedChoice> out;
    for (std::string line; std::getline(in, line);) {
        if (line.empty() || line[0] == '#') continue;
        const size_t colon = line.find(':');
        REQUIRE(colon != std::string::npos);
        KeyedChoice c;
        c.line = line;
        std::istringstream what(line.substr(0, colon)), keys(line.substr(colon + 1));
        what >> c.type >> c.must_hold;
        for (std::string k; keys >> k;) {
            const size_t star = k.find('*');
            const int times = star == std::string::npos ? 1 : std::stoi(k.substr(star + 1));
            for (int t = 0; t < times; ++t) c.keys.push_back(k.substr(0, star));
        }
        out.push_back(c);
    }
    return out;
}
int key_index(const std::string& name) {
    if (name == "Down") return ImGui::GetKeyIndex(ImGuiKey_DownArrow);
    if (name == "Up") return ImGui::GetKeyIndex(ImGuiKey_UpArrow);
    if (name == "Right") return ImGui::GetKeyIndex(ImGuiKey_RightArrow);
    if (name == "Space") return ImGui::GetKeyIndex(ImGuiKey_Space);
    FAIL("unknown key " << name);
    return 0;
}
}  // namespace

TEST_CASE("the Add menu is worked by the keyboard: each line of add_by_keys.txt adds its kind", "[viewer][files][nav]") {
    const rv::Layout start = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/shg-single.json").layout;
    rv::edit::Document doc(start);
    Session s(doc);
    std::ifstream catalog(RV_SOURCE_DIR "/layouts/lenses.json");
    s.state.tools.catalog = rv::parse_lens_catalog(std::string(std::istreambuf_iterator<char>(catalog), {}),
                                                   rv::material_library_for(start)).lenses;
    REQUIRE_FALSE(s.state.tools.catalog.empty());
    const std::vector<KeyedChoice> choices = keyed_choices();
    REQUIRE(choices.size() == 16);
    std::set<std::string> types;
    for (const KeyedChoice& c : choices) {
        CAPTURE(c.line);
        const size_t elements = doc.layout().elements.size(), beams = doc.layout().beams.size();
        s.mouse(s.state.last_view.to_screen(rv::Vec2(450, 60)), false);  // an empty corner of the table
        s.key(rv::ui::keys::kA, false, true);
        s.settle();
        for (const std::string& k : c.keys) s.key(key_index(k));
        s.settle();
        CHECK_FALSE(s.state.add_here_mm.has_value());  // the menu closed
        if (c.type == "beam") {
            CHECK(doc.layout().beams.size() == beams + 1);
            continue;
        }
        REQUIRE(doc.layout().elements.size() == elements + 1);
        // At the cursor, which has not moved since the first line (keys alone worked the menu).
        if (c.type != "stage")
            CHECK((doc.layout().elements.back().at_mm - rv::ui::snapped_to_hole(start.table, rv::Vec2(450, 60))).norm() < 1e-9);
        const nlohmann::json added = nlohmann::json::parse(rv::write_layout(doc.layout()))["elements"].back();
        CHECK(added["type"] == c.type);
        types.insert(c.type);
        if (c.must_hold.empty()) continue;
        const size_t eq = c.must_hold.find('=');
        if (c.must_hold[0] == '-') CHECK_FALSE(added.contains(c.must_hold.substr(1)));
        else if (eq == std::string::npos) CHECK(added.contains(c.must_hold));
        else CHECK(added.value(c.must_hold.substr(0, eq), std::string()) == c.must_hold.substr(eq + 1));
    }
    // Every element kind the reader knows is among them.
    for (const std::string& type : rv::element_type_names()) CHECK(types.count(type) == 1);
    // And the mouse works the table again: a drag from there moves one optic onto a hole.
    const rv::Layout before_drag = doc.layout();
    const ImVec2 at = s.state.last_view.to_screen(rv::Vec2(450, 60));
    s.mouse(ImVec2(at.x + 40, at.y + 30), false);
    s.drag(at, ImVec2(at.x - 72, at.y - 56));
    s.settle();
    size_t moved = 0;
    for (size_t i = 0; i < before_drag.elements.size(); ++i) moved += doc.layout().elements[i].at_mm != before_drag.elements[i].at_mm;
    CHECK(moved == 1);
}

TEST_CASE("Save of a new layout without a file asks for one", "[viewer][files]") {
    rv::edit::Document doc(rv::edit::layout_of(rv::edit::layout_templates()[0]));
    Session s(doc);
    s.key(rv::ui::keys::kS, true);
    CHECK(s.state.file_dialog.visible);
    CHECK(s.state.file_dialog.mode == rv::ui::FileDialogState::Mode::SaveAs);
}
