// Helpers shared by the libFuzzer targets of fuzz/: how an input's bytes become host arguments,
// and a byte-exact fingerprint of a Result (numbers by their bits, so -0.0, NaN payloads and
// the last bit all count) for the fuzzers' own consistency checks.
#pragma once

#include "rxnheat/catalogue.hpp"

#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat::fuzz {

/// Stops the run as a finding (libFuzzer saves the input that got here).
[[noreturn]] inline void fail(const char* what, const std::string& detail) {
    std::fprintf(stderr, "rxnheat fuzz finding: %s\n%s\n", what, detail.c_str());
    std::abort();
}

/// The input's lines (split at '\n'; the last line may lack its line end).
inline std::vector<std::string_view> lines(std::string_view input) {
    std::vector<std::string_view> out;
    for (;;) {
        std::size_t nl = input.find('\n');
        out.push_back(input.substr(0, nl));
        if (nl == std::string_view::npos) break;
        input.remove_prefix(nl + 1);
    }
    return out;
}

/// One cell as a host hands it over: "=<number>" is a number (strtod, so "=nan", "=1e-320",
/// "=-0" all reach the engine), "~" an empty cell, anything else text as it is.
inline Cell cell_of(std::string_view field) {
    if (field == "~") return Cell{};
    if (!field.empty() && field[0] == '=') {
        std::string digits(field.substr(1));
        return Cell::of(std::strtod(digits.c_str(), nullptr));
    }
    return Cell::of(std::string(field));
}

/// One argument: an empty field is omitted; "|row|row…" is a range whose rows are split at '|'
/// and cells at ';' (short rows padded with empty cells, as a spreadsheet range is
/// rectangular); anything else is one cell.
inline Arg arg_of(std::string_view field) {
    if (field.empty()) return Arg::omitted();
    if (field[0] != '|') return Arg::of(cell_of(field));
    std::vector<std::vector<Cell>> grid;
    std::size_t cols = 1;
    std::string_view rest = field.substr(1);
    for (;;) {
        std::size_t bar = rest.find('|');
        std::string_view row = rest.substr(0, bar);
        std::vector<Cell> cells;
        for (;;) {
            std::size_t semi = row.find(';');
            cells.push_back(cell_of(row.substr(0, semi)));
            if (semi == std::string_view::npos) break;
            row.remove_prefix(semi + 1);
        }
        if (cells.size() > cols) cols = cells.size();
        grid.push_back(std::move(cells));
        if (bar == std::string_view::npos) break;
        rest.remove_prefix(bar + 1);
    }
    std::vector<Cell> flat;
    flat.reserve(grid.size() * cols);
    for (auto& row : grid) {
        row.resize(cols);
        for (auto& c : row) flat.push_back(std::move(c));
    }
    return Arg::range(grid.size(), cols, std::move(flat));
}

inline std::string bits_of(double x) {
    unsigned long long u;
    std::memcpy(&u, &x, sizeof u);
    char buf[32];
    std::snprintf(buf, sizeof buf, "%016llx", u);
    return buf;
}

/// Everything a host could show of one Outcome, numbers by their bits.
inline std::string fingerprint(const Outcome& o) {
    std::string s = std::to_string(static_cast<int>(o.kind)) + ":";
    switch (o.kind) {
    case Outcome::Kind::empty: break;
    case Outcome::Kind::number: s += bits_of(o.number) + " " + o.unit; break;
    case Outcome::Kind::text: s += o.text; break;
    case Outcome::Kind::error:
        s += std::to_string(static_cast<int>(o.error)) + "@" + std::to_string(o.argument) + " " + o.text;
        break;
    }
    return s;
}

inline std::string fingerprint(const Result& r) {
    std::string s = std::to_string(r.rows) + "x" + std::to_string(r.cols) + "\n";
    for (const auto& o : r.cells) s += fingerprint(o) + "\n";
    return s;
}

}  // namespace rxnheat::fuzz
