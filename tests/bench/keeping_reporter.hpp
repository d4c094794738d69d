#pragma once
// A console reporter that also keeps each benchmark's time per iteration, so a
// program can print ratios between benchmarks measured in the same run.
#include <benchmark/benchmark.h>

#include <map>
#include <string>
#include <vector>

namespace soffit::bench {

class KeepingReporter : public benchmark::ConsoleReporter {
 public:
  std::map<std::string, double> ms;  // benchmark name → milliseconds per iteration
  void ReportRuns(const std::vector<Run>& runs) override {
    for (const Run& r : runs)
      if (!r.error_occurred)
        ms[r.benchmark_name()] =
            r.GetAdjustedRealTime() / benchmark::GetTimeUnitMultiplier(r.time_unit) * 1e3;
    ConsoleReporter::ReportRuns(runs);
  }
};

}  // namespace soffit::bench
