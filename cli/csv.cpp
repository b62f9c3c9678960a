// CSV reading and quoting for the rxnheat command line (see csv.hpp).
#include "csv.hpp"

#include <cerrno>

#include <unistd.h>

namespace rxncli::csv {

Reader::Reader(std::FILE* in, std::size_t max_record_bytes)
    : in_(in), max_bytes_(max_record_bytes), buf_(65536) {}

int Reader::get() {
    if (!pushed_.empty()) {
        const int c = static_cast<unsigned char>(pushed_.back());
        pushed_.pop_back();
        return c;
    }
    if (pos_ == len_) {
        if (eof_) return EOF;
        ssize_t n;
        do {
            n = ::read(fileno(in_), buf_.data(), buf_.size());
        } while (n < 0 && errno == EINTR);
        if (n <= 0) {
            if (n < 0) read_errno_ = errno ? errno : EIO;
            eof_ = true;
            return EOF;
        }
        len_ = static_cast<std::size_t>(n);
        pos_ = 0;
    }
    return static_cast<unsigned char>(buf_[pos_++]);
}

void Reader::unget(int c) {
    if (c != EOF) pushed_.push_back(static_cast<char>(c));
}

bool Reader::next(Record& out) {
    out.cells.clear();
    out.error.clear();
    if (at_start_) {  // drop a UTF-8 byte-order mark at the very start
        at_start_ = false;
        const int b0 = get();
        if (b0 == 0xEF) {
            const int b1 = get();
            if (b1 == 0xBB) {
                const int b2 = get();
                if (b2 != 0xBF) unget(b2), unget(b1), unget(b0);
            } else {
                unget(b1), unget(b0);
            }
        } else {
            unget(b0);
        }
    }
    int c = get();
    if (c == EOF) return false;
    out.line = line_;

    enum class State { start, unquoted, quoted, after_quote } st = State::start;
    std::string cell;
    std::size_t bytes = 0;
    bool truncated = false;
    auto fail = [&](const std::string& what) {
        if (out.error.empty()) out.error = what;
    };
    auto add = [&](int ch) {
        if (++bytes > max_bytes_) {
            truncated = true;
            return;
        }
        cell.push_back(static_cast<char>(ch));
    };
    auto end_cell = [&] {
        out.cells.push_back(std::move(cell));
        cell.clear();
    };
    // Consumes a line end that starts with c ('\n', or '\r' with an optional '\n' after it).
    auto line_end = [&](int ch) {
        if (ch == '\r') {
            const int n = get();
            if (n != '\n') unget(n);
        }
        ++line_;
    };

    for (;; c = get()) {
        switch (st) {
        case State::start:
            if (c == EOF) { end_cell(); goto done; }
            if (c == '"') { st = State::quoted; break; }
            if (c == ',') { end_cell(); break; }
            if (c == '\n' || c == '\r') { line_end(c); end_cell(); goto done; }
            add(c);
            st = State::unquoted;
            break;
        case State::unquoted:
            if (c == EOF) { end_cell(); goto done; }
            if (c == ',') { end_cell(); st = State::start; break; }
            if (c == '\n' || c == '\r') { line_end(c); end_cell(); goto done; }
            add(c);
            break;
        case State::quoted:
            if (c == EOF) {
                fail("a quoted cell is not closed before the end of the input");
                end_cell();
                goto done;
            }
            if (c == '"') { st = State::after_quote; break; }
            if (c == '\n') ++line_;
            add(c);
            break;
        case State::after_quote:
            if (c == '"') { add('"'); st = State::quoted; break; }
            if (c == EOF) { end_cell(); goto done; }
            if (c == ',') { end_cell(); st = State::start; break; }
            if (c == '\n' || c == '\r') { line_end(c); end_cell(); goto done; }
            fail("text after the closing quote of cell " + std::to_string(out.cells.size() + 1) +
                 " (write a quote inside a quoted cell as \"\")");
            add(c);
            st = State::unquoted;
            break;
        }
    }
done:
    if (truncated)
        out.error = "the row is longer than " + std::to_string(max_bytes_) + " bytes";
    return true;
}

std::string quote(std::string_view cell) {
    bool needs = false;
    for (char ch : cell)
        if (ch == ',' || ch == '"' || ch == '\n' || ch == '\r') needs = true;
    if (!cell.empty() && (cell.front() == ' ' || cell.front() == '\t' || cell.back() == ' ' || cell.back() == '\t'))
        needs = true;
    if (!needs) return std::string(cell);
    std::string out;
    out.reserve(cell.size() + 2);
    out.push_back('"');
    for (char ch : cell) {
        if (ch == '"') out.push_back('"');
        out.push_back(ch);
    }
    out.push_back('"');
    return out;
}

void append_row(std::string& out, const std::vector<std::string>& cells) {
    for (std::size_t i = 0; i < cells.size(); ++i) {
        if (i) out.push_back(',');
        out += quote(cells[i]);
    }
    out.push_back('\n');
}

}  // namespace rxncli::csv
