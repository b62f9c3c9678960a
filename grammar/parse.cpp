// parse.hpp implemented over the X3 grammar (reaction.hpp): UTF-8 decoding, the limits checked
// before parsing, the messages for failed expectations, and the conversion of the syntax tree
// into the public Reaction / Species (exact numbers, atom totals, charge, phase).
#include "grammar/parse.hpp"

#include "grammar/ast.hpp"
#include "grammar/reaction.hpp"

#include <boost/container/small_vector.hpp>
#include <boost/spirit/home/x3.hpp>

#include <algorithm>
#include <array>
#include <cstdint>
#include <cstdio>
#include <cstring>
#include <optional>
#include <utility>

namespace rxnheat::grammar {

ParseError::ParseError(std::size_t position, const std::string& message)
    : std::runtime_error(position == 0 ? message
                                       : "position " + std::to_string(position) + ": " + message),
      position_(position),
      detail_(message) {}

namespace {

namespace x3 = boost::spirit::x3;
using Text = std::u32string;  ///< the decoded input, and texts built for messages
using ast::Span;
using ast::view;
using Iter = parser::iterator_type;

enum class Mode { reaction, species, number };

// ---- characters ------------------------------------------------------------------------------

bool is_blank(char32_t c) {
    return c == U' ' || c == U'\t' || c == U'\r' || c == U'\n' || c == U'\u00A0' ||
           c == U'\u2009' || c == U'\u202F';
}
bool is_digit(char32_t c) { return c >= U'0' && c <= U'9'; }
bool is_upper(char32_t c) { return c >= U'A' && c <= U'Z'; }
bool is_lower(char32_t c) { return c >= U'a' && c <= U'z'; }
bool is_letter(char32_t c) { return is_upper(c) || is_lower(c); }
bool is_sign(char32_t c) { return c == U'+' || c == U'-' || c == U'\u2212'; }

int subscript_value(char32_t c) { return c >= U'\u2080' && c <= U'\u2089' ? int(c - U'\u2080') : -1; }

int superscript_value(char32_t c) {
    switch (c) {
        case U'\u2070': return 0;
        case U'\u00B9': return 1;
        case U'\u00B2': return 2;
        case U'\u00B3': return 3;
        default: return c >= U'\u2074' && c <= U'\u2079' ? int(c - U'\u2074') + 4 : -1;
    }
}

/// Vulgar fraction characters: {numerator, denominator}, or {0, 0}.
std::pair<int, int> vulgar_value(char32_t c) {
    switch (c) {
        case U'\u00BD': return {1, 2};
        case U'\u2153': return {1, 3};
        case U'\u2154': return {2, 3};
        case U'\u00BC': return {1, 4};
        case U'\u00BE': return {3, 4};
        case U'\u2155': return {1, 5};
        case U'\u2156': return {2, 5};
        case U'\u2157': return {3, 5};
        case U'\u2158': return {4, 5};
        case U'\u2159': return {1, 6};
        case U'\u215A': return {5, 6};
        case U'\u2150': return {1, 7};
        case U'\u215B': return {1, 8};
        case U'\u215C': return {3, 8};
        case U'\u215D': return {5, 8};
        case U'\u215E': return {7, 8};
        case U'\u2151': return {1, 9};
        case U'\u2152': return {1, 10};
        default: return {0, 0};
    }
}
bool is_vulgar(char32_t c) { return vulgar_value(c).second != 0; }
bool is_number_char(char32_t c) { return is_digit(c) || c == U'.' || c == U'/' || is_vulgar(c); }

bool is_hydrate_dot(char32_t c) {
    return c == U'\u00B7' || c == U'\u2022' || c == U'\u22C5' || c == U'*';
}

const Text arrows[] = {U"<=>", U"<->", U"->", U"=>", U"=", U"\u2192", U"\u27F6", U"\u21CC"};

/// Every character the notation uses; anything else is reported as an unexpected character.
bool in_alphabet(char32_t c) {
    if (is_blank(c) || is_letter(c) || is_digit(c)) return true;
    if (c < 0x80) return std::u32string_view(U"+-^{}()[]./*,=<>").find(c) != std::u32string_view::npos;
    return c == U'\u2212' || subscript_value(c) >= 0 || superscript_value(c) >= 0 ||
           c == U'\u207A' || c == U'\u207B' || is_vulgar(c) || is_hydrate_dot(c) ||
           c == U'\u2192' || c == U'\u27F6' || c == U'\u21CC';
}

// ---- UTF-8 -----------------------------------------------------------------------------------

void append_utf8(std::string& out, char32_t c) {
    if (c < 0x80) {
        out += char(c);
    } else if (c < 0x800) {
        out += char(0xC0 | (c >> 6));
        out += char(0x80 | (c & 0x3F));
    } else if (c < 0x10000) {
        out += char(0xE0 | (c >> 12));
        out += char(0x80 | ((c >> 6) & 0x3F));
        out += char(0x80 | (c & 0x3F));
    } else {
        out += char(0xF0 | (c >> 18));
        out += char(0x80 | ((c >> 12) & 0x3F));
        out += char(0x80 | ((c >> 6) & 0x3F));
        out += char(0x80 | (c & 0x3F));
    }
}

std::string utf8(Iter first, Iter last) {
    bool ascii = true;  // nearly every text: then each code point is its own byte
    for (Iter p = first; p != last; ++p) ascii &= *p < 0x80;
    if (ascii) return std::string(first, last);
    std::string out;
    out.reserve(std::size_t(last - first));
    for (; first != last; ++first) {
        if (*first < 0x80)
            out.push_back(char(*first));
        else
            append_utf8(out, *first);
    }
    return out;
}
std::string utf8(std::u32string_view t) { return utf8(t.data(), t.data() + t.size()); }

std::string hex_byte(unsigned char b) {
    char buf[8];
    std::snprintf(buf, sizeof buf, "0x%02X", unsigned(b));
    return buf;
}

/// Strict decoding (no overlong forms, surrogates or values above U+10FFFF).
void decode(std::string_view s, Text& out) {
    // All ASCII, the common case: one pass to find out, one to widen (no per-run searching),
    // each eight bytes at a time. `out` is resized from what it held, every character of it then
    // written: a buffer kept between calls fills only the difference in length.
    std::uint64_t any = 0;
    std::size_t k = 0;
    for (; k + 8 <= s.size(); k += 8) {
        std::uint64_t w;
        std::memcpy(&w, s.data() + k, 8);
        any |= w;
    }
    for (; k < s.size(); ++k) any |= static_cast<unsigned char>(s[k]);
    if ((any & 0x8080808080808080ull) == 0) {
        out.resize(s.size());
        char32_t* o = out.data();
        for (k = 0; k + 8 <= s.size(); k += 8) {
            unsigned char b[8];
            std::memcpy(b, s.data() + k, 8);
            for (int j = 0; j < 8; ++j) o[k + std::size_t(j)] = b[j];
        }
        for (; k < s.size(); ++k) o[k] = static_cast<unsigned char>(s[k]);
        return;
    }
    out.clear();
    out.reserve(s.size());
    std::size_t i = 0;
    while (i < s.size()) {
        auto const b = static_cast<unsigned char>(s[i]);
        auto bad = [&](const std::string& why) {
            return ParseError(out.size() + 1, "the text is not valid UTF-8 (" + why + ")");
        };
        if (b < 0x80) {  // a run of ASCII, the common case, appended at once
            std::size_t j = i + 1;
            while (j < s.size() && static_cast<unsigned char>(s[j]) < 0x80) ++j;
            const std::size_t at = out.size();
            out.resize(at + (j - i));  // within the reserved size (append of a range would copy it first)
            for (std::size_t k = i; k < j; ++k) out[at + k - i] = static_cast<unsigned char>(s[k]);
            i = j;
            continue;
        }
        std::size_t len;
        char32_t cp;
        char32_t min;
        if ((b & 0xE0) == 0xC0) {
            len = 2, cp = b & 0x1F, min = 0x80;
        } else if ((b & 0xF0) == 0xE0) {
            len = 3, cp = b & 0x0F, min = 0x800;
        } else if ((b & 0xF8) == 0xF0) {
            len = 4, cp = b & 0x07, min = 0x10000;
        } else {
            throw bad("byte " + hex_byte(b) + " cannot start a character");
        }
        if (i + len > s.size()) throw bad("the last character is incomplete");
        for (std::size_t k = 1; k < len; ++k) {
            auto const c = static_cast<unsigned char>(s[i + k]);
            if ((c & 0xC0) != 0x80) throw bad("byte " + hex_byte(c) + " cannot continue a character");
            cp = (cp << 6) | (c & 0x3F);
        }
        if (cp < min) throw bad("overlong encoding");
        if (cp > 0x10FFFF || (cp >= 0xD800 && cp <= 0xDFFF)) throw bad("not a Unicode character");
        out.push_back(cp);
        i += len;
    }
}

/// "'x'" for printable characters, plus the code point for non-ASCII; "U+0007" for controls.
std::string describe(char32_t c) {
    char buf[16];
    std::snprintf(buf, sizeof buf, "U+%04X", unsigned(c));
    bool const invisible = c < 0x20 || c == 0x7F || (c >= 0x80 && c < 0xA0) || c == 0xFEFF ||
                           (c >= 0x200B && c <= 0x200F) || (c >= 0x2028 && c <= 0x202E) ||
                           (c >= 0x2060 && c <= 0x2064);
    if (invisible) return std::string(buf) + " (invisible)";
    std::string q = "'";
    append_utf8(q, c);
    q += "'";
    return c < 0x80 ? q : q + " (" + buf + ")";
}

std::string in_quotes(std::u32string_view t) { return "'" + utf8(t) + "'"; }
std::string in_quotes(const Span& t) { return in_quotes(view(t)); }

// ---- checks before the grammar runs ----------------------------------------------------------

const char* empty_message(Mode mode) {
    switch (mode) {
        case Mode::reaction: return "the reaction is empty";
        case Mode::species: return "the species is empty";
        case Mode::number: return "the number is empty";
    }
    return "the text is empty";
}

/// The ASCII characters the pre-scan below looks at: brackets, digits, '+' and the arrows'
/// '=' and '>' (a table: one load, not eleven tests, for each of the other characters).
constexpr std::array<bool, 128> ascii_scanned = [] {
    std::array<bool, 128> c{};
    for (char b : {'(', '[', '{', ')', ']', '}', '+', '=', '>'}) c[static_cast<unsigned char>(b)] = true;
    for (char d = '0'; d <= '9'; ++d) c[static_cast<unsigned char>(d)] = true;
    return c;
}();

/// What the pre-scan counts on the way, for reserve_sides(): the '+' signs before the first
/// arrow character ('=', '>', U+2192, U+27F6, U+21CC) and after it.
struct Counts {
    std::size_t plus_before = 0, plus_after = 0;
};

bool is_arrow_char(char32_t c) {
    return c == U'=' || c == U'>' || c == U'\u2192' || c == U'\u27F6' || c == U'\u21CC';
}

/// Decodes the text into `t` (a buffer the caller may keep between calls) and checks what the
/// grammar relies on: the length, bracket pairing and depth, and the digits of each number.
/// One pass over the decoded text, which also counts `counts` (when given).
void prepare(std::string_view utf8_text, Mode mode, Text& t, Counts* counts = nullptr) {
    if (utf8_text.size() > max_input_characters) {  // bytes ≥ characters: only then count
        std::size_t chars = 0;  // code points if valid UTF-8: bytes that do not continue a character
        for (char b : utf8_text)
            if ((static_cast<unsigned char>(b) & 0xC0) != 0x80) ++chars;
        if (chars > max_input_characters)
            throw ParseError(0, "input longer than " + std::to_string(max_input_characters) + " characters");
    }

    decode(utf8_text, t);
    if (std::all_of(t.begin(), t.end(), is_blank)) throw ParseError(1, empty_message(mode));

    struct Open {
        char32_t ch;
        std::size_t position;
    };
    boost::container::small_vector<Open, max_group_depth + 1> open;  // never more: checked below
    auto closer = [](char32_t c) { return c == U'(' ? U')' : c == U'[' ? U']' : U'}'; };
    std::size_t plus[2] = {0, 0};  // before and after the first arrow character
    bool after = false;
    for (std::size_t i = 0; i < t.size(); ++i) {
        char32_t const c = t[i];
        if (c < 0x80 && !ascii_scanned[c]) continue;  // most characters
        if (c == U'+') {
            ++plus[after];
        } else if (is_arrow_char(c)) {
            after = true;
        } else if (c == U'(' || c == U'[' || c == U'{') {
            open.push_back({c, i + 1});
            if (open.size() > max_group_depth)
                throw ParseError(i + 1, "groups nested deeper than " + std::to_string(max_group_depth) +
                                            " levels");
        } else if (c == U')' || c == U']' || c == U'}') {
            if (open.empty()) throw ParseError(i + 1, "unmatched " + describe(c));
            if (closer(open.back().ch) != c)
                throw ParseError(i + 1, describe(c) + " does not match the " + describe(open.back().ch) +
                                            " at position " + std::to_string(open.back().position));
            open.pop_back();
        } else if (is_digit(c) || (c >= 0x80 && (subscript_value(c) >= 0 || superscript_value(c) >= 0))) {
            // one number: a run of digits of one kind, ASCII ones possibly with decimal points
            auto const kind = [](char32_t d) {
                return is_digit(d) ? 1 : subscript_value(d) >= 0 ? 2 : superscript_value(d) >= 0 ? 3 : 0;
            };
            int const k = kind(c);
            std::size_t j = i, digits = 0;
            while (j < t.size()) {
                if (kind(t[j]) == k) {
                    ++digits;
                    ++j;
                } else if (k == 1 && t[j] == U'.' && j + 1 < t.size() && is_digit(t[j + 1])) {
                    ++j;
                } else {
                    break;
                }
            }
            if (digits > max_number_digits)
                throw ParseError(i + 1, "a number may have at most " + std::to_string(max_number_digits) +
                                            " digits");
            i = j - 1;
        }
    }
    if (!open.empty()) throw ParseError(open.back().position, "unmatched " + describe(open.back().ch));
    if (counts) *counts = {plus[0], plus[1]};
}

Text prepare(std::string_view utf8_text, Mode mode) {
    Text t;
    prepare(utf8_text, mode, t);
    return t;
}

// ---- messages for failed expectations --------------------------------------------------------

/// Is one of the arrows at t[i...]? Sets *which to it.
bool arrow_at(const Text& t, std::size_t i, Text* which) {
    for (const Text& a : arrows)
        if (t.compare(i, a.size(), a) == 0) {
            if (which) *which = a;
            return true;
        }
    return false;
}

/// Does t[0, end) end with an arrow?
bool arrow_before(const Text& t, std::size_t end, Text* which) {
    for (const Text& a : arrows)
        if (end >= a.size() && t.compare(end - a.size(), a.size(), a) == 0) {
            if (which) *which = a;
            return true;
        }
    return false;
}


bool starts_term(char32_t c) {
    return is_letter(c) || is_digit(c) || c == U'(' || c == U'[' || is_vulgar(c);
}

/// The species text starting at i: up to whitespace, an arrow or a '+' that separates (one
/// followed by the start of another term; a '+' before whitespace or the end is a charge).
Text word_at(const Text& t, std::size_t i) {
    std::size_t j = i;
    while (j < t.size() && !is_blank(t[j]) && !(j > i && arrow_at(t, j, nullptr)) &&
           !(j > i && t[j] == U'+' && j + 1 < t.size() && starts_term(t[j + 1])))
        ++j;
    return t.substr(i, j - i);
}

class Diagnosis {
public:
    Diagnosis(Mode mode, const Text& t, const parser::Tracker& tracker)
        : mode_(mode), t_(t), tr_(tracker) {}

