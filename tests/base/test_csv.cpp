// Tests of the CSV reader and writer (include/rxnheat/csv.hpp, engine/src/csv.cpp).
//
// Outside sources: RFC 4180 (Common Format and MIME Type for CSV Files, 2005), section 2, for
// the quoting rules (named beside the checks as "RFC 4180 2.n"); Python's csv module (Debian
// python3, run at test time) as a second reader of the same bytes.
#include <catch2/catch.hpp>

#include "rxnheat/csv.hpp"

#include <cerrno>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <future>
#include <random>
#include <string>
#include <vector>

#include <fcntl.h>
#include <unistd.h>

namespace csv = rxnheat::csv;
using Cells = std::vector<std::string>;

namespace {

std::vector<csv::Record> read_all(std::string_view text, csv::Options options = {}) {
    csv::Reader reader(text, options);
    std::vector<csv::Record> out;
    csv::Record rec;
    while (reader.next(rec)) out.push_back(rec);
    return out;
}

// Same through a std::FILE* (a temporary file), so both sources are checked on the same bytes.
std::vector<csv::Record> read_all_file(const std::string& text, csv::Options options = {}) {
    std::FILE* f = std::tmpfile();
    REQUIRE(f != nullptr);
    REQUIRE(std::fwrite(text.data(), 1, text.size(), f) == text.size());
    REQUIRE(std::fflush(f) == 0);
    REQUIRE(::lseek(fileno(f), 0, SEEK_SET) == 0);
    csv::Reader reader(f, options);
    std::vector<csv::Record> out;
    csv::Record rec;
    while (reader.next(rec)) out.push_back(rec);
    CHECK(reader.read_error() == 0);
    std::fclose(f);
    return out;
}

bool contains(const std::string& s, const std::string& part) { return s.find(part) != std::string::npos; }

}  // namespace

TEST_CASE("csv: plain cells, quoted cells with commas, doubled quotes", "[csv]") {
    // RFC 4180 2.4: cells separated by commas, spaces are part of a cell.
    auto r = read_all("a, b ,c\n");
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"a", " b ", "c"});
    CHECK(r[0].line == 1);
    CHECK(r[0].error.empty());
    // RFC 4180 2.6: a cell holding a comma is in double quotes.
    r = read_all("x,\"one, two\",y\n");
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"x", "one, two", "y"});
    // RFC 4180 2.7: a quote inside a quoted cell is written twice.
    r = read_all("\"say \"\"hi\"\"\",\"\"\"\",\"\"\n");
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"say \"hi\"", "\"", ""});
    CHECK(r[0].error.empty());
    // Empty cells anywhere, and a last record without a line end (RFC 4180 2.2).
    r = read_all(",a,,\nb");
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells == Cells{"", "a", "", ""});
    CHECK(r[1].cells == Cells{"b"});
    CHECK(r[1].line == 2);
}

TEST_CASE("csv: line breaks inside quotes, and line numbers", "[csv]") {
    // RFC 4180 2.6: a cell holding a line break is in double quotes; the break is cell text.
    auto r = read_all("\"two\nlines\",x\nnext\n");
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells == Cells{"two\nlines", "x"});
    CHECK(r[0].line == 1);
    CHECK(r[1].cells == Cells{"next"});
    CHECK(r[1].line == 3);
    // CRLF inside quotes is kept byte for byte and counts as one line; so is a lone CR.
    r = read_all("\"a\r\nb\",\"c\rd\"\r\nlast\r\n");
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells == Cells{"a\r\nb", "c\rd"});
    CHECK(r[1].cells == Cells{"last"});
    CHECK(r[1].line == 4);
}

TEST_CASE("csv: LF, CRLF and lone CR line ends", "[csv]") {
    // RFC 4180 2.1 writes CRLF; LF and lone CR are what other systems write.
    for (const std::string& text : {std::string("a,b\nc\n\nd"), std::string("a,b\r\nc\r\n\r\nd"),
                                    std::string("a,b\rc\r\rd"), std::string("a,b\r\nc\n\rd\r\n")}) {
        INFO(text);
        const auto r = read_all(text);
        REQUIRE(r.size() == 4);
        CHECK(r[0].cells == Cells{"a", "b"});
        CHECK(r[1].cells == Cells{"c"});
        CHECK(r[2].cells == Cells{""});  // the empty line
        CHECK(r[3].cells == Cells{"d"});
        CHECK((r[0].line == 1 && r[1].line == 2 && r[2].line == 3 && r[3].line == 4));
    }
    // "\n\r" is two line ends (LF, then a lone CR), not one.
    const auto r = read_all("a\n\rb");
    REQUIRE(r.size() == 3);
    CHECK(r[2].line == 3);
}

