// The text functions through the public API (rxnheat.hpp): balancing, the report, RXNSOURCE and
// the version.
#include "behaviour_helpers.hpp"

#include <string>
#include <utility>

using namespace rxnheat_test;

TEST_CASE("balance gives the smallest whole numbers", "[behaviour][balance]") {
    const std::pair<const char*, const char*> cases[] = {
        // Hand-balanced (atom counting) — each result can be verified by counting elements.
        {"C3H8 + O2 -> CO2 + H2O", "C3H8 + 5 O2 -> 3 CO2 + 4 H2O"},
        {"C3H8(g) + O2(g) -> CO2(g) + H2O(l)", "C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)"},
        {"H2 + O2 -> H2O", "2 H2 + O2 -> 2 H2O"},
        {"2 H2 + O2 -> H2O", "2 H2 + O2 -> 2 H2O"},
        {"Al + O2 -> Al2O3", "4 Al + 3 O2 -> 2 Al2O3"},
        {"NH3 + O2 -> NO + H2O", "4 NH3 + 5 O2 -> 4 NO + 6 H2O"},
        {"Fe2O3 + CO -> Fe + CO2", "Fe2O3 + 3 CO -> 2 Fe + 3 CO2"},
        {"C2H5OH + O2 -> CO2 + H2O", "C2H5OH + 3 O2 -> 2 CO2 + 3 H2O"},
        {"KMnO4 + HCl -> KCl + MnCl2 + Cl2 + H2O", "2 KMnO4 + 16 HCl -> 2 KCl + 2 MnCl2 + 5 Cl2 + 8 H2O"},
        {"Cu + HNO3 -> Cu(NO3)2 + NO + H2O", "3 Cu + 8 HNO3 -> 3 Cu(NO3)2 + 2 NO + 4 H2O"},
        {"CuSO4*5H2O -> CuSO4 + H2O", "CuSO4*5H2O -> CuSO4 + 5 H2O"},
        // Charge-balanced ionic reactions.
        {"Fe^3+ + OH- -> Fe(OH)3", "Fe^3+ + 3 OH- -> Fe(OH)3"},
        {"MnO4- + Fe^2+ + H+ -> Mn^2+ + Fe^3+ + H2O", "MnO4- + 5 Fe^2+ + 8 H+ -> Mn^2+ + 5 Fe^3+ + 4 H2O"},
        {"Cr2O7^2- + Fe^2+ + H+ -> Cr^3+ + Fe^3+ + H2O", "Cr2O7^2- + 6 Fe^2+ + 14 H+ -> 2 Cr^3+ + 6 Fe^3+ + 7 H2O"},
    };
    for (const auto& c : cases) {
        // Named references rather than a structured binding, which a lambda may capture only
        // from C++20 on (clang 14 refuses it in C++17).
        const auto& in = c.first;
        const auto& expected = c.second;
        auto o = attempt([&] { return eng().balance(in); });
        INFO(in << " -> " << o.text << o.message);
        CHECK(o.text == expected);  // hand-balanced by counting atoms and charge (see comment above)
    }
    // The balanced text really balances: dh works on it (a reaction with data).
    CHECK_NOTHROW(eng().dh(eng().balance("CH4(g) + O2(g) -> CO2(g) + H2O(l)")));  // consequence of balancing
    CHECK(eng().dh(eng().balance("CH4(g) + O2(g) -> CO2(g) + H2O(l)")) == Approx(eng().dh(CH4_COMB)).margin(1e-9));  // same reaction

    // Two independent balances, or none: errors (engine/FUNCTIONS.md, RXNBALANCE).
    for (const char* bad : {"H2 + O2 -> H2O + H2O2",        // two independent balances (4 species, 2 elements)
                            "CO + O2 + C -> CO2",            // two independent balances
                            "Na -> Cl",                      // no balance
                            "H2O -> H2",                     // no balance (O only on one side)
                            "Fe^3+ -> Fe"}) {                // charge cannot balance
        auto o = attempt([&] { return eng().balance(bad); });
        INFO("balance('" << bad << "')");
        REQUIRE_ENGINE_ERROR(o);  // engine/FUNCTIONS.md, RXNBALANCE: an error if no balance or more than one
        CHECK_FALSE(o.message.empty());
    }
}

TEST_CASE("report, source and version", "[behaviour]") {
    const auto rep = eng().report("2H2 + O2 = 2H2O");
    CHECK(rep.canonical == "2 H2(g) + O2(g) -> 2 H2O(l)");                 // rxnheat.hpp canonical form, engine/DATA.md, Phases
    CHECK(rep.dH_kJ_per_mol == Approx(eng().dh("2H2 + O2 = 2H2O")).margin(1e-9));  // consistency
    CHECK(rep.dU_kJ_per_mol == Approx(eng().du("2H2 + O2 = 2H2O")).margin(1e-9));  // consistency
    CHECK(rep.dn_gas == Approx(-3).margin(1e-12));                          // 0 − (2 + 1), counted by hand
    CHECK(rep.sources.size() >= 3);                                         // engine/DATA.md, Sources: every species carries its source
    const std::string src = eng().source(CH4_COMB);
    INFO(src);
    CHECK(contains(src, "CH4"));                   // engine/FUNCTIONS.md, RXNSOURCE: every number's source
    CHECK(contains(src, "H2O"));                   // engine/FUNCTIONS.md, RXNSOURCE
    CHECK((contains(src, "NASA") || contains(src, "McBride")));  // engine/DATA.md, Sources citation
    CHECK_FALSE(rxnheat::Engine::version().empty());  // engine/FUNCTIONS.md, RXNVERSION
}
