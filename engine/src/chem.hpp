// Exact linear algebra for balancing: the rational null space of the element-and-charge matrix.
#pragma once

#include "grammar/parse.hpp"

#include <cstdint>
#include <optional>
#include <vector>

namespace rxnheat::detail {

using grammar::Rational;

/// Reduces `m` in place to reduced row echelon form by exact Gauss–Jordan elimination, choosing
/// pivots among its first `pivot_cols` columns only (row operations act on whole rows, so the
/// columns after them ride along: an augmented right-hand side). Returns the pivot columns, in
/// order; row i of the result has its pivot, 1, in column pivots[i].
std::vector<std::size_t> reduce_rows(std::vector<std::vector<Rational>>& m, std::size_t pivot_cols);

/// Basis of the null space of `m` (rows × cols, row-major), by exact Gauss-Jordan elimination.
std::vector<std::vector<Rational>> null_space(std::vector<std::vector<Rational>> m, std::size_t cols);

/// What the element-and-charge matrix says about balancing: the null space's dimension decides.
struct BalanceSolution {
    enum class Kind {
        unique,     ///< exactly one balance up to scale: `coefficients`
        none,       ///< the null space is {0}
        several,    ///< `ways` independent balances (at least that many when !ways_exact)
        too_large,  ///< deciding exactly would need numbers of more than `max_balance_bits` bits
    } kind = Kind::none;
    std::vector<Rational> coefficients;  ///< unique: whole numbers without a common factor
    std::size_t ways = 0;
    bool ways_exact = true;
};

/// Size cap of the exact fallback elimination (see solve_balance): about 190 decimal digits.
inline constexpr std::size_t max_balance_bits = 640;

/// One column of the element-and-charge matrix: (row, value) of its nonzero entries.
using SparseColumn = std::vector<std::pair<std::size_t, Rational>>;

/// Decides the balance of the matrix of `rows` rows and the columns `m` exactly, in time bounded by the matrix's
/// size: the rank modulo word-sized primes gives a lower bound on the rational rank, and null
/// vectors rebuilt from those residues (Chinese remainders, rational reconstruction) and checked
/// exactly on the matrix give the upper bound. Only when that fails (numbers beyond 2^61, or a prime
/// dividing a minor) does it eliminate exactly, fraction-free, stopping as soon as a second free
/// column shows that no single balance exists, and giving up (too_large) past max_balance_bits.
BalanceSolution solve_balance(std::size_t rows, const std::vector<SparseColumn>& m);

/// The element-and-charge matrix of a reaction of few terms, in whole numbers and inline (no
/// heap): column j is term j, multiplied by scale[j] to clear the denominators of its counts.
struct SmallBalanceMatrix {
    static constexpr std::size_t max_rows = 12, max_cols = 12;
    /// Entries are kept below this in magnitude: then every check of a balance fits 128 bits.
    static constexpr std::int64_t max_entry = std::int64_t(1) << 31;
    std::size_t rows = 0, cols = 0;
    std::int64_t a[max_rows][max_cols] = {};
    std::int64_t scale[max_cols] = {};
};

/// Decides the balance of `m` as solve_balance decides that of the same matrix (the same kind,
/// number of ways and coefficients; a unique balance with its free column positive), by
/// fraction-free elimination in 128-bit integers on the stack. A reaction of a few terms is the
/// common case, and this needs no allocation but the answer's. std::nullopt when an intermediate
/// value would pass 2^62: then solve_balance decides.
std::optional<BalanceSolution> solve_balance_small(const SmallBalanceMatrix& m);

/// Scales a rational vector to the smallest whole numbers with the same ratios (sign kept).
std::vector<Rational> smallest_integers(const std::vector<Rational>& v);

}  // namespace rxnheat::detail
