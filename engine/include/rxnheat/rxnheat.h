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
 *     A species-table handle is immutable and may be shared the same way (close it last).
 *   - Temperatures in kelvin; energies in the unit asked for (default kJ/mol, kJ, kW).
 *   - No C++ exception crosses this interface.
 * The functions below up to rxnheat_molar_mass() are the first, fixed-signature interface and
 * stay as they are; rxnheat_call() (further down) reaches every function of the catalogue.
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

/* ---- the function catalogue: every cell function through one call ----------------------------
 *
 * rxnheat_call() evaluates any function of the catalogue (the same table the Calc add-in and the
 * CLI are built from, so a function added there is callable here with no new C symbol). It is
 * named by its Calc name ("RXNDH", ASCII case-insensitive), its CLI command ("dh") or its frozen
 * IDL method ("rxnDH"); the arguments are given in the Calc order, as in engine/FUNCTIONS.md.
 * rxnheat_function_count()/rxnheat_function_name() list the functions.
 *
 * Argument rules (the catalogue's own, with 0 meaning 0 and no text read as a number):
 *   - RXNHEAT_VALUE_OMITTED, and text that is empty or blank, mean "not given": an optional
 *     argument takes its default, a required one is an error naming it.
 *   - A number argument must be given as RXNHEAT_VALUE_NUMBER; a temperature may be a number
 *     (kelvin) or text with a unit ("350 C"); a factor a number or exact text ("1/2").
 *   - A species table argument ("table") is given as RXNHEAT_VALUE_TABLE with a handle from
 *     rxnheat_table_from_csv() or rxnheat_table_from_rows().
 *   - More arguments than the function takes is an error (RXNWHY takes any number).
 *
 * Deliberate gap: arrays do not cross the C ABI. In Calc a range of reactions (or species, or
 * temperatures) gives an array result; a C host loops over its own values instead, one call
 * each, and a user table is built once into a handle rather than passed as a range of cells.
 *
 * Statuses: RXNHEAT_OK, or the status of the error's kind (rxnheat::error_kind_info(kind).c_status
 * in the C++ interface: RXNHEAT_E_SYNTAX ... RXNHEAT_E_TABLE, RXNHEAT_E_INTERNAL for a bug), or
 * RXNHEAT_E_TRUNCATED when a text result does not fit its buffer. An unknown function name is
 * RXNHEAT_E_ARGUMENT. RXNCHECK and RXNWHY answer every problem as their text result (status
 * RXNHEAT_OK), exactly as they do in Calc.
 *
 * Nothing throws across this interface; out of memory is RXNHEAT_E_INTERNAL with a message. */

/* A user species table (engine/DATA.md, User tables), parsed once; immutable, so one handle may be used by any
 * number of calls on any threads at the same time. Close it after the last call that uses it. */
typedef struct rxnheat_table rxnheat_table;

/* Reads a CSV file whose first row names the columns (formula, phase, dHf, and optionally S, cp
 * or a..e, tmin, tmax, name, source). On success *table is a new handle; on error *table is NULL
 * and `err` names the row (header = row 1) and the column. */
RXNHEAT_C_API rxnheat_status rxnheat_table_from_csv(const char* path, rxnheat_table** table, char* err,
                                                    size_t err_size);
/* The same from cells in memory: `cells` holds rows·cols UTF-8 strings, row by row, row 0 the
 * header; a NULL cell is an empty one. The cells are copied; the caller keeps ownership. */
RXNHEAT_C_API rxnheat_status rxnheat_table_from_rows(const char* const* cells, size_t rows, size_t cols,
                                                     rxnheat_table** table, char* err, size_t err_size);
/* Frees the handle (NULL is allowed). No call may be using it at the same time. */
RXNHEAT_C_API void rxnheat_table_close(rxnheat_table* table);

typedef enum rxnheat_value_kind {
    RXNHEAT_VALUE_OMITTED = 0,  /* not given: the default of an optional argument */
    RXNHEAT_VALUE_NUMBER = 1,   /* `number`; must be finite */
    RXNHEAT_VALUE_TEXT = 2,     /* `text`, UTF-8, NUL-terminated, not NULL */
    RXNHEAT_VALUE_TABLE = 3     /* `table`, a handle from rxnheat_table_from_*(), not NULL */
} rxnheat_value_kind;

