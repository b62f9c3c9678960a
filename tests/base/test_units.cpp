// Tests of the unit system (engine/src/units.hpp) and parse_temperature().
//
// Every conversion factor is compared, at test time, with GNU units (Debian package `units`,
// run as `units -d 15 -t FROM TO`; 15 significant digits is its maximum). The GNU units
// expression is written beside each of our unit names ("source: GNU units"). Relative
// tolerance 1e-12: GNU units prints 15 digits, so this is far above its rounding and far below
// any real difference between two definitions (e.g. IT vs thermochemical BTU differ by 7e-4,
// R = 8.314462618 vs k·N_A by 2e-11).
#include <catch2/catch.hpp>

#include "rxnheat/rxnheat.hpp"
#include "units.hpp"

#include <charconv>
#include <cmath>
#include <cstdio>
#include <limits>
#include <random>
#include <string>
#include <vector>

using rxnheat::Error;
using rxnheat::ErrorKind;
namespace d = rxnheat::detail;

namespace {

constexpr double rel_tol = 1e-12;

// Runs GNU units and returns the number it prints for FROM in TO. Fails the test (never skips) if
// units is missing or does not give one number.
double gnu_units(const std::string& from, const std::string& to) {
    const std::string cmd = "LC_ALL=C units -d 15 -t '" + from + "' '" + to + "' 2>&1";
    FILE* pipe = popen(cmd.c_str(), "r");
    INFO("command: " << cmd);
    REQUIRE(pipe != nullptr);
    std::string out;
    char buf[256];
    while (std::fgets(buf, sizeof buf, pipe)) out += buf;
    const int status = pclose(pipe);
    INFO("GNU units printed: " << out);
    REQUIRE(status == 0);
    while (!out.empty() && (out.back() == '\n' || out.back() == ' ')) out.pop_back();
    double v = 0;
    const auto r = std::from_chars(out.data(), out.data() + out.size(), v);
    REQUIRE(r.ec == std::errc());
    REQUIRE(r.ptr == out.data() + out.size());
    return v;
}

double rel_diff(double a, double b) { return std::fabs(a - b) / std::max(std::fabs(a), std::fabs(b)); }

#define CHECK_REL(ours, reference)                                                        \
    do {                                                                                  \
        const double ours_ = (ours), ref_ = (reference);                                  \
        INFO("ours " << ours_ << ", reference " << ref_ << ", rel. diff " << rel_diff(ours_, ref_)); \
        CHECK(rel_diff(ours_, ref_) <= rel_tol);                                          \
    } while (0)

// The message of the rxnheat::Error that f throws; fails the test if f throws nothing or another
// kind. Any other exception type propagates and fails the test case.
template <class F>
std::string error_of(F f, ErrorKind expected) {
    try {
        f();
    } catch (const Error& e) {
        CHECK(static_cast<int>(e.kind()) == static_cast<int>(expected));
        return e.what();
    }
    FAIL("no rxnheat::Error thrown");
    return {};
}

struct Row {
    const char* ours;  // our unit name
    const char* gnu;   // GNU units expression for one of it
};

const double M_water = 18.01528;  // an arbitrary test molar mass, g/mol (value immaterial here)

}  // namespace

TEST_CASE("constants agree with GNU units", "[units]") {
    // source: GNU units: `R` (= gasconstant = k N_A)
    CHECK_REL(d::R, gnu_units("R", "J/mol/K"));
    CHECK_REL(d::R, d::boltzmann_J_per_K * d::avogadro_per_mol);
    // source: GNU units: `k`, `N_A`
    CHECK_REL(d::boltzmann_J_per_K, gnu_units("k", "J/K"));
    CHECK_REL(d::avogadro_per_mol, gnu_units("N_A", "1/mol"));
    // source: GNU units: psi = pound force / inch^2
    CHECK_REL(d::unit_def::psi_Pa, gnu_units("lbf/in^2", "Pa"));
    CHECK_REL(d::unit_def::psi_Pa, gnu_units("psi", "Pa"));
    // source: GNU units: cal = calorie_th; btu = btu_IT; therm = UStherm; lb; atm
    CHECK_REL(d::unit_def::cal_J, gnu_units("cal", "J"));
    CHECK_REL(d::unit_def::cal_J, gnu_units("calorie_th", "J"));
    CHECK_REL(d::unit_def::btu_J, gnu_units("btu", "J"));
    CHECK_REL(d::unit_def::btu_J, gnu_units("btu_IT", "J"));
    CHECK_REL(d::unit_def::therm_J, gnu_units("therm", "J"));
    CHECK_REL(d::unit_def::lb_kg, gnu_units("lb", "kg"));
    CHECK_REL(d::unit_def::lbmol_mol, gnu_units("(lb/g) * mol", "mol"));
    CHECK_REL(d::unit_def::atm_Pa, gnu_units("atm", "Pa"));
    CHECK_REL(d::unit_def::ft3_m3, gnu_units("ft^3", "m^3"));
    // source: GNU units: tempC(0), tempF(60)
    CHECK_REL(d::unit_def::T_zero_C, gnu_units("tempC(0)", "K"));
    CHECK_REL(d::unit_def::T_60_F, gnu_units("tempF(60)", "K"));
    // The chosen definitions are really distinct from the alternatives (so the checks above can
    // tell them apart). source: GNU units: calorie_IT, btu_th, ECtherm
    CHECK(rel_diff(d::unit_def::cal_J, gnu_units("calorie_IT", "J")) > 1e-4);
    CHECK(rel_diff(d::unit_def::btu_J, gnu_units("btu_th", "J")) > 1e-4);
    CHECK(rel_diff(d::unit_def::therm_J, gnu_units("ECtherm", "J")) > 1e-4);
    CHECK(rel_diff(d::unit_def::therm_J, gnu_units("1e5 btu", "J")) > 1e-4);
    // Gcal is on the International Table calorie (units.hpp says why). source: GNU units:
    // calorie_IT; its own `Gcal` (= 1e9 cal = calorie_th) is the other choice, 0.067 % away.
    CHECK_REL(d::unit_def::cal_IT_J, gnu_units("calorie_IT", "J"));
    CHECK(rel_diff(1e9 * d::unit_def::cal_IT_J, gnu_units("Gcal", "J")) > 1e-4);
    // The IT BTU is built on the same calorie: BTU = cal_IT · lb/g · 5/9 (degF/K).
    // source: GNU units: calorie_IT, lb, degF
    CHECK_REL(d::unit_def::btu_J, gnu_units("calorie_IT * (lb/g) * (degF/K)", "J"));
    // source: GNU units: tempC(15) (ISO 13443 standard reference temperature)
    CHECK_REL(d::unit_def::T_15_C, gnu_units("tempC(15)", "K"));
}

