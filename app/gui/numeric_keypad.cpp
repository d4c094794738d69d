#include "app/gui/numeric_keypad.hpp"

#include <imgui.h>

#include <algorithm>
#include <charconv>
#include <cmath>
#include <cstdio>

#include "app/gui/ui_probe.hpp"
#include "app/gui/ui_theme.hpp"

namespace soffit::gui {
namespace {

// A fingertip needs about this much whatever the text size (common practice
// for touch targets; the same 44 px the theme gives a button at scale 1).
constexpr float kMinKey = 44.0f;
constexpr float kValueFontScale = 1.3f;  // the typed value reads larger than the labels
// The column beside the keys, top to bottom: Delete by the value, Next under the thumb.
constexpr const char* kActions[4] = {"Delete", "Cancel", "OK", "Next"};

struct KeypadLayout {
  float key = kMinKey;       // side of a digit key
  float action_w = 0;        // width of the Delete/Cancel/OK/Next column
  float content_w = 0;       // inner width of the popup
};

// Sizes the keys so that title, context, value, four rows of keys and the
// action column fit the display: the landscape tablet is short, not narrow,
// so the actions go beside the keys rather than under them.
KeypadLayout fit_to_display(const std::string& title, const std::string& context) {
  const ImGuiStyle& st = ImGui::GetStyle();
  const ImVec2 display = ImGui::GetIO().DisplaySize;
  const float font = ImGui::GetFontSize();
  const float margin = std::max(st.DisplaySafeAreaPadding.y, font * 0.5f);
  const float avail_w = display.x - 2 * margin - 2 * st.WindowPadding.x;
  const float avail_h = display.y - 2 * margin;

  KeypadLayout l;
  for (const char* a : kActions) l.action_w = std::max(l.action_w, ImGui::CalcTextSize(a).x + 2 * st.FramePadding.x);
  l.action_w = std::max(l.action_w, font * 5);
  const float title_w = ImGui::CalcTextSize(title.c_str()).x + 2 * st.FramePadding.x - 2 * st.WindowPadding.x;
  const float key_max = std::min(ImGui::GetFrameHeight() * 1.8f, (avail_w - l.action_w - 4 * st.ItemSpacing.x) / 3);
  const float title_h = font + 2 * st.FramePadding.y;
  const float value_h = font * kValueFontScale + st.ItemSpacing.y;
  l.key = std::max(kMinKey, key_max);
  // The context line wraps at the popup's width, which follows the keys: settle in a few rounds.
  for (int round = 0; round < 3; ++round) {
    const float grid_w = 3 * l.key + 4 * st.ItemSpacing.x + l.action_w;
    l.content_w = std::min(std::max(grid_w, title_w), std::max(grid_w, avail_w));
    const float context_h =
        context.empty() ? 0 : ImGui::CalcTextSize(context.c_str(), nullptr, false, l.content_w).y + st.ItemSpacing.y;
    // The four key rows have three spacings between them.
    const float fixed = 2 * st.WindowPadding.y + title_h + context_h + value_h + 3 * st.ItemSpacing.y;
    l.key = std::clamp((avail_h - fixed) / 4, kMinKey, std::max(kMinKey, key_max));
  }
  l.key = std::floor(l.key);
  const float grid_w = 3 * l.key + 4 * st.ItemSpacing.x + l.action_w;
  l.content_w = std::min(std::max(grid_w, title_w), std::max(grid_w, avail_w));
  return l;
}

}  // namespace

std::string unit_in_title(const std::string& title) {
  const size_t open = title.find('(');
  if (open == std::string::npos) return {};
  const size_t close = title.find(')', open);
  if (close == std::string::npos) return {};
  const std::string inside = title.substr(open + 1, close - open - 1);
  // A unit is a short word ("mm", "m", "°"); "(+ up)" or "(x, z)" are not.
  if (inside.empty() || inside.size() > 6 || inside.find_first_of(" ,") != std::string::npos) return {};
  return inside;
}

void NumericKeypad::begin(const std::string& title, double initial, int decimals) {
  title_ = title;
  context_.clear();
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, initial);
  text_ = buf;
}

void NumericKeypad::begin_text(const std::string& title, const std::string& initial) {
  title_ = title;
  context_.clear();
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
  if (!ImGui::IsPopupOpen(title_.c_str())) return result;
  const KeypadLayout l = fit_to_display(title_, context_);
  const ImGuiStyle& st = ImGui::GetStyle();
  const ImVec2 display = ImGui::GetIO().DisplaySize;
  ImGui::SetNextWindowPos(ImVec2(display.x / 2, display.y / 2), ImGuiCond_Always, ImVec2(0.5f, 0.5f));
  ImGui::SetNextWindowSizeConstraints(ImVec2(0, 0), display);
  if (!ImGui::BeginPopupModal(title_.c_str(), nullptr,
                              ImGuiWindowFlags_AlwaysAutoResize | ImGuiWindowFlags_NoMove |
                                  ImGuiWindowFlags_NoSavedSettings))
    return result;

  // The width the layout was sized for, whatever the text; the cursor goes
  // back so that the marker takes no line of its own.
  const ImVec2 start = ImGui::GetCursorPos();
  ImGui::Dummy(ImVec2(l.content_w, 0));
  ImGui::SetCursorPos(start);
  const float left = start.x;
  if (!context_.empty()) {
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().faint_ink));
    ImGui::PushTextWrapPos(left + l.content_w);
    ImGui::TextUnformatted(context_.c_str());
    ImGui::PopTextWrapPos();
    ImGui::PopStyleColor();
    probe("key:context");
  }
  ImGui::SetWindowFontScale(kValueFontScale);
  ImGui::TextUnformatted(text_.empty() ? " " : text_.c_str());
  probe("key:value");
  if (const std::string unit = unit_in_title(title_); !unit.empty()) {
    ImGui::SameLine();
    ImGui::PushStyleColor(ImGuiCol_Text, ImGui::ColorConvertU32ToFloat4(palette().faint_ink));
    ImGui::TextUnformatted(unit.c_str());
    ImGui::PopStyleColor();
  }
  ImGui::SetWindowFontScale(1.0f);

  double value = 0.0;
  const auto [end, ec] = std::from_chars(text_.data(), text_.data() + text_.size(), value);
  const bool valid = !text_.empty() && ec == std::errc() && end == text_.data() + text_.size() && std::isfinite(value);

  static const char* rows[4] = {"789", "456", "123", "-0."};
  bool actions[4] = {};
  for (int r = 0; r < 4; ++r) {
    for (int k = 0; k < 3; ++k) {
      const char ch = rows[r][k];
      const char label[2] = {ch, 0};
      if (k > 0) ImGui::SameLine();
      const bool pressed = ImGui::Button(ch == '-' ? "+/-" : label, ImVec2(l.key, l.key));
      probe(std::string("key:") + ch);
      if (pressed) press(ch);
    }
    ImGui::SameLine(0, 2 * st.ItemSpacing.x);  // a gap keeps the actions apart from the digits
    const bool commit = r >= 2;
    if (commit) ImGui::BeginDisabled(!valid);
    actions[r] = ImGui::Button(kActions[r], ImVec2(l.action_w, l.key));
    static const char* probes[4] = {"key:<", "key:cancel", "key:ok", "key:next"};
    probe(probes[r]);
    if (commit) ImGui::EndDisabled();
  }
  const bool back = actions[0], cancel = actions[1], ok = actions[2];
  // Next keeps a hand on the keypad down a column of readings, as on a booking sheet.
  const bool next = actions[3];
  if (back) press('<');
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
