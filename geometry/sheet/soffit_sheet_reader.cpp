// The Soffit survey sheet: "soffit-sheet,1", metadata lines, "readings", the
// column header, data rows (SHEET_FORMAT.md).
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/row_flags.hpp"
#include "geometry/sheet/sheet_columns.hpp"
#include "geometry/sheet/sheet_defaults.hpp"
#include "geometry/sheet/sheet_forms.hpp"
#include "geometry/sheet/sheet_number.hpp"
#include "geometry/sheet/sheet_units.hpp"
#include "geometry/sheet/unit_plausibility.hpp"

namespace soffit {
namespace {

constexpr int kFormatVersion = 1;

int read_version(const CsvRow& first, const std::string& file) {
  const std::string cell = first.cells.size() > 1 ? first.cells[1] : "";
  const auto v = try_parse_number(cell);
  if (!v || *v != static_cast<int>(*v) || *v < 1) {
    throw InputError(file, first.line, "soffit-sheet",
                     "the format version is missing or not a whole number; the first line "
                     "must read soffit-sheet," + std::to_string(kFormatVersion));
  }
  if (*v > kFormatVersion) {
    throw InputError(file, first.line, "soffit-sheet",
                     "this sheet was made for format version " + cell +
                         ", newer than this program reads (version " +
                         std::to_string(kFormatVersion) + "); update the program");
  }
  return static_cast<int>(*v);
}

void check_table_units(const SurveySheet& sheet, const std::string& file) {
  for (size_t c = 0; c < sheet.columns.size(); ++c) {
    const SheetColumn& col = sheet.columns[c];
    if (col.unit != "m" && col.unit != "mm") continue;
    ColumnValues cv;
    cv.field = col.name;
    cv.unit = col.unit;
    cv.grid = col.quantity == "easting" || col.quantity == "northing";
    cv.precision = col.quantity == "sigma";
    for (const RawRow& row : sheet.raw_rows) {
      if (row.values[c]) cv.values.push_back({row.line, *row.values[c]});
    }
    check_column_units(cv, file);
  }
}

// Per reading: its own sigma, else --sigma-mm, else the sheet's sigma, else
// the polar propagation, else the instrument class default.
double choose_sigma(const std::optional<double>& row_sigma, const SheetOptions& opts,
                    const SheetMetadata& meta, const std::optional<double>& derived,
                    const InstrumentClass& cls) {
  if (row_sigma) return *row_sigma;
  if (opts.default_sigma_m) return *opts.default_sigma_m;
  if (meta.sigma_m) return *meta.sigma_m;
  if (derived) return *derived;
  return cls.sigma_m;
}

}  // namespace

std::vector<std::optional<double>> column_si(const SurveySheet& sheet, const char* quantity) {
  std::vector<std::optional<double>> out(sheet.raw_rows.size());
  const int c = column_index(sheet.columns, quantity);
  if (c < 0) return out;
  for (size_t i = 0; i < sheet.raw_rows.size(); ++i) {
    if (sheet.raw_rows[i].values[c]) out[i] = to_si(*sheet.raw_rows[i].values[c], sheet.columns[c].unit);
  }
  return out;
}

SurveySheet read_soffit_sheet(const std::vector<CsvRow>& rows, const std::string& file,
                              const SheetOptions& opts) {
  SurveySheet sheet;
  sheet.source = file;
  sheet.form = SheetForm::soffit_sheet;

  size_t i = 0;
  for (; rows[i].comment; ++i) sheet.comments.push_back({rows[i].line, rows[i].text});
  const CsvRow& first = rows[i];
  sheet.format_version = read_version(first, file);

  // Metadata lines up to "readings".
  SheetMetadataLines meta;
  int readings_line = 0;
  for (++i; i < rows.size(); ++i) {
    const CsvRow& row = rows[i];
    if (row.comment) {
      sheet.comments.push_back({row.line, row.text});
      continue;
    }
    if (ascii_lower(row.cells[0]) == "readings") {
      readings_line = row.line;
      ++i;
      break;
    }
    if (row.cells.size() >= 2 && looks_like_column_name(row.cells[0]) &&
        looks_like_column_name(row.cells[1])) {
      throw InputError(file, row.line, "",
                       "this looks like the column header, but the line 'readings' is missing "
                       "before it; add a line readings between the metadata and the header");
    }
    meta.add(row, file, sheet.warnings);
    sheet.raw_metadata.push_back(
        {row.line, row.cells[0], std::vector<std::string>(row.cells.begin() + 1, row.cells.end())});
  }
  if (readings_line == 0) {
    throw InputError(file, 0, "",
                     "no 'readings' line: after the metadata write a line readings, then the "
                     "column header, then one row per reading");
  }

  const MetadataEntry* method_entry = meta.find("method");
  if (!method_entry) {
    throw InputError(file, first.line, "method",
                     "the sheet does not say how it was measured; add a metadata line "
                     "method,offsets (or method,polar or method,points)");
  }
  const auto method = method_from_keyword(ascii_lower(method_entry->text));
  if (!method) {
    throw InputError(file, method_entry->line, method_entry->key,
                     "'" + method_entry->text + "' is not a method; write offsets, polar or points");
  }
  sheet.method = *method;
  sheet.metadata = meta.summary(file, sheet.warnings);
  meta.warn_keys_not_used_by(sheet.method, file, sheet.warnings);

  // Column header and data rows.
  for (; i < rows.size() && rows[i].comment; ++i) sheet.comments.push_back({rows[i].line, rows[i].text});
  if (i == rows.size()) {
    throw InputError(file, readings_line, "",
                     "no column header after the 'readings' line; expected " +
                         expected_columns(sheet.method));
  }
  sheet.columns = read_header_row(rows[i], sheet.method, file, sheet.warnings);
  for (++i; i < rows.size(); ++i) {
    if (rows[i].comment) {
      sheet.comments.push_back({rows[i].line, rows[i].text});
      continue;
    }
    sheet.raw_rows.push_back(read_data_row(rows[i], sheet.columns, sheet.method, file));
  }
  check_table_units(sheet, file);

  // Flags first: the points plane is fitted to the usable readings only.
  std::vector<RowFlags> flags;
  for (const RawRow& raw : sheet.raw_rows) {
    flags.push_back(read_row_flags(raw, sheet.columns, file, sheet.warnings));
    Reading r;
    r.source_line = raw.line;
    r.excluded = flags.back().excluded;
    r.exclusion_reason = flags.back().exclusion_reason;
    r.check = flags.back().check;
    r.note = flags.back().note;
    sheet.readings.push_back(r);
  }
  if (!opts.allow_few_readings) require_usable_readings(sheet.readings, file);

  MethodReduction red;
  switch (sheet.method) {
    case SurveyMethod::offsets: red = reduce_offsets_sheet(sheet, meta); break;
    case SurveyMethod::polar: red = reduce_polar_sheet(sheet, meta); break;
    case SurveyMethod::points: red = reduce_points_sheet(sheet, meta); break;
    case SurveyMethod::xz_list: break;
  }

  const InstrumentClass& cls = sheet.metadata.instrument
                                   ? *find_instrument_class(*sheet.metadata.instrument)
                                   : default_instrument_class(sheet.method);
  red.derived_sigma.resize(sheet.readings.size());
  for (size_t k = 0; k < sheet.readings.size(); ++k) {
    sheet.readings[k].sigma =
        choose_sigma(flags[k].sigma_m, opts, sheet.metadata, red.derived_sigma[k], cls);
  }
  check_repeats_and_closures(red.keys, sheet.readings, red.match_nearest, file, sheet.warnings);
  return sheet;
}

}  // namespace soffit
