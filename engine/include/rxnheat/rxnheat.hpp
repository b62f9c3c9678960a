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

#include <cstdint>
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

/// What went wrong, for hosts that map errors to their own codes. Each kind's name, C status
/// and whether it is a bug are in one table: error_kind_info().
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

/// One row of the error-kind table, read by the CLI (`error_kind` in --json), the C ABI
/// (status codes) and the add-in (bad input -> Err:502, a bug -> #VALUE!).
struct ErrorKindInfo {
    ErrorKind kind;
    const char* name;   ///< "unknown_species"
    int c_status;       ///< the rxnheat_status of rxnheat.h
    bool internal;      ///< a bug in rxnheat rather than bad input
};
RXNHEAT_API const ErrorKindInfo& error_kind_info(ErrorKind kind) noexcept;

class RXNHEAT_API Error : public std::runtime_error {
public:
    Error(ErrorKind kind, const std::string& message);
    ErrorKind kind() const noexcept { return kind_; }
private:
    ErrorKind kind_;
};

/// Standard reference temperature, K.
inline constexpr double T_ref = 298.15;
/// Standard pressure, bar (IUPAC: 1 bar = 100 kPa).
inline constexpr double P_standard_bar = 1.0;
/// Longest reaction, species or argument text accepted, in characters (the one input limit).
inline constexpr std::size_t max_input_chars = 4096;
/// Band of |ΔrH°| counted as thermoneutral by kind()/RXNKIND unless told otherwise, kJ/mol.
inline constexpr double default_tolerance_kJ_per_mol = 0.1;

/// Text helpers shared by every layer, so that the add-in, the CLI and the engine trim and
/// print numbers the same way.
/// Without blanks (space, tab, CR, LF) at either end.
RXNHEAT_API std::string_view trim(std::string_view text) noexcept;
/// The shortest decimal text that reads back as the same double ("0.1", "-890.5701757717673").
RXNHEAT_API std::string exact_number(double x);
/// A number for messages in words: 10 significant digits ("623.15", "1e+306").
RXNHEAT_API std::string number_words(double x);

/// Temperature text -> kelvin: "350 C", "350 °C", "662 F", "1100 R", "623.15 K", or a bare
/// number (kelvin). Throws Error(unit/argument) for anything else, for 0 K and below, for a
/// kelvin value too close to 0 to compute with (a denormal number) and for a number that
/// overflows or underflows (each said in words).
RXNHEAT_API double parse_temperature(std::string_view text);

/// A user species table (engine/DATA.md, User tables), built from rows of text cells; row 0 names the columns.
/// Rows override the built-in data for the same formula and phase.
class RXNHEAT_API SpeciesTable {
public:
    /// Throws Error(table) naming the row (1-based, header = row 1) and the column.
    static SpeciesTable from_rows(const std::vector<std::vector<std::string>>& rows);
    /// Reads a CSV file with the same columns (for the CLI's --table).
    static SpeciesTable from_csv_file(const std::string& path);
    /// A fingerprint of the parsed table (header and cells, escaped), taken once when the table
    /// is built; prepared reactions are cached under (fingerprint, reaction text).
    std::uint64_t fingerprint() const noexcept;
    struct Impl;
    const Impl* impl() const noexcept { return impl_.get(); }
    std::shared_ptr<const Impl> shared_impl() const noexcept { return impl_; }
private:
    std::shared_ptr<const Impl> impl_;
};

/// The state a function is evaluated at. One struct instead of the same positional defaults in
/// every signature. A bare number converts to it (the temperature in K), so `dh(r, 500)` reads
/// as "at 500 K".
struct Conditions {
    double temperature_K = T_ref;
    double pressure_bar = P_standard_bar;  ///< absolute: eq_conversion() (RXNEQX)
    const SpeciesTable* table = nullptr;   ///< user species table over the built-in data, or none
    Conditions() = default;
    Conditions(double T_K, const SpeciesTable* user_table = nullptr)  // NOLINT: implicit on purpose
        : temperature_K(T_K), table(user_table) {}
};

