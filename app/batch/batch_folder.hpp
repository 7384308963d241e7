#pragma once
// The folder of a sweep or study: -o DIR, or <input stem><suffix> next to the input file. It is
// created if missing and reused (resumed) if present; its case folders live in <folder>/cases/.
// A second batch on the same folder at the same time is refused (an flock on <folder>/.batch.lock,
// held until the process ends; the kernel drops it when the process dies, even by kill -9).
#include <filesystem>
#include <optional>
#include <string>

namespace rotcap::app {

/// Returns the folder; InputError (exit 2) when it cannot be created or another batch holds it.
std::filesystem::path open_batch_folder(const std::filesystem::path& input,
                                        const std::optional<std::filesystem::path>& requested, const std::string& suffix);

/// The number of cases run at a time: the requested one, or one per core (at least 1).
int worker_count(int requested);

}  // namespace rotcap::app
