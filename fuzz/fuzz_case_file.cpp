// Fuzz harness (a): case-file text -> CaseInput through parse_case_text, the reader and every
// component's validation (io/case_file.hpp). The input's name is "fuzz_case.toml" in the working
// directory, so a general model's [model] mesh is looked up there (the reader checks only that
// the mesh file exists). See fuzz/fuzz_main.hpp for how it runs.
#include "fuzz/fuzz_main.hpp"
#include "io/case_file.hpp"

namespace rotcap::fuzz {

Outcome run_one(std::string_view text, bool quiet) {
  return classify_input([&] { (void)parse_case_text(text, "fuzz_case.toml"); }, quiet);
}

}  // namespace rotcap::fuzz
