// Errors and the small text helpers every layer shares.
#include "rxnheat/rxnheat.h"
#include "rxnheat/rxnheat.hpp"

#include <charconv>
#include <cstdio>

namespace rxnheat {

Error::Error(ErrorKind kind, const std::string& message) : std::runtime_error(message), kind_(kind) {}

namespace {
// The one table of error kinds: in ErrorKind's order (checked by the index below).
constexpr ErrorKindInfo error_kinds[] = {
    {ErrorKind::syntax, "syntax", RXNHEAT_E_SYNTAX, false},
    {ErrorKind::too_long, "too_long", RXNHEAT_E_TOO_LONG, false},
    {ErrorKind::unknown_species, "unknown_species", RXNHEAT_E_UNKNOWN_SPECIES, false},
    {ErrorKind::ambiguous_species, "ambiguous_species", RXNHEAT_E_AMBIGUOUS_SPECIES, false},
    {ErrorKind::phase, "phase", RXNHEAT_E_PHASE, false},
    {ErrorKind::out_of_range, "out_of_range", RXNHEAT_E_OUT_OF_RANGE, false},
    {ErrorKind::unbalanced, "unbalanced", RXNHEAT_E_UNBALANCED, false},
    {ErrorKind::unit, "unit", RXNHEAT_E_UNIT, false},
    {ErrorKind::argument, "argument", RXNHEAT_E_ARGUMENT, false},
    {ErrorKind::table, "table", RXNHEAT_E_TABLE, false},
    {ErrorKind::internal, "internal", RXNHEAT_E_INTERNAL, true},
};
constexpr bool in_enum_order() {
    for (std::size_t i = 0; i < std::size(error_kinds); ++i)
        if (static_cast<std::size_t>(error_kinds[i].kind) != i) return false;
    return true;
}
static_assert(in_enum_order() && std::size(error_kinds) == static_cast<std::size_t>(ErrorKind::internal) + 1,
              "error_kinds must list every ErrorKind in its order");
}  // namespace

const ErrorKindInfo& error_kind_info(ErrorKind kind) noexcept {
    const auto i = static_cast<std::size_t>(kind);
    return i < std::size(error_kinds) ? error_kinds[i] : error_kinds[std::size(error_kinds) - 1];
}

const char* to_string(HeatKind kind) noexcept {
    switch (kind) {
    case HeatKind::exothermic: return "exothermic";
    case HeatKind::endothermic: return "endothermic";
    case HeatKind::thermoneutral: return "thermoneutral";
    }
    return "thermoneutral";
}

std::string_view trim(std::string_view s) noexcept {
    auto blank = [](char c) { return c == ' ' || c == '\t' || c == '\r' || c == '\n'; };
    while (!s.empty() && blank(s.front())) s.remove_prefix(1);
    while (!s.empty() && blank(s.back())) s.remove_suffix(1);
    return s;
}

std::string exact_number(double x) {
    // Shortest text that reads back as the same double, fixed or scientific, whichever is
    // shorter (300, 298.15, -890.5629..., 1e+21).
    char buf[64];
    const auto r = std::to_chars(buf, buf + sizeof buf, x);
    return std::string(buf, r.ptr);
}

std::string number_words(double x) {
    char buf[40];
    std::snprintf(buf, sizeof buf, "%.10g", x);
    return buf;
}

}  // namespace rxnheat
