// Spreadsheet exports and locale-proof numbers (geometry/sheet/csv_rows, sheet_number).
#include <doctest/doctest.h>

#include <cmath>
#include <string>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/csv_rows.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/sheet_reader.hpp"

using namespace soffit;

TEST_CASE("sheet csv: BOM, CRLF, quotes and trailing empty cells are accepted") {
  // A spreadsheet "CSV UTF-8" export: byte-order mark, CRLF, trailing commas,
  // a quoted cell holding a comma and a doubled quote.
  const std::string text =
      "\xEF\xBB\xBF" "a,b,,\r\n"
      "\"x, y\",\"say \"\"hi\"\"\",,\r\n"
      ",,,\r\n"
      "  # a comment, with \"stray quote\r\n"
      " 3 , 4 \r\n";
  const auto rows = split_csv_rows(text, "t.csv");
  REQUIRE(rows.size() == 4);  // the blank row is dropped
  CHECK(rows[0].line == 1);
  CHECK(rows[0].cells == std::vector<std::string>{"a", "b"});
  CHECK(rows[1].cells == std::vector<std::string>{"x, y", "say \"hi\""});
  CHECK(rows[2].comment);
  CHECK(rows[2].line == 4);
  CHECK(rows[3].cells == std::vector<std::string>{"3", "4"});
  CHECK(rows[3].line == 5);
}

TEST_CASE("sheet csv: an unclosed quote names its line") {
  try {
    split_csv_rows("a,b\n\"open,1\n", "q.csv");
    FAIL("no error");
  } catch (const InputError& e) {
    CHECK(e.file() == "q.csv");
    CHECK(e.line() == 2);
  }
}

TEST_CASE("sheet numbers: from_chars reads the whole cell, finite values only") {
  CHECK(try_parse_number("9.800") == 9.8);
  CHECK(try_parse_number("+1302") == 1302.0);
  CHECK(try_parse_number("-0.300") == -0.3);
  CHECK(try_parse_number("1e3") == 1000.0);
  CHECK(try_parse_number(" 2.5 ") == 2.5);
  // strtod would accept these; a survey sheet must not.
  CHECK_FALSE(try_parse_number("nan"));
  CHECK_FALSE(try_parse_number("NaN"));
  CHECK_FALSE(try_parse_number("inf"));
  CHECK_FALSE(try_parse_number("-Infinity"));
  CHECK_FALSE(try_parse_number("1,5"));
  CHECK_FALSE(try_parse_number("12 mm"));
  CHECK_FALSE(try_parse_number(""));
  CHECK_FALSE(try_parse_number("++1"));
  CHECK_FALSE(try_parse_number("0x10"));
}

TEST_CASE("sheet numbers: parse_number explains what is wrong") {
  CHECK_THROWS_WITH_AS(parse_number("1,5", "f.csv", 7, "z"),
                       "f.csv:7: field 'z': '1,5' is not a number: use a point as the decimal "
                       "separator (for example 1.5, not 1,5)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_number("", "f.csv", 7, "z"),
                       "f.csv:7: field 'z': the cell is empty; a number is needed here",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_number("abc", "f.csv", 8, "x"), "f.csv:8: field 'x': 'abc' is not a number",
                       InputError);
}

TEST_CASE("sheet numbers: fixed formatting has a point and no negative zero") {
  CHECK(format_fixed(1.5, 3) == "1.500");
  CHECK(format_fixed(-0.0001, 1) == "0.0");
  CHECK(format_fixed(-0.3, 3) == "-0.300");
}

TEST_CASE("sheet csv: a spreadsheet re-export of a survey sheet reads the same") {
  // The S1 MW 2019 example as a spreadsheet would save it: UTF-8 BOM, CRLF,
  // every cell quoted, three trailing empty cells on every line.
  const std::string clean =
      "soffit-sheet,1\nmethod,offsets\ndatum_rl_m,9.800\nz_origin_rl_m,9.500\nnote,\"a, b\"\n"
      "readings\nid,station_m,offset_mm\n1,0.000,-300\n2,0.400,160\n3,0.800,493\n";
  std::string messy = "\xEF\xBB\xBF";
  std::string cell;
  bool in_quotes = false;
  for (char c : clean) {  // re-quote every cell (the note cell already holds quotes)
    if (c == '"') {
      in_quotes = !in_quotes;
      continue;
    }
    if ((c == ',' && !in_quotes) || c == '\n') {
      messy += "\"" + cell + "\"";
      cell.clear();
      messy += c == ',' ? "," : ",,,\r\n";
      continue;
    }
    cell += c;
  }
  const SurveySheet a = parse_sheet(clean, "a.csv", {});
  const SurveySheet b = parse_sheet(messy, "b.csv", {});
  REQUIRE(a.readings.size() == 3);
  REQUIRE(b.readings.size() == 3);
  for (size_t i = 0; i < 3; ++i) {
    CHECK(a.readings[i].x == b.readings[i].x);
    CHECK(a.readings[i].z == b.readings[i].z);
    CHECK(a.raw_rows[i].cells == b.raw_rows[i].cells);
  }
  CHECK(b.metadata.note == "a, b");
  CHECK(b.warnings.empty());
  CHECK(std::abs(b.readings[2].z - 0.793) < 1e-12);  // 9.800 − 9.500 + 0.493
}
