// librxnheat.so is the engine (rxnheat_core, linked whole) plus this translation unit.
// The C ABI lives in capi.cpp; the C++ interface in include/rxnheat/rxnheat.hpp.
#include "rxnheat/rxnheat.h"
