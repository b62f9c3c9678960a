// Heating values of fuels (FUELHV): complete-combustion reactions built from each component's
// elemental composition, and the mole-fraction-weighted mixture. Private to the engine.
#pragma once

#include "rxnheat/rxnheat.hpp"

#include <string_view>
#include <vector>

namespace rxnheat::detail {

/// The heating value of a fuel, in `unit` (empty: MJ/kg), on `basis` ("HHV", the default when
/// empty, or "LHV", either in any letter case). `composition`: each species and its mole
/// fraction or mol % (FeedItem::amount_mol holds it), summing to 1 or 100 within 0.5 %;
/// `single`: one species given alone (no sum to check). See Engine::heating_value().
double fuel_heating_value(const std::vector<FeedItem>& composition, bool single, std::string_view basis,
                          std::string_view unit, const SpeciesTable* table);

}  // namespace rxnheat::detail
