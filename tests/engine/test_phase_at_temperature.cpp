// Phases as the engine takes them: a species written without a phase is the phase stable at the
// evaluation temperature and 1 bar; a charged species without a phase is aqueous; every text the
// engine writes names the phase used and keeps the charge.
#include <catch2/catch.hpp>

#include "rxnheat/rxnheat.hpp"

#include <string>

using rxnheat::Engine;

namespace {
Engine& eng() { return Engine::shared(); }
bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }
}  // namespace

TEST_CASE("no phase written: the stable phase at the evaluation temperature", "[phase]") {
    const char* shift = "CO + H2O -> CO2 + H2";
    // At 500 K water is steam at 1 bar. ΔrH°(500 K) of the water-gas shift with steam is
    // −39.8 kJ/mol (NIST-JANAF 4th ed. 1998: ΔfH°(500 K) CO −110.003, H2O(g) −243.826,
    // CO2 −393.666 kJ/mol, from memory), not the −4.5 kJ/mol that liquid water would give.
    CHECK(eng().dh(shift, 500) == Approx(-39.84).margin(0.1));
    CHECK(eng().dh(shift, 500) == eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 500));  // the same data
    CHECK(eng().report(shift, 500).canonical == "CO(g) + H2O(g) -> CO2(g) + H2(g)");
    // At 298.15 K the stable phase of water is the liquid (CODATA: −285.830 kJ/mol, so ΔrH° is
    // −393.51 + 285.83 + 110.53 = +2.85 kJ/mol, Cox et al. 1989, from memory).
    CHECK(eng().dh(shift) == eng().dh("CO(g) + H2O(l) -> CO2(g) + H2(g)"));
    CHECK(eng().dh(shift) == Approx(2.85).margin(0.05));
    CHECK(eng().report(shift).canonical == "CO(g) + H2O(l) -> CO2(g) + H2(g)");
    // Either side of the normal boiling point (373.12 K at 1 bar, NIST, from memory).
    CHECK(contains(eng().report("H2 + 1/2 O2 -> H2O", 372).canonical, "H2O(l)"));
    CHECK(contains(eng().report("H2 + 1/2 O2 -> H2O", 374.5).canonical, "H2O(g)"));
    // Every report says which phase was used, and why.
    CHECK(contains(eng().source(shift, 500), "H2O(g)"));
    CHECK(contains(eng().source(shift, 500), "lowest G"));
    // The load of a shift converter at 250 °C: 7600 Nm3/h of CO (invented duty, engine numbers
    // compared with the explicit-phase form).
    CHECK(eng().load(shift, 7600, "Nm3/h", "CO", "kW", 523.15) ==
          eng().load("CO(g) + H2O(g) -> CO2(g) + H2(g)", 7600, "Nm3/h", "CO", "kW", 523.15));
    // ΔrU° counts the moles of gas at T: at 500 K, Δn(gas) = 0 for the shift.
    CHECK(eng().report(shift, 500).dn_gas == 0);
    CHECK(eng().report(shift).dn_gas == 1);  // liquid water at 298.15 K: 2 mol of gas out, 1 in
}

TEST_CASE("a written liquid above its boiling point is kept, and said", "[phase]") {
    // Pressurised liquid water at 400 K is allowed (the NASA Glenn liquid record reaches 600 K).
    CHECK_NOTHROW(eng().dh("H2O(l) -> H2O(g)", 400));
    CHECK(contains(eng().source("H2O(l) -> H2O(g)", 400), "above its 1-bar boiling point"));
    CHECK_FALSE(contains(eng().source("H2O(l) -> H2O(g)", 350), "above its 1-bar boiling point"));
    // Outside the liquid record's range it is an error naming the range, never an extrapolation.
    CHECK_THROWS_WITH(eng().dh("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)", 623.15), Catch::Contains("273.15–600 K"));
}

TEST_CASE("a charged species written without a phase is aqueous", "[phase][ions]") {
    // H+ + OH- -> H2O is the neutralisation, never the gas-phase ion reaction (−1676.8 kJ/mol):
    // −55.815 kJ/mol from the built-in aqueous table (CODATA Key Values, Cox et al. 1989:
    // ΔfH° OH−(aq) −230.015, H2O(l) −285.830; from memory).
    CHECK(eng().dh("H+ + OH- -> H2O") == Approx(-55.815).margin(0.001));
    CHECK(eng().report("H+ + OH- -> H2O").canonical == "H+(aq) + OH-(aq) -> H2O(l)");
    // An ion the aqueous table does not hold is still taken as aqueous, and the error says so and
    // how to write the gas-phase ion.
    const std::string why = eng().check("Au+ + Cl- -> AuCl(s)");
    CHECK(contains(why, "taken as aqueous"));
    CHECK(contains(why, "data/aqueous.csv"));
    CHECK(contains(why, "(g)"));
    CHECK_THROWS_AS(eng().dh("Au+ + Cl- -> AuCl(s)"), rxnheat::Error);
    // With aqueous rows in a user table the rows are used (they give the same value here).
    const auto ions = rxnheat::SpeciesTable::from_rows({
        {"formula", "phase", "dHf"},
        {"H+", "aq", "0"},
        {"OH-", "aq", "-230.015"},
    });
    CHECK(eng().dh("H+ + OH- -> H2O", {298.15, &ions}) == Approx(-55.815).margin(0.001));
    CHECK(eng().report("H+ + OH- -> H2O", {298.15, &ions}).canonical == "H+(aq) + OH-(aq) -> H2O(l)");
    // A gas-phase ion is written with (g); its label keeps the charge.
    CHECK(eng().species_report("H+(g)").species == "H+(g)");
    CHECK(contains(eng().source("H+(g)"), "H+(g)"));
}

TEST_CASE("the species report prints what the data have", "[phase][species]") {
    // Water with no phase at 500 K is the gas (NASA Glenn record 'H2O', 200–6000 K).
    const auto r = eng().species_report("H2O", 500);
    CHECK(r.species == "H2O(g)");
    CHECK(r.record == "H2O");
    CHECK(r.has_heat_capacity);
    // ΔfH° of H2O(g) at 298.15 K: −241.826 kJ/mol (CODATA Key Values, Cox et al. 1989).
    CHECK(r.dHf_kJ_per_mol == Approx(-241.826).margin(0.001));
}
