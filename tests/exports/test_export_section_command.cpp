// `soffit export-section`: fits a sheet like `soffit fit`, writes the section's
// files into a folder, prints their paths; bad input exits 2 naming file, line
// and field (dispatch.hpp exit codes). Two runs give byte-identical files.
#include <doctest/doctest.h>

#include <filesystem>
#include <sstream>
#include <string>
#include <vector>

#include "tests/cli/run_command.hpp"
#include "tests/exports/export_test_support.hpp"

using soffit::test::ExportDir;
using soffit::test::run_soffit;
namespace fs = std::filesystem;

namespace {

const std::string kSheet = soffit::test::kDemoSheets + "sallow-ford_S1-MW_2019.csv";
// FIELD.md §10.3: d best 0.465 m; road RL 12.052 over the S1 crown, springing RL 9.500.
const std::string kModel = " --ring-mm 465 --road-z 2.552";

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> out;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) out.push_back(line);
  return out;
}

}  // namespace

TEST_CASE("soffit export-section writes csv, svg and geo into a new folder and prints their paths") {
  ExportDir dir;
  const fs::path out = dir.path() / "new" / "folder";
  const auto r = run_soffit("export-section " + kSheet + " --out " + out.string() + kModel + " --seed 3 --mc 200");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const auto printed = lines_of(r.out);
  REQUIRE(printed.size() == 3);
  CHECK(printed[0] == (out / "sallow-ford_S1-MW_2019_points.csv").string());
  CHECK(printed[1] == (out / "sallow-ford_S1-MW_2019_elevation.svg").string());
  CHECK(printed[2] == (out / "sallow-ford_S1-MW_2019_ring-fill.geo").string());
  for (const auto& p : printed) CHECK(fs::file_size(p) > 1000);
  CHECK(soffit::test::read_text(printed[0]).find("# program: soffit ") != std::string::npos);
}

TEST_CASE("soffit export-section: two runs give byte-identical files") {
  ExportDir a, b;
  const std::string args = "export-section " + kSheet + kModel + " --mc 200 --seed 5 --shape auto --out ";
  REQUIRE(run_soffit(args + a.path().string()).exit_code == 0);
  REQUIRE(run_soffit(args + b.path().string()).exit_code == 0);
  int compared = 0;
  for (const auto& e : fs::directory_iterator(a.path())) {
    CAPTURE(e.path().filename().string());
    const std::string one = soffit::test::read_text(e.path().string());
    const std::string two = soffit::test::read_text((b.path() / e.path().filename()).string());
    CHECK(!one.empty());
    CHECK(one == two);
    ++compared;
  }
  CHECK(compared == 3);
}

TEST_CASE("soffit export-section: --format chooses the files - geo is added only with a ring thickness") {
  ExportDir dir;
  auto r = run_soffit("export-section " + kSheet + " --mc 0 --format svg --out " + dir.path().string());
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  CHECK(lines_of(r.out).size() == 1);
  r = run_soffit("export-section " + kSheet + " --mc 0 --out " + dir.path().string());
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  CHECK(lines_of(r.out).size() == 2);  // csv, svg
}

TEST_CASE("soffit export-section: bad input exits 2 and names the file, line, field or option") {
  ExportDir dir;
  const std::string out = " --out " + dir.path().string();
  auto r = run_soffit("export-section " + dir.file("missing.csv") + out);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("missing.csv") != std::string::npos);

  const std::string bad = dir.file("bad.csv");
  soffit::test::write_text(bad, "soffit-sheet,1\nmethod,offsets\ndatum_rl_m,9.800\nz_origin_rl_m,9.500\nreadings\n"
                                "station_m,offset_mm\n0,-300\n0.4,16O\n0.8,493\n");
  r = run_soffit("export-section " + bad + out);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("bad.csv:8: field 'offset_mm'") != std::string::npos);

  r = run_soffit("export-section " + kSheet + out + " --format pdf");
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("'pdf' is not a section format") != std::string::npos);
  r = run_soffit("export-section " + kSheet + out + " --format geo");
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("give --ring-mm") != std::string::npos);
  r = run_soffit("export-section " + kSheet + out + " --mc 0 --ring-mm 465 --road-z 1.9");
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("--road-z: road level z = 1.900 m is not above the top of the extrados") != std::string::npos);
  r = run_soffit("export-section " + kSheet + out + " --ring-mm -3");
  CHECK(r.exit_code == 2);
  r = run_soffit("export-section " + kSheet);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("--out DIR is required") != std::string::npos);
  CHECK(fs::is_empty(dir.path()) == false);  // bad.csv only: nothing was exported
  int exported = 0;
  for (const auto& e : fs::directory_iterator(dir.path())) exported += e.path().filename() != "bad.csv";
  CHECK(exported == 0);
}
