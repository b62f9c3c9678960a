// A reaction parsed, checked and resolved once, then evaluated at any temperature. Private.
#pragma once

#include "database.hpp"
#include "rxnheat/rxnheat.hpp"

#include <boost/container/small_vector.hpp>

#include <array>
#include <atomic>
#include <cstdint>
#include <memory>
#include <mutex>
#include <unordered_map>
#include <optional>
#include <shared_mutex>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat::detail {

/// A reaction prepared for evaluation. Stages that failed keep their error, so a cached bad
/// reaction fails the same way every time without being parsed again.
struct Prepared {
    /// Per-term lists hold up to four terms inline: a typical reaction's prepare allocates none
    /// of them (each heap block is paid twice, when made and when the cache evicts it).
    template <class T> using PerTerm = boost::container::small_vector<T, 4>;

    /// What is kept of a term's species once the reaction is prepared: its texts, as ranges of
    /// `texts`. The grammar's tree (some 500 bytes a term, four strings and the atoms) is dropped
    /// at the end of prepare(), so a cached reaction is this one block. The cache evicts entries
    /// last touched thousands of calls before, and destroying the tree read it back from memory:
    /// a cold dh of CH4 took 2.27 µs with the tree kept and 1.83 µs with it dropped (medians of
    /// 5, four alternated rounds, tests/bench/RESULTS-engine.md).
    struct KeptTerm {
        std::uint32_t written_at = 0, written_size = 0;  ///< the species exactly as written
        std::uint32_t body_at = 0, body_size = 0;        ///< its formula, or its name (is_name)
        std::uint32_t key_at = 0, key_size = 0;          ///< Composition::key() (none after composition_error)
        std::int32_t charge = 0;
        std::uint8_t phase = 0;  ///< an index into kept_phases: "", "g", "l", "s", "aq"
        bool is_name = false;
    };
    /// A term's species as kept: views into the prepared reaction (grammar::Species's text fields).
    struct SpeciesText {
        std::string_view written;  ///< exactly as written, phase included
        std::string_view body;     ///< the formula without phase or charge, or the name
        std::string_view phase;    ///< "", "g", "l", "s" or "aq"
        int charge = 0;
        bool is_name = false;
    };
    /// A side: terms [first, first + count).
    struct Side {
        std::size_t first = 0, count = 0;
    };

    PerTerm<KeptTerm> terms;                  ///< reactants then products
    std::size_t n_reactants = 0;
    std::string arrow;                        ///< as written
    /// The reaction's text as given (the cache's key views it), then the terms' texts; inline for
    /// a typical reaction, so a cached one is a single block.
    boost::container::small_vector<char, 160> texts;
    std::size_t text_size = 0;                ///< of the reaction's text, at the start of `texts`
    PerTerm<Rational> nu;                     ///< signed: reactants < 0, products > 0
    PerTerm<double> nu_double;                ///< nu as doubles, converted once (hot path)
    /// Per term (empty if composition_error); shared with the species memo, not copied.
    PerTerm<std::shared_ptr<const Composition>> compositions;
    std::optional<Error> composition_error;   ///< a bad element symbol or unknown name
    std::optional<Error> balance_error;       ///< unbalanced elements or charge
    PerTerm<std::shared_ptr<const Substance>> substances;  ///< per term (empty if resolve_error); shared with the species memo
    std::optional<Error> resolve_error;       ///< no data, ambiguous, missing phase
    /// Σ over terms of composition_bytes() and substance_bytes(), set by prepare() (estimated_bytes).
    std::size_t species_data_bytes = 0;

