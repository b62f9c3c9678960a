// The grammar's interface to the rest of rxnheat: reaction text in, syntax tree out.
// The grammar knows chemical notation only (coefficients, formulas, groups, hydrates, charges,
// phases, arrows); it knows nothing of thermodynamics or of which element symbols exist.
#pragma once

#include "grammar/rational.hpp"

#include <boost/container/small_vector.hpp>

#include <cstddef>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat::grammar {

/// One element symbol occurrence, counts multiplied out through groups and hydrate parts.
struct Atom {
    std::string symbol;     ///< as written, e.g. "Cl" (validity is checked by the engine)
    Rational count;         ///< total count in the formula unit
    std::size_t position;   ///< 1-based character position of the symbol's first occurrence
};

/// A formula's atoms: up to four held inline (nearly every formula has at most four elements), so
/// a species is built without a heap block of its own.
using Atoms = boost::container::small_vector<Atom, 4>;

struct Species {
    bool is_name = false;   ///< true for a name such as "ethanol" or "n-octane" (starts lowercase)
    std::string name;       ///< the name as written (is_name only), inner spaces folded to one
    std::string formula;    ///< formula as ASCII without phase/charge: "CuSO4*5H2O", "Ca(OH)2"
    Atoms atoms;              ///< element counts, one entry per distinct symbol, in order of first appearance
    int charge = 0;         ///< net charge, e.g. -2 for "SO4^2-"
    std::string phase;      ///< "", "g", "l", "s" (also for "(cr)"), "aq"
    std::string written;    ///< the species exactly as written (UTF-8, trimmed), phase included
    std::size_t position = 0;  ///< 1-based character position of the species' first character
};

struct Term {
    Rational coefficient{1};
    bool coefficient_written = false;
    Species species;
    std::size_t position = 0;  ///< 1-based character position of the term (coefficient or species)
};

struct Reaction {
    std::vector<Term> reactants;
    std::vector<Term> products;
    std::string arrow;         ///< as written, e.g. "->" or "→"
};

/// Limits the parse functions enforce (a ParseError otherwise); see grammar/SYNTAX.md.
inline constexpr std::size_t max_input_characters = 4096;  ///< longer input is refused unparsed
inline constexpr std::size_t max_group_depth = 16;         ///< nesting of (), [] and {}
inline constexpr std::size_t max_number_digits = 12;       ///< digits in any one number

/// A syntax error: where (1-based character, not byte, position) and what was expected.
/// what() is the full message, e.g. "position 14: expected a species after '+'".
/// Position 0 means the error concerns the whole text (only "input longer than 4096
/// characters"); what() is then the message alone.
class ParseError : public std::runtime_error {
public:
    ParseError(std::size_t position, const std::string& message);
    std::size_t position() const noexcept { return position_; }
    const std::string& detail() const noexcept { return detail_; }  ///< message without the position prefix
private:
    std::size_t position_;
    std::string detail_;
};

/// Parses a whole reaction. Throws ParseError. Input must be valid UTF-8.
Reaction parse_reaction(std::string_view utf8);
/// The same into `out`, whose previous content it replaces, reusing its storage: a caller that
/// parses one reaction after another into the same tree allocates no term lists. After a
/// ParseError `out` holds an unspecified reaction (valid, to be parsed into again).
void parse_reaction(std::string_view utf8, Reaction& out);

/// Parses one species with optional phase, no coefficient (SPECIESHF, --per, RXNLOAD key).
Species parse_species(std::string_view utf8);

/// Parses a number: integer, decimal, a/b, or a vulgar fraction (½ ⅓ ⅔ ¼ ¾), exactly.
Rational parse_number(std::string_view utf8);

}  // namespace rxnheat::grammar
