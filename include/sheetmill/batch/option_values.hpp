#pragma once
// Parsing the values of the index and batch command-line options. Every function throws
// Error(input) naming the option (`where`) and what was expected.

#include <string>
#include <utility>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::batch {

// "25000" or "1:25000" or "1:25 000" -> 25000.
double parse_scale(const std::string& text, const std::string& where);
// A paper length with its unit: mm, cm, in, pt -> millimetres. "0" is allowed bare.
double parse_paper_length_mm(const std::string& text, const std::string& where);
// A ground length with its unit: m, km, ft, mi -> metres.
double parse_ground_length_m(const std::string& text, const std::string& where);
// "400x300mm" (unit once, at the end, or on each side) -> {width_mm, height_mm}.
std::pair<double, double> parse_frame_mm(const std::string& text, const std::string& where);
// "7.5x7.5" or "7.5" (minutes of arc; a trailing "min" or "'" is allowed) -> {width, height}.
std::pair<double, double> parse_minutes(const std::string& text, const std::string& where);
// "minx,miny,maxx,maxy" -> Box.
Box parse_box(const std::string& text, const std::string& where);
// "a,b,c" -> {"a","b","c"}, empty items dropped.
std::vector<std::string> split_list(const std::string& text);

}  // namespace sheetmill::batch
