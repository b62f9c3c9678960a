// FUELHV (Engine::heating_value and its catalogue row): heating values of fuels and fuel-gas
// mixtures from complete-combustion reactions built from each species' formula.
//
// Outside references (each named beside its check):
//  - standard enthalpies of combustion ΔcH° at 298.15 K as the NIST Chemistry WebBook (SRD 69)
//    lists them, typed from memory; for H2, CO and graphite the CODATA Key Values (Cox et al.
//    1989) ΔfH° of H2O(l), CO2(g), CO(g), from memory;
//  - heating values per kg as engineering handbooks print them, from memory (3–4 figures);
//  - ideal-gas gross and net heating values per scf at 60 °F and 14.696 psia of GPA Standard 2145
//    (Table of Physical Properties for Hydrocarbons), from memory;
//  - GNU units (Debian `units`) for every unit factor: R, the metering conditions, BTU, lb, ft³;
//  - molar masses from python3-periodictable (IUPAC atomic weights).
// The LHV is derived from the published HHV with ΔvapH° of water at 298.15 K = 44.004 kJ/mol
// (CODATA Key Values: ΔfH° H2O(g) −241.826, H2O(l) −285.830 kJ/mol, from memory), as handbooks
// derive it: LHV = HHV − (moles of H2O formed) × 44.004 kJ/mol.
#include "behaviour_helpers.hpp"

#include <rxnheat/catalogue.hpp>

#include <cmath>
#include <string>
#include <vector>

using namespace rxnheat_test;
using rxnheat::FeedItem;

namespace {

constexpr double water_vaporisation_kJ = 285.830 - 241.826;  // CODATA Key Values, from memory

struct Published {
    const char* species;    // as a user writes it
    const char* formula;    // for python3-periodictable
    double hhv_kJ_per_mol;  // −ΔcH° at 298.15 K, water liquid
    double water_mol;       // H2O formed per mole
    double tolerance;       // relative, on kJ/mol
    const char* source;
};

// NASA Glenn's ΔfH° (the engine's data) and the calorimetric values behind the WebBook agree to
// a few tenths of a kJ/mol for these; 0.1 % is well above that and well below any real error
// (the wrong water phase is 5 to 10 %, a wrong phase of the fuel 3 to 5 %).
const std::vector<Published> published = {
    {"CH4(g)", "CH4", 890.7, 2, 1e-3, "NIST WebBook ΔcH°gas methane −890.7 kJ/mol, from memory"},
    {"C2H6(g)", "C2H6", 1560.7, 3, 1e-3, "NIST WebBook ΔcH°gas ethane −1560.7 kJ/mol, from memory"},
    {"C3H8(g)", "C3H8", 2219.2, 4, 1e-3, "NIST WebBook ΔcH°gas propane −2219.2 kJ/mol, from memory"},
    {"n-butane", "C4H10", 2877.6, 5, 1e-3, "NIST WebBook ΔcH°gas n-butane −2877.6 kJ/mol, from memory"},
    {"H2(g)", "H2", 285.83, 1, 1e-3, "CODATA Key Values ΔfH° H2O(l) −285.83 kJ/mol, from memory"},
    {"CO(g)", "CO", 282.98, 0, 1e-3,
     "CODATA Key Values ΔfH° CO2(g) −393.51, CO(g) −110.53 kJ/mol, from memory"},
    {"CH3OH(l)", "CH4O", 726.1, 2, 1.5e-3, "NIST WebBook ΔcH°liquid methanol −726.1 kJ/mol, from memory"},
    {"C2H5OH(l)", "C2H6O", 1366.8, 3, 1.5e-3, "NIST WebBook ΔcH°liquid ethanol −1366.8 kJ/mol, from memory"},
    {"C(s)", "C", 393.51, 0, 1e-3, "CODATA Key Values ΔfH° CO2(g) −393.51 kJ/mol (graphite), from memory"},
};

double rel_diff(double a, double b) { return std::fabs(a - b) / std::fabs(b); }

double hv(const std::string& species, const char* basis, const char* unit) {
    return eng().heating_value(species, basis, unit);
}

}  // namespace

