#include "descriptions.hpp"

namespace rxnheat_addin {

namespace {

// Argument texts shared by several functions.
constexpr const char* reaction_text =
    "Reaction text as chemists write it, e.g. CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l) "
    "(arrows -> = → ⇌, Unicode subscripts allowed), or a cell holding it. A range of "
    "reactions gives an array of the same shape (enter as an array formula); an element "
    "that fails shows Err:502, and RXNCHECK over the same range says why.";
constexpr const char* temperature_optional_text =
    "Optional. Temperature: a number in kelvin, or text with a unit such as \"350 C\", "
    "\"350 °C\", \"662 F\", \"1100 R\", \"623.15 K\". Omitted, empty, blank or 0: 298.15 K.";
constexpr const char* temperature_required_text =
    "Required. Temperature: a number in kelvin, or text with a unit such as \"350 C\", "
    "\"350 °C\", \"662 F\", \"1100 R\", \"623.15 K\".";
constexpr const char* energy_unit_text =
    "Optional. Result unit: J/mol, kJ/mol (default), MJ/kmol, kcal/mol, cal/mol, BTU/lbmol "
    "(per mole of reaction as written); with 'per' also kJ/kg, MJ/kg, kJ/g, kcal/kg, BTU/lb.";
constexpr const char* per_text =
    "Optional. A species of the reaction, e.g. \"CH4\": the result is then per mole of that "
    "species, or per mass of it with a mass unit such as MJ/kg. Omitted: per mole of reaction.";
constexpr const char* table_text =
    "Optional. A cell range with your own species data; its first row names the columns: "
    "formula, phase, dHf (kJ/mol at 298.15 K), and optionally S (J/(mol·K)), cp (J/(mol·K)) "
    "or a, b, c, d, e (Shomate, T in K/1000), tmin, tmax, name, source. Its rows override "
    "the built-in data for the same formula and phase.";
constexpr const char* species_text =
    "Species with its phase, e.g. CO2(g), H2O(l), Fe(s), or a name such as ethanol(l); or a "
    "cell holding it. A range gives an array of the same shape (enter as an array formula); "
    "an element that fails shows Err:502.";

std::vector<FunctionText> make_functions() {
    return {
        {"rxnDH", "RXNDH",
         "Standard reaction enthalpy ΔrH° of the reaction as written (per mole of reaction "
         "extent), at 298.15 K or the temperature given, from the built-in data (NASA Glenn, "
         "NASA/TP-2002-211556) or your table. Negative means heat is released (exothermic). "
         "Default unit kJ/mol.",
         {{"reaction", reaction_text},
          {"temperature", temperature_optional_text},
          {"unit", energy_unit_text},
          {"per", per_text},
          {"table", table_text}}},
        {"rxnDU", "RXNDU",
         "Standard reaction internal energy ΔrU° = ΔrH° − Δn(gas)·R·T of the reaction as "
         "written, for constant-volume (bomb calorimeter) work. Default unit kJ/mol. Same "
         "arguments as RXNDH.",
         {{"reaction", reaction_text},
          {"temperature", temperature_optional_text},
          {"unit", energy_unit_text},
          {"per", per_text},
          {"table", table_text}}},
        {"rxnLoad", "RXNLOAD",
         "Heat load: the enthalpy change when the given amount or flow of the key species "
         "reacts (or forms) by the reaction as written. An amount gives a total (default kJ); "
         "a flow (per s, min, h, d) gives a rate (default kW). Negative means heat is released. "
         "CAUTION: a screening estimate for the standard state, ideal gas and complete "
         "conversion. Thermal runaway and relief sizing need calorimetry and a process hazard "
         "analysis; defer to local codes and licensed engineers.",
         {{"reaction", reaction_text},
          {"quantity", "Required. How much of the key species reacts or forms, as a number in "
                       "quantity_unit (e.g. 500)."},
          {"quantity_unit",
           "Required. Amount: mol, kmol, lbmol; mass: g, kg, t, lb; normal gas volume: Nm3 "
           "(0 °C, 101.325 kPa) or scf (60 °F, 14.696 psia); or any of these per s, min, h or d "
           "for a flow, e.g. \"kg/h\"."},
          {"key", "Required. The species of the reaction that the quantity refers to, e.g. "
                  "\"CH4\"."},
          {"result_unit",
           "Optional. For a total: kJ (default), J, MJ, GJ, kWh, MWh, kcal, BTU, MMBTU, therm. "
           "For a flow: kW (default), W, MW, kcal/h, BTU/h, MMBTU/h, TR (12,000 BTU/h)."},
          {"temperature", temperature_optional_text},
          {"table", table_text}}},
        {"rxnKind", "RXNKIND",
         "Classifies the reaction as text: exothermic (ΔrH° < 0), endothermic (ΔrH° > 0) or "
         "thermoneutral (|ΔrH°| within the tolerance).",
         {{"reaction", reaction_text},
          {"temperature", temperature_optional_text},
          {"tolerance", "Optional. Band in kJ/mol (per mole of reaction) counted as "
                        "thermoneutral. Omitted, empty, blank or 0: 0.1 kJ/mol."},
          {"table", table_text}}},
        {"rxnCheck", "RXNCHECK",
         "Checks a reaction and returns ok, or the first problem in plain words: where the text "
         "does not parse, which element or charge does not balance, an unknown or ambiguous "
         "species, a missing phase, a temperature outside the data. It is the same diagnosis "
         "with which RXNDH and the other numeric functions fail (Err:502).",
         {{"reaction", reaction_text},
          {"temperature", temperature_optional_text},
          {"table", table_text}}},
        {"rxnBalance", "RXNBALANCE",
         "Balances a reaction: returns its text with the smallest whole-number coefficients "
         "that balance every element and the charge. An error if no balance exists or if more "
         "than one independent balance does.",
         {{"reaction", reaction_text}, {"table", table_text}}},
        {"rxnReverse", "RXNREVERSE",
         "Returns the reaction text with products and reactants exchanged (ΔrH° changes sign).",
         {{"reaction", reaction_text}}},
        {"rxnScale", "RXNSCALE",
         "Returns the reaction text with every coefficient multiplied by the factor; exact "
         "fractions are kept (1/2 O2). ΔrH° scales by the same factor.",
         {{"reaction", reaction_text},
          {"factor", "Required. A number, or text such as \"1/2\", \"0.5\" or \"½\"."}}},
        {"speciesHf", "SPECIESHF",
         "Standard enthalpy of formation ΔfH° of one species, default kJ/mol at 298.15 K. At "
         "another temperature: the enthalpy of formation from the elements in their reference "
         "states at that temperature.",
         {{"species", species_text},
          {"temperature", temperature_optional_text},
          {"unit", "Optional. J/mol, kJ/mol (default), MJ/kmol, kcal/mol, cal/mol, BTU/lbmol "
                   "(per mole of the species)."},
          {"table", table_text}}},
        {"speciesCp", "SPECIESCP",
         "Standard molar heat capacity Cp° of one species at the temperature, in J/(mol·K).",
         {{"species", species_text},
          {"temperature", temperature_required_text},
          {"table", table_text}}},
        {"speciesH", "SPECIESH",
         "Sensible heat H°(T) − H°(Tref) of one species in kJ/mol, including phase changes "
         "covered by the data (no extrapolation outside the data's range).",
         {{"species", species_text},
          {"temperature", temperature_required_text},
          {"reference_temperature",
           "Optional. The reference temperature Tref, as a number in kelvin or text with a "
           "unit. Omitted, empty, blank or 0: 298.15 K."},
          {"table", table_text}}},
        {"molarMass", "MOLARMASS",
         "Molar mass in g/mol from the IUPAC standard atomic weights.",
         {{"formula", "Chemical formula, e.g. CH4, Ca(OH)2, CuSO4·5H2O (a phase is allowed and "
                      "ignored), or a cell holding it. A range gives an array of the same "
                      "shape."}}},
        {"rxnSource", "RXNSOURCE",
         "Text naming where every number used for the reaction or species came from: the data "
         "set, its record and its publication.",
         {{"reaction_or_species", "A reaction or a species, as text or a cell. A range gives "
                                  "an array of the same shape."},
          {"table", table_text}}},
        {"rxnVersion", "RXNVERSION",
         "Version of the rxnheat add-in and identity of its data set, for template audits.",
         {}},
    };
}

bool same_ignoring_case(std::string_view a, std::string_view b) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i) {
        char x = a[i], y = b[i];
        if (x >= 'a' && x <= 'z') x = static_cast<char>(x - 'a' + 'A');
        if (y >= 'a' && y <= 'z') y = static_cast<char>(y - 'a' + 'A');
        if (x != y) return false;
    }
    return true;
}

}  // namespace

const std::vector<FunctionText>& functions() {
    static const std::vector<FunctionText> all = make_functions();
    return all;
}

const FunctionText* by_programmatic(std::string_view name) {
    for (const auto& f : functions())
        if (name == f.programmatic) return &f;
    return nullptr;
}

const FunctionText* by_display(std::string_view name) {
    for (const auto& f : functions())
        if (same_ignoring_case(name, f.display)) return &f;
    return nullptr;
}

}  // namespace rxnheat_addin
