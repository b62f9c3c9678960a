// Syntax tree produced by the X3 reaction grammar (grammar/reaction_def.hpp). Private to
// grammar/: parse.cpp turns it into the public rxnheat::grammar::Reaction / Species.
//
// The grammar runs over decoded code points (a std::u32string, read through pointers), so every
// text field here is a Span of the input: the characters exactly as written (subscripts,
// superscripts and Unicode signs included), not a copy; parse.cpp interprets them. Nodes
// deriving from Located get their source range from the annotation handler, which is how
// character positions reach the public tree. Spans, small inline vectors and ranges held in the
// nodes keep a parse from allocating for each node (a typical four-term reaction's tree is built
// with no allocation at all: tests/bench/RESULTS-engine.md, "Cold path").
#pragma once

#include <boost/container/small_vector.hpp>
#include <boost/fusion/include/adapt_struct.hpp>
#include <boost/optional.hpp>
#include <boost/range/iterator_range_core.hpp>
#include <boost/spirit/home/x3/support/ast/variant.hpp>

#include <cstddef>
#include <string_view>

namespace rxnheat::grammar::ast {

namespace x3 = boost::spirit::x3;

/// Where the grammar reads: a code point of the decoded input.
using Iter = const char32_t*;

/// A stretch of the input as written, [begin, end). Empty (two null pointers) for "not written".
using Span = boost::iterator_range<Iter>;

inline std::u32string_view view(const Span& s) { return {s.begin(), std::size_t(s.size())}; }

/// Up to N elements held inline, more on the heap (N is what typical formulas and reactions need).
template <typename T, std::size_t N>
using Few = boost::container::small_vector<T, N>;

/// The node's source range, set by the rules' on_success handler (reaction_def.hpp).
struct Located {
    Iter first = nullptr;
    Iter last = nullptr;
};

/// One element symbol with its count as written ("" = 1; "2", "0.947" or "₂").
struct Element : Located {
    Span symbol;
    Span count;
};

struct Group;

/// An element or a bracketed group inside a formula part.
struct Item : x3::variant<Element, x3::forward_ast<Group>> {
    using base_type::base_type;
    using base_type::operator=;
};

/// "(OH)2", "[Cu(NH3)4]": the opening bracket, the contents and the count ("" = 1).
struct Group : Located {
    char32_t open = U'(';
    Few<Item, 4> items;
    Span count;
};

/// One hydrate part: "CuSO4" or "5H2O" (multiplier "5"; "" = 1; always "" for the first part).
struct Part : Located {
    Span multiplier;
    Few<Item, 4> items;
};

/// A charge as written: magnitude digits ("" = 1, ASCII or superscript) and the sign character
/// ('+', '-', U+2212, '⁺' or '⁻').
struct Charge : Located {
    Span magnitude;
    char32_t sign = U'+';
};

struct Formula : Located {
    Few<Part, 1> parts;
    boost::optional<Charge> charge;
};

/// A species is a formula or a name (a Span, starts lowercase, inner whitespace as written). The
/// formula comes first, so a default Body holds one and the grammar parses into it as it is.
struct Body : x3::variant<Formula, Span> {
    using base_type::base_type;
    using base_type::operator=;
};

struct Species : Located {
    Body body;
    boost::optional<Span> phase;  ///< the word inside the parentheses, not yet validated
};

struct Term : Located {
    boost::optional<Span> coefficient;  ///< as written: "2", "0.5", "1/2", "½", "1½"
    Species species;
};

/// Filled by the reaction rule through the Tracker (reaction.hpp), not as an X3 attribute.
struct Reaction {
    Few<Term, 4> reactants;
    Span arrow;
    Few<Term, 4> products;
};

}  // namespace rxnheat::grammar::ast

BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Element, symbol, count)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Group, open, items, count)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Part, multiplier, items)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Charge, magnitude, sign)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Formula, parts, charge)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Species, body, phase)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Term, coefficient, species)