/* One argument. A zero-initialised value (`rxnheat_value v = {0};`) is "omitted". The pointers
 * are only read during the call. */
typedef struct rxnheat_value {
    int kind; /* an rxnheat_value_kind */
    double number;
    const char* text;
    const rxnheat_table* table;
} rxnheat_value;

static inline rxnheat_value rxnheat_omitted(void) {
    rxnheat_value v = {RXNHEAT_VALUE_OMITTED, 0.0, NULL, NULL};
    return v;
}
static inline rxnheat_value rxnheat_number(double x) {
    rxnheat_value v = {RXNHEAT_VALUE_NUMBER, x, NULL, NULL};
    return v;
}
static inline rxnheat_value rxnheat_text(const char* s) {
    rxnheat_value v = {RXNHEAT_VALUE_TEXT, 0.0, s, NULL};
    return v;
}
static inline rxnheat_value rxnheat_table_value(const rxnheat_table* t) {
    rxnheat_value v = {RXNHEAT_VALUE_TABLE, 0.0, NULL, t};
    return v;
}

typedef enum rxnheat_result_kind {
    RXNHEAT_RESULT_NONE = 0,    /* the call failed: see the status and `err` */
    RXNHEAT_RESULT_NUMBER = 1,  /* `number` in `unit` */
    RXNHEAT_RESULT_TEXT = 2     /* the text is in the caller's `text` buffer */
} rxnheat_result_kind;

/* What rxnheat_call() gives besides its status. Filled on every return when not NULL. */
typedef struct rxnheat_result {
    int kind;            /* an rxnheat_result_kind */
    double number;       /* RXNHEAT_RESULT_NUMBER; NaN otherwise, never a plausible value */
    char unit[32];       /* the number's unit, UTF-8, e.g. "kJ/mol", "kW", "J/(mol·K)", "g/mol"; "" else */
    size_t text_length;  /* RXNHEAT_RESULT_TEXT: bytes of the whole text without its NUL, so that a
                            host whose buffer was too small (RXNHEAT_E_TRUNCATED) can retry */
    size_t argument;     /* on error: the 1-based argument at fault, 0 when not one argument */
} rxnheat_result;

/* Evaluates catalogue function `function` on `nargs` arguments (`args` may be NULL when nargs is
 * 0). A text result goes to `text` (NUL-terminated; truncated to text_size with status
 * RXNHEAT_E_TRUNCATED); for a number result `text` is set to "". On error `err` holds the message
 * in words (it names the argument at fault where there is one) and `text` is "". `out`, `text`
 * and `err` may each be NULL. Thread-safe, like every function here. */
RXNHEAT_C_API rxnheat_status rxnheat_call(rxnheat_engine* engine, const char* function, const rxnheat_value* args,
                                          size_t nargs, rxnheat_result* out, char* text, size_t text_size, char* err,
                                          size_t err_size);

/* RXNWHY: writes "ok", or in words exactly why rxnheat_call(engine, function, args, nargs, ...)
 * fails, to `text` (an unknown function is named, and the functions listed). Status RXNHEAT_OK,
 * RXNHEAT_E_TRUNCATED, or RXNHEAT_E_INTERNAL (with `err`) when rxnheat itself fails. */
RXNHEAT_C_API rxnheat_status rxnheat_why(rxnheat_engine* engine, const char* function, const rxnheat_value* args,
                                         size_t nargs, char* text, size_t text_size, char* err, size_t err_size);

/* The functions rxnheat_call() knows, in the order of engine/FUNCTIONS.md: their Calc names ("RXNDH", ...).
 * rxnheat_function_name() returns a static string, or NULL when i >= rxnheat_function_count(). */
RXNHEAT_C_API size_t rxnheat_function_count(void);
RXNHEAT_C_API const char* rxnheat_function_name(size_t i);

#ifdef __cplusplus
}
#endif

#endif /* RXNHEAT_H */
