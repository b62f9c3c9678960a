// Reader for the NASA Glenn thermodynamic coefficient file (NASA/TP-2002-211556, appendix A).
// Private to the engine.
#pragma once

#include <array>
#include <cmath>
#include <cstddef>
#include <string>
#include <string_view>
#include <utility>
#include <vector>

namespace rxnheat::detail {

/// The gas constant the NASA Glenn coefficients were fitted with, J/(mol·K) (TP-2002-211556).
inline constexpr double R_nasa = 8.314510;

enum class PhaseKind { gas, liquid, solid };  // solid = condensed and not liquid

/// One temperature interval of 9-term coefficients:
/// Cp/R = a0 T^-2 + a1 T^-1 + a2 + a3 T + a4 T^2 + a5 T^3 + a6 T^4, b0/b1 the H and S constants.
struct Interval {
    double tmin = 0, tmax = 0;
    std::array<double, 7> a{};
    std::array<double, 2> b{};
};

struct Record {
    std::string name;        ///< the file's own name, e.g. "C8H18(L),n-octa", "Fe(a)", "CH4"
    std::string comment;     ///< the rest of the first line (references), trimmed
    std::string date_code;   ///< reference-date code, e.g. "g 8/99", "j 3/78", "tpis96"
    /// Composition from the element fields: symbols normalised to element case ("CL" -> "Cl"),
    /// electrons ("E") removed and turned into the charge.
    std::vector<std::pair<std::string, double>> elements;
    int charge = 0;          ///< -(electron count): "E -1.00" is a cation
    PhaseKind phase = PhaseKind::gas;
    int phase_code = 0;      ///< the file's phase field: 0 gas, >0 condensed
    double molar_mass = 0;   ///< g/mol, from the record
    double h298 = 0;         ///< J/mol: ΔfH°(298.15 K), or the assigned enthalpy at t_single
    std::vector<Interval> intervals;  ///< ascending, contiguous; continued records merged in
    double t_single = 0;     ///< zero-interval records only: the one temperature h298 applies at
    bool reactant_only = false;  ///< listed after "END PRODUCTS"
    std::size_t line = 0;    ///< 1-based line of the record's first line in the file
    std::vector<std::size_t> merged_lines;  ///< first lines of the continuation records merged in
    double tmin() const { return intervals.empty() ? t_single : intervals.front().tmin; }
    double tmax() const { return intervals.empty() ? t_single : intervals.back().tmax; }
};

/// Parses the whole file text. Consecutive records with the same name (e.g. below and above a
/// Curie or lambda point) are merged into one Record with their intervals concatenated; a gap or
/// overlap between them is an error. Throws std::runtime_error("thermo.inp line N: ...") on
/// anything malformed.
std::vector<Record> parse_nasa_glenn(std::string_view text);

/// The interval of r that holds T (either one at a shared boundary), or nullptr outside r's range.
const Interval* find_interval(const Record& r, double T);

/// Cp°/R, H°/(R·T) and S°/R of one interval at T (closed forms of TP-2002-211556 eqs. 1-3).
double cp_over_R(const Interval& iv, double T);
/// The `lnT` forms take ln(T) from the caller, so a reaction's species share one logarithm
/// (Prepared::dH); both forms give the same bits.
inline double h_over_RT(const Interval& iv, double T, double lnT) {
    const auto& a = iv.a;
    return -a[0] / (T * T) + a[1] * lnT / T + a[2] +
           T * (a[3] / 2 + T * (a[4] / 3 + T * (a[5] / 4 + T * a[6] / 5))) + iv.b[0] / T;
}
inline double h_over_RT(const Interval& iv, double T) { return h_over_RT(iv, T, std::log(T)); }
inline double s_over_R(const Interval& iv, double T, double lnT) {
    const auto& a = iv.a;
    return -a[0] / (2 * T * T) - a[1] / T + a[2] * lnT +
           T * (a[3] + T * (a[4] / 2 + T * (a[5] / 3 + T * a[6] / 4))) + iv.b[1];
}
inline double s_over_R(const Interval& iv, double T) { return s_over_R(iv, T, std::log(T)); }

}  // namespace rxnheat::detail
