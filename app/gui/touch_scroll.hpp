#pragma once
// Scrolling long lists with a finger (ImGui 1.86 scrolls only by wheel and
// scrollbar, and GLFW delivers a touch as the mouse): drag anywhere in the list
// to move it, and "Page up"/"Page down" buttons for a gloved hand.
namespace soffit::gui {

// Call inside a window or child, after its contents. A drag that starts in
// this window (not in a child of it) scrolls it with the pointer, even when it
// starts on a row or button: once the pointer has moved past the drag
// threshold, the pressed item is let go, so lifting the finger does not also
// tap it. A drag that starts in a text field being edited selects text instead.
void drag_to_scroll();

// Call right after EndChild() (or EndTable() of a table with ScrollY): "Page up"
// and "Page down" buttons that move that child by its visible height less one
// row, so the row at the edge stays in view. Each is disabled at its end.
// `id` names them for probes: "<id>:page-up", "<id>:page-down". True when pressed.
bool paging_buttons(const char* id);

}  // namespace soffit::gui
