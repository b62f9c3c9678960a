// Robustness through the public API (rxnheat.hpp): bad input never crashes or hangs, random byte
// strings, threads give the same values as one thread, and the cache is invisible.
#include "behaviour_helpers.hpp"

#include <atomic>
#include <cmath>
#include <functional>
#include <random>
#include <sstream>
#include <string>
#include <thread>
#include <vector>

using namespace rxnheat_test;

TEST_CASE("bad input never crashes or hangs", "[behaviour][robust]") {
    const std::string parens(4096, '(');
    const std::string too_long = std::string("H2(g) + 1/2 O2(g) -> H2O(l)") + std::string(5000, ' ');
    std::string long_ok = "H2(g) + 1/2 O2(g) -> H2O(l)";
    long_ok += std::string(rxnheat::max_input_chars - long_ok.size(), ' ');
    REQUIRE(long_ok.size() == 4096);

    struct Case { const char* what; std::function<double()> f; ErrorKind kind; bool check_kind; };
    const std::vector<Case> cases = {
        {"empty reaction", [] { return eng().dh(""); }, ErrorKind::syntax, true},
        {"blank reaction", [] { return eng().dh("   "); }, ErrorKind::syntax, true},
        {"4 KiB of '('", [&] { return eng().dh(parens); }, ErrorKind::syntax, false},
        {"4 KiB of '(' as a species", [&] { return eng().species_hf(parens); }, ErrorKind::syntax, false},
        {"4 KiB of '(' molar mass", [&] { return eng().molar_mass(parens); }, ErrorKind::syntax, false},
        {"5000+ characters", [&] { return eng().dh(too_long); }, ErrorKind::too_long, true},
        {"5000+ characters, species", [&] { return eng().species_hf(std::string(5000, 'C')); }, ErrorKind::too_long, true},
        {"species with no data", [] { return eng().dh("2 KMnO4(s) -> K2MnO4(s) + MnO2(s) + O2(g)"); }, ErrorKind::unknown_species, true},
        {"species with no data (hf)", [] { return eng().species_hf("XeF6(g)"); }, ErrorKind::unknown_species, true},
        {"T below 200 K", [] { return eng().dh(CH4_COMB, 150); }, ErrorKind::out_of_range, true},
        {"negative T", [] { return eng().dh(CH4_COMB, -5); }, ErrorKind::argument, false},
        {"zero T", [] { return eng().dh(CH4_COMB, 0); }, ErrorKind::argument, false},
        {"NaN T", [] { return eng().dh(CH4_COMB, std::nan("")); }, ErrorKind::argument, false},
        {"infinite T", [] { return eng().dh(CH4_COMB, INFINITY); }, ErrorKind::argument, false},
        {"NaN T species", [] { return eng().species_h("N2(g)", std::nan("")); }, ErrorKind::argument, false},
        {"NaN Tref", [] { return eng().species_h("N2(g)", 500, std::nan("")); }, ErrorKind::argument, false},
        {"unknown unit", [] { return eng().dh(CH4_COMB, 298.15, "kJ/furlong"); }, ErrorKind::unit, true},
        {"mJ/mol", [] { return eng().dh(CH4_COMB, 298.15, "mJ/mol"); }, ErrorKind::unit, true},
        {"unknown phase", [] { return eng().dh("H2(g) + 1/2 O2(g) -> H2O(x)"); }, ErrorKind::syntax, false},
        {"only an arrow", [] { return eng().dh("->"); }, ErrorKind::syntax, true},
        {"no arrow", [] { return eng().dh("H2 + O2"); }, ErrorKind::syntax, true},
        {"two arrows", [] { return eng().dh("H2 -> H2 -> H2"); }, ErrorKind::syntax, true},
        {"zero denominator", [] { return eng().dh("H2 + 1/0 O2 -> H2O"); }, ErrorKind::syntax, false},
        {"invalid UTF-8", [] { return eng().dh("H2 + O2 \xff\xfe-> H2O"); }, ErrorKind::syntax, false},
        {"NUL inside", [] { return eng().dh(std::string_view("H2\0 + O2 -> H2O", 15)); }, ErrorKind::syntax, false},
    };
    double slowest = 0;
    std::string slowest_what;
    for (const auto& c : cases) {
        auto o = attempt(c.f);
        INFO(c.what << ": value " << o.value << ", kind " << kind_name(o.kind) << ", message: " << o.message);
        REQUIRE_ENGINE_ERROR(o);                                 // DEVELOPERS.md, Working rules: bad input gets a clear error
        CHECK_FALSE(o.message.empty());                          // an error in words
        if (c.check_kind) CHECK(o.kind == c.kind);               // rxnheat.hpp ErrorKind
        CHECK(o.kind != ErrorKind::internal);                    // bad input is not a bug
        CHECK(o.seconds < 1.0);                                  // issue 2: never hangs
        if (o.seconds > slowest) { slowest = o.seconds; slowest_what = c.what; }
    }
    WARN("slowest bad-input call: " << slowest << " s (" << slowest_what << ")");
    // RXNCHECK never throws and gives words for bad reaction text.
    for (const std::string& r : {std::string(), parens, too_long, std::string("->"), std::string("H2 + 1/0 O2 -> H2O"),
                                 std::string("H2 + O2 \xff\xfe-> H2O")}) {
        const std::string said = eng().check(r);
        INFO("check said: " << said);
        CHECK(said != "ok");       // engine/FUNCTIONS.md, RXNCHECK
        CHECK_FALSE(said.empty()); // in words
    }
    // Legal but extreme inputs: a finite number or rxnheat::Error, quickly.
    const std::vector<std::pair<const char*, std::function<double()>>> extreme = {
        {"huge coefficients", [] { return eng().dh("99999999999999999999999999999 H2 + 99999999999999999999999999999/2 O2 -> 99999999999999999999999999999 H2O"); }},
        {"huge count", [] { return eng().molar_mass("C99999999999999999999"); }},
        {"deep nesting", [] { return eng().molar_mass(std::string(2000, '(') + "H" + std::string(2000, ')')); }},
        {"deep nesting in a reaction", [] { return eng().dh(std::string(2000, '[') + "H2" + std::string(2000, ']') + " -> H2"); }},
        {"many terms", [] { std::string r = "H2"; for (int i = 0; i < 600; ++i) r += " + H2"; return eng().dh(r + " -> 601 H2"); }},
    };
    for (const auto& [what, f] : extreme) {
        auto o = attempt(f);
        INFO(what << ": value " << o.value << ", message " << o.message << ", " << o.seconds << " s");
        CHECK((o.engine_error || (o.returned && std::isfinite(o.value))));  // rxnheat.hpp contract
        CHECK(o.seconds < 1.0);  // never hangs
    }
    // Exactly 4096 characters is allowed (grammar/SYNTAX.md: longer than 4096 is refused).
    CHECK(eng().dh(long_ok) == Approx(eng().dh("H2(g) + 1/2 O2(g) -> H2O(l)")).margin(1e-9));  // grammar/SYNTAX.md limit
    auto over = attempt([&] { return eng().dh(long_ok + " "); });
    REQUIRE_ENGINE_ERROR(over);
    CHECK(over.kind == ErrorKind::too_long);  // grammar/SYNTAX.md: 4097 characters refused
}

