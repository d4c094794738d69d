// `soffit import`, `list`, `show` (issue 3 "Command line"): the contract is
// the exit code (0 ok, 2 bad input; dispatch.hpp) and the JSON keys.
#include <doctest/doctest.h>

#include <nlohmann/json.hpp>

#include "tests/cli/run_command.hpp"
#include "tests/storage/temp_project_dir.hpp"

using nlohmann::json;
using soffit::test::run_soffit;

namespace {
const std::string kSheets = std::string(SOFFIT_ASSETS) + "/sheets/";
}

TEST_CASE("soffit import, list and show build and report a project") {
  soffit::test::TempDir dir;
  const std::string project = dir.file("cli.soffit");
  auto r = run_soffit("import " + project + " " + kSheets + "sallow-ford_S1-MW_2019.csv --structure BVDC-ST-0417");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  CHECK(r.out.find("imported 11 readings") != std::string::npos);
  r = run_soffit("import " + project + " " + kSheets + "sallow-ford_S2-MW_2025.csv --structure BVDC-ST-0417 --span 2");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);

  r = run_soffit("list " + project + " --json");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const json list = json::parse(r.out);
  REQUIRE(list.at("structures").size() == 1);
  CHECK(list["structures"][0]["ref"] == "BVDC-ST-0417");
  CHECK(list["structures"][0]["spans"] == 2);
  CHECK(list["structures"][0]["inspections"] == 2);  // 2019 and 2025 visits (FIELD.md §10.1)

  r = run_soffit("show " + project + " BVDC-ST-0417 --json");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const json show = json::parse(r.out);
  CHECK(show["name"] == "Sallow Ford Bridge");
  REQUIRE(show["inspections"].size() == 2);
  CHECK(show["inspections"][0]["date"] == "2019-05-14");
  CHECK(show["inspections"][0]["sections"][0]["readings"] == 11);
  CHECK(show["inspections"][1]["sections"][0]["span"] == "S2");
  // Viewing leaves no -wal behind to be taken for a crash next time.
  CHECK_FALSE(std::filesystem::exists(project + "-wal"));
}

TEST_CASE("soffit import names the file, line and field of a bad sheet and exits 2") {
  soffit::test::TempDir dir;
  const std::string project = dir.file("bad.soffit");
  const std::string sheet = dir.file("bad_sheet.csv");
  soffit::test::write_bytes(sheet,
                            "soffit-sheet,1\nmethod,offsets\ndatum_rl_m,9.800\nreadings\nid,station_m,offset_mm\n"
                            "1,0.000,-300\n2,0.400,abc\n3,0.800,493\n");
  const auto r = run_soffit("import " + project + " " + sheet + " --structure X --date 2019-05-14 --section MW");
  CHECK(r.exit_code == 2);
  CHECK(r.err.find(sheet + ":7") != std::string::npos);
  CHECK(r.err.find("offset_mm") != std::string::npos);
  CHECK_FALSE(std::filesystem::exists(project));  // nothing is created for a refused sheet
}

TEST_CASE("soffit import refuses a bad date, a missing structure and a foreign file with exit 2") {
  soffit::test::TempDir dir;
  const std::string sheet = kSheets + "sallow-ford_S1-MW_2019.csv";
  auto r = run_soffit("import " + dir.file("p.soffit") + " " + sheet + " --structure X --date 14/05/2019");
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("--date must be YYYY-MM-DD") != std::string::npos);
  r = run_soffit("import " + dir.file("p.soffit") + " " + sheet);
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("--structure") != std::string::npos);
  const std::string text = dir.file("notes.txt");
  soffit::test::write_bytes(text, "not a project\n");
  r = run_soffit("import " + text + " " + sheet + " --structure X");
  CHECK(r.exit_code == 2);
  CHECK(r.err.find("not a Soffit project file") != std::string::npos);
  CHECK(soffit::test::read_bytes(text) == "not a project\n");
  r = run_soffit("show " + dir.file("absent.soffit") + " X");
  CHECK(r.exit_code == 2);
}
