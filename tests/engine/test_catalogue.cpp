// The function catalogue (catalogue.hpp): the one set of argument rules every host goes through
// (omitted, blank, Calc's 0-as-blank, the CLI's text numbers, 1×1 ranges, ranges that spread
// into arrays and how shapes combine), RXNCHECK/RXNWHY answering in words, tables given as
// ranges, the Engine's own cache, and the well-formedness of every catalogue row.
//
// Expected numbers are checked against Engine's own functions called directly (the catalogue
// must add nothing to them) or against outside sources named beside each check.
#include <catch2/catch.hpp>

#include "behaviour_helpers.hpp"  // periodictable_masses (python3-periodictable)

#include <rxnheat/catalogue.hpp>
#include <rxnheat/rxnheat.hpp>

#include <cmath>
#include <functional>
#include <map>
#include <memory>
#include <set>
#include <string>
#include <vector>

using rxnheat::Arg;
using rxnheat::Cell;
using rxnheat::Engine;
using rxnheat::ErrorKind;
using rxnheat::HostRules;
using rxnheat::Result;

namespace {

const HostRules calc{true, false, "Calc add-in"};      // as the add-in passes them
const HostRules cli{false, true, "command line"};      // as the CLI passes them

const char* const CH4 = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";
const char* const WGS = "CO(g) + H2O(g) -> CO2(g) + H2(g)";
const char* const NH3 = "N2(g) + 3 H2(g) -> 2 NH3(g)";
const char* const UNBALANCED = "H2(g) + O2(g) -> H2O(l)";

Engine& eng() { return Engine::shared(); }

const rxnheat::FunctionSpec& fn(const char* name) {
    const rxnheat::FunctionSpec* f = rxnheat::find_function(name);
    INFO("function " << name);
    REQUIRE(f != nullptr);
    return *f;
}

Arg text(const char* s) { return Arg::of(std::string(s)); }
Arg num(double x) { return Arg::of(x); }
Arg empty_cell() { return Arg::of(Cell{}); }
Cell t(const char* s) { return Cell::of(std::string(s)); }
Cell n(double x) { return Cell::of(x); }

Result eval(const char* name, const std::vector<Arg>& args, const HostRules& rules = calc, Engine& e = eng()) {
    return rxnheat::evaluate(fn(name), args, rules, e);
}

/// The single outcome of a call that must not be an array.
rxnheat::Outcome one(const char* name, const std::vector<Arg>& args, const HostRules& rules = calc,
                     Engine& e = eng()) {
    const Result r = eval(name, args, rules, e);
    REQUIRE_FALSE(r.is_array());
    REQUIRE(r.cells.size() == 1);
    return r.single();
}

double number_of(const rxnheat::Outcome& o) {
    INFO("outcome text: " << o.text);
    REQUIRE(o.kind == rxnheat::Outcome::Kind::number);
    return o.number;
}

bool has(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

}  // namespace

// ================================================================================================
TEST_CASE("optional arguments: omitted, empty, blank text and Calc's 0 mean the default", "[catalogue][args]") {
    const double at298 = eng().dh(CH4);  // Engine::dh directly
    // CODATA Key Values (Cox et al. 1989) via the NASA Glenn data: −890.57 kJ/mol.
    CHECK(at298 == Approx(-890.57).margin(0.01));
    for (const Arg& blank : {Arg::omitted(), empty_cell(), text(""), text("   "), num(0)}) {
        const rxnheat::Outcome o = one("RXNDH", {text(CH4), blank}, calc);
        CHECK(number_of(o) == at298);   // 298.15 K by default (catalogue.hpp, engine/FUNCTIONS.md)
        CHECK(o.unit == "kJ/mol");      // the default unit
    }
    // The CLI (and C) keep 0 as 0: a temperature of 0 K is an error, not the default.
    const rxnheat::Outcome zero_cli = one("RXNDH", {text(CH4), num(0)}, cli);
    CHECK(zero_cli.kind == rxnheat::Outcome::Kind::error);  // HostRules: zero_is_blank off
    // Blank unit and per: kJ/mol per mole of reaction.
    CHECK(number_of(one("RXNDH", {text(CH4), Arg::omitted(), text(" "), empty_cell()}, calc)) == at298);
    CHECK(number_of(one("RXNDH", {text(CH4), Arg::omitted(), num(0), num(0)}, calc)) == at298);  // Calc 0 = blank
    // A given temperature, as a number or as text with a unit, is Engine::dh at that temperature.
    CHECK(number_of(one("RXNDH", {text(WGS), num(1000)}, calc)) == eng().dh(WGS, 1000));
    CHECK(number_of(one("RXNDH", {text(WGS), text("450 C")}, calc)) == eng().dh(WGS, rxnheat::parse_temperature("450 C")));
    // RXNLOAD: a blank result unit picks kJ (a total) and kW (a flow).
    CHECK(one("RXNLOAD", {text(CH4), num(2), text("mol"), text("CH4(g)"), text("")}, calc).unit == "kJ");
    CHECK(one("RXNLOAD", {text(CH4), num(2), text("kmol/h"), text("CH4(g)"), num(0)}, calc).unit == "kW");
}

TEST_CASE("a required argument: 0 is kept, blank is an error naming it", "[catalogue][args]") {
    // RXNLOAD's quantity is a required number: Calc's 0 there is 0 kJ, not "not given".
    const rxnheat::Outcome zero = one("RXNLOAD", {text(CH4), num(0), text("mol"), text("CH4(g)")}, calc);
    CHECK(number_of(zero) == 0.0);  // 0 mol react: no heat (arithmetic)
    CHECK(number_of(one("RXNLOAD", {text(CH4), num(2.5), text("mol"), text("CH4(g)")}, calc)) ==
          eng().load(CH4, 2.5, "mol", "CH4(g)"));  // Engine::load directly
    // RXNSCALE's factor is required: 0 reaches the engine (which refuses it), not the default.
    const rxnheat::Outcome scale0 = one("RXNSCALE", {text(NH3), num(0)}, calc);
    INFO(scale0.text);
    CHECK(scale0.kind == rxnheat::Outcome::Kind::error);
    CHECK_FALSE(has(scale0.text, "required"));
    // Omitted or empty: an error naming the argument and its position.
    const rxnheat::Outcome missing = one("RXNLOAD", {text(CH4), Arg::omitted(), text("mol"), text("CH4(g)")}, calc);
    CHECK(missing.kind == rxnheat::Outcome::Kind::error);
    CHECK(has(missing.text, "'quantity' is required"));
    CHECK(missing.argument == 2);
    const rxnheat::Outcome no_key = one("RXNLOAD", {text(CH4), num(1), text("mol"), text("  ")}, calc);
    CHECK(has(no_key.text, "'key' is required"));
    CHECK(no_key.argument == 4);
    const rxnheat::Outcome no_T = one("SPECIESCP", {text("N2(g)"), Arg::omitted()}, calc);
    CHECK(has(no_T.text, "'temperature' is required"));
}

TEST_CASE("the CLI reads text numbers strictly, and Calc wants numbers", "[catalogue][args]") {
    CHECK(number_of(one("RXNLOAD", {text(CH4), text("2.5"), text("mol"), text("CH4(g)")}, cli)) ==
          eng().load(CH4, 2.5, "mol", "CH4(g)"));  // Engine::load directly
    const rxnheat::Outcome sloppy = one("RXNLOAD", {text(CH4), text("2.5x"), text("mol"), text("CH4(g)")}, cli);
    CHECK(sloppy.kind == rxnheat::Outcome::Kind::error);
    CHECK(has(sloppy.text, "'quantity' must be a number, not '2.5x'"));
    const rxnheat::Outcome in_calc = one("RXNLOAD", {text(CH4), text("2.5"), text("mol"), text("CH4(g)")}, calc);
    CHECK(has(in_calc.text, "'quantity' must be a number, not text"));
    // Text where text belongs: a number is an error in either host.
    CHECK(has(one("RXNDH", {num(5)}, calc).text, "'reaction' must be text, not a number"));
    CHECK(has(one("RXNDH", {text(CH4), Arg::omitted(), num(5)}, cli).text, "'unit' must be text, not a number"));
    // A non-finite number is refused before the engine sees it.
    CHECK(has(one("RXNLOAD", {text(CH4), num(INFINITY), text("mol"), text("CH4(g)")}, calc).text,
              "'quantity' is not a finite number"));
}

TEST_CASE("a 1×1 range is its cell, and a range where one value belongs is an error", "[catalogue][ranges]") {
    const double dh = eng().dh(CH4);
    // Non-spreading arguments (unit, per, quantity) given as 1×1 ranges.
    CHECK(number_of(one("RXNDH", {text(CH4), Arg::omitted(), Arg::range(1, 1, {t("J/mol")})}, calc)) ==
          eng().dh(CH4, rxnheat::T_ref, "J/mol"));
    CHECK(number_of(one("RXNLOAD", {text(CH4), Arg::range(1, 1, {n(3)}), text("mol"), Arg::range(1, 1, {t("O2(g)")})},
                        calc)) == eng().load(CH4, 3, "mol", "O2(g)"));
    // A spreading argument given as a 1×1 range: one value, the cell's.
    const Result r = eval("RXNDH", {Arg::range(1, 1, {t(CH4)})}, calc);
    REQUIRE(r.cells.size() == 1);
    CHECK(number_of(r.cells[0]) == dh);
    // A range of 2 cells where a single value belongs: an error naming the argument and the count.
    const rxnheat::Outcome two = one("RXNDH", {text(CH4), Arg::omitted(), Arg::range(1, 2, {t("kJ/mol"), t("J/mol")})}, calc);
    INFO(two.text);
    CHECK(two.kind == rxnheat::Outcome::Kind::error);
    CHECK(has(two.text, "'unit' must be a single value, not a range of 2 cells"));
    CHECK(two.argument == 3);
    const rxnheat::Outcome six = one("RXNLOAD", {text(CH4), Arg::range(2, 3, {n(1), n(2), n(3), n(4), n(5), n(6)}),
                                                 text("mol"), text("CH4(g)")}, calc);
    CHECK(has(six.text, "'quantity' must be a single value, not a range of 6 cells"));
    CHECK(six.argument == 2);
}

TEST_CASE("a range of reactions gives an array of its shape", "[catalogue][ranges]") {
    // 2×2: a good reaction, a blank cell, an unbalanced one, another good one; at 1000 K is out
    // of H2O(l)'s range, so 700 K is used for the gases (thermo.inp H2O(L) ends at 600 K).
    const Result r = eval("RXNDH", {Arg::range(2, 2, {t(WGS), Cell{}, t(UNBALANCED), t(NH3)}), num(700)}, calc);
    REQUIRE(r.is_array());
    CHECK(r.rows == 2);
    CHECK(r.cols == 2);
    REQUIRE(r.cells.size() == 4);
    CHECK(number_of(r.cells[0]) == eng().dh(WGS, 700));                 // Engine::dh directly
    CHECK(r.cells[1].kind == rxnheat::Outcome::Kind::empty);            // a blank cell stays blank
    CHECK(r.cells[2].kind == rxnheat::Outcome::Kind::error);            // the failing element fails alone
    CHECK(r.cells[2].error == ErrorKind::unbalanced);
    CHECK(r.cells[2].text == eng().check(UNBALANCED, 700));             // the same diagnosis as RXNCHECK
    CHECK(number_of(r.cells[3]) == eng().dh(NH3, 700));                 // Engine::dh directly
    // Blank text and Calc's 0 in a range of reactions are blank too.
    const Result b = eval("RXNDH", {Arg::range(3, 1, {t("  "), n(0), t(CH4)})}, calc);
    REQUIRE(b.cells.size() == 3);
    CHECK(b.cells[0].kind == rxnheat::Outcome::Kind::empty);
    CHECK(b.cells[1].kind == rxnheat::Outcome::Kind::empty);
    CHECK(number_of(b.cells[2]) == eng().dh(CH4));
    // MOLARMASS spreads too (python3-periodictable, IUPAC atomic weights).
    const auto pt = rxnheat_test::periodictable_masses({"CH4", "CuSO4(H2O)5"});
    const Result m = eval("MOLARMASS", {Arg::range(1, 3, {t("CH4"), t("Xx2"), t("CuSO4·5H2O")})}, calc);
    REQUIRE(m.cells.size() == 3);
    CHECK(number_of(m.cells[0]) == Approx(pt[0]).margin(0.01));  // python3-periodictable
    CHECK(m.cells[1].kind == rxnheat::Outcome::Kind::error);     // not an element symbol (grammar/SYNTAX.md)
    CHECK(number_of(m.cells[2]) == Approx(pt[1]).margin(0.01));  // python3-periodictable
}

TEST_CASE("a column of reactions with a row of temperatures gives the whole table", "[catalogue][ranges]") {
    const char* reactions[] = {WGS, NH3, "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)"};
    const double temps[] = {500, rxnheat::parse_temperature("450 C"), 1000};
    const Result r = eval("RXNDH",
                          {Arg::range(3, 1, {t(reactions[0]), t(reactions[1]), t(reactions[2])}),
                           Arg::range(1, 3, {n(500), t("450 C"), n(1000)})},
                          calc);
    REQUIRE(r.is_array());
    REQUIRE(r.rows == 3);
    REQUIRE(r.cols == 3);
    for (std::size_t i = 0; i < 3; ++i)
        for (std::size_t j = 0; j < 3; ++j) {
            INFO("row " << i + 1 << ", column " << j + 1);
            CHECK(number_of(r.cells[i * 3 + j]) == eng().dh(reactions[i], temps[j]));  // Engine::dh directly
        }
    // The same from the CLI's text-only values.
    const Result c = eval("RXNDH", {Arg::range(3, 1, {t(reactions[0]), t(reactions[1]), t(reactions[2])}),
                                    Arg::range(1, 3, {t("500"), t("450 C"), t("1000 K")})},
                          cli);
    REQUIRE(c.cells.size() == 9);
    CHECK(number_of(c.cells[5]) == eng().dh(reactions[1], 1000));
}

TEST_CASE("ranges of one shape pair cell by cell, and other shapes are an error in words", "[catalogue][ranges]") {
    const Result r = eval("RXNDH", {Arg::range(2, 1, {t(WGS), t(NH3)}), Arg::range(2, 1, {n(600), n(800)})}, calc);
    REQUIRE(r.rows == 2);
    REQUIRE(r.cols == 1);
    CHECK(number_of(r.cells[0]) == eng().dh(WGS, 600));  // Engine::dh directly
    CHECK(number_of(r.cells[1]) == eng().dh(NH3, 800));  // Engine::dh directly
    // SPECIESH: a row of species with a row of temperatures.
    const Result h = eval("SPECIESH", {Arg::range(1, 2, {t("N2(g)"), t("O2(g)")}), Arg::range(1, 2, {n(500), n(700)})}, calc);
    REQUIRE(h.cells.size() == 2);
    CHECK(number_of(h.cells[0]) == eng().species_h("N2(g)", 500));
    CHECK(number_of(h.cells[1]) == eng().species_h("O2(g)", 700));
    // 2×1 with 3×1, and a row with a column (the wrong way round): errors in words.
    for (const auto& shapes : {std::vector<Arg>{Arg::range(2, 1, {t(WGS), t(NH3)}), Arg::range(3, 1, {n(500), n(600), n(700)})},
                               std::vector<Arg>{Arg::range(1, 2, {t(WGS), t(NH3)}), Arg::range(2, 1, {n(500), n(600)})}}) {
        const rxnheat::Outcome o = one("RXNDH", shapes, calc);
        INFO(o.text);
        CHECK(o.kind == rxnheat::Outcome::Kind::error);
        CHECK(o.error == ErrorKind::argument);
        CHECK(has(o.text, "do not combine"));
        CHECK(has(o.text, "'reaction'"));
        CHECK(has(o.text, "'temperature'"));
        CHECK(o.argument == 2);
    }
    CHECK(has(one("RXNDH", {Arg::range(2, 1, {t(WGS), t(NH3)}), Arg::range(3, 1, {n(500), n(600), n(700)})}).text,
              "a range of 2×1 cells for 'reaction' and one of 3×1 for 'temperature'"));
}

TEST_CASE("a temperature below absolute zero is an error as a number as well as text", "[catalogue][args]") {
    // Found by tests/addin/test_hostile.py: RXNSOURCE with the cell number -1 (or -1e308) as its
    // temperature listed its sources, while the command line's "-1" was an error.
    for (const double T : {-1.0, -1e308, -273.15}) {
        INFO("T = " << T);
        const auto as_number = one("RXNSOURCE", {text(CH4), Arg::omitted(), num(T)});
        CHECK(as_number.kind == rxnheat::Outcome::Kind::error);
        CHECK(has(as_number.text, "temperature"));
        const auto as_text = one("RXNSOURCE", {text(CH4), Arg::omitted(), text(std::to_string(T).c_str())}, cli);
        CHECK(as_text.kind == rxnheat::Outcome::Kind::error);
    }
    CHECK(one("RXNSOURCE", {text(CH4), Arg::omitted(), num(500)}).kind == rxnheat::Outcome::Kind::text);
}

TEST_CASE("too many arguments is an error", "[catalogue][args]") {
    const rxnheat::Outcome o = one("RXNREVERSE", {text(CH4), text("extra")}, calc);
    CHECK(o.kind == rxnheat::Outcome::Kind::error);
    CHECK(has(o.text, "RXNREVERSE takes at most 1 arguments, not 2"));
    CHECK(one("RXNVERSION", {num(1)}, calc).kind == rxnheat::Outcome::Kind::error);
    CHECK(one("RXNDH", {text(CH4), num(298.15), text("kJ/mol"), empty_cell(), Arg::omitted(), num(1)}, calc).kind ==
          rxnheat::Outcome::Kind::error);  // RXNDH takes 5
    // RXNWHY takes any number (its `arguments` are the diagnosed call's).
    CHECK(one("RXNWHY", {text("RXNDH"), text(CH4), Arg::omitted(), Arg::omitted(), Arg::omitted()}, calc).text == "ok");
}

TEST_CASE("RXNCHECK answers every problem as text", "[catalogue][check]") {
    const rxnheat::Outcome ok = one("RXNCHECK", {text(CH4)}, calc);
    CHECK(ok.kind == rxnheat::Outcome::Kind::text);
    CHECK(ok.text == "ok");
    const rxnheat::Outcome bad = one("RXNCHECK", {text(UNBALANCED)}, calc);
    CHECK(bad.kind == rxnheat::Outcome::Kind::text);              // errors_as_text: not an error
    CHECK(bad.text == eng().check(UNBALANCED));                   // the same words as Engine::check
    const rxnheat::Outcome hot = one("RXNCHECK", {text(CH4), num(1000)}, calc);
    CHECK(hot.text == eng().check(CH4, 1000));                    // H2O(l) ends at 600 K (thermo.inp)
    CHECK(has(hot.text, "600"));
    // Argument problems are words too.
    const rxnheat::Outcome many = one("RXNCHECK", {text(CH4), num(300), Arg::omitted(), num(1)}, calc);
    CHECK(many.kind == rxnheat::Outcome::Kind::text);
    CHECK(has(many.text, "at most 3"));
    const rxnheat::Outcome empty = one("RXNCHECK", {text(" ")}, calc);
    CHECK(empty.kind == rxnheat::Outcome::Kind::text);
    CHECK(has(empty.text, "'reaction' is required"));
    // Over a range: an array of texts, blank cells blank.
    const Result r = eval("RXNCHECK", {Arg::range(1, 3, {t(CH4), Cell{}, t(UNBALANCED)})}, calc);
    REQUIRE(r.cells.size() == 3);
    CHECK(r.cells[0].text == "ok");
    CHECK(r.cells[1].kind == rxnheat::Outcome::Kind::empty);
    CHECK(r.cells[2].kind == rxnheat::Outcome::Kind::text);
    CHECK(r.cells[2].text == eng().check(UNBALANCED));
}

TEST_CASE("RXNWHY says ok, or exactly what is wrong", "[catalogue][why]") {
    // An unknown unit is named.
    const rxnheat::Outcome unit = one("RXNWHY", {text("RXNDH"), text(CH4), Arg::omitted(), text("kg/hr")}, calc);
    INFO(unit.text);
    CHECK(unit.kind == rxnheat::Outcome::Kind::text);
    CHECK(has(unit.text, "'kg/hr'"));
    // why() gives the same words as RXNWHY.
    CHECK(rxnheat::why(fn("RXNDH"), {text(CH4), Arg::omitted(), text("kg/hr")}, calc) == unit.text);
    // RXNLOAD's own unit: a mass flow is fine; a bad quantity unit is named.
    CHECK(has(one("RXNWHY", {text("RXNLOAD"), text(CH4), num(100), text("kg/hour"), text("CH4(g)")}, calc).text,
              "'kg/hour'"));
    // 'hr' is the trade's spelling of the hour: accepted.
    CHECK(one("RXNWHY", {text("RXNLOAD"), text(CH4), num(100), text("kg/hr"), text("CH4(g)")}, calc).text == "ok");
    CHECK(one("RXNWHY", {text("RXNLOAD"), text(CH4), num(100), text("kg/h"), text("CH4(g)")}, calc).text == "ok");
    // An unknown function: named, and the functions listed.
    const rxnheat::Outcome none = one("RXNWHY", {text("RXNDHH"), text(CH4)}, calc);
    CHECK(has(none.text, "there is no rxnheat function 'RXNDHH'"));
    for (const auto& f : rxnheat::catalogue()) CHECK(has(none.text, f.calc_name));
    // A good call.
    CHECK(one("RXNWHY", {text("RXNDH"), text(CH4)}, calc).text == "ok");
    CHECK(one("RXNWHY", {text("rxndh"), text(CH4)}, calc).text == "ok");  // Calc names: ASCII case-insensitive
    CHECK(one("RXNWHY", {text("dh"), text(CH4)}, cli).text == "ok");      // the CLI command names it too
    // An array's failing element, by row and column.
    const rxnheat::Outcome arr = one("RXNWHY", {text("RXNDH"), Arg::range(2, 2, {t(WGS), t(NH3), t(UNBALANCED), Cell{}}), num(700)}, calc);
    INFO(arr.text);
    CHECK(arr.text == "row 2, column 1 of the array: " + eng().check(UNBALANCED, 700));
    // The argument at fault is named.
    CHECK(has(one("RXNWHY", {text("RXNLOAD"), text(CH4), Arg::omitted(), text("mol"), text("CH4(g)")}, calc).text,
              "'quantity' is required"));
}

TEST_CASE("a species table given as a range, and headers are part of its identity", "[catalogue][table]") {
    const char* const XEF6 = "Xe(g) + 3 F2(g) -> XeF6(g)";
    // Row values are our own test values (an invented row; elements are 0 by definition).
    const Arg a = Arg::range(2, 4, {t("formula"), t("phase"), t("dHf"), t("S"), t("XeF6"), t("g"), n(-279), n(300)});
    const Arg b = Arg::range(2, 4, {t("formula"), t("phase"), t("S"), t("dHf"), t("XeF6"), t("g"), n(-279), n(300)});
    Engine own(rxnheat::EngineOptions{64});
    CHECK(number_of(one("RXNDH", {text(XEF6), Arg::omitted(), Arg::omitted(), Arg::omitted(), a}, calc, own)) ==
          Approx(-279).margin(1e-9));  // the table's dHf
    CHECK(number_of(one("RXNDH", {text(XEF6), Arg::omitted(), Arg::omitted(), Arg::omitted(), b}, calc, own)) ==
          Approx(300).margin(1e-9));   // the same cells, dHf now the last column
    CHECK(number_of(one("RXNDH", {text(XEF6), Arg::omitted(), Arg::omitted(), Arg::omitted(), a}, calc, own)) ==
          Approx(-279).margin(1e-9));  // and back: no cached result shared between them
    // The fingerprints: the header counts; the same content gives the same fingerprint.
    const auto ta = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-279", "300"}});
    const auto tb = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "S", "dHf"}, {"XeF6", "g", "-279", "300"}});
    const auto ta2 = rxnheat::SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-279", "300"}});
    CHECK(ta.fingerprint() != tb.fingerprint());
    CHECK(ta.fingerprint() == ta2.fingerprint());
    // A table through Arg::of(table) (the CLI's --table) gives the same as the range.
    auto shared = std::make_shared<const rxnheat::SpeciesTable>(ta);
    CHECK(number_of(one("SPECIESHF", {text("XeF6(g)"), Arg::omitted(), Arg::omitted(), Arg::of(shared)}, cli)) ==
          Approx(-279).margin(1e-9));
    // Without the table there are no data for XeF6(g).
    CHECK(one("RXNDH", {text(XEF6)}, calc).error == ErrorKind::unknown_species);
    // A malformed table is an error naming row and column, on the table argument.
    const rxnheat::Outcome bad = one("RXNDH", {text(XEF6), Arg::omitted(), Arg::omitted(), Arg::omitted(),
                                               Arg::range(2, 3, {t("formula"), t("phase"), t("dHf"), t("XeF6"), t("g"), t("abc")})}, calc);
    INFO(bad.text);
    CHECK(bad.error == ErrorKind::table);
    CHECK(has(bad.text, "dHf"));
    CHECK(bad.argument == 5);
    // A single cell where a table belongs.
    CHECK(one("RXNDH", {text(XEF6), Arg::omitted(), Arg::omitted(), Arg::omitted(), text("mytable")}, calc).error ==
          ErrorKind::argument);
}