TEST_CASE("csv: empty input, empty lines, and line()", "[csv]") {
    CHECK(read_all("").empty());
    auto r = read_all("\n");
    REQUIRE(r.size() == 1);  // one empty line; the line end at the end starts no other record
    CHECK(r[0].cells == Cells{""});
    r = read_all("a\n\n\nb\n");
    REQUIRE(r.size() == 4);
    CHECK(r[1].cells == Cells{""});
    CHECK(r[2].line == 3);
    CHECK(r[3].line == 4);
    csv::Reader reader(std::string_view("a\r\nb\r\n"));
    csv::Record rec;
    CHECK(reader.line() == 1);
    REQUIRE(reader.next(rec));
    CHECK(reader.line() == 2);
    REQUIRE(reader.next(rec));
    CHECK(!reader.next(rec));
    CHECK(reader.line() == 3);
}

TEST_CASE("csv: a UTF-8 byte-order mark at the very start is dropped, nowhere else", "[csv]") {
    // EF BB BF is U+FEFF in UTF-8 (Unicode Standard, ch. 23.8), as spreadsheets write it for
    // "CSV UTF-8".
    auto r = read_all("\xEF\xBB\xBF" "formula,phase\r\nH2O,l\r\n");
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells == Cells{"formula", "phase"});
    r = read_all("\xEF\xBB\xBF\"quoted\",x\n");
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"quoted", "x"});
    r = read_all("a\n\xEF\xBB\xBF" "b\n");  // not at the start: ordinary bytes
    REQUIRE(r.size() == 2);
    CHECK(r[1].cells == Cells{"\xEF\xBB\xBF" "b"});
    r = read_all("\xEF\xBBx\n");  // not a whole mark: kept
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"\xEF\xBBx"});
    r = read_all("\xEF\xBB");
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"\xEF\xBB"});
    CHECK(read_all("\xEF\xBB\xBF").empty());
    // Other bytes pass through, UTF-8 or not, NUL included.
    r = read_all(std::string("\xCE\x94rH\xC2\xB0,\xFF\0z\n", 11));
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"\xCE\x94rH\xC2\xB0", std::string("\xFF\0z", 3)});
}

TEST_CASE("csv: an unclosed quote is an error naming the line where the cell starts", "[csv]") {
    auto r = read_all("a,b\nc,\"d\ne\nf");
    REQUIRE(r.size() == 2);
    CHECK(r[0].error.empty());
    CHECK(r[1].line == 2);
    CHECK(r[1].cells == Cells{"c", "d\ne\nf"});
    CHECK(r[1].error == "a quoted cell that starts on line 2 is not closed before the end of the input");
    // The record starts on line 1; its unclosed cell on line 2.
    r = read_all("a,\"x\ny\",\"q\n");
    REQUIRE(r.size() == 1);
    CHECK(r[0].line == 1);
    CHECK(contains(r[0].error, "starts on line 2"));
    // Closed just before the end: no error.
    r = read_all("\"a\"");
    REQUIRE(r.size() == 1);
    CHECK(r[0].error.empty());
    CHECK(r[0].cells == Cells{"a"});
}

