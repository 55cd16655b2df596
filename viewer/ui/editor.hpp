#pragma once
// Editing on the table view: click selects the optic under the cursor, dragging it moves it
// (snapped to the nearest breadboard hole unless snapping is off or Alt is held), and the
// operations the shortcuts (ui/shortcuts.hpp) and menus call. Every change goes through the
// Document, which rebuilds the report and the scene.
#include <optional>
#include <string>
#include <vector>

#include "edit/document.hpp"
#include "ui/view.hpp"

namespace rv::ui {

struct EditorState {
    std::optional<size_t> selected;  // element index
    // The selected element's id and the document revision it was read at: after a change of
    // the layout (undo, delete, …) the selection follows the id (sync_selection).
    std::string selected_id;
    unsigned selection_revision = 0;
    // Set while a solver's solution is previewed: the layout is not edited then.
    bool locked = false;
    bool snap = true;
    struct Drag {
        size_t element;
        Vec2 grab_offset_mm;  // element position minus the cursor's table point at the press
        Vec2 start_mm;
        edit::Document::Gesture gesture = 0;
    };
    std::optional<Drag> drag;
    std::string status;  // the last thing the editor has to say (saved, an error)
    // The measuring tool (M): a press and drag on the table draws a ruler, its ends caught by
    // an optic's centre within 8 px; it stays until the next measurement or Esc.
    bool measuring = false;
    struct Ruler {
        Vec2 from_mm, to_mm;
        bool active = false;  // the button is still down
    };
    std::optional<Ruler> ruler;
};

// The ruler's text: "123.4 mm at 12.3°" (angle from the table's x axis, counter-clockwise).
std::string ruler_text(const EditorState::Ruler& r);

// The element whose symbol is under a table point, if any (within its half aperture or 8 px).
std::optional<size_t> element_at(const edit::Document& doc, const Vec2& table_mm, double px_per_mm);

// The canvas interaction for one frame (after the canvas's invisible button was submitted):
// returns true when it took the mouse (a press on an element), so the view does not pan.
bool edit_on_canvas(edit::Document& doc, EditorState& state, const View& view);

// Ends a drag in progress, restoring where it started (Esc); false when there is none.
bool cancel_drag(edit::Document& doc, EditorState& state);
// Selects the next (step +1) or previous (−1) element with a symbol, wrapping around.
void select_next(const edit::Document& doc, EditorState& state, int step);

// Where snapping puts a point: the centre of its breadboard hole (analysis/breadboard_holes.hpp,
// the grid the table view draws); the point itself when the table has no hole.
Vec2 snapped_to_hole(const Table& table, const Vec2& p_mm);

// Keeps the selection on the same element across changes of the layout (call once a frame).
void sync_selection(const edit::Document& doc, EditorState& state);
// Selects an element and records its id.
void select(const edit::Document& doc, EditorState& state, std::optional<size_t> element);

// Operations behind the shortcuts and menus.
void delete_selected(edit::Document& doc, EditorState& state);
void duplicate_selected(edit::Document& doc, EditorState& state);
void rotate_selected(edit::Document& doc, EditorState& state, double degrees);
// Adds an element of a kind by its type name ("lens", …) with its first Add choice's defaults
// (edit/new_elements.hpp), selected; a stage carries the selected optic. A type the window cannot
// add (or a stage with nothing selected to carry) is refused in state.status.
void add_element(edit::Document& doc, EditorState& state, const std::string& type, const Vec2& at_mm);
// Adds an element (its id a stem that gets a number; placed on the hole nearest at_mm, a stage
// excepted), selected; false with the reader's whole message in state.status if refused.
bool add_new_element(edit::Document& doc, EditorState& state, Element element, const Vec2& at_mm);
// A stage carrying the given optics (edit::carriable_ids), selected.
bool add_stage(edit::Document& doc, EditorState& state, std::vector<std::string> carries);
// A new beam starting on the hole nearest at_mm (edit::new_beam).
bool add_beam(edit::Document& doc, EditorState& state, const Vec2& at_mm);
// The type names the Add menu offers, in ElementKind's order (every kind).
std::vector<std::string> addable_element_types();

}  // namespace rv::ui
