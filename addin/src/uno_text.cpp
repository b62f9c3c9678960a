#include "uno_text.hpp"

#include <rtl/string.hxx>
#include <rtl/textcvt.h>
#include <rtl/textenc.h>
#include <sal/mathconf.h>

#include <cstddef>
#include <limits>

namespace rxnheat::addin {

bool to_utf8(const OUString& text, std::string& out) {
    // Most cells are ASCII (reaction texts, units): copied straight into `out`, without the
    // OString that the general conversion allocates and then copies (one allocation a cell less
    // on the array path, tests/bench/bench_addin_array.cpp).
    const sal_Unicode* p = text.getStr();
    const std::size_t n = static_cast<std::size_t>(text.getLength());
    std::size_t i = 0;
    while (i < n && p[i] < 0x80) ++i;
    if (i == n) {
        out.resize(n);
        for (std::size_t k = 0; k < n; ++k) out[k] = static_cast<char>(p[k]);
        return true;
    }
    // A lone surrogate is refused here: the office's converter drops a high surrogate at the
    // end of the text without an error ("H2O" + UNICHAR(55357) would read as "H2O").
    for (std::size_t k = i; k < n; ++k) {
        if (p[k] >= 0xD800 && p[k] <= 0xDBFF) {
            if (k + 1 == n || p[k + 1] < 0xDC00 || p[k + 1] > 0xDFFF) return false;
            ++k;
        } else if (p[k] >= 0xDC00 && p[k] <= 0xDFFF) {
            return false;
        }
    }
    ::rtl::OString s;
    if (!text.convertToString(&s, RTL_TEXTENCODING_UTF8,
                              RTL_UNICODETOTEXT_FLAGS_UNDEFINED_ERROR | RTL_UNICODETOTEXT_FLAGS_INVALID_ERROR))
        return false;
    out.assign(s.getStr(), static_cast<std::size_t>(s.getLength()));
    return true;
}

OUString from_utf8(std::string_view text) {
    return OUString(text.data(), static_cast<sal_Int32>(text.size()), RTL_TEXTENCODING_UTF8);
}

double error_element(bool internal) {
    // LibreOffice's formula error codes: 502 = invalid argument, 519 = #VALUE!.
    sal_math_Double v;
    v.value = std::numeric_limits<double>::quiet_NaN();
    v.nan_parts.fraction_lo = internal ? 519u : 502u;
    return v.value;
}

}  // namespace rxnheat::addin
