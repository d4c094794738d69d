#pragma once
// The per-reading columns every method shares: id, sigma, exclude, check,
// surface and note.
#include <optional>
#include <string>
#include <vector>

#include "geometry/sheet/survey_sheet.hpp"

namespace soffit {

struct RowFlags {
  std::string id;
  std::optional<double> sigma_m;  // per-reading precision, if the sigma cell is filled
  bool excluded = false;
  std::string exclusion_reason;
  bool check = false;             // a closing-check repeat
  std::string note;               // "surface: joint; wet" from the surface and note cells
};

// Throws on a check cell that is not yes/no, or a sigma that is not positive.
RowFlags read_row_flags(const RawRow& row, const std::vector<SheetColumn>& columns,
                        const std::string& file, std::vector<std::string>& warnings);

}  // namespace soffit
