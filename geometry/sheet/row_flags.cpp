#include "geometry/sheet/row_flags.hpp"

#include "geometry/core/input_error.hpp"
#include "geometry/sheet/csv_rows.hpp"
#include "geometry/sheet/sheet_columns.hpp"
#include "geometry/sheet/sheet_units.hpp"

namespace soffit {
namespace {

const std::string* cell_of(const RawRow& row, const std::vector<SheetColumn>& columns,
                           const char* quantity) {
  const int i = column_index(columns, quantity);
  if (i < 0 || row.cells[i].empty()) return nullptr;
  return &row.cells[i];
}

bool is_yes(const std::string& v) {
  return v == "yes" || v == "y" || v == "x" || v == "1" || v == "true";
}
bool is_no(const std::string& v) { return v == "no" || v == "n" || v == "0" || v == "false"; }

}  // namespace

RowFlags read_row_flags(const RawRow& row, const std::vector<SheetColumn>& columns,
                        const std::string& file, std::vector<std::string>& warnings) {
  RowFlags flags;
  if (const std::string* id = cell_of(row, columns, "id")) flags.id = *id;

  if (const int i = column_index(columns, "sigma"); i >= 0 && row.values[i]) {
    if (*row.values[i] <= 0.0) {
      throw InputError(file, row.line, columns[i].name,
                       "a precision must be greater than zero (leave the cell empty to use "
                       "the sheet's default)");
    }
    flags.sigma_m = to_si(*row.values[i], columns[i].unit);
  }

  if (const std::string* ex = cell_of(row, columns, "exclude")) {
    const std::string low = ascii_lower(*ex);
    if (!is_no(low)) {
      flags.excluded = true;
      flags.exclusion_reason = *ex;
      if (is_yes(low)) {
        flags.exclusion_reason = "no reason given";
        warnings.push_back(file + ":" + std::to_string(row.line) +
                           ": reading excluded without a reason; write the reason in the "
                           "exclude cell (e.g. 'tape snagged')");
      }
    }
  }

  if (const std::string* ck = cell_of(row, columns, "check")) {
    const std::string low = ascii_lower(*ck);
    if (is_yes(low) || low == "check") {
      flags.check = true;
    } else if (!is_no(low)) {
      const int i = column_index(columns, "check");
      throw InputError(file, row.line, columns[i].name,
                       "'" + *ck + "' is not understood; write yes for a closing-check repeat, "
                       "or leave the cell empty");
    }
  }

  const std::string* surface = cell_of(row, columns, "surface");
  const std::string* note = cell_of(row, columns, "note");
  if (surface) flags.note = "surface: " + *surface;
  if (note) flags.note += (flags.note.empty() ? "" : "; ") + *note;
  return flags;
}

}  // namespace soffit
