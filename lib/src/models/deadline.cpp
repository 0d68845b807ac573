// The deadline model: alternating offers with at most `rounds` offers.
// Formulas, sources and status tables are documented in the public header; the comments
// here explain the numerical choices.
#include <algorithm>
#include <cmath>

#include "deadline.hpp"
#include "powers.hpp"

namespace cto::core {

// ---------------------------------------------------------------------------
// Deadline (finite horizon)
// ---------------------------------------------------------------------------
// Exact backward induction from the last round.  In each round the proposer either makes
// the offer the responder accepts (its discounted value of going on) or, when that leaves
// it less than its own discounted value of waiting, an offer that is refused; the
// responder accepts when indifferent.  Play therefore runs in phases:
//   - an agreement phase, where the proposer's value follows the two-step linear map
//     F -> S (1 - d_resp) + q F, so F_{s-2m} = F* + q^m (F_s - F*) with q^m = exp(m log q);
//     whether agreement holds in a round is affine in q^m, hence monotone in m;
//   - a disagreement phase (possible with negative payoffs), where each side's value is
//     only discounted, v_i d_i^k; agreement returns when S >= sum_i d_i^k v_i, a constant
//     minus two exponentials in k, which has at most one turning point.
// Each phase is crossed at once by bisection on its monotone pieces, so the cost does not
// grow with `rounds`.  Once agreement holds with both values non-negative (and S >= 0)
// it holds in every earlier round: the proposer can always pay the responder's
// discounted value and keep more than its own.
namespace {

constexpr int kDeadlinePhases = 256;  // phase changes before giving up (no_convergence)

struct Deadline {
    double S;
    double d[2], om[2], ld[2];  // factors, 1 - factors and logs, [A, B]; A proposes in odd rounds
    double omA, omB, one_minus_q, log_q;

    static int proposer(int64_t t) { return (t % 2 == 1) ? 0 : 1; }

    // Proposer value at round r <= s given proposer value Fs at round s and agreement in
    // every round r..s (same parity as s).
    double back_same(int64_t s, double Fs, int64_t r) const {
        if (one_minus_q == 0.0) return Fs;  // both factors 1: the values just alternate
        const int X = proposer(r);
        const double star = rub_opener(S, X == 0 ? omB : omA, one_minus_q);
        return star + pow_count(log_q, static_cast<double>((s - r) / 2)) * (Fs - star);
    }
    // Proposer value at any round r <= t, agreement in every round r..t, given the
    // proposer's value Ft and the responder's Yt = S - Ft in round t.  One step back is
    // S - d Ft = S (1 - d) + d Yt, formed without cancellation when it is small.
    double F_at(int64_t t, double Ft, double Yt, int64_t r) const {
        if ((t - r) % 2 == 0) return back_same(t, Ft, r);
        const int R = proposer(t);  // the responder of round t-1
        const double Ft1 = S * om[R] + d[R] * Yt;
        return back_same(t - 1, Ft1, r);
    }
    // Whether round r agrees given agreement in round r+1 with proposer value F (weak).
    bool agrees_after(int64_t r, double F) const {
        const int P = proposer(r), R = 1 - P;  // R proposes in round r + 1
        return S - d[R] * F >= d[P] * (S - F);
    }
    // Discounting a value over k rounds: v d^k.
    double disc(int i, double v, double k) const {
        if (v == 0.0 || k == 0.0) return v;
        return v * pow_count(ld[i], k);
    }
};

// Largest index in [lo, hi] where pred holds, given pred(lo) and pred is true on a prefix
// [lo, x] and false after it.
template <class Pred>
int64_t last_true(int64_t lo, int64_t hi, Pred &&pred) {
    while (lo < hi) {
        const int64_t mid = lo + (hi - lo + 1) / 2;
        if (pred(mid))
            lo = mid;
        else
            hi = mid - 1;
    }
    return lo;
}

}  // namespace

namespace {

// Backward induction from round `rounds` down to round 1, state and steps.  Values v are
// those of A (index 0) and B at the date of round t.
struct Run {
    const Deadline &g;
    const double *b;  // deadline payoffs [A, B]
    int own;          // 0 when own is A
    int64_t t = 0;
    double v[2] = {0.0, 0.0};
    bool agreed = false;  // (weak) agreement in round t
    bool ever = false;    // a strict gain from agreement somewhere on the path from round t
    double *out;
    int *bad;

    Run(const Deadline &game, const double *payoffs, int own_index, double *o, int *bd)
        : g(game), b(payoffs), own(own_index), out(o), bad(bd) {}

