#pragma once
// The page machinery of the inspection report: an A4 portrait cairo PDF
// surface written into memory, a cursor that runs down the page and starts a
// new one when the next block does not fit, wrapped text, ruled tables and
// the footer on every page. Cairo's toy text API with DejaVu Sans (Debian's
// fonts-dejavu-core): enough for a report, and the same on every machine that
// builds Soffit.
#include <cairo.h>

#include <string>
#include <string_view>
#include <vector>

namespace soffit {

// ISO 216 A4 in PostScript points (1/72 in).
inline constexpr double kA4WidthPt = 595.276;
inline constexpr double kA4HeightPt = 841.890;
inline constexpr double kReportMarginPt = 42.0;

struct ReportColumn {
  std::string heading;
  double width_pt = 0.0;
  bool right_aligned = false;  // numbers line up on their last digit
};

class ReportPages {
 public:
  // `footer_left` is printed on every page beside "page N of M"; `total_pages`
  // 0 while the page count is not yet known (the first of two passes).
  ReportPages(std::string footer_left, int total_pages, const std::string& creation_date_iso,
              const std::string& creator);
  ~ReportPages();
  ReportPages(const ReportPages&) = delete;
  ReportPages& operator=(const ReportPages&) = delete;

  cairo_t* cr() { return cr_; }
  double left() const { return kReportMarginPt; }
  double width() const { return kA4WidthPt - 2 * kReportMarginPt; }
  double y() const { return y_; }
  void advance(double dy) { y_ += dy; }

  // Starts a new page unless `height_pt` still fits above the footer.
  void need(double height_pt);
  void new_page();

  void heading(std::string_view text, double size_pt);
  // Wrapped to the text width; returns the height used.
  double paragraph(std::string_view text, double size_pt, double indent_pt = 0.0);
  // Key–value lines, two columns.
  void facts(const std::vector<std::pair<std::string, std::string>>& rows);
  // A framed, tinted box holding a wrapped paragraph.
  void caution_box(std::string_view title, std::string_view text);
  // A header row and ruled body rows; a table that runs over a page repeats its header.
  void table(const std::vector<ReportColumn>& columns, const std::vector<std::vector<std::string>>& rows);

  int page_count() const { return page_; }
  std::string finish();  // the PDF bytes; the pages are spent afterwards

 private:
  void footer();
  void table_header(const std::vector<ReportColumn>& columns);
  std::vector<std::string> wrap(std::string_view text, double size_pt, double width_pt);

  cairo_surface_t* surface_ = nullptr;
  cairo_t* cr_ = nullptr;
  std::string bytes_;
  std::string footer_left_;
  int total_pages_ = 0;
  int page_ = 1;
  double y_ = kReportMarginPt;
};

// Sets the font face (DejaVu Sans, bold or not) and size.
void report_font(cairo_t* cr, double size_pt, bool bold = false);
// Draws `text` with its baseline at (x, y); anchor 0 left, 0.5 centre, 1 right.
void report_text(cairo_t* cr, double x, double y, std::string_view text, double anchor = 0.0);

}  // namespace soffit
