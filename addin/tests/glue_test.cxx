// Test of the add-in's UNO glue: status -> Calc error mapping and argument conversion
// (the range and offer-path functions: glue_ranges.hxx).
//
// The glue (src/deal_addin.cxx) is compiled here against a stand-in for the library's
// table-driven interface: one function whose second argument selects the status
// cto_call returns.  This reaches every status, including no convergence and internal
// error, which no sheet case can produce with the real library.  The expected
// exceptions and codes are the mapping documented in addin/README.md, with Calc's error
// numbers from LibreOffice 7.4 include/formula/errorcodes.hxx (IllegalArgument 502,
// IllegalFPOperation 503, NoValue 519, NoConvergence 523, NotAvailable 0x7fff) and the
// exception-to-error rules of ScUnoAddInCall::ExecuteCallWithArgs (LibreOffice 7.4
// sc/source/core/tool/addincol.cxx; from memory).
#include "../src/deal_addin.cxx"

#include <algorithm>
#include <cstdio>
#include <cstdlib>
#include <vector>
#include <rtl/ref.hxx>

// ---- the stand-in library -------------------------------------------------------
namespace {
const char *const kChoices[] = {"alpha", "beta", nullptr};
const cto_arg_info kArgs[] = {
    {"value", "Value", "a number", CTO_ARG_REAL, 0, 0.0, 0, nullptr},
    {"status", "Status", "status to return", CTO_ARG_REAL, 0, 0.0, 0, nullptr},
    {"flag", "Flag", "a boolean", CTO_ARG_BOOL, 1, 1.0, 0, nullptr},
    {"pick", "Pick", "a choice", CTO_ARG_CHOICE, 1, 0.0, 0, kChoices}};
const cto_output_info kOuts[] = {{"value", "v"}, {"code", "c"}};
const cto_function_info kFake = {sizeof(cto_function_info), 0, "fake", "DEALFAKE", "s", "f",
                                 "src", "st", 4, kArgs, 2, kOuts};
} // namespace

extern "C" {
const char *cto_status_message(int) { return "stand-in"; }
// value + 10 flag + 100 pick; a NaN argument is invalid (the library's rule);
// status 9 means "ok but not finite" (a defect the glue must not show as a number).
int cto_call(int id, const double *a, double *o, int *bad) {
    if (bad) *bad = -1;
    if (id == 2) { // offer_path: the table's checks (a number each; rounds whole)
        for (int j = 0; j < 7; ++j)
            if (std::isnan(a[j]) || (j == 4 && a[j] != std::floor(a[j])) ||
                (j == 6 && a[j] != 0.0 && a[j] != 1.0)) {
                if (bad) *bad = j;
                return CTO_E_INVALID;
            }
        o[0] = o[1] = 0.5;
        return CTO_OK;
    }
    if (id != 0) {
        o[0] = o[1] = std::nan("");
        return CTO_E_INVALID;
    }
    for (int j = 0; j < 4; ++j)
        if (std::isnan(a[j])) {
            if (bad) *bad = j;
            o[0] = o[1] = std::nan("");
            return CTO_E_INVALID;
        }
    const int st = static_cast<int>(a[1]);
    o[0] = a[0] + 10 * a[2] + 100 * a[3];
    o[1] = st;
    if (st == 9) {
        o[0] = HUGE_VAL;
        return CTO_OK;
    }
    return st;
}
// Output 1 ("code") is coded: words for 0, 1 and 2; other codes have none.
const char *cto_output_word(int id, int k, double code) {
    static const char *const kWords[] = {"zero", "one", "two"};
    if (id != 0 || k != 1 || !(code >= 0.0 && code <= 2.0) || code != std::floor(code))
        return nullptr;
    return kWords[static_cast<int>(code)];
}
// The reason: "reason <value> <flag> <pick>" with the status cto_call gives.
int cto_explain(int id, const double *a, char *text, size_t size) {
    double o[2];
    const int st = cto_call(id, a, o, nullptr);
    std::snprintf(text, size, "reason %g %g %g", a[0], a[2], a[3]);
    return st;
}
int cto_call_strided(int id, size_t n, const char *const *args, const ptrdiff_t *as,
                     char *const *outs, const ptrdiff_t *os, signed char *st, ptrdiff_t ss,
                     cto_batch_report *) {
    for (size_t i = 0; i < n; ++i) {
        double a[4], o[2] = {0.0, 0.0};
        for (int j = 0; j < 4; ++j)
            std::memcpy(&a[j], args[j] + static_cast<ptrdiff_t>(i) * as[j], sizeof(double));
        const int s = cto_call(id, a, o, nullptr);
        for (int k = 0; k < 2; ++k)
            std::memcpy(outs[k] + static_cast<ptrdiff_t>(i) * os[k], &o[k], sizeof(double));
        st[static_cast<ptrdiff_t>(i) * ss] = static_cast<signed char>(s);
    }
    return CTO_OK;
}
}

