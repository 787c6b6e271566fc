// Tests of output_files.hpp: a set of files written all or nothing, in a temporary folder.
#include <catch2/catch.hpp>

#include <algorithm>
#include <chrono>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>
#include <unistd.h>

#include <nlohmann/json.hpp>

#include "cairn/output/output_files.hpp"

namespace fs = std::filesystem;
using cairn::write_files_atomically;

namespace {

// A fresh folder under the system's temporary folder, removed at the end of the test.
struct TempFolder {
  fs::path path;
  TempFolder() {
    std::string pattern = (fs::temp_directory_path() / "cairn-output-files.XXXXXX").string();
    REQUIRE(::mkdtemp(pattern.data()) != nullptr);
    path = pattern;
  }
  ~TempFolder() {
    std::error_code ignored;
    fs::remove_all(path, ignored);
  }
};

std::string read(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

void write(const fs::path& path, const std::string& text) {
  std::ofstream(path, std::ios::binary) << text;
}

nlohmann::json manifest_of(const fs::path& folder) {
  return nlohmann::json::parse(read(folder / cairn::kManifestName));
}

// Every entry of a folder, recursively, as relative paths.
std::vector<std::string> listing(const fs::path& folder) {
  std::vector<std::string> names;
  for (const auto& e : fs::recursive_directory_iterator(folder))
    names.push_back(fs::relative(e.path(), folder).string());
  std::sort(names.begin(), names.end());
  return names;
}

}  // namespace

TEST_CASE("output_files: SHA-256 of the FIPS 180-4 examples", "[output_files][published]") {
  // Source: NIST, FIPS 180-4 Secure Hash Standard (2015), and its example values
  // (NIST CSRC "Examples with Intermediate Values", SHA256.pdf): "abc" and the two-block
  // message "abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq".
  CHECK(cairn::sha256_hex("abc") ==
        "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  CHECK(cairn::sha256_hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq") ==
        "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1");
  // The empty message (common practice: the widely quoted digest of zero bytes).
  CHECK(cairn::sha256_hex("") ==
        "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  // Lengths around the padding boundary (55, 56, 64 bytes) hash without error and differ.
  CHECK(cairn::sha256_hex(std::string(55, 'a')) != cairn::sha256_hex(std::string(56, 'a')));
  CHECK(cairn::sha256_hex(std::string(64, 'a')).size() == 64);
}

TEST_CASE("output_files: writes every file and a complete manifest naming them", "[output_files]") {
  TempFolder tmp;
  const fs::path out = tmp.path / "out";
  write_files_atomically(out.string(), {{"report.txt", "new report\n"}, {"cap-a/table.csv", "a,b\n"}});
  CHECK(read(out / "report.txt") == "new report\n");
  CHECK(read(out / "cap-a/table.csv") == "a,b\n");
  CHECK(listing(out) == std::vector<std::string>{"cairn-manifest.json", "cap-a", "cap-a/table.csv",
                                                 "report.txt"});
  const auto m = manifest_of(out);
  CHECK(m["tool"] == "cairn");
  CHECK(m["complete"] == true);
  CHECK(m["version"] == CAIRN_VERSION);
  CHECK(m["written"].get<std::string>().size() == 20);  // 2026-01-01T00:00:00Z
  REQUIRE(m["files"].size() == 2);
  CHECK(m["files"][0]["name"] == "report.txt");
  CHECK(m["files"][0]["bytes"] == 11);
  CHECK(m["files"][0]["sha256"] == cairn::sha256_hex("new report\n"));
  CHECK(m["files"][1]["name"] == "cap-a/table.csv");
}

TEST_CASE("output_files: a second run replaces cairn's own files and keeps the earlier ones listed",
          "[output_files]") {
  TempFolder tmp;
  const fs::path out = tmp.path / "out";
  write_files_atomically(out.string(), {{"a.txt", "1"}, {"b.txt", "1"}});
  write_files_atomically(out.string(), {{"a.txt", "2"}});
  CHECK(read(out / "a.txt") == "2");
  CHECK(read(out / "b.txt") == "1");
  const auto m = manifest_of(out);
  CHECK(m["files"].size() == 1);
  CHECK(m["earlier_files"] == nlohmann::json::array({"b.txt"}));
  // b.txt is still cairn's: a third run may replace it.
  write_files_atomically(out.string(), {{"b.txt", "3"}});
  CHECK(read(out / "b.txt") == "3");
}

TEST_CASE("output_files: refuses before writing anything", "[output_files]") {
  TempFolder tmp;
  const fs::path out = tmp.path / "out";
  write_files_atomically(out.string(), {{"a.txt", "old a"}, {"b.txt", "old b"}});
  const std::string old_manifest = read(out / cairn::kManifestName);

  SECTION("a folder where a file goes") {
    fs::create_directory(out / "c.txt");
    CHECK_THROWS_WITH(write_files_atomically(out.string(), {{"a.txt", "new"}, {"c.txt", "new"}}),
                      Catch::Contains("is a folder") && Catch::Contains("nothing was written"));
  }
  SECTION("a file where a folder goes") {
    write(out / "cap", "x");
    CHECK_THROWS_WITH(write_files_atomically(out.string(), {{"a.txt", "new"}, {"cap/c.txt", "new"}}),
                      Catch::Contains("is in the way"));
  }
  SECTION("a file of the user's with an output's name") {
    write(out / "c.txt", "the user's");
    CHECK_THROWS_WITH(write_files_atomically(out.string(), {{"a.txt", "new"}, {"c.txt", "new"}}),
                      Catch::Contains("was not written by cairn"));
    CHECK(read(out / "c.txt") == "the user's");
  }
  SECTION("a name that is also another's folder") {
    CHECK_THROWS_WITH(write_files_atomically(out.string(), {{"a.txt", "new"}, {"a.txt/c.csv", "new"}}),
                      Catch::Contains("both a file and the folder"));
  }
  SECTION("a manifest that is not cairn's") {
    write(out / cairn::kManifestName, "{\"files\": [\"a.txt\"]}");
    CHECK_THROWS_WITH(write_files_atomically(out.string(), {{"a.txt", "new"}}),
                      Catch::Contains("was not written by cairn"));
    write(out / cairn::kManifestName, old_manifest);
  }
  CHECK(read(out / "a.txt") == "old a");
  CHECK(read(out / "b.txt") == "old b");
  CHECK(read(out / cairn::kManifestName) == old_manifest);
  for (const auto& name : listing(out)) CHECK(name.find(".cairn-tmp-") == std::string::npos);
}

TEST_CASE("output_files: a user's file in a folder without a manifest is never replaced",
          "[output_files]") {
  TempFolder tmp;
  write(tmp.path / "report.txt", "mine");
  CHECK_THROWS_AS(write_files_atomically(tmp.path.string(), {{"report.txt", "cairn's"}}),
                  cairn::OutputError);
  CHECK(read(tmp.path / "report.txt") == "mine");
  CHECK(listing(tmp.path) == std::vector<std::string>{"report.txt"});
}

TEST_CASE("output_files: a failed run leaves no folder it made", "[output_files]") {
  TempFolder tmp;
  // A name longer than a file name may be (255 bytes on Linux file systems) fails when its
  // temporary is written, after the folders were made: they must go again, with a.txt.
  const fs::path out = tmp.path / "new";
  CHECK_THROWS_WITH(write_files_atomically(out.string(), {{"a.txt", "1"},
                                                          {"sub/" + std::string(300, 'n'), "2"}}),
                    Catch::Contains("nothing was written"));
  CHECK(listing(tmp.path).empty());
}

TEST_CASE("output_files: stale temporaries of runs that are gone are removed", "[output_files]") {
  TempFolder tmp;
  const fs::path out = tmp.path / "out";
  fs::create_directories(out / "cap-a");
  // A folder of an earlier run's files, which this run does not write into.
  write_files_atomically(out.string(), {{"cap-b/table.csv", "earlier"}});
  write(out / "cap-b" / ".cairn-tmp-999999999-table.csv", "stale");

  // pid 999999999 is above Linux's largest pid (4194304), so no such process exists.
  write(out / ".cairn-tmp-999999999-report.txt", "stale");
  write(out / "cap-a" / ".cairn-tmp-999999999-table.csv", "stale");
  write(out / "report.txt.cairn-tmp-999999999", "stale, older naming");
  // A temporary of a live process (this one), recent: another run may be writing it.
  const std::string live = ".cairn-tmp-" + std::to_string(::getpid()) + "-live.txt";
  write(out / live, "in progress");
  // The same, but older than kStaleTemporaryAge: its pid has been reused.
  const std::string old = ".cairn-tmp-" + std::to_string(::getpid()) + "-old.txt";
  write(out / old, "old");
  fs::last_write_time(out / old, fs::file_time_type::clock::now() - std::chrono::hours(2));
  // Files that only look similar are not cairn's temporaries.
  write(out / ".cairn-tmp-notes.txt", "the user's");
  write(out / "cairn-tmp-1-x", "the user's");

  write_files_atomically(out.string(), {{"report.txt", "new"}, {"cap-a/table.csv", "new"}});
  std::vector<std::string> left = {".cairn-tmp-notes.txt", live, "cairn-manifest.json",
                                   "cairn-tmp-1-x", "cap-a", "cap-a/table.csv", "cap-b",
                                   "cap-b/table.csv", "report.txt"};
  std::sort(left.begin(), left.end());
  CHECK(listing(out) == left);
}

TEST_CASE("output_files: a manifest left incomplete still names cairn's files", "[output_files]") {
  // A run stopped among its renames leaves the manifest marked incomplete: the next run may
  // replace every file it names, and then marks its own set complete.
  TempFolder tmp;
  const fs::path out = tmp.path / "out";
  write_files_atomically(out.string(), {{"a.txt", "1"}, {"b.txt", "1"}});
  auto m = manifest_of(out);
  m["complete"] = false;
  write(out / cairn::kManifestName, m.dump());
  write_files_atomically(out.string(), {{"a.txt", "2"}, {"b.txt", "2"}});
  CHECK(manifest_of(out)["complete"] == true);
  CHECK(read(out / "b.txt") == "2");
}
