// output_files.hpp — writes a set of output files all-or-nothing.
//
// Each file is first written in full to a temporary name in the target folder; only when
// every file is written are they renamed into place (rename is atomic on one file system).
// On any failure the temporaries are removed and files already in the folder are left as
// they were.
#pragma once

#include <stdexcept>
#include <string>
#include <utility>
#include <vector>

namespace cairn {

// An output could not be written (exit status 2).
class OutputError : public std::runtime_error {
 public:
  using std::runtime_error::runtime_error;
};

// Writes (name, content) pairs into `folder`, creating it if needed. Throws OutputError.
void write_files_atomically(const std::string& folder,
                            const std::vector<std::pair<std::string, std::string>>& files);

}  // namespace cairn
