// Reaction enthalpies of industrial reactions, engine against
//  (a) a second, deliberately simple evaluation of the NASA Glenn coefficient file
//      (data/nasa-glenn/thermo.inp, McBride, Zehe & Gordon, NASA/TP-2002-211556, 2002), written
//      here without any engine code: each record is found by its exact name, its intervals are
//      read by fixed columns, and H°(T) = R·T·(−a1/T² + a2·lnT/T + a3 + a4·T/2 + a5·T²/3 +
//      a6·T³/4 + a7·T⁴/5 + b1/T) with R = 8.314510 J/(mol·K), the value the coefficients were
//      fitted with (NASA/TP-2002-211556). ΔrH° = Σ ν·H°(T). Agreement within 0.1 kJ/mol.
//  (b) reaction values derived from CODATA Key Values (Cox et al. 1989) and NIST-JANAF (Chase
//      1998) formation enthalpies and sensible heats, typed from memory; the tolerance is the sum
//      of |ν|·(stated uncertainty) of the formation enthalpies used.
#include <catch2/catch.hpp>

#include <rxnheat/rxnheat.hpp>

#include "nasa_simple_evaluator.hpp"

#include <cmath>
#include <fstream>
#include <map>
#include <sstream>
#include <stdexcept>
#include <string>
#include <vector>

namespace {

using rxnheat_test::thermo_file;

struct Part {
    double nu;            // signed: reactants < 0
    const char* record;   // exact NASA record name at the temperature of the case
};

struct Case {
    const char* reaction;
    double T;
    std::vector<Part> parts;
};

double simple_dH_kJ(const Case& c) {
    double sum = 0;
    for (const auto& p : c.parts) sum += p.nu * thermo_file().H(p.record, c.T);
    return sum / 1000.0;
}

}  // namespace

TEST_CASE("the simple evaluator reads the file as published", "[reference][reaction]") {
    // Self-check of the test's own evaluator against numbers printed in the file's headers
    // (NASA/TP-2002-211556 convention: the assigned enthalpy at 298.15 K is ΔfH°).
    CHECK(thermo_file().H("CO2", 298.15) / 1000 == Approx(-393.510).margin(0.002));   // thermo.inp header of CO2: -393510.000
    CHECK(thermo_file().H("H2O(L)", 298.15) / 1000 == Approx(-285.830).margin(0.002)); // thermo.inp header of H2O(L): -285830.000
    CHECK(thermo_file().H("N2", 298.15) / 1000 == Approx(0.0).margin(0.002));         // reference element, thermo.inp header 0.000
    // Sensible heat of N2 to 1000 K: 21.463 kJ/mol (NIST-JANAF 1998, from memory).
    CHECK((thermo_file().H("N2", 1000) - thermo_file().H("N2", 298.15)) / 1000 == Approx(21.463).margin(0.02));  // JANAF, from memory
}

