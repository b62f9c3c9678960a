// Conversion between Calc's UNO values and the engine's C++ types, for the rxnheat add-in.
// No thermodynamics here: only reading arguments and shaping results.
#pragma once

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>
#include <rtl/ustring.hxx>

#include <rxnheat/rxnheat.hpp>

#include <memory>
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

/// Optional temperature: number in K, or text with a unit (rxnheat::parse_temperature);
/// not given -> `fallback`. A 1x1 range counts as its one cell.
double temperature_arg(const uno::Any& value, const char* name, int position,
                       double fallback = rxnheat::T_ref);
/// Optional text argument (unit, species): not given -> empty string.
std::string text_arg(const uno::Any& value, const char* name, int position);
/// Required text argument: ArgError if not given.
std::string required_text_arg(const uno::Any& value, const char* name, int position);
/// Optional number: not given -> `fallback`.
double number_arg(const uno::Any& value, const char* name, int position, double fallback);
/// Required number (a blank cell is 0, as everywhere in Calc).
double required_number_arg(const uno::Any& value, const char* name, int position);

/// Optional user species table (SPEC 3.4) from a cell range; nullptr when not given.
/// Tables are cached by content, so a sheet full of formulas over one range builds it once.
std::shared_ptr<const rxnheat::SpeciesTable> table_arg(const uno::Any& value, int position);

/// The value Calc shows as an error in one element of an array result: a NaN whose payload is
/// the office's error code (Err:502 for bad input, #VALUE! for an internal failure), the same
/// representation Calc uses for error values inside matrices. It is never a number.
double error_element(bool internal);

}  // namespace rxnheat_addin
