// An exact rational number for counts, coefficients and balances: two 64-bit integers while the
// value fits in them (the counts and coefficients of every real formula and reaction), an
// arbitrary-precision boost::multiprecision::cpp_rational when it does not (16 nested groups of
// 12-digit counts, or a balance's intermediate values, can exceed 64 bits).
//
// Why not cpp_rational throughout: every cpp_rational operation runs a multi-limb gcd and may
// allocate; a profile of a cold `dh` put over half of its instructions there. Here the common
// case is a few 128-bit multiplications and one 64-bit gcd, with no allocation.
//
// The representation is canonical: a value is held in 64 bits exactly when its reduced
// numerator and denominator both fit in (−2^63, 2^63), and only then, so two values are equal
// exactly when their representations are. The big form is immutable and shared between copies.
#pragma once

#include <boost/multiprecision/cpp_int.hpp>

#include <cstdint>
#include <memory>
#include <string>
#include <type_traits>

namespace rxnheat::grammar {

class Rational {
public:
    using big_type = boost::multiprecision::cpp_rational;
    using integer_type = boost::multiprecision::cpp_int;

    Rational() noexcept = default;
    /// Any built-in integer (implicit, as for cpp_rational: `r == 0`, `2 * r`, `1 / r`).
    template <typename I, std::enable_if_t<std::is_integral_v<I> && !std::is_same_v<I, bool>, int> = 0>
    Rational(I n) {  // NOLINT(google-explicit-constructor)
        if constexpr (std::is_signed_v<I>) {
            if (static_cast<long long>(n) != INT64_MIN) {
                n_ = static_cast<std::int64_t>(n);
                return;
            }
        } else {
            if (static_cast<unsigned long long>(n) <= static_cast<unsigned long long>(INT64_MAX)) {
                n_ = static_cast<std::int64_t>(n);
                return;
            }
        }
        assign(big_type(n));
    }
    /// num/den, reduced; den must not be zero (std::overflow_error otherwise).
    Rational(std::int64_t num, std::int64_t den);
    explicit Rational(const big_type& v) { assign(v); }
    explicit Rational(const integer_type& n);
    Rational(const integer_type& num, const integer_type& den);
    /// "a/b" or "a", as cpp_rational reads it (tests and constants).
    explicit Rational(const char* text) { assign(big_type(text)); }

    bool is_zero() const noexcept { return !big_ && n_ == 0; }
    int sign() const noexcept { return big_ ? sign_big() : (n_ > 0) - (n_ < 0); }
    bool is_integer() const noexcept { return big_ ? boost::multiprecision::denominator(*big_) == 1 : d_ == 1; }
    /// True when the value is held in 64 bits (then num64()/den64() are the reduced terms).
    bool fits_64() const noexcept { return !big_; }
    std::int64_t num64() const noexcept { return n_; }
    std::int64_t den64() const noexcept { return d_; }

    integer_type numerator() const;
    integer_type denominator() const;
    big_type big() const;
    /// The nearest double (correctly rounded).
    double to_double() const;
    template <typename T>
    T convert_to() const {
        static_assert(std::is_same_v<T, double>, "Rational converts to double only");
        return to_double();
    }
    /// "n/d", or "n" for a whole number (as cpp_rational::str()).
    std::string str() const;

    Rational operator-() const;
    Rational& operator+=(const Rational& b) { return *this = *this + b; }
    Rational& operator-=(const Rational& b) { return *this = *this - b; }
    Rational& operator*=(const Rational& b) { return *this = *this * b; }
    Rational& operator/=(const Rational& b) { return *this = *this / b; }

    friend Rational operator+(const Rational& a, const Rational& b);
    friend Rational operator-(const Rational& a, const Rational& b);
    friend Rational operator*(const Rational& a, const Rational& b);
    friend Rational operator/(const Rational& a, const Rational& b);
    /// Inline for values held in 64 bits (nearly every comparison: "is this count 1", "is it 0").
    friend bool operator==(const Rational& a, const Rational& b) {
        if (!a.big_ && !b.big_) return a.n_ == b.n_ && a.d_ == b.d_;
        return equal_big(a, b);
    }
    friend bool operator<(const Rational& a, const Rational& b);
    friend bool operator!=(const Rational& a, const Rational& b) { return !(a == b); }
    friend bool operator>(const Rational& a, const Rational& b) { return b < a; }
    friend bool operator<=(const Rational& a, const Rational& b) { return !(b < a); }
    friend bool operator>=(const Rational& a, const Rational& b) { return !(a < b); }

private:
    static bool equal_big(const Rational& a, const Rational& b);  ///< == when either is held big
    int sign_big() const noexcept;
    void assign(const big_type& v);
    /// num/den reduced (den != 0), then as lowest_terms().
    static Rational reduced(__int128 num, __int128 den);
    /// From a fraction already in lowest terms with den > 0: 64-bit if it fits, big otherwise.
    static Rational lowest_terms(__int128 num, __int128 den);

    std::int64_t n_ = 0, d_ = 1;            // the value when big_ is empty
    std::shared_ptr<const big_type> big_;  // the value when it does not fit in 64 bits
};

inline Rational::integer_type numerator(const Rational& r) { return r.numerator(); }
inline Rational::integer_type denominator(const Rational& r) { return r.denominator(); }

}  // namespace rxnheat::grammar
