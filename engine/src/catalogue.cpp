// The function catalogue (catalogue.hpp): the one table of cell functions, and the one set of
// rules by which every host's arguments are read and spread into arrays.
#include "rxnheat/catalogue.hpp"

#include "reaction.hpp"
#include "steam.hpp"
#include "units.hpp"

#include <algorithm>
#include <cerrno>
#include <cfloat>
#include <cmath>
#include <cstdint>
#include <cstdlib>
#include <cstring>
#include <list>
#include <mutex>
#include <utility>

#ifndef RXNHEAT_VERSION
#define RXNHEAT_VERSION "0.0.0"
#endif

namespace rxnheat {

// ---- the arguments of one evaluation, read ----------------------------------------------------

struct Bound {
    struct Value {
        bool given = false;
        bool is_text = false;  ///< factor: given as text (kept exact)
        double number = 0;     ///< numbers; temperatures in K
        std::string text;      ///< trimmed text
        std::vector<Value> items;  ///< list kinds: one per cell of the range, blanks kept (given false)
    };
    std::vector<Value> values;  ///< one per ArgSpec
    Conditions at;              ///< temperature and pressure (the arguments of those names) and table
    std::vector<FeedItem> feed; ///< the feed argument (or a fuel given as a range), its blank rows left out
    const std::vector<Arg>* all = nullptr;  ///< the call's arguments as given (for `rest`)
    std::size_t rest_from = 0;
    const HostRules* rules = nullptr;

