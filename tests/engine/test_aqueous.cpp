// The built-in aqueous table, data/aqueous.csv (engine/DATA.md, Aqueous): (aq) species and
// charged species written without a phase. The table's values were typed from memory from the
// NBS tables (Wagman et al. 1982) and the CODATA Key Values (Cox et al. 1989), so the checks
// here are consistency checks against heats of reaction that are common practice to quote
// (textbook values), each named beside it, plus the engine's rules for the table.
#include "behaviour_helpers.hpp"

#include "database.hpp"
#include "tables.hpp"

#include <set>

using rxnheat::Error;
using rxnheat::SpeciesTable;
using rxnheat_test::contains;
using rxnheat_test::eng;

TEST_CASE("aqueous table: its rows load, each with a source and the from-memory flag", "[aqueous]") {
    const auto& rows = rxnheat::detail::Database::get().aqueous_rows();
    CHECK(rows.size() >= 60);
    std::set<std::string> labels;
    for (const auto& a : rows) {
        INFO(a.row.formula);
        labels.insert(a.label);
        CHECK((a.row.source.rfind("NBS 1982", 0) == 0 || a.row.source.rfind("CODATA 1989", 0) == 0));
        // Only the zeros of H+(aq), a convention, are not from memory.
        CHECK(a.row.from_memory == (a.label != "H+"));
        CHECK(a.molar_mass > 0);
    }
    // The species the table was asked to hold.
    for (const char* f : {"H+", "OH-", "Li+", "Na+", "K+", "Rb+", "Cs+", "Mg^2+", "Ca^2+", "Sr^2+", "Ba^2+", "NH4+",
                          "Fe^2+", "Fe^3+", "Cu^2+", "Zn^2+", "Al^3+", "F-", "Cl-", "Br-", "I-", "NO3-", "NO2-",
                          "SO4^2-", "HSO4-", "SO3^2-", "CO3^2-", "HCO3-", "PO4^3-", "HPO4^2-", "H2PO4-",
                          "CH3COO-", "CN-", "ClO-", "S^2-", "HS-", "CO2", "NH3", "H2S", "SO2", "O2", "H2", "HCN",
                          "C2H5OH"}) {
        INFO(f);
        CHECK(labels.count(f) == 1);
    }
    // The source text names the file, the row's source in full and the flag.
    const std::string src = eng().source("SO4^2-(aq)");
    CHECK(contains(src, "SO4^2-(aq): data/aqueous.csv line"));
    CHECK(contains(src, "Cox, Wagman & Medvedev 1989"));
    CHECK(contains(src, "Wagman et al. 1982"));  // its Cp° is the NBS value
    CHECK(contains(src, "typed from memory"));
    CHECK(contains(eng().source("Fe^3+(aq)"), "NBS tables of chemical thermodynamic properties, Wagman et al. 1982"));
}

TEST_CASE("aqueous table: strong acid + strong base neutralisation", "[aqueous][consistency]") {
    // Common practice: the heat of neutralisation of a strong acid by a strong base in dilute
    // solution is −55.8 kJ/mol at 25 °C. From the data: ΔfH°(H2O, l) −285.830 (NASA Glenn,
    // the CODATA value) − ΔfH°(OH−, aq) −230.015 (CODATA 1989, from memory) = −55.815.
    CHECK(eng().dh("H+(aq) + OH-(aq) -> H2O(l)") == Approx(-55.8).margin(0.1));
    CHECK(eng().dh("H+(aq) + OH-(aq) -> H2O(l)") == Approx(-55.815).margin(1e-6));
    // A charged species without a phase is aqueous: the same reaction.
    CHECK(eng().dh("H+ + OH- -> H2O") == Approx(-55.815).margin(1e-6));
    CHECK(eng().report("H+ + OH- -> H2O").canonical == "H+(aq) + OH-(aq) -> H2O(l)");
    CHECK(eng().check("H+ + OH- -> H2O") == "ok");
}

TEST_CASE("aqueous table: NaOH(s) dissolving", "[aqueous][consistency]") {
    // Common practice: the integral heat of solution of NaOH at infinite dilution is about
    // −44.5 kJ/mol. NASA Glenn NaOH(a) −425.800; Na+ −240.34 and OH− −230.015 (CODATA 1989,
    // from memory): −44.555.
    CHECK(eng().dh("NaOH(s) -> Na+ + OH-") == Approx(-44.5).margin(0.3));
    CHECK(eng().check("NaOH(s) -> Na+ + OH-") == "ok");
}

TEST_CASE("aqueous table: NH4NO3(s) dissolving is endothermic", "[aqueous][consistency]") {
    // Common practice: ammonium nitrate dissolves endothermically (cold packs), about
    // +25.7 kJ/mol at infinite dilution. NASA Glenn NH4NO3(IV) −365.600; NH4+ −133.26 and NO3−
    // −206.85 (CODATA 1989, from memory): +25.49.
    CHECK(eng().dh("NH4NO3(s) -> NH4+ + NO3-") == Approx(25.7).margin(0.5));
    CHECK(eng().kind("NH4NO3(s) -> NH4+ + NO3-") == rxnheat::HeatKind::endothermic);
    CHECK(eng().check("NH4NO3(s) -> NH4+ + NO3-") == "ok");
}

