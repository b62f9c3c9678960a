// Issue 10, items 2 and 4: every public function driven with hostile inputs (several hundred
// generated here, plus every file of a fuzz corpus when one is there) throws nothing but
// rxnheat::Error (or std::bad_alloc), never reports an internal error for bad input, and
// check() says exactly what the numeric functions throw.
//
// The corpus: every file under $RXNHEAT_FUZZ_CORPUS (folders separated by ':'), or else under
// fuzz/corpus and tests/fuzz-corpus of the source tree when they exist; each file's whole text
// and each of its lines (split at line feeds and NULs) is one input. At most 2000 of these inputs
// are taken (in file order), so that the suite stays quick; $RXNHEAT_FUZZ_CORPUS_MAX sets another
// limit (0: all).
#include "behaviour_helpers.hpp"

#include <rxnheat/catalogue.hpp>
#include <rxnheat/csv.hpp>
#include <rxnheat/rxnheat.h>

#include <cfloat>
#include <cmath>
#include <cstdint>
#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <functional>
#include <memory>
#include <set>
#include <sstream>
#include <string>
#include <typeinfo>
#include <vector>

using namespace rxnheat_test;
using rxnheat::Arg;
using rxnheat::ArgKind;
using rxnheat::Cell;
using rxnheat::Conditions;
using rxnheat::FeedItem;
using rxnheat::HessStep;
using rxnheat::SpeciesTable;

