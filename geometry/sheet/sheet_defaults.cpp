#include "geometry/sheet/sheet_defaults.hpp"

#include "geometry/sheet/angles.hpp"

namespace soffit {

const std::vector<InstrumentClass>& instrument_classes() {
  // FIELD.md §3.1 typical 1σ precisions, "from memory" there; the middle of
  // each quoted range. Edit here, nowhere else.
  static const std::vector<InstrumentClass> classes = {
      {"string-line", "taut string line, taped offsets", 0.004, 0, 0, 0},
      {"laser-level", "laser or optical level datum, taped offsets", 0.0025, 0, 0, 0},
      {"handheld-laser", "handheld laser meter shot plumb up", 0.002, 0, 0, 0},
      // Tilt ±0.2° gives 10–17 mm across the line of sight at 3–5 m.
      {"handheld-laser-polar", "handheld laser meter, distance and tilt", 0.013, 0.002, 0,
       degrees_to_radians(0.2)},
      // Angles 1–5″, distance ±(2–3 mm + 2 ppm); ±3–5 mm on masonry.
      {"total-station", "total station, reflectorless", 0.004, 0.003, 2.0,
       degrees_to_radians(5.0 / 3600.0)},
      {"laser-scan", "registered laser scan, sliced", 0.0045, 0, 0, 0},
      {"levelling", "levelling to soffit points, inverted staff", 0.001, 0, 0, 0},
  };
  return classes;
}

const InstrumentClass* find_instrument_class(std::string_view key) {
  for (const InstrumentClass& c : instrument_classes()) {
    if (c.key == key) return &c;
  }
  return nullptr;
}

std::string instrument_class_list() {
  std::string s;
  for (const InstrumentClass& c : instrument_classes()) {
    if (!s.empty()) s += ", ";
    s += c.key;
  }
  return s;
}

const InstrumentClass& default_instrument_class(SurveyMethod method) {
  switch (method) {
    case SurveyMethod::polar: return *find_instrument_class("handheld-laser-polar");
    case SurveyMethod::points: return *find_instrument_class("total-station");
    case SurveyMethod::offsets:
    case SurveyMethod::xz_list: break;
  }
  return *find_instrument_class("laser-level");
}

const SheetLimits& sheet_limits() {
  static const SheetLimits limits;
  return limits;
}

}  // namespace soffit