TEST_CASE("random byte strings: a finite number or rxnheat::Error, quickly", "[behaviour][robust][fuzz]") {
    std::mt19937 rng(20261201u);  // fixed seed
    const std::string alphabet = "CHONSFeClKMgCaAlSi()[]{}+-^=<>→⇌·*/.0123456789 glsaqcr½⁺⁻²³₂₄";
    const std::vector<std::string> pieces = {"H2", "O2", "H2O", "(g)", "(l)", "(s)", "(aq)", " + ", " -> ", "=",
                                             "CH4", "2 ", "1/2 ", "Fe^3+", "OH-", "·5H2O", "Ca(OH)2", "[", "]",
                                             "(", ")", "e-", "⇌", "→", "CO2", "0.5 ", "ethanol", " ", "^", "{2+}"};
    int n_value = 0, n_error = 0, n_other = 0, n_nonfinite = 0;
    double slowest = 0;
    std::string slowest_input;
    std::vector<std::string> bad;
    const int N = 3000;
    for (int i = 0; i < N; ++i) {
        std::string s;
        const int mode = i % 3;
        const int len = static_cast<int>(rng() % (i % 97 == 0 ? 4200 : 60));
        for (int k = 0; k < len; ++k) {
            if (mode == 0) s.push_back(static_cast<char>(rng() % 256));                 // raw bytes
            else if (mode == 1) s.push_back(alphabet[rng() % alphabet.size()]);          // chemistry bytes (may split UTF-8)
            else s += pieces[rng() % pieces.size()];                                     // chemistry tokens
        }
        const std::vector<std::function<Outcome()>> calls = {
            [&] { return attempt([&] { return eng().dh(s); }); },
            [&] { return attempt([&] { return eng().dh(s, 1000, "MJ/kmol"); }); },
            [&] { return attempt([&] { return eng().du(s); }); },
            [&] { return attempt([&] { return eng().species_hf(s); }); },
            [&] { return attempt([&] { return eng().species_h(s, 800); }); },
            [&] { return attempt([&] { return eng().molar_mass(s); }); },
            [&] { return attempt([&] { return eng().load(s, 1, "kmol/h", "H2(g)"); }); },
            [&] { return attempt([&] { return eng().load(CH4_COMB, 1, "kmol/h", s); }); },
            [&] { return attempt([&] { return eng().dh(CH4_COMB, 298.15, s); }); },
            [&] { return attempt([&] { return eng().balance(s); }); },
            [&] { return attempt([&] { return eng().reverse(s); }); },
            [&] { return attempt([&] { return eng().scale(s, "2"); }); },
            [&] { return attempt([&] { return eng().scale(CH4_COMB, s); }); },
            [&] { return attempt([&] { return eng().kind(s); }); },
            [&] { return attempt([&] { return eng().source(s); }); },
            [&] { return attempt([&] { return rxnheat::parse_temperature(s); }); },
            [&] { return attempt([&] { return eng().check(s); }); },
        };
        for (const auto& call : calls) {
            const Outcome o = call();
            if (o.seconds > slowest) { slowest = o.seconds; slowest_input = s.substr(0, 80); }
            if (o.engine_error) ++n_error;
            else if (o.other_exception) { ++n_other; if (bad.size() < 10) bad.push_back(s.substr(0, 80) + " => " + o.message); }
            else if (o.text.empty() && !std::isfinite(o.value)) { ++n_nonfinite; if (bad.size() < 10) bad.push_back(s.substr(0, 80) + " => non-finite"); }
            else ++n_value;
        }
    }
    std::string first_bad;
    for (const auto& b : bad) first_bad += "\n  " + b;
    WARN("fuzz: " << N << " inputs x 17 calls: " << n_value << " values, " << n_error << " rxnheat::Error, "
         << n_other << " other exceptions, " << n_nonfinite << " non-finite; slowest call " << slowest << " s");
    INFO("first offending inputs:" << first_bad);
    CHECK(n_other == 0);      // rxnheat.hpp: every function returns a value or throws rxnheat::Error
    CHECK(n_nonfinite == 0);  // DEVELOPERS.md, Working rules: never a non-number
    CHECK(slowest < 1.0);     // issue 2: never hangs
}