TEST_CASE("csv: misplaced quotes", "[csv]") {
    // Text after a closing quote: an error (RFC 4180 2.5/2.7 allow none), the text kept.
    auto r = read_all("\"a\"b,c\nd\n");
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells == Cells{"ab", "c"});
    CHECK(r[0].error == "text after the closing quote of cell 1 (write a quote inside a quoted cell as \"\")");
    CHECK(r[1].error.empty());
    r = read_all("x,\"a\" \n");
    REQUIRE(r.size() == 1);
    CHECK(contains(r[0].error, "closing quote of cell 2"));
    // A quote inside an unquoted cell is an ordinary character (RFC 4180 2.5 says such cells
    // "may not" hold quotes; we keep it), and blanks before a quote make the cell unquoted.
    r = read_all("5\" pipe, \"a,b\"\n");
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"5\" pipe", " \"a", "b\""});
    CHECK(r[0].error.empty());
    // ... or, with strict_quotes, an error naming the cell.
    csv::Options strict;
    strict.strict_quotes = true;
    r = read_all("ok,hy\"drogen\nnext\n", strict);
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells == Cells{"ok", "hy\"drogen"});
    CHECK(r[0].error == "a '\"' inside the unquoted field (cell 2): quote the whole cell and write \"\" for a quote");
    CHECK(r[1].error.empty());
    r = read_all("\"quoted \"\"fine\"\"\",x\n", strict);
    REQUIRE(r.size() == 1);
    CHECK(r[0].error.empty());
}

TEST_CASE("csv: an over-long record keeps its first bytes, carries an error, and the next record reads", "[csv]") {
    csv::Options small;
    small.max_record_bytes = 10;
    auto r = read_all("abcdefgh,ijklmnop\n\"0123456789\",\"x\ny\"\nnext\n", small);
    REQUIRE(r.size() == 3);
    CHECK(r[0].cells == Cells{"abcdefgh", "ij"});
    CHECK(r[0].error == "the row is longer than 10 bytes");
    // 13 bytes of cell text, the last cell's line break inside quotes still counted as a line.
    CHECK(r[1].error == "the row is longer than 10 bytes");
    CHECK(r[1].cells == Cells{"0123456789", ""});
    CHECK(r[2].cells == Cells{"next"});
    CHECK(r[2].line == 4);
    CHECK(r[2].error.empty());
    r = read_all("0123456789,\n", small);  // exactly 10 bytes: fine
    REQUIRE(r.size() == 1);
    CHECK(r[0].error.empty());
    // The default limit, 16384 bytes: 20000 bytes in one cell.
    r = read_all(std::string(20000, 'x') + "\nok\n");
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells.at(0).size() == 16384);
    CHECK(r[0].error == "the row is longer than 16384 bytes");
    CHECK(r[1].cells == Cells{"ok"});
    // An unclosed quote says so rather than "too long", since it is why the record ran on.
    r = read_all("a,\"" + std::string(100, 'x') + "\n" + std::string(100, 'y'), small);
    REQUIRE(r.size() == 1);
    CHECK(contains(r[0].error, "not closed"));
}

TEST_CASE("csv: a record over the cell limit keeps the first cells and carries an error", "[csv]") {
    // 4096 cells (4095 commas): fine; 5001 cells: the first 4096 kept, an error.
    auto r = read_all(std::string(4095, ',') + "\n" + std::string(5000, ',') + "\nok\n");
    REQUIRE(r.size() == 3);
    CHECK(r[0].cells.size() == 4096);
    CHECK(r[0].error.empty());
    CHECK(r[1].cells.size() == 4096);
    CHECK(r[1].error == "the row has more than 4096 cells");
    CHECK(r[2].cells == Cells{"ok"});
    CHECK(r[2].line == 3);
    csv::Options three;
    three.max_cells = 3;
    r = read_all("a,b,c,d,e\nf\n", three);
    REQUIRE(r.size() == 2);
    CHECK(r[0].cells == Cells{"a", "b", "c"});
    CHECK(r[0].error == "the row has more than 3 cells");
    CHECK(r[1].cells == Cells{"f"});
}

TEST_CASE("csv: comment lines, when asked for", "[csv]") {
    csv::Options hash;
    hash.comment = '#';
    // A comment line is skipped whole, quotes and commas in it included; it may be indented.
    auto r = read_all("# a \"quote, left open\n  \t# indented\r\nh1,h2\n# between\n1,#2\n\"#3\",x\n", hash);
    REQUIRE(r.size() == 3);
    CHECK(r[0].cells == Cells{"h1", "h2"});
    CHECK(r[0].line == 3);
    CHECK(r[1].cells == Cells{"1", "#2"});  // '#' after the start of a record is text
    CHECK(r[1].line == 5);
    CHECK(r[2].cells == Cells{"#3", "x"});  // so is a quoted '#'
    // A line inside a quoted cell is cell text, even when it starts with '#'.
    r = read_all("\"a\n# not a comment\",b\n", hash);
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"a\n# not a comment", "b"});
    // Blanks alone are a record (the caller decides); a comment at the end without a line end.
    r = read_all("  \n# last", hash);
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"  "});
    // Without the option '#' is text.
    r = read_all("# x\n");
    REQUIRE(r.size() == 1);
    CHECK(r[0].cells == Cells{"# x"});
}

