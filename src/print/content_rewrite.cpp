#include "print/content_rewrite.hpp"

#ifndef POINTERHOLDER_TRANSITION
#define POINTERHOLDER_TRANSITION 4
#endif
#include <charconv>
#include <cmath>
#include <qpdf/BufferInputSource.hh>
#include <qpdf/QPDFTokenizer.hh>
#include <vector>

#include "sheetmill/core/error.hpp"

namespace sheetmill::print::detail {

namespace {

using Token = QPDFTokenizer::Token;

std::string num(double v) {
  char buf[32];
  auto r =
      std::to_chars(buf, buf + sizeof buf, std::round(v * 1e5) / 1e5, std::chars_format::fixed);
  std::string s(buf, r.ptr);
  if (s.find('.') != std::string::npos) {
    while (s.back() == '0') s.pop_back();
    if (s.back() == '.') s.pop_back();
  }
  return s == "-0" ? "0" : s;
}

bool numeric(const Token& t) {
  return t.getType() == QPDFTokenizer::tt_integer || t.getType() == QPDFTokenizer::tt_real;
}

double value(const Token& t) {
  return std::stod(t.getValue());
}

struct State {
  bool fill_solid = false, stroke_solid = false;  // solid black (0/0/0/100)
  bool fill_rgb = false, stroke_rgb = false;      // the colour space was DeviceRGB
  int op = -1, OP = -1;                           // overprint as last set here; -1 unknown
};

bool solid_black(const Cmyk& c) {
  return c.c == 0 && c.m == 0 && c.y == 0 && c.k >= 1;
}

class Rewriter {
 public:
  Rewriter(const CmykMapper& mapper, bool mask) : mapper_(mapper), mask_(mask) {}

  Rewritten run(const std::string& content) {
    auto input = std::make_shared<BufferInputSource>(
        "content stream",
        new Buffer(reinterpret_cast<unsigned char*>(const_cast<char*>(content.data())),
                   content.size()),
        true);
    QPDFTokenizer tok;
    tok.allowEOF();
    for (;;) {
      Token t = tok.readToken(input, "content stream", true);
      if (t.getType() == QPDFTokenizer::tt_eof) break;
      if (t.getType() == QPDFTokenizer::tt_bad) {
        throw_internal_error("unreadable content stream token: " + t.getErrorMessage());
      }
      if (t.getType() != QPDFTokenizer::tt_word) {
        operands_.push_back(t);
        continue;
      }
      const std::string& w = t.getValue();
      if (w == "ID") {
        // Inline image data follows one white-space character (ISO 32000-1 section 8.9.7).
        char c;
        input->read(&c, 1);
        tok.expectInlineImage(input);
        Token data = tok.readToken(input, "inline image", true);
        inline_image(data);
        continue;
      }
      op(w);
      operands_.clear();
    }
    flush_path();
    out_.content = std::move(text_);
    return std::move(out_);
  }

 private:
  std::string& sink() { return in_path_ ? path_ : text_; }

  void emit_operands() {
    std::string& s = sink();
    for (const Token& o : operands_) {
      s += o.getRawValue();
      s += ' ';
    }
  }
  void emit(const std::string& w) {
    emit_operands();
    sink() += w;
    sink() += '\n';
  }

  void flush_path() {
    text_ += path_;
    path_.clear();
    in_path_ = false;
  }

  // Sets overprint for the painting operator that follows (stroke: OP, fill: op).
  void overprint(int want_stroke, int want_fill) {
    if (mask_) return;
    State& s = state_.back();
    if (want_stroke < 0) want_stroke = s.OP < 0 ? 0 : s.OP;
    if (want_fill < 0) want_fill = s.op < 0 ? 0 : s.op;
    if (s.OP == want_stroke && s.op == want_fill) return;
    std::string name = "/SmOv" + std::to_string(want_stroke) + std::to_string(want_fill);
    out_.overprint_states.insert(name);
    text_ += name + " gs\n";
    s.OP = want_stroke;
    s.op = want_fill;
  }

  bool numbers(std::size_t n) const {
    if (operands_.size() != n) return false;
    for (const Token& t : operands_)
      if (!numeric(t)) return false;
    return true;
  }

  // rg/RG and DeviceRGB sc/scn: the CMYK (or, in a mask, the grey) form.
  void rgb_colour(bool stroke, const char* cmyk_op, const char* gray_op) {
    double r = value(operands_[0]), g = value(operands_[1]), b = value(operands_[2]);
    operands_.clear();
    ++out_.colours_converted;
    if (mask_) {
      // Luminosity of the mask, with the NTSC weights ISO 32000-1 section 11.6.5.3 names
      // for DeviceRGB to DeviceGray (common practice: Cairo's masks are neutral anyway).
      emit(num(0.3 * r + 0.59 * g + 0.11 * b) + " " + gray_op);
      return;
    }
    Cmyk c = mapper_.map(r, g, b);
    (stroke ? state_.back().stroke_solid : state_.back().fill_solid) = solid_black(c);
    emit(num(c.c) + " " + num(c.m) + " " + num(c.y) + " " + num(c.k) + " " + cmyk_op);
  }

