// Number and JSON text for the rxnheat command line, and where it goes. Private to the CLI.
#pragma once

#include <string>
#include <string_view>

namespace rxnheat::cli {

/// A number for people: 6 significant digits (%.6g), but written out in full without an
/// exponent from 1e6 up to 1e15 (totals such as 123456789 kJ stay readable).
std::string plain_number(double x);

/// A number for programs: the shortest decimal that reads back as the same double (at most
/// 17 significant digits); JSON null if it is not finite.
std::string exact_number(double x);

/// A JSON string literal: quotes, backslashes and control characters escaped; valid UTF-8
/// passed through; each byte that is not part of valid UTF-8 replaced by U+FFFD.
std::string json_string(std::string_view s);

/// Builds one JSON object, keys in the order added.
class JsonObject {
public:
    JsonObject& str(std::string_view key, std::string_view value);
    JsonObject& num(std::string_view key, double value);
    JsonObject& boolean(std::string_view key, bool value);
    JsonObject& null(std::string_view key);
    JsonObject& raw(std::string_view key, std::string_view json);  ///< value already JSON
    std::string text() const { return s_ + "}"; }

private:
    void key(std::string_view k);
    std::string s_ = "{";
    bool first_ = true;
};

/// Where results and errors go, and the state of what has been written: text or JSON mode, and
/// whether `batch --json` has opened its object (so that an error escaping the batch closes
/// that object instead of starting a second one). Owned by main; one per run.
class Output {
public:
    explicit Output(bool json) : json_(json) {}
    bool json() const noexcept { return json_; }
    void write(std::string_view s) const;      ///< to standard output
    void write_err(std::string_view s) const;  ///< to standard error
    /// One result: `plain` in text mode, the object in JSON mode; each with a line feed.
    void result(const std::string& plain, const JsonObject& json) const;
    void set_batch_open(bool open) noexcept { batch_open_ = open; }
    bool batch_open() const noexcept { return batch_open_; }

private:
    bool json_;
    bool batch_open_ = false;
};

}  // namespace rxnheat::cli
