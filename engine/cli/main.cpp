// rxnheat: the command line over the rxnheat engine (SPEC section 5). Thin: every number and
// every diagnosis comes from rxnheat::Engine; this file parses arguments, formats results as
// text or JSON, and streams the batch CSV. See CLI.md for the user's description.
#include "csv.hpp"
#include "format.hpp"

#include "rxnheat/rxnheat.hpp"

#include <algorithm>
#include <atomic>
#include <cctype>
#include <cerrno>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <exception>
#include <new>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>
#include <system_error>
#include <thread>
#include <vector>

namespace {

using rxncli::exact_number;
using rxncli::json_string;
using rxncli::JsonObject;
using rxncli::plain_number;

// ---- errors and exit status ------------------------------------------------------------------

constexpr int exit_ok = 0;
constexpr int exit_internal = 1;
constexpr int exit_bad_input = 2;

/// A bad command line (unknown command or option, missing or extra argument): exit 2, with usage.
struct UsageError : std::runtime_error {
    using std::runtime_error::runtime_error;
};

const char* kind_name(rxnheat::ErrorKind k) {
    using K = rxnheat::ErrorKind;
    switch (k) {
    case K::syntax: return "syntax";
    case K::too_long: return "too_long";
    case K::unknown_species: return "unknown_species";
    case K::ambiguous_species: return "ambiguous_species";
    case K::phase: return "phase";
    case K::out_of_range: return "out_of_range";
    case K::unbalanced: return "unbalanced";
    case K::unit: return "unit";
    case K::argument: return "argument";
    case K::table: return "table";
    case K::internal: return "internal";
    }
    return "internal";
}

rxnheat::Error bad_argument(const std::string& msg) { return rxnheat::Error(rxnheat::ErrorKind::argument, msg); }

// ---- output ----------------------------------------------------------------------------------

void write_out(std::string_view s) { std::fwrite(s.data(), 1, s.size(), stdout); }
void write_err(std::string_view s) { std::fwrite(s.data(), 1, s.size(), stderr); }

/// Set while `batch --json` has written the opening of its object, so that an error escaping
/// the batch closes that object instead of starting a second one.
bool g_json_batch_open = false;

// ---- options ---------------------------------------------------------------------------------

enum Option : unsigned {
    opt_temperature = 1u << 0,
    opt_unit = 1u << 1,
    opt_per = 1u << 2,
    opt_basis = 1u << 3,
    opt_extra = 1u << 4,
    opt_threads = 1u << 5,
    opt_table = 1u << 6,
    opt_tolerance = 1u << 7,
};

struct OptionSpec {
    Option id;
    char short_name;        // 0: none
    const char* long_name;  // without "--"
};

constexpr OptionSpec option_specs[] = {
    {opt_temperature, 'T', "temperature"},
    {opt_unit, 'u', "unit"},
    {opt_per, 0, "per"},
    {opt_basis, 0, "basis"},
    {opt_extra, 0, "extra"},
    {opt_threads, 0, "threads"},
    {opt_table, 0, "table"},
    {opt_tolerance, 0, "tolerance"},
};

std::string option_display(Option id) {
    for (const auto& s : option_specs)
        if (s.id == id)
            return s.short_name ? std::string("-") + s.short_name + "/--" + s.long_name : std::string("--") + s.long_name;
    return "?";
}

struct Args {
    std::string command;
    std::vector<std::string> positional;
    bool json = false;
    bool help = false;
    std::optional<std::string> temperature, unit, per, basis, threads, table, tolerance;
    std::vector<std::string> extra;
    unsigned given = 0;  // Option bits seen

    std::optional<std::string>* slot(Option id) {
        switch (id) {
        case opt_temperature: return &temperature;
        case opt_unit: return &unit;
        case opt_per: return &per;
        case opt_basis: return &basis;
        case opt_threads: return &threads;
        case opt_table: return &table;
        case opt_tolerance: return &tolerance;
        case opt_extra: return nullptr;
        }
        return nullptr;
    }
};

/// True for text that is a whole number in decimal notation ("-5", "1e3", "-0.5"), so that a
/// negative number is taken as an argument rather than as an option.
bool is_number(const std::string& s) {
    if (s.empty()) return false;
    char* end = nullptr;
    errno = 0;
    std::strtod(s.c_str(), &end);
    return end == s.c_str() + s.size();
}

// ---- the engine's context for one command ------------------------------------------------------

struct Context {
    Args& args;
    rxnheat::Engine& engine;
    std::optional<rxnheat::SpeciesTable> table_storage;
    const rxnheat::SpeciesTable* table = nullptr;
    double T = rxnheat::T_ref;