    bool given(std::size_t i) const { return i < values.size() && values[i].given; }
    std::string_view text(std::size_t i) const { return given(i) ? std::string_view(values[i].text) : std::string_view(); }
    double number(std::size_t i, double fallback = 0) const { return given(i) ? values[i].number : fallback; }
};

namespace {

// ---- texts shared by several rows ---------------------------------------------------------------

constexpr const char* reaction_help =
    "Reaction text as chemists write it, e.g. CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l) "
    "(arrows -> = → ⇌, Unicode subscripts allowed), or a cell holding it. A range of "
    "reactions gives an array of the same shape (enter as an array formula); an element "
    "that fails shows Err:502, and RXNCHECK over the same range says why.";
constexpr const char* temperature_help =
    "Temperature: a number in kelvin, or text with a unit such as \"350 C\", \"350 °C\", "
    "\"662 F\", \"1100 R\", \"623.15 K\". Omitted, empty or blank: 298.15 K.";
constexpr const char* temperature_required_help =
    "Temperature: a number in kelvin, or text with a unit such as \"350 C\", \"350 °C\", "
    "\"662 F\", \"1100 R\", \"623.15 K\".";
constexpr const char* energy_unit_help =
    "Result unit: J/mol, kJ/mol (default), MJ/kmol, kcal/mol, cal/mol, BTU/lbmol (per mole of "
    "reaction as written); with 'per' also kJ/kg, MJ/kg, kJ/g, kcal/kg, BTU/lb.";
constexpr const char* per_help =
    "A species of the reaction, e.g. \"CH4\": the result is then per mole of that species, or "
    "per mass of it with a mass unit such as MJ/kg. Omitted: per mole of reaction.";
constexpr const char* table_help =
    "A cell range with your own species data; its first row names the columns: formula, phase, "
    "dHf (kJ/mol at 298.15 K), and optionally S (J/(mol·K)), cp (J/(mol·K)) or a, b, c, d, e "
    "(Shomate, T in K/1000), tmin, tmax, name, source. Its rows override the built-in data for "
    "the same formula and phase.";
constexpr const char* species_help =
    "Species, e.g. CO2(g), H2O(l), Fe(s), or a name such as ethanol(l); written without a phase, the "
    "phase stable at the temperature is taken (a charged species: aqueous). Or a cell holding it. A "
    "range gives an array of the same shape (enter as an array formula); an element that fails shows "
    "Err:502.";
// Appended (by literal concatenation) to the descriptions of the functions that give heat loads
// and temperature rises.
#define RXNHEAT_CAUTION                                                                            \
    " CAUTION: a screening estimate for the standard state, ideal gas and complete conversion. "   \
    "Thermal runaway and relief sizing need calorimetry and a process hazard analysis; defer to "  \
    "local codes and licensed engineers."

// The steam functions (IAPWS-IF97): what is implemented, said once for their descriptions.
#define RXNHEAT_STEAM_SCOPE                                                                        \
    " IAPWS-IF97 (the IAPWS R7-97(2012) release): regions 1 (compressed liquid), 2 (vapour) and 4 " \
    "(saturation) are implemented; a state in region 3 (near the critical point), in region 5 (above " \
    "1073.15 K) or outside IF97 (below 273.15 K, above 1000 bar) is an error that names it, never an "  \
    "extrapolation. These are properties of real water and steam, not ideal-gas data."
constexpr const char* steam_pressure_help =
    "Pressure: a number in bar (absolute), or text with a unit such as \"10 bar\", \"1 MPa\", \"1000 kPa\", "
    "\"1 atm\", \"150 psia\", or gauge \"9 barg\", \"135 psig\" (over 101.325 kPa). A range gives an array "
    "of the same shape.";

// Argument rows used by several functions.
ArgSpec reaction_arg() { return {"reaction", ArgKind::reaction, true, "", reaction_help, true, nullptr, "REACTION"}; }
ArgSpec temperature_arg() {
    return {"temperature", ArgKind::temperature, false, "298.15 K", temperature_help, true, "-T,--temperature", "TEMP"};
}
ArgSpec temperature_required_arg() {
    return {"temperature", ArgKind::temperature, true, "", temperature_required_help, true, "-T,--temperature", "TEMP"};
}
ArgSpec table_arg() { return {"table", ArgKind::table, false, "", table_help, false, "--table", "FILE.csv"}; }
ArgSpec species_arg() { return {"species", ArgKind::species, true, "", species_help, true, nullptr, "SPECIES"}; }

ArgSpec flow_unit_arg() {
    return {"flow_unit", ArgKind::unit, false, "kmol/h",
            "Unit of every flow: kmol/h (default), or any amount, mass or normal gas volume of RXNLOAD per s, min, h "
            "or d (mol/s, kg/h, t/d, lb/h, Nm3/h, scf/d), or a total amount (kmol, kg, Nm3) for an energy result.",
            false, "--flow-unit", "UNIT"};
}
ArgSpec stream_result_unit_arg() {
    return {"result_unit", ArgKind::unit, false, "kW or kJ",
            "For flows: kW (default), W, MW, kcal/h, Gcal/h, BTU/h, MMBTU/h, TR. For total amounts: kJ (default), "
            "J, MJ, GJ, kWh, MWh, kcal, BTU, MMBTU, therm.",
            false, "-u,--unit", "UNIT"};
}

std::string unit_or(std::string_view given, const char* fallback) {
    return given.empty() ? std::string(fallback) : std::string(given);
}

Outcome dh_call(Engine& e, const Bound& b) {
    return Outcome::of(e.dh(b.text(0), b.at, b.text(2), b.text(3)), unit_or(b.text(2), "kJ/mol"));
}
Outcome du_call(Engine& e, const Bound& b) {
    return Outcome::of(e.du(b.text(0), b.at, b.text(2), b.text(3)), unit_or(b.text(2), "kJ/mol"));
}
Outcome ds_call(Engine& e, const Bound& b) {
    return Outcome::of(e.ds(b.text(0), b.at, b.text(2)), unit_or(b.text(2), "J/(mol·K)"));
}
Outcome dg_call(Engine& e, const Bound& b) {
    return Outcome::of(e.dg(b.text(0), b.at, b.text(2)), unit_or(b.text(2), "kJ/mol"));
}
Outcome logk_call(Engine& e, const Bound& b) { return Outcome::of(e.logk(b.text(0), b.at)); }
Outcome load_call(Engine& e, const Bound& b) {
    const double v = e.load(b.text(0), b.number(1), b.text(2), b.text(3), b.text(4), b.at);
    return Outcome::of(v, Engine::load_unit(b.text(2), b.text(4)));
}
Outcome kind_call(Engine& e, const Bound& b) {
    return Outcome::of_text(to_string(e.kind(b.text(0), b.at, b.number(2, default_tolerance_kJ_per_mol))));
}
Outcome check_call(Engine& e, const Bound& b) {
    // The same evaluation as check(), so that the failure keeps its kind (RXNWHY, the CLI);
    // errors_as_text turns it into RXNCHECK's words.
    e.dh(b.text(0), b.at);
    return Outcome::of_text("ok");
}
Outcome balance_call(Engine& e, const Bound& b) { return Outcome::of_text(e.balance(b.text(0), b.at)); }
Outcome reverse_call(Engine& e, const Bound& b) { return Outcome::of_text(e.reverse(b.text(0))); }
Outcome scale_call(Engine& e, const Bound& b) {
    const Bound::Value& f = b.values[1];
    return Outcome::of_text(f.is_text ? e.scale(b.text(0), std::string_view(f.text)) : e.scale(b.text(0), f.number));
}
Outcome hf_call(Engine& e, const Bound& b) {
    return Outcome::of(e.species_hf(b.text(0), b.at, b.text(2)), unit_or(b.text(2), "kJ/mol"));
}
Outcome cp_call(Engine& e, const Bound& b) { return Outcome::of(e.species_cp(b.text(0), b.at), "J/(mol·K)"); }
Outcome h_call(Engine& e, const Bound& b) {
    return Outcome::of(e.species_h(b.text(0), b.at, b.number(2, T_ref)), "kJ/mol");
}
Outcome molar_mass_call(Engine& e, const Bound& b) { return Outcome::of(e.molar_mass(b.text(0)), "g/mol"); }
Outcome eqx_call(Engine& e, const Bound& b) {
    const std::string key(b.text(4));
    return Outcome::of(e.eq_conversion(b.text(0), b.feed, key, b.at));
}
Outcome steam_tsat_call(Engine&, const Bound& b) { return Outcome::of(Engine::steam_tsat(b.number(0)), "K"); }
Outcome steam_psat_call(Engine&, const Bound& b) { return Outcome::of(Engine::steam_psat(b.number(0)), "bar"); }
Outcome steam_h_call(Engine&, const Bound& b) {
    // With a state the temperature is not used (the saturated state is fixed by the pressure).
    if (b.given(2)) return Outcome::of(Engine::steam_h(b.number(0), steam::parse_saturated_state(b.text(2))), "kJ/kg");
    if (!b.given(1))
        throw Error(ErrorKind::argument, "give a temperature, or the state \"liquid\" or \"vapour\" for the saturated "
                                         "liquid or vapour at the pressure");
    return Outcome::of(Engine::steam_h(b.number(0), b.number(1)), "kJ/kg");
}
Outcome steam_latent_call(Engine&, const Bound& b) { return Outcome::of(Engine::steam_latent(b.number(0)), "kJ/kg"); }
/// RXNHESS's steps and their values, paired by position; a position blank in both is skipped.
std::vector<HessStep> hess_steps(const Bound& b, bool with_values) {
    const auto& steps = b.values[1].items;
    std::vector<HessStep> out;
    if (with_values) {
        const auto& dh = b.values[2].items;
        if (steps.size() != dh.size())
            throw Error(ErrorKind::argument, "'steps' has " + std::to_string(steps.size()) +
                                                 " cells and 'step_dh' " + std::to_string(dh.size()) +
                                                 "; give one ΔH beside each step");
        for (std::size_t i = 0; i < steps.size(); ++i) {
            const std::string n = std::to_string(i + 1);
            if (!steps[i].given && !dh[i].given) continue;
            if (!dh[i].given) throw Error(ErrorKind::argument, "step " + n + " has no ΔH in 'step_dh'");
            if (!steps[i].given)
                throw Error(ErrorKind::argument,
                            "'step_dh' gives a ΔH for step " + n + ", but that cell of 'steps' is blank");
            out.push_back({i + 1, steps[i].text, dh[i].number});
        }
    } else {
        for (std::size_t i = 0; i < steps.size(); ++i)
            if (steps[i].given) out.push_back({i + 1, steps[i].text, 0});
    }
    if (out.empty()) throw Error(ErrorKind::argument, "'steps' is required, and every cell of it is blank");
    return out;
}
Outcome hess_call(Engine& e, const Bound& b) {
    return Outcome::of(e.hess(b.text(0), hess_steps(b, true), b.text(3)), unit_or(b.text(3), "kJ/mol"));
}
Outcome hess_plan_call(Engine& e, const Bound& b) {
    return Outcome::of_text(e.hess_plan(b.text(0), hess_steps(b, false)));
}
Outcome fuel_call(Engine& e, const Bound& b) {
    // A fuel is one species (text) or a composition (a range, read as a feed).
    const double v = b.feed.empty() ? e.heating_value(b.text(0), b.text(1), b.text(2), b.at)
                                    : e.heating_value(b.feed, b.text(1), b.text(2), b.at);
    return Outcome::of(v, unit_or(b.text(2), "MJ/kg"));
}
Outcome streamh_call(Engine& e, const Bound& b) {
    return Outcome::of(e.stream_enthalpy(b.feed, b.text(2), b.text(3), b.at), Engine::stream_unit(b.text(2), b.text(3)));
}
Outcome duty_call(Engine& e, const Bound& b) {
    const double v = e.duty(b.text(0), b.feed, b.number(2), b.text(3), b.number(4), b.number(5), b.text(6), b.text(7),
                            b.at.table);
    return Outcome::of(v, Engine::stream_unit(b.text(6), b.text(7)));
}
Outcome tad_call(Engine& e, const Bound& b) {
    Conditions at = b.at;
    at.temperature_K = b.number(1);
    return Outcome::of(e.adiabatic_temperature(b.text(0), b.feed, b.number(3, 1.0), at), "K");
}
Outcome source_call(Engine& e, const Bound& b) { return Outcome::of_text(e.source(b.text(0), b.at)); }
Outcome version_call(Engine&, const Bound& b) {
    return Outcome::of_text(std::string("rxnheat ") + b.rules->host_name + " " + RXNHEAT_VERSION + "; engine " +
                            Engine::version());
}
Outcome why_call(Engine& e, const Bound& b);

std::vector<FunctionSpec> make_catalogue() {
    const char* none = "";
    return {
        {"RXNDH", "rxnDH", "dh", "standard reaction enthalpy ΔrH° of the reaction as written",
         "Standard reaction enthalpy ΔrH° of the reaction as written (per mole of reaction extent), at "
         "298.15 K or the temperature given, from the built-in data (NASA Glenn, NASA/TP-2002-211556) or "
         "your table. Negative means heat is released (exothermic). Default unit kJ/mol.",
         {reaction_arg(), temperature_arg(),
          {"unit", ArgKind::unit, false, "kJ/mol", energy_unit_help, false, "-u,--unit", "UNIT"},
          {"per", ArgKind::species, false, "", per_help, false, "--per", "SPECIES"}, table_arg()},
         Returns::number, layer_all, none, false, dh_call},
        {"RXNDU", "rxnDU", "du", "standard reaction internal energy ΔrU° = ΔrH° − Δn(gas)·R·T",
         "Standard reaction internal energy ΔrU° = ΔrH° − Δn(gas)·R·T of the reaction as written, for "
         "constant-volume (bomb calorimeter) work. Default unit kJ/mol. Same arguments as RXNDH.",
         {reaction_arg(), temperature_arg(),
          {"unit", ArgKind::unit, false, "kJ/mol", energy_unit_help, false, "-u,--unit", "UNIT"},
          {"per", ArgKind::species, false, "", per_help, false, "--per", "SPECIES"}, table_arg()},
         Returns::number, layer_all, none, false, du_call},
        {"RXNDS", "rxnDS", "ds", "standard reaction entropy ΔrS° of the reaction as written",
         "Standard reaction entropy ΔrS° = Σ ν·S° of the reaction as written (per mole of reaction extent, "
         "standard pressure 1 bar), at 298.15 K or the temperature given, from the built-in data (NASA Glenn, "
         "NASA/TP-2002-211556) or your table's S column. Default unit J/(mol·K).",
         {reaction_arg(), temperature_arg(),
          {"unit", ArgKind::unit, false, "J/(mol·K)",
           "Result unit: J/(mol·K) (default), kJ/(mol·K), cal/(mol·K) (thermochemical calorie, 4.184 J); "
           "also written J/(mol*K) or J/mol/K.",
           false, "-u,--unit", "UNIT"},
          table_arg()},
         Returns::number, layer_all, none, false, ds_call},
        {"RXNDG", "rxnDG", "dg", "standard reaction Gibbs energy ΔrG° = ΔrH° − T·ΔrS°",
         "Standard reaction Gibbs energy ΔrG° = ΔrH° − T·ΔrS° of the reaction as written (per mole of "
         "reaction extent, standard pressure 1 bar). Negative means the products are favoured at the standard "
         "state (K > 1); an exothermic reaction can still have ΔrG° > 0 at a high temperature. Default unit "
         "kJ/mol.",
         {reaction_arg(), temperature_arg(),
          {"unit", ArgKind::unit, false, "kJ/mol",
           "Result unit: J/mol, kJ/mol (default), MJ/kmol, kcal/mol, cal/mol, BTU/lbmol (per mole of reaction "
           "as written).",
           false, "-u,--unit", "UNIT"},
          table_arg()},
         Returns::number, layer_all, none, false, dg_call},
        {"RXNLOGK", "rxnLogK", "logk", "equilibrium constant log10 K = −ΔrG°/(R·T·ln 10)",
         "Decimal logarithm of the equilibrium constant K of the reaction as written, log10 K = "
         "−ΔrG°/(R·T·ln 10), with gases referred to the standard pressure of 1 bar and condensed species "
         "pure. Above 0: products favoured; below 0: reactants favoured.",
         {reaction_arg(), temperature_arg(), table_arg()}, Returns::number, layer_all, none, false, logk_call},
        {"RXNLOAD", "rxnLoad", "load", "heat load when an amount or flow of a key species reacts",
         "Heat load: the enthalpy change when the given amount or flow of the key species reacts (or forms) by "
         "the reaction as written. An amount gives a total (default kJ); a flow (per s, min, h, d) gives a rate "
         "(default kW). Negative means heat is released." RXNHEAT_CAUTION,
         {reaction_arg(),
          {"quantity", ArgKind::number, true, "",
           "How much of the key species reacts or forms, as a number in quantity_unit (e.g. 500).", false,
           nullptr, "QUANTITY"},
          {"quantity_unit", ArgKind::unit, true, "",
           "Amount: mol, kmol, lbmol; mass: g, kg, t, lb; normal gas volume: Nm3 (0 °C, 101.325 kPa) or scf "
           "(60 °F, 14.696 psia); or any of these per s, min, h or d for a flow, e.g. \"kg/h\".",
           false, nullptr, "QUANTITY_UNIT"},
          {"key", ArgKind::species, true, "", "The species of the reaction that the quantity refers to, e.g. \"CH4\".",
           false, nullptr, "KEY"},
          {"result_unit", ArgKind::unit, false, "kJ or kW",
           "For a total: kJ (default), J, MJ, GJ, kWh, MWh, kcal, BTU, MMBTU, therm. For a flow: kW (default), "
           "W, MW, kcal/h, BTU/h, MMBTU/h, TR (12,000 BTU/h).",
           false, "-u,--unit", "UNIT"},
          temperature_arg(), table_arg()},
         Returns::number, layer_all, none, false, load_call},
        {"RXNKIND", "rxnKind", "kind", "exothermic, endothermic or thermoneutral",
         "Classifies the reaction as text: exothermic (ΔrH° < 0), endothermic (ΔrH° > 0) or thermoneutral "
         "(|ΔrH°| within the tolerance).",
         {reaction_arg(), temperature_arg(),
          {"tolerance", ArgKind::number, false, "0.1 kJ/mol",
           "Band in kJ/mol (per mole of reaction) counted as thermoneutral. Omitted, empty or blank: 0.1 kJ/mol.",
           false, "--tolerance", "KJ"},
          table_arg()},
         Returns::text, layer_all, none, false, kind_call},
        {"RXNCHECK", "rxnCheck", "check", "ok, or the first problem with a reaction in words",
         "Checks a reaction and returns ok, or the first problem in plain words: where the text does not "
         "parse, which element or charge does not balance, an unknown or ambiguous species, a missing phase, a "
         "temperature outside the data. It is the same diagnosis with which RXNDH and the other numeric "
         "functions fail (Err:502).",
         {reaction_arg(), temperature_arg(), table_arg()}, Returns::text, layer_all, none, true, check_call},
        {"RXNBALANCE", "rxnBalance", "balance", "the reaction with the smallest whole-number coefficients",
         "Balances a reaction: returns its text with the smallest whole-number coefficients that balance every "
         "element and the charge. An error if no balance exists or if more than one independent balance does.",
         {reaction_arg(), table_arg()}, Returns::text, layer_all, none, false, balance_call},
        {"RXNREVERSE", "rxnReverse", "reverse", "products and reactants exchanged",
         "Returns the reaction text with products and reactants exchanged (ΔrH° changes sign).",
         {reaction_arg()}, Returns::text, layer_all, none, false, reverse_call},
        {"RXNSCALE", "rxnScale", "scale", "every coefficient times a factor, fractions kept",
         "Returns the reaction text with every coefficient multiplied by the factor; exact fractions are kept "
         "(1/2 O2). ΔrH° scales by the same factor.",
         {reaction_arg(),
          {"factor", ArgKind::factor, true, "", "A number, or text such as \"1/2\", \"0.5\" or \"½\".", false,
           nullptr, "FACTOR"}},
         Returns::text, layer_all, none, false, scale_call},
        {"RXNWHY", "rxnWhy", "why", "ok, or in words why a call of another rxnheat function fails",
         "Diagnoses a call of any rxnheat function: give the function's name (e.g. \"RXNLOAD\") and then that "
         "function's arguments in order. Returns ok, or in words exactly what is wrong: the unit, the key "
         "species, the quantity, the table, the temperature or the reaction.",
         {{"function", ArgKind::text, true, "", "The name of an rxnheat function, e.g. \"RXNLOAD\".", false,
           nullptr, "FUNCTION"},
          {"arguments", ArgKind::rest, false, "",
           "That function's arguments, in its order, exactly as in the call being diagnosed.", false, nullptr,
           "ARGS"}},
         Returns::text, layer_all, none, true, why_call},
        {"SPECIESHF", "speciesHf", "hf", "standard enthalpy of formation ΔfH° of one species",
         "Standard enthalpy of formation ΔfH° of one species, default kJ/mol at 298.15 K. At another "
         "temperature: the enthalpy of formation from the elements in their reference states at that "
         "temperature.",
         {species_arg(), temperature_arg(),
          {"unit", ArgKind::unit, false, "kJ/mol",
           "J/mol, kJ/mol (default), MJ/kmol, kcal/mol, cal/mol, BTU/lbmol (per mole of the species).", false,
           "-u,--unit", "UNIT"},
          table_arg()},
         Returns::number, layer_all, none, false, hf_call},
        {"SPECIESCP", "speciesCp", "cp", "standard molar heat capacity Cp° of one species",
         "Standard molar heat capacity Cp° of one species at the temperature, in J/(mol·K).",
         {species_arg(), temperature_required_arg(), table_arg()}, Returns::number, layer_all, none, false,
         cp_call},
        {"SPECIESH", "speciesH", "sensible", "sensible heat H°(T) − H°(Tref) of one species",
         "Sensible heat H°(T) − H°(Tref) of one species in kJ/mol, including phase changes covered by the "
         "data (no extrapolation outside the data's range).",
         {species_arg(), temperature_required_arg(),
          {"reference_temperature", ArgKind::temperature, false, "298.15 K",
           "The reference temperature Tref, as a number in kelvin or text with a unit. Omitted, empty or blank: "
           "298.15 K.",
           false, "--tref", "TEMP"},
          table_arg()},
         Returns::number, layer_all, none, false, h_call},
        {"MOLARMASS", "molarMass", "molarmass", "molar mass from standard atomic weights",
         "Molar mass in g/mol from the IUPAC standard atomic weights.",
         {{"formula", ArgKind::formula, true, "",
           "Chemical formula, e.g. CH4, Ca(OH)2, CuSO4·5H2O (a phase is allowed and ignored), or a cell holding "
           "it. A range gives an array of the same shape.",
           true, nullptr, "FORMULA"}},
         Returns::number, layer_all, none, false, molar_mass_call},
        {"RXNEQX", "rxnEqX", "eqx", "equilibrium conversion of a key reactant for one reaction from a feed",
         "Equilibrium conversion (0 to 1) of the key reactant for this one reaction from the feed, at the "
         "temperature and pressure: one reaction, ideal gas, no kinetics. K from ΔrG° = ΔrH° − T·ΔrS° of the "
         "built-in data (NASA Glenn) or your table at 1 bar; gases as an ideal mixture, condensed species pure. "
         "Feed species not in the reaction are inerts. Negative when products in the feed react back.",
         {reaction_arg(), temperature_required_arg(),
          {"pressure", ArgKind::pressure, true, "",
           "Pressure: a number in bar (absolute), or text with a unit such as \"20 bar\", \"2 MPa\", \"300 kPa\", "
           "\"1 atm\", \"150 psia\", or gauge \"19 barg\", \"150 psig\" (over 101.325 kPa).",
           false, "-P,--pressure", "PRESSURE"},
          {"feed", ArgKind::feed, true, "",
           "A two-column range: species, amount in mol (or any one amount or flow unit for every row: only the "
           "ratios matter). Blank rows are skipped; species not in the reaction are inerts.",
           false, "--feed", "SPECIES=MOL"},
          {"key", ArgKind::species, false, "the first reactant",
           "The reactant whose conversion is given, e.g. \"N2\". Omitted: the first reactant.", false, "--key",
           "SPECIES"},
          table_arg()},
         Returns::number, layer_calc | layer_cli,
         "C: the feed is a range, and ranges do not cross the C interface (rxnheat.h); C++ callers use "
         "Engine::eq_conversion.",
         false, eqx_call},
        {"RXNHESS", "rxnHess", "hess", "ΔH of a reaction combined by Hess's law from step reactions of known ΔH",
         "ΔH of the target reaction as an exact combination of your step reactions, from the ΔH you give for each "
         "step (not from the built-in data): Hess's law. An error (RXNWHY says why in words) when the target is no "
         "combination of the steps, when dependent steps give two different answers, or when one substance is "
         "spelled two ways. RXNHESSPLAN shows the combination used.",
         {{"target", ArgKind::reaction, true, "",
           "The reaction whose ΔH is wanted, as text or a cell, e.g. C(s) + 1/2 O2(g) -> CO(g).", false, nullptr,
           "TARGET"},
          {"steps", ArgKind::reactions, true, "",
           "The step reactions whose ΔH are known, in order: a column (or row) of cells, blank cells skipped "
           "(on the command line, --step once per step). Species are matched as written, phases included.",
           false, "--step", "REACTION"},
          {"step_dh", ArgKind::numbers, true, "",
           "The steps' ΔH in the same order, per mole of each step as written, in 'unit': a column (or row) "
           "beside the steps (on the command line, --dh once per step).",
           false, "--dh", "DH"},
          {"unit", ArgKind::unit, false, "kJ/mol",
           "The unit of the step values and of the result: J/mol, kJ/mol (default), MJ/kmol, kcal/mol, cal/mol, "
           "BTU/lbmol.",
           false, "-u,--unit", "UNIT"}},
         Returns::number, layer_calc | layer_cli,
         "C: the steps are ranges, and ranges do not cross the C interface (rxnheat.h); C++ callers use "
         "Engine::hess.",
         false, hess_call},
        {"RXNHESSPLAN", "rxnHessPlan", "hess-plan", "the combination of step reactions that gives a target reaction",
         "Text: the target reaction as a combination of the step reactions by their numbers (their positions in "
         "the range), e.g. 1×(1) − 2×(3) + 1/2×(4); the combination RXNHESS uses.",
         {{"target", ArgKind::reaction, true, "", "The reaction to combine, as text or a cell.", false, nullptr,
           "TARGET"},
          {"steps", ArgKind::reactions, true, "",
           "The step reactions, in order: a column (or row) of cells, blank cells skipped but keeping their "
           "numbers (on the command line, --step once per step).",
           false, "--step", "REACTION"}},
         Returns::text, layer_calc | layer_cli,
         "C: the steps are a range, and ranges do not cross the C interface (rxnheat.h); C++ callers use "
         "Engine::hess_plan.",
         false, hess_plan_call},
        {"STEAMTSAT", "steamTsat", "steam tsat", "saturation temperature of water at a pressure, IAPWS-IF97",
         "Saturation (boiling) temperature of water in K at the pressure, from the saturation-temperature "
         "equation of IAPWS-IF97 region 4, from 611.213 Pa (saturation at 273.15 K) to the critical point "
         "(220.64 bar, 647.096 K)." RXNHEAT_STEAM_SCOPE,
         {{"pressure", ArgKind::pressure, true, "", steam_pressure_help, true, nullptr, "PRESSURE"}}, Returns::number,
         layer_all, none, false, steam_tsat_call},
        {"STEAMPSAT", "steamPsat", "steam psat", "saturation pressure of water at a temperature, IAPWS-IF97",
         "Saturation (vapour) pressure of water in bar absolute at the temperature, from the saturation-pressure "
         "equation of IAPWS-IF97 region 4, from 273.15 K to the critical point (647.096 K, 220.64 bar)."
         RXNHEAT_STEAM_SCOPE,
         {temperature_required_arg()}, Returns::number, layer_all, none, false, steam_psat_call},
        {"STEAMH", "steamH", "steam h", "specific enthalpy of water or steam, IAPWS-IF97",
         "Specific enthalpy of water or steam in kJ/kg: compressed liquid (IAPWS-IF97 region 1) or superheated "
         "vapour (region 2) at the pressure and temperature; with state \"liquid\" or \"vapour\", the saturated "
         "liquid or vapour at the pressure (region 4; the temperature is then not used). Reference state of "
         "IAPWS-IF97 and of steam tables: internal energy and entropy zero for the saturated liquid at the triple "
         "point (273.16 K, 611.657 Pa); not the formation basis of STREAMH and SPECIESH. A state on the "
         "saturation line needs the state." RXNHEAT_STEAM_SCOPE,
         {{"pressure", ArgKind::pressure, true, "", steam_pressure_help, true, nullptr, "PRESSURE"},
          {"temperature", ArgKind::temperature, false, "",
           "Temperature: a number in kelvin, or text with a unit such as \"250 C\", \"482 F\", \"523.15 K\". "
           "Required unless the state is given. A range gives an array of the same shape.",
           true, "-T,--temperature", "TEMP"},
          {"state", ArgKind::text, false, "",
           "\"liquid\" or \"vapour\": the saturated liquid or vapour at the pressure (the temperature is then not "
           "used). Omitted, empty or blank: the compressed liquid or superheated vapour at the temperature.",
           false, "--state", "STATE"}},
         Returns::number, layer_all, none, false, steam_h_call},
        {"STEAMLATENT", "steamLatent", "steam latent", "latent heat of vaporisation of water at a pressure, IAPWS-IF97",
         "Latent heat of vaporisation of water in kJ/kg at the pressure: the enthalpy of the saturated vapour "
         "(IAPWS-IF97 region 2) minus that of the saturated liquid (region 1) at the saturation temperature "
         "(region 4), from 611.213 Pa to 165.29 bar (saturation at 623.15 K; above it the saturated states lie in "
         "region 3). The heat given up by 1 kg of steam condensing at that pressure." RXNHEAT_STEAM_SCOPE,
         {{"pressure", ArgKind::pressure, true, "", steam_pressure_help, true, nullptr, "PRESSURE"}}, Returns::number,
         layer_all, none, false, steam_latent_call},
        {"FUELHV", "fuelHV", "hv", "heating value (HHV or LHV) of a fuel or a fuel-gas mixture",
         "Heating value of a fuel: the heat given off by its complete combustion with O2 at 25 °C, from the "
         "built-in data (NASA Glenn, NASA/TP-2002-211556) or your table, as a positive number. The combustion "
         "reactions are built from each species' formula: C to CO2(g), H to H2O(l) for HHV (the higher, gross "
         "value) or H2O(g) for LHV (the lower, net value), S to SO2(g), N to N2(g). A mixture is weighted by "
         "mole fraction; CO2, H2O, SO2, N2, O2 and the noble gases in it are inerts that count zero (but count "
         "in its mass and volume). Default MJ/kg. Per gas volume (MJ/Nm3, MJ/Sm3, kWh/Nm3, BTU/scf) as an ideal "
         "gas, without the compressibility correction of ISO 6976 (real natural gas: some 0.2 to 0.3 % more per "
         "volume).",
         {{"fuel", ArgKind::fuel, true, "",
           "A species, e.g. CH4(g), C3H8, methanol(l) (no phase: the phase stable at 25 °C), or a two-column "
           "range: species, mole fraction (summing to 1) or mol % (summing to 100), within 0.5 %; blank rows "
           "are skipped.",
           false, nullptr, "FUEL|SPECIES=FRACTION"},
          {"basis", ArgKind::text, false, "HHV",
           "HHV (higher heating value, the water formed liquid; the default) or LHV (lower heating value, the "
           "water formed a vapour); upper or lower case.",
           false, "--basis", "HHV|LHV"},
          {"unit", ArgKind::unit, false, "MJ/kg",
           "Per mass: MJ/kg (default), kJ/kg, kJ/g, kcal/kg, BTU/lb; per mole: kJ/mol, J/mol, MJ/kmol, "
           "kcal/mol, BTU/lbmol; per gas volume (ideal gas, every species a gas at 25 °C): MJ/Nm3, kWh/Nm3 "
           "(0 °C, 101.325 kPa), MJ/Sm3, kWh/Sm3 (15 °C, 101.325 kPa), BTU/scf (60 °F, 14.696 psia).",
           false, "-u,--unit", "UNIT"},
          table_arg()},
         Returns::number, layer_all, none, false, fuel_call},
        {"STREAMH", "streamH", "streamh", "enthalpy flow of a stream on the formation basis",
         "Enthalpy flow of a stream, Σ F·H°(T), on the formation basis: elements in their reference states at "
         "298.15 K have H = 0, so the difference of two streams is a heat duty. H° = ΔfH°(298.15 K) + [H°(T) − "
         "H°(298.15 K)] from the built-in data (NASA Glenn) or your table; a species without a phase is taken in "
         "the phase stable at the temperature. Default flows kmol/h, result kW.",
         {{"stream", ArgKind::feed, true, "",
           "A two-column range: species, flow in flow_unit (e.g. CH4(g) and 12.5). Blank rows are skipped.", false,
           "--stream", "SPECIES=FLOW"},
          temperature_required_arg(), flow_unit_arg(), stream_result_unit_arg(), table_arg()},
         Returns::number, layer_calc | layer_cli,
         "C: the stream is a range, and ranges do not cross the C interface (rxnheat.h); C++ callers use "
         "Engine::stream_enthalpy.",
         false, streamh_call},
        {"RXNDUTY", "rxnDuty", "duty", "heat duty of a reactor from its feed, conversion and temperatures",
         "Heat to supply to a reactor (negative: to remove): the feed enters at the inlet temperature, the given "
         "conversion of the key reactant reacts by the reaction as written, and everything leaves at the outlet "
         "temperature; = STREAMH(outlet stream) − STREAMH(feed). Feed species not in the reaction are inerts. An "
         "error if a reactant would run out. Default flows kmol/h, result kW." RXNHEAT_CAUTION,
         {reaction_arg(),
          {"feed", ArgKind::feed, true, "",
           "A two-column range: species, flow in flow_unit. Blank rows are skipped; species not in the reaction are "
           "inerts.",
           false, "--feed", "SPECIES=FLOW"},
          {"conversion", ArgKind::number, true, "", "The fraction of the key species fed that reacts, from 0 to 1.",
           false, nullptr, "CONVERSION"},
          {"key", ArgKind::species, true, "", "The reactant whose conversion is given, e.g. \"CO\".", false, nullptr,
           "KEY"},
          {"inlet_temperature", ArgKind::temperature, true, "",
           "Temperature of the feed: a number in kelvin, or text with a unit such as \"350 C\".", true, nullptr,
           "T_IN"},
          {"outlet_temperature", ArgKind::temperature, true, "",
           "Temperature of every stream leaving: a number in kelvin, or text with a unit such as \"350 C\".", true,
           nullptr, "T_OUT"},
          flow_unit_arg(), stream_result_unit_arg(), table_arg()},
         Returns::number, layer_calc | layer_cli,
         "C: the feed is a range, and ranges do not cross the C interface (rxnheat.h); C++ callers use "
         "Engine::duty.",
         false, duty_call},
        {"RXNTAD", "rxnTad", "tad", "adiabatic outlet temperature of a reaction's feed",
         "Adiabatic outlet temperature (K) of the reaction's feed as written (each reactant its coefficient, in "
         "mol per mol of reaction; a species on both sides, such as N2 carried through, its coefficient on the "
         "left) plus the extra feed (inerts, excess air as O2 + 3.76 N2 per mol O2), after the "
         "conversion of the limiting reactant (default 1): where the enthalpy of the products equals that of the "
         "feed, solved on the NASA Glenn H°(T) curves with each species in its phase as written. No dissociation: "
         "above about 2000 K a real flame is cooler. An error when the answer leaves the data's temperature "
         "range." RXNHEAT_CAUTION,
         {reaction_arg(),
          {"feed_temperature", ArgKind::temperature, true, "",
           "Temperature of the feed: a number in kelvin, or text with a unit such as \"25 C\".", true, nullptr,
           "FEED_TEMP"},
          {"extra_feed", ArgKind::feed, false, "",
           "A two-column range: species, mol per mol of reaction, fed besides the reactants as written (e.g. N2 and "
           "7.52 for the air of a methane flame). Omitted: none.",
           false, "--extra", "SPECIES=MOL"},
          {"conversion", ArgKind::number, false, "1",
           "The fraction of the limiting reactant that reacts, from 0 to 1. Omitted, empty or blank (in Calc also "
           "0): 1.",
           false, "--conversion", "X"},
          table_arg()},
         Returns::number, layer_calc | layer_cli,
         "C: the extra feed is a range, and ranges do not cross the C interface (rxnheat.h); C++ callers use "
         "Engine::adiabatic_temperature.",
         false, tad_call},
        {"RXNSOURCE", "rxnSource", "source", "where every number used came from",
         "Text naming where every number used for the reaction or species came from: the data set, its record "
         "and its publication, and the phase used at the temperature.",
         {{"reaction_or_species", ArgKind::reaction, true, "",
           "A reaction or a species, as text or a cell. A range gives an array of the same shape.", true, nullptr,
           "REACTION_OR_SPECIES"},
          table_arg(),
          // After the table: saved documents call rxnSource(reaction_or_species; table).
          {"temperature", ArgKind::temperature, false, "298.15 K",
           "The temperature whose data are cited: a species written without a phase is cited in the phase stable "
           "there, and a written liquid above its 1-bar boiling point is noted. Omitted, empty or blank: 298.15 K.",
           true, "-T,--temperature", "TEMP"}},
         Returns::text, layer_all, none, false, source_call},
        {"RXNVERSION", "rxnVersion", "version", "version and data-set identity, for template audits",
         "Version of rxnheat and identity of its data set, for template audits.", {}, Returns::text, layer_all,
         none, false, version_call},
    };
}

const std::vector<FunctionSpec>& table() {
    static const std::vector<FunctionSpec> all = make_catalogue();
    return all;
}

bool same_ascii_ignoring_case(std::string_view a, std::string_view b) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i) {
        char x = a[i], y = b[i];
        if (x >= 'a' && x <= 'z') x = static_cast<char>(x - 'a' + 'A');
        if (y >= 'a' && y <= 'z') y = static_cast<char>(y - 'a' + 'A');
        if (x != y) return false;
    }
    return true;
}