TEST_CASE("energy per mole units agree with GNU units", "[units]") {
    // source: GNU units (each expression converted to J/mol)
    const std::vector<Row> rows = {
        {"J/mol", "J/mol"},
        {"kJ/mol", "kJ/mol"},
        {"MJ/kmol", "MJ/kmol"},
        {"kcal/mol", "kcal/mol"},
        {"cal/mol", "cal/mol"},
        {"BTU/lbmol", "btu / ((lb/g) * mol)"},  // GNU units has no lbmol: lb/g mol
        {"Btu/lbmol", "btu / ((lb/g) * mol)"},  // the NIST spelling, same unit
    };
    const double x = -890362.0;  // J/mol, any value
    for (const Row& r : rows) {
        INFO(r.ours << " = " << r.gnu);
        const double f = gnu_units(r.gnu, "J/mol");
        CHECK_REL(d::from_J_per_mol(x, r.ours, "the value"), x / f);
        CHECK_REL(d::from_J_per_mol(x, r.ours, "the value", M_water), x / f);  // a molar mass changes nothing
        CHECK_REL(d::to_J_per_mol(1.0, r.ours, "the value"), f);
        CHECK_FALSE(d::is_per_mass_unit(r.ours));
    }
    // Empty unit = kJ/mol; blanks at the ends and around '/' ignored.
    CHECK_REL(d::from_J_per_mol(x, "", "the value"), x / 1000.0);
    CHECK_REL(d::from_J_per_mol(x, " kJ / mol ", "the value"), x / gnu_units("kJ/mol", "J/mol"));
}

TEST_CASE("energy per mass units agree with GNU units", "[units]") {
    // source: GNU units (each expression converted to J/g)
    const std::vector<Row> rows = {
        {"kJ/kg", "kJ/kg"},
        {"MJ/kg", "MJ/kg"},
        {"kJ/g", "kJ/g"},
        {"kcal/kg", "kcal/kg"},
        {"BTU/lb", "btu/lb"},
        {"Btu/lb", "btu/lb"},
    };
    const double x = -890362.0;   // J/mol
    const double M = 16.04246;    // g/mol (any positive value)
    for (const Row& r : rows) {
        INFO(r.ours << " = " << r.gnu);
        const double f = gnu_units(r.gnu, "J/g");
        CHECK_REL(d::from_J_per_mol(x, r.ours, "the value", M), x / M / f);
        CHECK_REL(d::to_J_per_mol(1.0, r.ours, "the value", M), f * M);
        CHECK(d::is_per_mass_unit(r.ours));
    }
}

namespace {
// source: GNU units — our quantity unit, its GNU units expression, and the GNU unit it is
// converted to (mol for amounts and normal volumes, g for masses).
struct QRow {
    const char* ours;
    const char* gnu;
    const char* to;
    bool mass;
};
const std::vector<QRow> quantity_rows = {
    {"mol", "mol", "mol", false},
    {"kmol", "kmol", "mol", false},
    {"lbmol", "(lb/g) * mol", "mol", false},
    {"g", "g", "g", true},
    {"kg", "kg", "g", true},
    {"t", "tonne", "g", true},
    {"lb", "lb", "g", true},
    {"klb", "klb", "g", true},  // GNU units: k prefix on lb (= 1000 lb, checked below)
    // ideal gas n = pV/(RT) at 0 °C and 101.325 kPa
    {"Nm3", "101.325 kPa * m^3 / (R * tempC(0))", "mol", false},
    {"Nm\xC2\xB3", "101.325 kPa * m^3 / (R * tempC(0))", "mol", false},
    {"Nm^3", "101.325 kPa * m^3 / (R * tempC(0))", "mol", false},
    // ideal gas at 15 °C and 101.325 kPa (Sm3: ISO 13443 standard reference conditions; GNU
    // units has no Sm3, so this is the definition written in its named constants)
    {"Sm3", "101.325 kPa * m^3 / (R * tempC(15))", "mol", false},
    {"Sm\xC2\xB3", "101.325 kPa * m^3 / (R * tempC(15))", "mol", false},
    {"Sm^3", "101.325 kPa * m^3 / (R * tempC(15))", "mol", false},
    // ideal gas at 60 °F and 14.696 psia
    {"scf", "14.696 psi * ft^3 / (R * tempF(60))", "mol", false},
    // MMscf = 10^6 scf (the trade's definition; GNU units has no MMscf)
    {"MMscf", "1e6 * 14.696 psi * ft^3 / (R * tempF(60))", "mol", false},
};
// source: GNU units (`hr` is its own abbreviation of hour)
const std::vector<Row> time_rows = {{"s", "s"}, {"min", "minute"}, {"h", "hour"}, {"hr", "hr"}, {"d", "day"}};
}  // namespace

