#pragma once
// Reader for the NIST StRD nonlinear regression files kept in tests/data.
#include <cctype>
#include <fstream>
#include <sstream>
#include <string>
#include <vector>

namespace soffit::test {

struct NistDataset {
  std::vector<std::vector<double>> starts;  // starts[k][j]: start k+1, parameter j
  std::vector<double> certified;            // certified parameter values
  std::vector<double> certified_sd;         // certified standard deviations
  double certified_rss = 0.0;
  std::vector<double> x, y;
};

inline NistDataset load_nist(const std::string& path) {
  NistDataset d;
  std::ifstream in(path);
  std::string line;
  bool in_data = false;
  while (std::getline(in, line)) {
    if (!line.empty() && line.back() == '\r') line.pop_back();
    std::istringstream ls(line);
    if (in_data) {
      double y = 0, x = 0;
      if (ls >> y >> x) {
        d.y.push_back(y);
        d.x.push_back(x);
      }
      continue;
    }
    std::string first, eq;
    ls >> first;
    if (first.size() >= 2 && first[0] == 'b' && std::isdigit(static_cast<unsigned char>(first[1]))) {
      ls >> eq;
      if (eq != "=") continue;
      double s1, s2, value, sd;
      if (ls >> s1 >> s2 >> value >> sd) {
        if (d.starts.empty()) d.starts.resize(2);
        d.starts[0].push_back(s1);
        d.starts[1].push_back(s2);
        d.certified.push_back(value);
        d.certified_sd.push_back(sd);
      }
    } else if (first == "Residual" && line.find("Sum of Squares:") != std::string::npos) {
      d.certified_rss = std::stod(line.substr(line.find(':') + 1));
    } else if (first == "Data:") {
      // The header also has a "Data:" line describing the responses; the
      // table starts at the one that names the columns "y x".
      std::string a, b;
      in_data = (ls >> a >> b) && a == "y" && b == "x";
    }
  }
  return d;
}

}  // namespace soffit::test
