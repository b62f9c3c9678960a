// rxnheat/csv.hpp — the one CSV reader and writer of rxnheat, used by the embedded data tables
// (data/elements.csv, data/aliases.csv), by user species tables read from a file (the CLI's
// --table) and by the CLI's batch input and output. Exported from librxnheat.
//
// The rules of the reader:
// - RFC 4180 quoting. A cell that starts with '"' is quoted: it ends at the next lone '"', may
//   hold commas and line breaks, and "" inside it stands for one '"'. Blanks before the opening
//   quote make the cell unquoted (RFC 4180 keeps spaces as part of a cell).
// - Text between a closing quote and the next comma or line end is an error of that record
//   (the text is kept as part of the cell).
// - A '"' inside an unquoted cell is an ordinary character; with Options::strict_quotes it is
//   an error of the record instead (for tables we write ourselves, where it can only be a typo).
// - Records end at LF, CRLF or a lone CR; a line break inside a quoted cell is kept as it is
//   written, byte for byte. Line numbers count every line end, including those inside quotes.
//   A line end at the very end of the input starts no further record.
// - A UTF-8 byte-order mark (EF BB BF) at the very start of the input is dropped; all other
//   bytes pass through unchanged (UTF-8 or not). A NUL byte is an ordinary byte.
// - An empty line is a record of one empty cell; callers decide whether blank records matter.
// - With Options::comment set (e.g. '#'), a line whose first byte other than blanks (space,
//   tab) is that character, where a record would start, is skipped whole, quotes and all.
// - An unclosed quote at the end of the input is an error of the last record, in words naming
//   the line on which the quoted cell started.
// - Memory is bounded per record: the reader holds one record at a time. A record whose cells
//   hold more than Options::max_record_bytes bytes in all keeps its first bytes only and carries
//   an error; a record of more than Options::max_cells cells keeps the first max_cells and
//   carries an error. In both cases the reader reads on to the record's real end, so the next
//   record is read normally.
// - Time and memory are bounded per input as well, for input that never ends (/dev/zero):
//   with Options::max_record_span, a record still without its end after that many bytes stops
//   the reader; with Options::max_input_bytes, so does an input longer than that. The record
//   being read carries the error, and stopped() says why in words; next() is false after it.
// - A failed read (e.g. the path is a directory) ends the input: read_error() gives the errno,
//   and a record that was cut short by it carries an error in words.
// - When a record has several faults, its error names one, in this order: a failed read, an
//   unclosed quote, an over-long record, too many cells, then the first misplaced quote.
//
// A std::FILE* source is read through its file descriptor (read(2)), so that rows arriving on a
// pipe are returned as soon as their line end arrives rather than when a stdio buffer fills;
// give a stream from which nothing has been read yet. A text source is read in place: the text
// must outlive the reader.
//
// The writer: quote() quotes a cell when it must (see there); append_row() writes one record
// with LF as its line end.
#pragma once

#include "rxnheat/rxnheat.hpp"  // RXNHEAT_API

#include <cstddef>
#include <cstdio>
#include <memory>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat::csv {

/// One record (row) of a CSV input.
struct Record {
    std::vector<std::string> cells;  ///< at least one cell (an empty line gives one empty cell)
    std::size_t line = 0;            ///< 1-based line on which the record starts
    std::string error;               ///< empty, or what was wrong with this record, in words
};

/// How a Reader reads; the defaults suit data from users (the CLI's batch input).
struct Options {
    std::size_t max_record_bytes = 16384;  ///< bytes of cell text held per record
    std::size_t max_cells = 4096;          ///< cells held per record
    char comment = '\0';                   ///< comment-line character, or '\0' for none
    bool strict_quotes = false;            ///< a '"' inside an unquoted cell is an error
    std::size_t max_record_span = 0;       ///< bytes one record may span before reading stops (0: any)
    std::size_t max_input_bytes = 0;       ///< bytes of input read at most (0: any)
};

/// Reads records one at a time from a stdio stream or from text in memory.
class RXNHEAT_API Reader {
public:
    explicit Reader(std::FILE* in, Options options = {});
    explicit Reader(std::string_view text, Options options = {});
    ~Reader();
    Reader(Reader&&) noexcept;             ///< a moved-from reader may only be destroyed or assigned
    Reader& operator=(Reader&&) noexcept;
    Reader(const Reader&) = delete;
    Reader& operator=(const Reader&) = delete;

    /// The next record; false at the end of the input (or after a failed read, see read_error()).
    bool next(Record& out);
    /// errno of a failed read, 0 if none (always 0 for a text source).
    int read_error() const noexcept;
    /// The line the reader has reached: 1 + the number of line ends read so far.
    std::size_t line() const noexcept;
    /// Empty, or why a limit (Options::max_record_span, max_input_bytes) stopped the reading.
    const std::string& stopped() const noexcept;

private:
    struct State;
    std::unique_ptr<State> s_;
};

/// A cell as written to CSV: quoted (with inner quotes doubled) when it holds a comma, a quote,
/// a line break or leading/trailing blanks (space, tab); unchanged otherwise.
RXNHEAT_API std::string quote(std::string_view cell);

/// Appends the cell to `out` as quote() writes it, without a string of its own.
RXNHEAT_API void append_cell(std::string& out, std::string_view cell);

/// Appends cells joined by commas, each quoted as needed, and a line feed.
RXNHEAT_API void append_row(std::string& out, const std::vector<std::string>& cells);

}  // namespace rxnheat::csv
