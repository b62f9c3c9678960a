// Benchmarks of the rxnheat engine through its public API (Google Benchmark).
//
//  cold    parse + resolve + evaluate: every iteration's text is new (spaces are inserted at
//          three places: 64,000 distinct texts of nearly equal length, built before timing), so
//          the engine's cache of prepared reactions misses.
//  cold_dh_small_cache  cold with a 256-entry cache: what the cold path costs when the entry it
//          evicts is still in the processor's caches (see BM_cold_dh_small_cache).
//  cached  the same text again and again: the cache hits and only the evaluation at T runs.
//  load, balance, check, species_h: typical cell functions on cached text.
//  floor   what a cached evaluation cannot avoid, measured in the same run for the ratios
//          (scripts/bench): `floor/hash_lookup` finds the reaction text in a hash table of 4,096
//          texts (hash the text, compare it once: a cache hit can do no less), and
//          `floor/nasa_4_species` evaluates four NASA 7-term H°/RT polynomials (one shared ln T) and
//          sums them with coefficients (the arithmetic ΔrH° of a four-species reaction needs
//          when each species keeps its own data). Their sum is the floor of a cached dh.
#include <benchmark/benchmark.h>

#include <rxnheat/catalogue.hpp>
#include <rxnheat/rxnheat.hpp>

#include "cold_texts.hpp"

#include <algorithm>
#include <cmath>
#include <cstddef>
#include <functional>
#include <string_view>
#include <unordered_map>
#include <string>
#include <utility>
#include <vector>

