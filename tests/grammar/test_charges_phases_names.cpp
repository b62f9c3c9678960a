// Charges in every notation, phases, and names (aliases).
#include "grammar_helpers.hpp"

using namespace grammar_test;
using rxnheat::grammar::parse_reaction;
using rxnheat::grammar::parse_species;

TEST_CASE("charges: trailing sign, caret, braces, superscripts", "[grammar][charge]") {
    struct Case {
        const char* text;
        const char* formula;
        int charge;
    };
    const Case cases[] = {
        {"H+", "H", 1},
        {"OH-", "OH", -1},
        {"OH−", "OH", -1},  // U+2212 minus sign
        {"NH4+", "NH4", 1},
        {"Fe^3+", "Fe", 3},
        {"Fe^2+", "Fe", 2},
        {"OH^-", "OH", -1},
        {"Na^+", "Na", 1},
        {"SO4^2-", "SO4", -2},
        {"SO4^2−", "SO4", -2},
        {"PO4{3-}", "PO4", -3},
        {"Fe{3+}", "Fe", 3},
        {"Cl{-}", "Cl", -1},
        {"Fe³⁺", "Fe", 3},
        {"SO₄²⁻", "SO4", -2},
        {"H⁺", "H", 1},
        {"Cl⁻", "Cl", -1},
        {"[Fe(CN)6]^4-", "[Fe(CN)6]", -4},
        {"[Cu(NH3)4]{2+}", "[Cu(NH3)4]", 2},
        {"Fe^12+", "Fe", 12},
        {"Fe¹⁰⁺", "Fe", 10},
    };
    for (const Case& c : cases) {
        INFO(c.text);
        const Species s = parse_species(c.text);
        CHECK(s.formula == c.formula);
        CHECK(s.charge == c.charge);
        CHECK(s.phase.empty());
        CHECK(s.written == c.text);
    }
    CHECK(atoms(parse_species("SO₄²⁻")) == "S=1 O=4");  // superscripts are not counts
}

TEST_CASE("charges come before the phase", "[grammar][charge]") {
    const Species a = parse_species("SO4^2-(aq)");
    CHECK(a.charge == -2);
    CHECK(a.phase == "aq");
    const Species b = parse_species("Fe³⁺(aq)");
    CHECK(b.charge == 3);
    CHECK(b.phase == "aq");
    const Species c = parse_species("PO4{3-}(aq)");
    CHECK(c.charge == -3);
    CHECK(c.phase == "aq");
    const Species d = parse_species("Cl- (aq)");  // whitespace before the phase
    CHECK(d.charge == -1);
    CHECK(d.phase == "aq");
}

TEST_CASE("digits before a trailing sign are counts", "[grammar][charge]") {
    const Species fe3 = parse_species("Fe3+");
    CHECK(fe3.formula == "Fe3");
    CHECK(atoms(fe3) == "Fe=3");
    CHECK(fe3.charge == 1);
    const Species ion = parse_species("Fe^3+");
    CHECK(atoms(ion) == "Fe=1");
    CHECK(ion.charge == 3);
    const Species sup = parse_species("Fe³⁺");
    CHECK(atoms(sup) == "Fe=1");
    CHECK(sup.charge == 3);
}

TEST_CASE("phases: g l s aq, cr is s, the last parenthesised lowercase word", "[grammar][phase]") {
    CHECK(parse_species("CO2(g)").phase == "g");
    CHECK(parse_species("H2O(l)").phase == "l");
    CHECK(parse_species("Fe(s)").phase == "s");
    CHECK(parse_species("C(cr)").phase == "s");
    CHECK(parse_species("NaCl(aq)").phase == "aq");
    CHECK(parse_species("H2O").phase.empty());
    const Species lime = parse_species("Ca(OH)2(s)");
    CHECK(lime.formula == "Ca(OH)2");
    CHECK(lime.phase == "s");
    const Species spaced = parse_species("CH4 (g)");
    CHECK(spaced.formula == "CH4");
    CHECK(spaced.phase == "g");
    // a group that ends the formula is still a group, not a phase
    const Species group_last = parse_species("Fe(OH)");
    CHECK(group_last.phase.empty());
    CHECK(atoms(group_last) == "Fe=1 O=1 H=1");
}

TEST_CASE("names start with a lowercase letter", "[grammar][name]") {
    struct Case {
        const char* text;
        const char* name;
        const char* phase;
    };
    const Case cases[] = {
        {"ethanol", "ethanol", ""},
        {"n-octane", "n-octane", ""},
        {"isooctane", "isooctane", ""},
        {"ethylene oxide", "ethylene oxide", ""},
        {"ethylene   oxide", "ethylene oxide", ""},         // inner whitespace folded
        {"ethylene\t oxide(g)", "ethylene oxide", "g"},
        {"ethylene\u00A0oxide", "ethylene oxide", ""},       // no-break space
        {"ethanol(l)", "ethanol", "l"},
        {"ethanol (l)", "ethanol", "l"},
        {"cis-2-butene(g)", "cis-2-butene", "g"},
        {"trans-1,2-dichloroethene", "trans-1,2-dichloroethene", ""},
        {"propylene(g)", "propylene", "g"},
    };
    for (const Case& c : cases) {
        INFO(c.text);
        const Species s = parse_species(c.text);
        CHECK(s.is_name);
        CHECK(s.name == c.name);
        CHECK(s.phase == c.phase);
        CHECK(s.formula.empty());
        CHECK(s.atoms.empty());
        CHECK(s.charge == 0);
        CHECK(s.written == c.text);
    }
}

TEST_CASE("names inside reactions end at '+', an arrow, a phase or the end", "[grammar][name]") {
    const Reaction r = parse_reaction("ethylene oxide(g)+water(l)->ethylene glycol(l)");
    REQUIRE(r.reactants.size() == 2);
    CHECK(r.reactants[0].species.name == "ethylene oxide");
    CHECK(r.reactants[0].species.phase == "g");
    CHECK(r.reactants[1].species.name == "water");
    REQUIRE(r.products.size() == 1);
    CHECK(r.products[0].species.name == "ethylene glycol");
    CHECK(r.products[0].species.phase == "l");

    const Reaction octane = parse_reaction("2 n-octane->16CO2+18H2O");  // "->" is not part of the name
    CHECK(octane.reactants[0].coefficient == 2);
    CHECK(octane.reactants[0].species.name == "n-octane");
    CHECK(octane.arrow == "->");
    CHECK(octane.products[0].coefficient == 16);

    const Reaction coefficient = parse_reaction("2ethanol = 2 ethanol");
    CHECK(coefficient.reactants[0].coefficient == 2);
    CHECK(coefficient.reactants[0].species.name == "ethanol");
    CHECK(coefficient.reactants[0].species.position == 2);
}
