// Water and steam, IAPWS-IF97 (engine/src/steam.*, Engine::steam_*, and the catalogue rows
// STEAMTSAT, STEAMPSAT, STEAMH, STEAMLATENT), against:
//  - every verification value of the IAPWS release R7-97(2012) for the regions implemented:
//    Table 5 (region 1), Table 15 (region 2), Tables 35 and 36 (region 4), and the B23 check
//    point of section 4; each to the digits printed there (half a unit of the last printed digit);
//  - values from common steam tables, typed from memory (each check says so);
//  - errors in words outside regions 1, 2 and 4 (the release's region limits, section 4).
// 1,000 random points against Debian's python3-iapws are in test_steam_iapws.py (CTest runs it).
#include "behaviour_helpers.hpp"

#include "steam.hpp"

#include <rxnheat/catalogue.hpp>

#include <cmath>
#include <cstdlib>
#include <iomanip>
#include <string>
#include <vector>

using namespace rxnheat_test;
using rxnheat::Arg;
using rxnheat::Engine;
using rxnheat::SaturatedState;
namespace steam = rxnheat::steam;

namespace {

/// Checks `x` against a value printed in the release as text ("0.115331273e3"): within half a
/// unit of its last printed digit.
void check_printed(double x, const char* printed, const char* what) {
    const std::string t = printed;
    const auto e = t.find('e');
    const std::string mantissa = t.substr(0, e);
    const int exponent = e == std::string::npos ? 0 : std::atoi(t.c_str() + e + 1);
    const auto point = mantissa.find('.');
    const int decimals = point == std::string::npos ? 0 : static_cast<int>(mantissa.size() - point - 1);
    const double half_unit = 0.5 * std::pow(10.0, exponent - decimals);
    const double want = std::strtod(printed, nullptr);
    INFO(what << ": computed " << std::setprecision(12) << x << ", printed " << printed);
    CHECK(std::fabs(x - want) <= half_unit);
}

struct TableRow {
    double T_K, p_MPa;
    const char *v, *h, *u, *s, *cp, *w;
};

void check_row(const steam::State& st, const TableRow& r, const std::string& table) {
    const std::string at =
        table + " T = " + std::to_string(r.T_K) + " K, p = " + std::to_string(r.p_MPa) + " MPa: ";
    check_printed(st.v_m3_per_kg, r.v, (at + "v").c_str());
    check_printed(st.h_kJ_per_kg, r.h, (at + "h").c_str());
    check_printed(st.u_kJ_per_kg, r.u, (at + "u").c_str());
    check_printed(st.s_kJ_per_kgK, r.s, (at + "s").c_str());
    check_printed(st.cp_kJ_per_kgK, r.cp, (at + "cp").c_str());
    check_printed(st.w_m_per_s, r.w, (at + "w").c_str());
}

const rxnheat::HostRules calc{true, false, "Calc add-in"};

rxnheat::Outcome call(const char* name, const std::vector<Arg>& args,
                      const rxnheat::HostRules& rules = calc) {
    const rxnheat::FunctionSpec* f = rxnheat::find_function(name);
    REQUIRE(f != nullptr);
    const rxnheat::Result r = rxnheat::evaluate(*f, args, rules);
    REQUIRE_FALSE(r.is_array());
    return r.single();
}
Arg text(const char* s) { return Arg::of(std::string(s)); }
Arg num(double x) { return Arg::of(x); }

/// An error of `kind` whose message holds `part`.
void check_error(const rxnheat::Outcome& o, ErrorKind kind, const std::string& part) {
    INFO("outcome: " << o.text << " (number " << o.number << ")");
    REQUIRE(o.kind == rxnheat::Outcome::Kind::error);
    CHECK(o.error == kind);
    CHECK(contains(o.text, part));
}

}  // namespace

TEST_CASE("IAPWS-IF97 Table 5: region 1 verification values", "[steam][if97]") {
    // IAPWS R7-97(2012), Table 5: v (m³/kg), h, u (kJ/kg), s, cp (kJ/(kg·K)), w (m/s).
    const TableRow rows[] = {
        {300, 3, "0.100215168e-2", "0.115331273e3", "0.112324818e3", "0.392294792", "0.417301218e1",
         "0.150773921e4"},
        {300, 80, "0.971180894e-3", "0.184142828e3", "0.106448356e3", "0.368563852", "0.401008987e1",
         "0.163469054e4"},
        {500, 3, "0.120241800e-2", "0.975542239e3", "0.971934985e3", "0.258041912e1", "0.465580682e1",
         "0.124071337e4"},
    };
    for (const auto& r : rows) check_row(steam::region1(r.p_MPa, r.T_K), r, "IF97 Table 5");
}

