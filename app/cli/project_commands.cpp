// `soffit import`, `soffit list`, `soffit show`: the project file from the
// command line. Exit codes as dispatch.hpp: 0 ok, 1 internal, 2 bad input.
// `import` also reads spreadsheet exports through a column mapping
// (--map/--map-file and settings; SHEET_FORMAT.md "Spreadsheet exports").
#include <array>
#include <cstdio>
#include <cstdlib>
#include <filesystem>
#include <iostream>
#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "app/cli/option_parsing.hpp"
#include "geometry/core/input_error.hpp"
#include "geometry/sheet/column_mapping.hpp"
#include "geometry/sheet/mapped_sheet_reader.hpp"
#include "geometry/sheet/sheet_reader.hpp"
#include "storage/inspection_observations.hpp"
#include "storage/project_file.hpp"
#include "storage/register_queries.hpp"
#include "storage/sheet_import.hpp"

namespace soffit::cli {

// Rows carry an author; on the command line it is the login name unless
// SOFFIT_AUTHOR says otherwise. (Also used by search_command.cpp.)
std::string author_name() {
  for (const char* var : {"SOFFIT_AUTHOR", "USER", "LOGNAME"}) {
    if (const char* v = std::getenv(var); v && *v) return v;
  }
  return "unknown";
}

namespace {

using nlohmann::json;
using storage::Access;
using storage::ErrorKind;
using storage::Project;
using storage::StorageError;

bool is_iso_date(const std::string& d) {
  if (d.size() != 10 || d[4] != '-' || d[7] != '-') return false;
  for (size_t i : {0, 1, 2, 3, 5, 6, 8, 9})
    if (d[i] < '0' || d[i] > '9') return false;
  const int month = std::stoi(d.substr(5, 2)), day = std::stoi(d.substr(8, 2));
  return month >= 1 && month <= 12 && day >= 1 && day <= 31;
}

// "S2" or "2" → 2; anything else → 0.
int span_index_from_label(const std::string& label) {
  std::string digits = label;
  if (!digits.empty() && (digits[0] == 'S' || digits[0] == 's')) digits.erase(0, 1);
  if (digits.empty() || digits.size() > 3 || digits.find_first_not_of("0123456789") != std::string::npos) return 0;
  return std::stoi(digits);
}

int report_storage_error(const char* verb, const StorageError& e) {
  std::fprintf(stderr, "soffit %s: %s\n", verb, e.what());
  return e.kind() == ErrorKind::io ? 1 : 2;
}

int usage(const char* verb, const std::string& problem, const char* synopsis) {
  std::fprintf(stderr, "soffit %s: %s\nusage: soffit %s\n", verb, problem.c_str(), synopsis);
  return 2;
}

json section_json(const storage::SectionRecord& s) {
  json j = {{"span", s.span_label}, {"section", s.label}, {"method", s.method},
            {"readings", s.reading_count}, {"excluded", s.excluded_count}};
  j["position_m"] = s.position_m ? json(*s.position_m) : json(nullptr);
  j["reference_face"] = s.reference_face;
  j["direction"] = s.direction;
  j["datum"] = s.datum;
  return j;
}

json optional_number(const std::optional<double>& v) { return v ? json(*v) : json(nullptr); }

json observations_json(const storage::InspectionObservations& o) {
  json j = {{"ring_counts", json::array()}, {"fill_depths", json::array()}, {"defects", json::array()}};
  for (const auto& r : o.ring_counts)
    j["ring_counts"].push_back({{"span", r.span_label}, {"face", r.face}, {"position", r.position},
                                {"rings", r.rings}, {"unit_depth_mm", optional_number(r.unit_depth_mm)},
                                {"thickness_mm", optional_number(r.thickness_mm)}, {"confidence", r.confidence}});
  for (const auto& f : o.fill_depths)
    j["fill_depths"].push_back({{"span", f.span_label}, {"chainage_m", f.chainage_m}, {"method", f.method},
                                {"depth_m", f.depth_m}, {"uncertainty_m", optional_number(f.uncertainty_m)}});
  for (const auto& d : o.defects)
    j["defects"].push_back({{"ref", d.ref}, {"span", d.span_label}, {"type", d.defect_type},
                            {"element", d.element}, {"severity_scale", d.severity_scale},
                            {"severity", d.severity ? json(*d.severity) : json(nullptr)},
                            {"length_m", optional_number(d.length_m)}, {"width_mm", optional_number(d.width_mm)},
                            {"area_m2", optional_number(d.area_m2)}, {"photos", d.photo_count}});
  return j;
}

// Numbers an inspector reads off a page: thickness in mm, depths in m, ± where known.
void print_observations(const storage::InspectionObservations& o) {
  if (!o.ring_counts.empty()) std::printf("  ring counts: %zu\n", o.ring_counts.size());
  for (const auto& r : o.ring_counts) {
    std::printf("    %s %s %-14s %d rings", r.span_label.c_str(), r.face.c_str(), r.position.c_str(), r.rings);
    if (r.thickness_mm) std::printf("  thickness %.0f mm", *r.thickness_mm);
    if (!r.confidence.empty()) std::printf("  (%s confidence)", r.confidence.c_str());
    std::printf("\n");
  }
  if (!o.fill_depths.empty()) std::printf("  fill depths: %zu\n", o.fill_depths.size());
  for (const auto& f : o.fill_depths) {
    std::printf("    %s x %.2f m  %-9s %.3f m", f.span_label.c_str(), f.chainage_m, f.method.c_str(), f.depth_m);
    if (f.uncertainty_m) std::printf(" ± %.3f m", *f.uncertainty_m);
    std::printf("\n");
  }
  int photos = 0;
  for (const auto& d : o.defects) photos += d.photo_count;
  if (!o.defects.empty()) std::printf("  defects: %zu (%d photos)\n", o.defects.size(), photos);
  for (const auto& d : o.defects) {
    std::printf("    %-4s %-3s %-20s %s", d.ref.c_str(), d.span_label.c_str(), d.defect_type.c_str(),
                d.element.c_str());
    if (d.severity) std::printf("  severity %lld (%s)", *d.severity, d.severity_scale.c_str());
    if (d.width_mm) std::printf("  width %.1f mm", *d.width_mm);
    if (d.length_m) std::printf("  length %.2f m", *d.length_m);
    if (d.area_m2) std::printf("  area %.2f m2", *d.area_m2);
    std::printf("  photos %d\n", d.photo_count);
  }
}

}  // namespace

int run_import(int argc, char** argv) {
  constexpr const char* kSynopsis =
      "import PROJECT SHEET --structure REF [--span N] [--date YYYY-MM-DD] [--section NAME]\n"
      "       [--map TARGET=SOURCE,... | --map-file FILE] [--method offsets|polar|points]\n"
      "       [--datum-rl-m V] [--z-origin-rl-m V] [--sigma-mm S] [--set KEY=VALUE]...";
  std::string project_path, sheet_path, structure, date, section, map_file;
  std::vector<std::string> map_specs;
  // Settings for a mapped export, in the order given: (option, key, value).
  std::vector<std::array<std::string, 3>> settings;
  int span = 0;
  try {
    OptionCursor args(argc, argv, "import");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (arg == "--structure") structure = args.value(arg);
      else if (arg == "--span") span = static_cast<int>(args.integer(arg, 1, 999));
      else if (arg == "--date") date = args.value(arg);
      else if (arg == "--section") section = args.value(arg);
      else if (arg == "--map") map_specs.emplace_back(args.value(arg));
      else if (arg == "--map-file") map_file = args.value(arg);
      else if (arg == "--method") settings.push_back({"--method", "method", std::string(args.value(arg))});
      else if (arg == "--datum-rl-m") settings.push_back({"--datum-rl-m", "datum_rl_m", std::string(args.value(arg))});
      else if (arg == "--z-origin-rl-m")
        settings.push_back({"--z-origin-rl-m", "z_origin_rl_m", std::string(args.value(arg))});
      else if (arg == "--sigma-mm") settings.push_back({"--sigma-mm", "sigma_mm", std::string(args.value(arg))});
      else if (arg == "--set") settings.push_back({"--set", "", std::string(args.value(arg))});
      else if (!arg.empty() && arg[0] == '-') throw UsageError("unknown option '" + std::string(arg) + "'");
      else if (project_path.empty()) project_path = arg;
      else if (sheet_path.empty()) sheet_path = arg;
      else throw UsageError("one PROJECT and one SHEET, not '" + std::string(arg) + "' as well");
    }
    if (project_path.empty() || sheet_path.empty()) throw UsageError("PROJECT and SHEET are both needed");
    if (structure.empty()) throw UsageError("--structure REF is needed (the owner's reference)");
    if (!date.empty() && !is_iso_date(date)) throw UsageError("--date must be YYYY-MM-DD, not '" + date + "'");
    if (!settings.empty() && map_specs.empty() && map_file.empty())
      throw UsageError(settings.front()[0] + " is for a spreadsheet export read with --map or --map-file; "
                       "a Soffit sheet states it in its own metadata lines");
  } catch (const UsageError& e) {
    return usage("import", e.what(), kSynopsis);
  }

