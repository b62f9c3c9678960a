// Bounded cost (issue 10, item 5): the worst reactions of up to 4 KiB — thousands of terms,
// hundreds of ions, every element at once, a dense system of many elements — are accepted or
// rejected quickly by check, balance, scale, reverse and dh, and with the right answer.
//
// The target is 1 ms per call; the test asserts a median of 20 ms (CI machines are shared and
// noisy) and prints the measured medians. Every expected answer is built here by construction
// (a sum of reactant formulas is their product; n species made of fewer than n − 1 elements
// cannot balance in one way only: the null space of an m × n matrix has dimension ≥ n − m),
// never read from the engine.
#include "behaviour_helpers.hpp"

#include "chem.hpp"  // solve_balance, for the path only contrived matrices reach

#include <algorithm>
#include <chrono>
#include <fstream>
#include <random>
#include <string>
#include <vector>

using namespace rxnheat_test;

namespace {

// Sanitizer builds (RXNHEAT_SANITIZE) run several times slower by design, and this test is about
// the cost growing with the input, not about their constant factor: their bounds are 10 times.
#ifdef RXNHEAT_SANITIZED
constexpr double slowdown = 10;
#else
constexpr double slowdown = 1;
#endif
constexpr double bound_ms = 20 * slowdown;  // asserted; the target is 1 ms (issue 10, item 5)
// Inputs of thousands of terms: their parse, compositions and keys cost about 3,900
// instructions per one-letter term (callgrind, linear in the terms; 25,000 before the cold-path
// work of tests/bench/RESULTS-engine.md), which the balance decision does not change; they are
// held to this bound and to the cost of a balanced reaction of as many terms.
constexpr double long_bound_ms = 60 * slowdown;

/// Median wall time of `runs` calls of f, in ms; each call's outcome must be the same.
template <class F>
double median_ms(F&& f, int runs = 7) {
    std::vector<double> t;
    for (int i = 0; i < runs; ++i) {
        const auto t0 = std::chrono::steady_clock::now();
        f();
        t.push_back(std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count());
    }
    std::sort(t.begin(), t.end());
    return t[t.size() / 2];
}

/// Every element symbol of data/elements.csv, in file order.
std::vector<std::string> element_symbols() {
    std::ifstream f(std::string(RXNHEAT_SOURCE_DIR) + "/data/elements.csv");
    std::vector<std::string> out;
    std::string line;
    bool header = true;
    while (std::getline(f, line)) {
        if (line.empty() || line[0] == '#') continue;
        if (header) { header = false; continue; }
        out.push_back(line.substr(0, line.find(',')));
    }
    return out;
}

std::string joined(const std::vector<std::string>& parts, const char* sep) {
    std::string s;
    for (std::size_t i = 0; i < parts.size(); ++i) s += (i ? sep : "") + parts[i];
    return s;
}

/// Runs check, balance, scale, reverse and dh on `text` with no cache (every call pays the whole
/// parse and decision), asserts the bound on each median and reports the medians.
double time_all(const std::string& name, const std::string& text, double bound = bound_ms) {
    REQUIRE(text.size() <= 4096);
    rxnheat::Engine cold(rxnheat::EngineOptions{0});
    const double t_check = median_ms([&] { (void)cold.check(text); });
    const double t_balance = median_ms([&] { (void)attempt([&] { return cold.balance(text); }); });
    const double t_scale = median_ms([&] { (void)attempt([&] { return cold.scale(text, "2"); }); });
    const double t_reverse = median_ms([&] { (void)attempt([&] { return cold.reverse(text); }); });
    const double t_dh = median_ms([&] { (void)attempt([&] { return cold.dh(text); }); });
    WARN(name << " (" << text.size() << " bytes): median ms check " << t_check << ", balance " << t_balance
              << ", scale " << t_scale << ", reverse " << t_reverse << ", dh " << t_dh << " (target 1 ms)");
    CHECK(t_check < bound);
    CHECK(t_balance < bound);
    CHECK(t_scale < bound);
    CHECK(t_reverse < bound);
    CHECK(t_dh < bound);
    return t_check;
}

/// Median ms of check on a reaction that balances as written (the floor: parse, compositions and
/// data of as many terms, no balance to find).
double floor_check_ms(const std::string& text) {
    rxnheat::Engine cold(rxnheat::EngineOptions{0});
    return median_ms([&] { (void)cold.check(text); });
}

}  // namespace

