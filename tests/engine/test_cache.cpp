// The cache of prepared reactions and user tables (issue 10, item 1): a result is never shared
// between two tables unless their content is the same, no cell text can forge another table's
// identity, and the cache's memory stays within a byte bound however large the tables are.
//
// Row values are our own test values (invented rows for XeF6; elements are 0 by definition), so
// each expected number is the table's own cell, not a value from an outside source.
#include <catch2/catch.hpp>

#include "rxnheat/rxnheat.hpp"

#include <malloc.h>

#include <atomic>
#include <cstddef>
#include <cstdio>
#include <string>
#include <thread>
#include <vector>

using rxnheat::Engine;
using rxnheat::SpeciesTable;

namespace {
const char* const XEF6 = "Xe(g) + 3 F2(g) -> XeF6(g)";

// Bytes the allocator has handed out and not taken back (glibc: small blocks plus mmapped ones).
std::size_t heap_in_use() {
    const struct mallinfo2 m = mallinfo2();
    return m.uordblks + m.hblkhd;
}
}  // namespace

TEST_CASE("cache: a header renamed (S to cp) is another table", "[cache][usertable]") {
    Engine e(rxnheat::EngineOptions{64});
    const auto with_s = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-279", "300"}});
    const auto with_cp = SpeciesTable::from_rows({{"formula", "phase", "dHf", "cp"}, {"XeF6", "g", "-279", "300"}});
    // ΔrS° with the S column: the row's S minus the built-in Xe(g) and F2(g) (NASA Glenn).
    const double ds = e.ds(XEF6, {rxnheat::T_ref, &with_s});
    CHECK(ds < 300);  // 300 J/(mol·K) minus the reactants' entropies
    // The same cells under "cp": the row gives no entropy, so ΔrS° is an error, not the first
    // table's number.
    CHECK_THROWS_AS(e.ds(XEF6, {rxnheat::T_ref, &with_cp}), rxnheat::Error);
    CHECK(e.ds(XEF6, {rxnheat::T_ref, &with_s}) == ds);
}

TEST_CASE("cache: columns swapped are another table", "[cache][usertable]") {
    Engine e(rxnheat::EngineOptions{64});
    const auto a = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-279", "300"}});
    const auto b = SpeciesTable::from_rows({{"formula", "phase", "S", "dHf"}, {"XeF6", "g", "-279", "300"}});
    CHECK(e.dh(XEF6, {rxnheat::T_ref, &a}) == Approx(-279).margin(1e-9));
    CHECK(e.dh(XEF6, {rxnheat::T_ref, &b}) == Approx(300).margin(1e-9));
    CHECK(e.dh(XEF6, {rxnheat::T_ref, &a}) == Approx(-279).margin(1e-9));
}

TEST_CASE("cache: no cell text forges another table's identity", "[cache][usertable]") {
    Engine e(rxnheat::EngineOptions{64});
    // The cells joined without separators read the same ("XeF6g-279300") in both tables.
    const auto a = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-279", "300"}});
    const auto b = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-27", "9300"}});
    CHECK(e.dh(XEF6, {rxnheat::T_ref, &a}) == Approx(-279).margin(1e-9));
    CHECK(e.dh(XEF6, {rxnheat::T_ref, &b}) == Approx(-27).margin(1e-9));
    // Joined with commas and line ends, a cell holding ",", a line end or a length prefix would
    // read as other cells: here a name cell "x\n4:XeF6" against a row that really has those cells.
    const auto c = SpeciesTable::from_rows(
        {{"formula", "phase", "dHf", "name"}, {"XeF6", "g", "-279", "x\n4:XeF6,1:g,4:-100,0:"}});
    const auto d = SpeciesTable::from_rows(
        {{"formula", "phase", "dHf", "name"}, {"XeF6", "g", "-279", "x"}, {"XeF6", "g", "-100", ""}});
    CHECK(c.fingerprint() != d.fingerprint());
    CHECK(e.dh(XEF6, {rxnheat::T_ref, &c}) == Approx(-279).margin(1e-9));
    // d has XeF6(g) twice; the first row wins (engine/DATA.md, User tables)
    CHECK(e.source(XEF6, {rxnheat::T_ref, &d}).find("row 2") != std::string::npos);
    // A blank row between the header and a row moves the row's number (which the messages and
    // sources cite): the two tables are not the same table.
    const auto one = SpeciesTable::from_rows({{"formula", "phase", "dHf"}, {"XeF6", "g", "-279"}});
    const auto two = SpeciesTable::from_rows({{"formula", "phase", "dHf"}, {"", "", ""}, {"XeF6", "g", "-279"}});
    const std::string s1 = e.source(XEF6, {rxnheat::T_ref, &one});
    const std::string s2 = e.source(XEF6, {rxnheat::T_ref, &two});
    INFO(s1 << "\n" << s2);
    CHECK(s1.find("user species table row 2") != std::string::npos);
    CHECK(s2.find("user species table row 3") != std::string::npos);
}

