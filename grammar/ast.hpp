// Syntax tree produced by the X3 reaction grammar (grammar/reaction_def.hpp). Private to
// grammar/: parse.cpp turns it into the public rxnheat::grammar::Reaction / Species.
//
// The grammar runs over decoded code points (std::u32string), so every text field here holds
// the characters exactly as written (subscripts, superscripts and Unicode signs included);
// parse.cpp interprets them. Nodes deriving from position_tagged get their source range from
// the annotation handler, which is how character positions reach the public tree.
#pragma once

#include <boost/fusion/include/adapt_struct.hpp>
#include <boost/optional.hpp>
#include <boost/spirit/home/x3/support/ast/position_tagged.hpp>
#include <boost/spirit/home/x3/support/ast/variant.hpp>

#include <string>
#include <vector>

namespace rxnheat::grammar::ast {

namespace x3 = boost::spirit::x3;

using Text = std::u32string;

/// One element symbol with its count as written ("" = 1; "2", "0.947" or "₂").
struct Element : x3::position_tagged {
    Text symbol;
    Text count;
};

struct Group;

/// An element or a bracketed group inside a formula part.
struct Item : x3::variant<Element, x3::forward_ast<Group>> {
    using base_type::base_type;
    using base_type::operator=;
};

/// "(OH)2", "[Cu(NH3)4]": the opening bracket, the contents and the count ("" = 1).
struct Group : x3::position_tagged {
    char32_t open = U'(';
    std::vector<Item> items;
    Text count;
};

/// One hydrate part: "CuSO4" or "5H2O" (multiplier "5"; "" = 1; always "" for the first part).
struct Part : x3::position_tagged {
    Text multiplier;
    std::vector<Item> items;
};

/// A charge as written: magnitude digits ("" = 1, ASCII or superscript) and the sign character
/// ('+', '-', U+2212, '⁺' or '⁻').
struct Charge : x3::position_tagged {
    Text magnitude;
    char32_t sign = U'+';
};

struct Formula : x3::position_tagged {
    std::vector<Part> parts;
    boost::optional<Charge> charge;
};

/// A species is a name (Text, starts lowercase, inner whitespace as written) or a formula.
struct Body : x3::variant<Text, Formula> {
    using base_type::base_type;
    using base_type::operator=;
};

struct Species : x3::position_tagged {
    Body body;
    boost::optional<Text> phase;  ///< the word inside the parentheses, not yet validated
};

struct Term : x3::position_tagged {
    boost::optional<Text> coefficient;  ///< as written: "2", "0.5", "1/2", "½", "1½"
    Species species;
};

struct Reaction {
    std::vector<Term> reactants;
    Text arrow;
    std::vector<Term> products;
};

}  // namespace rxnheat::grammar::ast

BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Element, symbol, count)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Group, open, items, count)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Part, multiplier, items)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Charge, magnitude, sign)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Formula, parts, charge)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Species, body, phase)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Term, coefficient, species)
BOOST_FUSION_ADAPT_STRUCT(rxnheat::grammar::ast::Reaction, reactants, arrow, products)
