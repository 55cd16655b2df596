#include "ui/file_dialog.hpp"

#include <imgui.h>

#include <cstdio>
#include <filesystem>
#include <system_error>

namespace rv::ui {

namespace {

constexpr const char* kPopupId = "###file-dialog";

std::filesystem::path working_folder() {
    std::error_code ec;
    const std::filesystem::path p = std::filesystem::current_path(ec);
    return ec ? std::filesystem::path("/") : p;
}

void set_path(FileDialogState& s, const std::string& text) {
    std::snprintf(s.path, sizeof s.path, "%s", text.c_str());
}

void enter_folder(FileDialogState& s, const std::filesystem::path& folder) {
    s.listing = edit::list_folder(folder);
    std::string text = s.listing.folder.string();
    if (text.empty() || text.back() != '/') text += '/';
    set_path(s, text);
    s.candidates.clear();
    s.focus_path = true;
    s.cursor_to_end = true;
}

// The path field's callback: on the frames after opening, the cursor goes to the end (a name
// typed then extends the folder shown instead of replacing it); Tab completes with
// edit/folder_listing, written into the field.
int field_callback(ImGuiInputTextCallbackData* data) {
    auto* s = static_cast<FileDialogState*>(data->UserData);
    if (data->EventFlag == ImGuiInputTextFlags_CallbackAlways) {
        if (s->cursor_to_end) {
            data->CursorPos = data->SelectionStart = data->SelectionEnd = data->BufTextLen;
            s->cursor_to_end = false;
        }
        return 0;
    }
    const edit::Completion c = edit::complete_path(std::string(data->Buf, static_cast<size_t>(data->BufTextLen)), working_folder());
    s->candidates = c.candidates;
    if (c.text != std::string(data->Buf, static_cast<size_t>(data->BufTextLen))) {
        data->DeleteChars(0, data->BufTextLen);
        data->InsertChars(0, c.text.c_str());
    }
    s->listing = edit::list_folder(edit::folder_of_typed(c.text, working_folder()));
    return 0;
}

// The path as confirmed: a folder is entered (nullopt), anything else is the answer.
std::optional<std::string> confirm(FileDialogState& s) {
    const std::string typed = s.path;
    if (typed.empty()) {
        s.error = "type a file name";
        return std::nullopt;
    }
    std::error_code ec;
    std::filesystem::path p(typed);
    if (!p.is_absolute()) p = working_folder() / p;
    if (std::filesystem::is_directory(p, ec)) {
        enter_folder(s, p);
        return std::nullopt;
    }
    s.visible = false;
    s.error.clear();
    ImGui::CloseCurrentPopup();
    if (s.mode == FileDialogState::Mode::Open) s.pending_open = p.lexically_normal().string();
    return p.lexically_normal().string();
}

}  // namespace

void show_file_dialog(FileDialogState& s, FileDialogState::Mode mode, const std::string& start_path) {
    s.mode = mode;
    s.visible = true;
    s.focus_path = s.cursor_to_end = true;
    s.error.clear();
    s.candidates.clear();
    s.pending_open.reset();
    s.listing = edit::list_folder(edit::folder_of_typed(start_path, working_folder()));
    if (start_path.empty() || std::filesystem::is_directory(start_path)) {
        std::string text = s.listing.folder.string();
        if (text.empty() || text.back() != '/') text += '/';
        set_path(s, text);
    } else {
        set_path(s, start_path);
    }
}

void reopen_with_error(FileDialogState& s, const std::string& error) {
    s.visible = true;
    s.focus_path = s.cursor_to_end = true;
    s.error = error;
    s.pending_open.reset();
}

std::optional<std::string> draw_file_dialog(FileDialogState& s, const std::vector<std::string>& recent) {
    if (!s.visible) return std::nullopt;
    const bool open = s.mode == FileDialogState::Mode::Open;
    const std::string title = std::string(open ? "Open a layout" : "Save the layout as") + kPopupId;
    if (!ImGui::IsPopupOpen(title.c_str())) ImGui::OpenPopup(title.c_str());
    ImGui::SetNextWindowSize(ImVec2(640, 0), ImGuiCond_Appearing);
    if (!ImGui::BeginPopupModal(title.c_str(), nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return std::nullopt;
    std::optional<std::string> chosen;
    ImGui::TextUnformatted(s.listing.folder.string().c_str());
    ImGui::SameLine();
    if (ImGui::SmallButton("parent folder")) enter_folder(s, s.listing.folder.parent_path());
    if (!s.listing.error.empty()) ImGui::TextWrapped("%s", s.listing.error.c_str());
    ImGui::BeginChild("entries", ImVec2(620, 220), true);
    for (const edit::FolderEntry& e : s.listing.entries) {
        const std::string label = e.folder ? e.name + "/" : e.name;
        if (ImGui::Selectable(label.c_str(), false, ImGuiSelectableFlags_AllowDoubleClick)) {
            const std::filesystem::path p = s.listing.folder / e.name;
            if (e.folder) {
                enter_folder(s, p);
                break;  // the listing changed under the loop
            }
            set_path(s, p.string());
            if (ImGui::IsMouseDoubleClicked(ImGuiMouseButton_Left)) chosen = confirm(s);
        }
    }
    ImGui::EndChild();
    if (open && !recent.empty() && !chosen) {
        ImGui::TextDisabled("recent files");
        for (const std::string& f : recent)
            if (ImGui::Selectable(f.c_str(), false, ImGuiSelectableFlags_AllowDoubleClick)) {
                set_path(s, f);
                if (ImGui::IsMouseDoubleClicked(ImGuiMouseButton_Left)) chosen = confirm(s);
            }
    }
    // Until the field has the keyboard (a modal's first frame only sizes it).
    if (s.focus_path) ImGui::SetKeyboardFocusHere();
    ImGui::SetNextItemWidth(560);
    if (ImGui::InputText("path", s.path, sizeof s.path,
                         ImGuiInputTextFlags_EnterReturnsTrue | ImGuiInputTextFlags_CallbackCompletion |
                             ImGuiInputTextFlags_CallbackAlways,
                         field_callback, &s) &&
        !chosen)
        chosen = confirm(s);
    if (ImGui::IsItemActive()) s.focus_path = false;
    if (!s.candidates.empty()) {
        std::string line;
        for (const std::string& c : s.candidates) line += (line.empty() ? "" : "   ") + c;
        ImGui::TextWrapped("Tab: %s", line.c_str());
    }
    if (!s.error.empty()) {
        ImGui::PushStyleColor(ImGuiCol_Text, IM_COL32(200, 30, 30, 255));
        ImGui::TextWrapped("%s", s.error.c_str());
        ImGui::PopStyleColor();
    }
    if (ImGui::Button(open ? "Open" : "Save") && !chosen) chosen = confirm(s);
    ImGui::SameLine();
    const bool escape = ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Escape), false);
    if ((ImGui::Button("Cancel") || escape) && !chosen) {
        s.visible = false;
        s.pending_open.reset();
        ImGui::CloseCurrentPopup();
    }
    ImGui::EndPopup();
    return chosen;
}

}  // namespace rv::ui
