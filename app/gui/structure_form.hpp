#pragma once
// The form for a structure's own details (reference, name, what it carries and
// crosses, spans, location, notes), used to add one to the register and to
// edit one. Shown as a modal popup sized to the screen, its fields full width
// and touch-tall, scrolling by finger when the text is large. The caller saves:
// a refused save keeps the form open with the reason, its field outlined.
#include <functional>
#include <initializer_list>
#include <string>

#include "storage/register_records.hpp"

namespace soffit::gui {

class StructureForm {
 public:
  // Writes the fields (through the session). Throws to refuse them; a message
  // that starts with a field's name ("latitude: ...") outlines that field.
  using Save = std::function<void(const storage::StructureFields&)>;

  void open_new();
  void open_edit(const storage::StructureRecord& structure);
  bool is_open() const { return open_; }
  // The structure being edited; empty when adding one.
  const std::string& structure_id() const { return structure_id_; }

  // Draws the form while it is open (call every frame of the screen that
  // opened it). True on the frame a save succeeded; the form is then closed.
  bool draw(const Save& save);

  // The fields as last saved, for the caller to show them.
  const storage::StructureFields& saved() const { return saved_; }
  // Why the last save was refused, without the file's path; empty if it was not.
  const std::string& error() const { return error_; }

  // Reads the typed text into fields; false with error() set (naming the
  // field) when a number cannot be read. Numbers: a point or a comma for decimals.
  bool read_fields(storage::StructureFields& out);

 private:
  void draw_fields();
  struct Field {
    const char* label;
    const char* key;  // as a refusal names it: "reference", "latitude", ...
    std::string* text;
    const char* probe_name;
  };
  void draw_input(const char* field, std::string& text, const char* probe_name);
  void draw_row(const char* id, std::initializer_list<Field> fields, bool side_by_side);
  void fail(std::string message);

  std::string ref_, name_, carries_, crosses_, spans_, latitude_, longitude_, notes_;
  bool fictitious_ = false;
  std::string structure_id_, editing_ref_;
  bool open_ = false, open_requested_ = false, focus_first_ = false;
  std::string error_, error_field_;
  storage::StructureFields saved_;
};

}  // namespace soffit::gui
