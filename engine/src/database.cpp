// The embedded data set, indexed, and species resolution (engine/DATA.md, Identity and Phases).
#include "database.hpp"

#include "rxnheat/rxnheat.hpp"
#include "usertable.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <limits>
#include <set>
#include <stdexcept>

namespace rxnheat::detail {

std::string lower(std::string_view s) {
    std::string out(s);
    for (char& c : out)
        if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
    return out;
}

std::string rational_text(const Rational& r) { return r.str(); }  // "n" or "n/d", as cpp_rational writes it

double to_double(const Rational& r) { return r.convert_to<double>(); }

namespace {

Rational rational_from_count(double x) {
    // NASA element counts are written with at most 5 decimals.
    const long long scaled = std::llround(x * 100000.0);
    return Rational(scaled, 100000);
}

/// Exact: each element's count as a rational ("H2 O1", "C1/3"), never a formatted decimal, so
/// that only equal compositions share a key (H2O0.9999999 is not water).
std::string key_of(const std::vector<std::pair<std::string, Rational>>& atoms, int charge) {
    // Sorted by symbol through indices (no copy of the symbols or counts: keys are built for
    // every term of every new reaction).
    std::array<std::uint16_t, 64> small_order;
    std::vector<std::uint16_t> large_order;
    std::uint16_t* order = small_order.data();
    if (atoms.size() > small_order.size()) {
        large_order.resize(atoms.size());
        order = large_order.data();
    }
    for (std::size_t i = 0; i < atoms.size(); ++i) order[i] = static_cast<std::uint16_t>(i);
    std::stable_sort(order, order + atoms.size(),
                     [&](std::uint16_t a, std::uint16_t b) { return atoms[a].first < atoms[b].first; });
    std::string key;
    key.reserve(atoms.size() * 6 + 8);
    for (std::size_t i = 0; i < atoms.size(); ++i) {
        const auto& [symbol, count] = atoms[order[i]];
        Rational n = count;
        while (i + 1 < atoms.size() && atoms[order[i + 1]].first == symbol) n += atoms[order[++i]].second;
        if (n == 0) continue;
        key += symbol;
        key += n.str();
        key += ' ';
    }
    key += "|q";
    key += std::to_string(charge);
    return key;
}

std::string key_of(const Record& r) {
    std::vector<std::pair<std::string, Rational>> atoms;
    for (const auto& [s, n] : r.elements) atoms.emplace_back(s, rational_from_count(n));
    return key_of(std::move(atoms), r.charge);
}

// The substance part of a record's name: for condensed records the final phase tag is
// removed ("Ca(OH)2(cr)" -> "Ca(OH)2", "C8H18(L),n-octa" -> "C8H18"); the isomer tag after a
// comma is returned separately.
std::pair<std::string, std::string> base_and_tag(const Record& r) {
    std::string main = r.name, tag;
    if (auto comma = main.find(','); comma != std::string::npos) {
        tag = main.substr(comma + 1);
        main = main.substr(0, comma);
    }
    if (r.phase != PhaseKind::gas) {
        if (auto open = main.rfind('('); open != std::string::npos && open > 0) main = main.substr(0, open);
    }
    return {main, tag};
}

bool tags_compatible(const std::string& a, const std::string& b) {
    if (a.empty() || b.empty()) return a.empty() && b.empty();
    const auto n = std::min(a.size(), b.size());
    return a.compare(0, n, b, 0, n) == 0;  // the file truncates long names
}

char phase_char(PhaseKind p) { return p == PhaseKind::gas ? 'g' : p == PhaseKind::liquid ? 'l' : 's'; }

const char* phase_word(char p) {
    switch (p) {
    case 'g': return "gas";
    case 'l': return "liquid";
    case 's': return "solid";
    default: return "aqueous";
    }
}


}  // namespace

bool covers(const Record& r, double T) {
    if (r.intervals.empty()) return std::fabs(T - r.t_single) < 0.005;
    return T >= r.tmin() - 1e-6 && T <= r.tmax() + 1e-6;
}

const Interval& interval_at(const Record& r, double T) {
    for (const auto& iv : r.intervals)
        if (T <= iv.tmax + 1e-6) return iv;
    return r.intervals.back();
}

namespace {

std::uint64_t fnv1a(std::string_view s, std::uint64_t h = 1469598103934665603ull) {
    for (unsigned char c : s) {
        h ^= c;
        h *= 1099511628211ull;
    }
    return h;
}

}  // namespace

std::string Composition::key() const { return key_of(atoms, charge); }

// ---------------------------------------------------------------------------------------------
// Substance

std::string charge_suffix(int charge) {
    if (charge == 0) return {};
    const char sign = charge > 0 ? '+' : '-';
    const int n = charge > 0 ? charge : -charge;
    return n == 1 ? std::string(1, sign) : "^" + std::to_string(n) + sign;
}

std::string Substance::identity() const {
    if (aqueous) return "aq:" + aqueous->label;
    if (user) return "user:" + user->formula + charge_suffix(composition.charge) + "(" + phase + ")";
    std::string id(1, phase_assumed ? '?' : phase);
    for (const Record* r : phase_assumed ? candidates : records) id += "|" + r->name;
    return id;
}

namespace {

double gibbs(const Record& r, double T) {
    const Interval& iv = interval_at(r, T);
    return R_nasa * T * (h_over_RT(iv, T) - s_over_R(iv, T));
}

/// Lowest G° at T among the records that cover T with polynomials; nullptr if none does.
const Record* stable_among(const std::vector<const Record*>& records, double T) {
    const Record* best = nullptr;
    double best_G = std::numeric_limits<double>::infinity();
    for (const Record* r : records) {
        if (r->intervals.empty() || !covers(*r, T)) continue;
        const double G = gibbs(*r, T);
        if (G < best_G) {
            best_G = G;
            best = r;
        }
    }
    return best;
}

void need_polynomial(const Substance& s, const Record& r, double T, const char* what) {
    if (r.intervals.empty())
        throw Error(ErrorKind::out_of_range, s.display_at(T) + ": the NASA Glenn record '" + r.name +
                                                 "' gives only the enthalpy at " + number_words(r.t_single) +
                                                 " K, no " + what);
}

}  // namespace

namespace {

/// The full citation of a data/aqueous.csv source cell ("CODATA 1989; Cp NBS 1982").
std::string aqueous_citation(const std::string& source) {
    std::string out;
    if (source.find("CODATA 1989") != std::string::npos)
        out += "CODATA Key Values for Thermodynamics, Cox, Wagman & Medvedev 1989";
    if (source.find("NBS 1982") != std::string::npos)
        out += std::string(out.empty() ? "" : "; ") +
               "NBS tables of chemical thermodynamic properties, Wagman et al. 1982";
    return out;
}

void check_aqueous_range(const AqueousSpecies& a, const std::string& shown, double T) {
    if (!std::isfinite(T) || T <= 0)
        throw Error(ErrorKind::argument, "temperature must be a positive number of kelvin");
    if (!a.row.has_cp) {
        if (std::fabs(T - T_ref) < 0.005) return;
        throw Error(ErrorKind::out_of_range,
                    shown + ": data/aqueous.csv gives it at 298.15 K only (line " + std::to_string(a.row.line) +
                        " has no Cp°); " + number_words(T) + " K is outside that");
    }
    if (T < aqueous_tmin_K - 1e-6 || T > aqueous_tmax_K + 1e-6)
        throw Error(ErrorKind::out_of_range,
                    shown + ": data/aqueous.csv covers " + number_words(aqueous_tmin_K) + "–" +
                        number_words(aqueous_tmax_K) + " K (constant Cp° from 298.15 K); " + number_words(T) +
                        " K is outside it");
}

}  // namespace

const Record& Substance::record_at(double T) const {
    if (aqueous || user)
        throw Error(ErrorKind::internal, display + " has no NASA Glenn record");
    if (!std::isfinite(T) || T <= 0)
        throw Error(ErrorKind::argument, "temperature must be a positive number of kelvin");
    if (phase_assumed) {
        if (const Record* r = stable_among(candidates, T)) return *r;
        throw Error(ErrorKind::out_of_range,
                    label + ": no phase was written, and none of its data covers " + number_words(T) +
                        " K (the data cover " + range_text() + "; rxnheat never extrapolates)");
    }
    for (const Record* r : records)
        if (covers(*r, T)) return *r;
    throw Error(ErrorKind::out_of_range, display + ": the data cover " + range_text() + "; " + number_words(T) +
                                             " K is outside them (rxnheat never extrapolates)");
}

char Substance::phase_at(double T) const {
    if (aqueous || user || !phase_assumed) return phase;
    return phase_char(record_at(T).phase);
}

std::string Substance::display_at(double T) const {
    if (aqueous || user || !phase_assumed) return display;
    return label + "(" + std::string(1, phase_at(T)) + ")";
}

double Substance::H(double T) const {
    if (aqueous) {
        check_aqueous_range(*aqueous, display, T);
        return aqueous->row.dHf_J_per_mol + (aqueous->row.has_cp ? aqueous->row.Cp_J_per_molK * (T - T_ref) : 0.0);
    }
    if (user) return user->H(T, display);
    const Record& r = record_at(T);
    // At 298.15 K itself the tabulated ΔfH° is used (the polynomial reproduces it to within
    // 1 J/mol, but reference elements should give exactly zero).
    if (r.intervals.empty() || std::fabs(T - T_ref) < 1e-9) return r.h298;
    return h_over_RT(interval_at(r, T), T) * R_nasa * T;
}

double Substance::S(double T) const {
    if (aqueous) {
        check_aqueous_range(*aqueous, display, T);
        return aqueous->row.S_J_per_molK + (aqueous->row.has_cp ? aqueous->row.Cp_J_per_molK * std::log(T / T_ref) : 0.0);
    }
    if (user) return user->S(T, display);
    const Record& r = record_at(T);
    need_polynomial(*this, r, T, "entropy");
    return s_over_R(interval_at(r, T), T) * R_nasa;
}

double Substance::Cp(double T) const {
    if (aqueous) {
        if (!aqueous->row.has_cp)
            throw Error(ErrorKind::unknown_species, display + ": data/aqueous.csv gives no Cp° for it (line " +
                                                        std::to_string(aqueous->row.line) + ")");
        check_aqueous_range(*aqueous, display, T);
        return aqueous->row.Cp_J_per_molK;
    }
    if (user) return user->Cp(T, display);
    const Record& r = record_at(T);
    need_polynomial(*this, r, T, "heat capacity");
    return cp_over_R(interval_at(r, T), T) * R_nasa;
}

std::string Substance::range_text() const {
    if (aqueous)
        return aqueous->row.has_cp ? number_words(aqueous_tmin_K) + "–" + number_words(aqueous_tmax_K) + " K"
                                   : std::string("298.15 K only");
    if (user) return user->range_text();
    std::string out;
    for (const Record* r : phase_assumed ? candidates : records) {
        if (!out.empty()) out += ", ";
        if (r->intervals.empty())
            out += number_words(r->t_single) + " K only";
        else
            out += number_words(r->tmin()) + "–" + number_words(r->tmax()) + " K";
        out += " ('" + r->name + "')";
    }
    return out;
}

std::string Substance::source(double T) const {
    if (aqueous) {
        const AqueousRow& a = aqueous->row;
        std::string out = display + ": data/aqueous.csv line " + std::to_string(a.line) + ", " + a.source + " (" +
                          aqueous_citation(a.source) + ")";
        if (a.from_memory) out += "; the values were typed from memory (check them against the printed tables)";
        if (!a.has_cp)
            out += ". No Cp° given: used at 298.15 K only";
        else if (std::fabs(T - T_ref) >= 1e-9)
            out += ". At " + number_words(T) + " K: taken from 298.15 K with Cp° held constant at " +
                   number_words(a.Cp_J_per_molK) + " J/(mol·K) (an assumption; used only within " +
                   number_words(aqueous_tmin_K) + "–" + number_words(aqueous_tmax_K) + " K)";
        return out;
    }
    if (user) return display + ": user species table row " + std::to_string(user->row) +
                     (user->source.empty() ? "" : " (" + user->source + ")");
    // The records of the phase used at T (all of them: polymorphs and continued records).
    std::vector<const Record*> used = records;
    std::string out = display_at(T);
    if (phase_assumed) {
        const char p = phase_at(T);
        used.clear();
        for (const Record* r : candidates)
            if (phase_char(r->phase) == p) used.push_back(r);
    }
    out += ": NASA Glenn record";
    out += used.size() > 1 ? "s " : " ";
    for (std::size_t i = 0; i < used.size(); ++i) {
        const Record* r = used[i];
        if (i) out += "; ";
        out += "'" + r->name + "' [" + r->date_code + "] " + r->comment;
    }
    out += " — McBride, Zehe & Gordon, NASA/TP-2002-211556";
    if (phase_assumed)
        out += ". No phase was written: the " + std::string(phase_word(phase_at(T))) + " is the phase of lowest G° at " +
               number_words(T) + " K and 1 bar";
    if (!phase_assumed && phase == 'l' && !vapour.empty()) {
        // A written liquid where the gas is the stable phase at 1 bar: allowed (a pressurised
        // liquid), but said.
        const Record* gas = stable_among(vapour, T);
        const Record* liquid = nullptr;
        for (const Record* r : records)
            if (!r->intervals.empty() && covers(*r, T)) liquid = r;
        if (gas && liquid && gibbs(*gas, T) < gibbs(*liquid, T))
            out += ". Note: the liquid is used at " + number_words(T) +
                   " K, above its 1-bar boiling point (a pressurised liquid; write (g) for the vapour)";
    }
    return out;
}

// ---------------------------------------------------------------------------------------------
// Database

const Database& Database::get() {
    static const Database db(embedded_thermo_inp(), embedded_elements_csv(), embedded_aliases_csv(),
                             embedded_aqueous_csv());
    return db;
}

Database::Database(std::string_view thermo, std::string_view elements, std::string_view aliases,
                   std::string_view aqueous)
    : records_(parse_nasa_glenn(thermo)),
      elements_(parse_elements_csv(elements)),
      aliases_(parse_aliases_csv(aliases)) {
    for (const auto& e : elements_) by_symbol_.emplace(e.symbol, &e);
    for (const auto& r : records_) {
        by_name_.emplace(r.name, &r);
        by_composition_[key_of(r)].push_back(&r);
        if (r.comment.find("Ref-Elm") != std::string::npos && r.elements.size() == 1 && r.charge == 0)
            reference_forms_[r.elements.front().first].push_back(&r);
    }
    for (auto& [sym, list] : reference_forms_)
        std::sort(list.begin(), list.end(), [](const Record* a, const Record* b) { return a->tmin() < b->tmin(); });
    for (const auto& a : aliases_) {
        by_alias_.emplace(lower(a.name), &a);
        std::vector<std::string> names = a.solid;
        names.push_back(a.gas);
        names.push_back(a.liquid);
        for (const auto& n : names)
            if (const Record* r = record(n)) alias_of_.emplace(r, a.name);
    }
    for (AqueousRow& row : parse_aqueous_csv(aqueous)) {
        // The file's formulas are read by the reaction grammar, so a row means what the same
        // text in a reaction means; a formula the grammar reads otherwise is an error here.
        auto fail = [&row](const std::string& what) {
            throw std::runtime_error("aqueous.csv line " + std::to_string(row.line) + ", column 'formula': " + what);
        };
        AqueousSpecies a;
        try {
            a.parsed = grammar::parse_species(row.formula);
        } catch (const grammar::ParseError& e) {
            fail(e.what());
        }
        if (a.parsed.is_name || !a.parsed.phase.empty()) fail("'" + row.formula + "' is not a formula without a phase");
        for (const auto& atom : a.parsed.atoms)
            if (!element(atom.symbol)) fail("'" + atom.symbol + "' is not an element symbol");
        a.label = a.parsed.formula + charge_suffix(a.parsed.charge);
        if (a.label != row.formula)
            fail("write '" + row.formula + "' as '" + a.label + "', the way the engine writes it back");
        a.composition = composition(a.parsed);
        a.molar_mass = molar_mass(a.composition);
        a.row = std::move(row);
        aqueous_.push_back(std::move(a));
    }
    for (const AqueousSpecies& a : aqueous_) {
        aqueous_by_label_.emplace(a.label, &a);
        if (!a.row.name.empty()) aqueous_by_name_.emplace(lower(a.row.name), &a);
        aqueous_by_composition_[a.composition.key()].push_back(&a);
    }
    char buf[32];
    std::snprintf(buf, sizeof buf, "%016llx",
                  static_cast<unsigned long long>(fnv1a(aqueous, fnv1a(aliases, fnv1a(elements, fnv1a(thermo))))));
    identity_ = std::string("data set ") + buf + " (NASA Glenn thermo.inp, " + std::to_string(records_.size()) +
                " records; " + std::to_string(elements_.size()) + " atomic weights; " +
                std::to_string(aliases_.size()) + " names; " + std::to_string(aqueous_.size()) + " aqueous species)";
}

const Element* Database::element(std::string_view symbol) const {
    auto it = by_symbol_.find(std::string(symbol));
    return it == by_symbol_.end() ? nullptr : it->second;
}

const Alias* Database::alias(std::string_view name) const {
    auto it = by_alias_.find(lower(name));
    return it == by_alias_.end() ? nullptr : it->second;
}

const Record* Database::record(std::string_view name) const {
    if (name.empty()) return nullptr;
    auto it = by_name_.find(std::string(name));
    return it == by_name_.end() ? nullptr : it->second;
}

const std::vector<const Record*>& Database::reference_forms(const std::string& symbol) const {
    static const std::vector<const Record*> none;
    auto it = reference_forms_.find(symbol);
    return it == reference_forms_.end() ? none : it->second;
}

namespace {
Composition composition_of(const Record& r) {
    Composition c;
    for (const auto& [s, n] : r.elements) c.atoms.emplace_back(s, rational_from_count(n));
    std::sort(c.atoms.begin(), c.atoms.end(), [](const auto& a, const auto& b) { return a.first < b.first; });
    c.charge = r.charge;
    return c;
}

const Alias& known_alias(const Database& db, const grammar::Species& sp) {
    const Alias* a = db.alias(sp.name);
    if (!a)
        throw Error(ErrorKind::unknown_species,
                    "position " + std::to_string(sp.position) + ": '" + sp.name +
                        "' is not a name rxnheat knows (names are listed in data/aliases.csv); write the formula instead");
    return *a;
}
}  // namespace

Composition Database::composition(const grammar::Species& sp, const SpeciesTable* table) const {
    if (table && table->impl())
        if (auto user = find_user_species(*table->impl(), sp)) return composition(user->parsed);
    if (sp.is_name && sp.phase == "aq")
        if (const AqueousSpecies* a = aqueous(sp)) return a->composition;
    if (sp.is_name) {
        const Alias& a = known_alias(*this, sp);
        for (const std::string* n : {&a.gas, &a.liquid})
            if (const Record* r = record(*n)) return composition_of(*r);
        for (const auto& n : a.solid)
            if (const Record* r = record(n)) return composition_of(*r);
        throw Error(ErrorKind::internal, "alias '" + a.name + "' names no record");
    }
    Composition c;
    for (const auto& atom : sp.atoms) {
        if (!element(atom.symbol))
            throw Error(ErrorKind::syntax, "position " + std::to_string(atom.position) + ": '" + atom.symbol +
                                               "' is not an element symbol (symbols are case-sensitive: Co is cobalt, CO is carbon monoxide)");
        if (atom.count <= 0) continue;
        c.atoms.emplace_back(atom.symbol, atom.count);
    }
    std::sort(c.atoms.begin(), c.atoms.end(), [](const auto& a, const auto& b) { return a.first < b.first; });
    c.charge = sp.charge;
    return c;
}

double Database::molar_mass(const Composition& c) const {
    double m = 0;
    for (const auto& [s, n] : c.atoms) {
        const Element* e = element(s);
        if (!e) throw Error(ErrorKind::syntax, "'" + s + "' is not an element symbol");
        m += e->weight * to_double(n);
    }
    return m;
}

std::string Database::describe(const Record* r) const {
    auto it = alias_of_.find(r);
    if (it != alias_of_.end()) return it->second;
    return r->name;
}

const AqueousSpecies* Database::aqueous(const grammar::Species& sp) const {
    if (sp.is_name) {
        auto it = aqueous_by_name_.find(lower(sp.name));
        return it == aqueous_by_name_.end() ? nullptr : it->second;
    }
    const std::string label = sp.formula + charge_suffix(sp.charge);
    if (auto it = aqueous_by_label_.find(label); it != aqueous_by_label_.end()) return it->second;
    // The same atoms under another formula (HO- for OH-, C2H6O for C2H5OH): said, not taken,
    // since an isomer the table does not hold has the same composition.
    auto it = aqueous_by_composition_.find(composition(sp).key());
    if (it == aqueous_by_composition_.end()) return nullptr;
    std::string rows;
    for (const AqueousSpecies* a : it->second) rows += std::string(rows.empty() ? "" : ", ") + a->label + "(aq)";
    throw Error(ErrorKind::unknown_species,
                sp.written + ": data/aqueous.csv has no row for " + label + "(aq) as written; it has this composition as " +
                    rows + ". Write that formula if it is the species you mean");
}

Substance Database::resolve(const grammar::Species& written, const SpeciesTable* table) const {
    // A charged species written without a phase is an ion in water, as chemists mean it; a
    // gas-phase ion needs (g) written.
    grammar::Species sp_aq;
    const bool charged_unphased = written.phase.empty() && written.charge != 0;
    if (charged_unphased) {
        sp_aq = written;
        sp_aq.phase = "aq";
    }
    const grammar::Species& sp = charged_unphased ? sp_aq : written;
    const std::string shown = sp.is_name ? sp.name : sp.formula + charge_suffix(sp.charge);
    if (table && table->impl()) {
        if (auto user = find_user_species(*table->impl(), sp)) {
            Substance s;
            s.user = user;
            s.phase = user->phase;
            s.label = shown;
            s.display = shown + "(" + (s.phase == 'a' ? std::string("aq") : std::string(1, s.phase)) + ")";
            s.composition = composition(user->parsed);
            s.molar_mass = molar_mass(s.composition);
            return s;
        }
    }
    if (sp.phase == "aq") {
        if (sp.is_name && !aqueous(sp) && !alias(sp.name))
            known_alias(*this, sp);  // the unknown-name error, which says how to write a formula
        if (const AqueousSpecies* a = aqueous(sp)) {
            Substance s;
            s.aqueous = a;
            s.phase = 'a';
            s.label = sp.is_name ? sp.name : a->label;
            s.display = s.label + "(aq)";
            s.composition = a->composition;
            s.molar_mass = a->molar_mass;
            return s;
        }
        const std::string what = sp.is_name ? sp.name : shown;
        const std::string count = std::to_string(aqueous_.size());
        if (charged_unphased)
            throw Error(ErrorKind::unknown_species,
                        written.written + ": a charged species written without a phase is taken as aqueous (aq), "
                                          "and the built-in aqueous table (data/aqueous.csv, " + count +
                                          " species) has no " + what + "(aq); give it in a user species table "
                                          "(formula, phase aq, dHf), or write (g) for the gas-phase ion");
        throw Error(ErrorKind::unknown_species,
                    sp.written + ": the built-in aqueous table (data/aqueous.csv, " + count + " species) has no " +
                        what + "(aq); give it in a user species table (formula, phase aq, dHf)");
    }
    std::vector<const Record*> found;
    if (sp.is_name) {
        const Alias& a = known_alias(*this, sp);
        auto add = [&](const std::string& n) {
            if (const Record* r = record(n)) found.push_back(r);
        };
        if (sp.phase.empty() || sp.phase == "g") add(a.gas);
        if (sp.phase.empty() || sp.phase == "l") add(a.liquid);
        if (sp.phase.empty() || sp.phase == "s")
            for (const auto& n : a.solid) add(n);
        if (found.empty())
            throw Error(ErrorKind::phase, sp.written + ": the data have no " + phase_word(sp.phase[0]) +
                                              " form of " + a.name);
        return resolve_records(sp, std::move(found), shown, nullptr);
    }
    const Composition comp = composition(sp);
    auto it = by_composition_.find(comp.key());
    if (it == by_composition_.end())
        throw Error(ErrorKind::unknown_species,
                    "position " + std::to_string(sp.position) + ": no data for " + sp.written +
                        " (no NASA Glenn record has this composition" + (comp.charge ? " and charge" : "") + ")");
    std::set<char> phases_there;
    for (const Record* r : it->second) {
        phases_there.insert(phase_char(r->phase));
        if (sp.phase.empty() || sp.phase[0] == phase_char(r->phase)) found.push_back(r);
    }
    if (found.empty()) {
        std::string have;
        for (char p : phases_there) have += std::string(have.empty() ? "" : ", ") + phase_word(p);
        throw Error(ErrorKind::phase, "position " + std::to_string(sp.position) + ": no " +
                                          phase_word(sp.phase[0]) + " data for " + sp.formula +
                                          "; the data have it as: " + have);
    }
    std::vector<const Record*> named;
    for (const Record* r : found)
        if (lower(base_and_tag(*r).first) == lower(sp.formula)) named.push_back(r);
    if (!named.empty()) found = std::move(named);
    Substance s = resolve_records(sp, std::move(found), shown, &comp);
    if (s.phase == 'l') {
        // The gas records of the same substance (same name base), for the note in source().
        const std::string base = lower(base_and_tag(*s.records.front()).first);
        for (const Record* r : it->second)
            if (r->phase == PhaseKind::gas && lower(base_and_tag(*r).first) == base) s.vapour.push_back(r);
    }
    return s;
}

Substance Database::resolve_records(const grammar::Species& sp, std::vector<const Record*> found,
                                    const std::string& shown, const Composition* comp) const {
    // Group the records into substances: one substance may have several phases or polymorphs.
    struct Group {
        std::string base, tag;
        std::vector<const Record*> records;
    };
    std::vector<Group> groups;
    for (const Record* r : found) {
        // Plain references into the pair, not a structured binding: a lambda may capture one
        // only from C++20 on (GCC 12 accepts that in C++17, clang 14 refuses it).
        const auto base_tag = base_and_tag(*r);
        const std::string& base = base_tag.first;
        const std::string& tag = base_tag.second;
        auto g = std::find_if(groups.begin(), groups.end(), [&](const Group& g) {
            return lower(g.base) == lower(base) && tags_compatible(g.tag, tag);
        });
        if (g == groups.end()) {
            groups.push_back({base, tag, {}});
            g = groups.end() - 1;
        } else if (tag.size() > g->tag.size()) {
            g->tag = tag;
        }
        g->records.push_back(r);
    }
    if (groups.size() > 1) {
        std::string names;
        for (const auto& g : groups) names += std::string(names.empty() ? "" : ", ") + describe(g.records.front());
        std::string example = describe(groups.front().records.front());
        throw Error(ErrorKind::ambiguous_species,
                    sp.written + " is ambiguous: " + names + ". Name the one you mean, e.g. " + example +
                        (sp.phase.empty() ? "" : "(" + sp.phase + ")"));
    }
    auto& recs = groups.front().records;
    std::sort(recs.begin(), recs.end(), [](const Record* a, const Record* b) { return a->tmin() < b->tmin(); });
    Substance s;
    s.label = shown;
    char phase = 0;
    if (!sp.phase.empty()) {
        phase = sp.phase[0];
    } else {
        // No phase written: the phase stable at the evaluation temperature and 1 bar (lowest G°
        // among the substance's records that cover it), chosen at each evaluation. `phase` and
        // `records` name the phase at 298.15 K where one covers it, for labels without a T.
        s.phase_assumed = true;
        s.candidates = recs;
        const Record* at_ref = stable_among(recs, T_ref);
        if (!at_ref)
            for (const Record* r : recs)
                if (!r->intervals.empty()) at_ref = r;
        if (!at_ref)
            throw Error(ErrorKind::phase, sp.written + ": write its phase, (g), (l) or (s); its data give no "
                                                       "heat capacities that tell which phase is stable");
        phase = phase_char(at_ref->phase);
    }
    s.phase = phase;
    s.display = shown + "(" + std::string(1, phase) + ")";
    for (const Record* r : recs)
        if (phase_char(r->phase) == phase) s.records.push_back(r);
    s.composition = comp ? *comp : composition_of(*s.records.front());
    s.molar_mass = molar_mass(s.composition);
    return s;
}

}  // namespace rxnheat::detail
