/* rxnheat — C interface to the reaction-heat engine (librxnheat.so).
 *
 * A stable C ABI over the same engine as the C++ interface (rxnheat.hpp), so that other hosts
 * can load the shared library. Conventions:
 *   - Every function returns an rxnheat_status; RXNHEAT_OK (0) on success.
 *   - Numeric results are written to *out only on success; nothing plausible is written on error.
 *   - On error, a message in words is written to `err` (NUL-terminated, truncated to err_size;
 *     `err` may be NULL). Text results go to `out` (NUL-terminated); when `out_size` is too
 *     small the status is RXNHEAT_E_TRUNCATED and `out` holds the truncated text.
 *   - Strings are UTF-8. NULL for an optional string argument means its default.
 *   - Thread-safe: any function may be called from any thread at the same time, on one handle
 *     or on several. Handles are cheap; all share the embedded data and the reaction cache.
 *   - Temperatures in kelvin; energies in the unit asked for (default kJ/mol, kJ, kW).
 */
#ifndef RXNHEAT_H
#define RXNHEAT_H

#include <stddef.h>

#if defined(RXNHEAT_BUILDING)
#define RXNHEAT_C_API __attribute__((visibility("default")))
#else
#define RXNHEAT_C_API
#endif

#ifdef __cplusplus
extern "C" {
#endif

typedef struct rxnheat_engine rxnheat_engine;

typedef enum rxnheat_status {
    RXNHEAT_OK = 0,
    RXNHEAT_E_SYNTAX = 1,            /* the text does not parse */
    RXNHEAT_E_TOO_LONG = 2,          /* over 4096 characters */
    RXNHEAT_E_UNKNOWN_SPECIES = 3,
    RXNHEAT_E_AMBIGUOUS_SPECIES = 4,
    RXNHEAT_E_PHASE = 5,
    RXNHEAT_E_OUT_OF_RANGE = 6,      /* temperature outside the data; never extrapolated */
    RXNHEAT_E_UNBALANCED = 7,
    RXNHEAT_E_UNIT = 8,
    RXNHEAT_E_ARGUMENT = 9,
    RXNHEAT_E_TABLE = 10,
    RXNHEAT_E_TRUNCATED = 11,        /* text result longer than the buffer */
    RXNHEAT_E_INTERNAL = 99
} rxnheat_status;

/* Opens a handle (never NULL unless out of memory). Close it with rxnheat_close(). */
RXNHEAT_C_API rxnheat_engine* rxnheat_open(void);
RXNHEAT_C_API void rxnheat_close(rxnheat_engine* engine);

/* Library version and data-set identity (a static string). */
RXNHEAT_C_API const char* rxnheat_version(void);

/* "350 C" -> 623.15 and so on; see rxnheat::parse_temperature. */
RXNHEAT_C_API rxnheat_status rxnheat_parse_temperature(const char* text, double* kelvin, char* err, size_t err_size);

/* ΔrH° / ΔrU° of the reaction as written at T (K), in `unit` (NULL: kJ/mol), optionally per
 * mole or mass of species `per` (NULL: per mole of extent). */
RXNHEAT_C_API rxnheat_status rxnheat_dh(rxnheat_engine* engine, const char* reaction, double T, const char* unit,
                                        const char* per, double* out, char* err, size_t err_size);
RXNHEAT_C_API rxnheat_status rxnheat_du(rxnheat_engine* engine, const char* reaction, double T, const char* unit,
                                        const char* per, double* out, char* err, size_t err_size);

/* Enthalpy change when `quantity` `quantity_unit` of `key` reacts; result_unit NULL = kJ or kW. */
RXNHEAT_C_API rxnheat_status rxnheat_load(rxnheat_engine* engine, const char* reaction, double quantity,
                                          const char* quantity_unit, const char* key, const char* result_unit,
                                          double T, double* out, char* err, size_t err_size);

/* Text results. */
RXNHEAT_C_API rxnheat_status rxnheat_kind(rxnheat_engine* engine, const char* reaction, double T, double tolerance_kJ,
                                          char* out, size_t out_size, char* err, size_t err_size);
/* "ok" or the diagnosis in words, always RXNHEAT_OK unless the buffer is too small. */
RXNHEAT_C_API rxnheat_status rxnheat_check(rxnheat_engine* engine, const char* reaction, double T, char* out,
                                           size_t out_size);
RXNHEAT_C_API rxnheat_status rxnheat_balance(rxnheat_engine* engine, const char* reaction, char* out,
                                             size_t out_size, char* err, size_t err_size);
RXNHEAT_C_API rxnheat_status rxnheat_reverse(rxnheat_engine* engine, const char* reaction, char* out,
                                             size_t out_size, char* err, size_t err_size);
RXNHEAT_C_API rxnheat_status rxnheat_scale(rxnheat_engine* engine, const char* reaction, const char* factor,
                                           char* out, size_t out_size, char* err, size_t err_size);
RXNHEAT_C_API rxnheat_status rxnheat_source(rxnheat_engine* engine, const char* reaction_or_species, char* out,
                                            size_t out_size, char* err, size_t err_size);

/* Species: ΔfH° (unit NULL = kJ/mol), Cp° J/(mol·K), H°(T)−H°(Tref) kJ/mol, S° J/(mol·K). */
RXNHEAT_C_API rxnheat_status rxnheat_species_hf(rxnheat_engine* engine, const char* species, double T,
                                                const char* unit, double* out, char* err, size_t err_size);
RXNHEAT_C_API rxnheat_status rxnheat_species_cp(rxnheat_engine* engine, const char* species, double T, double* out,
                                                char* err, size_t err_size);
RXNHEAT_C_API rxnheat_status rxnheat_species_h(rxnheat_engine* engine, const char* species, double T, double Tref,
                                               double* out, char* err, size_t err_size);
RXNHEAT_C_API rxnheat_status rxnheat_species_s(rxnheat_engine* engine, const char* species, double T, double* out,
                                               char* err, size_t err_size);
/* g/mol from standard atomic weights. */
RXNHEAT_C_API rxnheat_status rxnheat_molar_mass(rxnheat_engine* engine, const char* formula, double* out, char* err,
                                                size_t err_size);

#ifdef __cplusplus
}
#endif

#endif /* RXNHEAT_H */
