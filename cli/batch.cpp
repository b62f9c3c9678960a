// `rxnheat batch` (see batch.hpp): rows read in chunks of 1024, computed (and formatted) on
// --threads threads, written in input order and flushed, so memory stays constant and a pipe's
// results appear as its rows arrive.
#include "batch.hpp"

#include "commands.hpp"
#include "rxnheat/csv.hpp"

#include <algorithm>
#include <atomic>
#include <cerrno>
#include <charconv>
#include <condition_variable>
#include <deque>
#include <mutex>
#include <string_view>
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
//
// The pipeline: with --threads 1 one thread reads a chunk, computes it, writes it, and so on.
// With more, one thread reads chunks ahead (at most `chunks_in_flight` of them, so memory stays
// constant) while the main thread and --threads − 2 helpers compute the current chunk in
// blocks of `block_rows` rows, each block formatting its own rows, and the main thread writes
// the blocks in order and flushes. The reading thread never waits for the writing, so a pipe's
// results still appear as soon as a chunk of its rows is in.

constexpr std::size_t batch_chunk_rows = 1024;
constexpr std::size_t block_rows = 64;
constexpr std::size_t chunks_in_flight = 3;
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
    const char* kind = "";
};

/// Rows of the input, reused from chunk to chunk (their strings keep their capacity).
struct Chunk {
    std::vector<BatchRow> rows;
    std::size_t n = 0;                    // rows in use
    std::vector<std::string> block_out;   // each block's output text
    std::size_t first_index = 0;          // index of rows[0] among all rows written
};

// Spaces and tabs only, not rxnheat::trim: a line break inside a quoted cell is text, so such a
// cell is neither blank nor the header word (the row gets its own error instead).
std::string_view trimmed(std::string_view s) {
    const auto b = s.find_first_not_of(" \t");
    if (b == std::string_view::npos) return {};
    const auto e = s.find_last_not_of(" \t");
    return s.substr(b, e - b + 1);
}

struct Settings {
    Engine* engine;
    const SpeciesTable* table;
    double default_T;
    std::string default_unit;
    bool json;
};

