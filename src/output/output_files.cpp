#include "cairn/output/output_files.hpp"

#include <algorithm>
#include <array>
#include <cerrno>
#include <chrono>
#include <cstdint>
#include <cstring>
#include <ctime>
#include <filesystem>
#include <fstream>
#include <optional>
#include <set>
#include <streambuf>
#include <signal.h>
#include <unistd.h>

#include <fmt/format.h>
#include <nlohmann/json.hpp>

namespace cairn {
namespace {

namespace fs = std::filesystem;
using nlohmann::json;

constexpr std::string_view kTemporaryTag = ".cairn-tmp-";

// ---- SHA-256, FIPS 180-4 §6.2 ----------------------------------------------------------

constexpr std::array<std::uint32_t, 64> kRoundConstants = {
    0x428a2f98, 0x71374491, 0xb5c0fbcf, 0xe9b5dba5, 0x3956c25b, 0x59f111f1, 0x923f82a4,
    0xab1c5ed5, 0xd807aa98, 0x12835b01, 0x243185be, 0x550c7dc3, 0x72be5d74, 0x80deb1fe,
    0x9bdc06a7, 0xc19bf174, 0xe49b69c1, 0xefbe4786, 0x0fc19dc6, 0x240ca1cc, 0x2de92c6f,
    0x4a7484aa, 0x5cb0a9dc, 0x76f988da, 0x983e5152, 0xa831c66d, 0xb00327c8, 0xbf597fc7,
    0xc6e00bf3, 0xd5a79147, 0x06ca6351, 0x14292967, 0x27b70a85, 0x2e1b2138, 0x4d2c6dfc,
    0x53380d13, 0x650a7354, 0x766a0abb, 0x81c2c92e, 0x92722c85, 0xa2bfe8a1, 0xa81a664b,
    0xc24b8b70, 0xc76c51a3, 0xd192e819, 0xd6990624, 0xf40e3585, 0x106aa070, 0x19a4c116,
    0x1e376c08, 0x2748774c, 0x34b0bcb5, 0x391c0cb3, 0x4ed8aa4a, 0x5b9cca4f, 0x682e6ff3,
    0x748f82ee, 0x78a5636f, 0x84c87814, 0x8cc70208, 0x90befffa, 0xa4506ceb, 0xbef9a3f7,
    0xc67178f2};

constexpr std::uint32_t rotr(std::uint32_t x, int n) { return (x >> n) | (x << (32 - n)); }

void sha256_block(std::array<std::uint32_t, 8>& h, const unsigned char* block) {
  std::array<std::uint32_t, 64> w{};
  for (int t = 0; t < 16; ++t)
    w[t] = std::uint32_t(block[4 * t]) << 24 | std::uint32_t(block[4 * t + 1]) << 16 |
           std::uint32_t(block[4 * t + 2]) << 8 | std::uint32_t(block[4 * t + 3]);
  for (int t = 16; t < 64; ++t) {
    const std::uint32_t s0 = rotr(w[t - 15], 7) ^ rotr(w[t - 15], 18) ^ (w[t - 15] >> 3);
    const std::uint32_t s1 = rotr(w[t - 2], 17) ^ rotr(w[t - 2], 19) ^ (w[t - 2] >> 10);
    w[t] = w[t - 16] + s0 + w[t - 7] + s1;
  }
  std::uint32_t a = h[0], b = h[1], c = h[2], d = h[3], e = h[4], f = h[5], g = h[6], k = h[7];
  for (int t = 0; t < 64; ++t) {
    const std::uint32_t t1 = k + (rotr(e, 6) ^ rotr(e, 11) ^ rotr(e, 25)) + ((e & f) ^ (~e & g)) +
                             kRoundConstants[t] + w[t];
    const std::uint32_t t2 = (rotr(a, 2) ^ rotr(a, 13) ^ rotr(a, 22)) + ((a & b) ^ (a & c) ^ (b & c));
    k = g, g = f, f = e, e = d + t1, d = c, c = b, b = a, a = t1 + t2;
  }
  h[0] += a, h[1] += b, h[2] += c, h[3] += d, h[4] += e, h[5] += f, h[6] += g, h[7] += k;
}

// Incremental SHA-256 of a stream of bytes.
class Sha256 {
 public:
  void update(const char* data, std::size_t n) {
    total_ += n;
    while (n > 0) {
      const std::size_t take = std::min<std::size_t>(n, 64 - fill_);
      std::memcpy(block_ + fill_, data, take);
      fill_ += take, data += take, n -= take;
      if (fill_ == 64) {
        sha256_block(h_, block_);
        fill_ = 0;
      }
    }
  }
  std::string hex() {
    // Padding: 0x80, zeros to 56 bytes mod 64, the length in bits as a big-endian 64-bit number.
    const std::uint64_t bits = total_ * 8;
    const char one = '\x80', zero = '\0';
    update(&one, 1);
    while (fill_ != 56) update(&zero, 1);
    for (int i = 7; i >= 0; --i) {
      const char byte = static_cast<char>((bits >> (8 * i)) & 0xff);
      update(&byte, 1);
    }
    std::string text;
    for (const std::uint32_t word : h_) text += fmt::format("{:08x}", word);
    return text;
  }
  std::uint64_t bytes() const { return total_; }

