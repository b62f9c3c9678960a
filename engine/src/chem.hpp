// Exact linear algebra for balancing: the rational null space of the element-and-charge matrix.
#pragma once

#include "grammar/parse.hpp"

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

/// Scales a rational vector to the smallest whole numbers with the same ratios (sign kept).
std::vector<Rational> smallest_integers(const std::vector<Rational>& v);

}  // namespace rxnheat::detail
