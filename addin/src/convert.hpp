// Conversion between Calc's UNO values and the engine's C++ types, for the rxnheat add-in.
// No thermodynamics here: only reading arguments and shaping results. The engine-free part
// (argument kinds, text, numbers, UTF-8, ranges) is in uno_args.hpp; this file adds the
// arguments that need the engine to be read.
#pragma once

#include "uno_args.hpp"

#include <rxnheat/rxnheat.hpp>

#include <memory>

namespace rxnheat_addin {

/// Optional temperature: number in K, or text with a unit (rxnheat::parse_temperature);
/// not given -> `fallback`. A 1x1 range counts as its one cell.
double temperature_arg(const uno::Any& value, const char* name, int position,
                       double fallback = rxnheat::T_ref);

/// Optional user species table (SPEC 3.4) from a cell range; nullptr when not given.
/// Tables are cached by content, so a sheet full of formulas over one range builds it once.
std::shared_ptr<const rxnheat::SpeciesTable> table_arg(const uno::Any& value, int position);

}  // namespace rxnheat_addin