TEST_CASE("quantity units and flows agree with GNU units", "[units]") {
    const double M = 44.0095;  // g/mol (any positive value)
    const double q = 12.5;
    for (const QRow& r : quantity_rows) {
        INFO(r.ours << " = " << r.gnu << " (in " << r.to << ")");
        const double f = gnu_units(r.gnu, r.to);
        const double expected = r.mass ? q * f / M : q * f;
        CHECK_REL(d::quantity_to_mol(q, r.ours, M), expected);
        if (!r.mass) CHECK_REL(d::quantity_to_mol(q, r.ours), expected);
        const d::QuantityUnit u = d::quantity_unit(r.ours);
        CHECK_FALSE(u.is_rate());
        CHECK(u.seconds == 0);
        for (const Row& t : time_rows) {
            const std::string name = std::string(r.ours) + "/" + t.ours;
            const std::string expr = std::string("(") + r.gnu + ") / " + t.gnu;
            INFO(name << " = " << expr);
            const double fr = gnu_units(expr, std::string(r.to) + "/s");
            CHECK_REL(d::quantity_to_mol(q, name, M), r.mass ? q * fr / M : q * fr);
            const d::QuantityUnit ur = d::quantity_unit(name);
            CHECK(ur.is_rate());
            CHECK_REL(ur.seconds, gnu_units(t.gnu, "s"));
            CHECK(static_cast<int>(ur.kind) == static_cast<int>(u.kind));
        }
    }
    // The struct's parts. source: GNU units
    const d::QuantityUnit scf = d::quantity_unit("scf");
    CHECK(scf.kind == d::QuantityKind::volume);
    CHECK_REL(scf.factor, gnu_units("ft^3", "m^3"));
    CHECK_REL(scf.mol_per_m3, gnu_units("14.696 psi / (R * tempF(60))", "mol/m^3"));
    const d::QuantityUnit nm3 = d::quantity_unit("Nm3/h");
    CHECK(nm3.kind == d::QuantityKind::volume);
    CHECK(nm3.factor == 1.0);
    CHECK_REL(nm3.mol_per_m3, gnu_units("101.325 kPa / (R * tempC(0))", "mol/m^3"));
    CHECK_REL(nm3.seconds, 3600.0);
    const d::QuantityUnit lb = d::quantity_unit("lb");
    CHECK(lb.kind == d::QuantityKind::mass);
    CHECK_REL(lb.factor, gnu_units("lb", "g"));
    CHECK(lb.mol_per_m3 == 0);
    CHECK(d::quantity_unit("kmol/d").kind == d::QuantityKind::amount);
    // klb is 1000 lb. source: GNU units
    CHECK_REL(d::quantity_unit("klb/h").factor, gnu_units("1000 lb", "g"));
    // Sm3: 15 °C, 101.325 kPa. source: GNU units (named constants, as in the rows above)
    const d::QuantityUnit sm3 = d::quantity_unit("Sm3/hr");
    CHECK(sm3.kind == d::QuantityKind::volume);
    CHECK(sm3.factor == 1.0);
    CHECK_REL(sm3.mol_per_m3, gnu_units("101.325 kPa / (R * tempC(15))", "mol/m^3"));
    CHECK_REL(sm3.seconds, gnu_units("hr", "s"));
    // Ideal gas (common practice): Nm3 holds 288.15/273.15 times the moles of Sm3.
    CHECK_REL(d::quantity_to_mol(1, "Nm3") / d::quantity_to_mol(1, "Sm3"), 288.15 / 273.15);
    // Published figure (from memory): 23.645 L/mol at 15 °C, 101.325 kPa.
    CHECK(1000.0 / d::quantity_to_mol(1, "Sm3") == Approx(23.645).epsilon(1e-4));
    // MMscfd is one word for MMscf/d. source: GNU units (named constants; 10^6 scf per day)
    const d::QuantityUnit mmscfd = d::quantity_unit("MMscfd");
    CHECK(mmscfd.is_rate());
    CHECK(mmscfd.kind == d::QuantityKind::volume);
    CHECK_REL(mmscfd.seconds, gnu_units("day", "s"));
    CHECK_REL(mmscfd.factor, gnu_units("1e6 ft^3", "m^3"));
    CHECK_REL(d::quantity_to_mol(12.5, "MMscfd"),
              gnu_units("12.5 * 1e6 * 14.696 psi * ft^3 / (R * tempF(60)) / day", "mol/s"));
    CHECK(d::quantity_to_mol(12.5, "MMscfd") == d::quantity_to_mol(12.5, "MMscf/d"));
    CHECK(d::quantity_to_mol(12.5, " MMscfd ") == d::quantity_to_mol(12.5, "MMscf/d"));
    // hr is h, for every base.
    for (const QRow& r : quantity_rows) {
        INFO(r.ours);
        CHECK(d::quantity_to_mol(3.0, std::string(r.ours) + "/hr", 44.0) ==
              d::quantity_to_mol(3.0, std::string(r.ours) + "/h", 44.0));
    }
    // Published figure (common practice): about 379.5 scf per lbmol at 60 °F, 14.696 psia;
    // 22.414 L/mol at 0 °C, 1 atm.
    CHECK(d::unit_def::lbmol_mol / d::quantity_to_mol(1, "scf") == Approx(379.5).epsilon(1e-3));
    CHECK(1000.0 / d::quantity_to_mol(1, "Nm3") == Approx(22.414).epsilon(1e-4));
    // Blanks around '/' are ignored.
    CHECK_REL(d::quantity_to_mol(1, " kg / h ", M), d::quantity_to_mol(1, "kg/h", M));
}

