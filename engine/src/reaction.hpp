// A reaction parsed, checked and resolved once, then evaluated at any temperature. Private.
#pragma once

#include "database.hpp"
#include "rxnheat/rxnheat.hpp"

#include <list>
#include <memory>
#include <mutex>
#include <unordered_map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat::detail {

/// A reaction prepared for evaluation. Stages that failed keep their error, so a cached bad
/// reaction fails the same way every time without being parsed again.
struct Prepared {
    grammar::Reaction ast;
    std::vector<const grammar::Term*> terms;  ///< reactants then products
    std::vector<Rational> nu;                 ///< signed: reactants < 0, products > 0
    std::vector<Composition> compositions;    ///< per term (empty if composition_error)
    std::vector<std::string> composition_keys;  ///< Composition::key() per term, for matching `per`/`key`
    std::optional<Error> composition_error;   ///< a bad element symbol or unknown name
    std::optional<Error> balance_error;       ///< unbalanced elements or charge
    std::vector<Substance> substances;        ///< per term (empty if resolve_error)
    std::optional<Error> resolve_error;       ///< no data, ambiguous, missing phase

    /// Throws the first error of the stages a function needs.
    void require_compositions() const;
    void require_thermo() const;              ///< compositions, balance and data

    double dH(double T) const;                ///< J/mol of extent
    double dS(double T) const;                ///< J/(mol·K)
    double dn_gas(double T) const;            ///< products minus reactants, species that are gas at T
    std::string canonical(double T) const;    ///< with the phases used at T, "->"
    /// Net signed coefficient of the species `key` in the reaction (matched by composition,
    /// and by phase when `key` has one). Throws when absent, netted to zero or ambiguous.
    Rational key_coefficient(const grammar::Species& key, const SpeciesTable* table, double T,
                             std::size_t* term_index) const;
};

/// Throws Error(argument) for a sum Σ νᵢ·value(T) over the reaction's species that is not finite,
/// naming the quantity and its largest term.
[[noreturn]] void not_finite_sum(const Prepared& p, const char* quantity, const char* unit, double T,
                                 double (Substance::*value)(double) const);

/// Prepared reactions by (table fingerprint, exact text), least recently used first out. Owned
/// by an Engine (Engine::Impl); thread-safe. A fingerprint match is confirmed on the table's
/// content before a hit is used, so two tables can never share a result.
class PreparedCache {
public:
    explicit PreparedCache(std::size_t capacity) : capacity_(capacity) {}
    std::shared_ptr<const Prepared> find(std::string_view text, const SpeciesTable* table);
    void put(std::string_view text, const SpeciesTable* table, std::shared_ptr<const Prepared> value);
    CacheStats stats() const;
    void clear();

private:
    struct Entry {
        std::string key;                                  ///< fingerprint (16 hex) + text
        std::shared_ptr<const SpeciesTable::Impl> table;  ///< to confirm a fingerprint match
        std::shared_ptr<const Prepared> value;
    };
    static std::string key_of(std::string_view text, const SpeciesTable* table);
    std::size_t capacity_;
    mutable std::mutex mutex_;
    std::list<Entry> lru_;
    std::unordered_map<std::string, std::list<Entry>::iterator> map_;
    std::size_t hits_ = 0, misses_ = 0;
};

/// Parses and prepares (parse errors throw); through `cache` when one is given.
std::shared_ptr<const Prepared> prepare(std::string_view text, const SpeciesTable* table,
                                        PreparedCache* cache);

/// The reaction with the smallest whole-number coefficients that balance elements and charge
/// (exact rational null space), species as written. Throws Error(unbalanced) when there is no
/// balance, more than one independent one, or a species would need a zero or negative coefficient.
std::string balanced_text(const Prepared& p);

/// Text of the reaction with new coefficients, species as written, the arrow as written.
std::string reaction_text(const grammar::Reaction& r, const std::vector<Rational>& reactant_coefs,
                          const std::vector<Rational>& product_coefs);

/// Throws Error(too_long / syntax) for input the grammar must not see.
void check_input_text(std::string_view text, const char* what);

}  // namespace rxnheat::detail