namespace {

// ---- the inputs ---------------------------------------------------------------------------------

const std::vector<std::string>& numbers() {
    static const std::vector<std::string> v = {
        "0", "-0", "+0", "0.0", "1", "-1", "2", "0.5", "1/2", "½", "1/0", "0/0", "-1/2", "1e-320", "4.9e-324",
        "2.2250738585072014e-308", "1e-400", "-1e-400", "1e308", "1.7976931348623157e308", "1e309", "1e400",
        "-1e308", "nan", "NaN", "-nan", "inf", "-inf", "Infinity", "1e13", "1e-7", "999999999999", "9999999999999",
        "0.9999999", "1.0000001", "0x10", "1,5", "1.5.5", "1e", "e5", ".", "-", "+", "1e+", "1_000", "٣",
        "１", "1\xC2\xA0" "000", "\xE2\x88\x92" "5", "12345678901234567890", "0.000000000001", "1e-12",
    };
    return v;
}

const std::vector<std::string>& temperatures() {
    static const std::vector<std::string> v = {
        "298.15", "0 K", "-273.15 C", "-459.67 F", "0 R", "1e-310 K", "1e-400 K", "350 C", "1e308 F", "1e308 K",
        "NaN K", "inf C", "500", "200 K", "6000 K", "20000 K", "1e5 K", "25 \xC2\xB0" "C", "350 k", "350,5 C",
        "-1 K", "1e-300 K", "298.15 K K",
    };
    return v;
}

const std::vector<std::string>& units() {
    static const std::vector<std::string> v = {
        "", "kJ/mol", "J/mol", "kcal/mol", "BTU/lbmol", "MJ/kmol", "kJ/kg", "MJ/kg", "BTU/lb", "J/(mol\xC2\xB7K)",
        "kJ/(mol*K)", "J/mol/K", "cal/(mol.K)", "mol", "kmol/h", "kg/h", "t/d", "Nm3/h", "scf/min", "lb/s", "kW",
        "MW", "BTU/h", "TR", "kJ", "kWh", "MMBTU", "therm", "MJ/Nm3", "BTU/scf", "kJ/furlong", "KJ/MOL", "kj/mol",
        "kJ /mol", "kJ/mol ", "/", "//", "kJ/", "/mol", "\xC2\xB7", "J/(mol\xC2\xB7K", "kg/h/h", "mol/s/s",
    };
    return v;
}

const std::vector<std::string>& species() {
    static const std::vector<std::string> v = {
        "H2O", "H2O(l)", "H2O(g)", "H2O(s)", "H2O(aq)", "H2O0.9999999", "H2O1.0000001", "H1.9999999O", "CH4",
        "CH4(g)", "O2", "O3", "CO2", "N2", "NH3", "C", "C(s)", "C(gr)", "Fe", "Fe(s)", "e-", "H+", "OH-", "SO4^2-",
        "Fe^3+", "Fe{3+}", "Na+(aq)", "Cl-(aq)", "H+(g)", "C999999999999", "C9999999999999", "H2O999999999999",
        "ethanol", "ethanol(l)", "n-octane", "methane", "water", "Ca(OH)2", "CuSO4*5H2O", "CuSO4\xC2\xB7" "5H2O",
        "X", "Xx", "Uuo", "D2O", "T2O", "H\xE2\x82\x82O", "\xD0\x9D" "2O", "H2O\xE2\x80\x8D", "H2 O", "(H2O)",
        "((H2O))", "[H2O]", "{H2O}", "H2O)", "(H2O", "H2O(x)", "H2O()", "H2O(g)(l)", "2H2O", "1/2 O2", "O2-2",
        "O^99-", "O^100-", "O-", "O--", "O++", "C60", "C60(s)", "He", "Ar", "Xe", "CH3COOH", "C2H5OH", "C8H18",
        "NaCl(s)", "NaCl(aq)", "Na+", "KMnO4", "XeF6(g)", "UF6", "H(CH2)999H", "H(CH2)9999999H",
    };
    return v;
}

const std::vector<std::string>& reactions() {
    static const std::vector<std::string> v = {
        CH4_COMB, "H2 + 1/2 O2 -> H2O", "2 H2(g) + O2(g) -> 2 H2O(l)", "N2 + 3 H2 -> 2 NH3", "H2O(l) -> H2O(g)",
        "H+ + OH- -> H2O(l)", "H+(aq) + OH-(aq) -> H2O(l)", "Fe^3+ + e- -> Fe^2+", "2 O3(g) -> 3 O2(g)",
        "O3(g) -> 3/2 O2(g)", "H2O0.9999999 -> H2O", "H2O -> H2O0.9999999", "C + O2 -> CO2", "C(s) + O2(g) -> CO2(g)",
        "CaCO3(s) -> CaO(s) + CO2(g)", "H2 + O2 -> H2O", "H2 -> H2", "H2 -> O2", "->", "H2 ->", "-> H2", "H2 + O2",
        "H2 -> H2 -> H2", "H2 = H2", "H2 \xE2\x86\x92 H2", "H2 <-> H2", "H2 <=> H2", "H2 \xE2\x87\x8C H2",
        "0 H2 -> 0 H2", "-1 H2 -> -1 H2", "1/0 H2 -> H2", "1e-7 H2 + 5e-8 O2 -> 1e-7 H2O", "0.0000001 H2 -> 0.0000001 H2",
        "999999999999 H2 + 499999999999.5 O2 -> 999999999999 H2O", "9999999999999 H2 -> 9999999999999 H2",
        "H2 + H2 + H2 -> 3 H2", "2 H2O -> 2 H2 + O2", "C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)",
        "ethanol(l) + 3 O2 -> 2 CO2 + 3 H2O(l)", "CH4 + 2 O2 -> CO2 + 2 H2O", "H2O(s) -> H2O(l)",
        "C8H18(l) + 25/2 O2 -> 8 CO2 + 9 H2O", "Na+ + Cl- -> NaCl(s)", "2 Fe + 3/2 O2 -> Fe2O3(s)",
        "CuSO4*5H2O(s) -> CuSO4(s) + 5 H2O(g)", "e- -> e-", "H2 + O2 -> H2O2 + H2O", "H2 + Cl2 -> 2 HCl",
        "X + Y -> Z", "H2O(x) -> H2O", "H2 + \xFF -> H2", std::string("H2\0 -> H2", 9), "H2\t+\tO2\n->\nH2O2",
        "\xEF\xBB\xBF" "H2 -> H2", "H\xE2\x82\x82 \xE2\x86\x92 H\xE2\x82\x82",
    };
    return v;
}

/// Every input of the generated list: the lists above, their combinations, and long ones.
std::vector<std::string> generated() {
    std::vector<std::string> out;
    for (const auto* list : {&numbers(), &temperatures(), &units(), &species(), &reactions()})
        out.insert(out.end(), list->begin(), list->end());
    // Reactions of each species with edge coefficients.
    for (const auto& c : {"", "2 ", "1/2 ", "1e-7 ", "0.9999999 ", "999999999999 "})
        for (const auto& s : species()) {
            out.push_back(std::string(c) + s + " -> " + s);
            out.push_back(std::string(c) + s + " + O2 -> " + s + " + O2");
        }
    // Pairs of species across the arrow.
    for (std::size_t i = 0; i + 1 < species().size(); i += 3) out.push_back(species()[i] + " -> " + species()[i + 1]);
    // Control characters and text the grammar must refuse in words.
    for (int c = 1; c < 32; ++c) out.push_back(std::string("H2 -> H2") + static_cast<char>(c) + "O");
    out.push_back("\x7f");
    out.push_back(std::string(1, '\0'));
    // Long inputs: near and over the 4096-character limit, deep groups, many terms, many ions.
    out.push_back(std::string(4096, '('));
    out.push_back(std::string(4097, 'H'));
    out.push_back(std::string(2000, '(') + "H" + std::string(2000, ')'));
    std::string terms = "H2";
    for (int i = 0; i < 150; ++i) terms += " + H2";
    out.push_back(terms + " -> H2");
    std::string ions = "Na+";
    for (int i = 0; i < 100; ++i) ions += " + Cl- + Na+";
    out.push_back(ions + " -> NaCl(s)");
    out.push_back("C" + std::string(4000, '9'));
    out.push_back(std::string(4000, ' ') + "H2 -> H2");
    std::string utf;
    for (int i = 0; i < 1000; ++i) utf += "\xE2\x86\x92";
    out.push_back(utf);
    return out;
}

/// The committed fuzz corpus, when there is one (see the comment at the top).
std::vector<std::string> corpus_inputs(std::vector<std::string>* folders_read) {
    namespace fs = std::filesystem;
    std::vector<std::string> folders;
    if (const char* env = std::getenv("RXNHEAT_FUZZ_CORPUS")) {
        std::stringstream in(env);
        std::string f;
        while (std::getline(in, f, ':'))
            if (!f.empty()) folders.push_back(f);
    } else {
        folders = {std::string(RXNHEAT_SOURCE_DIR) + "/fuzz/corpus", std::string(RXNHEAT_SOURCE_DIR) + "/tests/fuzz-corpus"};
    }
    std::vector<std::string> out;
    std::size_t limit = 2000;
    if (const char* max = std::getenv("RXNHEAT_FUZZ_CORPUS_MAX")) limit = std::strtoul(max, nullptr, 10);
    if (limit == 0) limit = SIZE_MAX;
    std::size_t files = 0;
    for (const auto& folder : folders) {
        std::error_code ec;
        if (!fs::is_directory(folder, ec)) continue;
        folders_read->push_back(folder);
        for (fs::recursive_directory_iterator it(folder, ec), end; it != end && out.size() < limit; it.increment(ec)) {
            if (ec) break;
            if (!it->is_regular_file(ec)) continue;
            std::ifstream f(it->path(), std::ios::binary);
            std::string text((std::istreambuf_iterator<char>(f)), std::istreambuf_iterator<char>());
            if (text.size() > 65536) text.resize(65536);
            ++files;
            out.push_back(text);
            std::string line;
            for (char c : text) {
                if (c == '\n' || c == '\0') {
                    out.push_back(line);
                    line.clear();
                } else {
                    line += c;
                }
            }
            out.push_back(line);
        }
    }
    if (out.size() > limit) out.resize(limit);
    return out;
}

std::vector<std::string> all_inputs(std::vector<std::string>* folders_read) {
    std::vector<std::string> v = generated();
    const auto c = corpus_inputs(folders_read);
    v.insert(v.end(), c.begin(), c.end());
    std::set<std::string> seen;
    std::vector<std::string> unique;
    for (auto& s : v)
        if (seen.insert(s).second) unique.push_back(std::move(s));
    return unique;
}

const std::vector<double>& edge_doubles() {
    static const std::vector<double> v = {0.0, -0.0, 1e-320, 4.9e-324, DBL_MIN, 1e-7, 0.5, 1, 298.15, 1000, 1e13,
                                          1e308, DBL_MAX, -1, -1e308, NAN, INFINITY, -INFINITY};
    return v;
}

// Tables: none, ordinary, and tables whose values are finite but at the edge of a double.
struct Tables {
    SpeciesTable plain = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax", "name"},
                                                  {"O3", "g", "142.7", "238.9", "39.2", "200", "1000", "ozone"},
                                                  {"OH-", "aq", "-230.015", "-10.90", "", "", "", "hydroxide"}});
    SpeciesTable huge_h = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"},
                                                   {"O3", "g", "1e305", "238.9", "30", "200", "1000"}});
    SpeciesTable huge_s = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S", "cp", "tmin", "tmax"},
                                                   {"O3", "g", "142.7", "1e306", "30", "200", "1000"}});
    SpeciesTable huge_cp = SpeciesTable::from_rows({{"formula", "phase", "dHf", "S", "a", "b", "c", "tmin", "tmax"},
                                                    {"O3", "g", "142.7", "238.9", "1e300", "1e300", "1e300", "200", "1000"},
                                                    {"CH4", "g", "-74.87", "186.25", "1e300", "-1e300", "", "1", "1e5"}});
    std::vector<const SpeciesTable*> all() const { return {nullptr, &plain, &huge_h, &huge_s, &huge_cp}; }
};
const Tables& tables() {
    static const Tables t;
    return t;
}

