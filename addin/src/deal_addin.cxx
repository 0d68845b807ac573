// The counteroffer Calc add-in: UNO glue only.
//
// Every method (generated from the catalogue table into deal_methods_*.inc) forwards
// to evaluate(), which
//   1. converts each UNO Any to a double (omitted -> the catalogue default; text of
//      a choice -> its index; TRUE/FALSE -> 1/0; an empty or text cell where a
//      number is needed -> NaN, which the library rejects as an invalid argument),
//   2. calls cto_call (all scalars) or cto_call_strided (any argument a range),
//   3. maps the status to the error value Calc shows (addin/README.md):
//        invalid argument -> IllegalArgumentException       -> Err:502
//        no deal          -> VOID result                     -> #N/A
//        indeterminate    -> NaN result                      -> #NUM! (Err:503)
//        no convergence   -> sheet::NoConvergenceException   -> Err:523
//        internal error   -> RuntimeException                -> #VALUE! (Err:519)
//      In an array result each element carries its own code as an error NaN.
// Validation and mathematics live in the library only.
#include <counteroffer/counteroffer.h>

#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/lang/XServiceInfo.hpp>
#include <com/sun/star/lang/XServiceName.hpp>
#include <com/sun/star/registry/XRegistryKey.hpp>
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
#include <vector>

namespace css = com::sun::star;
using rtl::OUString;

