#include "storage/sheet_json.hpp"

#include <nlohmann/json.hpp>

namespace soffit::storage {

using nlohmann::json;

std::string sheet_layout_to_json(const SurveySheet& sheet) {
  json j;
  j["source"] = sheet.source;
  j["form"] = sheet.form == SheetForm::soffit_sheet ? "soffit_sheet" : "plain_xz";
  j["format_version"] = sheet.format_version;
  j["method"] = method_key(sheet.method);
  j["metadata"] = json::array();
  for (const auto& m : sheet.raw_metadata) j["metadata"].push_back({{"line", m.line}, {"key", m.key}, {"values", m.values}});
  j["columns"] = json::array();
  for (const auto& c : sheet.columns)
    j["columns"].push_back({{"name", c.name}, {"quantity", c.quantity}, {"unit", c.unit}});
  j["comments"] = json::array();
  for (const auto& c : sheet.comments) j["comments"].push_back({{"line", c.line}, {"text", c.text}});
  j["warnings"] = sheet.warnings;
  return j.dump();
}

void sheet_layout_from_json(const std::string& json_text, SurveySheet& sheet) {
  const json j = json::parse(json_text);
  sheet.source = j.at("source").get<std::string>();
  sheet.form = j.at("form") == "soffit_sheet" ? SheetForm::soffit_sheet : SheetForm::plain_xz;
  sheet.format_version = j.at("format_version").get<int>();
  sheet.method = method_from_key(j.at("method").get<std::string>());
  for (const auto& m : j.at("metadata"))
    sheet.raw_metadata.push_back({m.at("line").get<int>(), m.at("key").get<std::string>(),
                                  m.at("values").get<std::vector<std::string>>()});
  for (const auto& c : j.at("columns"))
    sheet.columns.push_back(
        {c.at("name").get<std::string>(), c.at("quantity").get<std::string>(), c.at("unit").get<std::string>()});
  for (const auto& c : j.at("comments")) sheet.comments.push_back({c.at("line").get<int>(), c.at("text").get<std::string>()});
  sheet.warnings = j.value("warnings", std::vector<std::string>{});
}

std::string method_key(SurveyMethod method) {
  return method == SurveyMethod::xz_list ? "xz_list" : method_keyword(method);
}

SurveyMethod method_from_key(const std::string& key) {
  return method_from_keyword(key).value_or(SurveyMethod::xz_list);
}

std::string cells_to_json(const std::vector<std::string>& cells) { return json(cells).dump(); }

std::vector<std::string> cells_from_json(const std::string& json_text) {
  if (json_text.empty()) return {};
  return json::parse(json_text).get<std::vector<std::string>>();
}

}  // namespace soffit::storage