TEST_CASE("FUELHV: pure fuels against published enthalpies of combustion", "[fuel]") {
    std::vector<std::string> formulas;
    for (const auto& p : published) formulas.push_back(p.formula);
    const std::vector<double> M = periodictable_masses(formulas);  // python3-periodictable
    for (std::size_t i = 0; i < published.size(); ++i) {
        const Published& p = published[i];
        const std::string species = p.species;
        const double hhv = hv(species, "HHV", "kJ/mol");
        const double lhv = hv(species, "LHV", "kJ/mol");
        const double lhv_published = p.hhv_kJ_per_mol - p.water_mol * water_vaporisation_kJ;
        INFO(p.species << ": HHV " << hhv << " kJ/mol against " << p.hhv_kJ_per_mol << " (" << p.source << "); LHV "
                       << lhv << " against " << lhv_published);
        CHECK(rel_diff(hhv, p.hhv_kJ_per_mol) <= p.tolerance);
        CHECK(rel_diff(lhv, lhv_published) <= p.tolerance);
        // Per kg: the same per mole over the molar mass (python3-periodictable), to the difference of
        // its atomic weights from the abridged ones of data/elements.csv (3e-5 for CH4: 1e-4).
        CHECK(rel_diff(hv(species, "HHV", "MJ/kg"), p.hhv_kJ_per_mol / M[i]) <= p.tolerance + 1e-4);
        CHECK(rel_diff(hv(species, "LHV", "MJ/kg"), lhv_published / M[i]) <= p.tolerance + 1e-4);
        // The default is HHV in MJ/kg.
        CHECK(hv(species, "", "") == hv(species, "HHV", "MJ/kg"));
        // Without water formed the two bases agree exactly.
        if (p.water_mol == 0) CHECK(hhv == lhv);
    }
}

TEST_CASE("FUELHV: per-kg heating values as handbooks print them", "[fuel]") {
    // Engineering handbook tables (3–4 figures), from memory; 0.5 % covers their rounding and the
    // spread between handbooks.
    struct Row {
        const char* species;
        double hhv_MJ_per_kg, lhv_MJ_per_kg;
    };
    for (const Row& r : std::vector<Row>{{"CH4", 55.50, 50.01},
                                         {"C2H6", 51.90, 47.48},
                                         {"C3H8", 50.35, 46.35},
                                         {"butane", 49.50, 45.72},
                                         {"H2", 141.8, 120.0},
                                         {"CO", 10.10, 10.10},
                                         {"methanol", 22.7, 19.9},
                                         {"ethanol", 29.7, 26.8},
                                         {"C(s)", 32.8, 32.8}}) {
        const double hhv = hv(r.species, "HHV", "MJ/kg"), lhv = hv(r.species, "LHV", "MJ/kg");
        INFO(r.species << ": HHV " << hhv << " MJ/kg against " << r.hhv_MJ_per_kg << ", LHV " << lhv << " against "
                       << r.lhv_MJ_per_kg);
        CHECK(rel_diff(hhv, r.hhv_MJ_per_kg) <= 5e-3);
        CHECK(rel_diff(lhv, r.lhv_MJ_per_kg) <= 5e-3);
    }
    // Written without a phase, methanol and ethanol are the liquids (stable at 25 °C); as gases
    // their heating values are higher by the enthalpy of vaporisation.
    CHECK(hv("CH3OH", "HHV", "kJ/mol") == hv("CH3OH(l)", "HHV", "kJ/mol"));
    CHECK(hv("CH3OH(g)", "HHV", "kJ/mol") - hv("CH3OH(l)", "HHV", "kJ/mol") == Approx(37.4).margin(1.0));  // NIST WebBook ΔvapH° methanol 37.4 kJ/mol, from memory
}

