// io/checkpoint_file: round trip of every kind of entry to the bit, atomic replacement, and damaged
// or foreign files reported as InputError naming the file.
#include "io/checkpoint_file.hpp"
#include "io/input_error.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstring>
#include <fstream>
#include <limits>

namespace rotcap {
namespace {

namespace fs = std::filesystem;

fs::path scratch(const std::string& name) {
  const fs::path dir = fs::temp_directory_path() / "rotcap_checkpoint_test";
  fs::create_directories(dir);
  return dir / name;
}

CheckpointData sample() {
  CheckpointData d;
  d.arrays["problem.u"] = {1.0, -0.0, 1e-300, 3.141592653589793, std::numeric_limits<double>::quiet_NaN()};
  d.arrays["empty"] = {};
  std::vector<double>& big = d.arrays["big"];
  for (int i = 0; i < 200000; ++i) big.push_back(std::sin(0.001 * i));  // several HDF5 chunks
  d.integers["steps"] = 42;
  d.integers["negative"] = -7;
  d.texts["case.text"] = "title = \"a\"\n[steel]\nfy = 355.0\n";
  d.texts["blank"] = "";
  return d;
}

TEST(CheckpointFile, RoundTripKeepsEveryEntryToTheBit) {
  const fs::path file = scratch("roundtrip.h5");
  const CheckpointData in = sample();
  write_checkpoint(file, in);
  EXPECT_FALSE(fs::exists(file.string() + ".part"));
  const CheckpointData out = read_checkpoint(file);
  ASSERT_EQ(out.arrays.size(), in.arrays.size());
  for (const auto& [name, a] : in.arrays) {
    const std::vector<double>& b = out.array(name);
    ASSERT_EQ(a.size(), b.size()) << name;
    if (!a.empty())  // memcmp of the null data() of an empty vector is undefined, even for 0 bytes
      EXPECT_EQ(std::memcmp(a.data(), b.data(), a.size() * sizeof(double)), 0) << name;  // NaN and -0 too
  }
  EXPECT_EQ(out.integers, in.integers);
  EXPECT_EQ(out.texts, in.texts);
  EXPECT_EQ(checkpoint_checksum(out), checkpoint_checksum(in));
  EXPECT_THROW(out.scalar("problem.u"), InputError) << "scalar() needs a length-1 array";
  EXPECT_THROW(out.integer("absent"), InputError);
}

TEST(CheckpointFile, RewriteReplacesTheWholeFile) {
  const fs::path file = scratch("rewrite.h5");
  write_checkpoint(file, sample());
  CheckpointData second;
  second.integers["steps"] = 43;
  write_checkpoint(file, second);
  const CheckpointData out = read_checkpoint(file);
  EXPECT_EQ(out.integer("steps"), 43);
  EXPECT_TRUE(out.arrays.empty());
  EXPECT_THROW(out.array("big"), InputError);
}

TEST(CheckpointFile, DamagedArrayIsInputErrorNamingTheFile) {
  const fs::path file = scratch("damaged.h5");
  write_checkpoint(file, sample());
  {
    const auto middle = static_cast<std::streamoff>(fs::file_size(file) / 2);  // inside "big"
    std::fstream f(file, std::ios::in | std::ios::out | std::ios::binary);
    f.seekp(middle);
    f.write("\x7f\x7f\x7f\x7f", 4);
  }
  try {
    read_checkpoint(file);
    FAIL() << "a damaged checkpoint was read";
  } catch (const InputError& e) {
    EXPECT_EQ(e.file(), file);
    EXPECT_NE(std::string(e.what()).find("big"), std::string::npos) << e.what();
  }
}

TEST(CheckpointFile, MissingOrForeignFileIsInputError) {
  EXPECT_THROW(read_checkpoint(scratch("absent.h5")), InputError);
  const fs::path text = scratch("not_hdf5.h5");
  std::ofstream(text) << "not a checkpoint\n";
  try {
    read_checkpoint(text);
    FAIL() << "a text file was read as a checkpoint";
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("not HDF5"), std::string::npos) << e.what();
  }
}

}  // namespace
}  // namespace rotcap
