// User species tables (engine/DATA.md, User tables): rows that override the built-in data. Private.
#pragma once

#include "grammar/parse.hpp"
#include "rxnheat/rxnheat.hpp"

#include <array>
#include <cstdint>
#include <memory>
#include <optional>
#include <string>
#include <vector>

namespace rxnheat::detail {

struct UserSpecies {
    std::string formula;   ///< ASCII formula as the grammar normalises it, e.g. "H2O"
    std::string name;      ///< optional common name (matched case-insensitively)
    char phase = 'g';      ///< 'g', 'l', 's', 'a'
    double dHf = 0;        ///< J/mol at 298.15 K
    std::optional<double> S298;  ///< J/(mol·K)
    enum class CpForm { none, constant, shomate } cp_form = CpForm::none;
    double cp = 0;                  ///< constant Cp, J/(mol·K)
    double A = 0, B = 0, C = 0, D = 0, E = 0;  ///< Shomate, t = T/1000
    double tmin = T_ref, tmax = T_ref;
    std::string source;
    std::size_t row = 0;   ///< 1-based row in the table (header = 1)
    grammar::Species parsed;  ///< the formula cell as parsed (composition comes from it)

    double H(double T, const std::string& shown) const;   ///< J/mol
    double S(double T, const std::string& shown) const;   ///< J/(mol·K)
    double Cp(double T, const std::string& shown) const;  ///< J/(mol·K)
    std::string range_text() const;
};

/// The terms of the Shomate forms (NIST, t = T/1000) that UserSpecies sums: ∫Cp dT in kJ/mol,
/// ∫Cp/T dT and Cp in J/(mol·K). Also bounded when a table is read (every value finite).
std::array<double, 5> shomate_h_terms(const UserSpecies& u, double t);
std::array<double, 5> shomate_s_terms(const UserSpecies& u, double t);
std::array<double, 5> shomate_cp_terms(const UserSpecies& u, double t);

/// The row for a parsed species, or nullptr: formula (or name) and phase must match; a species
/// written without a phase matches when the table has exactly one row for it.
std::shared_ptr<const UserSpecies> find_user_species(const SpeciesTable::Impl& table, const grammar::Species& sp);

/// Text that identifies a table's content (part of cache keys).
const std::string& table_identity(const SpeciesTable::Impl& table);

}  // namespace rxnheat::detail

struct rxnheat::SpeciesTable::Impl {
    std::vector<std::shared_ptr<const detail::UserSpecies>> rows;
    std::string identity;          ///< every cell, header included, length-prefixed
    std::uint64_t fingerprint = 0; ///< hash of `identity`, taken once
};
