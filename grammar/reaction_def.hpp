// Definition of the X3 reaction grammar. Included by reaction.cpp only (one instantiation).
//
// The grammar runs over decoded code points without a skipper: whitespace is matched where it
// may appear, because it is significant in two places (inner spaces of names, and the
// trailing-sign rule: a '+'/'-' after a formula is a charge before whitespace, '(', an arrow or
// the end). Expectation points throw with a short key; the top rules' on_error hands the key
// and position to the Tracker and parse.cpp turns them into a message. The keys are:
//   "species"           a species (or coefficient + species) at the start of a side or after '+'
//   "arrow"             the arrow after the reactants
//   "end"               the end of the text (after the products / the species / the number)
//   "number"            a number (parse_number)
//   "digits after point", "denominator", "group", "group close", "hydrate", "caret charge",
//   "brace charge", "brace close", "superscript sign", "phase"   (inside a term)
// Limits that would need unbounded recursion or arithmetic (nesting depth, digit counts, input
// length) are checked by parse.cpp before the grammar runs.
#pragma once

#include "grammar/ast.hpp"
#include "grammar/reaction.hpp"

#include <boost/spirit/home/x3.hpp>
#include <boost/mpl/contains.hpp>
#include <boost/throw_exception.hpp>

#include <cstdint>
#include <type_traits>

namespace rxnheat::grammar::parser {

namespace detail {

/// One code point from a set; exposes it as attribute when WithAttribute (X3's own char
/// parsers for the standard encoding truncate char32_t, so they are not used here).
template <bool WithAttribute>
struct code_points : x3::char_parser<code_points<WithAttribute>> {
    using attribute_type = std::conditional_t<WithAttribute, char32_t, x3::unused_type>;
    static bool const has_attribute = WithAttribute;

    constexpr explicit code_points(char32_t const* set)
        : set(set), ascii_low(ascii_mask(set, 0)), ascii_high(ascii_mask(set, 64)) {}

    template <typename Char, typename Context>
    bool test(Char ch, Context const&) const {
        // ASCII, nearly every character read, by a bit of the set's mask; others by the list.
        auto const c = static_cast<char32_t>(ch);
        if (c < 64) return (ascii_low >> c) & 1u;
        if (c < 128) return (ascii_high >> (c - 64)) & 1u;
        for (char32_t const* p = set; *p; ++p)
            if (c == *p) return true;
        return false;
    }

    /// Bit (c - base) for each member c in [base, base + 64).
    static constexpr std::uint64_t ascii_mask(char32_t const* set, char32_t base) {
        std::uint64_t m = 0;
        for (char32_t const* p = set; *p; ++p)
            if (*p >= base && *p < base + 64) m |= std::uint64_t(1) << (*p - base);
        return m;
    }

    char32_t const* set;
    std::uint64_t ascii_low, ascii_high;  ///< members U+0000..U+003F and U+0040..U+007F
};

/// One code point in [lo, hi].
struct code_point_range : x3::char_parser<code_point_range> {
    using attribute_type = char32_t;
    static bool const has_attribute = true;

    constexpr code_point_range(char32_t lo, char32_t hi) : lo(lo), hi(hi) {}

    template <typename Char, typename Context>
    bool test(Char ch, Context const&) const {
        auto const c = static_cast<char32_t>(ch);
        return lo <= c && c <= hi;
    }

    char32_t lo, hi;
};

/// A literal sequence of code points, no attribute.
struct code_point_string : x3::parser<code_point_string> {
    using attribute_type = x3::unused_type;
    static bool const has_attribute = false;

    constexpr explicit code_point_string(char32_t const* text) : text(text) {}

    template <typename Iterator, typename Context, typename RContext, typename Attribute>
    bool parse(Iterator& first, Iterator const& last, Context const&, RContext&, Attribute&) const {
        Iterator i = first;
        for (char32_t const* p = text; *p; ++p, ++i)
            if (i == last || static_cast<char32_t>(*i) != *p) return false;
        first = i;
        return true;
    }

