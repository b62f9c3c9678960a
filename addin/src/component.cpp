// The rxnheat Calc add-in: one UNO component whose methods are the catalogue's cell functions
// (rxnheat/catalogue.hpp). It is generic over the catalogue: the methods of XRxnheatFunctions
// are generated (rxnheat-gen methods -> function_methods.inc), each forwarding to call(index of
// its catalogue row, {its arguments}); the XAddIn names and Function Wizard texts are look-ups
// in the same rows. It computes nothing and knows no function by name.
//
// Errors: a single call with bad input throws css::lang::IllegalArgumentException carrying the
// engine's message (Calc shows Err:502); an engine bug throws css::uno::RuntimeException
// (#VALUE!). In an array result, a failing element holds the office's error value for Err:502
// (or #VALUE! for a bug) and the other elements are computed; RXNCHECK over the same range
// gives each reason in words. Nothing else ever leaves a method.
#include "uno_values.hpp"

#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/lang/Locale.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/lang/XServiceName.hpp>
#include <com/sun/star/sheet/XAddIn.hpp>
#include <com/sun/star/uno/RuntimeException.hpp>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <cppuhelper/implbase4.hxx>
#include <cppuhelper/supportsservice.hxx>
#include <cppuhelper/weak.hxx>
#include <org/rxnheat/calc/XRxnheatFunctions.hpp>
#include <sal/types.h>

#include <rxnheat/catalogue.hpp>

#include <new>
#include <string>

