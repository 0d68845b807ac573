// The catalogue as data: names, arguments, defaults and help for every function, and
// the generic entry points cto_call / cto_call_strided that the wrappers are built on.
// A new catalogue row is one entry in kRows below (plus its model in models/ and its
// named C function in capi.cpp).
#include <cmath>
#include <cstring>
#include <utility>

#include "models.hpp"

namespace core = cto::core;

namespace {

constexpr double kNaN = core::kNaN;
constexpr double kInf = core::kInf;

// ---- argument descriptions --------------------------------------------------
constexpr const char *kUtilityChoices[] = {"power", "exponential", nullptr};
constexpr const char *kRoleChoices[] = {"proposer", "partner", nullptr};
constexpr const char *kWrtChoices[] = {"own", "other", nullptr};

constexpr cto_arg_info req(const char *name, const char *label, const char *help, int kind) {
    return {name, label, help, kind, 0, 0.0, 0, nullptr};
}
constexpr cto_arg_info opt(const char *name, const char *label, const char *help, int kind,
                           double def) {
    return {name, label, help, kind, 1, def, 0, nullptr};
}
constexpr cto_arg_info count(const char *name, const char *label, const char *help,
                             int64_t min, int has_default, double def) {
    return {name, label, help, CTO_ARG_COUNT, has_default, def, min, nullptr};
}
constexpr cto_arg_info choice(const char *name, const char *label, const char *help,
                              const char *const *choices, int has_default, double def) {
    return {name, label, help, CTO_ARG_CHOICE, has_default, def, 0, choices};
}

#define FACTOR(who, Who)                                                              \
    req(who "_factor", Who " factor",                                                 \
        Who " per-round discount factor, 0 to 1 (1 = delay costs " who " nothing)", \
        CTO_ARG_UNIT)
#define RATE(who, Who)                                                                 \
    req(who "_rate", Who " rate",                                                      \
        Who " annual cost of capital or delay, as a fraction (0.08 = 8%); at least 0", \
        CTO_ARG_NONNEG)
const cto_arg_info kOwnFactor = FACTOR("own", "Own");
const cto_arg_info kOtherFactor = FACTOR("other", "Other");
const cto_arg_info kOwnRate = RATE("own", "Own");
const cto_arg_info kOtherRate = RATE("other", "Other");
const cto_arg_info kSurplus = opt("surplus", "Surplus",
                                  "money to be split, in any currency unit (default 1: "
                                  "results are fractions)",
                                  CTO_ARG_REAL, 1.0);
const cto_arg_info kOwnOpens = opt("own_opens", "Own opens",
                                   "TRUE if own makes the first offer (default TRUE)",
                                   CTO_ARG_BOOL, 1.0);
const cto_arg_info kDays = req("days", "Days between offers",
                               "time between successive offers, in days; at least 0",
                               CTO_ARG_NONNEG);
const cto_arg_info kBasis = opt("basis", "Day basis", "days per year (default 365); above 0",
                                CTO_ARG_POSITIVE, 365.0);
const cto_arg_info kContinuous =
    opt("continuous", "Continuous rates",
        "TRUE if rates are continuously compounded (default FALSE: annual effective)",
        CTO_ARG_BOOL, 0.0);
const cto_arg_info kBreakdownReq =
    req("breakdown_prob", "Breakdown probability",
        "chance that talks end for good after each rejection, 0 to 1", CTO_ARG_UNIT);
const cto_arg_info kBreakdownOpt =
    opt("breakdown_prob", "Breakdown probability",
        "chance that talks end for good after each rejection, 0 to 1 (default 0)",
        CTO_ARG_UNIT, 0.0);
#define FALLBACK(who, Who, kind_of)                                                    \
    kind_of(who "_fallback", Who " fallback",                                          \
            "money " who " gets if talks break down (may be negative)", CTO_ARG_REAL)
#define OPT0(n, l, h, k) opt(n, l, h " (default 0)", k, 0.0)
const cto_arg_info kOwnFallbackReq = FALLBACK("own", "Own", req);
const cto_arg_info kOtherFallbackReq = FALLBACK("other", "Other", req);
const cto_arg_info kOwnFallbackOpt = FALLBACK("own", "Own", OPT0);
const cto_arg_info kOtherFallbackOpt = FALLBACK("other", "Other", OPT0);

const cto_arg_info kRoundFactorArgs[] = {
    req("rate", "Rate", "annual rate as a fraction (0.08 = 8%); at least 0", CTO_ARG_NONNEG),
    kDays, kBasis, kContinuous};
const cto_arg_info kShareArgs[] = {kOwnFactor, kOtherFactor, kSurplus, kOwnOpens};
const cto_arg_info kShareFromRatesArgs[] = {kOwnRate, kOtherRate, kDays,       kSurplus,
                                            kOwnOpens, kBasis,    kContinuous};
const cto_arg_info kLimitShareArgs[] = {
    req("own_rate", "Own rate",
        "own continuously compounded rate (for an annual effective rate R use LN(1+R)); "
        "at least 0",
        CTO_ARG_NONNEG),
    req("other_rate", "Other rate",
        "other's continuously compounded rate, in the same unit; at least 0", CTO_ARG_NONNEG),
    kSurplus};
const cto_arg_info kBreakdownArgs[] = {kOwnFactor,      kOtherFactor,      kBreakdownReq,
                                       kOwnFallbackReq, kOtherFallbackReq, kSurplus,
                                       kOwnOpens};
const cto_arg_info kOutsideArgs[] = {
    kOwnFactor, kOtherFactor,
    req("own_outside", "Own walk-away value",
        "money own gets by walking away instead of answering an offer", CTO_ARG_REAL),
    req("other_outside", "Other walk-away value",
        "money the other side gets by walking away instead of answering", CTO_ARG_REAL),
    kSurplus, kOwnOpens};
const cto_arg_info kInsideArgs[] = {
    kOwnFactor, kOtherFactor,
    req("own_inside", "Own status-quo value",
        "present value of own's income from the status quo if no deal is ever made",
        CTO_ARG_REAL),
    req("other_inside", "Other status-quo value",
        "present value of the other side's status-quo income if no deal is ever made",
        CTO_ARG_REAL),
    kSurplus, kOwnOpens};
const cto_arg_info kSolveArgs[] = {
    kOwnFactor,
    kOtherFactor,
    kBreakdownOpt,
    kOwnFallbackOpt,
    kOtherFallbackOpt,
    opt("own_inside", "Own status-quo value",
        "present value of own's status-quo income while no deal is made (default 0)",
        CTO_ARG_REAL, 0.0),
    opt("other_inside", "Other status-quo value",
        "present value of the other side's status-quo income (default 0)", CTO_ARG_REAL,
        0.0),
    opt("own_outside", "Own walk-away value",
        "money own gets by walking away (default: no walk-away option)", CTO_ARG_OPTIONAL,
        -kInf),
    opt("other_outside", "Other walk-away value",
        "money the other side gets by walking away (default: none)", CTO_ARG_OPTIONAL, -kInf),
    kSurplus,
    kOwnOpens};
const cto_arg_info kDeadlineArgs[] = {
    kOwnFactor,
    kOtherFactor,
    count("rounds", "Rounds",
          "largest number of offers that can be made before the deadline; whole number, "
          "at least 0",
          0, 0, 0.0),
    opt("own_fallback", "Own deadline payoff",
        "money own gets if the last offer is rejected (default 0)", CTO_ARG_REAL, 0.0),
    opt("other_fallback", "Other deadline payoff",
        "money the other side gets if the last offer is rejected (default 0)", CTO_ARG_REAL,
        0.0),
    kSurplus,
    kOwnOpens};
const cto_arg_info kFixedCostArgs[] = {
    req("own_cost", "Own cost per round", "money own loses for each round of delay; at least 0",
        CTO_ARG_NONNEG),
    req("other_cost", "Other cost per round",
        "money the other side loses for each round of delay; at least 0", CTO_ARG_NONNEG),
    kSurplus, kOwnOpens};
const cto_arg_info kDelayCostArgs[] = {
    req("factor", "Factor", "the party's per-round discount factor, 0 to 1", CTO_ARG_UNIT),
    req("stake", "Stake", "money the party would receive on agreement this round",
        CTO_ARG_REAL),
    kBreakdownOpt,
    opt("fallback", "Fallback", "money the party gets if talks break down (default 0)",
        CTO_ARG_REAL, 0.0)};
const cto_arg_info kFirstMoverArgs[] = {kOwnFactor, kOtherFactor, kSurplus};
const cto_arg_info kNashArgs[] = {
    req("own_fallback", "Own disagreement payoff",
        "money own gets without a deal (at least 0 when a curvature is below 1)", CTO_ARG_REAL),
    req("other_fallback", "Other disagreement payoff",
        "money the other side gets without a deal (at least 0 when a curvature is below 1)",
        CTO_ARG_REAL),
    opt("own_weight", "Own bargaining power", "own weight in the Nash product, 0 to 1 (default 0.5)",
        CTO_ARG_UNIT, 0.5),
    kSurplus,
    opt("own_curvature", "Own curvature",
        "exponent a of own utility x^a, above 0 and at most 1 (default 1: risk neutral)",
        CTO_ARG_POSITIVE, 1.0),
    opt("other_curvature", "Other curvature",
        "exponent of the other side's utility, above 0 and at most 1 (default 1)",
        CTO_ARG_POSITIVE, 1.0)};
const cto_arg_info kRiskAverseArgs[] = {
    kOwnFactor,
    kOtherFactor,
    req("own_curvature", "Own curvature",
        "power: exponent a of x^a, above 0 and at most 1; exponential: risk aversion k per "
        "money unit, above 0",
        CTO_ARG_POSITIVE),
    req("other_curvature", "Other curvature",
        "the other side's exponent (power) or risk aversion (exponential), as for own",
        CTO_ARG_POSITIVE),
    choice("utility", "Utility",
           "\"power\" (u = x^a, the default) or \"exponential\" (u = (1 - exp(-k x))/k)",
           kUtilityChoices, 1, CTO_UTILITY_POWER),
    kBreakdownOpt,
    opt("own_fallback", "Own fallback",
        "money own gets if talks break down (default 0; at least 0 for power utility)",
        CTO_ARG_REAL, 0.0),
    opt("other_fallback", "Other fallback",
        "money the other side gets on breakdown (default 0; at least 0 for power utility)",
        CTO_ARG_REAL, 0.0),
    kSurplus,
    kOwnOpens};
const cto_arg_info kGroupArgs[] = {
    req("factor", "Factor", "common per-round discount factor, 0 to 1", CTO_ARG_UNIT),
    count("parties", "Parties", "number of parties, whole number, at least 1", 1, 0, 0.0),
    count("position", "Position",
          "places after the proposer (0 = the proposer itself), whole number below parties", 0,
          1, 0.0),
    kSurplus};
const cto_arg_info kMajorityArgs[] = {
    req("factor", "Factor", "common per-round discount factor, 0 to 1", CTO_ARG_UNIT),
    count("parties", "Parties", "number of voters, whole number, at least 1", 1, 0, 0.0),
    count("votes_needed", "Votes needed",
          "votes needed to pass, proposer included, at most parties (default 0: simple "
          "majority)",
          0, 1, 0.0),
    choice("role", "Role", "\"proposer\" (the default) or \"partner\" (a coalition member)",
           kRoleChoices, 1, CTO_ROLE_PROPOSER),
    kSurplus};
const cto_arg_info kImpliedFactorArgs[] = {
    req("observed_share", "Observed share", "own fraction of the surplus in a deal, 0 to 1",
        CTO_ARG_UNIT),
    kOtherFactor, kOwnOpens};
const cto_arg_info kImpliedRateArgs[] = {
    req("observed_share", "Observed share", "own fraction of the surplus in a deal, 0 to 1",
        CTO_ARG_UNIT),
    kOtherRate, kDays, kOwnOpens, kBasis, kContinuous};
const cto_arg_info kSensitivityArgs[] = {
    kOwnRate,
    kOtherRate,
    kDays,
    choice("wrt", "With respect to",
           "\"own\" (the default) for own rate, \"other\" for the other side's rate",
           kWrtChoices, 1, CTO_WRT_OWN),
    kSurplus,
    kOwnOpens,
    kBasis,
    kContinuous};
const cto_arg_info kScreeningArgs[] = {
    req("high_value", "High value", "what the buyer pays at most if its value is high; above 0",
        CTO_ARG_POSITIVE),
    req("low_value", "Low value",
        "what the buyer pays at most if its value is low; above 0, at most the high value",
        CTO_ARG_POSITIVE),
    req("high_prob", "High probability", "probability that the buyer's value is high, 0 to 1",
        CTO_ARG_UNIT),
    req("seller_factor", "Seller factor", "seller's discount factor between the offers, 0 to 1",
        CTO_ARG_UNIT),
    req("buyer_factor", "Buyer factor", "buyer's discount factor between the offers, 0 to 1",
        CTO_ARG_UNIT)};

const cto_output_info kValueOut[] = {{"value", "the function's result"}};
const cto_output_info kSolveOut[] = {
    {"own_share", "own payoff (money); the no-deal payoff when no deal is rational"},
    {"other_share", "the other side's payoff (money)"},
    {"binding", "which walk-away option binds: 0 none, 1 own, 2 other, 3 both"},
    {"rational", "1 if a deal is rational (the surplus exceeds the no-deal payoffs), else 0"}};

// ---- conversion of the generic double arguments ---------------------------------
bool to_bool(double x, bool &v) {
    if (x == 0.0) {
        v = false;
        return true;
    }
    if (x == 1.0) {
        v = true;
        return true;
    }
    return false;
}
// A whole number in [lo, 2^63).
bool to_count(double x, int64_t lo, int64_t &v) {
    if (!(x >= static_cast<double>(lo) && x < 9223372036854775808.0) || x != std::floor(x))
        return false;
    v = static_cast<int64_t>(x);
    return true;
}
bool to_choice(double x, int n, int &v) {
    if (!(x >= 0.0 && x < n) || x != std::floor(x)) return false;
    v = static_cast<int>(x);
    return true;
}
int reject(int index, double *o, int n_out, int *bad) {
    for (int k = 0; k < n_out; ++k) o[k] = kNaN;
    if (bad) *bad = index;
    return CTO_E_INVALID;
}

// ---- thunks: doubles in, the core function, outputs --------------------------
// The argument positions follow the catalogue order in the tables above.
#define BOOL_AT(var, i, nout) \
    bool var;                 \
    if (!to_bool(a[i], var)) return reject(i, o, nout, bad)
#define COUNT_AT(var, i, lo, nout) \
    int64_t var;                   \
    if (!to_count(a[i], lo, var)) return reject(i, o, nout, bad)
#define CHOICE_AT(var, i, n, nout) \
    int var;                       \
    if (!to_choice(a[i], n, var)) return reject(i, o, nout, bad)

inline int t_round_factor(const double *a, double *o, int *bad) {
    BOOL_AT(cont, 3, 1);
    return core::round_factor(a[0], a[1], a[2], cont, o, bad);
}
inline int t_share(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 3, 1);
    return core::share(a[0], a[1], a[2], opens, o, bad);
}
inline int t_share_from_rates(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 4, 1);
    BOOL_AT(cont, 6, 1);
    return core::share_from_rates(a[0], a[1], a[2], a[3], opens, a[5], cont, o, bad);
}
inline int t_limit_share(const double *a, double *o, int *bad) {
    return core::limit_share(a[0], a[1], a[2], o, bad);
}
inline int t_breakdown_share(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 6, 1);
    return core::breakdown_share(a[0], a[1], a[2], a[3], a[4], a[5], opens, o, bad);
}
inline int t_outside_option_share(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 5, 1);
    return core::outside_option_share(a[0], a[1], a[2], a[3], a[4], opens, o, bad);
}
inline int t_inside_option_share(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 5, 1);
    return core::inside_option_share(a[0], a[1], a[2], a[3], a[4], opens, o, bad);
}
inline int t_solve(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 10, 4);
    const core::SolveIn in{a[0], a[1], a[2], a[3], a[4], a[5], a[6], a[7], a[8], a[9], opens};
    core::SolveOut so;
    const int st = core::solve(in, &so, bad);
    o[0] = so.own_share;
    o[1] = so.other_share;
    o[2] = st == CTO_OK ? static_cast<double>(so.binding)
                        : (st == CTO_E_NO_DEAL ? CTO_BINDS_NONE : kNaN);
    o[3] = st == CTO_E_INVALID || st == CTO_E_INTERNAL ? kNaN : (so.rational ? 1.0 : 0.0);
    return st;
}
inline int t_deadline_share(const double *a, double *o, int *bad) {
    COUNT_AT(rounds, 2, 0, 1);
    BOOL_AT(opens, 6, 1);
    return core::deadline_share(a[0], a[1], rounds, a[3], a[4], a[5], opens, o, bad);
}
inline int t_fixed_cost_share(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 3, 1);
    return core::fixed_cost_share(a[0], a[1], a[2], opens, o, bad);
}
inline int t_delay_cost(const double *a, double *o, int *bad) {
    return core::delay_cost(a[0], a[1], a[2], a[3], o, bad);
}
inline int t_first_mover_advantage(const double *a, double *o, int *bad) {
    return core::first_mover_advantage(a[0], a[1], a[2], o, bad);
}
inline int t_nash_share(const double *a, double *o, int *bad) {
    return core::nash_share(a[0], a[1], a[2], a[3], a[4], a[5], o, bad);
}
inline int t_risk_averse_share(const double *a, double *o, int *bad) {
    CHOICE_AT(utility, 4, 2, 1);
    BOOL_AT(opens, 9, 1);
    return core::risk_averse_share(a[0], a[1], a[2], a[3], utility, a[5], a[6], a[7], a[8],
                                   opens, o, bad);
}
inline int t_group_share(const double *a, double *o, int *bad) {
    COUNT_AT(parties, 1, 1, 1);
    COUNT_AT(position, 2, 0, 1);
    return core::group_share(a[0], parties, position, a[3], o, bad);
}
inline int t_majority_share(const double *a, double *o, int *bad) {
    COUNT_AT(parties, 1, 1, 1);
    COUNT_AT(votes, 2, 0, 1);
    CHOICE_AT(role, 3, 2, 1);
    return core::majority_share(a[0], parties, votes, role, a[4], o, bad);
}
inline int t_implied_factor(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 2, 1);
    return core::implied_factor(a[0], a[1], opens, o, bad);
}
inline int t_implied_rate(const double *a, double *o, int *bad) {
    BOOL_AT(opens, 3, 1);
    BOOL_AT(cont, 5, 1);
    return core::implied_rate(a[0], a[1], a[2], opens, a[4], cont, o, bad);
}
inline int t_share_sensitivity(const double *a, double *o, int *bad) {
    CHOICE_AT(wrt, 3, 2, 1);
    BOOL_AT(opens, 5, 1);
    BOOL_AT(cont, 7, 1);
    return core::share_sensitivity(a[0], a[1], a[2], wrt, a[4], opens, a[6], cont, o, bad);
}
inline int t_screening_profit(const double *a, double *o, int *bad) {
    return core::screening_profit(a[0], a[1], a[2], a[3], a[4], o, bad);
}

