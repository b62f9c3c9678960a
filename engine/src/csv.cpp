// The CSV reader and writer (rules in include/rxnheat/csv.hpp).
#include "rxnheat/csv.hpp"

#include <cerrno>
#include <cstring>

#include <unistd.h>

namespace rxnheat::csv {

struct Reader::State {
    explicit State(Options o) : opt(o) {}

    Options opt;
    std::FILE* file = nullptr;    // the stream source, or null for a text source
    std::vector<char> buf;        // the stream source's read buffer
    const char* data = nullptr;   // bytes not yet taken: data[pos..len)
    std::size_t pos = 0, len = 0;
    bool eof = false;
    int read_errno = 0;
    std::size_t line = 1;
    bool at_start = true;         // nothing read yet: a byte-order mark may follow
    // A CR just ended a line; an LF right after it belongs to the same line end. Kept as a flag
    // rather than read ahead at once, so a record ending in CR on a pipe is returned without
    // waiting for the next byte.
    bool skip_lf = false;
    char pushed[3] = {};          // bytes put back (only while looking for the byte-order mark)
    int npushed = 0;

    bool refill() {
        if (!file || eof) return false;
        ssize_t n;
        do {
            n = ::read(fileno(file), buf.data(), buf.size());
        } while (n < 0 && errno == EINTR);
        if (n <= 0) {
            if (n < 0) read_errno = errno ? errno : EIO;
            eof = true;
            return false;
        }
        data = buf.data();
        len = static_cast<std::size_t>(n);
        pos = 0;
        return true;
    }
    // Bytes taken from the source, and where the record being read started (for the limits).
    std::size_t taken = 0, record_start = 0, record_line = 1;
    std::string stop;  // why a limit stopped the reading; every later byte is then EOF

