// Every error form: message and 1-based character position.
#include "grammar_helpers.hpp"

using namespace grammar_test;
using rxnheat::grammar::parse_number;
using rxnheat::grammar::parse_reaction;
using rxnheat::grammar::parse_species;

static const char* const arrow_expected =
    "expected an arrow (->, =, \u2192, \u21CC ...) between reactants and products";

TEST_CASE("errors: empty input", "[grammar][errors]") {
    CHECK_REACTION_ERROR("", 1, "the reaction is empty");
    CHECK_REACTION_ERROR("  \t ", 1, "the reaction is empty");
    CHECK_SPECIES_ERROR("", 1, "the species is empty");
    CHECK_NUMBER_ERROR(" ", 1, "the number is empty");
}

TEST_CASE("errors: missing species", "[grammar][errors]") {
    CHECK_REACTION_ERROR("CH4(g) + 2 O2(g) + -> CO2", 20, "expected a species after '+'");
    CHECK_REACTION_ERROR("CH4 + -> CO2", 7, "expected a species after '+'");
    CHECK_REACTION_ERROR("CH4 + O2 -> CO2 +", 18, "expected a species after '+'");
    CHECK_REACTION_ERROR("CH4 ++ O2 -> CO2", 6, "expected a species after '+'");
    CHECK_REACTION_ERROR("2 -> H2", 3, "expected a species after the coefficient '2'");
    CHECK_REACTION_ERROR("H2 -> 1/2", 10, "expected a species after the coefficient '1/2'");
    CHECK_REACTION_ERROR("H2 ->", 6, "expected a species after the arrow '->'");
    CHECK_REACTION_ERROR("H2 →   ", 8, "expected a species after the arrow '→'");
    CHECK_REACTION_ERROR("-> H2", 1, "expected a species before the arrow '->'");
    CHECK_REACTION_ERROR("+ H2 -> H", 1, "expected a species before '+'");
    CHECK_REACTION_ERROR(") -> H", 1, "unmatched ')'");
    CHECK_REACTION_ERROR("^H -> H", 1,
                         "expected a species (a formula such as H2O or a name such as ethanol)");
}

TEST_CASE("errors: missing or extra arrow", "[grammar][errors]") {
    CHECK_REACTION_ERROR("H2 + O2 H2O", 9, arrow_expected);
    CHECK_REACTION_ERROR("H2 + O2", 8, arrow_expected);
    CHECK_REACTION_ERROR("H2 <- H", 4, arrow_expected);
    CHECK_REACTION_ERROR("A -> B -> C", 8, "found a second arrow '->'; a reaction has exactly one arrow");
    CHECK_REACTION_ERROR("H2 + O2 -> H2O2 H2", 17, "expected '+' or the end of the reaction after 'H2O2'");
    CHECK_REACTION_ERROR("x -> y, z", 7, "expected '+' or the end of the reaction after 'y'");
}

TEST_CASE("errors: brackets and nesting", "[grammar][errors]") {
    CHECK_REACTION_ERROR("Ca(OH2 -> x", 3, "unmatched '('");
    CHECK_REACTION_ERROR("2 Ca(OH -> x", 5, "unmatched '('");
    CHECK_REACTION_ERROR("CaOH)2 -> x", 5, "unmatched ')'");
    CHECK_SPECIES_ERROR("Ca(OH]2", 6, "']' does not match the '(' at position 3");
    CHECK_SPECIES_ERROR("[Cu(NH3)4)", 10, "')' does not match the '[' at position 1");
    CHECK_SPECIES_ERROR("Ca()2", 4, "expected an element symbol after '('");
    CHECK_SPECIES_ERROR("K[]", 3, "expected an element symbol after '['");
    CHECK_SPECIES_ERROR("Ca(OH-)2", 6, "expected ')' to close the '(' at position 3");
    CHECK_SPECIES_ERROR("[Cu(NH3)4 ]", 10, "expected ']' to close the '[' at position 1");
    CHECK_SPECIES_ERROR("H2O(1)", 5,
                        "expected an element symbol after '('; for the liquid phase write (l) with a "
                        "lowercase L");
    std::string deep;
    for (int k = 0; k < 17; ++k) deep += "(H";
    for (int k = 0; k < 17; ++k) deep += ")";
    CHECK_SPECIES_ERROR(deep, 33, "groups nested deeper than 16 levels");
    const std::string braces = "Fe" + std::string(17, '{') + "+" + std::string(17, '}');
    CHECK_SPECIES_ERROR(braces, 19, "groups nested deeper than 16 levels");
}

