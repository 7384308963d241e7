#pragma once
// Checkpoint files: the state of a run after a converged step, so that `rotcap resume` can continue
// it as if it had never stopped. The content is plain named data (this layer knows nothing of the
// mechanics): arrays of doubles, 64-bit integers and texts, each under a dotted name ("problem.u").
//
// Format: HDF5 (Debian libhdf5-dev), one dataset per array (chunked, Fletcher-32 checksummed by
// HDF5) and one attribute per integer or text on the root group, plus
//   format  = "rotcap checkpoint"   version = kCheckpointVersion
//   content_checksum = FNV-1a 64 of every name, integer, text and array byte in name order,
// checked on reading (it also covers the attributes, which HDF5 does not checksum).
// Writing is atomic: <file>.part is written, flushed to disk (fsync) and renamed onto file, so the
// file on disk is always the last complete checkpoint (or absent).
// Errors: read_checkpoint throws InputError naming the file and what is wrong (missing, not a
// checkpoint, other version, checksum mismatch, missing entry); write_checkpoint throws OutputError.
#include <cstdint>
#include <filesystem>
#include <map>
#include <string>
#include <vector>

namespace rotcap {

inline constexpr std::int64_t kCheckpointVersion = 1;

struct CheckpointData {
  std::map<std::string, std::vector<double>> arrays;
  std::map<std::string, std::int64_t> integers;
  std::map<std::string, std::string> texts;

  /// Accessors that throw InputError (file = source) naming a missing entry.
  const std::vector<double>& array(const std::string& name) const;
  double scalar(const std::string& name) const;  ///< an array of length 1
  std::int64_t integer(const std::string& name) const;
  const std::string& text(const std::string& name) const;
  std::filesystem::path source;  ///< the file it was read from (for messages)
};

/// FNV-1a 64-bit hash of the content (names included), the content_checksum attribute.
std::uint64_t checkpoint_checksum(const CheckpointData& data);

void write_checkpoint(const std::filesystem::path& file, const CheckpointData& data);
CheckpointData read_checkpoint(const std::filesystem::path& file);

}  // namespace rotcap
