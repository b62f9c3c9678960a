// CSV for the rxnheat command line (RFC 4180 quoting): a streaming reader that holds one
// record at a time, and the quoting used when writing. Private to the CLI.
#pragma once

#include <cstddef>
#include <cstdio>
#include <string>
#include <string_view>
#include <vector>

namespace rxncli::csv {

/// One record (row) of a CSV file.
struct Record {
    std::vector<std::string> cells;
    std::size_t line = 0;  ///< 1-based line on which the record starts
    std::string error;     ///< empty, or what was wrong with this record (the reader goes on)
};

/// Reads records one by one from a stdio stream (through its file descriptor, so that a pipe's
/// rows are taken as they arrive, not when a whole buffer has filled). Memory is bounded: a record longer than
/// max_record_bytes keeps its first bytes only and carries an error; the reader goes on with
/// the next record. Accepts LF, CRLF and lone CR line ends; a UTF-8 byte-order mark at the
/// very start is dropped; bytes are otherwise passed through unchanged (UTF-8 included).
/// Quoted cells may hold commas, line breaks and doubled quotes (""), as RFC 4180 says.
/// A quote inside an unquoted cell is kept as an ordinary character.
class Reader {
public:
    explicit Reader(std::FILE* in, std::size_t max_record_bytes = 16384);
    /// The next record; false at the end of the input (or on a read error, see read_error()).
    bool next(Record& out);
    /// errno of a failed read, 0 if none.
    int read_error() const noexcept { return read_errno_; }

private:
    int get();          ///< next byte or EOF
    void unget(int c);  ///< puts a byte back (EOF is ignored)
    std::FILE* in_;
    std::size_t max_bytes_;
    std::vector<char> buf_;
    std::size_t pos_ = 0, len_ = 0;
    std::size_t line_ = 1;
    bool at_start_ = true;
    bool eof_ = false;
    int read_errno_ = 0;
    std::string pushed_;  ///< bytes put back, last in first out
};

/// A cell as written to CSV: quoted (with inner quotes doubled) when it holds a comma, a
/// quote, a line break or leading/trailing blanks; unchanged otherwise.
std::string quote(std::string_view cell);

/// Appends cells joined by commas, each quoted as needed, and a line feed.
void append_row(std::string& out, const std::vector<std::string>& cells);

}  // namespace rxncli::csv
