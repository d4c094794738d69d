#include "app/model/local_time.hpp"

#include <ctime>

namespace soffit::app {

namespace {

std::string local_now(const char* format) {
  const std::time_t now = std::time(nullptr);
  std::tm local{};
  localtime_r(&now, &local);
  char buf[32];
  std::strftime(buf, sizeof buf, format, &local);
  return buf;
}

}  // namespace

std::string today_iso() { return local_now("%Y-%m-%d"); }

std::string clock_hhmm() { return local_now("%H:%M"); }

}  // namespace soffit::app