    ParseError error() const {
        if (!tr_.failed()) return ParseError(1, "the text could not be read");
        std::size_t const i = std::size_t(tr_.where() - t_.data());
        bool const at_end = i >= t_.size();
        char32_t const c = at_end ? 0 : t_[i];
        const std::string& key = tr_.key();

        if (!at_end && !in_alphabet(c)) return ParseError(i + 1, "unexpected character " + describe(c));
        if (!at_end && is_lower(c) && i >= 2 && is_lower(t_[i - 1]) && is_upper(t_[i - 2]))
            return ParseError(i + 1, "unexpected " + describe(c) + " after " + in_quotes(t_.substr(i - 2, 2)) +
                                         ": an element symbol is one uppercase letter, optionally "
                                         "followed by one lowercase letter (names such as 'ethanol' "
                                         "are written all in lowercase)");

        if (auto e = full_stop_as_hydrate_dot(i, key)) return *e;

        if (key == "species") return species_expected(i, c, at_end);
        if (key == "arrow" || key == "end") return end_of_part(key, i, c, at_end);
        if (key == "number") return ParseError(i + 1, "expected a number such as 2, 0.5, 3/2 or ½");
        if (key == "digits after point") return ParseError(i + 1, "expected a digit after '.'");
        if (key == "denominator") return ParseError(i + 1, "expected a whole number after '/'");
        if (key == "group") {
            std::string m = "expected an element symbol after " + describe(t_[i - 1]);
            if (c == U'1' && i + 1 < t_.size() && t_[i + 1] == U')')
                m += "; for the liquid phase write (l) with a lowercase L";
            return ParseError(i + 1, m);
        }
        if (key == "group close") {
            std::size_t const o = opening_bracket(i);
            char32_t const close = t_[o] == U'[' ? U']' : U')';
            return ParseError(i + 1, "expected " + describe(close) + " to close the " + describe(t_[o]) +
                                         " at position " + std::to_string(o + 1));
        }
        if (key == "hydrate") {
            std::size_t j = i;
            while (j > 0 && is_blank(t_[j - 1])) --j;
            return ParseError(i + 1, "expected a formula after " + describe(t_[j - 1]));
        }
        if (key == "caret charge") {
            std::string m = "expected a charge such as ^2+ or ^- after '^'";
            if (!at_end && is_sign(c) && i + 1 < t_.size() && is_digit(t_[i + 1]))
                m += " (the digits come before the sign: ^" + utf8(Text(1, t_[i + 1])) + utf8(Text(1, c)) + ")";
            return ParseError(i + 1, m);
        }
        if (key == "brace charge") return ParseError(i + 1, "expected a charge such as {2+} or {-} after '{'");
        if (key == "brace close") return ParseError(i + 1, "expected '}' after the charge");
        if (key == "superscript sign")
            return ParseError(i + 1, "expected \u207A or \u207B after the superscript digits");
        if (key == "phase")
            return ParseError(i, "expected a phase: (g), (l), (s), (cr) or (aq)");
        return ParseError(i + 1, at_end ? "unexpected end of the text" : "unexpected " + describe(c));
    }

private:
    /// "CaSO4.H2O", "NaCl.H2O", "CaSO4.½H2O": a full stop after a formula and before the start
    /// of another formula part, which the grammar could not read, is a hydrate dot typed as a
    /// full stop. Said so, with the two hydrate dots, instead of "expected a digit after '.'".
    std::optional<ParseError> full_stop_as_hydrate_dot(std::size_t i, const std::string& key) const {
        std::size_t d = i;  // the full stop
        if (key == "digits after point") {
            if (i == 0 || t_[i - 1] != U'.') return std::nullopt;
            d = i - 1;
        } else if (i >= t_.size() || t_[i] != U'.') {
            return std::nullopt;
        }
        auto const in_formula = [](char32_t c) {
            return is_letter(c) || is_digit(c) || subscript_value(c) >= 0 || c == U'(' || c == U')' ||
                   c == U'[' || c == U']' || c == U'.' || is_hydrate_dot(c) || is_vulgar(c);
        };
        if (d + 1 >= t_.size()) return std::nullopt;
        char32_t const next = t_[d + 1];
        if (!(is_upper(next) || next == U'(' || next == U'[' || is_digit(next) || is_vulgar(next)))
            return std::nullopt;
        // Before it: a formula (ending in a letter, a bracket or a count after one), not a coefficient.
        std::size_t k = d;
        while (k > 0 && (is_digit(t_[k - 1]) || subscript_value(t_[k - 1]) >= 0)) --k;
        if (k == 0 || !(is_letter(t_[k - 1]) || t_[k - 1] == U')' || t_[k - 1] == U']')) return std::nullopt;
        std::size_t first = d, last = d + 1;
        while (first > 0 && in_formula(t_[first - 1])) --first;
        while (last < t_.size() && in_formula(t_[last]) && !(t_[last] == U'(' && last + 1 < t_.size() &&
                                                              is_lower(t_[last + 1])))
            ++last;
        Text dot = t_.substr(first, last - first), star = dot;
        dot[d - first] = U'\u00B7';
        star[d - first] = U'*';
        return ParseError(d + 1, "a full stop is not a hydrate dot; for a hydrate write " + in_quotes(dot) +
                                     " or " + in_quotes(star));
    }

