// Drives the photo viewer through ImGui's input on the demo project (FIELD.md
// §10, invented; storage/demo_project.cpp gives every defect one photo): the
// thumbnails arrive from the loader's worker, a tap shows a photo, "Mark a
// defect" then a tap on the photo stores a marker where the finger was, the
// file is reopened to prove it, and Undo takes it away. Stored values are read
// back by SQL of the test's own, not from the view.
#include <doctest/doctest.h>
#include <stb_image_write.h>

#include <chrono>
#include <cmath>
#include <filesystem>
#include <fstream>
#include <optional>
#include <string>
#include <thread>
#include <vector>

#include "app/gui/photo_viewer.hpp"
#include "headless_ui.hpp"
#include "storage/photo_store.hpp"
#include "storage/sqlite_statement.hpp"
#include "tests/app/demo_project_fixture.hpp"

using namespace soffit;
namespace fs = std::filesystem;

namespace {

using test::DemoProject;

// Counts what the view asks of the display, in place of OpenGL.
struct FakeTextures final : gui::TextureFactory {
  int* created;
  int* destroyed;
  std::vector<std::pair<int, int>>* sizes;
  FakeTextures(int* c, int* d, std::vector<std::pair<int, int>>* s) : created(c), destroyed(d), sizes(s) {}
  ImTextureID create(const uint8_t* rgba, int w, int h) override {
    if (!rgba) return nullptr;
    sizes->emplace_back(w, h);
    return reinterpret_cast<ImTextureID>(static_cast<intptr_t>(++*created));
  }
  void destroy(ImTextureID) override { ++*destroyed; }
  int max_side() const override { return 4096; }
};

std::string visit_id(storage::Project& p, const std::string& date) {
  storage::Statement q(p.db(), "SELECT id FROM inspection WHERE inspection_date = ?1");
  q.bind(1, date);
  REQUIRE(q.step());
  return q.column_text(0);
}

std::string defect_id(storage::Project& p, const std::string& visit, const std::string& ref) {
  storage::Statement q(p.db(), "SELECT id FROM defect WHERE inspection_id = ?1 AND ref = ?2");
  q.bind_all(visit, ref);
  REQUIRE(q.step());
  return q.column_text(0);
}

long long count(storage::Project& p, const std::string& sql, const std::string& a, const std::string& b = "") {
  storage::Statement q(p.db(), sql);
  q.bind(1, a);
  if (!b.empty()) q.bind(2, b);
  REQUIRE(q.step());
  return q.column_int64(0);
}

std::optional<std::pair<double, double>> stored_marker(storage::Project& p, const std::string& photo,
                                                       const std::string& defect) {
  storage::Statement q(p.db(),
                       "SELECT json_extract(marker_json, '$.x'), json_extract(marker_json, '$.y') FROM photo_defect "
                       "WHERE photo_id = ?1 AND defect_id = ?2");
  q.bind_all(photo, defect);
  if (!q.step()) return std::nullopt;
  return std::make_pair(q.column_double(0), q.column_double(1));
}

// Frames until `done` or 10 s: decoding runs on the loader's worker.
template <typename F>
bool frames_until(test::HeadlessUi& ui, F done) {
  const auto until = std::chrono::steady_clock::now() + std::chrono::seconds(10);
  while (!done()) {
    if (std::chrono::steady_clock::now() > until) return false;
    ui.frame();
    std::this_thread::sleep_for(std::chrono::milliseconds(1));
  }
  ui.frame();  // the view draws what arrived
  return true;
}

// The viewer drawn headless as the app draws it each frame: what the worker
// finished is taken first, then the view is drawn.
struct ViewerUi : test::HeadlessUi {
  explicit ViewerUi(gui::PhotoViewer& viewer)
      : HeadlessUi([&viewer] {
          viewer.poll();
          viewer.draw();
        }) {}
};

// The demo's 2025 visit (FIELD.md §10: PI-2025) open in a viewer with no
// display (placeholders of each photo's shape), one frame drawn.
struct Viewing2025 {
  DemoProject demo;
  const std::string visit = visit_id(*demo.project, "2025-05-21");
  gui::PhotoViewer viewer;
  ViewerUi ui{viewer};

