// Fuzz harness (b): mesh-file text -> GmshMesh through parse_gmsh_text (io/gmsh_reader.hpp),
// whose contract is InputError and nothing else on bad input. See fuzz/fuzz_main.hpp for how it
// runs.
#include "fuzz/fuzz_main.hpp"
#include "io/gmsh_reader.hpp"

namespace rotcap::fuzz {

Outcome run_one(std::string_view text, bool quiet) {
  return classify_input([&] { (void)parse_gmsh_text(text, "fuzz_mesh.msh"); }, quiet);
}

}  // namespace rotcap::fuzz
