// Every example of grammar/SYNTAX.md, Examples: coefficients, atoms, charges,
// phases and positions as the text means them.
#include "grammar_helpers.hpp"

using namespace grammar_test;
using rxnheat::grammar::parse_reaction;

TEST_CASE("spec: methane combustion with phases", "[grammar][spec]") {
    const Reaction r = parse_reaction("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)");
    CHECK(r.arrow == "->");
    REQUIRE(r.reactants.size() == 2);
    REQUIRE(r.products.size() == 2);

    const Term& ch4 = r.reactants[0];
    CHECK(ch4.coefficient == 1);
    CHECK_FALSE(ch4.coefficient_written);
    CHECK(ch4.position == 1);
    CHECK(ch4.species.formula == "CH4");
    CHECK(atoms(ch4.species) == "C=1 H=4");
    CHECK(ch4.species.phase == "g");
    CHECK(ch4.species.charge == 0);
    CHECK(ch4.species.written == "CH4(g)");
    CHECK_FALSE(ch4.species.is_name);

    const Term& o2 = r.reactants[1];
    CHECK(o2.coefficient == 2);
    CHECK(o2.coefficient_written);
    CHECK(o2.position == 10);          // the '2'
    CHECK(o2.species.position == 12);  // the 'O'
    CHECK(atoms(o2.species) == "O=2");
    CHECK(o2.species.phase == "g");

    CHECK(r.products[0].species.formula == "CO2");
    CHECK(atoms(r.products[0].species) == "C=1 O=2");
    CHECK(r.products[0].species.phase == "g");
    CHECK(r.products[1].coefficient == 2);
    CHECK(r.products[1].species.formula == "H2O");
    CHECK(atoms(r.products[1].species) == "H=2 O=1");
    CHECK(r.products[1].species.phase == "l");
}

TEST_CASE("spec: phases may be omitted, '=' arrow, coefficient glued to formula", "[grammar][spec]") {
    const Reaction r = parse_reaction("2H2 + O2 = 2H2O");
    CHECK(r.arrow == "=");
    REQUIRE(r.reactants.size() == 2);
    REQUIRE(r.products.size() == 1);
    CHECK(r.reactants[0].coefficient == 2);
    CHECK(r.reactants[0].species.formula == "H2");
    CHECK(atoms(r.reactants[0].species) == "H=2");
    CHECK(r.reactants[0].species.phase.empty());
    CHECK(r.reactants[1].coefficient == 1);
    CHECK(atoms(r.reactants[1].species) == "O=2");
    CHECK(r.products[0].coefficient == 2);
    CHECK(atoms(r.products[0].species) == "H=2 O=1");
    CHECK(r.products[0].species.phase.empty());
}

TEST_CASE("spec: fractional coefficients and the Unicode arrow", "[grammar][spec]") {
    const Reaction r = parse_reaction("1/2 N2(g) + 3/2 H2(g) → NH3(g)");
    CHECK(r.arrow == "→");
    REQUIRE(r.reactants.size() == 2);
    CHECK(r.reactants[0].coefficient == q(1, 2));
    CHECK(atoms(r.reactants[0].species) == "N=2");
    CHECK(r.reactants[1].coefficient == q(3, 2));
    CHECK(atoms(r.reactants[1].species) == "H=2");
    REQUIRE(r.products.size() == 1);
    CHECK(r.products[0].coefficient == 1);
    CHECK(atoms(r.products[0].species) == "N=1 H=3");
    CHECK(r.products[0].species.position == 25);  // characters, not bytes: '→' is one
}

TEST_CASE("spec: decimal coefficient is exact, equilibrium arrow", "[grammar][spec]") {
    const Reaction r = parse_reaction("SO2(g) + 0.5 O2(g) ⇌ SO3(g)");
    CHECK(r.arrow == "⇌");
    CHECK(r.reactants[1].coefficient == q(1, 2));
    CHECK(atoms(r.reactants[0].species) == "S=1 O=2");
    CHECK(atoms(r.products[0].species) == "S=1 O=3");
    CHECK(r.products[0].species.phase == "g");
}

TEST_CASE("spec: Unicode subscripts and arrows as pasted from documents", "[grammar][spec]") {
    const Reaction r = parse_reaction("CH₄(g) + 2O₂(g) → CO₂(g) + 2H₂O(l)");
    CHECK(r.arrow == "→");
    REQUIRE(r.reactants.size() == 2);
    REQUIRE(r.products.size() == 2);
    CHECK(r.reactants[0].species.formula == "CH4");  // ASCII form
    CHECK(r.reactants[0].species.written == "CH₄(g)");  // as written
    CHECK(atoms(r.reactants[0].species) == "C=1 H=4");
    CHECK(r.reactants[1].coefficient == 2);
    CHECK(r.reactants[1].species.formula == "O2");
    CHECK(r.products[0].species.formula == "CO2");
    CHECK(r.products[1].coefficient == 2);
    CHECK(r.products[1].species.formula == "H2O");
    CHECK(atoms(r.products[1].species) == "H=2 O=1");
    CHECK(r.products[1].species.phase == "l");
    CHECK(r.products[1].position == 28);
    CHECK(r.products[1].species.position == 29);
    // the same reaction in ASCII gives the same tree
    const Reaction a = parse_reaction("CH4(g) + 2O2(g) -> CO2(g) + 2H2O(l)");
    for (std::size_t k = 0; k < 2; ++k) {
        CHECK(atoms(a.reactants[k].species) == atoms(r.reactants[k].species));
        CHECK(atoms(a.products[k].species) == atoms(r.products[k].species));
    }
}

