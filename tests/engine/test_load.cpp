// RXNLOAD through the public API (rxnheat.hpp): amounts, masses, normal volumes, flows and result
// units against GNU units and python3-periodictable (see behaviour_helpers.hpp).
#include "behaviour_helpers.hpp"

#include <cmath>
#include <functional>
#include <vector>

using namespace rxnheat_test;

TEST_CASE("RXNLOAD for amounts, masses, normal volumes and flows", "[behaviour][units][load]") {
    const auto pt = periodictable_masses({"CH4", "CO2", "O2"});  // python3-periodictable
    const double dh = eng().dh(CH4_COMB);  // kJ per mol of extent; ν(CH4) = 1, ν(CO2) = 1, ν(O2) = 2
    const double R = R_gnu();
    const double s_per_h = gnu_units("hour", "s");
    const double s_per_d = gnu_units("day", "s");

    // Totals (default kJ).
    CHECK(eng().load(CH4_COMB, 2.5, "mol", "CH4(g)") == Approx(2.5 * dh).epsilon(1e-9));   // ΔH·n/ν, ν = 1
    CHECK(eng().load(CH4_COMB, 2.5, "mol", "O2(g)") == Approx(2.5 * dh / 2).epsilon(1e-9)); // ΔH·n/ν, ν = 2
    CHECK(eng().load(CH4_COMB, 3, "kmol", "CH4(g)") == Approx(3 * gnu_units("kmol", "mol") * dh).epsilon(1e-9));  // GNU units kmol
    CHECK(eng().load(CH4_COMB, 3, "lbmol", "CH4(g)") == Approx(3 * gnu_units("lb", "g") * dh).epsilon(1e-9));     // lbmol = (lb/g) mol, GNU units lb
    CHECK(eng().load(CH4_COMB, 16, "g", "CH4(g)") == Approx(16 / pt[0] * dh).epsilon(1e-4));                     // periodictable M
    CHECK(eng().load(CH4_COMB, 2, "kg", "CO2(g)") == Approx(2 * gnu_units("kg", "g") / pt[1] * dh).epsilon(1e-4));  // GNU units, periodictable
    CHECK(eng().load(CH4_COMB, 2, "t", "CH4(g)") == Approx(2 * gnu_units("tonne", "g") / pt[0] * dh).epsilon(1e-4));  // GNU units tonne
    CHECK(eng().load(CH4_COMB, 2, "lb", "CH4(g)") == Approx(2 * gnu_units("lb", "g") / pt[0] * dh).epsilon(1e-4));    // GNU units lb
    // Normal volume: 0 °C and 101.325 kPa, ideal gas n = pV/(RT) (engine/DATA.md, Units).
    const double n_Nm3 = gnu_units("atm", "Pa") * 1.0 / (R * gnu_units("tempC(0)", "K"));
    CHECK(eng().load(CH4_COMB, 100, "Nm3", "CH4(g)") == Approx(100 * n_Nm3 * dh).epsilon(1e-6));  // ideal gas from R, GNU units
    // scf: 60 °F and 14.696 psia (engine/DATA.md, Units).
    const double n_scf = gnu_units("14.696 psi", "Pa") * gnu_units("ft3", "m3") / (R * gnu_units("tempF(60)", "K"));
    CHECK(eng().load(CH4_COMB, 1000, "scf", "CH4(g)") == Approx(1000 * n_scf * dh).epsilon(1e-6));  // ideal gas from R, GNU units

    // Rates (default kW = kJ/s).
    CHECK(eng().load(CH4_COMB, 10, "kmol/h", "CH4(g)") == Approx(10 * gnu_units("kmol/hour", "mol/s") * dh).epsilon(1e-9));  // GNU units
    CHECK(eng().load(CH4_COMB, 10, "mol/s", "CH4(g)") == Approx(10 * dh).epsilon(1e-9));                                 // definition
    CHECK(eng().load(CH4_COMB, 60, "mol/min", "CH4(g)") == Approx(60 * gnu_units("1/min", "1/s") * dh).epsilon(1e-9));  // GNU units
    CHECK(eng().load(CH4_COMB, 1000, "kg/h", "CH4(g)") == Approx(1000 * gnu_units("kg/hour", "g/s") / pt[0] * dh).epsilon(1e-4));  // GNU units, periodictable
    CHECK(eng().load(CH4_COMB, 24, "t/d", "CO2(g)") == Approx(24 * gnu_units("tonne/day", "g/s") / pt[1] * dh).epsilon(1e-4));    // GNU units, periodictable
    CHECK(eng().load(CH4_COMB, 500, "Nm3/h", "CH4(g)") == Approx(500 * n_Nm3 / s_per_h * dh).epsilon(1e-6));  // ideal gas, GNU units
    CHECK(eng().load(CH4_COMB, 1e6, "scf/d", "CH4(g)") == Approx(1e6 * n_scf / s_per_d * dh).epsilon(1e-6)); // ideal gas, GNU units
    CHECK(eng().load(CH4_COMB, 1e6, "scf/d", "O2(g)") == Approx(1e6 * n_scf / s_per_d * dh / 2).epsilon(1e-6)); // ΔH·n/ν, ν = 2

    // Result units.
    const double kW = eng().load(CH4_COMB, 10, "kmol/h", "CH4(g)");
    struct RU { const char* unit; const char* gnu; };
    const RU rates[] = {{"W", "W"}, {"MW", "MW"}, {"kcal/h", "kcal/hr"}, {"BTU/h", "btu/hr"},
                        {"MMBTU/h", "1e6 btu/hr"}, {"TR", "tonref"}};
    for (const auto& u : rates) {
        INFO("rate unit " << u.unit);
        CHECK(eng().load(CH4_COMB, 10, "kmol/h", "CH4(g)", u.unit) == Approx(kW * gnu_units("kW", u.gnu)).epsilon(1e-9));  // GNU units
    }
    const double kJ = eng().load(CH4_COMB, 3, "kmol", "CH4(g)");
    const RU totals[] = {{"J", "J"}, {"MJ", "MJ"}, {"GJ", "GJ"}, {"kWh", "kWh"}, {"MWh", "MWh"},
                         {"kcal", "kcal"}, {"BTU", "btu"}, {"MMBTU", "1e6 btu"}, {"therm", "therm"}};
    for (const auto& u : totals) {
        INFO("total unit " << u.unit);
        CHECK(eng().load(CH4_COMB, 3, "kmol", "CH4(g)", u.unit) == Approx(kJ * gnu_units("kJ", u.gnu)).epsilon(1e-9));  // GNU units
    }
    // Temperature argument: the load follows ΔH(T).
    CHECK(eng().load("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)", 5, "mol", "CH4(g)", "kJ", 1000) ==
          Approx(5 * eng().dh("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)", 1000)).epsilon(1e-9));  // ΔH(T)·n/ν

    // Mismatched or unknown units and bad keys are errors.
    for (auto f : std::vector<std::function<double()>>{
             [] { return eng().load(CH4_COMB, 1, "kmol/h", "CH4(g)", "kJ"); },      // a total unit for a flow
             [] { return eng().load(CH4_COMB, 1, "kmol", "CH4(g)", "kW"); },        // a power unit for a total
             [] { return eng().load(CH4_COMB, 1, "kmol/week", "CH4(g)"); },         // not a time unit of engine/DATA.md, Units
             [] { return eng().load(CH4_COMB, 1, "KMOL", "CH4(g)"); },              // case matters
             [] { return eng().load(CH4_COMB, 1, "", "CH4(g)"); },                  // no unit
             [] { return eng().load(CH4_COMB, 1, "kmol", "N2(g)"); },               // key not in the reaction
             [] { return eng().load(CH4_COMB, 1, "kmol", ""); },                    // no key
             [] { return eng().load(CH4_COMB, std::nan(""), "kmol", "CH4(g)"); },   // NaN quantity
             [] { return eng().load(CH4_COMB, INFINITY, "kmol", "CH4(g)"); },       // infinite quantity
         }) {
        auto o = attempt(f);
        REQUIRE_ENGINE_ERROR(o);  // DEVELOPERS.md, Working rules: clear error, never a plausible number
    }
}
