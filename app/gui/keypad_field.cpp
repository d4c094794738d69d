#include "app/gui/keypad_field.hpp"

#include <imgui.h>

#include <cstdio>

#include "app/gui/ui_probe.hpp"

namespace soffit::gui {

bool KeypadField::button(std::optional<double>& value, const std::string& shown, const std::string& probe_name,
                         float width, const std::string& title, const std::string& initial) {
  // "###": the button keeps its id while what it says changes.
  const bool tapped = ImGui::Button((shown + "###" + probe_name).c_str(), ImVec2(width, 0));
  probe(probe_name);
  if (tapped) {
    keypad_.begin_text(title, initial);
    target_ = &value;
    opening_ = true;
  }
  return tapped;
}

bool KeypadField::button(std::optional<double>& value, const std::string& probe_name, float width,
                         const std::string& title, int decimals) {
  char text[32] = "tap to enter";
  if (value) std::snprintf(text, sizeof text, "%.*f", decimals, *value);
  return button(value, text, probe_name, width, title, value ? std::string(text) : std::string());
}

bool KeypadField::draw() {
  // Opened here rather than at the tap, so that the keypad's popup is opened
  // and drawn from the same window (the tap may be inside a scrolling child).
  if (opening_) {
    ImGui::OpenPopup(keypad_.popup_id().c_str());
    opening_ = false;
  }
  if (!target_) return false;
  if (const auto v = keypad_.draw()) {
    *target_ = *v;
    target_ = nullptr;
    return true;
  }
  if (!ImGui::IsPopupOpen(keypad_.popup_id().c_str())) target_ = nullptr;  // cancelled
  return false;
}

}  // namespace soffit::gui