    ParseError species_expected(std::size_t i, char32_t c, bool at_end) const {
        static const char* generic = "expected a species (a formula such as H2O or a name such as ethanol)";
        Text arrow;
        if (mode_ == Mode::species) {
            if (!at_end && (is_digit(c) || is_vulgar(c))) {
                std::size_t j = i;
                while (j < t_.size() && is_number_char(t_[j])) ++j;
                return ParseError(i + 1, "expected a species without a coefficient, found " +
                                             in_quotes(t_.substr(i, j - i)));
            }
            if (!at_end && arrow_at(t_, i, &arrow))
                return ParseError(i + 1, "expected a species, found the arrow " + in_quotes(arrow));
            return ParseError(i + 1, generic);
        }
        std::size_t j = i;  // end of what precedes, whitespace skipped
        while (j > 0 && is_blank(t_[j - 1])) --j;
        if (j == 0) {
            if (!at_end && arrow_at(t_, i, &arrow))
                return ParseError(i + 1, "expected a species before the arrow " + in_quotes(arrow));
            if (c == U'+') return ParseError(i + 1, "expected a species before '+'");
            return ParseError(i + 1, generic);
        }
        char32_t const p = t_[j - 1];
        if (p == U'+') return ParseError(i + 1, "expected a species after '+'");
        if (is_number_char(p)) {
            std::size_t k = j;
            while (k > 0 && is_number_char(t_[k - 1])) --k;
            return ParseError(i + 1, "expected a species after the coefficient " + in_quotes(t_.substr(k, j - k)));
        }
        if (arrow_before(t_, j, &arrow))
            return ParseError(i + 1, "expected a species after the arrow " + in_quotes(arrow));
        return ParseError(i + 1, generic);
    }