namespace {

constexpr const char kServiceName[] = "org.counteroffer.DealFunctions";
constexpr const char kImplName[] = "org.counteroffer.DealFunctionsImpl";
constexpr int kMaxArgs = 32;

// Calc's error codes (include/formula/errorcodes.hxx of LibreOffice 7.4).
constexpr std::uint32_t kErrIllegalArgument = 502;  // Err:502
constexpr std::uint32_t kErrIllegalFPOperation = 503; // #NUM!
constexpr std::uint32_t kErrNoValue = 519;            // #VALUE!
constexpr std::uint32_t kErrNoConvergence = 523;      // Err:523
constexpr std::uint32_t kErrNotAvailable = 0x7fff;    // #N/A

// A quiet NaN carrying a Calc error code in the low 32 bits of the fraction: the
// way Calc itself stores an error in a number (formula::CreateDoubleError).  Used
// only inside array results, where each element needs its own error value.
double error_nan(std::uint32_t code) {
    const std::uint64_t bits = UINT64_C(0x7ff8000000000000) | code;
    double d;
    std::memcpy(&d, &bits, sizeof d);
    return d;
}

std::uint32_t status_error(int status) {
    switch (status) {
    case CTO_E_INVALID: return kErrIllegalArgument;
    case CTO_E_NO_DEAL: return kErrNotAvailable;
    case CTO_E_INDETERMINATE: return kErrIllegalFPOperation;
    case CTO_E_NO_CONVERGENCE: return kErrNoConvergence;
    default: return kErrNoValue;
    }
}

const double kNaN = std::numeric_limits<double>::quiet_NaN();

css::uno::Sequence<OUString> SAL_CALL service_names() {
    css::uno::Sequence<OUString> s(2);
    s.getArray()[0] = kServiceName;
    s.getArray()[1] = "com.sun.star.sheet.AddIn";
    return s;
}

bool equals_ignore_case(const OUString &s, const char *ascii) {
    return s.equalsIgnoreAsciiCaseAscii(ascii);
}

// One cell value (or one range element) to the library's double for argument `a`.
// Anything that is not a usable value becomes NaN, which cto_call rejects as an
// invalid argument and reports by position: validation stays in the library.
double to_double(const css::uno::Any &v, const cto_arg_info &a) {
    switch (v.getValueTypeClass()) {
    case css::uno::TypeClass_VOID:
        return a.has_default ? a.default_value : kNaN;
    case css::uno::TypeClass_DOUBLE:
        return *static_cast<const double *>(v.getValue());
    case css::uno::TypeClass_BOOLEAN:
        return *static_cast<const sal_Bool *>(v.getValue()) ? 1.0 : 0.0;
    case css::uno::TypeClass_FLOAT:
    case css::uno::TypeClass_BYTE:
    case css::uno::TypeClass_SHORT:
    case css::uno::TypeClass_UNSIGNED_SHORT:
    case css::uno::TypeClass_LONG:
    case css::uno::TypeClass_UNSIGNED_LONG:
    case css::uno::TypeClass_HYPER: {
        double d = kNaN;
        v >>= d;
        return d;
    }
    case css::uno::TypeClass_STRING: {
        const OUString &s = *static_cast<const OUString *>(v.getValue());
        if (a.kind == CTO_ARG_CHOICE && a.choices) {
            int i = 0;
            for (const char *const *c = a.choices; *c; ++c, ++i)
                if (equals_ignore_case(s, *c)) return static_cast<double>(i);
        } else if (a.kind == CTO_ARG_BOOL) {
            if (equals_ignore_case(s, "TRUE")) return 1.0;
            if (equals_ignore_case(s, "FALSE")) return 0.0;
        }
        return kNaN; // text where a number is needed
    }
    default:
        return kNaN;
    }
}

// A range argument: Calc passes sequence<sequence<any>> (rows of cells) for an
// `any` parameter given a cell range or an inline array.
struct Range {
    const css::uno::Sequence<css::uno::Sequence<css::uno::Any>> *mixed = nullptr;
    css::uno::Sequence<css::uno::Sequence<css::uno::Any>> owned;
    sal_Int32 rows = 1, cols = 1;
};

bool as_range(const css::uno::Any &v, Range &r) {
    if (v.getValueTypeClass() != css::uno::TypeClass_SEQUENCE) return false;
    using Mixed = css::uno::Sequence<css::uno::Sequence<css::uno::Any>>;
    if (v.getValueType() == cppu::UnoType<Mixed>::get()) {
        r.mixed = static_cast<const Mixed *>(v.getValue()); // no copy
    } else {
        // sequence<sequence<double>> or another element type: convert once.
        if (!(v >>= r.owned)) {
            css::uno::Sequence<css::uno::Sequence<double>> d;
            if (!(v >>= d)) return false;
            r.owned.realloc(d.getLength());
            for (sal_Int32 i = 0; i < d.getLength(); ++i) {
                css::uno::Sequence<css::uno::Any> row(d[i].getLength());
                for (sal_Int32 j = 0; j < d[i].getLength(); ++j) row.getArray()[j] <<= d[i][j];
                r.owned.getArray()[i] = row;
            }
        }
        r.mixed = &r.owned;
    }
    r.rows = r.mixed->getLength();
    r.cols = r.rows > 0 ? (*r.mixed)[0].getLength() : 0;
    for (sal_Int32 i = 1; i < r.rows; ++i)
        if ((*r.mixed)[i].getLength() != r.cols) return false;
    return r.rows > 0 && r.cols > 0;
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

    css::uno::Any evaluate(int id, const css::uno::Any *const *args, int n, bool outcome) {
        try {
            const cto_function_info &f = info(id);
            if (f.n_args != n || n > kMaxArgs || f.n_outputs < 1 || f.n_outputs > kMaxArgs)
                throw css::uno::RuntimeException(
                    "counteroffer: the add-in was built for another catalogue");
            bool any_range = outcome;
            for (int j = 0; j < n && !any_range; ++j)
                any_range = args[j]->getValueTypeClass() == css::uno::TypeClass_SEQUENCE;
            if (any_range) return evaluate_array(f, args, outcome);
            return evaluate_scalar(f, args);
        } catch (const css::uno::Exception &) {
            throw; // IllegalArgument, NoConvergence, Runtime: mapped by Calc
        } catch (const std::exception &e) {
            throw css::uno::RuntimeException(OUString::createFromAscii(e.what()));
        } catch (...) {
            throw css::uno::RuntimeException("counteroffer: unexpected failure");
        }
    }

    css::uno::Any evaluate_scalar(const cto_function_info &f, const css::uno::Any *const *args) {
        double in[kMaxArgs];
        double out[kMaxArgs];
        for (int j = 0; j < f.n_args; ++j) in[j] = to_double(*args[j], f.args[j]);
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

    // Ranges in, array out.  Every range argument must have the same shape; a
    // single value (or a 1x1 range) applies to every element.  The plain form
    // returns the first output in that shape; the outcome form returns one row per
    // element (row-major) with every output as a column.
    css::uno::Any evaluate_array(const cto_function_info &f, const css::uno::Any *const *args,
                                 bool outcome) {
        const int n = f.n_args;
        std::vector<Range> ranges(static_cast<size_t>(n));
        std::vector<char> is_range(static_cast<size_t>(n), 0);
        sal_Int32 rows = 1, cols = 1;
        for (int j = 0; j < n; ++j) {
            if (args[j]->getValueTypeClass() != css::uno::TypeClass_SEQUENCE) continue;
            Range &r = ranges[static_cast<size_t>(j)];
            if (!as_range(*args[j], r)) throw_invalid(f, j);
            if (r.rows == 1 && r.cols == 1) continue; // broadcast like a scalar
            is_range[static_cast<size_t>(j)] = 1;
            if (rows == 1 && cols == 1) {
                rows = r.rows;
                cols = r.cols;
            } else if (r.rows != rows || r.cols != cols) {
                throw css::lang::IllegalArgumentException(
                    OUString::createFromAscii(f.calc_name) + ": argument " +
                        OUString::number(j + 1) + " has another shape than the ranges before it",
                    css::uno::Reference<css::uno::XInterface>(), static_cast<sal_Int16>(j));
            }
        }
        const size_t count = static_cast<size_t>(rows) * static_cast<size_t>(cols);
        std::vector<std::vector<double>> cols_in(static_cast<size_t>(n));
        std::vector<const char *> arg_ptr(static_cast<size_t>(n));
        std::vector<ptrdiff_t> arg_stride(static_cast<size_t>(n));
        for (int j = 0; j < n; ++j) {
            const size_t uj = static_cast<size_t>(j);
            std::vector<double> &c = cols_in[uj];
            if (is_range[uj]) {
                c.resize(count);
                const auto &m = *ranges[uj].mixed;
                size_t k = 0;
                for (sal_Int32 r = 0; r < rows; ++r) {
                    const css::uno::Any *row = m[r].getConstArray();
                    for (sal_Int32 q = 0; q < cols; ++q) c[k++] = to_double(row[q], f.args[j]);
                }
                arg_stride[uj] = static_cast<ptrdiff_t>(sizeof(double));
            } else {
                const css::uno::Any &v =
                    ranges[uj].mixed ? (*ranges[uj].mixed)[0][0] : *args[j];
                c.assign(1, to_double(v, f.args[j]));
                arg_stride[uj] = 0;
            }
            arg_ptr[uj] = reinterpret_cast<const char *>(c.data());
        }
        const int nout = outcome ? f.n_outputs : 1;
        std::vector<std::vector<double>> outs(static_cast<size_t>(f.n_outputs),
                                              std::vector<double>(count));
        std::vector<char *> out_ptr(static_cast<size_t>(f.n_outputs));
        std::vector<ptrdiff_t> out_stride(static_cast<size_t>(f.n_outputs),
                                          static_cast<ptrdiff_t>(sizeof(double)));
        for (size_t k = 0; k < outs.size(); ++k) out_ptr[k] = reinterpret_cast<char *>(outs[k].data());
        std::vector<signed char> status(count);
        cto_batch_report report;
        std::memset(&report, 0, sizeof report);
        report.size = sizeof report;
        const int st = cto_call_strided(f.id, count, arg_ptr.data(), arg_stride.data(),
                                        out_ptr.data(), out_stride.data(), status.data(), 1,
                                        &report);
        if (st != CTO_OK)
            throw css::uno::RuntimeException(OUString::createFromAscii(f.calc_name) +
                                             ": the strided call was refused");
        auto cell = [&](size_t i, int k) -> double {
            const int s = status[i];
            const double v = outs[static_cast<size_t>(k)][i];
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
        css::uno::Sequence<css::uno::Sequence<double>> res(static_cast<sal_Int32>(count));
        auto *pr = res.getArray();
        for (size_t i = 0; i < count; ++i) {
            css::uno::Sequence<double> row(nout);
            double *p = row.getArray();
            for (int k = 0; k < nout; ++k) p[k] = cell(i, k);
            pr[i] = std::move(row);
        }
        return css::uno::Any(res);
    }

    // DEALCALLPROBE: the same conversion as every function, no model.
    css::uno::Any probe(const css::uno::Any *const *args) {
        static const cto_arg_info kNumber = {"value", "Value", "", CTO_ARG_REAL, 0, 0.0, 0,
                                             nullptr};
        const double v = to_double(*args[0], kNumber);
        const double w = to_double(*args[1], kNumber);
        if (!std::isfinite(v) || !std::isfinite(w))
            throw css::lang::IllegalArgumentException(
                "DEALCALLPROBE: a number is required",
                css::uno::Reference<css::uno::XInterface>(), 0);
        return css::uno::Any(v);
    }
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
