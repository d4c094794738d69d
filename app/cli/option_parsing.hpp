#pragma once
// Walks a verb's arguments; numbers are parsed locale-independently.
#include <charconv>
#include <cmath>
#include <stdexcept>
#include <string>
#include <string_view>

namespace soffit::cli {

class UsageError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

class OptionCursor {
 public:
  // argv[0] is the verb itself.
  OptionCursor(int argc, char** argv, std::string_view verb) : argc_(argc), argv_(argv), verb_(verb) {}

  bool more() const { return index_ < argc_; }
  std::string_view next() { return argv_[index_++]; }

  std::string_view value(std::string_view option) {
    if (!more()) throw UsageError(std::string(option) + " needs a value");
    return next();
  }

  double number(std::string_view option) {
    const std::string_view text = value(option);
    double v = 0.0;
    const auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), v);
    if (ec != std::errc() || end != text.data() + text.size() || !std::isfinite(v))
      throw UsageError(std::string(option) + " needs a number, not '" + std::string(text) + "'");
    return v;
  }

  long long integer(std::string_view option, long long min, long long max = 1LL << 62) {
    const std::string_view text = value(option);
    long long v = 0;
    const auto [end, ec] = std::from_chars(text.data(), text.data() + text.size(), v);
    if (ec != std::errc() || end != text.data() + text.size() || v < min || v > max)
      throw UsageError(std::string(option) + " needs a whole number from " + std::to_string(min) +
                       ", not '" + std::string(text) + "'");
    return v;
  }

 private:
  int argc_;
  char** argv_;
  std::string_view verb_;
  int index_ = 1;
};

}  // namespace soffit::cli
