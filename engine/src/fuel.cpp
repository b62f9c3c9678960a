// FUELHV: heating values from complete-combustion reactions built and balanced from each
// component's composition (see fuel.hpp and engine/DATA.md, Heating values).
#include "fuel.hpp"

#include "database.hpp"
#include "reaction.hpp"
#include "units.hpp"

#include <cmath>
#include <string>

namespace rxnheat::detail {
namespace {

// The combustion products, written with their phases, so that the data (NASA Glenn or a user
// table's rows for them) are taken in those phases.
struct Products {
    Substance co2, h2o_liquid, h2o_gas, so2, n2, o2;
};

Substance resolve_text(std::string_view text, const SpeciesTable* table) {
    return Database::get().resolve(grammar::parse_species(text), table);
}

Products products(const SpeciesTable* table) {
    return {resolve_text("CO2(g)", table), resolve_text("H2O(l)", table), resolve_text("H2O(g)", table),
            resolve_text("SO2(g)", table), resolve_text("N2(g)", table),  resolve_text("O2(g)", table)};
}

// Noble gases: no combustion, no product; they are inerts of a fuel gas (helium in natural gas,
// argon in a syngas) although their element is none of C, H, N, O, S.
bool is_noble_gas(const std::string& symbol) {
    return symbol == "He" || symbol == "Ne" || symbol == "Ar" || symbol == "Kr" || symbol == "Xe" || symbol == "Rn";
}

struct Counts {
    Rational C, H, N, O, S;
};

/// The component's atoms, or an error in words naming an element that does not burn to one of
/// the products (and a charge). `inert` is set for a noble gas.
Counts counts_of(const Substance& s, const std::string& written, bool& inert) {
    if (s.composition.charge != 0)
        throw Error(ErrorKind::argument, "the fuel component '" + written + "' is an ion; a heating value is for neutral species");
    Counts c;
    inert = false;
    for (const auto& [symbol, n] : s.composition.atoms) {
        if (symbol == "C") c.C = n;
        else if (symbol == "H") c.H = n;
        else if (symbol == "N") c.N = n;
        else if (symbol == "O") c.O = n;
        else if (symbol == "S") c.S = n;
        else if (is_noble_gas(symbol) && s.composition.atoms.size() == 1) inert = true;
        else
            throw Error(ErrorKind::argument,
                        "the fuel component '" + written + "' contains " + symbol +
                            "; FUELHV burns only C (to CO2), H (to H2O), S (to SO2) and N (to N2), with O from the air, "
                            "and takes the noble gases as inerts");
    }
    return c;
}

/// −ΔcH° at 298.15 K in J per mole of the component, complete combustion with O2(g) to CO2(g),
/// H2O (liquid for HHV, gas for LHV), SO2(g), N2(g); 0 for an inert (a combustion product itself
/// — CO2, H2O, SO2, N2 in any phase — O2, or a noble gas: its "combustion" needs no O2 and
/// gives nothing new).
double combustion_heat(const Substance& s, const std::string& written, bool hhv, const Products& p) {
    bool noble = false;
    const Counts c = counts_of(s, written, noble);
    if (noble) return 0;
    const auto only = [&](const Rational& C, const Rational& H, const Rational& N, const Rational& O, const Rational& S) {
        return c.C == C && c.H == H && c.N == N && c.O == O && c.S == S;
    };
    if (only(1, 0, 0, 2, 0) || only(0, 2, 0, 1, 0) || only(0, 0, 0, 2, 1) || only(0, 0, 2, 0, 0) || only(0, 0, 0, 2, 0))
        return 0;
    // CcHhNnOoSs + (c + h/4 + s − o/2) O2 -> c CO2 + h/2 H2O + s SO2 + n/2 N2: balanced by
    // construction (exact fractions); a negative O2 coefficient puts O2 among the products.
    const Rational o2 = c.C + c.H / 4 + c.S - c.O / 2;
    const double T = T_ref;
    const double reactants = s.H(T) + to_double(o2) * p.o2.H(T);
    const double out = to_double(c.C) * p.co2.H(T) + to_double(c.H / 2) * (hhv ? p.h2o_liquid : p.h2o_gas).H(T) +
                       to_double(c.S) * p.so2.H(T) + to_double(c.N / 2) * p.n2.H(T);
    return reactants - out;
}

/// HHV (true) or LHV (false); the letter case does not matter (the two words have no other meaning).
bool higher_basis(std::string_view basis) {
    const std::string_view b = trim(basis);
    check_input_text(b, "the basis");
    const std::string word = lower(b);
    if (word.empty() || word == "hhv") return true;
    if (word == "lhv") return false;
    throw Error(ErrorKind::argument, "the basis must be HHV (higher heating value: the water formed is liquid) or LHV "
                                     "(lower heating value: the water formed stays vapour), not '" +
                                         std::string(b) + "'");
}

}  // namespace

double fuel_heating_value(const std::vector<FeedItem>& composition, bool single, std::string_view basis,
                          std::string_view unit_text, const SpeciesTable* table) {
    const bool hhv = higher_basis(basis);
    const HeatingValueUnit unit = heating_value_unit(unit_text);
    if (composition.empty()) throw Error(ErrorKind::argument, "the fuel is empty; give a species, or each species and its mole fraction");

    // The fractions: each a number of zero or more, summing to 1 (mole fractions) or 100 (mol %)
    // within 0.5 % of that sum, then scaled to sum to exactly 1.
    double sum = 0;
    for (const FeedItem& item : composition) {
        if (!std::isfinite(item.amount_mol) || item.amount_mol < 0)
            throw Error(ErrorKind::argument, "the mole fraction of '" + item.species + "' must be a number, zero or more (got " +
                                                 number_words(item.amount_mol) + ")");
        sum += item.amount_mol;
    }
    if (!single && !(std::fabs(sum - 1) <= 0.005 || std::fabs(sum - 100) <= 0.5))
        throw Error(ErrorKind::argument, "the mole fractions of the fuel sum to " + number_words(sum) +
                                             "; they must sum to 1 (mole fractions) or 100 (mol %) within 0.5 %");

    const Products p = products(table);
    const Database& db = Database::get();
    double hv_J_per_mol = 0, molar_mass = 0;
    bool burns = false;
    std::vector<std::string> seen;
    for (const FeedItem& item : composition) {
        const std::string& written = item.species;
        check_input_text(written, "the fuel species");
        grammar::Species sp;
        try {
            sp = grammar::parse_species(written);
        } catch (const grammar::ParseError& e) {
            throw Error(ErrorKind::syntax, "the fuel species '" + written + "': " + e.what());
        }
        const Substance s = db.resolve(sp, table);
        const std::string id = s.identity();
        for (const auto& other : seen)
            if (other == id) throw Error(ErrorKind::argument, "the fuel names '" + written + "' twice; give each species once");
        seen.push_back(id);
        const double x = single ? 1.0 : item.amount_mol / sum;
        if (unit.per == HeatingPer::volume && s.phase_at(T_ref) != 'g')
            throw Error(ErrorKind::unit, "'" + unit.name + "' is per volume of gas at " + unit.conditions + ", but " +
                                             s.display_at(T_ref) + " is not a gas at 25 \xC2\xB0" "C" +
                                             (s.phase_assumed ? " (write its phase, e.g. (g), if it is a vapour in the gas)" : "") +
                                             ": give the heating value per mass (MJ/kg) or per mole (kJ/mol)");
        const double q = combustion_heat(s, written, hhv, p);
        if (q != 0 && x > 0) burns = true;
        hv_J_per_mol += x * q;
        molar_mass += x * s.molar_mass;
    }
    if (!burns)
        throw Error(ErrorKind::argument, "nothing in the fuel burns: every component is an inert (a combustion product, O2 "
                                         "or a noble gas), so it has no heating value");
    if (!(hv_J_per_mol > 0))
        throw Error(ErrorKind::argument, "the fuel gives off no heat on complete combustion (its heating value would be " +
                                             number_words(hv_J_per_mol / 1000) + " kJ/mol)");
    return heating_value_in(hv_J_per_mol, unit, molar_mass);
}

}  // namespace rxnheat::detail
