#pragma once
// A few SVG 1.1 primitives written as text, with coordinates in millimetres of
// paper (the viewBox is in mm, so a drawing printed at 100% is to scale).
// Numbers go through fixed_decimal (2 decimals: 0.01 mm of paper), text is
// XML-escaped: the same drawing always gives the same bytes, in any locale.
#include <string>
#include <string_view>
#include <vector>

#include "geometry/core/reading.hpp"

namespace soffit {

struct PaperPoint {
  double x = 0.0, y = 0.0;  // mm, y down
};

class SvgBuilder {
 public:
  SvgBuilder(double width_mm, double height_mm, std::string_view title);

  // `style` is a raw attribute list, e.g. R"(fill="none" stroke="#000")".
  void line(PaperPoint a, PaperPoint b, std::string_view style);
  void polyline(const std::vector<PaperPoint>& points, std::string_view style);
  void polygon(const std::vector<PaperPoint>& points, std::string_view style);
  void circle(PaperPoint centre, double radius, std::string_view style);
  void rect(PaperPoint corner, double width, double height, std::string_view style);
  // anchor: "start", "middle" or "end"; size in mm.
  void text(PaperPoint at, std::string_view content, double size, std::string_view anchor,
            std::string_view extra_style = {});
  void open_group(std::string_view id);
  void close_group();

  std::string finish();  // the whole document; the builder is spent afterwards

 private:
  std::string body_;
};

std::string xml_escape(std::string_view text);
// Greedy word wrap at `max_chars` characters per line.
std::vector<std::string> wrap_words(std::string_view text, std::size_t max_chars);

}  // namespace soffit