    int raw() {
        if (npushed) return static_cast<unsigned char>(pushed[--npushed]);
        if (!stop.empty() || (pos == len && !refill())) return EOF;
        if (opt.max_input_bytes && taken >= opt.max_input_bytes) {
            stop = "the input is longer than " + std::to_string(opt.max_input_bytes) + " bytes; the rest is not read";
            return EOF;
        }
        if (opt.max_record_span && taken - record_start >= opt.max_record_span) {
            stop = "no line end within " + std::to_string(opt.max_record_span) + " bytes of line " +
                   std::to_string(record_line) + "; the rest of the input is not read";
            return EOF;
        }
        ++taken;
        return static_cast<unsigned char>(data[pos++]);
    }
    void start_record() {
        record_start = taken;
        record_line = line;
    }
    int get() {
        int c = raw();
        if (skip_lf) {
            skip_lf = false;
            if (c == '\n') c = raw();
        }
        return c;
    }
    void unget(int c) {
        if (c != EOF) pushed[npushed++] = static_cast<char>(c);
    }
    // Consumes a line end outside quotes that starts with c ('\n' or '\r').
    void line_end(int c) {
        ++line;
        if (c == '\r') skip_lf = true;
    }
    void drop_byte_order_mark() {
        const int b0 = raw();
        if (b0 != 0xEF) return unget(b0);
        const int b1 = raw();
        if (b1 != 0xBB) return unget(b1), unget(b0);
        const int b2 = raw();
        if (b2 != 0xBF) return unget(b2), unget(b1), unget(b0);
    }
};

Reader::Reader(std::FILE* in, Options options) : s_(std::make_unique<State>(options)) {
    s_->file = in;
    s_->buf.resize(65536);
}

Reader::Reader(std::string_view text, Options options) : s_(std::make_unique<State>(options)) {
    s_->data = text.data();
    s_->len = text.size();
}

Reader::~Reader() = default;
Reader::Reader(Reader&&) noexcept = default;
Reader& Reader::operator=(Reader&&) noexcept = default;

int Reader::read_error() const noexcept { return s_->read_errno; }
std::size_t Reader::line() const noexcept { return s_->line; }
const std::string& Reader::stopped() const noexcept { return s_->stop; }

bool Reader::next(Record& out) {
    State& s = *s_;
    out.error.clear();
    out.line = 0;
    if (s.at_start) {
        s.at_start = false;
        s.drop_byte_order_mark();
    }

    // Leading blanks of the line, then either a comment line (skipped whole) or the record.
    std::string lead;
    int c;
    for (;;) {
        s.start_record();
        lead.clear();
        c = s.get();
        while (c == ' ' || c == '\t') {
            if (lead.size() <= s.opt.max_record_bytes) lead.push_back(static_cast<char>(c));
            c = s.get();
        }
        if (!s.opt.comment || c != static_cast<unsigned char>(s.opt.comment)) break;
        while (c != EOF && c != '\n' && c != '\r') c = s.get();
        if (c == EOF) return false;
        s.line_end(c);
    }
    if (c == EOF && lead.empty()) return false;
    out.line = s.line;

    enum class Where { start, unquoted, quoted, after_quote } st = Where::start;
    std::string cell;
    std::size_t bytes = 0;       // cell text held for this record
    std::size_t ncells = 0;      // cells ended, including any beyond max_cells
    std::size_t quote_line = 0;  // line of the last opening quote
    bool truncated = false, too_many = false, unclosed = false;
    std::string misplaced;       // the first misplaced-quote error
    auto add = [&](int ch) {
        if (bytes >= s.opt.max_record_bytes) {
            truncated = true;
            return;
        }
        ++bytes;
        cell.push_back(static_cast<char>(ch));
    };
    // The record's cells reuse the strings of the record before (swapped in and out), so rows of
    // the same shape cost no allocation.
    std::size_t kept = 0;  // cells of this record in out.cells[0..kept)
    auto end_cell = [&] {
        ++ncells;
        if (kept >= s.opt.max_cells)
            too_many = true;
        else if (kept < out.cells.size())
            out.cells[kept++].swap(cell);
        else
            out.cells.push_back(std::move(cell)), ++kept;
        cell.clear();
    };
    // A run of ordinary bytes straight from the buffer: none of , " CR LF, within the limits
    // raw() keeps. Only where get() would give the same bytes one by one.
    auto take_run = [&] {
        if (s.npushed || s.skip_lf || !s.stop.empty()) return;
        std::size_t limit = s.len;
        if (s.opt.max_input_bytes) limit = std::min(limit, s.pos + (s.opt.max_input_bytes - std::min(s.taken, s.opt.max_input_bytes)));
        if (s.opt.max_record_span)
            limit = std::min(limit, s.pos + (s.opt.max_record_span - std::min(s.taken - s.record_start, s.opt.max_record_span)));
        std::size_t end = s.pos;
        while (end < limit) {
            const char ch = s.data[end];
            if (ch == ',' || ch == '"' || ch == '\n' || ch == '\r') break;
            ++end;
        }
        const std::size_t n = end - s.pos, room = s.opt.max_record_bytes - std::min(bytes, s.opt.max_record_bytes);
        cell.append(s.data + s.pos, std::min(n, room));
        if (n > room) truncated = true;
        bytes += std::min(n, room);
        s.taken += n;
        s.pos = end;
    };
    for (char b : lead) add(static_cast<unsigned char>(b));
    if (!lead.empty()) st = Where::unquoted;

    for (int prev = 0;; prev = c, c = s.get()) {
        switch (st) {
        case Where::start:
            if (c == EOF) { end_cell(); goto done; }
            if (c == '"') { st = Where::quoted; quote_line = s.line; break; }
            if (c == ',') { end_cell(); break; }
            if (c == '\n' || c == '\r') { s.line_end(c); end_cell(); goto done; }
            add(c);
            take_run();
            st = Where::unquoted;
            break;
        case Where::unquoted:
            if (c == EOF) { end_cell(); goto done; }
            if (c == ',') { end_cell(); st = Where::start; break; }
            if (c == '\n' || c == '\r') { s.line_end(c); end_cell(); goto done; }
            if (c == '"' && s.opt.strict_quotes && misplaced.empty())
                misplaced = "a '\"' inside the unquoted field (cell " + std::to_string(ncells + 1) +
                            "): quote the whole cell and write \"\" for a quote";
            add(c);
            take_run();
            break;
        case Where::quoted:
            if (c == EOF) { unclosed = true; end_cell(); goto done; }
            if (c == '"') { st = Where::after_quote; break; }
            // A line break inside quotes is cell text; CRLF counts as one line end.
            if (c == '\r' || (c == '\n' && prev != '\r')) ++s.line;
            add(c);
            if (c != '\r') take_run();  // a run holds no line break, so `prev` stays right
            break;
        case Where::after_quote:
            if (c == '"') { add('"'); st = Where::quoted; break; }
            if (c == EOF) { end_cell(); goto done; }
            if (c == ',') { end_cell(); st = Where::start; break; }
            if (c == '\n' || c == '\r') { s.line_end(c); end_cell(); goto done; }
            if (misplaced.empty())
                misplaced = "text after the closing quote of cell " + std::to_string(ncells + 1) +
                            " (write a quote inside a quoted cell as \"\")";
            add(c);
            st = Where::unquoted;
            break;
        }
    }
done:
    out.cells.resize(kept);
    if (!s.stop.empty())
        out.error = s.stop;
    else if (s.read_errno)
        out.error = std::string("the input could not be read to the end of this row: ") + std::strerror(s.read_errno);
    else if (unclosed)
        out.error = "a quoted cell that starts on line " + std::to_string(quote_line) +
                    " is not closed before the end of the input";
    else if (truncated)
        out.error = "the row is longer than " + std::to_string(s.opt.max_record_bytes) + " bytes";
    else if (too_many)
        out.error = "the row has more than " + std::to_string(s.opt.max_cells) + " cells";
    else
        out.error = std::move(misplaced);
    return true;
}

namespace {
bool needs_quotes(std::string_view cell) {
    for (char ch : cell)
        if (ch == ',' || ch == '"' || ch == '\n' || ch == '\r') return true;
    return !cell.empty() && (cell.front() == ' ' || cell.front() == '\t' || cell.back() == ' ' || cell.back() == '\t');
}
}  // namespace

void append_cell(std::string& out, std::string_view cell) {
    if (!needs_quotes(cell)) {
        out.append(cell.data(), cell.size());
        return;
    }
    out.push_back('"');
    for (char ch : cell) {
        if (ch == '"') out.push_back('"');
        out.push_back(ch);
    }
    out.push_back('"');
}

std::string quote(std::string_view cell) {
    std::string out;
    out.reserve(cell.size() + 2);
    append_cell(out, cell);
    return out;
}

void append_row(std::string& out, const std::vector<std::string>& cells) {
    for (std::size_t i = 0; i < cells.size(); ++i) {
        if (i) out.push_back(',');
        append_cell(out, cells[i]);
    }
    out.push_back('\n');
}

}  // namespace rxnheat::csv