TEST_CASE("cache: a byte bound smaller than one entry caches nothing, and values stay right", "[cache][memory]") {
    Engine e(rxnheat::EngineOptions{64, 100});
    const double a = e.dh("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)");
    CHECK(e.cache_stats().entries == 0);
    CHECK(e.cache_stats().bytes == 0);
    CHECK(e.dh("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)") == a);
    CHECK(a == Engine::shared().dh("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)"));
}

TEST_CASE("cache: the same content in a new table object still hits", "[cache][usertable]") {
    Engine e(rxnheat::EngineOptions{64});
    const auto a = SpeciesTable::from_rows({{"formula", "phase", "dHf"}, {"XeF6", "g", "-279"}});
    const double first = e.dh(XEF6, {rxnheat::T_ref, &a});
    const auto a2 = SpeciesTable::from_rows({{"formula", "phase", "dHf"}, {"XeF6", "g", "-279"}});
    const std::size_t hits = e.cache_stats().hits;
    CHECK(e.dh(XEF6, {rxnheat::T_ref, &a2}) == first);
    CHECK(e.cache_stats().hits == hits + 1);
}

TEST_CASE("cache: memory stays bounded with multi-MB tables and hundreds of reactions", "[cache][memory]") {
    // 200 tables of 1 MiB each (a long source cell), each used for one reaction and then dropped
    // by the caller: the cache must not keep them alive.
    const std::string big(std::size_t(1) << 20, 's');
    const std::size_t before = heap_in_use();
    {
        Engine e(rxnheat::EngineOptions{4096});
        for (int i = 0; i < 200; ++i) {
            const auto t = SpeciesTable::from_rows(
                {{"formula", "phase", "dHf", "source"}, {"XeF6", "g", std::to_string(-200 - i), big}});
            CHECK(e.dh(XEF6, {rxnheat::T_ref, &t}) == Approx(-200 - i).margin(1e-9));
        }
        // One table of ≈ 5 MB (5 long source cells) and 300 distinct reactions on it.
        std::vector<std::vector<std::string>> rows{{"formula", "phase", "dHf", "source"}};
        for (int k = 0; k < 5; ++k) rows.push_back({"XeF" + std::to_string(k + 1), "g", std::to_string(-50 * (k + 1)), big});
        const auto t5 = SpeciesTable::from_rows(rows);
        for (int i = 0; i < 300; ++i) {
            const std::string r = "Xe(g) +" + std::string(static_cast<std::size_t>(i + 1), ' ') + "3 F2(g) -> XeF6(g)";
            CHECK_THROWS_AS(e.dh(r, {rxnheat::T_ref, &t5}), rxnheat::Error);  // XeF6 is not in t5
            const std::string r2 = "Xe(g) +" + std::string(static_cast<std::size_t>(i + 1), ' ') + "F2(g) -> XeF2(g)";
            CHECK(e.dh(r2, {rxnheat::T_ref, &t5}) == Approx(-100).margin(1e-9));
        }
        const auto stats = e.cache_stats();
        INFO("cache: " << stats.entries << " entries, " << stats.bytes << " bytes (bound " << stats.byte_capacity << ")");
        CHECK(stats.byte_capacity == std::size_t(32) << 20);  // EngineOptions' default
        CHECK(stats.bytes <= stats.byte_capacity);
        CHECK(stats.bytes > 0);
        CHECK(stats.entries > 10);  // bounded, not emptied: small entries stay
        const std::size_t held = heap_in_use() - before;
        INFO("heap held by the engine with its cache: " << held << " bytes");
        // The table t5 itself (≈ 5 MiB of cells, kept twice: cells and identity) plus a cache
        // within its 32 MiB default bound, plus allocator slack.
        CHECK(held < std::size_t(56) << 20);
    }
}

