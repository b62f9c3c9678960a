#include "gen_docs.hpp"

#include "rxnheat/catalogue.hpp"

#include <stdexcept>

namespace rxnheat::gen {

namespace {

// Markdown table cells hold no line breaks or bars.
std::string cell(std::string s) {
    std::string out;
    for (char c : s) {
        if (c == '|') out += "\\|";
        else if (c == '\n') out += ' ';
        else out += c;
    }
    return out;
}

std::string signature(const FunctionSpec& f) {
    std::string s;
    for (std::size_t i = 0; i < f.args.size(); ++i) {
        const ArgSpec& a = f.args[i];
        if (i) s += "; ";
        std::string n = a.kind == ArgKind::rest ? std::string(a.name) + "…" : a.name;
        s += a.required ? n : "[" + n + "]";
    }
    return s.empty() ? "—" : s;
}

std::string layers(const FunctionSpec& f) {
    std::string s;
    auto add = [&](Layer l, const char* word) {
        if (f.in(l)) s += std::string(s.empty() ? "" : ", ") + word;
    };
    add(layer_calc, "Calc");
    add(layer_cli, "CLI");
    add(layer_c, "C");
    return s;
}

/// The command's arguments as its --help usage line writes them (a CLI test holds the two
/// together): positionals in order, then each option by its short name if it has one.
std::string cli_arguments(const FunctionSpec& f) {
    std::string out;
    // A required argument is a positional even where it has an option name (SPECIESCP's TEMP).
    // A required feed's SPECIES=MOL words come after every other positional (they take the rest).
    for (const bool feed : {false, true})
        for (const auto& a : f.args)
            if ((!a.cli_option || (a.required && !is_list(a.kind))) && (a.kind == ArgKind::feed) == feed)
                out += std::string(out.empty() ? "" : " ") + a.cli_value +
                       (a.kind == ArgKind::rest || a.kind == ArgKind::feed || a.kind == ArgKind::fuel ? "..." : "");
    for (const auto& a : f.args)
        if (a.cli_option && (!a.required || a.kind == ArgKind::feed || is_list(a.kind))) {  // given repeated
            std::string opt = a.cli_option;
            const auto comma = opt.find(',');
            const std::string shown =
                (comma == std::string::npos ? opt : opt.substr(0, comma)) + " " + a.cli_value;
            // A required list is its option repeated (--step R1 --step R2); the rest are optional.
            out += std::string(out.empty() ? "" : " ") +
                   (a.required && is_list(a.kind) ? shown + "..." : "[" + shown + "]");
        }
    return out;
}

}  // namespace

std::string functions_markdown() {
    std::string out =
        "# Cell functions\n\n"
        "Generated from the function catalogue (`engine/src/catalogue.cpp`) by `scripts/gen-docs`;\n"
        "do not edit by hand (a test fails when this page and the catalogue differ).\n\n"
        "Arguments in [] are optional. A range where the table says *range → array* gives an\n"
        "array of the same shape (enter as an array formula); a column of reactions or species with\n"
        "a row of temperatures gives the whole table, and two ranges of one shape pair cell by cell.\n"
        "An omitted, empty or blank optional argument takes its default (Calc passes a blank cell\n"
        "as 0, so there 0 also means the default). Temperatures are a number in kelvin or text with\n"
        "a unit (`\"350 C\"`). Reaction text: [grammar/SYNTAX.md](../grammar/SYNTAX.md); data,\n"
        "phases and units: [DATA.md](DATA.md); the command line: [cli/CLI.md](../cli/CLI.md).\n\n"
        "Results are standard-state, ideal-gas, complete-conversion screening estimates; thermal\n"
        "runaway and relief sizing need calorimetry and a process hazard analysis, and local codes\n"
        "and licensed engineers decide.\n\n"
        "The STEAM functions are the exception to ideal gas: IAPWS-IF97 properties of real water and\n"
        "steam (regions 1, 2 and 4; an error, never an extrapolation, elsewhere).\n\n"
        "| function | arguments | returns | command |\n|---|---|---|---|\n";
    for (const auto& f : catalogue())
        out += "| [" + std::string(f.calc_name) + "](#" + std::string(f.calc_name) + ") | " + cell(signature(f)) +
               " | " + cell(f.summary) + " | `rxnheat " + f.cli_command + "` |\n";
    for (const auto& f : catalogue()) {
        out += "\n## " + std::string(f.calc_name) + "\n\n";
        out += std::string(f.calc_name) + "(" + signature(f) + ") — returns " +
               (f.returns == Returns::number ? "a number" : "text") + ". Layers: " + layers(f) + ".";
        if (*f.gaps) out += std::string(" Not in every layer: ") + f.gaps;
        out += "\n\n" + std::string(f.description) + "\n\n";
        if (!f.args.empty()) {
            out += "| argument | kind | | default | range → array | |\n|---|---|---|---|---|---|\n";
            for (const auto& a : f.args)
                out += "| " + std::string(a.name) + " | " + to_string(a.kind) + " | " +
                       (a.required ? "required" : "optional") + " | " + cell(a.default_text) + " | " +
                       (a.spreads ? "yes" : "") + " | " + cell(a.help) + " |\n";
            out += "\n";
        }
        const std::string args = cli_arguments(f);
        out += "Command line: `rxnheat " + std::string(f.cli_command) + (args.empty() ? "" : " " + args) +
               "`; stored in documents as `ORG.RXNHEAT.CALC.FUNCTIONS." + std::string(f.idl_method) + "`.\n";
    }
    return out;
}

std::string commands_markdown() {
    std::string out = "| command | arguments | cell function | what it gives |\n|---|---|---|---|\n";
    for (const auto& f : catalogue())
        if (f.in(layer_cli)) {
            const std::string args = cli_arguments(f);
            out += "| `" + std::string(f.cli_command) + "` | " + (args.empty() ? "" : "`" + cell(args) + "`") + " | [" +
                   f.calc_name + "](../engine/FUNCTIONS.md#" + f.calc_name + ") | " + cell(f.summary) + " |\n";
        }
    return out;
}

std::string replace_between(const std::string& page, const std::string& begin, const std::string& end,
                            const std::string& body) {
    const auto b = page.find(begin);
    const auto e = page.find(end);
    if (b == std::string::npos || e == std::string::npos || e < b)
        throw std::runtime_error("the page lacks the markers '" + begin + "' ... '" + end + "'");
    const auto body_start = page.find('\n', b) + 1;
    return page.substr(0, body_start) + body + page.substr(e);
}

}  // namespace rxnheat::gen
