// The one instantiation of the reaction grammar (X3 compile time is spent here only).
#include "grammar/reaction_def.hpp"

namespace rxnheat::grammar::parser {

BOOST_SPIRIT_INSTANTIATE(reaction_type, iterator_type, context_type)
BOOST_SPIRIT_INSTANTIATE(species_only_type, iterator_type, context_type)
BOOST_SPIRIT_INSTANTIATE(number_only_type, iterator_type, context_type)

}  // namespace rxnheat::grammar::parser
