// soffit: with no arguments (or only GUI options such as --demo), the field
// app; with a verb, a headless command.
#include <cstdio>
#include <string>

#include "app/cli/dispatch.hpp"
#include "app/gui/gui_options.hpp"

int main(int argc, char** argv) {
  if (argc < 2 || argv[1][0] == '-') {
    const std::string first = argc > 1 ? argv[1] : "";
    if (first != "--help" && first != "-h") {
      soffit::gui::GuiOptions options;
      std::string error;
      if (!soffit::gui::parse_gui_options(argc, argv, options, error)) {
        std::fprintf(stderr, "soffit: %s\nusage: soffit [--demo] [--screenshot PNG] [--view NAME] [--scale S]\n",
                     error.c_str());
        return 2;
      }
      return soffit::gui::run_gui(options);
    }
  }
  return soffit::cli::run(argc, argv);
}