// ---- reading one value ------------------------------------------------------------------------

std::string quoted(const char* name) { return std::string("'") + name + "'"; }

[[noreturn]] void bad(const ArgSpec& a, const std::string& what) {
    throw Error(ErrorKind::argument, quoted(a.name) + " " + what);
}

bool is_text_kind(ArgKind k) {
    return k == ArgKind::reaction || k == ArgKind::species || k == ArgKind::formula || k == ArgKind::unit ||
           k == ArgKind::text || k == ArgKind::fuel;
}

/// True when the cell means "not given" under the host's rules.
bool blank_cell(const Cell& c, const ArgSpec& a, const HostRules& rules) {
    switch (c.kind) {
    case Cell::Kind::empty: return true;
    case Cell::Kind::text: return trim(c.text).empty();
    case Cell::Kind::number:
        // Calc gives a blank cell as 0; a required number or factor keeps its 0.
        return rules.zero_is_blank && c.number == 0 &&
               !(a.required && (a.kind == ArgKind::number || a.kind == ArgKind::factor || a.kind == ArgKind::pressure));
    }
    return true;
}

double strict_number(const ArgSpec& a, std::string_view text) {
    const std::string s(text);
    char* end = nullptr;
    errno = 0;
    const double v = std::strtod(s.c_str(), &end);
    if (s.empty() || end != s.c_str() + s.size() || !std::isfinite(v))
        bad(a, "must be a number, not '" + s + "'");
    // strtod gives 0 or a denormal for a number closer to zero than a double holds: said, not
    // taken as 0.
    if (errno == ERANGE && std::fabs(v) < DBL_MIN)
        bad(a, "'" + s + "' underflows: it is closer to zero than a double can hold (about 2.2e-308)");
    return v;
}

