#pragma once
// A number field for a finger: the value shown on a large button, a tap opens
// the on-screen keypad on it, and OK writes the number back into the
// std::optional<double> the button was drawn for. One KeypadField serves all
// the number fields of a form; the keypad opens over the form.
#include <optional>
#include <string>

#include "app/gui/numeric_keypad.hpp"

namespace soffit::gui {

class KeypadField {
 public:
  // A button `width` wide (0: as wide as its text) that says `shown`; a tap
  // opens the keypad titled `title` on `value`, starting from `initial`.
  // `value` must outlive the keypad (a member of the form). True when tapped.
  bool button(std::optional<double>& value, const std::string& shown, const std::string& probe_name, float width,
              const std::string& title, const std::string& initial);
  // The common case: the value to `decimals` places, or "tap to enter";
  // the keypad starts from the value as shown.
  bool button(std::optional<double>& value, const std::string& probe_name, float width, const std::string& title,
              int decimals);
  // After the fields, in the same window as them: draws the keypad while it
  // is open. True on the frame OK wrote a value into the field tapped.
  bool draw();

 private:
  NumericKeypad keypad_;
  std::optional<double>* target_ = nullptr;
  bool opening_ = false;
};

}  // namespace soffit::gui