  Viewing2025() {
    viewer.open(*demo.project, visit);
    ui.frame();
  }
};

// Closes the demo's project file and opens it again from disk: what is then read was committed.
void reopen(DemoProject& demo) {
  const std::string path = demo.project->path();
  demo.project.reset();
  demo.project.emplace(storage::Project::open(path, "test"));
}

// A flat grey w x h PNG of the test's own beside the demo project (add_photo takes JPEG or PNG); its path.
std::string grey_png(const DemoProject& demo, const std::string& name, int w, int h, uint8_t grey) {
  const std::vector<uint8_t> px(static_cast<size_t>(w * h * 3), grey);
  const std::string path = (demo.dir / name).string();
  REQUIRE(stbi_write_png(path.c_str(), w, h, 3, px.data(), w * 3));
  return path;
}

// Types `path` (and `caption`, if any) into the Add photo dialog and confirms it.
void add_through_dialog(test::HeadlessUi& ui, const std::string& path, const std::string& caption = "") {
  REQUIRE(ui.tap("add photo"));
  REQUIRE(ui.tap("photo path"));
  ImGui::GetIO().AddInputCharactersUTF8(path.c_str());
  ui.frame();
  if (!caption.empty()) {
    REQUIRE(ui.tap("photo caption"));
    ImGui::GetIO().AddInputCharactersUTF8(caption.c_str());
    ui.frame();
  }
  REQUIRE(ui.tap("confirm add photo"));
}

}  // namespace

TEST_CASE("photo viewer: the 2025 visit's photos arrive as thumbnails from the worker, then the first large") {
  DemoProject demo;
  int created = 0, destroyed = 0;
  std::vector<std::pair<int, int>> sizes;
  const std::string visit = visit_id(*demo.project, "2025-05-21");  // FIELD.md §10: PI-2025
  {
    gui::PhotoViewer viewer(std::make_unique<FakeTextures>(&created, &destroyed, &sizes));
    viewer.open(*demo.project, visit);
    test::HeadlessUi ui([&] {
      viewer.poll();
      viewer.draw();
    });
    ui.frame();
    // Every 2025 defect (D01–D10, FIELD.md §10.4) has one photo in the demo.
    const long long in_db = count(*demo.project, "SELECT count(*) FROM photo WHERE inspection_id = ?1", visit);
    REQUIRE(in_db == 10);
    CHECK(viewer.visit().photos.size() == 10);
    REQUIRE(frames_until(ui, [&] { return viewer.thumbnails_ready() && viewer.photo_ready(); }));
    CHECK(created == 11);  // ten thumbnails and the photo shown
    // The demo pictures are 640 x 480 (demo_photo_painter.hpp); add_photo stores thumbnails box-averaged
    // by a whole factor to at most kThumbnailSide (image_thumbnail.hpp): ceil(640 / 256) = 3, so 214 x 160.
    CHECK(std::count(sizes.begin(), sizes.end(), std::pair{214, 160}) == 10);
    CHECK(std::count(sizes.begin(), sizes.end(), std::pair{640, 480}) == 1);
    CHECK(viewer.photo_error().empty());
    for (int i = 1; i <= 10; ++i) CHECK(ui.drawn("photo:" + std::to_string(i)));
    // Drawn with the photo's own shape, inside the window.
    const auto rect = viewer.image_rect();
    REQUIRE(rect);
    const float w = rect->second.x - rect->first.x, h = rect->second.y - rect->first.y;
    CHECK(std::abs(w / h - 640.0f / 480.0f) < 0.01f);
    CHECK(rect->second.x <= 1280.0f);
    CHECK(rect->second.y <= 800.0f);
  }
  CHECK(destroyed == created);  // no texture outlives the viewer
}

TEST_CASE_FIXTURE(Viewing2025,
                  "photo viewer: tap a photo, mark a defect by tapping it - the marker is where the finger was, "
                  "survives reopening the file, and Undo removes it") {
  REQUIRE(frames_until(ui, [&] { return viewer.thumbnails_ready(); }));
  REQUIRE(ui.tap("photo:2"));
  REQUIRE(viewer.selected() == size_t{1});
  REQUIRE(frames_until(ui, [&] { return viewer.photo_ready(); }));
  const std::string photo = viewer.visit().photos[1].id;
  // D05 (the missing brick in S2, FIELD.md §10.4) is not on this photo yet.
  const std::string d05 = defect_id(*demo.project, visit, "D05");
  REQUIRE_FALSE(stored_marker(*demo.project, photo, d05));

  REQUIRE(ui.tap("mark defect"));
  REQUIRE(ui.tap("defect:D05"));
  const auto rect = viewer.image_rect();
  REQUIRE(rect);
  const auto [a, b] = *rect;
  const ImVec2 at(a.x + 0.30f * (b.x - a.x), a.y + 0.65f * (b.y - a.y));
  ui.tap_at(at);
  CHECK(viewer.message().empty());
  // Expected from the tap itself, mapped through the rectangle the photo was drawn in.
  const double want_x = (at.x - a.x) / (b.x - a.x), want_y = (at.y - a.y) / (b.y - a.y);
  auto marker = stored_marker(*demo.project, photo, d05);
  REQUIRE(marker);
  CHECK(std::abs(marker->first - want_x) < 0.01);
  CHECK(std::abs(marker->second - want_y) < 0.01);
  CHECK(viewer.saved_note().find("demo.soffit") != std::string::npos);  // says where the change went

  // Reopen the file: the marker was committed, not held by the view.
  viewer.close();
  reopen(demo);
  marker = stored_marker(*demo.project, photo, d05);
  REQUIRE(marker);
  CHECK(std::abs(marker->first - want_x) < 0.01);
  CHECK(std::abs(marker->second - want_y) < 0.01);

  // The journal lives in the file, so Undo still takes it back after reopening.
  viewer.open(*demo.project, visit);
  ui.forget_controls();
  ui.frame();
  REQUIRE(ui.tap("undo"));
  CHECK_FALSE(stored_marker(*demo.project, photo, d05));
  REQUIRE(ui.tap("redo"));
  CHECK(stored_marker(*demo.project, photo, d05));
}

