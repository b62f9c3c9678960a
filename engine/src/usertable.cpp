// User species tables (engine/DATA.md, User tables).
#include "usertable.hpp"

#include "database.hpp"

#include "rxnheat/csv.hpp"

#include <algorithm>
#include <cerrno>
#include <cfloat>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <cstring>
#include <iterator>

#include <sys/stat.h>

namespace rxnheat {

namespace {

using detail::UserSpecies;

[[noreturn]] void table_error(std::size_t row, const std::string& column, const std::string& what) {
    throw Error(ErrorKind::table, "species table row " + std::to_string(row) +
                                      (column.empty() ? "" : ", column '" + column + "'") + ": " + what);
}

double number_cell(const std::string& text, std::size_t row, const std::string& column) {
    const std::string t(trim(text));
    double v = 0;
    auto [p, ec] = std::from_chars(t.data(), t.data() + t.size(), v);
    if (t.empty() || ec != std::errc() || p != t.data() + t.size() || !std::isfinite(v))
        table_error(row, column, "'" + t + "' is not a number");
    return v;
}

// Limits of a species table read from a file (from_csv_file).
constexpr std::size_t max_table_rows = 100000;
constexpr std::size_t max_table_row_cells = 256;
constexpr std::size_t max_table_cells = 1000000;
constexpr std::size_t max_table_file_bytes = 64u << 20;

const char* const known_columns[] = {"formula", "phase", "dHf", "S", "cp", "a", "b", "c", "d", "e",
                                     "tmin", "tmax", "name", "source"};

/// The largest magnitude of each function over the row's range, from the terms its evaluation
/// sums (detail::shomate_*_terms, the constant-cp forms): every term's magnitude is monotone in T
/// for T > 0, so over tmin..tmax it is largest at one end, and rounding is monotone, so a finite
/// bound means every evaluation in the range is finite.
struct RowBounds {
    double H = 0, S = 0, Cp = 0;  ///< J/mol, J/(mol·K), J/(mol·K)
};
template <class Terms>
double bound_of(Terms terms_at, double lo, double hi) {
    const auto a = terms_at(lo), b = terms_at(hi);
    double sum = 0;
    for (std::size_t i = 0; i < a.size(); ++i) sum += std::max(std::fabs(a[i]), std::fabs(b[i]));
    return sum;
}
RowBounds bounds_of(const UserSpecies& u) {
    RowBounds r;
    const double S298 = u.S298 ? std::fabs(*u.S298) : 0.0;
    switch (u.cp_form) {
    case UserSpecies::CpForm::none:
        r.H = std::fabs(u.dHf);
        r.S = S298;
        break;
    case UserSpecies::CpForm::constant:
        r.Cp = std::fabs(u.cp);
        r.H = std::fabs(u.dHf) + r.Cp * std::max(std::fabs(u.tmin - T_ref), std::fabs(u.tmax - T_ref));
        r.S = S298 + r.Cp * std::max(std::fabs(std::log(u.tmin / T_ref)), std::fabs(std::log(u.tmax / T_ref)));
        break;
    case UserSpecies::CpForm::shomate: {
        // The ends as check_range() lets them be reached (1e-6 K of rounding either side).
        const double lo = (u.tmin - std::min(1e-6, u.tmin / 2)) / 1000.0, hi = (u.tmax + 1e-6) / 1000.0;
        const double ref = T_ref / 1000.0;
        auto h = [&u](double t) { return detail::shomate_h_terms(u, t); };
        auto s = [&u](double t) { return detail::shomate_s_terms(u, t); };
        auto cp = [&u](double t) { return detail::shomate_cp_terms(u, t); };
        r.Cp = bound_of(cp, lo, hi);
        r.H = std::fabs(u.dHf) + 1000.0 * (bound_of(h, lo, hi) + bound_of(h, ref, ref));
        r.S = S298 + bound_of(s, lo, hi) + bound_of(s, ref, ref);
        break;
    }
    }
    return r;
}

/// Every value the row can give within its range is a finite number, or the table is refused
/// naming the row and the cells (issue 10: finite or an error, everywhere).
void check_row_finite(const UserSpecies& u) {
    const RowBounds b = bounds_of(u);
    if (std::isfinite(b.H) && std::isfinite(b.S) && std::isfinite(b.Cp)) return;
    const char* what = !std::isfinite(b.Cp) ? "Cp°" : !std::isfinite(b.H) ? "H°" : "S°";
    const std::string range = u.range_text();
    const std::string why = std::string(what) + " is not finite somewhere in " + range +
                            " (it exceeds the largest number a double holds, about 1.8e+308)";
    switch (u.cp_form) {
    case UserSpecies::CpForm::constant:
        table_error(u.row, "cp", "with cp = " + number_words(u.cp) + " J/(mol·K), " + why);
    case UserSpecies::CpForm::shomate:
        table_error(u.row, "", "the Shomate coefficients a..e give a value that is not finite: " + why);
    default: table_error(u.row, "dHf", why);
    }
}


}  // namespace

SpeciesTable SpeciesTable::from_rows(const std::vector<std::vector<std::string>>& rows) {
    auto impl = std::make_shared<Impl>();
    if (rows.empty()) table_error(1, "", "the table is empty; its first row must name the columns");
    std::vector<std::string> header;
    for (const auto& h : rows.front()) header.emplace_back(trim(h));
    int col_of[std::size(known_columns)];
    for (auto& c : col_of) c = -1;
    for (std::size_t j = 0; j < header.size(); ++j) {
        if (header[j].empty()) continue;
        bool known = false;
        for (std::size_t k = 0; k < std::size(known_columns); ++k)
            if (header[j] == known_columns[k]) {
                if (col_of[k] >= 0) table_error(1, header[j], "the column is named twice");
                col_of[k] = static_cast<int>(j);
                known = true;
            }
        if (!known) {
            std::string list;
            for (const char* k : known_columns) list += std::string(list.empty() ? "" : ", ") + k;
            table_error(1, header[j], "unknown column; the columns are " + list);
        }
    }
    for (const char* required : {"formula", "phase", "dHf"})
        for (std::size_t k = 0; k < std::size(known_columns); ++k)
            if (std::string(known_columns[k]) == required && col_of[k] < 0)
                table_error(1, required, "required column missing (formula, phase and dHf are required)");
    auto cell = [&](const std::vector<std::string>& r, const char* name) -> std::string {
        for (std::size_t k = 0; k < std::size(known_columns); ++k)
            if (std::string(known_columns[k]) == name)
                return col_of[k] >= 0 && static_cast<std::size_t>(col_of[k]) < r.size() ? std::string(trim(r[col_of[k]])) : std::string();
        return {};
    };
    // The table's identity: every cell of every row, the header included (two tables with the
    // same cells under other headers are different tables), each cell length-prefixed so that no
    // cell text can forge another table's identity. It is hashed once into the fingerprint.
    std::string identity;
    auto add_row_identity = [&identity](const std::vector<std::string>& r) {
        for (const auto& c : r) identity += std::to_string(c.size()) + ":" + c;
        identity += "\n";
    };
    add_row_identity(rows.front());
    for (std::size_t i = 1; i < rows.size(); ++i) {
        const auto& r = rows[i];
        const std::size_t row = i + 1;
        // Blank rows count too: they move the numbers of the rows below, which messages and
        // sources cite, so a table with one is not the table without it.
        add_row_identity(r);
        bool blank = true;
        for (const auto& c : r) blank = blank && trim(c).empty();
        if (blank) continue;
        auto u = std::make_shared<UserSpecies>();
        u->row = row;
        const std::string formula = cell(r, "formula");
        if (formula.empty()) table_error(row, "formula", "empty");
        try {
            const auto sp = grammar::parse_species(formula);
            if (sp.is_name) table_error(row, "formula", "'" + formula + "' is not a formula");
            if (!sp.phase.empty()) table_error(row, "formula", "write the phase in the phase column");
            for (const auto& atom : sp.atoms)
                if (!detail::Database::get().element(atom.symbol))
                    table_error(row, "formula", "'" + atom.symbol + "' is not an element symbol");
            u->formula = sp.formula;
            u->parsed = sp;
            if (sp.charge) u->formula += (sp.charge > 0 ? "+" : "-") + std::to_string(std::abs(sp.charge));
        } catch (const grammar::ParseError& e) {
            table_error(row, "formula", e.what());
        }
        const std::string phase = detail::lower(cell(r, "phase"));
        if (phase == "g") u->phase = 'g';
        else if (phase == "l") u->phase = 'l';
        else if (phase == "s" || phase == "cr") u->phase = 's';
        else if (phase == "aq") u->phase = 'a';
        else table_error(row, "phase", "'" + phase + "' is not a phase; use g, l, s, cr or aq");
        u->dHf = 1000.0 * number_cell(cell(r, "dHf"), row, "dHf");
        if (!std::isfinite(u->dHf))
            table_error(row, "dHf", "'" + cell(r, "dHf") + "' kJ/mol is not finite in J/mol (it exceeds the largest "
                                    "number a double holds, about 1.8e+308 J/mol)");
        if (auto s = cell(r, "S"); !s.empty()) u->S298 = number_cell(s, row, "S");
        const std::string cp = cell(r, "cp");
        bool any_shomate = false;
        for (const char* k : {"a", "b", "c", "d", "e"}) any_shomate = any_shomate || !cell(r, k).empty();
        if (!cp.empty() && any_shomate) table_error(row, "cp", "give either cp or the Shomate a..e, not both");
        if (!cp.empty()) {
            u->cp_form = UserSpecies::CpForm::constant;
            u->cp = number_cell(cp, row, "cp");
        } else if (any_shomate) {
            u->cp_form = UserSpecies::CpForm::shomate;
            double* dst[] = {&u->A, &u->B, &u->C, &u->D, &u->E};
            const char* names[] = {"a", "b", "c", "d", "e"};
            for (int k = 0; k < 5; ++k) {
                const auto t = cell(r, names[k]);
                *dst[k] = t.empty() ? 0.0 : number_cell(t, row, names[k]);
            }
        }
        if (auto t = cell(r, "tmin"); !t.empty()) u->tmin = number_cell(t, row, "tmin");
        if (auto t = cell(r, "tmax"); !t.empty()) u->tmax = number_cell(t, row, "tmax");
        if (u->tmin <= 0) table_error(row, "tmin", "must be above 0 K");
        if (u->tmin < DBL_MIN)
            table_error(row, "tmin", number_words(u->tmin) + " K is too close to 0 K to compute with (a denormal number)");
        if (u->tmax < u->tmin) table_error(row, "tmax", "is below tmin");
        if (u->tmin > T_ref || u->tmax < T_ref)
            table_error(row, "tmin", "the range must include 298.15 K (dHf is given there)");
        if (u->cp_form == UserSpecies::CpForm::none && (u->tmin < T_ref || u->tmax > T_ref))
            table_error(row, "cp", "a range beyond 298.15 K needs cp or the Shomate a..e");
        check_row_finite(*u);
        u->name = cell(r, "name");
        u->source = cell(r, "source");
        impl->rows.push_back(std::move(u));
    }
    std::uint64_t h = 1469598103934665603ull;  // FNV-1a, 64 bits
    for (unsigned char c : identity) h = (h ^ c) * 1099511628211ull;
    impl->fingerprint = h;
    impl->identity = std::move(identity);
    SpeciesTable t;
    t.impl_ = std::move(impl);
    return t;
}

SpeciesTable SpeciesTable::from_csv_file(const std::string& path) {
    const std::string what = "the species table file '" + path + "'";
    std::FILE* f = std::fopen(path.c_str(), "rb");
    if (!f) throw Error(ErrorKind::table, "cannot read " + what + ": " + std::strerror(errno));
    struct Closer {
        std::FILE* f;
        ~Closer() { std::fclose(f); }
    } closer{f};
    // fopen opens a directory for reading on Linux; say what it is rather than a read error.
    struct stat st;
    if (::fstat(fileno(f), &st) == 0 && S_ISDIR(st.st_mode))
        throw Error(ErrorKind::table, "cannot read " + what + ": it is a directory, not a file");

    // A '"' inside an unquoted cell is an error: spreadsheets quote such cells, so a stray one is
    // a typo, and reading on would give a formula or number that is not what was meant.
    csv::Options options;
    options.strict_quotes = true;
    // Memory and time bounded whatever the file holds (a device such as /dev/zero never ends):
    // a table has 14 columns, so 256 cells leave room for a spreadsheet's padding; the whole
    // table is held as cells, so their number and the bytes read are capped too.
    options.max_cells = max_table_row_cells;
    options.max_record_span = max_table_file_bytes / 4;
    options.max_input_bytes = max_table_file_bytes;
    csv::Reader reader(f, options);
    csv::Record rec;
    std::vector<std::vector<std::string>> rows;
    std::size_t cells = 0;
    while (reader.next(rec)) {
        if (!reader.stopped().empty() || reader.read_error()) break;  // reported below, for the whole file
        // Rows are numbered as from_rows numbers them (the header is row 1), which is what a
        // spreadsheet shows; the reader's words name the line where that differs.
        if (!rec.error.empty()) table_error(rows.size() + 1, "", rec.error);
        cells += rec.cells.size();
        if (cells > max_table_cells)
            throw Error(ErrorKind::table, what + " has more than " + std::to_string(max_table_cells) +
                                              " cells; a species table holds at most that many");
        // Moved into a vector of exactly its size: the reader's grows by doubling, and a table
        // of many rows would hold up to twice its cells.
        rows.emplace_back(std::make_move_iterator(rec.cells.begin()), std::make_move_iterator(rec.cells.end()));
        if (rows.size() > max_table_rows)
            throw Error(ErrorKind::table, "species table '" + path + "' has over " + std::to_string(max_table_rows) + " rows");
    }
    if (!reader.stopped().empty()) throw Error(ErrorKind::table, "cannot read " + what + ": " + reader.stopped());
    if (reader.read_error())
        throw Error(ErrorKind::table, "cannot read " + what + ": " + std::strerror(reader.read_error()));
    return from_rows(rows);
}

namespace detail {

namespace {
void check_range(const UserSpecies& u, double T, const std::string& shown) {
    if (!std::isfinite(T) || T <= 0) throw Error(ErrorKind::argument, "temperature must be a positive number of kelvin");
    if (T < u.tmin - 1e-6 || T > u.tmax + 1e-6)
        throw Error(ErrorKind::out_of_range, shown + ": the species table row " + std::to_string(u.row) + " covers " +
                                                 u.range_text() + "; " + number_words(T) + " K is outside it");
}
template <class Terms>
double sum_of(const Terms& terms) {
    double sum = 0;
    for (double x : terms) sum += x;
    return sum;
}
double shomate_h(const UserSpecies& u, double T) { return sum_of(shomate_h_terms(u, T / 1000.0)); }
double shomate_s(const UserSpecies& u, double T) { return sum_of(shomate_s_terms(u, T / 1000.0)); }

/// A value of the row at T: finite within the range (the table was checked when it was read);
/// within the 1e-6 K that check_range() allows below a tiny tmin it may not be, and is said.
double checked(double v, const UserSpecies& u, const char* what, double T, const std::string& shown) {
    if (std::isfinite(v)) return v;
    throw Error(ErrorKind::argument, shown + ": the species table row " + std::to_string(u.row) + " gives " + what +
                                         " = " + number_words(v) + " at " + number_words(T) + " K, not a finite number");
}
}  // namespace

// Shomate integrals (NIST form, t = T/1000): ∫Cp dT in kJ/mol and ∫Cp/T dT in J/(mol·K), and
// Cp itself, as the terms that are summed.
std::array<double, 5> shomate_h_terms(const UserSpecies& u, double t) {
    return {u.A * t, u.B * t * t / 2, u.C * t * t * t / 3, u.D * t * t * t * t / 4, -u.E / t};
}
std::array<double, 5> shomate_s_terms(const UserSpecies& u, double t) {
    return {u.A * std::log(t), u.B * t, u.C * t * t / 2, u.D * t * t * t / 3, -u.E / (2 * t * t)};
}
std::array<double, 5> shomate_cp_terms(const UserSpecies& u, double t) {
    return {u.A, u.B * t, u.C * t * t, u.D * t * t * t, u.E / (t * t)};
}

std::string UserSpecies::range_text() const { return number_words(tmin) + "–" + number_words(tmax) + " K"; }

double UserSpecies::H(double T, const std::string& shown) const {
    check_range(*this, T, shown);
    switch (cp_form) {
    case CpForm::constant: return checked(dHf + cp * (T - T_ref), *this, "H°", T, shown);
    case CpForm::shomate:
        return checked(dHf + 1000.0 * (shomate_h(*this, T) - shomate_h(*this, T_ref)), *this, "H°", T, shown);
    default: return dHf;
    }
}

double UserSpecies::S(double T, const std::string& shown) const {
    check_range(*this, T, shown);
    if (!S298) throw Error(ErrorKind::unknown_species, shown + ": the species table row " + std::to_string(row) + " gives no S");
    switch (cp_form) {
    case CpForm::constant: return checked(*S298 + cp * std::log(T / T_ref), *this, "S°", T, shown);
    case CpForm::shomate: return checked(*S298 + shomate_s(*this, T) - shomate_s(*this, T_ref), *this, "S°", T, shown);
    default: return *S298;
    }
}

double UserSpecies::Cp(double T, const std::string& shown) const {
    check_range(*this, T, shown);
    switch (cp_form) {
    case CpForm::constant: return cp;
    case CpForm::shomate: return checked(sum_of(shomate_cp_terms(*this, T / 1000.0)), *this, "Cp°", T, shown);
    default: throw Error(ErrorKind::unknown_species, shown + ": the species table row " + std::to_string(row) + " gives no cp");
    }
}

std::shared_ptr<const UserSpecies> find_user_species(const SpeciesTable::Impl& table, const grammar::Species& sp) {
    std::string formula = sp.formula;
    if (sp.charge) formula += (sp.charge > 0 ? "+" : "-") + std::to_string(std::abs(sp.charge));
    const char want = sp.phase.empty() ? 0 : sp.phase == "aq" ? 'a' : sp.phase[0];
    std::shared_ptr<const UserSpecies> hit;
    int hits = 0;
    for (const auto& u : table.rows) {
        const bool same = sp.is_name ? (!u->name.empty() && lower(u->name) == lower(sp.name)) : u->formula == formula;
        if (!same) continue;
        if (want && u->phase != want) continue;
        if (want) return u;  // later rows do not override earlier ones: first match wins
        hit = u;
        ++hits;
    }
    if (hits > 1)
        throw Error(ErrorKind::phase, sp.written + ": the species table has it in more than one phase; write the phase");
    return hit;
}

const std::string& table_identity(const SpeciesTable::Impl& table) { return table.identity; }

}  // namespace detail

std::uint64_t SpeciesTable::fingerprint() const noexcept { return impl_ ? impl_->fingerprint : 0; }
}  // namespace rxnheat