    ParseError end_of_part(const std::string& key, std::size_t i, char32_t c, bool at_end) const {
        if (auto e = sign_before_space(i, at_end)) return *e;
        Text arrow;
        std::string const after = last_species(i);
        if (!at_end && is_sign(c) && c != U'+' && !arrow_at(t_, i, nullptr) && tr_.has_species() &&
            tr_.species_last() == t_.data() + i) {
            if (is_lower(*tr_.species_first()))
                return ParseError(i + 1, "unexpected " + describe(c) + " after the name " + after +
                                             ": a name has no charge, and a '-' inside a name joins two "
                                             "parts, as in 'n-octane'");
            return ParseError(i + 1, "a '-' directly after " + after +
                                         " is a charge only where the formula ends: before a space, "
                                         "'(', an arrow or the end of the text");
        }
        if (mode_ == Mode::number)
            return ParseError(i + 1, "expected the end of the text after the number");
        if (mode_ == Mode::species) {
            if (!at_end && arrow_at(t_, i, &arrow))
                return ParseError(i + 1, "expected a single species, found the arrow " + in_quotes(arrow) +
                                             " (a reaction)");
            if (c == U'+') return ParseError(i + 1, "expected a single species, found '+'");
            return ParseError(i + 1, "expected the end of the text after the species " + after);
        }
        if (key == "arrow")
            return ParseError(i + 1, "expected an arrow (->, =, \u2192, \u21CC ...) between reactants and products");
        if (!at_end && arrow_at(t_, i, &arrow))
            return ParseError(i + 1, "found a second arrow " + in_quotes(arrow) + "; a reaction has exactly one arrow");
        return ParseError(i + 1, "expected '+' or the end of the reaction after " + after);
    }

