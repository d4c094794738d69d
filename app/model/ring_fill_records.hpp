#pragma once
// Ring counts and fill depths of one visit as the rings view edits them:
// their database keys, the step from what is taped on site (one ring = brick
// + joint) to what is stored (the brick alone; the joint is the span's), and
// each change as one Project::edit, so one undo step. No UI here.
#include <optional>
#include <string>
#include <vector>

#include "storage/project_file.hpp"
#include "storage/survey_records.hpp"

namespace soffit::app {

// The keys of a visit's rows, one per row of `counts` / `fills` (in the order
// storage::load_inspection_export gives them). A key is empty where the row
// read again does not match: that row is then shown but cannot be edited.
std::vector<std::string> ring_count_ids(storage::Connection& db, const std::string& inspection_id,
                                        const std::vector<storage::RingCountFields>& counts);
std::vector<std::string> fill_depth_ids(storage::Connection& db, const std::string& inspection_id,
                                        const std::vector<storage::FillDepthFields>& fills);

// The span's joint, if recorded: what separates "brick + joint" from the brick.
std::optional<double> span_joint_mm(const storage::SpanDetails& span);
// Brick + joint to start a new count with: the span's unit depth plus its joint
// when both are recorded (else the unit depth alone, else nothing).
std::optional<double> default_ring_depth_mm(const storage::SpanDetails& span);
// One ring of a stored count as the dialog shows it: its unit depth plus the span's joint.
std::optional<double> ring_depth_mm(const storage::RingCountFields& count, const storage::SpanDetails& span);
// The stored unit depth for `ring_depth_mm` typed as one ring (brick + joint).
// Returns nullopt and sets `problem` (naming the field) when the joint takes all of it.
std::optional<double> unit_depth_from_ring_depth(double ring_depth_mm, const storage::SpanDetails& span,
                                                 std::string& problem);

// "S1 US crown": names a count on the Undo button and in the saved note.
std::string ring_count_name(const std::string& span_label, const storage::RingCountFields& c);
// "S1 at 3.20 m (trial pit)".
std::string fill_depth_name(const std::string& span_label, const storage::FillDepthFields& f);
// Words for a stored method key: trial_pit → "trial pit", gpr → "GPR".
std::string fill_method_words(const std::string& method);

// Each is one edit of the project file (one undo step) labelled with `name`.
// Bad values throw storage::StorageError naming the field; nothing is changed then.
std::string add_ring_count(storage::Project& project, const std::string& name, const storage::RingCountFields& f);
void update_ring_count(storage::Project& project, const std::string& name, const std::string& id,
                       const storage::RingCountFields& f);
void delete_ring_count(storage::Project& project, const std::string& name, const std::string& id);
std::string add_fill_depth(storage::Project& project, const std::string& name, const storage::FillDepthFields& f);
void update_fill_depth(storage::Project& project, const std::string& name, const std::string& id,
                       const storage::FillDepthFields& f);
void delete_fill_depth(storage::Project& project, const std::string& name, const std::string& id);

}  // namespace soffit::app
