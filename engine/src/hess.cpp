// Hess's law from the user's own steps (RXNHESS, RXNHESSPLAN): the target reaction as an exact
// rational combination of step reactions, and its ΔH from the steps' given values.
//
// Species are matched as written, not through the data: a step may hold a species the data do
// not have (that is often why an engineer combines steps). Two spellings of one composition and
// phase ("C2H5OH(l)", "ethanol(l)") could be one substance or two isomers, so they are an error
// that asks for one spelling, never a guess; so is a formula written with a phase in one place
// and without one in another.
#include "hess.hpp"

#include "chem.hpp"
#include "database.hpp"

#include <cmath>
#include <map>
#include <utility>

namespace rxnheat::detail {

namespace {

/// The identity of a species as written, without its phase: formula (or name) with charge; for
/// "written with a phase here, without one there".
std::string phaseless_identity(const Prepared::SpeciesText& s) {
    std::string id = s.is_name ? "name:" + lower(s.body) : std::string(s.body);
    if (s.charge != 0) id += "^" + std::to_string(s.charge);
    return id;
}
/// The same with the written phase.
std::string written_identity(const Prepared::SpeciesText& s) {
    return phaseless_identity(s) + "(" + std::string(s.phase) + ")";
}

struct Seen {
    std::string written;  ///< as the user wrote it, for messages
    std::string where;    ///< "the target", "step 2"
    std::string composition_key;
    std::string phase;
};

/// Species of every reaction by identity, checked for the two spellings the law cannot settle.
class SpeciesIndex {
public:
    std::size_t add(const Prepared::SpeciesText& s, std::string_view composition_key, const std::string& where) {
        const std::string id = written_identity(s);
        const auto it = index_.find(id);
        if (it != index_.end()) return it->second;
        for (const auto& other : seen_) {
            if (other.composition_key == composition_key && other.phase == s.phase)
                throw Error(
                    ErrorKind::argument,
                    "'" + std::string(s.written) + "' (" + where + ") and '" + other.written + "' (" + other.where +
                        ") have the same composition and phase; write one substance the same way in the "
                        "target and every step (rxnheat does not guess whether two spellings are one "
                        "substance or two isomers)");
        }
        const std::string bare = phaseless_identity(s);
        for (const auto& [other_bare, k] : bare_) {
            if (other_bare != bare) continue;
            const Seen& other = seen_[k];
            if (other.phase.empty() != s.phase.empty())
                throw Error(ErrorKind::argument,
                            "'" + std::string(s.written) + "' (" + where + ") and '" + other.written + "' (" +
                                other.where +
                                ") differ only in that one has a phase written; write the phase "
                                "the same way in the target and every step");
        }
        const std::size_t k = seen_.size();
        seen_.push_back({std::string(s.written), where, std::string(composition_key), std::string(s.phase)});
        index_.emplace(id, k);
        bare_.emplace_back(bare, k);
        return k;
    }
    std::size_t size() const { return seen_.size(); }
    const Seen& at(std::size_t k) const { return seen_[k]; }

private:
    std::vector<Seen> seen_;
    std::map<std::string, std::size_t> index_;
    std::vector<std::pair<std::string, std::size_t>> bare_;
};

std::string step_name(const HessStep& s) { return "step " + std::to_string(s.number); }

/// The reaction's net coefficients by species (a species on both sides counts once).
std::map<std::size_t, Rational> net_coefficients(const Prepared& p, SpeciesIndex& index,
                                                 const std::string& where) {
    std::map<std::size_t, Rational> net;
    for (std::size_t i = 0; i < p.terms.size(); ++i) {
        const std::size_t k = index.add(p.species(i), p.composition_key(i), where);
        net[k] += p.nu[i];
    }
    return net;
}

/// "1×(1) − 2×(3) + 1/2×(4)" from the coefficients (zero ones left out).
std::string plan_text(const std::vector<Rational>& x, const std::vector<HessStep>& steps) {
    std::string out;
    for (std::size_t j = 0; j < x.size(); ++j) {
        if (x[j] == 0) continue;
        const bool negative = x[j] < 0;
        const Rational magnitude = negative ? Rational(-x[j]) : x[j];
        if (out.empty())
            out += negative ? "−" : "";
        else
            out += negative ? " − " : " + ";
        out += rational_text(magnitude) + "×(" + std::to_string(steps[j].number) + ")";
    }
    return out;
}

}  // namespace

HessCombination combine(const Prepared& target, const std::vector<std::shared_ptr<const Prepared>>& steps,
                        const std::vector<HessStep>& step_rows) {
    if (steps.empty())
        throw Error(ErrorKind::argument, "no steps are given; give the step reactions and their ΔH");
    if (steps.size() > max_hess_steps)
        throw Error(ErrorKind::argument, std::to_string(steps.size()) +
                                             " steps are given; rxnheat combines at most " +
                                             std::to_string(max_hess_steps));
    SpeciesIndex index;
    auto checked = [](const Prepared& p, const std::string& where) {
        try {
            p.require_compositions();
            if (p.balance_error) throw *p.balance_error;
        } catch (const Error& e) {
            throw Error(e.kind(), where + ": " + e.what());
        }
    };
    checked(target, "the target");
    const auto t = net_coefficients(target, index, "the target");
    std::vector<std::map<std::size_t, Rational>> columns;
    for (std::size_t j = 0; j < steps.size(); ++j) {
        const std::string where = step_name(step_rows[j]);
        checked(*steps[j], where);
        columns.push_back(net_coefficients(*steps[j], index, where));
    }
    const std::size_t m = index.size(), n = steps.size();
    if (m > max_hess_species)
        throw Error(ErrorKind::argument, "the target and steps hold " + std::to_string(m) +
                                             " different species; rxnheat combines at most " +
                                             std::to_string(max_hess_species));

    // A species of the target that no step holds: say so by name, the commonest slip.
    for (const auto& [k, nu] : t) {
        if (nu == 0) continue;
        bool in_a_step = false;
        for (const auto& c : columns)
            if (c.count(k) && c.at(k) != 0) in_a_step = true;
        if (!in_a_step)
            throw Error(ErrorKind::argument,
                        "the target is no combination of the steps: '" + index.at(k).written +
                            "' of the target is in no step (with that formula and phase)");
    }

    // Gauss–Jordan elimination of [A | t], exact: rows are species, columns the steps.
    std::vector<std::vector<Rational>> a(m, std::vector<Rational>(n + 1, Rational(0)));
    for (std::size_t j = 0; j < n; ++j)
        for (const auto& [k, nu] : columns[j]) a[k][j] = nu;
    for (const auto& [k, nu] : t) a[k][n] = nu;
    const std::vector<std::size_t> pivot_col = reduce_rows(a, n);
    const std::size_t r = pivot_col.size();
    for (std::size_t i = r; i < m; ++i)
        if (a[i][n] != 0)
            throw Error(
                ErrorKind::argument,
                "the target is no combination of the steps: no multiples of them add up to it (check that "
                "every species is written the same way, phases included, in the target and the steps)");

    HessCombination out;
    out.x.assign(n, Rational(0));  // free steps (dependent on the others) left at zero
    for (std::size_t i = 0; i < pivot_col.size(); ++i) out.x[pivot_col[i]] = a[i][n];
    out.dependent = null_space(std::move(a), n);  // `a` is reduced already: this re-reads its pivots
    out.plan = plan_text(out.x, step_rows);
    if (out.plan.empty())
        throw Error(ErrorKind::argument,
                    "the target has no net change of any species; there is nothing to combine");
    return out;
}

double combined_dh_J_per_mol(const HessCombination& c, const std::vector<HessStep>& steps,
                             const std::vector<double>& step_dh_J_per_mol) {
    double sum = 0;
    for (std::size_t j = 0; j < c.x.size(); ++j)
        if (c.x[j] != 0) sum += to_double(c.x[j]) * step_dh_J_per_mol[j];

    // Dependent steps: each cycle among them must have a ΔH of zero, or the target's ΔH depends
    // on which steps are used. Values typed to a few digits rarely close a cycle exactly by
    // accident, so the test is tight (1e-9 of the cycle's terms): a mismatch is the user's to see.
    for (const auto& cycle : c.dependent) {
        double around = 0, scale = 0;
        for (std::size_t j = 0; j < cycle.size(); ++j) {
            if (cycle[j] == 0) continue;
            const double term = to_double(cycle[j]) * step_dh_J_per_mol[j];
            around += term;
            scale += std::fabs(term);
        }
        if (std::fabs(around) > 1e-9 * scale + 1e-9) {
            throw Error(ErrorKind::argument,
                        "the steps are dependent (" + plan_text(cycle, steps) +
                            " leaves no species at all) but their ΔH do not cancel (they add up to " +
                            number_words(around / 1000) +
                            " kJ/mol), so the target's ΔH would depend on which steps are used; give "
                            "consistent values or leave a step out");
        }
    }
    return sum;
}

}  // namespace rxnheat::detail
