// Reader for the NASA Glenn thermodynamic coefficient file (NASA/TP-2002-211556, appendix A).
//
// The layout is fixed-column Fortran. Columns below are 1-based, as in the report:
//   record line 1   name (first token), the rest comments / references
//   record line 2   1-2 number of T intervals, 4-9 reference-date code, 11-50 five pairs of
//                   (2-char element symbol, 6-char count), 51-52 phase (0 gas), 53-65 molecular
//                   weight, 66-80 heat of formation at 298.15 K (J/mol) or, with no intervals, the
//                   assigned enthalpy at the temperature of the next line
//   per interval    1-11 Tmin, 12-22 Tmax, 23 number of coefficients, 24-63 eight exponents,
//                   66-80 H(298.15)-H(0); then five D16.9 coefficients; then two D16.9
//                   coefficients, 16 blank (or zero) columns, b1 and b2 (D16.9 each)
//   no interval     1-11 the temperature
#include "nasa.hpp"

#include "rxnheat/rxnheat.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <optional>
#include <stdexcept>
#include <unordered_map>

namespace rxnheat::detail {

namespace {

struct Line {
    std::string_view text;  // without the line end
    std::size_t number;     // 1-based
};

std::vector<Line> split_lines(std::string_view text) {
    std::vector<Line> lines;
    std::size_t pos = 0, number = 1;
    while (pos < text.size()) {
        std::size_t end = text.find('\n', pos);
        if (end == std::string_view::npos) end = text.size();
        std::string_view l = text.substr(pos, end - pos);
        if (!l.empty() && l.back() == '\r') l.remove_suffix(1);
        lines.push_back({l, number++});
        pos = end + 1;
    }
    return lines;
}

// Fields and lines are trimmed with rxnheat::trim (spaces, tabs, CR, LF). The same as trimming
// spaces and tabs alone here: split_lines cuts at LF and drops the CR of CRLF (the shipped file's
// line end), so a CR or LF reaches trim only from a malformed file.

bool blank(std::string_view s) { return trim(s).empty(); }

[[noreturn]] void fail(std::size_t line, const std::string& what) {
    throw std::runtime_error("thermo.inp line " + std::to_string(line) + ": " + what);
}

/// Columns first..last (1-based, inclusive) of a line; missing columns read as blank.
std::string_view cols(std::string_view l, std::size_t first, std::size_t last) {
    if (first > l.size()) return {};
    return l.substr(first - 1, std::min(last, l.size()) - (first - 1));
}

std::string quoted(std::string_view s) { return s.empty() ? std::string("blanks") : "'" + std::string(s) + "'"; }

/// A Fortran real (F or D/E notation) in the given columns; nullopt when not a number.
std::optional<double> fortran_real(std::string_view field) {
    std::string s(trim(field));
    if (s.empty()) return std::nullopt;
    for (char& c : s)
        if (c == 'D' || c == 'd') c = 'E';
    std::size_t start = (s[0] == '+') ? 1 : 0;  // from_chars takes no leading '+'
    if (start == 1 && (s.size() == 1 || s[1] == '+' || s[1] == '-')) return std::nullopt;
    double v = 0;
    auto [ptr, ec] = std::from_chars(s.data() + start, s.data() + s.size(), v);
    if (ec != std::errc() || ptr != s.data() + s.size() || !std::isfinite(v)) return std::nullopt;
    return v;
}

double real_at(const Line& l, std::size_t first, std::size_t last, const char* what) {
    auto v = fortran_real(cols(l.text, first, last));
    if (!v)
        fail(l.number, std::string("expected ") + what + " in columns " + std::to_string(first) + "-" +
                           std::to_string(last) + ", found " + quoted(trim(cols(l.text, first, last))));
    return *v;
}

int int_at(const Line& l, std::size_t first, std::size_t last, const char* what) {
    std::string_view f = trim(cols(l.text, first, last));
    int v = 0;
    auto [ptr, ec] = std::from_chars(f.data(), f.data() + f.size(), v);
    if (f.empty() || ec != std::errc() || ptr != f.data() + f.size())
        fail(l.number, std::string("expected ") + what + " (a whole number) in columns " +
                           std::to_string(first) + "-" + std::to_string(last) + ", found " + quoted(f));
    return v;
}

bool starts_with_word(std::string_view l, std::string_view word) {
    l = trim(l);
    if (l.size() < word.size()) return false;
    for (std::size_t i = 0; i < word.size(); ++i)
        if (std::toupper(static_cast<unsigned char>(l[i])) != std::toupper(static_cast<unsigned char>(word[i])))
            return false;
    return l.size() == word.size() || l[word.size()] == ' ' || l[word.size()] == '\t';
}

bool is_end_products(std::string_view l) {
    l = trim(l);
    return starts_with_word(l, "END") && starts_with_word(trim(l.substr(3)), "PRODUCTS");
}
bool is_end_reactants(std::string_view l) {
    l = trim(l);
    return starts_with_word(l, "END") && starts_with_word(trim(l.substr(3)), "REACTANTS");
}

std::string temperature_text(double t) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%g K", t);
    return buf;
}

/// Reads the element fields (columns 11-50) of record line 2 into r.elements / r.charge.
void read_elements(const Line& l, Record& r) {
    double electrons = 0;
    for (std::size_t k = 0; k < 5; ++k) {
        const std::size_t c0 = 11 + 8 * k;
        std::string_view sym = trim(cols(l.text, c0, c0 + 1));
        std::string_view count_text = cols(l.text, c0 + 2, c0 + 7);
        std::optional<double> count = fortran_real(count_text);
        if (sym.empty() && (!count || *count == 0)) continue;  // unused field
        if (!count)
            fail(l.number, "expected the count of element " + quoted(sym) + " in columns " +
                               std::to_string(c0 + 2) + "-" + std::to_string(c0 + 7) + ", found " +
                               quoted(trim(count_text)));
        // A zero count marks an unused field whatever its symbol. (The file's dummy record "UA"
        // has its first two fields shifted by one column, leaving "0 " in a symbol field.)
        if (*count == 0) continue;
        bool letters = !sym.empty() && std::all_of(sym.begin(), sym.end(), [](char c) {
            return std::isalpha(static_cast<unsigned char>(c)) != 0;
        });
        if (!letters)
            fail(l.number, "element field " + std::to_string(k + 1) + " (columns " + std::to_string(c0) +
                               "-" + std::to_string(c0 + 7) + ") has count " + quoted(trim(count_text)) +
                               " but no element symbol");
        std::string s(sym);
        s[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(s[0])));
        for (std::size_t i = 1; i < s.size(); ++i)
            s[i] = static_cast<char>(std::tolower(static_cast<unsigned char>(s[i])));
        if (s == "E") {
            electrons += *count;
            continue;
        }
        if (*count < 0)
            fail(l.number, "element " + s + " has a negative count " + quoted(trim(count_text)));
        auto it = std::find_if(r.elements.begin(), r.elements.end(), [&](auto& p) { return p.first == s; });
        if (it != r.elements.end())
            it->second += *count;
        else
            r.elements.emplace_back(s, *count);
    }
    double q = -electrons;
    if (std::fabs(q - std::round(q)) > 1e-9 || std::fabs(q) > 100)
        fail(l.number, "electron count " + std::to_string(electrons) + " is not a whole number");
    r.charge = static_cast<int>(std::lround(q));
}