TEST_CASE("IAPWS-IF97 Table 15: region 2 verification values", "[steam][if97]") {
    // IAPWS R7-97(2012), Table 15.
    const TableRow rows[] = {
        {300, 0.0035, "0.394913866e2", "0.254991145e4", "0.241169160e4", "0.852238967e1", "0.191300162e1",
         "0.427920172e3"},
        {700, 0.0035, "0.923015898e2", "0.333568375e4", "0.301262819e4", "0.101749996e2", "0.208141274e1",
         "0.644289068e3"},
        {700, 30, "0.542946619e-2", "0.263149474e4", "0.246861076e4", "0.517540298e1", "0.103505092e2",
         "0.480386523e3"},
    };
    for (const auto& r : rows) check_row(steam::region2(r.p_MPa, r.T_K), r, "IF97 Table 15");
}

TEST_CASE("IAPWS-IF97 Tables 35 and 36: region 4 verification values", "[steam][if97]") {
    // Table 35: saturation pressure (MPa) at 300, 500, 600 K (eq. 30).
    check_printed(steam::saturation_pressure_MPa(300), "0.353658941e-2", "IF97 Table 35 ps(300 K)");
    check_printed(steam::saturation_pressure_MPa(500), "0.263889776e1", "IF97 Table 35 ps(500 K)");
    check_printed(steam::saturation_pressure_MPa(600), "0.123443146e2", "IF97 Table 35 ps(600 K)");
    // Table 36: saturation temperature (K) at 0.1, 1, 10 MPa (eq. 31).
    check_printed(steam::saturation_temperature_K(0.1), "0.372755919e3", "IF97 Table 36 Ts(0.1 MPa)");
    check_printed(steam::saturation_temperature_K(1), "0.453035632e3", "IF97 Table 36 Ts(1 MPa)");
    check_printed(steam::saturation_temperature_K(10), "0.584149488e3", "IF97 Table 36 Ts(10 MPa)");
    // The same through the public functions, in bar (1 MPa = 10 bar, by definition of the bar).
    check_printed(Engine::steam_psat(500) / 10, "0.263889776e1", "IF97 Table 35 via Engine::steam_psat");
    check_printed(Engine::steam_tsat(10), "0.453035632e3", "IF97 Table 36 via Engine::steam_tsat");
    // Section 4, the B23 check point: T = 623.15 K <-> p = 16.5291643 MPa (eqs. 5 and 6).
    check_printed(steam::b23_pressure_MPa(623.15), "0.165291643e2", "IF97 section 4 B23 p(623.15 K)");
    check_printed(steam::b23_temperature_K(16.5291643), "0.623150000e3",
                  "IF97 section 4 B23 T(16.5291643 MPa)");
}

TEST_CASE("IAPWS-IF97 reference state: u and s zero for the triple-point liquid", "[steam][if97]") {
    // IAPWS R7-97(2012), section 5: the saturated liquid at the triple point (273.16 K,
    // 611.657 Pa) has u = 0 and s = 0; region 1 there gives them within the fit's accuracy.
    const steam::State t = steam::region1(611.657e-6, 273.16);
    CHECK(std::fabs(t.u_kJ_per_kg) < 1e-3);
    CHECK(std::fabs(t.s_kJ_per_kgK) < 1e-6);
    // h = u + p·v there: about 0.000612 kJ/kg (arithmetic on the printed reference).
    CHECK(t.h_kJ_per_kg == Approx(t.u_kJ_per_kg + 611.657e-3 * t.v_m3_per_kg).margin(1e-12));
}