    /// "2H2+ O2": a sign directly after a formula and before whitespace is a charge, so the next
    /// species has no '+' before it. Reported at the sign, with the two ways to write it.
    /// Likewise "Fe+(OH)2": a sign before '(' is a charge, and '(' + uppercase is no phase.
    std::optional<ParseError> sign_before_space(std::size_t i, bool at_end) const {
        if (at_end || !tr_.has_species() || !starts_term(t_[i])) return std::nullopt;
        auto const e = std::size_t(tr_.species_last() - t_.data());  // one past the species
        if (e == 0 || e > i || !is_sign(t_[e - 1]) || is_lower(*tr_.species_first())) return std::nullopt;
        std::size_t d = e - 1;  // a caret charge ("Fe^3+ O2") is no trailing sign: just a missing '+'
        while (d > 0 && is_digit(t_[d - 1])) --d;
        if (d > 0 && t_[d - 1] == U'^') return std::nullopt;
        if (e == i) {
            if (t_[i] != U'(' || t_[e - 1] != U'+') return std::nullopt;
            Text const formula(tr_.species_first(), tr_.species_last() - 1);
            Text const next = word_at(t_, i);
            return ParseError(e, "'+' directly after " + in_quotes(formula) +
                                     " and before '(' is read as a charge; write " +
                                     in_quotes(formula + U" + " + next) + " to add the species");
        }
        for (std::size_t k = e; k < i; ++k)
            if (!is_blank(t_[k])) return std::nullopt;
        Text const sign = t_.substr(e - 1, 1);
        Text const formula(tr_.species_first(), tr_.species_last() - 1);
        Text const ion(tr_.species_first(), tr_.species_last());
        Text const next = word_at(t_, i);
        std::string m = "'" + utf8(sign) + "' directly after " + in_quotes(formula) +
                        " and before a space is read as a charge, so " + in_quotes(next) +
                        " has no '+' before it; ";
        if (t_[e - 1] == U'+')
            m += "write " + in_quotes(formula + U" + " + next) + " to add the species (or " +
                 in_quotes(ion + U" + " + next) + " if " + in_quotes(ion) + " is an ion)";
        else
            m += "write " + in_quotes(ion + U" + " + next) + " to add the ion";
        return ParseError(e, m);
    }

    std::string last_species(std::size_t i) const {
        if (!tr_.has_species() || tr_.species_last() > t_.data() + i) return "the species";
        return in_quotes(Text(tr_.species_first(), tr_.species_last()));
    }

    /// The bracket opening the group that encloses t[i] (pairing was checked by prepare()).
    std::size_t opening_bracket(std::size_t i) const {
        std::size_t depth = 0;
        for (std::size_t k = i; k > 0; --k) {
            char32_t const c = t_[k - 1];
            if (c == U')' || c == U']' || c == U'}') ++depth;
            if (c == U'(' || c == U'[' || c == U'{') {
                if (depth == 0) return k - 1;
                --depth;
            }
        }
        return 0;
    }

    Mode mode_;
    const Text& t_;
    const parser::Tracker& tr_;
};

// ---- syntax tree to public tree --------------------------------------------------------------

/// num/den, reduced (den > 0). Whole numbers, the common case, need no gcd.
Rational ratio(std::int64_t num, std::int64_t den) { return den == 1 ? Rational(num) : Rational(num, den); }

/// Exact value of "12.5" (ASCII); *had_point tells whether a decimal point was written.
/// prepare() has capped numbers at 12 digits, so the integers fit comfortably.
Rational decimal_value(std::u32string_view s, std::size_t& i, bool* had_point) {
    std::int64_t num = 0, den = 1;
    *had_point = false;
    for (; i < s.size(); ++i) {
        if (is_digit(s[i])) {
            num = num * 10 + (s[i] - U'0');
            if (*had_point) den *= 10;
        } else if (s[i] == U'.' && !*had_point) {
            *had_point = true;
        } else {
            break;
        }
    }
    return ratio(num, den);
}

/// Subscript digits to ASCII; other characters unchanged.
Text ascii_digits(std::u32string_view s) {
    Text out(s);
    for (char32_t& c : out)
        if (subscript_value(c) >= 0) c = U'0' + char32_t(subscript_value(c));
    return out;
}

/// "0.5" for fractions with a terminating decimal, else "a/b".
std::string rational_text(const Rational& r) {
    using boost::multiprecision::cpp_int;
    cpp_int const num = numerator(r);
    cpp_int const den = denominator(r);
    cpp_int d = den;
    int twos = 0, fives = 0;
    while (d % 2 == 0) d /= 2, ++twos;
    while (d % 5 == 0) d /= 5, ++fives;
    if (d != 1) return num.str() + "/" + den.str();
    int const places = std::max(twos, fives);
    cpp_int scaled = num;
    for (int k = 0; k < places; ++k) scaled *= 10;
    scaled /= den;
    std::string digits = scaled.str();
    if (places == 0) return digits;
    if (digits.size() <= std::size_t(places)) digits.insert(0, std::size_t(places) + 1 - digits.size(), '0');
    digits.insert(digits.size() - std::size_t(places), ".");
    return digits;
}

class Builder {
    /// The source range of the formula being built, as indices into the decoded text (for the
    /// corrected formula text that typo messages suggest).
    struct Where {
        std::size_t first, last;            ///< the formula, charge included
        std::size_t part_first, part_last;  ///< the items of the current part (no multiplier)
    };

public:
    Builder(const Text& t, const parser::Tracker& tracker) : t_(t), tr_(tracker) {}

    /// A number as the grammar accepted it: [sign] decimal [/ decimal | vulgar] | [sign] vulgar.
    Rational number(const Span& written, std::size_t position) const {
        std::u32string_view const s = view(written);
        std::size_t i = 0;
        bool negative = false;
        if (i < s.size() && is_sign(s[i])) negative = s[i++] != U'+';
        Rational value;
        if (i < s.size() && is_vulgar(s[i])) {
            auto const [n, d] = vulgar_value(s[i]);
            value = ratio(n, d);
        } else {
            bool point = false;
            Rational const whole = decimal_value(s, i, &point);
            if (i < s.size() && s[i] == U'/') {
                ++i;
                bool den_point = false;
                Rational const den = decimal_value(s, i, &den_point);
                if (point || den_point)
                    throw ParseError(position, "a fraction a/b needs whole numbers: " + in_quotes(s));
                if (den == 0) throw ParseError(position, "division by zero in " + in_quotes(s));
                value = whole / den;
            } else if (i < s.size() && is_vulgar(s[i])) {
                if (point)
                    throw ParseError(position, "a mixed number such as 1½ needs a whole number before the "
                                               "fraction: " + in_quotes(s));
                auto const [n, d] = vulgar_value(s[i]);
                value = whole + ratio(n, d);
            } else {
                value = whole;
            }
        }
        return negative ? Rational(-value) : value;
    }

