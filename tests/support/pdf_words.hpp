#pragma once
// Words of a PDF as poppler's `pdftotext -bbox` reports them: the outside reader the tests use
// to check what a sheet's text says and where it stands.

#include <filesystem>
#include <string>
#include <vector>

#include "sheetmill/core/geometry.hpp"

namespace sheetmill::test {

struct PdfWord {
  std::string text;
  Box box_pt;  // PDF points, y down from the page's top-left corner
  Box box_mm() const;
};

// Every word on every page, in poppler's reading order, or with `content_order` in the order
// the page's content stream draws them (pdftotext -raw). Throws when pdftotext fails.
std::vector<PdfWord> pdf_words(const std::filesystem::path& pdf, bool content_order = false);

// Poppler ends a word at the end of every text-showing string, so text laid glyph by glyph along
// a curve (each glyph its own string, turned its own way) comes back one letter per "word".
// This joins neighbours (in content order: see pdf_words) back into words: a letter joins the word
// before it when their boxes are closer than `max_gap_em` of the letters' size across the line
// (the letters of a word abut, since poppler's boxes are advance boxes; a word space leaves about
// 0.3 em).
// Words are kept as poppler built them otherwise.
std::vector<PdfWord> join_letters(const std::vector<PdfWord>& words, double max_gap_em = 0.12);
// The word each piece belongs to under the same rule: pieces with one number form one word.
std::vector<std::size_t> letter_groups(const std::vector<PdfWord>& words, double max_gap_em = 0.12);

// Pairs of words (pieces of different words, in content order as pdf_words(pdf, true) gives
// them) whose boxes, each shrunk by `shrink_pt` on every side, overlap: two words printed over
// each other. The shrink absorbs boxes that only touch (poppler's boxes are the fonts' boxes,
// taller than the ink).
std::vector<std::pair<PdfWord, PdfWord>> overlapping_words(const std::vector<PdfWord>& words,
                                                           double shrink_pt = 0.25);

}  // namespace sheetmill::test
