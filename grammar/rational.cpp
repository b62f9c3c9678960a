// Rational (rational.hpp): 64-bit fast paths with 128-bit intermediates, cpp_rational otherwise.
#include "grammar/rational.hpp"

#include <numeric>
#include <stdexcept>

namespace rxnheat::grammar {

namespace {

using u128 = unsigned __int128;
using i128 = __int128;

constexpr i128 max64 = INT64_MAX;  // the 64-bit form holds |n| <= 2^63 - 1 and 1 <= d <= 2^63 - 1

std::uint64_t magnitude(std::int64_t x) { return x < 0 ? std::uint64_t(0) - std::uint64_t(x) : std::uint64_t(x); }

u128 magnitude(i128 x) { return x < 0 ? u128(0) - u128(x) : u128(x); }

/// gcd of a 128-bit and a 64-bit number (b > 0): one 128-bit remainder, then 64-bit.
std::uint64_t gcd_128_64(u128 a, std::uint64_t b) { return std::gcd(std::uint64_t(a % b), b); }

/// gcd of two 128-bit numbers (binary, no division), for the rare results beyond 64 bits.
u128 gcd_128(u128 a, u128 b) {
    if (a == 0) return b;
    if (b == 0) return a;
    int shift = 0;
    while (((a | b) & 1) == 0) a >>= 1, b >>= 1, ++shift;
    while ((a & 1) == 0) a >>= 1;
    do {
        while ((b & 1) == 0) b >>= 1;
        if (a > b) std::swap(a, b);
        b -= a;
    } while (b != 0);
    return a << shift;
}

Rational::integer_type to_integer(i128 x) {
    const u128 m = magnitude(x);
    Rational::integer_type r = static_cast<std::uint64_t>(m >> 64);
    r <<= 64;
    r += static_cast<std::uint64_t>(m);
    return x < 0 ? Rational::integer_type(-r) : r;
}

[[noreturn]] void divide_by_zero() { throw std::overflow_error("rational division by zero"); }

}  // namespace

Rational::Rational(std::int64_t num, std::int64_t den) {
    if (den == 0) divide_by_zero();
    if (num == INT64_MIN || den == INT64_MIN) {
        assign(big_type(num) / big_type(den));
        return;
    }
    *this = reduced(i128(num), i128(den));
}

Rational::Rational(const integer_type& n) {
    static const integer_type limit = integer_type(INT64_MAX);
    if (n <= limit && n >= -limit) {  // the common case, without a big rational in between
        n_ = n.convert_to<std::int64_t>();
        return;
    }
    assign(big_type(n));
}

Rational::Rational(const integer_type& num, const integer_type& den) {
    if (den == 0) divide_by_zero();
    assign(big_type(num, den));
}

Rational Rational::reduced(i128 num, i128 den) {
    if (den < 0) num = -num, den = -den;
    if (num == 0) return Rational();
    if (den != 1) {
        const u128 g = gcd_128(magnitude(num), u128(den));
        if (g > 1) num /= i128(g), den /= i128(g);
    }
    return lowest_terms(num, den);
}

Rational Rational::lowest_terms(i128 num, i128 den) {
    Rational r;
    if (magnitude(num) <= u128(max64) && den <= max64) {
        r.n_ = std::int64_t(num);
        r.d_ = std::int64_t(den);
    } else {
        r.big_ = std::make_shared<const big_type>(to_integer(num), to_integer(den));
    }
    return r;
}

void Rational::assign(const big_type& v) {
    const auto& n = boost::multiprecision::numerator(v);
    const auto& d = boost::multiprecision::denominator(v);
    static const integer_type limit = integer_type(INT64_MAX);
    if (d <= limit && n <= limit && n >= -limit) {
        n_ = n.convert_to<std::int64_t>();
        d_ = d.convert_to<std::int64_t>();
        big_.reset();
        return;
    }
    n_ = 0;
    d_ = 1;
    big_ = std::make_shared<const big_type>(v);
}

int Rational::sign_big() const noexcept { return big_->sign(); }

Rational::integer_type Rational::numerator() const {
    return big_ ? integer_type(boost::multiprecision::numerator(*big_)) : integer_type(n_);
}

Rational::integer_type Rational::denominator() const {
    return big_ ? integer_type(boost::multiprecision::denominator(*big_)) : integer_type(d_);
}

Rational::big_type Rational::big() const {
    if (big_) return *big_;
    big_type r(n_);
    if (d_ != 1) r /= d_;
    return r;
}

double Rational::to_double() const {
    // Both terms exact in a double: one IEEE division, correctly rounded.
    constexpr std::int64_t exact = std::int64_t(1) << 53;
    if (!big_ && n_ <= exact && n_ >= -exact && d_ <= exact) return double(n_) / double(d_);
    return big().convert_to<double>();
}

std::string Rational::str() const {
    if (big_) return big_->str();
    if (d_ == 1) return std::to_string(n_);
    return std::to_string(n_) + "/" + std::to_string(d_);
}

Rational Rational::operator-() const {
    if (big_) return Rational(big_type(-*big_));
    Rational r = *this;
    r.n_ = -n_;  // |n| <= 2^63 - 1, so no overflow
    return r;
}

Rational operator+(const Rational& a, const Rational& b) {
    if (a.big_ || b.big_) return Rational(a.big() + b.big());
    if (a.n_ == 0) return b;
    if (b.n_ == 0) return a;
    if (a.d_ == 1 && b.d_ == 1) return Rational::lowest_terms(i128(a.n_) + b.n_, 1);
    // Knuth's addition in lowest terms: g = gcd(d1, d2), t = n1·(d2/g) + n2·(d1/g),
    // g2 = gcd(t, g); the sum is (t/g2) / ((d1/g)·(d2/g2)), already reduced.
    const std::int64_t g = std::int64_t(std::gcd(std::uint64_t(a.d_), std::uint64_t(b.d_)));
    const i128 t = i128(a.n_) * (b.d_ / g) + i128(b.n_) * (a.d_ / g);
    if (t == 0) return Rational();
    const std::int64_t g2 = std::int64_t(gcd_128_64(magnitude(t), std::uint64_t(g)));
    const i128 num = t / g2;
    const i128 den = i128(a.d_ / g) * (b.d_ / g2);
    return Rational::lowest_terms(num, den);
}

Rational operator-(const Rational& a, const Rational& b) { return a + (-b); }

Rational operator*(const Rational& a, const Rational& b) {
    if (a.big_ || b.big_) return Rational(a.big() * b.big());
    if (a.n_ == 0 || b.n_ == 0) return Rational();
    if (a.d_ == 1 && b.d_ == 1) return Rational::lowest_terms(i128(a.n_) * b.n_, 1);  // no gcd needed
    // Cross-cancel first, so the products are in lowest terms.
    const std::int64_t g1 = std::int64_t(std::gcd(magnitude(a.n_), std::uint64_t(b.d_)));
    const std::int64_t g2 = std::int64_t(std::gcd(magnitude(b.n_), std::uint64_t(a.d_)));
    const i128 num = i128(a.n_ / g1) * (b.n_ / g2);
    const i128 den = i128(a.d_ / g2) * (b.d_ / g1);
    return Rational::lowest_terms(num, den);
}

Rational operator/(const Rational& a, const Rational& b) {
    if (b.is_zero()) divide_by_zero();
    if (b.big_) return Rational(a.big() / b.big());
    Rational inverse;  // 1/b: exchange the terms, keep the denominator positive
    inverse.n_ = b.n_ < 0 ? -b.d_ : b.d_;
    inverse.d_ = b.n_ < 0 ? -b.n_ : b.n_;
    return a * inverse;
}

bool Rational::equal_big(const Rational& a, const Rational& b) {
    if (a.big_ && b.big_) return *a.big_ == *b.big_;
    return false;  // canonical: a value that fits is never held big
}

bool operator<(const Rational& a, const Rational& b) {
    if (a.big_ || b.big_) return a.big() < b.big();
    return i128(a.n_) * b.d_ < i128(b.n_) * a.d_;
}

}  // namespace rxnheat::grammar