TEST_CASE("load result units agree with GNU units", "[units]") {
    // source: GNU units (totals in J)
    const std::vector<Row> totals = {
        {"J", "J"},       {"kJ", "kJ"},   {"MJ", "MJ"},         {"GJ", "GJ"},
        {"kWh", "kWh"},   {"MWh", "MWh"}, {"kcal", "kcal"},     {"BTU", "btu"},
        {"MMBTU", "1e6 btu"}, {"therm", "therm"},
        {"Btu", "btu"},   {"MMBtu", "1e6 btu"},
        {"Gcal", "1e9 calorie_IT"},  // GNU units: calorie_IT (its `Gcal` is thermochemical)
    };
    // source: GNU units (rates in W)
    const std::vector<Row> rates = {
        {"W", "W"},
        {"kW", "kW"},
        {"MW", "MW"},
        {"kcal/h", "kcal/hour"},
        {"BTU/h", "btu/hour"},
        {"MMBTU/h", "1e6 btu/hour"},
        {"TR", "tonref"},  // GNU units: tonrefrigeration = uston 144 btu / lb day
        {"Btu/h", "btu/hour"},
        {"MMBtu/h", "1e6 btu/hour"},
        {"Gcal/h", "1e9 calorie_IT/hour"},
        // "/hr" beside "/h". source: GNU units: hr
        {"kcal/hr", "kcal/hr"},
        {"BTU/hr", "btu/hr"},
        {"Btu/hr", "btu/hr"},
        {"MMBTU/hr", "1e6 btu/hr"},
        {"MMBtu/hr", "1e6 btu/hr"},
        {"Gcal/hr", "1e9 calorie_IT/hr"},
        {" Btu / hr ", "btu/hr"},
    };
    const double x = -3.75e7;
    for (const Row& r : totals) {
        INFO(r.ours << " = " << r.gnu);
        CHECK_REL(d::load_result(x, r.ours, false, "the heat load"), x / gnu_units(r.gnu, "J"));
    }
    for (const Row& r : rates) {
        INFO(r.ours << " = " << r.gnu);
        CHECK_REL(d::load_result(x, r.ours, true, "the heat load"), x / gnu_units(r.gnu, "W"));
    }
    // TR = 12,000 BTU/h (engine/DATA.md, Units). source: GNU units
    CHECK_REL(d::load_result(x, "TR", true, "the heat load"), x / gnu_units("12000 btu/hour", "W"));
    // Defaults: kJ for totals, kW for rates.
    CHECK_REL(d::load_result(x, "", false, "the heat load"), x / 1e3);
    CHECK_REL(d::load_result(x, "", true, "the heat load"), x / 1e3);
    CHECK(d::default_total_unit == "kJ");
    CHECK(d::default_rate_unit == "kW");
}

TEST_CASE("a load end to end: kg/h of methane burnt to kW", "[units]") {
    // 100 kg/h of CH4 (M = 16.04246 g/mol, from memory), ΔH = -890.36 kJ/mol (from memory): the
    // arithmetic through the unit functions, checked against GNU units doing the whole sum.
    const double M = 16.04246, dH = -890.36e3;
    const double mol_per_s = d::quantity_to_mol(100, "kg/h", M);
    const double kW = d::load_result(mol_per_s * dH, "", true, "the heat load", "kg/h");
    // source: GNU units
    CHECK_REL(kW, gnu_units("100 kg/hour / (16.04246 g/mol) * (-890.36 kJ/mol)", "kW"));
    // The same in the trade's spellings: 10 t/hr to Gcal/h and MMBtu/hr. source: GNU units
    const double s10 = d::quantity_to_mol(10, "t/hr", M) * dH;
    CHECK_REL(d::load_result(s10, "Gcal/h", true, "the heat load", "t/hr"),
              gnu_units("10 tonne/hr / (16.04246 g/mol) * (-890.36 kJ/mol)", "1e9 calorie_IT/hour"));
    CHECK_REL(d::load_result(s10, "MMBtu/hr", true, "the heat load", "t/hr"),
              gnu_units("10 tonne/hr / (16.04246 g/mol) * (-890.36 kJ/mol)", "1e6 btu/hour"));
    const double BTU_h = d::load_result(mol_per_s * dH, "BTU/h", true, "the heat load", "kg/h");
    CHECK_REL(BTU_h, gnu_units("100 kg/hour / (16.04246 g/mol) * (-890.36 kJ/mol)", "btu/hour"));
    const double mmbtu = d::load_result(d::quantity_to_mol(1000, "scf") * dH, "MMBTU", false, "the heat load", "scf");
    CHECK_REL(mmbtu, gnu_units("1000 * 14.696 psi * ft^3 / (R * tempF(60)) * (-890.36 kJ/mol)", "1e6 btu"));
}

// ---- errors ---------------------------------------------------------------------------------------

