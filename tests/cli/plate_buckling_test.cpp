// Plate buckling through the command line: `rotcap buckling CASE -o DIR` on general models read
// from Gmsh meshes (tests/data/buckling/*.geo -> *.msh), the load factors read back from
// DIR/buckling.json. Checks the whole route a user takes: case file, mesh reader, groups,
// supports, edge line loads shared by tributary length, prebuckling, eigen solver, output.
//
// Both plates: t = 1 mm, E = 210 000 MPa, nu = 0.3, b = 100 mm, reference load N_xx = -1 N/mm
// (-100 N on the edge x = a), so the load factor is N_cr [N/mm] and
//   k = N_cr b^2 / (pi^2 D),  D = E t^3 / (12 (1 - nu^2)),
// i.e. sigma_cr = k pi^2 E t^2 / (12 (1 - nu^2) b^2) (Timoshenko & Gere, Theory of Elastic
// Stability, 2nd ed. 1961, ch. 9; formula CONF-2nd in docs/spec/references.md sec. 3).
// Supports ("hard" simple support, in-plane freedom): see the comments of the case files.
#include "tests/cli/cli_runner.hpp"
#include "tests/test_support.hpp"

#include <nlohmann/json.hpp>

#include <cmath>
#include <cstdio>
#include <numbers>
#include <vector>

namespace rotcap {
namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kE = 210000.0, kNu = 0.3, kT = 1.0, kB = 100.0;

// N_cr / k for the plates above [N/mm].
double critical_force_per_k() {
  const double D = kE * kT * kT * kT / (12.0 * (1.0 - kNu * kNu));
  return kPi * kPi * D / (kB * kB);
}

struct BuckleRun {
  testing::CommandOutcome outcome;
  std::filesystem::path results;  ///< the -o folder
  nlohmann::json result;          ///< buckling.json (null if missing or unreadable)
};

BuckleRun buckle(const std::string& case_name) {
  const std::filesystem::path scratch = testing::scratch_folder("buckle_" + case_name);
  const std::filesystem::path case_file = testing::source_root() / "tests/data/buckling" / (case_name + ".toml");
  BuckleRun r;
  r.results = scratch / "results";
  r.outcome = testing::run_rotcap(
      "buckling '" + case_file.string() + "' -o '" + r.results.string() + "' --quiet --threads 1", scratch);
  std::ifstream in(r.results / "buckling.json");
  if (in) r.result = nlohmann::json::parse(in, nullptr, false);
  return r;
}

TEST(PlateBucklingCli, SimplySupportedSquarePlateGivesCoefficientFour) {
  const BuckleRun r = buckle("ss_square_plate");
  ASSERT_EQ(r.outcome.exit_code, 0) << r.outcome.err;
  ASSERT_TRUE(r.result.is_object()) << "buckling.json missing or unreadable";
  EXPECT_EQ(r.result.at("status"), "Ok");
  EXPECT_TRUE(r.result.at("sturm_check").at("passed").get<bool>());
  const std::vector<double> lambda = r.result.at("load_factors").get<std::vector<double>>();
  ASSERT_EQ(lambda.size(), 2u);
  // k = (m b / a + a / (m b))^2: 4.0 for m = 1 and 6.25 for m = 2 half-waves on the square plate
  // (Timoshenko & Gere 1961, sec. 9.2; FROM MEMORY, docs/spec/references.md sec. 3).
  const double k1 = lambda[0] / critical_force_per_k(), k2 = lambda[1] / critical_force_per_k();
  std::printf("[ rotcap buckling: SS square plate 20x20 ] k1 = %.4f (ref 4.0, Timoshenko & Gere 1961, from memory: "
              "error %+.3f %%), k2 = %.4f (ref 6.25, same source: error %+.3f %%)\n",
              k1, 100.0 * (k1 / 4.0 - 1.0), k2, 100.0 * (k2 / 6.25 - 1.0));
  EXPECT_CLOSE(k1, 4.0, 0.02, 0.0);
  EXPECT_CLOSE(k2, 6.25, 0.02, 0.0);
  // The mode shapes were written next to buckling.json.
  EXPECT_TRUE(std::filesystem::exists(r.results / "modes.pvd"));
  EXPECT_TRUE(std::filesystem::exists(r.results / "modes" / "mode_01.vtu"));
  EXPECT_TRUE(std::filesystem::exists(r.results / "modes" / "mode_02.vtu"));
}

TEST(PlateBucklingCli, PlateWithOneFreeEdgeGivesOutstandCoefficient) {
  const BuckleRun r = buckle("outstand_plate");
  ASSERT_EQ(r.outcome.exit_code, 0) << r.outcome.err;
  ASSERT_TRUE(r.result.is_object()) << "buckling.json missing or unreadable";
  EXPECT_EQ(r.result.at("status"), "Ok");
  EXPECT_TRUE(r.result.at("sturm_check").at("passed").get<bool>());
  const std::vector<double> lambda = r.result.at("load_factors").get<std::vector<double>>();
  ASSERT_FALSE(lambda.empty());
  // Loaded edges and one unloaded edge simply supported, the other free, one half-wave:
  // k = 0.425 + (b/a)^2 (Timoshenko & Gere 1961, ch. 9; Bulson, The Stability of Flat Plates,
  // 1970; FROM MEMORY, docs/spec/references.md sec. 3); a/b = 4 gives 0.4875.
  const double a = 400.0, k_ref = 0.425 + (kB / a) * (kB / a);
  const double k1 = lambda[0] / critical_force_per_k();
  std::printf("[ rotcap buckling: outstand plate a/b = 4, 40x10 ] k1 = %.4f (ref 0.425 + (b/a)^2 = %.4f, Timoshenko & "
              "Gere 1961 / Bulson 1970, from memory: error %+.3f %%)\n",
              k1, k_ref, 100.0 * (k1 / k_ref - 1.0));
  EXPECT_CLOSE(k1, k_ref, 0.04, 0.0);
}

}  // namespace
}  // namespace rotcap
