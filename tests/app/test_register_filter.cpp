// The register's filters (issue: due for inspection, with severe defects) and order.
#include <doctest/doctest.h>

#include "app/model/register_filter.hpp"

using namespace soffit;

namespace {
storage::StructureSummary row(const std::string& ref, const std::string& name, const std::string& latest,
                              std::optional<int> worst) {
  storage::StructureSummary s;
  s.structure.fields.ref = ref;
  s.structure.fields.name = name;
  s.latest_visit = latest;
  s.worst_severity = worst;
  return s;
}
}  // namespace

TEST_CASE("a structure is due once the interval since its latest visit has passed, or if never visited") {
  // 6 years: principal inspections in UK highway practice (FIELD.md §1.2, from memory; an editable default).
  CHECK_FALSE(app::due_for_inspection("2025-05-21", "2031-05-20", 6));
  CHECK(app::due_for_inspection("2025-05-21", "2031-05-21", 6));
  CHECK(app::due_for_inspection("2019-05-14", "2026-12-01", 6));
  CHECK(app::due_for_inspection("", "2026-12-01", 6));
  CHECK_FALSE(app::due_for_inspection("2025-05-21", "2026-12-01", 2));
}

TEST_CASE("filters keep due structures and those with severe defects at the latest visit - order as asked") {
  const std::vector<storage::StructureSummary> rows = {
      row("B-2", "Alder Bridge", "2019-03-01", 2),
      row("A-1", "Sallow Ford Bridge", "2025-05-21", 4),
      row("C-3", "Culvert Lane", "", std::nullopt),
  };
  app::RegisterFilter f;
  CHECK(app::filter_register(rows, f, "2026-12-01") == std::vector<size_t>{1, 0, 2});  // by reference
  f.due_only = true;
  CHECK(app::filter_register(rows, f, "2026-12-01") == std::vector<size_t>{0, 2});
  f.due_only = false;
  f.severe_only = true;
  CHECK(app::filter_register(rows, f, "2026-12-01") == std::vector<size_t>{1});
  f.severe_only = false;
  f.order = app::RegisterOrder::name;
  CHECK(app::filter_register(rows, f, "2026-12-01") == std::vector<size_t>{0, 2, 1});
  f.order = app::RegisterOrder::latest_visit;  // never visited first, then the oldest visit
  CHECK(app::filter_register(rows, f, "2026-12-01") == std::vector<size_t>{2, 0, 1});
}
