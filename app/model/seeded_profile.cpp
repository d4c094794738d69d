#include "app/model/seeded_profile.hpp"

namespace soffit::app {

ProfileAnalysis seeded_profile(const Readings& readings, int monte_carlo_draws) {
  ProfileRequest request;
  request.uncertainty.monte_carlo_draws = monte_carlo_draws;
  request.uncertainty.seed = 1;
  return analyse_profile(readings, request);
}

}  // namespace soffit::app