TEST_CASE("FUELHV: per gas volume against GPA 2145 and GNU units", "[fuel][units]") {
    // GPA Standard 2145, ideal-gas gross and net heating values at 60 °F and 14.696 psia, Btu/scf,
    // from memory. GPA refers the combustion to 60 °F, FUELHV to 25 °C: the heating values differ
    // by about 0.1 % between the two; 0.3 % allows for that.
    struct Row {
        const char* species;
        double gross, net;
    };
    for (const Row& r : std::vector<Row>{{"CH4", 1010.0, 909.4},
                                         {"C2H6", 1769.7, 1618.7},
                                         {"C3H8", 2516.1, 2314.9},
                                         {"butane", 3262.3, 3010.8},
                                         {"H2", 324.2, 273.8},
                                         {"CO", 320.5, 320.5}}) {
        const double gross = hv(r.species, "HHV", "BTU/scf"), net = hv(r.species, "LHV", "BTU/scf");
        INFO(r.species << ": gross " << gross << " Btu/scf against " << r.gross << ", net " << net << " against " << r.net);
        CHECK(rel_diff(gross, r.gross) <= 3e-3);
        CHECK(rel_diff(net, r.net) <= 3e-3);
    }
    // Every unit against GNU units: the value per mole times GNU units' conversion (ideal gas at
    // the unit's metering conditions, R = k·N_A).
    struct Unit {
        const char* ours;
        const char* gnu_from;  // one kJ/mol, as GNU units writes it per volume or mass
        const char* gnu_to;
        bool per_mass;
    };
    // The engine's own molar mass here: this checks the unit factors, not the atomic weights.
    const double M_CH4 = eng().molar_mass("CH4");
    for (const Unit& u : std::vector<Unit>{
             {"MJ/Nm3", "kJ/mol * atm / (R * tempC(0))", "MJ/m^3", false},
             {"MJ/Nm³", "kJ/mol * atm / (R * tempC(0))", "MJ/m^3", false},
             {"kWh/Nm3", "kJ/mol * atm / (R * tempC(0))", "kWh/m^3", false},
             {"MJ/Sm3", "kJ/mol * atm / (R * tempC(15))", "MJ/m^3", false},
             {"kWh/Sm3", "kJ/mol * atm / (R * tempC(15))", "kWh/m^3", false},
             {"BTU/scf", "kJ/mol * 14.696 psi / (R * tempF(60))", "btu/ft^3", false},
             {"Btu/scf", "kJ/mol * 14.696 psi / (R * tempF(60))", "btu/ft^3", false},
             {"BTU/lb", "kJ/g", "btu/lb", true},
             {"kcal/kg", "kJ/g", "calorie_th/g", true},
             {"kJ/kg", "kJ/g", "kJ/kg", true},
             {"BTU/lbmol", "kJ/mol", "btu/(lb/g * mol)", false},
         }) {
        const double per_mol = hv("CH4(g)", "HHV", "kJ/mol");
        const double factor = gnu_units(u.gnu_from, u.gnu_to);
        const double expected = u.per_mass ? per_mol / M_CH4 * factor : per_mol * factor;
        INFO(u.ours << ": ours " << hv("CH4(g)", "HHV", u.ours) << ", via GNU units " << expected);
        CHECK(rel_diff(hv("CH4(g)", "HHV", u.ours), expected) <= 1e-12);
    }
    // A liquid has no heating value per gas volume: an error in words, not an ideal-gas number.
    const auto liquid = attempt([] { return hv("methanol", "HHV", "MJ/Nm3"); });
    REQUIRE(liquid.engine_error);
    CHECK(liquid.kind == ErrorKind::unit);
    CHECK(contains(liquid.message, "not a gas at 25"));
    CHECK(contains(liquid.message, "MJ/kg"));
}

