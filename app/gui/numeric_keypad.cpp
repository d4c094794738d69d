#include "app/gui/numeric_keypad.hpp"

#include <imgui.h>

#include <charconv>
#include <cmath>
#include <cstdio>

#include "app/gui/ui_probe.hpp"

namespace soffit::gui {

void NumericKeypad::begin(const std::string& title, double initial, int decimals) {
  title_ = title;
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, initial);
  text_ = buf;
}

void NumericKeypad::begin_text(const std::string& title, const std::string& initial) {
  title_ = title;
  text_ = initial;
}

void NumericKeypad::press(char key) {
  if (key == '<') {
    if (!text_.empty()) text_.pop_back();
  } else if (key == '-') {
    if (!text_.empty() && text_[0] == '-')
      text_.erase(0, 1);
    else
      text_.insert(0, 1, '-');
  } else if (key == '.') {
    if (text_.find('.') == std::string::npos) text_ += text_.empty() || text_ == "-" ? "0." : ".";
  } else if (text_.size() < 16) {
    text_ += key;
  }
}

std::optional<double> NumericKeypad::draw() {
  std::optional<double> result;
  if (!ImGui::BeginPopupModal(title_.c_str(), nullptr, ImGuiWindowFlags_AlwaysAutoResize)) return result;
  const float key = ImGui::GetFrameHeight() * 1.8f;  // well above the 44 px minimum at scale 1
  ImGui::SetWindowFontScale(1.3f);
  ImGui::Text("%s", text_.empty() ? " " : text_.c_str());
  ImGui::SetWindowFontScale(1.0f);
  static const char* rows[4] = {"789", "456", "123", "-0."};
  for (const char* row : rows) {
    for (int k = 0; k < 3; ++k) {
      const char label[2] = {row[k], 0};
      if (k > 0) ImGui::SameLine();
      const bool pressed = ImGui::Button(row[k] == '-' ? "+/-" : label, ImVec2(key, key));
      probe(std::string("key:") + row[k]);
      if (pressed) press(row[k]);
    }
  }
  const bool back = ImGui::Button("Delete", ImVec2(key * 3 + ImGui::GetStyle().ItemSpacing.x * 2, key * 0.7f));
  probe("key:<");
  if (back) press('<');

  double value = 0.0;
  const auto [end, ec] = std::from_chars(text_.data(), text_.data() + text_.size(), value);
  const bool valid = !text_.empty() && ec == std::errc() && end == text_.data() + text_.size() && std::isfinite(value);
  ImGui::BeginDisabled(!valid);
  const bool ok = ImGui::Button("OK", ImVec2(key * 1.5f, key * 0.8f));
  probe("key:ok");
  ImGui::SameLine();
  // Next keeps a hand on the keypad down a column of readings, as on a booking sheet.
  const bool next = ImGui::Button("Next", ImVec2(key * 1.5f, key * 0.8f));
  probe("key:next");
  ImGui::EndDisabled();
  const bool cancel = ImGui::Button("Cancel", ImVec2(key * 3 + ImGui::GetStyle().ItemSpacing.x * 2, key * 0.7f));
  probe("key:cancel");
  if ((ok || next) && valid) {
    result = value;
    next_ = next;
    ImGui::CloseCurrentPopup();
  } else if (cancel) {
    ImGui::CloseCurrentPopup();
  }
  ImGui::EndPopup();
  return result;
}

}  // namespace soffit::gui
