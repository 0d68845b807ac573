// Glue test of DEALRANGE, DEALRANGEOUTCOME, DEALSWING and DEALOFFERPATH (src/ranges.hxx,
// src/offers.hxx) and of DEALREASON for the range functions against stand-ins for
// cto_share_range, cto_share_swing, cto_range_explain, cto_swing_explain and
// cto_offer_path_rows that record what the glue hands over and return the status a test
// asks for.  The expected conversions are the rules of addin/README.md "Ranges" and
// "DEALOFFERPATH"; the expected error values those of "Error values" (Calc's codes from
// LibreOffice 7.4 include/formula/errorcodes.hxx).  Included by glue_test.cxx.

// ---- stand-ins ------------------------------------------------------------------
namespace {
const char *const kOfferers[] = {"seller", "buyer", nullptr};
const double kAbsent = -HUGE_VAL;
// The inputs of share_range under their catalogue names (labels "In1".."In14").
const cto_arg_info kRangeFakeArgs[] = {
    {"own_rate", "In1", "h", CTO_ARG_NONNEG, 0, 0.0, 0, nullptr},
    {"other_rate", "In2", "h", CTO_ARG_NONNEG, 0, 0.0, 0, nullptr},
    {"days", "In3", "h", CTO_ARG_NONNEG, 0, 0.0, 0, nullptr},
    {"breakdown_prob", "In4", "h", CTO_ARG_UNIT, 1, 0.0, 0, nullptr},
    {"own_fallback", "In5", "h", CTO_ARG_REAL, 1, 0.0, 0, nullptr},
    {"other_fallback", "In6", "h", CTO_ARG_REAL, 1, 0.0, 0, nullptr},
    {"own_inside", "In7", "h", CTO_ARG_REAL, 1, 0.0, 0, nullptr},
    {"other_inside", "In8", "h", CTO_ARG_REAL, 1, 0.0, 0, nullptr},
    {"own_outside", "In9", "h", CTO_ARG_OPTIONAL, 1, kAbsent, 0, nullptr},
    {"other_outside", "In10", "h", CTO_ARG_OPTIONAL, 1, kAbsent, 0, nullptr},
    {"surplus", "In11", "h", CTO_ARG_REAL, 1, 1.0, 0, nullptr},
    {"own_opens", "In12", "h", CTO_ARG_BOOL, 1, 1.0, 0, nullptr},
    {"basis", "In13", "h", CTO_ARG_POSITIVE, 1, 365.0, 0, nullptr},
    {"continuous", "In14", "h", CTO_ARG_BOOL, 1, 0.0, 0, nullptr}};
const cto_function_info kRangeFake = {sizeof(cto_function_info), 3, "rates_fake", "", "s", "f",
                                      "src", "st", 14, kRangeFakeArgs, 1, kOuts};
// An earlier function where a walk-away value is required (as in DEALOUTSIDE): the range
// functions must take the argument of that name with a default (the combined model's).
const cto_arg_info kOutsideArgs[] = {
    {"own_outside", "Required", "h", CTO_ARG_REAL, 0, 0.0, 0, nullptr}};
const cto_function_info kOutsideFake = {sizeof(cto_function_info), 1, "outside_fake", "", "s",
                                        "f", "src", "st", 1, kOutsideArgs, 1, kOuts};
const cto_arg_info kOfferArgs[] = {
    {"private_low", "Low", "h", CTO_ARG_REAL, 0, 0.0, 0, nullptr},
    {"private_high", "High", "h", CTO_ARG_REAL, 0, 0.0, 0, nullptr},
    {"offerer_factor", "Of", "h", CTO_ARG_UNIT, 0, 0.0, 0, nullptr},
    {"responder_factor", "Rf", "h", CTO_ARG_UNIT, 0, 0.0, 0, nullptr},
    {"rounds", "Rounds", "h", CTO_ARG_COUNT, 1, 0.0, 0, nullptr},
    {"known_value", "Known", "h", CTO_ARG_REAL, 1, 0.0, 0, nullptr},
    {"offerer", "Offerer", "h", CTO_ARG_CHOICE, 1, 0.0, 0, kOfferers}};
const cto_function_info kOfferFake = {sizeof(cto_function_info), 2, "offer_path", "", "s", "f",
                                      "src", "st", 7, kOfferArgs, 2, kOuts};

struct Recorded {
    cto_range_input in;
    cto_range_options opt;
    int status = CTO_OK;       // what the stand-ins return
    int bad = -1;              // the index they report for CTO_E_INVALID
    double offer_args[7];
    int64_t offer_rounds = 0, offer_capacity = 0;
    int offer_offerer = -1;
    int64_t path_rounds = 5000; // rounds the stand-in path has
    bool explained_run = false; // the reason function was asked to run the function itself
} rec;

// The library's rules, simulated: a fixed input needs a number, a range low <= high.
int fake_check(const cto_range_input *in) {
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j) {
        const cto_range_arg &a = in->arg[j];
        const bool ok = a.kind == CTO_RANGE_FIXED ? !std::isnan(a.mode)
                        : a.kind == CTO_RANGE_UNIFORM ? a.low <= a.high
                                                      : a.low <= a.mode && a.mode <= a.high;
        if (!ok) return j;
    }
    return -1;
}
} // namespace