  void op(const std::string& w) {
    State& s = state_.back();
    if (w == "rg" || w == "RG") {
      if (!numbers(3)) throw_internal_error("malformed " + w + " in a content stream");
      bool stroke = w == "RG";
      rgb_colour(stroke, stroke ? "K" : "k", stroke ? "G" : "g");
    } else if ((w == "g" || w == "G") && numbers(1) && !mask_) {
      double v = value(operands_[0]);
      operands_.clear();
      bool stroke = w == "G";
      (stroke ? s.stroke_solid : s.fill_solid) = v <= 0;
      emit("0 0 0 " + num(1 - v) + (stroke ? " K" : " k"));
    } else if (w == "k" || w == "K") {
      bool solid = numbers(4) && value(operands_[0]) == 0 && value(operands_[1]) == 0 &&
                   value(operands_[2]) == 0 && value(operands_[3]) >= 1;
      (w == "K" ? s.stroke_solid : s.fill_solid) = solid;
      emit(w);
    } else if (w == "cs" || w == "CS") {
      bool stroke = w == "CS";
      bool rgb = operands_.size() == 1 && operands_[0].getValue() == "/DeviceRGB";
      (stroke ? s.stroke_rgb : s.fill_rgb) = rgb;
      (stroke ? s.stroke_solid : s.fill_solid) = false;
      if (rgb) {
        operands_.clear();
        emit(std::string(mask_ ? "/DeviceGray " : "/DeviceCMYK ") + w);
      } else {
        emit(w);
      }
    } else if ((w == "sc" || w == "scn" || w == "SC" || w == "SCN") &&
               ((w[0] == 's') ? s.fill_rgb : s.stroke_rgb) && numbers(3)) {
      bool stroke = w[0] == 'S';
      rgb_colour(stroke, w.c_str(), w.c_str());
    } else if (w == "q") {
      emit(w);
      state_.push_back(state_.back());
    } else if (w == "Q") {
      emit(w);
      if (state_.size() > 1) state_.pop_back();
    } else if (w == "m" || w == "l" || w == "c" || w == "v" || w == "y" || w == "h" || w == "re" ||
               w == "W" || w == "W*") {
      in_path_ = true;
      emit(w);
    } else if (w == "S" || w == "s") {
      overprint(s.stroke_solid ? 1 : 0, -1);
      flush_path();
      emit(w);
    } else if (w == "f" || w == "F" || w == "f*") {
      overprint(-1, 0);
      flush_path();
      emit(w);
    } else if (w == "B" || w == "B*" || w == "b" || w == "b*") {
      overprint(s.stroke_solid ? 1 : 0, 0);
      flush_path();
      emit(w);
    } else if (w == "n") {
      flush_path();
      emit(w);
    } else if (w == "Tj" || w == "TJ" || w == "'" || w == "\"") {
      overprint(-1, s.fill_solid ? 1 : 0);
      emit(w);
    } else if (w == "Do" || w == "sh" || w == "BI") {
      overprint(0, 0);
      emit(w);
    } else {
      emit(w);
    }
  }

  void inline_image(const Token& data) {
    // The operands since BI are the image dictionary. Cairo writes small images inline;
    // an RGB one would need its samples converted here.
    for (std::size_t i = 0; i + 1 < operands_.size(); ++i) {
      const std::string& k = operands_[i].getValue();
      const std::string& v = operands_[i + 1].getValue();
      if ((k == "/CS" || k == "/ColorSpace") && (v == "/RGB" || v == "/DeviceRGB")) {
        throw_internal_error("an inline RGB image in the PDF; it cannot be made CMYK yet");
      }
    }
    emit_operands();
    text_ += "ID ";
    text_ += data.getRawValue();
    operands_.clear();
  }

  const CmykMapper& mapper_;
  bool mask_;
  std::vector<Token> operands_;
  std::vector<State> state_{State{}};
  std::string text_, path_;
  bool in_path_ = false;
  Rewritten out_;
};

}  // namespace

Rewritten rewrite_content(const std::string& content, const CmykMapper& mapper, bool mask) {
  return Rewriter(mapper, mask).run(content);
}

bool overprint_stroke(const std::string& name) {
  return name.size() == 7 && name[5] == '1';
}
bool overprint_fill(const std::string& name) {
  return name.size() == 7 && name[6] == '1';
}

}  // namespace sheetmill::print::detail
