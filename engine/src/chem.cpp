#include "chem.hpp"

#include "rxnheat/rxnheat.hpp"

#include <boost/multiprecision/cpp_int.hpp>

#include <cmath>
#include <cstdint>
#include <numeric>

namespace rxnheat::detail {

std::vector<std::size_t> reduce_rows(std::vector<std::vector<Rational>>& m, std::size_t pivot_cols) {
    const std::size_t rows = m.size();
    std::vector<std::size_t> pivot_col;
    std::size_t r = 0;
    for (std::size_t c = 0; c < pivot_cols && r < rows; ++c) {
        std::size_t p = r;
        while (p < rows && m[p][c] == 0) ++p;
        if (p == rows) continue;
        std::swap(m[p], m[r]);
        const Rational inv = 1 / m[r][c];
        for (auto& x : m[r]) x *= inv;
        for (std::size_t i = 0; i < rows; ++i) {
            if (i == r || m[i][c] == 0) continue;
            const Rational f = m[i][c];
            for (std::size_t j = c; j < m[i].size(); ++j) m[i][j] -= f * m[r][j];  // left of c: zeros already
        }
        pivot_col.push_back(c);
        ++r;
    }
    return pivot_col;
}

std::vector<std::vector<Rational>> null_space(std::vector<std::vector<Rational>> m, std::size_t cols) {
    const std::vector<std::size_t> pivot_col = reduce_rows(m, cols);
    std::vector<bool> is_pivot(cols, false);
    for (auto c : pivot_col) is_pivot[c] = true;
    std::vector<std::vector<Rational>> basis;
    for (std::size_t free = 0; free < cols; ++free) {
        if (is_pivot[free]) continue;
        std::vector<Rational> v(cols, Rational(0));
        v[free] = 1;
        for (std::size_t i = 0; i < pivot_col.size(); ++i) v[pivot_col[i]] = -m[i][free];
        basis.push_back(std::move(v));
    }
    return basis;
}

namespace {

using boost::multiprecision::cpp_int;
using Matrix = std::vector<std::vector<cpp_int>>;

/// The balance matrix in whole numbers, by columns: (row, value) of the nonzero entries.
struct IntColumns {
    std::size_t rows = 0;
    std::vector<std::vector<std::pair<std::size_t, cpp_int>>> cols;
};

// Four primes below 2^31: products of two residues fit 64 bits, and together they give a modulus
// above 2^123, enough to rebuild any fraction whose numerator and denominator are below 2^61.
constexpr std::uint64_t primes[] = {2147483647u, 2147483629u, 2147483587u, 2147483579u};

struct ModEchelon {
    std::vector<std::size_t> pivots;  // pivot column of row i, in order
    std::vector<std::uint64_t> a;     // rows × cols, reduced row echelon form modulo the prime
};

std::uint64_t power_mod(std::uint64_t b, std::uint64_t e, std::uint64_t p) {
    std::uint64_t r = 1;
    for (b %= p; e; e >>= 1) {
        if (e & 1) r = r * b % p;
        b = b * b % p;
    }
    return r;
}

/// 1/b modulo the prime P (Fermat), with P a constant so each % becomes multiplications.
template <std::uint64_t P>
std::uint64_t inverse_mod(std::uint64_t b) {
    std::uint64_t r = 1;
    for (std::uint64_t e = P - 2; e; e >>= 1) {
        if (e & 1) r = r * b % P;
        b = b * b % P;
    }
    return r;
}

// Gauss–Jordan elimination modulo P; a constant modulus lets the compiler turn each % into
// multiplications.
template <std::uint64_t P>
ModEchelon echelon_mod(const IntColumns& m) {
    const std::size_t rows = m.rows, cols = m.cols.size();
    ModEchelon e;
    e.a.assign(rows * cols, 0);
    auto at = [&](std::size_t i, std::size_t j) -> std::uint64_t& { return e.a[i * cols + j]; };
    for (std::size_t j = 0; j < cols; ++j)
        for (const auto& [i, x] : m.cols[j]) {
            static const cpp_int small = INT64_MAX;
            if (x <= small && x >= -small) {  // nearly every count: no big division
                std::int64_t r = x.template convert_to<std::int64_t>() % static_cast<std::int64_t>(P);
                if (r < 0) r += static_cast<std::int64_t>(P);
                at(i, j) = static_cast<std::uint64_t>(r);
                continue;
            }
            cpp_int r = x % P;  // the sign of x
            if (r < 0) r += P;
            at(i, j) = r.convert_to<std::uint64_t>();
        }
    std::size_t r = 0;
    for (std::size_t c = 0; c < cols && r < rows; ++c) {
        std::size_t p = r;
        while (p < rows && at(p, c) == 0) ++p;
        if (p == rows) continue;
        if (p != r)
            for (std::size_t j = c; j < cols; ++j) std::swap(at(p, j), at(r, j));
        const std::uint64_t inv = inverse_mod<P>(at(r, c));
        for (std::size_t j = c; j < cols; ++j) at(r, j) = at(r, j) * inv % P;
        for (std::size_t i = 0; i < rows; ++i) {
            if (i == r || at(i, c) == 0) continue;
            const std::uint64_t f = P - at(i, c);
            for (std::size_t j = c; j < cols; ++j)
                if (at(r, j)) at(i, j) = (at(i, j) + f * at(r, j)) % P;
        }
        e.pivots.push_back(c);
        ++r;
    }
    return e;
}

ModEchelon echelon_mod(std::size_t k, const IntColumns& m) {
    switch (k) {
    case 0: return echelon_mod<primes[0]>(m);
    case 1: return echelon_mod<primes[1]>(m);
    case 2: return echelon_mod<primes[2]>(m);
    default: return echelon_mod<primes[3]>(m);
    }
}

using i128 = __int128;

// The fraction n/d (|n|, d ≤ bound) congruent to u modulo mod, if there is one (Wang's rational
// reconstruction by the extended Euclidean algorithm); mod > 2·bound².
bool rebuild_fraction(i128 u, i128 mod, i128 bound, i128& n, i128& d) {
    i128 r0 = mod, r1 = u, t0 = 0, t1 = 1;
    while (r1 > bound) {
        const i128 q = r0 / r1;
        i128 t = r0 - q * r1;
        r0 = r1;
        r1 = t;
        t = t0 - q * t1;
        t0 = t1;
        t1 = t;
    }
    if (t1 < 0) {
        t1 = -t1;
        r1 = -r1;
    }
    if (t1 == 0 || t1 > bound) return false;
    i128 a = r1 < 0 ? -r1 : r1, b = t1;
    while (b) {
        const i128 t = a % b;
        a = b;
        b = t;
    }
    if (a != 1) return false;
    n = r1;
    d = t1;
    return true;
}

/// gcd of two positive numbers.
i128 gcd_i128(i128 a, i128 b) {
    while (b != 0) {
        const i128 t = a % b;
        a = b;
        b = t;
    }
    return a;
}

cpp_int to_big(i128 x) {
    if (x >= INT64_MIN && x <= INT64_MAX) return cpp_int(static_cast<std::int64_t>(x));  // one limb
    const bool neg = x < 0;
    const unsigned __int128 u = neg ? static_cast<unsigned __int128>(-(x + 1)) + 1 : static_cast<unsigned __int128>(x);
    cpp_int r = static_cast<std::uint64_t>(u >> 64);
    r <<= 64;
    r += static_cast<std::uint64_t>(u);
    return neg ? cpp_int(-r) : r;
}

bool is_null_vector(const IntColumns& m, const std::vector<cpp_int>& v) {
    std::vector<cpp_int> sum(m.rows);
    for (std::size_t j = 0; j < m.cols.size(); ++j)
        if (!v[j].is_zero())
            for (const auto& [i, x] : m.cols[j]) sum[i] += x * v[j];
    for (const auto& s : sum)
        if (!s.is_zero()) return false;
    return true;
}

// The null vectors of the free columns of es[0], rebuilt from the echelons of the primes in es
// and checked exactly on m; empty when any step fails (then more primes, or exact elimination).
std::vector<std::vector<cpp_int>> rebuilt_null_space(const IntColumns& m, const std::vector<ModEchelon>& es) {
    const std::size_t cols = m.cols.size();
    const ModEchelon& first = es.front();
    for (const auto& e : es)
        if (e.pivots != first.pivots) return {};  // a prime divides a minor: no shortcut
    i128 mod = 1;
    for (std::size_t k = 0; k < es.size(); ++k) mod *= static_cast<i128>(primes[k]);
    i128 bound = static_cast<i128>(std::sqrt(static_cast<double>(mod) / 2));
    while (bound > 0 && 2 * bound * bound >= mod) --bound;
    std::vector<bool> is_pivot(cols, false);
    for (auto c : first.pivots) is_pivot[c] = true;
    std::vector<std::vector<cpp_int>> out;
    for (std::size_t f = 0; f < cols; ++f) {
        if (is_pivot[f]) continue;
        // Residues of the vector with 1 at f, 0 at the other free columns, -a[i][f] at pivot i.
        std::vector<i128> num(cols, 0), den(cols, 1);
        num[f] = 1;
        for (std::size_t i = 0; i < first.pivots.size(); ++i) {
            i128 x = 0, m_so_far = 1;  // Garner: x ≡ each residue modulo each prime so far
            for (std::size_t k = 0; k < es.size(); ++k) {
                const std::uint64_t p = primes[k];
                const std::uint64_t a = es[k].a[i * cols + f];
                const std::uint64_t want = a ? p - a : 0;
                const std::uint64_t have = static_cast<std::uint64_t>(x % static_cast<i128>(p));
                const std::uint64_t m_mod = static_cast<std::uint64_t>(m_so_far % static_cast<i128>(p));
                const std::uint64_t inv = m_mod == 1 ? 1 : power_mod(m_mod, p - 2, p);  // 1 for the first prime
                const std::uint64_t t = (want + p - have) % p * inv % p;
                x += m_so_far * static_cast<i128>(t);
                m_so_far *= static_cast<i128>(p);
            }
            if (!rebuild_fraction(x, mod, bound, num[first.pivots[i]], den[first.pivots[i]])) return {};
        }
        // Whole numbers: times the least common multiple of the denominators, in 128 bits while
        // it stays below 2^63 (then |num| < 2^62 times l/den ≤ 2^63 fits too), else big.
        std::vector<cpp_int> v(cols);
        i128 l = 1;
        for (std::size_t j = 0; j < cols && l != 0; ++j)
            if (den[j] != 1) {
                const i128 q = den[j] / gcd_i128(l, den[j]);
                l = l > INT64_MAX / q ? 0 : l * q;  // 0: too large for the shortcut
            }
        if (l != 0) {
            for (std::size_t j = 0; j < cols; ++j)
                if (num[j] != 0) v[j] = to_big(num[j] * (l / den[j]));
        } else {
            cpp_int big_l = 1;
            for (std::size_t j = 0; j < cols; ++j)
                if (den[j] != 1) big_l = boost::multiprecision::lcm(big_l, to_big(den[j]));
            for (std::size_t j = 0; j < cols; ++j)
                if (num[j] != 0) v[j] = to_big(num[j]) * (big_l / to_big(den[j]));
        }
        if (!is_null_vector(m, v)) return {};
        out.push_back(std::move(v));
    }
    return out;
}

// Exact fraction-free Gauss–Jordan elimination (Bareiss): every entry stays a whole number (a
// minor of m), so no fraction is ever reduced. Stops as soon as a second free column is certain.
BalanceSolution eliminate_exactly(const IntColumns& m) {
    const std::size_t rows = m.rows, cols = m.cols.size();
    Matrix a(rows, std::vector<cpp_int>(cols));
    for (std::size_t j = 0; j < cols; ++j)
        for (const auto& [i, x] : m.cols[j]) a[i][j] = x;
    const cpp_int limit = cpp_int(1) << max_balance_bits;
    BalanceSolution out;
    std::vector<std::size_t> pivots, free;
    cpp_int prev = 1;
    std::size_t r = 0;
    for (std::size_t c = 0; c < cols; ++c) {
        std::size_t p = r;
        while (p < rows && a[p][c].is_zero()) ++p;
        if (p >= rows) {
            free.push_back(c);
            // Each later column gets a pivot from the rows left, or is free too.
            const std::size_t later_free = (cols - c - 1) - std::min(cols - c - 1, rows - r);
            if (free.size() + later_free >= 2) {
                out.kind = BalanceSolution::Kind::several;
                out.ways = free.size() + later_free;
                out.ways_exact = c + 1 == cols || r == rows;
                return out;
            }
            continue;
        }
        std::swap(a[p], a[r]);
        const cpp_int pivot = a[r][c];
        for (std::size_t i = 0; i < rows; ++i) {
            if (i == r) continue;
            const cpp_int f = a[i][c];
            if (f.is_zero() && pivot == prev) continue;
            for (std::size_t j = 0; j < cols; ++j) {
                if (j == c) continue;
                cpp_int& x = a[i][j];
                if (x.is_zero() && (f.is_zero() || a[r][j].is_zero())) continue;
                x = (pivot * x - f * a[r][j]) / prev;  // exact (Bareiss)
                if (x > limit || x < -limit) {
                    out.kind = BalanceSolution::Kind::too_large;
                    return out;
                }
            }
            a[i][c] = 0;
        }
        prev = pivot;
        pivots.push_back(c);
        ++r;
        if (r == rows && free.size() + (cols - c - 1) >= 2) {  // every later column is free
            out.kind = BalanceSolution::Kind::several;
            out.ways = free.size() + (cols - c - 1);
            return out;
        }
    }
    if (free.empty()) {
        out.kind = BalanceSolution::Kind::none;
        return out;
    }
    // One free column f: D x_f + a[i][f] = 0 on each pivot row i, D the common pivot; the sign
    // chosen so that x_f > 0, as the vectors rebuilt from residues have it.
    const std::size_t f = free.front();
    std::vector<cpp_int> v(cols);
    const bool flip = prev < 0;
    v[f] = flip ? cpp_int(-prev) : prev;
    for (std::size_t i = 0; i < pivots.size(); ++i) v[pivots[i]] = flip ? a[i][f] : cpp_int(-a[i][f]);
    out.kind = BalanceSolution::Kind::unique;
    for (auto& x : v) out.coefficients.emplace_back(x);
    return out;
}

i128 abs_i128(i128 x) { return x < 0 ? -x : x; }

}  // namespace

std::optional<BalanceSolution> solve_balance_small(const SmallBalanceMatrix& m) {
    constexpr std::size_t R = SmallBalanceMatrix::max_rows, C = SmallBalanceMatrix::max_cols;
    const std::size_t rows = m.rows, cols = m.cols;
    if (rows > R || cols > C) return std::nullopt;
    BalanceSolution out;
    if (cols >= rows + 2) {  // as solve_balance: the rank is at most the number of rows
        out.kind = BalanceSolution::Kind::several;
        out.ways = cols - rows;
        out.ways_exact = false;
        return out;
    }
    // The same fraction-free Gauss–Jordan elimination as eliminate_exactly, carried to the end
    // (the matrix is small): every entry a minor of m, kept below 2^62, so held in 64 bits and
    // each product of two a single widening multiplication into 128 bits.
    constexpr std::int64_t limit = std::int64_t(1) << 62;
    std::int64_t a[R][C];
    for (std::size_t i = 0; i < rows; ++i)
        for (std::size_t j = 0; j < cols; ++j) {
            if (m.a[i][j] >= SmallBalanceMatrix::max_entry || m.a[i][j] <= -SmallBalanceMatrix::max_entry)
                return std::nullopt;
            a[i][j] = m.a[i][j];
        }
    std::size_t pivots[C], free[C], nfree = 0, r = 0;
    std::int64_t prev = 1;
    for (std::size_t c = 0; c < cols; ++c) {
        std::size_t p = r;
        while (p < rows && a[p][c] == 0) ++p;
        if (p >= rows) {
            free[nfree++] = c;
            continue;
        }
        if (p != r)
            for (std::size_t j = 0; j < cols; ++j) std::swap(a[p][j], a[r][j]);
        const std::int64_t pivot = a[r][c];
        for (std::size_t i = 0; i < rows; ++i) {
            if (i == r) continue;
            const std::int64_t f = a[i][c];
            if (f == 0 && pivot == prev) continue;
            for (std::size_t j = 0; j < cols; ++j) {
                if (j == c) continue;
                const i128 num = i128(pivot) * a[i][j] - i128(f) * a[r][j];
                // exact (Bareiss); by the first pivot, 1, nothing to divide, and a quotient of
                // 64-bit numbers by the processor's own division, not the 128-bit routine's
                const i128 x = prev == 1 ? num
                               : num > INT64_MIN && num <= INT64_MAX  // (INT64_MIN / -1 would overflow)
                                   ? i128(static_cast<std::int64_t>(num) / prev)
                                   : num / prev;
                if (abs_i128(x) >= limit) return std::nullopt;
                a[i][j] = static_cast<std::int64_t>(x);
            }
            a[i][c] = 0;
        }
        prev = pivot;
        pivots[r++] = c;
    }
    if (nfree == 0) {
        out.kind = BalanceSolution::Kind::none;
        return out;
    }
    if (nfree > 1) {  // exactly: the elimination ran to the end
        out.kind = BalanceSolution::Kind::several;
        out.ways = nfree;
        return out;
    }
    // One free column f: D x_f + a[i][f] = 0 on each pivot row i, D the common pivot, x_f > 0.
    const std::size_t f = free[0];
    std::int64_t w[C] = {};  // the solution of the scaled matrix, each |w| < 2^62
    const std::int64_t sign = prev < 0 ? -1 : 1;
    w[f] = sign * prev;
    for (std::size_t i = 0; i < r; ++i) w[pivots[i]] = -sign * a[i][f];
    // Checked on m itself (|m| < 2^31, |w| < 2^62: each sum stays far below 2^127).
    for (std::size_t i = 0; i < rows; ++i) {
        i128 sum = 0;
        for (std::size_t j = 0; j < cols; ++j) sum += i128(m.a[i][j]) * w[j];
        if (sum != 0) throw Error(ErrorKind::internal, "the exact balance does not balance");
    }
    // The balance of the unscaled matrix, in lowest terms (scale < 2^31: products below 2^93).
    i128 v[C];
    bool in_64 = true;  // nearly always: then the gcd and the quotients in the processor's own division
    for (std::size_t j = 0; j < cols; ++j) {
        v[j] = i128(w[j]) * m.scale[j];
        in_64 = in_64 && abs_i128(v[j]) <= INT64_MAX;
    }
    out.kind = BalanceSolution::Kind::unique;
    out.coefficients.reserve(cols);
    if (in_64) {
        std::int64_t g = 0;
        for (std::size_t j = 0; j < cols; ++j) g = std::gcd(g, static_cast<std::int64_t>(v[j]));
        for (std::size_t j = 0; j < cols; ++j) out.coefficients.emplace_back(static_cast<std::int64_t>(v[j]) / g);
        return out;
    }
    i128 g = 0;
    for (std::size_t j = 0; j < cols; ++j) g = g == 0 ? abs_i128(v[j]) : v[j] == 0 ? g : gcd_i128(g, abs_i128(v[j]));
    for (std::size_t j = 0; j < cols; ++j) {
        const i128 x = v[j] / g;
        if (x >= INT64_MIN && x <= INT64_MAX)
            out.coefficients.emplace_back(static_cast<std::int64_t>(x));
        else
            out.coefficients.emplace_back(to_big(x));
    }
    return out;
}

BalanceSolution solve_balance(std::size_t rows, const std::vector<SparseColumn>& m) {
    using boost::multiprecision::denominator;
    using boost::multiprecision::numerator;
    BalanceSolution out;
    const std::size_t cols = m.size();
    if (cols >= rows + 2) {  // rank ≤ rows: at least cols − rows independent balances
        out.kind = BalanceSolution::Kind::several;
        out.ways = cols - rows;
        out.ways_exact = false;
        return out;
    }
    // Whole numbers: column j times the least common multiple of its denominators. A null
    // vector y of the scaled matrix is the balance scale[j]·y[j] of m.
    std::vector<cpp_int> scale(cols, 1);
    IntColumns a;
    a.rows = rows;
    a.cols.resize(cols);
    for (std::size_t j = 0; j < cols; ++j) {
        for (const auto& e : m[j])
            if (denominator(e.second) != 1) scale[j] = boost::multiprecision::lcm(scale[j], cpp_int(denominator(e.second)));
        a.cols[j].reserve(m[j].size());
        for (const auto& e : m[j]) {
            if (scale[j] == 1)  // whole counts, the common case: no division
                a.cols[j].emplace_back(e.first, numerator(e.second));
            else
                a.cols[j].emplace_back(e.first, numerator(e.second) * (scale[j] / denominator(e.second)));
        }
    }

    // The rank modulo a prime is at most the rational rank: full rank there means no balance.
    // Otherwise null vectors are rebuilt from 1, 2, then 4 primes (coefficients up to about
    // 3·10^4, 2·10^9, 2·10^18) and checked exactly: once they check, the dimension is exact.
    std::vector<ModEchelon> es;
    es.push_back(echelon_mod(0, a));
    if (es.front().pivots.size() == cols) {
        out.kind = BalanceSolution::Kind::none;
        return out;
    }
    std::vector<std::vector<cpp_int>> basis;
    for (std::size_t k : {1u, 2u, 4u}) {
        while (es.size() < k) es.push_back(echelon_mod(es.size(), a));
        basis = rebuilt_null_space(a, es);
        if (!basis.empty()) break;
    }
    std::vector<cpp_int> y;
    if (!basis.empty()) {
        // cols − rank(mod p) exact null vectors, independent (each has its own free column): the
        // rational null space has exactly that dimension.
        if (basis.size() > 1) {
            out.kind = BalanceSolution::Kind::several;
            out.ways = basis.size();
            return out;
        }
        y = std::move(basis.front());
    } else {
        BalanceSolution exact = eliminate_exactly(a);
        if (exact.kind != BalanceSolution::Kind::unique) return exact;
        for (const auto& x : exact.coefficients) y.push_back(numerator(x));
        if (!is_null_vector(a, y)) throw Error(ErrorKind::internal, "the exact balance does not balance");
    }
    cpp_int g = 0;
    for (std::size_t j = 0; j < cols; ++j) {
        if (scale[j] != 1) y[j] *= scale[j];
        g = boost::multiprecision::gcd(g, y[j]);
    }
    out.kind = BalanceSolution::Kind::unique;
    out.coefficients.reserve(cols);
    for (auto& x : y) out.coefficients.emplace_back(g == 1 ? x : cpp_int(x / g));
    return out;
}

std::vector<Rational> smallest_integers(const std::vector<Rational>& v) {
    using boost::multiprecision::cpp_int;
    using boost::multiprecision::denominator;
    using boost::multiprecision::numerator;
    cpp_int l = 1;
    for (const auto& x : v) l = boost::multiprecision::lcm(l, denominator(x));
    cpp_int g = 0;
    std::vector<cpp_int> ints;
    for (const auto& x : v) {
        cpp_int n = numerator(x) * (l / denominator(x));
        ints.push_back(n);
        g = boost::multiprecision::gcd(g, n);
    }
    if (g == 0) g = 1;
    std::vector<Rational> out;
    for (auto& n : ints) out.emplace_back(n / g);
    return out;
}

}  // namespace rxnheat::detail
