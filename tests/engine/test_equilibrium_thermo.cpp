// ΔrS°, ΔrG° and log10 K (RXNDS, RXNDG, RXNLOGK), engine against
//  (a) the simple evaluator of data/nasa-glenn/thermo.inp (nasa_simple_evaluator.hpp, shares no
//      code with the engine; NASA/TP-2002-211556): ΔrS° = Σ ν·S°(T), ΔrG° = Σ ν·H°(T) − T·ΔrS°,
//      log10 K = −ΔrG°/(R·T·ln 10) with R = 8.31446261815324 J/(mol·K) (exact SI; GNU units `R`);
//  (b) NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998): log10 Kf of formation of each
//      species, typed from memory, summed over the reaction (log K = Σ ν·log Kf).
#include "behaviour_helpers.hpp"
#include "nasa_simple_evaluator.hpp"

#include <rxnheat/catalogue.hpp>

#include <cmath>
#include <map>
#include <string>
#include <vector>

using namespace rxnheat_test;

namespace {

constexpr double R_SI = 8.31446261815324;  // J/(mol·K), exact (SI 2019); checked against GNU units below

struct Part {
    double nu;           // signed: reactants < 0
    const char* record;  // exact NASA record name (all gases here)
};

struct Reaction {
    const char* text;
    std::vector<Part> parts;
};

double ref_dS(const Reaction& r, double T) {
    double s = 0;
    for (const auto& p : r.parts) s += p.nu * thermo_file().S(p.record, T);
    return s;  // J/(mol·K)
}
double ref_dG(const Reaction& r, double T) {
    double h = 0;
    for (const auto& p : r.parts) h += p.nu * thermo_file().H(p.record, T);
    return h - T * ref_dS(r, T);  // J/mol
}
double ref_logK(const Reaction& r, double T) { return -ref_dG(r, T) / (R_SI * T * std::log(10.0)); }

const Reaction ammonia{"N2(g) + 3 H2(g) -> 2 NH3(g)", {{-1, "N2"}, {-3, "H2"}, {2, "NH3"}}};
const Reaction shift{"CO(g) + H2O(g) -> CO2(g) + H2(g)", {{-1, "CO"}, {-1, "H2O"}, {1, "CO2"}, {1, "H2"}}};
const Reaction reforming{"CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", {{-1, "CH4"}, {-1, "H2O"}, {1, "CO"}, {3, "H2"}}};
const Reaction sulfur{"SO2(g) + 1/2 O2(g) -> SO3(g)", {{-1, "SO2"}, {-0.5, "O2"}, {1, "SO3"}}};

}  // namespace

TEST_CASE("the simple evaluator's entropies read the file as published", "[reference][equilibrium]") {
    // S°(298.15 K), NIST-JANAF 4th ed. (1998), from memory: N2 191.609, H2 130.680, NH3 192.774,
    // CO2 213.795 J/(mol·K). The evaluator must agree to 0.05 J/(mol·K).
    CHECK(thermo_file().S("N2", 298.15) == Approx(191.609).margin(0.05));   // JANAF, from memory
    CHECK(thermo_file().S("H2", 298.15) == Approx(130.680).margin(0.05));   // JANAF, from memory
    CHECK(thermo_file().S("NH3", 298.15) == Approx(192.774).margin(0.05));  // JANAF, from memory
    CHECK(thermo_file().S("CO2", 298.15) == Approx(213.795).margin(0.05));  // JANAF, from memory
    CHECK(R_gnu() == Approx(R_SI).epsilon(1e-12));                          // GNU units: R = k N_A
}

