#pragma once
// Joining line pieces end to end (a road digitised as many segments) so a name can run along the
// whole chain. Private to the render stage.

#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::render {

// Chains pieces whose end points coincide within `snap` (page mm), reversing pieces as needed.
// Where three or more pieces meet, the first unused one found continues the chain. Every input
// point appears in exactly one output chain.
std::vector<Polyline> chain_lines(std::vector<Polyline> pieces, double snap = 0.01);

}  // namespace sheetmill::render
