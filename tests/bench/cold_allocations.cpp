// Heap allocations per cold call: how many blocks one parse + resolve + evaluate of a new reaction
// text asks of the allocator (each is paid again when the cache evicts the reaction). Replaces the
// global operator new with a counting one, warms the engine (its data, the species memo) with 100
// texts, then counts over N more, each new: the same reaction with spaces inserted at three
// places (cold_texts.hpp), as bench_engine's cold benchmarks do. Results:
// tests/bench/RESULTS-engine.md, Cold path.
//
//   build/tests/bench/cold_allocations [N]      (default 3000)
#include <rxnheat/rxnheat.hpp>

#include "cold_texts.hpp"

#include <atomic>
#include <cstdio>
#include <cstdlib>
#include <new>
#include <string>
#include <vector>

namespace {
std::atomic<bool> counting{false};
std::atomic<long> allocations{0};
}  // namespace

void* operator new(std::size_t n) {
    if (counting.load(std::memory_order_relaxed)) allocations.fetch_add(1, std::memory_order_relaxed);
    if (void* p = std::malloc(n ? n : 1)) return p;
    throw std::bad_alloc();
}
void operator delete(void* p) noexcept { std::free(p); }
void operator delete(void* p, std::size_t) noexcept { std::free(p); }

int main(int argc, char** argv) {
    const std::size_t n = argc > 1 ? std::strtoul(argv[1], nullptr, 10) : 3000;
    if (n == 0 || n > 60000) {
        std::fprintf(stderr, "cold_allocations: N from 1 to 60000\n");
        return 2;
    }
    auto& engine = rxnheat::Engine::shared();
    struct Case {
        const char* what;
        std::string reaction;
        double T_K;  ///< for dh
        bool balance;
    };
    const Case cases[] = {{"dh, CH4 combustion at 298.15 K", "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)", 298.15, false},
                          {"dh, water-gas shift at 1000 K", "CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000, false},
                          {"balance, C3H8 + O2", "C3H8 + O2 -> CO2 + H2O", 0, true}};
    for (const auto& c : cases) {
        std::vector<std::string> texts;
        for (std::size_t k = 0; k < n + 100; ++k) texts.push_back(rxnheat::bench::unique_text(c.reaction, k));
        double sink = 0;
        for (std::size_t k = 0; k < texts.size(); ++k) {
            if (k == 100) {
                allocations = 0;
                counting = true;
            }
            if (c.balance)
                sink += double(engine.balance(texts[k]).size());
            else
                sink += engine.dh(texts[k], c.T_K);
        }
        counting = false;
        std::printf("%-34s %6.2f allocations per call (%zu new texts; checksum %.6g)\n", c.what,
                    double(allocations.load()) / double(n), n, sink);
    }
}