TEST_CASE_FIXTURE(Viewing2025,
                  "photo viewer: marking a defect already on the photo moves its marker (one per defect and photo)") {
  const std::string photo = viewer.visit().photos[0].id;
  REQUIRE(viewer.visit().photos[0].links.size() == 1);
  const std::string ref = viewer.visit().photos[0].links[0].defect_ref;
  const std::string id = defect_id(*demo.project, visit, ref);
  REQUIRE(ui.tap("mark defect"));
  REQUIRE(ui.tap("defect:" + ref));
  const auto [a, b] = *viewer.image_rect();
  ui.tap_at(ImVec2(a.x + 0.9f * (b.x - a.x), a.y + 0.1f * (b.y - a.y)));
  const auto marker = stored_marker(*demo.project, photo, id);
  REQUIRE(marker);
  CHECK(std::abs(marker->first - 0.9) < 0.01);
  CHECK(std::abs(marker->second - 0.1) < 0.01);
  CHECK(count(*demo.project, "SELECT count(*) FROM photo_defect WHERE photo_id = ?1", photo) == 1);
}

TEST_CASE_FIXTURE(Viewing2025,
                  "photo viewer: removing a link asks first - Keep keeps it, Remove removes it, Undo brings it back") {
  const std::string photo = viewer.visit().photos[0].id;
  const std::string ref = viewer.visit().photos[0].links.at(0).defect_ref;
  const std::string sql = "SELECT count(*) FROM photo_defect WHERE photo_id = ?1";
  REQUIRE(ui.tap("unlink:" + ref));
  REQUIRE(ui.tap("keep link"));
  CHECK(count(*demo.project, sql, photo) == 1);
  REQUIRE(ui.tap("unlink:" + ref));
  REQUIRE(ui.tap("confirm unlink"));
  CHECK(count(*demo.project, sql, photo) == 0);
  CHECK(count(*demo.project, "SELECT count(*) FROM photo WHERE id = ?1", photo) == 1);  // the photo stays
  REQUIRE(ui.tap("undo"));
  CHECK(count(*demo.project, sql, photo) == 1);
}

TEST_CASE("photo viewer: the issued 2019 visit shows its photos but offers no marking") {
  DemoProject demo;
  const std::string visit = visit_id(*demo.project, "2019-05-14");  // issued by the demo (FIELD.md §10)
  gui::PhotoViewer viewer;
  viewer.open(*demo.project, visit);
  ViewerUi ui(viewer);
  ui.frame();
  REQUIRE_FALSE(viewer.visit().photos.empty());
  CHECK(viewer.visit().status == "issued");
  const long long links = count(*demo.project,
                                "SELECT count(*) FROM photo_defect l JOIN defect d ON d.id = l.defect_id "
                                "WHERE d.inspection_id = ?1",
                                visit);
  ui.forget_controls();
  ui.frame();
  REQUIRE(ui.tap("mark defect"));  // drawn, but disabled
  CHECK_FALSE(ui.drawn("defect:D01"));
  const std::string ref = viewer.visit().photos[0].links.at(0).defect_ref;
  REQUIRE(ui.tap("unlink:" + ref));
  CHECK_FALSE(ui.drawn("confirm unlink"));
  CHECK(count(*demo.project,
              "SELECT count(*) FROM photo_defect l JOIN defect d ON d.id = l.defect_id WHERE d.inspection_id = ?1",
              visit) == links);
}

TEST_CASE("photo viewer: a photo file missing from the media folder is named in a message, not a crash") {
  DemoProject demo;
  const std::string visit = visit_id(*demo.project, "2025-05-21");
  gui::PhotoViewer viewer;
  viewer.open(*demo.project, visit);
  const std::string file = storage::photo_file_path(demo.project->path(), viewer.visit().photos[2].file_name);
  REQUIRE(fs::remove(file));
  ViewerUi ui(viewer);
  ui.frame();
  REQUIRE(ui.tap("photo:3"));
  REQUIRE(viewer.selected() == size_t{2});
  REQUIRE(frames_until(ui, [&] { return viewer.photo_ready(); }));
  CAPTURE(viewer.photo_error());
  CHECK(viewer.photo_error().find(file) != std::string::npos);
  REQUIRE(ui.tap("photo:1"));  // the others still show
  REQUIRE(frames_until(ui, [&] { return viewer.photo_ready(); }));
  CHECK(viewer.photo_error().empty());
}