TEST_CASE("csv: a std::FILE* source reads the same records as a text source", "[csv]") {
    // Rows over several 64 KiB reads, so records and CRLF pairs straddle read boundaries.
    std::string text = "\xEF\xBB\xBFreaction,temperature\r\n";
    std::mt19937 rng(20240611);  // fixed seed: the same text every run
    for (int i = 0; i < 12000; ++i) {
        text += "\"CO(g) + H2O(g) -> CO2(g) + H2(g), row " + std::to_string(i) + "\"," + std::to_string(rng() % 900);
        text += (i % 3 == 0) ? "\r\n" : (i % 3 == 1) ? "\n" : "\r";
        if (i % 1000 == 7) text += "\"a\r\nquoted \"\"line\"\" break\"\r\n";
    }
    REQUIRE(text.size() > 4 * 65536);
    const auto from_text = read_all(text);
    const auto from_file = read_all_file(text);
    REQUIRE(from_text.size() == 12000 + 1 + 12);
    REQUIRE(from_file.size() == from_text.size());
    for (std::size_t i = 0; i < from_text.size(); ++i) {
        INFO("record " << i);
        CHECK(from_file[i].cells == from_text[i].cells);
        CHECK(from_file[i].line == from_text[i].line);
        CHECK(from_file[i].error.empty());
    }
    CHECK(from_text[0].cells == Cells{"reaction", "temperature"});
    CHECK(from_text.back().line == 12000 + 1 + 12 * 2);
}

TEST_CASE("csv: a pipe's records are returned as each line end arrives", "[csv]") {
    int fds[2];
    REQUIRE(::pipe(fds) == 0);
    std::FILE* in = ::fdopen(fds[0], "rb");
    REQUIRE(in != nullptr);
    csv::Reader reader(in);
    csv::Record rec;
    auto next_within = [&](std::chrono::seconds limit) {
        auto got = std::async(std::launch::async, [&] { return reader.next(rec); });
        if (got.wait_for(limit) == std::future_status::ready) return got.get();
        ::close(fds[1]);  // unblock the reader so the test ends; the check below fails
        fds[1] = -1;
        got.wait();
        return false;
    };
    const std::string first = "a,\"b\nc\"\n";
    REQUIRE(::write(fds[1], first.data(), first.size()) == static_cast<ssize_t>(first.size()));
    REQUIRE(next_within(std::chrono::seconds(10)));
    CHECK(rec.cells == Cells{"a", "b\nc"});
    // A record ended by a lone CR is returned without waiting to see whether an LF follows.
    REQUIRE(fds[1] >= 0);
    REQUIRE(::write(fds[1], "d\r", 2) == 2);
    REQUIRE(next_within(std::chrono::seconds(10)));
    CHECK(rec.cells == Cells{"d"});
    CHECK(rec.line == 3);
    // The LF that completes that CRLF arrives later and starts no empty record.
    REQUIRE(fds[1] >= 0);
    REQUIRE(::write(fds[1], "\ne", 2) == 2);
    ::close(fds[1]);
    REQUIRE(reader.next(rec));
    CHECK(rec.cells == Cells{"e"});
    CHECK(rec.line == 4);
    CHECK(!reader.next(rec));
    CHECK(reader.read_error() == 0);
    std::fclose(in);
}

TEST_CASE("csv: a failed read is reported", "[csv]") {
    // A directory opens for reading on Linux, and read(2) then fails with EISDIR.
    std::FILE* dir = std::fopen(RXNHEAT_SOURCE_DIR, "rb");
    REQUIRE(dir != nullptr);
    csv::Reader reader(dir);
    csv::Record rec;
    CHECK(!reader.next(rec));
    CHECK(reader.read_error() == EISDIR);
    std::fclose(dir);
}

