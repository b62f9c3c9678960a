// Units of rxnheat: tables, lookups, conversions and parse_temperature(). See units.hpp for the
// definitions and where each factor comes from.
#include "units.hpp"

#include "rxnheat/rxnheat.hpp"

#include <array>
#include <cfloat>
#include <charconv>
#include <cmath>
#include <cstdlib>
#include <string>
#include <system_error>

namespace rxnheat::detail {
namespace {

using namespace unit_def;

// ---- text helpers -------------------------------------------------------------------------------

// Length of the whitespace character at the start of s: ASCII blanks, NO-BREAK SPACE (U+00A0) and
// NARROW NO-BREAK SPACE (U+202F), which pasted numbers often carry. 0 if none.
std::size_t space_at(std::string_view s) noexcept {
    if (s.empty()) return 0;
    const char c = s[0];
    if (c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' || c == '\v') return 1;
    if (s.size() >= 2 && s[0] == '\xC2' && s[1] == '\xA0') return 2;
    if (s.size() >= 3 && s[0] == '\xE2' && s[1] == '\x80' && s[2] == '\xAF') return 3;
    return 0;
}

std::size_t space_before_end(std::string_view s) noexcept {
    if (s.empty()) return 0;
    const char c = s.back();
    if (c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' || c == '\v') return 1;
    if (s.size() >= 2 && s.substr(s.size() - 2) == "\xC2\xA0") return 2;
    if (s.size() >= 3 && s.substr(s.size() - 3) == "\xE2\x80\xAF") return 3;
    return 0;
}

std::string_view trim(std::string_view s) noexcept {
    while (std::size_t n = space_at(s)) s.remove_prefix(n);
    while (std::size_t n = space_before_end(s)) s.remove_suffix(n);
    return s;
}

// Trims both ends and drops blanks around every '/': " kg / h " -> "kg/h".
std::string normalise(std::string_view s) {
    s = trim(s);
    std::string out;
    out.reserve(s.size());
    for (std::size_t i = 0; i < s.size();) {
        if (s[i] == '/') {
            while (!out.empty() && (out.back() == ' ' || out.back() == '\t')) out.pop_back();
            out += '/';
            ++i;
            while (i < s.size() && (s[i] == ' ' || s[i] == '\t')) ++i;
        } else {
            out += s[i++];
        }
    }
    return out;
}

// The user's text for a message: at most 40 bytes (cut at a UTF-8 boundary), control characters
// shown as '?', in single quotes.
std::string quote(std::string_view s) {
    constexpr std::size_t limit = 40;
    bool cut = false;
    if (s.size() > limit) {
        std::size_t n = limit;
        while (n > 0 && (static_cast<unsigned char>(s[n]) & 0xC0) == 0x80) --n;
        s = s.substr(0, n);
        cut = true;
    }
    std::string out = "'";
    for (char c : s) out += (static_cast<unsigned char>(c) < 0x20 || c == 0x7F) ? '?' : c;
    if (cut) out += "...";
    out += "'";
    return out;
}

char ascii_lower(char c) noexcept { return (c >= 'A' && c <= 'Z') ? static_cast<char>(c - 'A' + 'a') : c; }

// True if s starts with `word` (lowercase ASCII), ignoring ASCII case.
bool starts_with_ignoring_ascii_case(std::string_view s, std::string_view word) noexcept {
    if (s.size() < word.size()) return false;
    for (std::size_t i = 0; i < word.size(); ++i)
        if (ascii_lower(s[i]) != word[i]) return false;
    return true;
}

// A number for a message, independent of the C locale, to 6 significant digits.
std::string format_number(double v) {
    char buf[64];
    const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::general, 6);
    return r.ec == std::errc() ? std::string(buf, r.ptr) : std::string("?");
}

bool equal_ignoring_ascii_case(std::string_view a, std::string_view b) noexcept {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i) {
        if (ascii_lower(a[i]) != ascii_lower(b[i])) return false;
    }
    return true;
}

bool underflows(std::string_view number) {
    // from_chars says "out of range" both ways; strtod tells them apart (HUGE_VAL or near 0).
    const std::string copy(number);
    return std::fabs(std::strtod(copy.c_str(), nullptr)) < 1.0;
}

/// The error for a value that is not finite: `what`, then " in " and `in` when `in` is given.
/// Out of line (cold, never inlined), apart from the test in require_finite, so that the
/// conversions on every cell's path carry no string building, not even in their prologue
/// (measured: building the name in place cost a cached dh 47 instructions, batch 20 %).
[[noreturn]] __attribute__((noinline, cold)) void not_finite(double v, std::string_view what, std::string_view in) {
    std::string name(what);
    if (!in.empty()) name += " in " + std::string(trim(in));
    throw Error(ErrorKind::argument, name + " is " + number_words(v) + ", not a finite number" +
                                         (std::isinf(v) ? ": the numbers combine beyond the largest a double "
                                                          "holds (about 1.8e+308)"
                                                        : ""));
}

inline void require_finite(double v, std::string_view what, std::string_view in = {}) {
    if (!std::isfinite(v)) not_finite(v, what, in);
}

double checked_molar_mass(std::optional<double> m) {
    // Callers test has_value() first.
    if (!std::isfinite(*m) || *m <= 0)
        throw Error(ErrorKind::argument, "the molar mass must be a finite number above 0 g/mol");
    return *m;
}

// ---- tables ------------------------------------------------------------------------------------

struct Named {
    std::string_view name;
    double factor;
};

// Energy per mole: J/mol per unit.
constexpr std::array<Named, 7> molar_units{{
    {"J/mol", 1.0},
    {"kJ/mol", 1e3},
    {"MJ/kmol", 1e3},
    {"kcal/mol", 1e3 * cal_J},
    {"cal/mol", cal_J},
    {"BTU/lbmol", btu_J / lbmol_mol},
    {"Btu/lbmol", btu_J / lbmol_mol},
}};
// Energy per mass: J/g per unit.
constexpr std::array<Named, 6> mass_units{{
    {"kJ/kg", 1.0},
    {"MJ/kg", 1e3},
    {"kJ/g", 1e3},
    {"kcal/kg", cal_J},
    {"BTU/lb", btu_J / (lb_kg * 1e3)},
    {"Btu/lb", btu_J / (lb_kg * 1e3)},
}};
// Entropy per mole: J/(mol·K) per unit. The '·' form first: it is the one messages list.
constexpr std::array<Named, 12> entropy_units{{
    {"J/(mol\xC2\xB7K)", 1.0},
    {"kJ/(mol\xC2\xB7K)", 1e3},
    {"cal/(mol\xC2\xB7K)", cal_J},
    {"J/(mol*K)", 1.0},
    {"kJ/(mol*K)", 1e3},
    {"cal/(mol*K)", cal_J},
    {"J/(mol.K)", 1.0},
    {"kJ/(mol.K)", 1e3},
    {"cal/(mol.K)", cal_J},
    {"J/mol/K", 1.0},
    {"kJ/mol/K", 1e3},
    {"cal/mol/K", cal_J},
}};
// Load totals: J per unit. (Gcal is on the IT calorie, kcal thermochemical: see units.hpp.)
constexpr std::array<Named, 13> total_units{{
    {"J", 1.0},
    {"kJ", 1e3},
    {"MJ", 1e6},
    {"GJ", 1e9},
    {"kWh", 3.6e6},
    {"MWh", 3.6e9},
    {"kcal", 1e3 * cal_J},
    {"Gcal", 1e9 * cal_IT_J},
    {"BTU", btu_J},
    {"Btu", btu_J},
    {"MMBTU", 1e6 * btu_J},
    {"MMBtu", 1e6 * btu_J},
    {"therm", therm_J},
}};
// Load rates: W per unit. Every "/h" here may also be written "/hr" (see hour_as_h()).
constexpr std::array<Named, 10> rate_units{{
    {"W", 1.0},
    {"kW", 1e3},
    {"MW", 1e6},
    {"kcal/h", 1e3 * cal_J / 3600.0},
    {"Gcal/h", 1e9 * cal_IT_J / 3600.0},
    {"BTU/h", btu_J / 3600.0},
    {"Btu/h", btu_J / 3600.0},
    {"MMBTU/h", 1e6 * btu_J / 3600.0},
    {"MMBtu/h", 1e6 * btu_J / 3600.0},
    {"TR", 12000.0 * btu_J / 3600.0},
}};
// Words for the messages: how the "/hr" spelling is told.
constexpr std::string_view hr_note = " (each /h also written /hr)";

// "Btu/hr" -> "Btu/h": the trade writes hours both ways, and only the last part after '/' is a
// time. Anything else is returned unchanged.
std::string hour_as_h(std::string name) {
    constexpr std::string_view hr = "/hr";
    if (name.size() > hr.size() && name.compare(name.size() - hr.size(), hr.size(), hr) == 0)
        name.pop_back();
    return name;
}

struct QuantityBase {
    std::string_view name;
    QuantityKind kind;
    double factor;      // mol, g, or m³
    double mol_per_m3;  // volume only
};
constexpr std::array<QuantityBase, 16> quantity_bases{{
    {"mol", QuantityKind::amount, 1.0, 0},
    {"kmol", QuantityKind::amount, 1e3, 0},
    {"lbmol", QuantityKind::amount, lbmol_mol, 0},
    {"g", QuantityKind::mass, 1.0, 0},
    {"kg", QuantityKind::mass, 1e3, 0},
    {"t", QuantityKind::mass, 1e6, 0},
    {"lb", QuantityKind::mass, lb_kg * 1e3, 0},
    {"klb", QuantityKind::mass, 1e3 * lb_kg * 1e3, 0},
    {"Nm3", QuantityKind::volume, 1.0, normal_mol_per_m3},
    {"Nm\xC2\xB3", QuantityKind::volume, 1.0, normal_mol_per_m3},  // Nm³
    {"Nm^3", QuantityKind::volume, 1.0, normal_mol_per_m3},
    {"Sm3", QuantityKind::volume, 1.0, standard_mol_per_m3},
    {"Sm\xC2\xB3", QuantityKind::volume, 1.0, standard_mol_per_m3},  // Sm³
    {"Sm^3", QuantityKind::volume, 1.0, standard_mol_per_m3},
    {"scf", QuantityKind::volume, ft3_m3, scf_mol_per_m3},
    {"MMscf", QuantityKind::volume, 1e6 * ft3_m3, scf_mol_per_m3},
}};
constexpr std::array<Named, 5> time_units{{
    {"s", 1.0}, {"min", 60.0}, {"h", 3600.0}, {"hr", 3600.0}, {"d", 86400.0}}};
// A flow written as one word, as gas flows are: MMscfd = MMscf/d.
struct FlowWord {
    std::string_view name;
    std::string_view base;  // a quantity_bases name
    std::string_view time;  // a time_units name
};
constexpr std::array<FlowWord, 1> flow_words{{{"MMscfd", "MMscf", "d"}}};

template <std::size_t N>
const Named* find(const std::array<Named, N>& table, std::string_view name) noexcept {
    for (const Named& u : table)
        if (u.name == name) return &u;
    return nullptr;
}

template <std::size_t N>
std::string join(const std::array<Named, N>& table) {
    std::string out;
    for (const Named& u : table) {
        if (!out.empty()) out += ", ";
        out += u.name;
    }
    return out;
}

// " (unit names are case-sensitive: did you mean 'MJ/kg'?)" when a known name matches but for
// letter case; else empty.
template <std::size_t N>
void add_case_hint(std::string& hint, const std::array<Named, N>& table, std::string_view name) {
    for (const Named& u : table)
        if (hint.empty() && u.name != name && equal_ignoring_ascii_case(u.name, name))
            hint = " (unit names are case-sensitive: did you mean '" + std::string(u.name) + "'?)";
}

const std::string& molar_known_text() {
    static const std::string text = "energy per mole " + join(molar_units) +
                                    "; per mass of the `per` species " + join(mass_units);
    return text;
}

const std::string& quantity_known_text() {
    static const std::string text =
        "amount mol, kmol, lbmol; mass g, kg, t, lb, klb (1000 lb); gas volume Nm3 (0 \xC2\xB0" "C, "
        "101.325 kPa), Sm3 (15 \xC2\xB0" "C, 101.325 kPa), scf (60 \xC2\xB0" "F, 14.696 psia), "
        "MMscf (10^6 scf); each alone for a total or followed by /s, /min, /h (or /hr) or /d for a "
        "flow (e.g. kg/h); MMscfd is MMscf/d";
    return text;
}

// The factor of a per-mole or per-mass energy unit; `per_mass` tells which.
double energy_factor(std::string_view unit_text, bool& per_mass) {
    // Fast path, no string built: the empty text and a unit written exactly as named (no unit
    // name has spaces, so normalise() leaves each unchanged and this finds what it would find).
    const auto look_up = [&per_mass](std::string_view name) -> const Named* {
        if (const Named* u = find(molar_units, name)) {
            per_mass = false;
            return u;
        }
        if (const Named* u = find(mass_units, name)) {
            per_mass = true;
            return u;
        }
        return nullptr;
    };
    if (unit_text.empty()) {  // the default, nearly every call: its row found once
        static const Named* const default_unit = find(molar_units, "kJ/mol");
        per_mass = false;
        return default_unit->factor;
    }
    if (const Named* u = look_up(unit_text)) return u->factor;
    const std::string unit = normalise(unit_text);
    const std::string_view name = unit.empty() ? std::string_view("kJ/mol") : std::string_view(unit);
    if (const Named* u = look_up(name)) return u->factor;
    std::string hint;
    add_case_hint(hint, molar_units, name);
    add_case_hint(hint, mass_units, name);
    if (hint.empty() && (find(total_units, name) || find(rate_units, hour_as_h(std::string(name)))))
        hint = " (that is a load unit; this result is an energy per amount, e.g. kJ/mol)";
    throw Error(ErrorKind::unit, "unknown energy unit " + quote(unit_text) + hint +
                                     "; known units: " + molar_known_text());
}

double energy_to_J_per_mol_factor(std::string_view unit, std::optional<double> molar_mass) {
    bool per_mass = false;
    const double f = energy_factor(unit, per_mass);
    if (!per_mass) return f;
    if (!molar_mass)
        throw Error(ErrorKind::unit,
                    "unit " + quote(trim(unit)) +
                        " is per mass: give `per`, the species whose mass it is per (or use an "
                        "energy per mole such as kJ/mol)");
    return f * checked_molar_mass(molar_mass);  // (J/g per unit) × (g/mol) = J/mol per unit
}

}  // namespace

// ---- energy per amount --------------------------------------------------------------------------

double from_J_per_mol(double J_per_mol, std::string_view unit, std::string_view what,
                      std::optional<double> molar_mass) {
    const double f = energy_to_J_per_mol_factor(unit, molar_mass);
    require_finite(J_per_mol, what);
    const double out = J_per_mol / f;  // per mass: J/mol times 1/(g/mol) can pass the largest double
    require_finite(out, what, unit);
    return out;
}

double to_J_per_mol(double value, std::string_view unit, std::string_view what, std::optional<double> molar_mass) {
    const double f = energy_to_J_per_mol_factor(unit, molar_mass);
    require_finite(value, what);
    const double out = value * f;  // 1e306 kJ/mol is 1e309 J/mol
    require_finite(out, what, "J/mol");
    return out;
}

double from_J_per_molK(double J_per_molK, std::string_view unit_text, std::string_view what) {
    // Fast path as in energy_factor(): a unit written exactly as named needs no normalising.
    if (const Named* u = unit_text.empty() ? find(entropy_units, "J/(mol\xC2\xB7K)") : find(entropy_units, unit_text)) {
        require_finite(J_per_molK, what);
        return J_per_molK / u->factor;
    }
    const std::string unit = normalise(unit_text);
    const std::string_view name = unit.empty() ? std::string_view("J/(mol\xC2\xB7K)") : std::string_view(unit);
    const Named* u = find(entropy_units, name);
    if (!u) {
        std::string hint;
        add_case_hint(hint, entropy_units, name);
        // "J/mol·K" read as written is J·K/mol; the trade means J/(mol·K), but a guess is not ours to make.
        for (std::string_view dot : {"\xC2\xB7K", "*K", ".K"}) {
            const std::size_t at = name.find('/');
            if (hint.empty() && at != std::string_view::npos && name.size() > dot.size() &&
                name.substr(name.size() - dot.size()) == dot && name.find('(') == std::string_view::npos)
                hint = " (write the per-kelvin part in parentheses, e.g. J/(mol\xC2\xB7K))";
        }
        bool per_mass = false;
        if (hint.empty()) {
            try {
                energy_factor(name, per_mass);
                hint = " (that is an energy per amount; an entropy is per kelvin, e.g. J/(mol\xC2\xB7K))";
            } catch (const Error&) {
            }
        }
        throw Error(ErrorKind::unit, "unknown entropy unit " + quote(unit_text) + hint +
                                         "; known units: J/(mol\xC2\xB7K) (default), kJ/(mol\xC2\xB7K), "
                                         "cal/(mol\xC2\xB7K) (thermochemical calorie, 4.184 J), each also "
                                         "written with * or . for \xC2\xB7 or as J/mol/K");
    }
    require_finite(J_per_molK, what);
    return J_per_molK / u->factor;
}

bool is_per_mass_unit(std::string_view unit) noexcept {
    try {
        return find(mass_units, normalise(unit)) != nullptr;
    } catch (...) {  // std::bad_alloc from normalise()
        return false;
    }
}

// ---- quantities ---------------------------------------------------------------------------------

QuantityUnit quantity_unit(std::string_view unit_text) {
    const std::string unit = normalise(unit_text);
    std::string_view base = unit, per;
    if (const std::size_t slash = base.find('/'); slash != std::string_view::npos) {
        per = base.substr(slash + 1);
        base = base.substr(0, slash);
    }
    const FlowWord* word = nullptr;
    for (const FlowWord& w : flow_words)
        if (w.name == base) word = &w;
    const bool has_slash = unit.find('/') != std::string::npos;
    const std::string_view base_name = word && !has_slash ? word->base : base;
    const QuantityBase* b = nullptr;
    for (const QuantityBase& q : quantity_bases)
        if (q.name == base_name) b = &q;
    const Named* t = word && !has_slash ? find(time_units, word->time)
                     : per.empty()      ? nullptr
                                        : find(time_units, per);
    const bool bad_time = has_slash && !t;
    if (!b || bad_time) {
        std::string msg = unit.empty() ? std::string("the quantity unit is empty")
                                       : "unknown quantity unit " + quote(unit_text);
        std::string hint;
        if (word) {
            hint = " (" + std::string(word->name) + " is already a flow, " + std::string(word->base) +
                   " per " + std::string(word->time) + ")";
        } else if (b && bad_time) {
            hint = " (the time after '/' must be s, min, h or d; hr may be written for h)";
        } else if (base == "m3" || base == "m\xC2\xB3" || base == "m^3") {
            hint = " (a gas volume needs its conditions: Nm3 at 0 \xC2\xB0" "C and 101.325 kPa, "
                   "Sm3 at 15 \xC2\xB0" "C and 101.325 kPa, or scf at 60 \xC2\xB0" "F and 14.696 psia)";
        } else {
            for (const QuantityBase& q : quantity_bases)
                if (hint.empty() && equal_ignoring_ascii_case(q.name, base))
                    hint = " (unit names are case-sensitive: did you mean '" + std::string(q.name) + "'?)";
            for (const FlowWord& w : flow_words)
                if (hint.empty() && equal_ignoring_ascii_case(w.name, base))
                    hint = " (unit names are case-sensitive: did you mean '" + std::string(w.name) + "'?)";
        }
        throw Error(ErrorKind::unit, msg + hint + "; known units: " + quantity_known_text());
    }
    QuantityUnit q;
    q.kind = b->kind;
    q.factor = b->factor;
    q.mol_per_m3 = b->mol_per_m3;
    q.seconds = t ? t->factor : 0.0;
    return q;
}

double quantity_to_mol(double quantity, std::string_view unit, std::optional<double> molar_mass) {
    const QuantityUnit q = quantity_unit(unit);
    require_finite(quantity, "the quantity");
    double mol = 0;
    switch (q.kind) {
    case QuantityKind::amount:
        mol = quantity * q.factor;
        break;
    case QuantityKind::mass:
        if (!molar_mass)
            throw Error(ErrorKind::unit, "the quantity unit " + quote(trim(unit)) +
                                             " is a mass: it needs the key species' molar mass");
        mol = quantity * q.factor / checked_molar_mass(molar_mass);
        break;
    case QuantityKind::volume:
        mol = quantity * q.factor * q.mol_per_m3;
        break;
    }
    if (q.is_rate()) mol /= q.seconds;
    if (!std::isfinite(mol))
        throw Error(ErrorKind::argument, "the quantity " + number_words(quantity) + " " + quote(trim(unit)) +
                                             " is too large: in " + (q.is_rate() ? "mol/s" : "mol") +
                                             " it passes the largest number a double holds (about 1.8e+308)");
    return mol;
}

// ---- heating values ------------------------------------------------------------------------------

namespace {

struct VolumeEnergy {
    std::string_view name;
    double J_per_m3;     // one of the unit, J per m³ of gas at its conditions
    double mol_per_m3;   // ideal-gas molar density at those conditions
    const char* conditions;
};
constexpr const char* normal_words = "0 \xC2\xB0" "C and 101.325 kPa";
constexpr const char* standard_words = "15 \xC2\xB0" "C and 101.325 kPa";
constexpr const char* scf_words = "60 \xC2\xB0" "F and 14.696 psia";
constexpr std::array<VolumeEnergy, 14> volume_energy_units{{
    {"MJ/Nm3", 1e6, normal_mol_per_m3, normal_words},
    {"MJ/Nm\xC2\xB3", 1e6, normal_mol_per_m3, normal_words},
    {"MJ/Nm^3", 1e6, normal_mol_per_m3, normal_words},
    {"kWh/Nm3", 3.6e6, normal_mol_per_m3, normal_words},
    {"kWh/Nm\xC2\xB3", 3.6e6, normal_mol_per_m3, normal_words},
    {"kWh/Nm^3", 3.6e6, normal_mol_per_m3, normal_words},
    {"MJ/Sm3", 1e6, standard_mol_per_m3, standard_words},
    {"MJ/Sm\xC2\xB3", 1e6, standard_mol_per_m3, standard_words},
    {"MJ/Sm^3", 1e6, standard_mol_per_m3, standard_words},
    {"kWh/Sm3", 3.6e6, standard_mol_per_m3, standard_words},
    {"kWh/Sm\xC2\xB3", 3.6e6, standard_mol_per_m3, standard_words},
    {"kWh/Sm^3", 3.6e6, standard_mol_per_m3, standard_words},
    {"BTU/scf", btu_J / ft3_m3, scf_mol_per_m3, scf_words},
    {"Btu/scf", btu_J / ft3_m3, scf_mol_per_m3, scf_words},
}};

const std::string& heating_known_text() {
    static const std::string text = [] {
        std::string t = "per mass " + join(mass_units) + " (default MJ/kg); per mole " + join(molar_units) +
                        "; per gas volume (ideal gas) ";
        for (const VolumeEnergy& v : volume_energy_units) {
            if (v.name.find('^') != std::string_view::npos || (v.name.back() != '3' && v.name.back() != 'f'))
                continue;  // one spelling of each in the list
            t += std::string(v.name) + " (" + v.conditions + "), ";
        }
        t.resize(t.size() - 2);
        return t + "; Nm3 and Sm3 also written Nm\xC2\xB3, Nm^3, Sm\xC2\xB3, Sm^3";
    }();
    return text;
}

}  // namespace

HeatingValueUnit heating_value_unit(std::string_view unit_text) {
    const std::string unit = normalise(unit_text);
    HeatingValueUnit u;
    u.name = unit.empty() ? std::string("MJ/kg") : unit;
    if (const Named* m = find(mass_units, u.name)) {
        u.per = HeatingPer::mass;
        u.factor = m->factor;
        return u;
    }
    if (const Named* m = find(molar_units, u.name)) {
        u.per = HeatingPer::mole;
        u.factor = m->factor;
        return u;
    }
    for (const VolumeEnergy& v : volume_energy_units)
        if (v.name == u.name) {
            u.per = HeatingPer::volume;
            u.factor = v.J_per_m3;
            u.mol_per_m3 = v.mol_per_m3;
            u.conditions = v.conditions;
            return u;
        }
    std::string hint;
    add_case_hint(hint, mass_units, u.name);
    add_case_hint(hint, molar_units, u.name);
    for (const VolumeEnergy& v : volume_energy_units)
        if (hint.empty() && equal_ignoring_ascii_case(v.name, u.name))
            hint = " (unit names are case-sensitive: did you mean '" + std::string(v.name) + "'?)";
    if (hint.empty() && (u.name == "MJ/m3" || u.name == "MJ/m\xC2\xB3" || u.name == "kWh/m3" || u.name == "BTU/ft3" ||
                         u.name == "Btu/ft3"))
        hint = " (a gas volume needs its conditions: Nm3 at 0 \xC2\xB0" "C, Sm3 at 15 \xC2\xB0" "C, scf at 60 \xC2\xB0" "F)";
    throw Error(ErrorKind::unit, "unknown heating-value unit " + quote(unit_text) + hint + "; known units: " +
                                     heating_known_text());
}

double heating_value_in(double J_per_mol, const HeatingValueUnit& u, double molar_mass) {
    require_finite(J_per_mol, "the heating value");
    switch (u.per) {
    case HeatingPer::mole: return J_per_mol / u.factor;
    case HeatingPer::mass: return J_per_mol / checked_molar_mass(molar_mass) / u.factor;
    case HeatingPer::volume: return J_per_mol * u.mol_per_m3 / u.factor;
    }
    return 0;
}

// ---- load results -------------------------------------------------------------------------------

double load_result(double J_or_W, std::string_view unit_text, bool rate, const char* what,
                   std::string_view quantity_unit_text) {
    const std::string unit = hour_as_h(normalise(unit_text));
    const std::string_view name =
        unit.empty() ? (rate ? default_rate_unit : default_total_unit) : std::string_view(unit);
    const Named* same = rate ? find(rate_units, name) : find(total_units, name);
    if (!same) {
        const std::string q = quantity_unit_text.empty() ? std::string() : quote(trim(quantity_unit_text));
        if (rate && find(total_units, name)) {
            throw Error(ErrorKind::unit,
                        (q.empty() ? std::string("the quantity") : q) +
                            " is a flow: give a power unit such as kW, MW, BTU/h, TR (not the "
                            "energy unit " + quote(unit_text) + "); power units: " + join(rate_units) +
                            std::string(hr_note));
        }
        if (!rate && find(rate_units, name)) {
            throw Error(ErrorKind::unit,
                        (q.empty() ? std::string("the quantity") : q) +
                            " is a total, not a flow: give an energy unit such as kJ, MJ, kWh, BTU "
                            "(not the power unit " + quote(unit_text) +
                            "), or give the quantity per time (e.g. kg/h) for a power; energy "
                            "units: " + join(total_units));
        }
        std::string hint;
        add_case_hint(hint, total_units, name);
        add_case_hint(hint, rate_units, name);
        if (hint.empty() && (find(molar_units, name) || find(mass_units, name)))
            hint = " (that is an energy per amount; a load is an energy, e.g. kJ, or a power, e.g. kW)";
        throw Error(ErrorKind::unit, "unknown result unit " + quote(unit_text) + hint +
                                         "; known units: totals " + join(total_units) +
                                         "; flows (power) " + join(rate_units) + std::string(hr_note));
    }
    require_finite(J_or_W, what);
    const double v = J_or_W / same->factor;
    return v;
}

}  // namespace rxnheat::detail

