// The register screen adds and edits structures (issue 4): driven through
// ImGui's input (taps, typed characters, keys, a finger drag) on the demo
// project, and checked by reopening the project file from disk.
#include <doctest/doctest.h>

#include <cmath>
#include <cstdlib>
#include <filesystem>

#include <unistd.h>

#include "app/gui/project_screens.hpp"
#include "storage/project_file.hpp"
#include "storage/register_queries.hpp"
#include "tests/gui/headless_ui.hpp"

using namespace soffit;
namespace fs = std::filesystem;

namespace {

constexpr const char* kDemoRef = "BVDC-ST-0417";  // the demo's one structure (FIELD.md §10)

// Its own app-data folder, so the demo project is written fresh for each case.
struct TempHome {
  fs::path dir;
  TempHome() {
    static int counter = 0;
    dir = fs::temp_directory_path() /
          ("soffit_register_edit_" + std::to_string(::getpid()) + "_" + std::to_string(counter++));
    fs::remove_all(dir);
    fs::create_directories(dir);
    ::setenv("XDG_DATA_HOME", dir.c_str(), 1);
  }
  ~TempHome() {
    std::error_code ec;
    fs::remove_all(dir, ec);
  }
  std::string project() const { return (dir / "soffit" / "sallow-ford-demo.soffit").string(); }
};

struct RegisterScreen {
  TempHome home;  // first: ProjectScreens reads its recent list from there
  gui::ProjectScreens screens{SOFFIT_ASSETS, "test"};
  test::HeadlessUi ui{[this] { screens.draw_current(); }};

  RegisterScreen() {
    screens.open_demo();
    REQUIRE(screens.screen == gui::Screen::register_list);
    ui.frame();
  }
  ~RegisterScreen() {
    screens.defects.close();
    screens.rings_fill.close();
  }

  // Lets the project go, so the file can be read as another program would.
  void close_project() {
    screens.defects.close();
    screens.rings_fill.close();
    screens.session().close();
  }

  void key(ImGuiKey key, int index, bool ctrl = false) {
    ImGuiIO& io = ImGui::GetIO();
    io.KeyMap[key] = index;  // as a backend maps its key codes (ImGui 1.86)
    io.KeyCtrl = ctrl;
    io.KeysDown[index] = true;
    ui.frame();
    io.KeysDown[index] = false;
    io.KeyCtrl = false;
    ui.frame();
  }

  // Taps the field, selects what is in it (Ctrl+A), types `text` over it, then Enter.
  void type(const std::string& field, const std::string& text) {
    REQUIRE(ui.tap(field));
    key(ImGuiKey_A, 'A', true);
    for (char c : text) ImGui::GetIO().AddInputCharacter(static_cast<unsigned char>(c));
    ui.frame();
    key(ImGuiKey_Enter, 13);
  }

  void drag(ImVec2 from, ImVec2 to, int steps) {
    ImGuiIO& io = ImGui::GetIO();
    io.MousePos = from;
    ui.frame();
    io.MouseDown[0] = true;
    ui.frame();
    for (int i = 1; i <= steps; ++i) {
      const float t = static_cast<float>(i) / static_cast<float>(steps);
      io.MousePos = ImVec2(from.x + (to.x - from.x) * t, from.y + (to.y - from.y) * t);
      ui.frame();
    }
    io.MouseDown[0] = false;
    ui.frame();
    ui.frame();  // the scroll set in the last frame is applied when the list begins again
    ui.frame();
  }

  float row_y(const std::string& ref) const {
    const auto& c = gui::UiProbe::instance().centres;
    const auto it = c.find("structure:" + ref);
    REQUIRE(it != c.end());
    return it->second.y;
  }
};

std::optional<storage::StructureRecord> read_back(const std::string& path, const std::string& ref) {
  storage::Project p = storage::Project::open(path, "checker", storage::Access::view);
  return storage::find_structure(p.db(), ref);
}

long long structure_count(storage::Project* p) { return p->db().query_int("SELECT count(*) FROM structure"); }

}  // namespace