TEST_CASE("tables read from ranges are kept by their cells: one changed cell is another table", "[catalogue][table]") {
    // Row values are our own test values (an invented row), as above.
    const char* const XEF6 = "Xe(g) + 3 F2(g) -> XeF6(g)";
    const auto range = [](Cell dHf) {
        return Arg::range(2, 4, {t("formula"), t("phase"), t("dHf"), t("S"), t("XeF6"), t("g"), std::move(dHf), n(300)});
    };
    const auto dh = [&](const Arg& table) {
        return one("RXNDH", {text(XEF6), Arg::omitted(), Arg::omitted(), Arg::omitted(), table}, calc);
    };
    // Alternating between two ranges that differ in one digit of one cell: each gets its own table.
    for (int round = 0; round < 3; ++round) {
        CHECK(number_of(dh(range(n(-279)))) == Approx(-279).margin(1e-9));
        CHECK(number_of(dh(range(n(-279.5)))) == Approx(-279.5).margin(1e-9));
    }
    // The number −279 and the text "-279" are read alike: the same table either way.
    CHECK(number_of(dh(range(t("-279")))) == Approx(-279).margin(1e-9));
    // The same cells in another shape are another table (here a malformed one), and the first
    // shape still reads as before.
    const Arg tall = Arg::range(4, 2, {t("formula"), t("phase"), t("dHf"), t("S"), t("XeF6"), t("g"), n(-279), n(300)});
    CHECK(dh(tall).error == ErrorKind::table);
    CHECK(number_of(dh(range(n(-279)))) == Approx(-279).margin(1e-9));
    // Texts that would read the same run together are told apart ("XeF6" + "g" and "XeF6g" + "").
    const Arg run_in = Arg::range(2, 4, {t("formula"), t("phase"), t("dHf"), t("S"), t("XeF6g"), t(""), n(-279), n(300)});
    CHECK(dh(run_in).kind == rxnheat::Outcome::Kind::error);
    CHECK(number_of(dh(range(n(-279)))) == Approx(-279).margin(1e-9));
}

