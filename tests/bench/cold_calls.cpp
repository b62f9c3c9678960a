// N cold calls of one kind, for counting instructions per call with callgrind: the engine and
// its species memo warmed with 5,000 new texts, then N more, each new (the texts of bench_engine's
// cold benchmarks, cold_texts.hpp), through the engine's usual 4,096-entry cache, which by then
// evicts an entry on every call. tests/bench/marginal_instructions.sh runs it twice under
// callgrind with two values of N: the difference of the totals over the difference of the calls
// is the cost of one call, with nothing done once (loading the data, building the texts) in it.
// The texts are built for all 64,000 whatever N, so their building cancels out too.
//
//   build/tests/bench/cold_calls dh|balance N [REACTION [T_K]]
#include <rxnheat/rxnheat.hpp>

#include "cold_texts.hpp"

#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <vector>

int main(int argc, char** argv) {
    if (argc < 3 || (std::strcmp(argv[1], "dh") != 0 && std::strcmp(argv[1], "balance") != 0)) {
        std::fprintf(stderr, "usage: cold_calls dh|balance N [REACTION [T_K]]\n");
        return 2;
    }
    const bool balance = std::strcmp(argv[1], "balance") == 0;
    const std::size_t n = std::strtoul(argv[2], nullptr, 10);
    const std::size_t warm = 5000;
    if (n == 0 || n + warm > 64000) {
        std::fprintf(stderr, "cold_calls: N from 1 to %zu (the texts must all be new)\n", std::size_t(64000) - warm);
        return 2;
    }
    const std::string reaction = argc > 3 ? argv[3]
                                 : balance ? "C3H8 + O2 -> CO2 + H2O"
                                           : "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";
    const double T_K = argc > 4 ? std::atof(argv[4]) : 298.15;
    // All 64,000 texts, whatever N: building them is then the same work in both runs.
    std::vector<std::string> texts;
    texts.reserve(64000);
    for (std::size_t k = 0; k < 64000; ++k) texts.push_back(rxnheat::bench::unique_text(reaction, k));
    auto& engine = rxnheat::Engine::shared();
    double sink = 0;
    for (std::size_t k = 0; k < warm + n; ++k)
        sink += balance ? double(engine.balance(texts[k]).size()) : engine.dh(texts[k], T_K);
    std::printf("%zu %s calls (checksum %.6g)\n", warm + n, argv[1], sink);
    return 0;
}
