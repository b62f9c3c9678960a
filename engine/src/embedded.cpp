// Access to the data files embedded at build time (see cmake/embed.cmake).
#include "tables.hpp"

namespace rxnheat::detail {

extern const char embedded_thermo_inp_text[];
extern const unsigned long embedded_thermo_inp_text_size;
extern const char embedded_nasa_provenance_text[];
extern const unsigned long embedded_nasa_provenance_text_size;
extern const char embedded_elements_csv_text[];
extern const unsigned long embedded_elements_csv_text_size;
extern const char embedded_aliases_csv_text[];
extern const unsigned long embedded_aliases_csv_text_size;
extern const char embedded_aqueous_csv_text[];
extern const unsigned long embedded_aqueous_csv_text_size;

std::string_view embedded_thermo_inp() { return {embedded_thermo_inp_text, embedded_thermo_inp_text_size}; }
std::string_view embedded_nasa_provenance() {
    return {embedded_nasa_provenance_text, embedded_nasa_provenance_text_size};
}
std::string_view embedded_elements_csv() { return {embedded_elements_csv_text, embedded_elements_csv_text_size}; }
std::string_view embedded_aliases_csv() { return {embedded_aliases_csv_text, embedded_aliases_csv_text_size}; }
std::string_view embedded_aqueous_csv() { return {embedded_aqueous_csv_text, embedded_aqueous_csv_text_size}; }

}  // namespace rxnheat::detail
