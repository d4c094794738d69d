// Geometric circle fit of a 10⁶-point scan of a segmental arch, against one
// plain pass over the same points (the memory-bound floor of any fit).
// Targets (project brief): fit < 40 ms, fit / plain pass < 20, measured in the
// same run. Build Release; run ./build/tests/bench/bench_circle_scan.
#include <benchmark/benchmark.h>

#include <cmath>
#include <cstdio>
#include <random>
#include <string>
#include <vector>

#include "geometry/fit/circle_geometric.hpp"
#include "tests/bench/keeping_reporter.hpp"

namespace {

// Segmental arch, span 10 m, rise 2.5 m: R 6.25 m, centre (5, −3.75) (REFERENCES.md §1, C2),
// scanned at random angles with 2 mm radial noise. Seeded: every run fits the same points.
const std::vector<soffit::Point2>& scan() {
  static const std::vector<soffit::Point2> points = [] {
    std::mt19937_64 rng(19940558);
    const double from = std::atan2(3.75, 5.0), to = std::atan2(3.75, -5.0);
    std::uniform_real_distribution<double> angle(from, to);
    std::normal_distribution<double> noise(0.0, 0.002);
    std::vector<soffit::Point2> p(1'000'000);
    for (auto& q : p) {
      const double t = angle(rng), r = 6.25 + noise(rng);
      q = {5.0 + r * std::cos(t), -3.75 + r * std::sin(t)};
    }
    return p;
  }();
  return points;
}

void plain_pass(benchmark::State& state) {
  const auto& p = scan();
  for (auto _ : state) {
    double sx = 0, sz = 0;
    for (const auto& q : p) {
      sx += q.x;
      sz += q.z;
    }
    benchmark::DoNotOptimize(sx);
    benchmark::DoNotOptimize(sz);
  }
}

void geometric_fit(benchmark::State& state) {
  const auto& p = scan();
  int iterations = 0;
  for (auto _ : state) {
    const auto fit = soffit::fit_circle_geometric(p);
    if (!fit || !fit->converged) state.SkipWithError("fit failed");
    iterations = fit ? fit->iterations : -1;
    benchmark::DoNotOptimize(fit);
  }
  state.counters["solver_iterations"] = iterations;
}

BENCHMARK(plain_pass)->Unit(benchmark::kMillisecond);
BENCHMARK(geometric_fit)->Unit(benchmark::kMillisecond);

}  // namespace

int main(int argc, char** argv) {
  benchmark::Initialize(&argc, argv);
  if (benchmark::ReportUnrecognizedArguments(argc, argv)) return 1;
  const auto fit = soffit::fit_circle_geometric(scan());
  if (fit)
    std::printf("fit: centre (%.6f, %.6f) R %.6f, RSS %.6g, %d solver iterations, %s\n",
                fit->circle.cx, fit->circle.cz, fit->circle.r, fit->rss, fit->iterations,
                fit->message.c_str());
  soffit::bench::KeepingReporter reporter;
  benchmark::RunSpecifiedBenchmarks(&reporter);
  benchmark::Shutdown();
  if (!reporter.ms.count("plain_pass") || !reporter.ms.count("geometric_fit")) {
    std::printf("run both benchmarks to compare them\n");
    return 0;
  }
  const double pass = reporter.ms["plain_pass"], full = reporter.ms["geometric_fit"];
  const double ratio = full / pass;
  std::printf("plain pass %.3f ms, geometric fit %.3f ms, ratio %.1f\n", pass, full, ratio);
  std::printf("target fit < 40 ms: %s; target ratio < 20: %s\n", full < 40 ? "met" : "NOT met",
              ratio < 20 ? "met" : "NOT met");
  return full < 40 && ratio < 20 ? 0 : 2;
}
