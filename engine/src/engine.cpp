// rxnheat::Engine: the public functions, thin over prepared reactions and resolved species.
#include "rxnheat/rxnheat.hpp"

#include "chem.hpp"
#include "database.hpp"
#include "reaction.hpp"
#include "units.hpp"
#include "usertable.hpp"

#include <cmath>
#include <cstdio>
#include <set>

#ifndef RXNHEAT_VERSION
#define RXNHEAT_VERSION "0.0.0"
#endif

namespace rxnheat {

using detail::Database;
using detail::Prepared;
using detail::Rational;
using detail::Substance;

// What one engine owns: the data it reads (the embedded set, parsed once and shared by every
// engine) and its own cache of prepared reactions.
struct Engine::Impl {
    const Database& db;
    detail::PreparedCache cache;
    explicit Impl(const EngineOptions& o) : db(Database::get()), cache(o.prepared_cache_entries) {}
    std::shared_ptr<const Prepared> prepare(std::string_view text, const SpeciesTable* table) {
        return detail::prepare(text, table, &cache);
    }
};

Engine::Engine(const EngineOptions& options) : impl_(std::make_unique<Impl>(options)) {}
Engine::~Engine() = default;

Engine& Engine::shared() {
    static Engine engine{EngineOptions{}};
    return engine;
}

CacheStats Engine::cache_stats() const { return impl_->cache.stats(); }
void Engine::clear_cache() { impl_->cache.clear(); }

namespace {

void check_temperature(double T) {
    if (!std::isfinite(T) || T <= 0)
        throw Error(ErrorKind::argument, "the temperature must be a positive number of kelvin (got " + number_words(T) + ")");
}

grammar::Species parse_one_species(std::string_view text, const char* what) {
    detail::check_input_text(text, what);
    try {
        return grammar::parse_species(text);
    } catch (const grammar::ParseError& e) {
        throw Error(ErrorKind::syntax, std::string(what) + ": " + e.what());
    }
}

Substance resolve_one(std::string_view text, const SpeciesTable* table) {
    const auto sp = parse_one_species(text, "the species");
    return Database::get().resolve(sp, table);
}

/// Value per mole of extent -> per mole (or mass) of the `per` species, in `unit`.
double per_extent_in_unit(const Prepared& p, double J_per_mol, std::string_view unit, std::string_view per,
                          const SpeciesTable* table, double T) {
    if (per.empty()) return detail::from_J_per_mol(J_per_mol, unit);
    const auto key = parse_one_species(per, "the 'per' species");
    std::size_t idx = 0;
    const Rational nu = p.key_coefficient(key, table, T, &idx);
    const double n = std::fabs(detail::to_double(nu));
    return detail::from_J_per_mol(J_per_mol / n, unit, p.substances[idx].molar_mass);
}

Rational rational_from_double(double x) {
    // The simplest fraction that is the double to 12 significant digits (0.5 -> 1/2,
    // 0.333333333333 -> 1/3); otherwise the decimal itself.
    long long h0 = 0, h1 = 1, k0 = 1, k1 = 0;
    double v = x;
    for (int i = 0; i < 40; ++i) {
        const double a = std::floor(v);
        if (std::fabs(a) > 1e12) break;
        const long long ai = static_cast<long long>(a);
        const long long h2 = ai * h1 + h0, k2 = ai * k1 + k0;
        if (k2 > 1000000) break;
        h0 = h1, h1 = h2, k0 = k1, k1 = k2;
        if (std::fabs(static_cast<double>(h1) / static_cast<double>(k1) - x) <= 1e-12 * std::fabs(x)) return Rational(h1, k1);
        const double frac = v - a;
        if (frac < 1e-15) break;
        v = 1.0 / frac;
    }
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.12g", x);
    return grammar::parse_number(buf);
}

std::string scaled(const Prepared& prepared, const Rational& factor) {
    if (factor <= 0)
        throw Error(ErrorKind::argument, "the factor must be above zero (to exchange the sides, reverse the reaction)");
    const Prepared* p = &prepared;
    std::vector<Rational> l, r;
    for (const auto& t : p->ast.reactants) l.push_back(t.coefficient * factor);
    for (const auto& t : p->ast.products) r.push_back(t.coefficient * factor);
    return detail::reaction_text(p->ast, l, r);
}

HeatKind kind_of(double dH_kJ, double tolerance_kJ) {
    if (std::fabs(dH_kJ) <= tolerance_kJ) return HeatKind::thermoneutral;
    return dH_kJ < 0 ? HeatKind::exothermic : HeatKind::endothermic;
}

bool looks_like_reaction(std::string_view s) {
    for (const char* arrow : {"->", "=", "\xE2\x86\x92", "\xE2\x9F\xB6", "\xE2\x87\x8C"})
        if (s.find(arrow) != std::string_view::npos) return true;
    return false;
}

/// ΔfH° of a species at T: its H°(T) minus that of its elements in their reference forms.
double formation_enthalpy(const Substance& s, double T) {
    check_temperature(T);
    if (std::fabs(T - T_ref) < 1e-9) return s.H(T_ref);
    const Database& db = Database::get();
    double h = s.H(T);
    auto element_h = [&](const std::string& sym) {
        for (const detail::Record* r : db.reference_forms(sym)) {
            if (r->intervals.empty() || T < r->tmin() - 1e-6 || T > r->tmax() + 1e-6) continue;
            double atoms = 0;
            for (const auto& e : r->elements) atoms += e.second;
            for (const auto& iv : r->intervals)
                if (T <= iv.tmax + 1e-6) return detail::h_over_RT(iv, T) * detail::R_nasa * T / atoms;
        }
        throw Error(ErrorKind::out_of_range, "no reference-state data for the element " + sym + " at " + number_words(T) +
                                                 " K, so ΔfH° there cannot be formed");
    };
    for (const auto& [sym, n] : s.composition.atoms) h -= detail::to_double(n) * element_h(sym);
    if (s.composition.charge) {
        const detail::Record* e = db.record("e-");
        if (!e) throw Error(ErrorKind::internal, "no electron record");
        Substance el;
        el.display = "e-";
        el.records = {e};
        h -= -s.composition.charge * el.H(T);
    }
    return h;
}

}  // namespace

double Engine::dh(std::string_view reaction, const Conditions& at, std::string_view unit, std::string_view per) {
    check_temperature(at.temperature_K);
    const auto p = impl_->prepare(reaction, at.table);
    return per_extent_in_unit(*p, p->dH(at.temperature_K), unit, per, at.table, at.temperature_K);
}

double Engine::du(std::string_view reaction, const Conditions& at, std::string_view unit, std::string_view per) {
    check_temperature(at.temperature_K);
    const auto p = impl_->prepare(reaction, at.table);
    const double T = at.temperature_K;
    const double dU = p->dH(T) - p->dn_gas(T) * detail::R * T;
    return per_extent_in_unit(*p, dU, unit, per, at.table, T);
}

double Engine::ds(std::string_view reaction, const Conditions& at, std::string_view unit) {
    check_temperature(at.temperature_K);
    const auto p = impl_->prepare(reaction, at.table);
    return detail::from_J_per_molK(p->dS(at.temperature_K), unit);
}

namespace {
/// ΔrG° in J/mol of extent at T.
double gibbs_J_per_mol(const Prepared& p, double T) { return p.dH(T) - T * p.dS(T); }
}  // namespace

double Engine::dg(std::string_view reaction, const Conditions& at, std::string_view unit) {
    check_temperature(at.temperature_K);
    const auto p = impl_->prepare(reaction, at.table);
    // A per-mass unit is told why it cannot be, rather than told to give a `per` species that
    // RXNDG does not take.
    if (detail::is_per_mass_unit(unit))
        throw Error(ErrorKind::unit, "unit '" + std::string(trim(unit)) +
                                         "' is per mass; ΔrG° is given per mole of reaction as written: use J/mol, "
                                         "kJ/mol, MJ/kmol, kcal/mol, cal/mol or BTU/lbmol");
    return detail::from_J_per_mol(gibbs_J_per_mol(*p, at.temperature_K), unit);
}

double Engine::logk(std::string_view reaction, const Conditions& at) {
    const double T = at.temperature_K;
    check_temperature(T);
    const auto p = impl_->prepare(reaction, at.table);
    return -gibbs_J_per_mol(*p, T) / (detail::R * T * std::log(10.0));
}

double Engine::load(std::string_view reaction, double quantity, std::string_view quantity_unit,
                    std::string_view key, std::string_view result_unit, const Conditions& at) {
    check_temperature(at.temperature_K);
    if (!std::isfinite(quantity)) throw Error(ErrorKind::argument, "the quantity must be a finite number");
    if (quantity < 0)
        throw Error(ErrorKind::argument, "the quantity must not be negative (give the amount that reacts or forms)");
    const auto p = impl_->prepare(reaction, at.table);
    const double dH = p->dH(at.temperature_K);
    if (key.empty()) throw Error(ErrorKind::argument, "name the key species whose quantity is given");
    const auto sp = parse_one_species(key, "the key species");
    std::size_t idx = 0;
    const double nu = std::fabs(detail::to_double(p->key_coefficient(sp, at.table, at.temperature_K, &idx)));
    const auto qu = detail::quantity_unit(quantity_unit);
    const double mol = detail::quantity_to_mol(quantity, quantity_unit, p->substances[idx].molar_mass);
    return detail::load_result(dH * mol / nu, result_unit, qu.is_rate(), quantity_unit);
}

std::string Engine::load_unit(std::string_view quantity_unit, std::string_view result_unit) {
    result_unit = trim(result_unit);
    if (!result_unit.empty()) return std::string(result_unit);
    return std::string(detail::quantity_unit(quantity_unit).is_rate() ? detail::default_rate_unit
                                                                      : detail::default_total_unit);
}

HeatKind Engine::kind(std::string_view reaction, const Conditions& at, double tolerance_kJ) {
    if (!std::isfinite(tolerance_kJ) || tolerance_kJ < 0)
        throw Error(ErrorKind::argument, "the tolerance must be a number of kJ/mol, zero or more");
    return kind_of(dh(reaction, at, "kJ/mol"), tolerance_kJ);
}

std::string Engine::check(std::string_view reaction, const Conditions& at) noexcept {
    try {
        check_temperature(at.temperature_K);
        impl_->prepare(reaction, at.table)->dH(at.temperature_K);
        return "ok";
    } catch (const std::exception& e) {
        return e.what();
    } catch (...) {
        return "internal error";
    }
}

std::string Engine::balance(std::string_view reaction, const Conditions& at) {
    return detail::balanced_text(*impl_->prepare(reaction, at.table));  // a table may name species
}

std::string Engine::reverse(std::string_view reaction) {
    const auto p = impl_->prepare(reaction, nullptr);
    grammar::Reaction r;
    r.reactants = p->ast.products;
    r.products = p->ast.reactants;
    r.arrow = p->ast.arrow;
    std::vector<Rational> l, rr;
    for (const auto& t : r.reactants) l.push_back(t.coefficient);
    for (const auto& t : r.products) rr.push_back(t.coefficient);
    return detail::reaction_text(r, l, rr);
}

std::string Engine::scale(std::string_view reaction, std::string_view factor) {
    detail::check_input_text(factor, "the factor");
    Rational f;
    try {
        f = grammar::parse_number(factor);
    } catch (const grammar::ParseError& e) {
        throw Error(ErrorKind::argument, std::string("the factor: ") + e.what());
    }
    return scaled(*impl_->prepare(reaction, nullptr), f);
}

std::string Engine::scale(std::string_view reaction, double factor) {
    if (!std::isfinite(factor) || factor <= 0)
        throw Error(ErrorKind::argument, "the factor must be a number above zero (to exchange the sides, reverse the reaction)");
    return scaled(*impl_->prepare(reaction, nullptr), rational_from_double(factor));
}

ReactionReport Engine::report(std::string_view reaction, const Conditions& at) {
    const double T = at.temperature_K;
    check_temperature(T);
    const auto p = impl_->prepare(reaction, at.table);
    ReactionReport r;
    r.temperature_K = T;
    const double dH = p->dH(T);
    r.dH_kJ_per_mol = dH / 1000.0;
    r.dn_gas = p->dn_gas(T);
    r.dU_kJ_per_mol = (dH - r.dn_gas * detail::R * T) / 1000.0;
    r.canonical = p->canonical(T);
    r.kind = kind_of(r.dH_kJ_per_mol, default_tolerance_kJ_per_mol);
    std::set<std::string> seen;
    for (const auto& s : p->substances) {
        if (!seen.insert(s.identity()).second) continue;
        r.sources.push_back({s.display_at(T), s.user ? std::string("user table") : s.record_at(T).name, s.source(T)});
    }
    return r;
}

double Engine::species_hf(std::string_view species, const Conditions& at, std::string_view unit) {
    const Substance s = resolve_one(species, at.table);
    return detail::from_J_per_mol(formation_enthalpy(s, at.temperature_K), unit, s.molar_mass);
}

double Engine::species_cp(std::string_view species, const Conditions& at) {
    check_temperature(at.temperature_K);
    return resolve_one(species, at.table).Cp(at.temperature_K);
}

double Engine::species_h(std::string_view species, const Conditions& at, double Tref) {
    const double T = at.temperature_K;
    check_temperature(T);
    check_temperature(Tref);
    const Substance s = resolve_one(species, at.table);
    return (s.H(T) - s.H(Tref)) / 1000.0;
}

double Engine::species_s(std::string_view species, const Conditions& at) {
    check_temperature(at.temperature_K);
    return resolve_one(species, at.table).S(at.temperature_K);
}

SpeciesReport Engine::species_report(std::string_view species, const Conditions& at) {
    const double T = at.temperature_K;
    check_temperature(T);
    const Substance s = resolve_one(species, at.table);
    SpeciesReport r;
    r.species = s.display_at(T);
    r.temperature_K = T;
    r.molar_mass_g_per_mol = s.molar_mass;
    r.source = s.source(T);
    if (s.user) {
        r.record = "user table";
        r.dHf_kJ_per_mol = s.user->dHf / 1000.0;
        // A row with only dHf (no cp): what the table has, and nothing more.
        if (s.user->cp_form == detail::UserSpecies::CpForm::none) return r;
    } else {
        const detail::Record& rec = s.record_at(T);
        r.record = rec.name;
        if (!rec.intervals.empty()) {
            r.tmin_K = rec.tmin();
            r.tmax_K = rec.tmax();
        }
        // ΔfH° at 298.15 K as the record tabulates it (also for a phase whose data do not reach
        // 298.15 K, such as ice or gamma iron, and for a record that gives only that value).
        r.dHf_kJ_per_mol = rec.h298 / 1000.0;
        if (rec.intervals.empty()) return r;  // no heat capacity in the data: nothing more to say
    }
    r.has_heat_capacity = true;
    const double H = s.H(T);
    r.H_kJ_per_mol = H / 1000.0;
    r.dH_sensible_kJ_per_mol = H / 1000.0 - r.dHf_kJ_per_mol;
    r.Cp_J_per_molK = s.Cp(T);
    r.S_J_per_molK = s.S(T);
    return r;
}

double Engine::molar_mass(std::string_view formula) {
    const auto sp = parse_one_species(formula, "the formula");
    const Database& db = Database::get();
    return db.molar_mass(db.composition(sp));
}

std::string Engine::source(std::string_view text, const Conditions& at) {
    const SpeciesTable* table = at.table;
    std::string out;
    if (looks_like_reaction(text)) {
        const auto p = impl_->prepare(text, table);
        p->require_thermo();
        std::set<std::string> seen;
        for (const auto& s : p->substances)
            if (seen.insert(s.identity()).second) out += s.source(at.temperature_K) + "\n";
    } else {
        out += resolve_one(text, table).source(at.temperature_K) + "\n";
    }
    out += "Molar masses: standard atomic weights, data/elements.csv. " + Database::get().identity() + ".";
    return out;
}

std::string Engine::version() {
    std::string v = std::string("rxnheat ") + RXNHEAT_VERSION + "; " + Database::get().identity();
    const std::string_view prov = detail::embedded_nasa_provenance();
    for (std::string_view key : {"origin: ", "sha256: "}) {
        auto at = prov.find(key);
        if (at == std::string_view::npos) continue;
        auto end = prov.find('\n', at);
        v += "; NASA file " + std::string(prov.substr(at, end - at));
    }
    return v;
}

}  // namespace rxnheat