extern "C" {
const char *cto_status_name(int s) {
    return s == CTO_OK ? "ok" : s == CTO_E_PRECISION ? "precision_not_reached" : "other";
}
void cto_range_default_options(cto_range_options *o) {
    std::memset(o, 0, sizeof *o);
    o->size = sizeof *o;
    o->n_probs = 3;
    o->probs[0] = 0.1, o->probs[1] = 0.5, o->probs[2] = 0.9;
    o->replicates = 16;
    o->digits = 3;
}
// own share at p: 100 + p; the quantile at p = 0.5 has 2 digits, the others 3.
int cto_share_range(const cto_range_input *in, const cto_range_options *opt,
                    cto_range_outcome *out) {
    rec.in = *in;
    rec.opt = *opt;
    out->bad = -1;
    int st = rec.status;
    const int j = fake_check(in);
    if (j >= 0) st = CTO_E_INVALID, out->bad = j;
    for (int k = 0; k < opt->n_probs; ++k)
        if (!(opt->probs[k] > 0.0 && opt->probs[k] < 1.0)) st = CTO_E_INVALID, out->bad = 14;
    if (!(opt->digits >= 1 && opt->digits <= 15)) st = CTO_E_INVALID, out->bad = 17;
    if (st == CTO_E_INVALID && out->bad < 0) out->bad = rec.bad;
    out->status = st;
    out->n_probs = opt->n_probs;
    for (int k = 0; k < opt->n_probs; ++k) {
        out->probs[k] = opt->probs[k];
        out->own[k] = {100.0 + opt->probs[k], 0.01, 0.02, opt->probs[k] == 0.5 ? 2 : 3};
        out->other[k] = {200.0 + opt->probs[k], 0.01, 0.02, 3};
    }
    out->points_per_replicate = 1024;
    out->replicates = 16;
    out->dimension = 2;
    out->spec_version = 1;
    return st;
}
// Rows: other_rate (0.4 at its low; no deal at its high), then own_rate (0.6, 0.7).
int cto_share_swing(const cto_range_input *in, cto_swing_outcome *out) {
    rec.in = *in;
    const int j = fake_check(in);
    out->status = j >= 0 ? CTO_E_INVALID : rec.status;
    out->bad = j >= 0 ? j : rec.bad;
    out->base = 0.5;
    out->base_status = CTO_OK;
    out->n_rows = rec.path_rounds == 0 ? 0 : 2;
    out->row[0] = {1, 0.4, 0.2, 0.2, CTO_OK, CTO_E_NO_DEAL};
    out->row[1] = {0, 0.6, 0.7, 0.1, CTO_OK, CTO_OK};
    return out->status;
}
// The reasons: what the glue handed over is recorded, the text says a part of it.
int cto_range_explain(const cto_range_input *in, const cto_range_options *opt,
                      const cto_range_outcome *out, char *text, size_t size) {
    rec.in = *in;
    rec.opt = *opt;
    rec.explained_run = out == nullptr;
    std::snprintf(text, size, "range reason: kind %d, %d probabilities, digits %d",
                  in->arg[1].kind, opt->n_probs, opt->digits);
    return CTO_OK;
}
int cto_swing_explain(const cto_range_input *in, const cto_swing_outcome *out, char *text,
                      size_t size) {
    rec.in = *in;
    rec.explained_run = out == nullptr;
    std::snprintf(text, size, "swing reason: kind %d", in->arg[0].kind);
    return CTO_OK;
}
// Row t (0-based): offer 10 + t, cutoff 5 + t, probabilities 0.001 and 0.001 (t + 1).
int cto_offer_path_rows(double lo, double hi, double df, double dr, int64_t rounds, double known,
                        int offerer, cto_offer_row *rows, int64_t cap, cto_offer_outcome *out) {
    const double a[] = {lo, hi, df, dr, static_cast<double>(rounds), known,
                        static_cast<double>(offerer)};
    std::memcpy(rec.offer_args, a, sizeof a);
    rec.offer_rounds = rounds;
    rec.offer_capacity = cap;
    rec.offer_offerer = offerer;
    if (!(lo <= hi) || rounds < 0 || (offerer != 0 && offerer != 1)) return CTO_E_INVALID;
    out->rows_written = std::min(cap, rec.path_rounds);
    for (int64_t t = 0; t < out->rows_written; ++t)
        rows[t] = {10.0 + static_cast<double>(t), 5.0 + static_cast<double>(t), 0.001,
                   0.001 * static_cast<double>(t + 1)};
    return rec.status;
}
}