    /// Each species' NASA polynomial interval per temperature segment, found once when every
    /// species is a NASA record of a written phase, so an evaluation searches no records and
    /// takes one logarithm for all species (the same arithmetic as Substance::H and S, so the
    /// same bits). A segment is an open stretch between the records' range and interval ends
    /// (2e-6 K inside them, beyond the selection's 1e-6 K slack) or one such end exactly; any
    /// other T (and 298.15 K, where tabulated ΔfH° are used) takes the per-species path, which
    /// also gives every error.
    struct Segment {
        double lo_K, hi_K;
        std::size_t first;  ///< intervals [first, first + terms.size()) of segment_intervals
    };
    /// Built at the second evaluation at a temperature other than 298.15 K, not in prepare: a
    /// reaction evaluated once (a sheet of distinct texts) takes the per-species path, which gives
    /// the same bits, and the build was a sixth of a cold dh. Thread-safe (segment_at).
    mutable boost::container::small_vector<Segment, 8> segments;  ///< inline: a gas reaction's usual five or so
    mutable boost::container::small_vector<const Interval*, 32> segment_intervals;
    bool segments_possible = false;  ///< every species a NASA record of a written phase (set by prepare)
    std::size_t segments_bytes_bound = 0;  ///< heap bytes the segments may take once built (for the cache's bound)
    /// The segment holding T; nullptr for 298.15 K, the first evaluation, or a T outside all.
    const Segment* segment_at(double T) const;
    /// ΔrH° at exactly 298.15 K (the default temperature), computed once by the per-species path.
    bool has_dH_ref = false;
    double dH_ref_J = 0;

    /// balanced_text(*this), computed on first use and kept (the null space is the costly part
    /// of RXNBALANCE; a sheet asks for the same reaction's balance again and again). Thread-safe.
    const std::string& balanced() const;

    /// Throws the first error of the stages a function needs.
    void require_compositions() const;
    void require_thermo() const;              ///< compositions, balance and data
    std::string_view text() const { return {texts.data(), text_size}; }
    std::string_view written(std::size_t i) const {
        return {texts.data() + terms[i].written_at, terms[i].written_size};
    }
    /// Composition::key() of term i, for matching `per`/`key` (after prepare, unless composition_error).
    std::string_view composition_key(std::size_t i) const {
        return {texts.data() + terms[i].key_at, terms[i].key_size};
    }
    SpeciesText species(std::size_t i) const;
    Side reactants() const { return {0, n_reactants}; }
    Side products() const { return {n_reactants, terms.size() - n_reactants}; }
    /// The coefficient of term i as written (nu without its sign).
    Rational coefficient(std::size_t i) const { return i < n_reactants ? -nu[i] : nu[i]; }
    /// Every term's, reactants then products.
    PerTerm<Rational> coefficients() const {
        PerTerm<Rational> c;
        for (std::size_t i = 0; i < terms.size(); ++i) c.push_back(coefficient(i));
        return c;
    }

    /// The error require_thermo() throws, or null: for answers that are the error in words
    /// (RXNCHECK), without the cost of a throw (some 16,000 instructions a call).
    const Error* thermo_error() const noexcept;

    double dH(double T) const;                ///< J/mol of extent
    double dS(double T) const;                ///< J/(mol·K)
    double dn_gas(double T) const;            ///< products minus reactants, species that are gas at T
    std::string canonical(double T) const;    ///< with the phases used at T, "->"
    /// Net signed coefficient of the species `key` in the reaction (matched by composition,
    /// and by phase when `key` has one). Throws when absent, netted to zero or ambiguous.
    /// `table`: the one this reaction was prepared with.
    Rational key_coefficient(const grammar::Species& key, const SpeciesTable* table, double T,
                             std::size_t* term_index) const;

private:
    mutable std::once_flag segments_once_;
    mutable std::atomic<int> segment_state_{0};  ///< 0 not evaluated, 1 evaluated once, 2 built
    mutable std::once_flag balanced_once_;
    mutable std::string balanced_text_;
    mutable std::optional<Error> balanced_error_;
};

/// Throws Error(argument) for a sum Σ νᵢ·value(T) over the reaction's species that is not finite,
/// naming the quantity and its largest term.
[[noreturn]] void not_finite_sum(const Prepared& p, const char* quantity, const char* unit, double T,
                                 double (Substance::*value)(double) const);

