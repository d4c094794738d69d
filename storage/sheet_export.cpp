#include "storage/sheet_export.hpp"

#include <algorithm>
#include <climits>

#include "storage/sheet_json.hpp"
#include "storage/sqlite_statement.hpp"

namespace soffit::storage {
namespace {

// Quotes a cell the way the reader (csv_rows.hpp) unquotes it: only when it
// holds a comma, a quote or spaces at either end that would otherwise be trimmed.
std::string csv_cell(const std::string& cell) {
  const bool needs = cell.find_first_of(",\"\r\n") != std::string::npos ||
                     (!cell.empty() && (cell.front() == ' ' || cell.back() == ' ' || cell.front() == '\t'));
  if (!needs) return cell;
  std::string out = "\"";
  for (char c : cell) {
    if (c == '"') out += '"';
    out += c;
  }
  return out + "\"";
}

std::string csv_line(const std::vector<std::string>& cells) {
  std::string line;
  for (size_t i = 0; i < cells.size(); ++i) {
    if (i) line += ',';
    line += csv_cell(cells[i]);
  }
  return line + "\n";
}

// Lines are written in their original order; comments go back between the
// lines they were read between.
struct Line {
  int number;
  std::string text;
};

// Lines written so far; with padding, blank lines fill the gap before a
// line's own number (a line whose number is already passed follows on).
struct Writer {
  std::string out;
  bool pad = false;
  int written = 0;
  void put(const std::string& text, int number = 0) {
    if (pad)
      for (; written + 1 < number; ++written) out += '\n';
    out += text;
    ++written;
  }
};

void emit_sorted(std::vector<Line>& lines, Writer& out) {
  std::stable_sort(lines.begin(), lines.end(), [](const Line& a, const Line& b) { return a.number < b.number; });
  for (const auto& l : lines) out.put(l.text, l.number);
  lines.clear();
}

}  // namespace

SurveySheet load_section_sheet(Connection& db, const std::string& section_id) {
  SurveySheet sheet;
  {
    Statement q(db, "SELECT sheet_json FROM section_survey WHERE id = ?1");
    q.bind(1, section_id);
    if (!q.step()) throw StorageError(ErrorKind::not_found, db.path(), "no section " + section_id);
    sheet_layout_from_json(q.column_text(0), sheet);
  }
  Statement q(db,
              "SELECT x_m, z_m, sigma_m, excluded, exclusion_reason, is_check, source_line, note, raw_cells_json "
              "FROM reading WHERE section_id = ?1 ORDER BY seq");
  q.bind(1, section_id);
  while (q.step()) {
    Reading r;
    r.x = q.column_double(0);
    r.z = q.column_double(1);
    r.sigma = q.column_double(2);
    r.excluded = q.column_int64(3) != 0;
    r.exclusion_reason = q.column_text(4);
    r.check = q.column_int64(5) != 0;
    r.source_line = static_cast<int>(q.column_int64(6));
    r.note = q.column_text(7);
    sheet.readings.push_back(r);
    RawRow raw;
    raw.line = r.source_line;
    raw.cells = cells_from_json(q.column_text(8));
    sheet.raw_rows.push_back(std::move(raw));
  }
  return sheet;
}

std::string write_sheet_text(const SurveySheet& sheet, bool keep_line_numbers) {
  const int first_row = sheet.raw_rows.empty() ? INT_MAX : sheet.raw_rows.front().line;
  std::vector<Line> lines;
  Writer out;
  out.pad = keep_line_numbers;
  std::vector<std::string> header;
  for (const auto& c : sheet.columns) header.push_back(c.name);

  if (sheet.form == SheetForm::soffit_sheet) {
    out.put("soffit-sheet," + std::to_string(sheet.format_version) + "\n", 1);
    for (const auto& m : sheet.raw_metadata) {
      std::vector<std::string> cells{m.key};
      cells.insert(cells.end(), m.values.begin(), m.values.end());
      lines.push_back({m.line, csv_line(cells)});
    }
    for (const auto& c : sheet.comments)
      if (c.line < first_row) lines.push_back({c.line, c.text + "\n"});
    emit_sorted(lines, out);
    out.put("readings\n", first_row == INT_MAX ? 0 : first_row - 2);
  } else {
    for (const auto& c : sheet.comments)
      if (c.line < first_row) lines.push_back({c.line, c.text + "\n"});
    emit_sorted(lines, out);
  }
  out.put(csv_line(header), first_row == INT_MAX ? 0 : first_row - 1);
  for (const auto& r : sheet.raw_rows) lines.push_back({r.line, csv_line(r.cells)});
  for (const auto& c : sheet.comments)
    if (c.line >= first_row) lines.push_back({c.line, c.text + "\n"});
  emit_sorted(lines, out);
  return out.out;
}

std::string export_section_sheet(Connection& db, const std::string& section_id) {
  return write_sheet_text(load_section_sheet(db, section_id));
}

}  // namespace soffit::storage
