// Units of rxnheat: energy per amount, quantities and flows (RXNLOAD), load results, and the
// gas constant. Private to the engine; parse_temperature() is public (rxnheat.hpp).
//
// ---- Unit definitions (every factor is checked against GNU units in tests/base/test_units.cpp)
//
//  Gas constant   R = k·N_A = 1.380649e-23 J/K × 6.02214076e23 /mol = 8.31446261815324 J/(mol·K),
//                 exact since the 2019 SI (CODATA 2018; printed there as 8.314 462 618...).
//                 GNU units: `gasconstant` (alias `R`) = k N_A, the same number. (The NASA Glenn
//                 coefficients were fitted with 8.314510; nasa.hpp keeps that one for them.)
//  cal, kcal      thermochemical calorie, 1 cal = 4.184 J exactly, as thermochemical tables use.
//                 GNU units: `cal` = `calorie_th` = 4.184 J (not the 4.1868 J IT calorie).
//  BTU            International Table BTU, 1055.05585262 J exactly (= cal_IT·lb·°F/(g·K)).
//                 GNU units: `btu` = `btu_IT`. MMBTU = 10^6 BTU. BTU/lb = 2.326 J/g exactly.
//                 `Btu`, `MMBtu` (the spelling of NIST SP 811 and of gas trading) are the same
//                 units as `BTU`, `MMBTU`, accepted wherever those are.
//  Gcal           10^9 International Table calories, 1 Gcal = 4.1868e9 J exactly (GNU units:
//                 `1e9 calorie_IT`; its own `Gcal` is thermochemical, 4.184e9 J). Chosen because
//                 Gcal is the unit of heat-supply and steam bills and heat meters, which count
//                 in IT calories, and a user typing Gcal compares with those figures; a
//                 thermochemical Gcal would differ from them by 0.067 % without a word. It is
//                 the same calorie the IT BTU is built on. The price: 1 Gcal is NOT 10^6 of
//                 rxnheat's (thermochemical) kcal; 1 Gcal = 1.000669 × 10^6 kcal.
//  therm          the US therm, 105 480 400 J exactly, as GNU units' `therm` (= `UStherm`).
//                 It is not 10^5 IT BTU (105 505 585.262 J) nor the EC therm (10^5 × 1055.06 J):
//                 the three differ by up to 0.025 %.
//  lb, lbmol      avoirdupois pound 0.45359237 kg exactly; lbmol = 453.59237 mol; klb = 1000 lb.
//  t              metric tonne, 1000 kg (not the short or long ton).
//  psi            lbf/in² = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² = 6894.757293168... Pa.
//  Nm3 (Nm³)      1 m³ of ideal gas at 0 °C (273.15 K) and 101.325 kPa:
//                 n = p·V/(R·T) = 44.6150334054703 mol (molar volume 22.413969545 L/mol).
//  scf            1 ft³ (0.028316846592 m³) of ideal gas at 60 °F (288.7055... K) and
//                 14.696 psia (101325.353... Pa): 1.19529110617742 mol (379.4828 scf/lbmol).
//                 MMscf = 10^6 scf; MMscfd = MMscf/d (one word, as gas flows are written).
//  Sm3 (Sm³)      1 m³ of ideal gas at 15 °C (288.15 K) and 101.325 kPa, the standard
//                 reference conditions of ISO 13443: 42.2925433791574 mol (23.6448300 L/mol).
//                 All three are computed from R, not typed molar volumes; the ideal gas law
//                 is what the trade's conversions between them assume.
//  TR             ton of refrigeration, 12 000 BTU/h = 3516.8528420667 W (GNU units `tonref`).
//  time           s, min = 60 s, h = 3600 s (also written hr), d = 86 400 s. Every flow and
//                 rate takes hr where it takes h: kg/hr, Btu/hr, kcal/hr, Gcal/hr, Nm3/hr.
//  kWh, MWh       3.6e6 J, 3.6e9 J.
//  pressure       bar = 1e5 Pa (number alone: bar absolute); atm = 101 325 Pa; psia = psi;
//                 barg, psig: gauge, over 1 atm (101.325 kPa). GNU units: `bar`, `atm`, `psi`.
//  temperature    K; C: T = t + 273.15; F: T = (t + 459.67)·5/9; R (Rankine): T = t·5/9.
//
// Unit names are case-sensitive (`MJ/kg` is accepted, `mJ/kg` and `mj/kg` are errors that list
// the known units; a wrong-case name gets a "did you mean" hint, never a silent fix). Spaces at
// either end of a unit and around its '/' are ignored. An empty energy or result unit means the
// default (kJ/mol; kJ for totals, kW for rates). An empty quantity unit is an error.
#pragma once

