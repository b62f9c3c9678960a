// The Calc add-in's argument rules, without an office: real uno::Any values (built with the
// SDK's cppu/sal libraries, no running office needed) go through the add-in's own conversion
// (addin/src/uno_values.cpp) into the catalogue's rxnheat::evaluate, and back as UNO values.
#include "uno_values.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <cstring>
#include <string>
#include <vector>

namespace {

namespace uno = ::com::sun::star::uno;
using rxnheat::addin::Answer;
using Row = uno::Sequence<uno::Any>;
using Rows = uno::Sequence<Row>;

constexpr const char* ch4_combustion = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";
constexpr const char* h2_combustion = "2 H2(g) + O2(g) -> 2 H2O(l)";
constexpr const char* nh3_formation = "1/2 N2(g) + 3/2 H2(g) -> NH3(g)";
constexpr const char* ch4_combustion_gas = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)";

uno::Any text(const char* s) { return uno::Any(rxnheat::addin::from_utf8(s)); }
uno::Any number(double x) { return uno::Any(x); }

Rows rows(std::vector<std::vector<uno::Any>> cells) {
    Rows out(static_cast<sal_Int32>(cells.size()));
    for (std::size_t r = 0; r < cells.size(); ++r) {
        Row row(static_cast<sal_Int32>(cells[r].size()));
        for (std::size_t c = 0; c < cells[r].size(); ++c) row.getArray()[c] = cells[r][c];
        out.getArray()[r] = row;
    }
    return out;
}

const rxnheat::FunctionSpec& fn(const char* calc_name) {
    const rxnheat::FunctionSpec* f = rxnheat::find_function(calc_name);
    REQUIRE(f != nullptr);
    return *f;
}

double as_number(const uno::Any& v) {
    double d = std::nan("");
    REQUIRE(v.getValueTypeClass() == uno::TypeClass_DOUBLE);
    v >>= d;
    return d;
}
std::string as_text(const uno::Any& v) {
    REQUIRE(v.getValueTypeClass() == uno::TypeClass_STRING);
    ::rtl::OUString s;
    v >>= s;
    std::string out;
    REQUIRE(rxnheat::addin::to_utf8(s, out));
    return out;
}
Rows as_rows(const uno::Any& v) {
    Rows r;
    REQUIRE((v >>= r));
    return r;
}

/// A call that must give a value.
uno::Any value(const Answer& a) {
    INFO("message: " << a.message);
    REQUIRE(a.kind == Answer::Kind::value);
    return a.value;
}

// RXNDH with all five arguments given as UNO values (void for "omitted").
Answer dh(const uno::Any& reaction, const uno::Any& t = {}, const uno::Any& unit = {}, const uno::Any& per = {},
          const uno::Any& table = {}) {
    return rxnheat::addin::answer(fn("RXNDH"), {&reaction, &t, &unit, &per, &table});
}

// CODATA Key Values (Cox et al. 1989): ΔfH° CO2(g) −393.51, H2O(l) −285.83 kJ/mol; CH4(g)
// −74.6 kJ/mol (NASA/TP-2002-211556): ΔrH° = −393.51 − 2·285.83 + 74.6 = −890.57 kJ/mol.
constexpr double ch4_dh_kJ = -890.57, ch4_tolerance_kJ = 0.15;

}  // namespace

TEST_CASE("add-in: omitted arguments (void) take their defaults") {
    const double d = as_number(value(dh(text(ch4_combustion))));
    CHECK(d == Approx(ch4_dh_kJ).margin(ch4_tolerance_kJ));  // CODATA Key Values / NASA Glenn
}

TEST_CASE("add-in: empty strings in optional arguments are omitted, and in a required one, an error") {
    const double omitted = as_number(value(dh(text(ch4_combustion))));
    CHECK(as_number(value(dh(text(ch4_combustion), text(""), text(""), text(""), text("")))) == omitted);
    CHECK(as_number(value(dh(text(ch4_combustion), text("  "), text(" "), text(""), text("")))) == omitted);
    const Answer a = dh(text(""));
    REQUIRE(a.kind == Answer::Kind::bad_input);
    CHECK(a.message == "'reaction' is required but empty");
    CHECK(a.argument == 0);
    const Answer none = dh(uno::Any());
    REQUIRE(none.kind == Answer::Kind::bad_input);
    CHECK(none.message.find("'reaction' is required") == 0);
}

