#pragma once
// Shared test helpers. expect_close passes when |actual - expected| <= abs + rel * |expected|;
// the failure message prints both values and the relative error.
#include <gtest/gtest.h>

#include <cmath>
#include <string>

namespace rotcap::testing {

inline ::testing::AssertionResult close(double actual, double expected, double rel, double abs = 0.0) {
  const double err = std::abs(actual - expected);
  if (err <= abs + rel * std::abs(expected)) return ::testing::AssertionSuccess();
  return ::testing::AssertionFailure()
         << "actual " << actual << " vs expected " << expected << ": |error| " << err
         << " (relative " << (expected != 0.0 ? err / std::abs(expected) : err) << ") > abs " << abs
         << " + rel " << rel;
}

}  // namespace rotcap::testing

#define EXPECT_CLOSE(actual, expected, rel, abs) \
  EXPECT_TRUE(::rotcap::testing::close((actual), (expected), (rel), (abs)))
#define ASSERT_CLOSE(actual, expected, rel, abs) \
  ASSERT_TRUE(::rotcap::testing::close((actual), (expected), (rel), (abs)))