    char32_t const* text;
};

/// Like x3::expect[], but the failure carries a fixed key instead of X3's description.
template <typename Subject>
struct expect_key_directive : x3::unary_parser<Subject, expect_key_directive<Subject>> {
    using base_type = x3::unary_parser<Subject, expect_key_directive<Subject>>;
    static bool const is_pass_through_unary = true;

    constexpr expect_key_directive(Subject const& subject, char const* key)
        : base_type(subject), key(key) {}

    template <typename Iterator, typename Context, typename RContext, typename Attribute>
    bool parse(Iterator& first, Iterator const& last, Context const& context, RContext& rcontext,
               Attribute& attr) const {
        if (this->subject.parse(first, last, context, rcontext, attr)) return true;
        boost::throw_exception(x3::expectation_failure<Iterator>(first, key));
    }

    char const* key;
};

/// Parses `subject` into a new last element of `container`, removed again when the subject fails
/// without throwing: how the directives below build each element where it is kept. Forced inline:
/// left to the compiler, it stayed a call, and a cold parse took 400 instructions more.
template <typename Subject, typename Container, typename Iterator, typename Context, typename RContext>
BOOST_FORCEINLINE bool parse_into_new_back(Subject const& subject, Container& container, Iterator& first,
                                           Iterator const& last, Context const& context, RContext& rcontext) {
    container.emplace_back();
    if (subject.parse(first, last, context, rcontext, container.back())) return true;
    container.pop_back();
    return false;
}

/// Parses the subject into a new last element of the tracker's side (products or reactants).
template <typename Subject>
struct append_to_side_directive : x3::unary_parser<Subject, append_to_side_directive<Subject>> {
    using base_type = x3::unary_parser<Subject, append_to_side_directive<Subject>>;
    using attribute_type = x3::unused_type;
    static bool const has_attribute = false;

    constexpr append_to_side_directive(Subject const& subject, bool product) : base_type(subject), product(product) {}

    template <typename Iterator, typename Context, typename RContext, typename Attribute>
    bool parse(Iterator& first, Iterator const& last, Context const& context, RContext& rcontext,
               Attribute&) const {
        return parse_into_new_back(this->subject, x3::get<tracker_tag>(context).side(product), first, last,
                                   context, rcontext);
    }

    bool product;
};

struct append_to_side_gen {
    template <typename Subject>
    constexpr append_to_side_directive<typename x3::extension::as_parser<Subject>::value_type>
    operator[](Subject const& subject) const {
        return {x3::as_parser(subject), product};
    }
    bool product;
};

constexpr append_to_side_gen append_to_side(bool product) { return {product}; }

/// `left | right` into a variant attribute with each alternative parsed in place, in the
/// variant's own storage. X3's alternative parses into a temporary and moves it in, and a
/// formula (its parts and items held inline) was a tenth of a long reaction's parse.
template <typename Left, typename Right>
struct in_place_alternative : x3::binary_parser<Left, Right, in_place_alternative<Left, Right>> {
    using base_type = x3::binary_parser<Left, Right, in_place_alternative<Left, Right>>;
    constexpr in_place_alternative(Left const& left, Right const& right) : base_type(left, right) {}

    template <typename Iterator, typename Context, typename RContext, typename Variant>
    bool parse(Iterator& first, Iterator const& last, Context const& context, RContext& rcontext,
               Variant& attr) const {
        return alternative(this->left, first, last, context, rcontext, attr) ||
               alternative(this->right, first, last, context, rcontext, attr);
    }

private:
    /// An alternative whose attribute the variant holds as it is is parsed in place; one it holds
    /// indirectly (a group, behind x3::forward_ast) is parsed aside and moved in.
    template <typename Subject, typename Iterator, typename Context, typename RContext, typename Variant>
    static bool alternative(Subject const& subject, Iterator& first, Iterator const& last,
                            Context const& context, RContext& rcontext, Variant& attr) {
        using A = typename x3::traits::attribute_of<Subject, Context>::type;
        if constexpr (boost::mpl::contains<typename Variant::variant_type::types, A>::value) {
            if (!boost::get<A>(&attr.get())) attr = A();
            return subject.parse(first, last, context, rcontext, boost::get<A>(attr.get()));
        } else {
            A aside;
            if (!subject.parse(first, last, context, rcontext, aside)) return false;
            attr = std::move(aside);
            return true;
        }
    }
};

template <typename Left, typename Right>
constexpr in_place_alternative<Left, Right> in_place(Left const& left, Right const& right) {
    return {left, right};
}

/// `+subject` into a container, each element parsed in place in a new last element of the
/// container (removed again when the subject fails): X3's `+` parses each into a temporary and
/// moves it in, which for formula items was a tenth of a cold parse's grammar time.
template <typename Subject>
struct some_in_place_directive : x3::unary_parser<Subject, some_in_place_directive<Subject>> {
    using base_type = x3::unary_parser<Subject, some_in_place_directive<Subject>>;
    static bool const handles_container = true;
    constexpr explicit some_in_place_directive(Subject const& subject) : base_type(subject) {}

