#pragma once
// An on-screen numeric keypad for readings, for a tablet held in one hand:
// large keys, a sign key, no hover needed. Opened as a modal popup that is
// sized from the display, so that OK and Next are on screen at any text size.
#include <optional>
#include <string>

namespace soffit::gui {

class NumericKeypad {
 public:
  // Starts editing `initial` (as text) under `title`; call before opening the popup.
  void begin(const std::string& title, double initial, int decimals);
  // Starts editing a cell's text as typed (empty for a new cell).
  void begin_text(const std::string& title, const std::string& initial);
  // A line under the title that says which value this is (e.g. "reading 6,
  // station 3.200 m, now 1297 mm"); call after begin/begin_text, which clear it.
  void set_context(std::string context) { context_ = std::move(context); }
  // Draws the keypad if its popup is open. Returns the value when OK (or
  // Next) is pressed with a valid number; empty otherwise (also on Cancel).
  std::optional<double> draw();
  // Whether the last value came with Next: go on to the next reading's cell.
  bool next_pressed() const { return next_; }
  const std::string& popup_id() const { return title_; }
  const std::string& text() const { return text_; }
  const std::string& context() const { return context_; }

 private:
  void press(char key);
  std::string title_ = "Enter value";
  std::string context_;
  std::string text_;
  bool next_ = false;
};

// The unit a title carries in brackets ("offset (mm), reading 6" → "mm"); empty if none.
std::string unit_in_title(const std::string& title);

}  // namespace soffit::gui
