#pragma once
// An error in user data, located precisely enough to fix it: file, line, field.
#include <stdexcept>
#include <string>

namespace soffit {

class InputError : public std::runtime_error {
 public:
  InputError(std::string file, int line, std::string field, const std::string& what)
      : std::runtime_error(compose(file, line, field, what)),
        file_(std::move(file)), line_(line), field_(std::move(field)) {}

  const std::string& file() const { return file_; }
  int line() const { return line_; }           // 0 when the problem is the whole file
  const std::string& field() const { return field_; }  // empty when no single field

 private:
  static std::string compose(const std::string& file, int line, const std::string& field,
                             const std::string& what) {
    std::string s;
    s.append(file);
    if (line > 0) s.append(":").append(std::to_string(line));
    s.append(": ");
    if (!field.empty()) s.append("field '").append(field).append("': ");
    s.append(what);
    return s;
  }
  std::string file_;
  int line_;
  std::string field_;
};

}  // namespace soffit