TEST_CASE("steam functions through the catalogue: units and spot values", "[steam][catalogue]") {
    // IF97 Table 5, h at 300 K and 3 MPa, given as "3 MPa" and as 30 (bar).
    rxnheat::Outcome h = call("STEAMH", {text("3 MPa"), num(300)});
    REQUIRE(h.ok());
    check_printed(h.number, "0.115331273e3", "IF97 Table 5 via STEAMH(\"3 MPa\"; 300)");
    CHECK(h.unit == "kJ/kg");
    h = call("STEAMH", {num(30), text("26.85 C")});
    REQUIRE(h.ok());
    check_printed(h.number, "0.115331273e3", "IF97 Table 5 via STEAMH(30; \"26.85 C\")");
    // IF97 Table 15, h at 700 K and 30 MPa: region 2 just under the B23 boundary (30.47 MPa).
    h = call("STEAMH", {text("300 bar"), num(700)});
    REQUIRE(h.ok());
    check_printed(h.number, "0.263149474e4", "IF97 Table 15 via STEAMH(\"300 bar\"; 700)");

    rxnheat::Outcome t = call("STEAMTSAT", {text("1 MPa")});
    REQUIRE(t.ok());
    check_printed(t.number, "0.453035632e3", "IF97 Table 36 via STEAMTSAT(\"1 MPa\")");
    CHECK(t.unit == "K");
    rxnheat::Outcome p = call("STEAMPSAT", {num(600)});
    REQUIRE(p.ok());
    check_printed(p.number / 10, "0.123443146e2", "IF97 Table 35 via STEAMPSAT(600)");
    CHECK(p.unit == "bar");

    // Normal boiling point: 0 barg is 1.01325 bar; Ts 373.124 K (99.974 °C on ITS-90; steam
    // tables, from memory).
    t = call("STEAMTSAT", {text("0 barg")});
    REQUIRE(t.ok());
    CHECK(t.number == Approx(373.124).margin(0.001));

    // Latent heat at 10 bar: about 2015 kJ/kg (steam tables, from memory: hfg 2015 at 10 bar, 179.9 °C).
    const rxnheat::Outcome l10 = call("STEAMLATENT", {text("10 bar")});
    REQUIRE(l10.ok());
    CHECK(l10.number == Approx(2015).margin(2));
    CHECK(l10.unit == "kJ/kg");
    // Latent heat at 250 °C: about 1715 kJ/kg (steam tables, from memory), via STEAMPSAT then STEAMLATENT.
    const rxnheat::Outcome p250 = call("STEAMPSAT", {text("250 C")});
    REQUIRE(p250.ok());
    CHECK(p250.number == Approx(39.76).margin(0.02));  // 3.976 MPa at 250 °C (steam tables, from memory)
    const rxnheat::Outcome l250 = call("STEAMLATENT", {num(p250.number)});
    REQUIRE(l250.ok());
    CHECK(l250.number == Approx(1715).margin(2));

    // Saturated states at 10 bar: hf 762.7, hg 2777.1 kJ/kg (steam tables, from memory); their
    // difference is STEAMLATENT exactly (the same two evaluations).
    const rxnheat::Outcome hf = call("STEAMH", {text("10 bar"), Arg::omitted(), text("liquid")});
    const rxnheat::Outcome hg = call("STEAMH", {text("10 bar"), Arg::omitted(), text("Vapour")});
    REQUIRE(hf.ok());
    REQUIRE(hg.ok());
    CHECK(hf.number == Approx(762.7).margin(0.3));
    CHECK(hg.number == Approx(2777.1).margin(0.3));
    CHECK(hg.number - hf.number == l10.number);
    // With a state the temperature is not used (SPEC section 4): blank (Calc's 0) or given alike.
    const rxnheat::Outcome hg_T = call("STEAMH", {text("10 bar"), num(0), text("vapour")});
    REQUIRE(hg_T.ok());
    CHECK(hg_T.number == hg.number);
    // Saturated liquid and vapour bracket the single-phase values just beside the line.
    const double Ts = Engine::steam_tsat(10);
    CHECK(Engine::steam_h(10, Ts - 0.01) < hf.number);
    CHECK(Engine::steam_h(10, Ts - 0.01) == Approx(hf.number).margin(0.1));
    CHECK(Engine::steam_h(10, Ts + 0.01) > hg.number);
    CHECK(Engine::steam_h(10, Ts + 0.01) == Approx(hg.number).margin(0.1));
}

TEST_CASE("steam: a column of pressures with a row of temperatures gives the table", "[steam][catalogue]") {
    const Arg pressures = Arg::range(2, 1, {rxnheat::Cell::of(30.0), rxnheat::Cell::of(0.035)});
    const Arg temperatures = Arg::range(1, 2, {rxnheat::Cell::of(300.0), rxnheat::Cell::of(700.0)});
    const rxnheat::Result r =
        rxnheat::evaluate(*rxnheat::find_function("STEAMH"), {pressures, temperatures}, calc);
    REQUIRE(r.is_array());
    REQUIRE(r.rows == 2);
    REQUIRE(r.cols == 2);
    check_printed(r.cells[0].number, "0.115331273e3", "IF97 Table 5 (30 bar, 300 K) in an array");
    CHECK(r.cells[1].number == Engine::steam_h(30, 700));  // region 2, no table value there
    check_printed(r.cells[2].number, "0.254991145e4", "IF97 Table 15 (0.035 bar, 300 K) in an array");
    check_printed(r.cells[3].number, "0.333568375e4", "IF97 Table 15 (0.035 bar, 700 K) in an array");
}

