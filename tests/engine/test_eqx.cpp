// RXNEQX (Engine::eq_conversion and its catalogue row): the equilibrium conversion of one reaction
// from a feed, against solutions written here independently of the engine's solver:
//  - closed forms of the ideal-gas equilibrium (algebra) for N2O4 <=> 2 NO2, N2 + O2 <=> 2 NO and
//    CaCO3(s) <=> CaO(s) + CO2(g);
//  - plain bisection on the extent for ammonia synthesis;
// each with K computed here from the species' own data (ΔfH°, sensible heat and S° of every species
// from the NASA Glenn polynomials, NASA/TP-2002-211556, through the species functions, not the
// reaction's), with R from GNU units. Behaviour checks are common practice (no source).
#include "behaviour_helpers.hpp"

#include <rxnheat/catalogue.hpp>

#include <cmath>
#include <string>
#include <vector>

using namespace rxnheat_test;
using rxnheat::Conditions;
using rxnheat::FeedItem;

namespace {

struct Term {
    std::string species;
    double nu;  // signed: reactants < 0
};

/// ln K at T from the species data: −Σν·(H° − T·S°)/(R·T), H° = ΔfH°(298.15) + [H°(T) − H°(298.15)].
double ln_K(const std::vector<Term>& terms, double T) {
    double dG = 0;
    for (const auto& t : terms) {
        const double H_J = 1000 * (eng().species_hf(t.species) + eng().species_h(t.species, T));
        dG += t.nu * (H_J - T * eng().species_s(t.species, T));
    }
    return -dG / (R_gnu() * T);
}

Conditions at(double T, double p_bar) {
    Conditions c(T);
    c.pressure_bar = p_bar;
    return c;
}

/// Ammonia from N2 and H2 (and an inert): the extent ξ (mol of N2 reacted) by bisection on
/// ln Q(ξ) − ln K, every species a gas: N2 1−ξ... with the feed given.
double ammonia_bisection(double n_N2, double n_H2, double n_inert, double T, double p_bar) {
    const double lnK = ln_K({{"N2", -1}, {"H2", -3}, {"NH3", 2}}, T);
    auto g = [&](double xi) {
        const double N2 = n_N2 - xi, H2 = n_H2 - 3 * xi, NH3 = 2 * xi, total = N2 + H2 + NH3 + n_inert;
        return 2 * std::log(NH3 / total * p_bar) - std::log(N2 / total * p_bar) - 3 * std::log(H2 / total * p_bar) - lnK;
    };
    double lo = 0, hi = std::min(n_N2, n_H2 / 3);
    for (int i = 0; i < 2000; ++i) {
        const double mid = 0.5 * (lo + hi);
        if (mid == lo || mid == hi) break;
        (g(mid) < 0 ? lo : hi) = mid;
    }
    return 0.5 * (lo + hi) / n_N2;
}

constexpr const char* NH3_SYNTHESIS = "N2(g) + 3 H2(g) -> 2 NH3(g)";

}  // namespace

