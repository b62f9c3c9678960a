// The commands of the rxnheat command line and how their words are read (CLI11). Every catalogue
// function with layer_cli is a command named by its cli_command: its required arguments are
// positionals in Calc order, its optional arguments are options (cli_option, cli_value). The
// commands that exist only here (species, batch, functions) are declared beside them, once.
#pragma once

#include "rxnheat/catalogue.hpp"

#include <cstddef>
#include <map>
#include <stdexcept>
#include <string>
#include <string_view>
#include <vector>

namespace rxnheat::cli {

/// A bad command line (unknown command or option, missing or extra argument): exit 2, with usage.
struct UsageError : std::runtime_error {
    using std::runtime_error::runtime_error;
};

/// A positional argument as the command line shows it.
struct PositionalDef {
    std::string placeholder;  ///< "REACTION"
    bool required = true;
    bool variadic = false;    ///< takes every remaining word (why's ARGS)
    std::string help;
    std::size_t arg_index = 0;  ///< index into FunctionSpec::args (catalogue commands)
};

/// An option that takes a value.
struct OptionDef {
    char short_name = 0;     ///< 'T', or 0
    std::string long_name;   ///< "temperature" (without "--")
    std::string value_name;  ///< "TEMP"
    std::string help;
    std::string default_text;  ///< "" when there is none
    std::size_t arg_index = 0;  ///< index into FunctionSpec::args (catalogue commands)
    bool repeatable = false;    ///< given once per item (--feed N2=1 --feed H2=3)
    bool required = false;      ///< a required list: its items come only as this option (--step R1 --step R2)

    /// "-T/--temperature" or "--per", as messages name it.
    std::string display() const;
    /// "-T, --temperature TEMP" or "--per SPECIES", as help lists it.
    std::string label() const;
    /// "-T TEMP" or "--per SPECIES", as a usage line shows it.
    std::string usage() const;
};

struct CommandDef {
    std::string name;
    const FunctionSpec* function = nullptr;  ///< nullptr: a command of the command line only
    std::string summary;
    std::vector<PositionalDef> positionals;
    std::vector<OptionDef> options;
};

/// Every command: the catalogue's (layer_cli), in catalogue order, then species, batch, functions.
const std::vector<CommandDef>& commands();
const CommandDef* find_command(std::string_view name);
/// A command name of two words ("steam tsat": a catalogue row's cli_command) puts the command in
/// the group named by its first word; `rxnheat steam tsat 10bar` runs it. The members of a group,
/// in catalogue order; empty when `group` names no group.
std::vector<const CommandDef*> group_members(std::string_view group);
/// The command named by the first words of a command line ("dh ..." or "steam tsat ..."), and
/// how many words its name takes (1 or 2); nullptr when they name no command.
const CommandDef* command_named_by(const std::vector<std::string>& words, std::size_t& name_words);

/// A command the specification plans but this version (its catalogue) does not have.
struct PlannedCommand {
    const char* name;
    const char* what;
};
const std::vector<PlannedCommand>& planned_commands();
const PlannedCommand* find_planned(std::string_view name);

/// The words after the command name, read.
struct Parsed {
    std::vector<std::string> positionals;       ///< in order (after `--` too)
    std::map<std::string, std::string> values;  ///< long option name -> value as given (the first, if repeatable)
    std::map<std::string, std::vector<std::string>> repeated;  ///< repeatable options: every value, in order
    bool help = false;

    bool has(const std::string& long_name) const { return values.count(long_name) != 0; }
    /// The option's value, or `fallback` when it was not given.
    std::string value_or(const std::string& long_name, const std::string& fallback) const;
};

/// Reads `words` (the command line after the command name, --json already taken out) with
/// CLI11 against the command's options. Throws UsageError for a bad command line; checks the
/// number of positionals unless help was asked for.
Parsed parse(const CommandDef& cmd, const std::vector<std::string>& words);

}  // namespace rxnheat::cli
