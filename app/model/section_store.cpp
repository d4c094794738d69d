#include "app/model/section_store.hpp"

#include "storage/section_readings.hpp"

namespace soffit::app {

void save_section(storage::Project& project, const std::string& section_id, const SurveySheet& sheet,
                  const std::string& label) {
  project.edit(label, [&](storage::Connection& db) {
    storage::save_section_rows(db, project.author(), section_id, sheet);
  });
}

}  // namespace soffit::app