TEST_CASE("2,000 terms, unbalanced: rejected quickly, in words", "[bounded][balance]") {
    std::string text;
    for (int i = 0; i < 1999; ++i) text += "H+";
    text += "H->O";  // 2,000 terms; H on the left only, O on the right only
    const double t = time_all("2000 terms", text, long_bound_ms);
    // The floor: 1,999 H -> H1999 balances as written (2,000 terms too).
    std::string floor_text;
    for (int i = 0; i < 1998; ++i) floor_text += "H+";
    floor_text += "H->H1999";
    const double floor = floor_check_ms(floor_text);
    WARN("2000 terms: check " << t << " ms, balanced floor " << floor << " ms, ratio " << t / floor);
    CHECK(t < 2 * floor);
    const std::string msg = eng().check(text);
    CHECK(contains(msg, "not balanced"));  // H 2000 on the left, 0 on the right: counted by construction
    CHECK(contains(msg, "H 2000 on the left, 0 on the right"));
    auto b = attempt([&] { return eng().balance(text); });
    REQUIRE_ENGINE_ERROR(b);
    CHECK(b.kind == ErrorKind::unbalanced);
    // 2,000 species of 2 elements: the null space has dimension ≥ 1,998 (rank ≤ 2)
    CHECK(contains(b.message, "independent ways"));
    // scale and reverse rewrite the text and do not require a balance (engine/FUNCTIONS.md):
    // their answers, built here term by term.
    std::string scaled, reversed = "O ->";
    for (int i = 0; i < 2000; ++i) {
        scaled += i ? " + 2 H" : "2 H";
        reversed += i ? " + H" : " H";
    }
    scaled += " -> 2 O";
    CHECK(attempt([&] { return eng().scale(text, "2"); }).text == scaled);
    CHECK(attempt([&] { return eng().reverse(text); }).text == reversed);
}

TEST_CASE("800 ions: rejected quickly, charge named", "[bounded][balance]") {
    std::string text;
    for (int i = 0; i < 799; ++i) text += "H+ + ";
    text += "H+ -> H";  // 800 ions on the left, a neutral atom on the right
    time_all("800 ions", text);
    const std::string msg = eng().check(text);
    CHECK(contains(msg, "charge 800 on the left, 0 on the right"));  // counted by construction
    auto b = attempt([&] { return eng().balance(text); });
    REQUIRE_ENGINE_ERROR(b);
    CHECK(b.kind == ErrorKind::unbalanced);
}

TEST_CASE("every element at once: balanced exactly and quickly", "[bounded][balance]") {
    const auto symbols = element_symbols();
    REQUIRE(symbols.size() > 90);
    // X + Y + ... -> X2Y2...: each element once on the left, twice on the right, so the only
    // balance is 2 of every reactant and 1 of the product (one element per reactant column).
    std::string product, doubled;
    for (const auto& s : symbols) product += s + "2";
    std::vector<std::string> twice;
    for (const auto& s : symbols) twice.push_back("2 " + s);
    const std::string text = joined(symbols, " + ") + " -> " + product;
    const std::string expected = joined(twice, " + ") + " -> " + product;
    time_all("every element", text);
    auto b = attempt([&] { return eng().balance(text); });
    INFO(b.message);
    CHECK(b.text == expected);
    CHECK(contains(eng().check(text), "Balanced, it would read: " + expected));
    // One more species made of elements already present: two independent balances.
    auto two = attempt([&] { return eng().balance(joined(symbols, " + ") + " + H2 -> " + product); });
    REQUIRE_ENGINE_ERROR(two);
    CHECK(contains(two.message, "2 independent ways"));  // 97 species, 95 elements: at least 2
}