TEST_CASE("Add structure: typed in the form, saved, shown in the list and in the file after reopening") {
  RegisterScreen r;
  CHECK_FALSE(r.ui.drawn("structure:BVDC-ST-0501"));
  REQUIRE(r.ui.tap("add-structure"));
  CHECK(r.screens.structure_form().is_open());
  // Invented, like the demo (FIELD.md §10).
  r.type("form:reference", "BVDC-ST-0501");
  r.type("form:name", "Kestrel Lane Underbridge");
  r.type("form:spans", "3");
  r.type("form:latitude", "51,25");  // a comma for decimals, as a comma-decimal locale types it
  r.type("form:longitude", "-2.5");
  REQUIRE(r.ui.tap("form:fictitious"));
  REQUIRE(r.ui.tap("form:save"));
  CHECK_MESSAGE(r.screens.structure_form().error().empty(), r.screens.structure_form().error());
  CHECK_FALSE(r.screens.structure_form().is_open());

  r.ui.forget_controls();
  r.ui.frame();
  CHECK(r.ui.drawn("structure:BVDC-ST-0501"));
  CHECK(r.screens.saved_note().find("Added structure BVDC-ST-0501. Saved to the project file sallow-ford-demo.soffit") ==
        0);

  r.close_project();
  const auto s = read_back(r.home.project(), "BVDC-ST-0501");
  REQUIRE(s.has_value());
  CHECK(s->fields.name == "Kestrel Lane Underbridge");
  CHECK(s->fields.span_count == 3);
  REQUIRE(s->fields.latitude_deg.has_value());
  CHECK(std::abs(*s->fields.latitude_deg - 51.25) < 1e-12);
  REQUIRE(s->fields.longitude_deg.has_value());
  CHECK(std::abs(*s->fields.longitude_deg + 2.5) < 1e-12);
  CHECK(s->fields.location_fictitious);
  CHECK(s->author == "test");
  CHECK(read_back(r.home.project(), kDemoRef).has_value());  // the demo structure is untouched
}

TEST_CASE("A duplicate reference is refused with the field named - the form stays open and nothing changes") {
  RegisterScreen r;
  storage::Project* p = r.screens.session().project();
  const long long before = structure_count(p);
  const std::string journal = p->undo_label();
  REQUIRE(r.ui.tap("add-structure"));
  r.type("form:reference", kDemoRef);
  r.type("form:name", "Another name");
  REQUIRE(r.ui.tap("form:save"));
  CHECK(r.screens.structure_form().is_open());
  CHECK(r.screens.structure_form().error() ==
        "reference: BVDC-ST-0417 is already used by another structure in this project");
  CHECK(r.ui.drawn("form:error"));
  CHECK(structure_count(p) == before);
  CHECK(p->undo_label() == journal);  // no edit was recorded

  // A number that cannot be read is refused before the project is asked.
  r.type("form:reference", "BVDC-ST-0502");
  r.type("form:latitude", "north");
  REQUIRE(r.ui.tap("form:save"));
  CHECK(r.screens.structure_form().is_open());
  CHECK(r.screens.structure_form().error().rfind("latitude: 'north' is not a number", 0) == 0);

  REQUIRE(r.ui.tap("form:cancel"));
  CHECK_FALSE(r.screens.structure_form().is_open());
  CHECK(structure_count(p) == before);
  r.close_project();
  CHECK(read_back(r.home.project(), kDemoRef)->fields.name == "Sallow Ford Bridge");
  CHECK_FALSE(read_back(r.home.project(), "BVDC-ST-0502").has_value());
}

TEST_CASE("Undo takes an added structure away and Redo (or Ctrl+Y) brings it back - Ctrl+Z undoes too") {
  RegisterScreen r;
  storage::Project* p = r.screens.session().project();
  const long long before = structure_count(p);
  REQUIRE(r.ui.tap("add-structure"));
  r.type("form:reference", "BVDC-ST-0503");
  REQUIRE(r.ui.tap("form:save"));
  REQUIRE(structure_count(p) == before + 1);

  REQUIRE(r.ui.tap("undo"));
  CHECK(structure_count(p) == before);
  r.ui.forget_controls();
  r.ui.frame();
  CHECK_FALSE(r.ui.drawn("structure:BVDC-ST-0503"));
  CHECK(r.ui.drawn(std::string("structure:") + kDemoRef));
  CHECK(r.screens.saved_note().rfind("Undone: add structure BVDC-ST-0503. Saved to the project file", 0) == 0);

  r.key(ImGuiKey_Y, 'Y', true);
  CHECK(structure_count(p) == before + 1);
  r.ui.forget_controls();
  r.ui.frame();
  CHECK(r.ui.drawn("structure:BVDC-ST-0503"));

  r.key(ImGuiKey_Z, 'Z', true);
  CHECK(structure_count(p) == before);
  r.close_project();
  CHECK_FALSE(read_back(r.home.project(), "BVDC-ST-0503").has_value());
}

