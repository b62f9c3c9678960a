// Readers for the small CSV tables data/elements.csv, data/aliases.csv and data/aqueous.csv.
//
// The CSV itself is read by rxnheat::csv::Reader (rules in include/rxnheat/csv.hpp), with two
// additions for tables we write ourselves: a line whose first non-blank character is '#' is a
// comment, and a '"' inside an unquoted field is an error (it can only be a typo). Cells are
// trimmed of blanks; blank lines are skipped; the first other line is the header.
#include "tables.hpp"

#include "rxnheat/csv.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cmath>
#include <stdexcept>
#include <unordered_map>

namespace rxnheat::detail {

namespace {

struct CsvRow {
    std::size_t line = 0;             // 1-based line number in the file
    std::vector<std::string> fields;  // trimmed, unquoted
};

class CsvError {
public:
    explicit CsvError(std::string file) : file_(std::move(file)) {}
    [[noreturn]] void operator()(std::size_t line, const std::string& what) const {
        throw std::runtime_error(file_ + " line " + std::to_string(line) + ": " + what);
    }
    const std::string& file() const { return file_; }

private:
    std::string file_;
};

// Spaces and tabs only, not rxnheat::trim: a quoted cell may hold a line break, which is part of
// its text (and then fails the cell's own check) rather than a blank to drop.
std::string_view trim_spaces_tabs(std::string_view s) {
    while (!s.empty() && (s.front() == ' ' || s.front() == '\t')) s.remove_prefix(1);
    while (!s.empty() && (s.back() == ' ' || s.back() == '\t')) s.remove_suffix(1);
    return s;
}

/// The header and the data rows of a CSV text.
struct Csv {
    CsvRow header;
    std::vector<CsvRow> rows;
};

Csv read_csv(std::string_view text, const CsvError& fail) {
    csv::Options options;
    options.comment = '#';
    options.strict_quotes = true;
    csv::Reader reader(text, options);
    csv::Record rec;
    Csv out;
    bool have_header = false;
    while (reader.next(rec)) {
        if (!rec.error.empty()) fail(rec.line, rec.error);
        for (std::string& cell : rec.cells) cell = std::string(trim_spaces_tabs(cell));
        if (rec.cells.size() == 1 && rec.cells[0].empty()) continue;  // a blank line
        CsvRow row{rec.line, std::move(rec.cells)};
        if (!have_header) {
            out.header = std::move(row);
            have_header = true;
        } else {
            out.rows.push_back(std::move(row));
        }
    }
    if (!have_header) fail(reader.line(), "no header row");
    return out;
}

/// Column index of each required name in the header; an unknown or repeated column is an error.
std::vector<std::size_t> columns(const CsvRow& header, const std::vector<std::string>& required,
                                 const std::vector<std::string>& optional, const CsvError& fail) {
    std::vector<std::size_t> idx(required.size() + optional.size(), std::string::npos);
    for (std::size_t c = 0; c < header.fields.size(); ++c) {
        const std::string& h = header.fields[c];
        std::size_t k = 0;
        for (; k < required.size() + optional.size(); ++k)
            if ((k < required.size() ? required[k] : optional[k - required.size()]) == h) break;
        if (k == idx.size()) fail(header.line, "unknown column '" + h + "' in the header");
        if (idx[k] != std::string::npos) fail(header.line, "column '" + h + "' appears twice in the header");
        idx[k] = c;
    }
    for (std::size_t k = 0; k < required.size(); ++k)
        if (idx[k] == std::string::npos) fail(header.line, "the header lacks the column '" + required[k] + "'");
    return idx;
}

const std::string& field(const CsvRow& row, std::size_t col, std::size_t ncols, const CsvError& fail) {
    static const std::string empty;
    if (row.fields.size() > ncols)
        fail(row.line, std::to_string(row.fields.size()) + " fields, but the header has " + std::to_string(ncols));
    if (col == std::string::npos || col >= row.fields.size()) return empty;
    return row.fields[col];
}

}  // namespace

std::vector<Element> parse_elements_csv(std::string_view text) {
    const CsvError fail("elements.csv");
    const Csv csv = read_csv(text, fail);
    const auto idx = columns(csv.header, {"symbol", "z", "name", "weight"}, {"note"}, fail);
    const std::size_t ncols = csv.header.fields.size();
    std::vector<Element> out;
    std::unordered_map<std::string, std::size_t> seen;
    for (const CsvRow& row : csv.rows) {
        Element e;
        e.symbol = field(row, idx[0], ncols, fail);
        const std::string& z = field(row, idx[1], ncols, fail);
        e.name = field(row, idx[2], ncols, fail);
        const std::string& w = field(row, idx[3], ncols, fail);
        const bool symbol_ok = (e.symbol.size() == 1 || e.symbol.size() == 2) &&
                               std::isupper(static_cast<unsigned char>(e.symbol[0])) &&
                               (e.symbol.size() == 1 || std::islower(static_cast<unsigned char>(e.symbol[1])));
        if (!symbol_ok)
            fail(row.line, "column 'symbol': '" + e.symbol + "' is not an element symbol (one capital letter, "
                           "then at most one small letter)");
        auto zr = std::from_chars(z.data(), z.data() + z.size(), e.z);
        if (z.empty() || zr.ec != std::errc() || zr.ptr != z.data() + z.size() || e.z < 1 || e.z > 118)
            fail(row.line, "column 'z': '" + z + "' is not an atomic number 1-118");
        if (e.name.empty()) fail(row.line, "column 'name' is empty");
        auto wr = std::from_chars(w.data(), w.data() + w.size(), e.weight);
        if (w.empty() || wr.ec != std::errc() || wr.ptr != w.data() + w.size() || !(e.weight > 0) ||
            !std::isfinite(e.weight))
            fail(row.line, "column 'weight': '" + w + "' is not a positive number");
        auto [it, fresh] = seen.emplace(e.symbol, row.line);
        if (!fresh) fail(row.line, "symbol '" + e.symbol + "' repeats line " + std::to_string(it->second));
        out.push_back(std::move(e));
    }
    if (out.empty()) fail(csv.header.line, "no element rows after the header");
    return out;
}

bool valid_alias_name(std::string_view n) {
    if (n.empty() || !(n[0] >= 'a' && n[0] <= 'z')) return false;
    for (std::size_t i = 0; i < n.size(); ++i) {
        const char c = n[i];
        const bool ok = (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '-' || c == ',' || c == ' ';
        if (!ok) return false;
        if (c == ' ' && (i + 1 == n.size() || n[i + 1] == ' ')) return false;
    }
    return true;
}

std::vector<Alias> parse_aliases_csv(std::string_view text) {
    const CsvError fail("aliases.csv");
    const Csv csv = read_csv(text, fail);
    const auto idx = columns(csv.header, {"name", "gas", "liquid", "solid"}, {"note"}, fail);
    const std::size_t ncols = csv.header.fields.size();
    std::vector<Alias> out;
    std::unordered_map<std::string, std::size_t> seen;
    auto check_record_name = [&](const CsvRow& row, const char* col, const std::string& v) {
        if (v.find_first_of(" \t") != std::string::npos)
            fail(row.line, std::string("column '") + col + "': '" + v + "' is not a record name (it has a space)");
    };
    for (const CsvRow& row : csv.rows) {
        Alias a;
        a.name = field(row, idx[0], ncols, fail);
        if (!valid_alias_name(a.name))
            fail(row.line, "column 'name': '" + a.name + "' must start with a small letter and hold only "
                           "small letters, digits, '-', ',' and single spaces");
        a.gas = field(row, idx[1], ncols, fail);
        a.liquid = field(row, idx[2], ncols, fail);
        check_record_name(row, "gas", a.gas);
        check_record_name(row, "liquid", a.liquid);
        const std::string& solid = field(row, idx[3], ncols, fail);
        if (!solid.empty()) {
            std::size_t p = 0;
            while (true) {
                std::size_t bar = solid.find('|', p);
                std::string one(trim_spaces_tabs(std::string_view(solid).substr(p, bar == std::string::npos ? std::string::npos : bar - p)));
                if (one.empty()) fail(row.line, "column 'solid': an empty record name between '|'");
                check_record_name(row, "solid", one);
                if (std::find(a.solid.begin(), a.solid.end(), one) != a.solid.end())
                    fail(row.line, "column 'solid': '" + one + "' is listed twice");
                a.solid.push_back(std::move(one));
                if (bar == std::string::npos) break;
                p = bar + 1;
            }
        }
        if (a.gas.empty() && a.liquid.empty() && a.solid.empty())
            fail(row.line, "alias '" + a.name + "' names no record in columns 'gas', 'liquid' or 'solid'");
        auto [it, fresh] = seen.emplace(a.name, row.line);
        if (!fresh) fail(row.line, "alias '" + a.name + "' repeats line " + std::to_string(it->second));
        out.push_back(std::move(a));
    }
    if (out.empty()) fail(csv.header.line, "no alias rows after the header");
    return out;
}

namespace {
/// A finite number filling the whole cell, or an error naming the column.
double number_field(const CsvRow& row, const char* col, const std::string& v, const CsvError& fail) {
    double x = 0;
    auto r = std::from_chars(v.data(), v.data() + v.size(), x);
    if (v.empty() || r.ec != std::errc() || r.ptr != v.data() + v.size() || !std::isfinite(x))
        fail(row.line, std::string("column '") + col + "': '" + v + "' is not a number");
    return x;
}
}  // namespace

std::vector<AqueousRow> parse_aqueous_csv(std::string_view text) {
    const CsvError fail("aqueous.csv");
    const Csv csv = read_csv(text, fail);
    const auto idx = columns(csv.header,
                             {"formula", "dHf_kJ_per_mol", "S_J_per_molK", "Cp_J_per_molK", "source", "from_memory"},
                             {"name"}, fail);
    const std::size_t ncols = csv.header.fields.size();
    std::vector<AqueousRow> out;
    std::unordered_map<std::string, std::size_t> seen_formula, seen_name;
    for (const CsvRow& row : csv.rows) {
        AqueousRow a;
        a.line = row.line;
        a.formula = field(row, idx[0], ncols, fail);
        if (a.formula.empty()) fail(row.line, "column 'formula' is empty");
        if (a.formula.find_first_of(" \t(") != std::string::npos)
            fail(row.line, "column 'formula': '" + a.formula + "' must be one formula without a phase");
        a.dHf_J_per_mol = 1000.0 * number_field(row, "dHf_kJ_per_mol", field(row, idx[1], ncols, fail), fail);
        a.S_J_per_molK = number_field(row, "S_J_per_molK", field(row, idx[2], ncols, fail), fail);
        if (const std::string& cp = field(row, idx[3], ncols, fail); !cp.empty()) {
            a.has_cp = true;
            a.Cp_J_per_molK = number_field(row, "Cp_J_per_molK", cp, fail);
        }
        a.source = field(row, idx[4], ncols, fail);
        // Every row names one of the two compilations the file is drawn from, so that a citation
        // never reads as something it is not.
        if (a.source.rfind("NBS 1982", 0) != 0 && a.source.rfind("CODATA 1989", 0) != 0)
            fail(row.line, "column 'source': '" + a.source + "' must start with 'NBS 1982' or 'CODATA 1989'");
        const std::string& mem = field(row, idx[5], ncols, fail);
        if (mem != "yes" && mem != "no") fail(row.line, "column 'from_memory': '" + mem + "' must be yes or no");
        a.from_memory = mem == "yes";
        a.name = field(row, idx[6], ncols, fail);
        if (!a.name.empty() && !valid_alias_name(a.name))
            fail(row.line, "column 'name': '" + a.name + "' must start with a small letter and hold only "
                           "small letters, digits, '-', ',' and single spaces");
        auto [it, fresh] = seen_formula.emplace(a.formula, row.line);
        if (!fresh) fail(row.line, "formula '" + a.formula + "' repeats line " + std::to_string(it->second));
        if (!a.name.empty()) {
            auto [jt, fresh_name] = seen_name.emplace(a.name, row.line);
            if (!fresh_name) fail(row.line, "name '" + a.name + "' repeats line " + std::to_string(jt->second));
        }
        out.push_back(std::move(a));
    }
    if (out.empty()) fail(csv.header.line, "no rows after the header");
    return out;
}

}  // namespace rxnheat::detail