TEST_CASE("a dense system of many elements: balanced exactly and quickly", "[bounded][balance]") {
    // m reactants, each made of the same m elements with counts 1..9 (a fixed pseudo-random
    // sequence), and one product whose counts are their sums: R1 + ... + Rm -> P balances with
    // every coefficient 1, and in no other way when the m reactants are independent.
    const std::vector<std::string> el = {"H", "C", "N", "O", "F", "P", "S", "K", "V", "Y", "I", "W", "U",
                                         "B", "Na", "Mg", "Al", "Si", "Cl", "Ca", "Ti", "Cr", "Mn", "Fe"};
    const std::size_t m = el.size();
    unsigned seed = 12345;
    std::vector<std::vector<int>> count(m, std::vector<int>(m));
    std::vector<int> sum(m, 0);
    std::vector<std::string> reactants;
    for (std::size_t i = 0; i < m; ++i) {
        std::string f;
        for (std::size_t k = 0; k < m; ++k) {
            seed = seed * 1103515245u + 12345u;
            count[i][k] = 1 + static_cast<int>((seed >> 16) % 9);
            sum[k] += count[i][k];
            f += el[k] + std::to_string(count[i][k]);
        }
        reactants.push_back(f);
    }
    std::string product;
    for (std::size_t k = 0; k < m; ++k) product += el[k] + std::to_string(sum[k]);
    const std::string balanced = joined(reactants, " + ") + " -> " + product;
    const std::string unbalanced = joined(reactants, " + ") + " -> 2 " + product;
    time_all("dense 24 elements", unbalanced);
    auto b = attempt([&] { return eng().balance(unbalanced); });
    INFO(b.message);
    CHECK(b.text == balanced);  // by construction: the product is the sum of the reactants
    CHECK(contains(eng().check(unbalanced), "Balanced, it would read: " + balanced));
    // Without the first reactant no balance exists: the unique balance above shows R1..Rm are
    // independent, so P = R1 + ... + Rm is not a combination of R2..Rm.
    std::vector<std::string> fewer(reactants.begin() + 1, reactants.end());
    auto none = attempt([&] { return eng().balance(joined(fewer, " + ") + " -> " + product); });
    REQUIRE_ENGINE_ERROR(none);
    CHECK(contains(none.message, "no coefficients balance"));
    time_all("dense 24 elements, no balance", joined(fewer, " + ") + " -> " + product);
}

TEST_CASE("a balance beyond 12-digit coefficients is refused in words", "[bounded][balance]") {
    // A balance whose smallest whole numbers need 13 digits could not be read back by rxnheat
    // (numbers have at most 12 digits): H2 in a formula with 10^12 + 1 atoms... written as a count
    // of 12 digits times a group: (H999999999999)H2 has 1,000,000,000,001 H atoms, and
    // H2 -> that species needs 1,000,000,000,001 H2 per 2 of the product.
    const std::string text = "H2 -> (H999999999999)H2";
    auto b = attempt([&] { return eng().balance(text); });
    REQUIRE_ENGINE_ERROR(b);
    CHECK(b.kind == ErrorKind::unbalanced);
    CHECK(contains(b.message, "12 digits"));
    CHECK_FALSE(contains(eng().check(text), "Balanced, it would read"));
}

TEST_CASE("solve_balance: the exact elimination where the residues cannot rebuild the balance", "[bounded][balance]") {
    using rxnheat::detail::BalanceSolution;
    using rxnheat::detail::Rational;
    using rxnheat::detail::SparseColumn;
    // Two rows, three columns, balanced by (1, 1, 1): row 1: (1 + 10^-20) + 1·0 − (1 + 10^-20) = 0,
    // row 2: 1 + 1 − 2 = 0 (checked by hand). Scaled to whole numbers, columns 1 and 3 carry a
    // factor 10^20 that column 2 does not, so the rebuilt vector (1, 10^20, 1) is beyond 2^61 and
    // only the exact fraction-free elimination finds the balance.
    const Rational big("100000000000000000001/100000000000000000000"), minus_big("-100000000000000000001/100000000000000000000");
    const std::vector<SparseColumn> m = {{{0, big}, {1, Rational(1)}}, {{1, Rational(1)}}, {{0, minus_big}, {1, Rational(-2)}}};
    const BalanceSolution s = rxnheat::detail::solve_balance(2, m);
    REQUIRE(s.kind == BalanceSolution::Kind::unique);
    REQUIRE(s.coefficients.size() == 3);
    // Signed as every path signs a unique balance: positive in the free column (the third).
    CHECK((s.coefficients[0] == 1 && s.coefficients[1] == 1 && s.coefficients[2] == 1));
    // The same through the grammar: C^(1 + 10^-20) O + O -> C^(1 + 10^-20) O2, written with a
    // wrong coefficient; its balance is every coefficient 1.
    const std::string s0 = "C(C0.0000000001)0.0000000001O", s1 = "C(C0.0000000001)0.0000000001O2";
    auto b = attempt([&] { return eng().balance(s0 + " + 2 O -> " + s1); });
    INFO(b.message);
    CHECK(b.text == s0 + " + O -> " + s1);
    // No balance and several balances through the exact elimination as well: a fourth column
    // (0, 1) adds a second independent balance (O alone), found without the residues.
    std::vector<SparseColumn> m2 = m;
    m2.push_back({{1, Rational(-1)}});
    CHECK(rxnheat::detail::solve_balance(2, m2).kind == BalanceSolution::Kind::several);
}

