// The SVG elevation (issue 5 "SVG elevation of each span"): renders with
// rsvg-convert (librsvg, Debian's librsvg2-bin) and is not blank, shows the
// ring and the fill when given, escapes text, and is byte-deterministic.
#include <doctest/doctest.h>
#include <stb_image.h>

#include <cmath>
#include <stdexcept>
#include <string>

#include "exports/section_svg.hpp"
#include "tests/exports/export_test_support.hpp"

using namespace soffit;
using soffit::test::ExportDir;
using soffit::test::fitted_demo;

namespace {

struct Raster {
  int width = 0, height = 0;
  long non_white = 0, ring = 0, fill = 0;
};

bool near(const unsigned char* px, int r, int g, int b) {
  return std::abs(px[0] - r) <= 6 && std::abs(px[1] - g) <= 6 && std::abs(px[2] - b) <= 6;
}

// Renders at 96 dpi and counts pixels: any not white, the ring's and the fill's colours.
std::optional<Raster> render(const ExportDir& dir, const std::string& svg) {
  const std::string in = dir.file("e.svg"), out = dir.file("e.png");
  soffit::test::write_text(in, svg);
  const int rc = soffit::test::run_logged("rsvg-convert -d 96 -p 96 -o " + out + " " + in, dir.file("rsvg.log"));
  INFO(soffit::test::read_text(dir.file("rsvg.log")));
  CHECK(rc == 0);
  if (rc != 0) return std::nullopt;
  Raster r;
  int channels = 0;
  unsigned char* pixels = stbi_load(out.c_str(), &r.width, &r.height, &channels, 3);
  REQUIRE(pixels != nullptr);
  for (long i = 0; i < static_cast<long>(r.width) * r.height; ++i) {
    const unsigned char* p = pixels + 3 * i;
    if (p[0] < 245 || p[1] < 245 || p[2] < 245) ++r.non_white;
    if (near(p, 0xd8, 0xa5, 0x8c)) ++r.ring;
    if (near(p, 0xea, 0xdf, 0xc4)) ++r.fill;
  }
  stbi_image_free(pixels);
  return r;
}

double declared_mm(const std::string& svg, const std::string& attribute) {
  const size_t at = svg.find(attribute + "=\"");
  REQUIRE(at != std::string::npos);
  return std::stod(svg.substr(at + attribute.size() + 2));
}

}  // namespace

TEST_CASE("section SVG: renders with rsvg-convert, to its declared size, not blank, ring and fill shown") {
  if (!soffit::test::program_available("rsvg-convert")) {
    MESSAGE("rsvg-convert is missing (Debian librsvg2-bin; .ci/install-deps installs it): render check skipped");
    return;
  }
  const auto s = fitted_demo();
  RingFillOptions options;
  options.ring_thickness_m = 0.465;  // FIELD.md §10.3: d best 0.465 m over the S1 crown
  options.road_z_m = 12.052 - 9.500;  // FIELD.md §10.3: road RL at the centreline, springing RL 9.500
  const std::string svg = section_svg(s.sheet, s.analysis, options, "soffit test");
  CHECK(svg.rfind("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<svg", 0) == 0);
  CHECK(svg.find("nan") == std::string::npos);
  CHECK(svg.find("href") == std::string::npos);  // no external resources
  CHECK(svg.find("not a structural assessment") != std::string::npos);
  CHECK(svg.find("span 6.39") != std::string::npos);  // FIELD.md §10.2: span 6.3975 m
  CHECK(svg.find("rise 1597.") != std::string::npos);  // FIELD.md §10.2: rise 1597.3 mm
  CHECK(svg.find("scale 1:50") != std::string::npos);

  ExportDir dir;
  const auto raster = render(dir, svg);
  REQUIRE(raster);
  // 96 px per inch of 25.4 mm (rsvg-convert -d 96); rounding gives ±1 px.
  CHECK(std::abs(raster->width - declared_mm(svg, "width") / 25.4 * 96) <= 1.0);
  CHECK(std::abs(raster->height - declared_mm(svg, "height") / 25.4 * 96) <= 1.0);
  const double total = static_cast<double>(raster->width) * raster->height;
  CHECK(raster->non_white / total > 0.05);
  CHECK(raster->non_white / total < 0.8);
  // Ring ≈ 0.465 m × 7.8 m and fill ≈ 4.9 m² at 1:50 and 96 dpi: thousands of pixels each.
  CHECK(raster->ring > 2000);
  CHECK(raster->fill > 2000);
}

TEST_CASE("section SVG: without ring or road only the intrados and readings are drawn") {
  if (!soffit::test::program_available("rsvg-convert")) {
    MESSAGE("rsvg-convert is missing: render check skipped");
    return;
  }
  const auto s = fitted_demo();
  ExportDir dir;
  const auto raster = render(dir, section_svg(s.sheet, s.analysis, {}, "soffit test"));
  REQUIRE(raster);
  CHECK(raster->non_white > 1000);
  CHECK(raster->ring == 0);
  CHECK(raster->fill == 0);
}

TEST_CASE("section SVG: text from the sheet is escaped, so the file stays well-formed XML") {
  if (!soffit::test::program_available("rsvg-convert")) {
    MESSAGE("rsvg-convert is missing: render check skipped");
    return;
  }
  const std::string sheet =
      "soffit-sheet,1\nstructure_name,\"Mill <Lane> & \"\"Old\"\" Bridge\"\nmethod,offsets\n"
      "datum_rl_m,9.800\nz_origin_rl_m,9.500\nsigma_mm,3\nreadings\nstation_m,offset_mm\n"
      "0,-300\n0.4,160\n0.8,493\n1.6,968\n2.4,1216\n3.2,1302\n4.0,1217\n4.8,957\n5.6,492\n6.0,154\n6.4,-300\n";
  const auto s = soffit::test::fitted_text(sheet, "odd&<name>.csv");
  const std::string svg = section_svg(s.sheet, s.analysis, {}, "soffit test");
  CHECK(svg.find("Mill &lt;Lane&gt; &amp; &quot;Old&quot; Bridge") != std::string::npos);
  ExportDir dir;
  CHECK(render(dir, svg).has_value());
}

TEST_CASE("section SVG: deterministic, and a road below the ring is refused with the reason") {
  const auto s = fitted_demo();
  RingFillOptions options;
  options.ring_thickness_m = 0.465;
  options.road_z_m = 2.552;
  CHECK(section_svg(s.sheet, s.analysis, options, "t") == section_svg(s.sheet, s.analysis, options, "t"));
  options.road_z_m = 1.9;  // below the extrados crown, 1.597 + 0.465 m (FIELD.md §10.2–10.3)
  CHECK_THROWS_WITH_AS(section_svg(s.sheet, s.analysis, options, "t"),
                       doctest::Contains("is not above the top of the extrados"), std::invalid_argument);
}

TEST_CASE("section SVG: drawing scales are the usual ones and fit 250 mm of paper") {
  // Common practice: elevations at 1:20, 1:25, 1:50, 1:100, 1:200.
  CHECK(drawing_scale_for(7.4) == 50);   // 148 mm
  CHECK(drawing_scale_for(4.9) == 20);   // 245 mm
  CHECK(drawing_scale_for(5.1) == 25);   // 204 mm
  CHECK(drawing_scale_for(20.0) == 100);
}
