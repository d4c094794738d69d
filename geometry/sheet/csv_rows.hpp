#pragma once
// Splits CSV text into rows the way spreadsheets export them.
//
// Spreadsheets add a UTF-8 byte-order mark, CRLF line ends, trailing empty
// cells and quotes around cells with commas; all of these are accepted here so
// that the sheet parsers only ever see clean cells.
#include <string>
#include <string_view>
#include <vector>

namespace soffit {

struct CsvRow {
  int line = 0;                    // 1-based line number in the file
  std::vector<std::string> cells;  // trimmed, unquoted, trailing empty cells dropped
  bool comment = false;            // first cell starts with '#'
  std::string text;                // the raw line (without line end), kept for comments
};

// Blank rows (no cell with content) are dropped. Throws InputError on a quote
// that is opened but not closed on its line.
std::vector<CsvRow> split_csv_rows(std::string_view text, const std::string& file);

// Lower-case ASCII copy, for case-insensitive keys and column names.
std::string ascii_lower(std::string_view s);

}  // namespace soffit