// ---- checks ---------------------------------------------------------------------
namespace {
Mixed cells(sal_Int32 rows, sal_Int32 cols, std::initializer_list<css::uno::Any> vs) {
    Mixed m(rows);
    auto it = vs.begin();
    for (sal_Int32 r = 0; r < rows; ++r) {
        css::uno::Sequence<css::uno::Any> row(cols);
        for (sal_Int32 c = 0; c < cols; ++c) row.getArray()[c] = *it++;
        m.getArray()[r] = row;
    }
    return m;
}
css::uno::Any num(double x) { return css::uno::Any(x); }
css::uno::Any text(const char *s) { return css::uno::Any(OUString::createFromAscii(s)); }

// DEALRANGE's 18 arguments: the three required as given, the optional ones at `opt`
// (VOID: left out) except the ones set.
struct RangeCall {
    Mixed req[3] = {one(num(0.05)), one(num(0.08)), one(num(30.0))};
    css::uno::Any opt[15];
    std::vector<Arg> args() const {
        std::vector<Arg> a;
        for (const Mixed &m : req) a.emplace_back(m);
        for (const css::uno::Any &o : opt) a.emplace_back(o);
        return a;
    }
};

// The outcome of a call as Calc would see it, with the exception's argument position.
struct Result {
    Outcome kind = Outcome::Value;
    css::uno::Any value;
    int position = -1;
    OUString message;
};
template <class F> Result call(F f) {
    Result r;
    try {
        r.value = f();
        double d = 0;
        r.kind = !r.value.hasValue() ? Outcome::Void
                 : ((r.value >>= d) && std::isnan(d)) ? Outcome::NaN : Outcome::Value;
    } catch (const css::lang::IllegalArgumentException &e) {
        r.kind = Outcome::Illegal, r.position = e.ArgumentPosition, r.message = e.Message;
    } catch (const css::sheet::NoConvergenceException &e) {
        r.kind = Outcome::NoConv, r.message = e.Message;
    } catch (const css::uno::RuntimeException &) {
        r.kind = Outcome::Runtime;
    }
    return r;
}
Result range(DealFunctions &f, const RangeCall &c, bool outcome = false) {
    const std::vector<Arg> a = c.args();
    return call([&] { return f.share_range(a.data(), outcome); });
}

void check_range_conversion(DealFunctions &f) {
    rec.status = CTO_OK;
    RangeCall c;
    c.req[1] = cells(1, 2, {num(0.02), num(0.08)});            // uniform (a row)
    c.req[2] = cells(3, 1, {num(10.0), num(30.0), num(60.0)}); // PERT (a column)
    Result r = range(f, c);
    double v = 0;
    check(r.kind == Outcome::Value && (r.value >>= v) && v == 100.5,
          "DEALRANGE: a value at the default probability 0.5");
    check(rec.in.size == sizeof(cto_range_input) && rec.in.arg[0].kind == CTO_RANGE_FIXED &&
              rec.in.arg[0].mode == 0.05, "one cell: fixed");
    check(rec.in.arg[1].kind == CTO_RANGE_UNIFORM && rec.in.arg[1].low == 0.02 &&
              rec.in.arg[1].high == 0.08, "2 cells in a row: uniform (low, high)");
    check(rec.in.arg[2].kind == CTO_RANGE_PERT && rec.in.arg[2].low == 10.0 &&
              rec.in.arg[2].mode == 30.0 && rec.in.arg[2].high == 60.0,
          "3 cells in a column: PERT (low, mode, high) by default");
    check(rec.in.arg[3].kind == CTO_RANGE_FIXED && rec.in.arg[3].mode == 0.0 &&
              rec.in.arg[8].mode == kAbsent && rec.in.arg[10].mode == 1.0 &&
              rec.in.arg[11].mode == 1.0 && rec.in.arg[12].mode == 365.0,
          "left out: the catalogue default, fixed (walk-away value absent: -infinity; the "
          "argument with a default, not an earlier function's required one)");
    check(rec.opt.n_probs == 1 && rec.opt.probs[0] == 0.5 && rec.opt.seed == 0 &&
              rec.opt.digits == 3 && rec.opt.replicates == 16,
          "options: probability 0.5, seed 0, digits 3, the library's other defaults");
    c.opt[kArgShapeOpt] = text(" Triangular ");
    c.opt[kArgSeedOpt] = num(7.0);
    c.opt[kArgDigitsOpt] = num(2.0);
    c.opt[11 - 3] = text("FALSE"); // own_opens as text
    range(f, c);
    check(rec.in.arg[2].kind == CTO_RANGE_TRIANGULAR && rec.opt.seed == 7 && rec.opt.digits == 2 &&
              rec.in.arg[11].mode == 0.0,
          "shape \"triangular\" (any case), seed 7, digits 2, a boolean as text");
}

void check_range_errors(DealFunctions &f) {
    rec.status = CTO_OK;
    auto illegal_at = [&](RangeCall c, int position, const char *what) {
        const Result r = range(f, c);
        check(r.kind == Outcome::Illegal && r.position == position, what);
    };
    RangeCall c;
    c.req[1] = cells(1, 4, {num(1.0), num(2.0), num(3.0), num(4.0)});
    illegal_at(c, 1, "a 1x4 range: Err:502 for that argument");
    c.req[1] = cells(2, 2, {num(1.0), num(2.0), num(3.0), num(4.0)});
    illegal_at(c, 1, "a 2x2 range: Err:502");
    c.req[1] = cells(1, 2, {num(0.08), num(0.02)});
    illegal_at(c, 1, "low above high: the library's invalid index as the argument");
    c.req[1] = cells(1, 2, {num(0.02), css::uno::Any()});
    illegal_at(c, 1, "an empty cell inside a range: NaN, never the default");
    c.req[1] = cells(1, 3, {num(0.02), text("x"), num(0.08)});
    illegal_at(c, 1, "text inside a range: invalid");
    RangeCall s;
    s.opt[kArgShapeOpt] = text("normal");
    illegal_at(s, kArgShapeOpt + 3, "an unknown shape: Err:502");
    RangeCall d;
    d.opt[kArgDigitsOpt] = num(2.5);
    illegal_at(d, kArgDigitsOpt + 3, "digits not whole: Err:502 (it cannot become one)");
    RangeCall e;
    e.opt[kArgSeedOpt] = num(-1.0);
    illegal_at(e, kArgSeedOpt + 3, "a negative seed: Err:502");
    e.opt[kArgSeedOpt] = num(1.5);
    illegal_at(e, kArgSeedOpt + 3, "a seed not whole: Err:502");
    RangeCall p;
    p.opt[kArgProbOpt] = num(1.0);
    illegal_at(p, kArgProbOpt + 3, "probability 1: the library rejects it (probability)");
    std::vector<css::uno::Any> many(33, num(0.5));
    Mixed m(33);
    for (sal_Int32 i = 0; i < 33; ++i) m.getArray()[i] = css::uno::Sequence<css::uno::Any>(&many[0], 1);
    p.opt[kArgProbOpt] <<= m;
    illegal_at(p, kArgProbOpt + 3, "33 probabilities: more than the library's 32");
    const int statuses[] = {CTO_E_INDETERMINATE, CTO_E_NO_CONVERGENCE, CTO_E_INTERNAL};
    const Outcome want[] = {Outcome::NaN, Outcome::NoConv, Outcome::Runtime};
    for (int i = 0; i < 3; ++i) {
        rec.status = statuses[i];
        check(range(f, RangeCall()).kind == want[i] && range(f, RangeCall(), true).kind == want[i],
              "DEALRANGE/DEALRANGEOUTCOME: indeterminate #NUM!, no convergence Err:523, internal #VALUE!");
    }
    rec.status = CTO_OK;
}

void check_range_arrays(DealFunctions &f) {
    RangeCall c;
    c.opt[kArgProbOpt] <<= cells(3, 1, {num(0.1), num(0.5), num(0.9)});
    for (int st : {CTO_OK, CTO_E_PRECISION}) {
        rec.status = st;
        const Result r = range(f, c);
        css::uno::Sequence<css::uno::Sequence<double>> m;
        check((r.value >>= m) && m.getLength() == 3 && m[0].getLength() == 1 &&
                  rec.opt.n_probs == 3 && rec.opt.probs[2] == 0.9,
              "a column of probabilities: a column of quantiles");
        if (m.getLength() == 3)
            check(m[0][0] == 100.1 && m[2][0] == 100.9 &&
                      (st == CTO_OK ? m[1][0] == 100.5 : code_of(m[1][0]) == 523),
                  "precision not reached: Err:523 exactly where a quantile is short");
    }
    rec.status = CTO_E_PRECISION;
    check(range(f, RangeCall()).kind == Outcome::NoConv,
          "one probability short of the target: Err:523, never the rough value");
    c.opt[kArgProbOpt] = css::uno::Any();
    const Result o = range(f, c, true);
    css::uno::Sequence<css::uno::Sequence<css::uno::Any>> rows;
    check((o.value >>= rows) && rows.getLength() == 17 && rows[0].getLength() == 4 &&
              rec.opt.n_probs == 3, "outcome: 2 x 3 quantiles + 11 rows, 4 columns");
    if (rows.getLength() == 17) {
        OUString l0, l3, w;
        double v0 = 0, h0 = 0, d1 = 0, n = 0;
        check((rows[0][0] >>= l0) && l0 == "own share, p = 0.1" && (rows[0][1] >>= v0) &&
                  v0 == 100.1 && (rows[0][2] >>= h0) && h0 == 0.02,
              "outcome: own share at 0.1, its half-width");
        check((rows[1][3] >>= d1) && d1 == 2.0, "outcome: the digits of the short quantile");
        check((rows[3][0] >>= l3) && l3 == "other share, p = 0.1", "outcome: other share next");
        check((rows[12][1] >>= n) && n == 1024.0, "outcome: points per replicate");
        check((rows[15][1] >>= w) && w == "precision not reached", "outcome: the status word");
    }
    rec.status = CTO_OK;
}

void check_swing(DealFunctions &f) {
    RangeCall c;
    c.req[0] = cells(1, 2, {num(0.05), num(0.1)});
    std::vector<Arg> a = c.args();
    a.erase(a.begin() + 14, a.end());
    Result r = call([&] { return f.share_swing(a.data()); });
    css::uno::Sequence<css::uno::Sequence<css::uno::Any>> rows;
    check((r.value >>= rows) && rows.getLength() == 2 && rows[0].getLength() == 3,
          "DEALSWING: a row per uncertain input, 3 columns");
    if (rows.getLength() == 2) {
        OUString n0, n1;
        double lo = 0, hi = 0;
        check((rows[0][0] >>= n0) && n0 == "other_rate" && (rows[1][0] >>= n1) && n1 == "own_rate",
              "DEALSWING: the inputs' catalogue names in the library's order");
        check((rows[0][1] >>= lo) && lo == 0.4 && (rows[0][2] >>= hi) && code_of(hi) == 0x7fff,
              "DEALSWING: an end without a deal is #N/A");
    }
    rec.path_rounds = 0;
    r = call([&] { return f.share_swing(a.data()); });
    OUString none;
    check((r.value >>= rows) && rows.getLength() == 1 && (rows[0][0] >>= none) && none == "none",
          "DEALSWING: no uncertain input: one row \"none\"");
    rec.path_rounds = 5000;
    c.req[0] = cells(1, 2, {num(0.1), num(0.05)});
    a = c.args();
    r = call([&] { return f.share_swing(a.data()); });
    check(r.kind == Outcome::Illegal && r.position == 0, "DEALSWING: low above high is Err:502");
}

// DEALREASON for the range functions (addin/README.md "Why a cell fails"): the same
// conversion as the function (src/ranges.hxx), the library's reason after the Calc name,
// and what a value the add-in could not convert must be; never an error value.
void check_range_reason(DealFunctions &f) {
    auto reason = [&](const char *name, std::vector<css::uno::Any> as) {
        OUString words;
        f.reason(OUString::createFromAscii(name),
                 css::uno::Sequence<css::uno::Any>(as.data(), static_cast<sal_Int32>(as.size()))) >>=
            words;
        return words;
    };
    const css::uno::Any uniform(cells(1, 2, {num(0.02), num(0.08)}));
    check(reason("DEALRANGE", {num(0.05), uniform, num(30.0)}) ==
              "DEALRANGE: range reason: kind 1, 1 probabilities, digits 3",
          "reason: DEALRANGE's arguments read as DEALRANGE reads them (probability 0.5)");
    check(rec.explained_run && rec.in.arg[1].low == 0.02 && rec.in.arg[1].high == 0.08 &&
              rec.in.arg[0].mode == 0.05 && rec.in.arg[8].mode == kAbsent &&
              rec.opt.probs[0] == 0.5,
          "reason: a 1x2 range is uniform, left out is the default, the library runs it");
    check(reason(" dealRangeOutcome ", {num(0.05), uniform, num(30.0)}) ==
              "DEALRANGEOUTCOME: range reason: kind 1, 3 probabilities, digits 3",
          "reason: DEALRANGEOUTCOME (any case) keeps the library's three probabilities");
    check(reason("share_range", {num(0.05), uniform, num(30.0)}).startsWith("DEALRANGE: range"),
          "reason: the catalogue-style name share_range");
    std::vector<css::uno::Any> shape(16);
    shape[0] = num(0.05), shape[1] = uniform, shape[2] = num(30.0), shape[15] = text("normal");
    check(reason("DEALRANGE", shape) ==
              "DEALRANGE: invalid argument 16 (Shape): \"pert\" or \"triangular\"",
          "reason: an unknown shape is the add-in's own words");
    const css::uno::Any four(cells(1, 4, {num(1.0), num(2.0), num(3.0), num(4.0)}));
    check(reason("DEALRANGE", {num(0.05), four, num(30.0)}) ==
              "DEALRANGE: invalid argument 2 (In2): one cell, or 2 cells (low, high) or 3 (low, "
              "mode, high) in a row or a column",
          "reason: a 1x4 range is the add-in's own words");
    std::vector<css::uno::Any> digits(18);
    digits[0] = num(0.05), digits[1] = uniform, digits[2] = num(30.0), digits[17] = num(2.5);
    check(reason("DEALRANGE", digits) ==
              "DEALRANGE: invalid argument 18 (Digits): a whole number",
          "reason: digits not whole");
    const css::uno::Any pert(cells(3, 1, {num(0.01), num(0.05), num(0.1)}));
    check(reason("DEALSWING", {pert, num(0.08), num(30.0)}) == "DEALSWING: swing reason: kind 3",
          "reason: DEALSWING, a 3x1 range is PERT");
    check(reason("DEALSWING", std::vector<css::uno::Any>(15, num(1.0))) ==
              "DEALSWING takes at most 14 arguments; 15 were given",
          "reason: too many arguments for DEALSWING is a reason");
}

Result path(DealFunctions &f, std::initializer_list<css::uno::Any> opt, Mixed first = one(num(0.0))) {
    const Mixed req[] = {first, one(num(1.0)), one(num(0.9)), one(num(0.9))};
    std::vector<css::uno::Any> o(opt);
    o.resize(3);
    const Arg args[] = {Arg(req[0]), Arg(req[1]), Arg(req[2]), Arg(req[3]),
                        Arg(o[0]),   Arg(o[1]),   Arg(o[2])};
    return call([&] { return f.offer_path(args); });
}

void check_offer_path(DealFunctions &f) {
    rec.status = CTO_OK;
    Result r = path(f, {});
    css::uno::Sequence<css::uno::Sequence<double>> m;
    check((r.value >>= m) && m.getLength() == 1000 && m[0].getLength() == 5 &&
              rec.offer_capacity == 1000,
          "DEALOFFERPATH: at most 1,000 rows of 5 columns");
    if (m.getLength() == 1000)
        check(m[0][0] == 1.0 && m[0][1] == 10.0 && m[0][2] == 5.0 && m[0][3] == 0.001 &&
                  m[999][0] == 1000.0 && m[999][4] == 1.0,
              "DEALOFFERPATH: round, offer, cutoff, in that round, by that round");
    rec.path_rounds = 3;
    r = path(f, {num(3.0), num(0.25), text("Buyer")});
    check((r.value >>= m) && m.getLength() == 3 && rec.offer_rounds == 3 &&
              rec.offer_offerer == 1 && rec.offer_args[5] == 0.25,
          "DEALOFFERPATH: rounds, known value, offerer as text; a row per round");
    rec.path_rounds = 5000;
    const Result bad_rounds = path(f, {num(2.5)});
    check(bad_rounds.kind == Outcome::Illegal && bad_rounds.position == 4 && rec.offer_rounds == -1,
          "rounds not whole: -1 to the library, Err:502 naming rounds (the table's check)");
    const Result bad_offerer = path(f, {num(2.0), num(0.0), num(4294967297.0)});
    check(bad_offerer.kind == Outcome::Illegal && bad_offerer.position == 6 &&
              rec.offer_offerer == -1,
          "an offerer beyond int: -1 to the library (never wrapped to 1), Err:502");
    check(path(f, {}, cells(1, 2, {num(0.0), num(1.0)})).kind == Outcome::Illegal,
          "a range for a single value: Err:502");
    check(path(f, {}, one(text("x"))).kind == Outcome::Illegal, "text: Err:502");
    const int statuses[] = {CTO_E_NO_DEAL, CTO_E_INDETERMINATE, CTO_E_NO_CONVERGENCE, CTO_E_INTERNAL};
    const Outcome want[] = {Outcome::Void, Outcome::NaN, Outcome::NoConv, Outcome::Runtime};
    for (int i = 0; i < 4; ++i) {
        rec.status = statuses[i];
        check(path(f, {}).kind == want[i],
              "DEALOFFERPATH: no deal #N/A, indeterminate #NUM!, no convergence Err:523, internal #VALUE!");
    }
    rec.status = CTO_OK;
}
} // namespace