TEST_CASE("industrial reaction enthalpies against an independent evaluation of thermo.inp", "[reference][reaction]") {
    // Record names chosen by hand for the temperature of each case: the gas records (no phase
    // suffix), H2O(L) for liquid water, C(gr) graphite, CaCO3(cr) calcite, CaO(cr), Fe2O3(cr)
    // hematite (below its Curie point up to 960 K, above it beyond), Fe(a) alpha iron (below and
    // above its Curie point 1042 K), CH3OH(L), C2H5OH(L).
    const std::vector<Case> cases = {
        // combustion of fuels
        {"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)", 298.15, {{-1, "CH4"}, {-2, "O2"}, {1, "CO2"}, {2, "H2O(L)"}}},
        {"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)", 298.15, {{-1, "CH4"}, {-2, "O2"}, {1, "CO2"}, {2, "H2O"}}},
        {"CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)", 1000, {{-1, "CH4"}, {-2, "O2"}, {1, "CO2"}, {2, "H2O"}}},
        {"C2H6(g) + 7/2 O2(g) -> 2 CO2(g) + 3 H2O(l)", 298.15, {{-1, "C2H6"}, {-3.5, "O2"}, {2, "CO2"}, {3, "H2O(L)"}}},
        {"2 C2H6(g) + 7 O2(g) -> 4 CO2(g) + 6 H2O(g)", 1200, {{-2, "C2H6"}, {-7, "O2"}, {4, "CO2"}, {6, "H2O"}}},
        {"C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)", 298.15, {{-1, "C3H8"}, {-5, "O2"}, {3, "CO2"}, {4, "H2O(L)"}}},
        {"C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(g)", 800, {{-1, "C3H8"}, {-5, "O2"}, {3, "CO2"}, {4, "H2O"}}},
        {"n-butane(g) + 13/2 O2(g) -> 4 CO2(g) + 5 H2O(l)", 298.15, {{-1, "C4H10,n-butane"}, {-6.5, "O2"}, {4, "CO2"}, {5, "H2O(L)"}}},
        {"n-butane(g) + 6.5 O2(g) -> 4 CO2(g) + 5 H2O(g)", 900, {{-1, "C4H10,n-butane"}, {-6.5, "O2"}, {4, "CO2"}, {5, "H2O"}}},
        {"H2(g) + 1/2 O2(g) -> H2O(l)", 298.15, {{-1, "H2"}, {-0.5, "O2"}, {1, "H2O(L)"}}},
        {"2 H2(g) + O2(g) -> 2 H2O(g)", 1500, {{-2, "H2"}, {-1, "O2"}, {2, "H2O"}}},
        {"CO(g) + 1/2 O2(g) -> CO2(g)", 298.15, {{-1, "CO"}, {-0.5, "O2"}, {1, "CO2"}}},
        {"CO(g) + 1/2 O2(g) -> CO2(g)", 1200, {{-1, "CO"}, {-0.5, "O2"}, {1, "CO2"}}},
        {"C(s) + O2(g) -> CO2(g)", 298.15, {{-1, "C(gr)"}, {-1, "O2"}, {1, "CO2"}}},
        {"C(s) + O2(g) -> CO2(g)", 1000, {{-1, "C(gr)"}, {-1, "O2"}, {1, "CO2"}}},
        {"CH3OH(l) + 3/2 O2(g) -> CO2(g) + 2 H2O(l)", 298.15, {{-1, "CH3OH(L)"}, {-1.5, "O2"}, {1, "CO2"}, {2, "H2O(L)"}}},
        {"methanol(g) + 3/2 O2(g) -> CO2(g) + 2 H2O(g)", 600, {{-1, "CH3OH"}, {-1.5, "O2"}, {1, "CO2"}, {2, "H2O"}}},
        {"ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)", 298.15, {{-1, "C2H5OH(L)"}, {-3, "O2"}, {2, "CO2"}, {3, "H2O(L)"}}},
        {"C2H5OH(g) + 3 O2(g) -> 2 CO2(g) + 3 H2O(g)", 700, {{-1, "C2H5OH"}, {-3, "O2"}, {2, "CO2"}, {3, "H2O"}}},
        // steam reforming and water-gas shift
        {"CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", 298.15, {{-1, "CH4"}, {-1, "H2O"}, {1, "CO"}, {3, "H2"}}},
        {"CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", 1100, {{-1, "CH4"}, {-1, "H2O"}, {1, "CO"}, {3, "H2"}}},
        {"CO(g) + H2O(g) -> CO2(g) + H2(g)", 298.15, {{-1, "CO"}, {-1, "H2O"}, {1, "CO2"}, {1, "H2"}}},
        {"CO(g) + H2O(g) -> CO2(g) + H2(g)", 700, {{-1, "CO"}, {-1, "H2O"}, {1, "CO2"}, {1, "H2"}}},
        {"CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000, {{-1, "CO"}, {-1, "H2O"}, {1, "CO2"}, {1, "H2"}}},
        // ammonia synthesis and oxidation
        {"N2(g) + 3 H2(g) -> 2 NH3(g)", 298.15, {{-1, "N2"}, {-3, "H2"}, {2, "NH3"}}},
        {"N2(g) + 3 H2(g) -> 2 NH3(g)", 700, {{-1, "N2"}, {-3, "H2"}, {2, "NH3"}}},
        {"4 NH3(g) + 5 O2(g) -> 4 NO(g) + 6 H2O(g)", 298.15, {{-4, "NH3"}, {-5, "O2"}, {4, "NO"}, {6, "H2O"}}},
        {"4 NH3(g) + 5 O2(g) -> 4 NO(g) + 6 H2O(g)", 1173, {{-4, "NH3"}, {-5, "O2"}, {4, "NO"}, {6, "H2O"}}},
        // methanol synthesis
        {"CO(g) + 2 H2(g) -> CH3OH(g)", 298.15, {{-1, "CO"}, {-2, "H2"}, {1, "CH3OH"}}},
        {"CO(g) + 2 H2(g) -> CH3OH(g)", 523, {{-1, "CO"}, {-2, "H2"}, {1, "CH3OH"}}},
        {"CO2(g) + 3 H2(g) -> CH3OH(g) + H2O(g)", 298.15, {{-1, "CO2"}, {-3, "H2"}, {1, "CH3OH"}, {1, "H2O"}}},
        {"CO2(g) + 3 H2(g) -> CH3OH(g) + H2O(g)", 523, {{-1, "CO2"}, {-3, "H2"}, {1, "CH3OH"}, {1, "H2O"}}},
        // lime calcination
        {"CaCO3(s) -> CaO(s) + CO2(g)", 298.15, {{-1, "CaCO3(cr)"}, {1, "CaO(cr)"}, {1, "CO2"}}},
        {"CaCO3(s) -> CaO(s) + CO2(g)", 1173, {{-1, "CaCO3(cr)"}, {1, "CaO(cr)"}, {1, "CO2"}}},
        // sulfur dioxide oxidation (contact process)
        {"SO2(g) + 1/2 O2(g) -> SO3(g)", 298.15, {{-1, "SO2"}, {-0.5, "O2"}, {1, "SO3"}}},
        {"SO2(g) + 0.5 O2(g) ⇌ SO3(g)", 700, {{-1, "SO2"}, {-0.5, "O2"}, {1, "SO3"}}},
        // iron-ore reduction
        {"Fe2O3(s) + 3 CO(g) -> 2 Fe(s) + 3 CO2(g)", 298.15, {{-1, "Fe2O3(cr)"}, {-3, "CO"}, {2, "Fe(a)"}, {3, "CO2"}}},
        {"Fe2O3(s) + 3 CO(g) -> 2 Fe(s) + 3 CO2(g)", 1100, {{-1, "Fe2O3(cr)"}, {-3, "CO"}, {2, "Fe(a)"}, {3, "CO2"}}},
        {"Fe2O3(s) + 3 H2(g) -> 2 Fe(s) + 3 H2O(g)", 298.15, {{-1, "Fe2O3(cr)"}, {-3, "H2"}, {2, "Fe(a)"}, {3, "H2O"}}},
        {"Fe2O3(s) + 3 H2(g) -> 2 Fe(s) + 3 H2O(g)", 1100, {{-1, "Fe2O3(cr)"}, {-3, "H2"}, {2, "Fe(a)"}, {3, "H2O"}}},
        {"Fe2O3(s) + 3 H2(g) -> 2 Fe(s) + 3 H2O(g)", 1300, {{-1, "Fe2O3(cr)"}, {-3, "H2"}, {2, "Fe(c)"}, {3, "H2O"}}},
        // Boudouard
        {"C(s) + CO2(g) -> 2 CO(g)", 298.15, {{-1, "C(gr)"}, {-1, "CO2"}, {2, "CO"}}},
        {"C(s) + CO2(g) -> 2 CO(g)", 1000, {{-1, "C(gr)"}, {-1, "CO2"}, {2, "CO"}}},
    };
    auto& eng = rxnheat::Engine::shared();
    int distinct = 0;
    double worst = 0;
    std::string worst_case;
    for (const auto& c : cases) {
        const double expected = simple_dH_kJ(c);
        INFO(c.reaction << " at " << c.T << " K: independent evaluation of thermo.inp gives " << expected << " kJ/mol");
        double v = std::nan("");
        try {
            v = eng.dh(c.reaction, c.T);
        } catch (const std::exception& e) {
            FAIL_CHECK("engine threw: " << e.what());
            continue;
        }
        CHECK(v == Approx(expected).margin(0.1));  // NASA Glenn thermo.inp, second simple evaluation (above)
        ++distinct;
        if (std::fabs(v - expected) > worst) {
            worst = std::fabs(v - expected);
            worst_case = std::string(c.reaction) + " at " + std::to_string(c.T) + " K";
        }
    }
    WARN(cases.size() << " reaction cases; largest |engine - independent evaluation| = " << worst
         << " kJ/mol (" << worst_case << ")");
    CHECK(distinct == static_cast<int>(cases.size()));
}

TEST_CASE("reaction enthalpies against CODATA / JANAF derived values", "[reference][reaction]") {
    auto& eng = rxnheat::Engine::shared();
    // Formation enthalpies at 298.15 K, kJ/mol, with stated uncertainties (from memory):
    const double CO2 = -393.51, uCO2 = 0.13;      // CODATA Key Values 1989, from memory
    const double CO = -110.53, uCO = 0.17;        // CODATA Key Values 1989, from memory
    const double H2Ol = -285.830, uH2Ol = 0.040;  // CODATA Key Values 1989, from memory
    const double H2Og = -241.826, uH2Og = 0.040;  // CODATA Key Values 1989, from memory
    const double NH3 = -45.94, uNH3 = 0.35;       // CODATA Key Values 1989, from memory
    const double CH4 = -74.873, uCH4 = 0.34;      // NIST-JANAF 1998, from memory
    // Sensible heats H(1000 K) − H(298.15 K), kJ/mol (NIST-JANAF 1998, from memory):
    const double hCO2 = 33.397, hCO = 21.686, hH2 = 20.680, hH2O = 26.000, hCH4 = 38.179;

    // CH4 combustion to liquid water: 2·(−285.830) − 393.51 + 74.873 = −890.297 (≈ −890.3 to −890.6
    // depending on the CH4 value used; NASA's Gurvich CH4 gives the larger magnitude).
    CHECK(eng.dh("CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)") ==
          Approx(CO2 + 2 * H2Ol - CH4).margin(uCO2 + 2 * uH2Ol + uCH4));  // CODATA + JANAF, from memory
    // H2 combustion (HHV and LHV per mol).
    CHECK(eng.dh("H2(g) + 1/2 O2(g) -> H2O(l)") == Approx(H2Ol).margin(uH2Ol));  // CODATA, from memory
    CHECK(eng.dh("H2(g) + 1/2 O2(g) -> H2O(g)") == Approx(H2Og).margin(uH2Og));  // CODATA, from memory
    // CO and graphite combustion.
    CHECK(eng.dh("CO(g) + 1/2 O2(g) -> CO2(g)") == Approx(CO2 - CO).margin(uCO2 + uCO));  // CODATA, from memory
    CHECK(eng.dh("C(s) + O2(g) -> CO2(g)") == Approx(CO2).margin(uCO2));                 // CODATA, from memory
    // Boudouard: 2·(−110.53) + 393.51 = 172.45.
    CHECK(eng.dh("C(s) + CO2(g) -> 2 CO(g)") == Approx(2 * CO - CO2).margin(2 * uCO + uCO2));  // CODATA, from memory
    // Ammonia synthesis: 2·(−45.94) = −91.88.
    CHECK(eng.dh("N2(g) + 3 H2(g) -> 2 NH3(g)") == Approx(2 * NH3).margin(2 * uNH3));  // CODATA, from memory
    // Water-gas shift at 298.15 K: −41.154 (≈ −41.16).
    const double wgs298 = CO2 - CO - H2Og;
    CHECK(wgs298 == Approx(-41.16).margin(0.01));  // self-check of the arithmetic above (-41.154)
    CHECK(eng.dh("CO(g) + H2O(g) -> CO2(g) + H2(g)") == Approx(wgs298).margin(uCO2 + uCO + uH2Og));  // CODATA, from memory
    // Water-gas shift at 1000 K: −41.154 + (33.397 + 20.680 − 21.686 − 26.000) = −34.763 (JANAF's
    // own ΔfH(1000 K) values −394.623, −111.983, −247.857 give −34.783; both ≈ −34.8).
    const double wgs1000 = wgs298 + (hCO2 + hH2 - hCO - hH2O);
    CHECK(eng.dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) ==
          Approx(wgs1000).margin(uCO2 + uCO + uH2Og + 0.04));  // CODATA + JANAF sensible heats, from memory
    CHECK(eng.dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) ==
          Approx(-394.623 + 111.983 + 247.857).margin(uCO2 + uCO + uH2Og));  // JANAF ΔfH at 1000 K, from memory
    // Steam reforming at 298.15 and 1000 K.
    const double sr298 = CO - CH4 - H2Og;
    CHECK(eng.dh("CH4(g) + H2O(g) -> CO(g) + 3 H2(g)") == Approx(sr298).margin(uCO + uCH4 + uH2Og));  // CODATA + JANAF, from memory
    const double sr1000 = sr298 + (hCO + 3 * hH2 - hCH4 - hH2O);
    CHECK(eng.dh("CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", 1000) ==
          Approx(sr1000).margin(uCO + uCH4 + uH2Og + 0.08 + 0.51));  // CODATA + JANAF sensible heats, from memory
    // (+0.51: NASA's CH4 is Gurvich 1991, whose H(1000)-H(298.15) is 0.51 kJ/mol above JANAF's.)
}