TEST_CASE("RXNEQX: N2O4 <=> 2 NO2 against the closed form", "[eqx]") {
    // One mol N2O4: N2O4 1−ξ, NO2 2ξ, total 1+ξ; K = 4ξ²·p/(1−ξ²) gives ξ = sqrt(K/(K + 4p)) (algebra).
    const std::vector<Term> terms = {{"N2O4", -1}, {"NO2", 2}};
    // ΔrG°(298.15 K) from the NBS tables (Wagman et al. 1982: ΔfG° NO2 51.31, N2O4 97.89 kJ/mol),
    // typed from memory: 2·51.31 − 97.89 = 4.73 kJ/mol.
    CHECK(-ln_K(terms, 298.15) * R_gnu() * 298.15 / 1000 == Approx(4.73).margin(0.5));
    for (const double T : {298.15, 320.0, 350.0})
        for (const double p : {0.5, 1.0, 10.0}) {
            const double K = std::exp(ln_K(terms, T));
            const double expected = std::sqrt(K / (K + 4 * p));
            INFO("T " << T << " K, p " << p << " bar, K " << K);
            CHECK(eng().eq_conversion("N2O4(g) <=> 2 NO2(g)", {{"N2O4", 1}}, "", at(T, p)) ==
                  Approx(expected).epsilon(1e-9));
        }
    // Only ratios matter: 5 mol of the same feed.
    CHECK(eng().eq_conversion("N2O4(g) <=> 2 NO2(g)", {{"N2O4", 5}}, "N2O4", at(320, 2)) ==
          Approx(eng().eq_conversion("N2O4(g) <=> 2 NO2(g)", {{"N2O4", 1}}, "", at(320, 2))).epsilon(1e-12));
    // Much NO2 fed: it reacts back, and the conversion is negative. N2O4 1−ξ, NO2 10+2ξ, total 11+ξ:
    // K(1−ξ)(11+ξ) = p(10+2ξ)², i.e. (4p+K)ξ² + (40p+10K)ξ + 100p − 11K = 0, the root above −5 (algebra).
    {
        const double K = std::exp(ln_K(terms, 298.15)), p = 1;
        const double qa = 4 * p + K, qb = 40 * p + 10 * K, qc = 100 * p - 11 * K;
        const double root = (-qb + std::sqrt(qb * qb - 4 * qa * qc)) / (2 * qa);
        const double x =
            eng().eq_conversion("N2O4(g) <=> 2 NO2(g)", {{"N2O4", 1}, {"NO2", 10}}, "", at(298.15, p));
        CHECK(x < 0);
        CHECK(x == Approx(root).epsilon(1e-9));
    }
    // A product in the feed pushes back: with NO2 fed, less N2O4 dissociates (common practice).
    CHECK(eng().eq_conversion("N2O4(g) <=> 2 NO2(g)", {{"N2O4", 1}, {"NO2", 0.5}}, "", at(320, 1)) <
          eng().eq_conversion("N2O4(g) <=> 2 NO2(g)", {{"N2O4", 1}}, "", at(320, 1)));
}

TEST_CASE("RXNEQX: ammonia synthesis against bisection, and its textbook behaviour", "[eqx]") {
    const std::vector<FeedItem> feed = {{"N2", 1}, {"H2", 3}};
    for (const double T : {600.0, 700.0, 800.0})
        for (const double p : {50.0, 200.0}) {
            INFO("T " << T << " K, p " << p << " bar");
            CHECK(eng().eq_conversion(NH3_SYNTHESIS, feed, "", at(T, p)) ==
                  Approx(ammonia_bisection(1, 3, 0, T, p)).epsilon(1e-9));
        }
    const double x_700_200 = eng().eq_conversion(NH3_SYNTHESIS, feed, "", at(700, 200));
    const double x_700_50 = eng().eq_conversion(NH3_SYNTHESIS, feed, "", at(700, 50));
    const double x_800_200 = eng().eq_conversion(NH3_SYNTHESIS, feed, "", at(800, 200));
    // Common practice: fewer moles of gas on the product side, so pressure raises the conversion;
    // exothermic, so heat lowers it; an inert dilutes like a lower pressure.
    CHECK(x_700_200 > x_700_50);
    CHECK(x_800_200 < x_700_200);
    const std::vector<FeedItem> with_argon = {{"N2", 1}, {"H2", 3}, {"Ar", 1}};
    const double x_argon = eng().eq_conversion(NH3_SYNTHESIS, with_argon, "", at(700, 200));
    CHECK(x_argon < x_700_200);
    CHECK(x_argon == Approx(ammonia_bisection(1, 3, 1, 700, 200)).epsilon(1e-9));
    // Only the ratios matter, even for amounts whose sum would overflow a double.
    CHECK(eng().eq_conversion(NH3_SYNTHESIS, {{"N2", 5e307}, {"H2", 1.5e308}}, "", at(700, 200)) ==
          Approx(x_700_200).epsilon(1e-12));
    CHECK(eng().eq_conversion(NH3_SYNTHESIS, {{"N2", 1e-300}, {"H2", 3e-300}}, "", at(700, 200)) ==
          Approx(x_700_200).epsilon(1e-12));
    // The key: N2 and H2 in the 1:3 ratio of the reaction convert alike; in excess H2, N2 more than H2.
    CHECK(eng().eq_conversion(NH3_SYNTHESIS, feed, "H2", at(700, 200)) == Approx(x_700_200).epsilon(1e-12));
    const std::vector<FeedItem> rich = {{"N2", 1}, {"H2", 6}};
    const double xn = eng().eq_conversion(NH3_SYNTHESIS, rich, "N2", at(700, 200));
    const double xh = eng().eq_conversion(NH3_SYNTHESIS, rich, "H2(g)", at(700, 200));
    CHECK(xn == Approx(ammonia_bisection(1, 6, 0, 700, 200)).epsilon(1e-9));
    CHECK(xh == Approx(xn * 3.0 / 6.0).epsilon(1e-12));  // 3ξ of 6 mol vs ξ of 1 mol
}