// ---- the assertion --------------------------------------------------------------------------------

/// Failures collected over all calls, reported once (a few examples each) so that a finding
/// shows the inputs that cause it without thousands of lines.
struct Findings {
    std::vector<std::string> leaks;      ///< an exception other than rxnheat::Error / bad_alloc
    std::vector<std::string> internals;  ///< an internal error for bad input
    std::vector<std::string> mismatches; ///< check() and a numeric function disagree
    std::size_t calls = 0;
};

std::string shown(const std::string& s) {
    std::string out;
    for (unsigned char c : s.substr(0, 120)) {
        if (c < 32 || c == 127) {
            char buf[8];
            std::snprintf(buf, sizeof buf, "\\x%02x", c);
            out += buf;
        } else {
            out += static_cast<char>(c);
        }
    }
    return out + (s.size() > 120 ? "..." : "");
}

template <class F>
void drive(Findings& found, const char* what, const std::string& input, F&& f) {
    ++found.calls;
    try {
        f();
    } catch (const rxnheat::Error& e) {
        if (e.kind() == ErrorKind::internal)
            found.internals.push_back(std::string(what) + "('" + shown(input) + "'): " + e.what());
    } catch (const std::bad_alloc&) {
        // allowed by the interface (rxnheat.hpp)
    } catch (const std::exception& e) {
        found.leaks.push_back(std::string(what) + "('" + shown(input) + "'): " + typeid(e).name() + ": " + e.what());
    } catch (...) {
        found.leaks.push_back(std::string(what) + "('" + shown(input) + "'): a non-standard exception");
    }
}