namespace {

struct Typical {
    const char* name;
    const char* text;
    double T;
};

const Typical typical[] = {
    {"CH4_combustion_298K", "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)", 298.15},
    {"water_gas_shift_1000K", "CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000},
    {"ammonia_synthesis_700K", "N2(g) + 3 H2(g) -> 2 NH3(g)", 700},
    {"calcination_1173K", "CaCO3(s) -> CaO(s) + CO2(g)", 1173},
};

using rxnheat::bench::unique_text;

/// 64,000 distinct texts of one reaction, built before timing.
const std::vector<std::string>& unique_texts(const std::string& base) {
    static std::vector<std::pair<std::string, std::vector<std::string>>> all;
    for (const auto& p : all)
        if (p.first == base) return p.second;
    std::vector<std::string> v;
    v.reserve(64000);
    for (std::size_t k = 0; k < 64000; ++k) v.push_back(unique_text(base, k));
    all.emplace_back(base, std::move(v));
    return all.back().second;
}

void BM_cold_dh(benchmark::State& state, const Typical* r) {
    auto& e = rxnheat::Engine::shared();
    const auto& texts = unique_texts(r->text);
    // The position carries over between runs, so repetitions do not revisit recent texts (the
    // engine's cache holds far fewer than 64,000 entries).
    static std::size_t counter = 0;
    for (auto _ : state) benchmark::DoNotOptimize(e.dh(texts[counter++ % texts.size()], r->T));
    state.SetItemsProcessed(state.iterations());
}

/// cold_dh with the cache held to 256 entries: the same work (every text new, every call also
/// evicts the oldest entry), but the entries evicted were made moments ago and are still in the
/// processor's caches. With the usual 4,096 entries each eviction frees an entry last touched
/// thousands of calls earlier, whose parts are read from memory: the difference between the two
/// is that memory traffic, which instruction counts do not show.
void BM_cold_dh_small_cache(benchmark::State& state, const Typical* r) {
    rxnheat::EngineOptions options;
    options.prepared_cache_entries = 256;
    static rxnheat::Engine e(options);
    const auto& texts = unique_texts(r->text);
    static std::size_t counter = 0;
    for (auto _ : state) benchmark::DoNotOptimize(e.dh(texts[counter++ % texts.size()], r->T));
    state.SetItemsProcessed(state.iterations());
}

void BM_cached_dh(benchmark::State& state, const Typical* r) {
    auto& e = rxnheat::Engine::shared();
    const std::string text = r->text;
    e.dh(text, r->T);  // warm the cache
    for (auto _ : state) benchmark::DoNotOptimize(e.dh(text, r->T));
    state.SetItemsProcessed(state.iterations());
}

void BM_cached_report(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    const std::string text = "CO(g) + H2O(g) -> CO2(g) + H2(g)";
    e.report(text, 1000);
    for (auto _ : state) benchmark::DoNotOptimize(e.report(text, 1000));
    state.SetItemsProcessed(state.iterations());
}

void BM_load_kg_per_h(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    const std::string text = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";
    e.load(text, 1000, "kg/h", "CH4(g)", "MW");
    for (auto _ : state) benchmark::DoNotOptimize(e.load(text, 1000, "kg/h", "CH4(g)", "MW"));
    state.SetItemsProcessed(state.iterations());
}

void BM_load_Nm3_per_h_1000K(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    const std::string text = "CO(g) + H2O(g) -> CO2(g) + H2(g)";
    e.load(text, 5000, "Nm3/h", "CO(g)", "kW", 1000);
    for (auto _ : state) benchmark::DoNotOptimize(e.load(text, 5000, "Nm3/h", "CO(g)", "kW", 1000));
    state.SetItemsProcessed(state.iterations());
}

void BM_balance_cached(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    const std::string text = "KMnO4 + HCl -> KCl + MnCl2 + Cl2 + H2O";
    e.balance(text);
    for (auto _ : state) benchmark::DoNotOptimize(e.balance(text));
    state.SetItemsProcessed(state.iterations());
}

void BM_balance_cold(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    const auto& texts = unique_texts("C3H8 + O2 -> CO2 + H2O");
    static std::size_t counter = 0;
    for (auto _ : state) benchmark::DoNotOptimize(e.balance(texts[counter++ % texts.size()]));
    state.SetItemsProcessed(state.iterations());
}

void BM_check_cached(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    const std::string text = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";
    e.check(text);
    for (auto _ : state) benchmark::DoNotOptimize(e.check(text));
    state.SetItemsProcessed(state.iterations());
}

void BM_check_unbalanced(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    const std::string text = "H2(g) + O2(g) -> H2O(l)";
    e.check(text);
    for (auto _ : state) benchmark::DoNotOptimize(e.check(text));
    state.SetItemsProcessed(state.iterations());
}

void BM_species_h(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    e.species_h("CO2(g)", 1000);
    for (auto _ : state) benchmark::DoNotOptimize(e.species_h("CO2(g)", 1000));
    state.SetItemsProcessed(state.iterations());
}

void BM_molar_mass(benchmark::State& state) {
    auto& e = rxnheat::Engine::shared();
    for (auto _ : state) benchmark::DoNotOptimize(e.molar_mass("CuSO4·5H2O"));
    state.SetItemsProcessed(state.iterations());
}

void BM_floor_hash_lookup(benchmark::State& state) {
    // 4,096 distinct texts of the typical length (the engine cache's default entry count).
    const auto& texts = unique_texts("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)");
    std::unordered_map<std::string_view, double> table;
    for (std::size_t k = 0; k < 4096; ++k) table.emplace(texts[k], static_cast<double>(k));
    const std::string text = texts[123];
    for (auto _ : state) {
        benchmark::DoNotOptimize(text.data());
        const auto it = table.find(std::string_view(text));
        benchmark::DoNotOptimize(it->second);
    }
    state.SetItemsProcessed(state.iterations());
}

void BM_floor_nasa_4_species(benchmark::State& state) {
    // H°/RT = -a1/T² + a2 ln(T)/T + a3 + a4 T/2 + a5 T²/3 + a6 T³/4 + a7 T⁴/5 + b1/T (NASA 7-term
    // form, NASA/TP-2002-211556). The coefficient values do not change the time; these are
    // arbitrary numbers of the usual magnitudes, not data.
    double a[4][8];
    for (int i = 0; i < 4; ++i)
        for (int j = 0; j < 8; ++j) a[i][j] = (j + 1) * 0.37 * (i + 1) * std::pow(10.0, -3.0 * (j > 2 ? j - 2 : 0));
    const double nu[4] = {-1, -2, 1, 2};
    double T = 1000;
    for (auto _ : state) {
        benchmark::DoNotOptimize(T);
        double h = 0;
        const double lnT = std::log(T);  // one logarithm shared by the species
        for (int i = 0; i < 4; ++i) {
            const double* c = a[i];
            const double hrt = -c[0] / (T * T) + c[1] * lnT / T + c[2] +
                               T * (c[3] / 2 + T * (c[4] / 3 + T * (c[5] / 4 + T * c[6] / 5))) + c[7] / T;
            h += nu[i] * hrt * 8.31446261815324 * T;
        }
        benchmark::DoNotOptimize(h);
    }
    state.SetItemsProcessed(state.iterations());
}

/// A user species table of 10,000 rows as a Calc range passes it (header and 9,999 invented
/// alkane rows, values of the usual magnitudes, not data).
const std::vector<rxnheat::Cell>& big_table_cells() {
    using rxnheat::Cell;
    static const std::vector<Cell> cells = [] {
        std::vector<Cell> c;
        for (const char* h : {"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"}) c.push_back(Cell::of(std::string(h)));
        for (int i = 21; i < 10020; ++i) {
            c.push_back(Cell::of("C" + std::to_string(i) + "H" + std::to_string(2 * i + 2)));
            c.push_back(Cell::of(std::string("g")));
            for (double x : {-100.0 - i * 0.01, 200.0, 30.0, 200.0, 1000.0}) c.push_back(Cell::of(x));
        }
        return c;
    }();
    return cells;
}

// RXNDH through the catalogue with a 10,000-row table range, the table already read: what one
// cell of a sheet that names such a table pays beyond the reaction (finding the table by its cells).
void BM_table_range_dh(benchmark::State& state) {
    const auto& cells = big_table_cells();
    const rxnheat::FunctionSpec* f = rxnheat::find_function("RXNDH");
    rxnheat::HostRules calc;
    calc.zero_is_blank = true;
    const std::vector<rxnheat::Arg> args{rxnheat::Arg::of(std::string("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)")),
                                         rxnheat::Arg::of(400.0), rxnheat::Arg::omitted(), rxnheat::Arg::omitted(),
                                         rxnheat::Arg::range(10000, 7, cells)};
    rxnheat::evaluate(*f, args, calc);  // reads the table once
    for (auto _ : state) benchmark::DoNotOptimize(rxnheat::evaluate(*f, args, calc));
    state.SetItemsProcessed(state.iterations());
}

// Its floor: one comparison of the range's 70,000 cells with a kept copy (without an identity
// from the host, a table found by content costs at least this).
void BM_floor_compare_10000_rows(benchmark::State& state) {
    const auto& cells = big_table_cells();
    const std::vector<rxnheat::Cell> kept = cells;
    const auto same = [](const rxnheat::Cell& a, const rxnheat::Cell& b) {
        return a.kind == b.kind && a.number == b.number && a.text == b.text;
    };
    for (auto _ : state) benchmark::DoNotOptimize(std::equal(cells.begin(), cells.end(), kept.begin(), kept.end(), same));
    state.SetItemsProcessed(state.iterations());
}

int register_all() {
    benchmark::RegisterBenchmark("floor/hash_lookup", BM_floor_hash_lookup);
    benchmark::RegisterBenchmark("floor/nasa_4_species", BM_floor_nasa_4_species);
    for (const auto& r : typical) {
        benchmark::RegisterBenchmark((std::string("cold_dh/") + r.name).c_str(), BM_cold_dh, &r);
        benchmark::RegisterBenchmark((std::string("cached_dh/") + r.name).c_str(), BM_cached_dh, &r);
    }
    benchmark::RegisterBenchmark("cold_dh_small_cache/CH4_combustion_298K", BM_cold_dh_small_cache, &typical[0]);
    benchmark::RegisterBenchmark("cached_report/water_gas_shift_1000K", BM_cached_report);
    benchmark::RegisterBenchmark("load/CH4_kg_per_h_to_MW", BM_load_kg_per_h);
    benchmark::RegisterBenchmark("load/CO_Nm3_per_h_1000K", BM_load_Nm3_per_h_1000K);
    benchmark::RegisterBenchmark("balance_cached/KMnO4_HCl", BM_balance_cached);
    benchmark::RegisterBenchmark("balance_cold/C3H8_O2", BM_balance_cold);
    benchmark::RegisterBenchmark("check_cached/ok", BM_check_cached);
    benchmark::RegisterBenchmark("check_cached/unbalanced", BM_check_unbalanced);
    benchmark::RegisterBenchmark("species_h/CO2_1000K", BM_species_h);
    benchmark::RegisterBenchmark("molar_mass/CuSO4_5H2O", BM_molar_mass);
    benchmark::RegisterBenchmark("floor/compare_10000_rows", BM_floor_compare_10000_rows);
    benchmark::RegisterBenchmark("table_range/dh_10000_rows", BM_table_range_dh);
    return 0;
}

}  // namespace

int main(int argc, char** argv) {
    // First use builds the embedded data index; do it before timing anything.
    rxnheat::Engine::shared().dh("H2(g) + 1/2 O2(g) -> H2O(l)");
    register_all();
    benchmark::Initialize(&argc, argv);
    if (benchmark::ReportUnrecognizedArguments(argc, argv)) return 1;
    benchmark::RunSpecifiedBenchmarks();
    benchmark::Shutdown();
    return 0;
}