TEST_CASE("the Engine's own cache: sized, observable, clearable", "[catalogue][cache]") {
    Engine small(rxnheat::EngineOptions{8});
    auto s = small.cache_stats();
    CHECK(s.capacity == 8);
    CHECK(s.entries == 0);
    CHECK(s.hits == 0);
    CHECK(s.misses == 0);
    const double first = small.dh(WGS, 1000);
    s = small.cache_stats();
    CHECK(s.misses == 1);
    CHECK(s.hits == 0);
    CHECK(s.entries == 1);
    CHECK(small.dh(WGS, 1000) == first);
    CHECK(small.dh(WGS, 700) == eng().dh(WGS, 700));  // the key is the text, not the temperature
    s = small.cache_stats();
    CHECK(s.hits == 2);
    CHECK(s.misses == 1);
    CHECK(first == eng().dh(WGS, 1000));  // its own cache, the same data: the same value
    // More distinct texts than the capacity: entries stay within it.
    for (int i = 0; i < 20; ++i) small.dh(WGS + std::string(static_cast<std::size_t>(i + 1), ' '), 1000);
    CHECK(small.cache_stats().entries == 8);
    // evaluate() uses the engine it is given.
    const std::size_t misses_before = small.cache_stats().misses;
    CHECK(number_of(one("RXNDH", {text(NH3), num(700)}, calc, small)) == eng().dh(NH3, 700));
    CHECK(small.cache_stats().misses == misses_before + 1);
    small.clear_cache();
    CHECK(small.cache_stats().entries == 0);
    CHECK(small.dh(WGS, 1000) == first);  // cleared, recomputed: the same value
    // No cache at all.
    Engine none(rxnheat::EngineOptions{0});
    CHECK(none.cache_stats().capacity == 0);
    CHECK(none.dh(WGS, 1000) == first);
    CHECK(none.dh(WGS, 1000) == first);
    CHECK(none.cache_stats().entries == 0);
    CHECK(none.cache_stats().hits == 0);
}

