// rxnheat — the function catalogue: every cell function declared once.
//
// One row per function holds its names in every layer (the Calc name users type, the frozen IDL
// method that saved documents store, the CLI command), its texts, its arguments in Calc order
// (name, kind, required or not, default, help, whether a range there gives an array, the CLI
// option), the layers that expose it, and the engine call. The add-in, the CLI, the C ABI, the
// generated IDL and the reference pages are all read from it; nothing else lists functions.
//
// Hosts hand arguments over as they have them (Arg: omitted, a cell, a range of cells, or a
// table the host already built) and get a Result back (one Outcome, or a grid of them). The
// rules for reading arguments (blank, omitted, 1×1 range, a range that spreads into an array,
// text that is a number) are here, once, by argument kind — not in each host.
#pragma once

#include "rxnheat/rxnheat.hpp"

#include <cstddef>
#include <memory>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat {

// ---- values at the host boundary ------------------------------------------------------------

/// One spreadsheet cell, or one word of a command line: nothing, a number or text.
struct Cell {
    enum class Kind : unsigned char { empty, number, text };
    Kind kind = Kind::empty;
    double number = 0;
    std::string text;  ///< UTF-8, as given (untrimmed)

    static Cell of(double x) { return {Kind::number, x, {}}; }
    static Cell of(std::string s) { return {Kind::text, 0, std::move(s)}; }
};

/// An argument as a host passes it.
struct Arg {
    enum class Kind : unsigned char { omitted, cell, range, table };
    Kind kind = Kind::omitted;
    Cell cell;                                  ///< Kind::cell
    std::size_t rows = 0, cols = 0;             ///< Kind::range
    std::vector<Cell> cells;                    ///< Kind::range, row by row
    std::shared_ptr<const SpeciesTable> table;  ///< Kind::table (the CLI's --table FILE)

    static Arg omitted() { return {}; }
    static Arg of(Cell c) { Arg a; a.kind = Kind::cell; a.cell = std::move(c); return a; }
    static Arg of(double x) { return of(Cell::of(x)); }
    static Arg of(std::string s) { return of(Cell::of(std::move(s))); }
    RXNHEAT_API static Arg range(std::size_t rows, std::size_t cols, std::vector<Cell> cells);
    static Arg of(std::shared_ptr<const SpeciesTable> t) { Arg a; a.kind = Kind::table; a.table = std::move(t); return a; }
};

/// One result: nothing (a blank in an array), a number with its unit, text, or an error.
struct Outcome {
    enum class Kind : unsigned char { empty, number, text, error };
    Kind kind = Kind::empty;
    double number = 0;
    std::string text;   ///< the text result, or the error message in words
    std::string unit;   ///< the unit of a number ("kJ/mol", "kW"); empty for pure numbers
    ErrorKind error = ErrorKind::internal;  ///< Kind::error only
    std::size_t argument = 0;  ///< Kind::error: 1-based argument at fault, 0 if not one argument

    static Outcome of(double x, std::string unit = {}) { Outcome o; o.kind = Kind::number; o.number = x; o.unit = std::move(unit); return o; }
    static Outcome of_text(std::string s) { Outcome o; o.kind = Kind::text; o.text = std::move(s); return o; }
    static Outcome failed(const Error& e, std::size_t argument = 0);
    bool ok() const noexcept { return kind != Kind::error; }
};

/// What a call gives: one Outcome (rows == cols == 0), or a grid of them (an array formula).
struct Result {
    std::size_t rows = 0, cols = 0;
    std::vector<Outcome> cells;  ///< one for a single value; rows·cols, row by row, for a grid
    bool is_array() const noexcept { return rows > 0; }
    const Outcome& single() const { return cells.front(); }
};

// ---- the catalogue ----------------------------------------------------------------------------

