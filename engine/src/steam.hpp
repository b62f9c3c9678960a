// Water and steam by IAPWS-IF97 (the IAPWS release R7-97(2012), "Revised Release on the IAPWS
// Industrial Formulation 1997 for the Thermodynamic Properties of Water and Steam"): region 1
// (compressed liquid), region 2 (vapour, ideal-gas and residual parts), region 4 (the saturation
// line and its backward form) and the B23 boundary between regions 2 and 3. Regions 3 and 5 are
// not implemented: a state in them is an error that names the region, never an extrapolation.
// Private to the engine; the public functions are Engine::steam_* (rxnheat.hpp).
//
// Units inside: pressure in MPa, temperature in K, energies in kJ/kg (the release's own units);
// the Engine functions convert from and to bar.
#pragma once

#include "rxnheat/rxnheat.hpp"

#include <string_view>

namespace rxnheat::steam {

/// Specific gas constant of water in IAPWS-IF97, kJ/(kg·K) (release, eq. 1).
inline constexpr double R_kJ_per_kgK = 0.461526;
/// Critical point (release, eqs. 2, 3, 4).
inline constexpr double T_critical_K = 647.096;
inline constexpr double p_critical_MPa = 22.064;
/// Limits of regions 1, 2 and 4 (release, section 4 and figure 1).
inline constexpr double T_min_K = 273.15;  ///< lower limit of IF97
inline constexpr double T_13_K =
    623.15;  ///< regions 1 and 3 meet here; region 4 beside region 1 and 2 ends here
inline constexpr double T_B23_max_K = 863.15;       ///< above it region 2 reaches 100 MPa
inline constexpr double T_region2_max_K = 1073.15;  ///< above it: region 5
inline constexpr double T_region5_max_K = 2273.15;
inline constexpr double p_max_MPa = 100.0;  ///< regions 1, 2, 3
inline constexpr double p_region5_max_MPa = 50.0;

/// Properties of one state from a fundamental equation (region 1 or 2), the release's units.
struct State {
    double v_m3_per_kg = 0;    ///< specific volume
    double h_kJ_per_kg = 0;    ///< specific enthalpy
    double u_kJ_per_kg = 0;    ///< specific internal energy
    double s_kJ_per_kgK = 0;   ///< specific entropy
    double cp_kJ_per_kgK = 0;  ///< specific isobaric heat capacity
    double w_m_per_s = 0;      ///< speed of sound
};

/// Region 1, the Gibbs equation (release, eq. 7, table 2), at any (p, T): no range check.
State region1(double p_MPa, double T_K) noexcept;
/// Region 2, ideal-gas part (eq. 16, table 10) plus residual part (eq. 17, table 11): no range check.
State region2(double p_MPa, double T_K) noexcept;
/// Region 4, the saturation-pressure equation (eq. 30): ps in MPa for 273.15 K <= T <= 647.096 K
/// (no range check).
double saturation_pressure_MPa(double T_K) noexcept;
/// Region 4, the backward saturation-temperature equation (eq. 31): Ts in K for
/// 611.213 Pa <= p <= 22.064 MPa (no range check).
double saturation_temperature_K(double p_MPa) noexcept;
/// The B23 boundary (eqs. 5 and 6): pressure at a temperature and its inverse.
double b23_pressure_MPa(double T_K) noexcept;
double b23_temperature_K(double p_MPa) noexcept;

/// The regions of IAPWS-IF97 a (p, T) state may fall in, as the release numbers them.
enum class Region { one = 1, two = 2, three = 3, four = 4, five = 5, outside = 0 };
/// Which region the single-phase state (p, T) lies in; Region::four when p is the saturation
/// pressure at T within a relative 1e-9 (liquid or vapour is then the user's choice).
Region region_of(double p_MPa, double T_K) noexcept;

/// STEAMH's `state` argument: "liquid" or "vapour" (any letter case); anything else is
/// Error(argument) in words.
SaturatedState parse_saturated_state(std::string_view text);

}  // namespace rxnheat::steam
