#pragma once
// Seeded standard normal draws that are the same on every platform and
// standard library (std::normal_distribution is implementation-defined, so a
// Monte Carlo run would not reproduce across compilers).
// Generator: xoshiro256** seeded by splitmix64 (Blackman & Vigna, 2018);
// normal deviates by Marsaglia's polar method (Marsaglia & Bray, 1964).
#include <cmath>
#include <cstdint>

namespace soffit {

class NormalSource {
 public:
  explicit NormalSource(std::uint64_t seed) {
    for (auto& word : state_) word = splitmix64(seed);
  }

  double next() {
    if (has_spare_) {
      has_spare_ = false;
      return spare_;
    }
    double u, v, s;
    do {
      u = 2.0 * uniform() - 1.0;
      v = 2.0 * uniform() - 1.0;
      s = u * u + v * v;
    } while (s >= 1.0 || s == 0.0);
    const double f = std::sqrt(-2.0 * std::log(s) / s);
    spare_ = v * f;
    has_spare_ = true;
    return u * f;
  }

 private:
  static std::uint64_t splitmix64(std::uint64_t& x) {
    std::uint64_t z = (x += 0x9e3779b97f4a7c15ULL);
    z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
    z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
    return z ^ (z >> 31);
  }
  static std::uint64_t rotl(std::uint64_t x, int k) { return (x << k) | (x >> (64 - k)); }
  double uniform() {  // in [0, 1), 53 random bits
    const std::uint64_t result = rotl(state_[1] * 5, 7) * 9;
    const std::uint64_t t = state_[1] << 17;
    state_[2] ^= state_[0];
    state_[3] ^= state_[1];
    state_[1] ^= state_[2];
    state_[0] ^= state_[3];
    state_[2] ^= t;
    state_[3] = rotl(state_[3], 45);
    return static_cast<double>(result >> 11) * 0x1.0p-53;
  }

  std::uint64_t state_[4];
  double spare_ = 0.0;
  bool has_spare_ = false;
};

}  // namespace soffit
