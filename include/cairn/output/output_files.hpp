// output_files.hpp — writes a set of output files all-or-nothing, with a manifest that
// names the set.
//
// Every file is first written in full to a temporary name in its target folder
// (`.cairn-tmp-<pid>-<name>`). Only when all are written does cairn replace the folder's
// manifest (cairn-manifest.json) by one marked "complete": false, rename the files into
// place (rename is atomic on one file system), and last rewrite the manifest marked
// "complete": true. A reader trusts the files the manifest names only when it says
// complete, and can check each against its size and SHA-256. A run stopped at any point
// thus leaves either the old set under a complete manifest, or a manifest that says the
// set is incomplete; it may leave temporaries, which the next run into the folder removes.
//
// cairn never replaces a file it did not write: an existing file of an output's name that
// the folder's manifest does not list, or a folder in the way, stops the run before
// anything is written (OutputError, exit 2). On any failure the temporaries, and folders
// the run created, are removed.
#pragma once

#include <functional>
#include <ostream>
#include <stdexcept>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

namespace cairn {

// An output could not be written (exit status 2).
class OutputError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

// The manifest's name in the output folder.
inline constexpr const char* kManifestName = "cairn-manifest.json";

// Temporaries left by a run that is gone are removed when they are older than this, or
// at once when the process that wrote them no longer exists, s.
inline constexpr int kStaleTemporaryAge = 3600;

// Writes (name, content) pairs into `folder`, creating it and subfolders named in the
// names ("cap-a/report.txt") if needed; then the manifest. Requires distinct names, none of
// them the manifest's. Throws OutputError; the folder is then as it was, save for stale
// temporaries removed, or (only when a rename fails midway) holds a manifest marked
// incomplete.
void write_files_atomically(const std::string& folder,
                            const std::vector<std::pair<std::string, std::string>>& files);

// One output file written as a stream: `write` puts its content into the stream it is
// given (the file's temporary, hashed on the way), so no file is held whole in memory. An
// exception from `write` removes the temporaries and passes on.
struct OutputFile {
  std::string name;
  std::function<void(std::ostream&)> write;
};
void write_files_atomically(const std::string& folder, const std::vector<OutputFile>& files);

// SHA-256 digest of `bytes` as 64 lowercase hex digits (FIPS 180-4), for the manifest.
std::string sha256_hex(std::string_view bytes);

}  // namespace cairn