TEST_CASE("threads give the same values as one thread", "[behaviour][threads]") {
    const std::vector<std::pair<std::string, double>> mix = {
        {CH4_COMB, 298.15},
        {"CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000},
        {"N2(g) + 3 H2(g) -> 2 NH3(g)", 700},
        {"CaCO3(s) -> CaO(s) + CO2(g)", 1173},
        {"Fe2O3(s) + 3 CO(g) -> 2 Fe(s) + 3 CO2(g)", 1100},
        {"SO2(g) + 1/2 O2(g) -> SO3(g)", 700},
        {"CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", 1100},
        {"CO2(g) + 3 H2(g) -> CH3OH(g) + H2O(g)", 523},
        {"C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)", 800},
        {"H2(g) + O2(g) -> H2O(l)", 298.15},  // an error, the same in every thread
    };
    // Single-threaded reference values (text form so errors compare too).
    auto evaluate = [](const std::string& r, double T) {
        try {
            std::ostringstream os;
            os.precision(17);
            os << eng().dh(r, T) << '|' << eng().du(r, T) << '|' << eng().check(r, T);
            return os.str();
        } catch (const rxnheat::Error& e) {
            return std::string("error: ") + e.what();
        }
    };
    std::vector<std::string> expected;
    for (const auto& [r, T] : mix) expected.push_back(evaluate(r, T));
    constexpr int threads = 4, calls = 2000;
    std::atomic<int> mismatches{0};
    std::vector<std::string> first_mismatch(threads);
    std::vector<std::thread> pool;
    for (int t = 0; t < threads; ++t) {
        pool.emplace_back([&, t] {
            for (int i = 0; i < calls; ++i) {
                const std::size_t k = static_cast<std::size_t>(i * 7 + t * 3) % mix.size();
                // every 16th call a fresh text (whitespace varies) so parsing runs concurrently too
                std::string text = mix[k].first;
                if (i % 16 == 0) text += std::string(static_cast<std::size_t>(1 + (i / 16) % 50 + t * 50), ' ');
                const std::string got = evaluate(text, mix[k].second);
                if (got != expected[k]) {
                    if (mismatches++ == 0) first_mismatch[t] = text + " => " + got + " vs " + expected[k];
                }
            }
        });
    }
    for (auto& th : pool) th.join();
    std::string why;
    for (const auto& m : first_mismatch) why += m;
    INFO(why);
    CHECK(mismatches.load() == 0);  // rxnheat.hpp: all functions are thread-safe
}

TEST_CASE("the cache is invisible: same text, same value", "[behaviour][cache]") {
    const double first = eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000);
    CHECK(eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) == first);           // issue 2: cache keyed by text
    CHECK(eng().dh("CO(g)+H2O(g)->CO2(g)+H2(g)", 1000) == Approx(first).margin(1e-12));   // grammar/SYNTAX.md: whitespace is free
    CHECK(eng().dh("  CO(g) + H2O(g)  =  CO2(g) + H2(g) ", 1000) == Approx(first).margin(1e-12));  // grammar/SYNTAX.md: arrows mean the same
    // Many distinct texts (beyond any reasonable cache bound), then the first again.
    for (int i = 0; i < 5000; ++i) eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)" + std::string(static_cast<std::size_t>(i % 3000 + 1), ' '), 700 + i % 5);
    CHECK(eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) == first);  // issue 2: eviction does not change values
    // The same text at another temperature is another value (the key is not the temperature).
    CHECK(eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 700) != Approx(first).margin(0.5));  // Kirchhoff: ΔCp ≠ 0, so ΔH(700) ≠ ΔH(1000)
    // A bad text fails the same way twice.
    const std::string a = eng().check("H2(g) + O2(g) -> H2O(l)");
    CHECK(eng().check("H2(g) + O2(g) -> H2O(l)") == a);  // issue 2: cached errors repeat
}
