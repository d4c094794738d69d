#include "app/model/new_visit.hpp"

#include <chrono>

#include "geometry/core/input_error.hpp"
#include "storage/observation_edits.hpp"
#include "storage/register_edits.hpp"
#include "storage/register_queries.hpp"
#include "storage/storage_error.hpp"

namespace soffit::app {
namespace {

const char* kForm = "new visit";

bool is_calendar_date(const std::string& s) {
  if (s.size() != 10 || s[4] != '-' || s[7] != '-') return false;
  for (size_t i : {0, 1, 2, 3, 5, 6, 8, 9})
    if (s[i] < '0' || s[i] > '9') return false;
  const int y = std::stoi(s.substr(0, 4)), m = std::stoi(s.substr(5, 2)), d = std::stoi(s.substr(8, 2));
  const std::chrono::year_month_day ymd{std::chrono::year{y}, std::chrono::month{static_cast<unsigned>(m)},
                                        std::chrono::day{static_cast<unsigned>(d)}};
  return ymd.ok() && y >= 1800;
}

}  // namespace

std::string add_visit(storage::Project& project, const std::string& structure_ref, const NewVisit& visit) {
  if (!is_calendar_date(visit.date))
    throw InputError(kForm, 0, "date", "'" + visit.date + "' is not a date written as YYYY-MM-DD, e.g. " + today_iso());
  const auto detail = storage::structure_detail(project.db(), structure_ref);
  if (!detail)
    throw storage::StorageError(storage::ErrorKind::not_found, project.path(), "no structure " + structure_ref);
  for (const storage::InspectionRecord& v : detail->inspections)
    if (v.date == visit.date)
      throw InputError(kForm, 0, "date",
                       "there is already a visit on " + visit.date + " (" + v.status +
                           "): record into it, or make a new revision of it if it is issued");
  std::string id;
  project.edit("new visit " + visit.date, [&](storage::Connection& db) {
    id = storage::ensure_inspection(db, project.author(), detail->structure.id, visit.date);
    storage::update_inspection_details(db, project.author(), id, visit.details);
  });
  return id;
}

}  // namespace soffit::app
