#include "geometry/sheet/survey_method.hpp"

namespace soffit {

std::string method_keyword(SurveyMethod method) {
  switch (method) {
    case SurveyMethod::xz_list: return "x,z list";
    case SurveyMethod::offsets: return "offsets";
    case SurveyMethod::polar: return "polar";
    case SurveyMethod::points: return "points";
  }
  return "";
}

std::optional<SurveyMethod> method_from_keyword(std::string_view word) {
  if (word == "offsets") return SurveyMethod::offsets;
  if (word == "polar") return SurveyMethod::polar;
  if (word == "points") return SurveyMethod::points;
  return std::nullopt;
}

}  // namespace soffit
