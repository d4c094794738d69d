// The points CSV of one section (issue 5 "Points CSV per section"): every reading
// with its σ, flags and residual, read back to the printed digit, locale-proof.
#include <doctest/doctest.h>

#include <charconv>
#include <clocale>
#include <cmath>
#include <string>
#include <vector>

#include "exports/section_points_csv.hpp"
#include "tests/exports/export_test_support.hpp"

using namespace soffit;
using soffit::test::fitted_demo;
using soffit::test::fitted_text;

namespace {

// RFC 4180 records (LF line ends, '#' preamble lines skipped): a deliberately
// separate reader, so the writer is checked against the format, not itself.
std::vector<std::vector<std::string>> parse_csv(const std::string& text, std::vector<std::string>& comments) {
  std::vector<std::vector<std::string>> rows;
  size_t i = 0;
  while (i < text.size()) {
    if (text[i] == '#') {
      const size_t end = text.find('\n', i);
      comments.push_back(text.substr(i, end - i));
      i = end + 1;
      continue;
    }
    std::vector<std::string> row(1);
    bool quoted = false;
    for (; i < text.size(); ++i) {
      const char c = text[i];
      if (quoted) {
        if (c == '"' && i + 1 < text.size() && text[i + 1] == '"') row.back() += '"', ++i;
        else if (c == '"') quoted = false;
        else row.back() += c;
      } else if (c == '"') {
        quoted = true;
      } else if (c == ',') {
        row.emplace_back();
      } else if (c == '\n') {
        ++i;
        break;
      } else {
        row.back() += c;
      }
    }
    rows.push_back(row);
  }
  return rows;
}

double number(const std::string& text) {
  double v = NAN;
  const auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), v);
  CAPTURE(text);
  REQUIRE((ec == std::errc() && end == text.data() + text.size()));
  return v;
}

int decimals(const std::string& text) {
  const size_t dot = text.find('.');
  return dot == std::string::npos ? 0 : static_cast<int>(text.size() - dot - 1);
}

// The printed value equals `exact` to its last printed digit (half a unit of it).
void check_printed(const std::string& text, double exact, int expected_decimals) {
  CAPTURE(text);
  CAPTURE(exact);
  CHECK(decimals(text) == expected_decimals);
  CHECK(std::abs(number(text) - exact) <= 0.5 * std::pow(10.0, -expected_decimals) + 1e-12);
}

}  // namespace

TEST_CASE("section points CSV: reads back to the printed digit, every reading in sheet order") {
  const auto s = fitted_demo();
  const std::string csv = section_points_csv(s.sheet, s.analysis, "soffit test");
  std::vector<std::string> comments;
  const auto rows = parse_csv(csv, comments);
  REQUIRE(rows.size() == s.sheet.readings.size() + 1);
  CHECK(rows[0] == parse_csv(std::string(kSectionPointsHeader) + "\n", comments)[0]);
  const ShapeFit& fit = *s.analysis.fit;
  for (size_t i = 0; i < s.sheet.readings.size(); ++i) {
    const auto& row = rows[i + 1];
    REQUIRE(row.size() == 10);
    const Reading& r = s.sheet.readings[i];
    check_printed(row[0], r.x, 4);
    check_printed(row[1], r.z, 4);
    check_printed(row[2], fit.sigmas[i] * 1000.0, 2);
    CHECK(row[3] == (fit.used[i] ? "1" : "0"));
    CHECK(row[4].empty());
    CHECK(row[5] == "0");
    check_printed(row[6], fit.residuals[i] * 1000.0, 2);
    check_printed(row[7], fit.weights[i], 4);
    CHECK(row[8] == std::to_string(r.source_line));
  }
  // FIELD.md §10.2: the sheet is the 2019 S1 mid-width table, offsets + 0.300 m, so
  // x = 3.2 reads z = 1.302 + 0.300 = 1.602 m; the circle-fit residuals are −5.1 mm
  // at x = 0.8 and −5.1 / −3.3 mm at x = 4.8 / 5.6 (oracle given to 0.1 mm).
  CHECK(std::abs(number(rows[6][1]) - 1.602) < 1e-9);
  CHECK(std::abs(number(rows[3][6]) - -5.1) < 0.15);
  CHECK(std::abs(number(rows[8][6]) - -5.1) < 0.15);
  CHECK(std::abs(number(rows[9][6]) - -3.3) < 0.15);
}

TEST_CASE("section points CSV: the preamble names the source, shape, program and the caution") {
  const auto s = fitted_demo();
  const std::string csv = section_points_csv(s.sheet, s.analysis, "soffit 9.9.9");
  std::vector<std::string> comments;
  parse_csv(csv, comments);
  std::string preamble;
  for (const auto& c : comments) preamble += c + "\n";
  CHECK(preamble.find("# source: " + soffit::test::kDemoSheets + "sallow-ford_S1-MW_2019.csv\n") != std::string::npos);
  CHECK(preamble.find("# shape: segmental") != std::string::npos);
  CHECK(preamble.find("# program: soffit 9.9.9\n") != std::string::npos);
  CHECK(preamble.find("not a structural assessment") != std::string::npos);
  CHECK(preamble.find("BVDC-ST-0417") != std::string::npos);
}

TEST_CASE("section points CSV: excluded and check readings stay, flagged, with quoted reasons") {
  const std::string sheet =
      "soffit-sheet,1\nmethod,offsets\ndatum_rl_m,9.800\nz_origin_rl_m,9.500\nsigma_mm,3\nreadings\n"
      "id,station_m,offset_mm,check,exclude,note\n"
      "1,0.000,-300,,,\n2,0.400,160,,,\n3,0.800,493,,,\n4,1.600,968,,,\n"
      "5,2.400,1216,,\"hit a protruding brick, \"\"header\"\"\",\n"  // line 12
      "6,3.200,1302,,,crown\n7,4.000,1217,,,\n8,4.800,957,,,\n9,5.600,492,,,\n10,6.000,154,,,\n"
      "11,6.400,-300,,,\n12,0.000,-301,yes,,closing check\n";
  const auto s = fitted_text(sheet, "flags.csv");
  std::vector<std::string> comments;
  const auto rows = parse_csv(section_points_csv(s.sheet, s.analysis, "t"), comments);
  REQUIRE(rows.size() == 13);
  CHECK(rows[5][3] == "0");
  CHECK(rows[5][4] == "hit a protruding brick, \"header\"");
  CHECK(rows[5][8] == "12");
  CHECK(rows[5][7] == "0.0000");  // not used: weight 0 (profile_fit.hpp)
  CHECK(rows[12][3] == "0");
  CHECK(rows[12][5] == "1");
  CHECK(rows[12][9] == "closing check");
}

TEST_CASE("section points CSV: the same bytes under a comma-decimal locale") {
  const auto s = fitted_demo();
  const std::string in_c = section_points_csv(s.sheet, s.analysis, "t");
  CHECK(in_c == section_points_csv(s.sheet, s.analysis, "t"));  // deterministic
  const std::string previous = std::setlocale(LC_ALL, nullptr);
  if (!std::setlocale(LC_ALL, "de_DE.UTF-8")) {
    MESSAGE("de_DE.UTF-8 is not installed (.ci/install-deps makes it): locale check skipped");
    return;
  }
  const std::string in_german = section_points_csv(s.sheet, s.analysis, "t");
  std::setlocale(LC_ALL, previous.c_str());
  CHECK(in_german == in_c);
}
