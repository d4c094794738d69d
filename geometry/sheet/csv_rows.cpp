#include "geometry/sheet/csv_rows.hpp"

#include "geometry/core/input_error.hpp"

namespace soffit {
namespace {

bool is_space(char c) { return c == ' ' || c == '\t'; }

std::string trim(std::string_view s) {
  size_t b = 0, e = s.size();
  while (b < e && is_space(s[b])) ++b;
  while (e > b && is_space(s[e - 1])) --e;
  return std::string(s.substr(b, e - b));
}

std::vector<std::string> split_line(std::string_view line, const std::string& file, int line_no) {
  std::vector<std::string> cells;
  size_t i = 0;
  const size_t n = line.size();
  while (true) {
    while (i < n && is_space(line[i])) ++i;
    std::string cell;
    if (i < n && line[i] == '"') {
      ++i;
      bool closed = false;
      while (i < n) {
        if (line[i] == '"') {
          if (i + 1 < n && line[i + 1] == '"') {  // "" inside quotes is one quote
            cell += '"';
            i += 2;
            continue;
          }
          ++i;
          closed = true;
          break;
        }
        cell += line[i++];
      }
      if (!closed) {
        throw InputError(file, line_no, "",
                         "a quote (\") opens a cell but is not closed on this line; "
                         "close it or remove it");
      }
      while (i < n && is_space(line[i])) ++i;
      if (i < n && line[i] != ',') {
        throw InputError(file, line_no, "",
                         "text follows a closing quote in cell " +
                             std::to_string(cells.size() + 1) +
                             "; put the whole cell inside the quotes");
      }
    } else {
      size_t start = i;
      while (i < n && line[i] != ',') ++i;
      cell = trim(line.substr(start, i - start));
    }
    cells.push_back(std::move(cell));
    if (i >= n) break;
    ++i;  // the comma
  }
  while (!cells.empty() && cells.back().empty()) cells.pop_back();
  return cells;
}

}  // namespace

std::string ascii_lower(std::string_view s) {
  std::string out(s);
  for (char& c : out) {
    if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
  }
  return out;
}

std::vector<CsvRow> split_csv_rows(std::string_view text, const std::string& file) {
  if (text.substr(0, 3) == "\xEF\xBB\xBF") text.remove_prefix(3);
  std::vector<CsvRow> rows;
  int line_no = 0;
  size_t pos = 0;
  while (pos < text.size()) {
    size_t end = text.find('\n', pos);
    if (end == std::string_view::npos) end = text.size();
    std::string_view line = text.substr(pos, end - pos);
    pos = end + 1;
    ++line_no;
    if (!line.empty() && line.back() == '\r') line.remove_suffix(1);
    CsvRow row;
    row.line = line_no;
    row.text = std::string(line);
    std::string_view first = line;
    while (!first.empty() && is_space(first.front())) first.remove_prefix(1);
    if (!first.empty() && first.front() == '#') {  // comments may hold stray quotes: do not split
      row.comment = true;
      row.cells = {trim(first)};
      rows.push_back(std::move(row));
      continue;
    }
    row.cells = split_line(line, file, line_no);
    if (row.cells.empty()) continue;
    if (!row.cells[0].empty() && row.cells[0][0] == '#') row.comment = true;  // "# ..." quoted
    rows.push_back(std::move(row));
  }
  return rows;
}

}  // namespace soffit
