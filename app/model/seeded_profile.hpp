#pragma once
// A section's profile fitted the same way every time it is shown: shape
// chosen automatically, Monte Carlo uncertainty from a fixed seed, so that a
// screen opened twice (or two visits compared) never differs by chance alone.
#include "geometry/analysis/profile_analysis.hpp"

namespace soffit::app {

// analyse_profile with `monte_carlo_draws` draws from seed 1. Runs for a while: call it on a worker.
ProfileAnalysis seeded_profile(const Readings& readings, int monte_carlo_draws);

}  // namespace soffit::app
