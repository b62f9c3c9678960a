// The C ABI (rxnheat.h) over rxnheat::Engine. No exception crosses this boundary.
#include "rxnheat/rxnheat.h"

#include "rxnheat/catalogue.hpp"
#include "rxnheat/rxnheat.hpp"

#include <cmath>
#include <cstring>
#include <limits>
#include <memory>
#include <new>
#include <string>
#include <vector>

struct rxnheat_engine {
    rxnheat::Engine* engine;
};

struct rxnheat_table {
    std::shared_ptr<const rxnheat::SpeciesTable> table;
};

namespace {

void copy_text(const std::string& s, char* buf, size_t size) {
    if (!buf || size == 0) return;
    const size_t n = s.size() < size - 1 ? s.size() : size - 1;
    std::memcpy(buf, s.data(), n);
    buf[n] = '\0';
}

rxnheat_status status_of(rxnheat::ErrorKind k) {
    return static_cast<rxnheat_status>(rxnheat::error_kind_info(k).c_status);
}

std::string_view sv(const char* s) { return s ? std::string_view(s) : std::string_view(); }

template <class F>
rxnheat_status guarded(char* err, size_t err_size, F&& f) {
    try {
        f();
        copy_text("", err, err_size);
        return RXNHEAT_OK;
    } catch (const rxnheat::Error& e) {
        copy_text(e.what(), err, err_size);
        return status_of(e.kind());
    } catch (const std::bad_alloc&) {
        copy_text("out of memory", err, err_size);
        return RXNHEAT_E_INTERNAL;
    } catch (const std::exception& e) {
        copy_text(std::string("internal error: ") + e.what(), err, err_size);
        return RXNHEAT_E_INTERNAL;
    } catch (...) {
        copy_text("internal error", err, err_size);
        return RXNHEAT_E_INTERNAL;
    }
}

rxnheat_status text_result(const std::string& s, char* out, size_t out_size) {
    copy_text(s, out, out_size);
    return (out && s.size() < out_size) ? RXNHEAT_OK : RXNHEAT_E_TRUNCATED;
}

rxnheat::Engine& engine_of(rxnheat_engine* h) {
    if (!h || !h->engine) throw rxnheat::Error(rxnheat::ErrorKind::argument, "no engine handle (call rxnheat_open)");
    return *h->engine;
}

void need(const char* s, const char* what) {
    if (!s) throw rxnheat::Error(rxnheat::ErrorKind::argument, std::string(what) + " is missing");
}

template <class F>
rxnheat_status text_call(char* out, size_t out_size, char* err, size_t err_size, F&& f) {
    std::string s;
    const rxnheat_status st = guarded(err, err_size, [&] { s = f(); });
    if (st != RXNHEAT_OK) {
        copy_text("", out, out_size);
        return st;
    }
    return text_result(s, out, out_size);
}

/// What the C interface tells the catalogue about its values: 0 is 0, text is not a number.
const rxnheat::HostRules& c_rules() {
    static const rxnheat::HostRules rules{false, false, "C interface"};
    return rules;
}

std::vector<const rxnheat::FunctionSpec*> c_functions() {
    std::vector<const rxnheat::FunctionSpec*> v;
    for (const auto& f : rxnheat::catalogue())
        if (f.in(rxnheat::layer_c)) v.push_back(&f);
    return v;
}

const std::vector<const rxnheat::FunctionSpec*>& listed() {
    static const std::vector<const rxnheat::FunctionSpec*> v = c_functions();
    return v;
}

const rxnheat::FunctionSpec& function_named(const char* name) {
    need(name, "the function name");
    const rxnheat::FunctionSpec* f = rxnheat::find_function(name);
    if (!f || !f->in(rxnheat::layer_c)) {
        std::string list;
        for (const auto* g : listed()) list += std::string(list.empty() ? "" : ", ") + g->calc_name;
        throw rxnheat::Error(rxnheat::ErrorKind::argument,
                             "there is no rxnheat function '" + std::string(name) + "'; the functions are " + list);
    }
    return *f;
}

/// The C values as catalogue arguments. A value the C side got wrong (an unknown kind, a NULL
/// pointer) is an error naming the argument, never read as "omitted"; *at_fault gets its
/// 1-based position.
std::vector<rxnheat::Arg> args_of(const rxnheat_value* args, size_t nargs, size_t* at_fault) {
    using rxnheat::Arg;
    if (nargs > 0 && !args)
        throw rxnheat::Error(rxnheat::ErrorKind::argument, "the arguments are missing (args is NULL, nargs is " +
                                                               std::to_string(nargs) + ")");
    std::vector<Arg> v;
    v.reserve(nargs);
    for (size_t i = 0; i < nargs; ++i) {
        const rxnheat_value& a = args[i];
        const std::string which = "argument " + std::to_string(i + 1);
        *at_fault = i + 1;
        switch (a.kind) {
        case RXNHEAT_VALUE_OMITTED: v.push_back(Arg::omitted()); break;
        case RXNHEAT_VALUE_NUMBER: v.push_back(Arg::of(a.number)); break;
        case RXNHEAT_VALUE_TEXT:
            if (!a.text) throw rxnheat::Error(rxnheat::ErrorKind::argument, which + " is text but its pointer is NULL");
            v.push_back(Arg::of(std::string(a.text)));
            break;
        case RXNHEAT_VALUE_TABLE:
            if (!a.table || !a.table->table)
                throw rxnheat::Error(rxnheat::ErrorKind::argument, which + " is a table but its handle is NULL");
            v.push_back(Arg::of(a.table->table));
            break;
        default:
            throw rxnheat::Error(rxnheat::ErrorKind::argument,
                                 which + " has an unknown kind " + std::to_string(a.kind) +
                                     " (use RXNHEAT_VALUE_OMITTED, _NUMBER, _TEXT or _TABLE)");
        }
    }
    *at_fault = 0;
    return v;
}

void clear_result(rxnheat_result* out) {
    if (!out) return;
    out->kind = RXNHEAT_RESULT_NONE;
    out->number = std::numeric_limits<double>::quiet_NaN();
    out->unit[0] = '\0';
    out->text_length = 0;
    out->argument = 0;
}

template <class Make>
rxnheat_status table_result(rxnheat_table** table, char* err, size_t err_size, Make&& make) {
    if (table) *table = nullptr;
    return guarded(err, err_size, [&] {
        if (!table) throw rxnheat::Error(rxnheat::ErrorKind::argument, "nowhere to put the table (table is NULL)");
        auto t = std::make_shared<const rxnheat::SpeciesTable>(make());
        *table = new rxnheat_table{std::move(t)};
    });
}

}  // namespace

