#pragma once
#include <string>

namespace soffit::gui {

struct GuiOptions {
  bool demo = false;              // open the bundled demo data
  std::string screenshot_path;    // non-empty: render a few frames, write this PNG, exit
  std::string view = "section";   // which view the screenshot shows
  int screenshot_frames = 8;      // frames rendered before the capture (fits finish meanwhile)
  float ui_scale = 0.0f;          // 0: from the monitor's content scale
};

// Parses GUI options (argv without a verb). Returns false and fills `error` on bad usage.
bool parse_gui_options(int argc, char** argv, GuiOptions& options, std::string& error);

// Opens the field app. Returns the process exit code.
int run_gui(const GuiOptions& options);

}  // namespace soffit::gui