TEST_CASE("add-in: a 0 (Calc's blank cell) in an optional argument is its default") {
    const double omitted = as_number(value(dh(text(ch4_combustion))));
    CHECK(as_number(value(dh(text(ch4_combustion), number(0), number(0), number(0), number(0)))) == omitted);
    // RXNKIND's tolerance 0 is the default 0.1 kJ/mol, not a zero band.
    const uno::Any r = text(ch4_combustion), t, tol = number(0), table;
    CHECK(as_text(value(rxnheat::addin::answer(fn("RXNKIND"), {&r, &t, &tol, &table}))) == "exothermic");
    // SPECIESH's reference temperature 0 is 298.15 K: H°(298.15) − H°(298.15) = 0.
    const uno::Any n2 = text("N2(g)"), T = number(298.15), tref = number(0);
    CHECK(as_number(value(rxnheat::addin::answer(fn("SPECIESH"), {&n2, &T, &tref, &table}))) ==
          Approx(0).margin(1e-9));
}

TEST_CASE("add-in: a 0 in a required number is a real 0") {
    const uno::Any r = text(ch4_combustion), zero = number(0), unit = text("kg/h"), key = text("CH4"), none;
    const Answer a = rxnheat::addin::answer(fn("RXNLOAD"), {&r, &zero, &unit, &key, &none, &none, &none});
    CHECK(as_number(value(a)) == 0.0);  // no heat from no methane, not "quantity is required"
}

TEST_CASE("add-in: bool arguments are the numbers 1 and 0") {
    const uno::Any r = text(ch4_combustion), yes = uno::Any(true), one = number(1);
    const std::string scaled_true = as_text(value(rxnheat::addin::answer(fn("RXNSCALE"), {&r, &yes})));
    const std::string scaled_one = as_text(value(rxnheat::addin::answer(fn("RXNSCALE"), {&r, &one})));
    CHECK(scaled_true == scaled_one);
    // RXNLOAD with quantity TRUE = 1 kmol of CH4: 1000 × ΔrH° kJ (CODATA Key Values / NASA).
    const uno::Any unit = text("kmol"), key = text("CH4"), none;
    CHECK(as_number(value(rxnheat::addin::answer(fn("RXNLOAD"), {&r, &yes, &unit, &key, &none, &none, &none}))) ==
          Approx(1000 * ch4_dh_kJ).margin(1000 * ch4_tolerance_kJ));
}

TEST_CASE("add-in: a 1x1 range where one value is expected is that value") {
    const double kcal = as_number(value(dh(text(ch4_combustion), {}, text("kcal/mol"))));
    // GNU units: 1 kcal/mol = 4.184 kJ/mol (thermochemical calorie).
    CHECK(kcal == Approx(ch4_dh_kJ / 4.184).margin(ch4_tolerance_kJ / 4.184));
    CHECK(as_number(value(dh(text(ch4_combustion), {}, uno::Any(rows({{text("kcal/mol")}}))))) == kcal);
    // A bigger range there is an error in words.
    const Answer a = dh(text(ch4_combustion), {}, uno::Any(rows({{text("kJ/mol")}, {text("kJ/mol")}})));
    REQUIRE(a.kind == Answer::Kind::bad_input);
    CHECK(a.message == "'unit' must be a single value, not a range of 2 cells");
    CHECK(a.argument == 2);
}