/// Reads one given (non-blank) cell into `out` by the argument's kind.
void read_cell(const Cell& c, const ArgSpec& a, const HostRules& rules, Bound::Value& out) {
    out.given = true;
    if (c.kind == Cell::Kind::text) {
        const std::string_view t = trim(c.text);
        detail::check_input_text(t, quoted(a.name).c_str());  // the one input-length limit
        out.text.assign(t.data(), t.size());  // keeps the buffer of a Value used again (arrays)
    }
    const bool number = c.kind == Cell::Kind::number;
    if (number && !std::isfinite(c.number)) bad(a, "is not a finite number");
    // A denormal cell value (Calc computes one from =1E-300*1E-20) is what a text such as
    // "1e-320" underflows to: refused in the same words the text gets, so every host agrees.
    if (number && std::fpclassify(c.number) == FP_SUBNORMAL)
        bad(a, "is a denormal number: it is closer to zero than a double can hold with its digits "
               "(about 2.2e-308)");
    switch (a.kind) {
    case ArgKind::reaction:
    case ArgKind::species:
    case ArgKind::formula:
    case ArgKind::unit:
    case ArgKind::text:
    case ArgKind::fuel:  // a single value: a species
        if (number) bad(a, "must be text, not a number");
        return;
    case ArgKind::temperature:
        out.number = number ? c.number : parse_temperature(out.text);
        return;
    case ArgKind::pressure:
        out.number = number ? c.number : detail::parse_pressure(out.text);
        if (!(out.number > 0)) bad(a, "must be above zero absolute (a number in bar, or text such as \"20 bar\")");
        return;
    case ArgKind::number:
        if (!number && !rules.text_numbers) bad(a, "must be a number, not text");
        out.number = number ? c.number : strict_number(a, out.text);
        return;
    case ArgKind::factor:
        out.is_text = !number;
        if (number) out.number = c.number;
        return;
    case ArgKind::table:
    case ArgKind::feed:
    case ArgKind::reactions:
    case ArgKind::numbers:
    case ArgKind::rest:
        return;  // read elsewhere
    }
}

