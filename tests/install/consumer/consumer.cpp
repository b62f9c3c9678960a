// Uses the installed C++ interface: prints ΔrH° of methane combustion at 298.15 K in kJ/mol,
// and one CSV record read and written again by the installed CSV reader and writer.
#include <rxnheat/csv.hpp>
#include <rxnheat/rxnheat.hpp>

#include <cstdio>
#include <string>

int main() {
    rxnheat::csv::Reader reader(std::string_view("\xEF\xBB\xBF\"a, b\",c\r\n"));
    rxnheat::csv::Record rec;
    std::string row;
    if (reader.next(rec)) rxnheat::csv::append_row(row, rec.cells);
    std::printf("csv: %s", row.c_str());
    try {
        const double dh = rxnheat::Engine::shared().dh("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)");
        std::printf("%.2f\n", dh);
        rxnheat::Engine::shared().dh("H2 + O2 -> H2O");
        return 3;  // an unbalanced reaction must throw
    } catch (const rxnheat::Error& e) {
        std::printf("error: %s\n", e.what());
        return e.kind() == rxnheat::ErrorKind::unbalanced ? 0 : 4;
    }
}
