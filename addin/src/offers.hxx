// DEALOFFERPATH: the rows of offer_path (cto_offer_path_rows; addin/README.md
// "DEALOFFERPATH"), a row per round: round, offer, cutoff, probability of agreement in
// that round, probability of agreement by that round.
//
// Conversion only.  The arguments are offer_path's catalogue arguments, converted as
// every function converts them, each a single value (a larger range is Err:502).  A
// rounds or offerer that is not a whole number goes to cto_offer_path_rows as -1, which
// it rejects; on invalid input the library's table (cto_call of offer_path) names the
// argument.  The status maps to the error values of the rest.  At most cto_addin::kOfferPathMaxRows rows: a longer path,
// or one without a deadline, gives its first rounds.
#ifndef CTO_ADDIN_OFFERS_HXX
#define CTO_ADDIN_OFFERS_HXX

#include <vector>

#include "convert.hxx"
#include "range_args.h"

namespace {

const cto_function_info *catalogue_function(const std::vector<const cto_function_info *> &t,
                                            const char *name) {
    for (const cto_function_info *f : t)
        if (f && f->name && std::strcmp(f->name, name) == 0) return f;
    return nullptr;
}

// A count or choice for the C call: a whole number up to `limit` as it is; anything else
// -1, which the library rejects (rounds < 0, offerer not 0 or 1).
std::int64_t whole(double x, double limit) {
    return (x >= -limit && x <= limit && x == std::floor(x)) ? static_cast<std::int64_t>(x) : -1;
}

css::uno::Any offer_path_rows(const std::vector<const cto_function_info *> &t, const Arg *args) {
    const char *calc = cto_addin::kOfferPathCalc;
    constexpr int kArgs = 7;
    const cto_function_info *f = catalogue_function(t, cto_addin::kOfferPathFunction);
    if (!f || f->n_args != kArgs || f->n_outputs < 1 || f->n_outputs > 32)
        throw css::uno::RuntimeException("counteroffer: the add-in was built for another catalogue");
    double in[kArgs];
    for (int j = 0; j < kArgs; ++j) {
        View v;
        if (!make_view(args[j], v) || v.rows != 1 || v.cols != 1)
            throw_invalid_arg(calc, j, f->args[j].label);
        in[j] = to_double(v.first(), f->args[j]);
    }
    std::vector<cto_offer_row> rows(static_cast<size_t>(cto_addin::kOfferPathMaxRows));
    cto_offer_outcome o;
    std::memset(&o, 0, sizeof o);
    o.size = sizeof o;
    const int st = cto_offer_path_rows(in[0], in[1], in[2], in[3], whole(in[4], 9e15), in[5],
                                       static_cast<int>(whole(in[6], 1e6)), rows.data(),
                                       cto_addin::kOfferPathMaxRows, &o);
    if (st == CTO_E_INVALID) {
        // the library's table names the argument (cto_call of offer_path checks each)
        double totals[32];
        int bad = -1;
        cto_call(f->id, in, totals, &bad);
        const bool named = bad >= 0 && bad < kArgs;
        throw_invalid_arg(calc, named ? bad : -1, named ? f->args[bad].label : "");
    }
    if (st != CTO_OK) return status_result(calc, st);
    const std::int64_t n = o.rows_written < 0 ? 0
                           : o.rows_written > cto_addin::kOfferPathMaxRows
                               ? cto_addin::kOfferPathMaxRows
                               : o.rows_written;
    if (n == 0) return css::uno::Any();  // no round: #N/A
    css::uno::Sequence<css::uno::Sequence<double>> res(static_cast<sal_Int32>(n));
    for (std::int64_t i = 0; i < n; ++i) {
        const cto_offer_row &r = rows[static_cast<size_t>(i)];
        const double cells[cto_addin::kOfferPathColumns] = {
            static_cast<double>(i + 1), element(CTO_OK, r.offer), element(CTO_OK, r.cutoff),
            element(CTO_OK, r.round_probability), element(CTO_OK, r.cumulative_probability)};
        res.getArray()[i] = css::uno::Sequence<double>(cells, cto_addin::kOfferPathColumns);
    }
    return css::uno::Any(res);
}

} // namespace

#endif // CTO_ADDIN_OFFERS_HXX
