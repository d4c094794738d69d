#include "exports/report_pdf_layout.hpp"

#include <cairo-pdf.h>

#include <stdexcept>

namespace soffit {

namespace {

constexpr double kFooterHeightPt = 28.0;
constexpr double kRowPaddingPt = 3.0;

cairo_status_t append_bytes(void* closure, const unsigned char* data, unsigned int length) {
  static_cast<std::string*>(closure)->append(reinterpret_cast<const char*>(data), length);
  return CAIRO_STATUS_SUCCESS;
}

double bottom_limit() { return kA4HeightPt - kReportMarginPt - kFooterHeightPt; }

}  // namespace

void report_font(cairo_t* cr, double size_pt, bool bold) {
  cairo_select_font_face(cr, "DejaVu Sans", CAIRO_FONT_SLANT_NORMAL,
                         bold ? CAIRO_FONT_WEIGHT_BOLD : CAIRO_FONT_WEIGHT_NORMAL);
  cairo_set_font_size(cr, size_pt);
}

void report_text(cairo_t* cr, double x, double y, std::string_view text, double anchor) {
  const std::string s(text);
  if (anchor != 0.0) {
    cairo_text_extents_t e;
    cairo_text_extents(cr, s.c_str(), &e);
    x -= anchor * e.x_advance;
  }
  cairo_move_to(cr, x, y);
  cairo_show_text(cr, s.c_str());
}

ReportPages::ReportPages(std::string footer_left, int total_pages, const std::string& creation_date_iso,
                         const std::string& creator)
    : footer_left_(std::move(footer_left)), total_pages_(total_pages) {
  surface_ = cairo_pdf_surface_create_for_stream(append_bytes, &bytes_, kA4WidthPt, kA4HeightPt);
  // The inspection date, not the clock: the same data gives the same document
  // metadata (cairo 1.16 writes no other time into the file when this is set).
  cairo_pdf_surface_set_metadata(surface_, CAIRO_PDF_METADATA_CREATE_DATE, (creation_date_iso + "T00:00:00").c_str());
  cairo_pdf_surface_set_metadata(surface_, CAIRO_PDF_METADATA_TITLE, "Arch bridge inspection report");
  cairo_pdf_surface_set_metadata(surface_, CAIRO_PDF_METADATA_CREATOR, creator.c_str());
  cr_ = cairo_create(surface_);
  if (cairo_status(cr_) != CAIRO_STATUS_SUCCESS)
    throw std::runtime_error(std::string("PDF report: cairo: ") + cairo_status_to_string(cairo_status(cr_)));
}

ReportPages::~ReportPages() {
  if (cr_) cairo_destroy(cr_);
  if (surface_) cairo_surface_destroy(surface_);
}

void ReportPages::footer() {
  cairo_save(cr_);
  const double y = kA4HeightPt - kReportMarginPt;
  cairo_set_source_rgb(cr_, 0.55, 0.55, 0.55);
  cairo_set_line_width(cr_, 0.5);
  cairo_move_to(cr_, left(), y - 12);
  cairo_line_to(cr_, left() + width(), y - 12);
  cairo_stroke(cr_);
  cairo_set_source_rgb(cr_, 0.3, 0.3, 0.3);
  report_font(cr_, 6.5);
  report_text(cr_, left(), y, footer_left_);
  const std::string page = "page " + std::to_string(page_) +
                           (total_pages_ > 0 ? " of " + std::to_string(total_pages_) : std::string());
  report_text(cr_, left() + width(), y, page, 1.0);
  cairo_restore(cr_);
}

void ReportPages::new_page() {
  footer();
  cairo_show_page(cr_);
  ++page_;
  y_ = kReportMarginPt;
}

void ReportPages::need(double height_pt) {
  if (y_ + height_pt > bottom_limit() && y_ > kReportMarginPt) new_page();
}

void ReportPages::heading(std::string_view text, double size_pt) {
  need(size_pt * 2.5);
  y_ += size_pt * 1.2;
  cairo_set_source_rgb(cr_, 0.1, 0.2, 0.35);
  report_font(cr_, size_pt, true);
  report_text(cr_, left(), y_, text);
  y_ += size_pt * 0.6;
}

std::vector<std::string> ReportPages::wrap(std::string_view text, double size_pt, double width_pt) {
  report_font(cr_, size_pt);
  std::vector<std::string> lines;
  std::string line;
  size_t i = 0;
  while (i < text.size()) {
    size_t j = text.find(' ', i);
    if (j == std::string_view::npos) j = text.size();
    const std::string word(text.substr(i, j - i));
    const std::string candidate = line.empty() ? word : line + " " + word;
    cairo_text_extents_t e;
    cairo_text_extents(cr_, candidate.c_str(), &e);
    if (e.x_advance > width_pt && !line.empty()) {
      lines.push_back(line);
      line = word;
    } else {
      line = candidate;
    }
    i = j + 1;
  }
  if (!line.empty()) lines.push_back(line);
  return lines;
}

double ReportPages::paragraph(std::string_view text, double size_pt, double indent_pt) {
  const double start = y_;
  const double leading = size_pt * 1.35;
  for (const std::string& line : wrap(text, size_pt, width() - indent_pt)) {
    need(leading);
    y_ += leading;
    cairo_set_source_rgb(cr_, 0, 0, 0);
    report_font(cr_, size_pt);
    report_text(cr_, left() + indent_pt, y_, line);
  }
  y_ += size_pt * 0.4;
  return y_ - start;
}

void ReportPages::facts(const std::vector<std::pair<std::string, std::string>>& rows) {
  constexpr double size = 8.5, leading = 12.0, key_width = 130.0;
  for (const auto& [key, value] : rows) {
    const std::vector<std::string> lines = wrap(value.empty() ? "—" : value, size, width() - key_width);
    need(leading * static_cast<double>(lines.size()));
    cairo_set_source_rgb(cr_, 0.3, 0.3, 0.3);
    report_font(cr_, size, true);
    report_text(cr_, left(), y_ + leading, key);
    cairo_set_source_rgb(cr_, 0, 0, 0);
    report_font(cr_, size);
    for (const std::string& line : lines) {
      y_ += leading;
      report_text(cr_, left() + key_width, y_, line);
    }
  }
  y_ += 4;
}

void ReportPages::caution_box(std::string_view title, std::string_view text) {
  constexpr double size = 9.0, leading = 12.5, pad = 8.0;
  const std::vector<std::string> lines = wrap(text, size, width() - 2 * pad);
  const double height = pad * 2 + leading * static_cast<double>(lines.size() + 1);
  need(height + 8);
  y_ += 4;
  cairo_rectangle(cr_, left(), y_, width(), height);
  cairo_set_source_rgb(cr_, 1.0, 0.95, 0.82);
  cairo_fill_preserve(cr_);
  cairo_set_source_rgb(cr_, 0.75, 0.45, 0.0);
  cairo_set_line_width(cr_, 1.5);
  cairo_stroke(cr_);
  double y = y_ + pad;
  cairo_set_source_rgb(cr_, 0.45, 0.25, 0.0);
  report_font(cr_, size + 1, true);
  y += leading;
  report_text(cr_, left() + pad, y, title);
  cairo_set_source_rgb(cr_, 0, 0, 0);
  report_font(cr_, size);
  for (const std::string& line : lines) {
    y += leading;
    report_text(cr_, left() + pad, y, line);
  }
  y_ += height + 6;
}

void ReportPages::table_header(const std::vector<ReportColumn>& columns) {
  constexpr double size = 7.5, row = size + 2 * kRowPaddingPt + 2;
  double total = 0;
  for (const ReportColumn& c : columns) total += c.width_pt;
  cairo_rectangle(cr_, left(), y_, total, row);
  cairo_set_source_rgb(cr_, 0.86, 0.90, 0.95);
  cairo_fill(cr_);
  cairo_set_source_rgb(cr_, 0.1, 0.2, 0.35);
  report_font(cr_, size, true);
  double x = left();
  for (const ReportColumn& c : columns) {
    if (c.right_aligned) report_text(cr_, x + c.width_pt - 3, y_ + row - kRowPaddingPt - 1, c.heading, 1.0);
    else report_text(cr_, x + 3, y_ + row - kRowPaddingPt - 1, c.heading);
    x += c.width_pt;
  }
  y_ += row;
}

void ReportPages::table(const std::vector<ReportColumn>& columns, const std::vector<std::vector<std::string>>& rows) {
  constexpr double size = 7.5, leading = 9.5;
  double total = 0;
  for (const ReportColumn& c : columns) total += c.width_pt;
  need(3 * (leading + 2 * kRowPaddingPt));
  table_header(columns);
  for (const std::vector<std::string>& r : rows) {
    std::vector<std::vector<std::string>> cells;
    size_t lines = 1;
    for (size_t k = 0; k < columns.size(); ++k) {
      cells.push_back(wrap(k < r.size() ? r[k] : std::string(), size, columns[k].width_pt - 6));
      lines = std::max(lines, cells.back().size());
    }
    const double height = leading * static_cast<double>(lines) + 2 * kRowPaddingPt;
    if (y_ + height > bottom_limit()) {
      new_page();
      table_header(columns);
    }
    cairo_set_source_rgb(cr_, 0, 0, 0);
    report_font(cr_, size);
    double x = left();
    for (size_t k = 0; k < columns.size(); ++k) {
      double y = y_ + kRowPaddingPt;
      for (const std::string& line : cells[k]) {
        y += leading;
        if (columns[k].right_aligned) report_text(cr_, x + columns[k].width_pt - 3, y - 2, line, 1.0);
        else report_text(cr_, x + 3, y - 2, line);
      }
      x += columns[k].width_pt;
    }
    y_ += height;
    cairo_set_source_rgb(cr_, 0.75, 0.75, 0.75);
    cairo_set_line_width(cr_, 0.4);
    cairo_move_to(cr_, left(), y_);
    cairo_line_to(cr_, left() + total, y_);
    cairo_stroke(cr_);
  }
  y_ += 8;
}

std::string ReportPages::finish() {
  footer();
  cairo_show_page(cr_);
  cairo_destroy(cr_);
  cr_ = nullptr;
  cairo_surface_finish(surface_);
  const cairo_status_t status = cairo_surface_status(surface_);
  cairo_surface_destroy(surface_);
  surface_ = nullptr;
  if (status != CAIRO_STATUS_SUCCESS)
    throw std::runtime_error(std::string("PDF report: cairo: ") + cairo_status_to_string(status));
  return std::move(bytes_);
}

}  // namespace soffit
