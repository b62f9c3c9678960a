// Numbers: coefficients and parse_number, kept exact.
#include "grammar_helpers.hpp"

using namespace grammar_test;
using rxnheat::grammar::parse_number;
using rxnheat::grammar::parse_reaction;

TEST_CASE("parse_number: integers, decimals, fractions, vulgar fractions, exactly", "[grammar][number]") {
    CHECK(parse_number("2") == 2);
    CHECK(parse_number(" 0.5 ") == q(1, 2));
    CHECK(parse_number("0.1") == q(1, 10));  // exact, unlike the binary double 0.1
    CHECK(parse_number("1/3") == q(1, 3));
    CHECK(parse_number("6/4") == q(3, 2));
    CHECK(parse_number("12.25") == q(49, 4));
    CHECK(parse_number("007") == 7);
    CHECK(parse_number("0") == 0);  // a number; only coefficients refuse zero
    CHECK(parse_number("-3/4") == q(-3, 4));
    CHECK(parse_number("−2") == -2);  // U+2212
    CHECK(parse_number("+2") == 2);
    CHECK(parse_number("999999999999") == 999999999999LL);
    CHECK(parse_number("0.00000000001") == q(1, 100000000000LL));  // 12 digits, the most allowed
}

TEST_CASE("vulgar fractions and mixed numbers", "[grammar][number]") {
    struct Case {
        const char* text;
        long long num, den;
    };
    const Case cases[] = {
        {"½", 1, 2}, {"⅓", 1, 3}, {"⅔", 2, 3}, {"¼", 1, 4}, {"¾", 3, 4}, {"⅕", 1, 5},
        {"⅖", 2, 5}, {"⅗", 3, 5}, {"⅘", 4, 5}, {"⅙", 1, 6}, {"⅚", 5, 6}, {"⅐", 1, 7},
        {"⅛", 1, 8}, {"⅜", 3, 8}, {"⅝", 5, 8}, {"⅞", 7, 8}, {"⅑", 1, 9}, {"⅒", 1, 10},
        {"1½", 3, 2}, {"2¾", 11, 4}, {"-½", -1, 2},
    };
    for (const Case& c : cases) {
        INFO(c.text);
        CHECK(parse_number(c.text) == q(c.num, c.den));
    }
}

TEST_CASE("coefficients in every notation", "[grammar][number]") {
    const Reaction r = parse_reaction("½N2 + 1½H2 + 0.25 O2 + 3/4 C → ⅔ X");
    REQUIRE(r.reactants.size() == 4);
    CHECK(r.reactants[0].coefficient == q(1, 2));
    CHECK(r.reactants[0].species.formula == "N2");
    CHECK(r.reactants[1].coefficient == q(3, 2));
    CHECK(r.reactants[1].species.formula == "H2");
    CHECK(r.reactants[2].coefficient == q(1, 4));
    CHECK(r.reactants[3].coefficient == q(3, 4));
    CHECK(r.reactants[3].species.formula == "C");
    CHECK(r.products[0].coefficient == q(2, 3));
    CHECK(r.products[0].coefficient_written);
    CHECK_FALSE(r.reactants[0].species.is_name);
}

TEST_CASE("twelve-digit numbers stay exact through groups and hydrates", "[grammar][number]") {
    const Species s = rxnheat::grammar::parse_species("((C999999999999)999999999999)999999999999");
    REQUIRE(s.atoms.size() == 1);
    // (10^12 - 1)^3, exact
    const Rational n(999999999999LL);
    CHECK(s.atoms[0].count == n * n * n);
}
