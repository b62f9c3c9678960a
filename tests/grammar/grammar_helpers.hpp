// Shared helpers for the grammar tests. These are notation tests: the expected values are what
// the written text means (atoms counted by hand from the formula as written), so no outside
// data source is involved.
#pragma once

#include "grammar/parse.hpp"

#include <catch2/catch.hpp>

#include <string>
#include <vector>

namespace grammar_test {

using rxnheat::grammar::Atom;
using rxnheat::grammar::ParseError;
using rxnheat::grammar::Rational;
using rxnheat::grammar::Reaction;
using rxnheat::grammar::Species;
using rxnheat::grammar::Term;

/// num/den exactly. (Built by division: GCC 12 reports a false -Wmaybe-uninitialized inside
/// Boost for the two-argument cpp_rational constructor.)
inline Rational q(long long num, long long den = 1) {
    Rational r(num);
    r /= den;
    return r;
}

/// The species' atoms as "Sym=count" in order, e.g. "Cu=1 S=1 O=9 H=10".
inline std::string atoms(const Species& s) {
    std::string out;
    for (const Atom& a : s.atoms) {
        if (!out.empty()) out += ' ';
        out += a.symbol + "=" + a.count.str();
    }
    return out;
}

enum class Kind { reaction, species, number };

/// Parses and returns the ParseError (fails the test if none is thrown).
inline ParseError error_of(Kind kind, const std::string& text) {
    try {
        switch (kind) {
            case Kind::reaction: (void)rxnheat::grammar::parse_reaction(text); break;
            case Kind::species: (void)rxnheat::grammar::parse_species(text); break;
            case Kind::number: (void)rxnheat::grammar::parse_number(text); break;
        }
    } catch (const ParseError& e) {
        return e;
    }
    FAIL("no ParseError for: " << text);
    return ParseError(0, "unreachable");
}

#define CHECK_PARSE_ERROR(kind, text, pos, message)                          \
    do {                                                                     \
        const auto err_ = ::grammar_test::error_of(kind, text);              \
        INFO("input: " << (text));                                           \
        CHECK(err_.position() == (pos));                                     \
        CHECK(err_.detail() == std::string(message));                        \
        if ((pos) != 0)                                                      \
            CHECK(std::string(err_.what()) ==                                \
                  "position " + std::to_string(pos) + ": " + (message));     \
    } while (false)

#define CHECK_REACTION_ERROR(text, pos, message) \
    CHECK_PARSE_ERROR(::grammar_test::Kind::reaction, text, pos, message)
#define CHECK_SPECIES_ERROR(text, pos, message) \
    CHECK_PARSE_ERROR(::grammar_test::Kind::species, text, pos, message)
#define CHECK_NUMBER_ERROR(text, pos, message) \
    CHECK_PARSE_ERROR(::grammar_test::Kind::number, text, pos, message)

}  // namespace grammar_test
