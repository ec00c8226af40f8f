#pragma once
// sRGB colour with straight (not premultiplied) alpha, components 0..1.

namespace sheetmill {

struct Colour {
  double r = 0, g = 0, b = 0, a = 1;
  bool operator==(const Colour&) const = default;
};

}  // namespace sheetmill