// ---- temperature --------------------------------------------------------------------------------

namespace rxnheat {
namespace {

const char* const temperature_forms =
    "a number in kelvin, or a number and a unit: K, C, \xC2\xB0" "C, degC, F, \xC2\xB0" "F, degF, "
    "R, \xC2\xB0R, degR (R is Rankine), e.g. '350 C', '662 F', '623.15 K'";

enum class Scale { kelvin, celsius, fahrenheit, rankine };

// The unit after the number; false if it is none of the accepted forms.
bool temperature_scale(std::string_view u, Scale& scale) {
    if (u.empty() || u == "K") return scale = Scale::kelvin, true;
    // Degree sign (U+00B0), the masculine ordinal (U+00BA) and the ring above (U+02DA), which
    // pasted text often has in its place; "deg".
    for (std::string_view deg : {"\xC2\xB0", "\xC2\xBA", "\xCB\x9A", "deg"}) {
        if (u.size() == deg.size() + 1 && u.substr(0, deg.size()) == deg) {
            u = u.substr(deg.size());
            break;
        }
    }
    if (u == "C" || u == "\xE2\x84\x83") return scale = Scale::celsius, true;     // also U+2103 ℃
    if (u == "F" || u == "\xE2\x84\x89") return scale = Scale::fahrenheit, true;  // also U+2109 ℉
    if (u == "R") return scale = Scale::rankine, true;
    return false;
}

}  // namespace

double parse_temperature(std::string_view text) {
    using detail::quote;
    const std::string_view s = detail::trim(text);
    if (s.empty())
        throw Error(ErrorKind::argument, "the temperature is empty; give " + std::string(temperature_forms));

    // Sign: '+', '-' or the Unicode minus sign U+2212 (pasted text).
    std::string_view rest = s;
    bool negative = false;
    if (rest[0] == '+' || rest[0] == '-') {
        negative = rest[0] == '-';
        rest.remove_prefix(1);
    } else if (rest.size() >= 3 && rest.substr(0, 3) == "\xE2\x88\x92") {
        negative = true;
        rest.remove_prefix(3);
    }
    bool starts_numeric = !rest.empty() && ((rest[0] >= '0' && rest[0] <= '9') || rest[0] == '.');
    double x = 0;
    const char* end = rest.data();
    if (starts_numeric) {
        const auto r = std::from_chars(rest.data(), rest.data() + rest.size(), x, std::chars_format::general);
        if (r.ec == std::errc::result_out_of_range)
            throw Error(ErrorKind::argument,
                        "the temperature " + quote(text) +
                            (detail::underflows(rest.substr(0, static_cast<std::size_t>(r.ptr - rest.data())))
                                 ? " holds a number that underflows: it is closer to zero than a double can "
                                   "hold (about 2.2e-308)"
                                 : " is not a finite number"));
        if (r.ec != std::errc()) starts_numeric = false;
        end = r.ptr;
    }
    if (!starts_numeric) {
        const bool looks_non_finite = detail::starts_with_ignoring_ascii_case(rest, "nan") ||
                                       detail::starts_with_ignoring_ascii_case(rest, "inf");
        throw Error(ErrorKind::argument,
                    "the temperature " + quote(text) +
                        (looks_non_finite ? " is not a finite number" : " does not start with a number") +
                        "; give " + temperature_forms);
    }
    if (negative) x = -x;
    std::string_view unit = rest.substr(static_cast<std::size_t>(end - rest.data()));
    unit = detail::trim(unit);

    Scale scale = Scale::kelvin;
    if (!temperature_scale(unit, scale)) {
        std::string hint;
        if (!unit.empty() && unit[0] == ',')
            hint = " (use '.' as the decimal point)";
        else if (unit == "k" || unit == "c" || unit == "f" || unit == "r")
            hint = " (units are case-sensitive: write it in capitals)";
        throw Error(ErrorKind::unit, "unknown temperature unit " + quote(unit) + " in " + quote(text) +
                                         hint + "; give " + temperature_forms);
    }
    double T = x;
    switch (scale) {
    case Scale::kelvin: break;
    case Scale::celsius: T = x + detail::unit_def::T_zero_C; break;
    case Scale::fahrenheit: T = (x + 459.67) * 5.0 / 9.0; break;
    case Scale::rankine: T = x * 5.0 / 9.0; break;
    }
    if (!std::isfinite(T))
        throw Error(ErrorKind::argument, "the temperature " + quote(text) + " is too large");
    if (T < 0)
        throw Error(ErrorKind::argument, "the temperature " + quote(text) + " is below absolute zero (" +
                                             detail::format_number(T) + " K)");
    // 0 K and the denormal numbers just above it are no temperature any function can use (they
    // divide, or lose their digits): said here, where the text is read, not later in a data error.
    if (T == 0)
        throw Error(ErrorKind::argument, "the temperature " + quote(text) +
                                             " is absolute zero (0 K); give a temperature above it");
    if (T < DBL_MIN)
        throw Error(ErrorKind::argument, "the temperature " + quote(text) + " is " + number_words(T) +
                                             " K, too close to 0 K to compute with (a denormal number, below "
                                             "2.2e-308)");
    return T;
}

}  // namespace rxnheat

