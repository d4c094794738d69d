// The plain form: a header "x,z" or "x,z,sigma_mm", then one reading a row.
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/sheet_forms.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/unit_plausibility.hpp"

namespace soffit {

SurveySheet read_plain_xz(const std::vector<CsvRow>& rows, const std::string& file,
                          const SheetOptions& opts) {
  SurveySheet sheet;
  sheet.source = file;
  sheet.form = SheetForm::plain_xz;
  sheet.method = SurveyMethod::xz_list;

  size_t i = 0;
  for (; i < rows.size() && rows[i].comment; ++i) sheet.comments.push_back({rows[i].line, rows[i].text});
  const CsvRow& header = rows[i];
  std::vector<std::string> names;
  for (const std::string& c : header.cells) names.push_back(ascii_lower(c));
  const bool ok = (names.size() == 2 || names.size() == 3) && names[0] == "x" && names[1] == "z" &&
                  (names.size() == 2 || names[2] == "sigma_mm");
  if (!ok) {
    throw InputError(file, header.line, "",
                     "the header is '" + header.text +
                         "'; a plain file needs the header x,z or x,z,sigma_mm (metres, "
                         "sigma in mm); a survey sheet must start with the line soffit-sheet,1");
  }
  for (const std::string& n : names) {
    sheet.columns.push_back({n, n == "sigma_mm" ? "sigma" : n, n == "sigma_mm" ? "mm" : "m"});
  }

  ColumnValues xs{"x", "m", false, false, {}}, zs{"z", "m", false, false, {}},
      ss{"sigma_mm", "mm", false, true, {}};
  for (++i; i < rows.size(); ++i) {
    const CsvRow& row = rows[i];
    if (row.comment) {
      sheet.comments.push_back({row.line, row.text});
      continue;
    }
    if (row.cells.size() > names.size()) {
      throw InputError(file, row.line, "",
                       "this row has " + std::to_string(row.cells.size()) +
                           " cells but the header has " + std::to_string(names.size()) +
                           " columns (a decimal comma? use a point: 1.5, not 1,5)");
    }
    RawRow raw;
    raw.line = row.line;
    raw.cells = row.cells;
    raw.cells.resize(names.size());
    raw.values.resize(names.size());
    Reading r;
    r.source_line = row.line;
    for (size_t c = 0; c < names.size(); ++c) {
      if (c == 2 && raw.cells[c].empty()) continue;  // sigma is optional per row
      raw.values[c] = parse_number(raw.cells[c], file, row.line, names[c]);
    }
    r.x = *raw.values[0];
    r.z = *raw.values[1];
    xs.values.push_back({row.line, r.x});
    zs.values.push_back({row.line, r.z});
    if (names.size() == 3 && raw.values[2]) {
      if (*raw.values[2] <= 0.0) {
        throw InputError(file, row.line, "sigma_mm", "a precision must be greater than zero");
      }
      ss.values.push_back({row.line, *raw.values[2]});
      r.sigma = *raw.values[2] / 1000.0;
    } else if (opts.default_sigma_m) {
      r.sigma = *opts.default_sigma_m;
    }
    sheet.readings.push_back(r);
    sheet.raw_rows.push_back(std::move(raw));
  }
  const std::string fixed = "the plain x,z form is in metres: divide the values by 1000";
  check_column_units(xs, file, fixed);
  check_column_units(zs, file, fixed);
  check_column_units(ss, file, "sigma_mm is in millimetres: multiply the values by 1000");

  std::vector<StationKey> keys;
  for (const Reading& r : sheet.readings) {
    const std::string x = format_fixed(r.x, 6), z = format_fixed(r.z, 6);
    keys.push_back({x + "," + z, "the point x " + x + " m, z " + z + " m", "x"});
  }
  check_repeats_and_closures(keys, sheet.readings, false, file, sheet.warnings);
  if (!opts.allow_few_readings) require_usable_readings(sheet.readings, file);
  bool any_unstated = false;
  for (const Reading& r : sheet.readings) any_unstated = any_unstated || r.sigma == 0.0;
  if (any_unstated) {
    sheet.warnings.push_back(file + ": no precision stated for some readings (add a sigma_mm "
                                    "column or give --sigma-mm)");
  }
  return sheet;
}

}  // namespace soffit
