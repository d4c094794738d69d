#pragma once
// Runs the built `soffit` binary and captures its exit code, stdout and stderr.
#include <sys/wait.h>
#include <unistd.h>

#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <string>

namespace soffit::test {

struct CommandResult {
  int exit_code = -1;
  std::string out, err;
};

inline std::string slurp(const std::string& path) {
  std::ifstream in(path);
  std::stringstream s;
  s << in.rdbuf();
  return s.str();
}

inline CommandResult run_soffit(const std::string& arguments) {
  static int counter = 0;
  const std::string base = "/tmp/soffit_cli_test_" + std::to_string(::getpid()) + "_" + std::to_string(counter++);
  const std::string command = std::string(SOFFIT_BINARY) + " " + arguments + " >" + base + ".out 2>" + base + ".err";
  const int status = std::system(command.c_str());
  CommandResult r;
  r.exit_code = WIFEXITED(status) ? WEXITSTATUS(status) : -1;
  r.out = slurp(base + ".out");
  r.err = slurp(base + ".err");
  std::remove((base + ".out").c_str());
  std::remove((base + ".err").c_str());
  return r;
}

// Writes `text` to a fresh file and returns its path.
inline std::string write_temp(const std::string& name, const std::string& text) {
  const std::string path = "/tmp/soffit_cli_" + std::to_string(::getpid()) + "_" + name;
  std::ofstream(path) << text;
  return path;
}

}  // namespace soffit::test