/// One row of a feed or stream (RXNEQX, STREAMH, RXNDUTY, RXNTAD, FUELHV): a species as a user
/// writes it and its amount (RXNEQX: mol, or any one amount unit, only the ratios matter; STREAMH
/// and RXNDUTY: a flow in the call's flow unit; RXNTAD: mol per mol of reaction; FUELHV: the mole
/// fraction or mol %).
struct FeedItem {
    std::string species;
    double amount_mol = 0;
};

/// One known step of a Hess's-law combination (RXNHESS): its number as the user counts it (its
/// position in the range, 1-based), the reaction, and its ΔH per mole of reaction as written in
/// the unit given to Engine::hess().
struct HessStep {
    std::size_t number = 0;
    std::string reaction;
    double dh = 0;
};
/// The saturated states of water on the IAPWS-IF97 saturation line (Engine::steam_h).
enum class SaturatedState { liquid, vapour };

/// The sign of ΔrH°, as RXNKIND words it.
enum class HeatKind { exothermic, endothermic, thermoneutral };
/// "exothermic", "endothermic", "thermoneutral".
RXNHEAT_API const char* to_string(HeatKind kind) noexcept;

/// Sizes of an engine's own caches (prepared reactions), for tests and hosts that watch memory.
struct EngineOptions {
    std::size_t prepared_cache_entries = 4096;  ///< 0: no cache
    /// Bound on the cache's own memory (an estimate from its parts' sizes: texts, syntax trees,
    /// resolved species and the user-table rows they hold; tables are never kept alive by it).
    std::size_t prepared_cache_bytes = std::size_t(32) << 20;
};
struct CacheStats {
    std::size_t entries = 0, capacity = 0;
    std::size_t hits = 0, misses = 0;
    std::size_t bytes = 0, byte_capacity = 0;  ///< estimated bytes held, and the bound
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
    HeatKind kind = HeatKind::thermoneutral;  ///< at the default tolerance
    std::vector<SourceLine> sources;
};

/// A full description of one species at one temperature (the CLI's `species` command).
struct SpeciesReport {
    std::string species;          ///< resolved, with the phase used at temperature_K, e.g. "H2O(l)"
    std::string record;           ///< data record name
    double temperature_K = 0;
    double dHf_kJ_per_mol = 0;    ///< ΔfH° at 298.15 K (a phase whose data start above or end below
                                  ///< 298.15 K: the value its data record gives for 298.15 K)
    bool has_heat_capacity = false;  ///< false: the record (or table row) gives only an enthalpy at
                                     ///< one temperature — then dHf_kJ_per_mol holds that value (it
                                     ///< is ΔfH° only when that temperature is 298.15 K) and the
                                     ///< fields below are zero (nothing in the data to print)
    double H_kJ_per_mol = 0;      ///< assigned enthalpy H°(T) = ΔfH°(298.15) + [H°(T) − H°(298.15)]
    double dH_sensible_kJ_per_mol = 0;  ///< H°(T) − dHf: sensible heat from 298.15 K
    double Cp_J_per_molK = 0;
    double S_J_per_molK = 0;
    double molar_mass_g_per_mol = 0;
    double tmin_K = 0, tmax_K = 0;  ///< the range of the record used
    std::string source;
};

/// The engine. Every function takes the Conditions it is evaluated at (temperature, pressure,
/// user table); the text arguments are as a user types them.
class RXNHEAT_API Engine {
public:
    /// The engine over the embedded data set; created on first use, shared, thread-safe.
    static Engine& shared();
    /// An engine of its own (own cache) over the same embedded data.
    explicit Engine(const EngineOptions& options);