TEST_CASE("cache: threads hitting, missing and evicting give one thread's values", "[cache][threads]") {
    // A small cache (eviction all the time) shared by 4 threads over 48 texts and 3 tables
    // (two of the same content in different objects), against values from a cache-less engine.
    Engine shared(rxnheat::EngineOptions{16});
    Engine reference(rxnheat::EngineOptions{0});
    const auto t1 = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-279", "300"}});
    const auto t2 = SpeciesTable::from_rows({{"formula", "phase", "S", "dHf"}, {"XeF6", "g", "-279", "300"}});
    const auto t1b = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S"}, {"XeF6", "g", "-279", "300"}});
    const SpeciesTable* tables[] = {nullptr, &t1, &t2, &t1b};
    std::vector<std::string> texts;
    for (int i = 0; i < 16; ++i) {
        const std::string pad(static_cast<std::size_t>(i), ' ');
        texts.push_back("CO(g) + H2O(g) ->" + pad + " CO2(g) + H2(g)");
        texts.push_back("Xe(g) + 3 F2(g) ->" + pad + " XeF6(g)");
        texts.push_back("N2(g) + 3 H2(g) ->" + pad + " 2 NH3(g)");
    }
    const double temps[] = {298.15, 500, 1000};
    auto value = [](Engine& e, const std::string& r, double T, const SpeciesTable* t) {
        try {
            return std::to_string(e.dh(r, {T, t}));
        } catch (const rxnheat::Error& err) {
            return std::string(err.what());
        }
    };
    std::vector<std::string> expected;
    for (const auto& r : texts)
        for (double T : temps)
            for (const auto* t : tables) expected.push_back(value(reference, r, T, t));
    std::atomic<int> mismatches{0};
    std::vector<std::thread> pool;
    for (int k = 0; k < 4; ++k)
        pool.emplace_back([&, k] {
            for (int n = 0; n < 3000; ++n) {
                const std::size_t i = static_cast<std::size_t>(n * 7 + k * 13) % expected.size();
                const std::size_t r = i / (3 * 4), T = (i / 4) % 3, t = i % 4;
                if (value(shared, texts[r], temps[T], tables[t]) != expected[i]) ++mismatches;
            }
        });
    for (auto& th : pool) th.join();
    CHECK(mismatches.load() == 0);
    const auto s = shared.cache_stats();
    CHECK(s.entries <= 16);
    CHECK(s.hits + s.misses == 12000);
}

// The species memo keeps an unbalanced reaction's compositions without data (engine/src/
// reaction.cpp): a later balanced reaction of the same species must still find its data, and
// get the same value as an engine that never saw the unbalanced text.
TEST_CASE("cache: species first met in an unbalanced reaction still get their data", "[cache]") {
    Engine e(rxnheat::EngineOptions{64});
    CHECK(e.check("H2(g) + O2(g) -> H2O(l)").find("not balanced") != std::string::npos);
    CHECK(e.balance("H2(g) + O2(g) -> H2O(l)") == "2 H2(g) + O2(g) -> 2 H2O(l)");
    const double warm = e.dh("2 H2(g) + O2(g) -> 2 H2O(l)", 500);
    Engine fresh(rxnheat::EngineOptions{64});
    CHECK(warm == fresh.dh("2 H2(g) + O2(g) -> 2 H2O(l)", 500));
    CHECK(warm == Engine(rxnheat::EngineOptions{0}).dh("2 H2(g) + O2(g) -> 2 H2O(l)", 500));  // no cache, no memo
    // A species with no data met first unbalanced, then balanced: the error names it.
    CHECK(e.check("Xe(g) + F2(g) -> XeF6(g)").find("not balanced") != std::string::npos);
    CHECK_THROWS_AS(e.dh(XEF6), rxnheat::Error);
}

