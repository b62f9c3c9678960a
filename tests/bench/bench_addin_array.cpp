// Where the Calc add-in's array path spends its time, without an office (Google Benchmark).
//
// {=RXNDH(A1:A20000)} reaches the add-in as one sequence< sequence< any > > of 20,000 texts and
// goes back as one of 20,000 numbers. This times the add-in's own code on real UNO values (the
// SDK's cppu/sal, as tests/addin_rules does), stage by stage, beside the do-nothing add-in's
// reading of the same sequence (tests/bench/noop_addin/noop_args.cpp, with the loop of
// noop.cpp's benchNoop), so that each stage's cost is seen against the floor:
//
//   noop_array      the do-nothing add-in: classify, trim, UTF-16 -> UTF-8, 0.0 per element
//   to_arg          UNO range -> the catalogue's cells (rxnheat::addin::to_arg)
//   evaluate        the catalogue's spreading and the engine (rxnheat::evaluate), cells given
//   answer          the whole add-in call (to_arg + evaluate + the result back to UNO)
//   cells           20,000 single-cell calls of the add-in (answer on one text each)
//
// 20 reactions repeated 1,000 times ("mix", as tests/bench/bench_addin.py's sheet): the engine's
// cache holds every one, so what is left is conversion, allocation and the cached evaluation.
//   ./build/tests/bench/bench_addin_array --benchmark_repetitions=5 --benchmark_report_aggregates_only=true
#include "noop_args.hpp"
#include "uno_values.hpp"

#include <benchmark/benchmark.h>

#include <rxnheat/catalogue.hpp>

#include <string>
#include <vector>

namespace {

namespace uno = ::com::sun::star::uno;
using Rows = uno::Sequence<uno::Sequence<uno::Any>>;

constexpr int n_rows = 20000;

// The reactions of bench_addin.py's mix sheet (any 20 cached reactions serve).
const char* const reactions[] = {
    "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)", "2 H2(g) + O2(g) -> 2 H2O(l)", "CO(g) + H2O(g) -> CO2(g) + H2(g)",
    "N2(g) + 3 H2(g) -> 2 NH3(g)", "CaCO3(s) -> CaO(s) + CO2(g)", "C(s) + O2(g) -> CO2(g)",
    "2 CO(g) + O2(g) -> 2 CO2(g)", "CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", "C2H6(g) + 7/2 O2(g) -> 2 CO2(g) + 3 H2O(l)",
    "C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)", "2 SO2(g) + O2(g) -> 2 SO3(g)", "N2O4(g) -> 2 NO2(g)",
    "4 NH3(g) + 5 O2(g) -> 4 NO(g) + 6 H2O(g)", "H2(g) + Cl2(g) -> 2 HCl(g)", "C2H4(g) + H2(g) -> C2H6(g)",
    "CO2(g) + H2(g) -> CO(g) + H2O(g)", "2 NO(g) + O2(g) -> 2 NO2(g)", "CH3OH(g) -> CO(g) + 2 H2(g)",
    "C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)", "H2O(l) -> H2O(g)"};

const Rows& mix_range() {
    static const Rows rows = [] {
        Rows r(n_rows);
        for (int i = 0; i < n_rows; ++i) {
            uno::Sequence<uno::Any> row(1);
            row.getArray()[0] = uno::Any(rxnheat::addin::from_utf8(reactions[i % 20]));
            r.getArray()[i] = row;
        }
        return r;
    }();
    return rows;
}

const rxnheat::FunctionSpec& rxndh() { return *rxnheat::find_function("RXNDH"); }

// --- the floor: benchNoop's loop over the range (tests/bench/noop_addin/noop.cpp) -------------
uno::Any noop_element(const uno::Any& cell) {
    using rxnheat_addin::Given;
    const Given kind = rxnheat_addin::classify(cell);
    if (kind == Given::nothing) return uno::Any();
    if (kind != Given::text) return uno::Any(rxnheat_addin::error_element(false));
    ::rtl::OUString s;
    cell >>= s;
    const ::rtl::OUString t = s.trim();
    if (t.isEmpty()) return uno::Any();
    benchmark::DoNotOptimize(rxnheat_addin::to_utf8(t));
    return uno::Any(0.0);
}

void noop_array(benchmark::State& state) {
    const uno::Any in(mix_range());
    for (auto _ : state) {
        Rows rows;
        in >>= rows;
        Rows out(rows.getLength());
        for (sal_Int32 r = 0; r < rows.getLength(); ++r) {
            uno::Sequence<uno::Any> result(rows[r].getLength());
            for (sal_Int32 c = 0; c < rows[r].getLength(); ++c) result.getArray()[c] = noop_element(rows[r][c]);
            out.getArray()[r] = result;
        }
        benchmark::DoNotOptimize(uno::Any(out));
    }
    state.SetItemsProcessed(state.iterations() * n_rows);
}
BENCHMARK(noop_array)->Unit(benchmark::kMillisecond);

// --- the add-in, stage by stage ----------------------------------------------------------------
void to_arg(benchmark::State& state) {
    const uno::Any in(mix_range());
    for (auto _ : state) benchmark::DoNotOptimize(rxnheat::addin::to_arg(in, "reaction"));
    state.SetItemsProcessed(state.iterations() * n_rows);
}
BENCHMARK(to_arg)->Unit(benchmark::kMillisecond);

void evaluate(benchmark::State& state) {
    const std::vector<rxnheat::Arg> args{rxnheat::addin::to_arg(uno::Any(mix_range()), "reaction")};
    const rxnheat::HostRules rules = rxnheat::addin::calc_rules();
    rxnheat::evaluate(rxndh(), args, rules);  // warm the engine's cache
    for (auto _ : state) benchmark::DoNotOptimize(rxnheat::evaluate(rxndh(), args, rules));
    state.SetItemsProcessed(state.iterations() * n_rows);
}
BENCHMARK(evaluate)->Unit(benchmark::kMillisecond);

void answer(benchmark::State& state) {
    const uno::Any in(mix_range()), none;
    rxnheat::addin::answer(rxndh(), {&in, &none, &none, &none, &none});
    for (auto _ : state) benchmark::DoNotOptimize(rxnheat::addin::answer(rxndh(), {&in, &none, &none, &none, &none}));
    state.SetItemsProcessed(state.iterations() * n_rows);
}
BENCHMARK(answer)->Unit(benchmark::kMillisecond);

void cells(benchmark::State& state) {
    const Rows& rows = mix_range();
    const uno::Any none;
    for (auto _ : state)
        for (sal_Int32 i = 0; i < n_rows; ++i)
            benchmark::DoNotOptimize(rxnheat::addin::answer(rxndh(), {&rows[i][0], &none, &none, &none, &none}));
    state.SetItemsProcessed(state.iterations() * n_rows);
}
BENCHMARK(cells)->Unit(benchmark::kMillisecond);

}  // namespace

BENCHMARK_MAIN();