TEST_CASE("unknown energy unit lists every known one, and units are case-sensitive", "[units]") {
    const std::vector<std::string> known = {"J/mol", "kJ/mol", "MJ/kmol", "kcal/mol", "cal/mol", "BTU/lbmol",
                                            "Btu/lbmol", "kJ/kg", "MJ/kg", "kJ/g", "kcal/kg", "BTU/lb",
                                            "Btu/lb"};
    for (const char* bad : {"furlong", "mJ/kg", "mj/kg", "KJ/MOL", "kj/mol", "btu/lb", "kJ", "J/kg",
                            "kJ/mol/K", "/", "kJ//mol"}) {
        INFO("unit " << bad);
        const std::string msg = error_of([&] { d::from_J_per_mol(1.0, bad, "the value", 18.0); }, ErrorKind::unit);
        for (const std::string& k : known) CHECK(msg.find(k) != std::string::npos);
        CHECK(msg.find(std::string("'") + bad + "'") != std::string::npos);
        error_of([&] { d::to_J_per_mol(1.0, bad, "the value", 18.0); }, ErrorKind::unit);
    }
    // A wrong-case name is refused, with a hint but no silent fix.
    CHECK(error_of([] { d::from_J_per_mol(1.0, "mJ/kg", "the value", 18.0); }, ErrorKind::unit)
              .find("did you mean 'MJ/kg'") != std::string::npos);
    CHECK(error_of([] { d::from_J_per_mol(1.0, "kj/mol", "the value"); }, ErrorKind::unit)
              .find("did you mean 'kJ/mol'") != std::string::npos);
    CHECK_FALSE(d::is_per_mass_unit("mj/kg"));
    CHECK(d::is_per_mass_unit("Btu/lb"));
    CHECK(error_of([] { d::from_J_per_mol(1.0, "BTu/lbmol", "the value"); }, ErrorKind::unit)
              .find("did you mean 'BTU/lbmol'") != std::string::npos);
    CHECK(error_of([] { d::from_J_per_mol(1.0, "Btu/hr", "the value"); }, ErrorKind::unit).find("that is a load unit") !=
          std::string::npos);
}

TEST_CASE("per-mass unit without a molar mass asks for `per`", "[units]") {
    for (const char* u : {"kJ/kg", "MJ/kg", "kJ/g", "kcal/kg", "BTU/lb"}) {
        INFO(u);
        const std::string msg = error_of([&] { d::from_J_per_mol(-1e5, u, "the value"); }, ErrorKind::unit);
        CHECK(msg.find("`per`") != std::string::npos);
        error_of([&] { d::to_J_per_mol(1.0, u, "the value"); }, ErrorKind::unit);
    }
    for (double bad_M : {0.0, -18.0, std::numeric_limits<double>::quiet_NaN(),
                         std::numeric_limits<double>::infinity()}) {
        error_of([&] { d::from_J_per_mol(-1e5, "MJ/kg", "the value", bad_M); }, ErrorKind::argument);
        error_of([&] { d::quantity_to_mol(1.0, "kg", bad_M); }, ErrorKind::argument);
    }
}

TEST_CASE("rate and total result units are not mixed", "[units]") {
    std::string msg = error_of([] { d::load_result(1.0, "kJ", true, "the heat load", "kg/h"); }, ErrorKind::unit);
    CHECK(msg.find("'kg/h' is a flow: give a power unit such as kW, MW, BTU/h, TR") != std::string::npos);
    msg = error_of([] { d::load_result(1.0, "MMBTU", true, "the heat load"); }, ErrorKind::unit);
    CHECK(msg.find("is a flow") != std::string::npos);
    msg = error_of([] { d::load_result(1.0, "kW", false, "the heat load", "kg"); }, ErrorKind::unit);
    CHECK(msg.find("'kg' is a total, not a flow: give an energy unit") != std::string::npos);
    msg = error_of([] { d::load_result(1.0, "TR", false, "the heat load", "scf"); }, ErrorKind::unit);
    CHECK(msg.find("energy unit") != std::string::npos);
    // Unknown result unit: every known one is listed.
    msg = error_of([] { d::load_result(1.0, "kj", false, "the heat load"); }, ErrorKind::unit);
    for (const char* k : {"J", "kJ", "MJ", "GJ", "kWh", "MWh", "kcal", "BTU", "MMBTU", "therm", "W", "kW",
                          "MW", "kcal/h", "BTU/h", "MMBTU/h", "TR", "Gcal", "Btu", "MMBtu", "Gcal/h", "Btu/h",
                          "MMBtu/h", "/hr"})
        CHECK(msg.find(k) != std::string::npos);
    CHECK(msg.find("did you mean 'kJ'") != std::string::npos);
    // Wrong case keeps its hint; "/hr" totals and rates are not mixed either.
    CHECK(error_of([] { d::load_result(1.0, "gcal", false, "the heat load"); }, ErrorKind::unit).find("did you mean 'Gcal'") !=
          std::string::npos);
    CHECK(error_of([] { d::load_result(1.0, "GCAL/H", true, "the heat load"); }, ErrorKind::unit)
              .find("did you mean 'Gcal/h'") != std::string::npos);
    CHECK(error_of([] { d::load_result(1.0, "mmbtu", false, "the heat load"); }, ErrorKind::unit)
              .find("did you mean 'MMBTU'") != std::string::npos);
    CHECK(error_of([] { d::load_result(1.0, "Btu/hr", false, "the heat load", "kg"); }, ErrorKind::unit)
              .find("'kg' is a total, not a flow") != std::string::npos);
    CHECK(error_of([] { d::load_result(1.0, "Gcal", true, "the heat load", "t/hr"); }, ErrorKind::unit)
              .find("'t/hr' is a flow") != std::string::npos);
    for (const char* bad : {"Gcal/H", "Gcal/hrs", "Gcal/hour", "kW/hr", "TR/hr", "Btu/Hr", "MMbtu/h", "/hr",
                            "hr", "Gcal/hr/h"})
        error_of([&] { d::load_result(1.0, bad, true, "the heat load"); }, ErrorKind::unit);
    for (const char* bad : {"mJ", "Btu", "btu/h", "kW/h", "kJ/mol", "tr", "kWh/h", "hp"})
        error_of([&] { d::load_result(1.0, bad, true, "the heat load"); }, ErrorKind::unit);
    error_of([] { d::load_result(1.0, "kJ/mol", false, "the heat load"); }, ErrorKind::unit);
}