TEST_CASE("errors: phases", "[grammar][errors]") {
    CHECK_REACTION_ERROR("H2O(liq) -> H2O(g)", 4,
                         "unknown phase '(liq)': the phases are (g), (l), (s), (cr) (the same as (s)) and (aq)");
    CHECK_REACTION_ERROR("H2O(l) -> H2O(gas)", 14,
                         "unknown phase '(gas)': the phases are (g), (l), (s), (cr) (the same as (s)) and (aq)");
    CHECK_REACTION_ERROR("ethanol(vap) -> x", 8,
                         "unknown phase '(vap)': the phases are (g), (l), (s), (cr) (the same as (s)) and (aq)");
    CHECK_SPECIES_ERROR("H2O(l2)", 4, "expected a phase: (g), (l), (s), (cr) or (aq)");
    CHECK_SPECIES_ERROR("H2O(l)(g)", 7, "expected the end of the text after the species 'H2O(l)'");
}

TEST_CASE("errors: charges", "[grammar][errors]") {
    CHECK_SPECIES_ERROR("Fe^3", 4, "expected a charge such as ^2+ or ^- after '^'");
    CHECK_SPECIES_ERROR("Fe^+3", 4,
                        "expected a charge such as ^2+ or ^- after '^' (the digits come before the sign: ^3+)");
    CHECK_SPECIES_ERROR("Fe{x}", 4, "expected a charge such as {2+} or {-} after '{'");
    CHECK_SPECIES_ERROR("Fe{2+x}", 6, "expected '}' after the charge");
    CHECK_SPECIES_ERROR("Fe³", 4, "expected \u207A or \u207B after the superscript digits");
    CHECK_SPECIES_ERROR("Fe^0+", 3, "a charge of zero is not allowed; leave the charge out");
    CHECK_SPECIES_ERROR("Fe^100+", 3, "a charge may be at most 99");
    CHECK_REACTION_ERROR("CH3-CH3 -> x", 4,
                         "a '-' directly after 'CH3' is a charge only where the formula ends: before a "
                         "space, '(', an arrow or the end of the text");
    CHECK_REACTION_ERROR("e- -> x", 2,
                         "unexpected '-' after the name 'e': a name has no charge, and a '-' inside a "
                         "name joins two parts, as in 'n-octane'");
}

TEST_CASE("errors: numbers in reactions", "[grammar][errors]") {
    CHECK_REACTION_ERROR("0 H2 -> H2", 1, "a coefficient of zero is not allowed: '0'");
    CHECK_REACTION_ERROR("H2 -> 0.0 H2", 7, "a coefficient of zero is not allowed: '0.0'");
    CHECK_REACTION_ERROR("1/0 H2 -> H2", 1, "division by zero in '1/0'");
    CHECK_REACTION_ERROR("H0 -> x", 2, "a count of zero is not allowed: '0'");
    CHECK_REACTION_ERROR("Ca(OH)0 -> x", 7, "a count of zero is not allowed: '0'");
    CHECK_REACTION_ERROR("CuSO4·0H2O -> x", 7, "a hydrate multiplier of zero is not allowed: '0'");
    CHECK_REACTION_ERROR("1234567890123 H2 -> x", 1, "a number may have at most 12 digits");
    CHECK_REACTION_ERROR("H2 -> 1.234567890123 H2", 7, "a number may have at most 12 digits");
    CHECK_REACTION_ERROR("CH₁₂₃₄₅₆₇₈₉₀₁₂₃ -> x", 3, "a number may have at most 12 digits");
    CHECK_REACTION_ERROR("Fe^1234567890123+ -> x", 4, "a number may have at most 12 digits");
    CHECK(parse_reaction("123456789012 H2 -> 123456789012 H2").reactants[0].coefficient == 123456789012LL);
    CHECK_REACTION_ERROR("2.H2 -> x", 3, "expected a digit after '.'");
    CHECK_REACTION_ERROR("1/ H2 -> x", 3, "expected a whole number after '/'");
    CHECK_REACTION_ERROR("1.5½ H2 -> x", 1,
                         "a mixed number such as 1½ needs a whole number before the fraction: '1.5½'");
}

TEST_CASE("errors: hydrates", "[grammar][errors]") {
    CHECK_SPECIES_ERROR("CuSO4·", 7, "expected a formula after '·' (U+00B7)");
    CHECK_SPECIES_ERROR("CuSO4 * 5", 9, "expected a formula after '*'");
}

TEST_CASE("errors: symbols and characters", "[grammar][errors]") {
    CHECK_REACTION_ERROR("Ethanol -> x", 3,
                         "unexpected 'h' after 'Et': an element symbol is one uppercase letter, optionally "
                         "followed by one lowercase letter (names such as 'ethanol' are written all in "
                         "lowercase)");
    CHECK_REACTION_ERROR("H2 $ -> x", 4, "unexpected character '$'");
    CHECK_REACTION_ERROR("H2 + O2 → H2O₂ \u2206", 16, "unexpected character '\u2206' (U+2206)");
    CHECK_REACTION_ERROR("H2\u200B -> H2", 3, "unexpected character U+200B (invisible)");
    CHECK_REACTION_ERROR(std::string("H2 \0 -> H2", 10), 4, "unexpected character U+0000 (invisible)");
}

