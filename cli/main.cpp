// rxnheat: the command line over the rxnheat engine (cli/CLI.md). Thin: every number and every
// diagnosis comes from librxnheat; this file picks the command, runs it, and reports errors and
// the exit status. See CLI.md for the user's description.
#include "commands.hpp"
#include "format.hpp"
#include "help.hpp"
#include "options.hpp"

#include "rxnheat/rxnheat.hpp"

#include <cstddef>
#include <cstdio>
#include <exception>
#include <new>
#include <string>
#include <vector>

namespace {

using namespace rxnheat::cli;

[[noreturn]] void planned_error(const PlannedCommand& m) {
    throw UsageError(std::string("'") + m.name + "' (" + m.what +
                     ") is not available in this version of rxnheat; it is planned for a later version");
}

void write_help(const Output& out, const std::string& text) {
    out.write(out.json() ? JsonObject().str("help", text).text() + "\n" : text);
}

/// A group named without a command of it ("rxnheat steam", "rxnheat steam frobnicate").
[[noreturn]] void group_error(const std::vector<std::string>& words) {
    std::string names;
    for (const CommandDef* c : group_members(words[0])) names += (names.empty() ? "" : ", ") + c->name;
    throw UsageError((words.size() > 1 ? "unknown command '" + words[0] + " " + words[1] + "'"
                                       : "'" + words[0] + "' needs one of its commands") +
                     "; the '" + words[0] + "' commands are " + names);
}

/// Runs the command line `words` (--json already taken out); `cmd` is set once the command is known.
int run(const std::vector<std::string>& words, Output& out, const CommandDef*& cmd) {
    if (words.empty()) throw UsageError("no command given");
    const std::string& name = words[0];
    if (name == "--help" || name == "-h" || name == "help") {
        if (name == "help" && words.size() > 1) {
            const std::vector<std::string> topic(words.begin() + 1, words.end());
            if (const PlannedCommand* m = find_planned(topic[0])) planned_error(*m);
            std::size_t name_words = 1;
            cmd = command_named_by(topic, name_words);
            if (!cmd && !group_members(topic[0]).empty()) {
                if (topic.size() == 1) {
                    write_help(out, group_help(topic[0]));
                    return exit_ok;
                }
                group_error(topic);
            }
            if (!cmd) throw UsageError("unknown command '" + topic[0] + "'");
            write_help(out, command_help(*cmd));
            return exit_ok;
        }
        write_help(out, global_help());
        return exit_ok;
    }
    if (name == "--version") {
        const std::string v = rxnheat::Engine::version();
        out.write(out.json() ? JsonObject().str("version", v).text() + "\n" : v + "\n");
        return exit_ok;
    }
    if (const PlannedCommand* m = find_planned(name)) planned_error(*m);
    std::size_t name_words = 1;
    cmd = command_named_by(words, name_words);
    if (!cmd && !group_members(name).empty()) {
        if (words.size() > 1 && (words[1] == "--help" || words[1] == "-h")) {
            write_help(out, group_help(name));
            return exit_ok;
        }
        group_error(words);
    }
    if (!cmd) {
        if (!name.empty() && name[0] == '-') throw UsageError("unknown option '" + name + "' (give the command first)");
        throw UsageError("unknown command '" + name + "'");
    }
    const Parsed p = parse(*cmd, std::vector<std::string>(words.begin() + static_cast<std::ptrdiff_t>(name_words), words.end()));
    if (p.help) {
        write_help(out, command_help(*cmd));
        return exit_ok;
    }
    return run_command(*cmd, p, out, rxnheat::Engine::shared());
}

/// Writes an error the way the mode asks: the JSON object on standard output, or words on
/// standard error.
void report_error(Output& out, const CommandDef* cmd, const std::string& message, const char* kind, bool with_usage) {
    if (out.json()) {
        if (out.batch_open()) {
            // The batch object is already open: close it with the error instead of a second object.
            out.write("],\"error\":" + json_string(message) + ",\"error_kind\":" + json_string(kind) + "}\n");
            out.set_batch_open(false);
            return;
        }
        JsonObject j;
        j.str("error", message).str("error_kind", kind);
        if (with_usage && cmd) j.str("usage", usage_line(*cmd));
        out.write(j.text() + "\n");
        return;
    }
    const std::string prefix = cmd ? "rxnheat " + cmd->name + ": " : std::string("rxnheat: ");
    std::string text = prefix + message + "\n";
    if (with_usage) {
        if (cmd)
            text += usage_line(*cmd) + "\nrun 'rxnheat " + cmd->name + " --help' for more\n";
        else
            text += "usage: rxnheat COMMAND ARGUMENTS [OPTIONS]\nrun 'rxnheat --help' for the commands\n";
    }
    out.write_err(text);
}

std::string internal_words(const std::string& message) {
    return message.rfind("internal error", 0) == 0 ? message : "internal error: " + message;
}

}  // namespace

int main(int argc, char** argv) {
    std::vector<std::string> words;
    bool json = false;
    try {
        // --json anywhere before "--" selects JSON output, for every command alike.
        bool after_marker = false;
        for (int i = 1; i < argc; ++i) {
            const std::string w = argv[i];
            if (w == "--") after_marker = true;
            if (!after_marker && w == "--json") {
                json = true;
                continue;
            }
            words.push_back(w);
        }
    } catch (...) {
        std::fputs("rxnheat: out of memory reading the arguments\n", stderr);
        return exit_internal;
    }

    Output out(json);
    const CommandDef* cmd = nullptr;
    int status = exit_internal;
    try {
        status = run(words, out, cmd);
    } catch (const UsageError& e) {
        report_error(out, cmd, e.what(), "usage", true);
        status = exit_bad_input;
    } catch (const rxnheat::Error& e) {
        const bool internal = rxnheat::error_kind_info(e.kind()).internal;
        report_error(out, cmd, internal ? internal_words(e.what()) : std::string(e.what()),
                     rxnheat::error_kind_info(e.kind()).name, false);
        status = internal ? exit_internal : exit_bad_input;
    } catch (const std::bad_alloc&) {
        report_error(out, cmd, "internal error: out of memory", "internal", false);
        status = exit_internal;
    } catch (const std::exception& e) {
        report_error(out, cmd, internal_words(e.what()), "internal", false);
        status = exit_internal;
    } catch (...) {
        report_error(out, cmd, "internal error: unknown exception", "internal", false);
        status = exit_internal;
    }
    if (std::fflush(stdout) != 0 || std::ferror(stdout)) {
        std::fputs("rxnheat: cannot write to standard output\n", stderr);
        return exit_internal;
    }
    return status;
}
