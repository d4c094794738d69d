#include "app/model/register_filter.hpp"

#include <algorithm>
#include <cstdio>

namespace soffit::app {

bool due_for_inspection(const std::string& latest_visit, const std::string& today, int interval_years) {
  if (latest_visit.size() != 10 || today.size() != 10) return true;  // never inspected, or unreadable: look at it
  // Same month and day, `interval_years` later; ISO dates compare as text.
  const int year = std::stoi(latest_visit.substr(0, 4)) + interval_years;
  char due[16];
  std::snprintf(due, sizeof due, "%04d%s", year, latest_visit.substr(4).c_str());
  return today >= due;
}

std::vector<size_t> filter_register(const std::vector<storage::StructureSummary>& rows, const RegisterFilter& filter,
                                    const std::string& today) {
  std::vector<size_t> out;
  for (size_t i = 0; i < rows.size(); ++i) {
    const storage::StructureSummary& r = rows[i];
    if (filter.due_only && !due_for_inspection(r.latest_visit, today, filter.interval_years)) continue;
    if (filter.severe_only && !(r.worst_severity && *r.worst_severity >= filter.severe_from)) continue;
    out.push_back(i);
  }
  std::stable_sort(out.begin(), out.end(), [&](size_t a, size_t b) {
    const auto& x = rows[a].structure.fields;
    const auto& y = rows[b].structure.fields;
    switch (filter.order) {
      case RegisterOrder::name: return x.name < y.name;
      case RegisterOrder::latest_visit: return rows[a].latest_visit < rows[b].latest_visit;  // oldest first: most overdue on top
      case RegisterOrder::reference: break;
    }
    return x.ref < y.ref;
  });
  return out;
}

}  // namespace soffit::app
