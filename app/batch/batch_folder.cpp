#include "app/batch/batch_folder.hpp"

#include "io/input_error.hpp"

#include <fcntl.h>
#include <sys/file.h>
#include <unistd.h>

#include <thread>

namespace rotcap::app {

std::filesystem::path open_batch_folder(const std::filesystem::path& input,
                                        const std::optional<std::filesystem::path>& requested, const std::string& suffix) {
  const std::filesystem::path folder =
      requested ? *requested : (input.has_parent_path() ? input.parent_path() : ".") / (input.stem().string() + suffix);
  std::error_code ec;
  std::filesystem::create_directories(folder / "cases", ec);
  if (ec) throw InputError(input, 0, "-o", folder.string() + " (" + ec.message() + ")", "a folder that can be created");
  const std::filesystem::path lock = folder / ".batch.lock";
  const int fd = ::open(lock.c_str(), O_RDWR | O_CREAT | O_CLOEXEC, 0644);
  if (fd < 0) throw InputError(input, 0, "-o", folder.string() + " (cannot create .batch.lock)", "a writable folder");
  if (::flock(fd, LOCK_EX | LOCK_NB) != 0)
    throw InputError(input, 0, "-o", folder.string() + ", which another rotcap sweep or study is using now",
                     "a folder no other batch runs in (wait for it, or choose another with -o)");
  // fd stays open (and locked) until the process ends.
  return folder;
}

int worker_count(int requested) {
  if (requested > 0) return requested;
  const unsigned cores = std::thread::hardware_concurrency();
  return cores > 0 ? static_cast<int>(cores) : 1;
}

}  // namespace rotcap::app