    // Round T: the proposer keeps S - b_R if that beats b_P.
    void last_round(int64_t T) {
        t = T;
        const int P = Deadline::proposer(t), R = 1 - P;
        agreed = ever = exceeds(g.S, b[R], b[P]);
        v[P] = agreed ? g.S - b[R] : b[P];
        v[R] = b[R];
    }
    // One explicit round back: t -> t - 1.  After an agreeing round the responder's value
    // there is S minus the proposer's, so the new proposer's value S - d_R v_R is formed as
    // S (1 - d_R) + d_R v_P: no cancellation when the new proposer's share is tiny.
    void step() {
        --t;
        const int P = Deadline::proposer(t), R = 1 - P;
        const double cR = g.d[R] * v[R], cP = g.d[P] * v[P];
        const double keep = agreed ? g.S * g.om[R] + g.d[R] * v[P] : g.S - cR;
        const bool strict = keep > cP;
        agreed = keep >= cP;
        v[P] = agreed ? keep : cP;
        v[R] = cR;
        ever = ever || strict;
    }
    int done(double value, bool deal) const {
        if (!std::isfinite(value)) return invalid_at(5, out, bad);
        return status_only(deal ? CTO_OK : CTO_E_NO_DEAL, value, out, bad);
    }
    // Whether the next two rounds agree (explicit look-ahead on a copy).
    void look_ahead(bool *a1, bool *a2) const {
        Run c = *this;
        c.step();
        *a1 = c.agreed;
        *a2 = false;
        if (c.t > 1) {
            c.step();
            *a2 = c.agreed;
        }
    }
    void alternating_phase();
    int agreement_phase();
    int disagreement_phase();
    int solve(int64_t rounds);
};

// Alternating phase: round t-1 refuses, round t-2 agrees, and so on in cycles of two
// rounds.  With X proposing in round t and Y in t-1, after j cycles v_Y = d_Y^(2j) v_Y(0)
// and v_X = S - v_Y; whether cycle j keeps the pattern is affine in d_Y^(2j), so the
// cycles that do are a prefix found by bisection.
void Run::alternating_phase() {
    const int X = Deadline::proposer(t), Y = 1 - X;
    const double S = g.S, vY0 = v[Y];
    const int64_t J = (t - 1) / 2;
    auto cycle_ok = [&](int64_t j) {
        const double y = g.disc(Y, vY0, static_cast<double>(2 * (j - 1)));
        const double x = S - y;  // j >= 2
        const bool refuse = S - g.d[X] * x < g.d[Y] * y;
        const bool agree = S - g.d[Y] * (g.d[Y] * y) >= g.d[X] * (g.d[X] * x);
        return refuse && agree;
    };
    int64_t jstar = 1;
    if (J >= 2 && cycle_ok(2)) jstar = last_true(2, J, cycle_ok);
    // Take cycle 1 explicitly (it uses v_X(0)), then jump the rest.
    step();
    step();
    if (jstar > 1) {
        const double y = g.disc(Y, v[Y], static_cast<double>(2 * (jstar - 1)));
        v[Y] = y;
        v[X] = S - y;
        t -= 2 * (jstar - 1);
        agreed = true;  // cycle 1, taken explicitly, already recorded any strict gain
    }
}

// Agreement in rounds t and t-1: find the first round r < t (counting down) where
// agreement fails, bisecting each parity class (monotone in the number of cycles), and
// jump there; or, with agreement down to round 1, finish.  Returns a status when done,
// -1 to go on.
int Run::agreement_phase() {
    const double S = g.S, Ft = v[Deadline::proposer(t)], Yt = v[1 - Deadline::proposer(t)];
    int64_t r_fail = 0;
    const bool absorbing = v[0] >= 0.0 && v[1] >= 0.0 && S >= 0.0;
    if (!absorbing) {
        for (int64_t first = t - 1; first >= t - 2 && first >= 1; --first) {
            // rounds r = first, first - 2, ...: agreement after F at r + 1
            auto ok_at = [&](int64_t m) {
                const int64_t r = first - 2 * m;
                return g.agrees_after(r, g.F_at(t, Ft, Yt, r + 1));
            };
            if (!ok_at(0)) {
                r_fail = std::max(r_fail, first);
                continue;
            }
            const int64_t m_max = (first - 1) / 2;
            if (ok_at(m_max)) continue;  // agreement all the way down this class
            const int64_t m_ok = last_true(0, m_max, ok_at);
            r_fail = std::max(r_fail, first - 2 * (m_ok + 1));
        }
    }
    if (r_fail == 0) {
        // Agreement in every round down to round 1.
        const double F1 = g.F_at(t, Ft, Yt, 1);
        const double F2 = t >= 2 ? g.F_at(t, Ft, Yt, 2) : S - F1;
        if (!ever) ever = F1 > g.d[0] * (S - F2);  // a strict gain in round 1
        return done(own == 0 ? F1 : g.d[1] * F2, ever);
    }
    // Jump to round r_fail + 1 (still agreeing), then take the refusing round.
    const int64_t r1 = r_fail + 1;
    if (r1 < t) {
        const double F = g.F_at(t, Ft, Yt, r1);
        const int P = Deadline::proposer(r1);
        v[P] = F;
        v[1 - P] = S - F;
        t = r1;
    }
    step();
    return -1;
}

// Disagreement at round t-1: agreement returns at round t - k for the first k >= 1 with
// gap(k) = S - d_A^k v_A - d_B^k v_B >= 0, a constant minus two exponentials in k whose
// first difference changes sign at most once.  Returns a status when done, -1 to go on.
int Run::disagreement_phase() {
    const double S = g.S;
    if (v[0] >= 0.0 && v[1] >= 0.0 && S <= 0.0) {
        // Nothing to gain in any earlier round: the deadline payoffs, discounted.
        return done(g.disc(own, v[own], static_cast<double>(t - 1)), ever);
    }
    const double vA = v[0], vB = v[1];
    auto gap = [&](int64_t k) {
        const double kk = static_cast<double>(k);
        return S - g.disc(0, vA, kk) - g.disc(1, vB, kk);
    };
    const int64_t K = t - 1;
    int64_t k = -1;
    if (gap(1) >= 0.0) {
        k = 1;
    } else if (K > 1) {
        // The first difference changes sign at most once: split at its turn.
        auto rising = [&](int64_t j) { return gap(j + 1) >= gap(j); };
        const bool r0 = rising(1);
        int64_t turn = K;
        if (K > 2 && rising(K - 1) != r0)
            turn = last_true(1, K - 1, [&](int64_t j) { return rising(j) == r0; }) + 1;
        // Piece 1 is [1, turn]; piece 2 is [turn, K]; gap(1) < 0.
        auto first_nonneg = [&](int64_t lo, int64_t hi) {  // gap increasing on [lo, hi]
            if (gap(hi) < 0.0) return int64_t(-1);
            return last_true(lo, hi, [&](int64_t j) { return gap(j) < 0.0; }) + 1;
        };
        if (r0) {
            k = first_nonneg(1, turn);  // increasing first; then decreasing, stays below
        } else if (turn < K) {
            k = first_nonneg(turn, K);  // decreasing first (stays below), then increasing
        }
    }
    if (k < 0) {
        // No agreement in any earlier round: round-1 values are discounted.
        return done(g.disc(own, v[own], static_cast<double>(K)), ever);
    }
    // Rounds t-1 .. t-k+1 refuse; jump to round t - k + 1, then take round t - k.
    const double kk = static_cast<double>(k - 1);
    v[0] = g.disc(0, vA, kk);
    v[1] = g.disc(1, vB, kk);
    if (k > 1) agreed = false;  // round t - k + 1 refuses
    t -= k - 1;
    step();
    return -1;
}

int Run::solve(int64_t rounds) {
    last_round(rounds);
    for (int phase = 0; t > 1; ++phase) {
        if (phase > kDeadlinePhases) return status_only(CTO_E_NO_CONVERGENCE, kNaN, out, bad);
        if (!std::isfinite(v[0]) || !std::isfinite(v[1])) return invalid_at(5, out, bad);
        // Every value and the surplus below 2^-1000: the pattern is decided by rounding in
        // subnormal arithmetic (slow and meaningless), so say so instead of guessing.
        if (phase > 8 && std::fabs(g.S) < 0x1p-1000 && std::fabs(v[0]) < 0x1p-1000 &&
            std::fabs(v[1]) < 0x1p-1000)
            return status_only(CTO_E_NO_CONVERGENCE, kNaN, out, bad);
        bool a1, a2;
        look_ahead(&a1, &a2);
        int st = -1;
        if (a1 && !agreed) {
            step();  // agreement starts in the next round: take it, then run the phase
        } else if (!a1 && a2 && t > 2) {
            alternating_phase();
        } else if (agreed && a1) {
            st = agreement_phase();
        } else {
            st = disagreement_phase();
        }
        if (st >= 0) return st;
    }
    return done(v[own], ever);
}

// The induction on factors d (with 1 - d given without cancellation), deadline payoffs
// b and surplus S, own proposing first when own_opens.
int deadline_core(const double d[2], const double om[2], int64_t rounds, const double b[2],
                  double S, bool own_opens, double *out, int *bad) {
    Deadline g;
    g.S = S;
    for (int i = 0; i < 2; ++i) {
        const int k = own_opens ? i : 1 - i;  // A is the opener
        g.d[i] = d[k];
        g.om[i] = om[k];
        g.ld[i] = d[k] > 0.5 ? std::log1p(-om[k]) : std::log(d[k]);
    }
    g.omA = g.om[0];
    g.omB = g.om[1];
    g.one_minus_q = rub_den(g.d[0], g.omA, g.omB);
    g.log_q = std::log1p(-g.one_minus_q);
    const double bb[2] = {own_opens ? b[0] : b[1], own_opens ? b[1] : b[0]};
    Run run(g, bb, own_opens ? 0 : 1, out, bad);
    return run.solve(rounds);
}

// Validation shared by the two entry points; returns -1 when the inputs are valid.
int deadline_check(double own_factor, double other_factor, int64_t rounds, double own_fallback,
                   double other_fallback, double surplus, double *out, int *bad) {
    Check c;
    c.unit(own_factor, 0);
    c.unit(other_factor, 1);
    if (rounds < 0) c.fail(2);
    c.real(own_fallback, 3);
    c.real(other_fallback, 4);
    c.real(surplus, 5);
    if (!c.ok()) return invalid(c, out, bad);
    return -1;
}

}  // namespace

int deadline_share(double own_factor, double other_factor, int64_t rounds, double own_fallback,
                   double other_fallback, double surplus, bool own_opens, double *out,
                   int *bad) {
    const int pre = deadline_check(own_factor, other_factor, rounds, own_fallback,
                                   other_fallback, surplus, out, bad);
    if (pre >= 0) return pre;
    if (rounds == 0) return status_only(CTO_E_NO_DEAL, own_fallback, out, bad);
    const double d[2] = {own_factor, other_factor};
    const double om[2] = {1.0 - own_factor, 1.0 - other_factor};
    const double b[2] = {own_fallback, other_fallback};
    return deadline_core(d, om, rounds, b, surplus, own_opens, out, bad);
}

int deadline_share_breakdown(double own_factor, double other_factor, int64_t rounds,
                             double own_fallback, double other_fallback, double surplus,
                             bool own_opens, double p, double *out, int *bad) {
    int pre = deadline_check(own_factor, other_factor, rounds, own_fallback, other_fallback,
                             surplus, out, bad);
    if (pre < 0 && !(p >= 0.0 && p <= 1.0)) pre = invalid_at(7, out, bad);
    if (pre >= 0) return pre;
    if (p == 0.0)
        return deadline_share(own_factor, other_factor, rounds, own_fallback, other_fallback,
                              surplus, own_opens, out, bad);
    if (rounds == 0) return status_only(CTO_E_NO_DEAL, own_fallback, out, bad);
    // After a rejection talks break down with chance p (the deadline payoffs at once),
    // else the next round comes, discounted: a responder's value of rejecting is
    // p b + (1-p) d v = (1 - a) d0 + a v with a = (1-p) d and d0 = p b / (1 - a).  Above
    // d0 this is the model without breakdown on factors a, deadline payoffs b - d0 (paid
    // at the last rejection either way) and surplus S - d0_own - d0_oth.
    const double q1 = 1.0 - p;
    const double a[2] = {q1 * own_factor, q1 * other_factor};
    const double om[2] = {p + q1 * (1.0 - own_factor), p + q1 * (1.0 - other_factor)};
    const double d0[2] = {(p / om[0]) * own_fallback, (p / om[1]) * other_fallback};
    const double b[2] = {own_fallback - d0[0], other_fallback - d0[1]};
    const double Sp = (surplus - d0[0]) - d0[1];
    if (!std::isfinite(Sp) || !std::isfinite(b[0]) || !std::isfinite(b[1]))
        return invalid_at(5, out, bad);
    const int st = deadline_core(a, om, rounds, b, Sp, own_opens, out, bad);
    if (st == CTO_OK || st == CTO_E_NO_DEAL) {
        *out += d0[0];
        if (!std::isfinite(*out)) return invalid_at(5, out, bad);
    }
    return st;
}

}  // namespace cto::core
