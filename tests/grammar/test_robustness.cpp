// Robustness: random and mutated input from a fixed seed must only ever give a well-formed tree
// or a ParseError (no other exception, crash or hang), and large hostile input is refused fast.
#include "grammar_helpers.hpp"

#include <algorithm>
#include <chrono>
#include <cstdint>
#include <random>
#include <string>
#include <iterator>
#include <thread>
#include <vector>

using namespace grammar_test;
using rxnheat::grammar::parse_number;
using rxnheat::grammar::parse_reaction;
using rxnheat::grammar::parse_species;

namespace {

/// Upper bound for any position: characters of valid UTF-8, bytes otherwise.
std::size_t length_bound(const std::string& s) { return s.size() + 1; }

void check_species(const Species& s, std::size_t bound) {
    CHECK(s.position >= 1);
    CHECK(s.position <= bound);
    CHECK_FALSE(s.written.empty());
    CHECK((s.phase.empty() || s.phase == "g" || s.phase == "l" || s.phase == "s" || s.phase == "aq"));
    if (s.is_name) {
        CHECK_FALSE(s.name.empty());
        CHECK(s.atoms.empty());
        CHECK(s.charge == 0);
    } else {
        CHECK_FALSE(s.formula.empty());
        CHECK_FALSE(s.atoms.empty());
        for (const Atom& a : s.atoms) {
            CHECK(a.count > 0);
            CHECK(a.position >= s.position);
            CHECK(a.position <= bound);
        }
        for (char c : s.formula) CHECK(static_cast<unsigned char>(c) < 0x80);  // ASCII form
    }
}

/// Runs all three entry points; returns how many accepted the text.
int parse_all_ways(const std::string& text) {
    INFO("input bytes: " << text.size() << " text: " << text);
    std::size_t const bound = length_bound(text);
    int accepted = 0;
    auto check_error = [&](const ParseError& e) {
        CHECK(e.position() <= bound);
        CHECK_FALSE(e.detail().empty());
    };
    try {
        const Reaction r = parse_reaction(text);
        ++accepted;
        CHECK_FALSE(r.reactants.empty());
        CHECK_FALSE(r.products.empty());
        CHECK_FALSE(r.arrow.empty());
        for (const auto* side : {&r.reactants, &r.products})
            for (const Term& t : *side) {
                CHECK(t.coefficient > 0);
                CHECK(t.position >= 1);
                CHECK(t.position <= t.species.position);
                check_species(t.species, bound);
            }
    } catch (const ParseError& e) {
        check_error(e);
    } catch (const std::exception& e) {
        FAIL("parse_reaction threw a non-ParseError: " << e.what());
    }
    try {
        check_species(parse_species(text), bound);
        ++accepted;
    } catch (const ParseError& e) {
        check_error(e);
    } catch (const std::exception& e) {
        FAIL("parse_species threw a non-ParseError: " << e.what());
    }
    try {
        (void)parse_number(text);
        ++accepted;
    } catch (const ParseError& e) {
        check_error(e);
    } catch (const std::exception& e) {
        FAIL("parse_number threw a non-ParseError: " << e.what());
    }
    return accepted;
}

// The notation's characters, and some that are not, as UTF-8 pieces.
const char* const pieces[] = {
    "H", "O", "C", "N", "Fe", "Cl", "Co", "a", "e", "n", "l", "g", "s", "aq", "cr", "q", "x",
    "0", "1", "2", "3", "9", ".", "/", "+", "-", "−", "^", "{", "}", "(", ")", "[", "]", "*",
    "·", "•", "⋅", ",", "=", "<", ">", "->", "=>", "<=>", "<->", "→", "⟶", "⇌", " ", "  ", "\t",
    "\u00A0", "₂", "₃", "₀", "²", "³", "⁺", "⁻", "½", "¾", "⅛", "(g)", "(aq)", "(s)", "(liq)",
    "ethanol", "n-octane", "$", "\u200B", "\xFF", "\xE2\x86", "\0",
};

const char* const seeds[] = {
    "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)",
    "2H2 + O2 = 2H2O",
    "1/2 N2(g) + 3/2 H2(g) → NH3(g)",
    "SO2(g) + 0.5 O2(g) ⇌ SO3(g)",
    "CH₄(g) + 2O₂(g) → CO₂(g) + 2H₂O(l)",
    "CuSO4·5H2O(s) -> CuSO4(s) + 5 H2O(l)",
    "Ca(OH)2(s) + CO2(g) -> CaCO3(s) + H2O(l)",
    "H+(aq) + OH-(aq) -> H2O(l)",
    "Fe^3+(aq) + 3 OH^-(aq) -> Fe(OH)3(s)",
    "ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)",
    "[Cu(NH3)4]{2+}(aq) + SO₄²⁻ <=> ethylene oxide + Fe0.947O",
};

}  // namespace

