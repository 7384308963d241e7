#include "io/axis_ticks.hpp"

#include "core/text_format.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <stdexcept>
#include <string>

namespace rotcap {

namespace {

constexpr double kLargest = 1e300;  // larger magnitudes are not drawn (differences stay finite)

bool drawable(double v) { return std::abs(v) <= kLargest; }  // false for NaN too

std::string fixed(double v, int decimals) { return format_fixed(v, decimals); }

// Heckbert (1990) nicenum: a 1, 2, 5 or 10 times 10^k close to x > 0, rounded or ceiled.
double nice_number(double x, bool round) {
  const double e = std::floor(std::log10(x));
  const double p = std::pow(10.0, e), f = x / p;
  double nf;
  if (round) nf = f < 1.5 ? 1.0 : f < 3.0 ? 2.0 : f < 7.0 ? 5.0 : 10.0;
  else nf = f <= 1.0 ? 1.0 : f <= 2.0 ? 2.0 : f <= 5.0 ? 5.0 : 10.0;
  return nf * p;
}

}  // namespace

std::string tick_text(double v, const AxisTicks& t) {
  const double big = std::max(std::abs(t.lo), std::abs(t.hi));
  if (big >= 1e6 || t.step < 1e-4) {
    if (std::abs(v) < 1e-9 * t.step) return "0";
    char buf[64];
    auto res = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::general, 6);
    return std::string(buf, res.ptr);
  }
  return fixed(v, t.decimals);
}


void fill_tick_values(AxisTicks& t) {
  t.values.clear();
  const double slack = 1e-9;  // ticks on the ends despite round-off in lo / step
  const double k0 = std::ceil(t.lo / t.step - slack), k1 = std::floor(t.hi / t.step + slack);
  for (double k = k0; k <= k1; k += 1.0) t.values.push_back(k * t.step);
}

void widen_if_degenerate(double& lo, double& hi) {
  if (hi > lo) return;
  const double pad = lo != 0.0 ? 0.1 * std::abs(lo) : 1.0;
  lo -= pad;
  hi += pad;
}

AxisTicks nice_ticks(double lo, double hi, int target, bool expand) {
  if (!drawable(lo) || !drawable(hi) || lo > hi)
    throw std::invalid_argument("nice_ticks: range [" + std::to_string(lo) + ", " + std::to_string(hi) +
                                "]: expected lo <= hi, |lo|, |hi| <= 1e300");
  if (target < 2)
    throw std::invalid_argument("nice_ticks: target = " + std::to_string(target) + ": expected >= 2");
  widen_if_degenerate(lo, hi);
  // Heckbert (1990), loose labelling: range = nicenum(hi - lo, ceil), step = nicenum(range /
  // (target - 1), round), axis widened to floor(lo / step) step .. ceil(hi / step) step.
  const double range = nice_number(hi - lo, false);
  AxisTicks t;
  t.step = nice_number(range / (target - 1), true);
  t.lo = expand ? std::floor(lo / t.step) * t.step : lo;
  t.hi = expand ? std::ceil(hi / t.step) * t.step : hi;
  // Digits after the point for every multiple of step; 1e-9 keeps step = 10^k from rounding down.
  t.decimals = std::max(0, static_cast<int>(-std::floor(std::log10(t.step) + 1e-9)));
  fill_tick_values(t);
  return t;
}

}  // namespace rotcap
