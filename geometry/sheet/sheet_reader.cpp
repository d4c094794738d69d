#include "geometry/sheet/sheet_reader.hpp"

#include <fstream>
#include <sstream>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/csv_rows.hpp"
#include "geometry/sheet/sheet_forms.hpp"

namespace soffit {

SurveySheet read_sheet_file(const std::string& path, const SheetOptions& opts) {
  std::ifstream in(path, std::ios::binary);
  if (!in) {
    throw InputError(path, 0, "", "the file cannot be opened (check the name and that it exists)");
  }
  std::ostringstream text;
  text << in.rdbuf();
  if (in.bad()) throw InputError(path, 0, "", "the file could not be read to the end");
  return parse_sheet(text.str(), path, opts);
}

SurveySheet parse_sheet(std::string_view text, const std::string& name_for_messages,
                        const SheetOptions& opts) {
  const std::string& file = name_for_messages;
  std::string_view body = text;
  if (body.substr(0, 3) == "\xEF\xBB\xBF") body.remove_prefix(3);
  if (body.find_first_not_of(" \t\r\n") == std::string_view::npos) {
    throw InputError(file, 0, "", "the file is empty");
  }
  const std::vector<CsvRow> rows = split_csv_rows(text, file);
  for (const CsvRow& row : rows) {
    if (row.comment) continue;
    if (ascii_lower(row.cells[0]) == "soffit-sheet") return read_soffit_sheet(rows, file, opts);
    return read_plain_xz(rows, file, opts);
  }
  throw InputError(file, 0, "", "the file holds only comment lines and no readings");
}

}  // namespace soffit