TEST_CASE("spec: hydrate with a middle dot", "[grammar][spec]") {
    const Reaction r = parse_reaction("CuSO4·5H2O(s) -> CuSO4(s) + 5 H2O(l)");
    const Species& hydrate = r.reactants[0].species;
    CHECK(r.reactants[0].coefficient == 1);
    CHECK(hydrate.formula == "CuSO4*5H2O");
    CHECK(atoms(hydrate) == "Cu=1 S=1 O=9 H=10");  // O: 4 + 5*1, H: 5*2
    CHECK(hydrate.phase == "s");
    CHECK(hydrate.written == "CuSO4·5H2O(s)");
    CHECK(atoms(r.products[0].species) == "Cu=1 S=1 O=4");
    CHECK(r.products[1].coefficient == 5);
    CHECK(atoms(r.products[1].species) == "H=2 O=1");
    // '*' is the ASCII spelling of the same hydrate
    const Species star = parse_reaction("CuSO4*5H2O(s) -> CuSO4(s) + 5 H2O(l)").reactants[0].species;
    CHECK(star.formula == "CuSO4*5H2O");
    CHECK(atoms(star) == "Cu=1 S=1 O=9 H=10");
}

TEST_CASE("spec: group with count followed by a phase", "[grammar][spec]") {
    const Reaction r = parse_reaction("Ca(OH)2(s) + CO2(g) -> CaCO3(s) + H2O(l)");
    const Species& lime = r.reactants[0].species;
    CHECK(lime.formula == "Ca(OH)2");
    CHECK(atoms(lime) == "Ca=1 O=2 H=2");
    CHECK(lime.phase == "s");
    CHECK(atoms(r.products[0].species) == "Ca=1 C=1 O=3");
    CHECK(r.products[0].species.phase == "s");
    CHECK(r.products[1].species.phase == "l");
}

TEST_CASE("spec: trailing-sign charges before a phase", "[grammar][spec]") {
    const Reaction r = parse_reaction("H+(aq) + OH-(aq) -> H2O(l)");
    REQUIRE(r.reactants.size() == 2);
    CHECK(r.reactants[0].species.formula == "H");
    CHECK(r.reactants[0].species.charge == 1);
    CHECK(r.reactants[0].species.phase == "aq");
    CHECK(atoms(r.reactants[0].species) == "H=1");
    CHECK(r.reactants[1].species.formula == "OH");
    CHECK(r.reactants[1].species.charge == -1);
    CHECK(r.reactants[1].species.phase == "aq");
    CHECK(atoms(r.reactants[1].species) == "O=1 H=1");
    CHECK(r.products[0].species.charge == 0);
}

TEST_CASE("spec: caret charges", "[grammar][spec]") {
    const Reaction r = parse_reaction("Fe^3+(aq) + 3 OH^-(aq) -> Fe(OH)3(s)");
    CHECK(r.reactants[0].species.formula == "Fe");
    CHECK(atoms(r.reactants[0].species) == "Fe=1");
    CHECK(r.reactants[0].species.charge == 3);
    CHECK(r.reactants[0].species.phase == "aq");
    CHECK(r.reactants[1].coefficient == 3);
    CHECK(r.reactants[1].species.formula == "OH");
    CHECK(r.reactants[1].species.charge == -1);
    CHECK(r.reactants[1].species.phase == "aq");
    CHECK(r.products[0].species.formula == "Fe(OH)3");
    CHECK(atoms(r.products[0].species) == "Fe=1 O=3 H=3");
    CHECK(r.products[0].species.charge == 0);
    CHECK(r.products[0].species.phase == "s");
}

TEST_CASE("spec: a name from the alias table", "[grammar][spec]") {
    const Reaction r = parse_reaction("ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)");
    const Species& ethanol = r.reactants[0].species;
    CHECK(ethanol.is_name);
    CHECK(ethanol.name == "ethanol");
    CHECK(ethanol.formula.empty());
    CHECK(ethanol.atoms.empty());
    CHECK(ethanol.phase == "l");
    CHECK(ethanol.written == "ethanol(l)");
    CHECK(r.reactants[1].coefficient == 3);
    CHECK(r.products[0].coefficient == 2);
    CHECK(r.products[1].coefficient == 3);
    CHECK_FALSE(r.products[1].species.is_name);
}

TEST_CASE("spec: every listed arrow is accepted and kept as written", "[grammar][spec]") {
    for (const char* arrow : {"->", "=>", "=", "<=>", "<->", "→", "⟶", "⇌"}) {
        INFO("arrow " << arrow);
        const Reaction spaced = parse_reaction(std::string("H2 + Cl2 ") + arrow + " 2 HCl");
        CHECK(spaced.arrow == arrow);
        CHECK(spaced.reactants.size() == 2);
        CHECK(spaced.products.size() == 1);
        const Reaction tight = parse_reaction(std::string("H2+Cl2") + arrow + "2HCl");
        CHECK(tight.arrow == arrow);
        CHECK(tight.reactants.size() == 2);
        REQUIRE(tight.products.size() == 1);
        CHECK(tight.products[0].coefficient == 2);
        CHECK(atoms(tight.products[0].species) == "H=1 Cl=1");
    }
}

TEST_CASE("spec: the same species on both sides is kept on both sides", "[grammar][spec]") {
    const Reaction r = parse_reaction("CH4 + 2 O2 + 3 N2 -> CO2 + 2 H2O + 3 N2");
    REQUIRE(r.reactants.size() == 3);
    REQUIRE(r.products.size() == 3);
    CHECK(r.reactants[2].species.formula == "N2");
    CHECK(r.products[2].species.formula == "N2");
    CHECK(r.reactants[2].coefficient == 3);
    CHECK(r.products[2].coefficient == 3);
}