// ---- pressure -----------------------------------------------------------------------------------

namespace rxnheat::detail {
namespace {

const char* const pressure_forms =
    "a number in bar (absolute), or a number and a unit: bar, bara, Pa, kPa, MPa, atm, psia (absolute), "
    "barg, psig (gauge, over 101.325 kPa), e.g. '20 bar', '2 MPa', '150 psig'";

struct PressureUnit {
    std::string_view name;
    double bar;     ///< one unit in bar
    bool gauge;     ///< over the standard atmosphere
};
// 1 bar = 1e5 Pa exactly; atm = 101325 Pa exactly; psi = lbf/in² (unit_def::psi_Pa).
constexpr double Pa_bar = 1e-5;
const std::array<PressureUnit, 9> pressure_units = {{
    {"bar", 1.0, false},
    {"bara", 1.0, false},
    {"barg", 1.0, true},
    {"Pa", Pa_bar, false},
    {"kPa", 1e3 * Pa_bar, false},
    {"MPa", 1e6 * Pa_bar, false},
    {"atm", unit_def::atm_Pa * Pa_bar, false},
    {"psia", unit_def::psi_Pa * Pa_bar, false},
    {"psig", unit_def::psi_Pa * Pa_bar, true},
}};

bool same_ignoring_ascii_case(std::string_view a, std::string_view b) {
    if (a.size() != b.size()) return false;
    for (std::size_t i = 0; i < a.size(); ++i)
        if (ascii_lower(a[i]) != ascii_lower(b[i])) return false;
    return true;
}

}  // namespace

double parse_pressure(std::string_view text) {
    const std::string_view s = trim(text);
    if (s.empty()) throw Error(ErrorKind::argument, "the pressure is empty; give " + std::string(pressure_forms));
    std::string_view rest = s;
    bool negative = false;
    if (rest[0] == '+' || rest[0] == '-') {
        negative = rest[0] == '-';
        rest.remove_prefix(1);
    } else if (rest.size() >= 3 && rest.substr(0, 3) == "\xE2\x88\x92") {  // U+2212 minus (pasted text)
        negative = true;
        rest.remove_prefix(3);
    }
    double x = 0;
    const bool numeric = !rest.empty() && ((rest[0] >= '0' && rest[0] <= '9') || rest[0] == '.');
    const auto r = numeric ? std::from_chars(rest.data(), rest.data() + rest.size(), x, std::chars_format::general)
                           : std::from_chars_result{rest.data(), std::errc::invalid_argument};
    if (r.ec == std::errc::result_out_of_range)
        throw Error(ErrorKind::argument,
                    "the pressure " + quote(text) +
                        (underflows(rest.substr(0, static_cast<std::size_t>(r.ptr - rest.data())))
                             ? " holds a number that underflows: it is closer to zero than a double can hold "
                               "(about 2.2e-308)"
                             : " is not a finite number"));
    if (r.ec != std::errc())
        throw Error(ErrorKind::argument,
                    "the pressure " + quote(text) + " does not start with a number; give " + pressure_forms);
    if (negative) x = -x;
    const std::string_view unit = trim(rest.substr(static_cast<std::size_t>(r.ptr - rest.data())));
    const PressureUnit* found = nullptr;
    if (unit.empty()) {
        found = &pressure_units[0];
    } else {
        for (const auto& u : pressure_units)
            if (u.name == unit) found = &u;
    }
    if (!found) {
        std::string hint;
        if (unit == "psi")
            hint = " (psi alone does not say whether it is absolute or gauge: write psia or psig)";
        else if (!unit.empty() && unit[0] == ',')
            hint = " (use '.' as the decimal point)";
        else
            for (const auto& u : pressure_units)
                if (same_ignoring_ascii_case(u.name, unit)) hint = " (units are case-sensitive: did you mean " + quote(u.name) + "?)";
        throw Error(ErrorKind::unit, "unknown pressure unit " + quote(unit) + " in " + quote(text) + hint + "; give " +
                                         pressure_forms);
    }
    const double p = x * found->bar + (found->gauge ? unit_def::atm_Pa * Pa_bar : 0.0);
    if (!std::isfinite(p)) throw Error(ErrorKind::argument, "the pressure " + quote(text) + " is too large");
    if (p <= 0)
        throw Error(ErrorKind::argument, "the pressure " + quote(text) + " is not above zero absolute (" +
                                             format_number(p) + " bar); give an absolute pressure above 0");
    return p;
}

}  // namespace rxnheat::detail
