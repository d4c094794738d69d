#pragma once
namespace soffit::cli {
// Runs the verb named by argv[1]; returns the process exit code.
// Exit codes: 0 ok, 1 internal failure, 2 bad input or usage, 3 no fit possible.
int run(int argc, char** argv);
}  // namespace soffit::cli