TEST_CASE("every catalogue row is well-formed", "[catalogue][rows]") {
    const auto& all = rxnheat::catalogue();
    // engine/FUNCTIONS.md: the cell functions that exist today, written out by hand.
    const std::set<std::string> spec = {"RXNDH",     "RXNDU",     "RXNDS",     "RXNDG",     "RXNLOGK",   "RXNLOAD",   "RXNKIND",   "RXNCHECK",
                                        "RXNBALANCE", "RXNREVERSE", "RXNSCALE", "RXNWHY",    "SPECIESHF",
                                        "SPECIESCP", "SPECIESH",  "MOLARMASS", "RXNEQX",    "RXNHESS", "RXNHESSPLAN", "STEAMTSAT", "STEAMPSAT",
                                        "STEAMH",    "STEAMLATENT", "FUELHV", "STREAMH",   "RXNDUTY", "RXNTAD", "RXNSOURCE", "RXNVERSION"};
    std::set<std::string> calc_names, idl, commands;
    for (const auto& f : all) {
        INFO("function " << (f.calc_name ? f.calc_name : "(null)"));
        REQUIRE(f.calc_name != nullptr);
        REQUIRE(f.idl_method != nullptr);
        REQUIRE(f.cli_command != nullptr);
        CHECK(calc_names.insert(f.calc_name).second);  // unique
        CHECK(idl.insert(f.idl_method).second);        // unique
        CHECK(commands.insert(f.cli_command).second);  // unique
        CHECK(std::string(f.summary).size() > 0);
        CHECK(std::string(f.description).size() > 0);
        CHECK(rxnheat::find_function(f.calc_name) == &f);
        CHECK(rxnheat::find_function(f.idl_method) == &f);
        CHECK(rxnheat::find_function(f.cli_command) == &f);
        bool optional_seen = false;
        for (std::size_t i = 0; i < f.args.size(); ++i) {
            const auto& a = f.args[i];
            INFO("argument " << i + 1 << " " << a.name);
            CHECK(std::string(a.name).size() > 0);
            CHECK(std::string(a.help).size() > 0);
            if (a.kind == rxnheat::ArgKind::rest) {
                CHECK(i + 1 == f.args.size());  // rest comes last
                continue;
            }
            if (!a.required) optional_seen = true;
            else CHECK_FALSE(optional_seen);  // every required argument before the optional ones
        }
    }
    CHECK(calc_names == spec);  // the hand-written list
    CHECK(all.size() == spec.size());
}

