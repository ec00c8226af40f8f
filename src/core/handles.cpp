#include "sheetmill/core/handles.hpp"

#include <string>

#include "sheetmill/core/error.hpp"

namespace sheetmill {

void check_cairo(cairo_status_t status, const char* what) {
  if (status != CAIRO_STATUS_SUCCESS) {
    throw_internal_error(std::string(what) + ": cairo: " + cairo_status_to_string(status));
  }
}

}  // namespace sheetmill