TEST_CASE("bad quantity units and values", "[units]") {
    std::string msg = error_of([] { d::quantity_to_mol(1.0, "m3"); }, ErrorKind::unit);
    CHECK(msg.find("Nm3") != std::string::npos);
    CHECK(msg.find("scf") != std::string::npos);
    msg = error_of([] { d::quantity_to_mol(1.0, "KG", 18.0); }, ErrorKind::unit);
    CHECK(msg.find("did you mean 'kg'") != std::string::npos);
    for (const char* k : {"mol", "kmol", "lbmol", "g", "kg", "t", "lb", "Nm3", "scf", "/s", "/min", "/h", "/d",
                          "klb", "Sm3", "MMscf", "MMscfd", "/hr"})
        CHECK(msg.find(k) != std::string::npos);
    for (const char* bad : {"", "   ", "kg/", "kg/hour", "kg/H", "kg/HR", "kg/h/s", "/h", "/hr", "nm3", "SCF",
                            "Mg", "ton", "lbs", "kmol/y", "kg h", "kg\n/h", "MMscfd/h", "MMscfd/d",
                            "MMSCFD", "mmscf", "sm3", "SM3", "KLB", "Klb", "MMscf/day", "scfd", "Sm3/hrs"})
        error_of([&] { d::quantity_unit(bad); }, ErrorKind::unit);
    msg = error_of([] { d::quantity_unit("kg/hour"); }, ErrorKind::unit);
    CHECK(msg.find("s, min, h or d") != std::string::npos);
    CHECK(error_of([] { d::quantity_unit("MMscfd/h"); }, ErrorKind::unit).find("already a flow") !=
          std::string::npos);
    CHECK(error_of([] { d::quantity_unit("MMSCFD"); }, ErrorKind::unit).find("did you mean 'MMscfd'") !=
          std::string::npos);
    CHECK(error_of([] { d::quantity_unit("sm3/h"); }, ErrorKind::unit).find("did you mean 'Sm3'") !=
          std::string::npos);
    CHECK(error_of([] { d::quantity_unit("KLB/h"); }, ErrorKind::unit).find("did you mean 'klb'") !=
          std::string::npos);
    CHECK(error_of([] { d::quantity_unit("m3/h"); }, ErrorKind::unit).find("Sm3 at 15") != std::string::npos);
    // A mass needs the key species' molar mass.
    error_of([] { d::quantity_to_mol(1.0, "kg/h"); }, ErrorKind::unit);
    // Non-finite numbers.
    const double nan = std::numeric_limits<double>::quiet_NaN(), inf = std::numeric_limits<double>::infinity();
    error_of([&] { d::quantity_to_mol(nan, "kmol"); }, ErrorKind::argument);
    error_of([&] { d::quantity_to_mol(-inf, "Nm3/h"); }, ErrorKind::argument);
    error_of([&] { d::quantity_to_mol(1e308, "t", 1e-300); }, ErrorKind::argument);
    error_of([&] { d::from_J_per_mol(nan, "kJ/mol", "the value"); }, ErrorKind::argument);
    error_of([&] { d::to_J_per_mol(inf, "kJ/mol", "the value"); }, ErrorKind::argument);
    error_of([&] { d::load_result(inf, "kW", true, "the heat load"); }, ErrorKind::argument);
    error_of([&] { d::load_result(nan, "kJ", false, "the heat load"); }, ErrorKind::argument);
    // Finite in, infinite out: the conversion's result is checked too, and named. 1e306 kJ/mol
    // is 1e309 J/mol; 1e306 J/mol of a species of 1e-6 g/mol is 1e309 kJ/kg... in kJ/g 1e309.
    CHECK(error_of([&] { d::to_J_per_mol(1e306, "kJ/mol", "the ΔH of step 2"); }, ErrorKind::argument)
              .find("the ΔH of step 2 in J/mol is inf, not a finite number") != std::string::npos);
    CHECK(error_of([&] { d::from_J_per_mol(1e306, "kJ/g", "ΔrH°", 1e-6); }, ErrorKind::argument)
              .find("ΔrH° in kJ/g is inf") != std::string::npos);
    CHECK(error_of([&] { d::load_result(-inf, "kW", true, "the duty"); }, ErrorKind::argument)
              .find("the duty is -inf") != std::string::npos);
}

// ---- temperature ----------------------------------------------------------------------------------

