#include "uno_values.hpp"

#include <algorithm>
#include <cstddef>
#include <utility>
#include <vector>

namespace rxnheat::addin {

namespace {

using Rows = uno::Sequence<uno::Sequence<uno::Any>>;

std::string quoted(const std::string& name) { return "'" + name + "'"; }

std::string utf8(const OUString& s, const std::string& name) {
    std::string out;
    if (!to_utf8(s, out))
        throw ValueError(quoted(name) + " contains a character that is not valid Unicode (a lone UTF-16 surrogate)");
    return out;
}

/// The cell a scalar UNO value is; false when it is no scalar (a sequence or another type).
bool scalar_cell(const uno::Any& v, const std::string& name, Cell& out) {
    switch (v.getValueTypeClass()) {
    case uno::TypeClass_VOID:
        out = Cell{};
        return true;
    case uno::TypeClass_STRING:
        out = Cell::of(utf8(*static_cast<const OUString*>(v.getValue()), name));
        return true;
    case uno::TypeClass_BOOLEAN:
        out = Cell::of(*static_cast<const sal_Bool*>(v.getValue()) ? 1.0 : 0.0);
        return true;
    case uno::TypeClass_DOUBLE:
    case uno::TypeClass_FLOAT:
    case uno::TypeClass_BYTE:
    case uno::TypeClass_SHORT:
    case uno::TypeClass_UNSIGNED_SHORT:
    case uno::TypeClass_LONG:
    case uno::TypeClass_UNSIGNED_LONG:
    case uno::TypeClass_HYPER:
    case uno::TypeClass_UNSIGNED_HYPER: {
        double d = 0;
        v >>= d;  // the widening conversions UNO defines for every numeric type
        out = Cell::of(d);
        return true;
    }
    default:
        return false;
    }
}

std::string type_name(const uno::Any& v, const std::string& name) {
    std::string t;
    if (!to_utf8(v.getValueTypeName(), t)) t = "?";
    return quoted(name) + " is a value of UNO type " + t + ", which is no spreadsheet value";
}

Answer from_outcome_error(const Outcome& o) {
    Answer a;
    a.kind = o.error == ErrorKind::internal ? Answer::Kind::internal : Answer::Kind::bad_input;
    a.message = o.text;
    a.argument = o.argument > 0 ? static_cast<int>(o.argument) - 1 : -1;
    return a;
}

}  // namespace

HostRules calc_rules() {
    HostRules r;
    r.zero_is_blank = true;
    r.host_name = "Calc add-in";
    return r;
}

Arg to_arg(const uno::Any& value, const std::string& name) {
    Cell cell;
    if (scalar_cell(value, name, cell))
        return value.getValueTypeClass() == uno::TypeClass_VOID ? Arg::omitted() : Arg::of(std::move(cell));
    if (value.getValueType() != cppu::UnoType<Rows>::get()) throw ValueError(type_name(value, name));
    const Rows& rows = *static_cast<const Rows*>(value.getValue());
    std::size_t cols = 0;
    for (const auto& row : rows) cols = std::max(cols, static_cast<std::size_t>(row.getLength()));
    const std::size_t n_rows = static_cast<std::size_t>(rows.getLength());
    std::vector<Cell> cells(n_rows * cols);
    for (std::size_t r = 0; r < n_rows; ++r) {
        const auto& row = rows[static_cast<sal_Int32>(r)];
        for (sal_Int32 c = 0; c < row.getLength(); ++c) {
            const uno::Any& v = row[c];
            if (scalar_cell(v, name, cells[r * cols + static_cast<std::size_t>(c)])) continue;
            const std::string where = " (row " + std::to_string(r + 1) + ", column " + std::to_string(c + 1) + ")";
            if (v.getValueTypeClass() == uno::TypeClass_SEQUENCE)
                throw ValueError(quoted(name) + " holds a range inside a range" + where +
                                 "; give a plain cell range");
            throw ValueError(type_name(v, name) + where);
        }
    }
    if (n_rows == 0 || cols == 0) throw ValueError(quoted(name) + " is an empty range");
    return Arg::range(n_rows, cols, std::move(cells));
}

uno::Any to_any(const Outcome& o) {
    switch (o.kind) {
    case Outcome::Kind::empty: return uno::Any();
    case Outcome::Kind::number: return uno::Any(o.number);
    case Outcome::Kind::text: return uno::Any(from_utf8(o.text));
    case Outcome::Kind::error: return uno::Any(error_element(o.error == ErrorKind::internal));
    }
    return uno::Any();
}

Answer answer(const FunctionSpec& f, std::initializer_list<const uno::Any*> args, const uno::Sequence<uno::Any>* rest,
              Engine& engine) {
    std::vector<Arg> given;
    given.reserve(args.size() + (rest ? static_cast<std::size_t>(rest->getLength()) : 0));
    try {
        std::size_t i = 0;
        for (const uno::Any* a : args) {
            given.push_back(to_arg(*a, i < f.args.size() ? f.args[i].name : "argument " + std::to_string(i + 1)));
            ++i;
        }
        if (rest) {
            const std::string list = f.args.empty() ? std::string("arguments") : std::string(f.args.back().name);
            for (sal_Int32 k = 0; k < rest->getLength(); ++k)
                given.push_back(to_arg((*rest)[k], list + " " + std::to_string(k + 1)));
        }
    } catch (const ValueError& e) {
        // A value no cell can hold fails the call like any other bad argument; a function whose
        // answer is every problem in words (RXNCHECK, RXNWHY) says so in words.
        if (f.errors_as_text) return Answer{Answer::Kind::value, uno::Any(from_utf8(e.what())), {}, -1};
        return Answer{Answer::Kind::bad_input, {}, e.what(), static_cast<int>(given.size())};
    }

    const Result r = evaluate(f, given, calc_rules(), engine);
    if (!r.is_array()) {
        const Outcome& o = r.single();
        if (o.kind == Outcome::Kind::error) return from_outcome_error(o);
        return Answer{Answer::Kind::value, to_any(o), {}, -1};
    }
    Rows out(static_cast<sal_Int32>(r.rows));
    uno::Sequence<uno::Any>* out_rows = out.getArray();
    for (std::size_t row = 0; row < r.rows; ++row) {
        uno::Sequence<uno::Any> cells(static_cast<sal_Int32>(r.cols));
        uno::Any* c = cells.getArray();
        for (std::size_t col = 0; col < r.cols; ++col) c[col] = to_any(r.cells[row * r.cols + col]);
        out_rows[row] = std::move(cells);
    }
    return Answer{Answer::Kind::value, uno::Any(out), {}, -1};
}

}  // namespace rxnheat::addin
