// rxnheat::Engine: the public functions, thin over prepared reactions and resolved species.
#include "rxnheat/rxnheat.hpp"

#include "chem.hpp"
#include "database.hpp"
#include "hess.hpp"
#include "fuel.hpp"
#include "reaction.hpp"
#include "units.hpp"
#include "usertable.hpp"

#include <boost/math/tools/roots.hpp>

#include <array>
#include <cfloat>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <optional>
#include <set>

#ifndef RXNHEAT_VERSION
#define RXNHEAT_VERSION "0.0.0"
#endif

namespace rxnheat {

using detail::Database;
using detail::Prepared;
using detail::Rational;
using detail::Substance;

namespace {
std::shared_ptr<const grammar::Species> parse_one_species(std::string_view text, const char* what);  // below
}  // namespace

// What one engine owns: the data it reads (the embedded set, parsed once and shared by every
// engine) and its own cache of prepared reactions, with the species memo its reactions fill.
struct Engine::Impl {
    const Database& db;
    detail::PreparedCache cache;
    explicit Impl(const EngineOptions& o) : db(Database::get()), cache(o.prepared_cache_entries, o.prepared_cache_bytes) {}
    std::shared_ptr<const Prepared> prepare(std::string_view text, const SpeciesTable* table) {
        return detail::prepare(text, table, &cache);
    }
    /// A species argument (SPECIESH, SPECIESCP, a stream's species ...) resolved to its data.
    /// Without a user table, through the species memo that reactions use: a sheet names the same
    /// species in cell after cell, and a species' data depend on its written text alone, so a
    /// kept one is what resolving again would give (measured: SPECIESH 8,089 instructions a call
    /// when resolving every time).
    std::shared_ptr<const Substance> resolve(std::string_view text, const SpeciesTable* table) {
        const auto species = parse_one_species(text, "the species");
        const bool memo = !(table && table->impl());
        std::shared_ptr<const detail::PreparedCache::SpeciesMemo> found;
        if (memo) {
            const std::string_view written = species->written;
            cache.find_species(&written, 1, &found);
            if (found && found->substance) return found->substance;
        }
        auto substance = std::make_shared<const Substance>(db.resolve(*species, table));
        if (found) {  // the composition is kept already (a species first met in an unbalanced reaction)
            cache.put_species(species->written, found->composition, found->composition_key, substance);
        } else if (memo) {
            try {  // a memo entry holds the composition too, as a reaction's species would
                auto composition = std::make_shared<const detail::Composition>(db.composition(*species, table));
                const std::string key = composition->key();
                cache.put_species(species->written, std::move(composition), key, substance);
            } catch (const Error&) {
                // not kept (no species resolves without a composition; should one, it is resolved each time)
            }
        }
        return substance;
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

/// A species argument (a key, a `per` species, a feed's species) parsed. The last few texts'
/// parses are kept per thread: a sheet's cells name the same key again and again, and its parse
/// was the largest part of a cached RXNLOAD (measured: 3,500 of 9,300 instructions). Only
/// successful parses are kept, so every error is found and worded afresh; a parse depends on
/// the text alone, so a kept one is the one a new parse would give.
std::shared_ptr<const grammar::Species> parse_one_species(std::string_view text, const char* what) {
    struct Kept {
        std::string text;
        std::shared_ptr<const grammar::Species> species;
    };
    thread_local std::array<Kept, 4> kept;
    thread_local std::size_t next = 0;
    for (const Kept& k : kept)
        if (k.species && k.text == text) return k.species;
    detail::check_input_text(text, what);
    std::shared_ptr<const grammar::Species> species;
    try {
        species = std::make_shared<const grammar::Species>(grammar::parse_species(text));
    } catch (const grammar::ParseError& e) {
        throw Error(ErrorKind::syntax, std::string(what) + ": " + e.what());
    }
    kept[next] = {std::string(text), species};
    next = (next + 1) % kept.size();
    return species;
}

/// Value per mole of extent -> per mole (or mass) of the `per` species, in `unit`.
double per_extent_in_unit(const Prepared& p, double J_per_mol, std::string_view what, std::string_view unit,
                          std::string_view per, const SpeciesTable* table, double T) {
    if (per.empty()) return detail::from_J_per_mol(J_per_mol, unit, what);
    const auto key = parse_one_species(per, "the 'per' species");
    std::size_t idx = 0;
    const Rational nu = p.key_coefficient(*key, table, T, &idx);
    const double n = std::fabs(detail::to_double(nu));
    return detail::from_J_per_mol(J_per_mol / n, unit, what, p.substances[idx]->molar_mass);
}

/// Decimal text with an exponent ("1e-7", "2.5E+3", "+4e2"), read exactly; nullopt when the text
/// is not of that form. At most grammar::max_number_digits digits before the exponent, as in a
/// reaction's numbers; an exponent beyond what any coefficient of that many digits could hold
/// is Error(argument) naming the factor.
std::optional<Rational> exponent_decimal(std::string_view text) {
    using boost::multiprecision::cpp_int;
    const std::string_view t = trim(text);
    std::size_t i = 0;
    const bool minus = !t.empty() && t[0] == '-';
    if (i < t.size() && (t[i] == '+' || t[i] == '-')) ++i;
    cpp_int digits = 0;
    std::size_t n_digits = 0, n_decimals = 0;
    bool point = false;
    for (; i < t.size() && ((t[i] >= '0' && t[i] <= '9') || (t[i] == '.' && !point)); ++i) {
        if (t[i] == '.') {
            point = true;
            continue;
        }
        digits = digits * 10 + (t[i] - '0');
        ++n_digits;
        if (point) ++n_decimals;
    }
    if (n_digits == 0 || i == t.size() || (t[i] != 'e' && t[i] != 'E')) return std::nullopt;
    ++i;
    bool negative = false;
    if (i < t.size() && (t[i] == '+' || t[i] == '-')) negative = t[i++] == '-';
    if (i == t.size()) return std::nullopt;
    long long exponent = 0;
    for (; i < t.size(); ++i) {
        if (t[i] < '0' || t[i] > '9') return std::nullopt;
        exponent = std::min<long long>(exponent * 10 + (t[i] - '0'), 1000000);
    }
    if (n_digits > grammar::max_number_digits)
        throw Error(ErrorKind::argument, "the factor '" + std::string(t) + "' has more than " +
                                             std::to_string(grammar::max_number_digits) + " digits");
    const long long e = (negative ? -exponent : exponent) - static_cast<long long>(n_decimals);
    const long long limit = 2 * static_cast<long long>(grammar::max_number_digits);
    if (digits != 0 && (e > limit || e < -limit))
        throw Error(ErrorKind::argument, "the factor '" + std::string(t) + "' is too " + (e > 0 ? "large" : "small") +
                                             ": scaled coefficients must have at most " +
                                             std::to_string(grammar::max_number_digits) + " digits");
    if (minus) digits = -digits;
    const cpp_int power = boost::multiprecision::pow(cpp_int(10), static_cast<unsigned>(e < 0 ? -e : e));
    if (e < 0) return Rational(digits, power);
    return Rational(cpp_int(digits * power));
}

Rational rational_from_double(double x) {
    // The simplest fraction that is the double to 12 significant digits (0.5 -> 1/2,
    // 0.333333333333 -> 1/3); otherwise the decimal itself, to 12 significant digits, read
    // exactly (not through the grammar, which reads no exponents).
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
    std::snprintf(buf, sizeof buf, "%.11e", x);
    return *exponent_decimal(buf);
}

std::string scaled(const Prepared& prepared, const Rational& factor) {
    if (factor <= 0)
        throw Error(ErrorKind::argument, "the factor must be above zero (to exchange the sides, reverse the reaction)");
    const Prepared* p = &prepared;
    std::vector<Rational> c;
    // The text must read back as a reaction: no number in it longer than the grammar reads.
    auto too_long = [](const Rational& c) {
        if (c.fits_64()) {  // the common case: count the digits without big integers
            auto digits = [](std::int64_t v) {
                std::uint64_t u = v < 0 ? 0 - std::uint64_t(v) : std::uint64_t(v);
                std::size_t n = 1;
                while (u >= 10) u /= 10, ++n;
                return n;
            };
            return digits(c.num64()) > grammar::max_number_digits || digits(c.den64()) > grammar::max_number_digits;
        }
        return c.numerator().str().size() > grammar::max_number_digits ||
               c.denominator().str().size() > grammar::max_number_digits;
    };
    c.reserve(p->terms.size());
    for (std::size_t i = 0; i < p->terms.size(); ++i) {
        c.push_back(p->coefficient(i) * factor);
        if (too_long(c.back()))
            throw Error(ErrorKind::argument,
                        "scaled by " + detail::rational_text(factor) + ", the coefficient of " +
                            std::string(p->written(i)) + " would be " + detail::rational_text(c.back()) +
                            ", a number longer than the " + std::to_string(grammar::max_number_digits) +
                            " digits a reaction's numbers may have (grammar/SYNTAX.md)");
    }
    return detail::reaction_text(*p, p->reactants(), c.data(), p->products(), c.data() + p->n_reactants);
}

/// A value derived from the data and the arguments: itself when finite, else Error(argument)
/// naming the quantity (finite or an error, everywhere: issue 10).
double finite_value(double v, const char* quantity, double T, const char* unit) {
    if (std::isfinite(v)) return v;
    throw Error(ErrorKind::argument, std::string(quantity) + " at " + number_words(T) + " K is not a finite number (" +
                                         number_words(v) + (*unit ? " " : "") + unit +
                                         "): the data's values combine beyond the largest number a double holds "
                                         "(about 1.8e+308)");
}

/// ΔrU° = ΔrH° − Δn(gas)·R·T in J/mol of extent at T.
double internal_energy_J_per_mol(const Prepared& p, double T) {
    return finite_value(p.dH(T) - p.dn_gas(T) * detail::R * T, "ΔrU°", T, "J/mol");
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

/// The name of the data a species was taken from, for reports: a NASA record's own name, or
/// the table it came from.
std::string record_name(const Substance& s, double T) {
    if (s.aqueous) return "data/aqueous.csv " + s.aqueous->label;
    if (s.user) return "user table";
    return s.record_at(T).name;
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
    if (s.composition.charge && s.aqueous) {
        // Aqueous ions are formed on the convention that ΔfH°(H+, aq) = 0 at every temperature:
        // the charge is carried by H+(aq) formed from 1/2 H2, not by the electron gas.
        grammar::Species hplus;
        hplus.formula = "H";
        hplus.atoms = {{"H", 1, 1}};
        hplus.charge = 1;
        hplus.phase = "aq";
        hplus.written = "H+(aq)";
        const detail::AqueousSpecies* hp = db.aqueous(hplus);
        if (!hp) throw Error(ErrorKind::internal, "data/aqueous.csv has no H+ row");
        Substance h_ion;
        h_ion.aqueous = hp;
        h_ion.display = "H+(aq)";
        h -= s.composition.charge * (h_ion.H(T) - element_h("H"));
    } else if (s.composition.charge) {
        const detail::Record* e = db.record("e-");
        if (!e) throw Error(ErrorKind::internal, "no electron record");
        Substance el;
        el.display = "e-";
        el.records = {e};
        h -= -s.composition.charge * el.H(T);
    }
    return finite_value(h, "ΔfH°", T, "J/mol");
}

}  // namespace

double Engine::dh(std::string_view reaction, const Conditions& at, std::string_view unit, std::string_view per) {
    check_temperature(at.temperature_K);
    const auto p = impl_->prepare(reaction, at.table);
    return per_extent_in_unit(*p, p->dH(at.temperature_K), "ΔrH°", unit, per, at.table, at.temperature_K);
}

double Engine::du(std::string_view reaction, const Conditions& at, std::string_view unit, std::string_view per) {
    check_temperature(at.temperature_K);
    const auto p = impl_->prepare(reaction, at.table);
    const double T = at.temperature_K;
    return per_extent_in_unit(*p, internal_energy_J_per_mol(*p, T), "ΔrU°", unit, per, at.table, T);
}

double Engine::ds(std::string_view reaction, const Conditions& at, std::string_view unit) {
    check_temperature(at.temperature_K);
    const auto p = impl_->prepare(reaction, at.table);
    return detail::from_J_per_molK(p->dS(at.temperature_K), unit, "ΔrS°");
}

namespace {
/// ΔrG° in J/mol of extent at T.
double gibbs_J_per_mol(const Prepared& p, double T) {
    return finite_value(p.dH(T) - T * p.dS(T), "ΔrG°", T, "J/mol");
}
/// log10 K = −ΔrG°/(R·T·ln 10).
double log10_K(const Prepared& p, double T) {
    return finite_value(-gibbs_J_per_mol(p, T) / (detail::R * T * std::log(10.0)), "log K", T, "");
}
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
    return detail::from_J_per_mol(gibbs_J_per_mol(*p, at.temperature_K), unit, "ΔrG°");
}

double Engine::logk(std::string_view reaction, const Conditions& at) {
    const double T = at.temperature_K;
    check_temperature(T);
    const auto p = impl_->prepare(reaction, at.table);
    return log10_K(*p, T);
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
    const double nu = std::fabs(detail::to_double(p->key_coefficient(*sp, at.table, at.temperature_K, &idx)));
    const auto qu = detail::quantity_unit(quantity_unit);
    const double mol = detail::quantity_to_mol(quantity, quantity_unit, p->substances[idx]->molar_mass);
    return detail::load_result(dH * mol / nu, result_unit, qu.is_rate(), "the heat load", quantity_unit);
}

namespace {

// The reaction's species and a feed matched to them, shared by RXNEQX, RXNDUTY and RXNTAD.

/// One species of a reactor's streams: its data, its net coefficient in the reaction (0: an
/// inert) and its amount in, in mol (or mol/s).
struct StreamSpecies {
    Substance substance;
    std::string name;  ///< as used at the feed temperature, for messages
    double nu = 0;
    double in_mol = 0;
    bool fed = false;
};

/// Two rows of a stream name one species when they have one composition and, at T, one phase
/// (a species written without a phase is then the same as the one written with it).
std::string same_species_key(const Substance& s, double T) {
    return s.composition.key() + "|" + std::string(1, s.phase_at(T));
}

/// The reaction's species netted by identity (a species on both sides counts once), in order of
/// first appearance; `group[i]` is the entry of term i.
std::vector<StreamSpecies> reaction_species(const Prepared& p, double T, std::vector<std::size_t>& group) {
    std::vector<StreamSpecies> sp;
    group.assign(p.terms.size(), 0);
    for (std::size_t i = 0; i < p.terms.size(); ++i) {
        const std::string id = p.substances[i]->identity();
        std::size_t g = 0;
        while (g < sp.size() && sp[g].substance.identity() != id) ++g;
        if (g == sp.size()) sp.push_back({*p.substances[i], p.substances[i]->display_at(T), 0, 0, false});
        sp[g].nu += detail::to_double(p.nu[i]);
        group[i] = g;
    }
    return sp;
}

/// Adds a feed to `sp` (the reaction's species, first `reacting` entries): a row of a species of
/// the reaction (by composition, and by phase when one is written) adds to it, any other row is
/// an inert, resolved so that an unknown species is an error. `to_mol` turns a row's amount into
/// mol (or mol/s) given the species' molar mass. `what` names the feed in messages.
template <class ToMol>
void add_feed(std::vector<StreamSpecies>& sp, std::size_t reacting, const Prepared& p,
              const std::vector<std::size_t>& group, const std::vector<FeedItem>& feed,
              const SpeciesTable* table, double T, const char* what, ToMol to_mol) {
    const Database& db = Database::get();
    for (const FeedItem& item : feed) {
        if (!std::isfinite(item.amount_mol) || item.amount_mol < 0)
            throw Error(ErrorKind::argument, std::string("the ") + what + " amount of '" + item.species +
                                                 "' must be a number, zero or more (got " +
                                                 number_words(item.amount_mol) + ")");
        const auto fs_kept = parse_one_species(item.species, "the feed species");
        const grammar::Species& fs = *fs_kept;
        const std::string want = db.composition(fs, table).key();
        const char want_phase = fs.phase.empty() ? 0 : fs.phase == "aq" ? 'a' : fs.phase[0];
        std::size_t match = reacting;
        for (std::size_t i = 0; i < p.terms.size(); ++i) {
            if (p.composition_key(i) != want) continue;
            if (want_phase && p.substances[i]->phase_at(T) != want_phase) continue;
            if (match != reacting && match != group[i])
                throw Error(ErrorKind::argument, std::string("the ") + what + " species '" + item.species +
                                                     "' fits more than one species of the reaction (" +
                                                     sp[match].name + ", " + sp[group[i]].name +
                                                     "); write its phase");
            match = group[i];
        }
        if (match == reacting) {
            Substance inert = db.resolve(fs, table);
            for (std::size_t k = reacting; k < sp.size(); ++k)
                if (same_species_key(sp[k].substance, T) == same_species_key(inert, T))
                    throw Error(ErrorKind::argument, std::string("the ") + what + " names '" + item.species +
                                                         "' twice; give each species once");
            const double mol = to_mol(item.amount_mol, inert.molar_mass);
            std::string name = inert.display_at(T);
            sp.push_back({std::move(inert), std::move(name), 0, mol, true});
            continue;
        }
        if (sp[match].fed)
            throw Error(ErrorKind::argument, std::string("the ") + what + " names " + sp[match].name +
                                                 " twice; give each species once");
        sp[match].fed = true;
        sp[match].in_mol += to_mol(item.amount_mol, sp[match].substance.molar_mass);
    }
}

/// One species of an equilibrium: its net coefficient, its feed and whether it is a gas at T.
struct EqSpecies {
    std::string name;   ///< as used at T, for messages
    double nu = 0;      ///< net signed coefficient (0: an inert)
    double n0_mol = 0;  ///< in the feed
    bool gas = true;
};

/// ln Q(ξ) − ln K of an ideal-gas mixture at p/p° (condensed species pure: activity 1).
double eq_residual(const std::vector<EqSpecies>& sp, double xi, double ln_p, double dn_gas, double ln_K) {
    double f = 0, n_gas = 0;
    for (const auto& s : sp) {
        if (!s.gas) continue;
        const double n = s.n0_mol + s.nu * xi;
        n_gas += n;
        if (s.nu != 0) f += s.nu * std::log(n);
    }
    // Δn(gas) = 0: the pressure and the total drop out (and no gas at all is then no NaN).
    return (dn_gas != 0 ? f + dn_gas * (ln_p - std::log(n_gas)) : f) - ln_K;
}

}  // namespace

double Engine::eq_conversion(std::string_view reaction, const std::vector<FeedItem>& feed, std::string_view key,
                             const Conditions& at) {
    const double T = at.temperature_K;
    check_temperature(T);
    if (!std::isfinite(at.pressure_bar) || at.pressure_bar <= 0)
        throw Error(ErrorKind::argument, "the pressure must be above zero absolute (got " +
                                             number_words(at.pressure_bar) + " bar)");
    const auto p = impl_->prepare(reaction, at.table);
    p->require_thermo();

    // The reaction's species, netted by identity (a species on both sides counts once), and the
    // feed: each row a species of the reaction (by composition, and by phase when one is written)
    // or an inert (resolved, so that an unknown species is an error, and counted in the gas moles
    // only when it is a gas at T).
    if (feed.empty()) throw Error(ErrorKind::argument, "the feed is empty; give each species of the feed and its amount");
    std::vector<std::size_t> group;
    std::vector<StreamSpecies> stream = reaction_species(*p, T, group);
    const std::size_t reacting = stream.size();
    add_feed(stream, reacting, *p, group, feed, at.table, T, "feed", [](double amount, double) { return amount; });
    std::vector<EqSpecies> sp;
    sp.reserve(stream.size());
    for (const StreamSpecies& s : stream) sp.push_back({s.name, s.nu, s.in_mol, s.substance.phase_at(T) == 'g'});

    // Only the ratios matter: amounts relative to the largest, so that no sum of them overflows.
    double largest = 0;
    for (const auto& s : sp) largest = std::max(largest, s.n0_mol);
    if (largest > 0)
        for (auto& s : sp) s.n0_mol /= largest;

    // The key: a reactant (net coefficient < 0), the first one by default.
    std::size_t k = reacting;
    if (trim(key).empty()) {
        for (std::size_t g = 0; g < reacting && k == reacting; ++g)
            if (sp[g].nu < 0) k = g;
    } else {
        const auto ks = parse_one_species(key, "the key species");
        std::size_t idx = 0;
        p->key_coefficient(*ks, at.table, T, &idx);  // throws when not in the reaction or ambiguous
        k = group[idx];
        if (sp[k].nu > 0)
            throw Error(ErrorKind::argument, "the key species " + sp[k].name +
                                                 " is a product; the conversion is of a reactant (write the reaction the other way round to ask for it)");
    }
    if (k == reacting) throw Error(ErrorKind::argument, "the reaction has no reactant whose conversion could be given");
    for (std::size_t g = 0; g < reacting; ++g)
        if (sp[g].nu < 0 && !(sp[g].n0_mol > 0))
            throw Error(ErrorKind::argument, "the feed has no " + sp[g].name +
                                                 ", a reactant; give every reactant of the reaction in the feed");

    // ln K = −ΔrG°/(R·T) at the standard pressure (1 bar).
    const double dG = p->dH(T) - T * p->dS(T);
    const double ln_K = -dG / (detail::R * T);
    const double ln_max = std::log(DBL_MAX);
    if (!std::isfinite(ln_K) || std::fabs(ln_K) > ln_max)
        throw Error(ErrorKind::argument, "the equilibrium constant at " + number_words(T) + " K is K = e^" + number_words(ln_K) +
                                             ", beyond what a double holds (1e±308): the reaction " +
                                             (ln_K > 0 ? "goes to completion" : "does not go") +
                                             " for any practical purpose, and no conversion is computed");

    // The extent runs between the bounds where a species runs out.
    double lo = -HUGE_VAL, hi = HUGE_VAL, dn_gas = 0;
    for (std::size_t g = 0; g < reacting; ++g) {
        if (sp[g].gas) dn_gas += sp[g].nu;
        if (sp[g].nu < 0) hi = std::min(hi, sp[g].n0_mol / -sp[g].nu);
        if (sp[g].nu > 0) lo = std::max(lo, -sp[g].n0_mol / sp[g].nu);
    }
    if (!(hi > lo) || !std::isfinite(hi - lo)) throw Error(ErrorKind::internal, "no extent range for the equilibrium");
    const double ln_p = std::log(at.pressure_bar / P_standard_bar);
    const auto f = [&](double xi) { return eq_residual(sp, xi, ln_p, dn_gas, ln_K); };
    const double width = hi - lo;

    // Inner ends of the bracket: step towards each bound by factors of 1/16 until the residual
    // has the sign of that side (a gas running out sends ln Q to ∓∞); if the bound itself is
    // reached in doubles, the equilibrium lies there to double precision (a condensed species
    // that runs out leaves ln Q finite, and the answer is that bound).
    auto inner = [&](double bound, double sign) {
        for (double d = width / 2;; d /= 16) {
            const double x = bound + sign * d;
            if (x == bound || d == 0) return bound;
            const double r = f(x);
            if (std::isfinite(r) && (sign > 0 ? r < 0 : r > 0)) return x;
        }
    };
    const double a = inner(lo, +1), b = inner(hi, -1);
    double xi;
    if (a == lo && b == hi) {
        throw Error(ErrorKind::argument, "every extent of this reaction is at equilibrium (ln Q − ln K is 0 throughout)");
    } else if (a == lo) {
        xi = lo;
    } else if (b == hi) {
        xi = hi;
    } else {
        std::uintmax_t iterations = 400;
        // To double precision, or to 1e-290 of the extent's range: an extent that small (a pressure
        // near the smallest double) lies among the denormal numbers, where relative precision
        // cannot be had; the conversion is then 0 to any precision that matters.
        boost::math::tools::eps_tolerance<double> relative(52);
        const auto tolerance = [&](double x, double y) { return relative(x, y) || std::fabs(y - x) <= width * 1e-290; };
        const auto root = boost::math::tools::toms748_solve(f, a, b, f(a), f(b), tolerance, iterations);
        if (iterations >= 400) throw Error(ErrorKind::internal, "the equilibrium extent did not converge");
        xi = 0.5 * (root.first + root.second);
    }
    return -sp[k].nu * xi / sp[k].n0_mol;
}

double Engine::heating_value(const std::vector<FeedItem>& composition, std::string_view basis, std::string_view unit,
                             const Conditions& at) {
    return detail::fuel_heating_value(composition, false, basis, unit, at.table);
}

double Engine::heating_value(std::string_view species, std::string_view basis, std::string_view unit,
                             const Conditions& at) {
    return detail::fuel_heating_value({FeedItem{std::string(species), 1.0}}, true, basis, unit, at.table);
}

// ---- heat balances: STREAMH, RXNDUTY, RXNTAD ------------------------------------------------------

namespace {

/// The flow unit of a stream when none is given (SPEC section 4, STREAMH).
constexpr std::string_view default_flow_unit = "kmol/h";

std::string_view flow_unit_or_default(std::string_view flow_unit) {
    flow_unit = trim(flow_unit);
    return flow_unit.empty() ? default_flow_unit : flow_unit;
}

void check_conversion(double conversion) {
    if (!std::isfinite(conversion) || conversion < 0 || conversion > 1)
        throw Error(ErrorKind::argument, "the conversion must be a fraction from 0 to 1 (got " +
                                             number_words(conversion) +
                                             "; a percentage such as 90 % is written 0.9)");
}

}  // namespace

std::string Engine::stream_unit(std::string_view flow_unit, std::string_view result_unit) {
    return load_unit(flow_unit_or_default(flow_unit), result_unit);
}

double Engine::stream_enthalpy(const std::vector<FeedItem>& stream, std::string_view flow_unit,
                               std::string_view result_unit, const Conditions& at) {
    const double T = at.temperature_K;
    check_temperature(T);
    const std::string_view unit = flow_unit_or_default(flow_unit);
    const bool rate = detail::quantity_unit(unit).is_rate();
    if (stream.empty())
        throw Error(ErrorKind::argument, "the stream is empty; give each species of it and its flow");
    std::vector<std::string> seen;  // composition and phase at T: "CH4" and "CH4(g)" are one species at 500 K
    double total = 0;
    for (const FeedItem& item : stream) {
        if (!std::isfinite(item.amount_mol) || item.amount_mol < 0)
            throw Error(ErrorKind::argument, "the flow of '" + item.species +
                                                 "' must be a number, zero or more (got " +
                                                 number_words(item.amount_mol) + ")");
        const auto kept = impl_->resolve(item.species, at.table);
        const Substance& s = *kept;
        const std::string id = same_species_key(s, T);
        for (const auto& other : seen)
            if (other == id)
                throw Error(ErrorKind::argument,
                            "the stream names " + s.display_at(T) + " twice; give each species once");
        seen.push_back(id);
        const double mol = detail::quantity_to_mol(item.amount_mol, unit, s.molar_mass);
        if (mol != 0) total += mol * s.H(T);
    }
    return detail::load_result(total, result_unit, rate, "the stream's enthalpy", unit);
}

double Engine::duty(std::string_view reaction, const std::vector<FeedItem>& feed, double conversion,
                    std::string_view key, double inlet_K, double outlet_K, std::string_view flow_unit,
                    std::string_view result_unit, const SpeciesTable* table) {
    check_temperature(inlet_K);
    check_temperature(outlet_K);
    check_conversion(conversion);
    const std::string_view unit = flow_unit_or_default(flow_unit);
    const bool rate = detail::quantity_unit(unit).is_rate();
    const auto p = impl_->prepare(reaction, table);
    p->require_thermo();
    if (feed.empty())
        throw Error(ErrorKind::argument, "the feed is empty; give each species of the feed and its flow");

    std::vector<std::size_t> group;
    std::vector<StreamSpecies> sp = reaction_species(*p, inlet_K, group);
    const std::size_t reacting = sp.size();

    // The key: a reactant of the reaction.
    if (trim(key).empty()) throw Error(ErrorKind::argument, "name the key species whose conversion is given");
    const auto ks = parse_one_species(key, "the key species");
    std::size_t idx = 0;
    p->key_coefficient(*ks, table, inlet_K, &idx);  // throws when not in the reaction or ambiguous
    const std::size_t k = group[idx];
    if (sp[k].nu > 0)
        throw Error(ErrorKind::argument,
                    "the key species " + sp[k].name + " is a product; the conversion is of a reactant");

    add_feed(sp, reacting, *p, group, feed, table, inlet_K, "feed", [&](double amount, double molar_mass) {
        return detail::quantity_to_mol(amount, unit, molar_mass);
    });
    if (!(sp[k].in_mol > 0))
        throw Error(ErrorKind::argument,
                    "the feed has no " + sp[k].name + ", the key species; give its flow in the feed");

    // In the user's flow unit, for messages (the conversion is linear in every unit).
    const auto in_unit = [&](const StreamSpecies& s, double mol) {
        return number_words(mol / detail::quantity_to_mol(1, unit, s.substance.molar_mass)) + " " +
               std::string(unit);
    };
    const double xi = conversion * sp[k].in_mol / -sp[k].nu;
    double dH = 0;
    for (const StreamSpecies& s : sp) {
        const double change = s.nu * xi;
        double out = s.in_mol + change;
        if (s.nu < 0 && out < 0) {
            // Rounding may leave −1e-16 of a reactant fed exactly in proportion.
            if (out >= -1e-12 * s.in_mol)
                out = 0;
            else
                throw Error(ErrorKind::argument, s.name + " runs out: converting " +
                                                     number_words(conversion) + " of the " +
                                                     in_unit(sp[k], sp[k].in_mol) + " of " + sp[k].name +
                                                     " needs " + in_unit(s, -change) + " of " + s.name +
                                                     ", and the feed has " + in_unit(s, s.in_mol));
        }
        // Per species, out minus in: at one temperature this is exactly ν·ξ·H°, so that the
        // enthalpies of formation do not cancel in a sum of large terms.
        if (out != 0 || s.in_mol != 0)
            dH += out * s.substance.H(outlet_K) - s.in_mol * s.substance.H(inlet_K);
    }
    return detail::load_result(dH, result_unit, rate, "the duty", unit);
}

double Engine::adiabatic_temperature(std::string_view reaction, const std::vector<FeedItem>& extra_feed,
                                     double conversion, const Conditions& at) {
    const double T_feed = at.temperature_K;
    check_temperature(T_feed);
    check_conversion(conversion);
    const auto p = impl_->prepare(reaction, at.table);
    p->require_thermo();

    // The feed as written: each term on the left its coefficient, in mol per mol of reaction (a
    // species on both sides, N2 carried through a burner, is fed with its left-hand coefficient,
    // not its net one, which may be 0); then the extra feed.
    std::vector<std::size_t> group;
    std::vector<StreamSpecies> sp = reaction_species(*p, T_feed, group);
    const std::size_t reacting = sp.size();
    for (std::size_t i = 0; i < p->terms.size(); ++i)
        if (p->nu[i] < 0) sp[group[i]].in_mol -= detail::to_double(p->nu[i]);
    add_feed(sp, reacting, *p, group, extra_feed, at.table, T_feed, "extra feed",
             [](double amount, double) { return amount; });

    // The limiting reactant sets the extent.
    double extent = HUGE_VAL;
    for (std::size_t g = 0; g < reacting; ++g)
        if (sp[g].nu < 0) extent = std::min(extent, sp[g].in_mol / -sp[g].nu);
    if (!std::isfinite(extent)) throw Error(ErrorKind::argument, "the reaction has no reactant");
    const double xi = conversion * extent;

    std::vector<double> out(sp.size());
    double H_in = 0;
    for (std::size_t g = 0; g < sp.size(); ++g) {
        out[g] = std::max(0.0, sp[g].in_mol + sp[g].nu * xi);
        if (sp[g].in_mol != 0) H_in += sp[g].in_mol * sp[g].substance.H(T_feed);
    }
    finite_value(H_in, "the feed's enthalpy Σ n·H°", T_feed, "J per mol of reaction");
    // f(T) = H_out(T) − H_in: rises with T (Cp > 0; a phase change without a written phase is a
    // step up). Throws Error(out_of_range) where a species has no data.
    const auto f = [&](double T) {
        double h = 0;
        for (std::size_t g = 0; g < sp.size(); ++g)
            if (out[g] != 0) h += out[g] * sp[g].substance.H(T);
        // Not finite (amounts near the largest double): no root finder can bracket it.
        return finite_value(h - H_in, "the outlet's enthalpy Σ n·H° minus the feed's", T, "J per mol of reaction");
    };
    const double f_feed = f(T_feed);
    if (f_feed == 0) return T_feed;

    // March from the feed temperature towards the root (up for heat released, down for heat
    // taken up) until f changes sign; where the data end, the last temperature with data is found
    // by bisection and the answer must lie before it.
    const double dir = f_feed < 0 ? 1.0 : -1.0;
    const double step = dir > 0 ? 50.0 : 10.0;
    double a = T_feed, fa = f_feed, b = T_feed, fb = f_feed;
    for (int n = 1;; ++n) {
        const double T = T_feed + dir * step * n;
        if (T <= 0 || n > 2000) {
            throw Error(ErrorKind::out_of_range, "the adiabatic temperature lies below " + number_words(a) +
                                                     " K, where no temperature above 0 K balances the heat");
        }
        try {
            fb = f(T);
            b = T;
        } catch (const Error& e) {
            if (e.kind() != ErrorKind::out_of_range) throw;
            // The last temperature with data, between a (data) and T (none).
            double good = a, none = T;
            for (int i = 0; i < 80 && std::fabs(none - good) > 1e-9 * good; ++i) {
                const double mid = 0.5 * (good + none);
                try {
                    f(mid);
                    good = mid;
                } catch (const Error& inner) {
                    if (inner.kind() != ErrorKind::out_of_range) throw;
                    none = mid;
                }
            }
            const double f_good = f(good);
            if ((f_good < 0) == (fa < 0) && f_good != 0)
                throw Error(ErrorKind::out_of_range,
                            "the adiabatic temperature lies " + std::string(dir > 0 ? "above " : "below ") +
                                number_words(good) + " K, where the data end, so it is not computed (" +
                                e.what() + ")");
            b = good;
            fb = f_good;
        }
        if (fb == 0) return b;
        if ((fb < 0) != (fa < 0)) break;
        a = b;
        fa = fb;
    }
    std::uintmax_t iterations = 200;
    const double lo = std::min(a, b), hi = std::max(a, b);
    const double flo = lo == a ? fa : fb, fhi = lo == a ? fb : fa;
    const auto root = boost::math::tools::toms748_solve(
        f, lo, hi, flo, fhi, boost::math::tools::eps_tolerance<double>(48), iterations);
    if (iterations >= 200) throw Error(ErrorKind::internal, "the adiabatic temperature did not converge");
    return 0.5 * (root.first + root.second);
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
        const double T = at.temperature_K;
        check_temperature(T);
        const auto p = impl_->prepare(reaction, at.table);
        if (const Error* e = p->thermo_error()) return e->what();  // kept from prepare: no throw
        p->dH(T);
        internal_energy_J_per_mol(*p, T);
        // What RXNDS, RXNDG and RXNLOGK would throw for values that are not finite numbers is said
        // here too; data without entropies (a table row without S, a record of one temperature)
        // are those functions' own diagnosis, not a problem of the reaction.
        try {
            log10_K(*p, T);
        } catch (const Error& e) {
            if (e.kind() != ErrorKind::unknown_species && e.kind() != ErrorKind::out_of_range) throw;
        }
        return "ok";
    } catch (const std::exception& e) {
        return e.what();
    } catch (...) {
        return "internal error";
    }
}

std::string Engine::balance(std::string_view reaction, const Conditions& at) {
    return impl_->prepare(reaction, at.table)->balanced();  // a table may name species
}

std::string Engine::reverse(std::string_view reaction) {
    const auto p = impl_->prepare(reaction, nullptr);
    const auto c = p->coefficients();  // the sides swapped, written from the prepared reaction
    return detail::reaction_text(*p, p->products(), c.data() + p->n_reactants, p->reactants(), c.data());
}

std::string Engine::scale(std::string_view reaction, std::string_view factor) {
    detail::check_input_text(factor, "the factor");
    Rational f;
    try {
        f = grammar::parse_number(factor);
    } catch (const grammar::ParseError& e) {
        // A number with an exponent ("1e-7") is a number too, though no reaction writes one.
        if (auto exact = exponent_decimal(factor))
            f = *exact;
        else
            throw Error(ErrorKind::argument, std::string("the factor: ") + e.what());
    }
    return scaled(*impl_->prepare(reaction, nullptr), f);
}

std::string Engine::scale(std::string_view reaction, double factor) {
    if (!std::isfinite(factor) || factor <= 0)
        throw Error(ErrorKind::argument, "the factor must be a number above zero (to exchange the sides, reverse the reaction)");
    return scaled(*impl_->prepare(reaction, nullptr), rational_from_double(factor));
}

namespace {
/// The target and the steps prepared, each error naming the reaction it is in.
struct HessInput {
    std::shared_ptr<const Prepared> target;
    std::vector<std::shared_ptr<const Prepared>> steps;
};
HessInput prepare_hess(Engine::Impl& impl, std::string_view target, const std::vector<HessStep>& steps) {
    auto one = [&](std::string_view text, const std::string& where) {
        try {
            if (trim(text).empty()) throw Error(ErrorKind::argument, "is empty");
            return impl.prepare(text, nullptr);
        } catch (const Error& e) {
            throw Error(e.kind(), where + ": " + e.what());
        }
    };
    HessInput in;
    in.target = one(target, "the target");
    for (const auto& s : steps) in.steps.push_back(one(s.reaction, "step " + std::to_string(s.number)));
    return in;
}
}  // namespace

double Engine::hess(std::string_view target, const std::vector<HessStep>& steps, std::string_view unit) {
    if (detail::is_per_mass_unit(unit))
        throw Error(ErrorKind::unit,
                    "unit '" + std::string(trim(unit)) +
                        "' is per mass; RXNHESS combines values per mole of reaction as written: use "
                        "J/mol, kJ/mol, MJ/kmol, kcal/mol, cal/mol or BTU/lbmol");
    std::vector<double> dh_J;
    for (const auto& s : steps) {
        if (!std::isfinite(s.dh))
            throw Error(ErrorKind::argument,
                        "the ΔH of step " + std::to_string(s.number) + " is not a finite number");
        dh_J.push_back(detail::to_J_per_mol(s.dh, unit, "the ΔH of step " + std::to_string(s.number)));
    }
    const HessInput in = prepare_hess(*impl_, target, steps);
    const auto c = detail::combine(*in.target, in.steps, steps);
    return detail::from_J_per_mol(detail::combined_dh_J_per_mol(c, steps, dh_J), unit, "the combined ΔH");
}

std::string Engine::hess_plan(std::string_view target, const std::vector<HessStep>& steps) {
    const HessInput in = prepare_hess(*impl_, target, steps);
    return detail::combine(*in.target, in.steps, steps).plan;
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
    r.dU_kJ_per_mol = internal_energy_J_per_mol(*p, T) / 1000.0;
    r.canonical = p->canonical(T);
    r.kind = kind_of(r.dH_kJ_per_mol, default_tolerance_kJ_per_mol);
    std::set<std::string> seen;
    for (const auto& sp : p->substances) {
        const Substance& s = *sp;
        if (!seen.insert(s.identity()).second) continue;
        r.sources.push_back({s.display_at(T), record_name(s, T), s.source(T)});
    }
    return r;
}

double Engine::species_hf(std::string_view species, const Conditions& at, std::string_view unit) {
    const auto s = impl_->resolve(species, at.table);
    return detail::from_J_per_mol(formation_enthalpy(*s, at.temperature_K), unit, "ΔfH°", s->molar_mass);
}

double Engine::species_cp(std::string_view species, const Conditions& at) {
    check_temperature(at.temperature_K);
    return impl_->resolve(species, at.table)->Cp(at.temperature_K);
}

double Engine::species_h(std::string_view species, const Conditions& at, double Tref) {
    const double T = at.temperature_K;
    check_temperature(T);
    check_temperature(Tref);
    const auto s = impl_->resolve(species, at.table);
    return finite_value(s->H(T) - s->H(Tref), "H°(T) − H°(Tref)", T, "J/mol") / 1000.0;
}

double Engine::species_s(std::string_view species, const Conditions& at) {
    check_temperature(at.temperature_K);
    return impl_->resolve(species, at.table)->S(at.temperature_K);
}

SpeciesReport Engine::species_report(std::string_view species, const Conditions& at) {
    const double T = at.temperature_K;
    check_temperature(T);
    const auto kept = impl_->resolve(species, at.table);
    const Substance& s = *kept;
    SpeciesReport r;
    r.species = s.display_at(T);
    r.temperature_K = T;
    r.molar_mass_g_per_mol = s.molar_mass;
    r.source = s.source(T);
    if (s.aqueous) {
        r.record = record_name(s, T);
        r.dHf_kJ_per_mol = s.aqueous->row.dHf_J_per_mol / 1000.0;
        // A row without Cp° holds at 298.15 K only: its ΔfH°, and nothing more (as for a user row).
        if (!s.aqueous->row.has_cp) return r;
        r.tmin_K = detail::aqueous_tmin_K;
        r.tmax_K = detail::aqueous_tmax_K;
    } else if (s.user) {
        r.record = record_name(s, T);
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
    const Database& db = Database::get();
    return db.molar_mass(db.composition(*parse_one_species(formula, "the formula")));
}

std::string Engine::source(std::string_view text, const Conditions& at) {
    check_temperature(at.temperature_K);  // as every other function: -1 K names no phase
    const SpeciesTable* table = at.table;
    std::string out;
    if (looks_like_reaction(text)) {
        const auto p = impl_->prepare(text, table);
        p->require_thermo();
        std::set<std::string> seen;
        for (const auto& s : p->substances)
            if (seen.insert(s->identity()).second) out += s->source(at.temperature_K) + "\n";
    } else {
        out += impl_->resolve(text, table)->source(at.temperature_K) + "\n";
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
