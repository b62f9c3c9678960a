// Issue 10, items 2, 3, 4 and 7: every value derived from user data is finite or an error in
// words; compositions are matched exactly; only rxnheat::Error leaves the engine; temperature
// text at 0 K, denormal or underflowing is refused when it is read. The values in the tables
// below are deliberately absurd (they test the limits of a double, not chemistry).
#include "behaviour_helpers.hpp"

#include <rxnheat/catalogue.hpp>

#include <cfloat>
#include <cmath>
#include <string>
#include <vector>

using namespace rxnheat_test;
using rxnheat::SpeciesTable;

namespace {
std::string table_error(const std::vector<std::vector<std::string>>& rows) {
    try {
        SpeciesTable::from_rows(rows);
    } catch (const rxnheat::Error& e) {
        CHECK(e.kind() == ErrorKind::table);
        return e.what();
    }
    return "(accepted)";
}
}  // namespace

TEST_CASE("a table cell too large in J/mol is refused when the table is read", "[finite]") {
    // 1e306 kJ/mol is 1e309 J/mol, beyond the largest double (about 1.8e308, IEEE 754 binary64).
    const std::string msg = table_error({{"formula", "phase", "dHf", "cp", "tmin", "tmax"},
                                         {"O3", "g", "1e306", "30", "200", "1000"}});
    INFO(msg);
    CHECK(contains(msg, "row 2"));
    CHECK(contains(msg, "'dHf'"));
    CHECK(contains(msg, "1e306"));
}

TEST_CASE("extreme Shomate coefficients that make Cp, H or S infinite are refused", "[finite]") {
    // Cp = a + b·t + ... with t = T/1000: b = c = 1.5e308 give Cp = 3e308 at 1000 K.
    std::string msg = table_error({{"formula", "phase", "dHf", "S", "a", "b", "c", "tmin", "tmax"},
                                   {"O3", "g", "142.7", "238.9", "20", "1.5e308", "1.5e308", "200", "1000"}});
    INFO(msg);
    CHECK(contains(msg, "row 2"));
    CHECK(contains(msg, "Shomate"));
    // e/t² at a tiny tmin overflows although every cell is an ordinary number.
    msg = table_error({{"formula", "phase", "dHf", "S", "a", "e", "tmin", "tmax"},
                       {"O3", "g", "142.7", "238.9", "20", "1e300", "1e-5", "1000"}});
    INFO(msg);
    CHECK(contains(msg, "row 2"));
    CHECK(contains(msg, "not finite"));
    // A constant cp whose sensible heat over the range overflows.
    msg = table_error({{"formula", "phase", "dHf", "cp", "tmin", "tmax"}, {"O3", "g", "142.7", "1e306", "200", "1e5"}});
    INFO(msg);
    CHECK(contains(msg, "row 2"));
    CHECK(contains(msg, "'cp'"));
    // S of a constant cp down to a denormal tmin: ln(T/298.15) is -inf there.
    msg = table_error({{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"},
                       {"O3", "g", "142.7", "238.9", "30", "4.9e-324", "1000"}});
    INFO(msg);
    CHECK(contains(msg, "row 2"));
}

TEST_CASE("a sum that overflows is an error, and check() says the same as dh() and report()", "[finite]") {
    // 1e305 kJ/mol = 1e308 J/mol is a double; twice it is not.
    const auto t = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"},
                                            {"O3", "g", "1e305", "238.9", "30", "200", "1000"}});
    const char* r = "2 O3(g) -> 3 O2(g)";
    const rxnheat::Conditions at{400, &t};
    const auto dh = attempt([&] { return eng().dh(r, at); });
    REQUIRE_ENGINE_ERROR(dh);
    CHECK(contains(dh.message, "ΔrH°"));
    CHECK(contains(dh.message, "O3(g)"));
    CHECK(eng().check(r, at) == dh.message);
    const auto rep = attempt([&] { return eng().report(r, at).canonical; });
    REQUIRE_ENGINE_ERROR(rep);
    CHECK(rep.message == dh.message);
    const auto kind = attempt([&] { return eng().kind(r, at); });
    REQUIRE_ENGINE_ERROR(kind);
    CHECK(kind.message == dh.message);
    // One O3 only: 1e308 J/mol is finite, but ΔrG° = ΔrH° − T·ΔrS° stays finite too, and check() is ok.
    const char* one = "O3(g) -> 3/2 O2(g)";
    CHECK(eng().check(one, at) == "ok");
    CHECK(std::isfinite(eng().dh(one, at, "J/mol")));
    CHECK(std::isfinite(eng().dg(one, at, "J/mol")));
}

