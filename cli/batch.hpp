// `rxnheat batch`: ΔrH° for every row of a CSV file, streamed in chunks. A command of the command
// line only (no cell function reads a file).
#pragma once

#include "format.hpp"
#include "options.hpp"

#include "rxnheat/rxnheat.hpp"

namespace rxnheat::cli {

/// Runs the batch; returns the exit status (0 when the input was read, even with bad rows).
int run_batch(const Parsed& p, Output& out, Engine& engine);

/// What --help says beyond the usage line and the options, and the fields of its --json.
extern const char* const batch_details;
extern const char* const batch_json_fields;

}  // namespace rxnheat::cli
