#include "convert.hpp"

#include <list>
#include <mutex>
#include <string>
#include <utility>
#include <vector>

namespace rxnheat_addin {

double temperature_arg(const uno::Any& raw, const char* name, int position, double fallback) {
    const NumberOrText value = number_or_text_arg(raw, name, position);
    switch (value.kind) {
    case Given::number:
        return value.number;
    case Given::text:
        return rxnheat::parse_temperature(value.text);
    default:
        return fallback;
    }
}

std::shared_ptr<const rxnheat::SpeciesTable> table_arg(const uno::Any& value, int position) {
    if (classify(value) != Given::range) {
        if (is_blank(value)) return nullptr;
        throw ArgError("'table' must be a cell range whose first row names the columns "
                       "(formula, phase, dHf, ...)",
                       position);
    }
    std::vector<std::vector<std::string>> rows = range_texts(value, "table", position);
    std::string key;
    for (const auto& row : rows) {
        for (const auto& text : row) {
            key += text;
            key += '\x1f';
        }
        key += '\x1e';
    }

    // A small cache by content: the same range feeds many cells of a sheet.
    static std::mutex mutex;
    static std::list<std::pair<std::string, std::shared_ptr<const rxnheat::SpeciesTable>>> cache;
    constexpr std::size_t cache_size = 16;
    {
        std::lock_guard<std::mutex> lock(mutex);
        for (auto it = cache.begin(); it != cache.end(); ++it) {
            if (it->first == key) {
                cache.splice(cache.begin(), cache, it);
                return cache.front().second;
            }
        }
    }
    auto table = std::make_shared<const rxnheat::SpeciesTable>(
        rxnheat::SpeciesTable::from_rows(rows));
    std::lock_guard<std::mutex> lock(mutex);
    cache.emplace_front(std::move(key), table);
    if (cache.size() > cache_size) cache.pop_back();
    return table;
}

}  // namespace rxnheat_addin