  SurveySheet sheet;
  try {
    if (map_specs.empty() && map_file.empty()) {
      sheet = read_sheet_file(sheet_path, {});
    } else {
      // The file first; --map adds columns to it and options override its settings.
      ColumnMapping mapping = map_file.empty() ? ColumnMapping{} : read_column_map_file(map_file);
      for (const auto& spec : map_specs) add_column_map_spec(mapping, spec, "--map");
      for (const auto& [option, key, value] : settings) {
        if (key.empty()) add_setting_spec(mapping, value, option);
        else mapping.set(key, value, option);
      }
      sheet = read_mapped_sheet_file(sheet_path, mapping, {});
    }
  } catch (const InputError& e) {
    std::fprintf(stderr, "soffit import: %s\n", e.what());
    return 2;
  }
  // Options win over the sheet's own lines; the sheet fills what was not given.
  const auto& meta = sheet.metadata;
  if (date.empty() && meta.date) {
    if (!is_iso_date(*meta.date)) {
      std::fprintf(stderr, "soffit import: %s: field 'date': '%s' is not YYYY-MM-DD; give --date\n",
                   sheet_path.c_str(), meta.date->c_str());
      return 2;
    }
    date = *meta.date;
  }
  if (date.empty()) return usage("import", sheet_path + ": the sheet has no date line; give --date YYYY-MM-DD", kSynopsis);
  if (span == 0 && meta.span) span = span_index_from_label(*meta.span);
  if (span == 0 && meta.span) {
    std::fprintf(stderr, "soffit import: %s: field 'span': '%s' is not a span number (S1, S2…); give --span N\n",
                 sheet_path.c_str(), meta.span->c_str());
    return 2;
  }
  if (span == 0) span = 1;
  if (section.empty() && meta.section) section = *meta.section;
  if (section.empty())
    return usage("import", sheet_path + ": the sheet has no section line; give --section NAME", kSynopsis);

