#pragma once
// The Add menu: every element kind's choices (edit/new_elements.hpp), the thick singlets of the
// lens catalog, a stage carrying an optic chosen from a list, and a beam. New optics go on the
// hole nearest the middle of the table view, or from Shift+A's menu at the cursor, there.
#include "ui/frame.hpp"

namespace rv::ui {

// Inside the menu bar; draws nothing unless the menu is open.
void draw_add_menu(ViewerState& state, bool enabled);
// The same choices in a menu at the cursor while state.add_here_mm is set (Shift+A); closing it
// clears that.
void draw_add_here_popup(ViewerState& state);

}  // namespace rv::ui
