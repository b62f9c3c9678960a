// Every disambiguation rule written in grammar/SYNTAX.md, one test case each (same order).
#include "grammar_helpers.hpp"

using namespace grammar_test;
using rxnheat::grammar::parse_reaction;
using rxnheat::grammar::parse_species;

TEST_CASE("rule 1: a leading number is always the coefficient", "[grammar][rules]") {
    const Reaction r = parse_reaction("2H2O -> 2H2 + O2");
    CHECK(r.reactants[0].coefficient == 2);
    CHECK(r.reactants[0].species.formula == "H2O");
    CHECK(atoms(r.reactants[0].species) == "H=2 O=1");
    const Reaction spaced = parse_reaction("2 H2O -> 2 H2 + O2");
    CHECK(spaced.reactants[0].coefficient == 2);
    CHECK(spaced.reactants[0].species.formula == "H2O");
    const Reaction decimal = parse_reaction("0.5O2 -> O");
    CHECK(decimal.reactants[0].coefficient == q(1, 2));
    CHECK(atoms(decimal.reactants[0].species) == "O=2");
    const Reaction half = parse_reaction("½O2 -> O");
    CHECK(half.reactants[0].coefficient == q(1, 2));
}

TEST_CASE("rule 2: element symbols are read greedily, case matters", "[grammar][rules]") {
    CHECK(atoms(parse_species("Co")) == "Co=1");
    CHECK(atoms(parse_species("CO")) == "C=1 O=1");
    CHECK(atoms(parse_species("Hf")) == "Hf=1");
    CHECK(atoms(parse_species("HF")) == "H=1 F=1");
    CHECK(atoms(parse_species("Sn")) == "Sn=1");
    CHECK(atoms(parse_species("SN")) == "S=1 N=1");
}

TEST_CASE("rule 3: lowercase start means a name", "[grammar][rules]") {
    const Species name = parse_species("co");
    CHECK(name.is_name);
    CHECK(name.name == "co");
    CHECK(name.atoms.empty());
    CHECK_FALSE(parse_species("Co").is_name);
    // a name cannot begin with a digit: the digit is a coefficient
    CHECK_REACTION_ERROR("1-butene -> x", 2, "expected a species after the coefficient '1'");
}

TEST_CASE("rule 4: the phase is the last parenthesised lowercase word", "[grammar][rules]") {
    const Species s = parse_species("Ca(OH)2(s)");
    CHECK(s.formula == "Ca(OH)2");
    CHECK(s.phase == "s");
    CHECK(parse_species("C(cr)").phase == "s");
    const Species group = parse_species("Mg(OH)2");  // '(' then uppercase: a group
    CHECK(group.phase.empty());
    CHECK(atoms(group) == "Mg=1 O=2 H=2");
    CHECK_SPECIES_ERROR("H2O(liq)", 4,
                        "unknown phase '(liq)': the phases are (g), (l), (s), (cr) (the same as (s)) "
                        "and (aq)");
    // phases are lowercase: an uppercase one would silently be an element group
    CHECK_SPECIES_ERROR("H2O(L)", 4,
                        "'(L)' would be a group of the element L; phases are written in lowercase: (l)");
    CHECK_SPECIES_ERROR("CH4(G)", 4,
                        "'(G)' would be a group of the element G; phases are written in lowercase: (g)");
    CHECK_SPECIES_ERROR("CaO(S)", 4,
                        "'(S)' would be a group of the element S; phases are written in lowercase: (s)");
    CHECK(atoms(parse_species("Fe(SCN)")) == "Fe=1 S=1 C=1 N=1");  // not a phase: kept
    CHECK(atoms(parse_species("Na2(S)2")) == "Na=2 S=2");           // counted group: kept
}

TEST_CASE("rule 5: a trailing sign is a charge before the end, whitespace, '(' or an arrow", "[grammar][rules]") {
    // end of the text
    CHECK(parse_species("H+").charge == 1);
    CHECK(parse_reaction("H2O -> H+ + OH-").products[1].species.charge == -1);
    // whitespace
    const Reaction ions = parse_reaction("H+ + OH- -> H2O");
    REQUIRE(ions.reactants.size() == 2);
    CHECK(ions.reactants[0].species.formula == "H");
    CHECK(ions.reactants[0].species.charge == 1);
    CHECK(ions.reactants[1].species.formula == "OH");
    CHECK(ions.reactants[1].species.charge == -1);
    const Reaction tight_second = parse_reaction("H+ +OH- -> H2O");
    REQUIRE(tight_second.reactants.size() == 2);
    CHECK(tight_second.reactants[1].species.charge == -1);
    // '(' of a phase
    CHECK(parse_species("H+(aq)").charge == 1);
    // an arrow
    const Reaction before_arrow = parse_reaction("H2+->H2");
    CHECK(before_arrow.reactants[0].species.charge == 1);
    const Reaction minus_arrow = parse_reaction("OH-->OH");
    CHECK(minus_arrow.reactants[0].species.charge == -1);
    CHECK(minus_arrow.arrow == "->");
    CHECK(parse_reaction("H+=H").reactants[0].species.charge == 1);
    CHECK(parse_reaction("H+→H").reactants[0].species.charge == 1);
    // otherwise '+' separates species
    const Reaction water = parse_reaction("2H2+O2->2H2O");
    REQUIRE(water.reactants.size() == 2);
    CHECK(water.reactants[0].coefficient == 2);
    CHECK(water.reactants[0].species.charge == 0);
    CHECK(water.reactants[1].species.formula == "O2");
    CHECK(water.products[0].coefficient == 2);
    const Reaction iron = parse_reaction("Fe+3H2->x");
    REQUIRE(iron.reactants.size() == 2);
    CHECK(iron.reactants[0].species.formula == "Fe");
    CHECK(iron.reactants[0].species.charge == 0);
    CHECK(iron.reactants[1].coefficient == 3);
    CHECK(iron.reactants[1].species.formula == "H2");
}

