// Formulas: element symbols, counts (ASCII, decimal, subscript), groups in () and [], nesting,
// hydrates, the ASCII formula string and atom positions.
#include "grammar_helpers.hpp"

using namespace grammar_test;
using rxnheat::grammar::parse_species;

TEST_CASE("element symbols are one uppercase letter and greedily one lowercase", "[grammar][formula]") {
    CHECK(atoms(parse_species("Co")) == "Co=1");        // cobalt
    CHECK(atoms(parse_species("CO")) == "C=1 O=1");     // carbon monoxide
    CHECK(atoms(parse_species("NaCl")) == "Na=1 Cl=1");
    CHECK(atoms(parse_species("HCl")) == "H=1 Cl=1");
    CHECK(atoms(parse_species("CoCl2")) == "Co=1 Cl=2");
    CHECK(atoms(parse_species("COCl2")) == "C=1 O=1 Cl=2");  // phosgene
    // the grammar does not know which symbols exist: that is the engine's check
    const Species x = parse_species("Xq2");
    CHECK(atoms(x) == "Xq=2");
    CHECK(x.atoms[0].position == 1);
}

TEST_CASE("atoms: one entry per symbol, in order of first appearance, with its position", "[grammar][formula]") {
    const Species s = parse_species("CH3COOH");
    CHECK(atoms(s) == "C=2 H=4 O=2");
    REQUIRE(s.atoms.size() == 3);
    CHECK(s.atoms[0].position == 1);
    CHECK(s.atoms[1].position == 2);
    CHECK(s.atoms[2].position == 5);
    const Species glucose = parse_species("C₆H₁₂O₆");
    CHECK(glucose.formula == "C6H12O6");
    CHECK(atoms(glucose) == "C=6 H=12 O=6");
    REQUIRE(glucose.atoms.size() == 3);
    CHECK(glucose.atoms[1].position == 3);  // characters: C ₆ H
    CHECK(glucose.atoms[2].position == 6);
}

TEST_CASE("groups in () and [] multiply through, nested", "[grammar][formula]") {
    const Species phosphate = parse_species("Mg3(PO4)2");
    CHECK(phosphate.formula == "Mg3(PO4)2");
    CHECK(atoms(phosphate) == "Mg=3 P=2 O=8");

    const Species tbutanol = parse_species("(CH3)3COH");
    CHECK(atoms(tbutanol) == "C=4 H=10 O=1");
    CHECK(tbutanol.atoms[0].position == 2);  // first C is inside the group

    const Species complex = parse_species("[Cu(NH3)4]SO4");
    CHECK(complex.formula == "[Cu(NH3)4]SO4");
    CHECK(atoms(complex) == "Cu=1 N=4 H=12 S=1 O=4");

    const Species ferrocyanide = parse_species("K4[Fe(CN)6]");
    CHECK(atoms(ferrocyanide) == "K=4 Fe=1 C=6 N=6");

    const Species deep = parse_species("A((B2)3)4");
    CHECK(atoms(deep) == "A=1 B=24");

    const Species aluminium_sulfate = parse_species("Al2(SO4)3");
    CHECK(atoms(aluminium_sulfate) == "Al=2 S=3 O=12");
}

TEST_CASE("sixteen levels of nesting are accepted", "[grammar][formula]") {
    std::string text;
    for (int k = 0; k < 16; ++k) text += "(H";
    for (int k = 0; k < 16; ++k) text += ")2";
    const Species s = parse_species(text);
    // the H at depth d (1..16) is inside d groups of count 2, so counts 2^d: sum = 2^17 - 2
    CHECK(atoms(s) == "H=131070");
}

TEST_CASE("decimal counts for non-stoichiometric solids are exact", "[grammar][formula]") {
    const Species wustite = parse_species("Fe0.947O");
    CHECK(wustite.formula == "Fe0.947O");
    REQUIRE(wustite.atoms.size() == 2);
    CHECK(wustite.atoms[0].count == q(947, 1000));
    CHECK(wustite.atoms[1].count == 1);
    const Species grouped = parse_species("(Fe0.5Mn0.5)2O3");
    CHECK(atoms(grouped) == "Fe=1 Mn=1 O=3");
}

TEST_CASE("hydrates: every separator, multipliers, spaces, groups", "[grammar][formula]") {
    for (const char* dot : {"·", "•", "⋅", "*"}) {
        INFO("separator " << dot);
        const Species s = parse_species(std::string("CuSO4") + dot + "5H2O");
        CHECK(s.formula == "CuSO4*5H2O");
        CHECK(atoms(s) == "Cu=1 S=1 O=9 H=10");
    }
    const Species soda = parse_species("Na2CO3·10H2O");
    CHECK(atoms(soda) == "Na=2 C=1 O=13 H=20");
    const Species spaced = parse_species("CuSO4 · 5 H2O");
    CHECK(spaced.formula == "CuSO4*5H2O");
    CHECK(atoms(spaced) == "Cu=1 S=1 O=9 H=10");
    const Species plaster = parse_species("CaSO4·0.5H2O");  // decimal multiplier
    CHECK(plaster.formula == "CaSO4*0.5H2O");
    CHECK(atoms(plaster) == "Ca=1 S=1 O=9/2 H=1");
    const Species half = parse_species("CaSO4·½H2O");  // vulgar fraction multiplier
    CHECK(half.formula == "CaSO4*0.5H2O");
    CHECK(atoms(half) == "Ca=1 S=1 O=9/2 H=1");
    const Species no_multiplier = parse_species("CaSO4·H2O");
    CHECK(atoms(no_multiplier) == "Ca=1 S=1 O=5 H=2");
    const Species three_parts = parse_species("K4[Fe(CN)6]·3H2O");
    CHECK(three_parts.formula == "K4[Fe(CN)6]*3H2O");
    CHECK(atoms(three_parts) == "K=4 Fe=1 C=6 N=6 H=6 O=3");
    const Species double_salt = parse_species("K2SO4·Al2(SO4)3·24H2O");
    CHECK(double_salt.formula == "K2SO4*Al2(SO4)3*24H2O");
    CHECK(atoms(double_salt) == "K=2 S=4 O=40 Al=2 H=48");
    const Species phased = parse_species("CuSO4·5H2O(s)");
    CHECK(phased.phase == "s");
    CHECK(phased.written == "CuSO4·5H2O(s)");
}

TEST_CASE("the ASCII formula drops phase and charge and converts subscripts", "[grammar][formula]") {
    CHECK(parse_species("SO₄²⁻(aq)").formula == "SO4");
    CHECK(parse_species("Ca(OH)₂(s)").formula == "Ca(OH)2");
    CHECK(parse_species("[Fe(CN)₆]^4-").formula == "[Fe(CN)6]");
    CHECK(parse_species("NH4+(aq)").formula == "NH4");
}

TEST_CASE("species position and written text are trimmed", "[grammar][formula]") {
    const Species s = parse_species("  \tH2O (l)  ");
    CHECK(s.position == 4);
    CHECK(s.written == "H2O (l)");
    CHECK(s.phase == "l");
}
