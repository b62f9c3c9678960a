// RXNHESS and RXNHESSPLAN (Engine::hess, Engine::hess_plan, and through the catalogue): the
// target as an exact combination of the user's steps, ΔH from the steps' given values.
//
// Sources: CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989) for the ΔfH° of
// CO2(g), CO(g) and H2O(l) used as step values; the NASA Glenn data (NASA/TP-2002-211556, through
// the engine's own RXNDH) where a combination must reproduce the direct result; the rest is
// algebra (Hess's law, common practice): the combination is exact, so Σ xᵢ·ΔHᵢ holds for any
// values, which is why some checks use plain numbers such as 10 and 3.
#include "behaviour_helpers.hpp"

#include <rxnheat/catalogue.hpp>

using Catch::Matchers::Contains;
using rxnheat::Engine;
using rxnheat::HessStep;

namespace {

std::vector<HessStep> steps_of(std::initializer_list<std::pair<const char*, double>> rows) {
    std::vector<HessStep> out;
    std::size_t n = 0;
    for (const auto& [r, v] : rows) out.push_back({++n, r, v});
    return out;
}

std::string error_of(const std::function<void()>& f) {
    try {
        f();
    } catch (const rxnheat::Error& e) {
        return e.what();
    }
    return "(no error)";
}

}  // namespace

TEST_CASE("Hess: carbon monoxide from the two combustions, CODATA values", "[hess]") {
    // CODATA Key Values (Cox et al. 1989): ΔfH°(CO2, g) = −393.51 kJ/mol, ΔfH°(CO, g) = −110.53
    // kJ/mol, so CO + ½ O2 → CO2 has ΔH = −282.98 kJ/mol. The target is (1) − (2).
    const auto steps =
        steps_of({{"C(s) + O2(g) -> CO2(g)", -393.51}, {"CO(g) + 1/2 O2(g) -> CO2(g)", -282.98}});
    const char* target = "C(s) + 1/2 O2(g) -> CO(g)";
    CHECK(rxnheat_test::eng().hess_plan(target, steps) == "1×(1) − 1×(2)");
    CHECK(rxnheat_test::eng().hess(target, steps) == Approx(-110.53).margin(1e-9));  // CODATA ΔfH°(CO, g)
    // The unit applies to the step values and to the result: the same numbers in kcal/mol.
    auto kcal = steps;
    for (auto& s : kcal) s.dh /= 4.184;  // thermochemical calorie, exact by definition
    CHECK(rxnheat_test::eng().hess(target, kcal, "kcal/mol") == Approx(-110.53 / 4.184).epsilon(1e-12));
    CHECK(rxnheat_test::eng().hess(target, steps, "J/mol") ==
          Approx(-110.53).margin(1e-9));  // the numbers are J/mol then
}

TEST_CASE("Hess: fractions and signs, exact for any step values", "[hess]") {
    // Water-gas shift from the two combustions: CO + H2O → CO2 + H2 = ½(2) − ½(1).
    const auto steps = steps_of({{"2 H2(g) + O2(g) -> 2 H2O(g)", 10}, {"2 CO(g) + O2(g) -> 2 CO2(g)", 3}});
    const char* target = "CO(g) + H2O(g) -> CO2(g) + H2(g)";
    CHECK(rxnheat_test::eng().hess_plan(target, steps) == "−1/2×(1) + 1/2×(2)");
    CHECK(rxnheat_test::eng().hess(target, steps) == Approx(0.5 * 3 - 0.5 * 10).margin(1e-12));
    // Species on both sides of a step net out; a target written backwards flips every sign.
    CHECK(rxnheat_test::eng().hess_plan("CO2(g) + H2(g) -> CO(g) + H2O(g)", steps) == "1/2×(1) − 1/2×(2)");
}

TEST_CASE("Hess: steps whose values come from the data reproduce the direct result", "[hess]") {
    // ΔfH° of methane and of liquid ethanol from the combustions of C, H2 and the fuel, each step's
    // ΔH from RXNDH on the NASA Glenn data at several temperatures: the combination must equal
    // RXNDH of the target itself (Hess's law on one data set, common practice).
    auto& e = rxnheat_test::eng();
    struct Case {
        const char* target;
        std::vector<const char*> steps;
        const char* plan;
    };
    const std::vector<Case> cases = {
        {"C(s) + 2 H2(g) -> CH4(g)",
         {"C(s) + O2(g) -> CO2(g)", "H2(g) + 1/2 O2(g) -> H2O(g)", "CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)"},
         "1×(1) + 2×(2) − 1×(3)"},
        {"2 C(s) + 3 H2(g) + 1/2 O2(g) -> C2H5OH(l)",
         {"C(s) + O2(g) -> CO2(g)", "H2(g) + 1/2 O2(g) -> H2O(l)",
          "C2H5OH(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)"},
         "2×(1) + 3×(2) − 1×(3)"},
        {"N2(g) + 3 H2(g) -> 2 NH3(g)",
         {"4 NH3(g) + 3 O2(g) -> 2 N2(g) + 6 H2O(g)", "2 H2(g) + O2(g) -> 2 H2O(g)"},
         "−1/2×(1) + 3/2×(2)"},
    };
    for (const double T : {298.15, 320.0, 340.0}) {
        for (const auto& c : cases) {
            std::vector<HessStep> steps;
            for (std::size_t i = 0; i < c.steps.size(); ++i)
                steps.push_back({i + 1, c.steps[i], e.dh(c.steps[i], T)});
            INFO(c.target << " at " << T << " K");
            CHECK(e.hess_plan(c.target, steps) == c.plan);
            const double direct = e.dh(c.target, T);
            CHECK(e.hess(c.target, steps) == Approx(direct).epsilon(1e-12).margin(1e-9));
        }
    }
}

