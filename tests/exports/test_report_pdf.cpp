// The inspection report: `soffit export … --format pdf` writes one A4 PDF that
// poppler (Debian's poppler-utils, a PDF reader outside Soffit) opens, counts,
// renders and reads back as text. Each rendered page must show a drawing, not
// an empty sheet; the text must hold the caution and the structure reference.
#include <doctest/doctest.h>
#include <stb_image.h>

#include <algorithm>
#include <cctype>
#include <filesystem>
#include <set>
#include <string>

#include "tests/cli/run_command.hpp"
#include "tests/exports/geometry_json_support.hpp"

namespace fs = std::filesystem;
using soffit::test::ExportDir;
using soffit::test::run_soffit;

namespace {

struct PageLook {
  long pixels = 0, non_white = 0;
  size_t colours = 0;
};

PageLook look_at(const std::string& png) {
  PageLook look;
  int w = 0, h = 0, channels = 0;
  unsigned char* pixels = stbi_load(png.c_str(), &w, &h, &channels, 3);
  REQUIRE_MESSAGE(pixels != nullptr, png);
  std::set<int> colours;
  for (long i = 0; i < static_cast<long>(w) * h; ++i) {
    const unsigned char* p = pixels + 3 * i;
    if (p[0] < 245 || p[1] < 245 || p[2] < 245) ++look.non_white;
    colours.insert(p[0] << 16 | p[1] << 8 | p[2]);
  }
  stbi_image_free(pixels);
  look.pixels = static_cast<long>(w) * h;
  look.colours = colours.size();
  return look;
}

// pdftotext breaks lines where the layout does: compare on single spaces.
std::string squeezed(const std::string& text) {
  std::string out;
  for (char c : text) {
    const bool space = std::isspace(static_cast<unsigned char>(c)) != 0;
    if (space && (out.empty() || out.back() == ' ')) continue;
    out += space ? ' ' : c;
  }
  return out;
}

int pdfinfo_pages(const std::string& info) {
  const size_t at = info.find("Pages:");
  if (at == std::string::npos) return -1;
  return std::stoi(info.substr(at + 6));
}

}  // namespace

TEST_CASE("report PDF: soffit export --format pdf writes an A4 report that poppler opens, renders and reads") {
  if (!soffit::test::program_available("pdftoppm") || !soffit::test::program_available("pdfinfo") ||
      !soffit::test::program_available("pdftotext")) {
    MESSAGE("report PDF check skipped: Debian's poppler-utils is not installed (.ci/install-deps installs it)");
    return;
  }
  ExportDir dir;
  const fs::path out = dir.path() / "report";
  const auto r = run_soffit("export " + soffit::test::demo_project_path() + " --structure " + soffit::test::kDemoRef +
                            " --inspection 2019-05-14 --mc 100 --format pdf --out " + out.string());
  REQUIRE_MESSAGE(r.exit_code == 0, r.err);
  const fs::path pdf = out / "BVDC-ST-0417_2019-05-14_report.pdf";
  CHECK(r.out == pdf.string() + "\n");  // only the report was asked for
  REQUIRE(fs::exists(pdf));
  // Same data, same bytes: cairo writes no clock time once the creation date is set.
  const fs::path again = dir.path() / "again";
  REQUIRE(run_soffit("export " + soffit::test::demo_project_path() + " --structure " + soffit::test::kDemoRef +
                     " --inspection 2019-05-14 --mc 100 --format pdf --out " + again.string())
              .exit_code == 0);
  CHECK(soffit::test::read_text(pdf.string()) == soffit::test::read_text((again / pdf.filename()).string()));

  // pdfinfo (poppler): a title page plus at least one page per span.
  REQUIRE(soffit::test::run_logged("pdfinfo " + pdf.string(), dir.file("info.txt")) == 0);
  const std::string info = soffit::test::read_text(dir.file("info.txt"));
  const int pages = pdfinfo_pages(info);
  CAPTURE(info);
  CHECK(pages >= 2);
  // ISO 216: A4 is 210 × 297 mm = 595.28 × 841.89 pt; pdfinfo prints whole or 2-decimal points.
  CHECK(info.find("595.") != std::string::npos);
  CHECK(info.find("841.") != std::string::npos);
  // The creation date is the inspection's, not the clock's.
  CHECK(info.find("2019") != std::string::npos);

  // pdftoppm renders every page; each must carry a drawing or a table, not a blank sheet.
  REQUIRE(soffit::test::run_logged("pdftoppm -r 50 -png " + pdf.string() + " " + dir.file("page"),
                                   dir.file("pdftoppm.log")) == 0);
  int rendered = 0;
  for (const auto& e : fs::directory_iterator(dir.path())) {
    const std::string name = e.path().filename().string();
    if (name.rfind("page", 0) != 0 || e.path().extension() != ".png") continue;
    ++rendered;
    CAPTURE(name);
    const PageLook look = look_at(e.path().string());
    // At 50 dpi an A4 page is about 413 × 585 px; a page of text and lines covers
    // well over 1% of it (a blank page covers 0), and antialiased text and the
    // coloured drawings give far more than a handful of distinct colours.
    CHECK(look.non_white > look.pixels / 100);
    CHECK(look.colours > 16);
  }
  CHECK(rendered == pages);

  // pdftotext (poppler) reads back the caution, the reference and the visit.
  REQUIRE(soffit::test::run_logged("pdftotext -layout " + pdf.string() + " " + dir.file("report.txt"),
                                   dir.file("pdftotext.log")) == 0);
  const std::string text = squeezed(soffit::test::read_text(dir.file("report.txt")));
  // Issue 5 wording of the caution: "survey data, not an assessment; defer to local codes and a qualified engineer".
  CHECK(text.find("Survey data, not an assessment") != std::string::npos);
  CHECK(text.find("qualified engineer") != std::string::npos);
  CHECK(text.find("local codes") != std::string::npos);
  CHECK(text.find("BVDC-ST-0417") != std::string::npos);  // the demo structure's reference (FIELD.md §10)
  CHECK(text.find("2019-05-14") != std::string::npos);
  CHECK(text.find("fictitious") != std::string::npos);   // the demo location is invented and must say so
  CHECK(text.find("page 1 of " + std::to_string(pages)) != std::string::npos);
}
