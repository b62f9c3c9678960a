// Declaration of the X3 reaction grammar: rule types, the iterator and context it is compiled
// for, and the tracker the rules report positions and failures to. The definition is in
// reaction_def.hpp and is compiled once, in reaction.cpp. Private to grammar/.
#pragma once

#include "grammar/ast.hpp"

#include <boost/spirit/home/x3.hpp>

#include <string>
#include <utility>

namespace rxnheat::grammar::parser {

namespace x3 = boost::spirit::x3;

/// The grammar runs over decoded code points, so iterator distance = character position.
using iterator_type = ast::Iter;

/// Collects what the rules report while parsing: source ranges of located nodes (on_success,
/// kept in the nodes themselves) and the first expectation failure (on_error).
class Tracker {
public:
    template <typename Node>
    void tag(Node& node, iterator_type first, iterator_type last) {
        node.first = first;
        node.last = last;
    }
    void tag(ast::Species& node, iterator_type first, iterator_type last) {
        node.first = first;
        node.last = last;
        has_species_ = true;
        species_first_ = first;
        species_last_ = last;
    }
    void fail(iterator_type where, std::string key) {
        if (!failed_) {
            failed_ = true;
            where_ = where;
            key_ = std::move(key);
        }
    }

    /// Where the reaction rule puts each term it reads (parse_reaction sets it).
    void build(ast::Reaction* tree) { tree_ = tree; }
    decltype(ast::Reaction::reactants)& side(bool product) { return product ? tree_->products : tree_->reactants; }

    /// Source range of a located node.
    static ast::Span position_of(const ast::Located& node) { return {node.first, node.last}; }

    bool failed() const { return failed_; }
    iterator_type where() const { return where_; }
    const std::string& key() const { return key_; }  ///< which expectation failed, see reaction_def.hpp

    /// The most recent species the grammar accepted (for "after 'H2O'" in messages).
    bool has_species() const { return has_species_; }
    iterator_type species_first() const { return species_first_; }
    iterator_type species_last() const { return species_last_; }

private:
    ast::Reaction* tree_ = nullptr;
    bool failed_ = false;
    iterator_type where_{};
    std::string key_;
    bool has_species_ = false;
    iterator_type species_first_{};
    iterator_type species_last_{};
};

struct tracker_tag;

/// The context the top rules are instantiated for: x3::parse (no skipper) under
/// x3::with<tracker_tag>(tracker)[...], the tracker passed as an lvalue.
using context_type = x3::context<tracker_tag, Tracker, x3::unused_type>;

struct reaction_class;
struct species_only_class;
struct number_only_class;

using reaction_type = x3::rule<reaction_class, ast::Span>;  ///< a whole reaction: the arrow; the terms go to the Tracker
using species_only_type = x3::rule<species_only_class, ast::Species>;  ///< one species, nothing else
using number_only_type = x3::rule<number_only_class, ast::Span>;       ///< one number, nothing else

BOOST_SPIRIT_DECLARE(reaction_type, species_only_type, number_only_type)

reaction_type const& reaction();
species_only_type const& species_only();
number_only_type const& number_only();

}  // namespace rxnheat::grammar::parser
