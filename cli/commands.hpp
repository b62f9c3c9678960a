// Running a command: a catalogue function (its arguments handed to rxnheat::evaluate, its
// Outcome shown by the command's presenter) or a command of the command line only (species,
// functions, batch).
#pragma once

#include "format.hpp"
#include "options.hpp"

#include "rxnheat/rxnheat.hpp"

#include <string>

namespace rxnheat::cli {

constexpr int exit_ok = 0;
constexpr int exit_internal = 1;
constexpr int exit_bad_input = 2;

/// Runs one command and writes its result; returns the exit status. A failure is thrown
/// (rxnheat::Error with its kind, UsageError) for main to report.
int run_command(const CommandDef& cmd, const Parsed& p, Output& out, Engine& engine);

/// What a command's help says beside the catalogue's texts.
struct CommandText {
    const char* details = "";      ///< commands of the command line only: what it does
    const char* json_fields = "";  ///< the fields of its --json object
    const char* examples = "";     ///< example lines, each "rxnheat ..."
};
CommandText command_text(const CommandDef& cmd);

}  // namespace rxnheat::cli
