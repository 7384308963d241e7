#include "io/checkpoint_file.hpp"

#include "io/input_error.hpp"

#include <hdf5.h>

#include <fcntl.h>
#include <unistd.h>

#include <algorithm>
#include <cstring>

namespace rotcap {

namespace fs = std::filesystem;

namespace {

constexpr const char* kFormat = "rotcap checkpoint";
constexpr hsize_t kChunk = 1 << 16;  // doubles per chunk (512 kB)

/// Closes an HDF5 handle of any kind on scope exit.
struct Handle {
  hid_t id = H5I_INVALID_HID;
  explicit Handle(hid_t h) : id(h) {}
  Handle(const Handle&) = delete;
  Handle& operator=(const Handle&) = delete;
  ~Handle() {
    if (id >= 0) H5Idec_ref(id);
  }
  explicit operator bool() const { return id >= 0; }
};

void hash_bytes(std::uint64_t& h, const void* data, std::size_t n) {
  const auto* p = static_cast<const unsigned char*>(data);
  for (std::size_t i = 0; i < n; ++i) {
    h ^= p[i];
    h *= 1099511628211ull;
  }
}

void hash_name(std::uint64_t& h, const std::string& name) { hash_bytes(h, name.c_str(), name.size() + 1); }

[[noreturn]] void unreadable(const fs::path& file, const std::string& found) {
  throw InputError(file, 0, "", found, "a checkpoint written by this rotcap (format \"" + std::string(kFormat) +
                                           "\", version " + std::to_string(kCheckpointVersion) + ")");
}

void write_text_attribute(hid_t where, const std::string& name, const std::string& value, const fs::path& file) {
  Handle type(H5Tcopy(H5T_C_S1));
  H5Tset_size(type.id, std::max<std::size_t>(1, value.size()));
  H5Tset_strpad(type.id, H5T_STR_NULLPAD);
  Handle space(H5Screate(H5S_SCALAR));
  Handle attr(H5Acreate2(where, name.c_str(), type.id, space.id, H5P_DEFAULT, H5P_DEFAULT));
  if (!attr || H5Awrite(attr.id, type.id, value.empty() ? "" : value.data()) < 0)
    throw OutputError(file, "cannot write checkpoint entry " + name);
}

void write_integer_attribute(hid_t where, const std::string& name, std::int64_t value, const fs::path& file) {
  Handle space(H5Screate(H5S_SCALAR));
  Handle attr(H5Acreate2(where, name.c_str(), H5T_STD_I64LE, space.id, H5P_DEFAULT, H5P_DEFAULT));
  if (!attr || H5Awrite(attr.id, H5T_NATIVE_INT64, &value) < 0)
    throw OutputError(file, "cannot write checkpoint entry " + name);
}

void write_array(hid_t where, const std::string& name, const std::vector<double>& values, const fs::path& file) {
  const hsize_t n = values.size();
  const hsize_t maxdims = H5S_UNLIMITED;
  Handle space(H5Screate_simple(1, &n, &maxdims));
  Handle plist(H5Pcreate(H5P_DATASET_CREATE));
  const hsize_t chunk = std::clamp<hsize_t>(n, 1, kChunk);
  H5Pset_chunk(plist.id, 1, &chunk);
  H5Pset_fletcher32(plist.id);
  Handle set(H5Dcreate2(where, name.c_str(), H5T_IEEE_F64LE, space.id, H5P_DEFAULT, plist.id, H5P_DEFAULT));
  if (!set || (n > 0 && H5Dwrite(set.id, H5T_NATIVE_DOUBLE, H5S_ALL, H5S_ALL, H5P_DEFAULT, values.data()) < 0))
    throw OutputError(file, "cannot write checkpoint array " + name);
}

void sync_path(const fs::path& path, int flags) {
  const int fd = ::open(path.c_str(), flags);
  if (fd < 0) return;
  ::fsync(fd);
  ::close(fd);
}

struct ReadContext {
  CheckpointData* data;
  fs::path file;
  bool failed = false;
  std::string failure;
};

herr_t read_attribute(hid_t location, const char* name, const H5A_info_t*, void* op_data) {
  auto& ctx = *static_cast<ReadContext*>(op_data);
  Handle attr(H5Aopen(location, name, H5P_DEFAULT));
  Handle type(H5Aget_type(attr.id));
  if (H5Tget_class(type.id) == H5T_INTEGER) {
    std::int64_t v = 0;
    if (H5Aread(attr.id, H5T_NATIVE_INT64, &v) < 0) return ctx.failed = true, ctx.failure = name, -1;
    ctx.data->integers[name] = v;
  } else if (H5Tget_class(type.id) == H5T_STRING) {
    std::string s(H5Tget_size(type.id), '\0');
    if (H5Aread(attr.id, type.id, s.data()) < 0) return ctx.failed = true, ctx.failure = name, -1;
    s.resize(std::strlen(s.c_str()));
    ctx.data->texts[name] = s;
  }
  return 0;
}

herr_t read_dataset(hid_t group, const char* name, const H5L_info_t*, void* op_data) {
  auto& ctx = *static_cast<ReadContext*>(op_data);
  Handle set(H5Dopen2(group, name, H5P_DEFAULT));
  Handle space(H5Dget_space(set.id));
  if (!set || !space || H5Sget_simple_extent_ndims(space.id) != 1) return ctx.failed = true, ctx.failure = name, -1;
  hsize_t n = 0;
  H5Sget_simple_extent_dims(space.id, &n, nullptr);
  std::vector<double> v(n);
  if (n > 0 && H5Dread(set.id, H5T_NATIVE_DOUBLE, H5S_ALL, H5S_ALL, H5P_DEFAULT, v.data()) < 0)
    return ctx.failed = true, ctx.failure = std::string(name) + " (HDF5 checksum or read error)", -1;
  ctx.data->arrays[name] = std::move(v);
  return 0;
}

}  // namespace

std::uint64_t checkpoint_checksum(const CheckpointData& d) {
  std::uint64_t h = 14695981039346656037ull;
  for (const auto& [name, v] : d.integers) hash_name(h, name), hash_bytes(h, &v, sizeof v);
  for (const auto& [name, s] : d.texts) hash_name(h, name), hash_bytes(h, s.data(), s.size());
  for (const auto& [name, a] : d.arrays) hash_name(h, name), hash_bytes(h, a.data(), a.size() * sizeof(double));
  return h;
}

void write_checkpoint(const fs::path& file, const CheckpointData& data) {
  const fs::path part = fs::path(file.string() + ".part");
  H5Eset_auto2(H5E_DEFAULT, nullptr, nullptr);
  {
    Handle f(H5Fcreate(part.c_str(), H5F_ACC_TRUNC, H5P_DEFAULT, H5P_DEFAULT));
    if (!f) throw OutputError(part, "cannot create the checkpoint file");
    Handle root(H5Gopen2(f.id, "/", H5P_DEFAULT));
    write_text_attribute(root.id, "format", kFormat, part);
    write_integer_attribute(root.id, "version", kCheckpointVersion, part);
    const std::uint64_t sum = checkpoint_checksum(data);
    std::int64_t as_signed = 0;
    std::memcpy(&as_signed, &sum, sizeof sum);
    write_integer_attribute(root.id, "content_checksum", as_signed, part);
    for (const auto& [name, v] : data.integers) write_integer_attribute(root.id, "i:" + name, v, part);
    for (const auto& [name, s] : data.texts) write_text_attribute(root.id, "t:" + name, s, part);
    for (const auto& [name, a] : data.arrays) write_array(root.id, name, a, part);
    if (H5Fflush(f.id, H5F_SCOPE_GLOBAL) < 0) throw OutputError(part, "cannot flush the checkpoint file");
  }
  sync_path(part, O_RDONLY);
  std::error_code ec;
  fs::rename(part, file, ec);
  if (ec) throw OutputError(file, "cannot rename " + part.string() + ": " + ec.message());
  sync_path(file.parent_path().empty() ? fs::path(".") : file.parent_path(), O_RDONLY | O_DIRECTORY);
}

CheckpointData read_checkpoint(const fs::path& file) {
  if (!fs::exists(file)) unreadable(file, "no checkpoint file");
  H5Eset_auto2(H5E_DEFAULT, nullptr, nullptr);
  if (H5Fis_hdf5(file.c_str()) <= 0) unreadable(file, "a file that is not HDF5");
  Handle f(H5Fopen(file.c_str(), H5F_ACC_RDONLY, H5P_DEFAULT));
  if (!f) unreadable(file, "an HDF5 file that cannot be opened");
  CheckpointData raw;
  ReadContext ctx{&raw, file, false, {}};
  Handle root(H5Gopen2(f.id, "/", H5P_DEFAULT));
  hsize_t index = 0;
  if (H5Aiterate2(root.id, H5_INDEX_NAME, H5_ITER_NATIVE, &index, read_attribute, &ctx) < 0 || ctx.failed)
    unreadable(file, "an unreadable entry " + ctx.failure);
  index = 0;
  if (H5Literate(root.id, H5_INDEX_NAME, H5_ITER_NATIVE, &index, read_dataset, &ctx) < 0 || ctx.failed)
    unreadable(file, "an unreadable array " + ctx.failure);
  if (raw.texts["format"] != kFormat) unreadable(file, "format \"" + raw.texts["format"] + "\"");
  if (raw.integers["version"] != kCheckpointVersion)
    unreadable(file, "version " + std::to_string(raw.integers["version"]));
  CheckpointData data;
  data.source = file;
  data.arrays = std::move(raw.arrays);
  for (const auto& [name, v] : raw.integers)
    if (name.rfind("i:", 0) == 0) data.integers[name.substr(2)] = v;
  for (const auto& [name, s] : raw.texts)
    if (name.rfind("t:", 0) == 0) data.texts[name.substr(2)] = s;
  const std::uint64_t sum = checkpoint_checksum(data);
  std::int64_t as_signed = 0;
  std::memcpy(&as_signed, &sum, sizeof sum);
  if (raw.integers["content_checksum"] != as_signed) unreadable(file, "a content checksum that does not match (damaged file)");
  return data;
}

const std::vector<double>& CheckpointData::array(const std::string& name) const {
  const auto it = arrays.find(name);
  if (it == arrays.end()) unreadable(source, "no array " + name);
  return it->second;
}

double CheckpointData::scalar(const std::string& name) const {
  const std::vector<double>& a = array(name);
  if (a.size() != 1) unreadable(source, "array " + name + " of length " + std::to_string(a.size()) + ", not 1");
  return a[0];
}

std::int64_t CheckpointData::integer(const std::string& name) const {
  const auto it = integers.find(name);
  if (it == integers.end()) unreadable(source, "no integer " + name);
  return it->second;
}

const std::string& CheckpointData::text(const std::string& name) const {
  const auto it = texts.find(name);
  if (it == texts.end()) unreadable(source, "no text " + name);
  return it->second;
}

}  // namespace rotcap
