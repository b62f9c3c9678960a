// libFuzzer target: the engine's full entry, as every host reaches it — a function of the
// catalogue and its arguments (reaction, temperature text, unit text, any further argument)
// through rxnheat::evaluate() and rxnheat::why().
//
// Input: line 1 names the function (Calc name, IDL method or CLI command: "RXNDH", "dh"); a name
// that is no function picks one by its bytes, so every mutation still reaches a function.
// Characters after a space on line 1 choose the host rules: 'z' a blank cell is 0 (Calc), 't'
// text in a number argument is a number (the CLI). Each further line is one argument in Calc
// order (fuzz_common.hpp: empty = omitted, "=1e3" a number, "~" an empty cell, "|a;b|c;d" a
// range). Example: "RXNDH\nCH4 + 2 O2 -> CO2 + 2 H2O\n350 C\nMJ/kg\nCH4".
//
// Findings besides crashes and sanitizer reports: anything but a Result leaving evaluate() or
// why() (bad_alloc aside); a second, cached evaluation that differs from the first by any bit;
// why() saying "ok" for a call that failed, or a failure for a call that did not.
#include "fuzz_common.hpp"

#include <cstdint>
#include <new>

using namespace rxnheat;

namespace {

const FunctionSpec& pick(std::string_view name) {
    if (const FunctionSpec* f = find_function(name)) return *f;
    std::uint32_t h = 2166136261u;  // FNV-1a of the name
    for (unsigned char c : name) h = (h ^ c) * 16777619u;
    return catalogue()[h % catalogue().size()];
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    static Engine engine{EngineOptions{}};
    std::string_view input(reinterpret_cast<const char*>(data), size);
    auto fields = fuzz::lines(input);
    std::string_view head = fields[0];
    HostRules rules;
    std::size_t space = head.find(' ');
    if (space != std::string_view::npos) {
        std::string_view flags = head.substr(space + 1);
        rules.zero_is_blank = flags.find('z') != std::string_view::npos;
        rules.text_numbers = flags.find('t') != std::string_view::npos;
        head = head.substr(0, space);
    }
    const FunctionSpec& f = pick(head);
    std::vector<Arg> args;
    for (std::size_t i = 1; i < fields.size(); ++i) args.push_back(fuzz::arg_of(fields[i]));

    // Each input from an empty cache, so that a finding reproduces from its input alone.
    engine.clear_cache();
    try {
        const Result cold = evaluate(f, args, rules, engine);
        const Result warm = evaluate(f, args, rules, engine);
        const std::string a = fuzz::fingerprint(cold), b = fuzz::fingerprint(warm);
        if (a != b) fuzz::fail("a cached evaluation differs from the first", a + "----\n" + b);
        const std::string w = why(f, args, rules, engine);
        if (!f.errors_as_text) {
            bool failed = false;
            for (const auto& o : cold.cells) failed = failed || o.kind == Outcome::Kind::error;
            if (failed == (w == "ok"))
                fuzz::fail("why() disagrees with evaluate()", "why: " + w + "\n" + a);
        }
    } catch (const std::bad_alloc&) {
        // Allowed by the interface; libFuzzer's own memory limits report runaway allocations.
    }
    return 0;
}
