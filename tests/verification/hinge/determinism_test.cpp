// Determinism: the same input with the same thread count gives bit-identical results. Two runs of a
// generated case with two OpenMP threads (the coloured assembly is meant to be order-independent)
// and one BLAS thread; every result file is compared byte for byte, summary.json after removing what
// is allowed to change (timings, keys ending in _s, and the run date); checkpoint.h5 is skipped.
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <cstdlib>

namespace rotcap::testing {
namespace {

namespace fs = std::filesystem;

fs::path run_twice_member(const std::string& name) {
  const fs::path folder = scratch_folder(name);
  const fs::path results = folder / "results";
  const std::string line = "OPENBLAS_NUM_THREADS=1 '" + std::string(ROTCAP_EXE) + "' run '" +
                           hinge_case("class4_flange.toml").string() + "' -o '" + results.string() +
                           "' --threads 2 --quiet > '" + (folder / "out.txt").string() + "' 2>&1";
  EXPECT_EQ(std::system(line.c_str()), 0) << read_text(folder / "out.txt");
  return results;
}

nlohmann::json without_timings(nlohmann::json j) {
  if (j.is_object()) {
    nlohmann::json out = nlohmann::json::object();
    for (auto it = j.begin(); it != j.end(); ++it) {
      const std::string& k = it.key();
      if ((k.size() > 2 && k.compare(k.size() - 2, 2, "_s") == 0) || k == "run_date") continue;
      out[k] = without_timings(it.value());
    }
    return out;
  }
  return j;
}

TEST(Determinism, SameInputAndThreadCountGiveBitIdenticalResults) {
  const fs::path a = run_twice_member("determinism_a"), b = run_twice_member("determinism_b");
  int compared = 0;
  for (const auto& entry : fs::recursive_directory_iterator(a)) {
    if (!entry.is_regular_file()) continue;
    const fs::path rel = fs::relative(entry.path(), a);
    const std::string name = rel.filename().string();
    if (name == "run.log" || name == "report.html" || name == "report.pdf") continue;  // dates and paths
    // The checkpoint holds the run date and the solver's timings; its state is checked by resuming
    // (resume_test.cpp: the resumed curve equals the uninterrupted one to the bit).
    if (name == "checkpoint.h5") continue;
    ASSERT_TRUE(fs::exists(b / rel)) << rel;
    if (name == "summary.json") {
      EXPECT_EQ(without_timings(read_json(entry.path())), without_timings(read_json(b / rel)));
    } else {
      EXPECT_EQ(read_text(entry.path()), read_text(b / rel)) << rel << " differs between two equal runs";
    }
    ++compared;
  }
  EXPECT_GE(compared, 6);  // curve.csv, summary.json, hinge_law.csv, curve.svg, final_state.json, fields
}

}  // namespace
}  // namespace rotcap::testing
