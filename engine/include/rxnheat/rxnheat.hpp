// rxnheat — standard reaction enthalpies from reaction text.
//
// The public C++ interface of librxnheat (with rxnheat/csv.hpp, its CSV reader and writer).
// Everything else in the library is private.
// All functions are thread-safe. Every function that computes a number either returns a
// value computed from the embedded data or throws rxnheat::Error with a message in words;
// it never returns a placeholder.
//
// Temperatures are in kelvin (see parse_temperature() for text with units); energies are
// per mole of reaction extent (the reaction as written) unless a `per` species is given.
#pragma once

#include <memory>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

#if defined(RXNHEAT_BUILDING)
#define RXNHEAT_API __attribute__((visibility("default")))
#else
#define RXNHEAT_API
#endif

namespace rxnheat {

/// What went wrong, for hosts that map errors to their own codes.
enum class ErrorKind {
    syntax,             ///< the reaction or species text does not parse
    too_long,           ///< input over the 4096-character limit
    unknown_species,    ///< no data for a species
    ambiguous_species,  ///< two or more data records fit; the message lists them
    phase,              ///< phase missing where the data allow no single answer, or unknown phase
    out_of_range,       ///< temperature outside the data's range (never extrapolated)
    unbalanced,         ///< elements or charge do not balance; the message gives each total
    unit,               ///< unknown or unsuitable unit; the message lists the known ones
    argument,           ///< any other bad argument (non-finite number, missing key species, ...)
    table,              ///< malformed user species table (row and column named)
    internal            ///< a bug: please report
};

class RXNHEAT_API Error : public std::runtime_error {
public:
    Error(ErrorKind kind, const std::string& message);
    ErrorKind kind() const noexcept { return kind_; }
private:
    ErrorKind kind_;
};

/// Standard reference temperature, K.
inline constexpr double T_ref = 298.15;
/// Longest reaction or species text accepted, in characters.
inline constexpr std::size_t max_input_chars = 4096;

/// Temperature text -> kelvin: "350 C", "350 °C", "662 F", "1100 R", "623.15 K", or a bare
/// number (kelvin). Throws Error(unit/argument) for anything else or below 0 K.
RXNHEAT_API double parse_temperature(std::string_view text);

/// A user species table (SPEC 3.4), built from rows of text cells; row 0 names the columns.
/// Rows override the built-in data for the same formula and phase.
class RXNHEAT_API SpeciesTable {
public:
    /// Throws Error(table) naming the row (1-based, header = row 1) and the column.
    static SpeciesTable from_rows(const std::vector<std::vector<std::string>>& rows);
    /// Reads a CSV file with the same columns (for the CLI's --table).
    static SpeciesTable from_csv_file(const std::string& path);
    struct Impl;
    const Impl* impl() const noexcept { return impl_.get(); }
private:
    std::shared_ptr<const Impl> impl_;
};

/// Where one number came from, for RXNSOURCE and --json "sources".
struct SourceLine {
    std::string species;  ///< the species as resolved, e.g. "CH4(g)"
    std::string record;   ///< the data record's own name, e.g. "CH4" or "H2O(L)"
    std::string text;     ///< the full citation in words
};

/// A full evaluation of one reaction, for reports (the CLI's --json).
struct ReactionReport {
    std::string canonical;        ///< normalised reaction text, e.g. "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"
    double temperature_K = 0;
    double dH_kJ_per_mol = 0;     ///< ΔrH° per mole of extent
    double dU_kJ_per_mol = 0;     ///< ΔrU° = ΔrH° − Δn(gas)·R·T
    double dn_gas = 0;            ///< moles of gas, products minus reactants
    std::string kind;             ///< exothermic / endothermic / thermoneutral
    std::vector<SourceLine> sources;
};

/// A full description of one species at one temperature (the CLI's `species` command).
struct SpeciesReport {
    std::string species;          ///< resolved, e.g. "H2O(l)"
    std::string record;           ///< data record name
    double temperature_K = 0;
    double dHf_kJ_per_mol = 0;    ///< ΔfH° at 298.15 K (a phase whose data start above or end below
                                  ///< 298.15 K: the value its data record gives for 298.15 K)
    double H_kJ_per_mol = 0;      ///< assigned enthalpy H°(T) = ΔfH°(298.15) + [H°(T) − H°(298.15)]
    double dH_sensible_kJ_per_mol = 0;  ///< H°(T) − dHf: sensible heat from 298.15 K
    double Cp_J_per_molK = 0;
    double S_J_per_molK = 0;
    double molar_mass_g_per_mol = 0;
    double tmin_K = 0, tmax_K = 0;  ///< the range of the record used
    std::string source;
};

/// Every function below takes an optional user species table (nullptr: built-in data only).
class RXNHEAT_API Engine {
public:
    /// The engine over the embedded data set; created on first use, shared, thread-safe.
    static Engine& shared();