void report(const Findings& f) {
    INFO(f.calls << " calls");
    auto first = [](const std::vector<std::string>& v) {
        std::string out;
        for (std::size_t i = 0; i < v.size() && i < 12; ++i) out += "\n  " + v[i];
        return out;
    };
    INFO("exceptions other than rxnheat::Error (" << f.leaks.size() << "):" << first(f.leaks));
    CHECK(f.leaks.empty());
    INFO("internal errors for bad input (" << f.internals.size() << "):" << first(f.internals));
    CHECK(f.internals.empty());
    INFO("check() against the numeric functions (" << f.mismatches.size() << "):" << first(f.mismatches));
    CHECK(f.mismatches.empty());
}

/// A valid argument for each kind, so that one hostile argument reaches as deep as it can.
Arg plain_argument(ArgKind kind) {
    switch (kind) {
    case ArgKind::reaction: return Arg::of(std::string(CH4_COMB));
    case ArgKind::species: return Arg::of(std::string("CH4"));
    case ArgKind::formula: return Arg::of(std::string("CH4"));
    case ArgKind::temperature: return Arg::of(400.0);
    case ArgKind::pressure: return Arg::of(1.0);
    case ArgKind::unit: return Arg::omitted();
    case ArgKind::number: return Arg::of(1.0);
    case ArgKind::factor: return Arg::of(2.0);
    case ArgKind::text: return Arg::of(std::string("RXNDH"));
    case ArgKind::table: return Arg::omitted();
    case ArgKind::feed:
        return Arg::range(2, 2, {Cell::of(std::string("CH4")), Cell::of(1.0), Cell::of(std::string("O2")), Cell::of(2.0)});
    case ArgKind::reactions: return Arg::range(1, 1, {Cell::of(std::string(CH4_COMB))});
    case ArgKind::numbers: return Arg::range(1, 1, {Cell::of(-890.0)});
    case ArgKind::fuel: return Arg::of(std::string("CH4"));
    case ArgKind::rest: return Arg::omitted();
    }
    return Arg::omitted();
}

}  // namespace