    // Terms and species are built in place, in the vector's element and the term's member, not
    // built aside and moved in (a move and a destruction of four strings and a vector each).
    // `r`'s lists are emptied first and keep their storage.
    void reaction(const ast::Reaction& tree, Reaction& r) const {
        r.reactants.clear();
        r.products.clear();
        r.reactants.reserve(tree.reactants.size());
        r.products.reserve(tree.products.size());
        for (const auto& term : tree.reactants) this->term(term, r.reactants.emplace_back());
        for (const auto& term : tree.products) this->term(term, r.products.emplace_back());
        r.arrow = utf8(view(tree.arrow));
    }

    Species species(const ast::Species& tree) const {
        Species s;
        species(tree, s);
        return s;
    }

private:
    /// Fills `s`, a default-constructed Species.
    void species(const ast::Species& tree, Species& s) const {
        auto const range = tr_.position_of(tree);
        s.position = pos(range.begin());
        s.written = utf8(range.begin(), range.end());
        if (tree.phase) s.phase = phase(*tree.phase, range.end());
        if (auto const* name = boost::get<Span>(&tree.body.get())) {
            s.is_name = true;
            bool space = false;
            for (char32_t c : *name) {
                if (is_blank(c)) {
                    space = true;
                    continue;
                }
                if (space) s.name += ' ';
                space = false;
                append_utf8(s.name, c);
            }
        } else {
            formula(boost::get<ast::Formula>(tree.body.get()), s);
        }
    }

    std::size_t pos(Iter it) const { return std::size_t(it - t_.data()) + 1; }
    std::size_t start(const ast::Located& node) const { return pos(tr_.position_of(node).begin()); }

    /// Fills `term`, a default-constructed Term.
    void term(const ast::Term& tree, Term& term) const {
        term.position = start(tree);
        species(tree.species, term.species);
        if (tree.coefficient) {
            term.coefficient_written = true;
            term.coefficient = number(*tree.coefficient, term.position);
            if (term.coefficient == 0)
                throw ParseError(term.position, "a coefficient of zero is not allowed: " + in_quotes(*tree.coefficient));
        }
    }

    /// The phase's public name (a literal: assigned without building a string first).
    const char* phase(const Span& written, Iter species_end) const {
        std::u32string_view const word = view(written);
        std::size_t const position = pos(species_end) - word.size() - 2;  // at the '('
        if (word == U"g") return "g";
        if (word == U"l") return "l";
        if (word == U"s" || word == U"cr") return "s";
        if (word == U"aq") return "aq";
        throw ParseError(position, "unknown phase '(" + utf8(word) + ")': the phases are (g), (l), (s), "
                                   "(cr) (the same as (s)) and (aq)");
    }

    void formula(const ast::Formula& tree, Species& s) const {
        auto const range = tr_.position_of(tree);
        Where where{std::size_t(range.begin() - t_.data()), std::size_t(range.end() - t_.data()), 0, 0};
        Atoms before_last;  // s.atoms before the last part, to count that part alone
        for (std::size_t k = 0; k < tree.parts.size(); ++k) {
            const ast::Part& part = tree.parts[k];
            if (k > 0 && k + 1 == tree.parts.size()) before_last = s.atoms;  // (none before the first)
            where.part_first = item_first(part.items.front());
            where.part_last = std::size_t(tr_.position_of(part).end() - t_.data());
            Rational multiplier{1};
            if (k > 0) s.formula += '*';
            if (!part.multiplier.empty()) {
                multiplier = number(part.multiplier, start(part));
                if (multiplier == 0)
                    throw ParseError(start(part), "a hydrate multiplier of zero is not allowed: " +
                                                      in_quotes(part.multiplier));
                bool ascii = true;
                for (char32_t c : part.multiplier) ascii = ascii && (is_digit(c) || c == U'.');
                s.formula += ascii ? utf8(view(part.multiplier)) : rational_text(multiplier);
            }
            items(part.items, multiplier, s, where, true);
        }
        if (tree.charge) s.charge = charge(*tree.charge);
        mistyped_phase(tree.parts.back());
        zero_for_letter_o_at_end(tree.parts.back(), [&] { return part_atoms(s.atoms, before_last, tree.parts.back()); },
                                 where);
    }

    /// The atoms of one formula part per unit of it (its hydrate multiplier divided out): `after`
    /// less `before`, the totals before and after the part was added.
    Rational part_count(const Atoms& after, const Atoms& before, const char* symbol) const {
        Rational n{0};
        for (const auto& a : after)
            if (a.symbol == symbol) n += a.count;
        for (const auto& a : before)
            if (a.symbol == symbol) n -= a.count;
        return n;
    }
    struct PartAtoms {
        Rational C, H, N;
    };
    PartAtoms part_atoms(const Atoms& after, const Atoms& before, const ast::Part& part) const {
        Rational const m = part.multiplier.empty() ? Rational{1} : number(part.multiplier, start(part));
        return {part_count(after, before, "C") / m, part_count(after, before, "H") / m,
                part_count(after, before, "N") / m};
    }