    // --- reactions -------------------------------------------------------------------------
    /// ΔrH° of the reaction as written. `unit` (empty: kJ/mol): J/mol, kJ/mol, MJ/kmol,
    /// kcal/mol, cal/mol, BTU/lbmol; with `per` (a species of the reaction) also kJ/kg, MJ/kg,
    /// kJ/g, kcal/kg, BTU/lb.
    double dh(std::string_view reaction, const Conditions& at = {}, std::string_view unit = {},
              std::string_view per = {});
    /// ΔrU° = ΔrH° − Δn(gas)·R·T, same arguments as dh().
    double du(std::string_view reaction, const Conditions& at = {}, std::string_view unit = {},
              std::string_view per = {});
    /// ΔrS° of the reaction as written, from the species' standard entropies S°(T) (built-in
    /// data or the table's S column). `unit` (empty: J/(mol·K)): J/(mol·K), kJ/(mol·K),
    /// cal/(mol·K) (thermochemical); also written J/(mol*K), J/mol/K.
    double ds(std::string_view reaction, const Conditions& at = {}, std::string_view unit = {});
    /// ΔrG° = ΔrH° − T·ΔrS° of the reaction as written. `unit` the per-mole units of dh()
    /// (empty: kJ/mol); per-mass units are refused (ΔrG° here is per mole of reaction).
    double dg(std::string_view reaction, const Conditions& at = {}, std::string_view unit = {});
    /// log10 K = −ΔrG°/(R·T·ln 10), R = 8.31446261815324 J/(mol·K) (exact SI), standard state
    /// 1 bar for gases (Conditions::pressure_bar is not used: K does not depend on pressure).
    double logk(std::string_view reaction, const Conditions& at = {});
    /// Enthalpy change when `quantity` (in `quantity_unit`) of species `key` reacts or forms.
    /// Amount/mass/normal-volume units give a total (default kJ); "…/s|min|h|d" give a rate
    /// (default kW). Empty result_unit picks the default.
    double load(std::string_view reaction, double quantity, std::string_view quantity_unit,
                std::string_view key, std::string_view result_unit = {}, const Conditions& at = {});
    /// The unit load() answers in for these units: `result_unit`, or kJ / kW when it is empty.
    static std::string load_unit(std::string_view quantity_unit, std::string_view result_unit);
    /// Exothermic, endothermic or thermoneutral (|ΔrH°| <= tolerance, kJ/mol).
    HeatKind kind(std::string_view reaction, const Conditions& at = {},
                  double tolerance_kJ = default_tolerance_kJ_per_mol);
    /// "ok", or the first problem in words: what dh(), du(), kind() and report() would throw, and
    /// what ds(), dg() and logk() would throw for a value that is not a finite number (their
    /// data lacking entropies is their own diagnosis, not said here). Never throws.
    std::string check(std::string_view reaction, const Conditions& at = {}) noexcept;
    /// The reaction with the smallest whole-number coefficients (exact rational null space).
    /// Only the table of `at` is used (it may name species).
    std::string balance(std::string_view reaction, const Conditions& at = {});
    /// Products and reactants exchanged.
    std::string reverse(std::string_view reaction);
    /// Every coefficient times `factor` ("2", "0.5", "1/2", "½", "1e-7"); exact fractions kept.
    /// A double factor is taken as the simplest fraction within 1e-12 of it, else its decimal
    /// to 12 significant digits. Throws Error(argument) when a scaled coefficient would have more
    /// digits than a reaction's numbers may (12), so that the text always reads back.
    std::string scale(std::string_view reaction, std::string_view factor);
    std::string scale(std::string_view reaction, double factor);
    /// Equilibrium conversion (0–1) of the reactant `key` (empty: the first reactant) for this one
    /// reaction from `feed`, at at.temperature_K and at.pressure_bar: ideal-gas mixture, condensed
    /// species pure (activity 1), K from ΔrG° = ΔrH° − T·ΔrS° at 1 bar. Feed species not in the
    /// reaction are inerts. Negative when products in the feed react back. Throws Error(argument)
    /// for a feed without every reactant, a pressure <= 0, a K outside what a double holds.
    double eq_conversion(std::string_view reaction, const std::vector<FeedItem>& feed,
                         std::string_view key = {}, const Conditions& at = {});
    /// Hess's law: ΔH of `target` as an exact rational combination of the steps, from the steps'
    /// own ΔH (in `unit`, the per-mole units of dh(); empty: kJ/mol), not from the data. Species
    /// are matched as written (formula or name, charge, phase). Throws Error(argument) when the
    /// target is no combination of the steps, when dependent steps give two different answers,
    /// and for one substance spelled two ways; Error(unbalanced) for an unbalanced reaction.
    double hess(std::string_view target, const std::vector<HessStep>& steps, std::string_view unit = {});
    /// The combination hess() uses, by step number: "1×(1) − 2×(3) + 1/2×(4)" (step values unused).
    std::string hess_plan(std::string_view target, const std::vector<HessStep>& steps);
    /// Heating value (FUELHV): −ΔcH° at 298.15 K of complete combustion with O2 (C -> CO2(g),
    /// H -> H2O(l) for basis "HHV", the default, or H2O(g) for "LHV", in any letter case;
    /// S -> SO2(g); N -> N2(g)), the reactions built and balanced from each component's
    /// composition. `composition`: species and mole fraction or mol % (in FeedItem::amount_mol),
    /// summing to 1 or 100 within 0.5 % (then scaled to 1); components that are themselves
    /// combustion products (CO2, H2O, SO2, N2), O2 and the noble gases are inerts (zero). A
    /// mixture is weighted by mole fraction per mole, and per mass by its mean molar mass (inerts
    /// included). `unit` (empty: MJ/kg): per mass MJ/kg, kJ/kg, kJ/g, kcal/kg, BTU/lb; per mole
    /// the units of dh(); per gas volume MJ/Nm3, kWh/Nm3 (0 °C), MJ/Sm3, kWh/Sm3 (15 °C),
    /// BTU/scf (60 °F, 14.696 psia), all at 101.325 kPa as an ideal gas (no compressibility),
    /// which needs every component to be a gas at 25 °C. Species without a phase are taken in
    /// the phase stable at 25 °C. Positive; throws Error for any other element than C, H, N, O,
    /// S (and a noble gas alone), a fuel of inerts only, or one that gives off no heat.
    double heating_value(const std::vector<FeedItem>& composition, std::string_view basis = {},
                         std::string_view unit = {}, const Conditions& at = {});
    /// The same for one species alone.
    double heating_value(std::string_view species, std::string_view basis = {}, std::string_view unit = {},
                         const Conditions& at = {});
    // --- heat balances (STREAMH, RXNDUTY, RXNTAD) --------------------------------------------
    /// Σ Fᵢ·H°ᵢ(T) of a stream on the formation basis (elements in their reference states at
    /// 298.15 K have H = 0), H° the assigned enthalpy ΔfH°(298.15) + [H°(T) − H°(298.15)].
    /// Each FeedItem's amount is a flow (or amount) in `flow_unit` (empty: kmol/h): any quantity
    /// unit of load(), mass units through each species' molar mass, normal volumes as ideal gas.
    /// `result_unit` any load() result unit of the same kind (empty: kW for a flow, kJ for a
    /// total). A species without a phase is taken in its phase stable at T.
    double stream_enthalpy(const std::vector<FeedItem>& stream, std::string_view flow_unit = {},
                           std::string_view result_unit = {}, const Conditions& at = {});
    /// The unit stream_enthalpy() and duty() answer in: `result_unit`, or kW / kJ by the flow unit.
    static std::string stream_unit(std::string_view flow_unit, std::string_view result_unit);
    /// Heat to supply to a reactor (negative: to remove): `feed` (flows in `flow_unit`, as for
    /// stream_enthalpy()) enters at `inlet_K`; `conversion` (0–1) of the reactant `key` reacts by
    /// the reaction as written; everything leaves at `outlet_K`. = stream_enthalpy(out at
    /// outlet_K) − stream_enthalpy(feed at inlet_K). Feed species of the reaction are matched
    /// by composition (and phase, when written) and use the reaction's data; others are inerts.
    /// Throws Error(argument) for a conversion outside 0–1, a key that is no reactant, a
    /// reactant that would run out (naming it and the amounts).
    double duty(std::string_view reaction, const std::vector<FeedItem>& feed, double conversion,
                std::string_view key, double inlet_K, double outlet_K, std::string_view flow_unit = {},
                std::string_view result_unit = {}, const SpeciesTable* table = nullptr);
    /// Adiabatic outlet temperature (K) of the reaction's feed as written (each reactant its
    /// coefficient in mol per mol of reaction) plus `extra_feed` (mol per mol of reaction:
    /// inerts, excess reactants, products in the feed), fed at at.temperature_K, after
    /// `conversion` (0–1) of the limiting reactant: the root of Σ nᵢ,out·H°ᵢ(T) = Σ nᵢ,in·H°ᵢ(T_feed)
    /// on the data's closed-form H°(T), each species in its phase as written. Throws
    /// Error(out_of_range) when the answer lies outside the data's temperature range.
    double adiabatic_temperature(std::string_view reaction, const std::vector<FeedItem>& extra_feed = {},
                                 double conversion = 1, const Conditions& at = {});