// ---- strided loops, specialised per function (the thunk is inlined) --------------
struct Tally {
    size_t count[CTO_REPORT_SLOTS] = {};
    size_t first[CTO_REPORT_SLOTS] = {};
    int first_bad = -1;
};

using Thunk = int (*)(const double *, double *, int *);
using Loop = void (*)(size_t, const char *const *, const ptrdiff_t *, char *const *,
                      const ptrdiff_t *, signed char *, ptrdiff_t, Tally &);

// Functions whose core has a block kernel (core::share_block): it evaluates a block of
// elements branch-free, in a form the compiler vectorises, and says whether every
// element came out valid with status ok; otherwise the block is redone element by
// element through the thunk.  The kernel's values equal the thunk's bit for bit.
using BlockKernel = bool (*)(size_t, const double *const *, double *const *);
inline bool b_share(size_t m, const double *const *a, double *const *o) {
    return core::share_block(m, a[0], a[1], a[2], a[3], o[0]);
}
template <Thunk F>
constexpr BlockKernel kBlockKernel = nullptr;
template <>
constexpr BlockKernel kBlockKernel<t_share> = b_share;
constexpr size_t kBlock = 256;

inline bool is_double_array(const char *p, ptrdiff_t step) {
    return step == static_cast<ptrdiff_t>(sizeof(double)) &&
           reinterpret_cast<uintptr_t>(p) % alignof(double) == 0;
}