    /// "H20", "Na20", "CuSO4·5H20": a count of 20 to 90 typed as the last thing of a formula, on
    /// an element other than O, is far more often "2O" with the letter O typed as a zero than a
    /// true count (common practice; the reading is refused rather than guessed). A true count is
    /// written with the element in a group, "C9(H)20", which this check does not look at.
    /// Exempt: O ("O2O" is no formula), C (carbon clusters such as C60 are written this way and
    /// a carbon oxide ending in "C6O" is rare), 10 ("H1O" is nobody's way of writing HO, while
    /// C4H10 and C5H10 are common), and subscript digits (typeset on purpose, not a slip).
    /// Also exempt: H in a part with carbon whose hydrogen count is one a molecule can have, at
    /// most 2·C + 2 + N (a saturated open chain: nonane C9H20, C14H30, C19H40 are real). Above
    /// that the zero is still read as a mistyped O: "CH20" (CH2O), "CH3CH20" (CH3CH2O, 23 H on 2 C).
    /// `part_atoms()` gives the last part's PartAtoms; it is called only for a count that may be a
    /// mistyped O (the common formula needs no per-part totals).
    template <typename PartAtomsOf>
    void zero_for_letter_o_at_end(const ast::Part& part, PartAtomsOf part_atoms, const Where& where) const {
        if (part.items.empty()) return;
        auto const* e = boost::get<ast::Element>(&part.items.back().get());
        if (!e || view(e->symbol) == U"O" || view(e->symbol) == U"C") return;
        std::u32string_view const n = view(e->count);
        if (n.size() != 2 || n[0] < U'2' || n[0] > U'9' || n[1] != U'0') return;
        if (view(e->symbol) == U"H") {
            PartAtoms const atoms = part_atoms();
            if (atoms.C > 0 && atoms.H <= 2 * atoms.C + 2 + atoms.N) return;
        }
        std::size_t const count_at = start(*e) - 1 + e->symbol.size();  // index of the count
        Text letter_o = formula_text(where);
        letter_o[count_at + 1 - where.first] = U'O';
        Text group = formula_text(where);
        group.replace(start(*e) - 1 - where.first, e->symbol.size(), U"(" + Text(view(e->symbol)) + U")");
        throw ParseError(count_at + 2, in_quotes(n) + " at the end of the formula is far more often the letter O "
                                       "typed as a zero; if you meant the letter O, write " +
                                           in_quotes(letter_o) + "; for a true count of " + utf8(n) +
                                           " write " + in_quotes(group));
    }

    /// "H2O(L)", "CH4(G)", "CaO(S)": a closing group of one bare G, L or S is a phase typed in
    /// uppercase (read literally it would be an element group); refused with the fix.
    void mistyped_phase(const ast::Part& part) const {
        if (part.items.empty()) return;
        auto const* g = boost::get<x3::forward_ast<ast::Group>>(&part.items.back().get());
        if (!g || g->get().open != U'(' || !g->get().count.empty() || g->get().items.size() != 1) return;
        auto const* e = boost::get<ast::Element>(&g->get().items.front().get());
        if (!e || !e->count.empty() || (view(e->symbol) != U"G" && view(e->symbol) != U"L" && view(e->symbol) != U"S")) return;
        std::string const upper = utf8(view(e->symbol));
        std::string const lower(1, char(upper[0] - 'A' + 'a'));
        throw ParseError(start(g->get()), "'(" + upper + ")' would be a group of the element " + upper +
                                              "; phases are written in lowercase: (" + lower + ")");
    }

    /// items() at the top level of a part (not inside a bracket): where a full stop is ambiguous.
    template <typename Items>
    void items(const Items& items, const Rational& multiplier, Species& s,
               const Where& where, bool top_level) const {
        for (std::size_t k = 0; k < items.size(); ++k) {
            const ast::Item& item = items[k];
            bool const more = top_level && k + 1 < items.size();  // more formula follows in this part
            if (auto const* e = boost::get<ast::Element>(&item.get())) {
                Rational n{1};
                if (!e->count.empty()) n = count(e->count, start(*e) + e->symbol.size(), where, more);
                append_formula_text(s.formula, e->symbol, e->count);
                add_atom(s.atoms, e->symbol, multiplier == 1 ? n : n * multiplier, start(*e));
            } else {
                const ast::Group& g = boost::get<x3::forward_ast<ast::Group>>(item.get()).get();
                Rational n{1};
                if (!g.count.empty())
                    n = count(g.count, pos(tr_.position_of(g).end()) - g.count.size(), where, more);
                s.formula += g.open == U'[' ? '[' : '(';
                this->items(g.items, multiplier == 1 ? n : n * multiplier, s, where, false);
                s.formula += g.open == U'[' ? ']' : ')';
                append_formula_text(s.formula, Span(), g.count);
            }
        }
    }

    /// A count as written at 1-based `position`. `more`: more formula follows it at the top level
    /// of its part, where "4.5" could also be "4" and a hydrate part "5..." typed with a full stop.
    Rational count(const Span& span, std::size_t position, const Where& where, bool more) const {
        std::u32string_view const written = view(span);
        leading_zero(written, position, where);
        Text ascii;  // subscript digits as ASCII, only when there are any
        std::u32string_view digits = written;
        if (subscript_value(written[0]) >= 0) digits = ascii = ascii_digits(written);
        std::size_t i = 0;
        bool point = false;
        Rational const n = decimal_value(digits, i, &point);
        if (n == 0) throw ParseError(position, "a count of zero is not allowed: " + in_quotes(written));
        if (point && more && n >= 1) full_stop_between_parts(written, position, where);
        return n;
    }

    /// "C02", "CO02", "Ca(OH)02", "C₀₂": no count starts with a zero unless it is a decimal below
    /// one ("0.947"), so the zero is the letter O mistyped. The suggestion turns every leading
    /// zero into an O except one kept before a decimal point ("Fe00.5" -> "FeO0.5"). A lone "0"
    /// is left to the zero-count message.
    void leading_zero(std::u32string_view written, std::size_t position, const Where& where) const {
        auto const zero = [](char32_t c) { return c == U'0' || c == U'\u2080'; };
        auto const digit = [](char32_t c) { return is_digit(c) || subscript_value(c) >= 0; };
        if (written.size() < 2 || !zero(written[0]) || !digit(written[1])) return;
        Text fixed = formula_text(where);
        std::size_t const at = position - 1 - where.first;
        for (std::size_t k = 0; k < written.size() && zero(written[k]); ++k)
            if (k + 1 == written.size() || written[k + 1] != U'.') fixed[at + k] = U'O';
        throw ParseError(position, in_quotes(written) + " starts with a zero; if you meant the letter O, write " +
                                       in_quotes(fixed));
    }

