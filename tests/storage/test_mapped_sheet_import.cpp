// Survey-sheet import with column mapping for spreadsheet exports (issue 3:
// "column mapping for spreadsheet exports, unit detection and line-numbered
// errors"). The export below holds the invented S1 mid-width 2019 section of
// FIELD.md §10.2 as a spreadsheet writes it: a title line, quoted headers of
// its own, an extra column, trailing empty cells, CRLF line ends and an empty
// last row. Reference: the same section as a Soffit sheet
// (assets/sheets/sallow-ford_S1-MW_2019.csv) and the offsets reduction of
// SHEET_FORMAT.md, z = (datum_rl − z_origin_rl) + offset.
#include <doctest/doctest.h>

#include <cmath>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/column_mapping.hpp"
#include "geometry/sheet/mapped_sheet_reader.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "storage/project_file.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_export.hpp"
#include "storage/sheet_import.hpp"
#include "tests/cli/run_command.hpp"
#include "tests/storage/temp_project_dir.hpp"

using soffit::ColumnMapping;
using soffit::InputError;
using soffit::test::TempDir;

namespace {

const std::string kSheets = std::string(SOFFIT_ASSETS) + "/sheets/";

// Line 1 title, line 2 header, lines 3–13 the stations, line 14 empty cells only.
std::string level_book_export(const std::string& offset_cell_line7 = "1216") {
  return "\"Sallow Ford survey export\",,,,,,\r\n"
         "\"Stn\",\"Chainage (m)\",\"Offset mm\",\"Surface\",\"Remarks\",\"Easting\",,\r\n"
         "1,0.000,-300,brick,W springing,412003.1,,\r\n"
         "2,0.400,160,brick,,412003.5,,\r\n"
         "3,0.800,493,brick,,412003.9,,\r\n"
         "4,1.600,968,brick,,412004.7,,\r\n"
         "5,2.400," + offset_cell_line7 + ",brick,,412005.5,,\r\n"
         "6,3.200,1302,brick,crown,412006.3,,\r\n"
         "7,4.000,1217,brick,,412007.1,,\r\n"
         "8,4.800,957,brick,,412007.9,,\r\n"
         "9,5.600,492,brick,,412008.7,,\r\n"
         "10,6.000,154,brick,,412009.1,,\r\n"
         "11,6.400,-300,brick,E springing,412009.5,,\r\n"
         ",,,,,,,\r\n";
}

ColumnMapping level_book_mapping() {
  ColumnMapping m;
  soffit::add_column_map_spec(m, "id=Stn,station_m=Chainage (m),offset_mm=Offset mm,surface=Surface,note=Remarks",
                              "--map");
  m.set("method", "offsets", "--method");
  m.set("datum_rl_m", "9.800", "--datum-rl-m");
  m.set("z_origin_rl_m", "9.500", "--z-origin-rl-m");
  m.set("sigma_mm", "3", "--sigma-mm");
  return m;
}

std::string error_of(const std::string& text, const ColumnMapping& m) {
  try {
    soffit::parse_mapped_sheet(text, "level_book.csv", m, {});
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("a spreadsheet export read through a mapping gives the readings of the same Soffit sheet") {
  const auto mapped = soffit::parse_mapped_sheet(level_book_export(), "level_book.csv", level_book_mapping(), {});
  const auto sheet = soffit::read_sheet_file(kSheets + "sallow-ford_S1-MW_2019.csv", {});
  REQUIRE(mapped.readings.size() == 11);
  REQUIRE(sheet.readings.size() == mapped.readings.size());
  for (size_t i = 0; i < sheet.readings.size(); ++i) {
    CAPTURE(i);
    // Same cells and same reduction: the same doubles.
    CHECK(mapped.readings[i].x == sheet.readings[i].x);
    CHECK(mapped.readings[i].z == sheet.readings[i].z);
    CHECK(mapped.readings[i].sigma == sheet.readings[i].sigma);
    CHECK(mapped.readings[i].note == sheet.readings[i].note);
    // Each reading points at its line in the export (station k on line k + 2).
    CHECK(mapped.readings[i].source_line == static_cast<int>(i) + 3);
  }
  // Crown, station 6: z = (9.800 − 9.500) + 1.302 = 1.602 m (SHEET_FORMAT.md reduction, FIELD.md §10.2).
  CHECK(std::abs(mapped.readings[5].x - 3.200) < 1e-12);
  CHECK(std::abs(mapped.readings[5].z - 1.602) < 1e-12);
  CHECK(std::abs(mapped.readings[5].sigma - 0.003) < 1e-15);
  // The title line and the unmapped Easting column are named in warnings, not silently lost.
  bool title_warned = false, easting_warned = false;
  for (const auto& w : mapped.warnings) {
    title_warned = title_warned || contains(w, "level_book.csv:1: above the header line");
    easting_warned = easting_warned || (contains(w, "level_book.csv:2:") && contains(w, "'Easting'"));
  }
  CHECK(title_warned);
  CHECK(easting_warned);
}

TEST_CASE("errors in a mapped export name the export's own line and column") {
  const std::string e = error_of(level_book_export("abc"), level_book_mapping());
  CHECK(contains(e, "level_book.csv:7: field 'Offset mm': (mapped as offset_mm)"));

  // A required mapped cell left empty, on line 7 of the export.
  CHECK(contains(error_of(level_book_export(""), level_book_mapping()), "level_book.csv:7: field 'Offset mm'"));

  // A header that lacks a mapped column: the header line is named with what it has.
  ColumnMapping misspelt;
  soffit::add_column_map_spec(misspelt, "station_m=Chainage,offset_mm=Offset mm", "--map");
  misspelt.set("method", "offsets", "--method");
  const std::string h = error_of(level_book_export(), misspelt);
  CHECK(contains(h, "level_book.csv:2: field 'Chainage'"));
  CHECK(contains(h, "'Chainage (m)'"));

  // A setting with a decimal comma names the option that gave it, not a line of the export.
  ColumnMapping comma = level_book_mapping();
  comma.set("datum_rl_m", "9,800", "--datum-rl-m");
  CHECK(contains(error_of(level_book_export(), comma), "--datum-rl-m: field 'datum_rl_m'"));

  ColumnMapping no_method;
  soffit::add_column_map_spec(no_method, "station_m=Chainage (m),offset_mm=Offset mm", "--map");
  CHECK(contains(error_of(level_book_export(), no_method), "field 'method'"));
}

TEST_CASE("millimetres mapped as metres and metres mapped as millimetres are caught with line and column") {
  // Offsets booked in mm mapped as offset_m would run from −300 m to 1302 m: beyond any arch
  // (the 100 m limit of SHEET_FORMAT.md "Checks that stop the reading").
  ColumnMapping as_metres;
  soffit::add_column_map_spec(as_metres, "id=Stn,station_m=Chainage (m),offset_m=Offset mm", "--map");
  as_metres.set("method", "offsets", "--method");
  const std::string e = error_of(level_book_export(), as_metres);
  // Line 8 holds the largest value, 1302 (the crown).
  CHECK(contains(e, "level_book.csv:8: field 'Offset mm'"));
  CHECK(contains(e, "millimetres in a metres column"));
  CHECK(contains(e, "offset_mm=Offset mm"));

  // A second export booked in metres, mapped as millimetres: every value below 5 with decimals.
  const std::string metres_export =
      "Chainage (m),Offset (m)\r\n0.000,-0.300\r\n0.800,0.493\r\n1.600,0.968\r\n3.200,1.302\r\n"
      "4.800,0.957\r\n6.400,-0.300\r\n";
  ColumnMapping as_mm;
  soffit::add_column_map_spec(as_mm, "station_m=Chainage (m),offset_mm=Offset (m)", "--map");
  as_mm.set("method", "offsets", "--method");
  const std::string m = error_of(metres_export, as_mm);
  CHECK(contains(m, "level_book.csv:2: field 'Offset (m)'"));
  CHECK(contains(m, "metres in a millimetres column"));
  CHECK(contains(m, "offset_m=Offset (m)"));
}

TEST_CASE("a mapping file gives columns and settings - its own mistakes name its line") {
  const ColumnMapping m = soffit::parse_column_map(
      "soffit-map,1\r\n# level book of the laser level\r\ncolumn,id,Stn\r\ncolumn,station_m,Chainage (m)\r\n"
      "column,offset_mm,Offset mm\r\nmethod,offsets\r\ndatum_rl_m,9.800\r\nz_origin_rl_m,9.500\r\nsigma_mm,3\r\n",
      "laser.map");
  REQUIRE(m.columns.size() == 3);
  CHECK(m.columns[1].source == "Chainage (m)");
  CHECK(m.columns[1].origin_line == 4);
  const auto sheet = soffit::parse_mapped_sheet(level_book_export(), "level_book.csv", m, {});
  REQUIRE(sheet.readings.size() == 11);
  CHECK(std::abs(sheet.readings[5].z - 1.602) < 1e-12);  // as above (SHEET_FORMAT.md reduction)

  auto map_error = [](const std::string& text) {
    try {
      soffit::parse_column_map(text, "laser.map");
    } catch (const InputError& e) {
      return std::string(e.what());
    }
    return std::string();
  };
  CHECK(contains(map_error("method,offsets\n"), "laser.map:1:"));
  CHECK(contains(map_error("soffit-map,1\ncolumn,station_m\n"), "laser.map:2: field 'column'"));
  CHECK(contains(map_error("soffit-map,1\ncolumn,station_m,A\ncolumn,station_m,B\n"), "laser.map:3: field 'station_m'"));
  CHECK(contains(map_error("soffit-map,1\nmethod,offsets\nmethod,polar\n"), "laser.map:3: field 'method'"));

  // A setting of the mapping file that the sheet reader refuses names the mapping file's line.
  ColumnMapping bad = m;
  bad.set("datum_rl_m", "high", "laser.map", 7);
  CHECK(contains(error_of(level_book_export(), bad), "laser.map:7: field 'datum_rl_m'"));
}

TEST_CASE("a mapped export stored in a project exports as a Soffit sheet that reads back the same") {
  TempDir dir;
  auto project = soffit::storage::Project::create(dir.file("mapped.soffit"), "test");
  const auto mapped = soffit::parse_mapped_sheet(level_book_export(), "level_book.csv", level_book_mapping(), {});
  const auto r = soffit::storage::import_sheet(project, mapped, {"BVDC-ST-0417", 1, "2019-05-14", "MW"});
  CHECK(r.reading_count == 11);
  const std::string text = soffit::storage::export_section_sheet(project.db(), r.section_id);
  const auto again = soffit::parse_sheet(text, "exported.csv", {});
  REQUIRE(again.readings.size() == mapped.readings.size());
  for (size_t i = 0; i < again.readings.size(); ++i) {
    CAPTURE(i);
    CHECK(again.readings[i].x == mapped.readings[i].x);
    CHECK(again.readings[i].z == mapped.readings[i].z);
    CHECK(again.readings[i].sigma == mapped.readings[i].sigma);
    CHECK(again.readings[i].note == mapped.readings[i].note);
  }
  // The export speaks Soffit: the mapped columns under their Soffit names, the settings as metadata.
  CHECK(contains(text, "id,station_m,offset_mm,surface,note\n"));
  CHECK(contains(text, "datum_rl_m,9.800\n"));
  // Stored readings still point at the spreadsheet's lines.
  const auto stored = soffit::storage::load_section_sheet(project.db(), r.section_id);
  CHECK(stored.readings.front().source_line == 3);
}

TEST_CASE("soffit import --map reads a spreadsheet export - bad input exits 2 naming file, line and column") {
  TempDir dir;
  const std::string project = dir.file("cli_mapped.soffit");
  const std::string csv = dir.file("level_book.csv");
  soffit::test::write_bytes(csv, level_book_export());
  const std::string map = " --map \"id=Stn,station_m=Chainage (m),offset_mm=Offset mm,note=Remarks\"";
  auto r = soffit::test::run_soffit("import " + project + " " + csv + " --structure BVDC-ST-0417 --date 2019-05-14"
                                    " --section MW" + map +
                                    " --method offsets --datum-rl-m 9.800 --z-origin-rl-m 9.500 --sigma-mm 3");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  CHECK(contains(r.out, "imported 11 readings"));
  CHECK(contains(r.err, "'Easting'"));  // the unmapped column is reported

  const std::string map_file = dir.file("laser.map");
  soffit::test::write_bytes(map_file, "soffit-map,1\ncolumn,station_m,Chainage (m)\ncolumn,offset_mm,Offset mm\n"
                                      "method,offsets\ndatum_rl_m,9.800\nz_origin_rl_m,9.500\n");
  r = soffit::test::run_soffit("import " + project + " " + csv + " --structure BVDC-ST-0417 --date 2019-05-14"
                               " --section US --map-file " + map_file + " --set position_m=0.25");
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);

  const std::string bad = dir.file("bad_book.csv");
  soffit::test::write_bytes(bad, level_book_export("12 mm"));
  r = soffit::test::run_soffit("import " + project + " " + bad + " --structure BVDC-ST-0417 --date 2019-05-14"
                               " --section DS" + map + " --method offsets --datum-rl-m 9.800");
  CHECK(r.exit_code == 2);
  CHECK(contains(r.err, bad + ":7: field 'Offset mm'"));

  // Settings without a mapping are refused: a Soffit sheet states them itself.
  r = soffit::test::run_soffit("import " + project + " " + kSheets + "sallow-ford_S1-MW_2019.csv --structure X"
                               " --datum-rl-m 9.8");
  CHECK(r.exit_code == 2);
  CHECK(contains(r.err, "--datum-rl-m is for a spreadsheet export"));

  r = soffit::test::run_soffit("import " + project + " " + csv + " --structure BVDC-ST-0417 --date 2019-05-14"
                               " --section DS --map \"station_m\" --method offsets");
  CHECK(r.exit_code == 2);
  CHECK(contains(r.err, "--map: field 'station_m'"));
}
