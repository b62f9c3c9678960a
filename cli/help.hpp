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

}  // namespace rxnheat::cli