/// True for a condensed record that is a liquid: its name carries "(L)". The file also has four
/// condensed reactant records with no phase tag at all (IRFNA, JP-4, JP-5, RP-1); all four are
/// liquid propellants (nitric acid, kerosene fuels), so an untagged condensed record is a liquid.
bool liquid_name(const std::string& name) {
    if (name.find("(L)") != std::string::npos) return true;
    return name.find('(') == std::string::npos;
}

constexpr double t_eps = 1e-6;  // K: boundary temperatures are printed to 3 decimals

}  // namespace

std::vector<Record> parse_nasa_glenn(std::string_view text) {
    const std::vector<Line> lines = split_lines(text);
    const std::size_t end_line = lines.empty() ? 1 : lines.back().number + 1;
    std::size_t i = 0;

    // Header: '!' comments (and blank lines) up to the line "thermo", then the default T ranges.
    while (i < lines.size() && (blank(lines[i].text) || trim(lines[i].text).front() == '!')) ++i;
    if (i == lines.size()) fail(end_line, "no line 'thermo' before the end of the text");
    if (!starts_with_word(lines[i].text, "thermo"))
        fail(lines[i].number, "expected the line 'thermo' after the '!' comments, found " +
                                  quoted(trim(lines[i].text).substr(0, 40)));
    ++i;
    if (i == lines.size()) fail(end_line, "the text ends after 'thermo' (expected the default temperature ranges)");
    if (!fortran_real(cols(lines[i].text, 1, 10)))
        fail(lines[i].number, "expected the default temperature ranges after 'thermo', found " +
                                  quoted(trim(lines[i].text).substr(0, 40)));
    ++i;

    std::vector<Record> out;
    std::unordered_map<std::string, std::size_t> line_of_name;  // name -> first line, for repeats
    bool reactants = false, ended = false;

    auto need = [&](std::size_t k, const Record& r, const char* what) -> const Line& {
        if (k >= lines.size())
            fail(end_line, "the text ends inside the record " + quoted(r.name) + " of line " +
                               std::to_string(r.line) + " (expected " + what + ")");
        return lines[k];
    };

    while (i < lines.size()) {
        const Line& l1 = lines[i];
        if (blank(l1.text) || trim(l1.text).front() == '!') { ++i; continue; }
        if (is_end_products(l1.text)) {
            if (reactants) fail(l1.number, "a second 'END PRODUCTS'");
            reactants = true;
            ++i;
            continue;
        }
        if (is_end_reactants(l1.text)) { ended = true; break; }

        Record r;
        r.line = l1.number;
        r.reactant_only = reactants;
        {
            std::string_view t = trim(l1.text);
            std::size_t sp = t.find_first_of(" \t");
            r.name = std::string(t.substr(0, sp));
            r.comment = sp == std::string_view::npos ? std::string() : std::string(trim(t.substr(sp)));
        }
        const Line& l2 = need(i + 1, r, "the line with the number of intervals and the composition");
        const int n = int_at(l2, 1, 2, "the number of temperature intervals");
        if (n < 0 || n > 9) fail(l2.number, "number of temperature intervals " + std::to_string(n) + " is out of range 0-9");
        r.date_code = std::string(trim(cols(l2.text, 4, 9)));
        read_elements(l2, r);
        r.phase_code = int_at(l2, 51, 52, "the phase code");
        if (r.phase_code < 0) fail(l2.number, "negative phase code " + std::to_string(r.phase_code));
        r.phase = r.phase_code == 0 ? PhaseKind::gas : liquid_name(r.name) ? PhaseKind::liquid : PhaseKind::solid;
        r.molar_mass = real_at(l2, 53, 65, "the molecular weight");
        if (!(r.molar_mass > 0)) fail(l2.number, "molecular weight " + std::to_string(r.molar_mass) + " is not positive");
        r.h298 = real_at(l2, 66, 80, "the heat of formation");
        if (r.elements.empty() && r.charge == 0) fail(l2.number, "the element fields of " + quoted(r.name) + " are empty");

        std::size_t k = i + 2;
        if (n == 0) {
            const Line& lt = need(k, r, "the temperature line of a record without intervals");
            r.t_single = real_at(lt, 1, 11, "the temperature");
            if (!(r.t_single > 0)) fail(lt.number, "temperature " + temperature_text(r.t_single) + " is not positive");
            k += 1;
        }
        for (int m = 0; m < n; ++m) {
            const Line& lt = need(k, r, "a temperature-interval line");
            const Line& la = need(k + 1, r, "the first line of coefficients");
            const Line& lb = need(k + 2, r, "the second line of coefficients");
            Interval iv;
            iv.tmin = real_at(lt, 1, 11, "the interval's lower temperature");
            iv.tmax = real_at(lt, 12, 22, "the interval's upper temperature");
            if (!(iv.tmin > 0) || !(iv.tmax > iv.tmin))
                fail(lt.number, "temperature interval " + temperature_text(iv.tmin) + " to " +
                                    temperature_text(iv.tmax) + " is empty or not positive");
            const int nc = int_at(lt, 23, 23, "the number of coefficients");
            if (nc != 7) fail(lt.number, "expected 7 coefficients per interval, found " + std::to_string(nc));
            static const double expected_exp[8] = {-2, -1, 0, 1, 2, 3, 4, 0};
            for (std::size_t e = 0; e < 8; ++e) {
                double x = real_at(lt, 24 + 5 * e, 28 + 5 * e, "an exponent");
                if (x != expected_exp[e])
                    fail(lt.number, "exponent " + std::to_string(e + 1) + " is " +
                                        quoted(trim(cols(lt.text, 24 + 5 * e, 28 + 5 * e))) +
                                        ", expected the exponents -2 -1 0 1 2 3 4 0");
            }
            if (!r.intervals.empty() && std::fabs(iv.tmin - r.intervals.back().tmax) > t_eps)
                fail(lt.number, "interval " + std::to_string(m + 1) + " of " + quoted(r.name) + " starts at " +
                                    temperature_text(iv.tmin) + " but the previous one ends at " +
                                    temperature_text(r.intervals.back().tmax));
            for (std::size_t c = 0; c < 5; ++c)
                iv.a[c] = real_at(la, 1 + 16 * c, 16 + 16 * c, "a coefficient (D16.9)");
            iv.a[5] = real_at(lb, 1, 16, "a coefficient (D16.9)");
            iv.a[6] = real_at(lb, 17, 32, "a coefficient (D16.9)");
            // Columns 33-48 are blank, or (in 56 lines of the file) hold an explicit zero.
            if (!blank(cols(lb.text, 33, 48))) {
                auto extra = fortran_real(cols(lb.text, 33, 48));
                if (!extra || *extra != 0)
                    fail(lb.number, "columns 33-48 should be blank or zero, found " +
                                        quoted(trim(cols(lb.text, 33, 48))));
            }
            iv.b[0] = real_at(lb, 49, 64, "the integration constant b1 (D16.9)");
            iv.b[1] = real_at(lb, 65, 80, "the integration constant b2 (D16.9)");
            r.intervals.push_back(iv);
            k += 3;
        }

        // A record with the same name as the one just before continues it.
        if (!out.empty() && out.back().name == r.name && out.back().reactant_only == r.reactant_only) {
            Record& p = out.back();
            const std::string where = "record " + quoted(r.name) + " continues the record of line " + std::to_string(p.line);
            if (p.intervals.empty() || r.intervals.empty())
                fail(r.line, where + ", but one of them has no temperature intervals");
            if (p.elements != r.elements || p.charge != r.charge || p.molar_mass != r.molar_mass)
                fail(r.line, where + ", but its composition or molecular weight differs");
            if ((p.phase_code == 0) != (r.phase_code == 0))
                fail(r.line, where + ", but one is a gas and the other condensed");
            if (p.h298 != r.h298) fail(r.line, where + ", but its heat of formation differs");
            if (std::fabs(r.intervals.front().tmin - p.tmax()) > t_eps)
                fail(r.line, where + ", but starts at " + temperature_text(r.intervals.front().tmin) +
                                 " where that one ends at " + temperature_text(p.tmax()) +
                                 (r.intervals.front().tmin > p.tmax() ? " (a gap)" : " (an overlap)"));
            p.intervals.insert(p.intervals.end(), r.intervals.begin(), r.intervals.end());
            p.merged_lines.push_back(r.line);
        } else {
            auto [it, fresh] = line_of_name.emplace(r.name, r.line);
            if (!fresh)
                fail(r.line, "record " + quoted(r.name) + " repeats the name of the record of line " +
                                 std::to_string(it->second) + " without following it");
            out.push_back(std::move(r));
        }
        i = k;
    }
    if (!ended) fail(end_line, "the text ends without the line 'END REACTANTS'");
    if (out.empty()) fail(end_line, "no species records");
    return out;
}

const Interval* find_interval(const Record& r, double T) {
    for (const Interval& iv : r.intervals)
        if (T >= iv.tmin && T <= iv.tmax) return &iv;
    return nullptr;
}

double cp_over_R(const Interval& iv, double T) {
    const auto& a = iv.a;
    return a[0] / (T * T) + a[1] / T + a[2] + T * (a[3] + T * (a[4] + T * (a[5] + T * a[6])));
}

}  // namespace rxnheat::detail
