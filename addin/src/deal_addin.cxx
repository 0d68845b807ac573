// The counteroffer Calc add-in: UNO glue only.
//
// Every method (generated from the catalogue table into deal_methods_*.inc) forwards
// to evaluate(), which
//   1. converts each UNO Any to a double (omitted -> the catalogue default; text of
//      a choice -> its index; TRUE/FALSE -> 1/0; text where a number is needed, or
//      an empty cell inside a range -> NaN, which the library rejects as an invalid
//      argument; Calc 7.4 itself passes a single empty cell reference as 0),
//   2. calls cto_call (all scalars) or cto_call_strided (any argument a range),
//   3. maps the status to the error value Calc shows (addin/README.md):
//        invalid argument -> IllegalArgumentException       -> Err:502
//        no deal          -> VOID result                     -> #N/A
//        indeterminate    -> NaN result                      -> #NUM! (Err:503)
//        no convergence   -> sheet::NoConvergenceException   -> Err:523
//        internal error   -> RuntimeException                -> #VALUE! (Err:519)
//      In an array result each element carries its own code as an error NaN.
// DEALRANGE, DEALRANGEOUTCOME, DEALSWING (src/ranges.hxx) and DEALOFFERPATH
// (src/offers.hxx) are not catalogue rows; their methods forward to share_range,
// share_swing and offer_path below, with the same conversion and error values.
// Validation and mathematics live in the library only.
#include <counteroffer/counteroffer.h>

#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/lang/XServiceName.hpp>
#include <com/sun/star/sheet/NoConvergenceException.hpp>
#include <com/sun/star/uno/RuntimeException.hpp>
#include <com/sun/star/uno/Sequence.hxx>
#include <com/sun/star/uno/XComponentContext.hpp>
#include <cppuhelper/factory.hxx>
#include <cppuhelper/implbase3.hxx>
#include <cppuhelper/implementationentry.hxx>
#include <cppuhelper/supportsservice.hxx>
#include <cppu/unotype.hxx>
#include <org/counteroffer/XDealFunctions.hpp>
#include <rtl/ustring.hxx>

#include <cmath>
#include <cstdint>
#include <cstring>
#include <exception>
#include <limits>
#include <memory>
#include <vector>

#include "convert.hxx"
#include "offers.hxx"
#include "ranges.hxx"

namespace {

constexpr const char kServiceName[] = "org.counteroffer.DealFunctions";
constexpr const char kImplName[] = "org.counteroffer.DealFunctionsImpl";
constexpr int kMaxArgs = 32;

css::uno::Sequence<OUString> SAL_CALL service_names() {
    css::uno::Sequence<OUString> s(2);
    s.getArray()[0] = kServiceName;
    s.getArray()[1] = "com.sun.star.sheet.AddIn";
    return s;
}

} // namespace

