// Benchmark only (tests/bench/bench_addin.py), never shipped in rxnheat.oxt.
//
// BENCHNOOP(reaction; [temperature]; [unit]; [per]; [table]) has RXNDH's shape and reads its
// arguments the way the rxnheat add-in does (type checks, blank and omitted arguments, 1x1
// ranges, UTF-16 -> UTF-8 conversion and trimming of the text, a range as the first argument
// giving an array of the same shape), then returns 0.0 for every reaction without calling any
// engine. The time a sheet of BENCHNOOP cells takes is the floor that RXNDH's own cost sits on.
#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/lang/XServiceName.hpp>
#include <com/sun/star/sheet/XAddIn.hpp>
#include <com/sun/star/uno/RuntimeException.hpp>
#include <com/sun/star/uno/Sequence.hxx>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <cppuhelper/implbase4.hxx>
#include <cppuhelper/supportsservice.hxx>
#include <cppuhelper/weak.hxx>
#include <org/rxnheat/benchnoop/XBenchNoop.hpp>
#include <rtl/string.hxx>
#include <rtl/textcvt.h>
#include <rtl/textenc.h>
#include <rtl/ustring.hxx>
#include <sal/types.h>

#include <string>

namespace {

namespace uno = ::com::sun::star::uno;
namespace lang = ::com::sun::star::lang;
namespace sheet = ::com::sun::star::sheet;
using ::rtl::OString;
using ::rtl::OUString;
using Rows = uno::Sequence<uno::Sequence<uno::Any>>;

constexpr const char* service_name = "org.rxnheat.benchnoop.Functions";
constexpr const char* implementation_name = "org.rxnheat.benchnoop.FunctionsImpl";
constexpr const char* addin_service = "com.sun.star.sheet.AddIn";
constexpr const char* display_name = "BENCHNOOP";
constexpr const char* programmatic_name = "benchNoop";
const char* const argument_names[] = {"reaction", "temperature", "unit", "per", "table"};

OUString ascii(const char* s) { return OUString::createFromAscii(s); }

struct BadArgument {
    const char* what;
    int position;
};

enum class Given { nothing, text, number, range };

Given classify(const uno::Any& v) {
    switch (v.getValueTypeClass()) {
    case uno::TypeClass_VOID:
        return Given::nothing;
    case uno::TypeClass_STRING:
        return Given::text;
    case uno::TypeClass_DOUBLE:
    case uno::TypeClass_FLOAT:
    case uno::TypeClass_LONG:
    case uno::TypeClass_UNSIGNED_LONG:
    case uno::TypeClass_SHORT:
    case uno::TypeClass_UNSIGNED_SHORT:
    case uno::TypeClass_HYPER:
    case uno::TypeClass_UNSIGNED_HYPER:
    case uno::TypeClass_BYTE:
    case uno::TypeClass_BOOLEAN:
        return Given::number;
    case uno::TypeClass_SEQUENCE:
        if (v.getValueType() == cppu::UnoType<Rows>::get()) return Given::range;
        [[fallthrough]];
    default:
        throw BadArgument{"unexpected kind of value", -1};
    }
}

// The one cell of a 1x1 range, or the value itself.
const uno::Any& single(const uno::Any& v, int position) {
    if (classify(v) != Given::range) return v;
    const Rows* rows = static_cast<const Rows*>(v.getValue());
    if (rows->getLength() == 1 && (*rows)[0].getLength() == 1) return (*rows)[0][0];
    throw BadArgument{"a single value was expected, not a range", position};
}

bool blank(const uno::Any& v) {
    switch (classify(v)) {
    case Given::nothing:
        return true;
    case Given::number: {
        double d = 0;
        v >>= d;
        return d == 0;
    }
    case Given::text: {
        OUString s;
        v >>= s;
        return s.trim().isEmpty();
    }
    case Given::range:
        break;
    }
    return false;
}

std::string utf8(const OUString& s, int position) {
    OString out;
    if (!s.convertToString(&out, RTL_TEXTENCODING_UTF8,
                           RTL_UNICODETOTEXT_FLAGS_UNDEFINED_ERROR |
                               RTL_UNICODETOTEXT_FLAGS_INVALID_ERROR))
        throw BadArgument{"text that is not valid UTF-16", position};
    return std::string(out.getStr(), static_cast<std::size_t>(out.getLength()));
}

// Optional text (unit, per): empty when not given.
std::string optional_text(const uno::Any& raw, int position) {
    const uno::Any& v = single(raw, position);
    if (blank(v)) return {};
    if (classify(v) == Given::number) throw BadArgument{"text expected, not a number", position};
    OUString s;
    v >>= s;
    return utf8(s.trim(), position);
}

// Optional temperature: a number, or text (read, not parsed: parsing belongs to the engine).
double optional_temperature(const uno::Any& raw, int position) {
    const uno::Any& v = single(raw, position);
    if (blank(v)) return 298.15;
    if (classify(v) == Given::number) {
        double t = 0;
        v >>= t;
        return t;
    }
    OUString s;
    v >>= s;
    return static_cast<double>(utf8(s.trim(), position).size());
}

// Optional table: every cell read as text, as the add-in does before building a table.
std::size_t optional_table(const uno::Any& v, int position) {
    if (classify(v) != Given::range) {
        if (blank(v)) return 0;
        throw BadArgument{"a cell range was expected", position};
    }
    std::size_t bytes = 0;
    for (const auto& row : *static_cast<const Rows*>(v.getValue()))
        for (const auto& cell : row) {
            OUString s;
            if (classify(cell) == Given::text && (cell >>= s)) bytes += utf8(s, position).size();
        }
    return bytes;
}

class NoopFunctions
    : public cppu::WeakImplHelper4<org::rxnheat::benchnoop::XBenchNoop, sheet::XAddIn,
                                   lang::XServiceName, lang::XServiceInfo> {
public:
    NoopFunctions() { locale_.Language = ascii("en"); }

    uno::Any SAL_CALL benchNoop(const uno::Any& reaction, const uno::Any& temperature,
                                const uno::Any& unit, const uno::Any& per,
                                const uno::Any& table) override {
        try {
            optional_temperature(temperature, 1);
            optional_text(unit, 2);
            optional_text(per, 3);
            optional_table(table, 4);
            if (classify(reaction) == Given::range) {
                const Rows& in = *static_cast<const Rows*>(reaction.getValue());
                Rows out(in.getLength());
                for (sal_Int32 r = 0; r < in.getLength(); ++r) {
                    const uno::Sequence<uno::Any>& row = in[r];
                    uno::Sequence<uno::Any> result(row.getLength());
                    for (sal_Int32 c = 0; c < row.getLength(); ++c) {
                        OUString s;
                        if (classify(row[c]) != Given::text || !(row[c] >>= s)) continue;
                        OUString t = s.trim();
                        if (t.isEmpty()) continue;
                        utf8(t, 0);
                        result.getArray()[c] <<= 0.0;
                    }
                    out.getArray()[r] = result;
                }
                return uno::Any(out);
            }
            if (optional_text(reaction, 0).empty())
                throw BadArgument{"'reaction' is required but empty", 0};
            return uno::Any(0.0);
        } catch (const BadArgument& e) {
            throw lang::IllegalArgumentException(ascii(e.what), self(),
                                                 static_cast<sal_Int16>(e.position));
        }
    }

    // --- XAddIn -----------------------------------------------------------------------------
    OUString SAL_CALL getProgrammaticFuntionName(const OUString& display) override {
        return display.equalsAscii(display_name) ? ascii(programmatic_name) : OUString();
    }
    OUString SAL_CALL getDisplayFunctionName(const OUString& programmatic) override {
        return programmatic.equalsAscii(programmatic_name) ? ascii(display_name) : OUString();
    }
    OUString SAL_CALL getFunctionDescription(const OUString& programmatic) override {
        return programmatic.equalsAscii(programmatic_name)
                   ? ascii("Benchmark only: reads RXNDH's arguments and returns 0.")
                   : OUString();
    }
    OUString SAL_CALL getDisplayArgumentName(const OUString& programmatic,
                                             sal_Int32 argument) override {
        if (!programmatic.equalsAscii(programmatic_name) || argument < 0 || argument > 4)
            return OUString();
        return ascii(argument_names[argument]);
    }
    OUString SAL_CALL getArgumentDescription(const OUString& programmatic,
                                             sal_Int32 argument) override {
        return getDisplayArgumentName(programmatic, argument);
    }
    OUString SAL_CALL getProgrammaticCategoryName(const OUString&) override {
        return ascii("Add-In");
    }
    OUString SAL_CALL getDisplayCategoryName(const OUString&) override {
        return ascii("Add-In");
    }

    // --- XLocalizable -----------------------------------------------------------------------
    void SAL_CALL setLocale(const lang::Locale& locale) override { locale_ = locale; }
    lang::Locale SAL_CALL getLocale() override { return locale_; }

    // --- XServiceName, XServiceInfo ---------------------------------------------------------
    OUString SAL_CALL getServiceName() override { return ascii(service_name); }
    OUString SAL_CALL getImplementationName() override { return ascii(implementation_name); }
    sal_Bool SAL_CALL supportsService(const OUString& name) override {
        return cppu::supportsService(this, name);
    }
    uno::Sequence<OUString> SAL_CALL getSupportedServiceNames() override {
        uno::Sequence<OUString> names(2);
        names.getArray()[0] = ascii(service_name);
        names.getArray()[1] = ascii(addin_service);
        return names;
    }

private:
    uno::XInterface* self() { return static_cast<cppu::OWeakObject*>(this); }
    lang::Locale locale_;
};

}  // namespace

// Named by the `constructor` attribute in benchnoop.components.
extern "C" SAL_DLLPUBLIC_EXPORT ::com::sun::star::uno::XInterface*
org_rxnheat_benchnoop_Functions_get_implementation(
    ::com::sun::star::uno::XComponentContext*,
    const ::com::sun::star::uno::Sequence<::com::sun::star::uno::Any>&) {
    return cppu::acquire(new NoopFunctions());
}