TEST_CASE("rule 5: a sign before a space followed by a species is an error with a fix", "[grammar][rules]") {
    CHECK_REACTION_ERROR("2H2+ O2 -> 2H2O", 4,
                         "'+' directly after 'H2' and before a space is read as a charge, so 'O2' has no "
                         "'+' before it; write 'H2 + O2' to add the species (or 'H2+ + O2' if 'H2+' is "
                         "an ion)");
    CHECK_REACTION_ERROR("Na+ Cl- -> NaCl", 3,
                         "'+' directly after 'Na' and before a space is read as a charge, so 'Cl-' has "
                         "no '+' before it; write 'Na + Cl-' to add the species (or 'Na+ + Cl-' if "
                         "'Na+' is an ion)");
    CHECK_REACTION_ERROR("NaCl -> Cl- Na+", 11,
                         "'-' directly after 'Cl' and before a space is read as a charge, so 'Na+' has "
                         "no '+' before it; write 'Cl- + Na+' to add the ion");
    // a caret charge ends where it ends: here only the '+' between the species is missing
    CHECK_REACTION_ERROR("Fe^3+ O2 -> x", 7,
                         "expected an arrow (->, =, \u2192, \u21CC ...) between reactants and products");
    // a '+' before '(' is a charge too, and "(OH)2" is no phase
    CHECK_REACTION_ERROR("Fe+(OH)2 -> x", 3,
                         "'+' directly after 'Fe' and before '(' is read as a charge; write "
                         "'Fe + (OH)2' to add the species");
    const Reaction spaced = parse_reaction("Fe + (OH)2 -> x");
    REQUIRE(spaced.reactants.size() == 2);
    CHECK(atoms(spaced.reactants[1].species) == "O=2 H=2");
}

TEST_CASE("rule 6: digits before a trailing sign are counts", "[grammar][rules]") {
    const Species fe3 = parse_species("Fe3+");
    CHECK(atoms(fe3) == "Fe=3");
    CHECK(fe3.charge == 1);
    CHECK(parse_species("Fe^3+").charge == 3);
    CHECK(atoms(parse_species("Fe^3+")) == "Fe=1");
    CHECK(parse_species("Fe³⁺").charge == 3);
}

TEST_CASE("rule 7: '-' followed by '>' is part of the arrow", "[grammar][rules]") {
    const Reaction r = parse_reaction("H2O->H2O");
    CHECK(r.reactants[0].species.charge == 0);
    CHECK(r.arrow == "->");
    const Reaction n = parse_reaction("n-butane->isobutane");
    CHECK(n.reactants[0].species.name == "n-butane");
    CHECK(n.products[0].species.name == "isobutane");
}

TEST_CASE("rule 8: the longest arrow wins, and there is exactly one", "[grammar][rules]") {
    CHECK(parse_reaction("A<=>B").arrow == "<=>");
    CHECK(parse_reaction("A=>B").arrow == "=>");
    CHECK(parse_reaction("A=B").arrow == "=");
    CHECK(parse_reaction("A<->B").arrow == "<->");
    CHECK_REACTION_ERROR("A -> B -> C", 8, "found a second arrow '->'; a reaction has exactly one arrow");
    CHECK_REACTION_ERROR("A = B ⇌ C", 7, "found a second arrow '⇌'; a reaction has exactly one arrow");
}

TEST_CASE("rule 9: a point in a count is a decimal point only where it cannot be a hydrate dot", "[grammar][rules]") {
    CHECK(parse_species("Fe0.947O").atoms[0].count == q(947, 1000));  // below one: anywhere
    CHECK(atoms(parse_species("UO2.5")) == "U=1 O=5/2");               // last in its part
    CHECK(atoms(parse_species("(CuSO4.5H2O)")) == "Cu=1 S=1 O=11/2 H=2");  // inside brackets
    // CuSO4.5H2O could be CuSO(4.5)H2O or the hydrate: refused, never guessed
    CHECK_SPECIES_ERROR("CuSO4.5H2O", 6,
                        "the full stop in '4.5' could be a decimal point or a hydrate dot; for a hydrate "
                        "write 'CuSO4·5H2O' or 'CuSO4*5H2O', for a count of 4.5 put the formula in "
                        "brackets: '(CuSO4.5H2O)'");
    CHECK_SPECIES_ERROR("CaSO4.H2O", 6,
                        "a full stop is not a hydrate dot; for a hydrate write 'CaSO4·H2O' or 'CaSO4*H2O'");
    CHECK(atoms(parse_species("CuSO4*5H2O")) == "Cu=1 S=1 O=9 H=10");
}

