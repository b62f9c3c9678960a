// Preparing reactions: parse, compositions, balance, resolution; and the cache of prepared
// reactions keyed by the exact text (and user table), so a sheet that repeats a reaction pays
// the parse and the look-ups once.
#include "reaction.hpp"

#include "chem.hpp"
#include "units.hpp"
#include "usertable.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <list>
#include <set>
#include <map>
#include <mutex>
#include <unordered_map>

namespace rxnheat::detail {

namespace {

Error from_parse_error(const grammar::ParseError& e) { return Error(ErrorKind::syntax, e.what()); }

std::string side_text(const std::vector<grammar::Term>& terms, const std::vector<Rational>& coefs,
                      const std::vector<Substance>* resolved, std::size_t offset, double T) {
    std::string out;
    for (std::size_t i = 0; i < terms.size(); ++i) {
        if (i) out += " + ";
        if (coefs[i] != 1) out += rational_text(coefs[i]) + " ";
        out += resolved ? (*resolved)[offset + i].display_at(T) : terms[i].species.written;
    }
    return out;
}

/// An element or charge total exactly, so that two unequal totals never read alike: a decimal
/// when it is one ("0.9999999", "1.5"), else a fraction ("7/3").
std::string atom_count_text(const Rational& r) {
    using boost::multiprecision::cpp_int;
    using boost::multiprecision::denominator;
    using boost::multiprecision::numerator;
    const cpp_int den = denominator(r);
    if (den == 1) return rational_text(r);
    // Decimal digits needed: den = 2^a·5^b gives max(a, b); any other factor: not a decimal.
    cpp_int rest = den;
    unsigned twos = 0, fives = 0;
    while (rest % 2 == 0) rest /= 2, ++twos;
    while (rest % 5 == 0) rest /= 5, ++fives;
    if (rest != 1) return rational_text(r);
    const unsigned digits = std::max(twos, fives);
    cpp_int scaled = numerator(r) * boost::multiprecision::pow(cpp_int(10), digits) / den;
    const bool negative = scaled < 0;
    if (negative) scaled = -scaled;
    std::string text = scaled.str();
    if (text.size() <= digits) text.insert(0, digits + 1 - text.size(), '0');
    text.insert(text.size() - digits, ".");
    return (negative ? "-" : "") + text;
}

bool add_product(long long& total, long long a, long long b) {
    long long prod;
    return !__builtin_mul_overflow(a, b, &prod) && !__builtin_add_overflow(total, prod, &total);
}
bool add_product(Rational& total, const Rational& a, const Rational& b) {
    total += a * b;
    return true;
}

// Each element's total on the left and on the right, and the charge's, as text; empty when
// every total matches. In 64-bit integers when every coefficient and count is a whole number
// small enough (nearly every reaction: no rational arithmetic at all), exactly otherwise.
template <class Number, class Convert, class Text>
bool side_totals(const Prepared& p, Convert convert, Text text, std::string& bad) {
    std::map<std::string_view, std::pair<Number, Number>> totals;  // element -> (left, right)
    Number q_left = 0, q_right = 0;
    for (std::size_t i = 0; i < p.terms.size(); ++i) {
        const bool product = p.nu[i].sign() > 0;
        Number n;
        if (!convert(product ? p.nu[i] : Rational(-p.nu[i]), n)) return false;
        for (const auto& [sym, count] : p.compositions[i].atoms) {
            Number c;
            if (!convert(count, c)) return false;
            auto& t = totals[sym];
            if (!add_product(product ? t.second : t.first, n, c)) return false;
        }
        if (!add_product(product ? q_right : q_left, n, Number(p.compositions[i].charge))) return false;
    }
    for (const auto& [sym, t] : totals)
        if (t.first != t.second)
            bad += std::string(bad.empty() ? "" : "; ") + std::string(sym) + " " + text(t.first) + " on the left, " +
                   text(t.second) + " on the right";
    if (q_left != q_right)
        bad += std::string(bad.empty() ? "" : "; ") + "charge " + text(q_left) + " on the left, " + text(q_right) +
               " on the right";
    return true;
}

void check_balance(Prepared& p) {
    using boost::multiprecision::denominator;
    using boost::multiprecision::numerator;
    std::string bad;
    const auto to_integer = [](const Rational& r, long long& out) {
        if (denominator(r) != 1 || numerator(r) > 1'000'000'000'000'000LL || numerator(r) < -1'000'000'000'000'000LL)
            return false;
        out = numerator(r).convert_to<long long>();
        return true;
    };
    if (!side_totals<long long>(p, to_integer, [](long long x) { return std::to_string(x); }, bad)) {
        bad.clear();
        side_totals<Rational>(p, [](const Rational& r, Rational& out) { out = r; return true; }, atom_count_text, bad);
    }
    if (bad.empty()) return;
    std::string msg = "the reaction is not balanced: " + bad;
    try {
        msg += ". Balanced, it would read: " + balanced_text(p);
    } catch (const Error&) {
        // no unique balance: say nothing more
    }
    p.balance_error = Error(ErrorKind::unbalanced, msg);
}



}  // namespace

// The grammar refuses longer text unread; the engine's limit is the same number.
static_assert(max_input_chars == grammar::max_input_characters, "one input-length limit");

void check_input_text(std::string_view text, const char* what) {
    std::size_t chars = 0;
    for (unsigned char c : text)
        if ((c & 0xC0) != 0x80) ++chars;
    if (chars > max_input_chars)
        throw Error(ErrorKind::too_long, std::string(what) + " is " + std::to_string(chars) +
                                             " characters long; rxnheat reads at most " +
                                             std::to_string(max_input_chars));
}

void Prepared::require_compositions() const {
    if (composition_error) throw *composition_error;
}

void Prepared::require_thermo() const {
    require_compositions();
    if (balance_error) throw *balance_error;
    if (resolve_error) throw *resolve_error;
}

double Prepared::dH(double T) const {
    require_thermo();
    double h = 0;
    for (std::size_t i = 0; i < terms.size(); ++i) h += to_double(nu[i]) * substances[i].H(T);
    if (!std::isfinite(h)) not_finite_sum(*this, "ΔrH°", "J/mol", T, &Substance::H);
    return h;
}

double Prepared::dS(double T) const {
    require_thermo();
    double s = 0;
    for (std::size_t i = 0; i < terms.size(); ++i) s += to_double(nu[i]) * substances[i].S(T);
    if (!std::isfinite(s)) not_finite_sum(*this, "ΔrS°", "J/(mol·K)", T, &Substance::S);
    return s;
}

void not_finite_sum(const Prepared& p, const char* quantity, const char* unit, double T,
                    double (Substance::*value)(double) const) {
    // The term of largest magnitude, to say where the size comes from.
    std::size_t big = 0;
    double big_abs = -1;
    for (std::size_t i = 0; i < p.terms.size(); ++i) {
        const double a = std::fabs(to_double(p.nu[i]) * (p.substances[i].*value)(T));
        if (!(a <= big_abs)) big = i, big_abs = a;  // NaN or larger
    }
    const Rational n = p.nu[big] < 0 ? Rational(-p.nu[big]) : p.nu[big];
    throw Error(ErrorKind::argument,
                std::string(quantity) + " at " + number_words(T) + " K is not a finite number: its terms, such as " +
                    rational_text(n) + " × " + number_words((p.substances[big].*value)(T)) + " " + unit + " for " +
                    p.substances[big].display_at(T) +
                    ", add up beyond the largest number a double holds (about 1.8e+308)");
}

double Prepared::dn_gas(double T) const {
    require_thermo();
    double n = 0;
    for (std::size_t i = 0; i < terms.size(); ++i)
        if (substances[i].phase_at(T) == 'g') n += to_double(nu[i]);
    return n;
}

std::string Prepared::canonical(double T) const {
    require_thermo();
    std::vector<Rational> l, r;
    for (const auto& t : ast.reactants) l.push_back(t.coefficient);
    for (const auto& t : ast.products) r.push_back(t.coefficient);
    return side_text(ast.reactants, l, &substances, 0, T) + " -> " +
           side_text(ast.products, r, &substances, ast.reactants.size(), T);
}

Rational Prepared::key_coefficient(const grammar::Species& key, const SpeciesTable* table, double T,
                                   std::size_t* term_index) const {
    require_thermo();
    const Database& db = Database::get();
    const Composition want = db.composition(key, table);
    const std::string want_key = want.key();
    const char want_phase = key.phase.empty() ? 0 : key.phase == "aq" ? 'a' : key.phase[0];
    Rational net = 0;
    std::string identity;
    bool found = false;
    for (std::size_t i = 0; i < terms.size(); ++i) {
        if (composition_keys[i] != want_key) continue;
        if (want_phase && substances[i].phase_at(T) != want_phase) continue;
        if (found && substances[i].identity() != identity)
            throw Error(ErrorKind::argument, "'" + key.written + "' fits more than one species of the reaction (" +
                                                 substances[*term_index].display_at(T) + ", " +
                                                 substances[i].display_at(T) +
                                                 "); write its phase");
        if (!found) {
            identity = substances[i].identity();
            *term_index = i;
        }
        found = true;
        net += nu[i];
    }
    if (!found) throw Error(ErrorKind::argument, "'" + key.written + "' is not a species of the reaction");
    if (net == 0)
        throw Error(ErrorKind::argument, "'" + key.written + "' appears on both sides with the same amount, so "
                                                             "nothing of it reacts or forms");
    return net;
}

std::string reaction_text(const grammar::Reaction& r, const std::vector<Rational>& reactant_coefs,
                          const std::vector<Rational>& product_coefs) {
    return side_text(r.reactants, reactant_coefs, nullptr, 0, T_ref) + " " + r.arrow + " " +
           side_text(r.products, product_coefs, nullptr, 0, T_ref);
}

std::string balanced_text(const Prepared& prepared) {
    const Prepared* p = &prepared;
    p->require_compositions();
    // One row per element (in order of first appearance) and one for the charge when any
    // species is charged; one column per term, reactants positive.
    std::map<std::string, std::size_t> row_of;
    for (const auto& c : p->compositions)
        for (const auto& a : c.atoms) row_of.emplace(a.first, row_of.size());
    bool charged = false;
    for (const auto& c : p->compositions) charged = charged || c.charge != 0;
    const std::size_t n = p->terms.size();
    const std::size_t rows = row_of.size() + (charged ? 1 : 0);
    // The rank is at most the number of rows, so the null space has at least n − rows
    // dimensions: decided before any matrix is built (thousands of terms cost nothing more).
    if (n >= rows + 2)
        throw Error(ErrorKind::unbalanced,
                    "these " + std::to_string(n) + " species balance in at least " + std::to_string(n - rows) +
                        " independent ways (only " + std::to_string(rows) +
                        " element and charge totals fix their coefficients), so no single balance exists; give "
                        "the coefficients yourself or split the reaction");
    std::vector<SparseColumn> m(n);
    for (std::size_t j = 0; j < n; ++j) {
        const bool left = p->nu[j].sign() < 0;
        for (const auto& a : p->compositions[j].atoms)
            if (!a.second.is_zero()) m[j].emplace_back(row_of[a.first], left ? a.second : Rational(-a.second));
        if (const int q = p->compositions[j].charge) m[j].emplace_back(rows - 1, Rational(left ? q : -q));
    }
    const BalanceSolution sol = solve_balance(rows, m);
    switch (sol.kind) {
    case BalanceSolution::Kind::none:
        throw Error(ErrorKind::unbalanced, "no coefficients balance these species: check the formulas, or a species is missing");
    case BalanceSolution::Kind::several:
        throw Error(ErrorKind::unbalanced,
                    "these species balance in " + std::string(sol.ways_exact ? "" : "at least ") +
                        std::to_string(sol.ways) +
                        " independent ways, so no single balance exists; give the coefficients yourself or split the reaction");
    case BalanceSolution::Kind::too_large:
        throw Error(ErrorKind::unbalanced, "balancing these species exactly would need numbers of more than " +
                                               std::to_string(max_balance_bits * 30103 / 100000) +
                                               " digits; give the coefficients yourself");
    case BalanceSolution::Kind::unique: break;
    }
    auto v = sol.coefficients;
    bool any_neg = false, any_pos = false;
    for (const auto& x : v) {
        any_neg = any_neg || x < 0;
        any_pos = any_pos || x > 0;
    }
    if (any_neg && !any_pos)
        for (auto& x : v) x = -x;
    for (std::size_t j = 0; j < n; ++j)
        if (v[j] <= 0)
            throw Error(ErrorKind::unbalanced, "no balance with these species on these sides: " +
                                                   p->terms[j]->species.written +
                                                   (v[j] == 0 ? " would get a coefficient of zero"
                                                              : " belongs on the other side"));
    // The suggestion is capped where rxnheat's own reader stops: a coefficient it could not read
    // back is no use as a balance.
    for (std::size_t j = 0; j < n; ++j) {
        const std::string digits = rational_text(v[j]);
        if (digits.size() > grammar::max_number_digits)
            throw Error(ErrorKind::unbalanced,
                        "the only balance needs " + std::to_string(digits.size()) + " digits for " +
                            p->terms[j]->species.written + ", and rxnheat reads numbers of at most " +
                            std::to_string(grammar::max_number_digits) +
                            " digits; give the coefficients yourself");
    }
    const std::size_t nl = p->ast.reactants.size();
    return reaction_text(p->ast, std::vector<Rational>(v.begin(), v.begin() + nl),
                                 std::vector<Rational>(v.begin() + nl, v.end()));
}

std::string PreparedCache::key_of(std::string_view text, const SpeciesTable* table) {
    char fp[17] = "0000000000000000";
    if (table && table->impl())
        std::snprintf(fp, sizeof fp, "%016llx", static_cast<unsigned long long>(table->fingerprint()));
    std::string key(fp, 16);
    key.append(text.data(), text.size());
    return key;
}

std::shared_ptr<const Prepared> PreparedCache::find(std::string_view text, const SpeciesTable* table) {
    if (capacity_ == 0) return nullptr;
    const std::string key = key_of(text, table);
    const SpeciesTable::Impl* want = table ? table->impl() : nullptr;
    std::lock_guard<std::mutex> lock(mutex_);
    auto it = map_.find(key);
    if (it == map_.end() || (it->second->table.get() != want &&
                             (!want || !it->second->table || it->second->table->identity != want->identity))) {
        ++misses_;
        return nullptr;
    }
    ++hits_;
    lru_.splice(lru_.begin(), lru_, it->second);
    return it->second->value;
}

void PreparedCache::put(std::string_view text, const SpeciesTable* table, std::shared_ptr<const Prepared> value) {
    if (capacity_ == 0) return;
    std::string key = key_of(text, table);
    std::lock_guard<std::mutex> lock(mutex_);
    if (map_.count(key)) return;  // a colliding table keeps the first entry; the other is not cached
    lru_.push_front({key, table ? table->shared_impl() : nullptr, std::move(value)});
    map_.emplace(std::move(key), lru_.begin());
    if (map_.size() > capacity_) {
        map_.erase(lru_.back().key);
        lru_.pop_back();
    }
}

CacheStats PreparedCache::stats() const {
    std::lock_guard<std::mutex> lock(mutex_);
    return {map_.size(), capacity_, hits_, misses_};
}

void PreparedCache::clear() {
    std::lock_guard<std::mutex> lock(mutex_);
    map_.clear();
    lru_.clear();
}

std::shared_ptr<const Prepared> prepare(std::string_view text, const SpeciesTable* table, PreparedCache* cache) {
    check_input_text(text, "the reaction");
    if (cache)
        if (auto hit = cache->find(text, table)) return hit;

    auto p = std::make_shared<Prepared>();
    try {
        p->ast = grammar::parse_reaction(text);
    } catch (const grammar::ParseError& e) {
        throw from_parse_error(e);
    }
    for (const auto& t : p->ast.reactants) {
        p->terms.push_back(&t);
        p->nu.push_back(-t.coefficient);
    }
    for (const auto& t : p->ast.products) {
        p->terms.push_back(&t);
        p->nu.push_back(t.coefficient);
    }
    const Database& db = Database::get();
    try {
        for (const auto* t : p->terms) {
            p->compositions.push_back(db.composition(t->species, table));
            p->composition_keys.push_back(p->compositions.back().key());
        }
    } catch (const Error& e) {
        p->composition_error = e;
        p->compositions.clear();
        p->composition_keys.clear();
    }
    if (!p->composition_error) {
        check_balance(*p);
        // An unbalanced reaction's data is never used (require_thermo throws the balance error
        // first), so it is not looked up: a long unbalanced input costs its parse only.
        if (!p->balance_error) {
            try {
                for (const auto* t : p->terms) p->substances.push_back(db.resolve(t->species, table));
            } catch (const Error& e) {
                p->resolve_error = e;
                p->substances.clear();
            }
        }
    }
    if (cache) cache->put(text, table, p);
    return p;
}

}  // namespace rxnheat::detail
