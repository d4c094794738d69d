#pragma once
// The two forms of the rings view, for a finger on a tablet: a ring count
// (span, face, position, rings, brick + joint, taped face depth, confidence,
// basis) and a fill depth (span, chainage, offset, method, depth, uncertainty,
// surfacing). Numbers come from the on-screen keypad, choices are buttons.
// Each form only gathers and checks what is typed; the caller stores it and
// answers with the refusal, if any, which the form shows with nothing lost.
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "app/gui/keypad_field.hpp"
#include "storage/survey_records.hpp"

namespace soffit::gui {

struct SpanChoice {
  std::string id, label;
  storage::SpanDetails details;
};

// Stores what the form gathered; returns "" when kept, else why not (shown in the form).
template <class Fields>
using SaveFields = std::function<std::string(const Fields&)>;

class RingCountDialog {
 public:
  // A new count on the visit `inspection_id`; brick + joint starts from the span's details.
  void open_new(const std::vector<SpanChoice>& spans, const std::string& inspection_id);
  // The stored count `f`, every field filled in.
  void open_edit(const std::vector<SpanChoice>& spans, const storage::RingCountFields& f);
  // Draws the form while open; Save calls `save` and closes if it kept the count.
  void draw(const SaveFields<storage::RingCountFields>& save);
  bool is_open() const { return open_ || shown_; }

 private:
  const SpanChoice* span() const;
  void draw_body();
  // Keeps a number of rings typed on the keypad, or says why not.
  void keep_rings(double typed);
  std::optional<storage::RingCountFields> gathered();

  std::vector<SpanChoice> spans_;
  storage::RingCountFields base_;  // inspection, and the recorded range an edit keeps
  bool editing_ = false, open_ = false, shown_ = false;
  std::string span_id_, face_, position_, confidence_;
  int rings_ = 0;  // 0: not entered
  std::optional<double> ring_depth_mm_, taped_mm_;
  std::optional<double> rings_typed_;  // from the keypad, until checked into rings_
  char face_text_[32] = {}, position_text_[48] = {}, basis_[160] = {}, notes_[512] = {};
  KeypadField numbers_;
  std::string error_;
};

class FillDepthDialog {
 public:
  void open_new(const std::vector<SpanChoice>& spans, const std::string& inspection_id);
  void open_edit(const std::vector<SpanChoice>& spans, const storage::FillDepthFields& f);
  void draw(const SaveFields<storage::FillDepthFields>& save);
  bool is_open() const { return open_ || shown_; }

 private:
  void draw_body();
  std::optional<storage::FillDepthFields> gathered();

  std::vector<SpanChoice> spans_;
  storage::FillDepthFields base_;
  bool editing_ = false, open_ = false, shown_ = false;
  std::string span_id_, method_;
  std::optional<double> chainage_m_, offset_m_, depth_m_, uncertainty_m_, surfacing_m_;
  char notes_[512] = {};
  KeypadField numbers_;
  std::string error_;
};

}  // namespace soffit::gui
