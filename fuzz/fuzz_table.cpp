// libFuzzer target: user species tables (engine/DATA.md, User tables). Line 1 of the input is
// a reaction or species to evaluate with the table, line 2 a temperature; the rest is the
// table as CSV (the reader of rxnheat/csv.hpp, strict quotes, as for the CLI's --table).
//
// The table reaches the engine twice: built by SpeciesTable::from_rows (the CLI's way) and as a
// range of cells (the add-in's way, read by the catalogue). Every function of the catalogue
// that takes a table and needs nothing but a reaction, species or formula and a temperature is
// called with it, on two engines: one whose cache lives across inputs and one without a cache.
//
// Findings besides crashes and sanitizer reports: anything but rxnheat::Error from from_rows or
// anything but a Result from evaluate() (bad_alloc aside); the two table forms or the two
// engines giving different results (a cache that confuses tables shows up here).
#include "fuzz_common.hpp"

#include "rxnheat/csv.hpp"

#include <cstdint>
#include <memory>
#include <new>

using namespace rxnheat;

namespace {

/// The argument list for f with this table, or empty when f needs something else.
bool arguments(const FunctionSpec& f, const Arg& subject, const Arg& temperature, const Arg& table,
               std::vector<Arg>& out) {
    out.clear();
    bool has_table = false;
    for (const ArgSpec& a : f.args) {
        switch (a.kind) {
        case ArgKind::reaction:
        case ArgKind::species:
        case ArgKind::formula: out.push_back(subject); break;
        case ArgKind::temperature: out.push_back(temperature); break;
        case ArgKind::table: out.push_back(table); has_table = true; break;
        default:
            if (a.required) return false;
            out.push_back(Arg::omitted());
        }
    }
    return has_table;
}

}  // namespace

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    static Engine cached{EngineOptions{}};
    static Engine uncached{EngineOptions{0}};
    std::string_view input(reinterpret_cast<const char*>(data), size);
    std::size_t nl1 = input.find('\n');
    if (nl1 == std::string_view::npos) return 0;
    std::size_t nl2 = input.find('\n', nl1 + 1);
    if (nl2 == std::string_view::npos) return 0;
    const Arg subject = Arg::of(std::string(input.substr(0, nl1)));
    const std::string_view t = input.substr(nl1 + 1, nl2 - nl1 - 1);
    const Arg temperature = t.empty() ? Arg::omitted() : Arg::of(std::string(t));

    csv::Options options;
    options.strict_quotes = true;
    csv::Reader reader(input.substr(nl2 + 1), options);
    std::vector<std::vector<std::string>> rows;
    std::size_t cols = 0;
    for (csv::Record rec; reader.next(rec);) {
        if (!rec.error.empty()) return 0;  // the CLI refuses such a file before building a table
        if (rec.cells.size() > cols) cols = rec.cells.size();
        rows.push_back(std::move(rec.cells));
        if (rows.size() > 200) return 0;  // keep each input fast; size is bounded elsewhere
    }
    if (rows.empty()) return 0;
    std::vector<Cell> cells;
    for (auto& row : rows) {
        row.resize(cols);
        for (const auto& c : row) cells.push_back(Cell::of(c));
    }
    const Arg range = Arg::range(rows.size(), cols, std::move(cells));

    try {
        std::shared_ptr<const SpeciesTable> built;
        try {
            built = std::make_shared<const SpeciesTable>(SpeciesTable::from_rows(rows));
        } catch (const Error&) {
            // A malformed table: the range form must fail too (checked below).
        }
        const Arg table = built ? Arg::of(built) : Arg::omitted();
        const HostRules rules;
        std::vector<Arg> args;
        for (const FunctionSpec& f : catalogue()) {
            if (!arguments(f, subject, temperature, range, args)) continue;
            const Result result = evaluate(f, args, rules, cached);
            const std::string by_range = fuzz::fingerprint(result);
            const std::string uncached_range = fuzz::fingerprint(evaluate(f, args, rules, uncached));
            if (by_range != uncached_range)
                fuzz::fail("the cached engine differs from the uncached one", by_range + "----\n" + uncached_range);
            if (!built) {
                // A table from_rows refuses is refused as a range as well.
                if (!f.errors_as_text)
                    for (const auto& o : result.cells)
                        if (o.kind != Outcome::Kind::error)
                            fuzz::fail("a table refused by from_rows gave a result as a range",
                                       std::string(f.calc_name) + "\n" + by_range);
                continue;
            }
            arguments(f, subject, temperature, table, args);
            const std::string by_table = fuzz::fingerprint(evaluate(f, args, rules, cached));
            if (by_range != by_table)
                fuzz::fail("a table as a range differs from the same table built from rows",
                           std::string(f.calc_name) + "\n" + by_range + "----\n" + by_table);
        }
    } catch (const std::bad_alloc&) {
    }
    return 0;
}
