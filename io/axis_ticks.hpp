#pragma once
// Axis ticks: "nice" tick steps (1, 2 or 5 times a power of ten; Heckbert, "Nice numbers for graph
// labels", Graphics Gems, 1990) and their labels, for the line plots (io/svg_plot.hpp) and the
// colour bar of the report's mesh picture (io/report_html.hpp). No drawing here.
#include <string>
#include <vector>

namespace rotcap {

/// The ticks of one axis: values lo <= values[k] <= hi, all multiples of step.
struct AxisTicks {
  double lo = 0.0, hi = 1.0;   ///< axis range
  double step = 0.2;           ///< tick spacing, > 0
  std::vector<double> values;  ///< tick positions, ascending
  int decimals = 1;            ///< digits after the point that show every tick exactly
};

/// Heckbert's nice ticks for the data range [lo, hi] (lo <= hi, |lo|, |hi| <= 1e300), about target
/// ticks (>= 2). expand: widen [lo, hi] to whole steps (auto range); else keep lo, hi (explicit
/// limits). A zero-width range is widened first (widen_if_degenerate). Throws
/// std::invalid_argument for a range or target outside these limits.
AxisTicks nice_ticks(double lo, double hi, int target, bool expand);

/// Refills t.values with the multiples of t.step in [t.lo, t.hi] (after lo or hi were changed).
void fill_tick_values(AxisTicks& t);

/// A zero-width range [lo, lo] widened by 10 % of its value, or by 1 about 0; others unchanged.
void widen_if_degenerate(double& lo, double& hi);

/// The label of tick v: t.decimals fixed digits ("-0" printed as "0"), or 6 significant digits
/// for ranges beyond 1e6 or steps below 1e-4. Locale independent.
std::string tick_text(double v, const AxisTicks& t);

}  // namespace rotcap
