#include "noop_args.hpp"

#include <rtl/string.hxx>
#include <rtl/textenc.h>
#include <rtl/textcvt.h>

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <limits>
#include <utility>

namespace rxnheat_addin {

namespace {

using Rows = uno::Sequence<uno::Sequence<uno::Any>>;

bool is_space(char c) { return c == ' ' || c == '\t' || c == '\r' || c == '\n'; }

std::string trimmed(std::string s) {
    std::size_t b = 0, e = s.size();
    while (b < e && is_space(s[b])) ++b;
    while (e > b && is_space(s[e - 1])) --e;
    return s.substr(b, e - b);
}

std::string quoted(const char* name) { return std::string("'") + name + "'"; }

// Shortest decimal text that reads back as the same double (cells of a species table).
std::string number_text(double v) {
    char buf[40];
    for (int precision = 15; precision <= 17; ++precision) {
        std::snprintf(buf, sizeof buf, "%.*g", precision, v);
        if (std::strtod(buf, nullptr) == v) break;
    }
    return buf;
}

}  // namespace

std::string to_utf8(const OUString& text, int position) {
    std::string out;
    if (!rxnheat::addin::to_utf8(text, out))
        throw ArgError("the text contains a character that is not valid Unicode "
                       "(a lone UTF-16 surrogate)",
                       position);
    return out;
}

Given classify(const uno::Any& value) {
    switch (value.getValueTypeClass()) {
    case uno::TypeClass_VOID:
        return Given::nothing;
    case uno::TypeClass_STRING:
        return Given::text;
    case uno::TypeClass_DOUBLE:
    case uno::TypeClass_FLOAT:
    case uno::TypeClass_LONG:
    case uno::TypeClass_UNSIGNED_LONG:
    case uno::TypeClass_SHORT:
    case uno::TypeClass_UNSIGNED_SHORT:
    case uno::TypeClass_HYPER:
    case uno::TypeClass_UNSIGNED_HYPER:
    case uno::TypeClass_BYTE:
    case uno::TypeClass_BOOLEAN:
        return Given::number;
    case uno::TypeClass_SEQUENCE:
        if (value.getValueType() == cppu::UnoType<Rows>::get()) return Given::range;
        [[fallthrough]];
    default:
        break;
    }
    throw ArgError("unexpected kind of value from the spreadsheet (" +
                           to_utf8(value.getValueTypeName()) + ")",
                   -1);
}

bool is_blank(const uno::Any& value) {
    switch (classify(value)) {
    case Given::nothing:
        return true;
    case Given::number: {
        double d = 0;
        value >>= d;
        return d == 0;
    }
    case Given::text: {
        OUString s;
        value >>= s;
        return s.trim().isEmpty();
    }
    case Given::range:
        return false;
    }
    return false;
}

const uno::Any& single_value(const uno::Any& value, const char* name, int position) {
    if (classify(value) != Given::range) return value;
    const Rows* rows = static_cast<const Rows*>(value.getValue());
    if (rows->getLength() == 1 && (*rows)[0].getLength() == 1) return (*rows)[0][0];
    std::size_t cells = 0;
    for (const auto& row : *rows) cells += static_cast<std::size_t>(row.getLength());
    throw ArgError(quoted(name) + " must be a single value, not a range of " +
                       std::to_string(cells) + " cells",
                   position);
}

NumberOrText number_or_text_arg(const uno::Any& raw, const char* name, int position) {
    const uno::Any& value = single_value(raw, name, position);
    NumberOrText out;
    if (is_blank(value)) return out;
    if (classify(value) == Given::number) {
        value >>= out.number;
        if (!std::isfinite(out.number))
            throw ArgError(quoted(name) + " is not a finite number", position);
        out.kind = Given::number;
        return out;
    }
    OUString s;
    value >>= s;
    out.text = trimmed(to_utf8(s, position));
    out.kind = Given::text;
    return out;
}

std::string text_arg(const uno::Any& raw, const char* name, int position) {
    const uno::Any& value = single_value(raw, name, position);
    if (is_blank(value)) return {};
    if (classify(value) == Given::number)
        throw ArgError(quoted(name) + " must be text, not a number", position);
    OUString s;
    value >>= s;
    return trimmed(to_utf8(s, position));
}

std::string required_text_arg(const uno::Any& raw, const char* name, int position) {
    std::string s = text_arg(raw, name, position);
    if (s.empty()) throw ArgError(quoted(name) + " is required but empty", position);
    return s;
}

double number_arg(const uno::Any& raw, const char* name, int position, double fallback) {
    const uno::Any& value = single_value(raw, name, position);
    if (is_blank(value)) return fallback;
    return required_number_arg(value, name, position);
}

double required_number_arg(const uno::Any& raw, const char* name, int position) {
    const uno::Any& value = single_value(raw, name, position);
    switch (classify(value)) {
    case Given::nothing:
        throw ArgError(quoted(name) + " is required", position);
    case Given::text:
        throw ArgError(quoted(name) + " must be a number, not text", position);
    default:
        break;
    }
    double d = 0;
    value >>= d;
    if (!std::isfinite(d)) throw ArgError(quoted(name) + " is not a finite number", position);
    return d;
}

std::vector<std::vector<std::string>> range_texts(const uno::Any& value, const char* name,
                                                  int position) {
    const Rows* cells = static_cast<const Rows*>(value.getValue());
    std::vector<std::vector<std::string>> rows;
    rows.reserve(static_cast<std::size_t>(cells->getLength()));
    for (const auto& cell_row : *cells) {
        std::vector<std::string> row;
        row.reserve(static_cast<std::size_t>(cell_row.getLength()));
        for (const auto& cell : cell_row) {
            std::string text;
            switch (classify(cell)) {
            case Given::nothing:
                break;
            case Given::number: {
                double d = 0;
                cell >>= d;
                text = number_text(d);
                break;
            }
            case Given::text: {
                OUString s;
                cell >>= s;
                text = to_utf8(s, position);
                break;
            }
            case Given::range:
                throw ArgError(quoted(name) + ": nested range", position);
            }
            row.push_back(std::move(text));
        }
        rows.push_back(std::move(row));
    }
    return rows;
}

}  // namespace rxnheat_addin