TEST_CASE_FIXTURE(Viewing2025,
                  "photo viewer: Add photo copies a typed file into the project on a worker and shows it") {
  const std::string source = grey_png(demo, "new-photo.png", 60, 40, 120);
  add_through_dialog(ui, source, "looking N");
  REQUIRE(frames_until(ui, [&] { return !viewer.importing(); }));
  CHECK(viewer.message().empty());
  CHECK(count(*demo.project, "SELECT count(*) FROM photo WHERE inspection_id = ?1", visit) == 11);
  CHECK(count(*demo.project, "SELECT count(*) FROM photo WHERE original_name = ?1 AND caption = ?2",
              "new-photo.png", "looking N") == 1);
  REQUIRE(viewer.selected());
  CHECK(viewer.visit().photos[*viewer.selected()].original_name == "new-photo.png");
  REQUIRE(frames_until(ui, [&] { return viewer.photo_ready(); }));
  CHECK(viewer.photo_error().empty());
}

namespace {

size_t files_in(const std::string& folder) {
  return static_cast<size_t>(std::distance(fs::directory_iterator(folder), fs::directory_iterator()));
}

}  // namespace

TEST_CASE_FIXTURE(Viewing2025,
                  "photo viewer: Close photos during an import closes once the UI thread has stored the photo") {
  const std::string source = grey_png(demo, "late-photo.png", 80, 60, 90);
  add_through_dialog(ui, source);
  // Close is offered while the worker prepares the file; the view stays until the row is stored.
  REQUIRE(ui.tap("close photos"));
  REQUIRE(frames_until(ui, [&] { return !viewer.is_open(); }));
  CHECK_FALSE(viewer.importing());
  reopen(demo);  // the row is in the file
  const std::string path = demo.project->path();
  CHECK(count(*demo.project, "SELECT count(*) FROM photo WHERE inspection_id = ?1 AND original_name = ?2", visit,
              "late-photo.png") == 1);
  storage::Statement q(demo.project->db(), "SELECT file_name FROM photo WHERE original_name = 'late-photo.png'");
  REQUIRE(q.step());
  CHECK(fs::exists(storage::photo_file_path(path, q.column_text(0))));
}

TEST_CASE_FIXTURE(Viewing2025,
                  "photo viewer: a file that is not a photo is refused with its name - no row, no file in the "
                  "media folder") {
  const std::string source = (demo.dir / "site-notes.jpg").string();
  std::ofstream(source) << "site notes, not a photo\n";
  const std::string media = storage::media_folder(demo.project->path());
  const size_t files_before = files_in(media);
  const long long rows_before = count(*demo.project, "SELECT count(*) FROM photo WHERE inspection_id = ?1", visit);
  add_through_dialog(ui, source);
  REQUIRE(frames_until(ui, [&] { return !viewer.importing(); }));
  CAPTURE(viewer.message());
  CHECK(viewer.message().find("Photo not added:") == 0);
  CHECK(viewer.message().find("site-notes.jpg: not added: not a JPEG or PNG photo") != std::string::npos);
  CHECK(count(*demo.project, "SELECT count(*) FROM photo WHERE inspection_id = ?1", visit) == rows_before);
  CHECK(files_in(media) == files_before);
}

TEST_CASE("photo viewer: at most `keep_large` big photos stay as textures while the person goes through them") {
  DemoProject demo;
  int created = 0, destroyed = 0;
  std::vector<std::pair<int, int>> sizes;
  const std::string visit = visit_id(*demo.project, "2025-05-21");
  gui::PhotoViewer viewer(std::make_unique<FakeTextures>(&created, &destroyed, &sizes), 2);
  viewer.open(*demo.project, visit);
  ViewerUi ui(viewer);
  ui.frame();
  REQUIRE(frames_until(ui, [&] { return viewer.thumbnails_ready() && viewer.photo_ready(); }));
  for (int i = 2; i <= 5; ++i) {
    REQUIRE(ui.tap("photo:" + std::to_string(i)));
    REQUIRE(frames_until(ui, [&] { return viewer.photo_ready(); }));
  }
  const auto big = std::count(sizes.begin(), sizes.end(), std::pair{640, 480});
  CHECK(big == 5);                      // photos 1 to 5, each decoded once
  CHECK(created - destroyed == 10 + 2);  // the ten thumbnails and the two photos shown last
  viewer.close();
  CHECK(destroyed == created);
}
