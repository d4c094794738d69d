#pragma once
// Shared by the geometry file tests: the demo project written once per test
// run, and validation of a document against exports/geometry_schema.json by
// Debian's python3-jsonschema (an implementation of JSON Schema outside Soffit).
#include <doctest/doctest.h>

#include <filesystem>
#include <string>

#include "storage/demo_assets.hpp"
#include "storage/demo_project.hpp"
#include "tests/exports/export_test_support.hpp"

namespace soffit::test {

inline const std::string kGeometrySchema = std::string(SOFFIT_ASSETS) + "/../exports/geometry_schema.json";
inline constexpr const char* kDemoRef = "BVDC-ST-0417";

// The demo project (FIELD.md §10), written once and shared read-only.
inline const std::string& demo_project_path() {
  static ExportDir dir;
  static const std::string path = [] {
    const std::string p = dir.file("sallow-ford.soffit");
    const std::string sheets = storage::find_demo_sheets();
    REQUIRE_FALSE(sheets.empty());
    storage::write_demo_project(p, sheets, "test");
    return p;
  }();
  return path;
}

inline bool jsonschema_available() {
  return run_logged("/usr/bin/python3 -c 'import jsonschema'", "/dev/null") == 0;
}

// 0 when `document_path` validates (draft 2020-12); otherwise the validator's
// messages are in `log`.
inline int validate_against_schema(const std::string& document_path, const std::string& log) {
  const std::string script =
      "import json, sys, jsonschema\n"
      "schema = json.load(open(sys.argv[1]))\n"
      "jsonschema.Draft202012Validator.check_schema(schema)\n"
      "errors = list(jsonschema.Draft202012Validator(schema).iter_errors(json.load(open(sys.argv[2]))))\n"
      "for e in errors: print(e.json_path, e.message)\n"
      "sys.exit(1 if errors else 0)\n";
  const std::string script_path = document_path + ".validate.py";
  write_text(script_path, script);
  return run_logged("/usr/bin/python3 " + script_path + " " + kGeometrySchema + " " + document_path, log);
}

}  // namespace soffit::test