// ---- the checks -----------------------------------------------------------------
namespace {
int failures = 0, checks = 0;
void check(bool ok, const char *what) {
    ++checks;
    if (!ok) {
        ++failures;
        std::printf("FAIL: %s\n", what);
    }
}

Mixed one(const css::uno::Any &v) {
    css::uno::Sequence<css::uno::Any> row(&v, 1);
    return Mixed(&row, 1);
}

Mixed column(std::initializer_list<css::uno::Any> vs) {
    Mixed m(static_cast<sal_Int32>(vs.size()));
    sal_Int32 i = 0;
    for (const auto &v : vs) m.getArray()[i++] = css::uno::Sequence<css::uno::Any>(&v, 1);
    return m;
}

enum class Outcome { Value, Void, NaN, Illegal, NoConv, Runtime };

Outcome scalar(DealFunctions &f, const css::uno::Any &value, double status,
               const css::uno::Any &flag = css::uno::Any(),
               const css::uno::Any &pick = css::uno::Any(), double *got = nullptr) {
    const Mixed a0 = one(value), a1 = one(css::uno::Any(status));
    const Arg args[] = {Arg(a0), Arg(a1), Arg(flag), Arg(pick)};
    try {
        const css::uno::Any r = f.evaluate(0, args, 4, false);
        if (!r.hasValue()) return Outcome::Void;
        double d = 0;
        r >>= d;
        if (got) *got = d;
        return std::isnan(d) ? Outcome::NaN : Outcome::Value;
    } catch (const css::lang::IllegalArgumentException &) {
        return Outcome::Illegal;
    } catch (const css::sheet::NoConvergenceException &) {
        return Outcome::NoConv;
    } catch (const css::uno::RuntimeException &) {
        return Outcome::Runtime;
    }
}

std::uint32_t code_of(double d) {
    std::uint64_t bits;
    std::memcpy(&bits, &d, sizeof bits);
    return std::isnan(d) ? static_cast<std::uint32_t>(bits & 0xffffffffu) : 0;
}


// Status -> Calc (addin/README.md "Error values") and argument conversion.
void check_scalars(const rtl::Reference<DealFunctions> &f) {
    const css::uno::Any v(0.25);
    double got = 0;
    // Status -> Calc (addin/README.md "Error values").
    check(scalar(*f, v, CTO_OK, css::uno::Any(), css::uno::Any(), &got) == Outcome::Value &&
              got == 10.25, "ok -> the value (flag default TRUE = 1 applied)");
    check(scalar(*f, v, CTO_E_INVALID) == Outcome::Illegal, "invalid -> IllegalArgument (Err:502)");
    check(scalar(*f, v, CTO_E_NO_DEAL) == Outcome::Void, "no deal -> VOID (#N/A)");
    check(scalar(*f, v, CTO_E_INDETERMINATE) == Outcome::NaN, "indeterminate -> NaN (#NUM!)");
    check(scalar(*f, v, CTO_E_NO_CONVERGENCE) == Outcome::NoConv,
          "no convergence -> NoConvergenceException (Err:523)");
    check(scalar(*f, v, CTO_E_INTERNAL) == Outcome::Runtime, "internal -> RuntimeException (#VALUE!)");
    check(scalar(*f, v, 9) == Outcome::Runtime, "a non-finite ok value is never shown as a number");
    // Conversion (docs/reference/functions.md, "Conventions": types on each surface).
    check(scalar(*f, css::uno::Any(), CTO_OK) == Outcome::Illegal, "VOID required -> invalid");
    check(scalar(*f, css::uno::Any(OUString("0.5")), CTO_OK) == Outcome::Illegal,
          "text where a number is needed -> invalid");
    check(scalar(*f, v, CTO_OK, css::uno::Any(OUString("FaLsE")), css::uno::Any(), &got) ==
              Outcome::Value && got == 0.25, "boolean text, any case");
    check(scalar(*f, v, CTO_OK, css::uno::Any(true), css::uno::Any(OUString("BETA")), &got) ==
              Outcome::Value && got == 110.25, "choice text, any case -> its index");
    check(scalar(*f, v, CTO_OK, css::uno::Any(0.0), css::uno::Any(OUString("gamma"))) ==
              Outcome::Illegal, "unknown choice -> invalid");
    check(scalar(*f, v, CTO_OK, css::uno::Any(OUString("yes"))) == Outcome::Illegal,
          "bad boolean text -> invalid");
}

// Arrays: one element per status, each with its own code; the outcome form; shapes.
void check_arrays(const rtl::Reference<DealFunctions> &f) {
    const css::uno::Any v(0.25);
    const Mixed vals = column({v, v, v, v, v, v, css::uno::Any()});
    const Mixed sts = column({css::uno::Any(0.0), css::uno::Any(1.0), css::uno::Any(2.0),
                              css::uno::Any(3.0), css::uno::Any(4.0), css::uno::Any(5.0),
                              css::uno::Any(0.0)});
    const css::uno::Any none;
    const Arg args[] = {Arg(vals), Arg(sts), Arg(none), Arg(none)};
    const css::uno::Any r = f->evaluate(0, args, 4, false);
    css::uno::Sequence<css::uno::Sequence<double>> m;
    check((r >>= m) && m.getLength() == 7, "array result: 7 rows");
    if (m.getLength() == 7) {
        const std::uint32_t want[] = {0, 502, 0x7fff, 503, 523, 519, 502};
        for (int i = 0; i < 7; ++i) {
            char what[96];
            std::snprintf(what, sizeof what, "array element %d: code %u", i, want[i]);
            check(m[i].getLength() == 1 && code_of(m[i][0]) == want[i] &&
                      (want[i] != 0 || m[i][0] == 10.25), what);
        }
    }
    // Outcome form: every output as a column; no deal keeps the library's values; a coded
    // output shows its word, an error its code.
    const css::uno::Any ro = f->evaluate(0, args, 4, true);
    css::uno::Sequence<css::uno::Sequence<css::uno::Any>> mo;
    check((ro >>= mo) && mo.getLength() == 7 && mo[0].getLength() == 2, "outcome: 7 x 2");
    if (mo.getLength() == 7 && mo[2].getLength() == 2) {
        double v0 = 0, v4 = 0;
        OUString w0, w2;
        check((mo[2][0] >>= v0) && v0 == 10.25 && (mo[2][1] >>= w2) && w2 == "two",
              "outcome: no deal shows its values, the code as its word");
        check((mo[0][1] >>= w0) && w0 == "zero", "outcome: ok shows the code's word");
        check((mo[4][1] >>= v4) && code_of(v4) == 523, "outcome: no convergence shows its code");
    }
    // Ranges of different shapes are an invalid argument.
    const Mixed two = column({v, v});
    const Arg bad[] = {Arg(vals), Arg(two), Arg(none), Arg(none)};
    bool threw = false;
    try {
        f->evaluate(0, bad, 4, false);
    } catch (const css::lang::IllegalArgumentException &) {
        threw = true;
    }
    check(threw, "ranges of different shapes -> IllegalArgument");
}

void check_reason(const rtl::Reference<DealFunctions> &f) {
    const css::uno::Any v(0.25);
    // DEALREASON: the function found by its Calc or catalogue name in any case, the
    // arguments converted as the function converts them (defaults for the missing ones,
    // a range's first element), the library's text after the Calc name; a mistake in the
    // name or the count of arguments is itself a reason, never an error value.
    auto reason = [&](const char *name, std::initializer_list<css::uno::Any> as) {
        css::uno::Sequence<css::uno::Any> seq(static_cast<sal_Int32>(as.size()));
        sal_Int32 i = 0;
        for (const auto &x : as) seq.getArray()[i++] = x;
        OUString text;
        f->reason(OUString::createFromAscii(name), seq) >>= text;
        return text;
    };
    check(reason("dealfake", {v, css::uno::Any(0.0)}) == "DEALFAKE: reason 0.25 1 0",
          "reason: Calc name in any case, defaults applied");
    check(reason("fake", {css::uno::Any(column({css::uno::Any(2.0), v})), css::uno::Any(0.0),
                          css::uno::Any(OUString("false")), css::uno::Any(OUString("beta"))}) ==
              "DEALFAKE: reason 2 0 1",
          "reason: catalogue name; a range gives its first element; text choices converted");
    check(reason(" DEALFAKEOUTCOME ", {v, css::uno::Any(0.0)}).startsWith("DEALFAKE: reason"),
          "reason: the outcome form's name");
    check(reason("DEALNOPE", {v}).startsWith("unknown function \"DEALNOPE\""),
          "reason: an unknown name is a reason");
    check(reason("DEALFAKE", {v, v, v, v, v}) == "DEALFAKE takes at most 4 arguments; 5 were given",
          "reason: too many arguments is a reason");
}
} // namespace

namespace {
constexpr int kArgProbOpt = cto_addin::kArgProbability - 3, kArgShapeOpt = cto_addin::kArgShape - 3,
              kArgSeedOpt = cto_addin::kArgSeed - 3, kArgDigitsOpt = cto_addin::kArgDigits - 3;
} // namespace
#include "glue_ranges.hxx"

// The stand-in table: the function above, a required walk-away value, offer_path, the
// inputs of share_range.
extern "C" {
size_t cto_function_count(void) { return 4; }
const cto_function_info *cto_function_at(size_t i) {
    const cto_function_info *const t[] = {&kFake, &kOutsideFake, &kOfferFake, &kRangeFake};
    return i < 4 ? t[i] : nullptr;
}
}

int main() {
    rtl::Reference<DealFunctions> f(new DealFunctions);
    check_scalars(f);
    check_arrays(f);
    check_reason(f);
    check_range_conversion(*f);
    check_range_errors(*f);
    check_range_arrays(*f);
    check_swing(*f);
    check_range_reason(*f);
    check_offer_path(*f);
    std::printf("glue test: %d checks, %d failed\n", checks, failures);
    return failures ? EXIT_FAILURE : EXIT_SUCCESS;
}