TEST_CASE("aqueous table: H2SO4(l) dissolving fully dissociated", "[aqueous][consistency]") {
    // Common practice: about −96 kJ/mol for sulfuric acid to 2 H+ + SO4^2− at infinite dilution.
    // NASA Glenn H2SO4(L) −813.989; SO4^2− −909.34 (CODATA 1989, from memory): −95.35.
    CHECK(eng().dh("H2SO4(l) -> 2 H+ + SO4^2-") == Approx(-96).margin(1.0));
    CHECK(eng().check("H2SO4(l) -> 2 H+ + SO4^2-") == "ok");
}

TEST_CASE("aqueous table: more heats of solution", "[aqueous][consistency]") {
    // Common practice (textbook heats of solution at infinite dilution, 25 °C), against the
    // NASA Glenn solids/gases and the table's ions (from memory): a cross-check of several rows.
    CHECK(eng().dh("NaCl(s) -> Na+ + Cl-") == Approx(3.9).margin(0.3));   // about +3.9 kJ/mol
    CHECK(eng().dh("KCl(s) -> K+ + Cl-") == Approx(17.2).margin(0.3));    // about +17.2 kJ/mol
    CHECK(eng().dh("HCl(g) -> H+ + Cl-") == Approx(-74.8).margin(0.3));   // about −74.8 kJ/mol
    for (const char* r : {"NaCl(s) -> Na+ + Cl-", "KCl(s) -> K+ + Cl-", "HCl(g) -> H+ + Cl-"}) CHECK(eng().check(r) == "ok");
}

TEST_CASE("aqueous table: ionic reactions must balance charge", "[aqueous][consistency]") {
    // Common practice: an ionic equation balances charge as well as atoms.
    for (const char* r : {"H+ + OH- -> H2O", "NaOH(s) -> Na+ + OH-", "NH4NO3(s) -> NH4+ + NO3-",
                          "H2SO4(l) -> 2 H+ + SO4^2-"})
        CHECK(eng().check(r) == "ok");
    // The same atoms with a charge left over: named, never evaluated.
    const std::string why = eng().check("H2SO4(l) -> H+ + HSO4- + H+ + SO4^2-");
    CHECK(why != "ok");
    const std::string q = eng().check("NaOH(s) -> Na+ + OH^2-");
    CHECK(contains(q, "charge"));
    CHECK_THROWS_AS(eng().dh("NaOH(s) -> Na+ + OH^2-"), Error);
    // The balancer keeps the charge balanced: SO4^2- takes two H+.
    CHECK(eng().balance("H2SO4(l) -> H+ + SO4^2-") == "H2SO4(l) -> 2 H+ + SO4^2-");
}

TEST_CASE("aqueous table: away from 298.15 K", "[aqueous][temperature]") {
    // OH−(aq) has Cp° (NBS 1982, from memory: −148.5 J/(mol·K)); H+ has 0 by convention. At
    // 310 K the neutralisation is ΔrH°(298.15) + ∫ΔCp dT, with H2O(l) from its NASA record.
    const double dT = 310 - 298.15;
    const double water = eng().species_h("H2O(l)", 310, 298.15);  // kJ/mol, NASA Glenn
    CHECK(eng().dh("H+ + OH- -> H2O", 310) == Approx(-55.815 + water + 0.1485 * dT).margin(1e-6));
    // Common practice: the heat of neutralisation grows less exothermic with temperature, about
    // 0.2 kJ/mol per kelvin near 25 °C.
    CHECK((eng().dh("H+ + OH- -> H2O", 310) - eng().dh("H+ + OH- -> H2O")) / dT == Approx(0.22).margin(0.03));
    CHECK(eng().species_cp("OH-", 350) == Approx(-148.5));
    CHECK(eng().species_s("OH-", 350) == Approx(-10.90 - 148.5 * std::log(350 / 298.15)).margin(1e-9));
    CHECK(contains(eng().source("OH-", 310), "Cp° held constant at -148.5 J/(mol·K) (an assumption; used only within 273.15–373.15 K)"));
    CHECK_FALSE(contains(eng().source("OH-"), "held constant"));
    // Outside the window: an error naming it.
    CHECK_THROWS_WITH(eng().dh("H+ + OH- -> H2O", 400), Catch::Contains("273.15–373.15 K"));
    CHECK_THROWS_WITH(eng().dh("H+ + OH- -> H2O", 263.15), Catch::Contains("273.15–373.15 K"));
    // A row without Cp° holds at 298.15 K only.
    CHECK(eng().dh("CO2(g) -> CO2(aq)") == Approx(-413.26 + 393.51).margin(0.01));  // CODATA 1989, from memory
    CHECK_THROWS_WITH(eng().dh("CO2(g) -> CO2(aq)", 310), Catch::Contains("298.15 K only"));
    CHECK_THROWS_AS(eng().species_cp("CO2(aq)", 298.15), Error);
    // ΔfH° of an ion away from 298.15 K is formed on the H+(aq) convention: H+ stays 0.
    CHECK(eng().species_hf("H+", {310}, "kJ/mol") == Approx(0).margin(1e-9));
    // species report: the window as the range
    const auto r = eng().species_report("Na+", 320);
    CHECK(r.species == "Na+(aq)");
    CHECK(r.record == "data/aqueous.csv Na+");
    CHECK(r.dHf_kJ_per_mol == Approx(-240.34));
    CHECK(r.has_heat_capacity);
    CHECK(r.tmin_K == Approx(273.15));
    CHECK(r.tmax_K == Approx(373.15));
    CHECK(r.Cp_J_per_molK == Approx(46.4));
    CHECK(r.dH_sensible_kJ_per_mol == Approx(0.0464 * (320 - 298.15)));
    CHECK_FALSE(eng().species_report("Fe^3+").has_heat_capacity);
}