  try {
    const bool exists = std::filesystem::exists(project_path);
    Project project = exists ? Project::open(project_path, author_name()) : Project::create(project_path, author_name());
    const auto r = storage::import_sheet(project, sheet, {structure, span, date, section});
    for (const auto& w : sheet.warnings) std::fprintf(stderr, "soffit import: warning: %s\n", w.c_str());
    std::printf("%s %d readings of %s S%d %s %s into %s%s\n", "imported", r.reading_count, structure.c_str(), span,
                section.c_str(), date.c_str(), project_path.c_str(), exists ? "" : " (new project)");
    return 0;
  } catch (const StorageError& e) {
    return report_storage_error("import", e);
  }
}

int run_list(int argc, char** argv) {
  constexpr const char* kSynopsis = "list PROJECT [--json]";
  std::string project_path;
  bool as_json = false;
  try {
    OptionCursor args(argc, argv, "list");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (arg == "--json") as_json = true;
      else if (!arg.empty() && arg[0] == '-') throw UsageError("unknown option '" + std::string(arg) + "'");
      else if (project_path.empty()) project_path = arg;
      else throw UsageError("one PROJECT only");
    }
    if (project_path.empty()) throw UsageError("no PROJECT given");
  } catch (const UsageError& e) {
    return usage("list", e.what(), kSynopsis);
  }
  try {
    Project project = Project::open(project_path, author_name(), Access::view);
    const auto rows = storage::list_structures(project.db(), 1 << 30, 0);
    if (as_json) {
      json j = {{"project", project_path}, {"structures", json::array()}};
      for (const auto& s : rows)
        j["structures"].push_back({{"ref", s.structure.fields.ref}, {"name", s.structure.fields.name},
                                   {"spans", s.span_count}, {"inspections", s.inspection_count},
                                   {"sections", s.section_count}});
      std::cout << j.dump(2) << "\n";
    } else {
      for (const auto& s : rows)
        std::printf("%-20s %-30s spans %d  inspections %d  sections %d\n", s.structure.fields.ref.c_str(),
                    s.structure.fields.name.c_str(), s.span_count, s.inspection_count, s.section_count);
      if (rows.empty()) std::printf("(no structures)\n");
    }
    return 0;
  } catch (const StorageError& e) {
    return report_storage_error("list", e);
  }
}

