// Tests for cli.hpp: run_command_line from argv to exit status and messages. Exit 0 when
// every check passes, 1 when a check fails, 2 for usage or input problems (and then nothing
// on the output stream but help or the version).
#include <catch2/catch.hpp>

#include <sstream>
#include <string>
#include <vector>

#include "cairn/app/cli.hpp"

using namespace cairn;

namespace {

const std::string kData = CAIRN_TEST_DATA;

struct Ran {
  int status = -1;
  std::string out, err;
};

// Runs the command line "cairn <args…>" in memory.
Ran cairn_with(std::vector<std::string> args) {
  args.insert(args.begin(), "cairn");
  std::vector<const char*> argv;
  for (const auto& a : args) argv.push_back(a.c_str());
  std::ostringstream out, err;
  Ran ran;
  ran.status = run_command_line(static_cast<int>(argv.size()), argv.data(), out, err);
  ran.out = out.str();
  ran.err = err.str();
  return ran;
}

bool has(const std::string& text, const std::string& part) {
  return text.find(part) != std::string::npos;
}

}  // namespace

TEST_CASE("cli: exit statuses of pass, fail and bad input", "[cli]") {
  const Ran pass = cairn_with({"check", kData + "/e2e/pass.yaml"});
  CHECK(pass.status == kExitPass);
  CHECK(has(pass.out, "qualified engineer"));  // the caution closes every report
  CHECK(pass.err.empty());

  const Ran fail = cairn_with({"check", kData + "/e2e/fail_overload.yaml"});
  CHECK(fail.status == kExitFail);
  CHECK_FALSE(fail.out.empty());

  const Ran bad = cairn_with({"check", kData + "/bad_unknown_key.yaml"});
  CHECK(bad.status == kExitBadInput);
  CHECK(bad.out.empty());  // nothing half-written
  CHECK(has(bad.err,
            "bad_unknown_key.yaml:10:5: error: pile_types.PC45.lenght: unknown key; "
            "did you mean 'length'?"));
}

TEST_CASE("cli: a missing file is named", "[cli]") {
  const Ran ran = cairn_with({"check", kData + "/no-such-file.yaml"});
  CHECK(ran.status == kExitBadInput);
  CHECK(ran.out.empty());
  CHECK(has(ran.err, "no-such-file.yaml: error: cannot open the project file"));
}

TEST_CASE("cli: usage problems exit 2 with a message and a pointer to --help", "[cli]") {
  const Ran none = cairn_with({});
  CHECK(none.status == kExitBadInput);
  CHECK(has(none.err, "cairn: error: A subcommand is required"));
  CHECK(has(none.err, "Run 'cairn --help' for usage."));

  const Ran unknown = cairn_with({"chek", kData + "/e2e/pass.yaml"});
  CHECK(unknown.status == kExitBadInput);
  CHECK(has(unknown.err, "cairn: error: unknown command 'chek'; did you mean 'check'?"));

  const Ran far = cairn_with({"frobnicate"});
  CHECK(far.status == kExitBadInput);
  CHECK(has(far.err, "expected one of: check, capacity, springs, report"));

  const Ran format = cairn_with({"check", kData + "/e2e/pass.yaml", "--format", "bogus"});
  CHECK(format.status == kExitBadInput);
  CHECK(has(format.err, "--format"));
  CHECK(format.out.empty());

  const Ran explain = cairn_with({"check", kData + "/base.yaml", "--explain", "Z9"});
  CHECK(explain.status == kExitBadInput);
  CHECK(has(explain.err, "--explain: pile 'Z9' does not exist"));
}

TEST_CASE("cli: help and version go to the output stream and exit 0", "[cli]") {
  const Ran version = cairn_with({"--version"});
  CHECK(version.status == kExitPass);
  CHECK(version.out == std::string("cairn ") + CAIRN_VERSION + "\n");

  const Ran help = cairn_with({"--help"});
  CHECK(help.status == kExitPass);
  for (const char* command : {"check", "capacity", "springs", "report"})
    CHECK(has(help.out, command));
  CHECK(has(help.out, "qualified engineer"));
}

TEST_CASE("cli: the command line is shown in the report header and the format is honoured",
          "[cli]") {
  const std::string file = kData + "/e2e/pass.yaml";
  const Ran text = cairn_with({"check", file});
  CHECK(has(text.out, "command: cairn check " + file));
  const Ran json = cairn_with({"check", file, "--format", "json"});
  CHECK(json.status == kExitPass);
  CHECK(json.out.rfind("{", 0) == 0);
  const Ran markdown = cairn_with({"check", file, "--format", "markdown"});
  CHECK(markdown.out.rfind("# ", 0) == 0);
}

TEST_CASE("cli: capacity computes from the soil", "[cli]") {
  const Ran ran = cairn_with({"capacity", kData + "/e2e/soil.yaml"});
  CHECK(ran.status == kExitPass);
  CHECK(has(ran.out, "pile capacity"));
  CHECK(has(ran.out, "Capacity with depth"));
  const Ran need = cairn_with({"capacity", kData + "/e2e/soil.yaml", "--need-tension", "-5"});
  CHECK(need.status == kExitBadInput);
  CHECK(has(need.err, "--need-tension: expected a positive force in kN, got '-5'"));
}
