// The rxnheat Calc add-in: one UNO component whose methods are the cell functions of SPEC
// section 4. It converts arguments and results and calls the engine; it computes nothing.
//
// Errors: a single call with bad input throws css::lang::IllegalArgumentException carrying the
// engine's message (Calc shows Err:502); an engine bug throws css::uno::RuntimeException
// (#VALUE!). In an array result, a failing element holds the office's error value for Err:502
// (or #VALUE! for a bug) and the other elements are computed; RXNCHECK over the same range
// gives each reason in words. Nothing else ever leaves a method.
#include "convert.hpp"
#include "descriptions.hpp"

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

#include <rxnheat/rxnheat.hpp>

#include <new>
#include <string>

#ifndef RXNHEAT_ADDIN_VERSION
#error "RXNHEAT_ADDIN_VERSION must be defined by the build"
#endif

namespace rxnheat_addin {

namespace {

namespace lang = ::com::sun::star::lang;
namespace sheet = ::com::sun::star::sheet;
using Rows = uno::Sequence<uno::Sequence<uno::Any>>;

constexpr const char* service_name = "org.rxnheat.calc.Functions";
constexpr const char* implementation_name = "org.rxnheat.calc.FunctionsImpl";
constexpr const char* addin_service = "com.sun.star.sheet.AddIn";

OUString ascii(const char* s) { return OUString::createFromAscii(s); }

rxnheat::Engine& engine() { return rxnheat::Engine::shared(); }

uno::Any text_result(const std::string& s) { return uno::Any(from_utf8(s)); }

// Runs one cell function; turns every C++ exception into one of the two UNO exceptions
// Calc understands.
template <class F>
uno::Any guarded(uno::XInterface* self, F&& body) {
    try {
        return body();
    } catch (const lang::IllegalArgumentException&) {
        throw;
    } catch (const uno::RuntimeException&) {
        throw;
    } catch (const ArgError& e) {
        throw lang::IllegalArgumentException(from_utf8(e.what()), self,
                                             static_cast<sal_Int16>(e.position()));
    } catch (const rxnheat::Error& e) {
        if (e.kind() == rxnheat::ErrorKind::internal)
            throw uno::RuntimeException(ascii("rxnheat internal error: ") + from_utf8(e.what()), self);
        throw lang::IllegalArgumentException(from_utf8(e.what()), self, -1);
    } catch (const std::bad_alloc&) {
        throw uno::RuntimeException(ascii("rxnheat: out of memory"), self);
    } catch (const std::exception& e) {
        throw uno::RuntimeException(ascii("rxnheat internal error: ") + from_utf8(e.what()), self);
    } catch (...) {
        throw uno::RuntimeException(ascii("rxnheat internal error (unknown exception)"), self);
    }
}

// One element of an array result: the computed value, or the office's error value.
template <class F>
uno::Any element(const uno::Any& cell, const char* name, F& compute) {
    try {
        switch (classify(cell)) {
        case Given::nothing:
            return uno::Any();  // blank stays blank
        case Given::number:
            throw ArgError(std::string("'") + name + "' must be text, not a number", -1);
        case Given::range:
            throw ArgError("nested range", -1);
        case Given::text:
            break;
        }
        OUString s;
        cell >>= s;
        if (s.trim().isEmpty()) return uno::Any();
        return compute(to_utf8(s.trim()));
    } catch (const ArgError&) {
        return uno::Any(error_element(false));
    } catch (const rxnheat::Error& e) {
        return uno::Any(error_element(e.kind() == rxnheat::ErrorKind::internal));
    } catch (const std::bad_alloc&) {
        throw;
    } catch (const std::exception&) {
        return uno::Any(error_element(true));
    }
}

// The primary argument (reaction, species, formula): a single value gives compute(text); a
// range gives an array of the same shape, element by element, in this one call.
template <class F>
uno::Any over_primary(const uno::Any& primary, const char* name, F&& compute) {
    if (classify(primary) == Given::range) {
        Rows in;
        primary >>= in;
        Rows out(in.getLength());
        uno::Sequence<uno::Any>* out_rows = out.getArray();
        for (sal_Int32 r = 0; r < in.getLength(); ++r) {
            const uno::Sequence<uno::Any>& row = in[r];
            uno::Sequence<uno::Any> result(row.getLength());
            uno::Any* cells = result.getArray();
            for (sal_Int32 c = 0; c < row.getLength(); ++c)
                cells[c] = element(row[c], name, compute);
            out_rows[r] = result;
        }
        return uno::Any(out);
    }
    return compute(required_text_arg(primary, name, 0));
}

// RXNCHECK's form: every problem, of any argument, becomes words.
std::string words(const std::exception& e) { return e.what(); }

class Functions
    : public cppu::WeakImplHelper4<org::rxnheat::calc::XRxnheatFunctions, sheet::XAddIn,
                                   lang::XServiceName, lang::XServiceInfo> {
public:
    Functions() { locale_.Language = ascii("en"); }

    // --- XRxnheatFunctions ------------------------------------------------------------------
    uno::Any SAL_CALL rxnDH(const uno::Any& reaction, const uno::Any& temperature,
                            const uno::Any& unit, const uno::Any& per,
                            const uno::Any& table) override {
        return per_amount(&rxnheat::Engine::dh, reaction, temperature, unit, per, table);
    }

    uno::Any SAL_CALL rxnDU(const uno::Any& reaction, const uno::Any& temperature,
                            const uno::Any& unit, const uno::Any& per,
                            const uno::Any& table) override {
        return per_amount(&rxnheat::Engine::du, reaction, temperature, unit, per, table);
    }

    uno::Any SAL_CALL rxnLoad(const uno::Any& reaction, const uno::Any& quantity,
                              const uno::Any& quantityUnit, const uno::Any& key,
                              const uno::Any& resultUnit, const uno::Any& temperature,
                              const uno::Any& table) override {
        return guarded(self(), [&] {
            const double q = required_number_arg(quantity, "quantity", 1);
            const std::string qu = required_text_arg(quantityUnit, "quantity_unit", 2);
            const std::string k = required_text_arg(key, "key", 3);
            const std::string ru = text_arg(resultUnit, "result_unit", 4);
            const double T = temperature_arg(temperature, "temperature", 5);
            const auto t = table_arg(table, 6);
            return over_primary(reaction, "reaction", [&](const std::string& r) {
                return uno::Any(engine().load(r, q, qu, k, ru, {T, t.get()}));
            });
        });
    }

    uno::Any SAL_CALL rxnKind(const uno::Any& reaction, const uno::Any& temperature,
                              const uno::Any& tolerance, const uno::Any& table) override {
        return guarded(self(), [&] {
            const double T = temperature_arg(temperature, "temperature", 1);
            const double tol = number_arg(tolerance, "tolerance", 2, 0.1);
            const auto t = table_arg(table, 3);
            return over_primary(reaction, "reaction", [&](const std::string& r) {
                return text_result(rxnheat::to_string(engine().kind(r, {T, t.get()}, tol)));
            });
        });
    }

    uno::Any SAL_CALL rxnCheck(const uno::Any& reaction, const uno::Any& temperature,
                               const uno::Any& table) override {
        return guarded(self(), [&] {
            // Problems with the other arguments are the answer, in words, for every reaction.
            std::string problem;
            double T = rxnheat::T_ref;
            std::shared_ptr<const rxnheat::SpeciesTable> t;
            try {
                T = temperature_arg(temperature, "temperature", 1);
                t = table_arg(table, 2);
            } catch (const std::bad_alloc&) {
                throw;
            } catch (const std::exception& e) {
                problem = words(e);
            }
            auto check = [&](const std::string& r) -> std::string {
                if (!problem.empty()) return problem;
                return engine().check(r, {T, t.get()});
            };
            if (classify(reaction) != Given::range) {
                std::string r;
                try {
                    r = required_text_arg(reaction, "reaction", 0);
                } catch (const ArgError& e) {
                    return text_result(e.what());
                }
                return text_result(check(r));
            }
            Rows in;
            reaction >>= in;
            Rows out(in.getLength());
            for (sal_Int32 i = 0; i < in.getLength(); ++i) {
                const uno::Sequence<uno::Any>& row = in[i];
                uno::Sequence<uno::Any> result(row.getLength());
                for (sal_Int32 j = 0; j < row.getLength(); ++j) {
                    const uno::Any& cell = row[j];
                    OUString s;
                    if (classify(cell) == Given::nothing) continue;
                    if (classify(cell) == Given::text && (cell >>= s) && s.trim().isEmpty())
                        continue;
                    try {
                        result.getArray()[j] = text_result(check(
                            required_text_arg(cell, "reaction", 0)));
                    } catch (const ArgError& e) {
                        result.getArray()[j] = text_result(e.what());
                    }
                }
                out.getArray()[i] = result;
            }
            return uno::Any(out);
        });
    }

    uno::Any SAL_CALL rxnBalance(const uno::Any& reaction, const uno::Any& table) override {
        return guarded(self(), [&] {
            const auto t = table_arg(table, 1);
            return over_primary(reaction, "reaction", [&](const std::string& r) {
                return text_result(engine().balance(r, {rxnheat::T_ref, t.get()}));
            });
        });
    }

    uno::Any SAL_CALL rxnReverse(const uno::Any& reaction) override {
        return guarded(self(), [&] {
            return over_primary(reaction, "reaction", [&](const std::string& r) {
                return text_result(engine().reverse(r));
            });
        });
    }

    uno::Any SAL_CALL rxnScale(const uno::Any& reaction, const uno::Any& factor) override {
        return guarded(self(), [&] {
            // A number goes to scale(double); text ("1/2", "½") to scale(text), kept exact.
            bool numeric = false;
            double f = 0;
            std::string ftext;
            if (classify(factor) == Given::number) {
                numeric = true;
                f = required_number_arg(factor, "factor", 1);
            } else if (classify(factor) == Given::range) {
                f = required_number_arg(factor, "factor", 1);  // a 1x1 range of a number
                numeric = true;
            } else {
                ftext = required_text_arg(factor, "factor", 1);
            }
            return over_primary(reaction, "reaction", [&](const std::string& r) {
                return text_result(numeric ? engine().scale(r, f) : engine().scale(r, ftext));
            });
        });
    }

    uno::Any SAL_CALL speciesHf(const uno::Any& species, const uno::Any& temperature,
                                const uno::Any& unit, const uno::Any& table) override {
        return guarded(self(), [&] {
            const double T = temperature_arg(temperature, "temperature", 1);
            const std::string u = text_arg(unit, "unit", 2);
            const auto t = table_arg(table, 3);
            return over_primary(species, "species", [&](const std::string& s) {
                return uno::Any(engine().species_hf(s, {T, t.get()}, u));
            });
        });
    }

    uno::Any SAL_CALL speciesCp(const uno::Any& species, const uno::Any& temperature,
                                const uno::Any& table) override {
        return guarded(self(), [&] {
            const double T = required_temperature_arg(temperature);
            const auto t = table_arg(table, 2);
            return over_primary(species, "species", [&](const std::string& s) {
                return uno::Any(engine().species_cp(s, {T, t.get()}));
            });
        });
    }

    uno::Any SAL_CALL speciesH(const uno::Any& species, const uno::Any& temperature,
                               const uno::Any& referenceTemperature,
                               const uno::Any& table) override {
        return guarded(self(), [&] {
            const double T = required_temperature_arg(temperature);
            const double Tref = temperature_arg(referenceTemperature, "reference_temperature", 2);
            const auto t = table_arg(table, 3);
            return over_primary(species, "species", [&](const std::string& s) {
                return uno::Any(engine().species_h(s, {T, t.get()}, Tref));
            });
        });
    }

    uno::Any SAL_CALL molarMass(const uno::Any& formula) override {
        return guarded(self(), [&] {
            return over_primary(formula, "formula", [&](const std::string& f) {
                return uno::Any(engine().molar_mass(f));
            });
        });
    }

    uno::Any SAL_CALL rxnSource(const uno::Any& reactionOrSpecies,
                                const uno::Any& table) override {
        return guarded(self(), [&] {
            const auto t = table_arg(table, 1);
            return over_primary(reactionOrSpecies, "reaction_or_species",
                                [&](const std::string& x) {
                                    return text_result(engine().source(x, {rxnheat::T_ref, t.get()}));
                                });
        });
    }

    OUString SAL_CALL rxnVersion() override {
        uno::Any text = guarded(self(), [&] {
            return text_result(std::string("rxnheat Calc add-in ") + RXNHEAT_ADDIN_VERSION +
                               "; engine " + rxnheat::Engine::version());
        });
        OUString s;
        text >>= s;
        return s;
    }

    // --- XAddIn -------------------------------------------------------------------------------
    OUString SAL_CALL getProgrammaticFuntionName(const OUString& display) override {
        const FunctionText* f = by_display(safe_utf8(display));
        return f ? ascii(f->programmatic) : OUString();
    }
    OUString SAL_CALL getDisplayFunctionName(const OUString& programmatic) override {
        const FunctionText* f = by_programmatic(safe_utf8(programmatic));
        return f ? ascii(f->display) : OUString();
    }
    OUString SAL_CALL getFunctionDescription(const OUString& programmatic) override {
        const FunctionText* f = by_programmatic(safe_utf8(programmatic));
        return f ? from_utf8(f->description) : OUString();
    }
    OUString SAL_CALL getDisplayArgumentName(const OUString& programmatic,
                                             sal_Int32 argument) override {
        const ArgumentText* a = argument_text(programmatic, argument);
        return a ? ascii(a->name) : OUString();
    }
    OUString SAL_CALL getArgumentDescription(const OUString& programmatic,
                                             sal_Int32 argument) override {
        const ArgumentText* a = argument_text(programmatic, argument);
        return a ? from_utf8(a->description) : OUString();
    }
    OUString SAL_CALL getProgrammaticCategoryName(const OUString&) override {
        return ascii("Add-In");
    }
    OUString SAL_CALL getDisplayCategoryName(const OUString&) override {
        return ascii("Add-In");
    }

    // --- XLocalizable (texts are English only; the locale is kept as asked) -------------------
    void SAL_CALL setLocale(const lang::Locale& locale) override { locale_ = locale; }
    lang::Locale SAL_CALL getLocale() override { return locale_; }

    // --- XServiceName, XServiceInfo -----------------------------------------------------------
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
    // SPECIESCP and SPECIESH: the temperature (argument 1) has no default.
    static double required_temperature_arg(const uno::Any& temperature) {
        if (is_blank(temperature))
            throw ArgError("'temperature' is required (a number in K, or text such as \"350 C\")", 1);
        return temperature_arg(temperature, "temperature", 1);
    }

    // RXNDH and RXNDU: the same arguments, one engine function each. An empty unit is the
    // engine's default (kJ/mol).
    using PerAmount = double (rxnheat::Engine::*)(std::string_view, const rxnheat::Conditions&,
                                                   std::string_view, std::string_view);
    uno::Any per_amount(PerAmount f, const uno::Any& reaction, const uno::Any& temperature,
                        const uno::Any& unit, const uno::Any& per, const uno::Any& table) {
        return guarded(self(), [&] {
            const double T = temperature_arg(temperature, "temperature", 1);
            const std::string u = text_arg(unit, "unit", 2);
            const std::string p = text_arg(per, "per", 3);
            const auto t = table_arg(table, 4);
            return over_primary(reaction, "reaction", [&](const std::string& r) {
                return uno::Any((engine().*f)(r, {T, t.get()}, u, p));
            });
        });
    }

    uno::XInterface* self() { return static_cast<cppu::OWeakObject*>(this); }
    static std::string safe_utf8(const OUString& s) {
        try {
            return to_utf8(s);
        } catch (...) {
            return {};
        }
    }
    static const ArgumentText* argument_text(const OUString& programmatic, sal_Int32 argument) {
        const FunctionText* f = by_programmatic(safe_utf8(programmatic));
        if (!f || argument < 0 || static_cast<std::size_t>(argument) >= f->arguments.size())
            return nullptr;
        return &f->arguments[static_cast<std::size_t>(argument)];
    }

    lang::Locale locale_;
};

}  // namespace

}  // namespace rxnheat_addin

// Named by the `constructor` attribute in rxnheat.components.
extern "C" SAL_DLLPUBLIC_EXPORT ::com::sun::star::uno::XInterface*
org_rxnheat_calc_Functions_get_implementation(
    ::com::sun::star::uno::XComponentContext*,
    const ::com::sun::star::uno::Sequence<::com::sun::star::uno::Any>&) {
    return cppu::acquire(new rxnheat_addin::Functions());
}