/// Prepared reactions by (table fingerprint, exact text). Owned by an Engine (Engine::Impl);
/// thread-safe and read-mostly: a hit takes a shared lock on one shard and changes nothing but
/// atomics, so threads that evaluate cached reactions never wait for each other; a miss's insert
/// takes that shard's exclusive lock. Eviction is CLOCK (second chance: an entry used since the
/// hand last passed stays), bounded by entries and by estimated bytes.
///
/// User tables: an entry remembers its table by fingerprint and by a weak reference, so the cache
/// never keeps a table alive; a hit needs the table's content to be the same (the same object, or
/// equal identity text, engine/src/usertable.hpp), so two tables never share a result. Rows of a
/// table that an entry's species use are held by the entry and counted once per shard in its bytes.
class PreparedCache {
public:
    PreparedCache(std::size_t capacity_entries, std::size_t capacity_bytes);
    ~PreparedCache();
    PreparedCache(const PreparedCache&) = delete;
    PreparedCache& operator=(const PreparedCache&) = delete;
    /// The hash `text` is filed under with `table` (its fingerprint): computed once for a find
    /// and, on a miss, the put that follows.
    static std::uint64_t hash_of(std::string_view text, const SpeciesTable* table);
    std::shared_ptr<const Prepared> find(std::string_view text, const SpeciesTable* table, std::uint64_t hash);
    /// `value` is prepared from `text` (the entry's key views value->text()).
    void put(std::string_view text, const SpeciesTable* table, std::uint64_t hash, std::shared_ptr<const Prepared> value);
    CacheStats stats() const;
    void clear();

    /// Species resolved without a user table, by their exact written text ("CH4(g)"): a sheet's
    /// reactions share few species, so a new reaction text mostly finds its species here and
    /// skips their composition and data look-ups. Only successes are kept (errors name positions
    /// in the reaction); at most species_memo_entries species of at most 64 bytes of text each,
    /// emptied when full. Thread-safe (read-mostly, as the cache).
    struct SpeciesMemo {
        std::shared_ptr<const Composition> composition;
        std::string composition_key;
        std::shared_ptr<const Substance> substance;  ///< null: not resolved (an unbalanced reaction's species) or resolving failed
        std::string written;  ///< the key (set by put_species; the memo's map keys view it)
        /// composition_bytes() and substance_bytes() of the above (set by put_species), so a
        /// reaction using this memo counts its species without walking them again.
        std::size_t composition_bytes = 0, substance_bytes = 0;
    };
    static constexpr std::size_t species_memo_entries = 1024;
    /// For each of the n texts, its memo or null (not seen), under one shared lock: a reaction's
    /// species are looked up together.
    void find_species(const std::string_view* written, std::size_t n,
                      std::shared_ptr<const SpeciesMemo>* found) const;
    void put_species(std::string_view written, std::shared_ptr<const Composition> composition,
                     std::string_view composition_key, std::shared_ptr<const Substance> substance);

private:
    struct Shard;
    std::size_t capacity_, capacity_bytes_;
    std::vector<std::unique_ptr<Shard>> shards_;
    Shard& shard_of(std::uint64_t hash) const;
    mutable std::shared_mutex species_mutex_;
    /// Keyed by a view of the memo's own `written`, so a look-up builds no string.
    std::unordered_map<std::string_view, std::shared_ptr<const SpeciesMemo>> species_;
};

/// Bytes of a term's composition with its key, and of its substance, as estimated_bytes counts
/// them (the objects may be shared with the species memo: counted for each user, an upper bound).
std::size_t composition_bytes(const Composition& c, const std::string& key = {});
std::size_t substance_bytes(const Substance& s);

/// Estimated bytes of a prepared reaction: its own parts (sizes and string capacities), not the
/// user-table rows it refers to. Public for the tests of the cache's bound.
std::size_t estimated_bytes(const Prepared& p);

/// Parses and prepares (parse errors throw); through `cache` when one is given.
std::shared_ptr<const Prepared> prepare(std::string_view text, const SpeciesTable* table,
                                        PreparedCache* cache);

/// The reaction with the smallest whole-number coefficients that balance elements and charge
/// (exact rational null space), species as written. Throws Error(unbalanced) when there is no
/// balance, more than one independent one, or a species would need a zero or negative coefficient.
std::string balanced_text(const Prepared& p);

/// Text of a prepared reaction with new coefficients, species as written, the arrow as written:
/// `left arrow right`, a coefficient per term of each side (RXNREVERSE writes the sides swapped;
/// RXNBALANCE both sides' coefficients from one vector).
std::string reaction_text(const Prepared& p, Prepared::Side left, const Rational* left_coefs,
                          Prepared::Side right, const Rational* right_coefs);

/// Throws Error(too_long / syntax) for input the grammar must not see.
void check_input_text(std::string_view text, const char* what);

}  // namespace rxnheat::detail