    void emit(const std::string& plain, const JsonObject& json) const {
        if (args.json)
            write_out(json.text() + "\n");
        else
            write_out(plain + "\n");
    }
};

std::string sources_json(const std::vector<rxnheat::SourceLine>& sources) {
    std::string s = "[";
    for (std::size_t i = 0; i < sources.size(); ++i) {
        if (i) s += ",";
        s += JsonObject().str("species", sources[i].species).str("record", sources[i].record).str("text", sources[i].text).text();
    }
    return s + "]";
}

double parse_finite(const std::string& text, const char* what) {
    char* end = nullptr;
    const double v = std::strtod(text.c_str(), &end);
    if (text.empty() || end != text.c_str() + text.size() || !std::isfinite(v))
        throw bad_argument(std::string(what) + " must be a number, not '" + text + "'");
    return v;
}

// ---- commands --------------------------------------------------------------------------------

int run_dh_du(Context& c, bool is_du) {
    const std::string& reaction = c.args.positional[0];
    const std::string unit = c.args.unit.value_or("kJ/mol");
    const std::string per = c.args.per.value_or("");
    const double value = is_du ? c.engine.du(reaction, {c.T, c.table}, unit, per)
                               : c.engine.dh(reaction, {c.T, c.table}, unit, per);
    const rxnheat::ReactionReport rep = c.engine.report(reaction, {c.T, c.table});

    std::string plain = plain_number(value) + " " + unit;
    if (!per.empty()) plain += " of " + per;
    if (!is_du) plain += " (" + std::string(rxnheat::to_string(rep.kind)) + ")";

    JsonObject j;
    j.num("value", value).str("unit", unit);
    if (!per.empty()) j.str("per", per);
    if (!is_du) j.str("kind", rxnheat::to_string(rep.kind));
    j.num("temperature_K", rep.temperature_K).str("reaction", rep.canonical);
    if (is_du) j.num("dn_gas", rep.dn_gas).num("dH_kJ_per_mol", rep.dH_kJ_per_mol);
    j.raw("sources", sources_json(rep.sources));
    c.emit(plain, j);
    return exit_ok;
}

int run_dh(Context& c) { return run_dh_du(c, false); }
int run_du(Context& c) { return run_dh_du(c, true); }

int run_load(Context& c) {
    const auto& p = c.args.positional;
    const std::string& reaction = p[0];
    const double quantity = parse_finite(p[1], "the QUANTITY");
    const std::string& quantity_unit = p[2];
    const std::string& key = p[3];
    const double value = c.engine.load(reaction, quantity, quantity_unit, key, c.args.unit.value_or(""),
                                       {c.T, c.table});
    // The engine decides which quantity units are flows ("kg/hr", "MMscfd" too), so it names the
    // default result unit; a unit the user gave is echoed as given.
    const std::string unit = c.args.unit ? *c.args.unit : rxnheat::Engine::load_unit(quantity_unit, {});
    const rxnheat::ReactionReport rep = c.engine.report(reaction, {c.T, c.table});

    const std::string plain = plain_number(value) + " " + unit + " (" + std::string(rxnheat::to_string(rep.kind)) + ")";
    JsonObject j;
    j.num("value", value)
        .str("unit", unit)
        .str("kind", rxnheat::to_string(rep.kind))
        .num("quantity", quantity)
        .str("quantity_unit", quantity_unit)
        .str("key", key)
        .num("temperature_K", rep.temperature_K)
        .str("reaction", rep.canonical)
        .num("dH_kJ_per_mol", rep.dH_kJ_per_mol)
        .raw("sources", sources_json(rep.sources));
    c.emit(plain, j);
    return exit_ok;
}

int run_kind(Context& c) {
    const std::string& reaction = c.args.positional[0];
    const double tol = c.args.tolerance ? parse_finite(*c.args.tolerance, "--tolerance") : 0.1;
    const std::string word = rxnheat::to_string(c.engine.kind(reaction, {c.T, c.table}, tol));
    const rxnheat::ReactionReport rep = c.engine.report(reaction, {c.T, c.table});
    JsonObject j;
    j.str("kind", word)
        .num("dH_kJ_per_mol", rep.dH_kJ_per_mol)
        .num("tolerance_kJ_per_mol", tol)
        .num("temperature_K", rep.temperature_K)
        .str("reaction", rep.canonical);
    c.emit(word, j);
    return exit_ok;
}

int run_check(Context& c) {
    const std::string& reaction = c.args.positional[0];
    const std::string verdict = c.engine.check(reaction, {c.T, c.table});
    const bool ok = verdict == "ok";
    JsonObject j;
    j.boolean("ok", ok).str("check", verdict);
    if (!ok) j.str("error", verdict);
    j.num("temperature_K", c.T).str("input", reaction);
    c.emit(verdict, j);
    return ok ? exit_ok : exit_bad_input;
}

int run_text_result(Context& c, const std::string& result) {
    JsonObject j;
    j.str("reaction", result).str("input", c.args.positional[0]);
    c.emit(result, j);
    return exit_ok;
}

int run_balance(Context& c) { return run_text_result(c, c.engine.balance(c.args.positional[0], {rxnheat::T_ref, c.table})); }
int run_reverse(Context& c) { return run_text_result(c, c.engine.reverse(c.args.positional[0])); }

int run_scale(Context& c) {
    const std::string result = c.engine.scale(c.args.positional[0], std::string_view(c.args.positional[1]));
    JsonObject j;
    j.str("reaction", result).str("input", c.args.positional[0]).str("factor", c.args.positional[1]);
    c.emit(result, j);
    return exit_ok;
}

int run_species(Context& c) {
    const rxnheat::SpeciesReport r = c.engine.species_report(c.args.positional[0], {c.T, c.table});
    const bool has_range = r.tmax_K > 0;
    std::string plain;
    auto line = [&](const char* label, const std::string& value) {
        char buf[32];
        std::snprintf(buf, sizeof buf, "%-11s ", label);
        plain += buf + value + "\n";
    };
    line("species", r.species);
    line("record", r.record + (has_range ? ", " + plain_number(r.tmin_K) + " to " + plain_number(r.tmax_K) + " K" : ""));
    line("T", plain_number(r.temperature_K) + " K");
    line("dHf", plain_number(r.dHf_kJ_per_mol) + " kJ/mol (at 298.15 K)");
    line("Cp", plain_number(r.Cp_J_per_molK) + " J/(mol K)");
    line("H-H298", plain_number(r.dH_sensible_kJ_per_mol) + " kJ/mol");
    line("H", plain_number(r.H_kJ_per_mol) + " kJ/mol (assigned enthalpy: dHf + H-H298)");
    line("S", plain_number(r.S_J_per_molK) + " J/(mol K)");
    line("molar mass", plain_number(r.molar_mass_g_per_mol) + " g/mol");
    line("source", r.source);
    plain.pop_back();

    JsonObject j;
    j.str("species", r.species)
        .str("record", r.record)
        .num("temperature_K", r.temperature_K)
        .num("dHf_kJ_per_mol", r.dHf_kJ_per_mol)
        .num("Cp_J_per_molK", r.Cp_J_per_molK)
        .num("dH_sensible_kJ_per_mol", r.dH_sensible_kJ_per_mol)
        .num("H_kJ_per_mol", r.H_kJ_per_mol)
        .num("S_J_per_molK", r.S_J_per_molK)
        .num("molar_mass_g_per_mol", r.molar_mass_g_per_mol);
    if (has_range)
        j.num("tmin_K", r.tmin_K).num("tmax_K", r.tmax_K);
    else
        j.null("tmin_K").null("tmax_K");
    j.str("source", r.source);
    c.emit(plain, j);
    return exit_ok;
}

// ---- batch -------------------------------------------------------------------------------------

constexpr std::size_t batch_chunk_rows = 1024;
constexpr unsigned max_threads = 256;

struct BatchRow {
    std::size_t line = 0;
    std::string reaction, temperature_text, unit_text;
    std::string error;  // set by the reader, or by the computation
    bool internal = false;
    bool has_T = false;
    double T = 0;
    std::string unit;
    double value = 0;
    std::string kind;
};

std::string trimmed(const std::string& s) {
    const auto b = s.find_first_not_of(" \t");
    if (b == std::string::npos) return {};
    const auto e = s.find_last_not_of(" \t");
    return s.substr(b, e - b + 1);
}

void compute_row(BatchRow& r, rxnheat::Engine& engine, const rxnheat::SpeciesTable* table, double default_T,
                 const std::string& default_unit) {
    if (!r.error.empty()) return;
    try {
        r.unit = r.unit_text.empty() ? default_unit : r.unit_text;
        r.T = r.temperature_text.empty() ? default_T : rxnheat::parse_temperature(r.temperature_text);
        r.has_T = true;
        const rxnheat::ReactionReport rep = engine.report(r.reaction, {r.T, table});
        r.value = r.unit == "kJ/mol" ? rep.dH_kJ_per_mol : engine.dh(r.reaction, {r.T, table}, r.unit);
        r.kind = rxnheat::to_string(rep.kind);
    } catch (const rxnheat::Error& e) {
        r.error = e.what();
        r.internal = e.kind() == rxnheat::ErrorKind::internal;
    } catch (const std::exception& e) {
        r.error = std::string("internal error: ") + e.what();
        r.internal = true;
    } catch (...) {
        r.error = "internal error";
        r.internal = true;
    }
    if (!r.error.empty()) r.kind.clear();
}

void compute_chunk(std::vector<BatchRow>& rows, unsigned threads, rxnheat::Engine& engine,
                   const rxnheat::SpeciesTable* table, double default_T, const std::string& default_unit) {
    std::atomic<std::size_t> next{0};
    auto work = [&] {
        for (;;) {
            const std::size_t i = next.fetch_add(1);
            if (i >= rows.size()) return;
            compute_row(rows[i], engine, table, default_T, default_unit);
        }
    };
    const std::size_t helpers = std::min<std::size_t>(threads, rows.size()) - (rows.empty() ? 0 : 1);
    std::vector<std::thread> pool;
    for (std::size_t k = 0; k < helpers; ++k) {
        try {
            pool.emplace_back(work);
        } catch (const std::system_error&) {
            break;  // the system refused another thread: go on with those we have
        }
    }
    work();
    for (auto& t : pool) t.join();
}

std::string batch_row_csv(const BatchRow& r) {
    std::string out;
    rxncli::csv::append_row(out, {std::to_string(r.line), r.reaction, r.has_T ? exact_number(r.T) : "",
                                  r.error.empty() ? exact_number(r.value) : "", r.unit, r.kind, r.error});
    return out;
}

std::string batch_row_json(const BatchRow& r) {
    JsonObject j;
    j.num("line", static_cast<double>(r.line)).str("reaction", r.reaction);
    if (r.has_T) j.num("temperature_K", r.T);
    if (r.error.empty())
        j.num("value", r.value).str("unit", r.unit).str("kind", r.kind);
    else
        j.str("error", r.error);
    return j.text();
}

int run_batch(Context& c) {
    const Args& a = c.args;
    std::FILE* in = stdin;
    std::string name = "standard input";
    if (!a.positional.empty() && a.positional[0] != "-") {
        name = a.positional[0];
        in = std::fopen(name.c_str(), "rb");
        if (!in) throw bad_argument("cannot open '" + name + "': " + std::strerror(errno));
    }
    struct Closer {
        std::FILE* f;
        ~Closer() {
            if (f && f != stdin) std::fclose(f);
        }
    } closer{in};

    unsigned threads = 1;
    if (a.threads) {
        const std::string& t = *a.threads;
        char* end = nullptr;
        const long n = std::strtol(t.c_str(), &end, 10);
        if (t.empty() || end != t.c_str() + t.size() || n < 0 || n > static_cast<long>(max_threads))
            throw bad_argument("--threads must be a whole number from 0 to " + std::to_string(max_threads) +
                               " (0: one per processor), not '" + t + "'");
        threads = static_cast<unsigned>(n);
        if (threads == 0) threads = std::max(1u, std::thread::hardware_concurrency());
    }
    const std::string default_unit = a.unit.value_or("kJ/mol");

    rxncli::csv::Reader reader(in);
    rxncli::csv::Record rec;
    bool first_record = true;
    std::size_t total = 0, failed = 0;
    bool internal = false;

    if (a.json) {
        write_out("{\"results\":[");
        g_json_batch_open = true;
    } else {
        write_out("line,reaction,temperature_K,value,unit,kind,error\n");
    }

    std::vector<BatchRow> rows;
    rows.reserve(batch_chunk_rows);
    bool more = true;
    while (more) {
        rows.clear();
        while (rows.size() < batch_chunk_rows) {
            if (!reader.next(rec)) {
                more = false;
                break;
            }
            bool blank = rec.error.empty();
            for (const auto& cell : rec.cells)
                if (!trimmed(cell).empty()) blank = false;
            if (blank) continue;  // empty lines and rows of empty cells are not data
            const bool was_first = first_record;
            first_record = false;
            if (was_first && rec.error.empty() && trimmed(rec.cells[0]) == "reaction") continue;  // header

            BatchRow r;
            r.line = rec.line;
            r.reaction = rec.cells[0];
            if (rec.cells.size() > 1) r.temperature_text = trimmed(rec.cells[1]);
            if (rec.cells.size() > 2) r.unit_text = trimmed(rec.cells[2]);
            r.error = rec.error;
            std::size_t used = rec.cells.size();
            while (used > 0 && trimmed(rec.cells[used - 1]).empty()) --used;
            if (r.error.empty() && used > 3)
                r.error = "the row has " + std::to_string(used) +
                          " cells; a batch row is reaction[,temperature[,unit]]";
            rows.push_back(std::move(r));
        }
        compute_chunk(rows, threads, c.engine, c.table, c.T, default_unit);

        std::string out;
        for (const auto& r : rows) {
            if (a.json) {
                if (total) out += ",";
                out += batch_row_json(r);
            } else {
                out += batch_row_csv(r);
            }
            ++total;
            if (!r.error.empty()) ++failed;
            if (r.internal) internal = true;
        }
        write_out(out);
        std::fflush(stdout);
    }

    std::string read_failure;
    if (reader.read_error())
        read_failure = "cannot read '" + name + "': " + std::strerror(reader.read_error());

    if (a.json) {
        std::string t = "],\"rows\":" + std::to_string(total) + ",\"failed\":" + std::to_string(failed);
        if (!read_failure.empty()) t += ",\"error\":" + json_string(read_failure);
        write_out(t + "}\n");
        g_json_batch_open = false;
    }
    if (!read_failure.empty()) {
        if (!a.json) write_err("rxnheat batch: " + read_failure + "\n");
        return exit_bad_input;
    }
    if (failed)
        write_err("rxnheat batch: " + std::to_string(failed) + " of " + std::to_string(total) +
                  " rows have errors (see their error cells)\n");
    return internal ? exit_internal : exit_ok;
}

// ---- the command table ---------------------------------------------------------------------------

struct Command {
    const char* name;
    const char* arguments;  // usage after the name
    unsigned options;
    std::size_t min_args, max_args;
    const char* summary;
    const char* details;
    int (*run)(Context&);
};

const char* const temperature_help =
    "  -T, --temperature TEMP  kelvin, or text with a unit: \"350 C\", \"350 °C\", \"662 F\",\n"
    "                          \"1100 R\", \"623.15 K\" (default 298.15 K)\n";
const char* const table_help =
    "  --table FILE.csv        a user species table over the built-in data (first row names\n"
    "                          the columns: formula, phase, dHf [kJ/mol]; optional S, cp or\n"
    "                          a,b,c,d,e (Shomate), tmin, tmax, name, source)\n";
const char* const caution =
    "Results are standard-state, ideal-gas, complete-conversion estimates for screening.\n"
    "Thermal runaway and relief sizing need calorimetry and a process hazard analysis;\n"
    "follow local codes and the judgement of licensed engineers.\n";

const Command commands[] = {
    {"dh", "REACTION [-T TEMP] [-u UNIT] [--per SPECIES] [--table FILE.csv]",
     opt_temperature | opt_unit | opt_per | opt_table, 1, 1,
     "standard reaction enthalpy ΔrH° of the reaction as written",
     "Prints ΔrH° per mole of reaction extent (the reaction as written), with its unit and\n"
     "whether it is exothermic (ΔrH° < 0), endothermic (> 0) or thermoneutral (within 0.1 kJ/mol).\n"
     "\n"
     "Options:\n"
     "%T"
     "  -u, --unit UNIT         kJ/mol (default), J/mol, MJ/kmol, kcal/mol, cal/mol, BTU/lbmol;\n"
     "                          with --per also kJ/kg, MJ/kg, kJ/g, kcal/kg, BTU/lb\n"
     "  --per SPECIES           per mole (or per mass unit) of this species of the reaction\n"
     "%t"
     "  --json                  {\"value\", \"unit\", [\"per\"], \"kind\", \"temperature_K\",\n"
     "                          \"reaction\" (canonical text), \"sources\": [{\"species\", \"record\",\n"
     "                          \"text\"}]}\n"
     "\n"
     "Examples:\n"
     "  rxnheat dh \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\"\n"
     "  rxnheat dh \"CO(g) + H2O(g) -> CO2(g) + H2(g)\" -T \"450 C\"\n"
     "  rxnheat dh \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\" -u MJ/kg --per \"CH4(g)\"\n",
     run_dh},
    {"du", "REACTION [-T TEMP] [-u UNIT] [--per SPECIES] [--table FILE.csv]",
     opt_temperature | opt_unit | opt_per | opt_table, 1, 1,
     "standard reaction energy ΔrU° = ΔrH° − Δn(gas)·R·T (constant volume)",
     "Prints ΔrU° = ΔrH° − Δn(gas)·R·T per mole of reaction extent, for constant-volume (bomb)\n"
     "work. Options and units as for dh.\n"
     "\n"
     "Options:\n"
     "%T"
     "  -u, --unit UNIT         as for dh (default kJ/mol)\n"
     "  --per SPECIES           per mole (or per mass unit) of this species of the reaction\n"
     "%t"
     "  --json                  {\"value\", \"unit\", [\"per\"], \"temperature_K\", \"reaction\",\n"
     "                          \"dn_gas\", \"dH_kJ_per_mol\", \"sources\"}\n"
     "\n"
     "Example:\n"
     "  rxnheat du \"C7H16(l) + 11 O2(g) -> 7 CO2(g) + 8 H2O(l)\" -u kJ/kg --per \"C7H16(l)\"\n",
     run_du},
    {"load", "REACTION QUANTITY QUANTITY_UNIT KEY [-u UNIT] [-T TEMP] [--table FILE.csv]",
     opt_temperature | opt_unit | opt_table, 4, 4,
     "heat when QUANTITY of species KEY reacts or forms (a total or a rate)",
     "Prints the enthalpy change when QUANTITY (in QUANTITY_UNIT) of the species KEY reacts\n"
     "(a reactant) or forms (a product), the reaction otherwise as written. Negative: heat given\n"
     "off.\n"
     "  QUANTITY_UNIT  amount mol, kmol, lbmol; mass g, kg, t, lb; normal gas volume Nm3 (0 °C,\n"
     "                 101.325 kPa) or scf (60 °F, 14.696 psia); each optionally per s, min, h\n"
     "                 or d (kg/h) for a flow.\n"
     "\n"
     "Options:\n"
     "  -u, --unit UNIT         totals: kJ (default), J, MJ, GJ, kWh, MWh, kcal, BTU, MMBTU,\n"
     "                          therm; flows: kW (default), W, MW, kcal/h, BTU/h, MMBTU/h, TR\n"
     "%T"
     "%t"
     "  --json                  {\"value\", \"unit\", \"kind\", \"quantity\", \"quantity_unit\", \"key\",\n"
     "                          \"temperature_K\", \"reaction\", \"dH_kJ_per_mol\", \"sources\"}\n"
     "\n"
     "Example (a burner fed 120 kg/h of methane):\n"
     "  rxnheat load \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)\" 120 kg/h \"CH4(g)\" -u MW\n"
     "\n"
     "%c",
     run_load},
    {"kind", "REACTION [-T TEMP] [--tolerance KJ] [--table FILE.csv]",
     opt_temperature | opt_tolerance | opt_table, 1, 1,
     "exothermic, endothermic or thermoneutral",
     "Prints exothermic (ΔrH° < 0), endothermic (ΔrH° > 0) or thermoneutral (|ΔrH°| at or\n"
     "below the tolerance).\n"
     "\n"
     "Options:\n"
     "%T"
     "  --tolerance KJ          kJ/mol, default 0.1\n"
     "%t"
     "  --json                  {\"kind\", \"dH_kJ_per_mol\", \"tolerance_kJ_per_mol\",\n"
     "                          \"temperature_K\", \"reaction\"}\n",
     run_kind},
    {"check", "REACTION [-T TEMP] [--table FILE.csv]", opt_temperature | opt_table, 1, 1,
     "ok, or the first problem with the reaction in words",
     "Prints \"ok\" and exits 0 when ΔrH° can be computed at the temperature; otherwise prints the\n"
     "first problem in words on standard output (an unbalanced element with its totals on each\n"
     "side, a species with no data, a temperature outside the data's range, a syntax error with\n"
     "its position, ...) and exits 2.\n"
     "\n"
     "Options:\n"
     "%T"
     "%t"
     "  --json                  {\"ok\": true|false, \"check\": \"ok\" or the problem, \"error\": the\n"
     "                          problem (only when not ok), \"temperature_K\", \"input\"}\n"
     "\n"
     "Example:\n"
     "  rxnheat check \"H2(g) + O2(g) -> H2O(l)\"\n",
     run_check},
    {"balance", "REACTION [--table FILE.csv]", opt_table, 1, 1,
     "the reaction with the smallest whole-number coefficients",
     "Prints the reaction with the smallest whole-number coefficients that balance the elements\n"
     "and the charge (coefficients given in REACTION are ignored). An error when there is no\n"
     "balance or more than one independent one.\n"
     "\n"
     "Options:\n"
     "%t"
     "  --json                  {\"reaction\": the balanced text, \"input\"}\n"
     "\n"
     "Example:\n"
     "  rxnheat balance \"C3H8(g) + O2(g) -> CO2(g) + H2O(l)\"\n",
     run_balance},
    {"reverse", "REACTION", 0, 1, 1, "products and reactants exchanged",
     "Prints the reaction with products and reactants exchanged.\n"
     "\n"
     "Options:\n"
     "  --json                  {\"reaction\": the reversed text, \"input\"}\n",
     run_reverse},
    {"scale", "REACTION FACTOR", 0, 2, 2, "every coefficient times FACTOR",
     "Prints the reaction with every coefficient multiplied by FACTOR (above zero): an integer,\n"
     "a decimal, a fraction a/b or ½ ⅓ ⅔ ¼ ¾. Exact fractions are kept (1/2 O2).\n"
     "\n"
     "Options:\n"
     "  --json                  {\"reaction\": the scaled text, \"input\", \"factor\"}\n"
     "\n"
     "Example:\n"
     "  rxnheat scale \"2 H2(g) + O2(g) -> 2 H2O(l)\" 1/2\n",
     run_scale},
    {"species", "SPECIES [-T TEMP] [--table FILE.csv]", opt_temperature | opt_table, 1, 1,
     "ΔfH°, Cp°, H°(T)−H°(298.15 K), S°, molar mass, data record and source of one species",
     "Prints, for one species (a formula with its phase, or a name such as ethanol): ΔfH° at\n"
     "298.15 K, Cp° and S° at T, the sensible heat H°(T) − H°(298.15 K), the assigned enthalpy\n"
     "H°(T), the molar mass, the data record used with its temperature range, and its source.\n"
     "\n"
     "Options:\n"
     "%T"
     "%t"
     "  --json                  {\"species\", \"record\", \"temperature_K\", \"dHf_kJ_per_mol\",\n"
     "                          \"Cp_J_per_molK\", \"dH_sensible_kJ_per_mol\", \"H_kJ_per_mol\",\n"
     "                          \"S_J_per_molK\", \"molar_mass_g_per_mol\", \"tmin_K\", \"tmax_K\"\n"
     "                          (null for user-table rows without a range), \"source\"}\n"
     "\n"
     "Example:\n"
     "  rxnheat species \"Fe(s)\" -T 1300\n",
     run_species},
    {"batch", "[FILE|-] [-T TEMP] [-u UNIT] [--threads N] [--table FILE.csv]",
     opt_temperature | opt_unit | opt_threads | opt_table, 0, 1,
     "ΔrH° for every row of a CSV file (or standard input), streamed to CSV",
     "Reads CSV rows reaction[,temperature[,unit]] from FILE (or standard input when FILE is -\n"
     "or absent) and writes one CSV row per input row, in input order, to standard output:\n"
     "\n"
     "  line,reaction,temperature_K,value,unit,kind,error\n"
     "\n"
     "  line           the input line on which the row starts (1-based)\n"
     "  reaction       the reaction text as given\n"
     "  temperature_K  the temperature used, K\n"
     "  value          ΔrH° in `unit` (empty on error)\n"
     "  unit           the row's unit, or -u, or kJ/mol\n"
     "  kind           exothermic / endothermic / thermoneutral (empty on error)\n"
     "  error          empty, or what is wrong with this row\n"
     "\n"
     "An empty temperature or unit cell takes -T / -u (defaults 298.15 K, kJ/mol). A first row\n"
     "whose first cell is `reaction` is a header and is skipped; so are blank rows. A bad row\n"
     "gets its error text and the batch goes on; the number of bad rows is written to standard\n"
     "error. Quoting follows RFC 4180 (\"...\" around cells with commas, quotes or line breaks,\n"
     "\"\" for a quote); UTF-8 passes through; a UTF-8 byte-order mark is ignored. Numbers are\n"
     "written with every digit needed to read back the same double. The file is streamed in\n"
     "chunks of 1024 rows, so memory stays constant; a row longer than 16384 bytes is an error.\n"
     "Exit status 0 when the input was read (even with bad rows), 2 when it could not be read,\n"
     "1 after an internal failure.\n"
     "\n"
     "Options:\n"
     "%T"
     "  -u, --unit UNIT         default unit for rows without one (as for dh, per-mole units)\n"
     "  --threads N             rows computed in parallel: default 1; 0 = one per processor\n"
     "%t"
     "  --json                  instead of CSV, one object {\"results\": [{\"line\", \"reaction\",\n"
     "                          \"temperature_K\", \"value\", \"unit\", \"kind\"} or {\"line\",\n"
     "                          \"reaction\", \"error\"}, ...], \"rows\", \"failed\"}, also streamed\n"
     "\n"
     "Example:\n"
     "  rxnheat batch feeds.csv --threads 2 > heats.csv\n",
     run_batch},
};

/// Commands of the specification that this version does not have.
struct Missing {
    const char* name;
    const char* what;
};
constexpr Missing missing_commands[] = {
    {"dg", "standard reaction Gibbs energy ΔrG°"},
    {"logk", "equilibrium constant log10 K"},
    {"tad", "adiabatic outlet temperature"},
    {"hv", "heating value of a fuel"},
};

const Command* find_command(std::string_view name) {
    for (const auto& c : commands)
        if (name == c.name) return &c;
    return nullptr;
}

std::string usage_line(const Command& c) { return std::string("usage: rxnheat ") + c.name + " " + c.arguments; }

std::string command_help(const Command& c) {
    std::string out = usage_line(c) + "\n\n" + c.summary + ".\n\n";
    for (const char* p = c.details; *p; ++p) {
        if (*p == '%' && p[1]) {
            ++p;
            if (*p == 'T') out += temperature_help;
            else if (*p == 't') out += table_help;
            else if (*p == 'c') out += caution;
            continue;
        }
        out.push_back(*p);
    }
    // The help option goes at the end of the options block.
    const std::string help_line = "  -h, --help              this help\n";
    const auto opts = out.find("Options:\n");
    const auto block_end = opts == std::string::npos ? std::string::npos : out.find("\n\n", opts);
    if (block_end == std::string::npos)
        out += help_line;
    else
        out.insert(block_end + 1, help_line);
    out += "\nExit status: 0 success; 2 bad input (message on standard error, or {\"error\": ...}\n"
           "on standard output with --json); 1 internal failure.\n";
    return out;
}

std::string global_help() {
    std::string out =
        "rxnheat: standard reaction enthalpies from reaction text, on the rxnheat engine.\n"
        "\n"
        "usage: rxnheat COMMAND ARGUMENTS [OPTIONS]\n"
        "       rxnheat help [COMMAND]    rxnheat COMMAND --help    rxnheat --version\n"
        "\n"
        "Commands:\n";
    for (const auto& c : commands) {
        char buf[64];
        std::snprintf(buf, sizeof buf, "  %-9s", c.name);
        out += buf;
        out += c.summary;
        out += "\n";
    }
    out +=
        "\n"
        "Not in this version (planned for a later one; naming one is an error, exit status 2):\n";
    for (const auto& m : missing_commands) {
        char buf[64];
        std::snprintf(buf, sizeof buf, "  %-9s", m.name);
        out += buf;
        out += m.what;
        out += "\n";
    }
    out +=
        "\n"
        "Options (each command's help lists those it takes):\n"
        "  -T, --temperature TEMP  kelvin, or text with a unit: \"350 C\", \"662 F\", \"1100 R\",\n"
        "                          \"623.15 K\" (default 298.15 K)\n"
        "  -u, --unit UNIT         unit of the result (e.g. kJ/mol, kcal/mol, MJ/kg with --per)\n"
        "  --per SPECIES           dh, du: per mole or per mass unit of one species\n"
        "  --tolerance KJ          kind: thermoneutral band, kJ/mol (default 0.1)\n"
        "  --table FILE.csv        a user species table over the built-in data\n"
        "  --threads N             batch: rows computed in parallel (default 1; 0 = one per CPU)\n"
        "  --json                  exactly one JSON object on standard output: the results, or\n"
        "                          {\"error\": \"...\", \"error_kind\": \"...\"}\n"
        "  -h, --help              help\n"
        "  --                      everything after it is an argument, not an option\n"
        "Options may come before or after the arguments; --name=value also works.\n"
        "\n"
        "Reactions are written as chemists write them, in quotes:\n"
        "  \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\", \"1/2 N2(g) + 3/2 H2(g) → NH3(g)\"\n"
        "\n"
        "Numbers: text output shows 6 significant digits (whole numbers from 10^6 to 10^15 are\n"
        "written out); --json and batch CSV show every digit needed to read back the same double.\n"
        "\n"
        "Exit status: 0 success; 2 bad input (message on standard error, or the JSON error object\n"
        "on standard output with --json); 1 internal failure.\n"
        "\n";
    out += caution;
    return out;
}

// ---- argument parsing --------------------------------------------------------------------------

const Missing* find_missing(std::string_view name) {
    for (const auto& m : missing_commands)
        if (name == m.name) return &m;
    return nullptr;
}

[[noreturn]] void missing_error(const Missing& m) {
    throw UsageError(std::string("'") + m.name + "' (" + m.what +
                     ") is not available in this version of rxnheat; it is planned for a later version");
}

/// Parses the words after the command name into `a`, against the command's options.
void parse_arguments(const Command& cmd, const std::vector<std::string>& words, Args& a) {
    bool options_done = false;
    auto take_value = [&](Option id, std::optional<std::string> inline_value, std::size_t& i,
                          const std::string& as_written) {
        if (!(cmd.options & id))
            throw UsageError(std::string("the command '") + cmd.name + "' takes no " + as_written + " option");
        std::string value;
        if (inline_value) {
            value = *inline_value;
        } else {
            // The next word is the value, unless it looks like another option: a value may start
            // with '-' only before a digit or a point ("-T '-10 C'").
            const bool next_is_option = i + 1 < words.size() && words[i + 1].size() > 1 && words[i + 1][0] == '-' &&
                                        !(std::isdigit(static_cast<unsigned char>(words[i + 1][1])) || words[i + 1][1] == '.');
            if (i + 1 >= words.size() || next_is_option)
                throw UsageError("the option " + as_written + " needs a value" +
                                 (next_is_option ? " (found the option '" + words[i + 1] + "' instead)" : std::string()));
            value = words[++i];
        }
        if (trimmed(value).empty()) throw UsageError("the option " + as_written + " needs a value, not an empty one");
        if (id == opt_extra) {
            a.extra.push_back(value);
        } else {
            if (a.given & id) throw UsageError("the option " + option_display(id) + " is given twice");
            *a.slot(id) = value;
        }
        a.given |= id;
    };

    for (std::size_t i = 0; i < words.size(); ++i) {
        const std::string& w = words[i];
        if (options_done || w == "-" || w.size() < 2 || w[0] != '-' || is_number(w)) {
            a.positional.push_back(w);
            continue;
        }
        if (w == "--") {
            options_done = true;
            continue;
        }
        if (w[1] == '-') {  // --name or --name=value
            const auto eq = w.find('=');
            const std::string name = w.substr(2, eq == std::string::npos ? std::string::npos : eq - 2);
            std::optional<std::string> inline_value;
            if (eq != std::string::npos) inline_value = w.substr(eq + 1);
            if (name == "json" || name == "help") {
                if (inline_value) throw UsageError("the option --" + name + " takes no value");
                (name == "json" ? a.json : a.help) = true;
                continue;
            }
            const OptionSpec* spec = nullptr;
            for (const auto& s : option_specs)
                if (name == s.long_name) spec = &s;
            if (!spec) throw UsageError("unknown option '" + w + "'");
            take_value(spec->id, inline_value, i, "--" + name);
            continue;
        }
        // -X or -Xvalue
        const char letter = w[1];
        if (letter == 'h' && w.size() == 2) {
            a.help = true;
            continue;
        }
        const OptionSpec* spec = nullptr;
        for (const auto& s : option_specs)
            if (s.short_name && s.short_name == letter) spec = &s;
        if (!spec) throw UsageError("unknown option '" + w + "'");
        std::optional<std::string> inline_value;
        if (w.size() > 2) inline_value = w.substr(w[2] == '=' ? 3 : 2);  // -T300 or -T=300
        take_value(spec->id, inline_value, i, std::string("-") + letter);
    }
    if (a.help) return;
    const auto n = a.positional.size();
    if (n < cmd.min_args) {
        // Name the missing ones from the usage text ("REACTION QUANTITY QUANTITY_UNIT KEY ...").
        std::vector<std::string> names;
        std::string word;
        for (const char* p = cmd.arguments; *p && *p != '['; ++p) {
            if (*p == ' ') {
                if (!word.empty()) names.push_back(word);
                word.clear();
            } else {
                word.push_back(*p);
            }
        }
        if (!word.empty()) names.push_back(word);
        std::string missing;
        for (std::size_t k = n; k < cmd.min_args && k < names.size(); ++k) missing += (missing.empty() ? "" : " ") + names[k];
        throw UsageError("missing " + missing);
    }
    if (n > cmd.max_args)
        throw UsageError("unexpected argument '" + a.positional[cmd.max_args] +
                         "' (put each argument that contains spaces in quotes: a reaction, or a temperature "
                         "such as -T \"350 C\")");
}

int run(const std::vector<std::string>& argv, bool json, const Command*& cmd) {
    std::size_t first = 0;
    while (first < argv.size() && argv[first] == "--json") ++first;
    if (first >= argv.size()) throw UsageError("no command given");
    const std::string& name = argv[first];

    if (name == "--help" || name == "-h" || name == "help") {
        if (name == "help" && first + 1 < argv.size() && argv[first + 1] != "--json") {
            const std::string& topic = argv[first + 1];
            if (const Missing* m = find_missing(topic)) missing_error(*m);
            cmd = find_command(topic);
            if (!cmd) throw UsageError("unknown command '" + topic + "'");
            const std::string text = command_help(*cmd);
            write_out(json ? JsonObject().str("help", text).text() + "\n" : text);
            return exit_ok;
        }
        const std::string text = global_help();
        write_out(json ? JsonObject().str("help", text).text() + "\n" : text);
        return exit_ok;
    }
    if (name == "--version") {
        const std::string v = rxnheat::Engine::version();
        write_out(json ? JsonObject().str("version", v).text() + "\n" : v + "\n");
        return exit_ok;
    }
    if (const Missing* m = find_missing(name)) missing_error(*m);
    cmd = find_command(name);
    if (!cmd) {
        if (!name.empty() && name[0] == '-') throw UsageError("unknown option '" + name + "' (give the command first)");
        throw UsageError("unknown command '" + name + "'");
    }

    Args a;
    a.command = name;
    parse_arguments(*cmd, std::vector<std::string>(argv.begin() + static_cast<std::ptrdiff_t>(first) + 1, argv.end()), a);
    a.json = json;
    if (a.help) {
        const std::string text = command_help(*cmd);
        write_out(json ? JsonObject().str("help", text).text() + "\n" : text);
        return exit_ok;
    }

    Context c{a, rxnheat::Engine::shared(), std::nullopt, nullptr, rxnheat::T_ref};
    if (a.temperature) c.T = rxnheat::parse_temperature(*a.temperature);
    if (a.table) {
        c.table_storage = rxnheat::SpeciesTable::from_csv_file(*a.table);
        c.table = &*c.table_storage;
    }
    return cmd->run(c);
}

/// Writes an error the way the mode asks: JSON object on stdout, or words on stderr.
void report_error(bool json, const Command* cmd, const std::string& message, const char* kind, bool with_usage) {
    if (json) {
        JsonObject j;
        j.str("error", message).str("error_kind", kind);
        if (with_usage && cmd) j.str("usage", usage_line(*cmd));
        if (g_json_batch_open) {
            // The batch object is already open: close it with the error instead of a second object.
            write_out("],\"error\":" + json_string(message) + ",\"error_kind\":" + json_string(kind) + "}\n");
            g_json_batch_open = false;
        } else {
            write_out(j.text() + "\n");
        }
        return;
    }
    std::string prefix = cmd ? std::string("rxnheat ") + cmd->name + ": " : std::string("rxnheat: ");
    std::string text = prefix + message + "\n";
    if (with_usage) {
        if (cmd)
            text += usage_line(*cmd) + "\nrun 'rxnheat " + cmd->name + " --help' for more\n";
        else
            text += "usage: rxnheat COMMAND ARGUMENTS [OPTIONS]\nrun 'rxnheat --help' for the commands\n";
    }
    write_err(text);
}

}  // namespace