TEST_CASE("RXNEQX: K from 1e-30 to 1e30 converges (N2 + O2 <=> 2 NO, closed form)", "[eqx]") {
    // N2 + O2 -> 2 NO from 1 mol of each: K = 4ξ²/(1−ξ)² (Δn = 0), so ξ = s/(2 + s), s = sqrt(K).
    const std::vector<Term> fwd = {{"N2", -1}, {"O2", -1}, {"NO", 2}};
    const double lnK = ln_K(fwd, 298.15);
    INFO("ln K " << lnK);
    CHECK(lnK < std::log(1e-29));  // K near 1e-30 at 298.15 K
    const double s = std::exp(lnK / 2);
    const double x = eng().eq_conversion("N2(g) + O2(g) -> 2 NO(g)", {{"N2", 1}, {"O2", 1}}, "", at(298.15, 1));
    CHECK(x > 0);
    CHECK(x == Approx(s / (2 + s)).epsilon(1e-9));  // relative, at 1e-16
    // The reverse, K near 1e30, from 1 mol NO: N2 = O2 = ξ, NO 1−2ξ; ξ/(1−2ξ) = 1/s, X = 2ξ = 2/(2 + s).
    const double back = eng().eq_conversion("2 NO(g) -> N2(g) + O2(g)", {{"NO", 1}}, "", at(298.15, 1));
    CHECK(back == Approx(2 / (2 + s)).epsilon(1e-15));
    CHECK(back <= 1);
    // Water from the elements at 1000 K (K near 1e20) and its reverse, against the same bisection
    // done here: conversion near 1 and near 0.
    const std::vector<Term> w = {{"H2", -2}, {"O2", -1}, {"H2O(g)", 2}};
    const double lnKw = ln_K(w, 1000);
    auto water = [&](bool forward) {
        // forward: H2 2−2ξ, O2 1−ξ, H2O 2ξ (from 2 H2 + 1 O2); reverse: H2O 1−2ξ, H2 2ξ, O2 ξ.
        auto g = [&](double xi) {
            const double h2 = forward ? 2 - 2 * xi : 2 * xi, o2 = forward ? 1 - xi : xi, h2o = forward ? 2 * xi : 1 - 2 * xi;
            const double t = h2 + o2 + h2o;
            const double lnQ = 2 * std::log(h2o / t) - 2 * std::log(h2 / t) - std::log(o2 / t);
            return forward ? lnQ - lnKw : -lnQ + lnKw;
        };
        double lo = 0, hi = forward ? 1 : 0.5;
        for (int i = 0; i < 3000; ++i) {
            const double mid = 0.5 * (lo + hi);
            if (mid == lo || mid == hi) break;
            (g(mid) < 0 ? lo : hi) = mid;
        }
        return forward ? 0.5 * (lo + hi) : 2 * 0.5 * (lo + hi);
    };
    const double near1 = eng().eq_conversion("2 H2(g) + O2(g) -> 2 H2O(g)", {{"H2", 2}, {"O2", 1}}, "", at(1000, 1));
    CHECK(1 - near1 > 0);
    CHECK(1 - near1 < 1e-5);
    CHECK(1 - near1 == Approx(1 - water(true)).epsilon(1e-6));
    const double near0 = eng().eq_conversion("2 H2O(g) -> 2 H2(g) + O2(g)", {{"H2O", 1}}, "", at(1000, 1));
    CHECK(near0 > 0);
    CHECK(near0 < 1e-5);
    CHECK(near0 == Approx(water(false)).epsilon(1e-9));
}

