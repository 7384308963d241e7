// rotcap: plastic-hinge rotation capacity of steel I-beams by nonlinear shell analysis.
// The command line, as numbered steps: 1. parse, 2. set up logging, 3. run the command,
// 4. map failures to exit codes (2 bad input: InputError or OptionError; 3 stopped early;
// 1 internal error: anything else, failed ROTCAP_CHECKs included).
#include "app/batch/batch_commands.hpp"
#include "app/commands.hpp"
#include "app/interrupt.hpp"
#include "app/logging.hpp"
#include "core/option_error.hpp"
#include "io/input_error.hpp"
#include "solver/blas_threads.hpp"

#include <CLI/CLI.hpp>
#include <unistd.h>

#include <cstdlib>
#include <iostream>
#include <string>

namespace {

void add_common(CLI::App* cmd, rotcap::app::CommandOptions& o, bool with_case, bool with_output) {
  if (with_case) cmd->add_option("CASE", o.case_file, "case file (TOML)")->required();
  if (with_output) {
    cmd->add_option("-o,--output", o.output,
                    with_case ? "output folder (default: <case stem>_results next to the case file)"
                              : std::string("output folder (default: ") + rotcap::app::kDemoFolder +
                                    " in the working directory)");
    cmd->add_flag("--overwrite", o.overwrite, "replace the results in an existing output folder");
  }
  if (with_case || with_output)
    cmd->add_option("--mesh-scale", o.mesh_scale,
                    with_case ? "multiply [mesh] flange_elements and web_elements of a generated model by this "
                                "factor (mesh study; flange rounded to even, both >= 4)"
                              : "multiply the demo girder's mesh (18 x 23 elements across the flange and over the "
                                "web) by this factor (mesh study; flange rounded to even, both >= 4)")
        ->check(CLI::Range(0.25, 4.0));
  cmd->add_option("--threads", o.threads, "OpenMP threads for element loops (0: all cores)")->check(CLI::NonNegativeNumber);
  cmd->add_flag("--quiet", o.quiet, "print warnings and errors only");
}

}  // namespace

int main(int argc, char** argv) {
  using namespace rotcap::app;
  // 0. OpenMP threads waiting at the assembler's colour barriers spin by default (libgomp), which on a
  // shared machine made 2-thread assembly 3-5 times slower than 1 thread; OMP_WAIT_POLICY=passive
  // removed that (bench/results/assembly_kernel.txt). libgomp reads the variable once, when it is
  // loaded, so unless the user chose a policy the program runs itself again with "passive" (same
  // process id; if the exec fails it goes on as it is).
  if (std::getenv("OMP_WAIT_POLICY") == nullptr && ::setenv("OMP_WAIT_POLICY", "passive", 1) == 0)
    ::execv("/proc/self/exe", argv);
  // BLAS on one thread whatever OPENBLAS_NUM_THREADS says: our own threads share the cores, and a
  // threaded BLAS inside them tripled the demo's wall time (solver/blas_threads.hpp).
  rotcap::solver::use_one_blas_thread();
  // 1. Parse the command line.
  CLI::App cli{"rotcap: moment-rotation curves and rotation capacity of steel I-beam plastic hinges by "
               "nonlinear shell analysis (units: mm, N, MPa, rad)"};
  cli.set_version_flag("--version", std::string("rotcap ") + ROTCAP_VERSION);
  cli.require_subcommand(1);
  CommandOptions o;
  CLI::App* run = cli.add_subcommand("run", "full analysis of a case");
  add_common(run, o, true, true);
  CLI::App* check = cli.add_subcommand("check", "validate a case and print its derived data");
  add_common(check, o, true, false);
  CLI::App* buckling = cli.add_subcommand("buckling", "linear buckling load factors and mode shapes");
  add_common(buckling, o, true, true);
  buckling->add_option("-n,--modes", o.modes, "number of lowest positive load factors");
  CLI::App* demo = cli.add_subcommand("demo", "run the bundled demo (an invented car-park girder) end to end");
  add_common(demo, o, false, true);
  CLI::App* report = cli.add_subcommand("report", "re-make curve.svg, hinge_law.csv and report.html of a results folder");
  report->add_option("DIR", o.case_file, "results folder of `rotcap run`")->required();
  report->add_flag("--quiet", o.quiet, "print warnings and errors only");
  CLI::App* resume = cli.add_subcommand("resume", "continue a stopped run from its checkpoint, or extend a finished one");
  resume->add_option("DIR", o.case_file, "results folder of `rotcap run` (holds checkpoint.h5)")->required();
  resume->add_option("--max-rotation", o.max_rotation, "new max_rotation [rad] (extends a finished generated-model run)");
  resume->add_option("--stop-below", o.stop_below, "new stop_below (extends a run that stopped past the peak)");
  resume->add_option("--threads", o.threads, "OpenMP threads (default: the run's own)")->check(CLI::NonNegativeNumber);
  resume->add_flag("--quiet", o.quiet, "print warnings and errors only");
  BatchCommands batch;  // sweep, study (app/batch/)
  add_batch_commands(cli, batch);
  // A first word that is no command and no option: name it and list the commands (CLI11 would say
  // only that a subcommand is required).
  if (argc > 1 && argv[1][0] != '-') {
    std::string commands;
    bool known = false;
    for (const CLI::App* sub : cli.get_subcommands({})) {
      known = known || sub->get_name() == argv[1];
      commands += (commands.empty() ? "" : ", ") + sub->get_name();
    }
    if (!known) {
      std::cerr << "rotcap: error: unknown command '" << argv[1] << "'; expected one of " << commands
                << (std::string(argv[1]) == "buckle" ? " (buckle is now buckling)" : "") << " (rotcap --help)\n";
      return kExitBadInput;
    }
  }
  try {
    cli.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    const int code = cli.exit(e);
    return code == 0 ? kExitOk : kExitBadInput;
  }
  o.threads_given = resume->count("--threads") > 0;
  // 2. Logging; SIGINT / SIGTERM stop a path run at its next converged step (app/interrupt.hpp).
  setup_console_logging(o.quiet);
  install_interrupt_handlers();
  // 3. The command; 4. failures to exit codes.
  try {
    if (*run) return command_run(o);
    if (*check) return command_check(o);
    if (*buckling) return command_buckling(o);
    if (*demo) return command_demo(o);
    if (*report) return command_report(o);
    if (*resume) return command_resume(o);
    if (batch.chosen()) return batch.run();
  } catch (const rotcap::InputError& e) {
    std::cerr << "rotcap: error: " << e.what() << "\n";
    return kExitBadInput;
  } catch (const rotcap::OutputError& e) {
    std::cerr << "rotcap: cannot write output: " << e.what() << "\n";
    return kExitInternal;
  } catch (const rotcap::OptionError& e) {
    // An owner's validation that io did not place at a line (every case-file path converts it).
    std::cerr << "rotcap: error: " << o.case_file.string() << ": " << e.what() << "\n";
    return kExitBadInput;
  } catch (const std::exception& e) {
    // Everything else, ROTCAP_CHECK failures (InternalError) included, is a program error.
    std::cerr << "rotcap: internal error: " << e.what() << "\n";
    return kExitInternal;
  }
  return kExitInternal;
}
