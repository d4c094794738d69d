#include "app/cli/dispatch.hpp"

#include <cstdio>
#include <string_view>

namespace soffit::cli {

int run_fit(int argc, char** argv);  // fit_command.cpp
int run_import(int argc, char** argv);  // project_commands.cpp
int run_list(int argc, char** argv);    // project_commands.cpp
int run_show(int argc, char** argv);    // project_commands.cpp
int run_search(int argc, char** argv);  // search_command.cpp
int run_demo(int argc, char** argv);    // demo_command.cpp
int run_export_section(int argc, char** argv);  // export_section_command.cpp
int run_export(int argc, char** argv);  // export_command.cpp

namespace {
void print_usage() {
  std::fputs(
      "usage: soffit [--demo] [--scale S]      open the field app (no verb)\n"
      "       soffit VERB ...   (each verb prints its options on a usage error)\n"
      "  fit FILE [--shape NAME|auto] [--sigma-mm S] [--summary] ...  fit one section's sheet, print JSON\n"
      "  export-section SHEET --out DIR [--format csv,svg,geo] ...    write a section's analysis files\n"
      "  import PROJECT SHEET --structure REF [--map ...] ...         add a sheet or mapped export to a project\n"
      "  list PROJECT [--json]                                        the structures of a project\n"
      "  show PROJECT REF [--json]                                    a structure's inspections, sections, observations\n"
      "  search PROJECT TEXT [--json]                                 full-text search: structures, notes, defects\n"
      "  demo PATH                                                    write the invented demo project\n"
      "Soffit holds survey data, not an assessment: local codes and a qualified\n"
      "engineer decide what the geometry means.\n",
      stderr);
}
}  // namespace

int run(int argc, char** argv) {
  if (argc < 2) {
    print_usage();
    return 2;
  }
  std::string_view verb = argv[1];
  if (verb == "fit") return run_fit(argc - 1, argv + 1);
  if (verb == "import") return run_import(argc - 1, argv + 1);
  if (verb == "list") return run_list(argc - 1, argv + 1);
  if (verb == "show") return run_show(argc - 1, argv + 1);
  if (verb == "search") return run_search(argc - 1, argv + 1);
  if (verb == "demo") return run_demo(argc - 1, argv + 1);
  if (verb == "export-section") return run_export_section(argc - 1, argv + 1);
  if (verb == "export") return run_export(argc - 1, argv + 1);
  if (verb == "--help" || verb == "-h" || verb == "help") {
    print_usage();
    return 0;
  }
  std::fprintf(stderr, "soffit: unknown command '%s'\n", argv[1]);
  print_usage();
  return 2;
}

}  // namespace soffit::cli
