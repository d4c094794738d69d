#pragma once
// "New section" on a visit: span, label and how the readings are booked, in
// large buttons and keypad fields, then an empty section ready to type into.
#include <optional>
#include <string>
#include <vector>

#include "app/gui/fitted_modal.hpp"
#include "app/gui/keypad_field.hpp"
#include "app/model/new_section.hpp"
#include "storage/project_file.hpp"
#include "storage/register_records.hpp"

namespace soffit::gui {

class NewSectionDialog {
 public:
  // Opens the dialog for the visit on `date` of `structure_ref`.
  void request(const std::string& structure_ref, const std::string& date, std::vector<storage::SpanRecord> spans);
  // Draws it while open; returns the new section's key the frame it is made.
  std::optional<std::string> draw(storage::Project* project);

 private:
  void draw_body();
  // A number row: its label, then the value as a large button that opens the keypad on it.
  void number_row(const char* label, std::optional<double>& value, const char* probe_name, int decimals);

  bool open_ = false;
  app::NewSection spec_;
  std::vector<storage::SpanRecord> spans_;
  char label_[48] = {};
  std::string error_;
  KeypadField numbers_;
  FittedModal modal_;  // within the display at any text size, Create and Cancel pinned
};

}  // namespace soffit::gui
