// Help texts, generated from the catalogue and the command definitions.
#pragma once

#include "options.hpp"

#include <string>

namespace rxnheat::cli {

/// "usage: rxnheat dh REACTION [-T TEMP] ..."
std::string usage_line(const CommandDef& cmd);
/// `rxnheat COMMAND --help`.
std::string command_help(const CommandDef& cmd);
/// `rxnheat --help`.
std::string global_help();
/// `rxnheat steam --help`: the commands of a group (options.hpp, group_members), one line each.
std::string group_help(const std::string& group);

}  // namespace rxnheat::cli