int main(int argc, char** argv) {
    std::vector<std::string> words;
    bool json = false;
    try {
        for (int i = 1; i < argc; ++i) words.emplace_back(argv[i]);
        for (const auto& w : words) {
            if (w == "--") break;
            if (w == "--json") json = true;
        }
    } catch (...) {
        write_err("rxnheat: out of memory reading the arguments\n");
        return exit_internal;
    }

    const Command* cmd = nullptr;
    int status = exit_internal;
    try {
        status = run(words, json, cmd);
    } catch (const UsageError& e) {
        report_error(json, cmd, e.what(), "usage", true);
        status = exit_bad_input;
    } catch (const rxnheat::Error& e) {
        const bool internal = e.kind() == rxnheat::ErrorKind::internal;
        report_error(json, cmd, internal ? std::string("internal error: ") + e.what() : std::string(e.what()),
                     kind_name(e.kind()), false);
        status = internal ? exit_internal : exit_bad_input;
    } catch (const std::bad_alloc&) {
        report_error(json, cmd, "internal error: out of memory", "internal", false);
        status = exit_internal;
    } catch (const std::exception& e) {
        report_error(json, cmd, std::string("internal error: ") + e.what(), "internal", false);
        status = exit_internal;
    } catch (...) {
        report_error(json, cmd, "internal error: unknown exception", "internal", false);
        status = exit_internal;
    }
    if (std::fflush(stdout) != 0 || std::ferror(stdout)) {
        write_err("rxnheat: cannot write to standard output\n");
        return exit_internal;
    }
    return status;
}