TEST_CASE("rule 10: a hydrate multiplier applies to its part, the coefficient to the species", "[grammar][rules]") {
    const Species s = parse_species("Na2SO4·10H2O");
    CHECK(atoms(s) == "Na=2 S=1 O=14 H=20");
    const Reaction r = parse_reaction("2CaSO4·H2O -> 2CaSO4 + 2H2O");
    CHECK(r.reactants[0].coefficient == 2);
    CHECK(r.reactants[0].species.formula == "CaSO4*H2O");
    CHECK(atoms(r.reactants[0].species) == "Ca=1 S=1 O=5 H=2");
}

TEST_CASE("rule 11: subscripts are counts, superscripts are charges", "[grammar][rules]") {
    const Species s = parse_species("SO₄²⁻");
    CHECK(atoms(s) == "S=1 O=4");
    CHECK(s.charge == -2);
    const Species mixed = parse_species("C₂H₅OH");
    CHECK(atoms(mixed) == "C=2 H=6 O=1");
}

TEST_CASE("rule 12: whitespace is free between tokens and ends a formula", "[grammar][rules]") {
    const Reaction r = parse_reaction("  2  H2 \t+\u00A0O2   ->\t2 H2O  ");
    REQUIRE(r.reactants.size() == 2);
    CHECK(r.reactants[0].coefficient == 2);
    CHECK(r.reactants[1].species.formula == "O2");
    REQUIRE(r.products.size() == 1);
    CHECK(r.products[0].coefficient == 2);
    CHECK(r.products[0].species.written == "H2O");
    CHECK(parse_species("CH4 (g)").phase == "g");              // before a phase
    CHECK(parse_species("CuSO4 · 5H2O").formula == "CuSO4*5H2O");  // around a hydrate dot
    CHECK(parse_species("ethylene  oxide").name == "ethylene oxide");
    // the other whitespace characters: CR, LF, thin space, narrow no-break space
    const Reaction other = parse_reaction("H2\r\n+\u2009O2\u202F->\nH2O2");
    CHECK(other.reactants.size() == 2);
    CHECK(other.products[0].species.formula == "H2O2");
    // no whitespace inside a formula or a phase
    CHECK_REACTION_ERROR("H2 O -> H2O", 4,
                         "expected an arrow (->, =, \u2192, \u21CC ...) between reactants and products");
    CHECK_SPECIES_ERROR("CH4 ( g )", 5, "expected the end of the text after the species 'CH4'");
}

TEST_CASE("rule 13: fractions a/b are whole numbers, 1½ is a mixed number", "[grammar][rules]") {
    CHECK(parse_reaction("1½ O2 -> 3 O").reactants[0].coefficient == q(3, 2));
    CHECK(parse_reaction("3/2 O2 -> 3 O").reactants[0].coefficient == q(3, 2));
    CHECK(parse_reaction("1.5 O2 -> 3 O").reactants[0].coefficient == q(3, 2));
    CHECK_REACTION_ERROR("1.5/2 O2 -> O", 1, "a fraction a/b needs whole numbers: '1.5/2'");
    // "1 / 2" is the coefficient 1 followed by a stray '/'
    CHECK_REACTION_ERROR("1 / 2 O2 -> O", 3, "expected a species after the coefficient '1'");
}

TEST_CASE("rule 14: a count never starts with a zero", "[grammar][rules]") {
    CHECK_SPECIES_ERROR("C02", 2, "'02' starts with a zero; if you meant the letter O, write 'CO2'");
    CHECK(atoms(parse_species("Fe0.947O")) == "Fe=947/1000 O=1");
    CHECK(parse_reaction("10 H2O -> 10 H2O").reactants[0].coefficient == 10);  // coefficients are numbers
}

TEST_CASE("rule 15: 20 to 90 ending a formula, on an element other than O or C, is refused", "[grammar][rules]") {
    CHECK_SPECIES_ERROR("H20", 3,
                        "'20' at the end of the formula is far more often the letter O typed as a zero; "
                        "if you meant the letter O, write 'H2O'; for a true count of 20 write '(H)20'");
    CHECK(atoms(parse_species("(H)20")) == "H=20");
    CHECK(atoms(parse_species("C4H10")) == "C=4 H=10");
    CHECK(atoms(parse_species("P4O10")) == "P=4 O=10");
    CHECK(atoms(parse_species("C60")) == "C=60");
    CHECK(atoms(parse_species("C9H₂₀")) == "C=9 H=20");
}