TEST_CASE("log K of industrial equilibria against an independent evaluation of thermo.inp", "[reference][equilibrium]") {
    const std::vector<std::pair<const Reaction*, std::vector<double>>> cases = {
        {&ammonia, {298.15, 500, 700, 900}},
        {&shift, {500, 800, 1000}},
        {&reforming, {800, 1000, 1200}},
        {&sulfur, {700, 900}},
    };
    for (const auto& [r, temperatures] : cases)
        for (double T : temperatures) {
            INFO(r->text << " at " << T << " K: engine log K " << eng().logk(r->text, T) << ", ΔrG° "
                         << eng().dg(r->text, T) << " kJ/mol, ΔrS° " << eng().ds(r->text, T) << " J/(mol·K)");
            // The engine takes ΔfH° at 298.15 K as tabulated and the polynomial elsewhere (they agree
            // within 1 J/mol per species), so ΔrG° agrees to 5 J/mol and log K to 0.001.
            CHECK(eng().ds(r->text, T) == Approx(ref_dS(*r, T)).margin(1e-6));              // thermo.inp
            CHECK(eng().dg(r->text, T) == Approx(ref_dG(*r, T) / 1000).margin(0.005));      // thermo.inp
            CHECK(eng().logk(r->text, T) == Approx(ref_logK(*r, T)).margin(0.001));         // thermo.inp
            // ΔrG° = ΔrH° − T·ΔrS° through the public functions themselves.
            CHECK(eng().dg(r->text, T) ==
                  Approx(eng().dh(r->text, T) - T * eng().ds(r->text, T) / 1000).margin(1e-9));
        }
}

TEST_CASE("ammonia synthesis: the values the data give", "[reference][equilibrium]") {
    // thermo.inp evaluated above: log10 K(700 K) ≈ −4.05, ΔrG°(298.15 K) ≈ −32.8 kJ/mol.
    CHECK(eng().logk(ammonia.text, 700) == Approx(-4.05).margin(0.02));
    CHECK(eng().dg(ammonia.text) == Approx(-32.8).margin(0.15));
    // ΔrS°(298.15 K) = 2·192.774 − 191.609 − 3·130.680 = −198.10 J/(mol·K) (JANAF S°, from memory).
    CHECK(eng().ds(ammonia.text) == Approx(-198.10).margin(0.2));
    // Exothermic, yet the reactants are favoured at 700 K: the sign of ΔrH° is not that of ΔrG°.
    CHECK(eng().kind(ammonia.text, 700) == rxnheat::HeatKind::exothermic);
    CHECK(eng().logk(ammonia.text, 700) < 0);
    CHECK(eng().logk(ammonia.text, 298.15) > 0);
}

TEST_CASE("log K against NIST-JANAF log Kf (from memory)", "[reference][equilibrium]") {
    // log10 Kf of formation from the elements in their reference states, NIST-JANAF 4th ed.
    // (Chase 1998), typed from memory; the reaction's log K is Σ ν·log Kf (elements: 0).
    std::map<std::pair<std::string, double>, double> log_kf = {
        {{"NH3", 298.15}, 2.867}, {{"NH3", 500}, -0.501}, {{"NH3", 700}, -2.029},
        {{"CO", 500}, 16.235},    {{"CO", 800}, 11.916},  {{"CO", 1000}, 10.461},   {{"CO", 1200}, 9.481},
        {{"CO2", 500}, 41.259},   {{"CO2", 800}, 25.830}, {{"CO2", 1000}, 20.679},
        {{"H2O", 500}, 22.884},   {{"H2O", 800}, 13.287}, {{"H2O", 1000}, 10.060},  {{"H2O", 1200}, 7.897},
        {{"CH4", 800}, 0.139},    {{"CH4", 1000}, -1.018},
    };
    // CH4 at 800 K: typed first as −0.139; the sign was wrong (ΔfG° of CH4 changes sign near 820 K,
    // and from +19.49 kJ/mol at 1000 K with ΔfS° ≈ −108 J/(mol·K) it is ≈ −2.1 kJ/mol at 800 K).
    auto janaf = [&](const Reaction& r, double T) {
        double sum = 0;
        for (const auto& p : r.parts) {
            const std::string name = p.record;
            if (name == "N2" || name == "H2" || name == "O2") continue;  // reference elements: log Kf = 0
            sum += p.nu * log_kf.at({name, T});
        }
        return sum;
    };
    // Tolerance 0.02 in log K: memory of the table's last digit, and the data sets' own differences.
    for (double T : {298.15, 500.0, 700.0}) {
        INFO("ammonia synthesis at " << T << " K");
        CHECK(eng().logk(ammonia.text, T) == Approx(janaf(ammonia, T)).margin(0.02));  // JANAF, from memory
    }
    for (double T : {500.0, 800.0, 1000.0}) {
        INFO("water-gas shift at " << T << " K");
        CHECK(eng().logk(shift.text, T) == Approx(janaf(shift, T)).margin(0.02));  // JANAF, from memory
    }
    for (double T : {800.0, 1000.0}) {
        INFO("steam reforming at " << T << " K");
        CHECK(eng().logk(reforming.text, T) == Approx(janaf(reforming, T)).margin(0.02));  // JANAF, from memory
    }
}

