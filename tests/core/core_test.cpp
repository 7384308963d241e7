// core/: the always-on check macro, the option error and the number formatter.
#include "core/check.hpp"
#include "core/option_error.hpp"
#include "core/text_format.hpp"

#include <gtest/gtest.h>

#include <string>

namespace rotcap {
namespace {

int checked_index(int i, int size) {
  ROTCAP_CHECK(i >= 0 && i < size, "index " + std::to_string(i) + " of " + std::to_string(size));
  return i;
}

TEST(Check, PassingCheckReturnsNormally) { EXPECT_EQ(checked_index(2, 3), 2); }

TEST(Check, FailedCheckIsAnInternalErrorNamingFileLineConditionAndMessage) {
  try {
    checked_index(3, 3);
    ADD_FAILURE() << "no exception";
  } catch (const InternalError& e) {
    const std::string m = e.what();
    EXPECT_NE(m.find("core_test.cpp:"), std::string::npos) << m;
    EXPECT_NE(m.find("i >= 0 && i < size"), std::string::npos) << m;
    EXPECT_NE(m.find("index 3 of 3"), std::string::npos) << m;
  }
}

TEST(Check, InternalErrorIsNotAnInputError) {
  // main.cpp maps OptionError (an invalid_argument) to exit 2 and everything else to exit 1: a
  // failed check must never read as bad input.
  bool caught_as_invalid_argument = false;
  try {
    checked_index(-1, 3);
  } catch (const std::invalid_argument&) {
    caught_as_invalid_argument = true;
  } catch (const std::logic_error&) {
  }
  EXPECT_FALSE(caught_as_invalid_argument);
}

TEST(OptionError, KeepsKeyFoundAndExpectedAndReadsAsOneSentence) {
  const OptionError e("steel.fy", "-5 MPa", "fy > 0 [MPa]");
  EXPECT_EQ(e.key(), "steel.fy");
  EXPECT_EQ(e.found(), "-5 MPa");
  EXPECT_EQ(e.expected(), "fy > 0 [MPa]");
  EXPECT_EQ(std::string(e.what()), "steel.fy: found -5 MPa; expected fy > 0 [MPa]");
}

TEST(TextFormat, FormatsLikePrintfAtAnyLength) {
  EXPECT_EQ(format_text("%d-%s-%.2f", 7, "x", 1.005), "7-x-1.00");
  EXPECT_EQ(format_text("%s", std::string(1000, 'a').c_str()).size(), 1000u);
  EXPECT_EQ(format_text("plain"), "plain");
  EXPECT_EQ(format_number(355.0), "355");
  EXPECT_EQ(format_number(1e-4), "0.0001");
  EXPECT_EQ(format_number(2.5e6), "2500000");
  EXPECT_EQ(format_number(0.1 + 0.2), "0.3");
}

}  // namespace
}  // namespace rotcap
