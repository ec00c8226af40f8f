#pragma once
// One multi-page PDF from the sheets of a batch, pages in the given order, written atomically.
// Each sheet's pages are copied whole (content, fonts, images, georeferencing); the per-sheet
// layer lists are not merged. Inputs are opened at most 200 at a time, so any number of sheets
// can be merged within the open-file limit.

#include <filesystem>
#include <vector>

namespace sheetmill::batch {

void merge_pdfs(const std::vector<std::filesystem::path>& inputs,
                const std::filesystem::path& output);

}  // namespace sheetmill::batch
