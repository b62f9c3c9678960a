// Behaviour of the engine through its public API (rxnheat.hpp): Hess's-law relations, ΔrU°,
// per-species results, RXNLOAD units, classification, checks, balancing, scaling, phase rules,
// range and ambiguity errors, aliases, molar masses, robustness against bad input, threads and
// the cache.
//
// Outside references used at test time:
//  - GNU units (Debian package `units`, run as `units -d 15 -t FROM TO`) for every unit factor
//    and for R (`R` = k·N_A, exact in the 2019 SI).
//  - IUPAC atomic weights through Debian's python3-periodictable (`/usr/bin/python3`).
//  - data/nasa-glenn/thermo.inp record headers (ΔfH° in J/mol) where a value of the data set
//    itself is the point of the check (aliases pick the right record).
#include <catch2/catch.hpp>

#include <rxnheat/rxnheat.hpp>

#include <algorithm>
#include <array>
#include <atomic>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <functional>
#include <limits>
#include <random>
#include <regex>
#include <sstream>
#include <string>
#include <thread>
#include <vector>

namespace {

using rxnheat::ErrorKind;

rxnheat::Engine& eng() { return rxnheat::Engine::shared(); }

// ---- outside tools ---------------------------------------------------------------------------

std::string run_command(const std::string& cmd, int* status = nullptr) {
    std::string out;
    FILE* p = popen(cmd.c_str(), "r");
    if (!p) return out;
    std::array<char, 4096> buf{};
    std::size_t n;
    while ((n = std::fread(buf.data(), 1, buf.size(), p)) > 0) out.append(buf.data(), n);
    const int st = pclose(p);
    if (status) *status = st;
    return out;
}

/// GNU units: how many `to` in one `from` (or the value of a nonlinear unit such as tempF(60)).
double gnu_units(const std::string& from, const std::string& to) {
    int st = -1;
    const std::string out = run_command("units -d 15 -t '" + from + "' '" + to + "' 2>&1", &st);
    INFO("units -t '" << from << "' '" << to << "' said: " << out);
    REQUIRE(st == 0);
    return std::stod(out);
}

/// Molar masses from python3-periodictable (IUPAC atomic weights), one call for all formulas.
std::vector<double> periodictable_masses(const std::vector<std::string>& formulas) {
    std::string cmd = "/usr/bin/python3 -c 'import sys, periodictable as p\n"
                      "for f in sys.argv[1:]: print(repr(p.formula(f).mass))'";
    for (const auto& f : formulas) cmd += " '" + f + "'";
    int st = -1;
    const std::string out = run_command(cmd + " 2>&1", &st);
    INFO("python3-periodictable said: " << out);
    REQUIRE(st == 0);
    std::vector<double> v;
    std::istringstream in(out);
    std::string line;
    while (std::getline(in, line)) v.push_back(std::stod(line));
    REQUIRE(v.size() == formulas.size());
    return v;
}

double R_gnu() {
    static const double r = gnu_units("R", "J/mol/K");  // GNU units: R = k N_A
    return r;
}

// ---- error capture -----------------------------------------------------------------------------

struct Outcome {
    bool returned = false;
    double value = std::numeric_limits<double>::quiet_NaN();
    std::string text;
    bool engine_error = false;
    ErrorKind kind = ErrorKind::internal;
    bool other_exception = false;
    std::string message;
    double seconds = 0;
};

template <class F>
Outcome attempt(F&& f) {
    Outcome o;
    const auto t0 = std::chrono::steady_clock::now();
    try {
        using R = decltype(f());
        if constexpr (std::is_same_v<R, double>) {
            o.value = f();
        } else {
            o.text = f();
        }
        o.returned = true;
    } catch (const rxnheat::Error& e) {
        o.engine_error = true;
        o.kind = e.kind();
        o.message = e.what();
    } catch (const std::exception& e) {
        o.other_exception = true;
        o.message = e.what();
    } catch (...) {
        o.other_exception = true;
        o.message = "(non-standard exception)";
    }
    o.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    return o;
}

bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

const char* kind_name(ErrorKind k) {
    switch (k) {
        case ErrorKind::syntax: return "syntax";
        case ErrorKind::too_long: return "too_long";
        case ErrorKind::unknown_species: return "unknown_species";
        case ErrorKind::ambiguous_species: return "ambiguous_species";
        case ErrorKind::phase: return "phase";
        case ErrorKind::out_of_range: return "out_of_range";
        case ErrorKind::unbalanced: return "unbalanced";
        case ErrorKind::unit: return "unit";
        case ErrorKind::argument: return "argument";
        case ErrorKind::table: return "table";
        case ErrorKind::internal: return "internal";
    }
    return "?";
}

#define REQUIRE_ENGINE_ERROR(o)                                                                   \
    do {                                                                                          \
        INFO("returned=" << (o).returned << " value=" << (o).value << " text='" << (o).text       \
             << "' other_exception=" << (o).other_exception << " message: " << (o).message);      \
        REQUIRE((o).engine_error);                                                                \
    } while (0)

const char* const CH4_COMB = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";

}  // namespace

// ================================================================================================
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
    // The products of the original come first in the reversed text (SPEC 4: RXNREVERSE).
    const std::string rev = eng().reverse(CH4_COMB);
    const auto arrow = rev.find("->");
    REQUIRE(arrow != std::string::npos);
    CHECK(contains(rev.substr(0, arrow), "CO2(g)"));  // SPEC 4 RXNREVERSE: products and reactants exchanged
    CHECK(contains(rev.substr(0, arrow), "H2O(l)"));  // SPEC 4 RXNREVERSE
    CHECK(contains(rev.substr(arrow), "CH4(g)"));     // SPEC 4 RXNREVERSE
}

