#include "chem.hpp"

#include <boost/multiprecision/cpp_int.hpp>

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
