// `rxnheat batch` (see batch.hpp): rows read in chunks of 1024, computed on --threads threads,
// written in input order and flushed, so memory stays constant and a pipe's results appear as its
// rows arrive.
#include "batch.hpp"

#include "commands.hpp"
#include "rxnheat/csv.hpp"

#include <algorithm>
#include <atomic>
#include <cerrno>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <memory>
#include <exception>
#include <string>
#include <system_error>
#include <thread>
#include <vector>

namespace rxnheat::cli {

const char* const batch_details =
    "Reads CSV rows reaction[,temperature[,unit]] from FILE (or standard input when FILE is -\n"
     "or absent) and writes one CSV row per input row, in input order, to standard output:\n"
     "\n"
     "  line,reaction,temperature_K,value,unit,kind,error\n"
     "\n"
     "  line           the input line on which the row starts (1-based)\n"
     "  reaction       the reaction text as given\n"
     "  temperature_K  the temperature used, K\n"
     "  value          ΔrH° in `unit` (empty on error)\n"
     "  unit           the row's unit, or -u, or kJ/mol\n"
     "  kind           exothermic / endothermic / thermoneutral (empty on error)\n"
     "  error          empty, or what is wrong with this row\n"
     "\n"
     "An empty temperature or unit cell takes -T / -u (defaults 298.15 K, kJ/mol). A first row\n"
     "whose first cell is `reaction` is a header and is skipped; so are blank rows. A bad row\n"
     "gets its error text and the batch goes on; the number of bad rows is written to standard\n"
     "error. Quoting follows RFC 4180 (\"...\" around cells with commas, quotes or line breaks,\n"
     "\"\" for a quote); UTF-8 passes through; a UTF-8 byte-order mark is ignored. Numbers are\n"
     "written with every digit needed to read back the same double. The file is streamed in\n"
     "chunks of 1024 rows, so memory stays constant; a row longer than 16384 bytes or of more\n"
     "than 4096 cells is an error, and input with no line end for 16 MiB stops the batch. A NUL\n"
     "byte in a cell is written as \u2400 (U+2400, the symbol for NUL).\n"
     "Exit status 0 when the input was read (even with bad rows), 2 when it could not be read,\n"
     "1 after an internal failure.\n";

const char* const batch_json_fields =
    "instead of CSV, one object {\"results\": [{\"line\", \"reaction\", \"temperature_K\", \"value\", "
    "\"unit\", \"kind\"} or {\"line\", \"reaction\", \"error\"}, ...], \"rows\", \"failed\"}, also streamed";

namespace {

// ---- batch -------------------------------------------------------------------------------------

constexpr std::size_t batch_chunk_rows = 1024;
constexpr unsigned max_threads = 256;
constexpr std::size_t max_row_span_bytes = 16u << 20;

struct BatchRow {
    std::size_t line = 0;
    std::string reaction, temperature_text, unit_text;
    std::string error;  // set by the reader, or by the computation
    bool internal = false;
    bool has_T = false;
    double T = 0;
    std::string unit;
    double value = 0;
    std::string kind;
};

// Spaces and tabs only, not rxnheat::trim: a line break inside a quoted cell is text, so such a
// cell is neither blank nor the header word (the row gets its own error instead).
std::string trimmed(const std::string& s) {
    const auto b = s.find_first_not_of(" \t");
    if (b == std::string::npos) return {};
    const auto e = s.find_last_not_of(" \t");
    return s.substr(b, e - b + 1);
}

void compute_row(BatchRow& r, Engine& engine, const SpeciesTable* table, double default_T,
                 const std::string& default_unit) {
    if (!r.error.empty()) return;
    try {
        r.unit = r.unit_text.empty() ? default_unit : r.unit_text;
        r.T = r.temperature_text.empty() ? default_T : parse_temperature(r.temperature_text);
        r.has_T = true;
        const ReactionReport rep = engine.report(r.reaction, {r.T, table});
        r.value = r.unit == "kJ/mol" ? rep.dH_kJ_per_mol : engine.dh(r.reaction, {r.T, table}, r.unit);
        r.kind = to_string(rep.kind);
    } catch (const Error& e) {
        r.error = e.what();
        r.internal = e.kind() == ErrorKind::internal;
    } catch (const std::exception& e) {
        r.error = std::string("internal error: ") + e.what();
        r.internal = true;
    } catch (...) {
        r.error = "internal error";
        r.internal = true;
    }
    if (!r.error.empty()) r.kind.clear();
}

void compute_chunk(std::vector<BatchRow>& rows, unsigned threads, Engine& engine,
                   const SpeciesTable* table, double default_T, const std::string& default_unit) {
    std::atomic<std::size_t> next{0};
    auto work = [&] {
        for (;;) {
            const std::size_t i = next.fetch_add(1);
            if (i >= rows.size()) return;
            compute_row(rows[i], engine, table, default_T, default_unit);
        }
    };
    const std::size_t helpers = std::min<std::size_t>(threads, rows.size()) - (rows.empty() ? 0 : 1);
    std::vector<std::thread> pool;
    for (std::size_t k = 0; k < helpers; ++k) {
        try {
            pool.emplace_back(work);
        } catch (const std::system_error&) {
            break;  // the system refused another thread: go on with those we have
        }
    }
    work();
    for (auto& t : pool) t.join();
}

// A NUL byte ends a cell or the whole file in many programs that read CSV; it is written as
// U+2400 SYMBOL FOR NUL, which shows where it was. (JSON output escapes it as \u0000.)
std::string without_nul(std::string s) {
    for (std::size_t i = s.find('\0'); i != std::string::npos; i = s.find('\0', i + 3)) s.replace(i, 1, "\u2400");
    return s;
}

std::string batch_row_csv(const BatchRow& r) {
    std::string out;
    rxnheat::csv::append_row(out, {std::to_string(r.line), without_nul(r.reaction), r.has_T ? exact_number(r.T) : "",
                                  r.error.empty() ? exact_number(r.value) : "", without_nul(r.unit), r.kind,
                                  without_nul(r.error)});
    return out;
}

std::string batch_row_json(const BatchRow& r) {
    JsonObject j;
    j.num("line", static_cast<double>(r.line)).str("reaction", r.reaction);
    if (r.has_T) j.num("temperature_K", r.T);
    if (r.error.empty())
        j.num("value", r.value).str("unit", r.unit).str("kind", r.kind);
    else
        j.str("error", r.error);
    return j.text();
}

}  // namespace

int run_batch(const Parsed& p, Output& output, Engine& engine) {
    // Read in the order the other commands read them: temperature, table, then the input.
    const double default_T = p.has("temperature") ? parse_temperature(p.value_or("temperature", "")) : T_ref;
    std::shared_ptr<const SpeciesTable> table;
    if (p.has("table")) table = std::make_shared<const SpeciesTable>(SpeciesTable::from_csv_file(p.value_or("table", "")));
    std::FILE* in = stdin;
    std::string name = "standard input";
    if (!p.positionals.empty() && p.positionals[0] != "-") {
        name = p.positionals[0];
        in = std::fopen(name.c_str(), "rb");
        if (!in) throw Error(ErrorKind::argument, "cannot open '" + name + "': " + std::strerror(errno));
    }
    struct Closer {
        std::FILE* f;
        ~Closer() {
            if (f && f != stdin) std::fclose(f);
        }
    } closer{in};

    unsigned threads = 1;
    if (p.has("threads")) {
        const std::string t = p.value_or("threads", "");
        char* end = nullptr;
        const long n = std::strtol(t.c_str(), &end, 10);
        if (t.empty() || end != t.c_str() + t.size() || n < 0 || n > static_cast<long>(max_threads))
            throw Error(ErrorKind::argument, "--threads must be a whole number from 0 to " + std::to_string(max_threads) +
                               " (0: one per processor), not '" + t + "'");
        threads = static_cast<unsigned>(n);
        if (threads == 0) threads = std::max(1u, std::thread::hardware_concurrency());
    }
    const std::string default_unit = p.value_or("unit", "kJ/mol");

    // A row longer than the reader holds is an error row and the batch reads on to its end, but
    // not forever: input without a line end for 16 MiB (/dev/zero) stops the batch.
    rxnheat::csv::Options reader_options;
    reader_options.max_record_span = max_row_span_bytes;
    rxnheat::csv::Reader reader(in, reader_options);
    rxnheat::csv::Record rec;
    bool first_record = true;
    std::size_t total = 0, failed = 0;
    bool internal = false;

    if (output.json()) {
        output.write("{\"results\":[");
        output.set_batch_open(true);
    } else {
        output.write("line,reaction,temperature_K,value,unit,kind,error\n");
    }

    std::vector<BatchRow> rows;
    rows.reserve(batch_chunk_rows);
    bool more = true;
    while (more) {
        rows.clear();
        while (rows.size() < batch_chunk_rows) {
            if (!reader.next(rec)) {
                more = false;
                break;
            }
            bool blank = rec.error.empty();
            for (const auto& cell : rec.cells)
                if (!trimmed(cell).empty()) blank = false;
            if (blank) continue;  // empty lines and rows of empty cells are not data
            const bool was_first = first_record;
            first_record = false;
            if (was_first && rec.error.empty() && trimmed(rec.cells[0]) == "reaction") continue;  // header

            BatchRow r;
            r.line = rec.line;
            r.reaction = rec.cells[0];
            if (rec.cells.size() > 1) r.temperature_text = trimmed(rec.cells[1]);
            if (rec.cells.size() > 2) r.unit_text = trimmed(rec.cells[2]);
            r.error = rec.error;
            std::size_t used = rec.cells.size();
            while (used > 0 && trimmed(rec.cells[used - 1]).empty()) --used;
            if (r.error.empty() && used > 3)
                r.error = "the row has " + std::to_string(used) +
                          " cells; a batch row is reaction[,temperature[,unit]]";
            rows.push_back(std::move(r));
        }
        compute_chunk(rows, threads, engine, table.get(), default_T, default_unit);

        std::string out;
        for (const auto& r : rows) {
            if (output.json()) {
                if (total) out += ",";
                out += batch_row_json(r);
            } else {
                out += batch_row_csv(r);
            }
            ++total;
            if (!r.error.empty()) ++failed;
            if (r.internal) internal = true;
        }
        output.write(out);
        std::fflush(stdout);
    }

    std::string read_failure;
    if (!reader.stopped().empty())
        read_failure = "cannot read '" + name + "' to its end: " + reader.stopped();
    else if (reader.read_error())
        read_failure = "cannot read '" + name + "': " + std::strerror(reader.read_error());

    if (output.json()) {
        std::string t = "],\"rows\":" + std::to_string(total) + ",\"failed\":" + std::to_string(failed);
        if (!read_failure.empty()) t += ",\"error\":" + json_string(read_failure);
        output.write(t + "}\n");
        output.set_batch_open(false);
    }
    if (!read_failure.empty()) {
        if (!output.json()) output.write_err("rxnheat batch: " + read_failure + "\n");
        return exit_bad_input;
    }
    if (failed)
        output.write_err("rxnheat batch: " + std::to_string(failed) + " of " + std::to_string(total) +
                  " rows have errors (see their error cells)\n");
    return internal ? exit_internal : exit_ok;
}


}  // namespace rxnheat::cli
