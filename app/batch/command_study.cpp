// rotcap study CASE.toml: the case and its variants (study_variants.hpp), each a `rotcap run`
// child process, and R as a band over them.
#include "app/batch/batch_commands.hpp"
#include "app/batch/batch_folder.hpp"
#include "app/batch/batch_runner.hpp"
#include "app/batch/study_pages.hpp"
#include "app/batch/study_results.hpp"
#include "app/batch/study_variants.hpp"
#include "app/commands.hpp"
#include "io/atomic_file.hpp"
#include "io/case_file.hpp"
#include "io/case_overrides.hpp"
#include "io/input_error.hpp"

#include <iostream>

namespace rotcap::app {

int command_study(const BatchCommandOptions& options) {
  // 1. The case and its variants, each read by the case reader before anything runs.
  const CaseInput base = read_case_file(options.file);
  const std::vector<StudyVariant> variants = study_variants(base);
  const std::string base_text = read_text_file(options.file, "a case file (TOML)");
  std::vector<std::string> texts;
  for (const StudyVariant& v : variants) {
    texts.push_back(apply_case_overrides(base_text, options.file, v.overrides));
    try {
      parse_case_text(texts.back(), options.file);
    } catch (const InputError& e) {
      throw InputError(options.file, 0, e.key(), e.found() + " in the study variant " + v.name, e.expected());
    }
  }
  const std::filesystem::path folder = open_batch_folder(options.file, options.output, "_study");
  std::vector<BatchJob> jobs;
  for (std::size_t i = 0; i < variants.size(); ++i)
    jobs.push_back({variants[i].name, folder / "cases" / variants[i].name, texts[i]});
  // 2. The variants, N at a time; finished ones (an earlier run) are skipped.
  BatchOptions batch;
  batch.workers = worker_count(options.workers);
  batch.threads_per_case = options.threads;
  batch.pdf = options.pdf;
  batch.program = own_executable();
  batch.status_csv = folder / "status.csv";
  batch.label = "study";
  std::cout << "[study] " << jobs.size() << " variants of " << options.file.string() << " into " << folder.string() << ", "
            << batch.workers << " at a time\n";
  const std::vector<CaseOutcome> outcomes = run_batch(jobs, batch, std::cout);
  // 3. The band, the verdicts and the outputs.
  std::vector<std::filesystem::path> folders;
  for (const BatchJob& j : jobs) folders.push_back(j.folder);
  const StudyResult study = evaluate_study(variants, folders, outcomes);
  write_file_atomically(folder / "study.csv", study_csv(study));
  write_file_atomically(folder / "study.json", study_json(study).dump(2) + "\n");
  write_study_pages(options.file, study, folder);
  std::cout << status_table_text(jobs, outcomes) << study.r_statement << "\n" << study.mesh.text << "\n" << study.step.text << "\n"
            << "results: " << (folder / "report.html").string() << "\n";
  bool all_done = true;
  for (const CaseOutcome& o : outcomes) all_done = all_done && o.state == CaseState::done;
  return all_done ? kExitOk : kExitStoppedEarly;
}

}  // namespace rotcap::app
