// The C ABI (rxnheat.h) over rxnheat::Engine. No exception crosses this boundary.
#include "rxnheat/rxnheat.h"

#include "rxnheat/rxnheat.hpp"

#include <cstring>
#include <new>
#include <string>

struct rxnheat_engine {
    rxnheat::Engine* engine;
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

}  // extern "C"
