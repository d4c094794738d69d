#pragma once
// An on-screen numeric keypad for readings, for a tablet held in one hand:
// large keys, a sign key, no hover needed. Opened as a modal popup.
#include <optional>
#include <string>

namespace soffit::gui {

class NumericKeypad {
 public:
  // Starts editing `initial` (as text) under `title`; call before opening the popup.
  void begin(const std::string& title, double initial, int decimals);
  // Draws the keypad if its popup is open. Returns the value when OK is
  // pressed with a valid number; empty otherwise (also on Cancel).
  std::optional<double> draw();
  const std::string& popup_id() const { return title_; }
  const std::string& text() const { return text_; }

 private:
  void press(char key);
  std::string title_ = "Enter value";
  std::string text_;
};

}  // namespace soffit::gui