void compute_row(BatchRow& r, const Settings& st) {
    if (!r.error.empty()) return;
    try {
        r.unit.assign(r.unit_text.empty() ? st.default_unit : r.unit_text);
        r.T = r.temperature_text.empty() ? st.default_T : parse_temperature(r.temperature_text);
        r.has_T = true;
        const Conditions at{r.T, st.table};
        // The kind first: it fails as ΔrH° in kJ/mol fails, before any question of the unit.
        r.kind = to_string(st.engine->kind(r.reaction, at));
        r.value = st.engine->dh(r.reaction, at, r.unit);
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
    if (!r.error.empty()) r.kind = "";
}

// A NUL byte ends a cell or the whole file in many programs that read CSV; it is written as
// U+2400 SYMBOL FOR NUL, which shows where it was. (JSON output escapes it as \u0000.)
void append_csv_cell(std::string& out, const std::string& cell) {
    if (cell.find('\0') == std::string::npos) return rxnheat::csv::append_cell(out, cell);
    std::string s = cell;
    for (std::size_t i = s.find('\0'); i != std::string::npos; i = s.find('\0', i + 3)) s.replace(i, 1, "\u2400");
    rxnheat::csv::append_cell(out, s);
}

void append_number(std::string& out, double x) { out += exact_number(x); }

void append_row_csv(std::string& out, const BatchRow& r) {
    char line[24];
    const auto end = std::to_chars(line, line + sizeof line, r.line).ptr;
    out.append(line, end);
    out.push_back(',');
    append_csv_cell(out, r.reaction);
    out.push_back(',');
    if (r.has_T) append_number(out, r.T);
    out.push_back(',');
    if (r.error.empty()) append_number(out, r.value);
    out.push_back(',');
    append_csv_cell(out, r.unit);
    out.push_back(',');
    out += r.kind;
    out.push_back(',');
    append_csv_cell(out, r.error);
    out.push_back('\n');
}

void append_row_json(std::string& out, const BatchRow& r, bool first) {
    JsonObject j;
    j.num("line", static_cast<double>(r.line)).str("reaction", r.reaction);
    if (r.has_T) j.num("temperature_K", r.T);
    if (r.error.empty())
        j.num("value", r.value).str("unit", r.unit).str("kind", r.kind);
    else
        j.str("error", r.error);
    if (!first) out.push_back(',');
    out += j.text();
}

/// Computes and formats block b of the chunk.
void run_block(Chunk& c, std::size_t b, const Settings& st) {
    const std::size_t lo = b * block_rows, hi = std::min(c.n, lo + block_rows);
    std::string& out = c.block_out[b];
    out.clear();
    for (std::size_t i = lo; i < hi; ++i) {
        compute_row(c.rows[i], st);
        if (st.json)
            append_row_json(out, c.rows[i], c.first_index + i == 0);
        else
            append_row_csv(out, c.rows[i]);
    }
}

/// Every block of the chunk, on the calling thread and `helpers` more.
void run_chunk(Chunk& c, unsigned helpers, const Settings& st) {
    const std::size_t blocks = (c.n + block_rows - 1) / block_rows;
    if (c.block_out.size() < blocks) c.block_out.resize(blocks);
    std::atomic<std::size_t> next{0};
    auto work = [&] {
        for (std::size_t b; (b = next.fetch_add(1)) < blocks;) run_block(c, b, st);
    };
    std::vector<std::thread> pool;
    for (std::size_t k = 0; k + 1 < blocks && k < helpers; ++k) {
        try {
            pool.emplace_back(work);
        } catch (const std::system_error&) {
            break;  // the system refused another thread: go on with those we have
        }
    }
    work();
    for (auto& t : pool) t.join();
}

/// Reads the next chunk of rows (header and blank rows skipped); false when the input has ended
/// (the chunk may still hold rows).
bool read_chunk(rxnheat::csv::Reader& reader, rxnheat::csv::Record& rec, bool& first_record, Chunk& c) {
    c.n = 0;
    if (c.rows.size() < batch_chunk_rows) c.rows.resize(batch_chunk_rows);
    while (c.n < batch_chunk_rows) {
        if (!reader.next(rec)) return false;
        bool blank = rec.error.empty();
        for (const auto& cell : rec.cells)
            if (!trimmed(cell).empty()) {
                blank = false;
                break;
            }
        if (blank) continue;  // empty lines and rows of empty cells are not data
        const bool was_first = first_record;
        first_record = false;
        if (was_first && rec.error.empty() && trimmed(rec.cells[0]) == "reaction") continue;  // header

        BatchRow& r = c.rows[c.n++];
        r.line = rec.line;
        r.reaction.assign(rec.cells[0]);
        r.temperature_text.assign(rec.cells.size() > 1 ? trimmed(rec.cells[1]) : std::string_view());
        r.unit_text.assign(rec.cells.size() > 2 ? trimmed(rec.cells[2]) : std::string_view());
        r.error.assign(rec.error);
        r.internal = r.has_T = false;
        r.T = r.value = 0;
        r.unit.clear();
        r.kind = "";
        std::size_t used = rec.cells.size();
        while (used > 0 && trimmed(rec.cells[used - 1]).empty()) --used;
        if (r.error.empty() && used > 3)
            r.error = "the row has " + std::to_string(used) + " cells; a batch row is reaction[,temperature[,unit]]";
    }
    return true;
}

/// Chunks passed from the reading thread to the main thread, and back when written.
class ChunkQueue {
public:
    ChunkQueue() {
        for (auto& c : store_) free_.push_back(&c);
    }
    Chunk* take_free() {  // the reading thread; null when the main thread has stopped
        std::unique_lock<std::mutex> lock(m_);
        cv_.wait(lock, [&] { return !free_.empty() || abandoned_; });
        if (abandoned_) return nullptr;
        Chunk* c = free_.front();
        free_.pop_front();
        return c;
    }
    void put_full(Chunk* c, bool last) {
        std::lock_guard<std::mutex> lock(m_);
        if (c) full_.push_back(c);
        ended_ = ended_ || last;
        cv_.notify_all();
    }
    void fail(std::exception_ptr e) {
        std::lock_guard<std::mutex> lock(m_);
        error_ = e;
        ended_ = true;
        cv_.notify_all();
    }
    Chunk* take_full() {  // the main thread; null at the end of the input
        std::unique_lock<std::mutex> lock(m_);
        cv_.wait(lock, [&] { return !full_.empty() || ended_; });
        if (full_.empty()) {
            if (error_) std::rethrow_exception(error_);
            return nullptr;
        }
        Chunk* c = full_.front();
        full_.pop_front();
        return c;
    }
    void give_back(Chunk* c) {
        std::lock_guard<std::mutex> lock(m_);
        free_.push_back(c);
        cv_.notify_all();
    }
    void abandon() {
        std::lock_guard<std::mutex> lock(m_);
        abandoned_ = true;
        cv_.notify_all();
    }

private:
    std::mutex m_;
    std::condition_variable cv_;
    Chunk store_[chunks_in_flight];
    std::deque<Chunk*> free_, full_;
    bool ended_ = false, abandoned_ = false;
    std::exception_ptr error_;
};

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
    const Settings settings{&engine, table.get(), default_T, p.value_or("unit", "kJ/mol"), output.json()};

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

    auto write_chunk = [&](Chunk& c) {
        const std::size_t blocks = (c.n + block_rows - 1) / block_rows;
        for (std::size_t b = 0; b < blocks; ++b) output.write(c.block_out[b]);
        for (std::size_t i = 0; i < c.n; ++i) {
            if (!c.rows[i].error.empty()) ++failed;
            if (c.rows[i].internal) internal = true;
        }
        total += c.n;
        std::fflush(stdout);
    };

    if (threads == 1) {
        Chunk c;
        for (bool more = true; more;) {
            more = read_chunk(reader, rec, first_record, c);
            c.first_index = total;
            run_chunk(c, 0, settings);
            write_chunk(c);
        }
    } else {
        ChunkQueue queue;
        std::thread reading([&] {
            try {
                for (bool more = true; more;) {
                    Chunk* c = queue.take_free();
                    if (!c) return;
                    more = read_chunk(reader, rec, first_record, *c);
                    queue.put_full(c, !more);
                }
            } catch (...) {
                queue.fail(std::current_exception());
            }
        });
        struct Joiner {
            ChunkQueue& q;
            std::thread& t;
            ~Joiner() {
                q.abandon();
                t.join();
            }
        } joiner{queue, reading};
        while (Chunk* c = queue.take_full()) {
            c->first_index = total;
            run_chunk(*c, threads - 2, settings);
            write_chunk(*c);
            queue.give_back(c);
        }
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