TEST_CASE("add-in: a range of reactions gives an array of the same shape") {
    const Rows in = rows({{text(ch4_combustion), text(h2_combustion)},
                          {text("this is not a reaction"), uno::Any()}});
    const Rows out = as_rows(value(dh(uno::Any(in))));
    REQUIRE(out.getLength() == 2);
    REQUIRE(out[0].getLength() == 2);
    REQUIRE(out[1].getLength() == 2);
    CHECK(as_number(out[0][0]) == Approx(ch4_dh_kJ).margin(ch4_tolerance_kJ));  // CODATA / NASA
    CHECK(as_number(out[0][1]) == Approx(-571.66).margin(0.1));  // CODATA: 2 × ΔfH° H2O(l)
    // The failing element is the office's error value (a NaN carrying Err:502), not a number.
    const double failed = as_number(out[1][0]);
    CHECK(std::isnan(failed));
    const double err502 = rxnheat::addin::error_element(false);
    CHECK(std::memcmp(&failed, &err502, sizeof failed) == 0);
    CHECK(out[1][1].getValueTypeClass() == uno::TypeClass_VOID);  // a blank stays blank
}

TEST_CASE("add-in: a range inside a range is an error in words") {
    const Rows nested = rows({{text(ch4_combustion)}, {uno::Any(rows({{text(h2_combustion)}}))}});
    const Answer a = dh(uno::Any(nested));
    REQUIRE(a.kind == Answer::Kind::bad_input);
    CHECK(a.message == "'reaction' holds a range inside a range (row 2, column 1); give a plain cell range");
    CHECK(a.argument == 0);
    // RXNCHECK gives the same words as its answer.
    const uno::Any r = uno::Any(nested), none;
    CHECK(as_text(value(rxnheat::addin::answer(fn("RXNCHECK"), {&r, &none, &none}))) == a.message);
    // A value of a type no cell holds is refused the same way.
    const Answer odd = dh(uno::Any(uno::Sequence<sal_Int32>(2)));
    REQUIRE(odd.kind == Answer::Kind::bad_input);
    CHECK(odd.message.find("'reaction' is a value of UNO type") == 0);
}

TEST_CASE("add-in: a column of reactions with a row of temperatures is the whole table") {
    const std::vector<const char*> reactions = {ch4_combustion_gas, h2_combustion, nh3_formation};
    const std::vector<double> temperatures_K = {298.15, 400, 450, 500, 550};
    const Rows column = rows({{text(reactions[0])}, {text(reactions[1])}, {text(reactions[2])}});
    const Rows row = rows({{number(298.15), number(400), text("176.85 C"), number(500), text("990 R")}});
    const Rows out = as_rows(value(dh(uno::Any(column), uno::Any(row))));
    REQUIRE(out.getLength() == 3);
    for (sal_Int32 r = 0; r < 3; ++r) {
        REQUIRE(out[r].getLength() == 5);
        for (sal_Int32 c = 0; c < 5; ++c) {
            // Each element is the single call of its reaction at its temperature (450 K =
            // 176.85 °C, 550 K = 990 °R: GNU units tempC(176.85), tempR(990)).
            const double single = as_number(value(dh(text(reactions[r]), number(temperatures_K[c]))));
            CHECK(as_number(out[r][c]) == Approx(single).epsilon(1e-12));
        }
    }
    // At 298.15 K: CODATA Key Values, ΔfH° H2O(l) −285.83 and NH3(g) −45.94 kJ/mol.
    CHECK(as_number(out[1][0]) == Approx(-571.66).margin(0.1));
    CHECK(as_number(out[2][0]) == Approx(-45.94).margin(0.35));
}

TEST_CASE("add-in: ranges of shapes that do not combine are an error in words") {
    const Rows three = rows({{text(ch4_combustion)}, {text(h2_combustion)}, {text(nh3_formation)}});
    const Rows two = rows({{number(300)}, {number(400)}});
    const Answer a = dh(uno::Any(three), uno::Any(two));
    REQUIRE(a.kind == Answer::Kind::bad_input);
    CHECK(a.message.find("a range of 3×1 cells for 'reaction' and one of 2×1 for 'temperature' do not combine") == 0);
    CHECK(a.argument == 1);
}