TEST_CASE("RXNEQX: a condensed species is pure, and may run out (CaCO3 <=> CaO + CO2)", "[eqx]") {
    // K = p(CO2)/p° (solids at activity 1). From 1 mol CaCO3 with 10 mol N2 at p: y(CO2) = ξ/(10 + ξ)
    // = K/p gives ξ = 10·r/(1 − r), r = K/p, unless that is more than the 1 mol there is (then all).
    const std::vector<Term> terms = {{"CaCO3(s)", -1}, {"CaO(s)", 1}, {"CO2(g)", 1}};
    for (const double T : {900.0, 1000.0, 1100.0, 1300.0}) {
        const double r = std::exp(ln_K(terms, T)) / 1.0;
        const double expected = r < 1 ? std::min(1.0, 10 * r / (1 - r)) : 1.0;
        INFO("T " << T << " K, K " << r);
        CHECK(eng().eq_conversion("CaCO3(s) -> CaO(s) + CO2(g)", {{"CaCO3", 1}, {"N2", 10}}, "", at(T, 1)) ==
              Approx(expected).epsilon(1e-9));
    }
}

TEST_CASE("RXNEQX: errors in words", "[eqx]") {
    const std::vector<FeedItem> feed = {{"N2", 1}, {"H2", 3}};
    auto message = [](auto f) {
        const auto o = attempt(f);
        CHECK(o.engine_error);
        return o.message;
    };
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, {{"NH3", 1}}, "", at(700, 200)); })
              .find("the feed has no N2(g), a reactant") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, {{"N2", 1}}, "", at(700, 200)); })
              .find("the feed has no H2(g), a reactant") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, feed, "", at(700, 0)); })
              .find("the pressure must be above zero") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, feed, "", at(700, -3)); })
              .find("the pressure must be above zero") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, {{"N2", 1}, {"H2", 3}, {"Qq", 1}}, "", at(700, 200)); })
              .find("Qq") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, {{"N2", 1}, {"H2", 3}, {"N2", 1}}, "", at(700, 200)); })
              .find("twice") != std::string::npos);
    // An inert named twice, with and without its phase: an error, not the two amounts summed
    // (RXNEQX matches its feed with RXNDUTY's and RXNTAD's code, which refuses this).
    CHECK(message([&] {
              return eng().eq_conversion(NH3_SYNTHESIS, {{"N2", 1}, {"H2", 3}, {"CH4", 0.1}, {"CH4(g)", 0.1}}, "",
                                         at(700, 100));
          }).find("the feed names 'CH4(g)' twice") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, {{"N2", 1}, {"H2", -3}}, "", at(700, 200)); })
              .find("zero or more") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, feed, "NH3", at(700, 200)); })
              .find("is a product") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, feed, "CO2", at(700, 200)); })
              .find("not a species of the reaction") != std::string::npos);
    CHECK(message([&] { return eng().eq_conversion(NH3_SYNTHESIS, {}, "", at(700, 200)); }).find("the feed is empty") !=
          std::string::npos);
    // K beyond a double: octane burnt at 298.15 K has ΔrG° near −10 000 kJ per 2 mol (ln K > 709).
    CHECK(message([&] {
              return eng().eq_conversion("2 n-octane(g) + 25 O2(g) -> 16 CO2(g) + 18 H2O(g)", {{"n-octane", 1}, {"O2", 20}}, "",
                                         at(298.15, 1));
          }).find("beyond what a double holds") != std::string::npos);
}

