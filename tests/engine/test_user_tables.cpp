// User species tables (engine/DATA.md, User tables): rows override and extend the built-in data.
#include <catch2/catch.hpp>

#include "rxnheat/rxnheat.hpp"

#include <cstdio>
#include <cstdlib>
#include <string>
#include <vector>

#include <unistd.h>

using rxnheat::Engine;
using rxnheat::SpeciesTable;

namespace {
// Aqueous ions at 298.15 K: ΔfH° from CODATA Key Values (Cox et al. 1989), from memory.
SpeciesTable ions() {
    return SpeciesTable::from_rows({
        {"formula", "phase", "dHf", "S", "name", "source"},
        {"H+", "aq", "0", "0", "", "CODATA 1989 (convention)"},
        {"OH-", "aq", "-230.015", "-10.90", "hydroxide", "CODATA 1989, from memory"},
        {"", "", "", "", "", ""},  // blank rows (the rest of a selected range) are skipped
    });
}
}  // namespace

TEST_CASE("aqueous neutralisation from a user table", "[usertable]") {
    auto& e = Engine::shared();
    const auto t = ions();
    // ΔrH° = ΔfH°(H2O, l) − ΔfH°(OH−, aq) = −285.830 + 230.015 = −55.815 kJ/mol (CODATA Key
    // Values, Cox et al. 1989, from memory; H2O(l) comes from the built-in NASA Glenn record,
    // which carries the CODATA value).
    CHECK(e.dh("H+(aq) + OH-(aq) -> H2O(l)", {298.15, &t}, "kJ/mol") == Approx(-55.815).margin(0.001));
    // a species may be named by the table's name column
    CHECK(e.dh("H+(aq) + hydroxide(aq) -> H2O(l)", {298.15, &t}, "kJ/mol") == Approx(-55.815).margin(0.001));
    CHECK(e.balance("H+ + hydroxide(aq) -> H2O", {rxnheat::T_ref, &t}) == "H+ + hydroxide(aq) -> H2O");
    CHECK(e.source("H+(aq) + OH-(aq) -> H2O(l)", {rxnheat::T_ref, &t}).find("user species table row 3") != std::string::npos);
    // without the table, the built-in aqueous table (data/aqueous.csv) gives the same CODATA value
    CHECK(e.dh("H+(aq) + OH-(aq) -> H2O(l)", {298.15}, "kJ/mol") == Approx(-55.815).margin(0.001));
    CHECK(e.source("H+(aq) + OH-(aq) -> H2O(l)").find("OH-(aq): data/aqueous.csv") != std::string::npos);
    // a name the table and the built-in data do not hold with (aq) is an error naming the table
    CHECK(e.check("H+(aq) + hydroxide(aq) -> H2O(l)").find("is not a name rxnheat knows") != std::string::npos);
    // the rows cover 298.15 K only (no cp given): another temperature is a range error
    CHECK_THROWS_WITH(e.dh("H+(aq) + OH-(aq) -> H2O(l)", {310, &t}, "kJ/mol"),
                      Catch::Contains("covers 298.15–298.15 K"));
}

TEST_CASE("a user row overrides the built-in record of the same formula and phase", "[usertable]") {
    auto& e = Engine::shared();
    // A constant-cp row for CO2(g) over 298.15–400 K with the CODATA ΔfH° (from memory) and a
    // deliberately different cp, so the override is visible in the sensible heat.
    const auto t = SpeciesTable::from_rows({{"formula", "phase", "dHf", "cp", "tmin", "tmax"},
                                            {"CO2", "g", "-393.51", "40", "298.15", "400"}});
    CHECK(e.species_h("CO2(g)", {398.15, &t}, 298.15) == Approx(4.0).margin(1e-9));  // 40 J/(mol K) × 100 K
    CHECK(e.species_hf("CO2(g)", {298.15, &t}, "kJ/mol") == Approx(-393.51));
    CHECK(e.species_h("CO2(g)", 398.15) != Approx(4.0).margin(0.01));  // the NASA record differs
}