namespace {

using rxnheat::detail::BalanceSolution;

std::string describe(const BalanceSolution& s) {
    std::string out = s.kind == BalanceSolution::Kind::unique    ? "unique"
                      : s.kind == BalanceSolution::Kind::none    ? "none"
                      : s.kind == BalanceSolution::Kind::several ? "several"
                                                                 : "too_large";
    out += " ways=" + std::to_string(s.ways) + (s.ways_exact ? "" : "+");
    for (const auto& c : s.coefficients) out += " " + c.str();
    return out;
}

}  // namespace

TEST_CASE("solve_balance_small: the same answer as solve_balance on every small matrix tried", "[bounded][balance]") {
    using rxnheat::detail::Rational;
    using rxnheat::detail::SmallBalanceMatrix;
    using rxnheat::detail::SparseColumn;
    // 20,000 random matrices of 1–6 rows and 1–7 columns, entries −6…6 (zero half the time, as in
    // element matrices), each column optionally scaled by 2, 3 or 6 as a fractional count would
    // be: the stack elimination and the general path (residues, then exact elimination) must give
    // the same kind, number of ways and coefficients, sign included. A fixed seed: the same
    // matrices on every run.
    std::mt19937 rng(20261203);
    std::size_t counts[4] = {};
    for (int trial = 0; trial < 20000; ++trial) {
        SmallBalanceMatrix sm;
        sm.rows = 1 + rng() % 6;
        sm.cols = 1 + rng() % 7;
        std::vector<SparseColumn> m(sm.cols);
        for (std::size_t j = 0; j < sm.cols; ++j) {
            static const std::int64_t denominators[] = {1, 2, 3, 6};
            const std::int64_t d = denominators[rng() % 4];
            sm.scale[j] = d;
            for (std::size_t i = 0; i < sm.rows; ++i) {
                const int x = rng() % 2 ? 0 : int(rng() % 13) - 6;
                if (x == 0) continue;
                // The small matrix holds whole numbers (count·d) and the scale d; the general path
                // gets the counts themselves, x/d.
                sm.a[i][j] = x;
                m[j].emplace_back(i, Rational(x, d));
            }
        }
        const auto small = rxnheat::detail::solve_balance_small(sm);
        REQUIRE(small.has_value());  // entries this small never pass 2^62
        const BalanceSolution general = rxnheat::detail::solve_balance(sm.rows, m);
        INFO("trial " << trial << ": " << sm.rows << " x " << sm.cols);
        REQUIRE(describe(*small) == describe(general));
        ++counts[static_cast<int>(small->kind)];
    }
    // Every kind but too_large was met, each many times.
    CHECK(counts[0] > 1000);  // unique
    CHECK(counts[1] > 1000);  // none
    CHECK(counts[2] > 1000);  // several
}

TEST_CASE("solve_balance_small: hands over when an intermediate would pass 2^62", "[bounded][balance]") {
    using rxnheat::detail::SmallBalanceMatrix;
    // Entries b = 2^31 − 1 on the diagonal and 1 beside it: the second pivot is −(b² + 1), and the
    // step after it makes an entry of about b³ ≈ 2^93 (worked by hand), past the stack
    // elimination's bound of 2^62, so it answers nothing and solve_balance decides.
    SmallBalanceMatrix sm;
    sm.rows = 3;
    sm.cols = 4;
    const std::int64_t b = SmallBalanceMatrix::max_entry - 1;
    const std::int64_t rows[3][4] = {{b, 1, 0, 0}, {1, -b, 1, 0}, {0, 1, b, 1}};
    for (std::size_t i = 0; i < 3; ++i)
        for (std::size_t j = 0; j < 4; ++j) sm.a[i][j] = rows[i][j];
    for (auto& s : sm.scale) s = 1;
    CHECK_FALSE(rxnheat::detail::solve_balance_small(sm).has_value());
    // And an entry at the bound itself is refused before any arithmetic.
    sm.a[0][0] = SmallBalanceMatrix::max_entry;
    CHECK_FALSE(rxnheat::detail::solve_balance_small(sm).has_value());
}
