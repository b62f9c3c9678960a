// Typos that would parse into another formula (grammar/SYNTAX.md rules 9, 14 and 15): the
// letter O typed as a zero, and a hydrate typed with a full stop. Each is refused with the
// position of the character to fix and the corrected text; the formulas they resemble, and the
// escapes the messages give, keep parsing. Atom counts are counted by hand from the text.
#include "grammar_helpers.hpp"

using namespace grammar_test;
using rxnheat::grammar::parse_reaction;
using rxnheat::grammar::parse_species;

TEST_CASE("typos: a count with a leading zero is the letter O", "[grammar][typos]") {
    CHECK_SPECIES_ERROR("C02", 2, "'02' starts with a zero; if you meant the letter O, write 'CO2'");
    CHECK_SPECIES_ERROR("CO02", 3, "'02' starts with a zero; if you meant the letter O, write 'COO2'");
    CHECK_SPECIES_ERROR("Si02", 3, "'02' starts with a zero; if you meant the letter O, write 'SiO2'");
    CHECK_SPECIES_ERROR("NaHC03", 5, "'03' starts with a zero; if you meant the letter O, write 'NaHCO3'");
    CHECK_SPECIES_ERROR("C002", 2, "'002' starts with a zero; if you meant the letter O, write 'COO2'");
    CHECK_SPECIES_ERROR("C02(g)", 2, "'02' starts with a zero; if you meant the letter O, write 'CO2'");
    // group counts and subscript digits follow the same rule
    CHECK_SPECIES_ERROR("Ca(OH)02", 7,
                        "'02' starts with a zero; if you meant the letter O, write 'Ca(OH)O2'");
    CHECK_SPECIES_ERROR("C₀₂", 2, "'₀₂' starts with a zero; if you meant the letter O, write 'CO₂'");
    // a zero kept before a decimal point: the rest is a decimal count
    CHECK_SPECIES_ERROR("Fe00.5O", 3,
                        "'00.5' starts with a zero; if you meant the letter O, write 'FeO0.5O'");
    // in a reaction, the position counts from the start of the reaction
    CHECK_REACTION_ERROR("CH4 + 2 O2 -> C02 + 2 H2O", 16,
                         "'02' starts with a zero; if you meant the letter O, write 'CO2'");
    CHECK_REACTION_ERROR("2 S02 + O2 -> 2 SO3", 4,
                         "'02' starts with a zero; if you meant the letter O, write 'SO2'");
    // a lone zero (C0 for CO, H2O0) keeps the zero-count error, which already refuses it
    CHECK_SPECIES_ERROR("C0", 2, "a count of zero is not allowed: '0'");
    CHECK_SPECIES_ERROR("H2O0", 4, "a count of zero is not allowed: '0'");
}

TEST_CASE("typos: counts below one and numbers outside formulas keep their zeros", "[grammar][typos]") {
    CHECK(atoms(parse_species("Fe0.947O")) == "Fe=947/1000 O=1");
    CHECK(atoms(parse_species("Mn0.05O")) == "Mn=1/20 O=1");
    CHECK(atoms(parse_species("La0.8Sr0.2MnO3")) == "La=4/5 Sr=1/5 Mn=1 O=3");
    const Reaction r = parse_reaction("10 H2O -> 10 H2O");
    CHECK(r.reactants[0].coefficient == 10);
    CHECK(parse_reaction("20 H2 + 10 O2 -> 20 H2O").products[0].coefficient == 20);
    CHECK(parse_reaction("0.5 O2 -> O").reactants[0].coefficient == q(1, 2));
    CHECK(rxnheat::grammar::parse_number("007") == 7);
}