TEST_CASE("Hess: dependent steps are used when they agree and refused when they do not", "[hess]") {
    auto& e = rxnheat_test::eng();
    // Step 3 is twice step 2: a redundant step. With a consistent value the answer is the same.
    auto steps = steps_of({{"C(s) + O2(g) -> CO2(g)", -393.51},
                           {"CO(g) + 1/2 O2(g) -> CO2(g)", -282.98},
                           {"2 CO(g) + O2(g) -> 2 CO2(g)", -565.96}});
    CHECK(e.hess("C(s) + 1/2 O2(g) -> CO(g)", steps) == Approx(-110.53).margin(1e-9));
    // Rounded differently, the two routes give two answers: an error in words, never one of them.
    steps[2].dh = -566.0;
    const std::string msg = error_of([&] { e.hess("C(s) + 1/2 O2(g) -> CO(g)", steps); });
    CHECK_THAT(msg, Contains("dependent") && Contains("do not cancel") && Contains("0.04"));
    // The plan needs no values, so it is still given.
    CHECK(e.hess_plan("C(s) + 1/2 O2(g) -> CO(g)", steps) == "1×(1) − 1×(2)");
}

TEST_CASE("Hess: a target that is no combination is an error that says why", "[hess]") {
    auto& e = rxnheat_test::eng();
    const auto combustion = steps_of({{"C(s) + O2(g) -> CO2(g)", -393.51}});
    // A species of the target in no step is named.
    CHECK_THAT(error_of([&] { e.hess("C(s) + 1/2 O2(g) -> CO(g)", combustion); }),
               Contains("no combination") && Contains("'CO(g)'"));
    // Every species present, but the target is not a multiple of the one step.
    const auto mixed = steps_of({{"3 C(s) + 2 O2(g) -> 2 CO(g) + CO2(g)", -614.57}});
    CHECK_THAT(error_of([&] { e.hess("C(s) + O2(g) -> CO2(g)", mixed); }),
               Contains("no combination") && Contains("no multiples"));
    // Liquid and vapour water are different species: a target in H2O(l) is no combination of
    // steps in H2O(g).
    const auto vapour = steps_of({{"H2(g) + 1/2 O2(g) -> H2O(g)", -241.83}});
    CHECK_THAT(error_of([&] { e.hess("H2(g) + 1/2 O2(g) -> H2O(l)", vapour); }), Contains("'H2O(l)'"));
}

TEST_CASE("Hess: one substance spelled two ways, unbalanced or unreadable steps are errors", "[hess]") {
    auto& e = rxnheat_test::eng();
    const auto combustion = steps_of({{"C(s) + O2(g) -> CO2(g)", -393.51}});
    auto two_names = steps_of({{"ethanol(l) + 3 O2(g) -> 2 CO2(g) + 3 H2O(l)", -1366.8}});
    CHECK_THAT(error_of([&] { e.hess("2 CO2(g) + 3 H2O(l) -> C2H5OH(l) + 3 O2(g)", two_names); }),
               Contains("same composition and phase") && Contains("ethanol(l)") && Contains("C2H5OH(l)"));
    auto no_phase = steps_of({{"C(s) + O2(g) -> CO2", -393.51}, {"CO(g) + 1/2 O2(g) -> CO2(g)", -282.98}});
    CHECK_THAT(error_of([&] { e.hess("C(s) + 1/2 O2(g) -> CO(g)", no_phase); }), Contains("phase written"));
    auto unbalanced = steps_of({{"C(s) + O2(g) -> CO2(g)", -393.51}, {"CO(g) + O2(g) -> CO2(g)", -282.98}});
    CHECK_THAT(error_of([&] { e.hess("C(s) + 1/2 O2(g) -> CO(g)", unbalanced); }),
               Contains("step 2: the reaction is not balanced"));
    CHECK_THAT(error_of([&] {
                   e.hess("C(s) + 1/2 O2(g) -> CO(g)", steps_of({{"C(s) + -> CO2(g)", 1}}));
               }),
               Contains("step 1: "));
    CHECK_THAT(error_of([&] { e.hess("C(s) -> ", combustion); }), Contains("the target: "));
    CHECK_THAT(error_of([&] { e.hess("C(s) + 1/2 O2(g) -> CO(g)", {}); }), Contains("no steps"));
    // Per-mass units: the steps are per mole of each step, so a per-mass unit has no meaning here.
    CHECK_THAT(error_of([&] { e.hess("C(s) + O2(g) -> CO2(g)", combustion, "MJ/kg"); }),
               Contains("per mass"));
    CHECK_THAT(error_of([&] { e.hess("C(s) + O2(g) -> CO2(g)", combustion, "kJ/mole"); }),
               Contains("kJ/mol"));
    auto not_finite = combustion;
    not_finite[0].dh = std::numeric_limits<double>::infinity();
    CHECK_THAT(error_of([&] { e.hess("C(s) + O2(g) -> CO2(g)", not_finite); }),
               Contains("not a finite number"));
}

