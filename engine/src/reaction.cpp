// Preparing reactions: parse, compositions, balance, resolution; and the cache of prepared
// reactions keyed by the exact text (and user table), so a sheet that repeats a reaction pays
// the parse and the look-ups once.
#include "reaction.hpp"

#include "chem.hpp"
#include "units.hpp"
#include "usertable.hpp"

#include <boost/container/small_vector.hpp>

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <atomic>
#include <charconv>
#include <cstring>
#include <deque>
#include <functional>
#include <map>
#include <numeric>
#include <set>
#include <shared_mutex>
#include <unordered_map>

namespace rxnheat::detail {

namespace {

Error from_parse_error(const grammar::ParseError& e) { return Error(ErrorKind::syntax, e.what()); }

/// Two element symbols (a few letters) compared inline, not through a call to memcmp.
bool same_symbol(std::string_view a, std::string_view b) {
    if (a.size() != b.size()) return false;
    for (std::size_t k = 0; k < a.size(); ++k)
        if (a[k] != b[k]) return false;
    return true;
}

/// Text gathered in a buffer on the stack and appended to a string when the buffer is full and
/// at the end (flush() or the destructor): each append to a std::string is a call into the
/// library, and a reaction's text is a couple of dozen short pieces.
class StackText {
public:
    explicit StackText(std::string& out) : out_(out) {}
    StackText(const StackText&) = delete;
    StackText& operator=(const StackText&) = delete;
    ~StackText() { flush(); }
    StackText& operator+=(std::string_view v) {
        if (v.size() > sizeof buf_ - n_) {
            flush();
            if (v.size() > sizeof buf_) {
                out_.append(v.data(), v.size());
                return *this;
            }
        }
        std::memcpy(buf_ + n_, v.data(), v.size());
        n_ += v.size();
        return *this;
    }
    StackText& operator+=(char c) {
        if (n_ == sizeof buf_) flush();
        buf_[n_++] = c;
        return *this;
    }
    void flush() {
        out_.append(buf_, n_);
        n_ = 0;
    }

private:
    std::string& out_;
    char buf_[240];
    std::size_t n_ = 0;
};

/// Appends `r` as rational_text writes it ("n" or "n/d"); 64-bit values without a temporary.
void append_rational(StackText& out, const Rational& r) {
    if (!r.fits_64()) {
        out += rational_text(r);
        return;
    }
    char digits[48];
    char* end = std::to_chars(digits, digits + 24, r.num64()).ptr;
    if (r.den64() != 1) {
        *end++ = '/';
        end = std::to_chars(end, digits + sizeof digits, r.den64()).ptr;
    }
    out += std::string_view(digits, std::size_t(end - digits));
}

/// Appends one side: "a A + B + c C", each species as written, or as resolved at T.
void append_side(StackText& out, const Prepared& p, Prepared::Side side, const Rational* coefs, bool resolved,
                 double T) {
    for (std::size_t k = 0; k < side.count; ++k) {
        if (k) out += " + ";
        if (coefs[k] != 1) {
            append_rational(out, coefs[k]);
            out += ' ';
        }
        if (resolved)
            out += p.substances[side.first + k]->display_at(T);
        else
            out += p.written(side.first + k);
    }
}

/// Bytes a side takes as written (for one reservation of the whole text).
std::size_t side_bytes(const Prepared& p, Prepared::Side side) {
    std::size_t n = 0;
    for (std::size_t k = 0; k < side.count; ++k)
        n += p.terms[side.first + k].written_size + 8;  // " + ", and a short coefficient
    return n;
}

/// The phases a kept term may have (KeptTerm::phase indexes them), as the grammar writes them.
constexpr std::string_view kept_phases[] = {"", "g", "l", "s", "aq"};
std::uint8_t kept_phase(const std::string& phase) {
    for (std::uint8_t j = 0; j < std::size(kept_phases); ++j)
        if (phase == kept_phases[j]) return j;
    // The grammar writes only the phases above (grammar/parse.cpp); a new one is added there.
    throw Error(ErrorKind::syntax, "unknown phase '" + phase + "'");
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

// Each element's total on the left and on the right, and the charge's, as text after `lead`;
// `bad` left empty when every total matches. In 64-bit integers when every coefficient and count
// is a whole number small enough (nearly every reaction: no rational arithmetic), exactly otherwise.
template <class Number, class Convert, class Text>
bool side_totals(const Prepared& p, Convert convert, Text text, std::string_view lead, std::string& bad) {
    // element -> (left, right); a flat list (a reaction has few elements), in symbol order below
    boost::container::small_vector<std::pair<std::string_view, std::pair<Number, Number>>, 8> totals;
    auto total_of = [&totals](std::string_view sym) -> std::pair<Number, Number>& {
        for (auto& e : totals)
            if (same_symbol(e.first, sym)) return e.second;
        totals.emplace_back(sym, std::pair<Number, Number>(0, 0));
        return totals.back().second;
    };
    Number q_left = 0, q_right = 0;
    for (std::size_t i = 0; i < p.terms.size(); ++i) {
        const bool product = p.nu[i].sign() > 0;
        Number n;  // the coefficient as written: nu without its sign
        if (!convert(p.nu[i], n)) return false;
        if (!product) n = -n;
        for (const auto& [sym, count] : p.compositions[i]->atoms) {
            Number c;
            if (!convert(count, c)) return false;
            auto& t = total_of(sym);
            if (!add_product(product ? t.second : t.first, n, c)) return false;
        }
        if (!add_product(product ? q_right : q_left, n, Number(p.compositions[i]->charge))) return false;
    }
    bool balanced = q_left == q_right;
    for (const auto& e : totals) balanced = balanced && e.second.first == e.second.second;
    if (balanced) return true;  // nearly every reaction: nothing to sort or say
    std::sort(totals.begin(), totals.end(), [](const auto& x, const auto& y) { return x.first < y.first; });
    // Gathered on the stack: this message is built for every unbalanced reaction a sheet holds
    // (and a balanced one allocates nothing here).
    StackText out(bad);
    bool first = true;
    const auto say = [&](std::string_view what, const Number& left, const Number& right) {
        out += first ? lead : std::string_view("; ");
        first = false;
        out += what;
        out += ' ';
        text(left, out);
        out += " on the left, ";
        text(right, out);
        out += " on the right";
    };
    for (const auto& [sym, t] : totals)
        if (t.first != t.second) say(sym, t.first, t.second);
    if (q_left != q_right) say("charge", q_left, q_right);
    return true;
}

void check_balance(Prepared& p) {
    const auto to_integer = [](const Rational& r, long long& out) {
        if (!r.fits_64() || r.den64() != 1 || r.num64() > 1'000'000'000'000'000LL ||
            r.num64() < -1'000'000'000'000'000LL)
            return false;
        out = r.num64();
        return true;
    };
    const auto integer_text = [](long long x, StackText& to) {
        char digits[24];
        to += std::string_view(digits, std::size_t(std::to_chars(digits, digits + sizeof digits, x).ptr - digits));
    };
    const auto exact_text = [](const Rational& x, StackText& to) { to += atom_count_text(x); };
    constexpr std::string_view lead = "the reaction is not balanced: ";
    std::string msg;
    if (!side_totals<long long>(p, to_integer, integer_text, lead, msg)) {
        msg.clear();
        side_totals<Rational>(p, [](const Rational& r, Rational& out) { out = r; return true; }, exact_text, lead,
                              msg);
    }
    if (msg.empty()) return;
    try {
        // Through Prepared::balanced(), which keeps the answer: RXNBALANCE on this reaction
        // then reuses it instead of solving the same balance again.
        const std::string& balanced = p.balanced();
        msg += ". Balanced, it would read: ";
        msg += balanced;
    } catch (const Error&) {
        // no unique balance: say nothing more
    }
    p.balance_error = Error(ErrorKind::unbalanced, msg);
}



}  // namespace

// The grammar refuses longer text unread; the engine's limit is the same number.
static_assert(max_input_chars == grammar::max_input_characters, "one input-length limit");

void check_input_text(std::string_view text, const char* what) {
    if (text.size() <= max_input_chars) return;  // bytes >= characters: nothing to count
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

const Error* Prepared::thermo_error() const noexcept {
    if (composition_error) return &*composition_error;
    if (balance_error) return &*balance_error;
    if (resolve_error) return &*resolve_error;
    return nullptr;
}

void Prepared::require_thermo() const {
    if (const Error* e = thermo_error()) throw *e;
}

namespace {

/// Whether Prepared::segments can be built (every species a NASA record of a written phase),
/// and a bound on the heap bytes they would take then.
void plan_segments(Prepared& p) {
    if (p.substances.empty()) return;
    std::size_t ends = 0;
    for (const auto& sp : p.substances) {
        const Substance& s = *sp;
        if (s.user || s.aqueous || s.phase_assumed || s.records.empty()) return;
        for (const Record* r : s.records) {
            if (r->intervals.empty()) return;
            ends += 2 * r->intervals.size();
        }
    }
    p.segments_possible = true;
    const std::size_t segments = 2 * ends, intervals = segments * p.substances.size();
    if (segments > p.segments.capacity()) p.segments_bytes_bound += segments * sizeof(Prepared::Segment);
    if (intervals > p.segment_intervals.capacity()) p.segments_bytes_bound += intervals * sizeof(void*);
}

/// Prepared::segments, when plan_segments found them possible.
void build_segments(const Prepared& p) {
    boost::container::small_vector<double, 32> ends;  // a typical reaction's fit on the stack
    for (const auto& sp : p.substances)
        for (const Record* r : sp->records)
            for (const auto& iv : r->intervals) {
                ends.push_back(iv.tmin);
                ends.push_back(iv.tmax);
            }
    std::sort(ends.begin(), ends.end());
    ends.erase(std::unique(ends.begin(), ends.end()), ends.end());
    // Built on the stack, then copied at their exact sizes: a typical reaction's segments and
    // intervals then fit inside the Prepared (at most one segment at each end and one between
    // two ends; reserving that bound would put most of them on the heap).
    boost::container::small_vector<Prepared::Segment, 16> segments;
    boost::container::small_vector<const Interval*, 64> segment_intervals;
    // The intervals at one temperature, selecting records and intervals exactly as
    // Substance::H does; false when some species has no data there (the per-species path then
    // says so).
    auto intervals_at = [&p, &segment_intervals](double T) {
        for (const auto& sp : p.substances) {
            const Substance& s = *sp;
            const Record* hit = nullptr;
            for (const Record* r : s.records)
                if (covers(*r, T)) {
                    hit = r;
                    break;
                }
            if (!hit) return false;
            segment_intervals.push_back(&interval_at(*hit, T));
        }
        return true;
    };
    auto add = [&](double lo, double hi, double at) {
        const std::size_t first = segment_intervals.size();
        if (intervals_at(at)) segments.push_back({lo, hi, first});
        else segment_intervals.resize(first);
    };
    for (std::size_t k = 0; k < ends.size(); ++k) {
        add(ends[k], ends[k], ends[k]);
        if (k + 1 < ends.size() && ends[k + 1] - ends[k] > 1e-5) {
            const double lo = ends[k] + 2e-6, hi = ends[k + 1] - 2e-6;
            add(lo, hi, 0.5 * (lo + hi));
        }
    }
    p.segments.assign(segments.begin(), segments.end());
    p.segment_intervals.assign(segment_intervals.begin(), segment_intervals.end());
}

}  // namespace

const Prepared::Segment* Prepared::segment_at(double T) const {
    if (std::fabs(T - T_ref) < 1e-9) return nullptr;  // tabulated ΔfH° there (Substance::H)
    if (!segments_possible) return nullptr;
    int state = segment_state_.load(std::memory_order_acquire);
    if (state != 2) {
        // The first evaluation only marks the reaction; whoever comes next builds (call_once makes
        // the others wait for it and see what it wrote; the release store lets later callers skip
        // call_once and see the same).
        if (state == 0 && segment_state_.compare_exchange_strong(state, 1, std::memory_order_relaxed))
            return nullptr;
        std::call_once(segments_once_, [this] {
            build_segments(*this);
            segment_state_.store(2, std::memory_order_release);
        });
    }
    for (const auto& s : segments)
        if (T >= s.lo_K && T <= s.hi_K) return &s;
    return nullptr;
}

double Prepared::dH(double T) const {
    require_thermo();
    if (has_dH_ref && T == T_ref) return dH_ref_J;
    if (const Segment* g = segment_at(T)) {
        const double lnT = std::log(T);
        double h = 0;
        for (std::size_t i = 0; i < terms.size(); ++i)
            h += nu_double[i] * (h_over_RT(*segment_intervals[g->first + i], T, lnT) * R_nasa * T);
        if (!std::isfinite(h)) not_finite_sum(*this, "ΔrH°", "J/mol", T, &Substance::H);
        return h;
    }
    double h = 0;
    for (std::size_t i = 0; i < terms.size(); ++i) h += nu_double[i] * substances[i]->H(T);
    if (!std::isfinite(h)) not_finite_sum(*this, "ΔrH°", "J/mol", T, &Substance::H);
    return h;
}

double Prepared::dS(double T) const {
    require_thermo();
    if (const Segment* g = segment_at(T)) {
        const double lnT = std::log(T);
        double s = 0;
        for (std::size_t i = 0; i < terms.size(); ++i)
            s += nu_double[i] * (s_over_R(*segment_intervals[g->first + i], T, lnT) * R_nasa);
        if (!std::isfinite(s)) not_finite_sum(*this, "ΔrS°", "J/(mol·K)", T, &Substance::S);
        return s;
    }
    double s = 0;
    for (std::size_t i = 0; i < terms.size(); ++i) s += nu_double[i] * substances[i]->S(T);
    if (!std::isfinite(s)) not_finite_sum(*this, "ΔrS°", "J/(mol·K)", T, &Substance::S);
    return s;
}

void not_finite_sum(const Prepared& p, const char* quantity, const char* unit, double T,
                    double (Substance::*value)(double) const) {
    // The term of largest magnitude, to say where the size comes from.
    std::size_t big = 0;
    double big_abs = -1;
    for (std::size_t i = 0; i < p.terms.size(); ++i) {
        const double a = std::fabs(to_double(p.nu[i]) * ((*p.substances[i]).*value)(T));
        if (!(a <= big_abs)) big = i, big_abs = a;  // NaN or larger
    }
    const Rational n = p.nu[big] < 0 ? Rational(-p.nu[big]) : p.nu[big];
    throw Error(ErrorKind::argument,
                std::string(quantity) + " at " + number_words(T) + " K is not a finite number: its terms, such as " +
                    rational_text(n) + " × " + number_words(((*p.substances[big]).*value)(T)) + " " + unit + " for " +
                    p.substances[big]->display_at(T) +
                    ", add up beyond the largest number a double holds (about 1.8e+308)");
}

double Prepared::dn_gas(double T) const {
    require_thermo();
    double n = 0;
    for (std::size_t i = 0; i < terms.size(); ++i)
        if (substances[i]->phase_at(T) == 'g') n += nu_double[i];
    return n;
}

std::string Prepared::canonical(double T) const {
    require_thermo();
    const PerTerm<Rational> c = coefficients();
    std::string out;
    {
        StackText text(out);
        append_side(text, *this, reactants(), c.data(), true, T);
        text += " -> ";
        append_side(text, *this, products(), c.data() + n_reactants, true, T);
    }
    return out;
}

Prepared::SpeciesText Prepared::species(std::size_t i) const {
    const KeptTerm& t = terms[i];
    return {written(i), std::string_view(texts.data() + t.body_at, t.body_size), kept_phases[t.phase], t.charge,
            t.is_name};
}

Rational Prepared::key_coefficient(const grammar::Species& key, const SpeciesTable* table, double T,
                                   std::size_t* term_index) const {
    require_thermo();
    // The key written exactly as a term of the reaction (the common case, "CH4(g)" for
    // "CH4(g) + 2 O2(g) -> ..."): the same text and table give the same composition, already
    // keyed in prepare. Otherwise it is worked out.
    std::string want_key;
    bool keyed = false;
    for (std::size_t i = 0; i < terms.size() && !keyed; ++i)
        if (written(i) == key.written) {
            want_key = composition_key(i);
            keyed = true;
        }
    if (!keyed) want_key = Database::get().composition(key, table).key();
    const char want_phase = key.phase.empty() ? 0 : key.phase == "aq" ? 'a' : key.phase[0];
    Rational net = 0;
    std::string identity;
    bool found = false;
    for (std::size_t i = 0; i < terms.size(); ++i) {
        if (composition_key(i) != want_key) continue;
        if (want_phase && substances[i]->phase_at(T) != want_phase) continue;
        if (found && substances[i]->identity() != identity)
            throw Error(ErrorKind::argument, "'" + key.written + "' fits more than one species of the reaction (" +
                                                 substances[*term_index]->display_at(T) + ", " +
                                                 substances[i]->display_at(T) +
                                                 "); write its phase");
        if (!found) {
            identity = substances[i]->identity();
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

const std::string& Prepared::balanced() const {
    std::call_once(balanced_once_, [this] {
        try {
            balanced_text_ = balanced_text(*this);
        } catch (const Error& e) {
            balanced_error_ = e;
        }
    });
    if (balanced_error_) throw *balanced_error_;
    return balanced_text_;
}

std::string reaction_text(const Prepared& p, Prepared::Side left, const Rational* left_coefs,
                          Prepared::Side right, const Rational* right_coefs) {
    std::string out;
    out.reserve(side_bytes(p, left) + p.arrow.size() + 2 + side_bytes(p, right));
    {
        StackText text(out);
        append_side(text, p, left, left_coefs, false, T_ref);
        text += ' ';
        text += p.arrow;
        text += ' ';
        append_side(text, p, right, right_coefs, false, T_ref);
    }
    return out;
}

std::string balanced_text(const Prepared& prepared) {
    const Prepared* p = &prepared;
    p->require_compositions();
    // One row per element (in order of first appearance) and one for the charge when any
    // species is charged; one column per term, reactants positive. A reaction names few
    // elements: a flat list, searched in order, until it passes the small matrix's rows.
    boost::container::small_vector<std::string_view, SmallBalanceMatrix::max_rows> symbols;
    std::map<std::string_view, std::size_t> row_map;  // past max_rows elements only
    const auto row_of = [&](std::string_view sym) -> std::size_t {
        if (row_map.empty()) {
            for (std::size_t i = 0; i < symbols.size(); ++i)
                if (same_symbol(symbols[i], sym)) return i;
            if (symbols.size() < SmallBalanceMatrix::max_rows) {
                symbols.push_back(sym);
                return symbols.size() - 1;
            }
            for (std::size_t i = 0; i < symbols.size(); ++i) row_map.emplace(symbols[i], i);
        }
        return row_map.emplace(sym, row_map.size()).first->second;
    };
    // Each atom's row, in the order of the terms and their atoms, found once for both matrices.
    boost::container::small_vector<std::size_t, 32> atom_rows;
    bool charged = false;
    for (const auto& c : p->compositions) {
        for (const auto& a : c->atoms) atom_rows.push_back(row_of(a.first));
        charged = charged || c->charge != 0;
    }
    const std::size_t n = p->terms.size();
    const std::size_t elements = row_map.empty() ? symbols.size() : row_map.size();
    const std::size_t rows = elements + (charged ? 1 : 0);
    // The rank is at most the number of rows, so the null space has at least n − rows
    // dimensions: decided before any matrix is built (thousands of terms cost nothing more).
    if (n >= rows + 2)
        throw Error(ErrorKind::unbalanced,
                    "these " + std::to_string(n) + " species balance in at least " + std::to_string(n - rows) +
                        " independent ways (only " + std::to_string(rows) +
                        " element and charge totals fix their coefficients), so no single balance exists; give "
                        "the coefficients yourself or split the reaction");
    // Few terms and small whole counts (nearly every reaction): decided on the stack.
    std::optional<BalanceSolution> small;
    if (rows <= SmallBalanceMatrix::max_rows && n <= SmallBalanceMatrix::max_cols) {
        SmallBalanceMatrix sm;
        sm.rows = rows;
        sm.cols = n;
        bool fits = true;
        std::size_t next_atom = 0;  // into atom_rows
        for (std::size_t j = 0; j < n && fits; ++j) {
            const bool left = p->nu[j].sign() < 0;
            std::int64_t scale = 1;  // least common multiple of the counts' denominators
            for (const auto& a : p->compositions[j]->atoms) {
                if (!a.second.fits_64()) {
                    fits = false;
                    break;
                }
                const std::int64_t d = a.second.den64();
                const __int128 l = static_cast<__int128>(scale / std::gcd(scale, d)) * d;
                if (l >= SmallBalanceMatrix::max_entry) {
                    fits = false;
                    break;
                }
                scale = static_cast<std::int64_t>(l);
            }
            sm.scale[j] = scale;
            for (const auto& a : p->compositions[j]->atoms) {
                if (!fits) break;
                const __int128 x = static_cast<__int128>(a.second.num64()) * (scale / a.second.den64());
                if (x >= SmallBalanceMatrix::max_entry || x <= -SmallBalanceMatrix::max_entry) {
                    fits = false;
                    break;
                }
                sm.a[atom_rows[next_atom++]][j] += static_cast<std::int64_t>(left ? x : -x);
            }
            if (const int q = p->compositions[j]->charge) sm.a[rows - 1][j] = std::int64_t(left ? q : -q) * scale;
        }
        if (fits) small = solve_balance_small(sm);
    }
    std::optional<BalanceSolution> general;
    if (!small) {
        std::vector<SparseColumn> m(n);
        std::size_t next_atom = 0;  // into atom_rows
        for (std::size_t j = 0; j < n; ++j) {
            const bool left = p->nu[j].sign() < 0;
            for (const auto& a : p->compositions[j]->atoms) {
                const std::size_t row = atom_rows[next_atom++];
                if (!a.second.is_zero()) m[j].emplace_back(row, left ? a.second : Rational(-a.second));
            }
            if (const int q = p->compositions[j]->charge) m[j].emplace_back(rows - 1, Rational(left ? q : -q));
        }
        general = solve_balance(rows, m);
    }
    BalanceSolution& sol = small ? *small : *general;
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
    auto& v = sol.coefficients;
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
                                                   std::string(p->written(j)) +
                                                   (v[j] == 0 ? " would get a coefficient of zero"
                                                              : " belongs on the other side"));
    // The suggestion is capped where rxnheat's own reader stops: a coefficient it could not read
    // back is no use as a balance.
    static_assert(grammar::max_number_digits == 12, "the shortcut below: whole numbers below 10^12");
    for (std::size_t j = 0; j < n; ++j) {
        if (v[j].fits_64() && v[j].den64() == 1 && v[j].num64() < 1'000'000'000'000) continue;  // v[j] > 0
        const std::string digits = rational_text(v[j]);
        if (digits.size() > grammar::max_number_digits)
            throw Error(ErrorKind::unbalanced,
                        "the only balance needs " + std::to_string(digits.size()) + " digits for " +
                            std::string(p->written(j)) + ", and rxnheat reads numbers of at most " +
                            std::to_string(grammar::max_number_digits) +
                            " digits; give the coefficients yourself");
    }
    return reaction_text(*p, p->reactants(), v.data(), p->products(), v.data() + p->n_reactants);
}

// ---- the cache ----------------------------------------------------------------------------------

namespace {

std::size_t string_bytes(const std::string& s) {
    // Short strings live inside the object (counted by its sizeof); longer ones on the heap.
    return s.capacity() > 15 ? s.capacity() + 1 : 0;
}

/// Bytes a small vector holds on the heap (none while its elements fit inline, in sizeof(Prepared)).
template <class T, std::size_t N>
std::size_t heap_bytes(const boost::container::small_vector<T, N>& v) {
    return v.capacity() > N ? v.capacity() * sizeof(T) : 0;
}

std::size_t species_bytes(const grammar::Species& sp) {
    std::size_t n = string_bytes(sp.name) + string_bytes(sp.formula) + string_bytes(sp.phase) +
                    string_bytes(sp.written) + heap_bytes(sp.atoms);
    for (const auto& a : sp.atoms) n += string_bytes(a.symbol);
    return n;
}

std::size_t error_bytes(const std::optional<Error>& e) {
    return e ? std::char_traits<char>::length(e->what()) + 1 + sizeof(void*) * 4 : 0;  // message + object
}

/// Bytes of a user-table row held by an entry (its strings can be long: a source cell).
std::size_t user_row_bytes(const UserSpecies& u) {
    return sizeof(UserSpecies) + string_bytes(u.formula) + string_bytes(u.name) + string_bytes(u.source) +
           species_bytes(u.parsed);
}

std::uint64_t mix64(std::uint64_t x) {  // splitmix64's finaliser: spreads a fingerprint's bits
    x ^= x >> 30;
    x *= 0xbf58476d1ce4e5b9ull;
    x ^= x >> 27;
    x *= 0x94d049bb133111ebull;
    return x ^ (x >> 31);
}

}  // namespace

std::size_t composition_bytes(const Composition& c, const std::string& key) {
    std::size_t n = sizeof(Composition) + c.atoms.capacity() * sizeof(c.atoms[0]) + string_bytes(key);
    for (const auto& a : c.atoms) n += string_bytes(a.first);
    return n;
}

std::size_t substance_bytes(const Substance& s) {
    std::size_t n = sizeof(Substance) + string_bytes(s.label) + string_bytes(s.display) +
                    s.composition.atoms.capacity() * sizeof(s.composition.atoms[0]);
    for (const auto& a : s.composition.atoms) n += string_bytes(a.first);
    return n + (s.records.capacity() + s.candidates.capacity() + s.vapour.capacity()) * sizeof(void*);
}

std::size_t estimated_bytes(const Prepared& p) {
    std::size_t n = sizeof(Prepared) + string_bytes(p.arrow) + heap_bytes(p.texts);
    n += heap_bytes(p.terms) + heap_bytes(p.nu) + heap_bytes(p.nu_double);
    n += p.segments_bytes_bound;  // the segments' heap bytes once built (none yet, most often)
    n += heap_bytes(p.substances) + p.species_data_bytes;
    return n + error_bytes(p.composition_error) + error_bytes(p.balance_error) + error_bytes(p.resolve_error);
}

struct PreparedCache::Shard {
    struct Entry {
        std::string_view text;  ///< the reaction's text, kept in `value` (Prepared::text())
        std::uint64_t hash = 0;
        std::uint64_t fingerprint = 0;                    ///< of the table; 0: none
        const SpeciesTable::Impl* table_address = nullptr;  ///< fast check only, never dereferenced
        std::weak_ptr<const SpeciesTable::Impl> table;    ///< to confirm content; never keeps it alive
        std::shared_ptr<const Prepared> value;
        std::size_t bytes = 0;
        mutable std::atomic<bool> used{false};            ///< CLOCK's reference bit
    };
    mutable std::shared_mutex mutex;
    std::unordered_multimap<std::uint64_t, Entry> map;  ///< by hash; an entry lives in its node (stable)
    std::deque<Entry*> clock;                           ///< the hand takes from the front
    std::unordered_map<const UserSpecies*, std::size_t> rows_held;  ///< row -> entries holding it
    std::size_t bytes = 0;
    std::atomic<std::size_t> hits{0}, misses{0};

    /// Whether `e` was prepared for `text` with the table `want` (or its equal).
    static bool matches(const Entry& e, std::string_view text, std::uint64_t fp, const SpeciesTable::Impl* want) {
        if (e.fingerprint != fp || e.text != text) return false;
        if (!want) return !e.table_address;
        if (e.table_address == want && !e.table.expired()) return true;  // the same live table object
        const auto held = e.table.lock();
        return held && (held.get() == want || held->identity == want->identity);
    }

    void hold_rows(const Prepared& p, int delta) {
        for (const auto& sp : p.substances) {
        const Substance& s = *sp;
            if (!s.user) continue;
            if (delta > 0) {
                if (rows_held[s.user.get()]++ == 0) bytes += user_row_bytes(*s.user);
            } else {
                auto it = rows_held.find(s.user.get());
                if (--it->second == 0) {
                    bytes -= user_row_bytes(*s.user);
                    rows_held.erase(it);
                }
            }
        }
    }

    void erase(Entry* e) {
        bytes -= e->bytes;
        if (e->table_address) hold_rows(*e->value, -1);  // rows come only from a table
        auto range = map.equal_range(e->hash);
        for (auto it = range.first; it != range.second; ++it)
            if (&it->second == e) {
                map.erase(it);
                return;
            }
    }

    /// CLOCK: evicts until within both bounds; an entry used since the hand's last pass gets a
    /// second chance (at most one full turn of the hand clears every bit).
    void evict(std::size_t max_entries, std::size_t max_bytes) {
        while (!clock.empty() && (map.size() > max_entries || bytes > max_bytes)) {
            Entry* e = clock.front();
            clock.pop_front();
            if (e->used.load(std::memory_order_relaxed)) {
                e->used.store(false, std::memory_order_relaxed);
                clock.push_back(e);
                continue;
            }
            erase(e);
        }
    }
};

PreparedCache::PreparedCache(std::size_t capacity_entries, std::size_t capacity_bytes)
    : capacity_(capacity_entries), capacity_bytes_(capacity_bytes) {
    // Shards spread the shared lock's counter (one cache line written by every reader) over
    // several lines when many threads read; a small cache keeps one shard so its bound is exact.
    const std::size_t n = capacity_entries >= 1024 ? 8 : 1;
    for (std::size_t i = 0; i < n; ++i) shards_.push_back(std::make_unique<Shard>());
}

PreparedCache::~PreparedCache() = default;

PreparedCache::Shard& PreparedCache::shard_of(std::uint64_t hash) const {
    return *shards_[(hash >> 56) % shards_.size()];
}

std::uint64_t PreparedCache::hash_of(std::string_view text, const SpeciesTable* table) {
    const SpeciesTable::Impl* want = table ? table->impl() : nullptr;
    return std::hash<std::string_view>{}(text) ^ mix64(want ? want->fingerprint : 0);
}

std::shared_ptr<const Prepared> PreparedCache::find(std::string_view text, const SpeciesTable* table,
                                                    std::uint64_t h) {
    if (capacity_ == 0) return nullptr;
    const SpeciesTable::Impl* want = table ? table->impl() : nullptr;
    const std::uint64_t fp = want ? want->fingerprint : 0;
    Shard& s = shard_of(h);
    {
        std::shared_lock<std::shared_mutex> lock(s.mutex);
        auto range = s.map.equal_range(h);
        for (auto it = range.first; it != range.second; ++it) {
            const auto& e = it->second;
            if (!Shard::matches(e, text, fp, want)) continue;
            // Written only when not yet set: readers of a hot entry do not keep writing its line.
            if (!e.used.load(std::memory_order_relaxed)) e.used.store(true, std::memory_order_relaxed);
            s.hits.fetch_add(1, std::memory_order_relaxed);
            return e.value;
        }
    }
    s.misses.fetch_add(1, std::memory_order_relaxed);
    return nullptr;
}

void PreparedCache::put(std::string_view text, const SpeciesTable* table, std::uint64_t h,
                        std::shared_ptr<const Prepared> value) {
    if (capacity_ == 0) return;
    const SpeciesTable::Impl* want = table ? table->impl() : nullptr;
    const std::uint64_t fp = want ? want->fingerprint : 0;
    std::shared_ptr<const SpeciesTable::Impl> held_table;
    if (want) held_table = table->shared_impl();
    // + room for the balanced text Prepared::balanced() may keep later (about the text's size).
    const std::size_t bytes = sizeof(Shard::Entry) + estimated_bytes(*value) + 4 * sizeof(void*) + 2 * text.size() + 64;
    const std::size_t n = shards_.size();
    const std::size_t max_entries = capacity_ / n, max_bytes = capacity_bytes_ / n;
    Shard& s = shard_of(h);
    std::unique_lock<std::shared_mutex> lock(s.mutex);
    auto range = s.map.equal_range(h);
    for (auto it = range.first; it != range.second; ++it)
        if (Shard::matches(it->second, text, fp, want)) return;  // another thread put it first
    // An entry for the same text and fingerprint whose table is gone (or is another table of the
    // same fingerprint) can never hit again: replace it.
    for (auto it = range.first; it != range.second; ++it)
        if (it->second.fingerprint == fp && it->second.text == text) {
            Shard::Entry* old = &it->second;
            s.clock.erase(std::find(s.clock.begin(), s.clock.end(), old));
            s.erase(old);
            break;
        }
    // Built in its map node (no block of its own).
    Shard::Entry* raw = &s.map.emplace(std::piecewise_construct, std::forward_as_tuple(h), std::forward_as_tuple())->second;
    raw->hash = h;
    raw->fingerprint = fp;
    raw->table_address = want;
    raw->table = held_table;
    raw->bytes = bytes;  // the text is value's (in estimated_bytes)
    raw->value = std::move(value);
    raw->text = raw->value->text();
    s.clock.push_back(raw);
    s.bytes += raw->bytes;
    if (want) s.hold_rows(*raw->value, +1);  // rows come only from a table
    s.evict(max_entries, max_bytes);  // may evict the new entry itself when it alone is too big
}

void PreparedCache::find_species(const std::string_view* written, std::size_t n,
                                 std::shared_ptr<const SpeciesMemo>* found) const {
    if (capacity_ == 0) return;
    std::shared_lock<std::shared_mutex> lock(species_mutex_);
    for (std::size_t i = 0; i < n; ++i) {
        if (written[i].size() > 64) continue;
        const auto it = species_.find(written[i]);
        if (it != species_.end()) found[i] = it->second;
    }
}

void PreparedCache::put_species(std::string_view written, std::shared_ptr<const Composition> composition,
                                std::string_view composition_key, std::shared_ptr<const Substance> substance) {
    if (capacity_ == 0 || written.size() > 64) return;
    SpeciesMemo memo;
    memo.composition = std::move(composition);
    memo.composition_key.assign(composition_key.data(), composition_key.size());
    memo.substance = std::move(substance);
    memo.written.assign(written.data(), written.size());
    memo.composition_bytes = composition_bytes(*memo.composition, memo.composition_key);
    memo.substance_bytes = memo.substance ? substance_bytes(*memo.substance) : 0;
    auto kept = std::make_shared<const SpeciesMemo>(std::move(memo));
    std::unique_lock<std::shared_mutex> lock(species_mutex_);
    if (species_.size() >= species_memo_entries) species_.clear();
    // Replaces an entry without data (kept for the composition of an unbalanced reaction's
    // species). Erased first: the old key views the old memo's text.
    species_.erase(written);
    const std::string_view key = kept->written;
    species_.emplace(key, std::move(kept));
}

CacheStats PreparedCache::stats() const {
    CacheStats out;
    out.capacity = capacity_;
    out.byte_capacity = capacity_bytes_;
    for (const auto& s : shards_) {
        std::shared_lock<std::shared_mutex> lock(s->mutex);
        out.entries += s->map.size();
        out.bytes += s->bytes;
        out.hits += s->hits.load(std::memory_order_relaxed);
        out.misses += s->misses.load(std::memory_order_relaxed);
    }
    return out;
}

void PreparedCache::clear() {
    {
        std::unique_lock<std::shared_mutex> lock(species_mutex_);
        species_.clear();
    }
    for (auto& s : shards_) {
        std::unique_lock<std::shared_mutex> lock(s->mutex);
        s->clock.clear();
        s->map.clear();
        s->rows_held.clear();
        s->bytes = 0;
    }
}

std::shared_ptr<const Prepared> prepare(std::string_view text, const SpeciesTable* table, PreparedCache* cache) {
    check_input_text(text, "the reaction");
    const std::uint64_t hash = cache ? PreparedCache::hash_of(text, table) : 0;
    if (cache)
        if (auto hit = cache->find(text, table, hash)) return hit;

    auto p = std::make_shared<Prepared>();
    // The tree serves this call only; the prepared reaction keeps its terms' texts (KeptTerm).
    // It is kept per thread, so that its term lists keep their storage from call to call (two
    // blocks fewer to allocate and free; held: the largest input's tree, as the grammar's own).
    // A nested prepare (there is none today) would parse into a tree of its own.
    thread_local grammar::Reaction kept_tree;
    thread_local bool kept_tree_busy = false;
    grammar::Reaction own_tree;
    const bool use_kept = !kept_tree_busy;
    grammar::Reaction& ast = use_kept ? kept_tree : own_tree;
    struct Release {
        bool* busy;
        ~Release() {
            if (busy) *busy = false;
        }
    } release{use_kept ? &kept_tree_busy : nullptr};
    if (use_kept) kept_tree_busy = true;
    try {
        grammar::parse_reaction(text, ast);
    } catch (const grammar::ParseError& e) {
        throw from_parse_error(e);
    }
    const std::size_t n_terms = ast.reactants.size() + ast.products.size();
    Prepared::PerTerm<const grammar::Term*> tree;  // reactants then products, as p->terms
    tree.reserve(n_terms);
    p->terms.reserve(n_terms);
    p->nu.reserve(n_terms);
    p->nu_double.reserve(n_terms);
    p->compositions.reserve(n_terms);
    p->n_reactants = ast.reactants.size();
    p->arrow = std::move(ast.arrow);
    std::size_t text_bytes = text.size();
    for (const auto& side : {&ast.reactants, &ast.products})
        for (const auto& t : *side) {
            tree.push_back(&t);
            p->nu.push_back(side == &ast.reactants ? -t.coefficient : t.coefficient);
            text_bytes += t.species.written.size() + (t.species.is_name ? t.species.name : t.species.formula).size();
        }
    // One block of texts, copied piece by piece (a small vector's range insert took about 250
    // instructions a piece).
    p->texts.resize(text_bytes, boost::container::default_init);
    std::memcpy(p->texts.data(), text.data(), text.size());
    p->text_size = text.size();
    std::size_t at = text.size();
    const auto keep = [&](std::string_view piece, std::uint32_t& offset, std::uint32_t& size) {
        offset = static_cast<std::uint32_t>(at);
        size = static_cast<std::uint32_t>(piece.size());
        std::memcpy(p->texts.data() + at, piece.data(), piece.size());
        at += piece.size();
    };
    for (const auto* t : tree) {
        const grammar::Species& sp = t->species;
        Prepared::KeptTerm k;
        keep(sp.written, k.written_at, k.written_size);
        keep(sp.is_name ? std::string_view(sp.name) : std::string_view(sp.formula), k.body_at, k.body_size);
        k.charge = sp.charge;
        k.is_name = sp.is_name;
        k.phase = kept_phase(sp.phase);
        p->terms.push_back(k);
    }
    for (const auto& n : p->nu) p->nu_double.push_back(to_double(n));
    const Database& db = Database::get();
    // Species already resolved by this engine (no user table only: a table's rows come first).
    const bool memo = cache && !(table && table->impl());
    boost::container::small_vector<std::shared_ptr<const PreparedCache::SpeciesMemo>, 8> known(p->terms.size());
    if (memo) {
        boost::container::small_vector<std::string_view, 8> written;
        for (std::size_t i = 0; i < n_terms; ++i) written.push_back(p->written(i));
        cache->find_species(written.data(), written.size(), known.data());
    }
    try {
        Prepared::PerTerm<std::string> worked_out;  // keys of the species not in the memo
        Prepared::PerTerm<std::string_view> keys;   // each term's, viewing the memo or worked_out
        worked_out.reserve(n_terms);
        for (std::size_t i = 0; i < p->terms.size(); ++i) {
            if (known[i]) {
                p->compositions.push_back(known[i]->composition);
                keys.push_back(known[i]->composition_key);
            } else {
                p->compositions.push_back(std::make_shared<const Composition>(db.composition(tree[i]->species, table)));
                worked_out.push_back(p->compositions.back()->key());
                keys.push_back(worked_out.back());
                // Kept now, not only once the data is found below: an unbalanced reaction's
                // species are never resolved, and its next text would pay the composition again.
                if (memo) cache->put_species(p->written(i), p->compositions.back(), keys.back(), nullptr);
            }
        }
        std::size_t key_bytes = 0;
        for (const auto k : keys) key_bytes += k.size();
        p->texts.resize(at + key_bytes, boost::container::default_init);  // `at` is its end
        for (std::size_t i = 0; i < keys.size(); ++i) keep(keys[i], p->terms[i].key_at, p->terms[i].key_size);
    } catch (const Error& e) {
        p->composition_error = e;
        p->compositions.clear();
    }
    if (!p->composition_error) {
        check_balance(*p);
        // An unbalanced reaction's data is never used (require_thermo throws the balance error
        // first), so it is not looked up: a long unbalanced input costs its parse only.
        if (!p->balance_error) {
            try {
                p->substances.reserve(p->terms.size());
                for (std::size_t i = 0; i < p->terms.size(); ++i) {
                    if (known[i] && known[i]->substance) {
                        p->substances.push_back(known[i]->substance);
                        continue;
                    }
                    p->substances.push_back(std::make_shared<const Substance>(db.resolve(tree[i]->species, table)));
                    if (memo)
                        cache->put_species(p->written(i), p->compositions[i],
                                           p->composition_key(i), p->substances.back());
                }
                plan_segments(*p);
                try {
                    p->dH_ref_J = p->dH(T_ref);
                    p->has_dH_ref = true;
                } catch (const Error&) {
                    // no value at 298.15 K: each call says why
                }
            } catch (const Error& e) {
                p->resolve_error = e;
                p->substances.clear();
            }
        }
    }
    // The species' share of the entry's bytes, from the memo where it holds these very objects.
    for (std::size_t i = 0; i < p->compositions.size(); ++i) {
        const auto& m = known[i];
        p->species_data_bytes += m && m->composition == p->compositions[i]
                                     ? m->composition_bytes
                                     : composition_bytes(*p->compositions[i]);  // its key is in texts
        if (i < p->substances.size())
            p->species_data_bytes += m && m->substance == p->substances[i] ? m->substance_bytes
                                                                           : substance_bytes(*p->substances[i]);
    }
    if (cache) cache->put(text, table, hash, p);
    return p;
}

}  // namespace rxnheat::detail