TEST_CASE("every public function throws only rxnheat::Error on hostile input", "[robust][corpus]") {
    std::vector<std::string> folders;
    const auto inputs = all_inputs(&folders);
    INFO(inputs.size() << " inputs; corpus folders read: " << folders.size());
    REQUIRE(inputs.size() >= 500);
    rxnheat::Engine e{rxnheat::EngineOptions{}};
    const auto& t = tables().plain;
    Findings found;
    for (const std::string& s : inputs) {
        const Conditions at{400, &t};
        // As a reaction.
        drive(found, "dh", s, [&] { e.dh(s, at); });
        drive(found, "du", s, [&] { e.du(s, 400); });
        drive(found, "ds", s, [&] { e.ds(s, at); });
        drive(found, "dg", s, [&] { e.dg(s, 400); });
        drive(found, "logk", s, [&] { e.logk(s, at); });
        drive(found, "kind", s, [&] { e.kind(s, 400); });
        drive(found, "check", s, [&] { e.check(s, at); });
        drive(found, "balance", s, [&] { e.balance(s, at); });
        drive(found, "reverse", s, [&] { e.reverse(s); });
        drive(found, "scale(text)", s, [&] { e.scale(s, "2"); });
        drive(found, "scale(double)", s, [&] { e.scale(s, 0.1); });
        drive(found, "report", s, [&] { e.report(s, at); });
        drive(found, "source(reaction)", s, [&] { e.source(s, at); });
        drive(found, "load(reaction)", s, [&] { e.load(s, 1, "mol", "H2"); });
        drive(found, "eq_conversion(reaction)", s, [&] { e.eq_conversion(s, {{"H2", 1}, {"O2", 1}}, {}, 1000); });
        drive(found, "hess(target)", s, [&] { e.hess(s, {{1, CH4_COMB, -890}}); });
        drive(found, "hess(step)", s, [&] { e.hess(CH4_COMB, {{1, s, -890}}); });
        drive(found, "hess_plan", s, [&] { e.hess_plan(s, {{1, s, 1}}); });
        drive(found, "duty(reaction)", s, [&] { e.duty(s, {{"H2", 1}, {"O2", 1}}, 0.5, "H2", 300, 400); });
        drive(found, "adiabatic_temperature", s, [&] { e.adiabatic_temperature(s); });
        // As a species or formula.
        drive(found, "species_hf", s, [&] { e.species_hf(s, at); });
        drive(found, "species_hf(T)", s, [&] { e.species_hf(s, 1000); });
        drive(found, "species_cp", s, [&] { e.species_cp(s, at); });
        drive(found, "species_h", s, [&] { e.species_h(s, 1000); });
        drive(found, "species_s", s, [&] { e.species_s(s, at); });
        drive(found, "species_report", s, [&] { e.species_report(s, 1000); });
        drive(found, "molar_mass", s, [&] { e.molar_mass(s); });
        drive(found, "source(species)", s, [&] { e.source(s); });
        drive(found, "heating_value", s, [&] { e.heating_value(s); });
        drive(found, "heating_value(mix)", s, [&] { e.heating_value(std::vector<FeedItem>{{s, 0.5}, {"CH4", 0.5}}); });
        drive(found, "stream_enthalpy", s, [&] { e.stream_enthalpy({{s, 1}}, {}, {}, 500); });
        drive(found, "load key", s, [&] { e.load(CH4_COMB, 1, "mol", s); });
        drive(found, "dh per", s, [&] { e.dh(CH4_COMB, 400, "kJ/kg", s); });
        drive(found, "eq_conversion key", s, [&] { e.eq_conversion("N2 + 3 H2 -> 2 NH3", {{"N2", 1}, {"H2", 3}}, s, 600); });
        drive(found, "eq_conversion feed", s, [&] { e.eq_conversion("N2 + 3 H2 -> 2 NH3", {{"N2", 1}, {"H2", 3}, {s, 1}}, {}, 600); });
        drive(found, "adiabatic extra", s, [&] { e.adiabatic_temperature(CH4_COMB, {{s, 1}}); });
        // As a unit.
        drive(found, "dh unit", s, [&] { e.dh(CH4_COMB, 400, s); });
        drive(found, "dh unit per", s, [&] { e.dh(CH4_COMB, 400, s, "CH4"); });
        drive(found, "ds unit", s, [&] { e.ds(CH4_COMB, 400, s); });
        drive(found, "dg unit", s, [&] { e.dg(CH4_COMB, 400, s); });
        drive(found, "species_hf unit", s, [&] { e.species_hf("CH4", 400, s); });
        drive(found, "load quantity unit", s, [&] { e.load(CH4_COMB, 1, s, "CH4"); });
        drive(found, "load result unit", s, [&] { e.load(CH4_COMB, 1, "kmol/h", "CH4", s); });
        drive(found, "load_unit", s, [&] { rxnheat::Engine::load_unit(s, ""); });
        drive(found, "load_unit result", s, [&] { rxnheat::Engine::load_unit("kg/h", s); });
        drive(found, "stream_unit", s, [&] { rxnheat::Engine::stream_unit(s, ""); });
        drive(found, "stream_enthalpy flow unit", s, [&] { e.stream_enthalpy({{"CH4", 1}}, s); });
        drive(found, "stream_enthalpy result unit", s, [&] { e.stream_enthalpy({{"CH4", 1}}, "kmol/h", s); });
        drive(found, "duty units", s, [&] { e.duty(CH4_COMB, {{"CH4", 1}, {"O2", 2}}, 0.5, "CH4", 300, 400, s, s); });
        drive(found, "heating_value basis", s, [&] { e.heating_value("CH4", s); });
        drive(found, "heating_value unit", s, [&] { e.heating_value("CH4", "HHV", s); });
        drive(found, "hess unit", s, [&] { e.hess(CH4_COMB, {{1, CH4_COMB, -890}}, s); });
        // As a number's text.
        drive(found, "parse_temperature", s, [&] { rxnheat::parse_temperature(s); });
        drive(found, "scale factor", s, [&] { e.scale(CH4_COMB, std::string_view(s)); });
        drive(found, "trim/number_words", s, [&] {
            rxnheat::trim(s);
            rxnheat::number_words(std::strtod(s.c_str(), nullptr));
            rxnheat::exact_number(std::strtod(s.c_str(), nullptr));
        });
        // As a table cell, in every column, and as a CSV text.
        const std::vector<std::string> header = {"formula", "phase", "dHf", "S", "cp", "tmin", "tmax", "name", "source"};
        for (std::size_t col = 0; col < header.size(); ++col) {
            std::vector<std::string> row = {"O3", "g", "142.7", "238.9", "39.2", "200", "1000", "ozone", "memory"};
            row[col] = s;
            drive(found, "SpeciesTable::from_rows", s, [&] { SpeciesTable::from_rows({header, row}); });
            std::vector<std::string> h2 = header;
            h2[col] = s;
            drive(found, "SpeciesTable::from_rows header", s, [&] { SpeciesTable::from_rows({h2, row}); });
        }
        drive(found, "csv::Reader", s, [&] {
            rxnheat::csv::Reader r(s);
            rxnheat::csv::Record rec;
            while (r.next(rec)) {
            }
            rxnheat::csv::quote(s);
        });
        // The catalogue (every host's entry): each argument of each function in turn, as text
        // and, where it reads as one, as a number.
        rxnheat::HostRules rules;
        rxnheat::HostRules cli_rules;
        cli_rules.text_numbers = true;
        char* end = nullptr;
        const double as_number = std::strtod(s.c_str(), &end);
        const bool numeric = !s.empty() && end == s.c_str() + s.size();
        for (const auto& f : rxnheat::catalogue()) {
            std::vector<Arg> args;
            for (const auto& a : f.args) args.push_back(plain_argument(a.kind));
            for (std::size_t i = 0; i < args.size(); ++i) {
                auto with = args;
                with[i] = Arg::of(s);
                for (const auto* r : {&rules, &cli_rules}) {
                    ++found.calls;
                    try {
                        const auto result = rxnheat::evaluate(f, with, *r, e);
                        for (const auto& o : result.cells)
                            if (!o.ok() && o.error == ErrorKind::internal)
                                found.internals.push_back(std::string("evaluate ") + f.calc_name + " argument " +
                                                          std::to_string(i + 1) + " '" + shown(s) + "': " + o.text);
                        rxnheat::why(f, with, *r, e);
                    } catch (const std::bad_alloc&) {
                    } catch (const std::exception& x) {
                        found.leaks.push_back(std::string("evaluate ") + f.calc_name + ": " + x.what());
                    }
                }
                if (numeric) {
                    with[i] = Arg::of(as_number);
                    ++found.calls;
                    const auto result = rxnheat::evaluate(f, with, rules, e);
                    for (const auto& o : result.cells)
                        if (!o.ok() && o.error == ErrorKind::internal)
                            found.internals.push_back(std::string("evaluate ") + f.calc_name + " argument " +
                                                      std::to_string(i + 1) + " = " + shown(s) + ": " + o.text);
                }
            }
        }
    }
    // The tables at the edge of a double through every function that reads a table.
    for (const SpeciesTable* tab : tables().all())
        for (double T : {200.0, 298.15, 400.0, 1000.0, 1e5}) {
            const Conditions at{T, tab};
            const std::string s = "tables at " + rxnheat::number_words(T) + " K";
            for (const std::string& sp : {std::string("O3"), std::string("CH4"), std::string("O3(g)"), std::string("ozone")}) {
                drive(found, "species_hf", s, [&] { e.species_hf(sp, at); });
                drive(found, "species_cp", s, [&] { e.species_cp(sp, at); });
                drive(found, "species_h", s, [&] { e.species_h(sp, at, 250); });
                drive(found, "species_s", s, [&] { e.species_s(sp, at); });
                drive(found, "species_report", s, [&] { e.species_report(sp, at); });
                drive(found, "stream_enthalpy", s, [&] { e.stream_enthalpy({{sp, 1e300}, {"N2", 1}}, {}, {}, at); });
                drive(found, "heating_value", s, [&] { e.heating_value(sp, {}, {}, at); });
            }
            for (const char* r : {"2 O3(g) -> 3 O2(g)", "CH4 + 2 O2 -> CO2 + 2 H2O", "CH4 + 2 O3 -> CO2 + 2 H2O + O2"}) {
                drive(found, "eq_conversion", s, [&] { e.eq_conversion(r, {{"O3", 1}, {"CH4", 1}, {"O2", 3}}, {}, at); });
                drive(found, "duty", s, [&] { e.duty(r, {{"O3", 2}, {"CH4", 1}, {"O2", 3}}, 0.5, {}, 300, T, {}, {}, tab); });
                drive(found, "adiabatic_temperature", s, [&] { e.adiabatic_temperature(r, {{"N2", 3}}, 1, at); });
                drive(found, "load", s, [&] { e.load(r, 1e300, "kmol/h", "O2", {}, at); });
                drive(found, "report", s, [&] { e.report(r, at); });
                drive(found, "source", s, [&] { e.source(r, at); });
            }
        }
    // A species table from a CSV file of each input.
    {
        const std::string path = std::string(RXNHEAT_BINARY_DIR) + "/tests/hostile-table.csv";
        for (const std::string& s : inputs) {
            for (const std::string& text : {s, "formula,phase,dHf,S,cp,tmin,tmax\n" + s + ",g,1,1,1,200,1000\n",
                                            "formula,phase,dHf\nO3,g," + s + "\n"}) {
                if (std::FILE* f = std::fopen(path.c_str(), "wb")) {
                    std::fwrite(text.data(), 1, text.size(), f);
                    std::fclose(f);
                }
                drive(found, "SpeciesTable::from_csv_file", s, [&] { SpeciesTable::from_csv_file(path); });
            }
        }
        std::remove(path.c_str());
        drive(found, "SpeciesTable::from_csv_file", "(no file)", [&] { SpeciesTable::from_csv_file(path); });
        drive(found, "SpeciesTable::from_csv_file", "(empty path)", [&] { SpeciesTable::from_csv_file(""); });
    }
    // The numeric arguments at their edges.
    for (double d : edge_doubles()) {
        const std::string s = rxnheat::number_words(d);
        drive(found, "dh T", s, [&] { e.dh(CH4_COMB, d); });
        drive(found, "check T", s, [&] { e.check(CH4_COMB, d); });
        drive(found, "load quantity", s, [&] { e.load(CH4_COMB, d, "mol", "CH4"); });
        drive(found, "scale(double)", s, [&] { e.scale(CH4_COMB, d); });
        drive(found, "kind tolerance", s, [&] { e.kind(CH4_COMB, 400, d); });
        drive(found, "species_h Tref", s, [&] { e.species_h("N2", 400, d); });
        drive(found, "eq_conversion pressure", s, [&] {
            Conditions c{600};
            c.pressure_bar = d;
            e.eq_conversion("N2 + 3 H2 -> 2 NH3", {{"N2", 1}, {"H2", 3}}, {}, c);
        });
        drive(found, "eq_conversion amount", s, [&] { e.eq_conversion("N2 + 3 H2 -> 2 NH3", {{"N2", d}, {"H2", 3}}, {}, 600); });
        drive(found, "duty conversion", s, [&] { e.duty(CH4_COMB, {{"CH4", 1}, {"O2", 2}}, d, "CH4", 300, 400); });
        drive(found, "duty temperatures", s, [&] { e.duty(CH4_COMB, {{"CH4", 1}, {"O2", 2}}, 0.5, "CH4", d, d); });
        drive(found, "duty flow", s, [&] { e.duty(CH4_COMB, {{"CH4", d}, {"O2", 2}}, 0.5, "CH4", 300, 400); });
        drive(found, "adiabatic", s, [&] { e.adiabatic_temperature(CH4_COMB, {{"N2", d}}, 1, 300); });
        drive(found, "adiabatic conversion", s, [&] { e.adiabatic_temperature(CH4_COMB, {}, d, 300); });
        drive(found, "stream_enthalpy flow", s, [&] { e.stream_enthalpy({{"CH4", d}}); });
        drive(found, "heating_value fraction", s, [&] { e.heating_value(std::vector<FeedItem>{{"CH4", d}, {"N2", 1 - d}}); });
        drive(found, "hess dh", s, [&] { e.hess(CH4_COMB, {{1, CH4_COMB, d}}); });
        drive(found, "steam_tsat", s, [&] { rxnheat::Engine::steam_tsat(d); });
        drive(found, "steam_psat", s, [&] { rxnheat::Engine::steam_psat(d); });
        drive(found, "steam_h", s, [&] { rxnheat::Engine::steam_h(d, 500.0); });
        drive(found, "steam_h T", s, [&] { rxnheat::Engine::steam_h(10.0, d); });
        drive(found, "steam_h sat", s, [&] { rxnheat::Engine::steam_h(d, rxnheat::SaturatedState::vapour); });
        drive(found, "steam_latent", s, [&] { rxnheat::Engine::steam_latent(d); });
        for (const SpeciesTable* t : tables().all()) {
            drive(found, "dh table T", s, [&] { e.dh("2 O3(g) -> 3 O2(g)", {d, t}); });
            drive(found, "species_cp table T", s, [&] { e.species_cp("O3", {d, t}); });
        }
    }
    report(found);
}