TEST_CASE("fuzz: random bytes", "[grammar][robustness]") {
    std::mt19937 rng(20240611u);
    for (int k = 0; k < 1000; ++k) {
        std::string s(rng() % 65, '\0');
        for (char& c : s) c = static_cast<char>(rng() & 0xFF);
        parse_all_ways(s);
    }
}

TEST_CASE("fuzz: random strings of notation characters", "[grammar][robustness]") {
    std::mt19937 rng(777u);
    constexpr std::size_t n = sizeof pieces / sizeof pieces[0];
    for (int k = 0; k < 2000; ++k) {
        std::string s;
        for (std::uint32_t len = rng() % 24; len > 0; --len) {
            const char* p = pieces[rng() % n];
            s += (*p == '\0') ? std::string(1, '\0') : std::string(p);
        }
        parse_all_ways(s);
    }
}

TEST_CASE("fuzz: mutated examples", "[grammar][robustness]") {
    std::mt19937 rng(4242u);
    constexpr std::size_t n = sizeof pieces / sizeof pieces[0];
    int accepted = 0;
    for (const char* seed : seeds) REQUIRE(parse_all_ways(seed) >= 1);  // the seeds themselves parse
    for (int k = 0; k < 3000; ++k) {
        std::string s = seeds[rng() % (sizeof seeds / sizeof seeds[0])];
        for (std::uint32_t edits = 1 + rng() % 3; edits > 0; --edits) {
            std::size_t const at = s.empty() ? 0 : rng() % (s.size() + 1);
            switch (rng() % 4) {
                case 0: s.insert(at, pieces[rng() % n]); break;                 // insert a piece
                case 1: if (at < s.size()) s.erase(at, 1 + rng() % 3); break;   // delete bytes
                case 2: if (at < s.size()) s[at] = static_cast<char>(rng() & 0xFF); break;  // flip a byte
                case 3: s.insert(at, s.substr(at, rng() % 8)); break;           // duplicate a stretch
            }
        }
        accepted += parse_all_ways(s) > 0;
    }
    // Not a fixed number (the mutations are random), but both outcomes must occur.
    CHECK(accepted > 100);
    CHECK(accepted < 3000);
}

namespace {
// The fastest of three tries, so that a time slice lost to another process on a busy machine
// does not count as parsing time.
double milliseconds_to_fail(const std::string& text) {
    double best = 1e300;
    for (int attempt = 0; attempt < 3; ++attempt) {
        auto const t0 = std::chrono::steady_clock::now();
        bool failed = false;
        try {
            (void)parse_reaction(text);
        } catch (const ParseError&) {
            failed = true;
        }
        auto const t1 = std::chrono::steady_clock::now();
        CHECK(failed);
        best = std::min(best, std::chrono::duration<double, std::milli>(t1 - t0).count());
    }
    return best;
}
}  // namespace

// The bounds are for optimised code. Sanitizer builds (RXNHEAT_SANITIZED: ASan, UBSan and the
// fuzzers' coverage instrumentation) run several times slower by design (measured: 12.4 ms for a
// 10 ms case), and there the bounds are ten times: still far below what a quadratic or
// backtracking parse of 4,096 characters would take.
#ifdef RXNHEAT_SANITIZED
constexpr double slowdown = 10;
#else
constexpr double slowdown = 1;
#endif

TEST_CASE("hostile input is refused fast", "[grammar][robustness]") {
    const double bound_ms = 10.0 * slowdown;
    CHECK(milliseconds_to_fail(std::string(4096, '(')) < bound_ms);
    CHECK(milliseconds_to_fail(std::string(4096, '[')) < bound_ms);
    CHECK(milliseconds_to_fail(std::string(4096, ')')) < bound_ms);
    CHECK(milliseconds_to_fail(std::string(1 << 20, '(')) < bound_ms);  // refused by length
    std::mt19937 rng(99u);
    std::string bytes(4096, '\0');
    for (char& c : bytes) c = static_cast<char>(rng() & 0xFF);
    CHECK(milliseconds_to_fail(bytes) < bound_ms);
    std::string ascii(4096, ' ');
    for (char& c : ascii) c = static_cast<char>(' ' + rng() % 95);  // printable ASCII
    CHECK(milliseconds_to_fail(ascii) < bound_ms);
    std::string nested;  // deep but legal nesting, then an error at the very end
    while (nested.size() < 4000) nested += "(((((((((((((((H)2)2)2)2)2)2)2)2)2)2)2)2)2)2)2 + ";
    CHECK(milliseconds_to_fail(nested + "->") < bound_ms);
}

TEST_CASE("a long legal reaction near the limit parses", "[grammar][robustness]") {
    std::string text;
    while (text.size() < 4000) text += "2 CH4(g) + ";
    text += "O2 -> CO2";
    auto const t0 = std::chrono::steady_clock::now();
    const Reaction r = parse_reaction(text);
    auto const ms = std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t0).count();
    CHECK(r.reactants.size() == 365);
    CHECK(ms < 50.0 * slowdown);
}

