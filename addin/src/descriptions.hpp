// Names and Function Wizard texts of the rxnheat cell functions (SPEC section 4).
#pragma once

#include <string_view>
#include <vector>

namespace rxnheat_addin {

struct ArgumentText {
    const char* name;         ///< shown in the Function Wizard, SPEC's argument name
    const char* description;  ///< UTF-8
};

struct FunctionText {
    const char* programmatic;  ///< the method of XRxnheatFunctions
    const char* display;       ///< what users type, SPEC's function name
    const char* description;   ///< UTF-8
    std::vector<ArgumentText> arguments;
};

/// Every function of the add-in, in SPEC order.
const std::vector<FunctionText>& functions();

/// Lookups; nullptr when unknown. Display names compare ASCII case-insensitively.
const FunctionText* by_programmatic(std::string_view name);
const FunctionText* by_display(std::string_view name);

}  // namespace rxnheat_addin
