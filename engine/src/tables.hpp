// The small embedded CSV tables: standard atomic weights and species aliases. Private.
#pragma once

#include <string>
#include <string_view>
#include <vector>

namespace rxnheat::detail {

struct Element {
    std::string symbol;  ///< "Cl"
    int z = 0;
    std::string name;    ///< "chlorine"
    double weight = 0;   ///< standard atomic weight, g/mol
};

/// A common name for a substance, mapping to the NASA record names per phase.
struct Alias {
    std::string name;     ///< "ethanol" (matched case-insensitively)
    std::string gas;      ///< NASA record name of the gas, or empty
    std::string liquid;   ///< NASA record name of the liquid, or empty
    std::vector<std::string> solid;  ///< NASA record names of the solid forms, or empty
};

/// One row of data/aqueous.csv: an aqueous species at 298.15 K (engine/DATA.md, Aqueous). The
/// formula is kept as text; the engine parses it (this layer knows no grammar).
struct AqueousRow {
    std::size_t line = 0;       ///< 1-based line in data/aqueous.csv
    std::string formula;        ///< as written in the file, charge included: "SO4^2-"
    std::string name;           ///< optional common name (matched case-insensitively), or empty
    double dHf_J_per_mol = 0;   ///< ΔfH° at 298.15 K
    double S_J_per_molK = 0;    ///< S° at 298.15 K
    bool has_cp = false;        ///< false: Cp° not given (the row holds at 298.15 K only)
    double Cp_J_per_molK = 0;   ///< Cp° at 298.15 K, when has_cp
    std::string source;         ///< "NBS 1982", "CODATA 1989", ... as in the file
    bool from_memory = true;    ///< the values were typed from memory
};

/// Parse the CSV text of data/elements.csv / data/aliases.csv (comment lines start with '#').
/// Throw std::runtime_error("elements.csv line N: ...") when malformed.
std::vector<Element> parse_elements_csv(std::string_view text);
std::vector<Alias> parse_aliases_csv(std::string_view text);
/// Parse the CSV text of data/aqueous.csv; errors read "aqueous.csv line N: ...".
std::vector<AqueousRow> parse_aqueous_csv(std::string_view text);

/// True when n is usable as an alias name: a small letter first, then only small letters, digits,
/// '-', ',' and single spaces (no space at the end).
bool valid_alias_name(std::string_view n);

/// The embedded file texts (generated at build time from data/).
std::string_view embedded_thermo_inp();
std::string_view embedded_elements_csv();
std::string_view embedded_aliases_csv();
std::string_view embedded_aqueous_csv();
/// Provenance line of the embedded NASA file (from data/nasa-glenn/PROVENANCE).
std::string_view embedded_nasa_provenance();

}  // namespace rxnheat::detail
