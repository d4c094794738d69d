#include "app/gui/gui_options.hpp"

#include <algorithm>
#include <charconv>
#include <iterator>
#include <string_view>

namespace soffit::gui {

bool parse_gui_options(int argc, char** argv, GuiOptions& options, std::string& error) {
  for (int i = 1; i < argc; ++i) {
    const std::string_view arg = argv[i];
    auto value = [&]() -> const char* { return i + 1 < argc ? argv[++i] : nullptr; };
    if (arg == "--demo") {
      options.demo = true;
    } else if (arg == "--screenshot") {
      const char* v = value();
      if (!v) return error = "--screenshot needs a PNG path", false;
      options.screenshot_path = v;
    } else if (arg == "--view") {
      const char* v = value();
      if (!v) return error = "--view needs a view name", false;
      options.view = v;
      // One list for the check and the message (the README lists the same names).
      static const char* views[] = {"start",   "register", "add-structure", "structure", "new-section", "section", "keypad",
                                    "keyboard", "exclude", "defects",       "elevation", "photos",  "rings",
                                    "rings-add", "change"};
      if (std::find(std::begin(views), std::end(views), options.view) == std::end(views)) {
        std::string names;
        for (const char* v : views) names += (names.empty() ? "" : ", ") + std::string(v);
        return error = "unknown view '" + options.view + "' (views: " + names + ")", false;
      }
    } else if (arg == "--scale") {
      const char* v = value();
      const std::string_view text = v ? v : "";
      float scale = 0.0f;
      const auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), scale);
      if (!v || ec != std::errc() || end != text.data() + text.size() || scale < 0.75f || scale > 2.5f)
        return error = "--scale needs a number from 0.75 to 2.5", false;
      options.ui_scale = scale;
    } else {
      return error = "unknown option '" + std::string(arg) + "'", false;
    }
  }
  return true;
}

}  // namespace soffit::gui
