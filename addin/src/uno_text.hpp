// Engine-free UNO helpers shared by the rxnheat add-in (uno_values.cpp) and the benchmark's
// do-nothing add-in (tests/bench/noop_addin), which must not link the engine: UTF-16 <-> UTF-8
// and the office's error value for one element of an array result.
#pragma once

#include <rtl/ustring.hxx>

#include <string>
#include <string_view>

namespace rxnheat::addin {

using ::rtl::OUString;

/// UTF-16 -> UTF-8, lossless; false (and `out` untouched) for text that is not valid UTF-16
/// (a lone surrogate, which Calc can make with UNICHAR(55357)).
bool to_utf8(const OUString& text, std::string& out);
/// UTF-8 -> UTF-16, lossless; invalid bytes (never expected from the engine) become U+FFFD.
OUString from_utf8(std::string_view text);

/// The value Calc shows as an error in one element of an array result: a NaN whose payload is
/// the office's error code (Err:502 for bad input, #VALUE! for an internal failure), the same
/// representation Calc uses for error values inside matrices. It is never a number.
double error_element(bool internal);

}  // namespace rxnheat::addin