TEST_CASE("a quantity that overflows in mol says which quantity, in which unit", "[finite]") {
    // 1e306 kmol is 1e309 mol, beyond the largest double (about 1.8e308); 1e300 kmol is not.
    const char* r = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";
    const auto big = attempt([&] { return eng().load(r, 1e306, "kmol/h", "CH4", "", rxnheat::Conditions{298.15}); });
    REQUIRE_ENGINE_ERROR(big);
    CHECK(big.kind == ErrorKind::argument);
    CHECK(contains(big.message, "the quantity 1e+306 'kmol/h' is too large: in mol/s"));
    const auto amount = attempt([&] { return eng().load(r, 1e306, "kmol", "CH4", "", rxnheat::Conditions{298.15}); });
    REQUIRE_ENGINE_ERROR(amount);
    CHECK(contains(amount.message, "'kmol' is too large: in mol it passes"));
    // 1e300 kmol is 1e303 mol, a double; times ΔrH° of about −8.9e5 J/mol it is not (about
    // −8.9e308 J): the error names the heat load, not "the value".
    const auto load = attempt([&] { return eng().load(r, 1e300, "kmol", "CH4", "", rxnheat::Conditions{298.15}); });
    REQUIRE_ENGINE_ERROR(load);
    CHECK(contains(load.message, "the heat load is -inf, not a finite number"));
    CHECK(std::isfinite(eng().load(r, 1e290, "kmol", "CH4", "", rxnheat::Conditions{298.15})));
}

TEST_CASE("RXNHESS names the step whose ΔH overflows in J/mol", "[finite]") {
    // 1e306 kJ/mol is 1e309 J/mol, beyond the largest double.
    const auto h = attempt([&] {
        return eng().hess("C(s) + O2(g) -> CO2(g)", {{1, "C(s) + O2(g) -> CO2(g)", 1e306}}, "kJ/mol");
    });
    REQUIRE_ENGINE_ERROR(h);
    CHECK(h.kind == ErrorKind::argument);
    CHECK(contains(h.message, "the ΔH of step 1 in J/mol is inf, not a finite number"));
    // Two steps each finite in J/mol whose sum is not: the combined value is named.
    const auto sum = attempt([&] {
        return eng().hess("C(s) + 1/2 O2(g) -> CO(g)",
                          {{1, "C(s) + O2(g) -> CO2(g)", 1.5e308}, {2, "CO2(g) -> CO(g) + 1/2 O2(g)", 1.5e308}}, "J/mol");
    });
    REQUIRE_ENGINE_ERROR(sum);
    CHECK(contains(sum.message, "the combined ΔH is inf"));
}

TEST_CASE("ΔrG° or log K that overflow are said by check() as dg() and logk() throw them", "[finite]") {
    // S of 1e306 J/(mol·K) is finite; T·ΔS at 400 K is not.
    const auto t = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"},
                                            {"O3", "g", "142.7", "1e306", "30", "200", "1000"}});
    const char* r = "2 O3(g) -> 3 O2(g)";
    const rxnheat::Conditions at{400, &t};
    CHECK(std::isfinite(eng().dh(r, at)));
    const auto dg = attempt([&] { return eng().dg(r, at); });
    REQUIRE_ENGINE_ERROR(dg);
    CHECK(contains(dg.message, "ΔrG°"));
    const auto logk = attempt([&] { return eng().logk(r, at); });
    REQUIRE_ENGINE_ERROR(logk);
    CHECK(eng().check(r, at) == dg.message);
    CHECK(logk.message == dg.message);
}

