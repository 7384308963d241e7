// rotcap study end to end on the tiny generated case: each variant's summary.json echoes what the
// variant claims (mesh counts, first step, local shape, mode, sign, amplitude), and the band, the
// lowest R and the verdicts of study.json follow from those summaries.
#include "tests/batch/batch_test_support.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdlib>
#include <limits>
#include <set>

namespace fs = std::filesystem;
using namespace rotcap::testing;
using nlohmann::json;

namespace {

/// |variant - base| / base within the study's limits (M_max 1 %, R 5 %), from the two summaries.
bool converged(const json& base, const json& variant) {
  const double m0 = base["m_max_kNm"].get<double>(), m1 = variant["m_max_kNm"].get<double>();
  const double r0 = base["rotation_capacity"].get<double>(), r1 = variant["rotation_capacity"].get<double>();
  return std::abs(m1 - m0) / m0 <= 0.01 && std::abs(r1 - r0) / r0 <= 0.05;
}

}  // namespace

TEST(Study, EachVariantEchoesWhatItClaimsAndTheBandAndVerdictsFollowFromThem) {
  ::setenv("ROTCAP_NO_PDF", "1", 1);
  const fs::path scratch = scratch_folder("study_tiny");
  const fs::path out = scratch / "study";
  const fs::path case_file = source_root() / "tests/data/batch/tiny_cantilever.toml";
  const CommandOutcome r = run_rotcap("study '" + case_file.string() + "' -o '" + out.string() + "' -j 2", scratch);
  ASSERT_EQ(r.exit_code, 0) << r.out << r.err;
  const json study = read_json(out / "study.json");
  ASSERT_TRUE(study.is_object());
  const json& variants = study["variants"];
  ASSERT_EQ(variants.size(), 11u);
  std::set<std::string> names;
  std::map<std::string, json> summaries;
  for (const json& v : variants) {
    const std::string name = v["name"].get<std::string>();
    SCOPED_TRACE(name);
    names.insert(name);
    ASSERT_EQ(v["state"], "done") << v["reason"];
    const json s = read_json(out / v["folder"].get<std::string>() / "summary.json");
    ASSERT_TRUE(s.is_object());
    summaries[name] = s;
    const json& claims = v["claims"];
    EXPECT_EQ(s["mesh"]["flange_elements"], claims["flange_elements"]);
    EXPECT_EQ(s["mesh"]["web_elements"], claims["web_elements"]);
    EXPECT_EQ(s["input"]["analysis"]["first_step"].get<double>(), claims["first_step"].get<double>());
    EXPECT_EQ(s["imperfection"]["local"], claims["local"]);
    EXPECT_EQ(s["input"]["imperfection"]["local_amplitude"], claims["local_amplitude"]);
    EXPECT_EQ(s["imperfection"]["sign"], claims["sign"]);
    if (claims["local"] == "buckling_mode") {
      EXPECT_EQ(s["imperfection"]["local_mode"], claims["mode"]);
      EXPECT_EQ(s["imperfection"]["mode_classification"].get<std::string>().find("local_buckling") != std::string::npos, true);
    } else {
      EXPECT_FALSE(s["imperfection"].contains("local_mode"));
    }
  }
  EXPECT_EQ(names, (std::set<std::string>{"base", "mesh_x1.5", "step_x0.5", "amplitude_x0.5", "amplitude_x2", "mode1_negative",
                                           "mode2_positive", "mode2_negative", "mode3_positive", "mode3_negative", "half_sine"}));
  // What the variants claim is what they change: the base's own values elsewhere.
  const json& base = summaries["base"];
  EXPECT_EQ(summaries["mesh_x1.5"]["mesh"]["flange_elements"], 6);
  EXPECT_EQ(summaries["mesh_x1.5"]["mesh"]["web_elements"], 6);
  EXPECT_EQ(summaries["step_x0.5"]["input"]["analysis"]["first_step"].get<double>(),
            0.5 * base["input"]["analysis"]["first_step"].get<double>());
  EXPECT_EQ(summaries["amplitude_x2"]["input"]["imperfection"]["local_amplitude"], "b/100");
  EXPECT_EQ(summaries["amplitude_x0.5"]["input"]["imperfection"]["local_amplitude"], "b/400");
  // The same mode, reversed: the same amplitude in mm.
  EXPECT_EQ(summaries["mode1_negative"]["imperfection"]["local_amplitude_mm"], base["imperfection"]["local_amplitude_mm"]);
  EXPECT_EQ(summaries["mode1_negative"]["imperfection"]["sign"], -1);
  EXPECT_NE(summaries["mode2_positive"]["imperfection"]["mode"], base["imperfection"]["mode"]);

  // The band, the lowest R and the verdicts, recomputed from the summaries.
  double r_min = std::numeric_limits<double>::infinity(), r_max = -r_min, m_min = r_min, m_max = -r_min;
  std::string lowest;
  for (const auto& [name, s] : summaries) {
    m_min = std::min(m_min, s["m_max_kNm"].get<double>());
    m_max = std::max(m_max, s["m_max_kNm"].get<double>());
    if (!s["rotation_capacity"].is_number()) continue;
    const double R = s["rotation_capacity"].get<double>();
    if (R < r_min) lowest = name;
    r_min = std::min(r_min, R);
    r_max = std::max(r_max, R);
  }
  ASSERT_FALSE(lowest.empty()) << "no variant reached an R";
  EXPECT_EQ(study["band"]["rotation_capacity"]["min"].get<double>(), r_min);
  EXPECT_EQ(study["band"]["rotation_capacity"]["max"].get<double>(), r_max);
  EXPECT_EQ(study["band"]["m_max_kNm"]["min"].get<double>(), m_min);
  EXPECT_EQ(study["band"]["m_max_kNm"]["max"].get<double>(), m_max);
  EXPECT_EQ(study["lowest_r"]["variant"], lowest);
  for (const auto& [verdict, variant] : {std::pair<std::string, std::string>{"mesh", "mesh_x1.5"}, {"step", "step_x0.5"}}) {
    if (base["rotation_capacity"].is_number() && summaries[variant]["rotation_capacity"].is_number()) {
      EXPECT_EQ(study[verdict]["converged"].get<bool>(), converged(base, summaries[variant])) << verdict;
    } else {
      EXPECT_TRUE(study[verdict]["converged"].is_null()) << verdict;
    }
  }
  // The page states R as a band; study.csv has one row per variant.
  const std::string html = read_text(out / "report.html");
  EXPECT_NE(html.find(study["r_statement"].get<std::string>()), std::string::npos);
  EXPECT_NE(html.find("over 11 variants"), std::string::npos) << study["r_statement"];
  EXPECT_EQ(read_csv_rows(out / "study.csv").size(), 11u);
  EXPECT_TRUE(fs::exists(out / "study_curves.svg"));
}