TEST_CASE("steam: errors in words outside regions 1, 2 and 4", "[steam][errors]") {
    // Region 3 (release, section 4: above 623.15 K and above B23, up to 100 MPa).
    check_error(call("STEAMH", {text("250 bar"), num(650)}), ErrorKind::out_of_range, "region 3");
    check_error(call("STEAMH", {text("40 MPa"), text("700 K")}), ErrorKind::out_of_range, "region 3");
    // Region 5 (1073.15 K to 2273.15 K up to 50 MPa).
    check_error(call("STEAMH", {text("10 bar"), num(1200)}), ErrorKind::out_of_range, "region 5");
    // Outside IF97 altogether.
    check_error(call("STEAMH", {text("1500 bar"), num(300)}), ErrorKind::out_of_range, "1000 bar");
    check_error(call("STEAMH", {text("1 bar"), text("-10 C")}), ErrorKind::out_of_range, "273.15 K");
    check_error(call("STEAMH", {text("1 bar"), num(2500)}), ErrorKind::out_of_range, "2273.15 K");
    check_error(call("STEAMH", {text("600 bar"), num(1200)}), ErrorKind::out_of_range, "500 bar");
    // The saturation line itself: liquid or vapour must be said.
    check_error(call("STEAMH", {text("10 bar"), num(Engine::steam_tsat(10))}), ErrorKind::argument,
                "saturation line");
    // Saturated states in region 3 (above 623.15 K, 165.29 bar).
    check_error(call("STEAMLATENT", {text("200 bar")}), ErrorKind::out_of_range, "region 3");
    check_error(call("STEAMH", {text("200 bar"), Arg::omitted(), text("liquid")}), ErrorKind::out_of_range,
                "region 3");
    CHECK(call("STEAMLATENT", {text("165 bar")}).ok());
    // No saturation above the critical point, none below 273.15 K.
    check_error(call("STEAMTSAT", {text("250 bar")}), ErrorKind::out_of_range, "critical");
    check_error(call("STEAMTSAT", {text("0.005 bar")}), ErrorKind::out_of_range, "273.15 K");
    check_error(call("STEAMPSAT", {num(700)}), ErrorKind::out_of_range, "critical");
    check_error(call("STEAMPSAT", {num(250)}), ErrorKind::out_of_range, "273.15 K");
    check_error(call("STEAMLATENT", {text("300 bar")}), ErrorKind::out_of_range, "critical");
    // The ends of the saturation line are inside it.
    CHECK(call("STEAMPSAT", {num(647.096)}).number == Approx(220.64).margin(1e-4));
    CHECK(call("STEAMTSAT", {text("220.64 bar")}).number == Approx(647.096).margin(1e-4));
    CHECK(call("STEAMPSAT", {num(273.15)}).number == Approx(611.213e-5).epsilon(1e-6));
    // Pressures at or below zero, and nonsense units.
    check_error(call("STEAMTSAT", {num(-1)}), ErrorKind::argument, "above zero");
    check_error(call("STEAMTSAT", {text("-2 barg")}), ErrorKind::argument, "above zero");
    check_error(call("STEAMH", {text("0 bar"), num(300)}), ErrorKind::argument, "above zero");
    check_error(call("STEAMTSAT", {text("10 furlongs")}), ErrorKind::unit, "furlongs");
    const auto e = attempt([] { return Engine::steam_tsat(0); });
    CHECK(e.engine_error);
    CHECK(e.kind == ErrorKind::argument);
    const auto nan = attempt([] { return Engine::steam_h(10, std::nan("")); });
    CHECK(nan.engine_error);
    // State texts other than liquid and vapour.
    check_error(call("STEAMH", {text("10 bar"), Arg::omitted(), text("gas")}), ErrorKind::argument,
                "'state'");
    check_error(call("STEAMH", {text("10 bar"), Arg::omitted(), text("vapor")}), ErrorKind::argument,
                "vapour");
    check_error(call("STEAMH", {text("10 bar"), Arg::omitted(), text("saturated")}), ErrorKind::argument,
                "liquid");
    check_error(call("STEAMH", {text("10 bar"), Arg::omitted(), num(1)}), ErrorKind::argument, "text");
    // Neither a temperature nor a state.
    check_error(call("STEAMH", {text("10 bar")}), ErrorKind::argument, "give a temperature");
    // RXNWHY says the same in words.
    const rxnheat::Outcome why = call("RXNWHY", {text("STEAMH"), text("250 bar"), num(650)});
    CHECK(contains(why.text, "region 3"));
}
