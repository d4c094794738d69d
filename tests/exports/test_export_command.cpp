// `soffit export`: the geometry file and every section's files of one
// inspection, written only inside the chosen folder under sanitised names;
// two runs give the same bytes; bad input exits 2 naming the problem.
#include <doctest/doctest.h>

#include <filesystem>
#include <nlohmann/json.hpp>
#include <sstream>
#include <string>
#include <vector>

#include "geometry/sheet/sheet_reader.hpp"
#include "storage/project_file.hpp"
#include "storage/sheet_import.hpp"
#include "tests/cli/run_command.hpp"
#include "tests/exports/geometry_json_support.hpp"

using soffit::test::ExportDir;
using soffit::test::run_soffit;
namespace fs = std::filesystem;

namespace {

std::vector<std::string> lines_of(const std::string& text) {
  std::vector<std::string> out;
  std::istringstream in(text);
  for (std::string line; std::getline(in, line);) out.push_back(line);
  return out;
}

std::string demo_args() {
  return "export " + soffit::test::demo_project_path() + " --structure " + soffit::test::kDemoRef + " --mc 100";
}

}  // namespace

TEST_CASE("soffit export writes the geometry file and each section's csv, svg and geo - the JSON validates") {
  ExportDir dir;
  const fs::path out = dir.path() / "new";
  const auto r = run_soffit(demo_args() + " --inspection 2019-05-14 --out " + out.string());
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const auto printed = lines_of(r.out);
  // FIELD.md §10.2: four sections a visit; json + 3 files each. Every section has
  // ring counts (4 rings), so every one gets its .geo.
  REQUIRE(printed.size() == 13);
  CHECK(printed[0] == (out / "BVDC-ST-0417_2019-05-14_geometry.json").string());
  CHECK(fs::exists(out / "BVDC-ST-0417_2019-05-14_S1-MW_ring-fill.geo"));
  for (const auto& p : printed) {
    CHECK(fs::path(p).parent_path() == out);
    CHECK(fs::file_size(p) > 500);
  }
  // Road level only where fill was observed at the crown: S2 has none, and says so.
  CHECK(r.err.find("span S2 section MW: road level omitted") != std::string::npos);
  const std::string s1_geo = soffit::test::read_text((out / "BVDC-ST-0417_2019-05-14_S1-MW_ring-fill.geo").string());
  CHECK(s1_geo.find("\"fill\"") != std::string::npos);
  const auto doc = nlohmann::json::parse(soffit::test::read_text(printed[0]));
  CHECK(doc["provenance"]["inspection"]["date"] == "2019-05-14");
  if (soffit::test::jsonschema_available())
    CHECK(soffit::test::validate_against_schema(printed[0], dir.file("validate.log")) == 0);
  else
    MESSAGE("schema check skipped: Debian's python3-jsonschema is not installed");
  if (soffit::test::program_available("gmsh"))
    CHECK(soffit::test::run_logged("gmsh -2 " + (out / "BVDC-ST-0417_2019-05-14_S1-MW_ring-fill.geo").string() +
                                       " -o " + dir.file("s1.msh"),
                                   dir.file("gmsh.log")) == 0);
}

TEST_CASE("soffit export: two runs give byte-identical files") {
  ExportDir a, b;
  REQUIRE(run_soffit(demo_args() + " --out " + a.path().string()).exit_code == 0);
  REQUIRE(run_soffit(demo_args() + " --out " + b.path().string()).exit_code == 0);
  int compared = 0;
  for (const auto& e : fs::directory_iterator(a.path())) {
    CAPTURE(e.path().filename().string());
    const std::string one = soffit::test::read_text(e.path().string());
    CHECK(!one.empty());
    CHECK(one == soffit::test::read_text((b.path() / e.path().filename()).string()));
    ++compared;
  }
  CHECK(compared == 13);
}

TEST_CASE("soffit export never writes outside the folder, whatever the references hold") {
  ExportDir dir;
  const std::string project = dir.file("hostile.soffit");
  {
    auto p = soffit::storage::Project::create(project, "test");
    const auto sheet = soffit::read_sheet_file(soffit::test::kDemoSheets + "sallow-ford_S1-MW_2019.csv", {});
    soffit::storage::import_sheet(p, sheet, {"../../escape/x", 1, "2019-05-14", "../MW"});
  }
  const fs::path out = dir.path() / "out";
  const auto r = run_soffit("export " + project + " --structure ../../escape/x --mc 0 --out " + out.string());
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const auto printed = lines_of(r.out);
  REQUIRE(printed.size() == 3);  // json, csv, svg: no ring count, so no .geo
  for (const auto& p : printed) CHECK(fs::path(p).parent_path() == out);
  int files = 0;
  for (const auto& e : fs::recursive_directory_iterator(dir.path())) {
    if (!e.is_regular_file()) continue;
    ++files;
    CHECK((e.path().parent_path() == out || e.path() == fs::path(project)));
  }
  CHECK(files == 4);
  CHECK_FALSE(fs::exists(dir.path().parent_path() / "escape"));
  CHECK(r.err.find("no ring thickness from the ring counts") != std::string::npos);

  // A link planted where the geometry file goes is refused, and its target untouched.
  const fs::path victim = dir.path() / "victim.txt";
  soffit::test::write_text(victim.string(), "keep");
  fs::remove(printed[0]);
  fs::create_symlink(victim, printed[0]);
  const auto again = run_soffit("export " + project + " --structure ../../escape/x --mc 0 --out " + out.string());
  CHECK(again.exit_code == 2);
  CHECK(again.err.find("symbolic link") != std::string::npos);
  CHECK(soffit::test::read_text(victim.string()) == "keep");
}

TEST_CASE("soffit export: bad input exits 2 and names the problem") {
  ExportDir dir;
  const std::string out = " --out " + dir.path().string();
  auto r = run_soffit("export " + dir.file("missing.soffit") + " --structure X" + out);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("missing.soffit") != std::string::npos);
  r = run_soffit(demo_args() + " --structure NOPE" + out);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("NOPE") != std::string::npos);
  r = run_soffit(demo_args() + " --inspection 2020-01-01" + out);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("2020-01-01") != std::string::npos);
  r = run_soffit(demo_args() + " --format json,dxf" + out);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("'dxf'") != std::string::npos);
  r = run_soffit(demo_args());
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("--out") != std::string::npos);
  CHECK(fs::is_empty(dir.path()));
}
