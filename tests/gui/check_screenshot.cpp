// Checks that a screenshot really shows something: the expected size, not one
// flat colour, more than a handful of colours. Exit 0 when it does, 1 (with
// the reason) when it does not. Used by the GUI ctest entries under Xvfb.
#include <stb_image.h>

#include <cstdio>
#include <cstdlib>
#include <set>

int main(int argc, char** argv) {
  if (argc != 4) {
    std::fprintf(stderr, "usage: check_screenshot PNG WIDTH HEIGHT\n");
    return 2;
  }
  int w = 0, h = 0, channels = 0;
  unsigned char* pixels = stbi_load(argv[1], &w, &h, &channels, 3);
  if (!pixels) {
    std::fprintf(stderr, "%s: not a readable image\n", argv[1]);
    return 1;
  }
  const int want_w = std::atoi(argv[2]), want_h = std::atoi(argv[3]);
  std::set<unsigned int> colours;
  long differing = 0;
  const long n = static_cast<long>(w) * h;
  const unsigned char* first = pixels;
  for (long i = 0; i < n; ++i) {
    const unsigned char* p = pixels + 3 * i;
    colours.insert((p[0] << 16) | (p[1] << 8) | p[2]);
    if (p[0] != first[0] || p[1] != first[1] || p[2] != first[2]) ++differing;
  }
  stbi_image_free(pixels);
  int failures = 0;
  if (w != want_w || h != want_h) {
    std::fprintf(stderr, "%s: %dx%d, expected %dx%d\n", argv[1], w, h, want_w, want_h);
    ++failures;
  }
  if (differing < n / 100) {
    std::fprintf(stderr, "%s: blank (%ld of %ld pixels differ from the first)\n", argv[1], differing, n);
    ++failures;
  }
  if (colours.size() < 16) {
    std::fprintf(stderr, "%s: only %zu colours\n", argv[1], colours.size());
    ++failures;
  }
  std::printf("%s: %dx%d, %zu colours, %.1f%% drawn: %s\n", argv[1], w, h, colours.size(),
              100.0 * static_cast<double>(differing) / static_cast<double>(n), failures ? "FAILED" : "ok");
  return failures ? 1 : 0;
}
