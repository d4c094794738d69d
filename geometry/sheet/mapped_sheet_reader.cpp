#include "geometry/sheet/mapped_sheet_reader.hpp"

#include <fstream>
#include <sstream>

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/csv_rows.hpp"
#include "geometry/sheet/sheet_forms.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/sheet_units.hpp"
#include "geometry/sheet/unit_plausibility.hpp"

namespace soffit {
namespace {

std::string joined(const std::vector<std::string>& names) {
  std::string s;
  for (const auto& n : names) {
    if (n.empty()) continue;
    if (!s.empty()) s += ", ";
    s += "'" + n + "'";
  }
  return s;
}

// The export's header row: the first row that holds every mapped column, so
// that title lines a spreadsheet writes above the table are passed over.
struct Header {
  size_t row = 0;
  std::vector<int> source_index;  // per mapped column, its cell in the export
};

Header find_header(const std::vector<CsvRow>& rows, const ColumnMapping& mapping, const std::string& file) {
  const CsvRow* first = nullptr;
  for (size_t r = 0; r < rows.size(); ++r) {
    if (rows[r].comment) continue;
    if (!first) first = &rows[r];
    Header h{r, {}};
    for (const MappedColumn& mc : mapping.columns) {
      int found = -1;
      for (size_t c = 0; c < rows[r].cells.size(); ++c) {
        if (ascii_lower(rows[r].cells[c]) != ascii_lower(mc.source)) continue;
        if (found >= 0) {
          throw InputError(file, rows[r].line, mc.source,
                           "the header names this column twice (cells " + std::to_string(found + 1) + " and " +
                               std::to_string(c + 1) + "); rename one in the export");
        }
        found = static_cast<int>(c);
      }
      if (found < 0) break;
      h.source_index.push_back(found);
    }
    if (h.source_index.size() == mapping.columns.size()) return h;
  }
  if (!first) throw InputError(file, 0, "", "the file holds only comment lines and no readings");
  // Report against the line that holds the most mapped columns: the header
  // with a misspelt name, rather than a title line above it.
  const CsvRow* best = first;
  std::vector<std::string> best_missing;
  for (const CsvRow& row : rows) {
    if (row.comment) continue;
    std::vector<std::string> missing;
    for (const MappedColumn& mc : mapping.columns) {
      bool present = false;
      for (const auto& cell : row.cells) present = present || ascii_lower(cell) == ascii_lower(mc.source);
      if (!present) missing.push_back(mc.source);
    }
    if (best_missing.empty() || missing.size() < best_missing.size()) {
      best = &row;
      best_missing = missing;
    }
  }
  throw InputError(file, best->line, best_missing.front(),
                   "no header line holds every mapped column; missing " + joined(best_missing) +
                       "; line " + std::to_string(best->line) + " has " + joined(best->cells));
}

// Millimetres mapped as metres and the reverse, named by the export's column.
void check_mapped_units(const std::vector<CsvRow>& data, const Header& h, const ColumnMapping& mapping,
                        const std::string& file) {
  for (size_t k = 0; k < mapping.columns.size(); ++k) {
    const MappedColumn& mc = mapping.columns[k];
    const NameWithUnit nu = split_unit_suffix(ascii_lower(mc.target));
    if (nu.unit != "m" && nu.unit != "mm") continue;
    ColumnValues cv;
    cv.field = mc.source;
    cv.unit = nu.unit;
    cv.grid = nu.quantity == "easting" || nu.quantity == "northing";
    cv.precision = nu.quantity == "sigma";
    for (const CsvRow& row : data) {
      const size_t c = static_cast<size_t>(h.source_index[k]);
      if (row.comment || c >= row.cells.size()) continue;
      if (const auto v = try_parse_number(row.cells[c])) cv.values.push_back({row.line, *v});
    }
    const std::string other = nu.quantity + (nu.unit == "m" ? "_mm" : "_m");
    check_column_units(cv, file,
                       "map the column as " + other + "=" + mc.source + " instead of " + mc.target +
                           " (or correct the values in the export)");
  }
}

// The same message, but naming the export's column or the setting's origin.
[[noreturn]] void rethrow_in_export_terms(const InputError& e, const ColumnMapping& mapping,
                                          const std::string& file) {
  const std::string prefix = InputError(e.file(), e.line(), e.field(), "").what();
  std::string what = e.what();
  if (what.compare(0, prefix.size(), prefix) == 0) what.erase(0, prefix.size());
  if (!e.field().empty()) {
    if (const MappedColumn* mc = mapping.find_target(e.field())) {
      throw InputError(file, e.line(), mc->source, "(mapped as " + mc->target + ") " + what);
    }
    if (const MappedSetting* s = mapping.find_setting(e.field())) {
      throw InputError(s->origin, s->origin_line, s->key, what);
    }
  }
  throw e;
}

}  // namespace

SurveySheet parse_mapped_sheet(std::string_view text, const std::string& file, const ColumnMapping& mapping,
                               const SheetOptions& opts) {
  std::string_view body = text;
  if (body.substr(0, 3) == "\xEF\xBB\xBF") body.remove_prefix(3);
  if (body.find_first_not_of(" \t\r\n") == std::string_view::npos) throw InputError(file, 0, "", "the file is empty");
  if (mapping.columns.empty()) {
    throw InputError(file, 0, "", "no column mapping given; map at least the required columns, e.g. "
                                  "station_m=Chainage (m),offset_mm=Offset mm");
  }
  if (!mapping.find_setting("method")) {
    throw InputError(file, 0, "method",
                     "the mapping does not say how the export was measured; give the method "
                     "(offsets, polar or points)");
  }
  const std::vector<CsvRow> rows = split_csv_rows(body, file);
  const Header h = find_header(rows, mapping, file);

  // The export's own lines keep their numbers; the sheet's keyword lines,
  // which the export has not got, have line 0.
  std::vector<CsvRow> sheet_rows;
  sheet_rows.push_back({0, {"soffit-sheet", "1"}, false, "soffit-sheet,1"});
  for (const MappedSetting& s : mapping.settings) sheet_rows.push_back({0, {s.key, s.value}, false, ""});
  std::vector<std::string> warnings;
  for (size_t r = 0; r < h.row; ++r) {  // comments above the table stay comments
    if (rows[r].comment) {
      sheet_rows.push_back(rows[r]);
    } else {
      warnings.push_back(file + ":" + std::to_string(rows[r].line) +
                         ": above the header line, left out: " + rows[r].text);
    }
  }
  // The keyword line takes the header's number: the reader needs a line there.
  sheet_rows.push_back({rows[h.row].line, {"readings"}, false, "readings"});
  CsvRow header{rows[h.row].line, {}, false, ""};
  for (const MappedColumn& mc : mapping.columns) header.cells.push_back(mc.target);
  sheet_rows.push_back(header);

  std::vector<CsvRow> data(rows.begin() + static_cast<long>(h.row) + 1, rows.end());
  check_mapped_units(data, h, mapping, file);

  std::vector<std::string> unmapped;
  for (size_t c = 0; c < rows[h.row].cells.size(); ++c) {
    bool mapped = false;
    for (int i : h.source_index) mapped = mapped || static_cast<size_t>(i) == c;
    if (!mapped && !rows[h.row].cells[c].empty()) unmapped.push_back(rows[h.row].cells[c]);
  }
  if (!unmapped.empty()) {
    warnings.push_back(file + ":" + std::to_string(rows[h.row].line) + ": columns not mapped, left out: " +
                       joined(unmapped));
  }
  for (const CsvRow& row : data) {
    if (row.comment) {
      sheet_rows.push_back(row);
      continue;
    }
    CsvRow mapped{row.line, {}, false, ""};
    for (int i : h.source_index)
      mapped.cells.push_back(static_cast<size_t>(i) < row.cells.size() ? row.cells[static_cast<size_t>(i)] : "");
    while (!mapped.cells.empty() && mapped.cells.back().empty()) mapped.cells.pop_back();
    if (mapped.cells.empty()) {
      // A totals or remarks row of the spreadsheet: nothing in any mapped column.
      warnings.push_back(file + ":" + std::to_string(row.line) +
                         ": no value in any mapped column; the line is left out");
      continue;
    }
    sheet_rows.push_back(std::move(mapped));
  }

  SurveySheet sheet;
  try {
    sheet = read_soffit_sheet(sheet_rows, file, opts);
  } catch (const InputError& e) {
    rethrow_in_export_terms(e, mapping, file);
  }
  // The settings' lines have no number in the export: say where they came from.
  const std::string no_line = file + ":0: ";
  for (std::string& w : sheet.warnings)
    if (w.compare(0, no_line.size(), no_line) == 0) w = file + ": mapping settings: " + w.substr(no_line.size());
  sheet.warnings.insert(sheet.warnings.begin(), warnings.begin(), warnings.end());
  return sheet;
}

SurveySheet read_mapped_sheet_file(const std::string& path, const ColumnMapping& mapping, const SheetOptions& opts) {
  std::ifstream in(path, std::ios::binary);
  if (!in) throw InputError(path, 0, "", "the file cannot be opened (check the name and that it exists)");
  std::ostringstream text;
  text << in.rdbuf();
  if (in.bad()) throw InputError(path, 0, "", "the file could not be read to the end");
  return parse_mapped_sheet(text.str(), path, mapping, opts);
}

}  // namespace soffit
