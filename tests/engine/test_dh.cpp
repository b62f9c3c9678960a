// ΔrH° and ΔrU° through the public API (rxnheat.hpp): Hess's-law relations (reverse, scale, the
// same species on both sides), ΔrU° = ΔrH° − Δn(gas)·R·T, results per species, energy units
// and temperatures as text. Outside references: see behaviour_helpers.hpp.
#include "behaviour_helpers.hpp"

#include <cmath>
#include <string>
#include <utility>
#include <vector>

using namespace rxnheat_test;

TEST_CASE("reverse flips the sign of the enthalpy", "[behaviour][hess]") {
    // Common practice (Hess's law): ΔH of the reverse reaction is −ΔH.
    const std::vector<std::pair<std::string, double>> cases = {
        {CH4_COMB, 298.15},
        {"CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000},
        {"N2(g) + 3 H2(g) -> 2 NH3(g)", 700},
        {"CaCO3(s) -> CaO(s) + CO2(g)", 1173},
        {"Fe2O3(s) + 3 CO(g) -> 2 Fe(s) + 3 CO2(g)", 1100},
        {"1/2 N2(g) + 3/2 H2(g) → NH3(g)", 500},
    };
    for (const auto& [r, T] : cases) {
        const std::string rev = eng().reverse(r);
        INFO(r << " reversed: " << rev);
        const double fwd = eng().dh(r, T);
        CHECK(eng().dh(rev, T) == Approx(-fwd).margin(1e-9));               // Hess's law, common practice
        CHECK(eng().du(rev, T) == Approx(-eng().du(r, T)).margin(1e-9));    // Hess's law, common practice
        CHECK(eng().dh(eng().reverse(rev), T) == Approx(fwd).margin(1e-9)); // reversing twice is the identity
    }
    // The products of the original come first in the reversed text (engine/FUNCTIONS.md, RXNREVERSE).
    const std::string rev = eng().reverse(CH4_COMB);
    const auto arrow = rev.find("->");
    REQUIRE(arrow != std::string::npos);
    CHECK(contains(rev.substr(0, arrow), "CO2(g)"));  // engine/FUNCTIONS.md, RXNREVERSE: products and reactants exchanged
    CHECK(contains(rev.substr(0, arrow), "H2O(l)"));  // engine/FUNCTIONS.md, RXNREVERSE
    CHECK(contains(rev.substr(arrow), "CH4(g)"));     // engine/FUNCTIONS.md, RXNREVERSE
}

TEST_CASE("scale multiplies the enthalpy and keeps exact fractions", "[behaviour][hess]") {
    // Common practice (Hess's law): ΔH scales with the coefficients.
    for (double f : {2.0, 0.5, 3.0, 0.25}) {
        const std::string s = eng().scale(CH4_COMB, f);
        INFO("factor " << f << ": " << s);
        CHECK(eng().dh(s) == Approx(f * eng().dh(CH4_COMB)).margin(1e-9));                      // Hess's law
        CHECK(eng().dh(s, 350) == Approx(f * eng().dh(CH4_COMB, 350)).margin(1e-9));  // Hess's law at 350 K
    }
    // Exact fractions (engine/FUNCTIONS.md, RXNSCALE: "exact fractions kept: 1/2 O2").
    const std::string half = eng().scale("2 H2(g) + O2(g) -> 2 H2O(l)", "1/2");
    INFO("scaled by 1/2: " << half);
    CHECK(contains(half, "1/2 O2(g)"));  // engine/FUNCTIONS.md, RXNSCALE
    CHECK_FALSE(contains(half, "0.5"));  // engine/FUNCTIONS.md, RXNSCALE: fractions, not decimals
    CHECK_FALSE(contains(half, "2 H2(g)"));  // 2 × 1/2 = 1 (arithmetic)
    CHECK(eng().scale("2 H2(g) + O2(g) -> 2 H2O(l)", "½") == half);  // grammar/SYNTAX.md: ½ is 1/2
    CHECK(eng().scale("2 H2(g) + O2(g) -> 2 H2O(l)", 0.5) == half);  // 0.5 is exactly 1/2 in binary
    const std::string third = eng().scale("N2(g) + 3 H2(g) -> 2 NH3(g)", "1/3");
    INFO("scaled by 1/3: " << third);
    CHECK(contains(third, "1/3 N2(g)"));   // engine/FUNCTIONS.md, RXNSCALE, exact rational 1 × 1/3
    CHECK(contains(third, "2/3 NH3(g)"));  // engine/FUNCTIONS.md, RXNSCALE, exact rational 2 × 1/3
    CHECK(eng().dh(third) == Approx(eng().dh("N2(g) + 3 H2(g) -> 2 NH3(g)") / 3).margin(1e-9));  // Hess's law
    // A zero or non-finite factor is no reaction: a clear error, not "0 N2".
    auto zero = attempt([] { return eng().scale("N2(g) + 3 H2(g) -> 2 NH3(g)", "0"); });
    REQUIRE_ENGINE_ERROR(zero);  // DEVELOPERS.md, Working rules: bad input gets a clear error
    auto nan = attempt([] { return eng().scale("N2(g) + 3 H2(g) -> 2 NH3(g)", std::nan("")); });
    REQUIRE_ENGINE_ERROR(nan);  // DEVELOPERS.md, Working rules: bad input gets a clear error
}

TEST_CASE("scale refuses a coefficient longer than the grammar reads back", "[behaviour]") {
    // grammar/SYNTAX.md: a number has at most 12 digits, and scale's text must read back.
    // 12 digits (1 × 999999999999) are written; 13 (2 × 999999999999 = 1999999999998, arithmetic)
    // are refused with the coefficient in the message.
    const std::string twelve = eng().scale("H2O(l) -> H2O(g)", "999999999999");
    CHECK(twelve == "999999999999 H2O(l) -> 999999999999 H2O(g)");
    auto longer = attempt([] { return eng().scale("2 N2(g) -> 4 N(g)", "999999999999"); });
    REQUIRE_ENGINE_ERROR(longer);
    CHECK(contains(longer.message, "would be 1999999999998"));
    // The same rule beyond 64 bits: 999999999999² = 999999999998000000000001 (arithmetic).
    auto squared = attempt([] { return eng().scale("999999999999 N2(g) -> 2 N(g)", "999999999999"); });
    REQUIRE_ENGINE_ERROR(squared);
    CHECK(contains(squared.message, "would be 999999999998000000000001"));
    // A fraction's denominator counts as well: 1/999999999999 × 1/2.
    auto denominator = attempt([] { return eng().scale("1/999999999999 N2(g) -> 2/999999999999 N(g)", "1/2"); });
    REQUIRE_ENGINE_ERROR(denominator);
    CHECK(contains(denominator.message, "would be 1/1999999999998"));
}

TEST_CASE("RXNDU is RXNDH minus dn(gas) R T", "[behaviour]") {
    // engine/FUNCTIONS.md, RXNDU: ΔrU° = ΔrH° − Δn(gas)·R·T; R from GNU units. Δn counted by hand below.
    // Tolerance 1e-4 kJ/mol: the difference between R = 8.314510 (NASA fits) and
    // 8.31446261815324 (SI) is below 3e-5 kJ/mol for these cases.
    struct Case { const char* r; double T; double dn; };
    const Case cases[] = {
        {CH4_COMB, 298.15, 1 - 3},                                       // 1 CO2 − (1 CH4 + 2 O2)
        {"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)", 1000, 3 - 3},          // gas water: Δn = 0
        {"H2(g) + 1/2 O2(g) -> H2O(l)", 298.15, -1.5},                   // −(1 + 1/2)
        {"N2(g) + 3 H2(g) -> 2 NH3(g)", 700, 2 - 4},
        {"CaCO3(s) -> CaO(s) + CO2(g)", 1173, 1},
        {"C(s) + CO2(g) -> 2 CO(g)", 1000, 2 - 1},
        {"CO(g) + H2O(g) -> CO2(g) + H2(g)", 700, 0},
    };
    for (const auto& c : cases) {
        INFO(c.r << " at " << c.T << " K, dn(gas) = " << c.dn);
        const double dh = eng().dh(c.r, c.T);
        CHECK(eng().du(c.r, c.T) == Approx(dh - c.dn * R_gnu() * c.T / 1000).margin(1e-4));  // engine/FUNCTIONS.md, RXNDU; R from GNU units
        CHECK(eng().report(c.r, c.T).dn_gas == Approx(c.dn).margin(1e-12));                  // counted by hand
    }
}

TEST_CASE("results per species: per mole and per mass of a species", "[behaviour][units]") {
    const auto pt = periodictable_masses({"CH4", "O2", "H2O", "CO2"});  // python3-periodictable
    const double dh = eng().dh(CH4_COMB);
    // Per mole of a species: ΔH/ν with ν its coefficient as written (engine/FUNCTIONS.md, RXNDH `per`).
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/mol", "CH4(g)") == Approx(dh / 1).margin(1e-9));  // engine/FUNCTIONS.md, RXNDH per: ν = 1
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/mol", "O2(g)") == Approx(dh / 2).margin(1e-9));   // engine/FUNCTIONS.md, RXNDH per: ν = 2
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/mol", "H2O(l)") == Approx(dh / 2).margin(1e-9));  // engine/FUNCTIONS.md, RXNDH per: ν = 2
    // Per mass: (kJ/mol)/(g/mol) = kJ/g = MJ/kg; molar masses from python3-periodictable.
    CHECK(eng().dh(CH4_COMB, 298.15, "MJ/kg", "CH4(g)") == Approx(dh / pt[0]).epsilon(1e-4));   // periodictable M(CH4)
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/kg", "CH4(g)") == Approx(dh / pt[0] * 1000).epsilon(1e-4));  // periodictable
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/g", "O2(g)") == Approx(dh / 2 / pt[1]).epsilon(1e-4));  // periodictable M(O2)
    CHECK(eng().dh(CH4_COMB, 298.15, "MJ/kg", "CO2(g)") == Approx(dh / pt[3]).epsilon(1e-4));    // periodictable M(CO2)
    CHECK(eng().dh(CH4_COMB, 298.15, "BTU/lb", "CH4(g)") ==
          Approx(dh / pt[0] * gnu_units("kJ/g", "btu/lb")).epsilon(1e-4));   // GNU units kJ/g -> btu/lb
    CHECK(eng().dh(CH4_COMB, 298.15, "kcal/kg", "CH4(g)") ==
          Approx(dh / pt[0] * gnu_units("kJ/g", "kcal/kg")).epsilon(1e-4));  // GNU units kJ/g -> kcal/kg
    // A per-mass unit without `per`, and a `per` species not in the reaction, are errors.
    auto no_per = attempt([] { return eng().dh(CH4_COMB, 298.15, "MJ/kg"); });
    REQUIRE_ENGINE_ERROR(no_per);  // engine/FUNCTIONS.md, RXNDH: per-mass units need `per`
    auto absent = attempt([] { return eng().dh(CH4_COMB, 298.15, "kJ/mol", "N2(g)"); });
    REQUIRE_ENGINE_ERROR(absent);  // engine/FUNCTIONS.md, RXNDH: `per` is a species of the reaction
}

TEST_CASE("energy-per-amount units against GNU units", "[behaviour][units]") {
    const double dh = eng().dh(CH4_COMB);
    CHECK(eng().dh(CH4_COMB, 298.15, "J/mol") == Approx(dh * gnu_units("kJ/mol", "J/mol")).epsilon(1e-12));     // GNU units
    CHECK(eng().dh(CH4_COMB, 298.15, "MJ/kmol") == Approx(dh * gnu_units("kJ/mol", "MJ/kmol")).epsilon(1e-12)); // GNU units
    CHECK(eng().dh(CH4_COMB, 298.15, "kcal/mol") == Approx(dh * gnu_units("kJ/mol", "kcal/mol")).epsilon(1e-10));  // GNU units (thermochemical cal)
    CHECK(eng().dh(CH4_COMB, 298.15, "cal/mol") == Approx(dh * gnu_units("kJ/mol", "cal/mol")).epsilon(1e-10));    // GNU units
    // lbmol = (lb/g) mol; GNU units has no "lbmol", so the conversion is spelled out.
    CHECK(eng().dh(CH4_COMB, 298.15, "BTU/lbmol") ==
          Approx(dh * gnu_units("kJ/mol", "btu / (lb/g) mol")).epsilon(1e-9));  // GNU units
    // Case matters where the trade says so: mJ is not MJ (engine/DATA.md, Units), and the error lists units.
    for (const char* bad : {"mJ/mol", "mj/kmol", "kj/mol", "KJ/mol", "kJ/kmol ", "kJ per mol", "furlong"}) {
        auto o = attempt([&] { return eng().dh(CH4_COMB, 298.15, bad); });
        INFO("unit '" << bad << "'");
        REQUIRE_ENGINE_ERROR(o);                    // engine/DATA.md, Units: unknown unit is an error
        CHECK(o.kind == ErrorKind::unit);           // engine/DATA.md, Units
        CHECK(contains(o.message, "kJ/mol"));       // engine/DATA.md, Units: the error lists the known ones
        CHECK(contains(o.message, "MJ/kmol"));      // engine/DATA.md, Units: the error lists the known ones
    }
}

TEST_CASE("the same species on both sides nets", "[behaviour]") {
    // grammar/SYNTAX.md: the same species on both sides is allowed (its net coefficient counts).
    for (double T : {298.15, 350.0}) {
        const double base = eng().dh(CH4_COMB, T);
        CHECK(eng().dh("CH4(g) + 2 O2(g) + 3.76 N2(g) -> CO2(g) + 2 H2O(l) + 3.76 N2(g)", T) == Approx(base).margin(1e-9));  // grammar/SYNTAX.md
        CHECK(eng().dh("CH4(g) + 3 O2(g) -> CO2(g) + 2 H2O(l) + O2(g)", T) == Approx(base).margin(1e-9));                   // grammar/SYNTAX.md
        CHECK(eng().du("CH4(g) + 3 O2(g) -> CO2(g) + 2 H2O(l) + O2(g)", T) == Approx(eng().du(CH4_COMB, T)).margin(1e-9));  // grammar/SYNTAX.md + engine/FUNCTIONS.md, RXNDU
    }
    CHECK(eng().load("CH4(g) + 3 O2(g) -> CO2(g) + 2 H2O(l) + O2(g)", 1, "mol", "O2(g)") ==
          Approx(eng().dh(CH4_COMB) / 2).epsilon(1e-9));  // net ν(O2) = 2
}

TEST_CASE("temperatures as text", "[behaviour][units]") {
    CHECK(rxnheat::parse_temperature("350 C") == Approx(gnu_units("tempC(350)", "K")).margin(1e-9));   // GNU units tempC
    CHECK(rxnheat::parse_temperature("350 °C") == Approx(gnu_units("tempC(350)", "K")).margin(1e-9));  // GNU units tempC
    CHECK(rxnheat::parse_temperature("662 F") == Approx(gnu_units("tempF(662)", "K")).margin(1e-9));   // GNU units tempF
    CHECK(rxnheat::parse_temperature("1100 R") == Approx(gnu_units("tempR(1100)", "K")).margin(1e-9)); // GNU units tempR
    CHECK(rxnheat::parse_temperature("623.15 K") == Approx(623.15).margin(1e-12));                     // engine/DATA.md, Units
    CHECK(rxnheat::parse_temperature("623.15") == Approx(623.15).margin(1e-12));                       // engine/DATA.md, Units: a bare number is kelvin
    for (const char* bad : {"", "hot", "350 X", "-5 K", "-300 C", "nan", "1e999", "350 C C"}) {
        auto o = attempt([&] { return rxnheat::parse_temperature(bad); });
        INFO("parse_temperature('" << bad << "') gave " << o.value);
        REQUIRE_ENGINE_ERROR(o);  // rxnheat.hpp: Error for anything else or below 0 K
    }
}
