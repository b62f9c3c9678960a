// Rational (grammar/rational.hpp): the 64-bit fast paths must give exactly what Boost's
// cpp_rational gives (the oracle here: an independent arbitrary-precision implementation), on
// both sides of the 64-bit boundary, and the representation must stay canonical.
#include "grammar/rational.hpp"

#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <random>
#include <vector>

using rxnheat::grammar::Rational;
using Big = Rational::big_type;

namespace {

/// Both the value and the representation: 64-bit exactly when the reduced terms fit.
void check_same(const Rational& r, const Big& expected) {
    INFO("value " << r.str() << ", expected " << expected.str());
    CHECK(r.big() == expected);
    const auto& n = boost::multiprecision::numerator(expected);
    const auto& d = boost::multiprecision::denominator(expected);
    const Rational::integer_type limit(INT64_MAX);
    const bool fits = n <= limit && n >= -limit && d <= limit;
    CHECK(r.fits_64() == fits);
    CHECK(r.str() == expected.str());
    CHECK(r.to_double() == expected.convert_to<double>());
    CHECK(r.sign() == expected.sign());
}

Big big(std::int64_t n, std::int64_t d) { return Big(n) / Big(d); }

}  // namespace

TEST_CASE("Rational: construction reduces and keeps the sign on the numerator", "[grammar][rational]") {
    check_same(Rational(6, 4), big(3, 2));
    check_same(Rational(3, -6), big(-1, 2));
    check_same(Rational(-3, -6), big(1, 2));
    check_same(Rational(0, -5), Big(0));
    check_same(Rational(INT64_MIN), Big(INT64_MIN));  // -2^63 itself is held big (negation safety)
    check_same(Rational(INT64_MIN, 2), big(INT64_MIN, 2));
    check_same(Rational(std::uint64_t(1) << 63), Big(std::uint64_t(1) << 63));
    check_same(Rational("100000000000000000001/100000000000000000000"),
               Big("100000000000000000001/100000000000000000000"));
    CHECK_THROWS_AS(Rational(1, 0), std::overflow_error);
    CHECK_THROWS_AS(Rational(1) / Rational(0), std::overflow_error);
}

TEST_CASE("Rational: arithmetic across the 64-bit boundary equals cpp_rational", "[grammar][rational]") {
    const std::int64_t max = INT64_MAX;
    // Sums and products that just fit, just overflow, and come back into 64 bits.
    check_same(Rational(max - 1) + Rational(1), Big(max));
    check_same(Rational(max) + Rational(1), Big(max) + 1);
    check_same((Rational(max) + Rational(1)) - Rational(1), Big(max));
    check_same(Rational(-max) - Rational(1), Big(-max) - 1);
    check_same(Rational(std::int64_t(1) << 32) * Rational(std::int64_t(1) << 31), Big(std::uint64_t(1) << 63));
    check_same(Rational(1, max) + Rational(1, max - 1), big(1, max) + big(1, max - 1));
    check_same(Rational(max, 3) * Rational(3, max), Big(1));
    check_same(Rational(max) / Rational(max), Big(1));
    check_same(Rational(1, 3) + Rational(1, 6), big(1, 2));
    check_same(Rational(1, 2) - Rational(1, 2), Big(0));
    check_same(-Rational(max), Big(-max));
    CHECK(Rational(max) + 1 > Rational(max));
    CHECK(Rational(max) + 1 != Rational(max));
    CHECK(Rational(1, max) < Rational(1, max - 1));
    CHECK(Rational(-1, 3) < 0);
    CHECK(Rational(2, 4) == Rational(1, 2));
}

TEST_CASE("Rational: random operations equal cpp_rational", "[grammar][rational]") {
    // Terms drawn from four magnitudes (small counts, 12-digit numbers, near 2^62, near 2^63) so
    // every path (integers, Knuth's reduced sum, cross-cancelled product, overflow to big and back)
    // is taken many times. Fixed seed: the same cases on every run.
    std::mt19937_64 rng(20261202);
    const std::int64_t scales[] = {12, 999999999999LL, INT64_C(1) << 62, INT64_MAX};
    auto draw = [&]() -> std::int64_t {
        const std::int64_t s = scales[rng() % 4];
        std::int64_t v = std::int64_t(rng() % std::uint64_t(s)) + 1;
        return (rng() & 1) ? -v : v;
    };
    int big_results = 0;
    for (int k = 0; k < 20000; ++k) {
        std::int64_t n1 = draw(), n2 = draw(), d1 = draw(), d2 = draw();
        if (d1 < 0) d1 = -d1;
        if (d2 < 0) d2 = -d2;
        const Rational a(n1, d1), b(n2, d2);
        const Big A = big(n1, d1), B = big(n2, d2);
        Rational r;
        Big R;
        switch (k % 4) {
            case 0: r = a + b, R = A + B; break;
            case 1: r = a - b, R = A - B; break;
            case 2: r = a * b, R = A * B; break;
            default: r = a / b, R = A / B; break;
        }
        if (!r.fits_64()) ++big_results;
        // Chain once more, so values held big meet 64-bit ones.
        const Rational s = r * a + b;
        const Big S = R * A + B;
        if (r.big() != R || s.big() != S || (a < b) != (A < B) || (r == a) != (R == A)) {
            FAIL("case " << k << ": " << a.str() << ", " << b.str() << " gave " << r.str() << " and " << s.str()
                         << ", expected " << R.str() << " and " << S.str());
        }
        if (k % 97 == 0) check_same(s, S);
    }
    // Both forms were exercised (a check that could not fail otherwise would prove nothing).
    CHECK(big_results > 1000);
    CHECK(big_results < 19000);
}
