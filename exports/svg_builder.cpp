#include "exports/svg_builder.hpp"

#include "exports/fixed_decimal.hpp"

namespace soffit {

namespace {

std::string num(double v) { return fixed_decimal(v, 2); }

std::string points_attribute(const std::vector<PaperPoint>& points) {
  std::string s;
  for (const PaperPoint& p : points) {
    if (!s.empty()) s += ' ';
    s += num(p.x) + "," + num(p.y);
  }
  return s;
}

}  // namespace

std::string xml_escape(std::string_view text) {
  std::string out;
  for (char c : text) {
    switch (c) {
      case '&': out += "&amp;"; break;
      case '<': out += "&lt;"; break;
      case '>': out += "&gt;"; break;
      case '"': out += "&quot;"; break;
      case '\'': out += "&apos;"; break;
      default:
        // Control characters are not allowed in XML 1.0 text.
        if (static_cast<unsigned char>(c) < 0x20 && c != '\t') out += ' ';
        else out += c;
    }
  }
  return out;
}

std::vector<std::string> wrap_words(std::string_view text, std::size_t max_chars) {
  std::vector<std::string> lines;
  std::string current;
  std::size_t i = 0;
  while (i < text.size()) {
    const std::size_t end = std::min(text.find(' ', i), text.size());
    const std::string_view word = text.substr(i, end - i);
    if (!current.empty() && current.size() + 1 + word.size() > max_chars) {
      lines.push_back(current);
      current.clear();
    }
    if (!word.empty()) current += (current.empty() ? "" : " ") + std::string(word);
    i = end + 1;
  }
  if (!current.empty()) lines.push_back(current);
  return lines;
}

SvgBuilder::SvgBuilder(double width_mm, double height_mm, std::string_view title) {
  body_ = "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
          "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"" + num(width_mm) +
          "mm\" height=\"" + num(height_mm) + "mm\" viewBox=\"0 0 " + num(width_mm) + " " + num(height_mm) +
          "\" font-family=\"DejaVu Sans, Arial, sans-serif\">\n<title>" + xml_escape(title) + "</title>\n";
  rect({0, 0}, width_mm, height_mm, R"(fill="#ffffff")");
}

void SvgBuilder::line(PaperPoint a, PaperPoint b, std::string_view style) {
  body_ += "<line x1=\"" + num(a.x) + "\" y1=\"" + num(a.y) + "\" x2=\"" + num(b.x) + "\" y2=\"" + num(b.y) +
           "\" " + std::string(style) + "/>\n";
}

void SvgBuilder::polyline(const std::vector<PaperPoint>& points, std::string_view style) {
  body_ += "<polyline points=\"" + points_attribute(points) + "\" " + std::string(style) + "/>\n";
}

void SvgBuilder::polygon(const std::vector<PaperPoint>& points, std::string_view style) {
  body_ += "<polygon points=\"" + points_attribute(points) + "\" " + std::string(style) + "/>\n";
}

void SvgBuilder::circle(PaperPoint centre, double radius, std::string_view style) {
  body_ += "<circle cx=\"" + num(centre.x) + "\" cy=\"" + num(centre.y) + "\" r=\"" + num(radius) + "\" " +
           std::string(style) + "/>\n";
}

void SvgBuilder::rect(PaperPoint corner, double width, double height, std::string_view style) {
  body_ += "<rect x=\"" + num(corner.x) + "\" y=\"" + num(corner.y) + "\" width=\"" + num(width) +
           "\" height=\"" + num(height) + "\" " + std::string(style) + "/>\n";
}

void SvgBuilder::text(PaperPoint at, std::string_view content, double size, std::string_view anchor,
                      std::string_view extra_style) {
  body_ += "<text x=\"" + num(at.x) + "\" y=\"" + num(at.y) + "\" font-size=\"" + num(size) +
           "\" text-anchor=\"" + std::string(anchor) + "\"" +
           (extra_style.empty() ? std::string() : " " + std::string(extra_style)) + ">" + xml_escape(content) +
           "</text>\n";
}

void SvgBuilder::open_group(std::string_view id) { body_ += "<g id=\"" + xml_escape(id) + "\">\n"; }

void SvgBuilder::close_group() { body_ += "</g>\n"; }

std::string SvgBuilder::finish() {
  body_ += "</svg>\n";
  return std::move(body_);
}

}  // namespace soffit
