// Calc's UNO values <-> the catalogue's host values (rxnheat/catalogue.hpp), for the rxnheat
// add-in. No rules and no thermodynamics here: every argument rule (blank, omitted, a 0 from a
// blank cell, 1x1 ranges, ranges that spread into arrays) is rxnheat::evaluate's. This file only
// says what each UNO value is as a cell or a range, and how a Result goes back to Calc.
#pragma once

#include "uno_text.hpp"

#include <com/sun/star/uno/Any.hxx>
#include <com/sun/star/uno/Sequence.hxx>

#include <rxnheat/catalogue.hpp>

#include <initializer_list>
#include <stdexcept>
#include <string>

namespace rxnheat::addin {

namespace uno = ::com::sun::star::uno;

/// The rules by which the add-in's arguments are read: Calc passes a blank cell as 0.
HostRules calc_rules();

/// A UNO value that is no spreadsheet value (a range inside a range, a type Calc never passes,
/// text that is not valid UTF-16); the message names the argument, in words.
class ValueError : public std::runtime_error {
public:
    using std::runtime_error::runtime_error;
};

/// One argument as the engine takes it: void -> omitted; string -> a text cell; double, float,
/// any integer or bool -> a number cell; sequence< sequence< any > > -> a range (its rows may
/// differ in length only if Calc ever sent such a thing: the short ones are padded with empty
/// cells). Throws ValueError, naming `name`, for anything else.
Arg to_arg(const uno::Any& value, const std::string& name);

/// What a call gives back to Calc: a value (a number, text, nothing, or for an array
/// sequence< sequence< any > > with the office's error value in each failing element), or the
/// failure of the whole call (bad input: the component raises IllegalArgumentException, Err:502;
/// internal: RuntimeException).
struct Answer {
    enum class Kind { value, bad_input, internal };
    Kind kind = Kind::value;
    uno::Any value;
    std::string message;   ///< bad_input, internal: why, in words (UTF-8)
    int argument = -1;     ///< bad_input: 0-based argument at fault, -1 if not one argument
};

/// One element or single value as UNO: number -> double, text -> string, empty -> void, an error
/// -> the office's error value (error_element).
uno::Any to_any(const Outcome& outcome);

/// Runs catalogue function `f` on Calc's arguments: `args` in the catalogue's order, `rest` the
/// elements of a variable argument list (RXNWHY), each read like any other argument.
Answer answer(const FunctionSpec& f, std::initializer_list<const uno::Any*> args,
              const uno::Sequence<uno::Any>* rest = nullptr, Engine& engine = Engine::shared());

}  // namespace rxnheat::addin