 private:
  std::array<std::uint32_t, 8> h_ = {0x6a09e667, 0xbb67ae85, 0x3c6ef372, 0xa54ff53a,
                                     0x510e527f, 0x9b05688c, 0x1f83d9ab, 0x5be0cd19};
  unsigned char block_[64]{};
  std::size_t fill_ = 0;
  std::uint64_t total_ = 0;
};

// A stream buffer that passes everything on to `sink` and hashes it on the way.
class HashingBuffer : public std::streambuf {
 public:
  explicit HashingBuffer(std::streambuf* sink) : sink_(sink), buffer_(1 << 16) {
    setp(buffer_.data(), buffer_.data() + buffer_.size());
  }
  bool drain() {
    const std::streamsize n = pptr() - pbase();
    if (n > 0) {
      sha_.update(pbase(), static_cast<std::size_t>(n));
      if (sink_->sputn(pbase(), n) != n) ok_ = false;
    }
    setp(buffer_.data(), buffer_.data() + buffer_.size());
    return ok_;
  }
  Sha256& sha() { return sha_; }

 protected:
  int_type overflow(int_type c) override {
    if (!drain()) return traits_type::eof();
    if (!traits_type::eq_int_type(c, traits_type::eof())) {
      *pptr() = traits_type::to_char_type(c);
      pbump(1);
    }
    return traits_type::not_eof(c);
  }
  int sync() override { return drain() ? 0 : -1; }