TEST_CASE("log K and ΔrG° follow the reaction as written", "[behaviour][equilibrium]") {
    // Common practice: reversing a reaction inverts K; scaling it by n raises K to the n-th power.
    for (double T : {500.0, 900.0}) {
        const std::string r = ammonia.text;
        CHECK(eng().logk(eng().reverse(r), T) == Approx(-eng().logk(r, T)).margin(1e-9));
        CHECK(eng().dg(eng().reverse(r), T) == Approx(-eng().dg(r, T)).margin(1e-9));
        CHECK(eng().logk(eng().scale(r, "1/2"), T) == Approx(eng().logk(r, T) / 2).margin(1e-9));
        CHECK(eng().ds(eng().scale(r, "1/2"), T) == Approx(eng().ds(r, T) / 2).margin(1e-9));
    }
    // Temperatures as text: 426.85 C = 700 K.
    CHECK(eng().logk(ammonia.text, rxnheat::parse_temperature("426.85 C")) ==
          Approx(eng().logk(ammonia.text, 700)).margin(1e-9));
}

TEST_CASE("units of ΔrS° and ΔrG°", "[behaviour][units][equilibrium]") {
    const std::string r = ammonia.text;
    const double ds = eng().ds(r, 700);
    const double cal = gnu_units("cal", "J");  // GNU units: thermochemical calorie, 4.184 J
    CHECK(eng().ds(r, 700, "J/(mol\xC2\xB7K)") == ds);
    CHECK(eng().ds(r, 700, "J/(mol*K)") == ds);
    CHECK(eng().ds(r, 700, "J/mol/K") == ds);
    CHECK(eng().ds(r, 700, " kJ / (mol.K) ") == Approx(ds / 1000).epsilon(1e-14));
    CHECK(eng().ds(r, 700, "cal/(mol\xC2\xB7K)") == Approx(ds / cal).epsilon(1e-12));
    CHECK(eng().ds(r, 700, "cal/mol/K") == Approx(ds / cal).epsilon(1e-12));

    const double dg = eng().dg(r, 700);
    CHECK(eng().dg(r, 700, "J/mol") == Approx(dg * gnu_units("kJ", "J")).epsilon(1e-12));
    CHECK(eng().dg(r, 700, "kcal/mol") == Approx(dg * gnu_units("kJ", "kcal")).epsilon(1e-12));
    CHECK(eng().dg(r, 700, "BTU/lbmol") == Approx(dg * gnu_units("kJ/mol", "btu / ((lb/g) mol)")).epsilon(1e-12));

    // Unknown or unsuitable units: an error that lists the known ones, never a guess.
    auto unit_error = [&](auto f, const char* words) {
        const auto o = attempt(f);
        REQUIRE_ENGINE_ERROR(o);
        CHECK(o.kind == ErrorKind::unit);
        CHECK(contains(o.message, words));
        CHECK((contains(o.message, "cal/(mol\xC2\xB7K)") || contains(o.message, "kcal/mol")));  // the list
    };
    unit_error([&] { return eng().ds(r, 700, "J/mol\xC2\xB7K"); }, "in parentheses");  // J·K/mol as written
    unit_error([&] { return eng().ds(r, 700, "J/molK"); }, "unknown entropy unit");
    unit_error([&] { return eng().ds(r, 700, "j/(mol*k)"); }, "did you mean 'J/(mol*K)'");
    unit_error([&] { return eng().ds(r, 700, "kJ/mol"); }, "energy per amount");
    unit_error([&] { return eng().ds(r, 700, "kcal/(mol\xC2\xB7K)"); }, "unknown entropy unit");
    unit_error([&] { return eng().dg(r, 700, "kJ/kg"); }, "per mole of reaction");
    unit_error([&] { return eng().dg(r, 700, "J/(mol\xC2\xB7K)"); }, "unknown energy unit");
}