std::string cell_text(const Cell& c) {
    switch (c.kind) {
    case Cell::Kind::empty: return {};
    case Cell::Kind::number: return exact_number(c.number);
    case Cell::Kind::text: return c.text;
    }
    return {};
}

/// A fingerprint of a range's cells as the host gave them: its shape, and each cell's kind,
/// number bits or text bytes with their length (so no text can run into the next cell's).
std::uint64_t range_fingerprint(const Arg& arg) {
    // One multiply a word (FNV-style, 64-bit), the cell's kind and length folded into its first
    // word: the pass costs about what comparing the cells costs.
    constexpr std::uint64_t prime = 0x100000001b3ull;
    std::uint64_t h = 0xcbf29ce484222325ull ^ (arg.rows * 0x9e3779b97f4a7c15ull) ^ arg.cols;
    for (const Cell& c : arg.cells) {
        switch (c.kind) {
        case Cell::Kind::empty: h = (h ^ 1) * prime; break;
        case Cell::Kind::number: {
            std::uint64_t bits;
            std::memcpy(&bits, &c.number, sizeof bits);
            h = (h ^ 2) * prime;
            h = (h ^ bits) * prime;
            break;
        }
        case Cell::Kind::text: {
            h = (h ^ (3 + (std::uint64_t(c.text.size()) << 8))) * prime;
            const char* p = c.text.data();
            std::size_t n = c.text.size();
            for (; n >= 8; p += 8, n -= 8) {
                std::uint64_t w;
                std::memcpy(&w, p, 8);
                h = (h ^ w) * prime;
            }
            if (n) {
                std::uint64_t w = 0;
                std::memcpy(&w, p, n);
                h = (h ^ w) * prime;
            }
            break;
        }
        }
    }
    return h ^ (h >> 29);
}

