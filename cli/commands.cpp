// Running the commands (see commands.hpp). A catalogue command hands its words to
// rxnheat::evaluate as text cells (HostRules: text_numbers, "command line") and its --table file
// as a table; the number or text that comes back is shown by the command's presenter. The
// presenters of the commands that have always added fields of their own (dh's kind and sources,
// load's quantity, ...) are keyed by command name; every other function gets the generic one.
#include "commands.hpp"

#include "batch.hpp"

#include "rxnheat/catalogue.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <memory>
#include <string>
#include <vector>

namespace rxnheat::cli {

namespace {

const HostRules command_line_rules{false, true, "command line"};

/// One catalogue function called from the command line.
struct Call {
    const CommandDef& cmd;
    const FunctionSpec& f;
    const Parsed& p;
    Engine& engine;
    Output& out;
    std::vector<Arg> args;                      ///< one per catalogue argument (the rest spread out)
    std::shared_ptr<const SpeciesTable> table;  ///< --table, loaded
    Outcome result;

    /// The word given for the catalogue argument `name`, trimmed; "" when not given.
    std::string given(const char* name) const {
        for (std::size_t k = 0; k < cmd.positionals.size() && k < p.positionals.size(); ++k)
            if (std::string_view(f.args[cmd.positionals[k].arg_index].name) == name) return std::string(trim(p.positionals[k]));
        for (const auto& o : cmd.options)
            if (std::string_view(f.args[o.arg_index].name) == name && p.has(o.long_name))
                return std::string(trim(p.value_or(o.long_name, "")));
        return {};
    }
    const std::string& positional(std::size_t k) const { return p.positionals.at(k); }
    double temperature_K() const {
        const std::string t = given("temperature");
        return t.empty() ? T_ref : parse_temperature(t);
    }
    Conditions at() const { return {temperature_K(), table.get()}; }
};

std::shared_ptr<const SpeciesTable> load_table(const std::string& path) {
    return std::make_shared<const SpeciesTable>(SpeciesTable::from_csv_file(path));
}

/// The catalogue names an argument in its messages ("'quantity' must be a number"); the command
/// line names it as the user wrote it: QUANTITY, --tolerance.
std::string in_command_line_words(const CommandDef& cmd, const Outcome& o) {
    if (o.argument == 0 || !cmd.function) return o.text;
    const std::size_t index = o.argument - 1;
    if (index >= cmd.function->args.size()) return o.text;
    const std::string quoted = std::string("'") + cmd.function->args[index].name + "'";
    if (o.text.rfind(quoted, 0) != 0) return o.text;
    std::string name;
    for (const auto& p : cmd.positionals)
        if (p.arg_index == index) name = p.placeholder;
    for (const auto& opt : cmd.options)
        if (opt.arg_index == index) name = opt.display();
    return name.empty() ? o.text : name + o.text.substr(quoted.size());
}

std::string sources_json(const std::vector<SourceLine>& sources) {
    std::string s = "[";
    for (std::size_t i = 0; i < sources.size(); ++i) {
        if (i) s += ",";
        s += JsonObject().str("species", sources[i].species).str("record", sources[i].record).str("text", sources[i].text).text();
    }
    return s + "]";
}

// ---- presenters of the commands with fields of their own -----------------------------------

int present_dh_du(Call& c, bool is_du) {
    const std::string& reaction = c.positional(0);
    const double value = c.result.number;
    const std::string& unit = c.result.unit;
    const std::string per = c.given("per");
    const ReactionReport rep = c.engine.report(reaction, c.at());

    std::string plain = plain_number(value) + " " + unit;
    if (!per.empty()) plain += " of " + per;
    if (!is_du) plain += " (" + std::string(to_string(rep.kind)) + ")";

    JsonObject j;
    j.num("value", value).str("unit", unit);
    if (!per.empty()) j.str("per", per);
    if (!is_du) j.str("kind", to_string(rep.kind));
    j.num("temperature_K", rep.temperature_K).str("reaction", rep.canonical);
    if (is_du) j.num("dn_gas", rep.dn_gas).num("dH_kJ_per_mol", rep.dH_kJ_per_mol);
    j.raw("sources", sources_json(rep.sources));
    c.out.result(plain, j);
    return exit_ok;
}
int present_dh(Call& c) { return present_dh_du(c, false); }
int present_du(Call& c) { return present_dh_du(c, true); }

int present_load(Call& c) {
    const std::string& reaction = c.positional(0);
    const double quantity = std::strtod(c.given("quantity").c_str(), nullptr);  // read by evaluate already
    const ReactionReport rep = c.engine.report(reaction, c.at());
    const std::string& unit = c.result.unit;
    const std::string plain = plain_number(c.result.number) + " " + unit + " (" + to_string(rep.kind) + ")";
    JsonObject j;
    j.num("value", c.result.number)
        .str("unit", unit)
        .str("kind", to_string(rep.kind))
        .num("quantity", quantity)
        .str("quantity_unit", c.positional(2))
        .str("key", c.positional(3))
        .num("temperature_K", rep.temperature_K)
        .str("reaction", rep.canonical)
        .num("dH_kJ_per_mol", rep.dH_kJ_per_mol)
        .raw("sources", sources_json(rep.sources));
    c.out.result(plain, j);
    return exit_ok;
}

int present_kind(Call& c) {
    const std::string t = c.given("tolerance");
    const double tolerance = t.empty() ? default_tolerance_kJ_per_mol : std::strtod(t.c_str(), nullptr);
    const ReactionReport rep = c.engine.report(c.positional(0), c.at());
    JsonObject j;
    j.str("kind", c.result.text)
        .num("dH_kJ_per_mol", rep.dH_kJ_per_mol)
        .num("tolerance_kJ_per_mol", tolerance)
        .num("temperature_K", rep.temperature_K)
        .str("reaction", rep.canonical);
    c.out.result(c.result.text, j);
    return exit_ok;
}

int present_check(Call& c) {
    const std::string& verdict = c.result.text;
    const bool ok = verdict == "ok";
    JsonObject j;
    j.boolean("ok", ok).str("check", verdict);
    if (!ok) j.str("error", verdict);
    j.num("temperature_K", c.temperature_K()).str("input", c.positional(0));
    c.out.result(verdict, j);
    return ok ? exit_ok : exit_bad_input;
}

int present_reaction_text(Call& c) {
    JsonObject j;
    j.str("reaction", c.result.text).str("input", c.positional(0));
    if (c.cmd.name == "scale") j.str("factor", c.positional(1));
    c.out.result(c.result.text, j);
    return exit_ok;
}

// ---- the generic presenter ---------------------------------------------------------------------

/// {"name": word, ...} of the arguments given, by catalogue name; the rest as an array.
std::string input_json(const Call& c) {
    JsonObject j;
    for (std::size_t k = 0; k < c.cmd.positionals.size() && k < c.p.positionals.size(); ++k) {
        const PositionalDef& pd = c.cmd.positionals[k];
        const char* name = c.f.args[pd.arg_index].name;
        if (pd.variadic) {
            std::string list = "[";
            for (std::size_t m = k; m < c.p.positionals.size(); ++m)
                list += (m > k ? "," : "") + json_string(c.p.positionals[m]);
            j.raw(name, list + "]");
            break;
        }
        j.str(name, c.p.positionals[k]);
    }
    for (const auto& o : c.cmd.options) {
        if (!c.p.has(o.long_name)) continue;
        if (o.repeatable) {
            std::string list = "[";
            for (const auto& w : c.p.repeated.at(o.long_name)) list += (list.size() > 1 ? "," : "") + json_string(w);
            j.raw(std::string(c.f.args[o.arg_index].name) + "_options", list + "]");
            continue;
        }
        j.str(c.f.args[o.arg_index].name, c.p.value_or(o.long_name, ""));
    }
    return j.text();
}

/// Whether the function takes a temperature and this call has one: given, or its default (an
/// optional temperature without a default, STEAMH's, is not reported when not given).
bool has_temperature(const Call& c) {
    for (const auto& a : c.f.args)
        if (std::string_view(a.name) == "temperature") return *a.default_text || !c.given("temperature").empty();
    return false;
}

int present_generic(Call& c) {
    JsonObject j;
    std::string plain;
    int status = exit_ok;
    if (c.result.kind == Outcome::Kind::number) {
        plain = plain_number(c.result.number);
        if (!c.result.unit.empty()) plain += " " + c.result.unit;
        j.num("value", c.result.number).str("unit", c.result.unit);
    } else {
        plain = c.result.text;
        if (c.f.errors_as_text) {
            // RXNWHY: the answer is "ok" or the reason; the exit status says which.
            const bool ok = plain == "ok";
            j.boolean("ok", ok);
            if (!ok) status = exit_bad_input;
        }
        j.str("result", plain);
    }
    j.str("function", c.f.calc_name);
    if (has_temperature(c)) j.num("temperature_K", c.temperature_K());
    j.raw("input", input_json(c));
    c.out.result(plain, j);
    return status;
}

// ---- the presenters and help texts, by command ---------------------------------------------------

struct CommandEntry {
    const char* name;
    int (*present)(Call&);  ///< nullptr: the generic presenter (or a command of the command line only)
    CommandText text;
};

const char* const generic_number_json =
    "{\"value\", \"unit\", \"function\" (its cell name), [\"temperature_K\"], \"input\": {each "
    "argument given, by its cell name: the text as given}}";
const char* const generic_text_json =
    "{\"result\": the text, \"function\" (its cell name), [\"temperature_K\"], \"input\": {each argument "
    "given, by its cell name: the text as given}}";

const CommandEntry entries[] = {
    {"dh", present_dh,
     {"",
      "{\"value\", \"unit\", [\"per\"], \"kind\", \"temperature_K\", \"reaction\" (canonical text), "
      "\"sources\": [{\"species\", \"record\", \"text\"}]}",
      "rxnheat dh \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\"\n"
      "rxnheat dh \"CO(g) + H2O(g) -> CO2(g) + H2(g)\" -T \"450 C\"\n"
      "rxnheat dh \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\" -u MJ/kg --per \"CH4(g)\"\n"}},
    {"du", present_du,
     {"",
      "{\"value\", \"unit\", [\"per\"], \"temperature_K\", \"reaction\", \"dn_gas\", \"dH_kJ_per_mol\", "
      "\"sources\"}",
      "rxnheat du \"C7H16(l) + 11 O2(g) -> 7 CO2(g) + 8 H2O(l)\" -u kJ/kg --per \"C7H16(l)\"\n"}},
    {"ds", nullptr, {"", nullptr, "rxnheat ds \"N2(g) + 3 H2(g) -> 2 NH3(g)\" -T 700 -u \"cal/(mol*K)\"\n"}},
    {"dg", nullptr, {"", nullptr, "rxnheat dg \"CO(g) + H2O(g) -> CO2(g) + H2(g)\" -T \"800 C\"\n"}},
    {"logk", nullptr, {"", nullptr, "rxnheat logk \"N2(g) + 3 H2(g) -> 2 NH3(g)\" -T 700\n"}},
    {"load", present_load,
     {"",
      "{\"value\", \"unit\", \"kind\", \"quantity\", \"quantity_unit\", \"key\", \"temperature_K\", "
      "\"reaction\", \"dH_kJ_per_mol\", \"sources\"}",
      "rxnheat load \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)\" 120 kg/h \"CH4(g)\" -u MW\n"}},
    {"kind", present_kind,
     {"", "{\"kind\", \"dH_kJ_per_mol\", \"tolerance_kJ_per_mol\", \"temperature_K\", \"reaction\"}",
      "rxnheat kind \"CO(g) + H2O(g) -> CO2(g) + H2(g)\" --tolerance 50\n"}},
    {"check", present_check,
     {"Prints \"ok\" and exits 0 when the reaction can be evaluated; otherwise prints the first problem in "
      "words on standard output and exits 2.",
      "{\"ok\": true|false, \"check\": \"ok\" or the problem, \"error\": the problem (only when not ok), "
      "\"temperature_K\", \"input\"}",
      "rxnheat check \"H2(g) + O2(g) -> H2O(l)\"\n"}},
    {"balance", present_reaction_text,
     {"", "{\"reaction\": the balanced text, \"input\"}", "rxnheat balance \"C3H8(g) + O2(g) -> CO2(g) + H2O(l)\"\n"}},
    {"reverse", present_reaction_text, {"", "{\"reaction\": the reversed text, \"input\"}", ""}},
    {"scale", present_reaction_text,
     {"", "{\"reaction\": the scaled text, \"input\", \"factor\"}", "rxnheat scale \"2 H2(g) + O2(g) -> 2 H2O(l)\" 1/2\n"}},
    {"why", nullptr,
     {"Give the function by its cell name (RXNLOAD) or its command (load), then its arguments as positionals "
      "in the function's cell order, optional ones included (\"\" leaves one out); a table argument is the "
      "name of a CSV file. Prints ok and exits 0, or prints the reason and exits 2.",
      "{\"ok\": true|false, \"result\": \"ok\" or the reason, \"function\": \"RXNWHY\", \"input\": "
      "{\"function\", \"arguments\": [...]}}",
      "rxnheat why RXNLOAD \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\" 500 kg/hr CH4 kW\n"}},
    {"hv", nullptr,
     {"Give one species, or the fuel's composition as SPECIES=FRACTION words (mole fractions summing to 1, or "
      "mol % summing to 100, within 0.5 %).",
      nullptr,
      "rxnheat hv \"CH4(g)\"\n"
      "rxnheat hv CH4=0.95 C2H6=0.03 N2=0.02 -u MJ/Sm3 --basis LHV\n"}},
    {"molarmass", nullptr, {"", nullptr, "rxnheat molarmass \"CuSO4·5H2O\"\n"}},
    {"cp", nullptr, {"", nullptr, "rxnheat cp \"CO2(g)\" \"500 C\"\n"}},
    {"sensible", nullptr, {"", nullptr, "rxnheat sensible \"N2(g)\" 1000 --tref \"25 C\"\n"}},
    {"steam tsat", nullptr, {"", nullptr, "rxnheat steam tsat \"10 bar\"\nrxnheat steam tsat \"150 psig\"\n"}},
    {"steam psat", nullptr, {"", nullptr, "rxnheat steam psat \"250 C\"\n"}},
    {"steam h", nullptr,
     {"", nullptr,
      "rxnheat steam h \"40 bar\" -T \"400 C\"\nrxnheat steam h \"10 bar\" --state vapour\n"
      "rxnheat steam h \"10 bar\" --state liquid --json\n"}},
    {"steam latent", nullptr, {"", nullptr, "rxnheat steam latent \"10 bar\"\n"}},
    {"species", nullptr,
     {"Prints a card for one species (a formula with its phase, or a name such as ethanol), under four "
      "headings: Species (as resolved, and its molar mass); At 298.15 K (ΔfH°); At T (Cp°, the sensible heat "
      "H°(T) − H°(298.15 K), the assigned enthalpy H°(T) and S°); Source record (the data record's name, its "
      "temperature range and the citation). For a record that gives no heat capacity (only ΔfH° at 298.15 K, "
      "or only the enthalpy at one other temperature) it prints what the record gives and says that the rest "
      "is missing; the exit status is 0.",
      "{\"species\", \"record\", \"temperature_K\", \"dHf_kJ_per_mol\", \"Cp_J_per_molK\", "
      "\"dH_sensible_kJ_per_mol\", \"H_kJ_per_mol\", \"S_J_per_molK\", \"molar_mass_g_per_mol\", \"tmin_K\", "
      "\"tmax_K\", \"source\"}; null for what the data do not give (Cp, S and the enthalpies of a record "
      "without heat capacity; tmin_K and tmax_K of such a record or of a user-table row without a range)",
      "rxnheat species \"Fe(s)\" -T 1300\n"
      "rxnheat species \"CH3NO2(l)\" --json\n"}},
    {"batch", nullptr, {batch_details, batch_json_fields, "rxnheat batch feeds.csv --threads 2 > heats.csv\n"}},
    {"functions", nullptr,
     {"Lists every function of the catalogue, in the order of the specification: its cell name, its command "
      "(- when the command line does not have it), its summary and the layers that have it (calc: the Calc "
      "add-in, cli: this command line, c: the C interface).",
      "{\"functions\": [{\"calc_name\", \"cli_command\" (null when none), \"idl_method\", \"summary\", "
      "\"layers\": [\"calc\", \"cli\", \"c\"], \"arguments\": [{\"name\", \"kind\", \"required\", \"default\" "
      "(null when none), \"option\" (the command's option for it, e.g. \"--temperature\"; null for a "
      "positional), \"repeated\" (the option is given once per item)}]}]}",
      "rxnheat functions --json\n"}},
};

const CommandEntry* entry(const std::string& name) {
    for (const auto& e : entries)
        if (name == e.name) return &e;
    return nullptr;
}

// ---- catalogue commands ---------------------------------------------------------------------------

/// why: the target function's arguments as positionals in its cell order; a table argument is a file.
std::vector<Arg> why_arguments(const Parsed& p, std::string& failure) {
    std::vector<Arg> args;
    args.push_back(Arg::of(p.positionals.at(0)));
    const FunctionSpec* target = find_function(p.positionals[0]);
    for (std::size_t k = 1; k < p.positionals.size(); ++k) {
        const std::string& w = p.positionals[k];
        const std::size_t index = k - 1;
        const bool is_table = target && index < target->args.size() && target->args[index].kind == ArgKind::table;
        if (is_table && !trim(w).empty()) {
            try {
                args.push_back(Arg::of(load_table(w)));
            } catch (const Error& e) {
                failure = std::string("'") + target->args[index].name + "': " + e.what();
                args.push_back(Arg::omitted());
            }
            continue;
        }
        args.push_back(Arg::of(w));
    }
    return args;
}

/// A feed from SPECIES=MOL words: the positionals from `first` on, then every --feed, as the
/// two-column range (species, amount) the catalogue reads.
Arg feed_argument(const CommandDef& cmd, const Parsed& p, std::size_t first) {
    std::vector<std::string> words(p.positionals.begin() + static_cast<std::ptrdiff_t>(std::min(first, p.positionals.size())),
                                   p.positionals.end());
    for (const auto& o : cmd.options)
        if (o.repeatable && cmd.function->args[o.arg_index].kind == ArgKind::feed &&
            p.repeated.count(o.long_name))
            for (const auto& w : p.repeated.at(o.long_name)) words.push_back(w);
    std::vector<Cell> cells;
    for (const auto& w : words) {
        const auto eq = w.rfind('=');
        if (eq == std::string::npos || trim(std::string_view(w).substr(0, eq)).empty() ||
            trim(std::string_view(w).substr(eq + 1)).empty())
            throw UsageError("a feed item is SPECIES=MOL, e.g. N2=1, not '" + w + "'");
        cells.push_back(Cell::of(w.substr(0, eq)));
        cells.push_back(Cell::of(w.substr(eq + 1)));
    }
    if (cells.empty()) return Arg::omitted();  // "--feed is required"
    const std::size_t rows = cells.size() / 2;
    return Arg::range(rows, 2, std::move(cells));
}

int run_function(const CommandDef& cmd, const Parsed& p, Output& out, Engine& engine) {
    const FunctionSpec& f = *cmd.function;
    Call c{cmd, f, p, engine, out, {}, {}, {}};
    std::string failure;
    if (f.variadic()) {
        c.args = why_arguments(p, failure);
    } else {
        c.args.assign(f.args.size(), Arg::omitted());
        for (std::size_t k = 0; k < cmd.positionals.size() && k < p.positionals.size(); ++k) {
            if (f.args[cmd.positionals[k].arg_index].kind == ArgKind::feed) {
                c.args[cmd.positionals[k].arg_index] = feed_argument(cmd, p, k);
                break;
            }
            // A fuel: one word without '=' is a species; otherwise SPECIES=FRACTION words, read as a feed.
            if (f.args[cmd.positionals[k].arg_index].kind == ArgKind::fuel) {
                const bool species = p.positionals.size() == k + 1 && p.positionals[k].find('=') == std::string::npos;
                for (std::size_t m = k; !species && m < p.positionals.size(); ++m)
                    if (p.positionals[m].find('=') == std::string::npos)
                        throw UsageError("a fuel is one species, or SPECIES=FRACTION words such as CH4=0.95 N2=0.05, "
                                         "not '" + p.positionals[m] + "' among them");
                c.args[cmd.positionals[k].arg_index] = species ? Arg::of(p.positionals[k]) : feed_argument(cmd, p, k);
                break;
            }
            c.args[cmd.positionals[k].arg_index] = Arg::of(p.positionals[k]);
        }
        for (const auto& o : cmd.options) {
            if (!p.has(o.long_name)) continue;
            if (f.args[o.arg_index].kind == ArgKind::feed) {
                if (c.args[o.arg_index].kind == Arg::Kind::omitted) c.args[o.arg_index] = feed_argument(cmd, p, p.positionals.size());
                continue;
            }
            if (is_list(f.args[o.arg_index].kind)) {  // a column of the values, in the order given
                std::vector<Cell> cells;
                for (const auto& w : p.repeated.at(o.long_name)) cells.push_back(Cell::of(w));
                const std::size_t n = cells.size();
                c.args[o.arg_index] = Arg::range(n, 1, std::move(cells));
                continue;
            }
            const std::string value = p.value_or(o.long_name, "");
            if (f.args[o.arg_index].kind == ArgKind::table) {
                c.table = load_table(value);
                c.args[o.arg_index] = Arg::of(c.table);
            } else {
                c.args[o.arg_index] = Arg::of(value);
            }
        }
    }
    if (!failure.empty()) {
        c.result = Outcome::of_text(failure);  // why: the table file is the reason
    } else {
        const Result r = evaluate(f, c.args, command_line_rules, engine);
        c.result = r.single();
    }
    if (c.result.kind == Outcome::Kind::error) throw Error(c.result.error, in_command_line_words(cmd, c.result));
    const CommandEntry* e = entry(cmd.name);
    return e && e->present ? e->present(c) : present_generic(c);
}

// ---- commands of the command line only -----------------------------------------------------------

/// The species command's text: our own card, grouped under headings, one "label  value" line
/// each, the values in one column (labels are padded by characters, not bytes: ΔfH° is UTF-8).
class Card {
public:
    void heading(const std::string& title) {
        if (!text_.empty()) text_ += "\n";
        text_ += title + "\n";
    }
    void line(const std::string& label, const std::string& value) {
        std::size_t chars = 0;
        for (unsigned char c : label) chars += (c & 0xC0) != 0x80;
        text_ += "  " + label + std::string(chars < label_chars ? label_chars - chars : 1, ' ') + value + "\n";
    }
    void note(const std::string& words) { text_ += "  " + words + "\n"; }
    std::string text() const { return text_.substr(0, text_.size() - 1); }  // Output adds the line feed

private:
    static constexpr std::size_t label_chars = 24;
    std::string text_;
};

int run_species(const Parsed& p, Output& out, Engine& engine) {
    const double T = p.has("temperature") ? parse_temperature(p.value_or("temperature", "")) : T_ref;
    std::shared_ptr<const SpeciesTable> table;
    if (p.has("table")) table = load_table(p.value_or("table", ""));
    const SpeciesReport r = engine.species_report(p.positionals.at(0), {T, table.get()});
    const bool has_range = r.tmax_K > 0;
    const std::string at_T = plain_number(r.temperature_K) + " K";
    // A record without heat capacity covers one temperature only, so r.temperature_K is that
    // temperature. At 298.15 K its value is ΔfH°; at any other temperature (NASA Glenn gives
    // liquefied gases at their boiling points) it is the assigned enthalpy H°(T) there, and the
    // record says nothing about ΔfH° at 298.15 K.
    const bool value_is_dHf = r.has_heat_capacity || std::fabs(r.temperature_K - T_ref) < 0.005;

    Card card;
    card.heading("Species");
    card.line("species", r.species);
    card.line("molar mass", plain_number(r.molar_mass_g_per_mol) + " g/mol");
    if (value_is_dHf) {
        card.heading("At 298.15 K");
        card.line("ΔfH°", plain_number(r.dHf_kJ_per_mol) + " kJ/mol");
    }
    card.heading("At T = " + at_T);
    if (r.has_heat_capacity) {
        card.line("Cp°", plain_number(r.Cp_J_per_molK) + " J/(mol K)");
        card.line("H°(T) − H°(298.15 K)", plain_number(r.dH_sensible_kJ_per_mol) + " kJ/mol");
        card.line("H°(T)", plain_number(r.H_kJ_per_mol) + " kJ/mol (assigned enthalpy: ΔfH° + H°(T) − H°(298.15 K))");
        card.line("S°", plain_number(r.S_J_per_molK) + " J/(mol K)");
    } else if (value_is_dHf) {
        card.note("The data give no heat capacity for " + r.species + ", only ΔfH° at 298.15 K:");
        card.note("no Cp°, H°(T) − H°(298.15 K), H°(T) or S° can be given.");
    } else {
        card.line("H°(T)", plain_number(r.dHf_kJ_per_mol) + " kJ/mol (assigned enthalpy, as the record gives it)");
        card.note("The data give no heat capacity for " + r.species + ", only this enthalpy at " + at_T + ":");
        card.note("no ΔfH° at 298.15 K, Cp°, H°(T) − H°(298.15 K) or S° can be given.");
    }
    card.heading("Source record");
    card.line("name", r.record);
    if (has_range)
        card.line("temperature range", plain_number(r.tmin_K) + " to " + plain_number(r.tmax_K) + " K");
    else if (!r.has_heat_capacity)
        card.line("temperature range", at_T + " only");
    else
        card.line("temperature range", "none given");
    card.line("citation", r.source);

    JsonObject j;
    j.str("species", r.species).str("record", r.record).num("temperature_K", r.temperature_K);
    if (value_is_dHf)
        j.num("dHf_kJ_per_mol", r.dHf_kJ_per_mol);
    else
        j.null("dHf_kJ_per_mol");
    if (r.has_heat_capacity) {
        j.num("Cp_J_per_molK", r.Cp_J_per_molK)
            .num("dH_sensible_kJ_per_mol", r.dH_sensible_kJ_per_mol)
            .num("H_kJ_per_mol", r.H_kJ_per_mol)
            .num("S_J_per_molK", r.S_J_per_molK);
    } else {
        j.null("Cp_J_per_molK").null("dH_sensible_kJ_per_mol");
        if (value_is_dHf)
            j.null("H_kJ_per_mol");
        else
            j.num("H_kJ_per_mol", r.dHf_kJ_per_mol);
        j.null("S_J_per_molK");
    }
    j.num("molar_mass_g_per_mol", r.molar_mass_g_per_mol);
    if (has_range)
        j.num("tmin_K", r.tmin_K).num("tmax_K", r.tmax_K);
    else
        j.null("tmin_K").null("tmax_K");
    j.str("source", r.source);
    out.result(card.text(), j);
    return exit_ok;
}

std::vector<std::string> layer_names(const FunctionSpec& f) {
    std::vector<std::string> names;
    if (f.in(layer_calc)) names.push_back("calc");
    if (f.in(layer_cli)) names.push_back("cli");
    if (f.in(layer_c)) names.push_back("c");
    return names;
}

int run_functions(Output& out) {
    if (!out.json()) {
        std::string text;
        char buf[96];
        std::snprintf(buf, sizeof buf, "%-12s %-12s %-11s %s\n", "function", "command", "layers", "summary");
        text += buf;
        for (const auto& f : catalogue()) {
            std::string layers;
            for (const auto& l : layer_names(f)) layers += (layers.empty() ? "" : ",") + l;
            const bool has_command = f.in(layer_cli) && f.cli_command && *f.cli_command;
            std::snprintf(buf, sizeof buf, "%-12s %-12s %-11s ", f.calc_name, has_command ? f.cli_command : "-",
                          layers.c_str());
            text += buf + std::string(f.summary) + "\n";
        }
        out.write(text);
        return exit_ok;
    }
    std::string list = "[";
    for (const auto& f : catalogue()) {
        JsonObject j;
        j.str("calc_name", f.calc_name);
        if (f.in(layer_cli) && f.cli_command && *f.cli_command)
            j.str("cli_command", f.cli_command);
        else
            j.null("cli_command");
        j.str("idl_method", f.idl_method).str("summary", f.summary);
        std::string layers = "[";
        for (const auto& l : layer_names(f)) layers += (layers.size() > 1 ? "," : "") + json_string(l);
        j.raw("layers", layers + "]");
        // How the command line takes each argument (the options its command was set up with), so
        // that another host can put the same call to this one (tests/addin/test_hostile.py).
        const CommandDef* command = nullptr;
        for (const auto& c : commands())
            if (c.function == &f) command = &c;
        std::string args = "[";
        for (std::size_t i = 0; i < f.args.size(); ++i) {
            const ArgSpec& a = f.args[i];
            JsonObject aj;
            aj.str("name", a.name).str("kind", to_string(a.kind)).boolean("required", a.required);
            if (a.default_text && *a.default_text)
                aj.str("default", a.default_text);
            else
                aj.null("default");
            const OptionDef* option = nullptr;
            for (std::size_t k = 0; command && k < command->options.size(); ++k)
                if (command->options[k].arg_index == i) option = &command->options[k];
            if (option)
                aj.str("option", "--" + option->long_name).boolean("repeated", option->repeatable);
            else
                aj.null("option").boolean("repeated", false);
            args += (args.size() > 1 ? "," : "") + aj.text();
        }
        j.raw("arguments", args + "]");
        list += (list.size() > 1 ? "," : "") + j.text();
    }
    out.write(JsonObject().raw("functions", list + "]").text() + "\n");
    return exit_ok;
}

}  // namespace

CommandText command_text(const CommandDef& cmd) {
    CommandText t;
    if (const CommandEntry* e = entry(cmd.name)) t = e->text;
    if (!t.details) t.details = "";
    if (!t.examples) t.examples = "";
    if ((!t.json_fields || !*t.json_fields) && cmd.function)
        t.json_fields = cmd.function->returns == Returns::number ? generic_number_json : generic_text_json;
    if (!t.json_fields) t.json_fields = "";
    return t;
}

int run_command(const CommandDef& cmd, const Parsed& p, Output& out, Engine& engine) {
    if (cmd.function) return run_function(cmd, p, out, engine);
    if (cmd.name == "species") return run_species(p, out, engine);
    if (cmd.name == "batch") return run_batch(p, out, engine);
    if (cmd.name == "functions") return run_functions(out);
    throw Error(ErrorKind::internal, "the command '" + cmd.name + "' has nothing to run it");
}

}  // namespace rxnheat::cli
