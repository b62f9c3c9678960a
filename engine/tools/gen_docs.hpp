// Reference pages generated from the function catalogue (rxnheat/catalogue.hpp), so that the
// docs cannot drift from the functions: engine/FUNCTIONS.md (every cell function) and the
// command table of cli/CLI.md.
#pragma once

#include <string>

namespace rxnheat::gen {

/// The whole of engine/FUNCTIONS.md.
std::string functions_markdown();
/// The command table that stands between the markers in cli/CLI.md.
std::string commands_markdown();

/// Replaces the text between `begin` and `end` marker lines of `page` with `body`; throws
/// std::runtime_error when a marker is missing.
std::string replace_between(const std::string& page, const std::string& begin, const std::string& end,
                            const std::string& body);

inline constexpr const char* commands_begin = "<!-- commands: generated from the catalogue, do not edit -->";
inline constexpr const char* commands_end = "<!-- end of commands -->";

}  // namespace rxnheat::gen
