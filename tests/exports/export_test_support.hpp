#pragma once
// Shared by the section export tests: the demo section fitted once, a fresh
// folder per test, and running the external programs (rsvg-convert, gmsh)
// that prove the files are usable outside Soffit.
#include <doctest/doctest.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <string>

#include "geometry/analysis/profile_analysis.hpp"
#include "geometry/sheet/sheet_reader.hpp"

namespace soffit::test {

inline const std::string kDemoSheets = std::string(SOFFIT_ASSETS) + "/sheets/";
inline const std::string kTestProgram = "soffit test";

struct FittedSection {
  SurveySheet sheet;
  ProfileRequest request;
  ProfileAnalysis analysis;
};

// The demo sheet fitted as the FIELD.md §10.2 oracle is: a segmental arc, springing
// level from the end readings. Linearised ranges unless `draws` is given.
inline FittedSection fitted_demo(const std::string& sheet_name = "sallow-ford_S1-MW_2019.csv", int draws = 0) {
  FittedSection s;
  s.sheet = read_sheet_file(kDemoSheets + sheet_name, {});
  s.request.shape = "segmental";
  s.request.uncertainty.monte_carlo_draws = draws;
  s.request.uncertainty.seed = 3;
  s.analysis = analyse_profile(s.sheet.readings, s.request);
  REQUIRE_MESSAGE(s.analysis.ok(), s.analysis.error);
  return s;
}

inline FittedSection fitted_text(const std::string& text, const std::string& name,
                                 const std::string& shape = "segmental") {
  FittedSection s;
  s.sheet = parse_sheet(text, name, {});
  s.request.shape = shape;
  s.request.uncertainty.monte_carlo_draws = 0;
  s.analysis = analyse_profile(s.sheet.readings, s.request);
  REQUIRE_MESSAGE(s.analysis.ok(), s.analysis.error);
  return s;
}

class ExportDir {
 public:
  ExportDir() {
    static int counter = 0;
    path_ = std::filesystem::temp_directory_path() /
            ("soffit_exports_" + std::to_string(::getpid()) + "_" + std::to_string(counter++));
    std::filesystem::remove_all(path_);
    std::filesystem::create_directories(path_);
  }
  ~ExportDir() {
    std::error_code ec;
    std::filesystem::remove_all(path_, ec);
  }
  std::string file(const std::string& name) const { return (path_ / name).string(); }
  const std::filesystem::path& path() const { return path_; }

 private:
  std::filesystem::path path_;
};

inline void write_text(const std::string& path, const std::string& text) {
  std::ofstream(path, std::ios::binary) << text;
}

inline std::string read_text(const std::string& path) {
  std::ifstream in(path, std::ios::binary);
  return std::string(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
}

inline bool program_available(const std::string& name) {
  return std::system(("command -v " + name + " >/dev/null 2>&1").c_str()) == 0;
}

// Runs a shell command with its output sent to `log`; returns the exit code.
inline int run_logged(const std::string& command, const std::string& log) {
  const int status = std::system((command + " >" + log + " 2>&1").c_str());
  return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
}

}  // namespace soffit::test