TEST_CASE("the C interface answers hostile input with a status, never an internal error", "[robust][corpus][capi]") {
    std::vector<std::string> folders;
    const auto inputs = all_inputs(&folders);
    rxnheat_engine* h = rxnheat_open();
    REQUIRE(h);
    std::vector<std::string> internal;
    char text[512], err[512];
    double x = 0;
    auto note = [&](rxnheat_status st, const char* what, const std::string& s) {
        if (st == RXNHEAT_E_INTERNAL) internal.push_back(std::string(what) + "('" + shown(s) + "'): " + err);
    };
    for (const std::string& s : inputs) {
        const char* c = s.c_str();  // a C string ends at the first NUL, as a C host's would
        note(rxnheat_dh(h, c, 400, nullptr, nullptr, &x, err, sizeof err), "rxnheat_dh", s);
        note(rxnheat_dh(h, CH4_COMB, 400, c, nullptr, &x, err, sizeof err), "rxnheat_dh unit", s);
        note(rxnheat_check(h, c, 400, text, sizeof text), "rxnheat_check", s);
        note(rxnheat_scale(h, CH4_COMB, c, text, sizeof text, err, sizeof err), "rxnheat_scale", s);
        note(rxnheat_parse_temperature(c, &x, err, sizeof err), "rxnheat_parse_temperature", s);
        note(rxnheat_species_cp(h, c, 400, &x, err, sizeof err), "rxnheat_species_cp", s);
        for (std::size_t i = 0; i < rxnheat_function_count(); ++i) {
            rxnheat_value v[2] = {rxnheat_text(c), rxnheat_text(c)};
            rxnheat_result r;
            note(rxnheat_call(h, rxnheat_function_name(i), v, 2, &r, text, sizeof text, err, sizeof err),
                 rxnheat_function_name(i), s);
        }
    }
    rxnheat_close(h);
    INFO(internal.size() << " internal errors; first: " << (internal.empty() ? "" : internal.front()));
    CHECK(internal.empty());
}