// Whether a block of doubles written at out misses every byte that the block's nin
// inputs (at ap, with steps astep) are read from.
inline bool apart_from_inputs(const char *out, const char *const *ap, const ptrdiff_t *astep,
                              int nin) {
    const uintptr_t o_lo = reinterpret_cast<uintptr_t>(out);
    const uintptr_t o_hi = o_lo + kBlock * sizeof(double);
    for (int j = 0; j < nin; ++j) {
        uintptr_t lo = reinterpret_cast<uintptr_t>(ap[j]);
        uintptr_t hi = reinterpret_cast<uintptr_t>(ap[j] + (static_cast<ptrdiff_t>(kBlock) - 1) *
                                                               astep[j]);
        if (hi < lo) std::swap(lo, hi);
        if (!(hi + sizeof(double) <= o_lo || o_hi <= lo)) return false;
    }
    return true;
}

template <Thunk F, int NIN, int NOUT>
void strided(size_t n, const char *const *args, const ptrdiff_t *as, char *const *outs,
             const ptrdiff_t *os, signed char *st, ptrdiff_t ss, Tally &t) {
    double a[NIN];
    double o[NOUT];
    const char *ap[NIN];
    char *op[NOUT];
    ptrdiff_t astep[NIN], ostep[NOUT];
    for (int j = 0; j < NIN; ++j) {
        ap[j] = args[j];
        astep[j] = as[j];
    }
    for (int k = 0; k < NOUT; ++k) {
        op[k] = outs[k];
        ostep[k] = os[k];
    }
    size_t ok = 0, first_ok = 0;  // the common case is counted in registers
    // Element i: its inputs at ap[], read and advanced; outputs, status and tally.
    auto element = [&](size_t i) {
        for (int j = 0; j < NIN; ++j) {
            std::memcpy(&a[j], ap[j], sizeof(double));
            ap[j] += astep[j];
        }
        int bad = -1;
        int s = F(a, o, &bad);
        for (int k = 0; k < NOUT; ++k) {
            std::memcpy(op[k], &o[k], sizeof(double));
            op[k] += ostep[k];
        }
        if (st) st[static_cast<ptrdiff_t>(i) * ss] = static_cast<signed char>(s);
        if (s == CTO_OK) {
            if (ok++ == 0) first_ok = i;
            return;
        }
        if (s < 0 || s >= CTO_REPORT_SLOTS) s = CTO_E_INTERNAL;
        if (t.count[s]++ == 0) {
            t.first[s] = i;
            if (s == CTO_E_INVALID) t.first_bad = bad;
        }
    };
    size_t i = 0;
    if constexpr (kBlockKernel<F> != nullptr) {
        constexpr ptrdiff_t kBytes = static_cast<ptrdiff_t>(kBlock * sizeof(double));
        double in_buf[NIN][kBlock];
        double out_buf[NOUT][kBlock];
        const double *in[NIN];
        double *out[NOUT];
        bool filled[NIN] = {};  // a broadcast input's buffer holds its value already
        for (; n - i >= kBlock; i += kBlock) {
            for (int j = 0; j < NIN; ++j) {
                if (is_double_array(ap[j], astep[j])) {  // read in place
                    in[j] = reinterpret_cast<const double *>(ap[j]);
                    continue;
                }
                in[j] = in_buf[j];
                if (astep[j] == 0 && filled[j]) continue;
                const char *p = ap[j];
                for (size_t e = 0; e < kBlock; ++e, p += astep[j])
                    std::memcpy(&in_buf[j][e], p, sizeof(double));
                filled[j] = astep[j] == 0;
            }
            // An output is written in place when it is a double array apart from every
            // input of the block (the fallback below must still read the inputs).
            for (int k = 0; k < NOUT; ++k) {
                const bool in_place = is_double_array(op[k], ostep[k]) &&
                                      apart_from_inputs(op[k], ap, astep, NIN);
                out[k] = in_place ? reinterpret_cast<double *>(op[k]) : out_buf[k];
            }
            if (!kBlockKernel<F>(kBlock, in, out)) {
                for (size_t e = 0; e < kBlock; ++e) element(i + e);
                continue;
            }
            for (int j = 0; j < NIN; ++j) ap[j] += static_cast<ptrdiff_t>(kBlock) * astep[j];
            for (int k = 0; k < NOUT; ++k) {
                if (out[k] != out_buf[k]) {
                    op[k] += kBytes;
                    continue;
                }
                for (size_t e = 0; e < kBlock; ++e, op[k] += ostep[k])
                    std::memcpy(op[k], &out_buf[k][e], sizeof(double));
            }
            if (st) {
                for (size_t e = 0; e < kBlock; ++e)
                    st[static_cast<ptrdiff_t>(i + e) * ss] = static_cast<signed char>(CTO_OK);
            }
            if (ok == 0) first_ok = i;
            ok += kBlock;
        }
    }
    for (; i < n; ++i) element(i);
    if (ok > 0 && t.count[CTO_OK] == 0) t.first[CTO_OK] = first_ok;
    t.count[CTO_OK] += ok;
}