TEST_CASE("errors: invalid UTF-8 gives the character position", "[grammar][errors]") {
    CHECK_REACTION_ERROR("H2 \xFF -> x", 4, "the text is not valid UTF-8 (byte 0xFF cannot start a character)");
    CHECK_REACTION_ERROR("→ \xE2\x86", 3, "the text is not valid UTF-8 (the last character is incomplete)");
    CHECK_REACTION_ERROR("H\xC3(", 2, "the text is not valid UTF-8 (byte 0x28 cannot continue a character)");
    CHECK_REACTION_ERROR("H\xC0\xAF", 2, "the text is not valid UTF-8 (overlong encoding)");
    CHECK_REACTION_ERROR("H\xED\xA0\x80", 2, "the text is not valid UTF-8 (not a Unicode character)");
    CHECK_SPECIES_ERROR("\x80", 1, "the text is not valid UTF-8 (byte 0x80 cannot start a character)");
}

TEST_CASE("errors: input longer than 4096 characters", "[grammar][errors]") {
    const std::string ok_text = "H2 -> H2" + std::string(4096 - 8, ' ');
    CHECK(parse_reaction(ok_text).reactants.size() == 1);
    const std::string long_text = ok_text + " ";
    CHECK_REACTION_ERROR(long_text, 0, "input longer than 4096 characters");
    CHECK(std::string(error_of(Kind::reaction, long_text).what()) == "input longer than 4096 characters");
    CHECK_SPECIES_ERROR(std::string(5000, 'H'), 0, "input longer than 4096 characters");
    CHECK_NUMBER_ERROR(std::string(5000, '1'), 0, "input longer than 4096 characters");
    // characters, not bytes: 2000 two-byte characters are 4000 bytes but within the limit
    std::string subscripts = "H";
    for (int k = 0; k < 11; ++k) subscripts += "₂";
    std::string padded = subscripts + " -> x";
    while (padded.size() < 6000) padded += "\u00A0";  // 2 bytes each
    CHECK_NOTHROW(parse_reaction(padded));
}

TEST_CASE("errors: parse_species rejects coefficients, arrows and second species", "[grammar][errors]") {
    CHECK_SPECIES_ERROR("2H2O", 1, "expected a species without a coefficient, found '2'");
    CHECK_SPECIES_ERROR(" ½ O2", 2, "expected a species without a coefficient, found '½'");
    CHECK_SPECIES_ERROR("-> H2", 1, "expected a species, found the arrow '->'");
    CHECK_SPECIES_ERROR("H2 -> H2O", 4, "expected a single species, found the arrow '->' (a reaction)");
    CHECK_SPECIES_ERROR("H2 = H2O", 4, "expected a single species, found the arrow '=' (a reaction)");
    CHECK_SPECIES_ERROR("H2+O2", 3, "expected a single species, found '+'");
    CHECK_SPECIES_ERROR("H2 + O2", 4, "expected a single species, found '+'");
    CHECK_SPECIES_ERROR("H2O H2", 5, "expected the end of the text after the species 'H2O'");
}

TEST_CASE("errors: parse_number accepts only a number", "[grammar][errors]") {
    CHECK_NUMBER_ERROR("x", 1, "expected a number such as 2, 0.5, 3/2 or ½");
    CHECK_NUMBER_ERROR("H2", 1, "expected a number such as 2, 0.5, 3/2 or ½");
    CHECK_NUMBER_ERROR("2 H2", 3, "expected the end of the text after the number");
    CHECK_NUMBER_ERROR("2/", 3, "expected a whole number after '/'");
    CHECK_NUMBER_ERROR("1/0", 1, "division by zero in '1/0'");
    CHECK_NUMBER_ERROR("1.5/2", 1, "a fraction a/b needs whole numbers: '1.5/2'");
    CHECK_NUMBER_ERROR("2 -> 3", 3, "expected the end of the text after the number");
    CHECK_NUMBER_ERROR("1e3", 2, "expected the end of the text after the number");
}

TEST_CASE("ParseError carries position and detail separately", "[grammar][errors]") {
    const ParseError e(14, "expected a species after '+'");
    CHECK(e.position() == 14);
    CHECK(e.detail() == "expected a species after '+'");
    CHECK(std::string(e.what()) == "position 14: expected a species after '+'");
}