extern "C" {

rxnheat_engine* rxnheat_open(void) {
    try {
        return new rxnheat_engine{&rxnheat::Engine::shared()};
    } catch (...) {
        return nullptr;
    }
}

void rxnheat_close(rxnheat_engine* engine) { delete engine; }

const char* rxnheat_version(void) {
    try {
        static const std::string v = rxnheat::Engine::version();
        return v.c_str();
    } catch (...) {
        return "rxnheat (version unavailable)";
    }
}

rxnheat_status rxnheat_parse_temperature(const char* text, double* kelvin, char* err, size_t err_size) {
    return guarded(err, err_size, [&] {
        need(text, "the temperature");
        const double k = rxnheat::parse_temperature(text);
        if (kelvin) *kelvin = k;
    });
}

rxnheat_status rxnheat_dh(rxnheat_engine* h, const char* reaction, double T, const char* unit, const char* per,
                          double* out, char* err, size_t err_size) {
    return guarded(err, err_size, [&] {
        need(reaction, "the reaction");
        const double v = engine_of(h).dh(reaction, T, unit ? sv(unit) : "kJ/mol", sv(per));
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_du(rxnheat_engine* h, const char* reaction, double T, const char* unit, const char* per,
                          double* out, char* err, size_t err_size) {
    return guarded(err, err_size, [&] {
        need(reaction, "the reaction");
        const double v = engine_of(h).du(reaction, T, unit ? sv(unit) : "kJ/mol", sv(per));
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_load(rxnheat_engine* h, const char* reaction, double quantity, const char* quantity_unit,
                            const char* key, const char* result_unit, double T, double* out, char* err,
                            size_t err_size) {
    return guarded(err, err_size, [&] {
        need(reaction, "the reaction");
        need(quantity_unit, "the quantity unit");
        need(key, "the key species");
        const double v = engine_of(h).load(reaction, quantity, quantity_unit, key, sv(result_unit), T);
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_kind(rxnheat_engine* h, const char* reaction, double T, double tolerance_kJ, char* out,
                            size_t out_size, char* err, size_t err_size) {
    return text_call(out, out_size, err, err_size, [&] {
        need(reaction, "the reaction");
        return std::string(rxnheat::to_string(engine_of(h).kind(reaction, T, tolerance_kJ)));
    });
}

rxnheat_status rxnheat_check(rxnheat_engine* h, const char* reaction, double T, char* out, size_t out_size) {
    std::string s;
    try {
        s = reaction ? engine_of(h).check(reaction, T) : std::string("the reaction is missing");
    } catch (const std::exception& e) {
        s = e.what();
    } catch (...) {
        s = "internal error";
    }
    return text_result(s, out, out_size);
}

rxnheat_status rxnheat_balance(rxnheat_engine* h, const char* reaction, char* out, size_t out_size, char* err,
                               size_t err_size) {
    return text_call(out, out_size, err, err_size, [&] {
        need(reaction, "the reaction");
        return engine_of(h).balance(reaction);
    });
}

rxnheat_status rxnheat_reverse(rxnheat_engine* h, const char* reaction, char* out, size_t out_size, char* err,
                               size_t err_size) {
    return text_call(out, out_size, err, err_size, [&] {
        need(reaction, "the reaction");
        return engine_of(h).reverse(reaction);
    });
}

rxnheat_status rxnheat_scale(rxnheat_engine* h, const char* reaction, const char* factor, char* out,
                             size_t out_size, char* err, size_t err_size) {
    return text_call(out, out_size, err, err_size, [&] {
        need(reaction, "the reaction");
        need(factor, "the factor");
        return engine_of(h).scale(reaction, std::string_view(factor));
    });
}

rxnheat_status rxnheat_source(rxnheat_engine* h, const char* text, char* out, size_t out_size, char* err,
                              size_t err_size) {
    return text_call(out, out_size, err, err_size, [&] {
        need(text, "the reaction or species");
        return engine_of(h).source(text);
    });
}

rxnheat_status rxnheat_species_hf(rxnheat_engine* h, const char* species, double T, const char* unit, double* out,
                                  char* err, size_t err_size) {
    return guarded(err, err_size, [&] {
        need(species, "the species");
        const double v = engine_of(h).species_hf(species, T, unit ? sv(unit) : "kJ/mol");
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_species_cp(rxnheat_engine* h, const char* species, double T, double* out, char* err,
                                  size_t err_size) {
    return guarded(err, err_size, [&] {
        need(species, "the species");
        const double v = engine_of(h).species_cp(species, T);
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_species_h(rxnheat_engine* h, const char* species, double T, double Tref, double* out,
                                 char* err, size_t err_size) {
    return guarded(err, err_size, [&] {
        need(species, "the species");
        const double v = engine_of(h).species_h(species, T, Tref);
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_species_s(rxnheat_engine* h, const char* species, double T, double* out, char* err,
                                 size_t err_size) {
    return guarded(err, err_size, [&] {
        need(species, "the species");
        const double v = engine_of(h).species_s(species, T);
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_molar_mass(rxnheat_engine* h, const char* formula, double* out, char* err, size_t err_size) {
    return guarded(err, err_size, [&] {
        need(formula, "the formula");
        const double v = engine_of(h).molar_mass(formula);
        if (out) *out = v;
    });
}

rxnheat_status rxnheat_table_from_csv(const char* path, rxnheat_table** table, char* err, size_t err_size) {
    return table_result(table, err, err_size, [&] {
        need(path, "the species table file name");
        return rxnheat::SpeciesTable::from_csv_file(path);
    });
}

rxnheat_status rxnheat_table_from_rows(const char* const* cells, size_t rows, size_t cols, rxnheat_table** table,
                                       char* err, size_t err_size) {
    return table_result(table, err, err_size, [&] {
        if (rows == 0 || cols == 0)
            throw rxnheat::Error(rxnheat::ErrorKind::table, "the species table is empty (it needs a header row)");
        if (!cells) throw rxnheat::Error(rxnheat::ErrorKind::argument, "the table cells are missing (cells is NULL)");
        std::vector<std::vector<std::string>> v(rows);
        for (size_t r = 0; r < rows; ++r)
            for (size_t c = 0; c < cols; ++c) {
                const char* cell = cells[r * cols + c];
                v[r].emplace_back(cell ? cell : "");
            }
        return rxnheat::SpeciesTable::from_rows(v);
    });
}

void rxnheat_table_close(rxnheat_table* table) { delete table; }

rxnheat_status rxnheat_call(rxnheat_engine* h, const char* function, const rxnheat_value* args, size_t nargs,
                            rxnheat_result* out, char* text, size_t text_size, char* err, size_t err_size) {
    clear_result(out);
    copy_text("", text, text_size);
    rxnheat::Outcome o;
    size_t at_fault = 0;
    const rxnheat_status st = guarded(err, err_size, [&] {
        rxnheat::Engine& e = engine_of(h);
        const rxnheat::FunctionSpec& f = function_named(function);
        const rxnheat::Result r = rxnheat::evaluate(f, args_of(args, nargs, &at_fault), c_rules(), e);
        // No argument from C is a range, so the catalogue gives one value (never an array).
        if (r.is_array() || r.cells.size() != 1)
            throw rxnheat::Error(rxnheat::ErrorKind::internal, "an array result reached the C interface");
        o = r.single();
    });
    if (st != RXNHEAT_OK) {
        if (out) out->argument = at_fault;
        return st;
    }
    switch (o.kind) {
    case rxnheat::Outcome::Kind::error:
        copy_text(o.text, err, err_size);
        if (out) out->argument = o.argument;
        return status_of(o.error);
    case rxnheat::Outcome::Kind::number:
        if (o.unit.size() >= sizeof out->unit) {  // every unit the engine names is far shorter
            copy_text("internal error: the unit '" + o.unit + "' does not fit rxnheat_result.unit", err, err_size);
            return RXNHEAT_E_INTERNAL;
        }
        if (out) {
            out->kind = RXNHEAT_RESULT_NUMBER;
            out->number = o.number;
            copy_text(o.unit, out->unit, sizeof out->unit);
        }
        return RXNHEAT_OK;
    case rxnheat::Outcome::Kind::text:
        if (out) {
            out->kind = RXNHEAT_RESULT_TEXT;
            out->text_length = o.text.size();
        }
        return text_result(o.text, text, text_size);
    case rxnheat::Outcome::Kind::empty:
        break;
    }
    copy_text("internal error: an empty result reached the C interface", err, err_size);
    return RXNHEAT_E_INTERNAL;
}

rxnheat_status rxnheat_why(rxnheat_engine* h, const char* function, const rxnheat_value* args, size_t nargs,
                           char* text, size_t text_size, char* err, size_t err_size) {
    std::string said;
    const rxnheat_status st = guarded(err, err_size, [&] {
        rxnheat::Engine& e = engine_of(h);
        std::vector<rxnheat::Arg> all;
        // A problem with the C values themselves (a NULL text, an unknown kind) is the answer.
        try {
            need(function, "the function name");
            size_t at_fault = 0;
            all = args_of(args, nargs, &at_fault);
        } catch (const rxnheat::Error& bad) {
            said = bad.what();
            return;
        }
        // RXNWHY itself from the catalogue: the function's name, then its arguments.
        all.insert(all.begin(), rxnheat::Arg::of(std::string(function)));
        const rxnheat::Result r = rxnheat::evaluate(*rxnheat::find_function("RXNWHY"), all, c_rules(), e);
        said = r.single().text;
    });
    if (st != RXNHEAT_OK) {
        copy_text("", text, text_size);
        return st;
    }
    return text_result(said, text, text_size);
}

size_t rxnheat_function_count(void) {
    try {
        return listed().size();
    } catch (...) {
        return 0;
    }
}

const char* rxnheat_function_name(size_t i) {
    try {
        return i < listed().size() ? listed()[i]->calc_name : nullptr;
    } catch (...) {
        return nullptr;
    }
}

}  // extern "C"
