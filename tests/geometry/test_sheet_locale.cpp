// The reader ignores the C locale: inspectors run comma-decimal locales
// (nlohmann/json tests the same under de_DE, see STYLE.md item 6).
#include <doctest/doctest.h>

#include <clocale>
#include <string>

#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

namespace {

const char* kSheet =
    "soffit-sheet,1\n"
    "method,offsets\n"
    "datum_rl_m,9.800\n"
    "z_origin_rl_m,9.500\n"
    "line_sag_mm,2.5\n"
    "readings\n"
    "station_m,offset_mm,sigma_mm\n"
    "0.000,-300,2.5\n"
    "1.600,968.5,2.5\n"
    "3.200,1302,2.5\n"
    "4.800,957,2.5\n";

}  // namespace

TEST_CASE("sheet locale: a comma-decimal locale gives identical numbers") {
  const SurveySheet in_c = parse_sheet(kSheet, "l.csv", {});
  const char* names[] = {"de_DE.UTF-8", "de_DE.utf8", "de_DE", "fr_FR.UTF-8", "fr_FR.utf8"};
  const char* used = nullptr;
  for (const char* n : names) {
    if (std::setlocale(LC_ALL, n)) {
      used = n;
      break;
    }
  }
  if (!used) {
    MESSAGE("no comma-decimal locale installed (tried de_DE, fr_FR): locale check skipped");
    return;
  }
  const std::string point = std::localeconv()->decimal_point;
  const SurveySheet in_de = parse_sheet(kSheet, "l.csv", {});
  std::setlocale(LC_ALL, "C");
  CHECK(point == ",");  // otherwise the locale proves nothing
  REQUIRE(in_de.readings.size() == in_c.readings.size());
  for (size_t i = 0; i < in_c.readings.size(); ++i) {
    CHECK(in_de.readings[i].x == in_c.readings[i].x);  // bit-identical
    CHECK(in_de.readings[i].z == in_c.readings[i].z);
    CHECK(in_de.readings[i].sigma == in_c.readings[i].sigma);
  }
  CHECK(in_de.warnings == in_c.warnings);
}