// A cached reaction evaluated again at a temperature other than 298.15 K uses each species' NASA
// interval found once per temperature segment (engine/src/reaction.hpp, Prepared::segments),
// built at its second evaluation; its first, and every evaluation without a cache, goes species
// by species through their records. The two paths must give the same bits (same arithmetic), and
// the same errors, at every temperature: inside intervals, at their common ends (1000 K) and a
// hair beside them, and at or beyond the ends of the data.
TEST_CASE("cache: a cached reaction's later evaluations equal its first bit for bit", "[cache]") {
    Engine uncached(rxnheat::EngineOptions{0, 0});
    Engine cached(rxnheat::EngineOptions{});
    const char* const reactions[] = {
        "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)",
        "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)",
        "CO(g) + H2O(g) -> CO2(g) + H2(g)",
        "N2(g) + 3 H2(g) -> 2 NH3(g)",
        "CaCO3(s) -> CaO(s) + CO2(g)",
    };
    const double temperatures[] = {100,  200,  250,    298.15, 300,          350,  373.15,  500,
                                   999.999, 1000, 1000.000001, 1500, 3000, 5999, 6000, 6000.1, 20000};
    // The value, or the error's message: both paths must agree on either.
    auto outcome = [](auto&& f) -> std::string {
        try {
            const double v = f();
            char buf[40];
            std::snprintf(buf, sizeof buf, "%a", v);  // every bit
            return buf;
        } catch (const rxnheat::Error& e) {
            return std::string("error: ") + e.what();
        }
    };
    int values = 0;
    for (const char* r : reactions)
        for (const double T : temperatures) {
            const std::string h = outcome([&] { return uncached.dh(r, T); });
            const std::string s = outcome([&] { return uncached.ds(r, T); });
            const std::string g = outcome([&] { return uncached.dg(r, T); });
            values += h.rfind("error", 0) != 0;
            for (int k = 0; k < 3; ++k) {  // first (per species), then from the segments
                INFO(r << " at " << T << " K, evaluation " << k + 1);
                CHECK(outcome([&] { return cached.dh(r, T); }) == h);
                CHECK(outcome([&] { return cached.ds(r, T); }) == s);
                CHECK(outcome([&] { return cached.dg(r, T); }) == g);
            }
        }
    CHECK(values >= 40);  // most of the temperatures have data: the comparison is of numbers

    // Threads meeting a new reaction at once: one builds the segments, the others wait for it or
    // take the per-species path; every result is the same.
    const std::string ref = outcome([&] { return uncached.dh("C2H6(g) + 3.5 O2(g) -> 2 CO2(g) + 3 H2O(g)", 1200); });
    std::atomic<int> wrong{0};
    std::vector<std::thread> threads;
    for (int t = 0; t < 4; ++t)
        threads.emplace_back([&] {
            for (int i = 0; i < 200; ++i)
                if (outcome([&] { return cached.dh("C2H6(g) + 3.5 O2(g) -> 2 CO2(g) + 3 H2O(g)", 1200); }) != ref)
                    ++wrong;
        });
    for (auto& th : threads) th.join();
    CHECK(wrong == 0);
    CHECK(ref.rfind("error", 0) != 0);
}

// Species arguments (RXNLOAD's key, RXNDH's `per`) are parsed once per text and kept per thread
// for the last few texts (engine.cpp, parse_one_species): every answer must be the one a fresh
// parse gives, with more texts than are kept, errors among them and phases that differ.
TEST_CASE("cache: kept parses of species arguments give the answers of a fresh parse", "[cache]") {
    Engine& e = Engine::shared();
    const char* r = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";
    const double dh_kJ = e.dh(r);  // per mole of reaction as written (NASA Glenn data)
    // 1000 mol of the key: ΔrH° · 1000 / |ν| in kJ, ν by construction of the reaction text.
    struct Key {
        const char* text;
        double nu;  // 0: not a species of the reaction (an error, every time)
    };
    const Key keys[] = {{"CH4(g)", 1}, {"O2", 2},     {"N2", 0},  {"CO2(g)", 1}, {"H2O", 2},
                        {"H2O(g)", 0}, {"O2(g)", 2},  {"C(", 0},  {"CH4", 1},    {"H2O(l)", 2}};
    for (int round = 0; round < 3; ++round)
        for (const Key& k : keys) {
            INFO("round " << round << ", key " << k.text);
            if (k.nu == 0) {
                // An error, worded as a fresh parse words it (on a new thread nothing is kept).
                std::string here, fresh;
                try {
                    e.load(r, 1000, "mol", k.text, "kJ");
                } catch (const rxnheat::Error& x) {
                    here = x.what();
                }
                std::thread([&] {
                    try {
                        e.load(r, 1000, "mol", k.text, "kJ");
                    } catch (const rxnheat::Error& x) {
                        fresh = x.what();
                    }
                }).join();
                CHECK_FALSE(here.empty());
                CHECK(here == fresh);
                continue;
            }
            CHECK(e.load(r, 1000, "mol", k.text, "kJ") == Approx(dh_kJ * 1000 / k.nu).epsilon(1e-12));
            // And `per` through the same kept parses: ΔrH° per mole of the species.
            CHECK(e.dh(r, rxnheat::Conditions{}, "kJ/mol", k.text) == Approx(dh_kJ / k.nu).epsilon(1e-12));
        }
}