bool same_cell(const Cell& a, const Cell& b) {
    if (a.kind != b.kind) return false;
    switch (a.kind) {
    case Cell::Kind::empty: return true;
    case Cell::Kind::number: return std::memcmp(&a.number, &b.number, sizeof a.number) == 0;
    case Cell::Kind::text: return a.text == b.text;
    }
    return false;
}

/// A species table from a range. Tables are kept by content (a small cache), since one range
/// usually feeds many cells of a sheet: found by a fingerprint of the cells as given, then
/// compared cell by cell, so that a hit costs one pass over the cells and builds no text
/// (measured: a 10,000-row table cost 3.5 ms a call when its text was the key). The cache holds
/// at most 16 tables and, past the newest, 64 MB of their cells.
std::shared_ptr<const SpeciesTable> table_from_range(const Arg& arg) {
    struct Entry {
        std::uint64_t fingerprint;
        std::size_t rows, cols, bytes;
        std::vector<Cell> cells;  ///< as given: compared on a fingerprint match
        std::shared_ptr<const SpeciesTable> table;
    };
    static std::mutex mutex;
    static std::list<Entry> cache;
    static std::size_t cache_bytes = 0;
    constexpr std::size_t cache_entries = 16, cache_bytes_bound = std::size_t(64) << 20;
    const std::uint64_t fingerprint = range_fingerprint(arg);
    {
        std::lock_guard<std::mutex> lock(mutex);
        for (auto it = cache.begin(); it != cache.end(); ++it)
            if (it->fingerprint == fingerprint && it->rows == arg.rows && it->cols == arg.cols &&
                std::equal(it->cells.begin(), it->cells.end(), arg.cells.begin(), arg.cells.end(), same_cell)) {
                cache.splice(cache.begin(), cache, it);
                return cache.front().table;
            }
    }
    std::vector<std::vector<std::string>> rows(arg.rows);
    std::size_t bytes = arg.cells.size() * sizeof(Cell);
    for (std::size_t r = 0; r < arg.rows; ++r) {
        rows[r].reserve(arg.cols);
        for (std::size_t c = 0; c < arg.cols; ++c) {
            const Cell& cell = arg.cells[r * arg.cols + c];
            rows[r].push_back(cell_text(cell));
            if (cell.text.capacity() > 15) bytes += cell.text.capacity() + 1;
        }
    }
    auto table = std::make_shared<const SpeciesTable>(SpeciesTable::from_rows(rows));
    std::lock_guard<std::mutex> lock(mutex);
    cache.push_front(Entry{fingerprint, arg.rows, arg.cols, bytes, arg.cells, table});
    cache_bytes += bytes;
    while (cache.size() > cache_entries || (cache.size() > 1 && cache_bytes > cache_bytes_bound)) {
        cache_bytes -= cache.back().bytes;
        cache.pop_back();
    }
    return table;
}

