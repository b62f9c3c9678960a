// Reading Calc's UNO argument values, with no dependency on the rxnheat engine: the kind of an
// argument, blank and omitted arguments, 1x1 ranges, text and numbers, UTF-16 <-> UTF-8, the
// cells of a range as text, and the office's error value for one element of an array result.
// Compiled into the rxnheat add-in (through convert.hpp) and into the benchmark's do-nothing
// add-in (tests/bench/noop_addin), which must not link the engine.
#pragma once

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <rtl/ustring.hxx>

#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat_addin {

namespace uno = ::com::sun::star::uno;
using ::rtl::OString;
using ::rtl::OUString;

/// A bad argument found by the add-in itself; becomes IllegalArgumentException (Err:502).
class ArgError : public std::runtime_error {
public:
    ArgError(const std::string& message, int position)
        : std::runtime_error(message), position_(position) {}
    int position() const noexcept { return position_; }
private:
    int position_;  ///< 0-based argument index, -1 if not known
};

/// UTF-16 -> UTF-8, lossless; ArgError for text that is not valid UTF-16 (lone surrogates).
std::string to_utf8(const OUString& text, int position = -1);
/// UTF-8 -> UTF-16, lossless; invalid bytes (never expected from the engine) become U+FFFD.
OUString from_utf8(std::string_view text);

/// What an argument slot held.
enum class Given { nothing, text, number, range };
Given classify(const uno::Any& value);

/// Calc passes a blank single cell as the number 0 and an omitted argument as an empty any;
/// both read as "not given" in optional arguments (documented in README-install.md).
bool is_blank(const uno::Any& value);

/// The single cell of a 1x1 range, or the value itself; ArgError for a bigger range.
const uno::Any& single_value(const uno::Any& value, const char* name, int position);

/// An optional argument that may be a number or text (a temperature before the engine reads
/// its unit): `kind` is nothing (not given), number (finite, in `number`) or text (trimmed
/// UTF-8, in `text`). A 1x1 range counts as its one cell.
struct NumberOrText {
    Given kind = Given::nothing;
    double number = 0;
    std::string text;
};
NumberOrText number_or_text_arg(const uno::Any& value, const char* name, int position);

/// Optional text argument (unit, species): not given -> empty string.
std::string text_arg(const uno::Any& value, const char* name, int position);
/// Required text argument: ArgError if not given.
std::string required_text_arg(const uno::Any& value, const char* name, int position);
/// Optional number: not given -> `fallback`.
double number_arg(const uno::Any& value, const char* name, int position, double fallback);
/// Required number (a blank cell is 0, as everywhere in Calc).
double required_number_arg(const uno::Any& value, const char* name, int position);

/// The cells of a range argument as text, row by row: text as UTF-8 (untrimmed), a number as
/// the shortest decimal that reads back as the same double, an empty cell as "". ArgError
/// (naming `name`) for a nested range. `value` must be a range (classify() == Given::range).
std::vector<std::vector<std::string>> range_texts(const uno::Any& value, const char* name,
                                                  int position);

/// The value Calc shows as an error in one element of an array result: a NaN whose payload is
/// the office's error code (Err:502 for bad input, #VALUE! for an internal failure), the same
/// representation Calc uses for error values inside matrices. It is never a number.
double error_element(bool internal);

}  // namespace rxnheat_addin