TEST_CASE("ΔrS° with a user species table", "[behaviour][tables][equilibrium]") {
    // An invented NH3 row (S 192.0, constant cp 36.0, 298.15–1000 K): ΔrS°(T) = 2·(192.0 + 36.0·ln(T/298.15))
    // − S°(N2) − 3·S°(H2) with the others from thermo.inp (the simple evaluator).
    const auto t = rxnheat::SpeciesTable::from_rows(
        {{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"}, {"NH3", "g", "-45.9", "192.0", "36.0", "298.15", "1000"}});
    for (double T : {298.15, 600.0}) {
        const double want = 2 * (192.0 + 36.0 * std::log(T / 298.15)) - thermo_file().S("N2", T) -
                            3 * thermo_file().S("H2", T);
        CHECK(eng().ds(ammonia.text, {T, &t}) == Approx(want).margin(1e-6));
    }
    // A row without S: an error that says so, not a number.
    const auto no_s =
        rxnheat::SpeciesTable::from_rows(
        {{"formula", "phase", "dHf", "cp", "tmin", "tmax"}, {"NH3", "g", "-45.9", "36.0", "298.15", "1000"}});
    const auto o = attempt([&] { return eng().logk(ammonia.text, {500, &no_s}); });
    REQUIRE_ENGINE_ERROR(o);
    CHECK(contains(o.message, "gives no S"));
}

TEST_CASE("RXNDS, RXNDG and RXNLOGK through the catalogue", "[catalogue][equilibrium]") {
    using rxnheat::Arg;
    using rxnheat::Cell;
    const rxnheat::HostRules calc{true, false, "Calc add-in"};
    const auto* logk = rxnheat::find_function("RXNLOGK");
    REQUIRE(logk != nullptr);
    CHECK(rxnheat::find_function("rxnLogK") == logk);
    CHECK(rxnheat::find_function("logk") == logk);
    // A row of temperatures spreads into an array; a blank (0) temperature means 298.15 K.
    const auto r = rxnheat::evaluate(
        *logk, {Arg::of(std::string(ammonia.text)), Arg::range(1, 3, {Cell::of(500), Cell::of("700 K"), Cell::of(900)})},
        calc);
    REQUIRE(r.is_array());
    REQUIRE(r.cells.size() == 3);
    CHECK(r.cells[1].number == Approx(ref_logK(ammonia, 700)).margin(0.001));  // thermo.inp
    CHECK(r.cells[2].number == eng().logk(ammonia.text, 900));
    const auto blank = rxnheat::evaluate(*logk, {Arg::of(std::string(ammonia.text)), Arg::of(0.0)}, calc);
    CHECK(blank.single().number == eng().logk(ammonia.text));
    const auto ds = rxnheat::evaluate(*rxnheat::find_function("RXNDS"), {Arg::of(std::string(ammonia.text))}, calc);
    CHECK(ds.single().unit == "J/(mol\xC2\xB7K)");
    const auto dg = rxnheat::evaluate(*rxnheat::find_function("rxnDG"),
                                      {Arg::of(std::string(ammonia.text)), Arg::of(700.0), Arg::of(std::string("kJ/kg"))},
                                      calc);
    CHECK(dg.single().kind == rxnheat::Outcome::Kind::error);
    CHECK(dg.single().error == ErrorKind::unit);
}
