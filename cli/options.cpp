// The commands of the command line, set up from the catalogue, and reading their words with CLI11
// (see options.hpp).
#include "options.hpp"

#include <CLI/CLI.hpp>

#include <algorithm>
#include <cctype>
#include <cerrno>
#include <cstdlib>
#include <cstring>
#include <memory>

namespace rxnheat::cli {

std::string OptionDef::display() const {
    return short_name ? std::string("-") + short_name + "/--" + long_name : "--" + long_name;
}
std::string OptionDef::label() const {
    return (short_name ? std::string("-") + short_name + ", --" : std::string("--")) + long_name + " " + value_name;
}
std::string OptionDef::usage() const {
    return (short_name ? std::string("-") + short_name : "--" + long_name) + " " + value_name;
}

std::string Parsed::value_or(const std::string& long_name, const std::string& fallback) const {
    const auto it = values.find(long_name);
    return it == values.end() ? fallback : it->second;
}

namespace {

/// An option from its catalogue row: "-T,--temperature" -> T, temperature.
OptionDef option_from(const ArgSpec& a, std::size_t index) {
    OptionDef o;
    std::string flags = a.cli_option;
    const auto comma = flags.find(',');
    if (comma != std::string::npos) {
        if (comma == 2 && flags[0] == '-') o.short_name = flags[1];
        flags = flags.substr(comma + 1);
    }
    o.long_name = flags.rfind("--", 0) == 0 ? flags.substr(2) : flags;
    o.value_name = a.cli_value ? a.cli_value : "VALUE";
    o.help = a.help;
    o.default_text = a.default_text;
    o.arg_index = index;
    return o;
}

CommandDef command_from(const FunctionSpec& f) {
    CommandDef c;
    c.name = f.cli_command;
    c.function = &f;
    c.summary = f.summary;
    std::vector<PositionalDef> feed_words;  // after every other positional: they take the remaining words
    for (std::size_t i = 0; i < f.args.size(); ++i) {
        const ArgSpec& a = f.args[i];
        if (a.kind == ArgKind::feed) {
            // A feed is SPECIES=MOL words: the remaining positionals (a required feed only), or
            // repeated options named by the catalogue row (or both).
            std::string name = a.name;
            std::replace(name.begin(), name.end(), '_', ' ');
            // The catalogue's text describes the cell range: its words on the value are kept.
            std::string meaning = a.help;
            for (const char* cells : {"A two-column range: species, ", "Blank rows are skipped; ",
                                      "Blank rows are skipped. ", " Blank rows are skipped."})
                if (const auto at = meaning.find(cells); at != std::string::npos) {
                    meaning.erase(at, std::strlen(cells));
                    if (at < meaning.size() && at > 0)
                        meaning[at] = static_cast<char>(std::toupper(meaning[at]));
                }
            const std::string help =
                "The " + name + " as " + a.cli_value + " words, one per species, e.g. N2=1 H2=3: " + meaning;
            if (a.required) feed_words.push_back({a.cli_value, false, true, help, i});
            OptionDef o = option_from(a, i);
            o.help = "One species of the " + name + " and its amount, " + a.cli_value +
                     "; give it once per species" +
                     (a.required ? " (instead of or besides the words after the other arguments)." : ".");
            o.repeatable = true;
            c.options.push_back(o);
            continue;
        }
        if (is_list(a.kind)) {
            // A list is its option given once per item (--step R1 --step R2), required or not.
            OptionDef o = option_from(a, i);
            o.repeatable = true;
            o.required = a.required;
            c.options.push_back(o);
            continue;
        }
        // Required arguments are positionals, in cell order; optional ones are options.
        if (a.cli_option && !a.required) {
            c.options.push_back(option_from(a, i));
            continue;
        }
        PositionalDef p;
        p.placeholder = a.cli_value ? a.cli_value : a.name;
        p.required = a.required;
        p.variadic = a.kind == ArgKind::rest || a.kind == ArgKind::fuel;  // a fuel: FUEL, or SPECIES=FRACTION words
        p.help = a.help;
        p.arg_index = i;
        c.positionals.push_back(p);
    }
    c.positionals.insert(c.positionals.end(), feed_words.begin(), feed_words.end());
    return c;
}

/// The catalogue's option for an argument of some function, for the commands of the command line
/// only, so that -T and --table read and are described alike everywhere.
OptionDef catalogue_option(const char* function, const char* argument) {
    const FunctionSpec* f = find_function(function);
    for (std::size_t i = 0; f && i < f->args.size(); ++i)
        if (std::string_view(f->args[i].name) == argument && f->args[i].cli_option) return option_from(f->args[i], 0);
    throw std::logic_error(std::string("the catalogue has no option for ") + function + " " + argument);
}

std::vector<CommandDef> make_commands() {
    std::vector<CommandDef> all;
    for (const auto& f : catalogue())
        if (f.in(layer_cli) && f.cli_command && *f.cli_command) all.push_back(command_from(f));

    const OptionDef temperature = catalogue_option("RXNDH", "temperature");
    const OptionDef table = catalogue_option("RXNDH", "table");

    CommandDef species;
    species.name = "species";
    species.summary = "ΔfH°, Cp°, H°(T)−H°(298.15 K), S°, molar mass, data record and source of one species";
    species.positionals.push_back(
        {"SPECIES", true, false,
         "A species with its phase, e.g. CO2(g), H2O(l), Fe(s), or a name such as ethanol(l).", 0});
    species.options = {temperature, table};
    all.push_back(species);

    CommandDef batch;
    batch.name = "batch";
    batch.summary = "ΔrH° for every row of a CSV file (or standard input), streamed to CSV";
    batch.positionals.push_back({"FILE|-", false, false, "The CSV file to read; - or nothing: standard input.", 0});
    OptionDef batch_temperature = temperature;
    batch_temperature.help = "Temperature for rows without one: " + temperature.help.substr(temperature.help.find(':') + 2);
    OptionDef unit;
    unit.short_name = 'u';
    unit.long_name = "unit";
    unit.value_name = "UNIT";
    unit.help = "Unit for rows without one: a per-mole unit of dh (J/mol, kJ/mol, MJ/kmol, kcal/mol, cal/mol, "
                "BTU/lbmol).";
    unit.default_text = "kJ/mol";
    OptionDef threads;
    threads.long_name = "threads";
    threads.value_name = "N";
    threads.help = "Threads in all: from 2, one reads ahead while the others compute; 0: one per processor.";
    threads.default_text = "1";
    batch.options = {batch_temperature, unit, threads, table};
    all.push_back(batch);

    CommandDef functions;
    functions.name = "functions";
    functions.summary = "every function of the catalogue: its cell name, command, summary and layers";
    all.push_back(functions);
    return all;
}

bool is_number(const std::string& s) {
    if (s.empty()) return false;
    char* end = nullptr;
    errno = 0;
    std::strtod(s.c_str(), &end);
    return end == s.c_str() + s.size();
}

/// True for a word that reads as an option rather than a value: a value may start with '-' only
/// before a digit or a point ("-T '-10 C'", "-5").
bool looks_like_option(const std::string& w) {
    return w.size() > 1 && w[0] == '-' && !(std::isdigit(static_cast<unsigned char>(w[1])) || w[1] == '.');
}

const OptionDef* option_named(const CommandDef& cmd, const std::string& word) {
    for (const auto& o : cmd.options) {
        if (word == "--" + o.long_name || word.rfind("--" + o.long_name + "=", 0) == 0) return &o;
        if (o.short_name && word.size() >= 2 && word[0] == '-' && word[1] == o.short_name) return &o;
    }
    return nullptr;
}

/// Whether some command takes this option (for "the command 'reverse' takes no -T option").
bool any_command_takes(const std::string& word) {
    for (const auto& c : commands())
        if (option_named(c, word)) return true;
    return false;
}

std::string option_word(const std::string& w) {
    if (w.rfind("--", 0) == 0) return w.substr(0, w.find('='));
    return w.substr(0, 2);
}

}  // namespace

const std::vector<CommandDef>& commands() {
    static const std::vector<CommandDef> all = make_commands();
    return all;
}

const CommandDef* find_command(std::string_view name) {
    for (const auto& c : commands())
        if (name == c.name) return &c;
    return nullptr;
}

std::vector<const CommandDef*> group_members(std::string_view group) {
    std::vector<const CommandDef*> members;
    if (group.empty()) return members;
    for (const auto& c : commands())
        if (c.name.size() > group.size() && c.name.compare(0, group.size(), group) == 0 && c.name[group.size()] == ' ')
            members.push_back(&c);
    return members;
}

const CommandDef* command_named_by(const std::vector<std::string>& words, std::size_t& name_words) {
    name_words = 1;
    if (words.empty()) return nullptr;
    if (const CommandDef* c = find_command(words[0])) return c;
    if (words.size() < 2 || group_members(words[0]).empty()) return nullptr;
    name_words = 2;
    return find_command(words[0] + " " + words[1]);
}

const std::vector<PlannedCommand>& planned_commands() {
    // Named in cli/CLI.md as not in this version; each leaves this list when its function joins the catalogue.
    static const std::vector<PlannedCommand> all = [] {
        const std::vector<PlannedCommand> spec = {
            {"tad", "adiabatic outlet temperature"},
            {"hv", "heating value of a fuel"},
            {"duty", "heat duty of a reactor from its feed and conversion"},
            {"streamh", "enthalpy flow of a stream"},
            {"steam", "water and steam properties (IAPWS-IF97)"},
            {"hess", "ΔH of a reaction combined from known step reactions"},
        };
        std::vector<PlannedCommand> missing;
        for (const auto& p : spec)
            if (!find_command(p.name) && group_members(p.name).empty()) missing.push_back(p);
        return missing;
    }();
    return all;
}

const PlannedCommand* find_planned(std::string_view name) {
    for (const auto& p : planned_commands())
        if (name == p.name) return &p;
    return nullptr;
}

Parsed parse(const CommandDef& cmd, const std::vector<std::string>& given) {
    std::vector<std::string> words = given;
    // Checks CLI11 does not make: an option's value is the next word unless that word reads as an
    // option; "-T=300" is "-T300"; "-.5" is a number (CLI11 reads it as an option named '.').
    bool after_marker = false;
    for (std::size_t i = 0; i < words.size(); ++i) {
        std::string& w = words[i];
        if (after_marker) continue;
        if (w == "--") {
            after_marker = true;
            continue;
        }
        if (w.size() > 2 && w[0] == '-' && w[1] == '.' && is_number(w)) {
            w.insert(1, "0");
            continue;
        }
        const OptionDef* o = option_named(cmd, w);
        if (!o) continue;
        const bool is_short = w[1] != '-';
        if (is_short && w.size() > 2 && w[2] == '=') w.erase(2, 1);
        const bool inline_value = is_short ? w.size() > 2 : w.find('=') != std::string::npos;
        if (inline_value) continue;
        const std::string as_written = option_word(w);
        if (i + 1 >= words.size() || looks_like_option(words[i + 1]))
            throw UsageError("the option " + as_written + " needs a value" +
                             (i + 1 < words.size() ? " (found the option '" + words[i + 1] + "' instead)" : std::string()));
        ++i;  // the value, whatever it looks like
    }

    CLI::App app{cmd.summary, "rxnheat " + cmd.name};
    app.set_help_flag();  // our own help, from the catalogue
    app.allow_extras();   // unknown options are reported in our words below
    Parsed out;
    app.add_flag("-h,--help", out.help);
    std::vector<std::string> positionals;
    app.add_option("words", positionals)->expected(0, -1);
    std::map<std::string, std::vector<std::string>> values;
    for (const auto& o : cmd.options) {
        const std::string flags = (o.short_name ? std::string("-") + o.short_name + "," : std::string()) + "--" + o.long_name;
        // Every occurrence is kept, so that "given twice" is ours to say.
        app.add_option(flags, values[o.long_name])->expected(1)->allow_extra_args(false)->multi_option_policy(CLI::MultiOptionPolicy::TakeAll);
    }
    std::vector<std::string> reversed(words.rbegin(), words.rend());
    try {
        app.parse(reversed);
    } catch (const CLI::ParseError& e) {
        throw UsageError(e.what());
    }
    bool marker_seen = false;
    for (const std::string& w : app.remaining()) {
        if (w == "--" && !marker_seen) {
            marker_seen = true;
            continue;
        }
        const std::string name = option_word(w);
        if (any_command_takes(w))
            throw UsageError("the command '" + cmd.name + "' takes no " + name + " option");
        throw UsageError("unknown option '" + w + "'");
    }
    for (const auto& o : cmd.options) {
        const auto& v = values[o.long_name];
        if (v.empty()) continue;
        if (v.size() > 1 && !o.repeatable) throw UsageError("the option " + o.display() + " is given twice");
        for (const auto& each : v)
            if (trim(each).empty()) throw UsageError("the option " + o.display() + " needs a value, not an empty one");
        out.values[o.long_name] = v.front();
        if (o.repeatable) out.repeated[o.long_name] = v;
    }
    out.positionals = std::move(positionals);
    if (out.help) return out;

    std::size_t required = 0, most = 0;
    bool unbounded = false;
    for (const auto& p : cmd.positionals) {
        if (p.required) ++required;
        if (p.variadic) unbounded = true;
        ++most;
    }
    const std::size_t n = out.positionals.size();
    if (n < required) {
        std::string missing;
        for (std::size_t k = n; k < required; ++k) missing += (missing.empty() ? "" : " ") + cmd.positionals[k].placeholder;
        throw UsageError("missing " + missing);
    }
    if (!unbounded && n > most)
        throw UsageError("unexpected argument '" + out.positionals[most] +
                         "' (put each argument that contains spaces in quotes: a reaction, or a temperature "
                         "such as -T \"350 C\")");
    return out;
}

}  // namespace rxnheat::cli