std::string shape_text(std::size_t rows, std::size_t cols) {
    return std::to_string(rows) + "×" + std::to_string(cols);
}

/// A feed: a two-column range (species, amount), blank rows skipped.
void read_feed(const Arg& arg, const ArgSpec& a, const HostRules& rules, Bound& b) {
    if (arg.kind == Arg::Kind::omitted || (arg.kind == Arg::Kind::cell && blank_cell(arg.cell, a, rules)))
        bad(a, "is required (a two-column range: species, amount)");
    if (arg.kind != Arg::Kind::range)
        bad(a, "must be a two-column range (species, amount), not a single value");
    if (arg.cols != 2)
        bad(a, "must be a range of two columns (species, amount), not " + shape_text(arg.rows, arg.cols) + " cells");
    const ArgSpec amount_spec{a.name, ArgKind::number, true, "", "", false, nullptr, nullptr};
    for (std::size_t r = 0; r < arg.rows; ++r) {
        const Cell& species = arg.cells[r * 2];
        const Cell& amount = arg.cells[r * 2 + 1];
        const bool no_species = species.kind == Cell::Kind::empty || (species.kind == Cell::Kind::text && trim(species.text).empty());
        const bool no_amount = amount.kind == Cell::Kind::empty || (amount.kind == Cell::Kind::text && trim(amount.text).empty());
        if (no_species && no_amount) continue;  // a blank row
        const std::string row = " row " + std::to_string(r + 1);
        if (no_species) bad(a, row + ": an amount without a species");
        if (species.kind != Cell::Kind::text) bad(a, row + ": the species must be text, not a number");
        if (no_amount) bad(a, row + ": '" + std::string(trim(species.text)) + "' has no amount");
        Bound::Value v;
        try {
            read_cell(amount, amount_spec, rules, v);
        } catch (const Error& e) {
            // "'feed' must be a number, not text" -> "'feed' row 2: the amount must be ..."
            const std::string what = e.what();
            bad(a, row + ": the amount of '" + std::string(trim(species.text)) + "'" + what.substr(quoted(a.name).size()));
        }
        b.feed.push_back({std::string(trim(species.text)), v.number});
    }
    if (b.feed.empty() && a.required) bad(a, "is required, and every row of it is blank");
}

/// A list: a column or row of cells (or one cell), read one by one by the list's element kind,
/// blanks kept in place so that two lists pair by position.
void read_list(const Arg& arg, const ArgSpec& a, const HostRules& rules, Bound::Value& out) {
    const ArgKind element = a.kind == ArgKind::reactions ? ArgKind::reaction : ArgKind::number;
    const ArgSpec item{a.name, element, true, "", "", false, nullptr, nullptr};  // required: a 0 stays 0
    std::vector<const Cell*> cells;
    if (arg.kind == Arg::Kind::cell) {
        cells.push_back(&arg.cell);
    } else if (arg.kind == Arg::Kind::range) {
        if (arg.rows != 1 && arg.cols != 1)
            bad(a,
                "must be one column or one row of cells, not " + shape_text(arg.rows, arg.cols) + " cells");
        for (const auto& c : arg.cells) cells.push_back(&c);
    } else if (arg.kind == Arg::Kind::table) {
        bad(a, "must be a column or row of cells, not a species table");
    }
    if (cells.empty() && a.required) bad(a, "is required");
    for (std::size_t i = 0; i < cells.size(); ++i) {
        Bound::Value v;
        if (!blank_cell(*cells[i], item, rules)) {
            try {
                read_cell(*cells[i], item, rules, v);
            } catch (const Error& e) {
                // "'steps' must be text, not a number" -> "'steps' cell 2: must be text, ..."
                bad(a, "cell " + std::to_string(i + 1) + ":" +
                           std::string(e.what()).substr(quoted(a.name).size()));
            }
        }
        out.items.push_back(std::move(v));
    }
    out.given = false;
    for (const auto& v : out.items) out.given = out.given || v.given;
    if (!out.given && a.required) bad(a, "is required, and every cell of it is blank");
}

/// Reads a whole (non-spreading, or spreading but given as one value) argument.
void read_whole(const Arg& arg, const ArgSpec& a, const HostRules& rules, Bound& b,
                std::shared_ptr<const SpeciesTable>& table_holder, std::size_t i) {
    Bound::Value& out = b.values[i];
    if (a.kind == ArgKind::table) {
        if (arg.kind == Arg::Kind::table) {
            table_holder = arg.table;
        } else if (arg.kind == Arg::Kind::range) {
            table_holder = table_from_range(arg);
        } else if (arg.kind == Arg::Kind::cell && !blank_cell(arg.cell, a, rules)) {
            bad(a, "must be a cell range whose first row names the columns (formula, phase, dHf, ...)");
        }
        out.given = table_holder != nullptr;
        b.at.table = table_holder.get();
        return;
    }
    if (a.kind == ArgKind::feed || (a.kind == ArgKind::fuel && arg.kind == Arg::Kind::range && arg.rows * arg.cols != 1)) {
        if (a.kind == ArgKind::feed && !a.required &&
            (arg.kind == Arg::Kind::omitted || (arg.kind == Arg::Kind::cell && blank_cell(arg.cell, a, rules))))
            return;  // an optional feed (RXNTAD's extra_feed): none
        read_feed(arg, a, rules, b);  // a fuel's composition is read as a feed (fractions for amounts)
        out.given = !b.feed.empty();
        return;
    }
    if (is_list(a.kind)) {
        read_list(arg, a, rules, out);
        return;
    }
    const Cell* cell = nullptr;
    if (arg.kind == Arg::Kind::cell) {
        cell = &arg.cell;
    } else if (arg.kind == Arg::Kind::range) {
        if (arg.rows * arg.cols != 1)
            bad(a, "must be a single value, not a range of " + std::to_string(arg.rows * arg.cols) + " cells");
        cell = &arg.cells.front();
    } else if (arg.kind == Arg::Kind::table) {
        bad(a, "must be a single value, not a species table");
    }
    if (!cell || blank_cell(*cell, a, rules)) {
        if (a.required) {
            if (is_text_kind(a.kind) && cell && cell->kind != Cell::Kind::empty)
                bad(a, "is required but empty");
            bad(a, a.kind == ArgKind::temperature
                       ? "is required (a number in K, or text such as \"350 C\")"
                       : "is required");
        }
        return;
    }
    read_cell(*cell, a, rules, out);
}

