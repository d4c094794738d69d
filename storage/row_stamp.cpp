#include "storage/row_stamp.hpp"

#include <chrono>
#include <cstdio>
#include <ctime>
#include <random>

#include <sys/random.h>

namespace soffit::storage {

std::string new_uuid() {
  // The kernel's entropy source, drawn afresh per call, so that forked
  // processes never repeat each other's keys: one getrandom() call for all
  // 16 bytes (an import writes hundreds of keys), std::random_device if that fails.
  unsigned char b[16];
  if (::getrandom(b, sizeof b, 0) != static_cast<ssize_t>(sizeof b)) {
    std::random_device rd;
    for (int i = 0; i < 16; i += 4) {
      const unsigned v = rd();
      b[i] = v & 0xff;
      b[i + 1] = (v >> 8) & 0xff;
      b[i + 2] = (v >> 16) & 0xff;
      b[i + 3] = (v >> 24) & 0xff;
    }
  }
  b[6] = static_cast<unsigned char>((b[6] & 0x0f) | 0x40);  // version 4
  b[8] = static_cast<unsigned char>((b[8] & 0x3f) | 0x80);  // RFC 4122 variant
  char out[37];
  std::snprintf(out, sizeof out, "%02x%02x%02x%02x-%02x%02x-%02x%02x-%02x%02x-%02x%02x%02x%02x%02x%02x",
                b[0], b[1], b[2], b[3], b[4], b[5], b[6], b[7], b[8], b[9], b[10], b[11], b[12], b[13],
                b[14], b[15]);
  return out;
}

std::string utc_now() {
  const auto now = std::chrono::system_clock::now();
  const auto ms = std::chrono::duration_cast<std::chrono::milliseconds>(now.time_since_epoch()).count() % 1000;
  const std::time_t t = std::chrono::system_clock::to_time_t(now);
  std::tm tm{};
  gmtime_r(&t, &tm);
  char out[64];
  std::snprintf(out, sizeof out, "%04d-%02d-%02dT%02d:%02d:%02d.%03dZ", tm.tm_year + 1900, tm.tm_mon + 1,
                tm.tm_mday, tm.tm_hour, tm.tm_min, tm.tm_sec, static_cast<int>(ms));
  return out;
}

}  // namespace soffit::storage
