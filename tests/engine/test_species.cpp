// Species through the public API (rxnheat.hpp): phase rules, out-of-range temperatures, ambiguous
// compositions and aliases, molar masses against python3-periodictable, user species tables.
#include "behaviour_helpers.hpp"

#include <algorithm>
#include <cmath>
#include <functional>
#include <string>
#include <utility>
#include <vector>

using namespace rxnheat_test;

TEST_CASE("phase rules", "[behaviour][phase]") {
    // engine/DATA.md, Phases: no phase = the phase stable at the evaluation temperature (here
    // 298.15 K) and 1 bar.
    CHECK(eng().species_report("H2O").record == "H2O(L)");   // engine/DATA.md, Phases: H2O liquid
    CHECK(eng().species_report("H2O").species == "H2O(l)");  // engine/DATA.md, Phases
    CHECK(eng().species_report("CO2").record == "CO2");      // engine/DATA.md, Phases: CO2 gas
    CHECK(eng().species_report("H2").record == "H2");        // engine/DATA.md, Phases: H2 gas
    CHECK(eng().species_report("O2").record == "O2");        // engine/DATA.md, Phases: O2 gas
    CHECK(eng().species_report("C").record == "C(gr)");      // engine/DATA.md, Phases: C graphite
    CHECK(eng().species_report("C(s)").record == "C(gr)");   // only solid record of carbon in thermo.inp
    CHECK(eng().species_hf("H2O") == Approx(eng().species_hf("H2O(l)")).margin(1e-12));  // engine/DATA.md, Phases
    CHECK(eng().dh("2H2 + O2 = 2H2O") == Approx(2 * eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)")).margin(1e-9));  // grammar/SYNTAX.md example + engine/DATA.md, Phases
    // engine/DATA.md, Phases: (s) picks the record whose range holds T: alpha iron at 298 K, gamma at 1300 K.
    CHECK(eng().species_report("Fe(s)", 298.15).record == "Fe(a)");  // engine/DATA.md, Phases, thermo.inp Fe(a) 200–1184 K
    CHECK(eng().species_report("Fe(s)", 1100).record == "Fe(a)");    // thermo.inp Fe(a) second record 1042–1184 K
    CHECK(eng().species_report("Fe(s)", 1300).record == "Fe(c)");    // engine/DATA.md, Phases, thermo.inp Fe(c) 1184–1665 K
    CHECK(eng().species_report("Fe(s)", 1700).record == "Fe(d)");    // thermo.inp Fe(d) 1665–1809 K
    CHECK(eng().species_report("Fe(cr)", 1300).record == "Fe(c)");   // grammar/SYNTAX.md: (cr) is a synonym of (s)
    {
        auto ice = attempt([] { return eng().species_report("H2O(s)", 250).record; });
        INFO("species_report(\"H2O(s)\", 250): " << ice.text << ice.message);
        CHECK(ice.text == "H2O(cr)");  // thermo.inp H2O(cr) ice 200–273.15 K; engine/DATA.md, Phases (s) at T
    }
    // Sensible heat across the alpha→gamma change includes the transition (rxnheat.hpp species_h).
    const double through = eng().species_h("Fe(s)", 1300);
    CHECK(through > eng().species_h("Fe(s)", 1184 - 1e-6));  // H rises through the transition (physics)
}

TEST_CASE("out-of-range temperatures are errors naming the range", "[behaviour][range]") {
    struct Case { std::function<double()> f; const char* what; std::vector<std::string> mentions; };
    const std::vector<Case> cases = {
        {[] { return eng().species_h("H2O(l)", 1000); }, "H2O(l) at 1000 K", {"273.15", "600"}},       // thermo.inp H2O(L) 273.150–600.000
        {[] { return eng().dh(CH4_COMB, 1000); }, "CH4 combustion to H2O(l) at 1000 K", {"600"}},       // thermo.inp H2O(L)
        {[] { return eng().species_h("CH4(g)", 150); }, "CH4(g) at 150 K", {"200"}},                    // thermo.inp CH4 200–6000 K
        {[] { return eng().species_cp("N2(g)", 100); }, "N2(g) at 100 K", {"200"}},                     // thermo.inp N2 200–20000 K
        {[] { return eng().dh("N2(g) + 3 H2(g) -> 2 NH3(g)", 199.9); }, "NH3 synthesis at 199.9 K", {"200"}},  // thermo.inp 200 K lower limit
        {[] { return eng().species_hf("CH4(g)", 7000); }, "CH4(g) at 7000 K", {"6000"}},                // thermo.inp CH4 up to 6000 K
        {[] { return eng().species_h("Fe(s)", 2000); }, "Fe(s) at 2000 K (melts at 1809 K)", {"1809"}}, // thermo.inp Fe(d) up to 1809 K
        {[] { return eng().species_h("H2O(s)", 300); }, "ice at 300 K", {"273.15"}},                   // thermo.inp H2O(cr) up to 273.15 K
    };
    for (const auto& c : cases) {
        auto o = attempt(c.f);
        INFO(c.what << ": " << o.message);
        REQUIRE_ENGINE_ERROR(o);                       // engine/DATA.md, Phases: never an extrapolation
        CHECK(o.kind == ErrorKind::out_of_range);      // rxnheat.hpp ErrorKind::out_of_range
        for (const auto& m : c.mentions) CHECK(contains(o.message, m));  // engine/DATA.md, Phases: the error names the range
    }
    // Just inside the limits works (thermo.inp ranges).
    CHECK(std::isfinite(eng().species_h("CH4(g)", 200)));     // thermo.inp CH4 from 200 K
    CHECK(std::isfinite(eng().species_h("H2O(l)", 600)));     // thermo.inp H2O(L) to 600 K
    CHECK(std::isfinite(eng().species_h("H2O(l)", 273.15)));  // thermo.inp H2O(L) from 273.15 K
}

TEST_CASE("ambiguous compositions list the candidates, and names come from the alias table", "[behaviour][identity]") {
    {
        auto o = attempt([] { return eng().species_hf("C3H6(g)"); });
        INFO(o.message);
        REQUIRE_ENGINE_ERROR(o);
        CHECK(o.kind == ErrorKind::ambiguous_species);  // engine/DATA.md, Identity
        CHECK(contains(o.message, "propylene"));        // engine/DATA.md, Identity example
        CHECK(contains(o.message, "cyclopropane"));     // engine/DATA.md, Identity example
        CHECK(eng().check("C3H6(g) + 9/2 O2(g) -> 3 CO2(g) + 3 H2O(l)") == o.message);  // engine/FUNCTIONS.md, RXNCHECK: same diagnosis
    }
    {
        auto o = attempt([] { return eng().dh("C4H10(g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)"); });
        INFO(o.message);
        REQUIRE_ENGINE_ERROR(o);
        CHECK(o.kind == ErrorKind::ambiguous_species);  // engine/DATA.md, Identity: n-butane and isobutane share C4H10
        CHECK(contains(o.message, "butane"));           // engine/DATA.md, Identity: lists the candidates
    }
    // Alias names pick the right record (thermo.inp headers, ΔfH° in J/mol).
    CHECK(eng().species_hf("ethanol(l)") == Approx(-277.510).margin(0.005));     // thermo.inp C2H5OH(L): -277510.000
    CHECK(eng().species_hf("ethanol(g)") == Approx(-234.950).margin(0.005));     // thermo.inp C2H5OH: -234950.000
    CHECK(eng().species_hf("propylene(g)") == Approx(20.000).margin(0.005));     // thermo.inp C3H6,propylene: 20000.000
    CHECK(eng().species_hf("cyclopropane(g)") == Approx(53.300).margin(0.005));  // thermo.inp C3H6,cyclo-: 53300.000
    CHECK(eng().species_hf("methanol(l)") == Approx(-238.910).margin(0.005));    // thermo.inp CH3OH(L): -238910.000
    CHECK(eng().species_hf("n-butane(g)") == Approx(-125.790).margin(0.005));    // thermo.inp C4H10,n-butane: -125790.000
    // The formula as written matches the data's own formula (engine/DATA.md, Identity: C2H5OH vs CH3OCH3).
    CHECK(eng().dh("ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)") ==
          Approx(eng().dh("C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)")).margin(1e-9));  // engine/DATA.md, Identity
    CHECK(eng().species_hf("C2H5OH(g)") != Approx(eng().species_hf("CH3OCH3(g)")).margin(1.0));  // engine/DATA.md, Identity: isomers differ
    // Unknown names are errors.
    auto o = attempt([] { return eng().species_hf("unobtainium(s)"); });
    REQUIRE_ENGINE_ERROR(o);                          // engine/DATA.md, Identity
    CHECK(o.kind == ErrorKind::unknown_species);      // rxnheat.hpp ErrorKind::unknown_species
}

TEST_CASE("molar masses against python3-periodictable", "[behaviour][molar-mass]") {
    // rxnheat formula, periodictable formula (its syntax: hydrates as groups, no brackets).
    const std::vector<std::pair<std::string, std::string>> f = {
        {"H2O", "H2O"}, {"CO2", "CO2"}, {"CH4", "CH4"}, {"C2H5OH", "C2H5OH"}, {"C8H18", "C8H18"},
        {"NaCl", "NaCl"}, {"CaCO3", "CaCO3"}, {"Ca(OH)2", "Ca(OH)2"}, {"Ca3(PO4)2", "Ca3(PO4)2"},
        {"CuSO4·5H2O", "CuSO4(H2O)5"}, {"CuSO4*5H2O", "CuSO4(H2O)5"}, {"K4[Fe(CN)6]", "K4(Fe(CN)6)"},
        {"K3[Fe(CN)6]", "K3(Fe(CN)6)"}, {"[Cu(NH3)4]SO4", "(Cu(NH3)4)SO4"}, {"Al2(SO4)3", "Al2(SO4)3"},
        {"Fe2O3", "Fe2O3"}, {"Fe3O4", "Fe3O4"}, {"Mg(OH)2", "Mg(OH)2"}, {"(NH4)2SO4", "(NH4)2SO4"},
        {"NH4NO3", "NH4NO3"}, {"H2SO4", "H2SO4"}, {"HNO3", "HNO3"}, {"KMnO4", "KMnO4"},
        {"K2Cr2O7", "K2Cr2O7"}, {"C6H12O6", "C6H12O6"}, {"C12H22O11", "C12H22O11"},
        {"Na2CO3·10H2O", "Na2CO3(H2O)10"}, {"MgSO4·7H2O", "MgSO4(H2O)7"}, {"CaSO4·2H2O", "CaSO4(H2O)2"},
        {"Ba(OH)2·8H2O", "Ba(OH)2(H2O)8"}, {"Na2B4O7·10H2O", "Na2B4O7(H2O)10"},
        {"Fe0.947O", "Fe0.947O"}, {"CH1.95", "CH1.95"}, {"UO2", "UO2"}, {"Pb(NO3)2", "Pb(NO3)2"},
        {"AgNO3", "AgNO3"}, {"Hg2Cl2", "Hg2Cl2"}, {"CH3COOH", "CH3COOH"}, {"CCl4", "CCl4"},
        {"SF6", "SF6"}, {"WC", "WC"}, {"LiAlH4", "LiAlH4"}, {"Al2O3", "Al2O3"}, {"SiO2", "SiO2"},
        {"TiO2", "TiO2"}, {"Ca5(PO4)3OH", "Ca5(PO4)3OH"}, {"(CH3)3COH", "(CH3)3COH"},
        {"Mg3Si4O10(OH)2", "Mg3Si4O10(OH)2"}, {"Al2Si2O5(OH)4", "Al2Si2O5(OH)4"}, {"Co", "Co"},
    };
    std::vector<std::string> pt_names;
    for (const auto& p : f) pt_names.push_back(p.second);
    const auto ref = periodictable_masses(pt_names);  // python3-periodictable (IUPAC atomic weights)
    double worst_abs = 0, worst_rel = 0;
    std::string worst;
    for (std::size_t i = 0; i < f.size(); ++i) {
        auto o = attempt([&] { return eng().molar_mass(f[i].first); });
        INFO(f[i].first << ": engine " << o.value << ", periodictable " << ref[i] << " " << o.message);
        REQUIRE(o.returned);
        const double tol = std::max(0.01, 1e-4 * ref[i]);  // 0.01 g/mol or 1e-4 relative
        CHECK(o.value == Approx(ref[i]).margin(tol));      // python3-periodictable
        const double d = std::fabs(o.value - ref[i]);
        if (d / ref[i] > worst_rel) { worst_rel = d / ref[i]; worst_abs = d; worst = f[i].first; }
    }
    WARN("molar mass: worst difference from periodictable " << worst_abs << " g/mol (" << worst_rel
         << " relative) for " << worst << " over " << f.size() << " formulas");
    // A phase is allowed and ignored (rxnheat.hpp molar_mass).
    CHECK(eng().molar_mass("H2O(l)") == Approx(eng().molar_mass("H2O")).margin(1e-12));            // rxnheat.hpp
    CHECK(eng().molar_mass("CuSO4·5H2O(s)") == Approx(eng().molar_mass("CuSO4*5H2O")).margin(1e-12)); // rxnheat.hpp
    CHECK(eng().molar_mass("Co") != Approx(eng().molar_mass("CO")).margin(1.0));  // grammar/SYNTAX.md: Co ≠ CO
    // Not a formula: errors.
    for (const char* bad : {"", "Xx2", "H2O)", "co2", "2H2O + O2", "((((", "H-1"}) {
        auto o = attempt([&] { return eng().molar_mass(bad); });
        INFO("molar_mass('" << bad << "') value " << o.value);
        REQUIRE_ENGINE_ERROR(o);  // grammar/SYNTAX.md: only real element symbols; DEVELOPERS.md, Working rules: clear errors
    }
}

TEST_CASE("user species tables", "[behaviour][usertable]") {
    // engine/DATA.md, User tables. A constant-cp species: H(T) − H(298.15) = cp·(T − 298.15) exactly.
    const auto t = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf", "cp", "tmin", "tmax", "name", "source"},
                                                     {"XeF6", "g", "-279", "120", "250", "600", "xenon hexafluoride", "demo row"}});
    CHECK(eng().species_hf("XeF6(g)", {298.15, &t}, "kJ/mol") == Approx(-279).margin(1e-9));         // the table row
    CHECK(eng().species_h("XeF6(g)", {400, &t}, 298.15) == Approx(0.120 * (400 - 298.15)).margin(1e-9));  // integral of a constant cp
    CHECK(eng().dh("Xe(g) + 3 F2(g) -> XeF6(g)", {298.15, &t}, "kJ/mol") == Approx(-279).margin(1e-6));  // elements are zero
    // Shomate form (NIST WebBook N2, 100–500 K: A 28.98641, B 1.853978, C −9.647459, D 16.63537,
    // E 0.000117, from memory), overriding the built-in N2(g): H(500) − H(298.15) from the
    // closed-form integral, and ≈ 5.912 kJ/mol (NIST-JANAF, from memory).
    const double A = 28.98641, B = 1.853978, C = -9.647459, D = 16.63537, E = 0.000117;
    auto sh = [&](double T) { const double x = T / 1000; return A * x + B * x * x / 2 + C * x * x * x / 3 + D * x * x * x * x / 4 - E / x; };
    const auto n2 = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf", "a", "b", "c", "d", "e", "tmin", "tmax"},
                                                      {"N2", "g", "0", "28.98641", "1.853978", "-9.647459", "16.63537", "0.000117", "100", "500"}});
    CHECK(eng().species_h("N2(g)", {500, &n2}, 298.15) == Approx(sh(500) - sh(298.15)).margin(1e-6));  // Shomate integral (NIST form)
    CHECK(eng().species_h("N2(g)", {500, &n2}, 298.15) == Approx(5.912).margin(0.01));                 // NIST-JANAF, from memory
    auto out = attempt([&] { return eng().species_h("N2(g)", {600, &n2}, 298.15); });
    REQUIRE_ENGINE_ERROR(out);  // engine/DATA.md, Phases and User tables: outside tmax is an error
    // Overriding built-in data (engine/DATA.md, User tables: rows override the same formula and phase).
    const auto w = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf"}, {"H2O", "l", "-300"}});
    CHECK(eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)", {298.15, &w}, "kJ/mol") == Approx(-300).margin(1e-6));  // the table row
    CHECK(eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)") == Approx(-285.83).margin(0.01));  // built-in unchanged (CODATA, from memory)
    // A malformed table names the row and the column (engine/DATA.md, User tables).
    auto bad = attempt([] {
        rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf"}, {"H2O", "l", "-300"}, {"CO", "g", "abc"}});
        return 0.0;
    });
    INFO(bad.message);
    REQUIRE_ENGINE_ERROR(bad);
    CHECK(bad.kind == ErrorKind::table);  // rxnheat.hpp ErrorKind::table
    CHECK(contains(bad.message, "3"));    // row 3 (header = row 1)
    CHECK(contains(bad.message, "dHf"));  // the column
    auto missing = attempt([] { rxnheat::SpeciesTable::from_rows({{"formula", "phase"}, {"CO", "g"}}); return 0.0; });
    REQUIRE_ENGINE_ERROR(missing);  // engine/DATA.md, User tables: dHf is required
}