TEST_CASE("FUELHV: a natural gas against the sum of its parts", "[fuel]") {
    // 95 % CH4, 3 % C2H6, 2 % N2. Each part computed here from ΔfH° of the species (SPECIESHF,
    // one species at a time, not the combustion code), the metering conditions from GNU units,
    // the molar masses from python3-periodictable.
    const double hf_co2 = eng().species_hf("CO2(g)"), hf_h2o = eng().species_hf("H2O(l)"),
                 hf_h2o_g = eng().species_hf("H2O(g)");
    const double ch4 = eng().species_hf("CH4(g)") - (hf_co2 + 2 * hf_h2o);       // CH4 + 2 O2 -> CO2 + 2 H2O
    const double c2h6 = eng().species_hf("C2H6(g)") - (2 * hf_co2 + 3 * hf_h2o);  // C2H6 + 7/2 O2 -> 2 CO2 + 3 H2O
    const double ch4_net = ch4 - 2 * (hf_h2o_g - hf_h2o), c2h6_net = c2h6 - 3 * (hf_h2o_g - hf_h2o);
    const double per_mol = 0.95 * ch4 + 0.03 * c2h6, per_mol_net = 0.95 * ch4_net + 0.03 * c2h6_net;
    const std::vector<double> M = periodictable_masses({"CH4", "C2H6", "N2"});
    const double M_mix = 0.95 * M[0] + 0.03 * M[1] + 0.02 * M[2];
    const double Sm3 = gnu_units("atm / (R * tempC(15))", "mol/m^3");

    const std::vector<FeedItem> gas = {{"CH4", 0.95}, {"C2H6", 0.03}, {"N2", 0.02}};
    const double ours_Sm3 = eng().heating_value(gas, "HHV", "MJ/Sm3");
    INFO("natural gas: ours " << ours_Sm3 << " MJ/Sm3, sum of parts " << per_mol * Sm3 / 1000);
    CHECK(rel_diff(ours_Sm3, per_mol * Sm3 / 1000) <= 1e-9);
    CHECK(ours_Sm3 > 36);
    CHECK(ours_Sm3 < 39);
    CHECK(rel_diff(eng().heating_value(gas, "LHV", "MJ/Sm3"), per_mol_net * Sm3 / 1000) <= 1e-9);
    CHECK(rel_diff(eng().heating_value(gas, "HHV", "kJ/mol"), per_mol) <= 1e-9);
    // Per kg over the mixture's molar mass, the N2 included (python3-periodictable's atomic
    // weights against the abridged ones of data/elements.csv: 1e-4).
    CHECK(rel_diff(eng().heating_value(gas, "HHV", "MJ/kg"), per_mol / M_mix) <= 1e-4);
    // Mol % gives the same; a sum within 0.5 % is scaled to exactly 1.
    const std::vector<FeedItem> percent = {{"CH4", 95}, {"C2H6", 3}, {"N2", 2}};
    CHECK(rel_diff(eng().heating_value(percent, "HHV", "MJ/Sm3"), ours_Sm3) <= 1e-12);
    const std::vector<FeedItem> short_sum = {{"CH4", 0.95 * 0.996}, {"C2H6", 0.03 * 0.996}, {"N2", 0.02 * 0.996}};
    CHECK(rel_diff(eng().heating_value(short_sum, "HHV", "MJ/Sm3"), ours_Sm3) <= 1e-12);
}

TEST_CASE("FUELHV: a sour refinery gas and inerts", "[fuel]") {
    // H2S + 3/2 O2 -> SO2 + H2O(l): −ΔcH° = ΔfH° H2S − ΔfH° SO2 − ΔfH° H2O(l) = −20.6 + 296.81 + 285.83
    // = 562.0 kJ/mol (CODATA Key Values, from memory); 0.2 % for the H2S value's rounding.
    CHECK(rel_diff(hv("H2S", "HHV", "kJ/mol"), 562.0) <= 2e-3);
    // NH3 + 3/4 O2 -> 1/2 N2 + 3/2 H2O(l): −45.9 + 1.5 × 285.83 = 382.8 kJ/mol (CODATA Key Values, from memory).
    CHECK(rel_diff(hv("NH3", "HHV", "kJ/mol"), 382.8) <= 2e-3);
    // Inerts count zero per mole (but count in the mass): 50 % CO2 halves the heating value per mole.
    const double ch4 = hv("CH4", "HHV", "kJ/mol");
    for (const char* inert : {"CO2", "N2", "H2O(g)", "Ar", "He", "O2", "SO2"}) {
        INFO("inert " << inert);
        CHECK(rel_diff(eng().heating_value({{"CH4", 0.5}, {inert, 0.5}}, "HHV", "kJ/mol"), ch4 / 2) <= 1e-12);
    }
    // The basis is read in any letter case.
    CHECK(hv("CH4", "lhv", "kJ/mol") == hv("CH4", "LHV", "kJ/mol"));
    CHECK(hv("CH4", " hhv ", "kJ/mol") == hv("CH4", "HHV", "kJ/mol"));
}