TEST_CASE("Edit details on the structure screen: the form comes filled in, a change is saved, a bad one refused") {
  RegisterScreen r;
  REQUIRE(r.ui.tap(std::string("structure:") + kDemoRef));
  REQUIRE(r.screens.screen == gui::Screen::structure);
  REQUIRE(r.ui.tap("edit-structure"));
  REQUIRE(r.screens.structure_form().is_open());
  // Saving untouched is accepted and changes nothing: the form held the stored values.
  REQUIRE(r.ui.tap("form:save"));
  CHECK_MESSAGE(r.screens.structure_form().error().empty(), r.screens.structure_form().error());
  const auto unchanged = r.screens.session().structure(kDemoRef);
  REQUIRE(unchanged.has_value());
  CHECK(unchanged->structure.fields.carries == "Ferny Lane (unclassified)");  // demo_project.cpp's values
  CHECK(unchanged->structure.fields.span_count == 2);
  CHECK(unchanged->structure.fields.location_fictitious);

  REQUIRE(r.ui.tap("edit-structure"));
  r.type("form:latitude", "95");
  REQUIRE(r.ui.tap("form:save"));
  CHECK(r.screens.structure_form().is_open());
  CHECK(r.screens.structure_form().error() == "latitude: 95 is outside -90 to 90 degrees");
  r.type("form:latitude", "0");
  r.type("form:crosses", "Sallow Beck and a footpath");
  REQUIRE(r.ui.tap("form:save"));
  CHECK_FALSE(r.screens.structure_form().is_open());
  CHECK(r.screens.screen == gui::Screen::structure);
  CHECK(r.screens.session().structure(kDemoRef)->structure.fields.crosses == "Sallow Beck and a footpath");

  r.close_project();
  const auto s = read_back(r.home.project(), kDemoRef);
  REQUIRE(s.has_value());
  CHECK(s->fields.crosses == "Sallow Beck and a footpath");
  REQUIRE(s->fields.latitude_deg.has_value());
  CHECK(std::abs(*s->fields.latitude_deg) < 1e-12);
}

TEST_CASE("A finger drag scrolls the register list without opening a row, and the page buttons page it") {
  RegisterScreen r;
  // A register longer than the screen: forty invented structures.
  for (int i = 0; i < 40; ++i) {
    storage::StructureFields f;
    f.ref = "BVDC-ST-" + std::to_string(600 + i);
    r.screens.session().add_structure(f);
  }
  r.screens.open_demo();  // reopens the file, now with 41 rows
  r.ui.frame();
  r.ui.frame();
  const float top = r.row_y(kDemoRef);
  const float row = r.row_y("BVDC-ST-600") - top;
  REQUIRE(row > 0);

  // Start on a row: a finger lands on rows, and the drag must not tap it.
  const ImVec2 start = gui::UiProbe::instance().centres.at("structure:BVDC-ST-605");
  r.drag(start, ImVec2(start.x, start.y - 200), 10);
  CHECK(r.screens.screen == gui::Screen::register_list);
  const float dragged = r.row_y(kDemoRef);
  CHECK(std::abs((top - dragged) - 200.0f) < 1.0f);  // the content followed the finger

  REQUIRE(r.ui.tap("register:page-down"));
  r.ui.frame();
  const float paged = r.row_y(kDemoRef);
  CHECK(dragged - paged > 3 * row);  // a page is many rows
  REQUIRE(r.ui.tap("register:page-up"));
  r.ui.frame();
  CHECK(std::abs(r.row_y(kDemoRef) - dragged) < 1.0f);  // back by the same page
  REQUIRE(r.ui.tap("register:page-up"));
  r.ui.frame();
  CHECK(std::abs(r.row_y(kDemoRef) - top) < 1.0f);  // and no further than the top
}

TEST_CASE("Undo and Redo on the register carry a reading's step to the open section view") {
  RegisterScreen r;
  REQUIRE(r.ui.tap(std::string("structure:") + kDemoRef));
  REQUIRE(r.ui.tap("visit:2025-05-21"));  // the draft visit: the 2019 one is issued (demo_project.cpp)
  REQUIRE(r.screens.screen == gui::Screen::section);
  REQUIRE(r.screens.sections.readings() != nullptr);
  REQUIRE_FALSE(r.screens.sections.readings()->at(0).excluded);
  // Made through the session, not the view: the view learns of it only by reading the project again.
  const auto detail = r.screens.session().structure(kDemoRef);
  r.screens.session().set_reading_exclusion(detail->inspections.back().sections.front().id, 0, "staff not plumb");
  r.screens.screen = gui::Screen::register_list;  // as the Register tab does (tabs are the frame's, not drawn here)
  r.ui.frame();
  REQUIRE(r.ui.tap("undo"));
  REQUIRE(r.ui.tap("redo"));
  CHECK(r.screens.saved_note().rfind("Redone: exclude reading 1.", 0) == 0);
  REQUIRE(r.screens.sections.readings() != nullptr);
  CHECK(r.screens.sections.readings()->at(0).excluded);
  REQUIRE(r.ui.tap("undo"));
  CHECK_FALSE(r.screens.sections.readings()->at(0).excluded);
}