TEST_CASE("check() says exactly what the numeric functions throw", "[robust][corpus][check]") {
    std::vector<std::string> folders;
    auto inputs = all_inputs(&folders);
    rxnheat::Engine e{rxnheat::EngineOptions{}};
    Findings found;
    const std::vector<double> temps = {298.15, 400, 1000, 150, 5e4};
    std::size_t ok_count = 0, compared = 0;
    for (const std::string& s : inputs) {
        if (s.find("->") == std::string::npos && s.find('=') == std::string::npos &&
            s.find("\xE2\x86\x92") == std::string::npos)
            continue;  // not a reaction
        for (const SpeciesTable* t : tables().all())
            for (double T : temps) {
                const Conditions at{T, t};
                const std::string check = e.check(s, at);
                const std::string where = "'" + shown(s) + "' at " + rxnheat::number_words(T) + " K" +
                                          (t ? " with a table" : "");
                if (check == "ok") ++ok_count;
                ++compared;
                // What check() tries, in its order: dh, du (kind and report fail as they do),
                // then ds, dg, logk, whose errors for data without entropies (unknown_species,
                // out_of_range) are their own diagnosis. check() must say the first error of
                // these, or "ok".
                auto message_of = [&](const std::function<void()>& f, bool* data_gap) {
                    const auto o = attempt([&] {
                        f();
                        return std::string();
                    });
                    if (data_gap) *data_gap = o.engine_error && (o.kind == ErrorKind::unknown_species ||
                                                                 o.kind == ErrorKind::out_of_range);
                    if (o.other_exception) return "(exception) " + o.message;
                    return o.returned ? std::string("ok") : o.message;
                };
                const std::string dh = message_of([&] { e.dh(s, at); }, nullptr);
                const std::string du = message_of([&] { e.du(s, at); }, nullptr);
                std::string expected = dh != "ok" ? dh : du;
                if (expected == "ok")
                    for (const auto& f : std::vector<std::function<void()>>{[&] { e.ds(s, at); }, [&] { e.dg(s, at); },
                                                                            [&] { e.logk(s, at); }}) {
                        bool gap = false;
                        const std::string m = message_of(f, &gap);
                        if (m != "ok" && !gap) {
                            expected = m;
                            break;
                        }
                    }
                if (check != expected)
                    found.mismatches.push_back(where + ": check says '" + check + "', the numeric functions '" +
                                               expected + "'");
                const std::string kind = message_of([&] { e.kind(s, at); }, nullptr);
                if (kind != dh) found.mismatches.push_back(where + ": dh gives '" + dh + "', kind '" + kind + "'");
                const std::string rep = message_of([&] { e.report(s, at); }, nullptr);
                if (rep != (dh != "ok" ? dh : du))
                    found.mismatches.push_back(where + ": dh/du give '" + (dh != "ok" ? dh : du) + "', report '" + rep + "'");
                // A load of one mole of the first reactant is finite whenever check() is ok
                // (errors about the key itself are the key's, not the reaction's).
                if (check == "ok") {
                    const auto o = attempt([&] {
                        const auto p = e.report(s, at);
                        const auto arrow = p.canonical.find(" -> ");
                        std::string first = p.canonical.substr(0, p.canonical.find(" + "));
                        if (first.size() > arrow) first = p.canonical.substr(0, arrow);
                        const auto space = first.rfind(' ');
                        if (space != std::string::npos) first = first.substr(space + 1);
                        return e.load(s, 1, "mol", first, {}, at);
                    });
                    if (o.engine_error && o.kind != ErrorKind::argument)
                        found.mismatches.push_back("load " + where + ": check says ok, load gives '" + o.message + "'");
                    if (o.returned && !std::isfinite(o.value))
                        found.mismatches.push_back("load " + where + ": not finite");
                }
            }
    }
    INFO(compared << " comparisons, " << ok_count << " of them ok");
    CHECK(ok_count > 100);  // the comparison is not only between errors
    report(found);
}