int run_show(int argc, char** argv) {
  constexpr const char* kSynopsis = "show PROJECT REF [--json]";
  std::string project_path, ref;
  bool as_json = false;
  try {
    OptionCursor args(argc, argv, "show");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (arg == "--json") as_json = true;
      else if (!arg.empty() && arg[0] == '-') throw UsageError("unknown option '" + std::string(arg) + "'");
      else if (project_path.empty()) project_path = arg;
      else if (ref.empty()) ref = arg;
      else throw UsageError("one PROJECT and one REF only");
    }
    if (project_path.empty() || ref.empty()) throw UsageError("PROJECT and REF are both needed");
  } catch (const UsageError& e) {
    return usage("show", e.what(), kSynopsis);
  }
  try {
    Project project = Project::open(project_path, author_name(), Access::view);
    const auto d = storage::structure_detail(project.db(), ref);
    if (!d) {
      std::fprintf(stderr, "soffit show: %s: no structure with reference '%s'\n", project_path.c_str(), ref.c_str());
      return 2;
    }
    const auto& f = d->structure.fields;
    if (as_json) {
      json j = {{"ref", f.ref}, {"name", f.name}, {"carries", f.carries}, {"crosses", f.crosses},
                {"location_fictitious", f.location_fictitious}, {"notes", f.notes}};
      j["latitude_deg"] = f.latitude_deg ? json(*f.latitude_deg) : json(nullptr);
      j["longitude_deg"] = f.longitude_deg ? json(*f.longitude_deg) : json(nullptr);
      j["spans"] = json::array();
      for (const auto& s : d->spans) j["spans"].push_back({{"index", s.index}, {"label", s.label}});
      j["inspections"] = json::array();
      for (const auto& i : d->inspections) {
        json ij = {{"date", i.date}, {"status", i.status}, {"revision", i.revision},
                   {"inspector", i.inspector}, {"sections", json::array()}};
        for (const auto& s : i.sections) ij["sections"].push_back(section_json(s));
        ij.update(observations_json(storage::inspection_observations(project.db(), i.id)));
        j["inspections"].push_back(ij);
      }
      std::cout << j.dump(2) << "\n";
    } else {
      std::printf("%s  %s\n", f.ref.c_str(), f.name.c_str());
      std::printf("spans: %zu\n", d->spans.size());
      for (const auto& i : d->inspections) {
        std::printf("inspection %s  %s  revision %d\n", i.date.c_str(), i.status.c_str(), i.revision);
        for (const auto& s : i.sections)
          std::printf("  %s %-4s %-8s %2d readings (%d excluded)\n", s.span_label.c_str(), s.label.c_str(),
                      s.method.c_str(), s.reading_count, s.excluded_count);
        print_observations(storage::inspection_observations(project.db(), i.id));
      }
    }
    return 0;
  } catch (const StorageError& e) {
    return report_storage_error("show", e);
  }
}

}  // namespace soffit::cli