TEST_CASE("parse_temperature: every form, checked against GNU units tempC/tempF/degR", "[units]") {
    struct T {
        const char* text;
        const char* gnu;  // GNU units expression, converted to K
    };
    // source: GNU units (tempC(x) and tempF(x) are its Celsius and Fahrenheit scales; `degR` its
    // Rankine degree, 5/9 K, from absolute zero)
    const std::vector<T> cases = {
        {"623.15", "623.15 K"},
        {"623.15 K", "623.15 K"},
        {"623.15K", "623.15 K"},
        {"  623.15 K \t", "623.15 K"},
        {"+623.15 K", "623.15 K"},
        {"6.2315e2 K", "623.15 K"},
        {"6.2315E+2", "623.15 K"},
        {".5e3", "500 K"},
        {"350 C", "tempC(350)"},
        {"350C", "tempC(350)"},
        {"350 \xC2\xB0" "C", "tempC(350)"},         // °C
        {"350\xC2\xB0" "C", "tempC(350)"},
        {"350 \xC2\xBA" "C", "tempC(350)"},         // ºC (masculine ordinal)
        {"350 \xCB\x9A" "C", "tempC(350)"},         // ˚C (ring above)
        {"350 \xE2\x84\x83", "tempC(350)"},         // ℃
        {"350 degC", "tempC(350)"},
        {"-40 C", "tempC(-40)"},
        {"\xE2\x88\x92" "40 \xC2\xB0" "C", "tempC(-40)"},  // Unicode minus
        {"25.5\xC2\xA0\xC2\xB0" "C", "tempC(25.5)"},  // no-break space
        {"662 F", "tempF(662)"},
        {"662F", "tempF(662)"},
        {"662 \xC2\xB0" "F", "tempF(662)"},
        {"662 \xC2\xBA" "F", "tempF(662)"},
        {"662 \xE2\x84\x89", "tempF(662)"},         // ℉
        {"662 degF", "tempF(662)"},
        {"-40 F", "tempF(-40)"},
        {"60 F", "tempF(60)"},
        {"1100 R", "1100 degR"},
        {"1100R", "1100 degR"},
        {"1100 \xC2\xB0R", "1100 degR"},
        {"1100 \xC2\xBAR", "1100 degR"},
        {"1100 degR", "1100 degR"},
        {"1.1e3 R", "1100 degR"},
    };
    for (const T& c : cases) {
        INFO("text '" << c.text << "' = " << c.gnu);
        const double ours = rxnheat::parse_temperature(c.text);
        const double ref = gnu_units(c.gnu, "K");
        if (std::fabs(ref) < 1e-9)  // absolute zero: GNU units prints e.g. -5.7e-14 for tempF(-459.67)
            CHECK(std::fabs(ours) <= 1e-9);
        else
            CHECK_REL(ours, ref);
    }
    // Exact definitions (T = t + 273.15; T = (t + 459.67)·5/9; T = t·5/9): same results.
    CHECK(rxnheat::parse_temperature("350 C") == 350 + 273.15);
    CHECK(rxnheat::parse_temperature("662 F") == Approx((662 + 459.67) * 5 / 9).epsilon(1e-15));
    CHECK(rxnheat::parse_temperature("1100 R") == Approx(1100.0 * 5 / 9).epsilon(1e-15));
    CHECK(rxnheat::parse_temperature("-0 C") == 273.15);
    // Absolute zero itself is refused when read (issue 10, item 7): no function can use it.
    for (const char* t : {"0", "-0", "0 K", "-273.15 C", "-459.67 F", "0 R"}) {
        INFO(t);
        const std::string msg = error_of([&] { rxnheat::parse_temperature(t); }, ErrorKind::argument);
        CHECK(msg.find("absolute zero") != std::string::npos);
    }
}

TEST_CASE("parse_temperature errors", "[units]") {
    // Below absolute zero.
    for (const char* t : {"-1", "-0.001 K", "-273.16 C", "-300 \xC2\xB0" "C", "-460 F", "-1 R", "-1e300 C"}) {
        INFO(t);
        const std::string msg = error_of([&] { rxnheat::parse_temperature(t); }, ErrorKind::argument);
        CHECK(msg.find("below absolute zero") != std::string::npos);
    }
    // Unknown units: the message lists the accepted forms.
    for (const char* t : {"350 X", "350 k", "350 c", "350 \xC2\xB0K", "350 \xC2\xB0" "c", "350 C C",
                          "350 Celsius", "350 kelvin", "350 deg", "350 \xC2\xB0", "350,5 C", "1e 5",
                          "350 K.", "0x10", "350 \xC2\xB0 C", "12 degc", "5 \xFF\xFE"}) {
        INFO(t);
        const std::string msg = error_of([&] { rxnheat::parse_temperature(t); }, ErrorKind::unit);
        for (const char* form : {"K", "C", "\xC2\xB0" "C", "degC", "F", "\xC2\xB0" "F", "degF", "\xC2\xB0R",
                                 "degR", "Rankine"})
            CHECK(msg.find(form) != std::string::npos);
    }
    CHECK(error_of([] { rxnheat::parse_temperature("350,5 C"); }, ErrorKind::unit).find("'.'") !=
          std::string::npos);
    // Not a number at all, empty, non-finite.
    for (const char* t : {"", "   ", "\t\n", "abc", "C", "\xC2\xB0" "C", "K 350", "--5", "+-5", "+", "-", ".",
                          "e5", "nan", "NaN K", "inf", "-inf C", "Infinity", "1e400", "-1e400 K", "1e308 F",
                          "\xE2\x88\x92", "\xC2\xA0"}) {
        INFO("'" << t << "'");
        const std::string msg = error_of([&] { rxnheat::parse_temperature(t); }, ErrorKind::argument);
        CHECK(msg.find("temperature") != std::string::npos);
    }
    CHECK(error_of([] { rxnheat::parse_temperature("nan"); }, ErrorKind::argument).find("finite") !=
          std::string::npos);
    CHECK(error_of([] { rxnheat::parse_temperature(""); }, ErrorKind::argument).find("empty") !=
          std::string::npos);
    // An embedded NUL is not silently cut off.
    error_of([] { rxnheat::parse_temperature(std::string_view("350\0C", 5)); }, ErrorKind::unit);
    // A huge input gets a short message.
    const std::string huge(1 << 20, 'x');
    CHECK(error_of([&] { rxnheat::parse_temperature(huge); }, ErrorKind::argument).size() < 400);
    const std::string huge_unit = "300 " + std::string(1 << 20, 'K');
    CHECK(error_of([&] { rxnheat::parse_temperature(huge_unit); }, ErrorKind::unit).size() < 500);
}

