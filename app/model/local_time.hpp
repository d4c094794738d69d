#pragma once
// The tablet's own clock in local time, as the inspector reads it on site.
#include <string>

namespace soffit::app {

// Today's date as YYYY-MM-DD: the default date of a visit and the "today" of the register's filters.
std::string today_iso();
// The time as HH:MM (24 h), for "saved at …" lines.
std::string clock_hhmm();

}  // namespace soffit::app