    // --- reactions -------------------------------------------------------------------------
    /// ΔrH° of the reaction as written at T. `unit`: J/mol, kJ/mol, MJ/kmol, kcal/mol, cal/mol,
    /// BTU/lbmol; with `per` (a species of the reaction) also kJ/kg, MJ/kg, kJ/g, kcal/kg, BTU/lb.
    double dh(std::string_view reaction, double T = T_ref, std::string_view unit = "kJ/mol",
              std::string_view per = {}, const SpeciesTable* table = nullptr);
    /// ΔrU° = ΔrH° − Δn(gas)·R·T, same arguments as dh().
    double du(std::string_view reaction, double T = T_ref, std::string_view unit = "kJ/mol",
              std::string_view per = {}, const SpeciesTable* table = nullptr);
    /// Enthalpy change when `quantity` (in `quantity_unit`) of species `key` reacts or forms.
    /// Amount/mass/normal-volume units give a total (default kJ); "…/s|min|h|d" give a rate
    /// (default kW). Empty result_unit picks the default.
    double load(std::string_view reaction, double quantity, std::string_view quantity_unit,
                std::string_view key, std::string_view result_unit = {}, double T = T_ref,
                const SpeciesTable* table = nullptr);
    /// "exothermic", "endothermic" or "thermoneutral" (|ΔrH°| <= tolerance kJ/mol).
    std::string kind(std::string_view reaction, double T = T_ref, double tolerance_kJ = 0.1,
                     const SpeciesTable* table = nullptr);
    /// "ok", or the first problem in words (the same diagnosis dh() would throw). Never throws.
    std::string check(std::string_view reaction, double T = T_ref,
                      const SpeciesTable* table = nullptr) noexcept;
    /// The reaction with the smallest whole-number coefficients (exact rational null space).
    std::string balance(std::string_view reaction, const SpeciesTable* table = nullptr);
    /// Products and reactants exchanged.
    std::string reverse(std::string_view reaction);
    /// Every coefficient times `factor` ("2", "0.5", "1/2", "½"); exact fractions kept.
    std::string scale(std::string_view reaction, std::string_view factor);
    std::string scale(std::string_view reaction, double factor);
    /// Everything at once, for reports.
    ReactionReport report(std::string_view reaction, double T = T_ref,
                          const SpeciesTable* table = nullptr);

    // --- species ---------------------------------------------------------------------------
    /// ΔfH° of one species; at T ≠ 298.15 K the standard enthalpy of formation from the
    /// elements in their reference states at T. `unit` as for dh() (per mole of species).
    double species_hf(std::string_view species, double T = T_ref, std::string_view unit = "kJ/mol",
                      const SpeciesTable* table = nullptr);
    /// Cp° in J/(mol·K).
    double species_cp(std::string_view species, double T, const SpeciesTable* table = nullptr);
    /// H°(T) − H°(Tref) in kJ/mol (sensible heat, phase changes included).
    double species_h(std::string_view species, double T, double Tref = T_ref,
                     const SpeciesTable* table = nullptr);
    /// S°(T) in J/(mol·K).
    double species_s(std::string_view species, double T, const SpeciesTable* table = nullptr);
    SpeciesReport species_report(std::string_view species, double T = T_ref,
                                 const SpeciesTable* table = nullptr);

    /// g/mol from standard atomic weights. Formula only (a phase is allowed and ignored).
    double molar_mass(std::string_view formula);

    /// Where every number used came from, one line per item, for a reaction or a species.
    std::string source(std::string_view reaction_or_species, const SpeciesTable* table = nullptr);

    /// Library version and data-set identity.
    static std::string version();

    struct Impl;
    ~Engine();
    Engine(const Engine&) = delete;
    Engine& operator=(const Engine&) = delete;
private:
    Engine();
    std::unique_ptr<Impl> impl_;
};

}  // namespace rxnheat
