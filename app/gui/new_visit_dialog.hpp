#pragma once
// "New visit" on a structure: the date (today unless changed), the kind of
// inspection, who, the weather and air temperature, what could not be seen.
#include <optional>
#include <string>

#include "app/gui/fitted_modal.hpp"
#include "app/gui/keypad_field.hpp"
#include "app/model/new_visit.hpp"

namespace soffit::gui {

class NewVisitDialog {
 public:
  void request(const std::string& structure_ref, const std::string& inspector);
  // Draws it while open; returns the new visit's date the frame it is made.
  std::optional<std::string> draw(storage::Project* project);

 private:
  bool open_ = false;
  FittedModal modal_;
  std::string structure_ref_;
  app::NewVisit visit_;
  char date_[16] = {}, inspector_[80] = {}, weather_[120] = {}, not_inspected_[200] = {};
  std::string error_;
  KeypadField temperature_;
};

}  // namespace soffit::gui