TEST_CASE("scale multiplies the enthalpy and keeps exact fractions", "[behaviour][hess]") {
    // Common practice (Hess's law): ΔH scales with the coefficients.
    for (double f : {2.0, 0.5, 3.0, 0.25}) {
        const std::string s = eng().scale(CH4_COMB, f);
        INFO("factor " << f << ": " << s);
        CHECK(eng().dh(s) == Approx(f * eng().dh(CH4_COMB)).margin(1e-9));                      // Hess's law
        CHECK(eng().dh(s, 350) == Approx(f * eng().dh(CH4_COMB, 350)).margin(1e-9));  // Hess's law at 350 K
    }
    // Exact fractions (SPEC 4 RXNSCALE: "exact fractions kept: 1/2 O2").
    const std::string half = eng().scale("2 H2(g) + O2(g) -> 2 H2O(l)", "1/2");
    INFO("scaled by 1/2: " << half);
    CHECK(contains(half, "1/2 O2(g)"));  // SPEC 4 RXNSCALE
    CHECK_FALSE(contains(half, "0.5"));  // SPEC 4 RXNSCALE: fractions, not decimals
    CHECK_FALSE(contains(half, "2 H2(g)"));  // 2 × 1/2 = 1 (arithmetic)
    CHECK(eng().scale("2 H2(g) + O2(g) -> 2 H2O(l)", "½") == half);  // SPEC 2: ½ is 1/2
    CHECK(eng().scale("2 H2(g) + O2(g) -> 2 H2O(l)", 0.5) == half);  // 0.5 is exactly 1/2 in binary
    const std::string third = eng().scale("N2(g) + 3 H2(g) -> 2 NH3(g)", "1/3");
    INFO("scaled by 1/3: " << third);
    CHECK(contains(third, "1/3 N2(g)"));   // SPEC 4 RXNSCALE, exact rational 1 × 1/3
    CHECK(contains(third, "2/3 NH3(g)"));  // SPEC 4 RXNSCALE, exact rational 2 × 1/3
    CHECK(eng().dh(third) == Approx(eng().dh("N2(g) + 3 H2(g) -> 2 NH3(g)") / 3).margin(1e-9));  // Hess's law
    // A zero or non-finite factor is no reaction: a clear error, not "0 N2".
    auto zero = attempt([] { return eng().scale("N2(g) + 3 H2(g) -> 2 NH3(g)", "0"); });
    REQUIRE_ENGINE_ERROR(zero);  // RULES: bad input gets a clear error
    auto nan = attempt([] { return eng().scale("N2(g) + 3 H2(g) -> 2 NH3(g)", std::nan("")); });
    REQUIRE_ENGINE_ERROR(nan);  // RULES: bad input gets a clear error
}

TEST_CASE("RXNDU is RXNDH minus dn(gas) R T", "[behaviour]") {
    // SPEC 4: ΔrU° = ΔrH° − Δn(gas)·R·T; R from GNU units. Δn counted by hand below.
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
        CHECK(eng().du(c.r, c.T) == Approx(dh - c.dn * R_gnu() * c.T / 1000).margin(1e-4));  // SPEC 4, R from GNU units
        CHECK(eng().report(c.r, c.T).dn_gas == Approx(c.dn).margin(1e-12));                  // counted by hand
    }
}

TEST_CASE("results per species: per mole and per mass of a species", "[behaviour][units]") {
    const auto pt = periodictable_masses({"CH4", "O2", "H2O", "CO2"});  // python3-periodictable
    const double dh = eng().dh(CH4_COMB);
    // Per mole of a species: ΔH/ν with ν its coefficient as written (SPEC 4 RXNDH `per`).
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/mol", "CH4(g)") == Approx(dh / 1).margin(1e-9));  // SPEC 4, ν = 1
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/mol", "O2(g)") == Approx(dh / 2).margin(1e-9));   // SPEC 4, ν = 2
    CHECK(eng().dh(CH4_COMB, 298.15, "kJ/mol", "H2O(l)") == Approx(dh / 2).margin(1e-9));  // SPEC 4, ν = 2
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
    REQUIRE_ENGINE_ERROR(no_per);  // SPEC 4: per-mass units need `per`
    auto absent = attempt([] { return eng().dh(CH4_COMB, 298.15, "kJ/mol", "N2(g)"); });
    REQUIRE_ENGINE_ERROR(absent);  // SPEC 4: `per` is a species of the reaction
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
    // Case matters where the trade says so: mJ is not MJ (SPEC 4), and the error lists units.
    for (const char* bad : {"mJ/mol", "mj/kmol", "kj/mol", "KJ/mol", "kJ/kmol ", "kJ per mol", "furlong"}) {
        auto o = attempt([&] { return eng().dh(CH4_COMB, 298.15, bad); });
        INFO("unit '" << bad << "'");
        REQUIRE_ENGINE_ERROR(o);                    // SPEC 4: unknown unit is an error
        CHECK(o.kind == ErrorKind::unit);           // SPEC 4
        CHECK(contains(o.message, "kJ/mol"));       // SPEC 4: the error lists the known ones
        CHECK(contains(o.message, "MJ/kmol"));      // SPEC 4: the error lists the known ones
    }
}

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
    // Normal volume: 0 °C and 101.325 kPa, ideal gas n = pV/(RT) (SPEC 4).
    const double n_Nm3 = gnu_units("atm", "Pa") * 1.0 / (R * gnu_units("tempC(0)", "K"));
    CHECK(eng().load(CH4_COMB, 100, "Nm3", "CH4(g)") == Approx(100 * n_Nm3 * dh).epsilon(1e-6));  // ideal gas from R, GNU units
    // scf: 60 °F and 14.696 psia (SPEC 4).
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
             [] { return eng().load(CH4_COMB, 1, "kmol/week", "CH4(g)"); },         // not a time unit of SPEC 4
             [] { return eng().load(CH4_COMB, 1, "KMOL", "CH4(g)"); },              // case matters
             [] { return eng().load(CH4_COMB, 1, "", "CH4(g)"); },                  // no unit
             [] { return eng().load(CH4_COMB, 1, "kmol", "N2(g)"); },               // key not in the reaction
             [] { return eng().load(CH4_COMB, 1, "kmol", ""); },                    // no key
             [] { return eng().load(CH4_COMB, std::nan(""), "kmol", "CH4(g)"); },   // NaN quantity
             [] { return eng().load(CH4_COMB, INFINITY, "kmol", "CH4(g)"); },       // infinite quantity
         }) {
        auto o = attempt(f);
        REQUIRE_ENGINE_ERROR(o);  // SPEC 4, RULES: clear error, never a plausible number
    }
}