TEST_CASE("csv: quote() and append_row()", "[csv]") {
    CHECK(csv::quote("plain") == "plain");
    CHECK(csv::quote("") == "");
    CHECK(csv::quote("a,b") == "\"a,b\"");                          // RFC 4180 2.6
    CHECK(csv::quote("say \"hi\"") == "\"say \"\"hi\"\"\"");          // RFC 4180 2.7
    CHECK(csv::quote("two\nlines") == "\"two\nlines\"");              // RFC 4180 2.6
    CHECK(csv::quote("cr\r") == "\"cr\r\"");
    CHECK(csv::quote(" lead") == "\" lead\"");  // blanks kept visible and safe from trimming
    CHECK(csv::quote("trail\t") == "\"trail\t\"");
    CHECK(csv::quote("in side") == "in side");
    std::string out;
    csv::append_row(out, {"1", "a, b", "", "\"q\""});
    csv::append_row(out, {""});
    CHECK(out == "1,\"a, b\",,\"\"\"q\"\"\"\n\n");
}

TEST_CASE("csv: what append_row writes, the reader reads back", "[csv]") {
    std::mt19937 rng(4180);  // fixed seed
    const std::string alphabet = "ab ,\"\n\r\t#\xEF\xBB\xBF";
    std::vector<Cells> rows;
    std::string text;
    for (int i = 0; i < 2000; ++i) {
        Cells row(1 + rng() % 5);
        for (auto& cell : row)
            for (unsigned k = rng() % 8; k > 0; --k) cell += alphabet[rng() % alphabet.size()];
        // A first cell starting with a byte-order mark would lose it on the first row only.
        if (i == 0) row[0] = "first";
        rows.push_back(row);
        csv::append_row(text, row);
    }
    const auto back = read_all(text);
    REQUIRE(back.size() == rows.size());
    for (std::size_t i = 0; i < rows.size(); ++i) {
        INFO("row " << i);
        CHECK(back[i].cells == rows[i]);
        CHECK(back[i].error.empty());
    }
}

TEST_CASE("csv: agrees with Python's csv module on the same bytes", "[csv][external]") {
    // Outside reader: Python's csv module (Debian python3), reading with newline="" so that line
    // breaks inside quotes are kept as written, and encoding utf-8-sig, which drops a leading
    // byte-order mark. Each record is printed as its cells in hex, space-separated.
    const std::string text =
        "\xEF\xBB\xBF" "reaction,temperature,unit\r\n"
        "\"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\",\"25 C\",kJ/mol\r\n"
        "\"a, \"\"quoted\"\" one\",300\n"
        "\"two\r\nlines\",,\r"
        "CH\xE2\x82\x84(g),1000,\n"
        ",,\n"
        "last";
    char path[] = "/tmp/rxnheat-test-csv-XXXXXX";
    const int fd = ::mkstemp(path);
    REQUIRE(fd >= 0);
    REQUIRE(::write(fd, text.data(), text.size()) == static_cast<ssize_t>(text.size()));
    ::close(fd);
    const std::string cmd = std::string("/usr/bin/python3 -c \"import csv,sys\n"
                                        "for r in csv.reader(open(sys.argv[1], newline='', encoding='utf-8-sig')):\n"
                                        "    print(' '.join(c.encode('utf-8').hex() for c in r))\" ") +
                            path + " 2>&1";
    std::FILE* p = ::popen(cmd.c_str(), "r");
    REQUIRE(p != nullptr);
    std::string py;
    char buf[4096];
    while (std::size_t n = std::fread(buf, 1, sizeof buf, p)) py.append(buf, n);
    const int status = ::pclose(p);
    std::remove(path);
    INFO(py);
    REQUIRE(status == 0);

    std::string ours;
    for (const auto& rec : read_all(text)) {
        CHECK(rec.error.empty());
        for (std::size_t i = 0; i < rec.cells.size(); ++i) {
            if (i) ours += ' ';
            for (unsigned char ch : rec.cells[i]) {
                static const char* digits = "0123456789abcdef";
                ours += digits[ch >> 4];
                ours += digits[ch & 15];
            }
        }
        ours += '\n';
    }
    CHECK(ours == py);
}