    /// Everything at once, for reports.
    ReactionReport report(std::string_view reaction, const Conditions& at = {});

    // --- species ---------------------------------------------------------------------------
    /// ΔfH° of one species; at T ≠ 298.15 K the standard enthalpy of formation from the
    /// elements in their reference states at T. `unit` as for dh() (per mole of species).
    double species_hf(std::string_view species, const Conditions& at = {}, std::string_view unit = {});
    /// Cp° in J/(mol·K).
    double species_cp(std::string_view species, const Conditions& at);
    /// H°(T) − H°(Tref) in kJ/mol (sensible heat, phase changes included).
    double species_h(std::string_view species, const Conditions& at, double Tref_K = T_ref);
    /// S°(T) in J/(mol·K).
    double species_s(std::string_view species, const Conditions& at);
    SpeciesReport species_report(std::string_view species, const Conditions& at = {});

    /// g/mol from standard atomic weights. Formula only (a phase is allowed and ignored).
    double molar_mass(std::string_view formula);

    /// Where every number used came from, one line per item, for a reaction or a species.
    std::string source(std::string_view reaction_or_species, const Conditions& at = {});

    /// Library version and data-set identity.
    static std::string version();

    // --- water and steam, IAPWS-IF97 (regions 1, 2 and 4; not ideal gas) ----------------------
    // Pressures in bar absolute, temperatures in K, enthalpies in kJ/kg on the IF97 reference
    // (u = s = 0 for the saturated liquid at the triple point). A state outside regions 1, 2 and
    // 4 (region 3 near the critical point, region 5 above 1073.15 K, above 100 MPa, below
    // 273.15 K) is Error(out_of_range) naming the region; nothing is extrapolated.
    /// Saturation temperature (K) at the pressure, 611.213 Pa to 22.064 MPa (region 4, eq. 31).
    static double steam_tsat(double pressure_bar);
    /// Saturation pressure (bar) at the temperature, 273.15 K to 647.096 K (region 4, eq. 30).
    static double steam_psat(double temperature_K);
    /// h (kJ/kg) of compressed liquid (region 1) or vapour (region 2) at (p, T). A state on the
    /// saturation line (within a relative 1e-9 in pressure) is Error(argument): say which state.
    static double steam_h(double pressure_bar, double temperature_K);
    /// h (kJ/kg) of the saturated liquid (region 1) or vapour (region 2) at the pressure.
    static double steam_h(double pressure_bar, SaturatedState state);
    /// Latent heat of vaporisation h'' − h' (kJ/kg) at the pressure, up to 165.29 bar (623.15 K).
    static double steam_latent(double pressure_bar);

    // --- the engine's own state ----------------------------------------------------------------
    CacheStats cache_stats() const;
    void clear_cache();

    struct Impl;
    ~Engine();
    Engine(const Engine&) = delete;
    Engine& operator=(const Engine&) = delete;
private:
    std::unique_ptr<Impl> impl_;
};

}  // namespace rxnheat