namespace {

class DealFunctions
    : public cppu::WeakImplHelper3<org::counteroffer::XDealFunctions, css::lang::XServiceName,
                                   css::lang::XServiceInfo> {
  public:
    DealFunctions() {
        static_assert(sizeof(double) == 8, "IEEE double");
        table_.assign(cto_function_count(), nullptr);
        for (size_t i = 0; i < table_.size(); ++i) {
            const cto_function_info *f = cto_function_at(i);
            if (f && f->id >= 0 && static_cast<size_t>(f->id) < table_.size()) table_[f->id] = f;
        }
    }

    // XServiceName
    OUString SAL_CALL getServiceName() override { return kServiceName; }
    // XServiceInfo
    OUString SAL_CALL getImplementationName() override { return kImplName; }
    sal_Bool SAL_CALL supportsService(const OUString &name) override {
        return cppu::supportsService(this, name);
    }
    css::uno::Sequence<OUString> SAL_CALL getSupportedServiceNames() override {
        return service_names();
    }

    // org::counteroffer::XDealFunctions (generated from the catalogue table)
#include "deal_methods_decl.inc"

  private:
    std::vector<const cto_function_info *> table_;

    // Runs f; only the three UNO exceptions of the error mapping leave it, anything else
    // becomes a RuntimeException (#VALUE!).
    template <class F> static css::uno::Any guarded(F f) {
        try {
            return f();
        } catch (const css::uno::Exception &) {
            throw;
        } catch (const std::exception &e) {
            throw css::uno::RuntimeException(OUString::createFromAscii(e.what()));
        } catch (...) {
            throw css::uno::RuntimeException("counteroffer: unexpected failure");
        }
    }

    const cto_function_info &info(int id) const {
        if (id < 0 || static_cast<size_t>(id) >= table_.size() || !table_[id])
            throw css::uno::RuntimeException("counteroffer: function " + OUString::number(id) +
                                             " is not in the library's catalogue");
        return *table_[id];
    }

    [[noreturn]] void throw_invalid(const cto_function_info &f, int bad) const {
        OUString what = OUString::createFromAscii(f.calc_name) + ": invalid argument";
        if (bad >= 0 && bad < f.n_args)
            what += " " + OUString::number(bad + 1) + " (" +
                    OUString::createFromAscii(f.args[bad].label) + ")";
        throw css::lang::IllegalArgumentException(
            what, css::uno::Reference<css::uno::XInterface>(),
            static_cast<sal_Int16>(bad >= 0 ? bad : 0));
    }

  public:
    // The generic evaluator behind every generated method (public for the glue test).
    css::uno::Any evaluate(int id, const Arg *args, int n, bool outcome) {
        try {
            const cto_function_info &f = info(id);
            if (f.n_args != n || n > kMaxArgs || f.n_outputs < 1 || f.n_outputs > kMaxArgs)
                throw css::uno::RuntimeException(
                    "counteroffer: the add-in was built for another catalogue");
            View views[kMaxArgs];
            bool array = outcome;
            for (int j = 0; j < n; ++j) {
                if (!make_view(args[j], views[j])) throw_invalid(f, j);
                array = array || views[j].rows != 1 || views[j].cols != 1;
            }
            if (array) return evaluate_array(f, views, outcome);
            return evaluate_scalar(f, views);
        } catch (const css::uno::Exception &) {
            throw; // IllegalArgument, NoConvergence, Runtime: mapped by Calc
        } catch (const std::exception &e) {
            throw css::uno::RuntimeException(OUString::createFromAscii(e.what()));
        } catch (...) {
            throw css::uno::RuntimeException("counteroffer: unexpected failure");
        }
    }

  private:
    css::uno::Any evaluate_scalar(const cto_function_info &f, const View *views) {
        double in[kMaxArgs];
        double out[kMaxArgs];
        for (int j = 0; j < f.n_args; ++j) in[j] = to_double(views[j].first(), f.args[j]);
        int bad = -1;
        const int st = cto_call(f.id, in, out, &bad);
        switch (st) {
        case CTO_OK:
            if (std::isfinite(out[0])) return css::uno::Any(out[0]);
            throw css::uno::RuntimeException(OUString::createFromAscii(f.calc_name) +
                                             ": the library returned a non-finite value");
        case CTO_E_INVALID: throw_invalid(f, bad);
        case CTO_E_NO_DEAL: return css::uno::Any(); // VOID -> #N/A
        case CTO_E_INDETERMINATE: return css::uno::Any(kNaN); // -> #NUM!
        case CTO_E_NO_CONVERGENCE:
            throw css::sheet::NoConvergenceException(
                OUString::createFromAscii(f.calc_name) + ": no convergence",
                css::uno::Reference<css::uno::XInterface>());
        default:
            throw css::uno::RuntimeException(OUString::createFromAscii(f.calc_name) + ": " +
                                             OUString::createFromAscii(cto_status_message(st)));
        }
    }

    // The common shape of the range arguments (a single value or 1x1 range broadcasts);
    // ranges of different shapes are an invalid argument.
    void array_shape(const cto_function_info &f, const View *views, sal_Int32 &rows,
                     sal_Int32 &cols) const {
        rows = cols = 1;
        for (int j = 0; j < f.n_args; ++j) {
            const View &v = views[j];
            if (v.rows == 1 && v.cols == 1) continue;
            if (rows == 1 && cols == 1) {
                rows = v.rows;
                cols = v.cols;
            } else if (v.rows != rows || v.cols != cols) {
                throw css::lang::IllegalArgumentException(
                    OUString::createFromAscii(f.calc_name) + ": argument " +
                        OUString::number(j + 1) + " has another shape than the ranges before it",
                    css::uno::Reference<css::uno::XInterface>(), static_cast<sal_Int16>(j));
            }
        }
    }

    // Every element's outputs and status through cto_call_strided: each range argument
    // as a column of doubles (row-major), a single value with stride 0.
    struct Columns {
        std::vector<std::vector<double>> outs;
        std::vector<signed char> status;
    };
    Columns strided_call(const cto_function_info &f, const View *views, sal_Int32 rows,
                         sal_Int32 cols) {
        const int n = f.n_args;
        const size_t count = static_cast<size_t>(rows) * static_cast<size_t>(cols);
        std::vector<std::vector<double>> cols_in(static_cast<size_t>(n));
        std::vector<const char *> arg_ptr(static_cast<size_t>(n));
        std::vector<ptrdiff_t> arg_stride(static_cast<size_t>(n));
        for (int j = 0; j < n; ++j) {
            const size_t uj = static_cast<size_t>(j);
            const View &v = views[j];
            std::vector<double> &c = cols_in[uj];
            if (v.rows != 1 || v.cols != 1) {
                c.resize(count);
                size_t k = 0;
                for (sal_Int32 r = 0; r < rows; ++r) {
                    const css::uno::Any *row = (*v.m)[r].getConstArray();
                    for (sal_Int32 q = 0; q < cols; ++q) c[k++] = to_double(row[q], f.args[j]);
                }
                arg_stride[uj] = static_cast<ptrdiff_t>(sizeof(double));
            } else {
                c.assign(1, to_double(v.first(), f.args[j]));
                arg_stride[uj] = 0;
            }
            arg_ptr[uj] = reinterpret_cast<const char *>(c.data());
        }
        Columns res;
        res.outs.assign(static_cast<size_t>(f.n_outputs), std::vector<double>(count));
        res.status.resize(count);
        std::vector<char *> out_ptr(static_cast<size_t>(f.n_outputs));
        std::vector<ptrdiff_t> out_stride(static_cast<size_t>(f.n_outputs),
                                          static_cast<ptrdiff_t>(sizeof(double)));
        for (size_t k = 0; k < res.outs.size(); ++k)
            out_ptr[k] = reinterpret_cast<char *>(res.outs[k].data());
        cto_batch_report report;
        std::memset(&report, 0, sizeof report);
        report.size = sizeof report;
        if (cto_call_strided(f.id, count, arg_ptr.data(), arg_stride.data(), out_ptr.data(),
                             out_stride.data(), res.status.data(), 1, &report) != CTO_OK)
            throw css::uno::RuntimeException(OUString::createFromAscii(f.calc_name) +
                                             ": the strided call was refused");
        return res;
    }

    // Ranges in, array out.  Every range argument must have the same shape; a
    // single value (or a 1x1 range) applies to every element.  The plain form
    // returns the first output in that shape; the outcome form returns one row per
    // element (row-major) with every output as a column.
    css::uno::Any evaluate_array(const cto_function_info &f, const View *views, bool outcome) {
        sal_Int32 rows = 1, cols = 1;
        array_shape(f, views, rows, cols);
        const Columns c = strided_call(f, views, rows, cols);
        const size_t count = c.status.size();
        auto cell = [&](size_t i, int k) -> double {
            const int s = c.status[i];
            const double v = c.outs[static_cast<size_t>(k)][i];
            if (s == CTO_OK || (outcome && s == CTO_E_NO_DEAL))
                return std::isfinite(v) ? v : error_nan(kErrNoValue);
            return error_nan(status_error(s));
        };
        if (!outcome) {
            css::uno::Sequence<css::uno::Sequence<double>> res(rows);
            auto *pr = res.getArray();
            size_t i = 0;
            for (sal_Int32 r = 0; r < rows; ++r) {
                css::uno::Sequence<double> row(cols);
                double *p = row.getArray();
                for (sal_Int32 q = 0; q < cols; ++q) p[q] = cell(i++, 0);
                pr[r] = std::move(row);
            }
            return css::uno::Any(res);
        }
        // The outcome form: coded outputs (which walk-away value binds, whether a deal is
        // rational) as their words from the library; errors stay error values.
        const int nout = f.n_outputs;
        std::vector<bool> coded(static_cast<size_t>(nout));
        for (int k = 0; k < nout; ++k) coded[static_cast<size_t>(k)] = cto_output_word(f.id, k, 0.0);
        css::uno::Sequence<css::uno::Sequence<css::uno::Any>> res(static_cast<sal_Int32>(count));
        auto *pr = res.getArray();
        for (size_t i = 0; i < count; ++i) {
            css::uno::Sequence<css::uno::Any> row(nout);
            css::uno::Any *p = row.getArray();
            for (int k = 0; k < nout; ++k) {
                const double v = cell(i, k);
                const char *w = coded[static_cast<size_t>(k)] ? cto_output_word(f.id, k, v) : nullptr;
                if (w)
                    p[k] <<= OUString::createFromAscii(w);
                else
                    p[k] <<= v;
            }
            pr[i] = std::move(row);
        }
        return css::uno::Any(res);
    }

    // The catalogue function called `name` (its Calc name, its outcome form's, or its
    // catalogue name; any case), or nullptr.
    const cto_function_info *find(const OUString &name) const {
        OUString n = name.trim();
        if (n.isEmpty()) return nullptr;
        if (n.equalsIgnoreAsciiCaseAscii(cto_addin::kOfferPathCalc))  // not a catalogue row
            n = OUString::createFromAscii(cto_addin::kOfferPathFunction);
        for (const cto_function_info *f : table_) {
            if (!f) continue;
            if ((*f->calc_name && n.equalsIgnoreAsciiCaseAscii(f->calc_name)) ||
                n.equalsIgnoreAsciiCaseAscii(f->name) ||
                n.equalsIgnoreAsciiCase(OUString::createFromAscii(f->calc_name) + "OUTCOME"))
                return f;
        }
        return nullptr;
    }

  public:
    // DEALREASON: the library's reason (cto_explain) as text, for the same arguments
    // converted as the function itself would convert them; a range gives its first
    // element.  For DEALRANGE, DEALRANGEOUTCOME and DEALSWING (src/ranges.hxx) the
    // arguments are read as those functions read them and the reason is
    // cto_range_explain's or cto_swing_explain's.  It never fails on the user's input:
    // every mistake is a reason.
    css::uno::Any reason(const OUString &name, const css::uno::Sequence<css::uno::Any> &args) {
        try {
            const RangeFn rf = range_function(name);
            if (rf != RangeFn::None) return css::uno::Any(range_reason(table_, rf, args));
            const cto_function_info *f = find(name);
            if (!f)
                return css::uno::Any("unknown function \"" + name.trim() +
                                     "\": give the name of a DEAL function, e.g. \"DEALSOLVE\"");
            const OUString calc = OUString::createFromAscii(
                *f->calc_name ? f->calc_name
                : std::strcmp(f->name, cto_addin::kOfferPathFunction) == 0 ? cto_addin::kOfferPathCalc
                                                                           : f->name);
            if (args.getLength() > f->n_args)
                return css::uno::Any(calc + " takes at most " + OUString::number(f->n_args) +
                                     " arguments; " + OUString::number(args.getLength()) +
                                     " were given");
            double in[kMaxArgs];
            const css::uno::Any none;
            for (int j = 0; j < f->n_args && j < kMaxArgs; ++j) {
                const css::uno::Any &a = j < args.getLength() ? args[j] : none;
                View v;
                in[j] = make_view(Arg(a), v) ? to_double(v.first(), f->args[j]) : kNaN;
            }
            char text[512];
            cto_explain(f->id, in, text, sizeof text);
            return css::uno::Any(calc + ": " +
                                 OUString(text, static_cast<sal_Int32>(std::strlen(text)),
                                          RTL_TEXTENCODING_UTF8));
        } catch (const css::uno::Exception &) {
            throw;
        } catch (...) {
            throw css::uno::RuntimeException("counteroffer: unexpected failure");
        }
    }

    // The functions that are not catalogue rows (src/ranges.hxx, src/offers.hxx); args
    // in the order of src/range_args.h.
    css::uno::Any share_range(const Arg *args, bool outcome) {
        return guarded([&] {
            return outcome ? range_outcome(table_, args) : range_quantiles(table_, args);
        });
    }
    css::uno::Any share_swing(const Arg *args) {
        return guarded([&] { return range_swing(table_, args); });
    }
    css::uno::Any offer_path(const Arg *args) {
        return guarded([&] { return offer_path_rows(table_, args); });
    }

#ifdef CTO_ADDIN_TEST_BUILD
    // DEALCALLPROBE, in the test build of the extension only (counteroffer-test.oxt,
    // addin_gen --test-build): the same argument conversion as every function, no model.
    css::uno::Any probe(const Arg *args) {
        try {
            static const cto_arg_info kNumber = {"value", "Value", "", CTO_ARG_REAL, 0, 0.0, 0,
                                                 nullptr};
            static const cto_arg_info kOptional = {"value", "Value", "", CTO_ARG_REAL, 1, 1.0, 0,
                                                   nullptr};
            View v[4];
            double x[4];
            for (int j = 0; j < 4; ++j) {
                if (!make_view(args[j], v[j]))
                    throw css::lang::IllegalArgumentException(
                        "DEALCALLPROBE: bad range", css::uno::Reference<css::uno::XInterface>(),
                        static_cast<sal_Int16>(j));
                x[j] = to_double(v[j].first(), j < 2 ? kNumber : kOptional);
            }
            if (!std::isfinite(x[0]) || !std::isfinite(x[1]) || !std::isfinite(x[2]) ||
                !std::isfinite(x[3]))
                throw css::lang::IllegalArgumentException(
                    "DEALCALLPROBE: a number is required",
                    css::uno::Reference<css::uno::XInterface>(), 0);
            return css::uno::Any(x[0]);
        } catch (const css::uno::Exception &) {
            throw;
        } catch (...) {
            throw css::uno::RuntimeException("counteroffer: unexpected failure");
        }
    }
#endif
};

#include "deal_methods_def.inc"

css::uno::Reference<css::uno::XInterface> SAL_CALL
create(const css::uno::Reference<css::uno::XComponentContext> &) {
    return static_cast<cppu::OWeakObject *>(new DealFunctions);
}

OUString SAL_CALL impl_name() { return kImplName; }


const cppu::ImplementationEntry kEntries[] = {
    {create, impl_name, service_names, cppu::createSingleComponentFactory, nullptr, 0},
    {nullptr, nullptr, nullptr, nullptr, nullptr, 0}};

} // namespace

extern "C" SAL_DLLPUBLIC_EXPORT void *SAL_CALL
component_getFactory(const char *impl, void *service_manager, void *registry_key) {
    try {
        return cppu::component_getFactoryHelper(impl, service_manager, registry_key, kEntries);
    } catch (...) {
        return nullptr;
    }
}