    template <typename Iterator, typename Context, typename RContext, typename Container>
    bool parse(Iterator& first, Iterator const& last, Context const& context, RContext& rcontext,
               Container& container) const {
        std::size_t const before = container.size();
        while (parse_into_new_back(this->subject, container, first, last, context, rcontext)) {
        }
        return container.size() > before;
    }
};

template <typename Subject>
constexpr some_in_place_directive<typename x3::extension::as_parser<Subject>::value_type> some_in_place(
    Subject const& subject) {
    return some_in_place_directive<typename x3::extension::as_parser<Subject>::value_type>(x3::as_parser(subject));
}

/// `head >> *(separator >> expect(key)[tail])` into a container, each element parsed in place in
/// a new last element (a formula's parts: X3's sequence would parse each into a temporary, with
/// its inline items, and move it in).
template <typename Container, typename Head, typename Separator, typename Tail>
struct chain_in_place_parser : x3::parser<chain_in_place_parser<Container, Head, Separator, Tail>> {
    using attribute_type = Container;
    static bool const has_attribute = true;
    static bool const handles_container = true;

    constexpr chain_in_place_parser(Head const& head, Separator const& separator, Tail const& tail, char const* key)
        : head(head), separator(separator), tail(tail), key(key) {}

    template <typename Iterator, typename Context, typename RContext>
    bool parse(Iterator& first, Iterator const& last, Context const& context, RContext& rcontext,
               Container& out) const {
        if (!parse_into_new_back(head, out, first, last, context, rcontext)) return false;
        for (;;) {
            Iterator i = first;
            x3::unused_type none;
            if (!separator.parse(i, last, context, rcontext, none)) return true;
            if (!parse_into_new_back(tail, out, i, last, context, rcontext))
                boost::throw_exception(x3::expectation_failure<Iterator>(i, key));
            first = i;
        }
    }

    Head head;
    Separator separator;
    Tail tail;
    char const* key;
};

template <typename Container, typename Head, typename Separator, typename Tail>
constexpr auto chain_in_place(Head const& head, Separator const& separator, Tail const& tail, char const* key) {
    return chain_in_place_parser<Container, Head, Separator, Tail>(head, separator, tail, key);
}

struct expect_key_gen {
    template <typename Subject>
    constexpr expect_key_directive<typename x3::extension::as_parser<Subject>::value_type>
    operator[](Subject const& subject) const {
        return {x3::as_parser(subject), key};
    }
    char const* key;
};

constexpr expect_key_gen expect(char const* key) { return {key}; }

}  // namespace detail
}  // namespace rxnheat::grammar::parser

namespace boost::spirit::x3::traits {
// As for X3's own `+`: the attribute is a container of the subject's.
template <typename Subject, typename Context>
struct attribute_of<rxnheat::grammar::parser::detail::some_in_place_directive<Subject>, Context>
    : build_container<typename attribute_of<Subject, Context>::type> {};
}  // namespace boost::spirit::x3::traits

