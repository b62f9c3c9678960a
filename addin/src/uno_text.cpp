#include "uno_text.hpp"

#include <rtl/string.hxx>
#include <rtl/textcvt.h>
#include <rtl/textenc.h>
#include <sal/mathconf.h>

#include <limits>

namespace rxnheat::addin {

bool to_utf8(const OUString& text, std::string& out) {
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
