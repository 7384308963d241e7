// The report's mesh picture (io/mesh_picture.hpp) and its colour map (io/colour_map.hpp).
#include "io/colour_map.hpp"
#include "io/mesh_picture.hpp"
#include "tests/test_support.hpp"

#include <regex>
#include <stdexcept>

namespace rotcap {
namespace {

std::size_t count(const std::string& s, const std::string& what) {
  std::size_t n = 0;
  for (std::size_t at = 0; (at = s.find(what, at)) != std::string::npos; ++at) ++n;
  return n;
}

/// The text of the group <g class="name"> ... </g> (groups are not nested in the picture).
std::string group(const std::string& svg, const std::string& name) {
  const std::size_t a = svg.find("<g class=\"" + name + "\"");
  if (a == std::string::npos) return {};
  return svg.substr(a, svg.find("</g>", a) - a);
}

MeshPicture strip() {
  MeshPicture m;
  m.points = {{0, 0, 0}, {1, 0, 0}, {1, 1, 0}, {0, 1, 0}, {2, 0, 0}, {2, 1, 0}};
  m.quads = {{0, 1, 2, 3}, {1, 4, 5, 2}};
  m.values = {0, 1, 2, 3, 4, 5};
  m.field_name = "|uy| [mm]";
  return m;
}

TEST(ColourMap, ViridisHitsItsPublishedEndsAndControlPoints) {
  // matplotlib's viridis (van der Walt & Smith 2015): #440154 at 0, #fde725 at 1; the control
  // point k / 9 = 5 / 9 is #1f9e89 (viridisLite's viridis(10)[6]).
  EXPECT_EQ(colour_hex(viridis(0.0)), "#440154");
  EXPECT_EQ(colour_hex(viridis(1.0)), "#fde725");
  EXPECT_EQ(colour_hex(viridis(5.0 / 9.0)), "#1f9e89");
  // A quarter of the way from #440154 to #482878: (0x44 + 1, 0x01 + 9.75, 0x54 + 9) rounded.
  EXPECT_EQ(colour_hex(viridis(0.25 / 9.0)), "#450b5d");
  // Outside [0, 1] and NaN are clamped.
  EXPECT_EQ(colour_hex(viridis(-3.0)), "#440154");
  EXPECT_EQ(colour_hex(viridis(7.0)), "#fde725");
  EXPECT_EQ(colour_hex(viridis(std::nan(""))), "#440154");
}

TEST(ColourMap, ViridisLuminanceRisesMonotonically) {
  // A sequential map for magnitudes: lighter means larger, also in grey-scale print.
  double previous = -1.0;
  for (int k = 0; k <= 200; ++k) {
    const double y = relative_luminance(viridis(k / 200.0));
    EXPECT_GT(y, previous) << "t = " << k / 200.0;
    previous = y;
  }
  EXPECT_LT(relative_luminance(viridis(0.0)), 0.05);
  EXPECT_GT(relative_luminance(viridis(1.0)), 0.7);
}

TEST(MeshPicture, DrawsOnePolygonPerQuadInViridisColours) {
  MeshPicture m = strip();
  const std::string s = render_mesh_svg(m);
  const std::string mesh = group(s, "mesh");
  EXPECT_EQ(count(mesh, "<polygon"), 2u);
  // Quad means (0+1+2+3)/4 = 1.5 and (1+4+5+2)/4 = 3 of the range [0, 5]: t = 0.3 and 0.6.
  EXPECT_NE(mesh.find("fill=\"" + colour_hex(viridis(0.3)) + "\""), std::string::npos);
  EXPECT_NE(mesh.find("fill=\"" + colour_hex(viridis(0.6)) + "\""), std::string::npos);
  m.quads.push_back({0, 1, 2, 9});
  EXPECT_THROW(render_mesh_svg(m), std::invalid_argument);
}

TEST(MeshPicture, ColourBarHasNiceTickLabelsAndTheFieldWithItsUnit) {
  const std::string bar = group(render_mesh_svg(strip()), "colour-bar");
  // Field range [0, 5], about 5 ticks: range nicenum(5) = 5, step nicenum(1.25, round) = 1.
  std::vector<std::string> ticks;
  const std::regex tick("<text class=\"tick\"[^>]*>([^<]*)</text>");
  for (auto it = std::sregex_iterator(bar.begin(), bar.end(), tick); it != std::sregex_iterator(); ++it)
    ticks.push_back((*it)[1]);
  EXPECT_EQ(ticks, (std::vector<std::string>{"0", "1", "2", "3", "4", "5"}));
  EXPECT_NE(bar.find(">|uy| [mm]</text>"), std::string::npos);
  // The bar runs from the map's dark end at the bottom to its light end at the top.
  EXPECT_NE(bar.find(colour_hex(viridis(0.5 / 64))), std::string::npos);
  EXPECT_NE(bar.find(colour_hex(viridis(63.5 / 64))), std::string::npos);
}

TEST(MeshPicture, MarksSupportsAndLoadsWithAKey) {
  MeshPicture m = strip();
  EXPECT_EQ(group(render_mesh_svg(m), "key"), "");  // nothing to explain
  m.support_points = {{0, 0, 0}, {0, 1, 0}};
  m.loads.push_back({{2, 0.5, 0}, {0, 0, -1000}, {0, 0, 0}});     // a force: straight arrow
  m.loads.push_back({{0, 0.5, 0}, {0, 0, 0}, {0, 2e6, 0}});       // a moment: curved arrow
  const std::string s = render_mesh_svg(m);
  EXPECT_EQ(count(group(s, "supports"), "<polygon"), 2u);
  const std::string loads = group(s, "loads");
  EXPECT_EQ(count(loads, "<line"), 1u);
  EXPECT_EQ(count(loads, ">F</text>"), 1u);
  EXPECT_EQ(count(loads, "<path"), 1u);
  EXPECT_EQ(count(loads, ">M</text>"), 1u);
  EXPECT_NE(group(s, "key").find("support"), std::string::npos);
  m.support_points.push_back({0, std::nan(""), 0});
  EXPECT_THROW(render_mesh_svg(m), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
