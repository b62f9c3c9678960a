// Hess's law from the user's own steps (hess.cpp). Private.
#pragma once

#include "reaction.hpp"

#include <memory>
#include <string>
#include <vector>

namespace rxnheat::detail {

/// Bounds on one combination, so that a sheet cannot ask for an unbounded elimination.
inline constexpr std::size_t max_hess_steps = 50;
inline constexpr std::size_t max_hess_species = 400;

/// The target as a combination of the steps.
struct HessCombination {
    std::vector<Rational> x;                       ///< per step; steps the others already span: 0
    std::vector<std::vector<Rational>> dependent;  ///< a basis of the steps' own cycles (Σ cᵢ·stepᵢ = 0)
    std::string plan;                              ///< "1×(1) − 2×(3) + 1/2×(4)", by the steps' numbers
};

/// Solves target = Σ xᵢ·stepᵢ exactly (species matched as written). `steps` and `step_rows`
/// are parallel. Throws Error for an unbalanced or unreadable reaction (naming it), for two
/// spellings of one species, and when the target is no combination of the steps.
HessCombination combine(const Prepared& target, const std::vector<std::shared_ptr<const Prepared>>& steps,
                        const std::vector<HessStep>& step_rows);

/// Σ xᵢ·ΔHᵢ in J/mol; throws Error when dependent steps give two different answers.
double combined_dh_J_per_mol(const HessCombination& c, const std::vector<HessStep>& steps,
                             const std::vector<double>& step_dh_J_per_mol);

}  // namespace rxnheat::detail
