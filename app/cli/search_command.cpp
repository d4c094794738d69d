// soffit search PROJECT TEXT [--json] [--limit N]
// Full-text search over structures, inspection notes and defects
// (storage/register_search.hpp); best hits first. Words after PROJECT are
// joined, so quoting TEXT is optional. Exit 0 also when nothing matches.
#include <cstdio>
#include <iostream>
#include <nlohmann/json.hpp>
#include <string>
#include <string_view>

#include "app/cli/option_parsing.hpp"
#include "storage/project_file.hpp"
#include "storage/register_search.hpp"

namespace soffit::cli {

std::string author_name();  // project_commands.cpp

int run_search(int argc, char** argv) {
  constexpr const char* kSynopsis = "usage: soffit search PROJECT TEXT [--json] [--limit N]\n";
  std::string project_path, text;
  bool as_json = false;
  int limit = 50;
  try {
    OptionCursor args(argc, argv, "search");
    while (args.more()) {
      const std::string_view arg = args.next();
      if (arg == "--json") as_json = true;
      else if (arg == "--limit") limit = static_cast<int>(args.integer(arg, 1, 10000));
      else if (!arg.empty() && arg[0] == '-' && arg.size() > 1) throw UsageError("unknown option '" + std::string(arg) + "'");
      else if (project_path.empty()) project_path = arg;
      else text += (text.empty() ? "" : " ") + std::string(arg);
    }
    if (project_path.empty() || text.empty()) throw UsageError("PROJECT and TEXT are both needed");
    if (storage::fts_query_from_user_text(text).empty())
      throw UsageError("'" + text + "' has no letters or digits to search for");
  } catch (const UsageError& e) {
    std::fprintf(stderr, "soffit search: %s\n%s", e.what(), kSynopsis);
    return 2;
  }
  try {
    storage::Project project = storage::Project::open(project_path, author_name(), storage::Access::view);
    const auto hits = storage::search_register(project.db(), text, limit);
    if (as_json) {
      nlohmann::json j = {{"project", project_path}, {"text", text}, {"hits", nlohmann::json::array()}};
      for (const auto& h : hits)
        j["hits"].push_back({{"kind", storage::search_kind_name(h.kind)}, {"structure", h.structure_ref},
                             {"title", h.title}, {"snippet", h.snippet}, {"score", h.score}});
      std::cout << j.dump(2) << "\n";
    } else {
      for (const auto& h : hits)
        std::printf("%-10s %-16s %-32s %s\n", storage::search_kind_name(h.kind), h.structure_ref.c_str(),
                    h.title.c_str(), h.snippet.c_str());
      if (hits.empty()) std::printf("(no matches for '%s')\n", text.c_str());
    }
    return 0;
  } catch (const storage::StorageError& e) {
    std::fprintf(stderr, "soffit search: %s\n", e.what());
    return e.kind() == storage::ErrorKind::io ? 1 : 2;
  }
}

}  // namespace soffit::cli