// parse_reaction builds its syntax tree in one object per thread, kept from call to call
// (grammar/parse.cpp): nothing of one parse may reach the next, whether it was long, failed
// halfway through a side, or ran on another thread at the same time.
TEST_CASE("one parse leaves nothing behind for the next", "[grammar][robustness]") {
    std::string long_text;
    for (int i = 0; i < 1999; ++i) long_text += "H+";
    long_text += "H->O";
    const Reaction big = parse_reaction(long_text);
    CHECK(big.reactants.size() == 2000);
    CHECK(big.products.size() == 1);

    // Fails after three reactants were read: the next parse must not see them.
    CHECK_THROWS_AS(parse_reaction("CH4 + O2 + N2 + -> CO2"), ParseError);
    const Reaction small = parse_reaction("2 H2 + O2 -> 2 H2O");
    REQUIRE(small.reactants.size() == 2);
    REQUIRE(small.products.size() == 1);
    CHECK(small.reactants[0].species.formula == "H2");
    CHECK(small.reactants[0].coefficient == q(2));
    CHECK(small.reactants[1].species.formula == "O2");
    CHECK(small.products[0].species.formula == "H2O");
    CHECK(small.products[0].position == 14);
    CHECK(small.arrow == "->");

    // Two threads parsing different reactions at once each get their own terms.
    auto worker = [](std::string text, std::size_t left, std::size_t right, int* bad) {
        for (int k = 0; k < 200; ++k) {
            const Reaction r = parse_reaction(text);
            if (r.reactants.size() != left || r.products.size() != right) ++*bad;
        }
    };
    int bad_a = 0, bad_b = 0;
    std::thread a(worker, long_text, 2000, 1, &bad_a);
    std::thread b(worker, std::string("CaCO3(s) -> CaO(s) + CO2(g)"), 1, 2, &bad_b);
    a.join();
    b.join();
    CHECK(bad_a == 0);
    CHECK(bad_b == 0);
}

namespace {
/// Every field of a parsed reaction as one text, atoms and positions included, to compare two
/// parses of the same input.
std::string describe(const Reaction& r) {
    std::string out = "arrow " + r.arrow;
    const auto side = [&out](const char* name, const std::vector<Term>& terms) {
        for (const Term& t : terms) {
            const Species& s = t.species;
            out += std::string("\n") + name + " " + t.coefficient.str() + (t.coefficient_written ? " written" : "") +
                   " @" + std::to_string(t.position) + " [" + s.written + "] @" + std::to_string(s.position) +
                   (s.is_name ? " name '" + s.name + "'" : " formula " + s.formula) + " charge " +
                   std::to_string(s.charge) + " phase '" + s.phase + "' atoms";
            for (const Atom& a : s.atoms) out += " " + a.symbol + "=" + a.count.str() + "@" + std::to_string(a.position);
        }
    };
    side("left", r.reactants);
    side("right", r.products);
    return out;
}
}  // namespace

// parse_reaction(text, out) reuses `out`'s storage (the engine parses every reaction into one
// tree per thread): whatever `out` held before, a failed parse included, the result must be the
// fresh parse's, field for field.
TEST_CASE("a reaction parsed into a used tree is the one a fresh parse gives", "[grammar][robustness]") {
    std::string long_text;
    for (int i = 0; i < 299; ++i) long_text += "H2O + ";
    long_text += "ethanol(l) -> 3 CO2(g) + Fe^3+(aq)";
    std::vector<std::string> texts(std::begin(seeds), std::end(seeds));
    texts.push_back(long_text);
    texts.push_back("CH4(g) + O0 -> CO2(g)");          // fails in building the tree (a count of zero)
    texts.push_back("CH4 + O2 + N2 + -> CO2");          // fails in the grammar after three terms
    texts.push_back("n-octane(l) + 25/2 O2(g) -> 8 CO2(g) + 9 H2O(g)");
    std::vector<std::string> fresh;
    for (const auto& t : texts) {
        try {
            fresh.push_back(describe(parse_reaction(t)));
        } catch (const ParseError& e) {
            fresh.push_back(std::string("error ") + e.what());
        }
    }
    CHECK(fresh[fresh.size() - 3].rfind("error ", 0) == 0);  // the two failures do fail
    CHECK(fresh[fresh.size() - 2].rfind("error ", 0) == 0);
    Reaction kept;
    std::mt19937 rng(77u);
    for (int round = 0; round < 4; ++round) {
        std::vector<std::size_t> order(texts.size());
        for (std::size_t i = 0; i < order.size(); ++i) order[i] = i;
        std::shuffle(order.begin(), order.end(), rng);
        for (std::size_t i : order) {
            std::string got;
            try {
                rxnheat::grammar::parse_reaction(texts[i], kept);
                got = describe(kept);
            } catch (const ParseError& e) {
                got = std::string("error ") + e.what();
            }
            CHECK(got == fresh[i]);
        }
    }
}