#include <optional>
#include <string>
#include <string_view>

namespace rxnheat::detail {

/// Boltzmann and Avogadro constants (exact, SI 2019).
inline constexpr double boltzmann_J_per_K = 1.380649e-23;
inline constexpr double avogadro_per_mol = 6.02214076e23;
/// Molar gas constant R = k·N_A, J/(mol·K) (CODATA 2018, exact).
inline constexpr double R = 8.31446261815324;

/// Exact definitions used by the unit tables (see the block above).
namespace unit_def {
inline constexpr double cal_J = 4.184;                  // thermochemical calorie
inline constexpr double cal_IT_J = 4.1868;              // International Table calorie (Gcal)
inline constexpr double btu_J = 1055.05585262;          // International Table BTU
inline constexpr double therm_J = 105480400.0;          // US therm
inline constexpr double lb_kg = 0.45359237;             // avoirdupois pound
inline constexpr double lbmol_mol = 453.59237;
inline constexpr double standard_gravity = 9.80665;     // m/s², for lbf
inline constexpr double inch_m = 0.0254;
inline constexpr double ft_m = 0.3048;
inline constexpr double psi_Pa = lb_kg * standard_gravity / (inch_m * inch_m);
inline constexpr double atm_Pa = 101325.0;
inline constexpr double T_zero_C = 273.15;              // K at 0 °C
inline constexpr double T_15_C = T_zero_C + 15.0;       // K at 15 °C (ISO 13443)
inline constexpr double T_60_F = (60.0 + 459.67) * 5.0 / 9.0;  // K at 60 °F
/// Ideal-gas molar densities p/(R·T) at the normal and standard conditions, mol/m³.
inline constexpr double normal_mol_per_m3 = atm_Pa / (R * T_zero_C);        // Nm3
inline constexpr double standard_mol_per_m3 = atm_Pa / (R * T_15_C);        // Sm3
inline constexpr double scf_mol_per_m3 = 14.696 * psi_Pa / (R * T_60_F);    // scf
inline constexpr double ft3_m3 = ft_m * ft_m * ft_m;
}  // namespace unit_def

// ---- energy per amount: RXNDH, RXNDU, RXNDG, SPECIESHF (and FUELHV's per-mole/mass units) ----

/// A value given in J per mole of reaction extent (or of species), returned in `unit`:
/// per mole J/mol, kJ/mol, MJ/kmol, kcal/mol, cal/mol, BTU/lbmol (or Btu/lbmol); per mass
/// (only when `molar_mass_g_per_mol` is given: the molar mass of the `per` species) kJ/kg,
/// MJ/kg, kJ/g, kcal/kg, BTU/lb (or Btu/lb). Empty unit = kJ/mol.
/// Throws Error(unit) for an unknown unit (the message lists all known ones) and for a per-mass
/// unit without a molar mass (the message says to give `per`); Error(argument) for a non-finite
/// value or a molar mass that is not finite and > 0. `what` names the value in that error
/// ("ΔrH°"), for the value given and for the value in `unit`.
double from_J_per_mol(double J_per_mol, std::string_view unit, std::string_view what,
                      std::optional<double> molar_mass_g_per_mol = std::nullopt);
/// The inverse: a value in `unit` to J/mol (e.g. RXNHESS step values). Same rules and errors.
double to_J_per_mol(double value, std::string_view unit, std::string_view what,
                    std::optional<double> molar_mass_g_per_mol = std::nullopt);
/// True when `unit` is one of the per-mass units above (so the caller needs a molar mass).
/// Unknown units give false (from_J_per_mol() then reports them).
bool is_per_mass_unit(std::string_view unit) noexcept;

// ---- entropy per amount: RXNDS ------------------------------------------------------------------

/// A value in J/(mol·K) per mole of reaction extent, returned in `unit`: J/(mol·K) (the default
/// when empty), kJ/(mol·K), cal/(mol·K) (thermochemical calorie, 4.184 J); each also written with
/// '*' or '.' for '·' (J/(mol*K)) or as J/mol/K. "J/mol·K" is refused: read left to right it is
/// J·K/mol. Throws Error(unit) for any other unit (the message lists the known ones),
/// Error(argument) for a non-finite value, naming it `what`.
double from_J_per_molK(double J_per_molK, std::string_view unit, std::string_view what);

// ---- quantities and flows: RXNLOAD ------------------------------------------------------------

enum class QuantityKind { amount, mass, volume };

struct QuantityUnit {
    QuantityKind kind = QuantityKind::amount;
    /// One unit in mol (amount), g (mass), or m³ at the unit's own reference state (volume).
    double factor = 0;
    /// Volume units only: ideal-gas molar density p/(R·T) at the reference state, mol/m³;
    /// 0 for amount and mass units.
    double mol_per_m3 = 0;
    /// Seconds per time unit of a flow ("kg/h": 3600); 0 for a total.
    double seconds = 0;
    bool is_rate() const noexcept { return seconds > 0; }
};

/// Parses a quantity unit: mol, kmol, lbmol, g, kg, t, lb, klb, Nm3 (also Nm³, Nm^3), Sm3
/// (also Sm³, Sm^3), scf, MMscf, each optionally followed by /s, /min, /h, /hr or /d; or
/// MMscfd (= MMscf/d). Throws Error(unit) listing the accepted forms.
QuantityUnit quantity_unit(std::string_view unit);

/// `quantity` in `unit` → mol (a total) or mol/s (a flow) of the key species. Mass units need
/// the key's molar mass (g/mol). Throws Error(unit) for an unknown unit or a mass unit without
/// a molar mass, Error(argument) for a non-finite quantity or a bad molar mass.
double quantity_to_mol(double quantity, std::string_view unit,
                       std::optional<double> molar_mass_g_per_mol = std::nullopt);

// ---- pressure: RXNEQX ------------------------------------------------------------------------

/// Pressure text -> bar absolute: a bare number is bar; units bar, bara, Pa, kPa, MPa, atm, psia,
/// and the gauge units barg, psig (over the standard atmosphere, 1.01325 bar). `psi` alone is an
/// error (absolute or gauge is not said). Throws Error(unit) for an unknown unit,
/// Error(argument) for no number, a non-finite value, or an absolute pressure <= 0.
double parse_pressure(std::string_view text);

// ---- heating values: FUELHV -----------------------------------------------------------------

/// What a heating-value unit is per: a mole, a mass, or a gas volume at stated conditions.
enum class HeatingPer { mole, mass, volume };

struct HeatingValueUnit {
    std::string name;     ///< as the caller wrote it, trimmed ("MJ/Nm3"); the default "MJ/kg" when empty
    HeatingPer per = HeatingPer::mass;
    /// J per mole (mole), J per gram (mass) or J per m³ (volume) in one of the unit.
    double factor = 0;
    /// Volume only: the ideal-gas molar density p/(R·T) of its metering conditions, mol/m³.
    double mol_per_m3 = 0;
    /// Volume only: the metering conditions in words, for messages ("0 °C and 101.325 kPa").
    const char* conditions = "";
};

/// Parses a heating-value unit: the per-mole units of from_J_per_mol(), its per-mass units
/// (MJ/kg, the default when empty, kJ/kg, kJ/g, kcal/kg, BTU/lb, Btu/lb), and per gas volume
/// MJ/Nm3, kWh/Nm3 (0 °C), MJ/Sm3, kWh/Sm3 (15 °C), each also with ³ or ^3, and BTU/scf, Btu/scf
/// (60 °F, 14.696 psia). A gas volume is converted with the ideal-gas molar volume (no
/// compressibility). Throws Error(unit) for any other unit, listing the known ones.
HeatingValueUnit heating_value_unit(std::string_view unit);

/// A heating value in J per mole of fuel, in `unit` (see heating_value_unit()); `molar_mass` g/mol.
double heating_value_in(double J_per_mol, const HeatingValueUnit& unit, double molar_mass_g_per_mol);

// ---- load results: RXNLOAD ---------------------------------------------------------------------

inline constexpr std::string_view default_total_unit = "kJ";
inline constexpr std::string_view default_rate_unit = "kW";

/// An energy in J (`rate` false) or a power in W (`rate` true) returned in `unit`:
/// totals J, kJ, MJ, GJ, kWh, MWh, kcal, Gcal, BTU, Btu, MMBTU, MMBtu, therm; rates W, kW, MW,
/// kcal/h, Gcal/h, BTU/h, Btu/h, MMBTU/h, MMBtu/h, TR, each "/h" also written "/hr".
/// Empty unit = kJ or kW. `quantity_unit` (the RXNLOAD quantity's unit) only
/// words the error when a total unit is given for a flow or a power unit for a total.
/// Throws Error(unit) for an unknown or mismatched unit, Error(argument) for a non-finite value,
/// naming it as `what` ("the heat load").
double load_result(double J_or_W, std::string_view unit, bool rate, const char* what,
                   std::string_view quantity_unit = {});

}  // namespace rxnheat::detail