TEST_CASE("FUELHV: bad fuels, bases and units are errors in words", "[fuel][errors]") {
    struct Bad {
        std::vector<FeedItem> fuel;
        const char* basis;
        const char* unit;
        ErrorKind kind;
        const char* words;
    };
    const std::vector<Bad> cases = {
        {{{"CH4", 0.95}, {"C2H6", 0.03}}, "", "", ErrorKind::argument, "sum to 0.98"},      // off by 2 %
        {{{"CH4", 95}, {"C2H6", 3}, {"N2", 1.4}}, "", "", ErrorKind::argument, "sum to 99.4"},
        {{{"CH4", 0.5}, {"C2H6", 0.3}}, "", "", ErrorKind::argument, "within 0.5 %"},
        {{{"CH4", 1.0}, {"C2H6", -0.0}, {"N2", -0.1}, {"Ar", 0.1}}, "", "", ErrorKind::argument, "zero or more"},
        {{{"unobtainium", 1.0}}, "", "", ErrorKind::unknown_species, ""},
        {{{"Xy7", 1.0}}, "", "", ErrorKind::syntax, "not an element symbol"},
        {{{"CH4", 1.0}}, "GHV", "", ErrorKind::argument, "HHV"},
        {{{"CH4", 1.0}}, "HHVV", "", ErrorKind::argument, "LHV"},
        {{{"CH4", 1.0}}, "", "MJ/m3", ErrorKind::unit, "Nm3"},
        {{{"CH4", 1.0}}, "", "mj/kg", ErrorKind::unit, "did you mean 'MJ/kg'"},
        {{{"CH4", 1.0}}, "", "kJ", ErrorKind::unit, "known units"},
        {{{"CH3Cl", 1.0}}, "", "", ErrorKind::argument, "contains Cl"},
        {{{"N2", 0.5}, {"CO2", 0.5}}, "", "", ErrorKind::argument, "nothing in the fuel burns"},
        {{{"CH4", 0.5}, {"methane", 0.5}}, "", "", ErrorKind::argument, "twice"},
    };
    for (const Bad& b : cases) {
        INFO("fuel " << b.fuel.front().species << " ..., basis '" << b.basis << "', unit '" << b.unit << "'");
        const auto o = attempt([&] { return eng().heating_value(b.fuel, b.basis, b.unit); });
        INFO("said: " << o.message);
        REQUIRE(o.engine_error);
        CHECK(o.kind == b.kind);
        CHECK(contains(o.message, b.words));
    }
    const auto alone = attempt([] { return hv("Ar", "", ""); });
    CHECK(alone.engine_error);
    CHECK(contains(alone.message, "nothing in the fuel burns"));
}

TEST_CASE("FUELHV through the catalogue: a species or a two-column range", "[fuel][catalogue]") {
    using rxnheat::Arg;
    using rxnheat::Cell;
    const rxnheat::FunctionSpec* f = rxnheat::find_function("FUELHV");
    REQUIRE(f != nullptr);
    rxnheat::HostRules calc;
    calc.zero_is_blank = true;
    const auto one = [&](const std::vector<Arg>& args) { return rxnheat::evaluate(*f, args, calc).single(); };

    const auto species = one({Arg::of(std::string("CH4(g)"))});
    REQUIRE(species.ok());
    CHECK(species.unit == "MJ/kg");
    CHECK(species.number == Approx(55.5).epsilon(5e-3));  // handbook methane HHV 55.5 MJ/kg, from memory
    // A 1×1 range is the species; 0 for basis and unit (Calc's blank cells) are their defaults.
    CHECK(one({Arg::range(1, 1, {Cell::of(std::string("CH4(g)"))}), Arg::of(0.0), Arg::of(0.0)}).number == species.number);

    // A composition with a blank row between.
    const Arg gas = Arg::range(4, 2, {Cell::of(std::string("CH4")), Cell::of(95.0), Cell{}, Cell{},
                                      Cell::of(std::string("C2H6")), Cell::of(3.0), Cell::of(std::string("N2")), Cell::of(2.0)});
    const auto mix = one({gas, Arg::of(std::string("LHV")), Arg::of(std::string("MJ/Sm3"))});
    REQUIRE(mix.ok());
    CHECK(mix.unit == "MJ/Sm3");
    CHECK(mix.number == eng().heating_value({{"CH4", 95}, {"C2H6", 3}, {"N2", 2}}, "LHV", "MJ/Sm3"));

    // Errors name the argument.
    const auto number = one({Arg::of(5.0)});
    CHECK(!number.ok());
    CHECK(number.argument == 1);
    const auto three_cols = one({Arg::range(1, 3, {Cell::of(std::string("CH4")), Cell::of(1.0), Cell::of(1.0)})});
    CHECK(!three_cols.ok());
    CHECK(contains(three_cols.text, "two columns"));
    const auto no_fraction = one({Arg::range(2, 2, {Cell::of(std::string("CH4")), Cell::of(1.0), Cell::of(std::string("N2")), Cell{}})});
    CHECK(!no_fraction.ok());
    CHECK(contains(no_fraction.text, "row 2"));
    const auto off = one({Arg::range(2, 2, {Cell::of(std::string("CH4")), Cell::of(90.0), Cell::of(std::string("N2")), Cell::of(5.0)})});
    CHECK(!off.ok());
    CHECK(contains(off.text, "sum to 95"));
}