namespace rxnheat::addin {

namespace {

namespace lang = ::com::sun::star::lang;
namespace sheet = ::com::sun::star::sheet;

constexpr const char* service_name = "org.rxnheat.calc.Functions";
constexpr const char* implementation_name = "org.rxnheat.calc.FunctionsImpl";
constexpr const char* addin_service = "com.sun.star.sheet.AddIn";

OUString ascii(const char* s) { return OUString::createFromAscii(s); }

std::string safe_utf8(const OUString& s) {
    std::string out;
    return to_utf8(s, out) ? out : std::string();
}

bool same_ascii_ignoring_case(const std::string& a, const char* b) {
    std::size_t i = 0;
    for (; i < a.size() && b[i]; ++i) {
        char x = a[i], y = b[i];
        if (x >= 'a' && x <= 'z') x = static_cast<char>(x - 'a' + 'A');
        if (y >= 'a' && y <= 'z') y = static_cast<char>(y - 'a' + 'A');
        if (x != y) return false;
    }
    return i == a.size() && !b[i];
}

/// The Calc function of a programmatic name (the IDL method), or of a display name.
const FunctionSpec* by_method(const OUString& method) {
    const std::string m = safe_utf8(method);
    for (const auto& f : catalogue())
        if (f.in(layer_calc) && m == f.idl_method) return &f;
    return nullptr;
}
const FunctionSpec* by_display(const OUString& display) {
    const std::string d = safe_utf8(display);
    for (const auto& f : catalogue())
        if (f.in(layer_calc) && same_ascii_ignoring_case(d, f.calc_name)) return &f;
    return nullptr;
}
const ArgSpec* argument(const OUString& method, sal_Int32 index) {
    const FunctionSpec* f = by_method(method);
    if (!f || index < 0 || static_cast<std::size_t>(index) >= f->args.size()) return nullptr;
    return &f->args[static_cast<std::size_t>(index)];
}

/// The Function Wizard text of an argument: the catalogue's help, with whether it may be left
/// out (XAddIn has no other way to say so), and Calc's reading of a 0 where that matters.
std::string wizard_text(const ArgSpec& a) {
    std::string s = a.kind == ArgKind::rest ? "" : a.required ? "Required. " : "Optional. ";
    s += a.help;
    if (!a.required && (a.kind == ArgKind::temperature || a.kind == ArgKind::number))
        s += " A 0 counts as blank (Calc passes a blank cell as 0).";
    return s;
}

class Functions
    : public cppu::WeakImplHelper4<org::rxnheat::calc::XRxnheatFunctions, sheet::XAddIn,
                                   lang::XServiceName, lang::XServiceInfo> {
public:
    Functions() { locale_.Language = ascii("en"); }

    // --- XRxnheatFunctions: generated from the catalogue ----------------------------------------
#include "function_methods.inc"

    // --- XAddIn -------------------------------------------------------------------------------
    OUString SAL_CALL getProgrammaticFuntionName(const OUString& display) override {
        const FunctionSpec* f = by_display(display);
        return f ? ascii(f->idl_method) : OUString();
    }
    OUString SAL_CALL getDisplayFunctionName(const OUString& programmatic) override {
        const FunctionSpec* f = by_method(programmatic);
        return f ? ascii(f->calc_name) : OUString();
    }
    OUString SAL_CALL getFunctionDescription(const OUString& programmatic) override {
        const FunctionSpec* f = by_method(programmatic);
        return f ? from_utf8(f->description) : OUString();
    }
    OUString SAL_CALL getDisplayArgumentName(const OUString& programmatic, sal_Int32 index) override {
        const ArgSpec* a = argument(programmatic, index);
        return a ? ascii(a->name) : OUString();
    }
    OUString SAL_CALL getArgumentDescription(const OUString& programmatic, sal_Int32 index) override {
        const ArgSpec* a = argument(programmatic, index);
        return a ? from_utf8(wizard_text(*a)) : OUString();
    }
    // Every rxnheat function sits in Calc's own add-in category.
    OUString SAL_CALL getProgrammaticCategoryName(const OUString&) override { return ascii("Add-In"); }
    OUString SAL_CALL getDisplayCategoryName(const OUString&) override { return ascii("Add-In"); }

    // --- XLocalizable (texts are English only; the locale is kept as asked) -------------------
    void SAL_CALL setLocale(const lang::Locale& locale) override { locale_ = locale; }
    lang::Locale SAL_CALL getLocale() override { return locale_; }

    // --- XServiceName, XServiceInfo -----------------------------------------------------------
    OUString SAL_CALL getServiceName() override { return ascii(service_name); }
    OUString SAL_CALL getImplementationName() override { return ascii(implementation_name); }
    sal_Bool SAL_CALL supportsService(const OUString& name) override { return cppu::supportsService(this, name); }
    uno::Sequence<OUString> SAL_CALL getSupportedServiceNames() override {
        uno::Sequence<OUString> names(2);
        names.getArray()[0] = ascii(service_name);
        names.getArray()[1] = ascii(addin_service);
        return names;
    }

private:
    uno::XInterface* self() { return static_cast<cppu::OWeakObject*>(this); }

    /// Catalogue function `index` on Calc's arguments; a failure becomes one of the two UNO
    /// exceptions Calc understands.
    uno::Any call(std::size_t index, std::initializer_list<const uno::Any*> args,
                  const uno::Sequence<uno::Any>* rest = nullptr) {
        Answer a;
        try {
            a = answer(catalogue().at(index), args, rest);
        } catch (const std::bad_alloc&) {
            throw uno::RuntimeException(ascii("rxnheat: out of memory"), self());
        } catch (const std::exception& e) {
            throw uno::RuntimeException(ascii("rxnheat internal error: ") + from_utf8(e.what()), self());
        } catch (...) {
            throw uno::RuntimeException(ascii("rxnheat internal error (unknown exception)"), self());
        }
        switch (a.kind) {
        case Answer::Kind::value:
            return a.value;
        case Answer::Kind::bad_input:
            throw lang::IllegalArgumentException(from_utf8(a.message), self(), static_cast<sal_Int16>(a.argument));
        case Answer::Kind::internal:
            break;
        }
        throw uno::RuntimeException(ascii("rxnheat internal error: ") + from_utf8(a.message), self());
    }

    /// A function without arguments whose IDL result is a string.
    OUString call_text(std::size_t index) {
        OUString s;
        if (!(call(index, {}) >>= s))
            throw uno::RuntimeException(ascii("rxnheat internal error: a text function gave no text"), self());
        return s;
    }

    lang::Locale locale_;
};

}  // namespace

}  // namespace rxnheat::addin

// Named by the `constructor` attribute in rxnheat.components.
extern "C" SAL_DLLPUBLIC_EXPORT ::com::sun::star::uno::XInterface*
org_rxnheat_calc_Functions_get_implementation(
    ::com::sun::star::uno::XComponentContext*,
    const ::com::sun::star::uno::Sequence<::com::sun::star::uno::Any>&) {
    return cppu::acquire(new rxnheat::addin::Functions());
}