struct Row {
    cto_function_info info;
    Thunk thunk;
    Loop loop;
};

#define N_OF(arr) static_cast<int>(sizeof(arr) / sizeof(arr[0]))
#define ROW(id, name, calc, summary, formula, source, statuses, args, outs)                   \
    Row {                                                                                      \
        {sizeof(cto_function_info), id, #name, calc, summary, formula, source, statuses,       \
         N_OF(args), args, N_OF(outs), outs},                                                  \
            t_##name, strided<t_##name, N_OF(args), N_OF(outs)>                                \
    }

const char kStdStatus[] =
    "ok: the value; invalid: NaN; no_deal (surplus <= 0): 0; indeterminate (both factors 1): "
    "NaN";

const Row kRows[] = {
    ROW(0, round_factor, "DEALFACTOR", "per-round discount factor from an annual rate",
        "(1 + rate)^(-days/basis); continuous: exp(-rate days/basis)",
        "standard compounding (common practice); delta = exp(-r Delta) as in Rubinstein (1982)",
        "ok: factor in [0, 1]; invalid: NaN", kRoundFactorArgs, kValueOut),
    ROW(1, share, "DEALSHARE", "own share of the surplus, alternating offers",
        "own opens: S (1 - d_oth)/(1 - d_own d_oth); other opens: S d_own (1 - d_oth)/(1 - "
        "d_own d_oth)",
        "Rubinstein (1982), main theorem; Muthoo (1999) ch.3", kStdStatus, kShareArgs,
        kValueOut),
    ROW(2, share_from_rates, "DEALSHARERATE",
        "own share from annual rates and days between offers, cancellation-free",
        "S expm1(-rho_oth)/expm1(-(rho_own + rho_oth)), rho = c(rate) days/basis",
        "Rubinstein (1982); Muthoo (1999) s.3.2",
        "as share; indeterminate also when days = 0", kShareFromRatesArgs, kValueOut),
    ROW(3, limit_share, "DEALSHARELIMIT", "own share as offers become very frequent",
        "S r_oth/(r_own + r_oth)",
        "Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) ch.3",
        "ok; no_deal (surplus <= 0): 0; indeterminate (both rates 0): NaN; invalid: NaN",
        kLimitShareArgs, kValueOut),
    ROW(4, breakdown_share, "DEALBREAKDOWN", "own share with a risk that talks break down",
        "d0_open + (S - d0_own - d0_oth)(1 - a_resp)/(1 - a_own a_oth), a = (1-p) d, d0 = p b/(1 "
        "- a)",
        "Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) ch.4",
        "ok; no_deal (S <= d0_own + d0_oth): d0_own; indeterminate (p = 0, both factors 1): "
        "NaN; invalid: NaN",
        kBreakdownArgs, kValueOut),
    ROW(5, outside_option_share, "DEALOUTSIDE", "own share when either side may walk away",
        "S - x = max(w_resp, d_resp y), S - y = max(w_open, d_open x), four linear regimes",
        "Shaked & Sutton (1984); Binmore, Shaked & Sutton (1989); Muthoo (1999) ch.5",
        "ok; no_deal (S <= w_own + w_oth when an option is positive, else S <= 0): w_own or 0; "
        "indeterminate; invalid",
        kOutsideArgs, kValueOut),
    ROW(6, inside_option_share, "DEALINSIDE", "own share with status-quo income during talks",
        "g_open + (S - g_own - g_oth)(1 - d_resp)/(1 - d_own d_oth)", "Muthoo (1999) ch.6",
        "ok; no_deal (S <= g_own + g_oth): g_own; indeterminate; invalid", kInsideArgs,
        kValueOut),
    ROW(7, solve, "DEALSOLVE",
        "the combined model: breakdown risk, status quo and walk-away options at once",
        "S - x = max(w_B, p b_B + (1-p)((1-d_B) g_B + d_B y)), and the mirror condition",
        "Rubinstein (1982); Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) chs.3-6",
        "ok: shares, binding, rational = 1; no_deal: the no-deal payoffs, rational = 0; "
        "indeterminate: NaN shares; invalid: NaN",
        kSolveArgs, kSolveOut),
    ROW(8, deadline_share, "DEALDEADLINE", "own share when only a limited number of offers can be made",
        "backward induction; x_{t-2m} = x* + q^m (x_t - x*), q = d_own d_oth",
        "Stahl (1972); Gibbons (1992) s.2.1.D",
        "ok; no_deal (no agreement in any round, or rounds = 0): own's discounted deadline "
        "payoff; no_convergence: NaN; invalid: NaN",
        kDeadlineArgs, kValueOut),
    ROW(9, fixed_cost_share, "DEALFIXEDCOST", "own share when each round costs a fixed amount",
        "lower cost takes the surplus; the higher-cost opener keeps min(c_responder, S)",
        "Rubinstein (1982), fixed-cost case",
        "ok; no_deal (S <= 0): 0; indeterminate (equal costs below S): NaN; invalid: NaN",
        kFixedCostArgs, kValueOut),
    ROW(10, delay_cost, "DEALDELAYCOST", "expected value lost if agreement slips one round",
        "stake - ((1-p) factor stake + p fallback)",
        "Muthoo (1999) ch.4 timing; holding cost (1 - d) s", "ok; invalid: NaN", kDelayCostArgs,
        kValueOut),
    ROW(11, first_mover_advantage, "DEALFIRSTMOVER",
        "own share as opener minus own share as responder",
        "S (1 - d_own)(1 - d_oth)/(1 - d_own d_oth)", "Rubinstein (1982); Muthoo (1999) ch.3",
        kStdStatus, kFirstMoverArgs, kValueOut),
    ROW(12, nash_share, "DEALNASH", "own amount in the generalised Nash bargaining solution",
        "argmax (u_own(x) - u_own(b_own))^w (u_oth(S-x) - u_oth(b_oth))^(1-w), u = x^a",
        "Nash (1950); Kalai (1977); Muthoo (1999) ch.2",
        "ok; no_deal (S <= b_own + b_oth): b_own; no_convergence: NaN; invalid: NaN", kNashArgs,
        kValueOut),
    ROW(13, risk_averse_share, "DEALRISKAVERSE",
        "own share, alternating offers with risk-averse parties",
        "u_B(S - x) = p u_B(b_B) + (1-p) d_B u_B(y), u_A(S - y) = p u_A(b_A) + (1-p) d_A u_A(x)",
        "Binmore, Rubinstein & Wolinsky (1986); Muthoo (1999) chs.3-4",
        "ok; no_deal: own's certainty equivalent of waiting; indeterminate; no_convergence; "
        "invalid",
        kRiskAverseArgs, kValueOut),
    ROW(14, group_share, "DEALGROUP", "share of one of n parties, unanimity bargaining",
        "S d^k (1 - d)/(1 - d^n)", "Herrero (1985); Sutton (1986); Osborne & Rubinstein (1990) s.3.13",
        "ok; no_deal (S <= 0): 0; indeterminate (factor 1, 2+ parties): NaN; invalid: NaN",
        kGroupArgs, kValueOut),
    ROW(15, majority_share, "DEALMAJORITY", "proposer's or partner's share under majority rule",
        "proposer S (1 - d (q - 1)/n); partner S d/n", "Baron & Ferejohn (1989)",
        "ok; no_deal (S <= 0): 0; invalid: NaN", kMajorityArgs, kValueOut),
    ROW(16, implied_factor, "DEALIMPLIEDFACTOR",
        "own per-round factor that makes an observed split the equilibrium",
        "own opens: 1 - d_own = (1 - s)(1 - d_oth)/(s d_oth)", "inverse of Rubinstein (1982)",
        "ok; indeterminate (the share does not depend on own's factor): NaN; invalid "
        "(unreachable share): NaN",
        kImpliedFactorArgs, kValueOut),
    ROW(17, implied_rate, "DEALIMPLIEDRATE", "own annual rate that makes an observed split the equilibrium",
        "rho_own = -log1p(-(1 - s) expm1(rho_oth)/s) (own opens), as an annual rate",
        "inverse of Rubinstein (1982)",
        "ok; indeterminate (days = 0, or no dependence): NaN; invalid: NaN", kImpliedRateArgs,
        kValueOut),
    ROW(18, share_sensitivity, "DEALSENSITIVITY",
        "derivative of own share with respect to own or other annual rate",
        "d share/d rate, exact, from the expm1 form of share_from_rates",
        "Rubinstein (1982); Muthoo (1999) s.3.2", "as share_from_rates", kSensitivityArgs,
        kValueOut),
    ROW(19, screening_profit, "DEALSCREEN",
        "seller's best expected revenue over two offers to a buyer of unknown value",
        "max(pool v_L, screen q((1-d_b) v_H + d_b v_L) + (1-q) d_s v_L, skim)",
        "Fudenberg & Tirole (1983)", "ok; invalid: NaN", kScreeningArgs, kValueOut),
};
constexpr size_t kCount = sizeof(kRows) / sizeof(kRows[0]);

