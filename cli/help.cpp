// Help texts (see help.hpp): the usage line, summary, description and argument texts come from
// the catalogue; the command line adds its JSON fields, examples and the exit status.
#include "help.hpp"

#include "commands.hpp"

#include <algorithm>
#include <cstdio>
#include <string_view>

namespace rxnheat::cli {

namespace {

constexpr std::size_t width = 78;   // columns of help text
constexpr std::size_t indent = 26;  // where an option's or argument's text starts

const char* const caution_marker = " CAUTION: ";

/// Characters (UTF-8 code points) in s, for column counting.
std::size_t columns(std::string_view s) {
    std::size_t n = 0;
    for (unsigned char ch : s)
        if ((ch & 0xC0) != 0x80) ++n;
    return n;
}

/// The catalogue's texts are written for the Function Wizard; on the command line a value is a
/// word, not a cell, and there are no ranges. Sentences about cells and arrays are left out.
std::string command_line_wording(std::string text) {
    const char* cell_phrases[] = {", or a cell holding it", " or a cell holding it", ", as text or a cell", " or a cell"};
    for (const char* ph : cell_phrases)
        for (std::size_t at; (at = text.find(ph)) != std::string::npos;) text.erase(at, std::string_view(ph).size());
    const std::string range = "A cell range with";
    if (text.rfind(range, 0) == 0) text = "A CSV file with" + text.substr(range.size());
    std::string out;
    std::size_t start = 0;
    while (start < text.size()) {
        // A sentence ends at ". " before a capital letter (not "e.g. CH4").
        std::size_t end = start;
        for (;;) {
            end = text.find(". ", end);
            if (end == std::string::npos || (end + 2 < text.size() && text[end + 2] >= 'A' && text[end + 2] <= 'Z')) break;
            end += 2;
        }
        const std::string sentence = text.substr(start, end == std::string::npos ? std::string::npos : end + 1 - start);
        const bool about_cells = sentence.find("range") != std::string::npos || sentence.find("array") != std::string::npos ||
                                 sentence.find("Err:") != std::string::npos;
        if (!about_cells) out += (out.empty() ? "" : " ") + sentence;
        if (end == std::string::npos) break;
        start = end + 2;
    }
    return out;
}

/// `text` wrapped at `width` columns, every line but the first indented by `hang` spaces; the
/// first starts at column `first_column`.
std::string wrap(const std::string& text, std::size_t first_column, std::size_t hang) {
    std::string out;
    std::size_t col = first_column;
    bool line_start = true;
    std::size_t pos = 0;
    while (pos < text.size()) {
        std::size_t next = text.find(' ', pos);
        if (next == std::string::npos) next = text.size();
        const std::string word = text.substr(pos, next - pos);
        pos = next + 1;
        if (word.empty()) continue;
        if (!line_start && col + 1 + columns(word) > width) {
            out += "\n" + std::string(hang, ' ');
            col = hang;
            line_start = true;
        }
        if (!line_start) {
            out += ' ';
            ++col;
        }
        out += word;
        col += columns(word);
        line_start = false;
    }
    return out + "\n";
}

/// "  LABEL                   text..." with the text wrapped under itself.
std::string item(const std::string& label, const std::string& text) {
    std::string out = "  " + label;
    std::size_t col = 2 + columns(label);
    if (col + 2 > indent) {
        out += "\n" + std::string(indent, ' ');
    } else {
        out += std::string(indent - col, ' ');
    }
    return out + wrap(text, indent, indent);
}

std::string paragraph(const std::string& text) { return wrap(text, 0, 0); }

const char* const exit_status_text =
    "Exit status: 0 success; 2 bad input (message on standard error, or {\"error\": ...} on standard "
    "output with --json); 1 internal failure.";

}  // namespace

std::string usage_line(const CommandDef& cmd) {
    std::string out = "usage: rxnheat " + cmd.name;
    for (const auto& p : cmd.positionals)
        out += p.variadic ? " " + p.placeholder + "..." : p.required ? " " + p.placeholder : " [" + p.placeholder + "]";
    for (const auto& o : cmd.options) out += o.required ? " " + o.usage() + "..." : " [" + o.usage() + "]";
    return out;
}

std::string command_help(const CommandDef& cmd) {
    const CommandText t = command_text(cmd);
    std::string out = usage_line(cmd) + "\n\n" + cmd.summary + ".\n\n";
    std::string caution;
    if (cmd.function) {
        std::string description = cmd.function->description;
        const auto at = description.find(caution_marker);
        if (at != std::string::npos) {
            caution = description.substr(at + 1);
            description.erase(at);
        }
        out += paragraph(command_line_wording(description));
    }
    if (*t.details) out += (cmd.function ? "\n" : "") + paragraph(t.details);
    if (!cmd.positionals.empty()) {
        out += "\nArguments:\n";
        for (const auto& p : cmd.positionals) out += item(p.placeholder + (p.variadic ? "..." : ""), command_line_wording(p.help));
    }
    out += "\nOptions:\n";
    for (const auto& o : cmd.options) {
        std::string text = command_line_wording(o.help);
        if (!o.default_text.empty() && text.find(o.default_text) == std::string::npos)
            text += " Default: " + o.default_text + ".";
        out += item(o.label(), text);
    }
    if (*t.json_fields) out += item("--json", t.json_fields);
    out += item("-h, --help", "this help");
    if (*t.examples) {
        out += "\nExamples:\n";
        std::string_view ex = t.examples;
        while (!ex.empty()) {
            const auto nl = ex.find('\n');
            out += "  " + std::string(ex.substr(0, nl)) + "\n";
            ex = nl == std::string_view::npos ? std::string_view() : ex.substr(nl + 1);
        }
    }
    if (!caution.empty()) out += "\n" + paragraph(caution);
    out += "\n" + paragraph(exit_status_text);
    return out;
}

std::string group_help(const std::string& group) {
    std::string out = "usage: rxnheat " + group + " COMMAND ARGUMENTS [OPTIONS]\n\nCommands:\n";
    for (const CommandDef* c : group_members(group)) out += item(c->name, c->summary);
    return out + "\nrun 'rxnheat " + group + " COMMAND --help' for each command's arguments\n";
}

std::string global_help() {
    std::string out =
        "rxnheat: standard reaction enthalpies from reaction text, on the rxnheat engine.\n"
        "\n"
        "usage: rxnheat COMMAND ARGUMENTS [OPTIONS]\n"
        "       rxnheat help [COMMAND]    rxnheat COMMAND --help    rxnheat --version\n"
        "\n"
        "Commands:\n";
    int name_width = 11;  // the longest name and a space ("steam latent" is longer than most)
    for (const auto& c : commands()) name_width = std::max(name_width, static_cast<int>(c.name.size()) + 1);
    for (const auto& c : commands()) {
        char buf[64];
        std::snprintf(buf, sizeof buf, "  %-*s", name_width, c.name.c_str());
        out += buf + c.summary + "\n";
    }
    if (!planned_commands().empty()) {
        out += "\nNot in this version (planned for a later one; naming one is an error, exit status 2):\n";
        for (const auto& m : planned_commands()) {
            char buf[64];
            std::snprintf(buf, sizeof buf, "  %-*s", name_width, m.name);
            out += buf + std::string(m.what) + "\n";
        }
    }
    out +=
        "\n"
        "Options (each command's help lists those it takes, with their defaults):\n"
        "  -T, --temperature TEMP  kelvin, or text with a unit: \"350 C\", \"662 F\", \"1100 R\",\n"
        "                          \"623.15 K\" (default 298.15 K)\n"
        "  -u, --unit UNIT         unit of the result (e.g. kJ/mol, kcal/mol, MJ/kg with --per)\n"
        "  --table FILE.csv        a user species table over the built-in data\n"
        "  --json                  exactly one JSON object on standard output: the results, or\n"
        "                          {\"error\": \"...\", \"error_kind\": \"...\"}\n"
        "  -h, --help              help\n"
        "  --                      everything after it is an argument, not an option\n"
        "Options may come before or after the arguments; --name=value also works. A negative\n"
        "number is an argument, not an option.\n"
        "\n"
        "Reactions are written as chemists write them, in quotes:\n"
        "  \"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)\", \"1/2 N2(g) + 3/2 H2(g) → NH3(g)\"\n"
        "\n"
        "Numbers: text output shows 6 significant digits (whole numbers from 10^6 to 10^15 are\n"
        "written out); --json and batch CSV show every digit needed to read back the same double.\n"
        "\n"
        "Exit status: 0 success; 2 bad input (message on standard error, or the JSON error object\n"
        "on standard output with --json); 1 internal failure.\n"
        "\n"
        "Results are standard-state, ideal-gas, complete-conversion estimates for screening.\n"
        "Thermal runaway and relief sizing need calorimetry and a process hazard analysis;\n"
        "follow local codes and the judgement of licensed engineers.\n"
        "The steam commands are the exception to ideal gas: IAPWS-IF97 properties of real water\n"
        "and steam (regions 1, 2 and 4; an error, never an extrapolation, elsewhere).\n";
    return out;
}

}  // namespace rxnheat::cli