    /// "CuSO4.5H2O", "Na2CO3.10H2O", "Ba(OH)2.8H2O": a decimal count of one or more followed by
    /// more formula at the top level of a part reads as well as a hydrate typed with a full stop
    /// (a count below one cannot: "Fe0.947O" as a hydrate would have a count of zero). Refused,
    /// with both ways to write it: a hydrate dot, or brackets, inside which no hydrate dot can be.
    void full_stop_between_parts(std::u32string_view written, std::size_t position, const Where& where) const {
        std::size_t const point_at = position - 1 + written.find(U'.');  // index of the '.' in t_
        Text const text = formula_text(where);
        Text dot = text, star = text, bracketed = text;
        bracketed.insert(where.part_last - where.first, U")");
        bracketed.insert(where.part_first - where.first, U"(");
        dot[point_at - where.first] = U'\u00B7';
        star[point_at - where.first] = U'*';
        throw ParseError(point_at + 1, "the full stop in " + in_quotes(written) +
                                           " could be a decimal point or a hydrate dot; for a hydrate write " +
                                           in_quotes(dot) + " or " + in_quotes(star) + ", for a count of " +
                                           utf8(written) + " put the formula in brackets: " +
                                           in_quotes(bracketed));
    }

    /// Index in t_ of an item's first character.
    std::size_t item_first(const ast::Item& item) const {
        if (auto const* e = boost::get<ast::Element>(&item.get())) return start(*e) - 1;
        return start(boost::get<x3::forward_ast<ast::Group>>(item.get()).get()) - 1;
    }

    Text formula_text(const Where& where) const { return t_.substr(where.first, where.last - where.first); }

    /// An element symbol is ASCII letters (the grammar's `upper >> -lower`).
    static void add_atom(Atoms& atoms, const Span& symbol, const Rational& n, std::size_t position) {
        auto const same = [&](const std::string& a) {
            if (a.size() != std::size_t(symbol.size())) return false;
            for (std::size_t k = 0; k < a.size(); ++k)
                if (char32_t(a[k]) != symbol[std::ptrdiff_t(k)]) return false;
            return true;
        };
        for (Atom& a : atoms)
            if (same(a.symbol)) {
                a.count += n;
                return;
            }
        atoms.push_back(Atom{std::string(symbol.begin(), symbol.end()), n, position});
    }

    /// The formula's ASCII text: the symbol (ASCII letters) and the count, subscript digits as ASCII.
    static void append_formula_text(std::string& out, const Span& symbol, const Span& count) {
        for (char32_t c : symbol) out += char(c);
        for (char32_t c : count) out += subscript_value(c) >= 0 ? char('0' + subscript_value(c)) : char(c);
    }

    int charge(const ast::Charge& c) const {
        int magnitude = 1;
        if (!c.magnitude.empty()) {
            magnitude = 0;
            for (char32_t d : c.magnitude) {
                int const v = is_digit(d) ? int(d - U'0') : superscript_value(d);
                magnitude = magnitude * 10 + v;
                if (magnitude > 99) throw ParseError(start(c), "a charge may be at most 99");
            }
            if (magnitude == 0)
                throw ParseError(start(c), "a charge of zero is not allowed; leave the charge out");
        }
        bool const negative = c.sign == U'-' || c.sign == U'\u2212' || c.sign == U'\u207B';
        return negative ? -magnitude : magnitude;
    }

    const Text& t_;
    const parser::Tracker& tr_;
};

/// Room for the terms of each side before the grammar runs, so a side of thousands of terms is
/// not moved to a larger block again and again (a term of the syntax tree is some 460 bytes):
/// at most one more term than '+' signs before the first arrow character, and after it (counted
/// by prepare()). Only a capacity: the grammar decides what the terms are.
void reserve_sides(const Counts& counts, ast::Reaction& tree) {
    tree.reactants.reserve(counts.plus_before + 1);
    tree.products.reserve(counts.plus_after + 1);
}

template <typename Rule, typename Tree>
void run(Mode mode, const Text& t, Rule const& rule, Tree& tree, parser::Tracker& tracker) {
    Iter first = t.data();
    Iter const last = t.data() + t.size();
    bool const ok = x3::parse(first, last, x3::with<parser::tracker_tag>(tracker)[rule], tree);
    if (!ok || first != last) throw Diagnosis(mode, t, tracker).error();
}

}  // namespace

Reaction parse_reaction(std::string_view text) {
    Reaction r;
    parse_reaction(text, r);
    return r;
}

void parse_reaction(std::string_view text, Reaction& out) {
    // The decoded text in a buffer kept per thread, as the tree below: nothing the result holds
    // points into it (the Builder copies what it keeps), and no parse runs inside another.
    thread_local Text decoded;
    Counts counts;
    prepare(text, Mode::reaction, decoded, &counts);
    Text const& t = decoded;
    parser::Tracker tracker;
    // One tree per thread, its storage kept from call to call: a side of thousands of terms
    // (some 460 bytes each) would otherwise be a fresh block of up to 1 MB each time, which the C
    // library may map anew and the kernel fault in page by page (measured: 0.9 ms or 6 ms for the
    // same 2,000-term input, by the allocator's state). Held: at most the largest input's tree.
    thread_local ast::Reaction tree;
    tree.reactants.clear();
    tree.products.clear();
    tree.arrow = {};
    reserve_sides(counts, tree);
    tracker.build(&tree);
    run(Mode::reaction, t, parser::reaction(), tree.arrow, tracker);
    Builder(t, tracker).reaction(tree, out);
}

Species parse_species(std::string_view text) {
    Text const t = prepare(text, Mode::species);
    parser::Tracker tracker;
    ast::Species tree;
    run(Mode::species, t, parser::species_only(), tree, tracker);
    return Builder(t, tracker).species(tree);
}

Rational parse_number(std::string_view text) {
    Text const t = prepare(text, Mode::number);
    parser::Tracker tracker;
    Span tree;
    run(Mode::number, t, parser::number_only(), tree, tracker);
    std::size_t i = 0;
    while (i < t.size() && is_blank(t[i])) ++i;
    return Builder(t, tracker).number(tree, i + 1);
}

}  // namespace rxnheat::grammar