TEST_CASE("aqueous table: names, formulas and species it does not hold", "[aqueous][identity]") {
    // A neutral solute by its name column or its formula.
    CHECK(eng().species_hf("ethanol(aq)") == Approx(-288.3));  // NBS 1982, from memory
    CHECK(eng().species_hf("C2H5OH(aq)") == Approx(-288.3));
    CHECK(eng().species_report("ethanol(aq)").species == "ethanol(aq)");
    // A neutral formula without a phase is not aqueous: CO2 is the gas.
    CHECK(eng().species_report("CO2").species == "CO2(g)");
    // The same atoms under another formula: said, never taken.
    CHECK_THROWS_WITH(eng().dh("H+ + HO- -> H2O"), Catch::Contains("has this composition as OH-(aq)"));
    // An aqueous species the table does not hold is an unknown species, naming the table.
    CHECK_THROWS_WITH(eng().species_hf("Au+"), Catch::Contains("data/aqueous.csv"));
    CHECK_THROWS_WITH(eng().species_hf("Au+"), Catch::Contains("(g) for the gas-phase ion"));
    CHECK_THROWS_WITH(eng().species_hf("C6H6(aq)"), Catch::Contains("aqueous table (data/aqueous.csv"));
    CHECK_THROWS_WITH(eng().species_hf("ethane(aq)"), Catch::Contains("has no ethane(aq)"));
    CHECK_THROWS_WITH(eng().species_hf("frobnium(aq)"), Catch::Contains("is not a name rxnheat knows"));
    try {
        eng().species_hf("Au+");
        FAIL("no error");
    } catch (const Error& e) {
        CHECK(e.kind() == rxnheat::ErrorKind::unknown_species);
    }
    // A gas-phase ion is still the NASA record when (g) is written.
    CHECK(contains(eng().source("Na+(g)"), "NASA Glenn"));
}

TEST_CASE("aqueous table: a user species table row overrides it", "[aqueous][usertable]") {
    // A deliberately different OH− row, so the override is visible.
    const auto t = SpeciesTable::from_rows({{"formula", "phase", "dHf", "source"}, {"OH-", "aq", "-230", "plant lab"}});
    CHECK(eng().dh("H+ + OH- -> H2O", {298.15, &t}) == Approx(-55.830).margin(1e-6));
    CHECK(contains(eng().source("H+ + OH- -> H2O", {298.15, &t}), "OH-(aq): user species table row 2"));
    CHECK(contains(eng().source("H+ + OH- -> H2O", {298.15, &t}), "H+(aq): data/aqueous.csv"));
}

TEST_CASE("aqueous table: the reader refuses malformed rows", "[aqueous][tables]") {
    using rxnheat::detail::parse_aqueous_csv;
    const std::string hdr = "formula,name,dHf_kJ_per_mol,S_J_per_molK,Cp_J_per_molK,source,from_memory\n";
    CHECK(parse_aqueous_csv(hdr + "Na+,,-240.34,58.45,46.4,CODATA 1989,yes\n").size() == 1);
    CHECK_THROWS_WITH(parse_aqueous_csv(hdr + "Na+,,x,58.45,,NBS 1982,yes\n"),
                      Catch::Contains("aqueous.csv line 2: column 'dHf_kJ_per_mol'"));
    CHECK_THROWS_WITH(parse_aqueous_csv(hdr + "Na+,,-240,58,,JANAF,yes\n"), Catch::Contains("column 'source'"));
    CHECK_THROWS_WITH(parse_aqueous_csv(hdr + "Na+,,-240,58,,NBS 1982,maybe\n"), Catch::Contains("from_memory"));
    CHECK_THROWS_WITH(parse_aqueous_csv(hdr + "Na+,,-240,58,,NBS 1982,yes\nNa+,,-240,58,,NBS 1982,yes\n"),
                      Catch::Contains("repeats line 2"));
    CHECK_THROWS_WITH(parse_aqueous_csv(hdr + "Na+(aq),,-240,58,,NBS 1982,yes\n"), Catch::Contains("without a phase"));
    CHECK_THROWS_WITH(parse_aqueous_csv("formula,dHf_kJ_per_mol\n"), Catch::Contains("lacks the column"));
}
