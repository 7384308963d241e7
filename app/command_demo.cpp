// rotcap demo: writes the bundled demo case (a scenario of the project's own) and runs it.
#include "app/commands.hpp"
#include "app/demo_case.hpp"
#include "app/logging.hpp"
#include "io/input_error.hpp"

#include <fstream>

namespace rotcap::app {

int command_demo(const CommandOptions& options) {
  namespace fs = std::filesystem;
  const fs::path folder = options.output.value_or(kDemoFolder);
  if (fs::exists(folder) && !options.overwrite)
    throw InputError(folder, 0, "-o", "an existing output folder " + folder.string(),
                     "a new folder, or --overwrite to replace its results");
  // 1. The case files go to <folder>/input/, so the results folder documents what was run.
  const fs::path input = folder / "input";
  fs::create_directories(input);
  for (const DemoFile& f : kDemoFiles) {
    std::ofstream out(input / f.name);
    out << f.content;
    if (!out) throw OutputError(input / f.name, "cannot write the demo case");
  }
  // 2. Run it like `rotcap run`.
  CommandOptions run = options;
  run.case_file = input / kDemoCaseName;
  run.output = folder;
  run.overwrite = true;
  const int code = command_run(run);
  log_info("demo case: " + run.case_file.string());
  log_info("plot: " + (folder / "curve.svg").string() + "; fields (ParaView): " + (folder / "fields.pvd").string());
  log_info("curve: " + (folder / "curve.csv").string() + "; numbers: " + (folder / "summary.json").string());
  return code;
}

}  // namespace rotcap::app