TEST_CASE("log K that overflows alone is said by check() as logk() throws it", "[finite]") {
    // At 1e-300 K, −ΔrG°/(R·T·ln 10) of −2e10 J/mol is about 1e309: ΔrG° is finite, log K is not.
    const auto t = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"},
                                            {"O3", "g", "1e7", "238.9", "30", "1e-300", "1000"},
                                            {"O2", "g", "0", "205.1", "29", "1e-300", "1000"}});
    const char* r = "2 O3(g) -> 3 O2(g)";
    const rxnheat::Conditions at{1e-300, &t};
    CHECK(std::isfinite(eng().dg(r, at)));
    const auto logk = attempt([&] { return eng().logk(r, at); });
    REQUIRE_ENGINE_ERROR(logk);
    INFO(logk.message);
    CHECK(contains(logk.message, "log K at 1e-300 K is not a finite number (inf)"));
    CHECK(eng().check(r, at) == logk.message);
}

TEST_CASE("H2O0.9999999 is not water, and the balance message shows the counts apart", "[composition]") {
    // The grammar reads 0.9999999 exactly (9999999/10000000); no record has that composition.
    const auto hf = attempt([] { return eng().species_hf("H2O0.9999999"); });
    REQUIRE_ENGINE_ERROR(hf);
    CHECK(hf.kind == ErrorKind::unknown_species);
    const auto src = attempt([] { return eng().source("H2O0.9999999"); });
    REQUIRE_ENGINE_ERROR(src);
    // The same count within 5e-7 of a whole number on the other side is no match either.
    const auto m = attempt([] { return eng().molar_mass("H2O0.9999999"); });
    CHECK(m.returned);  // a molar mass needs no record
    const std::string msg = eng().check("H2O0.9999999 -> H2O");
    INFO(msg);
    CHECK(contains(msg, "not balanced"));
    CHECK(contains(msg, "0.9999999"));
    CHECK_FALSE(contains(msg, "O 1 on the left, 1 on the right"));
    // Totals that are no decimal are shown as fractions: 2/3, not 0.666667.
    const std::string third = eng().check("1/3 O2 -> O");
    INFO(third);
    CHECK(contains(third, "O 2/3 on the left, 1 on the right"));
    const std::string tiny = eng().check("3 O2 -> 2 O3.0000001");
    INFO(tiny);
    CHECK(contains(tiny, "O 6 on the left, 6.0000002 on the right"));
}

TEST_CASE("scale() with a double factor throws only rxnheat::Error and keeps the factor exact", "[scale]") {
    const char* r = "H2 + 1/2 O2 -> H2O";
    // 1e-7 is 1/10000000 to 12 significant digits: written exactly.
    const auto small = attempt([&] { return eng().scale(r, 1e-7); });
    INFO(small.message);
    REQUIRE(small.returned);
    CHECK(small.text == "1/10000000 H2 + 1/20000000 O2 -> 1/10000000 H2O");
    // The text "1e-7" means the same.
    CHECK(eng().scale(r, "1e-7") == small.text);
    CHECK(eng().scale(r, "2.5E-1") == eng().scale(r, "1/4"));
    // 1e13 gives coefficients of 14 digits, which no reaction text may hold (grammar/SYNTAX.md:
    // 12 digits at most): an error in words, not the grammar's own exception.
    for (double f : {1e13, 1e300, DBL_MAX, 1e-300, 4.9e-324, 123456789.123456789}) {
        const auto o = attempt([&] { return eng().scale(r, f); });
        INFO(f << ": " << o.text << o.message);
        CHECK_FALSE(o.other_exception);
        if (o.engine_error) CHECK(o.kind == ErrorKind::argument);
    }
    const auto big = attempt([&] { return eng().scale(r, 1e13); });
    REQUIRE_ENGINE_ERROR(big);
    CHECK(contains(big.message, "12 digits"));
    for (const char* f : {"1e13", "1e-400", "1e400", "1e", "1e+", "1.5e-3.2", "e5", "1e99999999999999999999"}) {
        const auto o = attempt([&] { return eng().scale(r, std::string_view(f)); });
        INFO(f << ": " << o.text << o.message);
        REQUIRE_ENGINE_ERROR(o);
    }
}