TEST_CASE("kind classifies with a tolerance", "[behaviour]") {
    CHECK(eng().kind(CH4_COMB) == "exothermic");                                       // ΔH ≈ −890 kJ/mol (CODATA)
    CHECK(eng().kind("CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", 1100) == "endothermic");    // ΔH ≈ +226 kJ/mol (JANAF)
    CHECK(eng().kind("CaCO3(s) -> CaO(s) + CO2(g)") == "endothermic");                 // calcination absorbs heat (common practice)
    const double wgs = eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000);
    CHECK(eng().kind("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000, std::fabs(wgs) + 0.01) == "thermoneutral");  // SPEC 4: |ΔH| <= tolerance
    CHECK(eng().kind("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000, std::fabs(wgs) - 0.01) == "exothermic");     // SPEC 4
    CHECK(eng().kind(CH4_COMB, 298.15, 1000) == "thermoneutral");  // SPEC 4: within tolerance
    CHECK(eng().report(CH4_COMB).kind == "exothermic");            // SPEC 5: kind in the report
    auto nan_tol = attempt([] { return eng().kind(CH4_COMB, 298.15, std::nan("")); });
    REQUIRE_ENGINE_ERROR(nan_tol);  // RULES: bad input gets a clear error
    auto neg_tol = attempt([] { return eng().kind(CH4_COMB, 298.15, -1.0); });
    REQUIRE_ENGINE_ERROR(neg_tol);  // a negative tolerance is meaningless: a clear error
    auto unbalanced = attempt([] { return eng().kind("H2(g) + O2(g) -> H2O(l)"); });
    REQUIRE_ENGINE_ERROR(unbalanced);  // SPEC 4: no classification of an unbalanced reaction
}

TEST_CASE("check says ok or names the problem in words", "[behaviour][check]") {
    CHECK(eng().check(CH4_COMB) == "ok");                                                 // SPEC 4 RXNCHECK
    CHECK(eng().check("2H2 + O2 = 2H2O") == "ok");                                        // SPEC 2 example
    CHECK(eng().check("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) == "ok");                 // SPEC 4
    CHECK(eng().check("CH₄(g) + 2O₂(g) → CO₂(g) + 2H₂O(l)") == "ok");                     // SPEC 2 example (Unicode)

    // Unbalanced: each element's left and right totals (issue 2, item 4).
    {
        const std::string msg = eng().check("H2(g) + O2(g) -> H2O(l)");
        INFO("check said: " << msg);
        CHECK(msg != "ok");
        CHECK(std::regex_search(msg, std::regex(R"(\bO\b\D*2\D*\b1\b)")));  // O: 2 on the left, 1 on the right
        auto o = attempt([] { return eng().dh("H2(g) + O2(g) -> H2O(l)"); });
        REQUIRE_ENGINE_ERROR(o);
        CHECK(o.kind == ErrorKind::unbalanced);  // rxnheat.hpp ErrorKind::unbalanced
        CHECK(o.message == msg);                 // SPEC 4: the same diagnosis the numeric functions fail with
    }
    {
        const std::string msg = eng().check("C3H8(g) + 5 O2(g) -> 3 CO2(g) + 3 H2O(l)");
        INFO("check said: " << msg);
        CHECK(std::regex_search(msg, std::regex(R"(\bH\b\D*8\D*\b6\b)")));  // H: 8 on the left, 6 on the right
        CHECK(std::regex_search(msg, std::regex(R"(\bO\b\D*10\D*\b9\b)"))); // O: 10 on the left, 9 on the right
    }
    {
        const std::string msg = eng().check("Na(g) -> Na+(g)");  // thermo.inp has both gas records
        INFO("check said: " << msg);
        CHECK(contains(msg, "charge"));  // SPEC 4 RXNBALANCE/issue 2: charge is balanced too
    }
    // Parse errors say where (SPEC 2).
    {
        const std::string msg = eng().check("CH4(g) + -> CO2(g)");
        INFO("check said: " << msg);
        CHECK(contains(msg, "position"));  // SPEC 2: "position 14: expected ..."
        CHECK(msg != "ok");
    }
    // Unknown element symbol.
    {
        const std::string msg = eng().check("Xq2(g) -> 2 Xq(g)");
        INFO("check said: " << msg);
        CHECK(contains(msg, "Xq"));  // SPEC 2: only real element symbols are accepted
    }
    // Out of range: H2O(l) stops at 600 K in the data (thermo.inp record H2O(L), 273.150–600.000 K).
    {
        const std::string msg = eng().check(CH4_COMB, 1000);
        INFO("check said: " << msg);
        CHECK(contains(msg, "600"));  // SPEC 3.3: the error names the range
    }
    // Species with no data.
    {
        const std::string msg = eng().check("Xe(g) + 3 F2(g) -> XeF6(g)");
        INFO("check said: " << msg);
        CHECK(msg != "ok");
        CHECK(contains(msg, "XeF6"));  // the message names the species
    }
}

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
    for (const auto& [in, expected] : cases) {
        auto o = attempt([&] { return eng().balance(in); });
        INFO(in << " -> " << o.text << o.message);
        CHECK(o.text == expected);  // hand-balanced by counting atoms and charge (see comment above)
    }
    // The balanced text really balances: dh works on it (a reaction with data).
    CHECK_NOTHROW(eng().dh(eng().balance("CH4(g) + O2(g) -> CO2(g) + H2O(l)")));  // consequence of balancing
    CHECK(eng().dh(eng().balance("CH4(g) + O2(g) -> CO2(g) + H2O(l)")) == Approx(eng().dh(CH4_COMB)).margin(1e-9));  // same reaction

    // Two independent balances, or none: errors (SPEC 4 RXNBALANCE).
    for (const char* bad : {"H2 + O2 -> H2O + H2O2",        // two independent balances (4 species, 2 elements)
                            "CO + O2 + C -> CO2",            // two independent balances
                            "Na -> Cl",                      // no balance
                            "H2O -> H2",                     // no balance (O only on one side)
                            "Fe^3+ -> Fe"}) {                // charge cannot balance
        auto o = attempt([&] { return eng().balance(bad); });
        INFO("balance('" << bad << "')");
        REQUIRE_ENGINE_ERROR(o);  // SPEC 4 RXNBALANCE: an error if no balance or more than one
        CHECK_FALSE(o.message.empty());
    }
}

TEST_CASE("phase rules", "[behaviour][phase]") {
    // SPEC 3.3: no phase = the phase stable at 298.15 K and 1 bar.
    CHECK(eng().species_report("H2O").record == "H2O(L)");   // SPEC 3.3: H2O liquid
    CHECK(eng().species_report("H2O").species == "H2O(l)");  // SPEC 3.3
    CHECK(eng().species_report("CO2").record == "CO2");      // SPEC 3.3: CO2 gas
    CHECK(eng().species_report("H2").record == "H2");        // SPEC 3.3: H2 gas
    CHECK(eng().species_report("O2").record == "O2");        // SPEC 3.3: O2 gas
    CHECK(eng().species_report("C").record == "C(gr)");      // SPEC 3.3: C graphite
    CHECK(eng().species_report("C(s)").record == "C(gr)");   // only solid record of carbon in thermo.inp
    CHECK(eng().species_hf("H2O") == Approx(eng().species_hf("H2O(l)")).margin(1e-12));  // SPEC 3.3
    CHECK(eng().dh("2H2 + O2 = 2H2O") == Approx(2 * eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)")).margin(1e-9));  // SPEC 2 example + SPEC 3.3
    // SPEC 3.3: (s) picks the record whose range holds T: alpha iron at 298 K, gamma at 1300 K.
    CHECK(eng().species_report("Fe(s)", 298.15).record == "Fe(a)");  // SPEC 3.3, thermo.inp Fe(a) 200–1184 K
    CHECK(eng().species_report("Fe(s)", 1100).record == "Fe(a)");    // thermo.inp Fe(a) second record 1042–1184 K
    CHECK(eng().species_report("Fe(s)", 1300).record == "Fe(c)");    // SPEC 3.3, thermo.inp Fe(c) 1184–1665 K
    CHECK(eng().species_report("Fe(s)", 1700).record == "Fe(d)");    // thermo.inp Fe(d) 1665–1809 K
    CHECK(eng().species_report("Fe(cr)", 1300).record == "Fe(c)");   // SPEC 2: (cr) is a synonym of (s)
    {
        auto ice = attempt([] { return eng().species_report("H2O(s)", 250).record; });
        INFO("species_report(\"H2O(s)\", 250): " << ice.text << ice.message);
        CHECK(ice.text == "H2O(cr)");  // thermo.inp H2O(cr) ice 200–273.15 K; SPEC 3.3 (s) at T
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
        REQUIRE_ENGINE_ERROR(o);                       // SPEC 3.3: never an extrapolation
        CHECK(o.kind == ErrorKind::out_of_range);      // rxnheat.hpp ErrorKind::out_of_range
        for (const auto& m : c.mentions) CHECK(contains(o.message, m));  // SPEC 3.3: the error names the range
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
        CHECK(o.kind == ErrorKind::ambiguous_species);  // SPEC 3.2
        CHECK(contains(o.message, "propylene"));        // SPEC 3.2 example
        CHECK(contains(o.message, "cyclopropane"));     // SPEC 3.2 example
        CHECK(eng().check("C3H6(g) + 9/2 O2(g) -> 3 CO2(g) + 3 H2O(l)") == o.message);  // SPEC 4: same diagnosis
    }
    {
        auto o = attempt([] { return eng().dh("C4H10(g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)"); });
        INFO(o.message);
        REQUIRE_ENGINE_ERROR(o);
        CHECK(o.kind == ErrorKind::ambiguous_species);  // SPEC 3.2: n-butane and isobutane share C4H10
        CHECK(contains(o.message, "butane"));           // SPEC 3.2: lists the candidates
    }
    // Alias names pick the right record (thermo.inp headers, ΔfH° in J/mol).
    CHECK(eng().species_hf("ethanol(l)") == Approx(-277.510).margin(0.005));     // thermo.inp C2H5OH(L): -277510.000
    CHECK(eng().species_hf("ethanol(g)") == Approx(-234.950).margin(0.005));     // thermo.inp C2H5OH: -234950.000
    CHECK(eng().species_hf("propylene(g)") == Approx(20.000).margin(0.005));     // thermo.inp C3H6,propylene: 20000.000
    CHECK(eng().species_hf("cyclopropane(g)") == Approx(53.300).margin(0.005));  // thermo.inp C3H6,cyclo-: 53300.000
    CHECK(eng().species_hf("methanol(l)") == Approx(-238.910).margin(0.005));    // thermo.inp CH3OH(L): -238910.000
    CHECK(eng().species_hf("n-butane(g)") == Approx(-125.790).margin(0.005));    // thermo.inp C4H10,n-butane: -125790.000
    // The formula as written matches the data's own formula (SPEC 3.2: C2H5OH vs CH3OCH3).
    CHECK(eng().dh("ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)") ==
          Approx(eng().dh("C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)")).margin(1e-9));  // SPEC 3.2
    CHECK(eng().species_hf("C2H5OH(g)") != Approx(eng().species_hf("CH3OCH3(g)")).margin(1.0));  // SPEC 3.2: isomers differ
    // Unknown names are errors.
    auto o = attempt([] { return eng().species_hf("unobtainium(s)"); });
    REQUIRE_ENGINE_ERROR(o);                          // SPEC 3.2
    CHECK(o.kind == ErrorKind::unknown_species);      // rxnheat.hpp ErrorKind::unknown_species
}

TEST_CASE("the same species on both sides nets", "[behaviour]") {
    // SPEC 2: the same species on both sides is allowed (its net coefficient counts).
    for (double T : {298.15, 350.0}) {
        const double base = eng().dh(CH4_COMB, T);
        CHECK(eng().dh("CH4(g) + 2 O2(g) + 3.76 N2(g) -> CO2(g) + 2 H2O(l) + 3.76 N2(g)", T) == Approx(base).margin(1e-9));  // SPEC 2
        CHECK(eng().dh("CH4(g) + 3 O2(g) -> CO2(g) + 2 H2O(l) + O2(g)", T) == Approx(base).margin(1e-9));                   // SPEC 2
        CHECK(eng().du("CH4(g) + 3 O2(g) -> CO2(g) + 2 H2O(l) + O2(g)", T) == Approx(eng().du(CH4_COMB, T)).margin(1e-9));  // SPEC 2 + SPEC 4
    }
    CHECK(eng().load("CH4(g) + 3 O2(g) -> CO2(g) + 2 H2O(l) + O2(g)", 1, "mol", "O2(g)") ==
          Approx(eng().dh(CH4_COMB) / 2).epsilon(1e-9));  // net ν(O2) = 2
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
    CHECK(eng().molar_mass("Co") != Approx(eng().molar_mass("CO")).margin(1.0));  // SPEC 2: Co ≠ CO
    // Not a formula: errors.
    for (const char* bad : {"", "Xx2", "H2O)", "co2", "2H2O + O2", "((((", "H-1"}) {
        auto o = attempt([&] { return eng().molar_mass(bad); });
        INFO("molar_mass('" << bad << "') value " << o.value);
        REQUIRE_ENGINE_ERROR(o);  // SPEC 2: only real element symbols; RULES: clear errors
    }
}

TEST_CASE("temperatures as text", "[behaviour][units]") {
    CHECK(rxnheat::parse_temperature("350 C") == Approx(gnu_units("tempC(350)", "K")).margin(1e-9));   // GNU units tempC
    CHECK(rxnheat::parse_temperature("350 °C") == Approx(gnu_units("tempC(350)", "K")).margin(1e-9));  // GNU units tempC
    CHECK(rxnheat::parse_temperature("662 F") == Approx(gnu_units("tempF(662)", "K")).margin(1e-9));   // GNU units tempF
    CHECK(rxnheat::parse_temperature("1100 R") == Approx(gnu_units("tempR(1100)", "K")).margin(1e-9)); // GNU units tempR
    CHECK(rxnheat::parse_temperature("623.15 K") == Approx(623.15).margin(1e-12));                     // SPEC 4
    CHECK(rxnheat::parse_temperature("623.15") == Approx(623.15).margin(1e-12));                       // SPEC 4: a bare number is kelvin
    for (const char* bad : {"", "hot", "350 X", "-5 K", "-300 C", "nan", "1e999", "350 C C"}) {
        auto o = attempt([&] { return rxnheat::parse_temperature(bad); });
        INFO("parse_temperature('" << bad << "') gave " << o.value);
        REQUIRE_ENGINE_ERROR(o);  // rxnheat.hpp: Error for anything else or below 0 K
    }
}

TEST_CASE("report, source and version", "[behaviour]") {
    const auto rep = eng().report("2H2 + O2 = 2H2O");
    CHECK(rep.canonical == "2 H2(g) + O2(g) -> 2 H2O(l)");                 // rxnheat.hpp canonical form, SPEC 3.3 phases
    CHECK(rep.dH_kJ_per_mol == Approx(eng().dh("2H2 + O2 = 2H2O")).margin(1e-9));  // consistency
    CHECK(rep.dU_kJ_per_mol == Approx(eng().du("2H2 + O2 = 2H2O")).margin(1e-9));  // consistency
    CHECK(rep.dn_gas == Approx(-3).margin(1e-12));                          // 0 − (2 + 1), counted by hand
    CHECK(rep.sources.size() >= 3);                                         // SPEC 3.1: every species carries its source
    const std::string src = eng().source(CH4_COMB);
    INFO(src);
    CHECK(contains(src, "CH4"));                   // SPEC 4 RXNSOURCE: every number's source
    CHECK(contains(src, "H2O"));                   // SPEC 4 RXNSOURCE
    CHECK((contains(src, "NASA") || contains(src, "McBride")));  // SPEC 3.1 citation
    CHECK_FALSE(rxnheat::Engine::version().empty());  // SPEC 4 RXNVERSION
}

TEST_CASE("user species tables", "[behaviour][usertable]") {
    // SPEC 3.4. A constant-cp species: H(T) − H(298.15) = cp·(T − 298.15) exactly.
    const auto t = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf", "cp", "tmin", "tmax", "name", "source"},
                                                     {"XeF6", "g", "-279", "120", "250", "600", "xenon hexafluoride", "demo row"}});
    CHECK(eng().species_hf("XeF6(g)", 298.15, "kJ/mol", &t) == Approx(-279).margin(1e-9));         // the table row
    CHECK(eng().species_h("XeF6(g)", 400, 298.15, &t) == Approx(0.120 * (400 - 298.15)).margin(1e-9));  // integral of a constant cp
    CHECK(eng().dh("Xe(g) + 3 F2(g) -> XeF6(g)", 298.15, "kJ/mol", {}, &t) == Approx(-279).margin(1e-6));  // elements are zero
    // Shomate form (NIST WebBook N2, 100–500 K: A 28.98641, B 1.853978, C −9.647459, D 16.63537,
    // E 0.000117, from memory), overriding the built-in N2(g): H(500) − H(298.15) from the
    // closed-form integral, and ≈ 5.912 kJ/mol (NIST-JANAF, from memory).
    const double A = 28.98641, B = 1.853978, C = -9.647459, D = 16.63537, E = 0.000117;
    auto sh = [&](double T) { const double x = T / 1000; return A * x + B * x * x / 2 + C * x * x * x / 3 + D * x * x * x * x / 4 - E / x; };
    const auto n2 = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf", "a", "b", "c", "d", "e", "tmin", "tmax"},
                                                      {"N2", "g", "0", "28.98641", "1.853978", "-9.647459", "16.63537", "0.000117", "100", "500"}});
    CHECK(eng().species_h("N2(g)", 500, 298.15, &n2) == Approx(sh(500) - sh(298.15)).margin(1e-6));  // Shomate integral (NIST form)
    CHECK(eng().species_h("N2(g)", 500, 298.15, &n2) == Approx(5.912).margin(0.01));                 // NIST-JANAF, from memory
    auto out = attempt([&] { return eng().species_h("N2(g)", 600, 298.15, &n2); });
    REQUIRE_ENGINE_ERROR(out);  // SPEC 3.3/3.4: outside tmax is an error
    // Overriding built-in data (SPEC 3.4: rows override the same formula and phase).
    const auto w = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf"}, {"H2O", "l", "-300"}});
    CHECK(eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)", 298.15, "kJ/mol", {}, &w) == Approx(-300).margin(1e-6));  // the table row
    CHECK(eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)") == Approx(-285.83).margin(0.01));  // built-in unchanged (CODATA, from memory)
    // A malformed table names the row and the column (SPEC 3.4).
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
    REQUIRE_ENGINE_ERROR(missing);  // SPEC 3.4: dHf is required
}

TEST_CASE("bad input never crashes or hangs", "[behaviour][robust]") {
    const std::string parens(4096, '(');
    const std::string too_long = std::string("H2(g) + 1/2 O2(g) -> H2O(l)") + std::string(5000, ' ');
    std::string long_ok = "H2(g) + 1/2 O2(g) -> H2O(l)";
    long_ok += std::string(rxnheat::max_input_chars - long_ok.size(), ' ');
    REQUIRE(long_ok.size() == 4096);

    struct Case { const char* what; std::function<double()> f; ErrorKind kind; bool check_kind; };
    const std::vector<Case> cases = {
        {"empty reaction", [] { return eng().dh(""); }, ErrorKind::syntax, true},
        {"blank reaction", [] { return eng().dh("   "); }, ErrorKind::syntax, true},
        {"4 KiB of '('", [&] { return eng().dh(parens); }, ErrorKind::syntax, false},
        {"4 KiB of '(' as a species", [&] { return eng().species_hf(parens); }, ErrorKind::syntax, false},
        {"4 KiB of '(' molar mass", [&] { return eng().molar_mass(parens); }, ErrorKind::syntax, false},
        {"5000+ characters", [&] { return eng().dh(too_long); }, ErrorKind::too_long, true},
        {"5000+ characters, species", [&] { return eng().species_hf(std::string(5000, 'C')); }, ErrorKind::too_long, true},
        {"species with no data", [] { return eng().dh("2 KMnO4(s) -> K2MnO4(s) + MnO2(s) + O2(g)"); }, ErrorKind::unknown_species, true},
        {"species with no data (hf)", [] { return eng().species_hf("XeF6(g)"); }, ErrorKind::unknown_species, true},
        {"T below 200 K", [] { return eng().dh(CH4_COMB, 150); }, ErrorKind::out_of_range, true},
        {"negative T", [] { return eng().dh(CH4_COMB, -5); }, ErrorKind::argument, false},
        {"zero T", [] { return eng().dh(CH4_COMB, 0); }, ErrorKind::argument, false},
        {"NaN T", [] { return eng().dh(CH4_COMB, std::nan("")); }, ErrorKind::argument, false},
        {"infinite T", [] { return eng().dh(CH4_COMB, INFINITY); }, ErrorKind::argument, false},
        {"NaN T species", [] { return eng().species_h("N2(g)", std::nan("")); }, ErrorKind::argument, false},
        {"NaN Tref", [] { return eng().species_h("N2(g)", 500, std::nan("")); }, ErrorKind::argument, false},
        {"unknown unit", [] { return eng().dh(CH4_COMB, 298.15, "kJ/furlong"); }, ErrorKind::unit, true},
        {"mJ/mol", [] { return eng().dh(CH4_COMB, 298.15, "mJ/mol"); }, ErrorKind::unit, true},
        {"unknown phase", [] { return eng().dh("H2(g) + 1/2 O2(g) -> H2O(x)"); }, ErrorKind::syntax, false},
        {"only an arrow", [] { return eng().dh("->"); }, ErrorKind::syntax, true},
        {"no arrow", [] { return eng().dh("H2 + O2"); }, ErrorKind::syntax, true},
        {"two arrows", [] { return eng().dh("H2 -> H2 -> H2"); }, ErrorKind::syntax, true},
        {"zero denominator", [] { return eng().dh("H2 + 1/0 O2 -> H2O"); }, ErrorKind::syntax, false},
        {"invalid UTF-8", [] { return eng().dh("H2 + O2 \xff\xfe-> H2O"); }, ErrorKind::syntax, false},
        {"NUL inside", [] { return eng().dh(std::string_view("H2\0 + O2 -> H2O", 15)); }, ErrorKind::syntax, false},
    };
    double slowest = 0;
    std::string slowest_what;
    for (const auto& c : cases) {
        auto o = attempt(c.f);
        INFO(c.what << ": value " << o.value << ", kind " << kind_name(o.kind) << ", message: " << o.message);
        REQUIRE_ENGINE_ERROR(o);                                 // RULES: bad input gets a clear error
        CHECK_FALSE(o.message.empty());                          // an error in words
        if (c.check_kind) CHECK(o.kind == c.kind);               // rxnheat.hpp ErrorKind
        CHECK(o.kind != ErrorKind::internal);                    // bad input is not a bug
        CHECK(o.seconds < 1.0);                                  // issue 2: never hangs
        if (o.seconds > slowest) { slowest = o.seconds; slowest_what = c.what; }
    }
    WARN("slowest bad-input call: " << slowest << " s (" << slowest_what << ")");
    // RXNCHECK never throws and gives words for bad reaction text.
    for (const std::string& r : {std::string(), parens, too_long, std::string("->"), std::string("H2 + 1/0 O2 -> H2O"),
                                 std::string("H2 + O2 \xff\xfe-> H2O")}) {
        const std::string said = eng().check(r);
        INFO("check said: " << said);
        CHECK(said != "ok");       // SPEC 4 RXNCHECK
        CHECK_FALSE(said.empty()); // in words
    }
    // Legal but extreme inputs: a finite number or rxnheat::Error, quickly.
    const std::vector<std::pair<const char*, std::function<double()>>> extreme = {
        {"huge coefficients", [] { return eng().dh("99999999999999999999999999999 H2 + 99999999999999999999999999999/2 O2 -> 99999999999999999999999999999 H2O"); }},
        {"huge count", [] { return eng().molar_mass("C99999999999999999999"); }},
        {"deep nesting", [] { return eng().molar_mass(std::string(2000, '(') + "H" + std::string(2000, ')')); }},
        {"deep nesting in a reaction", [] { return eng().dh(std::string(2000, '[') + "H2" + std::string(2000, ']') + " -> H2"); }},
        {"many terms", [] { std::string r = "H2"; for (int i = 0; i < 600; ++i) r += " + H2"; return eng().dh(r + " -> 601 H2"); }},
    };
    for (const auto& [what, f] : extreme) {
        auto o = attempt(f);
        INFO(what << ": value " << o.value << ", message " << o.message << ", " << o.seconds << " s");
        CHECK((o.engine_error || (o.returned && std::isfinite(o.value))));  // rxnheat.hpp contract
        CHECK(o.seconds < 1.0);  // never hangs
    }
    // Exactly 4096 characters is allowed (SPEC 2: longer than 4096 is refused).
    CHECK(eng().dh(long_ok) == Approx(eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)")).margin(1e-9));  // SPEC 2 limit
    auto over = attempt([&] { return eng().dh(long_ok + " "); });
    REQUIRE_ENGINE_ERROR(over);
    CHECK(over.kind == ErrorKind::too_long);  // SPEC 2: 4097 characters refused
}

TEST_CASE("random byte strings: a finite number or rxnheat::Error, quickly", "[behaviour][robust][fuzz]") {
    std::mt19937 rng(20261201u);  // fixed seed
    const std::string alphabet = "CHONSFeClKMgCaAlSi()[]{}+-^=<>→⇌·*/.0123456789 glsaqcr½⁺⁻²³₂₄";
    const std::vector<std::string> pieces = {"H2", "O2", "H2O", "(g)", "(l)", "(s)", "(aq)", " + ", " -> ", "=",
                                             "CH4", "2 ", "1/2 ", "Fe^3+", "OH-", "·5H2O", "Ca(OH)2", "[", "]",
                                             "(", ")", "e-", "⇌", "→", "CO2", "0.5 ", "ethanol", " ", "^", "{2+}"};
    int n_value = 0, n_error = 0, n_other = 0, n_nonfinite = 0;
    double slowest = 0;
    std::string slowest_input;
    std::vector<std::string> bad;
    const int N = 3000;
    for (int i = 0; i < N; ++i) {
        std::string s;
        const int mode = i % 3;
        const int len = static_cast<int>(rng() % (i % 97 == 0 ? 4200 : 60));
        for (int k = 0; k < len; ++k) {
            if (mode == 0) s.push_back(static_cast<char>(rng() % 256));                 // raw bytes
            else if (mode == 1) s.push_back(alphabet[rng() % alphabet.size()]);          // chemistry bytes (may split UTF-8)
            else s += pieces[rng() % pieces.size()];                                     // chemistry tokens
        }
        const std::vector<std::function<Outcome()>> calls = {
            [&] { return attempt([&] { return eng().dh(s); }); },
            [&] { return attempt([&] { return eng().dh(s, 1000, "MJ/kmol"); }); },
            [&] { return attempt([&] { return eng().du(s); }); },
            [&] { return attempt([&] { return eng().species_hf(s); }); },
            [&] { return attempt([&] { return eng().species_h(s, 800); }); },
            [&] { return attempt([&] { return eng().molar_mass(s); }); },
            [&] { return attempt([&] { return eng().load(s, 1, "kmol/h", "H2(g)"); }); },
            [&] { return attempt([&] { return eng().load(CH4_COMB, 1, "kmol/h", s); }); },
            [&] { return attempt([&] { return eng().dh(CH4_COMB, 298.15, s); }); },
            [&] { return attempt([&] { return eng().balance(s); }); },
            [&] { return attempt([&] { return eng().reverse(s); }); },
            [&] { return attempt([&] { return eng().scale(s, "2"); }); },
            [&] { return attempt([&] { return eng().scale(CH4_COMB, s); }); },
            [&] { return attempt([&] { return eng().kind(s); }); },
            [&] { return attempt([&] { return eng().source(s); }); },
            [&] { return attempt([&] { return rxnheat::parse_temperature(s); }); },
            [&] { return attempt([&] { return eng().check(s); }); },
        };
        for (const auto& call : calls) {
            const Outcome o = call();
            if (o.seconds > slowest) { slowest = o.seconds; slowest_input = s.substr(0, 80); }
            if (o.engine_error) ++n_error;
            else if (o.other_exception) { ++n_other; if (bad.size() < 10) bad.push_back(s.substr(0, 80) + " => " + o.message); }
            else if (o.text.empty() && !std::isfinite(o.value)) { ++n_nonfinite; if (bad.size() < 10) bad.push_back(s.substr(0, 80) + " => non-finite"); }
            else ++n_value;
        }
    }
    std::string first_bad;
    for (const auto& b : bad) first_bad += "\n  " + b;
    WARN("fuzz: " << N << " inputs x 17 calls: " << n_value << " values, " << n_error << " rxnheat::Error, "
         << n_other << " other exceptions, " << n_nonfinite << " non-finite; slowest call " << slowest << " s");
    INFO("first offending inputs:" << first_bad);
    CHECK(n_other == 0);      // rxnheat.hpp: every function returns a value or throws rxnheat::Error
    CHECK(n_nonfinite == 0);  // RULES: never a non-number
    CHECK(slowest < 1.0);     // issue 2: never hangs
}

TEST_CASE("threads give the same values as one thread", "[behaviour][threads]") {
    const std::vector<std::pair<std::string, double>> mix = {
        {CH4_COMB, 298.15},
        {"CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000},
        {"N2(g) + 3 H2(g) -> 2 NH3(g)", 700},
        {"CaCO3(s) -> CaO(s) + CO2(g)", 1173},
        {"Fe2O3(s) + 3 CO(g) -> 2 Fe(s) + 3 CO2(g)", 1100},
        {"SO2(g) + 1/2 O2(g) -> SO3(g)", 700},
        {"CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", 1100},
        {"CO2(g) + 3 H2(g) -> CH3OH(g) + H2O(g)", 523},
        {"C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)", 800},
        {"H2(g) + O2(g) -> H2O(l)", 298.15},  // an error, the same in every thread
    };
    // Single-threaded reference values (text form so errors compare too).
    auto evaluate = [](const std::string& r, double T) {
        try {
            std::ostringstream os;
            os.precision(17);
            os << eng().dh(r, T) << '|' << eng().du(r, T) << '|' << eng().check(r, T);
            return os.str();
        } catch (const rxnheat::Error& e) {
            return std::string("error: ") + e.what();
        }
    };
    std::vector<std::string> expected;
    for (const auto& [r, T] : mix) expected.push_back(evaluate(r, T));
    constexpr int threads = 4, calls = 2000;
    std::atomic<int> mismatches{0};
    std::vector<std::string> first_mismatch(threads);
    std::vector<std::thread> pool;
    for (int t = 0; t < threads; ++t) {
        pool.emplace_back([&, t] {
            for (int i = 0; i < calls; ++i) {
                const std::size_t k = static_cast<std::size_t>(i * 7 + t * 3) % mix.size();
                // every 16th call a fresh text (whitespace varies) so parsing runs concurrently too
                std::string text = mix[k].first;
                if (i % 16 == 0) text += std::string(static_cast<std::size_t>(1 + (i / 16) % 50 + t * 50), ' ');
                const std::string got = evaluate(text, mix[k].second);
                if (got != expected[k]) {
                    if (mismatches++ == 0) first_mismatch[t] = text + " => " + got + " vs " + expected[k];
                }
            }
        });
    }
    for (auto& th : pool) th.join();
    std::string why;
    for (const auto& m : first_mismatch) why += m;
    INFO(why);
    CHECK(mismatches.load() == 0);  // rxnheat.hpp: all functions are thread-safe
}

TEST_CASE("the cache is invisible: same text, same value", "[behaviour][cache]") {
    const double first = eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000);
    CHECK(eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) == first);           // issue 2: cache keyed by text
    CHECK(eng().dh("CO(g)+H2O(g)->CO2(g)+H2(g)", 1000) == Approx(first).margin(1e-12));   // SPEC 2: whitespace is free
    CHECK(eng().dh("  CO(g) + H2O(g)  =  CO2(g) + H2(g) ", 1000) == Approx(first).margin(1e-12));  // SPEC 2: arrows mean the same
    // Many distinct texts (beyond any reasonable cache bound), then the first again.
    for (int i = 0; i < 5000; ++i) eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)" + std::string(static_cast<std::size_t>(i % 3000 + 1), ' '), 700 + i % 5);
    CHECK(eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) == first);  // issue 2: eviction does not change values
    // The same text at another temperature is another value (the key is not the temperature).
    CHECK(eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 700) != Approx(first).margin(0.5));  // Kirchhoff: ΔCp ≠ 0, so ΔH(700) ≠ ΔH(1000)
    // A bad text fails the same way twice.
    const std::string a = eng().check("H2(g) + O2(g) -> H2O(l)");
    CHECK(eng().check("H2(g) + O2(g) -> H2O(l)") == a);  // issue 2: cached errors repeat
}