void set_temperature(const FunctionSpec& f, Bound& b) {
    for (std::size_t i = 0; i < f.args.size(); ++i) {
        if (f.args[i].kind == ArgKind::temperature && std::string_view(f.args[i].name) == "temperature")
            b.at.temperature_K = b.number(i, T_ref);
        if (f.args[i].kind == ArgKind::pressure && std::string_view(f.args[i].name) == "pressure")
            b.at.pressure_bar = b.number(i, P_standard_bar);
    }
}

Outcome run(const FunctionSpec& f, Engine& engine, const Bound& b) {
    try {
        return f.call(engine, b);
    } catch (const Error& e) {
        return Outcome::failed(e);
    } catch (const std::bad_alloc&) {
        throw;
    } catch (const std::exception& e) {
        return Outcome::failed(Error(ErrorKind::internal, std::string("internal error: ") + e.what()));
    }
}

Result single(Outcome o) {
    Result r;
    r.cells.push_back(std::move(o));
    return r;
}

Result evaluate_kept(const FunctionSpec& f, const std::vector<Arg>& args, const HostRules& rules, Engine& engine) {
    if (!f.variadic() && args.size() > f.args.size())
        return single(Outcome::failed(Error(ErrorKind::argument,
                                            std::string(f.calc_name) + " takes at most " +
                                                std::to_string(f.args.size()) + " arguments, not " +
                                                std::to_string(args.size()))));
    Bound base;
    base.values.resize(f.args.size());
    base.all = &args;
    base.rules = &rules;
    std::shared_ptr<const SpeciesTable> table_holder;
    static const Arg nothing;

    // Which arguments spread: a range given where the catalogue says a range gives an array.
    std::vector<std::size_t> spread;
    for (std::size_t i = 0; i < f.args.size(); ++i) {
        const ArgSpec& a = f.args[i];
        const Arg& arg = i < args.size() ? args[i] : nothing;
        if (a.kind == ArgKind::rest) {
            base.rest_from = i;
            break;
        }
        if (a.spreads && arg.kind == Arg::Kind::range) {
            spread.push_back(i);
            continue;
        }
        try {
            read_whole(arg, a, rules, base, table_holder, i);
        } catch (const Error& e) {
            return single(Outcome::failed(e, i + 1));
        }
    }
    set_temperature(f, base);
    if (spread.empty()) return single(run(f, engine, base));

    // Shape of the result: one range as it is; ranges of one shape paired cell by cell; a
    // column (the first) with a row (the second) as the whole table.
    const Arg& first = args[spread[0]];
    std::size_t rows = first.rows, cols = first.cols;
    bool table_form = false;
    for (std::size_t k = 1; k < spread.size(); ++k) {
        const Arg& other = args[spread[k]];
        if (other.rows == rows && other.cols == cols) continue;
        if (spread.size() == 2 && first.cols == 1 && other.rows == 1) {
            table_form = true;
            cols = other.cols;
            continue;
        }
        return single(Outcome::failed(
            Error(ErrorKind::argument,
                  "a range of " + shape_text(first.rows, first.cols) + " cells for " + quoted(f.args[spread[0]].name) +
                      " and one of " + shape_text(other.rows, other.cols) + " for " + quoted(f.args[spread[k]].name) +
                      " do not combine: give ranges of one shape (paired cell by cell), or a column of the first "
                      "with a row of the second (the whole table)"),
            spread[k] + 1));
    }

    Result out;
    out.rows = rows;
    out.cols = cols;
    out.cells.resize(rows * cols);
    // One Bound for every element: only the spreading arguments' values and the conditions
    // change between elements, so copying the whole of `base` (its vectors and strings) for each
    // of 20,000 elements was allocation for nothing (tests/bench/bench_addin_array.cpp).
    Bound b = base;
    for (std::size_t r = 0; r < rows; ++r)
        for (std::size_t c = 0; c < cols; ++c) {
            b.at = base.at;
            Outcome& o = out.cells[r * cols + c];
            bool blank = false;
            try {
                for (std::size_t k = 0; k < spread.size() && !blank; ++k) {
                    const std::size_t i = spread[k];
                    const Arg& arg = args[i];
                    const std::size_t at = table_form ? (k == 0 ? r : c) : r * cols + c;
                    const Cell& cell = arg.cells[at];
                    Bound::Value& v = b.values[i];
                    v.given = v.is_text = false;  // as a fresh Value, its text's buffer kept
                    v.number = 0;
                    v.text.clear();
                    if (blank_cell(cell, f.args[i], rules)) {
                        blank = true;  // a blank cell of a range stays blank in the result
                        break;
                    }
                    read_cell(cell, f.args[i], rules, v);
                }
            } catch (const Error& e) {
                o = Outcome::failed(e);
                continue;
            }
            if (blank) continue;
            set_temperature(f, b);
            o = run(f, engine, b);
        }
    return out;
}

Outcome why_call(Engine& e, const Bound& b) {
    const std::string_view name = b.text(0);
    const FunctionSpec* f = find_function(name);
    if (!f) {
        std::string list;
        for (const auto& g : table()) list += std::string(list.empty() ? "" : ", ") + g.calc_name;
        throw Error(ErrorKind::argument, "there is no rxnheat function '" + std::string(name) + "'; the functions are " + list);
    }
    std::vector<Arg> inner;
    if (b.all && b.all->size() > b.rest_from) inner.assign(b.all->begin() + static_cast<std::ptrdiff_t>(b.rest_from), b.all->end());
    return Outcome::of_text(why(*f, inner, *b.rules, e));
}

}  // namespace

Arg Arg::range(std::size_t rows, std::size_t cols, std::vector<Cell> cells) {
    Arg a;
    a.kind = Kind::range;
    a.rows = rows;
    a.cols = cols;
    a.cells = std::move(cells);
    a.cells.resize(rows * cols);
    return a;
}

Outcome Outcome::failed(const Error& e, std::size_t argument) {
    Outcome o;
    o.kind = Kind::error;
    o.text = e.what();
    o.error = e.kind();
    o.argument = argument;
    return o;
}

const char* to_string(ArgKind kind) noexcept {
    switch (kind) {
    case ArgKind::reaction: return "reaction";
    case ArgKind::species: return "species";
    case ArgKind::formula: return "formula";
    case ArgKind::temperature: return "temperature";
    case ArgKind::pressure: return "pressure";
    case ArgKind::unit: return "unit";
    case ArgKind::number: return "number";
    case ArgKind::factor: return "number or fraction";
    case ArgKind::text: return "text";
    case ArgKind::table: return "range (species table)";
    case ArgKind::feed: return "range (species, amount)";
    case ArgKind::reactions: return "range (reactions)";
    case ArgKind::numbers: return "range (numbers)";
    case ArgKind::fuel: return "species, or range (species, mole fraction)";
    case ArgKind::rest: return "arguments";
    }
    return "value";
}

const std::vector<FunctionSpec>& catalogue() { return table(); }

const FunctionSpec* find_function(std::string_view name) noexcept {
    name = trim(name);
    for (const auto& f : table())
        if (same_ascii_ignoring_case(name, f.calc_name) || name == f.idl_method || name == f.cli_command) return &f;
    return nullptr;
}

Result evaluate(const FunctionSpec& f, const std::vector<Arg>& args, const HostRules& rules, Engine& engine) {
    Result r = evaluate_kept(f, args, rules, engine);
    if (f.errors_as_text)
        for (auto& o : r.cells)
            if (o.kind == Outcome::Kind::error) o = Outcome::of_text(o.text);
    return r;
}

std::string why(const FunctionSpec& f, const std::vector<Arg>& args, const HostRules& rules, Engine& engine) {
    const Result r = evaluate_kept(f, args, rules, engine);
    for (std::size_t i = 0; i < r.cells.size(); ++i) {
        const Outcome& o = r.cells[i];
        if (o.kind != Outcome::Kind::error) continue;
        std::string where;
        if (r.is_array())
            where = "row " + std::to_string(i / r.cols + 1) + ", column " + std::to_string(i % r.cols + 1) +
                    " of the array: ";
        return where + o.text;
    }
    return "ok";
}

}  // namespace rxnheat