TEST_CASE("every catalogue row's call works on a sample input", "[catalogue][rows]") {
    const double dh = eng().dh(CH4);
    const auto pt = rxnheat_test::periodictable_masses({"CH4"});
    struct Sample {
        std::vector<Arg> args;
        std::function<void(const rxnheat::Outcome&)> check;
    };
    const std::map<std::string, Sample> samples = {
        {"RXNDH", {{text(CH4)}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(-890.57).margin(0.01));  // CODATA Key Values via NASA Glenn
         }}},
        {"RXNDU", {{text(CH4)}, [](const rxnheat::Outcome& o) { CHECK(o.number == eng().du(CH4)); }}},
        {"RXNDS", {{text("N2(g) + 3 H2(g) -> 2 NH3(g)")}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(-198.10).margin(0.2));  // NIST-JANAF 4th ed. S° at 298.15 K, from memory
             CHECK(o.unit == "J/(mol·K)");
         }}},
        {"RXNDG", {{text("N2(g) + 3 H2(g) -> 2 NH3(g)")}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(-32.73).margin(0.15));  // NIST-JANAF 4th ed. 2·ΔfG°(NH3), from memory
         }}},
        {"RXNLOGK", {{text("N2(g) + 3 H2(g) -> 2 NH3(g)"), num(700)}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(-4.058).margin(0.03));  // NIST-JANAF 4th ed. 2·log Kf(NH3, 700 K), from memory
             CHECK(o.unit.empty());
         }}},
        {"RXNLOAD", {{text(CH4), num(36), text("kmol/h"), text("CH4(g)")}, [&](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(10 * dh).epsilon(1e-12));  // 36 kmol/h = 10 mol/s (arithmetic)
             CHECK(o.unit == "kW");
         }}},
        {"RXNKIND", {{text(CH4)}, [](const rxnheat::Outcome& o) { CHECK(o.text == "exothermic"); }}},  // ΔH < 0
        {"RXNCHECK", {{text(CH4)}, [](const rxnheat::Outcome& o) { CHECK(o.text == "ok"); }}},
        {"RXNBALANCE", {{text("H2 + O2 -> H2O")}, [](const rxnheat::Outcome& o) {
             CHECK(o.text == "2 H2 + O2 -> 2 H2O");  // balanced by hand (atom counting)
         }}},
        {"RXNREVERSE", {{text(CH4)}, [](const rxnheat::Outcome& o) { CHECK(o.text == eng().reverse(CH4)); }}},
        {"RXNSCALE", {{text("2 H2(g) + O2(g) -> 2 H2O(l)"), text("1/2")}, [](const rxnheat::Outcome& o) {
             CHECK(has(o.text, "1/2 O2(g)"));  // engine/FUNCTIONS.md, RXNSCALE: exact fractions kept
         }}},
        {"RXNWHY", {{text("RXNDH"), text(CH4)}, [](const rxnheat::Outcome& o) { CHECK(o.text == "ok"); }}},
        {"SPECIESHF", {{text("CO2(g)")}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(-393.51).margin(0.01));  // CODATA Key Values (Cox et al. 1989), from memory
         }}},
        {"SPECIESCP", {{text("N2(g)"), num(500)}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(29.58).margin(0.05));  // NIST-JANAF 4th ed. N2 at 500 K, from memory
         }}},
        {"SPECIESH", {{text("N2(g)"), num(500)}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(5.912).margin(0.01));  // NIST-JANAF 4th ed., from memory
         }}},
        {"MOLARMASS", {{text("CH4")}, [&](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(pt[0]).margin(0.01));  // python3-periodictable
             CHECK(o.unit == "g/mol");
         }}},
        {"RXNEQX", {{text("N2O4(g) <=> 2 NO2(g)"), num(298.15), num(1),
                     Arg::range(1, 2, {rxnheat::Cell::of("N2O4"), rxnheat::Cell::of(1.0)})},
                    [](const rxnheat::Outcome& o) {
             // ΔrG° 4.73 kJ/mol (NBS tables, Wagman et al. 1982, from memory): K 0.148, ξ = sqrt(K/(K+4)) = 0.19
             CHECK(o.number == Approx(0.19).margin(0.02));
             CHECK(o.unit.empty());
         }}},
        {"STEAMTSAT", {{text("1 MPa")}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(453.035632).margin(5e-7));  // IAPWS-IF97 release, Table 36
             CHECK(o.unit == "K");
         }}},
        {"STEAMPSAT", {{num(500)}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(26.3889776).margin(5e-7));  // IAPWS-IF97 release, Table 35 (2.63889776 MPa)
             CHECK(o.unit == "bar");
         }}},
        {"STEAMH", {{text("3 MPa"), num(500)}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(975.542239).margin(5e-7));  // IAPWS-IF97 release, Table 5
             CHECK(o.unit == "kJ/kg");
         }}},
        {"STEAMLATENT", {{text("10 bar")}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(2015).margin(2));  // steam tables, hfg at 10 bar, from memory
         }}},
        {"RXNHESS", {{text("C(s) + 1/2 O2(g) -> CO(g)"),
                      Arg::range(2, 1, {rxnheat::Cell::of("C(s) + O2(g) -> CO2(g)"), rxnheat::Cell::of("CO(g) + 1/2 O2(g) -> CO2(g)")}),
                      Arg::range(2, 1, {rxnheat::Cell::of(-393.51), rxnheat::Cell::of(-282.98)})},
                     [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(-110.53).margin(1e-9));  // CODATA Key Values (Cox et al. 1989): ΔfH°(CO, g)
             CHECK(o.unit == "kJ/mol");
         }}},
        {"RXNHESSPLAN", {{text("C(s) + 1/2 O2(g) -> CO(g)"),
                          Arg::range(2, 1, {rxnheat::Cell::of("C(s) + O2(g) -> CO2(g)"), rxnheat::Cell::of("CO(g) + 1/2 O2(g) -> CO2(g)")})},
                         [](const rxnheat::Outcome& o) { CHECK(o.text == "1×(1) − 1×(2)"); }}},
        {"FUELHV", {{text("CH4(g)")}, [](const rxnheat::Outcome& o) {
             CHECK(o.number == Approx(55.5).epsilon(5e-3));  // methane HHV 55.5 MJ/kg (engineering handbooks, from memory)
             CHECK(o.unit == "MJ/kg");
         }}},
        {"STREAMH", {{Arg::range(1, 2, {rxnheat::Cell::of("O2(g)"), rxnheat::Cell::of(3.0)}), num(298.15)},
                     [](const rxnheat::Outcome& o) {
             CHECK(o.number == 0.0);  // an element in its reference state at 298.15 K: H = 0 (formation basis)
             CHECK(o.unit == "kW");
         }}},
        {"RXNDUTY", {{text("CO(g) + H2O(g) -> CO2(g) + H2(g)"),
                      Arg::range(2, 2, {rxnheat::Cell::of("CO"), rxnheat::Cell::of(36.0), rxnheat::Cell::of("H2O"),
                                        rxnheat::Cell::of(36.0)}),
                      num(0.5), text("CO"), num(298.15), num(298.15)},
                     [](const rxnheat::Outcome& o) {
             // In = out temperature: RXNLOAD of the 18 kmol/h (5 mol/s) converted (the identity of RXNDUTY).
             CHECK(o.number == Approx(eng().load("CO(g) + H2O(g) -> CO2(g) + H2(g)", 5, "mol/s", "CO")).epsilon(1e-12));
             CHECK(o.unit == "kW");
         }}},
        {"RXNTAD", {{text("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)"), num(298.15),
                     Arg::range(1, 2, {rxnheat::Cell::of("N2"), rxnheat::Cell::of(7.52)})},
                    [](const rxnheat::Outcome& o) {
             // No-dissociation flame temperature of stoichiometric methane-air, about 2320-2330 K
             // (combustion textbooks, from memory; checked closely in test_heat_balance.cpp).
             CHECK(o.number == Approx(2325).margin(15));
             CHECK(o.unit == "K");
         }}},
        {"RXNSOURCE", {{text(CH4)}, [](const rxnheat::Outcome& o) { CHECK(o.text == eng().source(CH4)); }}},
        {"RXNVERSION", {{}, [](const rxnheat::Outcome& o) {
             CHECK(has(o.text, "Calc add-in"));  // the host's name
             CHECK(has(o.text, Engine::version()));
         }}},
    };
    for (const auto& f : rxnheat::catalogue()) {
        INFO("function " << f.calc_name);
        const auto it = samples.find(f.calc_name);
        REQUIRE(it != samples.end());  // a sample for every row
        const rxnheat::Outcome o = one(f.calc_name, it->second.args, calc);
        INFO("outcome: " << o.text);
        REQUIRE(o.ok());
        CHECK(o.kind == (f.returns == rxnheat::Returns::number ? rxnheat::Outcome::Kind::number
                                                               : rxnheat::Outcome::Kind::text));
        it->second.check(o);
    }
}