TEST_CASE("add-in: RXNWHY reads its variable argument list like any other arguments") {
    const auto& why = fn("RXNWHY");
    const uno::Any load = text("RXNLOAD");
    uno::Sequence<uno::Any> rest(5);
    rest.getArray()[0] = text(ch4_combustion);  // A1: Calc passes a one-cell reference as its value
    rest.getArray()[1] = number(500);
    rest.getArray()[2] = text("kg/hour");
    rest.getArray()[3] = text("CH4");
    rest.getArray()[4] = text("kW");
    const std::string words = as_text(value(rxnheat::addin::answer(why, {&load}, &rest)));
    INFO(words);
    CHECK(words.find("unknown quantity unit 'kg/hour'") == 0);
    // A 1x1 range there spreads (the reaction gives arrays): the words say which element.
    rest.getArray()[0] = uno::Any(rows({{text(ch4_combustion)}}));
    CHECK(as_text(value(rxnheat::addin::answer(why, {&load}, &rest))) == "row 1, column 1 of the array: " + words);
    // The same call with the unit written kg/h is fine.
    rest.getArray()[2] = text("kg/h");
    CHECK(as_text(value(rxnheat::addin::answer(why, {&load}, &rest))) == "ok");
    const uno::Any dh_name = text("RXNDH");
    uno::Sequence<uno::Any> one(1);
    one.getArray()[0] = text(ch4_combustion);
    CHECK(as_text(value(rxnheat::addin::answer(why, {&dh_name}, &one))) == "ok");
    // A nested range among them: words, naming the list.
    one.getArray()[0] = uno::Any(rows({{uno::Any(rows({{text(ch4_combustion)}}))}}));
    const std::string nested = as_text(value(rxnheat::addin::answer(why, {&dh_name}, &one)));
    CHECK(nested.find("'arguments 1' holds a range inside a range") == 0);
}

TEST_CASE("add-in: host rules are Calc's") {
    const rxnheat::HostRules r = rxnheat::addin::calc_rules();
    CHECK(r.zero_is_blank);
    CHECK_FALSE(r.text_numbers);
    CHECK(std::string(r.host_name) == "Calc add-in");
}

TEST_CASE("add-in: UTF-16 -> UTF-8 for ASCII, other characters and lone surrogates") {
    // to_utf8 copies ASCII directly and converts anything else through the office's converter.
    std::string out = "kept";
    REQUIRE(rxnheat::addin::to_utf8(::rtl::OUString("CH4(g) -> C(s) + 2 H2(g)"), out));
    CHECK(out == "CH4(g) -> C(s) + 2 H2(g)");
    REQUIRE(rxnheat::addin::to_utf8(::rtl::OUString(), out));
    CHECK(out.empty());
    const sal_Unicode mixed[] = {'3', '5', '0', ' ', 0x00B0, 'C', ' ', 'H', 0x2082};  // "350 °C H₂"
    REQUIRE(rxnheat::addin::to_utf8(::rtl::OUString(mixed, 9), out));
    CHECK(out == "350 \xC2\xB0" "C H\xE2\x82\x82");
    const sal_Unicode lone[] = {'H', 0xD83D};  // a high surrogate with no low one (UNICHAR(55357))
    out = "untouched";
    CHECK_FALSE(rxnheat::addin::to_utf8(::rtl::OUString(lone, 2), out));
    CHECK(out == "untouched");
    // Found by this test: the office's converter dropped a high surrogate at the end silently.
    const sal_Unicode lone_low[] = {0xDE00, 'H'};
    CHECK_FALSE(rxnheat::addin::to_utf8(::rtl::OUString(lone_low, 2), out));
    const sal_Unicode lone_middle[] = {'H', 0xD83D, '2'};
    CHECK_FALSE(rxnheat::addin::to_utf8(::rtl::OUString(lone_middle, 3), out));
    const sal_Unicode pair[] = {0xD83D, 0xDE00};  // U+1F600 as a surrogate pair
    REQUIRE(rxnheat::addin::to_utf8(::rtl::OUString(pair, 2), out));
    CHECK(out == "\xF0\x9F\x98\x80");
}