TEST_CASE("Hess through the catalogue: ranges paired by position, blanks skipped", "[hess][catalogue]") {
    using rxnheat::Arg;
    using rxnheat::Cell;
    const auto* f = rxnheat::find_function("RXNHESS");
    const auto* plan = rxnheat::find_function("RXNHESSPLAN");
    REQUIRE(f);
    REQUIRE(plan);
    const rxnheat::HostRules calc{true, false, "Calc add-in"};
    // A column of three steps with the middle row blank in both columns: numbers keep positions.
    const Arg steps = Arg::range(
        3, 1, {Cell::of("C(s) + O2(g) -> CO2(g)"), Cell{}, Cell::of("CO(g) + 1/2 O2(g) -> CO2(g)")});
    const Arg values = Arg::range(3, 1, {Cell::of(-393.51), Cell{}, Cell::of(-282.98)});
    const Arg target = Arg::of("C(s) + 1/2 O2(g) -> CO(g)");
    const auto r = rxnheat::evaluate(*f, {target, steps, values}, calc);
    REQUIRE(r.single().ok());
    CHECK(r.single().number == Approx(-110.53).margin(1e-9));  // CODATA ΔfH°(CO, g)
    CHECK(r.single().unit == "kJ/mol");
    CHECK(rxnheat::evaluate(*plan, {target, steps}, calc).single().text == "1×(1) − 1×(3)");
    // A row works as a column does.
    const Arg row_steps =
        Arg::range(1, 2, {Cell::of("C(s) + O2(g) -> CO2(g)"), Cell::of("CO(g) + 1/2 O2(g) -> CO2(g)")});
    const Arg row_values = Arg::range(1, 2, {Cell::of(-393.51), Cell::of(-282.98)});
    CHECK(rxnheat::evaluate(*f, {target, row_steps, row_values}, calc).single().number ==
          Approx(-110.53).margin(1e-9));

    auto why = [&](std::vector<Arg> args) { return rxnheat::why(*f, args, calc); };
    CHECK_THAT(why({target, steps, Arg::range(2, 1, {Cell::of(-393.51), Cell::of(-282.98)})}),
               Contains("'steps' has 3 cells and 'step_dh' 2"));
    CHECK_THAT(why({target, steps, Arg::range(3, 1, {Cell::of(-393.51), Cell{}, Cell{}})}),
               Contains("step 3 has no ΔH"));
    CHECK_THAT(why({target, steps, Arg::range(3, 1, {Cell::of(-393.51), Cell::of(1.0), Cell::of(-282.98)})}),
               Contains("step 2, but that cell of 'steps' is blank"));
    CHECK_THAT(why({target, steps, Arg::range(3, 1, {Cell::of(-393.51), Cell{}, Cell::of("about -283")})}),
               Contains("'step_dh' cell 3: must be a number"));
    CHECK_THAT(why({target, Arg::range(2, 2, {Cell{}, Cell{}, Cell{}, Cell{}}), values}),
               Contains("one column or one row"));
    CHECK_THAT(why({target, Arg::range(2, 1, {Cell{}, Cell{}}), Arg::range(2, 1, {Cell{}, Cell{}})}),
               Contains("'steps' is required"));
    CHECK(why({target, steps, values}) == "ok");
    // A 0 in a range of step values is a value (a thermoneutral step), not a blank.
    const Arg zero = Arg::range(2, 1, {Cell::of(-393.51), Cell::of(0.0)});
    const Arg two =
        Arg::range(2, 1, {Cell::of("C(s) + O2(g) -> CO2(g)"), Cell::of("CO(g) + 1/2 O2(g) -> CO2(g)")});
    CHECK(rxnheat::evaluate(*f, {target, two, zero}, calc).single().number == Approx(-393.51).margin(1e-9));
}
