// soffit: with no arguments, the field app; with a verb, a headless command.
#include "app/cli/dispatch.hpp"

int main(int argc, char** argv) { return soffit::cli::run(argc, argv); }
