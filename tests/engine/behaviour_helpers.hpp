// Helpers shared by the engine behaviour tests (test_dh.cpp, test_load.cpp, test_kind_check.cpp,
// test_balance_text.cpp, test_species.cpp, test_robustness.cpp): the outside tools they check
// against, and attempt(), which captures a value or the error of one call.
//
// Outside references used at test time:
//  - GNU units (Debian package `units`, run as `units -d 15 -t FROM TO`) for every unit factor
//    and for R (`R` = k·N_A, exact in the 2019 SI).
//  - IUPAC atomic weights through Debian's python3-periodictable (`/usr/bin/python3`).
//  - data/nasa-glenn/thermo.inp record headers (ΔfH° in J/mol) where a value of the data set
//    itself is the point of the check (aliases pick the right record).
#pragma once

#include <catch2/catch.hpp>

#include <rxnheat/rxnheat.hpp>

#include <array>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <limits>
#include <sstream>
#include <string>
#include <type_traits>
#include <vector>

namespace rxnheat_test {

using rxnheat::ErrorKind;

inline rxnheat::Engine& eng() { return rxnheat::Engine::shared(); }

// ---- outside tools ---------------------------------------------------------------------------

inline std::string run_command(const std::string& cmd, int* status = nullptr) {
    std::string out;
    FILE* p = popen(cmd.c_str(), "r");
    if (!p) return out;
    std::array<char, 4096> buf{};
    std::size_t n;
    while ((n = std::fread(buf.data(), 1, buf.size(), p)) > 0) out.append(buf.data(), n);
    const int st = pclose(p);
    if (status) *status = st;
    return out;
}

/// GNU units: how many `to` in one `from` (or the value of a nonlinear unit such as tempF(60)).
inline double gnu_units(const std::string& from, const std::string& to) {
    int st = -1;
    const std::string out = run_command("units -d 15 -t '" + from + "' '" + to + "' 2>&1", &st);
    INFO("units -t '" << from << "' '" << to << "' said: " << out);
    REQUIRE(st == 0);
    return std::stod(out);
}

/// Molar masses from python3-periodictable (IUPAC atomic weights), one call for all formulas.
inline std::vector<double> periodictable_masses(const std::vector<std::string>& formulas) {
    std::string cmd = "/usr/bin/python3 -c 'import sys, periodictable as p\n"
                      "for f in sys.argv[1:]: print(repr(p.formula(f).mass))'";
    for (const auto& f : formulas) cmd += " '" + f + "'";
    int st = -1;
    const std::string out = run_command(cmd + " 2>&1", &st);
    INFO("python3-periodictable said: " << out);
    REQUIRE(st == 0);
    std::vector<double> v;
    std::istringstream in(out);
    std::string line;
    while (std::getline(in, line)) v.push_back(std::stod(line));
    REQUIRE(v.size() == formulas.size());
    return v;
}

inline double R_gnu() {
    static const double r = gnu_units("R", "J/mol/K");  // GNU units: R = k N_A
    return r;
}

// ---- error capture -----------------------------------------------------------------------------

struct Outcome {
    bool returned = false;
    double value = std::numeric_limits<double>::quiet_NaN();
    std::string text;
    bool engine_error = false;
    ErrorKind kind = ErrorKind::internal;
    bool other_exception = false;
    std::string message;
    double seconds = 0;
};

template <class F>
Outcome attempt(F&& f) {
    Outcome o;
    const auto t0 = std::chrono::steady_clock::now();
    try {
        using R = decltype(f());
        if constexpr (std::is_same_v<R, double>) {
            o.value = f();
        } else if constexpr (std::is_same_v<R, rxnheat::HeatKind>) {
            o.text = rxnheat::to_string(f());
        } else {
            o.text = f();
        }
        o.returned = true;
    } catch (const rxnheat::Error& e) {
        o.engine_error = true;
        o.kind = e.kind();
        o.message = e.what();
    } catch (const std::exception& e) {
        o.other_exception = true;
        o.message = e.what();
    } catch (...) {
        o.other_exception = true;
        o.message = "(non-standard exception)";
    }
    o.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
    return o;
}

inline bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

inline const char* kind_name(ErrorKind k) {
    switch (k) {
        case ErrorKind::syntax: return "syntax";
        case ErrorKind::too_long: return "too_long";
        case ErrorKind::unknown_species: return "unknown_species";
        case ErrorKind::ambiguous_species: return "ambiguous_species";
        case ErrorKind::phase: return "phase";
        case ErrorKind::out_of_range: return "out_of_range";
        case ErrorKind::unbalanced: return "unbalanced";
        case ErrorKind::unit: return "unit";
        case ErrorKind::argument: return "argument";
        case ErrorKind::table: return "table";
        case ErrorKind::internal: return "internal";
    }
    return "?";
}

#define REQUIRE_ENGINE_ERROR(o)                                                                   \
    do {                                                                                          \
        INFO("returned=" << (o).returned << " value=" << (o).value << " text='" << (o).text       \
             << "' other_exception=" << (o).other_exception << " message: " << (o).message);      \
        REQUIRE((o).engine_error);                                                                \
    } while (0)

inline constexpr const char* CH4_COMB = "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)";

}  // namespace rxnheat_test
