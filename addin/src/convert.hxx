// The add-in's argument conversion and error values, shared by every function of the
// glue (src/deal_addin.cxx, src/ranges.hxx, src/offers.hxx): one cell or range element to
// the library's double, a rectangular view of an argument, Calc's error codes and the
// error NaN of array results.  Conversion only: validation is the library's.
#ifndef CTO_ADDIN_CONVERT_HXX
#define CTO_ADDIN_CONVERT_HXX

#include <counteroffer/counteroffer.h>

#include <com/sun/star/lang/IllegalArgumentException.hpp>
#include <com/sun/star/sheet/NoConvergenceException.hpp>
#include <com/sun/star/uno/RuntimeException.hpp>
#include <com/sun/star/uno/Sequence.hxx>
#include <cppu/unotype.hxx>
#include <rtl/ustring.hxx>

#include <cmath>
#include <cstdint>
#include <cstring>
#include <limits>
#include <memory>

namespace css = com::sun::star;
using rtl::OUString;

namespace {

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
    case CTO_E_PRECISION: return kErrNoConvergence; // precision not reached: Err:523
    default: return kErrNoValue;
    }
}

const double kNaN = std::numeric_limits<double>::quiet_NaN();

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

using Mixed = css::uno::Sequence<css::uno::Sequence<css::uno::Any>>;

// One argument as Calc passes it.  A required argument is declared
// sequence<sequence<any>>: Calc then hands over a single cell as a 1x1 range whose
// element is VOID when the cell is empty (as `any`, an empty cell arrives as 0).
// An optional argument is declared `any` (VOID when left out); it may also hold a
// range (sequence<sequence<any>>) or an inline array.
struct Arg {
    const css::uno::Any *any = nullptr;
    const Mixed *seq = nullptr;
    explicit Arg(const css::uno::Any &a) : any(&a) {}
    explicit Arg(const Mixed &m) : seq(&m) {}
};

// A rectangular view of an argument: a range (rows x cols) or one value (1 x 1).
struct View {
    const Mixed *m = nullptr;          // the range, or nullptr for a single value
    const css::uno::Any *one = nullptr; // the single value
    std::unique_ptr<Mixed> owned;       // a converted sequence<sequence<double>>
    sal_Int32 rows = 1, cols = 1;

    const css::uno::Any &at(sal_Int32 r, sal_Int32 c) const {
        return m ? (*m)[r][c] : *one;
    }
    const css::uno::Any &first() const { return m ? (*m)[0][0] : *one; }
};

// false: not a usable range (ragged, empty, or an unknown element type).
bool make_view(const Arg &a, View &v) {
    if (a.seq) {
        v.m = a.seq;
    } else if (a.any->getValueTypeClass() != css::uno::TypeClass_SEQUENCE) {
        v.one = a.any;
        return true;
    } else if (a.any->getValueType() == cppu::UnoType<Mixed>::get()) {
        v.m = static_cast<const Mixed *>(a.any->getValue()); // no copy
    } else {
        css::uno::Sequence<css::uno::Sequence<double>> d;
        if (!(*a.any >>= d)) return false;
        v.owned = std::make_unique<Mixed>(d.getLength());
        for (sal_Int32 i = 0; i < d.getLength(); ++i) {
            css::uno::Sequence<css::uno::Any> row(d[i].getLength());
            for (sal_Int32 j = 0; j < d[i].getLength(); ++j) row.getArray()[j] <<= d[i][j];
            v.owned->getArray()[i] = row;
        }
        v.m = v.owned.get();
    }
    v.rows = v.m->getLength();
    v.cols = v.rows > 0 ? (*v.m)[0].getLength() : 0;
    for (sal_Int32 i = 1; i < v.rows; ++i)
        if ((*v.m)[i].getLength() != v.cols) return false;
    return v.rows > 0 && v.cols > 0;
}

} // namespace
namespace {

// Err:502 for argument `bad` (0-based; < 0: none named) of the Calc function `calc`;
// `why` (may be NULL) says what a value the add-in could not convert must be.
[[noreturn]] void throw_invalid_arg(const char *calc, int bad, const char *label,
                                    const char *why = nullptr) {
    OUString what = OUString::createFromAscii(calc) + ": invalid argument";
    if (bad >= 0)
        what += " " + OUString::number(bad + 1) + " (" + OUString::createFromAscii(label) + ")";
    if (why) what += ": " + OUString::createFromAscii(why);
    throw css::lang::IllegalArgumentException(what, css::uno::Reference<css::uno::XInterface>(),
                                              static_cast<sal_Int16>(bad >= 0 ? bad : 0));
}

// A status other than ok or invalid as Calc shows it (addin/README.md "Error values"):
// no deal VOID (#N/A), indeterminate NaN (#NUM!), no convergence Err:523, else #VALUE!.
css::uno::Any status_result(const char *calc, int status) {
    switch (status) {
    case CTO_E_NO_DEAL: return css::uno::Any();
    case CTO_E_INDETERMINATE: return css::uno::Any(kNaN);
    case CTO_E_NO_CONVERGENCE:
        throw css::sheet::NoConvergenceException(
            OUString::createFromAscii(calc) + ": no convergence",
            css::uno::Reference<css::uno::XInterface>());
    default:
        throw css::uno::RuntimeException(OUString::createFromAscii(calc) + ": " +
                                         OUString::createFromAscii(cto_status_message(status)));
    }
}

// An array element: the value for ok, else its status's error code as an error NaN.
double element(int status, double v) {
    if (status == CTO_OK) return std::isfinite(v) ? v : error_nan(kErrNoValue);
    return error_nan(status_error(status));
}

} // namespace

#endif // CTO_ADDIN_CONVERT_HXX
