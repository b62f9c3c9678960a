// Benchmark only (tests/bench/bench_addin.py), never shipped in rxnheat.oxt.
//
// BENCHNOOP(reaction; [temperature]; [unit]; [per]; [table]) has RXNDH's shape and reads its
// arguments with engine-free code of the add-in's former hand-written shape (noop_args.hpp: type
// checks, blank and omitted arguments, 1x1 ranges, UTF-16 -> UTF-8 conversion and trimming of
// the text, a range as the first argument giving an array of the same shape), then returns 0.0
// for every reaction without calling any engine. The time a sheet of BENCHNOOP cells takes is
// the floor that RXNDH's own cost sits on.
#include "noop_args.hpp"

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
#include <sal/types.h>

#include <string>

namespace {

namespace uno = ::com::sun::star::uno;
namespace lang = ::com::sun::star::lang;
namespace sheet = ::com::sun::star::sheet;
using ::rtl::OUString;
using Rows = uno::Sequence<uno::Sequence<uno::Any>>;
using rxnheat_addin::ArgError;
using rxnheat_addin::Given;
using rxnheat_addin::classify;

constexpr const char* service_name = "org.rxnheat.benchnoop.Functions";
constexpr const char* implementation_name = "org.rxnheat.benchnoop.FunctionsImpl";
constexpr const char* addin_service = "com.sun.star.sheet.AddIn";
constexpr const char* display_name = "BENCHNOOP";
constexpr const char* programmatic_name = "benchNoop";
const char* const argument_names[] = {"reaction", "temperature", "unit", "per", "table"};

OUString ascii(const char* s) { return OUString::createFromAscii(s); }

// What RXNDH computes from a reaction's text, here nothing: the text has been read.
uno::Any noop_result(const std::string&) { return uno::Any(0.0); }

// One element of the array result, as RXNDH gives it: a blank cell or blank text stays blank,
// a number or a nested range is the office's error value (Err:502), text gives the result.
uno::Any noop_element(const uno::Any& cell) {
    try {
        const Given kind = classify(cell);
        if (kind == Given::nothing) return uno::Any();
        if (kind != Given::text) return uno::Any(rxnheat_addin::error_element(false));
        OUString s;
        cell >>= s;
        const OUString t = s.trim();
        return t.isEmpty() ? uno::Any() : noop_result(rxnheat_addin::to_utf8(t));
    } catch (const ArgError&) {
        return uno::Any(rxnheat_addin::error_element(false));
    }
}

// The table argument, read as RXNDH reads it before building a species table.
void read_table(const uno::Any& table, int position) {
    if (classify(table) == Given::range)
        rxnheat_addin::range_texts(table, "table", position);
    else if (!rxnheat_addin::is_blank(table))
        throw ArgError("'table' must be a cell range", position);
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
            // Temperature text is read, not parsed: parsing belongs to the engine.
            rxnheat_addin::number_or_text_arg(temperature, "temperature", 1);
            rxnheat_addin::text_arg(unit, "unit", 2);
            rxnheat_addin::text_arg(per, "per", 3);
            read_table(table, 4);
            if (classify(reaction) != Given::range)
                return noop_result(rxnheat_addin::required_text_arg(reaction, "reaction", 0));
            Rows in;
            reaction >>= in;
            Rows out(in.getLength());
            for (sal_Int32 r = 0; r < in.getLength(); ++r) {
                uno::Sequence<uno::Any> result(in[r].getLength());
                for (sal_Int32 c = 0; c < in[r].getLength(); ++c)
                    result.getArray()[c] = noop_element(in[r][c]);
                out.getArray()[r] = result;
            }
            return uno::Any(out);
        } catch (const ArgError& e) {
            throw lang::IllegalArgumentException(rxnheat_addin::from_utf8(e.what()), self(),
                                                 static_cast<sal_Int16>(e.position()));
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
