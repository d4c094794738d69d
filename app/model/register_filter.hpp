#pragma once
// The register's filters and order: structures due for inspection, and those
// whose latest visit recorded severe defects. The interval is the owner's to
// set; 6 years is the default because a principal inspection every 6 years is
// common UK highway practice (FIELD.md §1.2, from memory: an editable default).
#include <string>
#include <vector>

#include "app/model/local_time.hpp"  // today_iso(): the `today` the filters take
#include "storage/register_records.hpp"

namespace soffit::app {

enum class RegisterOrder { reference, name, latest_visit };

struct RegisterFilter {
  bool due_only = false;
  int interval_years = 6;
  bool severe_only = false;
  int severe_from = 4;  // on Soffit's 1–5 scale (storage/defect_vocabulary.md)
  RegisterOrder order = RegisterOrder::reference;
};

// True when no visit is recorded, or the latest is `interval_years` or more before `today` (YYYY-MM-DD).
bool due_for_inspection(const std::string& latest_visit, const std::string& today, int interval_years);

// Indices into `rows` that pass the filter, in the chosen order.
std::vector<size_t> filter_register(const std::vector<storage::StructureSummary>& rows, const RegisterFilter& filter,
                                    const std::string& today);

}  // namespace soffit::app
