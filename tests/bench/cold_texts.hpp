// New reaction texts for the cold benchmarks (bench_engine.cpp, cold_allocations.cpp): the same
// reaction with spaces inserted, so that every text misses the engine's cache of prepared
// reactions while its parse, species and data stay those of the reaction.
#pragma once

#include <cstddef>
#include <string>

namespace rxnheat::bench {

/// A text that is the reaction with spaces inserted after its first species, after the arrow and
/// at the end, their counts spelling `k` in base 40: distinct texts for k < 64,000.
inline std::string unique_text(const std::string& base, std::size_t k) {
    const std::size_t a = k % 40, b = (k / 40) % 40, c = (k / 1600) % 40;
    std::string s = base;
    const auto first_space = s.find(' ');
    const auto arrow = s.find("->");
    std::string out;
    out.reserve(s.size() + a + b + c);
    out += s.substr(0, first_space);
    out += std::string(a, ' ');
    out += s.substr(first_space, arrow + 2 - first_space);
    out += std::string(b, ' ');
    out += s.substr(arrow + 2);
    out += std::string(c, ' ');
    return out;
}

}  // namespace rxnheat::bench
