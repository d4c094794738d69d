#pragma once
// The pinned footer of a fitted form that makes something (a section, a
// visit): why the last attempt was refused, then the make button and Cancel.
#include <string>

#include "app/gui/fitted_modal.hpp"

namespace soffit::gui {

enum class FormAnswer { none, create, cancel };

// Ends `modal`'s scrolling body and draws the footer under it: `error`, when
// not empty, as "Not made: …" in the warning colour (what was typed stays in
// the form), then `create_label` and Cancel, probed as "<probe_prefix>:create"
// and "<probe_prefix>:cancel". Returns which was tapped this frame.
FormAnswer create_or_cancel_footer(FittedModal& modal, const std::string& error, const char* create_label,
                                   const std::string& probe_prefix);

}  // namespace soffit::gui