 private:
  std::streambuf* sink_;
  std::vector<char> buffer_;
  Sha256 sha_;
  bool ok_ = true;
};

// What the manifest says of one file written.
struct Written {
  std::string name;
  std::uint64_t bytes = 0;
  std::string sha256;
};

// ---- the folder ---------------------------------------------------------------------------

// The temporary of `target`: beside it, so that the rename stays on one file system.
fs::path temporary_of(const fs::path& target) {
  return target.parent_path() /
         (std::string(kTemporaryTag) + std::to_string(::getpid()) + "-" + target.filename().string());
}

// The pid in a temporary's name: ".cairn-tmp-<pid>-<name>", or "<name>.cairn-tmp-<pid>" as
// written by cairn 0.1.0 and earlier.
std::optional<long> temporary_pid(const std::string& name) {
  auto digits = [](std::string_view s) -> std::optional<long> {
    if (s.empty() || s.size() > 9 || s.find_first_not_of("0123456789") != std::string_view::npos)
      return std::nullopt;
    return std::stol(std::string(s));
  };
  const std::string_view n = name;
  if (n.starts_with(kTemporaryTag)) {
    const auto rest = n.substr(kTemporaryTag.size());
    const auto dash = rest.find('-');
    if (dash == std::string_view::npos || dash + 1 == rest.size()) return std::nullopt;
    return digits(rest.substr(0, dash));
  }
  const auto at = n.rfind(kTemporaryTag);
  if (at == std::string_view::npos || at == 0) return std::nullopt;
  return digits(n.substr(at + kTemporaryTag.size()));
}

bool process_gone(long pid) { return pid <= 0 || (::kill(pid_t(pid), 0) != 0 && errno == ESRCH); }

// Removes the temporaries in `dir` (not below) of runs that are gone: their process no
// longer exists, or they are older than kStaleTemporaryAge (the pid may have been reused).
void remove_stale_temporaries(const fs::path& dir) {
  std::error_code ec;
  const auto now = fs::file_time_type::clock::now();
  for (fs::directory_iterator it(dir, ec), end; !ec && it != end; it.increment(ec)) {
    const auto pid = temporary_pid(it->path().filename().string());
    if (!pid || !it->is_regular_file(ec) || it->is_symlink(ec)) continue;
    const auto age = now - it->last_write_time(ec);
    if (process_gone(*pid) || (!ec && age > std::chrono::seconds(kStaleTemporaryAge))) {
      std::error_code ignored;
      fs::remove(it->path(), ignored);
    }
  }
}

std::string utc_now() {
  const std::time_t now = std::time(nullptr);
  std::tm utc{};
  ::gmtime_r(&now, &utc);
  char text[32];
  std::strftime(text, sizeof text, "%Y-%m-%dT%H:%M:%SZ", &utc);
  return text;
}

// The names the folder's manifest says cairn wrote: its set and the earlier files it lists.
// No manifest: none. A manifest that is not cairn's is a file cairn did not write.
std::set<std::string> names_written_by_cairn(const fs::path& manifest) {
  std::error_code ec;
  const auto status = fs::symlink_status(manifest, ec);
  if (!fs::exists(status)) return {};
  if (!fs::is_regular_file(status))
    throw OutputError(fmt::format("'{}' is in the way: not a file cairn wrote", manifest.string()));
  std::ifstream in(manifest, std::ios::binary);
  const json doc = json::parse(in, nullptr, /*allow_exceptions=*/false);
  if (!doc.is_object() || doc.value("tool", "") != "cairn" || !doc.contains("files") ||
      !doc["files"].is_array())
    throw OutputError(fmt::format("'{}' was not written by cairn; cairn replaces no file it did "
                                  "not write",
                                  manifest.string()));
  std::set<std::string> names;
  for (const auto& f : doc["files"])
    if (f.is_object() && f.contains("name") && f["name"].is_string()) names.insert(f["name"]);
  if (doc.contains("earlier_files") && doc["earlier_files"].is_array())
    for (const auto& f : doc["earlier_files"])
      if (f.is_string()) names.insert(f.get<std::string>());
  return names;
}

// Refuses, before anything is written, a target that cairn may not replace: a folder (or
// anything but a file) in the way, or a file the manifest does not name.
void check_target(const fs::path& folder, const std::string& name,
                  const std::set<std::string>& ours) {
  std::error_code ec;
  fs::path dir = folder;
  const fs::path relative(name);
  for (auto part = relative.begin(); part != relative.end(); ++part) {
    const fs::path path = dir / *part;
    const auto status = fs::symlink_status(path, ec);
    const bool last = std::next(part) == relative.end();
    if (!fs::exists(status)) return;
    if (!last) {
      if (!fs::is_directory(status))
        throw OutputError(fmt::format("'{}' is in the way of '{}': not a folder; nothing was "
                                      "written",
                                      path.string(), (folder / name).string()));
    } else if (fs::is_directory(status)) {
      throw OutputError(fmt::format("'{}' is a folder; cairn would write a file of that name; "
                                    "nothing was written",
                                    path.string()));
    } else if (!ours.contains(name)) {
      throw OutputError(fmt::format("'{}' exists and was not written by cairn (it is not named "
                                    "in '{}'); cairn replaces no file it did not write: move it "
                                    "or choose another --out folder; nothing was written",
                                    path.string(), (folder / kManifestName).string()));
    }
    dir = path;
  }
}

// The manifest as JSON text. Names that are not UTF-8 (a file name may be any bytes) are
// written with U+FFFD in place of the bad bytes.
std::string manifest_text(const std::vector<Written>& files,
                          const std::vector<std::string>& earlier, bool complete,
                          const std::string& written) {
  nlohmann::ordered_json list = nlohmann::ordered_json::array();
  for (const auto& f : files)
    list.push_back({{"name", f.name}, {"bytes", f.bytes}, {"sha256", f.sha256}});
  const nlohmann::ordered_json doc = {
      {"tool", "cairn"},
      {"version", CAIRN_VERSION},
      {"written", written},
      {"complete", complete},
      {"about", "The files of one run of cairn. Trust them only when 'complete' is true and "
                "each file's size and SHA-256 match; 'earlier_files' were written by earlier "
                "runs and are not part of this set."},
      {"files", std::move(list)},
      {"earlier_files", earlier}};
  return doc.dump(2, ' ', false, nlohmann::ordered_json::error_handler_t::replace) + "\n";
}

// Writes `content` to `path` through its temporary; the temporary is gone on failure.
void write_through_temporary(const fs::path& path, const std::string& content) {
  const fs::path temp = temporary_of(path);
  std::ofstream out(temp, std::ios::binary | std::ios::trunc);
  out << content;
  out.close();
  std::error_code ec;
  if (out) fs::rename(temp, path, ec);
  if (!out || ec) {
    std::error_code ignored;
    fs::remove(temp, ignored);
    throw OutputError(fmt::format("cannot write '{}'{}", path.string(),
                                  ec ? ": " + ec.message() : std::string()));
  }
}

}  // namespace

std::string sha256_hex(std::string_view bytes) {
  Sha256 sha;
  sha.update(bytes.data(), bytes.size());
  return sha.hex();
}

void write_files_atomically(const std::string& folder_name,
                            const std::vector<std::pair<std::string, std::string>>& contents) {
  std::vector<OutputFile> files;
  files.reserve(contents.size());
  for (const auto& [name, content] : contents)
    files.push_back({name, [&content = content](std::ostream& out) { out << content; }});
  write_files_atomically(folder_name, files);
}

void write_files_atomically(const std::string& folder_name, const std::vector<OutputFile>& files) {
  // Two files of one name would share a temporary, and the second rename would fail after
  // the first had already put its file in place: callers must give distinct names.
  std::set<std::string> names;
  for (const auto& file : files)
    if (!names.insert(file.name).second || file.name == kManifestName)
      throw std::logic_error("output file '" + file.name + "' named twice, or as the manifest");
  // A name that is also the folder of another ("a.txt" and "a.txt/b.csv", from a project
  // file named a.txt.yaml) would fail among the renames.
  for (const auto& name : names)
    for (fs::path dir = fs::path(name).parent_path(); !dir.empty(); dir = dir.parent_path())
      if (names.contains(dir.string()))
        throw OutputError(fmt::format("'{}' would be both a file and the folder of '{}'; rename "
                                      "one of the inputs; nothing was written",
                                      dir.string(), name));
  const fs::path folder(folder_name);
  std::error_code ec;

  // 1. Refuse before anything changes.
  const auto folder_status = fs::status(folder, ec);
  if (fs::exists(folder_status) && !fs::is_directory(folder_status))
    throw OutputError(fmt::format("'{}' is not a folder; nothing was written", folder_name));
  const std::set<std::string> ours = names_written_by_cairn(folder / kManifestName);
  for (const auto& file : files) check_target(folder, file.name, ours);

  // 2. Folders, remembering those made here; stale temporaries go.
  std::vector<fs::path> made_folders;
  std::set<fs::path> folders = {folder};
  for (const auto& file : files) folders.insert((folder / file.name).parent_path());
  std::vector<fs::path> temporaries;
  auto undo = [&] {
    std::error_code ignored;  // keeps `ec`, the error being reported
    for (const auto& p : temporaries) fs::remove(p, ignored);
    for (auto it = made_folders.rbegin(); it != made_folders.rend(); ++it) fs::remove(*it, ignored);
  };
  for (const auto& dir : folders) {
    // Each level, outermost first, so that every folder made can be removed again.
    fs::path level;
    for (const auto& part : dir) {
      level /= part;
      if (fs::exists(level, ec)) continue;
      if (!fs::create_directory(level, ec) || ec) {
        undo();
        throw OutputError(fmt::format("cannot create the output folder '{}': {}", level.string(),
                                      ec ? ec.message() : "it exists"));
      }
      made_folders.push_back(level);
    }
    remove_stale_temporaries(dir);
  }
  // Also the folders of earlier runs' files, which this run may not write into.
  for (const auto& name : ours) {
    const fs::path dir = (folder / name).parent_path();
    if (!folders.contains(dir) && fs::is_directory(fs::symlink_status(dir, ec)))
      remove_stale_temporaries(dir);
  }

  // 3. Every file in full under its temporary name, streamed and hashed on the way.
  std::vector<Written> done;
  for (const auto& [name, write] : files) {
    const fs::path temp = temporary_of(folder / name);
    std::ofstream out(temp, std::ios::binary | std::ios::trunc);
    if (out) temporaries.push_back(temp);
    HashingBuffer hashing(out.rdbuf());
    bool streamed = false;
    if (out) {
      std::ostream through(&hashing);
      try {
        write(through);
      } catch (...) {
        undo();
        throw;
      }
      through.flush();
      streamed = through.good() && hashing.drain();
    }
    done.push_back({name, hashing.sha().bytes(), hashing.sha().hex()});
    out.close();
    if (!out || !streamed) {
      undo();
      throw OutputError(fmt::format("cannot write '{}'; nothing was written",
                                    (folder / name).string()));
    }
  }

  // 4. The manifest says "incomplete" before the first rename, so that a run stopped among
  // the renames leaves no manifest vouching for a mixed set; it still names every file
  // cairn wrote into the folder, so that the next run may replace them.
  std::vector<std::string> earlier;
  for (const auto& name : ours)
    if (!names.contains(name) && fs::is_regular_file(fs::symlink_status(folder / name, ec)))
      earlier.push_back(name);
  const std::string written = utc_now();
  try {
    write_through_temporary(folder / kManifestName,
                            manifest_text(done, earlier, false, written));
  } catch (const OutputError&) {
    undo();
    throw;
  }
  for (std::size_t i = 0; i < files.size(); ++i) {
    fs::rename(temporaries[i], folder / files[i].name, ec);
    if (ec) {
      const std::string failed = (folder / files[i].name).string();
      temporaries.erase(temporaries.begin(), temporaries.begin() + std::ptrdiff_t(i));
      made_folders.clear();  // some hold files now
      undo();
      throw OutputError(fmt::format("cannot move '{}' into place: {}; the folder holds a mixed "
                                    "set, and its manifest says so (\"complete\": false)",
                                    failed, ec.message()));
    }
  }
  // 5. Last, the manifest that vouches for the set.
  write_through_temporary(folder / kManifestName, manifest_text(done, earlier, true, written));
}

}  // namespace cairn
