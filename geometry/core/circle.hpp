#pragma once
namespace soffit {
struct Circle {
  double cx = 0.0;  // centre x, m
  double cz = 0.0;  // centre z, m
  double r = 0.0;   // radius, m
};
}  // namespace soffit
