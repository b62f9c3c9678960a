// libFuzzer target: the reaction grammar alone (grammar/parse.hpp), on any bytes — a whole
// reaction, one species and one number, as the engine calls them.
//
// Findings besides crashes and sanitizer reports: any exception but grammar::ParseError (and
// bad_alloc); an error position beyond the text; a parsed term or species whose position lies
// outside the text; an atom count that is not positive.
#include "grammar/parse.hpp"

#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <new>
#include <string>

namespace g = rxnheat::grammar;

namespace {

[[noreturn]] void fail(const char* what, std::size_t value, std::size_t limit) {
    std::fprintf(stderr, "rxnheat fuzz finding: %s (%zu, limit %zu)\n", what, value, limit);
    std::abort();
}

// Characters (code points) of valid UTF-8, else bytes: positions count characters.
std::size_t characters(std::string_view s) {
    std::size_t n = 0;
    for (unsigned char b : s) n += (b & 0xC0) != 0x80;
    return n;
}

void check_species(const g::Species& s, std::size_t chars) {
    if (s.position == 0 || s.position > chars) fail("species position outside the text", s.position, chars);
    for (const auto& a : s.atoms) {
        if (a.count <= 0) fail("an atom count that is not positive", a.position, chars);
        if (a.position == 0 || a.position > chars) fail("atom position outside the text", a.position, chars);
    }
}

template <class F>
void guarded(std::size_t chars, F&& parse) {
    try {
        parse();
    } catch (const g::ParseError& e) {
        // Position 0 is the whole text; otherwise at most one past its last character.
        if (e.position() > chars + 1) fail("error position beyond the text", e.position(), chars + 1);
    } catch (const std::bad_alloc&) {
    }
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    std::string_view text(reinterpret_cast<const char*>(data), size);
    const std::size_t chars = characters(text);
    guarded(chars, [&] {
        g::Reaction r = g::parse_reaction(text);
        for (const auto* side : {&r.reactants, &r.products})
            for (const auto& t : *side) {
                if (t.position == 0 || t.position > chars) fail("term position outside the text", t.position, chars);
                check_species(t.species, chars);
            }
    });
    guarded(chars, [&] { check_species(g::parse_species(text), chars); });
    guarded(chars, [&] { (void)g::parse_number(text); });
    return 0;
}
