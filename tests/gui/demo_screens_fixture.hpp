#pragma once
// The app's screens on a fresh copy of the demo project, in a data folder of
// their own (XDG_DATA_HOME, where the app keeps the demo and its recent list),
// drawn headless once per frame as on screen; all removed afterwards.
#include <doctest/doctest.h>
#include <unistd.h>

#include <chrono>
#include <cstdlib>
#include <filesystem>
#include <optional>
#include <string>
#include <thread>

#include "app/gui/project_screens.hpp"
#include "tests/gui/headless_ui.hpp"

namespace soffit::test {

class DemoScreens {
 public:
  // Opens the demo on the structure screen; `name` keeps parallel tests apart.
  explicit DemoScreens(const std::string& name) {
    home_ = std::filesystem::temp_directory_path() / ("soffit_" + name + "_" + std::to_string(::getpid()));
    std::filesystem::remove_all(home_);
    std::filesystem::create_directories(home_);
    ::setenv("XDG_DATA_HOME", home_.c_str(), 1);
    screens_.emplace(SOFFIT_ASSETS, "test");
    ui_.emplace([this] {
      screens_->sections.poll();
      screens_->photos.poll();
      screens_->draw_current();
    });
    screens_->open_demo();
    screens_->open_first_sections();
    screens_->screen = gui::Screen::structure;
    ui_->frame();
  }
  ~DemoScreens() {
    screens_->defects.close();
    screens_->rings_fill.close();
    screens_.reset();
    ui_.reset();
    std::error_code ec;
    std::filesystem::remove_all(home_, ec);
  }
  DemoScreens(const DemoScreens&) = delete;
  DemoScreens& operator=(const DemoScreens&) = delete;

  gui::ProjectScreens& screens() { return *screens_; }
  HeadlessUi& ui() { return *ui_; }
  bool tap(const std::string& control) { return ui_->tap(control); }
  std::string project_path() { return screens_->session().path(); }

  // Frames until no fit or other work is running (bounded: a hang fails the test).
  bool settle() {
    for (int i = 0; i < 3000; ++i) {
      ui_->frame();
      const bool fitting = screens_->screen == gui::Screen::section && !screens_->sections.analysis();
      if (!screens_->busy() && !fitting) {
        ui_->frame();
        ui_->frame();
        return true;
      }
      std::this_thread::sleep_for(std::chrono::milliseconds(2));
    }
    return false;
  }

 private:
  std::filesystem::path home_;
  std::optional<gui::ProjectScreens> screens_;
  std::optional<HeadlessUi> ui_;
};

}  // namespace soffit::test