const Row *row(int id) {
    if (id < 0 || static_cast<size_t>(id) >= kCount) return nullptr;
    return &kRows[id];
}

}  // namespace

extern "C" {

CTO_API size_t cto_function_count(void) { return kCount; }

CTO_API const cto_function_info *cto_function_at(size_t index) {
    return index < kCount ? &kRows[index].info : nullptr;
}

CTO_API const cto_function_info *cto_function_find(const char *name) {
    if (!name) return nullptr;
    for (const Row &r : kRows)
        if (std::strcmp(r.info.name, name) == 0) return &r.info;
    return nullptr;
}

CTO_API int cto_call(int id, const double *args, double *outputs, int *bad_arg) {
    if (bad_arg) *bad_arg = -1;
    const Row *r = row(id);
    if (!r || !args || !outputs) return CTO_E_INVALID;
    try {
        return r->thunk(args, outputs, bad_arg);
    } catch (...) {
        for (int k = 0; k < r->info.n_outputs; ++k) outputs[k] = kNaN;
        return CTO_E_INTERNAL;
    }
}

CTO_API int cto_call_strided(int id, size_t n, const char *const *args,
                             const ptrdiff_t *arg_strides, char *const *outputs,
                             const ptrdiff_t *output_strides, signed char *statuses,
                             ptrdiff_t status_stride, cto_batch_report *report) {
    const Row *r = row(id);
    if (!r || !args || !arg_strides || !outputs || !output_strides) return CTO_E_INVALID;
    if (report && report->size < sizeof(cto_batch_report)) return CTO_E_INVALID;
    for (int j = 0; j < r->info.n_args; ++j)
        if (!args[j] && n > 0) return CTO_E_INVALID;
    for (int k = 0; k < r->info.n_outputs; ++k)
        if (!outputs[k] && n > 0) return CTO_E_INVALID;
    Tally t;
    try {
        r->loop(n, args, arg_strides, outputs, output_strides, statuses, status_stride, t);
    } catch (...) {
        return CTO_E_INTERNAL;
    }
    if (report) {
        for (int s = 0; s < CTO_REPORT_SLOTS; ++s) {
            report->count[s] = t.count[s];
            report->first_index[s] = t.first[s];
        }
        report->first_bad_arg = t.first_bad;
    }
    return CTO_OK;
}

}  // extern "C"