TEST_CASE("typos: 20 to 90 at the end of a formula is the letter O", "[grammar][typos]") {
    CHECK_SPECIES_ERROR("H20", 3,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'H2O'; for a true count of 20 write '(H)20'");
    CHECK_SPECIES_ERROR("H20(l)", 3,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'H2O'; for a true count of 20 write '(H)20'");
    CHECK_SPECIES_ERROR("Na20", 4,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'Na2O'; for a true count of 20 write '(Na)20'");
    CHECK_SPECIES_ERROR("CH20", 4,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'CH2O'; for a true count of 20 write 'C(H)20'");
    // H on carbon is refused only above what a molecule can hold (2·C + 2 + N hydrogen atoms):
    // CH20 (1 C: at most 4 H) and CH3CH20 (2 C: at most 6 H, written 23) are CH2O and CH3CH2O.
    CHECK_SPECIES_ERROR("CH3CH20", 7,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'CH3CH2O'; for a true count of 20 write 'CH3C(H)20'");
    CHECK_SPECIES_ERROR("N20", 3,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'N2O'; for a true count of 20 write '(N)20'");
    // the carbon of another part does not count: the water of a hydrate is its own part
    CHECK_SPECIES_ERROR("C2H2O4·2H20", 11,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'C2H2O4·2H2O'; for a true count of 20 write "
                        "'C2H2O4·2(H)20'");
    // N on carbon is not exempt: C3H8N20 is C3H8N2O
    CHECK_SPECIES_ERROR("C3H8N20", 7,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'C3H8N2O'; for a true count of 20 write 'C3H8(N)20'");
    CHECK_SPECIES_ERROR("K30", 3,
                        "'30' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'K3O'; for a true count of 30 write '(K)30'");
    CHECK_SPECIES_ERROR("CuSO4·5H20", 10,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'CuSO4·5H2O'; for a true count of 20 write "
                        "'CuSO4·5(H)20'");
    CHECK_REACTION_ERROR("2H2 + O2 -> 2H20", 16,
                         "'20' at the end of the formula is far more often the letter O typed as a zero; "
                         "if you meant the letter O, write 'H2O'; for a true count of 20 write '(H)20'");
}

TEST_CASE("typos: the escape for a true count of 20 gives the same atoms", "[grammar][typos]") {
    const Species h = parse_species("(H)20");
    CHECK(atoms(h) == "H=20");
    CHECK(h.formula == "(H)20");
    const Species nonane = parse_species("C9(H)20");
    CHECK(atoms(nonane) == "C=9 H=20");
    // the same atoms as the count written where the check does not apply (not at the end)
    CHECK(atoms(parse_species("H20C9")) == "H=20 C=9");
    CHECK(atoms(parse_species("C9H₂₀")) == "C=9 H=20");  // subscripts are typeset, not slips
    CHECK(atoms(parse_species("CuSO4·5(H)20")) == "Cu=1 S=1 O=4 H=100");
}

TEST_CASE("typos: alkanes and alkenes ending in H20 to H40 are real formulas", "[grammar][typos]") {
    // CnH2n+2 and CnH2n (common practice): nonane, decene, tetradecane, nonadecane, eicosene.
    CHECK(atoms(parse_species("C9H20")) == "C=9 H=20");
    CHECK(atoms(parse_species("C9H20(l)")) == "C=9 H=20");
    CHECK(atoms(parse_species("C10H20")) == "C=10 H=20");
    CHECK(atoms(parse_species("C14H30")) == "C=14 H=30");
    CHECK(atoms(parse_species("C19H40")) == "C=19 H=40");
    CHECK(atoms(parse_species("C20H40")) == "C=20 H=40");
}

TEST_CASE("typos: real formulas with 10 or a trailing zero keep working", "[grammar][typos]") {
    CHECK(atoms(parse_species("P4O10")) == "P=4 O=10");      // O is exempt
    CHECK(atoms(parse_species("C10H22")) == "C=10 H=22");
    CHECK(atoms(parse_species("C20H42")) == "C=20 H=42");
    CHECK(atoms(parse_species("B10H14")) == "B=10 H=14");
    CHECK(atoms(parse_species("C4H10")) == "C=4 H=10");      // 10 is exempt
    CHECK(atoms(parse_species("C5H10")) == "C=5 H=10");
    CHECK(atoms(parse_species("B4H10")) == "B=4 H=10");
    CHECK(atoms(parse_species("C60")) == "C=60");            // C is exempt
    CHECK(atoms(parse_species("C70(s)")) == "C=70");
    CHECK(atoms(parse_species("H20O")) == "H=20 O=1");       // not at the end
    CHECK(atoms(parse_species("Ca(OH)20")) == "Ca=1 O=20 H=20");  // a group count
    CHECK(atoms(parse_species("H200")) == "H=200");          // three digits
    CHECK(atoms(parse_species("Na2SO4·10H2O")) == "Na=2 S=1 O=14 H=20");
}

TEST_CASE("typos: a hydrate typed with a full stop is refused with both spellings", "[grammar][typos]") {
    CHECK_SPECIES_ERROR("CuSO4.5H2O", 6,
                        "the full stop in '4.5' could be a decimal point or a hydrate dot; for a hydrate "
                        "write 'CuSO4·5H2O' or 'CuSO4*5H2O', for a count of 4.5 put the formula in "
                        "brackets: '(CuSO4.5H2O)'");
    CHECK_SPECIES_ERROR("Na2CO3.10H2O", 7,
                        "the full stop in '3.10' could be a decimal point or a hydrate dot; for a hydrate "
                        "write 'Na2CO3·10H2O' or 'Na2CO3*10H2O', for a count of 3.10 put the formula in "
                        "brackets: '(Na2CO3.10H2O)'");
    CHECK_SPECIES_ERROR("CaSO4.2H2O", 6,
                        "the full stop in '4.2' could be a decimal point or a hydrate dot; for a hydrate "
                        "write 'CaSO4·2H2O' or 'CaSO4*2H2O', for a count of 4.2 put the formula in "
                        "brackets: '(CaSO4.2H2O)'");
    CHECK_SPECIES_ERROR("Ba(OH)2.8H2O", 8,
                        "the full stop in '2.8' could be a decimal point or a hydrate dot; for a hydrate "
                        "write 'Ba(OH)2·8H2O' or 'Ba(OH)2*8H2O', for a count of 2.8 put the formula in "
                        "brackets: '(Ba(OH)2.8H2O)'");
    // in a later hydrate part, only that part goes in brackets
    CHECK_SPECIES_ERROR("K2SO4·Al2(SO4)3.24H2O", 16,
                        "the full stop in '3.24' could be a decimal point or a hydrate dot; for a hydrate "
                        "write 'K2SO4·Al2(SO4)3·24H2O' or 'K2SO4·Al2(SO4)3*24H2O', for a count of 3.24 put "
                        "the formula in brackets: 'K2SO4·(Al2(SO4)3.24H2O)'");
    // decimal counts of one or more followed by more formula: the same ambiguity
    CHECK_SPECIES_ERROR("C1.5H3", 3,
                        "the full stop in '1.5' could be a decimal point or a hydrate dot; for a hydrate "
                        "write 'C1·5H3' or 'C1*5H3', for a count of 1.5 put the formula in brackets: "
                        "'(C1.5H3)'");
    CHECK_REACTION_ERROR("CuSO4.5H2O(s) -> CuSO4(s) + 5 H2O(l)", 6,
                         "the full stop in '4.5' could be a decimal point or a hydrate dot; for a hydrate "
                         "write 'CuSO4·5H2O' or 'CuSO4*5H2O', for a count of 4.5 put the formula in "
                         "brackets: '(CuSO4.5H2O)'");
}

TEST_CASE("typos: both spellings the message gives parse", "[grammar][typos]") {
    CHECK(atoms(parse_species("CuSO4·5H2O")) == "Cu=1 S=1 O=9 H=10");
    CHECK(atoms(parse_species("CuSO4*5H2O")) == "Cu=1 S=1 O=9 H=10");
    CHECK(atoms(parse_species("(CuSO4.5H2O)")) == "Cu=1 S=1 O=11/2 H=2");
    CHECK(atoms(parse_species("K2SO4·(Al2(SO4)3.24H2O)")) == "K=2 S=106/25 O=449/25 Al=2 H=2");
    CHECK(atoms(parse_species("(C1.5H3)")) == "C=3/2 H=3");
    CHECK(atoms(parse_species("H3C1.5")) == "H=3 C=3/2");
    CHECK(atoms(parse_species("(CH1.44O0.66)(g)")) == "C=1 H=36/25 O=33/50");
}

TEST_CASE("typos: decimal counts that cannot be a hydrate keep working", "[grammar][typos]") {
    CHECK(atoms(parse_species("Fe0.947O")) == "Fe=947/1000 O=1");   // below one: anywhere
    CHECK(atoms(parse_species("CO0.66H1.44")) == "C=1 O=33/50 H=36/25");  // one or more: last
    CHECK(atoms(parse_species("UO2.5")) == "U=1 O=5/2");
    CHECK(atoms(parse_species("UO2.5(s)")) == "U=1 O=5/2");
    CHECK(atoms(parse_species("CH1.95")) == "C=1 H=39/20");
    CHECK(atoms(parse_species("(Fe1.5Mn0.5)O3")) == "Fe=3/2 Mn=1/2 O=3");  // inside brackets
    CHECK(atoms(parse_species("CaSO4·1.5H2O")) == "Ca=1 S=1 O=11/2 H=3");  // a multiplier
    CHECK(atoms(parse_species("CuSO4.5·H2O")) == "Cu=1 S=1 O=11/2 H=2");   // ends its part
}

TEST_CASE("typos: a full stop the grammar cannot read says it is not a hydrate dot", "[grammar][typos]") {
    CHECK_SPECIES_ERROR("CaSO4.H2O", 6,
                        "a full stop is not a hydrate dot; for a hydrate write 'CaSO4·H2O' or 'CaSO4*H2O'");
    CHECK_SPECIES_ERROR("NaCl.H2O", 5,
                        "a full stop is not a hydrate dot; for a hydrate write 'NaCl·H2O' or 'NaCl*H2O'");
    CHECK_SPECIES_ERROR("CaSO4.½H2O", 6,
                        "a full stop is not a hydrate dot; for a hydrate write 'CaSO4·½H2O' or 'CaSO4*½H2O'");
    CHECK_REACTION_ERROR("NaCl.2H2O(s) -> NaCl(s) + 2 H2O(l)", 5,
                         "a full stop is not a hydrate dot; for a hydrate write 'NaCl·2H2O' or 'NaCl*2H2O'");
    // a coefficient's full stop keeps its message
    CHECK_REACTION_ERROR("2.H2 -> x", 3, "expected a digit after '.'");
}