TEST_CASE("RXNEQX through the catalogue: feed ranges, pressures with units", "[eqx][catalogue]") {
    using rxnheat::Arg;
    using rxnheat::Cell;
    const rxnheat::FunctionSpec* f = rxnheat::find_function("RXNEQX");
    REQUIRE(f != nullptr);
    const rxnheat::HostRules calc{true, false, "Calc add-in"};
    // A feed with a blank row between the species.
    const Arg feed = Arg::range(4, 2, {Cell::of("N2"), Cell::of(1.0), Cell{}, Cell{}, Cell::of("H2"), Cell::of(3.0),
                                       Cell::of("Ar"), Cell::of(0.0)});
    auto value = [&](Arg pressure, Arg key = Arg::omitted()) {
        const auto r = rxnheat::evaluate(*f, {Arg::of(NH3_SYNTHESIS), Arg::of(700.0), pressure, feed, key}, calc);
        return r.single();
    };
    const double expected = ammonia_bisection(1, 3, 0, 700, 200);
    CHECK(value(Arg::of(200.0)).number == Approx(expected).epsilon(1e-9));
    CHECK(value(Arg::of("20 MPa")).number == Approx(expected).epsilon(1e-9));
    CHECK(value(Arg::of("198.98675 barg")).number == Approx(expected).epsilon(1e-9));  // 198.98675 + 1.01325 = 200 bar
    CHECK(value(Arg::of("198.675 barg")).number < expected);  // 199.688 bar: less pressure, less ammonia
    CHECK(value(Arg::of("200 bar"), Arg::of("H2")).number == Approx(expected).epsilon(1e-9));
    // The temperature as text too.
    const auto r = rxnheat::evaluate(*f, {Arg::of(NH3_SYNTHESIS), Arg::of("426.85 C"), Arg::of("200 bar"), feed}, calc);
    CHECK(r.single().number == Approx(expected).epsilon(1e-9));
    // A blank pressure (Calc's 0) is not taken as any default.
    const auto zero = value(Arg::of(0.0));
    CHECK(zero.kind == rxnheat::Outcome::Kind::error);
    CHECK(zero.text.find("'pressure' must be above zero") != std::string::npos);
    CHECK(value(Arg::of("150 psi")).text.find("psia or psig") != std::string::npos);
    // A feed of one column, or one cell, or a row with a species and no amount.
    auto with_feed = [&](Arg fd) {
        return rxnheat::evaluate(*f, {Arg::of(NH3_SYNTHESIS), Arg::of(700.0), Arg::of(200.0), fd}, calc).single();
    };
    CHECK(with_feed(Arg::range(2, 1, {Cell::of("N2"), Cell::of("H2")})).text.find("two columns") != std::string::npos);
    CHECK(with_feed(Arg::of("N2")).text.find("two-column range") != std::string::npos);
    CHECK(with_feed(Arg::range(2, 2, {Cell::of("N2"), Cell::of(1.0), Cell::of("H2"), Cell{}})).text.find("row 2: 'H2' has no amount") !=
          std::string::npos);
    CHECK(with_feed(Arg::range(1, 2, {Cell::of("N2"), Cell::of("lots")})).text.find("row 1: the amount of 'N2' must be a number") !=
          std::string::npos);
    CHECK(with_feed(Arg::range(1, 2, {Cell{}, Cell{}})).text.find("every row of it is blank") != std::string::npos);
}