namespace boost::spirit::x3::detail {
// Same special case X3 has for its own expect[]: inside a container-collecting sequence.
template <typename Subject, typename Context, typename RContext>
struct parse_into_container_impl<rxnheat::grammar::parser::detail::expect_key_directive<Subject>,
                                 Context, RContext> {
    template <typename Iterator, typename Attribute>
    static bool call(rxnheat::grammar::parser::detail::expect_key_directive<Subject> const& parser,
                     Iterator& first, Iterator const& last, Context const& context,
                     RContext& rcontext, Attribute& attr) {
        if (parse_into_container(parser.subject, first, last, context, rcontext, attr)) return true;
        boost::throw_exception(expectation_failure<Iterator>(first, parser.key));
    }
};
}  // namespace boost::spirit::x3::detail

namespace rxnheat::grammar::parser {

// ---- handlers --------------------------------------------------------------------------------

/// on_success: record the node's source range (position_tagged nodes).
struct annotate_position {
    template <typename Iterator, typename Node, typename Context>
    void on_success(Iterator const& first, Iterator const& last, Node& node,
                    Context const& context) const {
        x3::get<tracker_tag>(context).tag(node, first, last);
    }
};

/// on_error (top rules only): record the first failed expectation and fail the parse.
struct report_failure {
    template <typename Iterator, typename Exception, typename Context>
    x3::error_handler_result on_error(Iterator&, Iterator const&, Exception const& x,
                                      Context const& context) const {
        x3::get<tracker_tag>(context).fail(x.where(), x.which());
        return x3::error_handler_result::fail;
    }
};

// ---- rule ids --------------------------------------------------------------------------------

struct count_class {};
struct multiplier_class {};
struct phase_word_class {};
struct number_token_class {};
struct element_class : annotate_position {};
struct group_class : annotate_position {};
struct item_class {};
struct first_part_class : annotate_position {};
struct later_part_class : annotate_position {};
struct parts_class {};
struct charge_body_class {};
struct caret_charge_class {};
struct brace_charge_class {};
struct superscript_charge_class {};
struct trailing_charge_class {};
struct charge_class : annotate_position {};
struct formula_class : annotate_position {};
struct name_class {};
struct body_class {};
struct phase_class {};
struct species_class : annotate_position {};
struct coefficient_class {};
struct term_class : annotate_position {};
struct reactants_class {};
struct products_class {};
struct arrow_class {};
struct reaction_class : report_failure {};
struct species_only_class : report_failure {};
struct number_only_class : report_failure {};

// ---- character classes -----------------------------------------------------------------------

using detail::code_point_range;
using detail::code_point_string;
using detail::code_points;
using detail::expect;

code_points<false> const blank{U" \t\r\n\u00A0\u2009\u202F"};  // space, tab, CR, LF, NBSP, thin, NNBSP
auto const ws = *blank;
code_point_range const digit{U'0', U'9'};
code_point_range const upper{U'A', U'Z'};
code_point_range const lower{U'a', U'z'};
code_point_range const subscript_digit{U'\u2080', U'\u2089'};  // ₀ … ₉
code_points<false> const superscript_digit{
    U"\u2070\u00B9\u00B2\u00B3\u2074\u2075\u2076\u2077\u2078\u2079"};  // ⁰ ¹ ² ³ ⁴ … ⁹
code_points<true> const superscript_sign{U"\u207A\u207B"};             // ⁺ ⁻
code_points<true> const sign{U"+-\u2212"};                             // + - − (U+2212)
code_points<false> const vulgar_fraction{
    U"\u00BD\u2153\u2154\u00BC\u00BE\u2155\u2156\u2157\u2158\u2159\u215A\u2150\u215B\u215C"
    U"\u215D\u215E\u2151\u2152"};  // ½ ⅓ ⅔ ¼ ¾ ⅕ ⅖ ⅗ ⅘ ⅙ ⅚ ⅐ ⅛ ⅜ ⅝ ⅞ ⅑ ⅒
code_points<false> const hydrate_dot{U"\u00B7\u2022\u22C5*"};  // · • ⋅ *
code_points<false> const point{U"."};
code_points<false> const slash{U"/"};
code_points<false> const plus{U"+"};
code_points<false> const caret{U"^"};
code_points<false> const open_brace{U"{"};
code_points<false> const close_brace{U"}"};
code_points<false> const open_paren{U"("};
code_points<false> const close_paren{U")"};
code_points<true> const open_bracket{U"(["};
code_points<false> const close_bracket{U")]"};  // pairing is checked by parse.cpp's pre-scan
code_points<false> const name_joiner{U"-,"};

/// Any arrow; longest first so "<=>" and "=>" are not read as "=".
auto const arrow_text = code_point_string(U"<=>") | code_point_string(U"<->") |
                        code_point_string(U"->") | code_point_string(U"=>") |
                        code_points<false>(U"=\u2192\u27F6\u21CC");  // = → ⟶ ⇌

// ---- rules -----------------------------------------------------------------------------------

// Text-valued pieces used inside sequences are rules, so X3 assigns the whole text at once
// instead of treating the sequence's string attribute as a container of characters.
x3::rule<count_class, ast::Span> const count = "count";
x3::rule<multiplier_class, ast::Span> const multiplier = "multiplier";
x3::rule<phase_word_class, ast::Span> const phase_word = "phase";
x3::rule<number_token_class, ast::Span> const number_token = "number";
x3::rule<element_class, ast::Element> const element = "element";
x3::rule<group_class, ast::Group> const group = "group";
x3::rule<item_class, ast::Item> const item = "item";
x3::rule<first_part_class, ast::Part> const first_part = "formula part";
x3::rule<later_part_class, ast::Part> const later_part = "hydrate part";
x3::rule<parts_class, decltype(ast::Formula::parts)> const parts = "formula parts";
x3::rule<charge_body_class, ast::Charge> const charge_body = "charge";
x3::rule<caret_charge_class, ast::Charge> const caret_charge = "^ charge";
x3::rule<brace_charge_class, ast::Charge> const brace_charge = "{} charge";
x3::rule<superscript_charge_class, ast::Charge> const superscript_charge = "superscript charge";
x3::rule<trailing_charge_class, ast::Charge> const trailing_charge = "trailing charge";
x3::rule<charge_class, ast::Charge> const charge = "charge";
x3::rule<formula_class, ast::Formula> const formula = "formula";
x3::rule<name_class, ast::Span> const name = "name";
x3::rule<body_class, ast::Body> const body = "species";
x3::rule<phase_class, ast::Span> const phase = "phase";
x3::rule<species_class, ast::Species> const species = "species";
x3::rule<coefficient_class, ast::Span> const coefficient = "coefficient";
x3::rule<term_class, ast::Term> const term = "term";
x3::rule<reactants_class> const reactants = "side";  // the terms go to the Tracker (see reaction.hpp)
x3::rule<products_class> const products = "side";
x3::rule<arrow_class, ast::Span> const arrow = "arrow";
reaction_type const reaction_rule = "reaction";
species_only_type const species_only_rule = "species";
number_only_type const number_only_rule = "number";

// Numbers: 2, 0.5, 1/2, ½ and the mixed 1½. Which combinations make sense (a/b of whole
// numbers, no zero) is decided by parse.cpp, which also gives the message.
auto const decimal = +digit >> -(point >> expect("digits after point")[+digit]);
auto const number_text = (decimal >> -((slash >> expect("denominator")[decimal]) | vulgar_fraction)) |
                         vulgar_fraction;

// Formulas. An element symbol is one uppercase letter and, greedily, one lowercase letter.
auto const count_def = x3::raw[decimal | +subscript_digit];
auto const count_or_one = count | x3::attr(ast::Span());

auto const element_def = x3::raw[upper >> -lower] >> count_or_one;
// '(' followed by a lowercase letter is a phase, not a group.
// Items are parsed in place (detail::some_in_place, detail::in_place): an element straight
// into the list's new element, a group aside (the list holds it behind a pointer).
auto const items = detail::some_in_place(item);
auto const group_def = open_bracket >> !lower >> expect("group")[items] >>
                       expect("group close")[close_bracket] >> count_or_one;
auto const item_def = detail::in_place(element, group);  // element | group

auto const multiplier_def = x3::raw[(decimal >> -vulgar_fraction) | vulgar_fraction];
auto const first_part_def = x3::attr(ast::Span()) >> items;
auto const later_part_def = ((multiplier >> ws) | x3::attr(ast::Span())) >> items;
// first_part >> *(ws >> hydrate_dot >> ws >> expect("hydrate")[later_part]), parts in place:
auto const parts_def =
    detail::chain_in_place<decltype(ast::Formula::parts)>(first_part, ws >> hydrate_dot >> ws, later_part, "hydrate");

// Charges: ^2+ ^- {2+} ²⁻ ⁺ and the trailing sign. A trailing sign is a charge only when the
// formula ends there: before the end, whitespace, '(' or an arrow; otherwise a '+' is the
// separator between species.
auto const charge_body_def = x3::raw[*digit] >> sign;
auto const caret_charge_def = caret >> expect("caret charge")[charge_body >> !digit];
auto const brace_charge_def =
    open_brace >> expect("brace charge")[charge_body] >> expect("brace close")[close_brace];
auto const superscript_charge_def =
    (x3::raw[+superscript_digit] >> expect("superscript sign")[superscript_sign]) |
    (x3::attr(ast::Span()) >> superscript_sign);
auto const trailing_charge_def =
    x3::attr(ast::Span()) >> sign >> &(x3::eoi | blank | open_paren | arrow_text);
auto const charge_def = caret_charge | brace_charge | superscript_charge | trailing_charge;

auto const formula_def = parts >> -charge;

// Names start with a lowercase letter: lowercase letters, digits, inner '-' and ',', and words
// separated by whitespace. A '-' before '>' belongs to an arrow.
auto const name_char = lower | digit | (name_joiner >> &(lower | digit));
auto const name_def = x3::raw[lower >> *name_char >> *(+blank >> &lower >> +name_char)];

// formula | name: the two start differently (uppercase or a bracket, lowercase), so the order
// decides nothing but which is tried first; a formula fails at a lowercase first character
// without an expectation. Formulas, nearly every species, first: the Body holds one already.
auto const body_def = detail::in_place(formula, name);
auto const phase_def = open_paren >> &lower >> expect("phase")[phase_word >> close_paren];
auto const phase_word_def = x3::raw[+lower];
auto const species_def = body >> -(ws >> phase);

// Terms, sides, reaction.
auto const coefficient_def = x3::raw[number_text];
auto const term_def = -coefficient >> ws >> expect("species")[species];
// Each term is read straight into a new element at the end of its side of the tree the Tracker
// holds (Tracker::side): a side has no attribute of its own, which X3 would build in a temporary
// container, and a term is not built aside and moved in (a term is some 460 bytes of inline
// storage; moving it was a tenth of a cold parse).
auto const reactant = detail::append_to_side(false)[term];
auto const product = detail::append_to_side(true)[term];
auto const reactants_def = reactant >> *(ws >> plus >> ws >> reactant);
auto const products_def = product >> *(ws >> plus >> ws >> product);
auto const arrow_def = x3::raw[arrow_text];

auto const reaction_rule_def = ws >> expect("species")[reactants] >> ws >> expect("arrow")[arrow] >> ws >>
                               expect("species")[products] >> ws >> expect("end")[x3::eoi];
auto const species_only_rule_def = ws >> expect("species")[species] >> ws >> expect("end")[x3::eoi];
auto const number_only_rule_def =
    ws >> number_token >> ws >> expect("end")[x3::eoi];
auto const number_token_def = x3::raw[expect("number")[-sign >> number_text]];

BOOST_SPIRIT_DEFINE(count, multiplier, phase_word, number_token, element, group, item, first_part, later_part, parts, charge_body, caret_charge,
                    brace_charge, superscript_charge, trailing_charge, charge, formula, name, body,
                    phase, species, coefficient, term, reactants, products, arrow, reaction_rule,
                    species_only_rule, number_only_rule)

reaction_type const& reaction() { return reaction_rule; }
species_only_type const& species_only() { return species_only_rule; }
number_only_type const& number_only() { return number_only_rule; }

}  // namespace rxnheat::grammar::parser