TEST_CASE("temperature text at 0 K, denormal or underflowing is refused when read", "[temperature]") {
    for (const char* t : {"0", "0 K", "-0", "0.0 R", "-273.15 C", "-459.67 F"}) {
        const auto o = attempt([&] { return rxnheat::parse_temperature(t); });
        INFO(t << ": " << o.value << o.message);
        REQUIRE_ENGINE_ERROR(o);
        CHECK(o.kind == ErrorKind::argument);
        CHECK(contains(o.message, "absolute zero"));
    }
    for (const char* t : {"1e-310", "1e-310 K", "4.9e-324", "2e-308 R"}) {
        const auto o = attempt([&] { return rxnheat::parse_temperature(t); });
        INFO(t << ": " << o.value << o.message);
        REQUIRE_ENGINE_ERROR(o);
        CHECK(contains(o.message, "too close to 0 K"));
    }
    for (const char* t : {"1e-400", "1e-400 K", "-1e-400 C"}) {
        const auto o = attempt([&] { return rxnheat::parse_temperature(t); });
        INFO(t << ": " << o.value << o.message);
        // −1e-400 °C would be 273.15 K, but the number itself is not what was written: said.
        REQUIRE_ENGINE_ERROR(o);
        CHECK(contains(o.message, "underflows"));
        CHECK_FALSE(contains(o.message, "not a finite number"));
    }
    // Overflow still says it is not finite; small normal numbers are read.
    CHECK(contains(attempt([] { return rxnheat::parse_temperature("1e400"); }).message, "finite"));
    CHECK(rxnheat::parse_temperature("1e-300 K") == 1e-300);
    CHECK(rxnheat::parse_temperature("-0 C") == 273.15);
}

TEST_CASE("a number argument given as text that underflows says so", "[temperature][catalogue]") {
    // The command line hands every number over as text (HostRules::text_numbers).
    const rxnheat::FunctionSpec* f = rxnheat::find_function("RXNLOAD");
    REQUIRE(f);
    rxnheat::HostRules cli;
    cli.text_numbers = true;
    auto load = [&](const char* quantity) {
        return rxnheat::evaluate(*f, {rxnheat::Arg::of(std::string(CH4_COMB)), rxnheat::Arg::of(std::string(quantity)),
                                      rxnheat::Arg::of(std::string("kmol")), rxnheat::Arg::of(std::string("CH4"))},
                                 cli)
            .single();
    };
    for (const char* q : {"1e-400", "1e-320"}) {
        const auto o = load(q);
        INFO(q << ": " << o.number << " " << o.text);
        REQUIRE_FALSE(o.ok());
        CHECK(contains(o.text, "underflows"));
        CHECK(contains(o.text, "'quantity'"));
    }
    // 1e-300 kmol is small but a number: a value (−890 kJ/mol × 1e-297 mol, NASA Glenn data).
    const auto small = load("1e-300");
    REQUIRE(small.ok());
    CHECK(small.number < 0);
}

TEST_CASE("a denormal number from a cell is refused as its text is", "[finite]") {
    // Calc computes a denormal from =1E-300*1E-20 and hands it over as a number, where the command
    // line hands "1e-320" over as text (refused above as underflowing): both hosts refuse it.
    const double denormal = 1e-300 * 1e-20;
    REQUIRE(std::fpclassify(denormal) == FP_SUBNORMAL);
    const rxnheat::HostRules calc;  // numbers as numbers
    const auto call = [&](const char* name, std::vector<rxnheat::Arg> args) {
        const rxnheat::FunctionSpec* f = rxnheat::find_function(name);
        REQUIRE(f);
        return rxnheat::evaluate(*f, args, calc).single();
    };
    const auto r = rxnheat::Arg::of(std::string(CH4_COMB));
    const auto load = call("RXNLOAD", {r, rxnheat::Arg::of(denormal), rxnheat::Arg::of(std::string("kmol")),
                                       rxnheat::Arg::of(std::string("CH4"))});
    INFO(load.text);
    REQUIRE_FALSE(load.ok());
    CHECK(contains(load.text, "denormal"));
    CHECK(contains(load.text, "'quantity'"));
    const auto source = call("RXNSOURCE", {r, rxnheat::Arg{}, rxnheat::Arg::of(denormal)});
    INFO(source.text);
    REQUIRE_FALSE(source.ok());
    CHECK(contains(source.text, "denormal"));
    // The smallest normal double is still a number.
    const auto tiny = call("RXNLOAD", {r, rxnheat::Arg::of(DBL_MIN), rxnheat::Arg::of(std::string("kmol")),
                                       rxnheat::Arg::of(std::string("CH4"))});
    INFO(tiny.text);
    CHECK(tiny.ok());
}