TEST_CASE("malformed tables name the row and the column", "[usertable]") {
    using Rows = std::vector<std::vector<std::string>>;
    auto fails = [](const Rows& rows, const std::string& words) {
        INFO(words);
        CHECK_THROWS_WITH(SpeciesTable::from_rows(rows), Catch::Contains(words));
    };
    fails({{"formula", "phase"}}, "column 'dHf'");
    fails({{"formula", "phase", "dHf"}, {"H2O", "l", "abc"}}, "row 2, column 'dHf'");
    fails({{"formula", "phase", "dHf"}, {"H2O", "x", "-285.83"}}, "row 2, column 'phase'");
    fails({{"formula", "phase", "dHf", "dHF"}}, "column 'dHF': unknown column");
    fails({{"formula", "phase", "dHf"}, {"H2O", "l", "1"}, {"Xq2", "l", "1"}}, "row 3, column 'formula': 'Xq' is not an element symbol");
    fails({{"formula", "phase", "dHf", "tmin", "tmax"}, {"H2O", "l", "-285.83", "300", "400"}},
          "must include 298.15 K");
    fails({{"formula", "phase", "dHf", "cp", "a"}, {"H2O", "l", "-285.83", "75", "1"}}, "row 2, column 'cp'");
}

TEST_CASE("from_csv_file reads CSV as a spreadsheet writes it", "[usertable]") {
    // A CO2(g) row with the CODATA ΔfH° (Cox et al. 1989, from memory) and an invented cp, saved
    // as "CSV UTF-8": a byte-order mark, CRLF line ends, a quoted comma and a quoted line break.
    char path[] = "/tmp/rxnheat-test-table-XXXXXX";
    const int fd = ::mkstemp(path);
    REQUIRE(fd >= 0);
    auto write_table = [&](const std::string& text) {
        std::FILE* f = std::fopen(path, "wb");
        REQUIRE(f != nullptr);
        std::fwrite(text.data(), 1, text.size(), f);
        std::fclose(f);
    };
    ::close(fd);
    const std::string head = "\xEF\xBB\xBF" "formula,phase,dHf,cp,tmin,tmax,name,source\r\n";
    write_table(head + "CO2,g,-393.51,40,298.15,400,\"carbon\r\ndioxide\",\"test, invented cp\"\r\n");
    auto& e = Engine::shared();
    const auto t = SpeciesTable::from_csv_file(path);
    CHECK(e.species_h("CO2(g)", {398.15, &t}, 298.15) == Approx(4.0).margin(1e-9));  // 40 J/(mol K) × 100 K
    CHECK(e.species_hf("CO2(g)", {298.15, &t}, "kJ/mol") == Approx(-393.51));
    // Rows are counted as a spreadsheet shows them: the row after the two-line cell is row 3.
    write_table(head + "CO2,g,-393.51,40,298.15,400,\"carbon\ndioxide\",x\r\nH2O,l,lots,,,,,\r\n");
    CHECK_THROWS_WITH(SpeciesTable::from_csv_file(path), Catch::Contains("species table row 3, column 'dHf'"));
    write_table(head + "CO2,g,\"-393.51,40\n");
    CHECK_THROWS_WITH(SpeciesTable::from_csv_file(path),
                      Catch::Contains("row 2: a quoted cell that starts on line 2 is not closed"));
    std::remove(path);
    CHECK_THROWS_WITH(SpeciesTable::from_csv_file(path), Catch::Contains("cannot read the species table file"));
    try {
        SpeciesTable::from_csv_file(RXNHEAT_SOURCE_DIR);
        FAIL("a directory read as a table");
    } catch (const rxnheat::Error& err) {
        CHECK(err.kind() == rxnheat::ErrorKind::table);
        CHECK(std::string(err.what()).find("is a directory") != std::string::npos);
    }
}