/// How an argument is read.
enum class ArgKind : unsigned char {
    reaction,     ///< reaction text
    species,      ///< species text (formula or name, phase optional)
    formula,      ///< a formula (MOLARMASS)
    temperature,  ///< a number in K, or text with a unit ("350 C")
    pressure,     ///< a number in bar absolute, or text with a unit ("20 barg", "2 MPa")
    unit,         ///< unit text
    number,       ///< a finite number
    factor,       ///< a number, or exact text ("1/2", "½")
    text,         ///< other text (a function name)
    table,        ///< a user species table: a range whose first row names the columns
    feed,         ///< a two-column range: species, amount (mol); blank rows skipped
    reactions,    ///< a column or row of reaction texts, kept by position (RXNHESS's steps)
    numbers,      ///< a column or row of numbers, kept by position (RXNHESS's step values)
    fuel,         ///< a species (text), or a two-column range: species, mole fraction or mol % (as feed)
    rest,         ///< every argument from here on, unread (RXNWHY's "arguments…")
};
/// True for the kinds that read a whole one-dimensional range as a list (given on the command line
/// as a repeated option, one value each time).
constexpr bool is_list(ArgKind kind) noexcept {
    return kind == ArgKind::reactions || kind == ArgKind::numbers;
}
/// The word used for a kind in help and docs ("reaction", "temperature", ...).
RXNHEAT_API const char* to_string(ArgKind kind) noexcept;

struct ArgSpec {
    const char* name;         ///< the documented argument name: Function Wizard, docs, messages
    ArgKind kind;
    bool required;
    const char* default_text; ///< the default in words ("298.15 K"), "" when there is none
    const char* help;         ///< Function Wizard and --help text, UTF-8, one sentence or two
    bool spreads;             ///< a range here gives an array result
    const char* cli_option;   ///< "-T,--temperature" for a CLI option; nullptr: a positional
    const char* cli_value;    ///< the value's placeholder in CLI help ("TEMP")
};

/// The layers that expose a function.
enum Layer : unsigned { layer_calc = 1u, layer_cli = 2u, layer_c = 4u, layer_all = 7u };

enum class Returns : unsigned char { number, text };

struct Bound;  // the arguments of one evaluation, read (see catalogue.cpp)

struct FunctionSpec {
    const char* calc_name;    ///< what users type: "RXNDH"
    const char* idl_method;   ///< frozen: documents store ORG.RXNHEAT.CALC.FUNCTIONS.<this>
    const char* cli_command;  ///< "dh"
    const char* summary;      ///< one line, no full stop
    const char* description;  ///< Function Wizard text, UTF-8
    std::vector<ArgSpec> args;
    Returns returns;
    unsigned layers;          ///< Layer bits
    const char* gaps;         ///< why a layer is left out (a recorded, deliberate gap), or ""
    bool errors_as_text;      ///< RXNCHECK, RXNWHY: every problem is the answer, in words
    Outcome (*call)(Engine&, const Bound&);

    bool in(Layer l) const noexcept { return (layers & l) != 0; }
    /// Arguments a call may take at most (rest: unbounded).
    bool variadic() const noexcept { return !args.empty() && args.back().kind == ArgKind::rest; }
};

/// Every cell function, in the order engine/FUNCTIONS.md lists them (it is generated from this list).
RXNHEAT_API const std::vector<FunctionSpec>& catalogue();
/// By Calc name (ASCII case-insensitive), IDL method or CLI command; nullptr when unknown.
RXNHEAT_API const FunctionSpec* find_function(std::string_view name) noexcept;

/// How a host hands over values that mean "not given".
struct HostRules {
    /// Calc passes a blank cell as the number 0: a 0 in an optional argument then means "not
    /// given" (its default). Off for the CLI and the C ABI, where 0 is 0.
    bool zero_is_blank = false;
    /// The CLI has only text: text in a number argument is read as a number (strictly).
    bool text_numbers = false;
    /// Shown by RXNVERSION: "Calc add-in", "command line", "C interface".
    const char* host_name = "library";
};

/// Reads the arguments by the function's rules and calls the engine. Never throws rxnheat::Error:
/// a failing argument or call is an Outcome of Kind::error (the whole call when a non-spreading
/// argument fails; one element of an array when that element fails). Throws only bad_alloc.
RXNHEAT_API Result evaluate(const FunctionSpec& f, const std::vector<Arg>& args, const HostRules& rules,
                            Engine& engine = Engine::shared());

/// RXNWHY: "ok", or in words exactly why this call of `f` fails (for an array, the first
/// element that fails, named by its row and column).
RXNHEAT_API std::string why(const FunctionSpec& f, const std::vector<Arg>& args, const HostRules& rules,
                            Engine& engine = Engine::shared());

}  // namespace rxnheat
