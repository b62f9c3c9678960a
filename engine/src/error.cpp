#include "rxnheat/rxnheat.hpp"

namespace rxnheat {

Error::Error(ErrorKind kind, const std::string& message) : std::runtime_error(message), kind_(kind) {}

}  // namespace rxnheat
