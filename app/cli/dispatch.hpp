#pragma once
namespace soffit::cli {
// Runs the verb named by argv[1]; returns the process exit code.
// Exit codes: 0 ok, 1 internal failure, 2 bad input or usage (including data
// that no arch can be fitted to; the message says why).
int run(int argc, char** argv);
}  // namespace soffit::cli