TEST_CASE("unit functions throw only rxnheat::Error on random input", "[units]") {
    std::mt19937 rng(20240611);
    const std::string alphabet = "0123456789.+-eE KCFRdegmolkJhsWBTU/^3 \t\xC2\xB0\xBA\xB3\xE2\x88\x92\xFF";
    std::uniform_int_distribution<std::size_t> len(0, 24), pick(0, alphabet.size() - 1);
    int ok = 0, errors = 0;
    for (int i = 0; i < 20000; ++i) {
        std::string s;
        for (std::size_t n = len(rng); n > 0; --n) s += alphabet[pick(rng)];
        try {
            const double T = rxnheat::parse_temperature(s);
            CHECK(std::isfinite(T));
            CHECK(T >= 0);
            ++ok;
        } catch (const Error&) {
            ++errors;
        }
        try { (void)d::from_J_per_mol(1.0, s, "the value", 18.0); ++ok; } catch (const Error&) { ++errors; }
        try { (void)d::quantity_to_mol(1.0, s, 18.0); ++ok; } catch (const Error&) { ++errors; }
        try { (void)d::load_result(1.0, s, (i & 1) != 0, "the heat load", s); ++ok; } catch (const Error&) { ++errors; }
        (void)d::is_per_mass_unit(s);
    }
    CHECK(ok > 0);
    CHECK(errors > 0);
}

TEST_CASE("pressure units agree with GNU units", "[units]") {
    // source: GNU units: bar, Pa, kPa, MPa, atm, psi (absolute); a bare number is bar.
    CHECK_REL(d::parse_pressure("7.5"), gnu_units("7.5 bar", "bar"));
    CHECK_REL(d::parse_pressure("7.5 bar"), gnu_units("7.5 bar", "bar"));
    CHECK_REL(d::parse_pressure("7.5 bara"), gnu_units("7.5 bar", "bar"));
    CHECK_REL(d::parse_pressure("250000 Pa"), gnu_units("250000 Pa", "bar"));
    CHECK_REL(d::parse_pressure("300 kPa"), gnu_units("300 kPa", "bar"));
    CHECK_REL(d::parse_pressure("2.5 MPa"), gnu_units("2.5 MPa", "bar"));
    CHECK_REL(d::parse_pressure("3 atm"), gnu_units("3 atm", "bar"));
    CHECK_REL(d::parse_pressure("150 psia"), gnu_units("150 psi", "bar"));
    // Gauge: over the standard atmosphere (GNU units `atm` = 101325 Pa).
    CHECK_REL(d::parse_pressure("19 barg"), gnu_units("19 bar + atm", "bar"));
    CHECK_REL(d::parse_pressure("150 psig"), gnu_units("150 psi + atm", "bar"));
    CHECK_REL(d::parse_pressure("0 psig"), gnu_units("atm", "bar"));
    CHECK_REL(d::parse_pressure(" 20bar "), 20.0);  // blanks at either end and none before the unit
}

TEST_CASE("bad pressures are errors in words", "[units]") {
    // psi alone: absolute or gauge is not said, so it is refused rather than guessed.
    CHECK(error_of([] { d::parse_pressure("150 psi"); }, ErrorKind::unit).find("psia or psig") != std::string::npos);
    CHECK(error_of([] { d::parse_pressure("2 mpa"); }, ErrorKind::unit).find("did you mean 'MPa'") != std::string::npos);
    CHECK(error_of([] { d::parse_pressure("2 torr"); }, ErrorKind::unit).find("unknown pressure unit 'torr'") !=
          std::string::npos);
    CHECK(error_of([] { d::parse_pressure("0"); }, ErrorKind::argument).find("not above zero") != std::string::npos);
    CHECK(error_of([] { d::parse_pressure("-5 bar"); }, ErrorKind::argument).find("not above zero") != std::string::npos);
    // -2 barg is below vacuum: 1.01325 − 2 < 0 bar absolute.
    CHECK(error_of([] { d::parse_pressure("-2 barg"); }, ErrorKind::argument).find("not above zero") != std::string::npos);
    CHECK(error_of([] { d::parse_pressure("bar"); }, ErrorKind::argument).find("does not start with a number") !=
          std::string::npos);
    CHECK(error_of([] { d::parse_pressure(""); }, ErrorKind::argument).find("empty") != std::string::npos);
    CHECK(error_of([] { d::parse_pressure("1e999 bar"); }, ErrorKind::argument).find("finite") != std::string::npos);
    CHECK(error_of([] { d::parse_pressure("2,5 bar"); }, ErrorKind::unit).find("decimal point") != std::string::npos);
}
