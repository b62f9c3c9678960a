// RXNKIND and RXNCHECK through the public API (rxnheat.hpp): classification with a tolerance, and
// every problem with a reaction named in words.
#include "behaviour_helpers.hpp"

#include <cmath>
#include <regex>
#include <string>

using namespace rxnheat_test;

TEST_CASE("kind classifies with a tolerance", "[behaviour]") {
    CHECK(eng().kind(CH4_COMB) == rxnheat::HeatKind::exothermic);                                       // ΔH ≈ −890 kJ/mol (CODATA)
    CHECK(eng().kind("CH4(g) + H2O(g) -> CO(g) + 3 H2(g)", 1100) == rxnheat::HeatKind::endothermic);    // ΔH ≈ +226 kJ/mol (JANAF)
    CHECK(eng().kind("CaCO3(s) -> CaO(s) + CO2(g)") == rxnheat::HeatKind::endothermic);                 // calcination absorbs heat (common practice)
    const double wgs = eng().dh("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000);
    CHECK(eng().kind("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000, std::fabs(wgs) + 0.01) == rxnheat::HeatKind::thermoneutral);  // engine/FUNCTIONS.md, RXNKIND: |ΔH| <= tolerance
    CHECK(eng().kind("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000, std::fabs(wgs) - 0.01) == rxnheat::HeatKind::exothermic);     // engine/FUNCTIONS.md, RXNKIND
    CHECK(eng().kind(CH4_COMB, 298.15, 1000) == rxnheat::HeatKind::thermoneutral);  // engine/FUNCTIONS.md, RXNKIND: within tolerance
    CHECK(eng().report(CH4_COMB).kind == rxnheat::HeatKind::exothermic);            // cli/CLI.md, JSON results: kind in the report
    auto nan_tol = attempt([] { return eng().kind(CH4_COMB, 298.15, std::nan("")); });
    REQUIRE_ENGINE_ERROR(nan_tol);  // DEVELOPERS.md, Working rules: bad input gets a clear error
    auto neg_tol = attempt([] { return eng().kind(CH4_COMB, 298.15, -1.0); });
    REQUIRE_ENGINE_ERROR(neg_tol);  // a negative tolerance is meaningless: a clear error
    auto unbalanced = attempt([] { return eng().kind("H2(g) + O2(g) -> H2O(l)"); });
    REQUIRE_ENGINE_ERROR(unbalanced);  // engine/FUNCTIONS.md, RXNKIND: no classification of an unbalanced reaction
}

TEST_CASE("check says ok or names the problem in words", "[behaviour][check]") {
    CHECK(eng().check(CH4_COMB) == "ok");                                                 // engine/FUNCTIONS.md, RXNCHECK
    CHECK(eng().check("2H2 + O2 = 2H2O") == "ok");                                        // grammar/SYNTAX.md example
    CHECK(eng().check("CO(g) + H2O(g) -> CO2(g) + H2(g)", 1000) == "ok");                 // engine/FUNCTIONS.md, RXNCHECK
    CHECK(eng().check("CH₄(g) + 2O₂(g) → CO₂(g) + 2H₂O(l)") == "ok");                     // grammar/SYNTAX.md example (Unicode)

    // Unbalanced: each element's left and right totals (issue 2, item 4).
    {
        const std::string msg = eng().check("H2(g) + O2(g) -> H2O(l)");
        INFO("check said: " << msg);
        CHECK(msg != "ok");
        CHECK(std::regex_search(msg, std::regex(R"(\bO\b\D*2\D*\b1\b)")));  // O: 2 on the left, 1 on the right
        auto o = attempt([] { return eng().dh("H2(g) + O2(g) -> H2O(l)"); });
        REQUIRE_ENGINE_ERROR(o);
        CHECK(o.kind == ErrorKind::unbalanced);  // rxnheat.hpp ErrorKind::unbalanced
        CHECK(o.message == msg);                 // engine/FUNCTIONS.md, RXNCHECK: the same diagnosis the numeric functions fail with
    }
    {
        const std::string msg = eng().check("C3H8(g) + 5 O2(g) -> 3 CO2(g) + 3 H2O(l)");
        INFO("check said: " << msg);
        CHECK(std::regex_search(msg, std::regex(R"(\bH\b\D*8\D*\b6\b)")));  // H: 8 on the left, 6 on the right
        CHECK(std::regex_search(msg, std::regex(R"(\bO\b\D*10\D*\b9\b)"))); // O: 10 on the left, 9 on the right
    }
    {
        const std::string msg = eng().check("Na(g) -> Na+(g)");  // thermo.inp has both gas records
        INFO("check said: " << msg);
        CHECK(contains(msg, "charge"));  // engine/FUNCTIONS.md, RXNBALANCE/issue 2: charge is balanced too
    }
    // Parse errors say where (grammar/SYNTAX.md).
    {
        const std::string msg = eng().check("CH4(g) + -> CO2(g)");
        INFO("check said: " << msg);
        CHECK(contains(msg, "position"));  // grammar/SYNTAX.md: "position 14: expected ..."
        CHECK(msg != "ok");
    }
    // Unknown element symbol.
    {
        const std::string msg = eng().check("Xq2(g) -> 2 Xq(g)");
        INFO("check said: " << msg);
        CHECK(contains(msg, "Xq"));  // grammar/SYNTAX.md: only real element symbols are accepted
    }
    // Out of range: H2O(l) stops at 600 K in the data (thermo.inp record H2O(L), 273.150–600.000 K).
    {
        const std::string msg = eng().check(CH4_COMB, 1000);
        INFO("check said: " << msg);
        CHECK(contains(msg, "600"));  // engine/DATA.md, Phases: the error names the range
    }
    // Species with no data.
    {
        const std::string msg = eng().check("Xe(g) + 3 F2(g) -> XeF6(g)");
        INFO("check said: " << msg);
        CHECK(msg != "ok");
        CHECK(contains(msg, "XeF6"));  // the message names the species
    }
}
