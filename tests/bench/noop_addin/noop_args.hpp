// Benchmark only: the do-nothing add-in's reading of Calc's UNO argument values, with no
// dependency on the rxnheat engine (the kind of an argument, blank and omitted arguments, 1x1
// ranges, text and numbers, the cells of a range as text). It is the reading the rxnheat add-in
// did by hand before it read every argument by the catalogue's rules; the text conversion and
// the error value are the add-in's own (addin/src/uno_text.hpp).
#pragma once

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <rtl/ustring.hxx>

#include "uno_text.hpp"

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
using rxnheat::addin::from_utf8;
using rxnheat::addin::error_element;

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

}  // namespace rxnheat_addin
