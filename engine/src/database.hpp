// The embedded data set, indexed, and species resolution (engine/DATA.md, Identity and Phases). Private.
#pragma once

#include "grammar/parse.hpp"
#include "nasa.hpp"
#include "tables.hpp"

#include <memory>
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

namespace rxnheat { class SpeciesTable; }

namespace rxnheat::detail {

using grammar::Rational;

/// Element counts of a formula unit, sorted by symbol, plus the net charge.
struct Composition {
    std::vector<std::pair<std::string, Rational>> atoms;
    int charge = 0;
    std::string key() const;  ///< canonical text key, equal for equal compositions
};

/// Thermodynamic model of one phase over one temperature range: a NASA record or a user row.
struct UserSpecies;  // usertable.hpp

/// Temperatures over which a row of data/aqueous.csv that gives Cp° is used, Cp° held at its
/// 298.15 K value (engine/DATA.md, Aqueous); a row without Cp° holds at 298.15 K only.
inline constexpr double aqueous_tmin_K = 273.15;
inline constexpr double aqueous_tmax_K = 373.15;

/// A row of data/aqueous.csv with its formula parsed.
struct AqueousSpecies {
    AqueousRow row;
    std::string label;          ///< formula with its charge as the engine writes it: "SO4^2-"
    grammar::Species parsed;
    Composition composition;
    double molar_mass = 0;      ///< g/mol
};

/// A species in a reaction, resolved to its data: one phase, one or more records (several
/// only for solid polymorphs, picked by temperature), or a user-table row.
struct Substance {
    std::string label;            ///< formula (with its charge: "H+", "SO4^2-") or name as written
    std::string display;          ///< label + the phase at 298.15 K (or the written phase): "CH4(g)"
    char phase = 'g';             ///< 'g', 'l', 's' or 'a' (aqueous); the written phase, or the
                                  ///< phase at 298.15 K when none was written (see phase_at())
    bool phase_assumed = false;   ///< no phase written: the phase stable at each T is used
    Composition composition;
    double molar_mass = 0;        ///< g/mol from standard atomic weights
    std::vector<const Record*> records;  ///< of `phase`, sorted by temperature
    /// phase_assumed: every record of the substance, any phase; the one of lowest G° at T is used.
    std::vector<const Record*> candidates;
    /// A written liquid: the substance's gas records, to say when the liquid is taken above its
    /// 1-bar boiling point (a pressurised liquid).
    std::vector<const Record*> vapour;
    std::shared_ptr<const UserSpecies> user;  ///< set instead of records for a user-table row
    const AqueousSpecies* aqueous = nullptr;  ///< set instead of records for a data/aqueous.csv row
    std::string identity() const; ///< equal for the same data (used to net and match species)

    /// The record used at T: the stable one (lowest G°) when no phase was written, else the
    /// record of the written phase whose range holds T. Throws Error(out_of_range) otherwise.
    const Record& record_at(double T) const;
    char phase_at(double T) const;           ///< the phase used at T
    std::string display_at(double T) const;  ///< label + the phase used at T

    /// Thermodynamic functions at T (throw Error(out_of_range) outside the data, never extrapolate).
    double H(double T) const;     ///< assigned enthalpy, J/mol (= ΔfH° at 298.15 K)
    double S(double T) const;     ///< J/(mol·K)
    double Cp(double T) const;    ///< J/(mol·K)
    std::string range_text() const;
    std::string source(double T = 298.15) const;  ///< one citation line, for the phase used at T
};

/// Whether a record's data cover T (its range, 1e-6 K of slack; a single-temperature record
/// within 0.005 K of its temperature).
bool covers(const Record& r, double T);
/// The record's polynomial interval used at T: the first whose upper end (1e-6 K of slack) is
/// at or above T. The record must have intervals.
const Interval& interval_at(const Record& r, double T);

/// Charge as written in labels: "+", "-", "^2+", "^3-"; empty for 0.
std::string charge_suffix(int charge);

class Database {
public:
    /// The embedded data, parsed and indexed on first use (thread-safe).
    static const Database& get();
    explicit Database(std::string_view thermo, std::string_view elements, std::string_view aliases,
                      std::string_view aqueous);

    const Element* element(std::string_view symbol) const;
    const Alias* alias(std::string_view name) const;
    const Record* record(std::string_view name) const;

    /// Composition of a parsed species (element symbols checked; names via the user table's
    /// `name` column, then the alias table).
    Composition composition(const grammar::Species& sp, const SpeciesTable* table = nullptr) const;
    double molar_mass(const Composition& c) const;

    /// Resolves a parsed species per engine/DATA.md, Identity and Phases (user table rows first).
    Substance resolve(const grammar::Species& sp, const SpeciesTable* table) const;

    /// Records of the reference form of an element (NASA "Ref-Elm"), sorted by temperature.
    const std::vector<const Record*>& reference_forms(const std::string& symbol) const;

    /// The data/aqueous.csv row for an (aq) species: by formula and charge as written, or by
    /// its `name` column; nullptr if the table has none. A row of the same composition under
    /// another formula is an error naming that row (never taken silently).
    const AqueousSpecies* aqueous(const grammar::Species& sp) const;
    const std::vector<AqueousSpecies>& aqueous_rows() const { return aqueous_; }

    const std::vector<Record>& records() const { return records_; }
    std::string identity() const { return identity_; }  ///< data-set identity text

private:
    std::vector<Record> records_;
    std::vector<Element> elements_;
    std::vector<Alias> aliases_;
    std::unordered_map<std::string, const Element*> by_symbol_;
    std::unordered_map<std::string, const Alias*> by_alias_;
    std::unordered_map<std::string, const Record*> by_name_;
    std::unordered_map<std::string, std::vector<const Record*>> by_composition_;
    std::unordered_map<std::string, std::vector<const Record*>> reference_forms_;
    std::unordered_map<const Record*, std::string> alias_of_;  ///< a common name for a record
    std::vector<AqueousSpecies> aqueous_;
    std::unordered_map<std::string, const AqueousSpecies*> aqueous_by_label_;
    std::unordered_map<std::string, const AqueousSpecies*> aqueous_by_name_;
    std::unordered_map<std::string, std::vector<const AqueousSpecies*>> aqueous_by_composition_;
    std::string identity_;

    /// `comp`: the species' composition when written as a formula (a name takes its record's).
    Substance resolve_records(const grammar::Species& sp, std::vector<const Record*> found,
                              const std::string& shown, const Composition* comp) const;
    std::string describe(const Record* r) const;
};

/// Lower-case ASCII copy.
std::string lower(std::string_view s);
/// Rational to text: "2", "1/2", "-3/4".
std::string rational_text(const Rational& r);
double to_double(const Rational& r);

}  // namespace rxnheat::detail