// check() reads the error a prepared reaction keeps (a composition, balance or data error)
// without throwing it; its answer must be the message dh() throws, on a first call and a cached one.
TEST_CASE("cache: check() answers a kept error exactly as dh() throws it", "[cache]") {
    Engine& e = Engine::shared();
    const char* kept[] = {
        "H2(g) + O2(g) -> H2O(l)",     // unbalanced
        "Qx + H2 -> QxH2",             // no such element
        "Xe(g) + 3 F2(g) -> XeF6(g)",  // no data for XeF6(g) without a table
    };
    for (const char* r : kept)
        for (int call = 0; call < 2; ++call) {
            INFO(r << ", call " << call);
            std::string thrown;
            try {
                e.dh(r);
            } catch (const rxnheat::Error& x) {
                thrown = x.what();
            }
            REQUIRE_FALSE(thrown.empty());
            CHECK(e.check(r) == thrown);
        }
    CHECK(e.check("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)") == "ok");
}

// Species arguments of SPECIESH, SPECIESCP, SPECIESS, SPECIESHF, the species report and a
// stream's species are resolved through the species memo that reactions fill (engine.cpp,
// Engine::Impl::resolve): every answer, and every error, must be the one of an engine without
// a cache (and so without a memo) — on first sight, on later calls, and for a species the memo
// first met in an unbalanced reaction, which holds its composition but no data.
TEST_CASE("cache: species functions through the species memo answer as an engine without one", "[cache]") {
    Engine e(rxnheat::EngineOptions{64});
    Engine none(rxnheat::EngineOptions{0});
    CHECK(e.check("H2(g) + O2(g) -> H2O(l)").find("not balanced") != std::string::npos);  // memo: composition only
    const char* species[] = {"H2(g)", "O2(g)", "CO2(g)", "H2O", "H2O(l)", "CH4", "N2",
                             "Xx",    "H2O(q)", "XeF6(g)", "C(", "  CO2(g) "};
    const auto answer = [](Engine& engine, const char* s, double T) {
        std::string out;
        const auto add = [&](auto&& f) {
            try {
                char buf[64];
                std::snprintf(buf, sizeof buf, "%.17g|", f());
                out += buf;
            } catch (const rxnheat::Error& x) {
                out += std::string("error: ") + x.what() + "|";
            }
        };
        add([&] { return engine.species_h(s, T); });
        add([&] { return engine.species_cp(s, T); });
        add([&] { return engine.species_s(s, T); });
        add([&] { return engine.species_hf(s, T); });
        add([&] { return engine.species_report(s, T).molar_mass_g_per_mol; });
        add([&] { return engine.stream_enthalpy({{s, 2.0}}, "mol/s", "kW", T); });
        return out;
    };
    for (int round = 0; round < 2; ++round)
        for (const char* s : species)
            for (double T : {298.15, 500.0, 1500.0}) {
                INFO("round " << round << ", " << s << " at " << T << " K");
                CHECK(answer(e, s, T) == answer(none, s, T));
            }
    // And a reaction after the species functions filled the memo: the same value as without.
    CHECK(e.dh("CH4 + 2 O2(g) -> CO2(g) + 2 H2O(l)", 500) == none.dh("CH4 + 2 O2(g) -> CO2(g) + 2 H2O(l)", 500));
}
