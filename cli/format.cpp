// Number and JSON text for the rxnheat command line (see format.hpp).
#include "format.hpp"

#include <cmath>
#include <cstdio>
#include <charconv>
#include <cstdlib>

namespace rxnheat::cli {

std::string plain_number(double x) {
    if (!std::isfinite(x)) return std::isnan(x) ? "nan" : (x < 0 ? "-inf" : "inf");
    char buf[64];
    const double a = std::fabs(x);
    if (a >= 1e6 && a < 1e15)
        std::snprintf(buf, sizeof buf, "%.0f", x);
    else
        std::snprintf(buf, sizeof buf, "%.6g", x);
    std::string s = buf;
    if (s == "-0") s = "0";
    return s;
}

std::string exact_number(double x) {
    if (!std::isfinite(x)) return "null";
    char buf[64];
    // Shortest text that reads back as the same double, fixed or scientific, whichever is
    // shorter (300, 298.15, -890.5629..., 1e+21).
    const auto r = std::to_chars(buf, buf + sizeof buf, x);
    return std::string(buf, r.ptr);
}

namespace {

/// Length of the valid UTF-8 sequence starting at s[i], or 0 if the byte there starts none.
std::size_t utf8_length(std::string_view s, std::size_t i) {
    auto b = [&](std::size_t k) { return static_cast<unsigned char>(s[k]); };
    auto cont = [&](std::size_t k, unsigned lo = 0x80, unsigned hi = 0xBF) {
        return k < s.size() && b(k) >= lo && b(k) <= hi;
    };
    const unsigned c = b(i);
    if (c < 0x80) return 1;
    if (c >= 0xC2 && c <= 0xDF) return cont(i + 1) ? 2 : 0;
    if (c >= 0xE0 && c <= 0xEF) {
        const unsigned lo = c == 0xE0 ? 0xA0 : 0x80, hi = c == 0xED ? 0x9F : 0xBF;
        return cont(i + 1, lo, hi) && cont(i + 2) ? 3 : 0;
    }
    if (c >= 0xF0 && c <= 0xF4) {
        const unsigned lo = c == 0xF0 ? 0x90 : 0x80, hi = c == 0xF4 ? 0x8F : 0xBF;
        return cont(i + 1, lo, hi) && cont(i + 2) && cont(i + 3) ? 4 : 0;
    }
    return 0;
}

}  // namespace

std::string json_string(std::string_view s) {
    std::string out;
    out.reserve(s.size() + 2);
    out.push_back('"');
    for (std::size_t i = 0; i < s.size();) {
        const unsigned char c = static_cast<unsigned char>(s[i]);
        if (c >= 0x80) {
            const std::size_t n = utf8_length(s, i);
            if (n == 0) {
                out += "\\ufffd";
                ++i;
            } else {
                out.append(s.substr(i, n));
                i += n;
            }
            continue;
        }
        switch (c) {
        case '"': out += "\\\""; break;
        case '\\': out += "\\\\"; break;
        case '\n': out += "\\n"; break;
        case '\r': out += "\\r"; break;
        case '\t': out += "\\t"; break;
        case '\b': out += "\\b"; break;
        case '\f': out += "\\f"; break;
        default:
            if (c < 0x20) {
                char buf[8];
                std::snprintf(buf, sizeof buf, "\\u%04x", c);
                out += buf;
            } else {
                out.push_back(static_cast<char>(c));
            }
        }
        ++i;
    }
    out.push_back('"');
    return out;
}

void JsonObject::key(std::string_view k) {
    if (!first_) s_.push_back(',');
    first_ = false;
    s_ += json_string(k);
    s_.push_back(':');
}

JsonObject& JsonObject::str(std::string_view k, std::string_view v) {
    key(k);
    s_ += json_string(v);
    return *this;
}

JsonObject& JsonObject::num(std::string_view k, double v) {
    key(k);
    s_ += exact_number(v);
    return *this;
}

JsonObject& JsonObject::boolean(std::string_view k, bool v) {
    key(k);
    s_ += v ? "true" : "false";
    return *this;
}

JsonObject& JsonObject::null(std::string_view k) {
    key(k);
    s_ += "null";
    return *this;
}

JsonObject& JsonObject::raw(std::string_view k, std::string_view json) {
    key(k);
    s_ += json;
    return *this;
}

void Output::write(std::string_view s) const { std::fwrite(s.data(), 1, s.size(), stdout); }
void Output::write_err(std::string_view s) const { std::fwrite(s.data(), 1, s.size(), stderr); }
void Output::result(const std::string& plain, const JsonObject& json) const {
    write((json_ ? json.text() : plain) + "\n");
}

}  // namespace rxnheat::cli
