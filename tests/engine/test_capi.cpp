// The C ABI's catalogue call (rxnheat.h: rxnheat_call, rxnheat_why, table handles, the function
// list): statuses, buffers, and C values that are wrong in themselves. The values are checked
// against the C++ Engine called directly; the installed-library test (tests/install) checks
// the same calls from a C program against outside sources.
#include <catch2/catch.hpp>

#include <rxnheat/catalogue.hpp>
#include <rxnheat/rxnheat.h>
#include <rxnheat/rxnheat.hpp>

#include <cmath>
#include <cstdio>
#include <cstring>
#include <set>
#include <string>
#include <vector>

namespace {

const char* const CH4 = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";

struct Handle {
    rxnheat_engine* e = rxnheat_open();
    ~Handle() { rxnheat_close(e); }
};

struct Call {
    rxnheat_status status;
    rxnheat_result result;
    std::string text, err;
};

Call call(rxnheat_engine* e, const char* f, const std::vector<rxnheat_value>& args, size_t text_size = 2048) {
    Call c{};
    std::vector<char> text(text_size + 1, 'x'), err(512, 'x');
    c.status = rxnheat_call(e, f, args.empty() ? nullptr : args.data(), args.size(), &c.result,
                            text_size ? text.data() : nullptr, text_size, err.data(), err.size());
    if (text_size) c.text = text.data();
    c.err = err.data();
    return c;
}

bool has(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("rxnheat_call gives what the Engine gives", "[capi]") {
    Handle h;
    REQUIRE(h.e != nullptr);
    const Call dh = call(h.e, "RXNDH", {rxnheat_text(CH4), rxnheat_number(350), rxnheat_text("kcal/mol")});
    INFO(dh.err);
    REQUIRE(dh.status == RXNHEAT_OK);
    CHECK(dh.result.kind == RXNHEAT_RESULT_NUMBER);
    CHECK(dh.result.number == rxnheat::Engine::shared().dh(CH4, 350, "kcal/mol"));  // Engine::dh directly
    CHECK(std::string(dh.result.unit) == "kcal/mol");
    CHECK(dh.text.empty());
    CHECK(dh.err.empty());
    // The first, fixed-signature function agrees (stable ABI kept).
    double v = 0;
    char err[256];
    REQUIRE(rxnheat_dh(h.e, CH4, 350, "kcal/mol", nullptr, &v, err, sizeof err) == RXNHEAT_OK);
    CHECK(v == dh.result.number);
    // By CLI command and IDL method too; a temperature as text.
    CHECK(call(h.e, "dh", {rxnheat_text(CH4), rxnheat_text("350 K")}).result.number ==
          rxnheat::Engine::shared().dh(CH4, 350));
    CHECK(call(h.e, "rxnDH", {rxnheat_text(CH4)}).status == RXNHEAT_OK);
    // Text results, with their full length.
    const Call rev = call(h.e, "RXNREVERSE", {rxnheat_text(CH4)});
    REQUIRE(rev.status == RXNHEAT_OK);
    CHECK(rev.result.kind == RXNHEAT_RESULT_TEXT);
    CHECK(rev.text == rxnheat::Engine::shared().reverse(CH4));
    CHECK(rev.result.text_length == rev.text.size());
    CHECK(std::isnan(rev.result.number));  // never a plausible number where none was computed
    CHECK(std::string(rev.result.unit).empty());
    // The species functions' unit texts fit.
    const Call cp = call(h.e, "SPECIESCP", {rxnheat_text("N2(g)"), rxnheat_number(500)});
    REQUIRE(cp.status == RXNHEAT_OK);
    CHECK(std::string(cp.result.unit) == "J/(mol·K)");
    // RXNVERSION names the C host.
    CHECK(has(call(h.e, "RXNVERSION", {}).text, "C interface"));
}

TEST_CASE("rxnheat_call statuses are the error kinds' statuses", "[capi]") {
    Handle h;
    const Call unit = call(h.e, "RXNDH", {rxnheat_text(CH4), rxnheat_omitted(), rxnheat_text("kg/hr")});
    CHECK(unit.status == rxnheat::error_kind_info(rxnheat::ErrorKind::unit).c_status);
    CHECK(unit.status == RXNHEAT_E_UNIT);
    CHECK(unit.result.kind == RXNHEAT_RESULT_NONE);
    CHECK(std::isnan(unit.result.number));
    CHECK(has(unit.err, "'kg/hr'"));
    CHECK(unit.text.empty());
    const Call unbalanced = call(h.e, "RXNDH", {rxnheat_text("H2(g) + O2(g) -> H2O(l)")});
    CHECK(unbalanced.status == RXNHEAT_E_UNBALANCED);
    const Call missing = call(h.e, "RXNLOAD", {rxnheat_text(CH4), rxnheat_omitted(), rxnheat_text("mol"), rxnheat_text("CH4")});
    CHECK(missing.status == RXNHEAT_E_ARGUMENT);
    CHECK(missing.result.argument == 2);
    CHECK(has(missing.err, "'quantity' is required"));
    // 0 is 0 in C: a temperature of 0 K is an error, not the default.
    CHECK(call(h.e, "RXNDH", {rxnheat_text(CH4), rxnheat_number(0)}).status == RXNHEAT_E_ARGUMENT);
    // Text is not read as a number in C.
    CHECK(call(h.e, "RXNLOAD", {rxnheat_text(CH4), rxnheat_text("2"), rxnheat_text("mol"), rxnheat_text("CH4")}).status ==
          RXNHEAT_E_ARGUMENT);
    // RXNCHECK answers in words with status OK.
    const Call check = call(h.e, "RXNCHECK", {rxnheat_text("H2(g) + O2(g) -> H2O(l)")});
    CHECK(check.status == RXNHEAT_OK);
    CHECK(check.text == rxnheat::Engine::shared().check("H2(g) + O2(g) -> H2O(l)"));
    // An unknown function: argument status, the functions listed.
    const Call unknown = call(h.e, "RXNFOO", {});
    CHECK(unknown.status == RXNHEAT_E_ARGUMENT);
    CHECK(has(unknown.err, "'RXNFOO'"));
    CHECK(has(unknown.err, "RXNVERSION"));
    // Too many arguments.
    CHECK(call(h.e, "RXNREVERSE", {rxnheat_text(CH4), rxnheat_text(CH4)}).status == RXNHEAT_E_ARGUMENT);
}

TEST_CASE("rxnheat_call refuses C values that are wrong in themselves", "[capi]") {
    Handle h;
    rxnheat_value null_text = rxnheat_text(nullptr);
    const Call a = call(h.e, "RXNDH", {null_text});
    CHECK(a.status == RXNHEAT_E_ARGUMENT);
    CHECK(has(a.err, "argument 1"));
    rxnheat_value odd = rxnheat_omitted();
    odd.kind = 42;
    const Call b = call(h.e, "RXNDH", {rxnheat_text(CH4), odd});
    CHECK(b.status == RXNHEAT_E_ARGUMENT);
    CHECK(has(b.err, "argument 2 has an unknown kind 42"));
    CHECK(b.result.argument == 2);
    CHECK(call(h.e, "RXNDH", {rxnheat_text(CH4), rxnheat_omitted(), rxnheat_omitted(), rxnheat_omitted(),
                              rxnheat_table_value(nullptr)}).status == RXNHEAT_E_ARGUMENT);
    char err[256];
    CHECK(rxnheat_call(h.e, "RXNDH", nullptr, 2, nullptr, nullptr, 0, err, sizeof err) == RXNHEAT_E_ARGUMENT);
    CHECK(rxnheat_call(h.e, nullptr, nullptr, 0, nullptr, nullptr, 0, err, sizeof err) == RXNHEAT_E_ARGUMENT);
    CHECK(rxnheat_call(nullptr, "RXNVERSION", nullptr, 0, nullptr, nullptr, 0, err, sizeof err) == RXNHEAT_E_ARGUMENT);
    // A zero-initialised value is "omitted".
    rxnheat_value zero;
    std::memset(&zero, 0, sizeof zero);
    CHECK(call(h.e, "RXNDH", {rxnheat_text(CH4), zero}).result.number == rxnheat::Engine::shared().dh(CH4));
}

TEST_CASE("FUELHV through the C interface: one species as text", "[capi][fuel]") {
    Handle h;
    const Call c = call(h.e, "FUELHV", {rxnheat_text("CH4(g)"), rxnheat_text("LHV"), rxnheat_text("kJ/mol")});
    REQUIRE(c.status == RXNHEAT_OK);
    CHECK(c.result.number == rxnheat::Engine::shared().heating_value("CH4(g)", "LHV", "kJ/mol"));
    CHECK(std::string(c.result.unit) == "kJ/mol");
    // Methane LHV 802.6 kJ/mol: NIST WebBook ΔcH° 890.7 less 2 × 44.004 (CODATA), from memory.
    CHECK(c.result.number == Approx(802.6).epsilon(1e-3));
    const Call bad = call(h.e, "FUELHV", {rxnheat_text("CH4(g)"), rxnheat_text("GHV")});
    CHECK(bad.status != RXNHEAT_OK);
    CHECK(bad.err.find("HHV") != std::string::npos);
}

TEST_CASE("a text result longer than the buffer is truncated and says so", "[capi]") {
    Handle h;
    const std::string whole = rxnheat::Engine::shared().source(CH4);
    REQUIRE(whole.size() > 10);
    const Call c = call(h.e, "RXNSOURCE", {rxnheat_text(CH4)}, 10);
    CHECK(c.status == RXNHEAT_E_TRUNCATED);
    CHECK(c.text == whole.substr(0, 9));  // 9 bytes and the NUL
    CHECK(c.result.text_length == whole.size());  // enough to retry
    const Call again = call(h.e, "RXNSOURCE", {rxnheat_text(CH4)}, c.result.text_length + 1);
    CHECK(again.status == RXNHEAT_OK);
    CHECK(again.text == whole);
    // A number needs no text buffer.
    CHECK(call(h.e, "MOLARMASS", {rxnheat_text("CH4")}, 0).status == RXNHEAT_OK);
}

TEST_CASE("species table handles", "[capi][table]") {
    Handle h;
    // An invented row (our own test values); elements are 0 by definition.
    const char* cells[] = {"formula", "phase", "dHf", "XeF6", "g", "-279"};
    rxnheat_table* t = nullptr;
    char err[256];
    REQUIRE(rxnheat_table_from_rows(cells, 2, 3, &t, err, sizeof err) == RXNHEAT_OK);
    REQUIRE(t != nullptr);
    const Call dh = call(h.e, "RXNDH", {rxnheat_text("Xe(g) + 3 F2(g) -> XeF6(g)"), rxnheat_omitted(), rxnheat_omitted(),
                                        rxnheat_omitted(), rxnheat_table_value(t)});
    CHECK(dh.status == RXNHEAT_OK);
    CHECK(dh.result.number == Approx(-279).margin(1e-9));  // the table's row
    CHECK(call(h.e, "RXNDH", {rxnheat_text("Xe(g) + 3 F2(g) -> XeF6(g)")}).status == RXNHEAT_E_UNKNOWN_SPECIES);
    rxnheat_table_close(t);
    // A malformed table: status RXNHEAT_E_TABLE, row and column named, no handle.
    const char* bad[] = {"formula", "phase", "dHf", "XeF6", "g", "abc"};
    t = reinterpret_cast<rxnheat_table*>(&err);  // must be reset to NULL
    CHECK(rxnheat_table_from_rows(bad, 2, 3, &t, err, sizeof err) == RXNHEAT_E_TABLE);
    CHECK(t == nullptr);
    CHECK(has(err, "dHf"));
    CHECK(rxnheat_table_from_rows(nullptr, 0, 0, &t, err, sizeof err) == RXNHEAT_E_TABLE);
    CHECK(rxnheat_table_from_rows(cells, 2, 3, nullptr, err, sizeof err) == RXNHEAT_E_ARGUMENT);
    // A file that does not exist.
    CHECK(rxnheat_table_from_csv("/nonexistent/species.csv", &t, err, sizeof err) == RXNHEAT_E_TABLE);
    CHECK(t == nullptr);
    CHECK(has(err, "/nonexistent/species.csv"));
    CHECK(rxnheat_table_from_csv(nullptr, &t, err, sizeof err) == RXNHEAT_E_ARGUMENT);
    rxnheat_table_close(nullptr);  // allowed
    // From a CSV file, NULL cells as empty ones.
    const std::string path = std::string(RXNHEAT_BINARY_DIR) + "/test_capi_species.csv";
    FILE* f = std::fopen(path.c_str(), "w");
    REQUIRE(f != nullptr);
    std::fputs("formula,phase,dHf,name\nXeF6,g,-279,xenon hexafluoride\n", f);
    std::fclose(f);
    REQUIRE(rxnheat_table_from_csv(path.c_str(), &t, err, sizeof err) == RXNHEAT_OK);
    CHECK(call(h.e, "SPECIESHF", {rxnheat_text("xenon hexafluoride(g)"), rxnheat_omitted(), rxnheat_omitted(),
                                  rxnheat_table_value(t)}).result.number == Approx(-279).margin(1e-9));
    rxnheat_table_close(t);
    std::remove(path.c_str());
    const char* with_null[] = {"formula", "phase", "dHf", "name", "XeF6", "g", "-279", nullptr};
    REQUIRE(rxnheat_table_from_rows(with_null, 2, 4, &t, err, sizeof err) == RXNHEAT_OK);
    rxnheat_table_close(t);
}

TEST_CASE("rxnheat_why and the function list", "[capi][why]") {
    Handle h;
    char text[1024], err[256];
    const rxnheat_value bad_unit[] = {rxnheat_text(CH4), rxnheat_omitted(), rxnheat_text("kg/hr")};
    REQUIRE(rxnheat_why(h.e, "RXNDH", bad_unit, 3, text, sizeof text, err, sizeof err) == RXNHEAT_OK);
    CHECK(has(text, "'kg/hr'"));
    CHECK(std::string(text) == rxnheat::why(*rxnheat::find_function("RXNDH"),
                                            {rxnheat::Arg::of(std::string(CH4)), rxnheat::Arg::omitted(),
                                             rxnheat::Arg::of(std::string("kg/hr"))},
                                            rxnheat::HostRules{false, false, "C interface"}));
    REQUIRE(rxnheat_why(h.e, "RXNDH", bad_unit, 1, text, sizeof text, err, sizeof err) == RXNHEAT_OK);
    CHECK(std::string(text) == "ok");
    REQUIRE(rxnheat_why(h.e, "NOPE", nullptr, 0, text, sizeof text, err, sizeof err) == RXNHEAT_OK);
    CHECK(has(text, "'NOPE'"));
    CHECK(has(text, "RXNDH"));
    const rxnheat_value null_text[] = {rxnheat_text(nullptr)};
    REQUIRE(rxnheat_why(h.e, "RXNDH", null_text, 1, text, sizeof text, err, sizeof err) == RXNHEAT_OK);
    CHECK(has(text, "argument 1"));
    CHECK(rxnheat_why(h.e, "RXNDH", bad_unit, 3, text, 4, err, sizeof err) == RXNHEAT_E_TRUNCATED);
    // The list: every catalogue function exposed to C, by its Calc name.
    std::set<std::string> listed;
    for (size_t i = 0; i < rxnheat_function_count(); ++i) {
        REQUIRE(rxnheat_function_name(i) != nullptr);
        listed.insert(rxnheat_function_name(i));
    }
    CHECK(rxnheat_function_name(rxnheat_function_count()) == nullptr);
    std::set<std::string> in_c;
    for (const auto& f : rxnheat::catalogue())
        if (f.in(rxnheat::layer_c)) in_c.insert(f.calc_name);
    CHECK(listed == in_c);
    // engine/FUNCTIONS.md: the 29 cell functions of today (see test_catalogue.cpp) but RXNEQX, STREAMH,
    // RXNDUTY and RXNTAD, whose feed or stream is a range, and RXNHESS and RXNHESSPLAN, whose steps
    // are (recorded gaps of the C layer). FUELHV is in it for one species (text).
    CHECK(listed.size() == 23);
    CHECK(listed.count("FUELHV") == 1);
    CHECK(listed.count("RXNEQX") == 0);
    CHECK(listed.count("RXNHESS") == 0);
    CHECK(listed.count("RXNHESSPLAN") == 0);
    for (const char* name : {"STREAMH", "RXNDUTY", "RXNTAD"}) CHECK(listed.count(name) == 0);
}

TEST_CASE("rxnheat_call reaches the steam functions (IAPWS-IF97)", "[capi][steam]") {
    Handle h;
    // IAPWS-IF97 release, Table 5: h = 975.542239 kJ/kg at 3 MPa, 500 K; by Calc name and by command.
    const Call st = call(h.e, "STEAMH", {rxnheat_text("3 MPa"), rxnheat_number(500)});
    INFO(st.err);
    REQUIRE(st.status == RXNHEAT_OK);
    CHECK(std::fabs(st.result.number - 975.542239) <= 5e-7);
    CHECK(std::string(st.result.unit) == "kJ/kg");
    CHECK(call(h.e, "steam h", {rxnheat_number(30), rxnheat_number(500)}).result.number == st.result.number);
    // The saturated vapour: temperature omitted, state given.
    const Call sat = call(h.e, "STEAMH", {rxnheat_number(10), rxnheat_omitted(), rxnheat_text("vapour")});
    REQUIRE(sat.status == RXNHEAT_OK);
    CHECK(sat.result.number == rxnheat::Engine::steam_h(10, rxnheat::SaturatedState::vapour));
    // Region 3 is RXNHEAT_E_OUT_OF_RANGE, with no number.
    const Call r3 = call(h.e, "STEAMH", {rxnheat_text("250 bar"), rxnheat_number(650)});
    CHECK(r3.status == RXNHEAT_E_OUT_OF_RANGE);
    CHECK(r3.result.kind == RXNHEAT_RESULT_NONE);
    CHECK(std::isnan(r3.result.number));
    CHECK(has(r3.err, "region 3"));
    // IAPWS-IF97 release, Table 36: Ts = 453.035632 K at 1 MPa.
    const Call ts = call(h.e, "STEAMTSAT", {rxnheat_text("1 MPa")});
    REQUIRE(ts.status == RXNHEAT_OK);
    CHECK(std::fabs(ts.result.number - 453.035632) <= 5e-7);
}
