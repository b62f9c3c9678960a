// Exact linear algebra for balancing: the rational null space of the element-and-charge matrix.
#pragma once

#include "grammar/parse.hpp"

#include <vector>

namespace rxnheat::detail {

using grammar::Rational;

/// Basis of the null space of `m` (rows × cols, row-major), by exact Gauss-Jordan elimination.
std::vector<std::vector<Rational>> null_space(std::vector<std::vector<Rational>> m, std::size_t cols);

/// Scales a rational vector to the smallest whole numbers with the same ratios (sign kept).
std::vector<Rational> smallest_integers(const std::vector<Rational>& v);

}  // namespace rxnheat::detail
