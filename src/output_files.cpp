#include "cairn/output_files.hpp"

#include <filesystem>
#include <fstream>
#include <set>
#include <stdexcept>
#include <unistd.h>

namespace cairn {

void write_files_atomically(const std::string& folder,
                            const std::vector<std::pair<std::string, std::string>>& files) {
  namespace fs = std::filesystem;
  // Two files of one name would share a temporary, and the second rename would fail after
  // the first had already put its file in place: callers must give distinct names.
  std::set<std::string> names;
  for (const auto& file : files)
    if (!names.insert(file.first).second)
      throw std::logic_error("output file '" + file.first + "' named twice");
  std::error_code ec;
  fs::create_directories(folder, ec);
  if (ec) throw OutputError("cannot create the output folder '" + folder + "': " + ec.message());
  const std::string tag = ".cairn-tmp-" + std::to_string(::getpid());
  std::vector<fs::path> written;
  auto clean = [&] {
    std::error_code ignored;  // keeps `ec`, the error being reported
    for (const auto& p : written) fs::remove(p, ignored);
  };
  for (const auto& [name, content] : files) {
    const fs::path temp = fs::path(folder) / (name + tag);
    fs::create_directories(temp.parent_path(), ec);
    std::ofstream out(temp, std::ios::binary | std::ios::trunc);
    if (out) written.push_back(temp);
    out << content;
    out.close();
    if (!out) {
      clean();
      throw OutputError("cannot write '" + (fs::path(folder) / name).string() + "'");
    }
  }
  for (std::size_t i = 0; i < files.size(); ++i) {
    fs::rename(written[i], fs::path(folder) / files[i].first, ec);
    if (ec) {
      clean();
      throw OutputError("cannot move '" + written[i].string() + "' into place: " + ec.message());
    }
  }
}

}  // namespace cairn
