// Repeated offers, the gap case: every type is worth serving (in gain units the values
// are uniform on [a, H] with a > 0), so the offerer can end the talks by offering a.
// There is no closed form; the stage functions are piecewise polynomial in the state
// (the highest remaining gain k): the cutoff C_n and the price P_n affine, the offerer's
// value W_n quadratic, on finitely many intervals of [a, H], and they are built exactly
// (derivation: docs/models/private-information.md s.2.4; the gap case of Fudenberg,
// Levine & Tirole 1985 and Gul, Sonnenschein & Wilson 1986, from memory).
//
// Stage n from stage n - 1 (n rounds left).  On a piece j = [l, r] of stage n - 1 the
// marginal responder's indifference gives the price for a cutoff x,
//     phi(x) = (1 - d_b) x + d_b P_(n-1)(x) = f0 + f1 x,
// and the offerer's objective (phi(x))(k - x) + d_s W_(n-1)(x) is a quadratic in x.  Its
// maximum over x in [l, min(r, k)] is at one of four candidates: x = l, x = r, x = k (no
// agreement this round), or the vertex when the quadratic is concave; each is feasible,
// so the largest candidate is the maximum.  A candidate's x is affine in k on an interval
// of k, and its value a quadratic in k.  The upper envelope of all candidates over [a, H]
// is found by a sweep: at each point the best candidate (ties: the one that grows faster,
// then the larger cutoff), then the first root where another quadratic overtakes it.
// Where P_(n-1) jumps at a breakpoint b, the candidates "x = r" of the left piece and
// "x = l" of the right piece both offer b; the envelope keeps the higher price (the top
// of the jump), which is the larger-cutoff tie rule of the previous stage.  On the path a
// state lands exactly on breakpoints (a constant cutoff stores the breakpoint itself) and
// takes the piece with the larger cutoff.
//
// Terminal stage: with a deadline, one round left: offer max(a, k/2); no deadline: the
// forced stage "offer a to all", and stages are added until two in a row are the same
// functions on [a, H]: that stage is the stationary equilibrium (the gap game ends in
// finitely many rounds, so the forced end stops mattering), and it serves every round.
// With a deadline, once two stages agree every longer deadline uses the same stage.
//
// Work space: fixed arrays on the stack (about 220 KB).  The oldest stages are dropped
// when it is full; a path that needs a dropped stage, a stage with more than kMaxPieces
// pieces, more than kMaxBuilt stages or more than kMaxWork candidate evaluations (a gap
// that is tiny against the highest gain, with a patient offerer) reports no convergence.
#include <algorithm>
#include <cmath>

#include "offers.hpp"

namespace cto::core::offers_detail {

namespace {

constexpr int kMaxPieces = 160;    // per stage
constexpr int kArena = 2048;       // over all stages kept
constexpr int kMaxCand = 4 * kMaxPieces;
constexpr int kSlots = 400;        // stages kept (the oldest are dropped first)
constexpr int64_t kMaxBuilt = 20000;    // stages built before giving up
constexpr int64_t kMaxRounds = 1000000;  // rounds of a path without a deadline
constexpr int64_t kMaxWork = 200000000;  // candidate evaluations (about 0.3 s) per call

struct Piece {
    double r;        // right end; the left end is the previous piece's r (or a)
    double c0, c1;   // cutoff C(k) = c0 + c1 k
    double p0, p1;   // price P(k) = p0 + p1 k
    double w0, w1, w2;  // value W(k) = w0 + w1 k + w2 k^2
};
struct Cand {
    double s, e;     // the k-interval where the candidate is feasible
    double x0, x1;   // cutoff
    double g0, g1;   // price
    double v0, v1, v2;  // value
    double at(double k) const { return v0 + k * (v1 + k * v2); }
    double slope(double k) const { return v1 + 2.0 * v2 * k; }
};

struct Work {
    Piece arena[kArena];
    int off[kSlots + 1];  // slot i: arena[off[i], off[i + 1]); slot 0 is stage first_n
    int slots = 0;
    int64_t first_n = 1, last_n = 0;  // stages kept: first_n .. last_n
    int64_t widest = 0;               // most pieces in a stage built
    int64_t work = 0;                 // candidate evaluations so far
    Cand cand[kMaxCand];
    double ev[2 * kMaxCand + 2];
    Piece next[kMaxPieces + 1];
    double a = 0.0;  // the lowest state: states are gains above the gap, y in [0, H]
    double H;        // L, the spread of the types
    double ds, db;
    double gap;      // the gap a (prices are gap + the functions below)
    double lin;      // (1 - d_s) gap: what delaying the sure part of the sale costs
};

// Adds the candidate with cutoff x0 + x1 k on [s, e] for piece (f, w) of the last stage.
void add_cand(Work &w, int &m, double s, double e, double x0, double x1, double f0, double f1,
              const Piece &pc) {
    s = std::max(s, w.a);
    e = std::min(e, w.H);
    if (!(e > s) || m >= kMaxCand) return;
    Cand &c = w.cand[m++];
    c.s = s, c.e = e, c.x0 = x0, c.x1 = x1;
    c.g0 = f0 + f1 * x0, c.g1 = f1 * x1;
    const double h0 = -x0, h1 = 1.0 - x1;  // k - x
    const double wa = pc.w0 + x0 * (pc.w1 + pc.w2 * x0);
    const double wb = (pc.w1 + 2.0 * pc.w2 * x0) * x1, wc = pc.w2 * x1 * x1;
    c.v0 = c.g0 * h0 + w.ds * wa - w.lin * x0;
    c.v1 = (c.g0 * h1 + c.g1 * h0) + w.ds * wb - w.lin * x1;
    c.v2 = c.g1 * h1 + w.ds * wc;
}

// The vertex candidate of a concave piece: x = x0 + x1 k on the k where l <= x <= min(r, k).
void add_vertex(Work &w, int &m, double l, double r, double f0, double f1, const Piece &pc) {
    const double A = f1 - w.ds * pc.w2;
    if (!(A > 0.0)) return;
    const double x0 = (w.ds * pc.w1 - f0 - w.lin) / (2.0 * A), x1 = f1 / (2.0 * A);
    double s = w.a, e = w.H;
    if (x1 > 0.0) {
        s = std::max(s, (l - x0) / x1);
        e = std::min(e, (r - x0) / x1);
    } else if (!(x0 >= l && x0 <= r)) {
        return;
    }
    if (x1 < 1.0) s = std::max(s, x0 / (1.0 - x1));      // x <= k
    else if (x1 > 1.0) e = std::min(e, x0 / (1.0 - x1));
    else if (x0 > 0.0) return;
    add_cand(w, m, s, e, x0, x1, f0, f1, pc);
}

int make_candidates(Work &w) {
    int m = 0;
    const int i0 = w.off[w.slots - 1], i1 = w.off[w.slots];
    for (int i = i0; i < i1; ++i) {
        const Piece &pc = w.arena[i];
        const double l = i == i0 ? w.a : w.arena[i - 1].r, r = pc.r;
        const double f0 = w.db * pc.p0, f1 = (1.0 - w.db) + w.db * pc.p1;
        add_cand(w, m, l, w.H, l, 0.0, f0, f1, pc);  // everyone above l agrees now
        add_cand(w, m, r, w.H, r, 0.0, f0, f1, pc);  // everyone above r
        add_cand(w, m, l, r, 0.0, 1.0, f0, f1, pc);  // nobody agrees this round
        add_vertex(w, m, l, r, f0, f1, pc);
    }
    return m;
}

// Best candidate at k from the right among those feasible on [k, k1].
int best_at(const Work &w, int m, double k, double k1) {
    int b = -1;
    for (int j = 0; j < m; ++j) {
        const Cand &c = w.cand[j];
        if (!(c.s <= k && c.e >= k1)) continue;
        if (b < 0) {
            b = j;
            continue;
        }
        const Cand &B = w.cand[b];
        const double dv = c.at(k) - B.at(k), tol = 1e-14 * (1.0 + std::fabs(B.at(k)));
        if (dv > tol) b = j;
        else if (dv >= -tol) {  // equal here: the one larger just to the right
            const double dsl = c.slope(k) - B.slope(k), dcurv = c.v2 - B.v2;
            if (dsl > 1e-12) b = j;
            else if (dsl >= -1e-12) {
                if (dcurv > 1e-12) b = j;
                else if (dcurv >= -1e-12 && c.x0 + c.x1 * k > B.x0 + B.x1 * k) b = j;
            }
        }
    }
    return b;
}

// First k in (k0, k1) where a feasible candidate overtakes b (its difference crosses
// zero upwards); k1 when none.
double overtaken(const Work &w, int m, int b, double k0, double k1) {
    const Cand &B = w.cand[b];
    double first = k1;
    const double eps = 1e-15 * (1.0 + std::fabs(k0));
    for (int j = 0; j < m; ++j) {
        const Cand &c = w.cand[j];
        if (j == b || !(c.s <= k0 && c.e >= k1)) continue;
        const double d0 = c.v0 - B.v0, d1 = c.v1 - B.v1, d2 = c.v2 - B.v2;
        double roots[2];
        int nr = 0;
        if (d2 == 0.0) {
            if (d1 > 0.0) roots[nr++] = -d0 / d1;
        } else {
            const double disc = d1 * d1 - 4.0 * d2 * d0;
            if (disc < 0.0) continue;
            const double q = -0.5 * (d1 + std::copysign(std::sqrt(disc), d1));
            roots[nr++] = q / d2;
            if (q != 0.0) roots[nr++] = d0 / q;
        }
        for (int i = 0; i < nr; ++i) {
            const double rt = roots[i];
            if (rt > k0 + eps && rt < first && d1 + 2.0 * d2 * rt > 0.0) first = rt;
        }
    }
    return first;
}

// Appends the segment ending at `end` with candidate c to the new stage; false on overflow.
bool push_piece(Work &w, int &np, double end, const Cand &c) {
    const Piece p{end, c.x0, c.x1, c.g0, c.g1, c.v0, c.v1, c.v2};
    if (np > 0) {
        Piece &q = w.next[np - 1];
        if (q.c0 == p.c0 && q.c1 == p.c1 && q.p0 == p.p0 && q.p1 == p.p1 && q.w0 == p.w0 &&
            q.w1 == p.w1 && q.w2 == p.w2) {
            q.r = end;  // same functions: merge
            return true;
        }
    }
    if (np >= kMaxPieces) return false;
    w.next[np++] = p;
    return true;
}

void drop_oldest(Work &w) {
    const int d = w.off[1];
    std::copy(w.arena + d, w.arena + w.off[w.slots], w.arena);
    for (int i = 0; i < w.slots; ++i) w.off[i] = w.off[i + 1] - d;
    --w.slots;
    ++w.first_n;
}

// Stage n from the stored stage n - 1, stored as stage n (dropping the oldest stages
// when the work space is full).  False when a stage does not fit at all.
bool build_stage(Work &w) {
    const int m = make_candidates(w);
    int ne = 0;
    for (int j = 0; j < m; ++j) w.ev[ne++] = w.cand[j].s, w.ev[ne++] = w.cand[j].e;
    std::sort(w.ev, w.ev + ne);
    int np = 0;
    for (int i = 0; i + 1 < ne; ++i) {
        const double u0 = w.ev[i], u1 = w.ev[i + 1];
        if (!(u1 > u0)) continue;
        double k = u0;
        for (int guard = 0; guard < 4 * kMaxCand; ++guard) {
            w.work += 2 * m;
            if (w.work > kMaxWork) return false;
            const int b = best_at(w, m, k, u1);
            if (b < 0) return false;
            const double next = overtaken(w, m, b, k, u1);
            if (!push_piece(w, np, next, w.cand[b])) return false;
            if (!(next < u1)) break;
            k = next;
        }
    }
    if (np == 0) return false;
    while (w.slots > 0 && (w.slots + 1 > kSlots || w.off[w.slots] + np > kArena)) drop_oldest(w);
    if (w.off[w.slots] + np > kArena) return false;
    w.next[np - 1].r = w.H;
    std::copy(w.next, w.next + np, w.arena + w.off[w.slots]);
    ++w.slots;
    w.off[w.slots] = w.off[w.slots - 1] + np;
    ++w.last_n;
    w.widest = std::max<int64_t>(w.widest, np);
    return true;
}

// One round left: offer the gap to all (y <= gap), or (gap + y)/2, i.e. gap + (y - gap)/2,
// with value (y - gap)^2/4 above the sure part gap x y.  Forced: the gap to all.
void first_stage(Work &w, bool forced) {
    const double g = w.gap, H = w.H;
    int np = 0;
    if (forced || g >= H) {
        w.arena[np++] = {H, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0};
    } else {
        w.arena[np++] = {g, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0};
        w.arena[np++] = {H, -0.5 * g, 0.5, -0.5 * g, 0.5, 0.25 * g * g, -0.5 * g, 0.25};
    }
    w.slots = 1;
    w.off[0] = 0;
    w.off[1] = np;
    w.first_n = w.last_n = 1;
    w.widest = np;
}

// Whether the last two stages are the same functions (then every later one is too).
bool same_stage(const Work &w) {
    if (w.slots < 2) return false;
    const int a0 = w.off[w.slots - 1], a1 = w.off[w.slots], b0 = w.off[w.slots - 2], b1 = a0;
    if (a1 - a0 != b1 - b0) return false;
    for (int i = 0; i < a1 - a0; ++i) {
        const Piece &p = w.arena[a0 + i], &q = w.arena[b0 + i];
        const double d[] = {p.r - q.r, p.c0 - q.c0, p.c1 - q.c1, p.p0 - q.p0,
                            p.p1 - q.p1, p.w0 - q.w0, p.w1 - q.w1, p.w2 - q.w2};
        const double m[] = {p.r, p.c0, p.c1, p.p0, p.p1, p.w0, p.w1, p.w2};
        for (int j = 0; j < 8; ++j)
            if (std::fabs(d[j]) > 1e-15 * std::max(1.0, std::fabs(m[j]))) return false;
    }
    return true;
}

// The piece of stage n holding k; at a breakpoint, the one with the larger cutoff.
// nullptr when stage n was dropped.
const Piece *lookup(const Work &w, int64_t n, double k) {
    if (n < w.first_n || n > w.last_n) return nullptr;
    const int slot = static_cast<int>(n - w.first_n), i0 = w.off[slot], i1 = w.off[slot + 1];
    const Piece *best = nullptr;
    double left = w.a;
    for (int i = i0; i < i1; ++i) {
        const Piece &p = w.arena[i];
        if (k >= left && k <= p.r) {
            if (!best || p.c0 + p.c1 * k > best->c0 + best->c1 * k) best = &p;
        }
        left = p.r;
    }
    return best ? best : (k < w.a ? &w.arena[i0] : &w.arena[i1 - 1]);
}

// The path from the top state H: round t uses stage stage_of(t).  Rows (in gain units)
// go to rows[0, cap); the totals are summed with the output formulas.
struct Walk {
    bool ok = true;  // false: a stage needed was dropped, or the path did not end
    int64_t rounds = 0, used = 0;
    double mass = 0, round_sum = 0, disc_mass = 0, offerer = 0, responder = 0;
    double first = kNaN, last = kNaN;  // prices and states above the gap
};

template <class StageOf>
Walk walk(const Work &w, double len, int64_t limit, StageOf stage_of, OfferRow *rows,
          int64_t cap) {
    Walk r;
    double k = w.H, dso = 1.0, dbo = 1.0;
    for (int64_t t = 1; t <= limit; ++t) {
        const Piece *found = lookup(w, stage_of(t), k);
        if (!found) {
            r.ok = false;
            return r;
        }
        const Piece &pc = *found;
        const double price = pc.p0 + pc.p1 * k;
        double kn = std::min(k, pc.c0 + pc.c1 * k);
        if (kn - w.a <= 1e-12 * len) kn = w.a;  // every type has agreed
        const double pi = (k - kn) / len;
        if (t == 1) r.first = price;
        r.mass += pi;
        r.round_sum += static_cast<double>(t) * pi;
        r.disc_mass += dso * pi;    // the sure part: gap x discounted mass
        r.offerer += dso * price * pi;
        r.responder += dbo * pi * (0.5 * (k + kn) - price);
        if (t <= cap) rows[t - 1] = {price, kn, pi, std::min(r.mass, 1.0)};
        r.rounds = t;
        if (pi > 0.0) r.used = t;
        dso *= w.ds;
        dbo *= w.db;
        k = kn;
        if (k == w.a) break;
    }
    r.last = k;
    return r;
}

// Totals in money (gain units of the canonical problem): the offerer's value is the sure
// part, gap x the discounted mass, plus the scaled margin above the gap.
void totals(const Walk &r, const Work &w, int64_t cap, double S, double gap, OfferTotals *o) {
    o->regime = kPathGap;
    o->rounds_used = r.used;
    o->rows_written = std::min(r.used, cap);
    o->stages = w.last_n;
    o->pieces = w.widest;
    o->agreement_probability = std::min(r.mass, 1.0);
    o->expected_round = r.round_sum / r.mass;
    o->offerer_value = gap * r.disc_mass + S * r.offerer;
    o->responder_value = S * r.responder;
    o->opening_offer = S * r.first;
    o->last_cutoff = S * r.last;
}

int finite_gap(Work &w, double len, int64_t T, OfferRow *rows, int64_t cap, double S,
               double gap, OfferTotals *o) {
    first_stage(w, false);
    while (w.last_n < T && !same_stage(w)) {
        if (w.last_n >= kMaxBuilt || !build_stage(w)) return CTO_E_NO_CONVERGENCE;
    }
    const int64_t top = w.last_n;  // stationary from here on, or T
    auto stage_of = [&](int64_t t) { return std::min(T - t + 1, top); };
    const Walk r = walk(w, len, T, stage_of, rows, cap);
    if (!r.ok) return CTO_E_NO_CONVERGENCE;
    totals(r, w, cap, S, gap, o);
    return CTO_OK;
}

// No deadline: forced terminal stage; stages are built until two in a row are the same
// functions; that stage is then the stationary equilibrium and serves every round.
int endless_gap(Work &w, double len, OfferRow *rows, int64_t cap, double S, double gap,
                OfferTotals *o) {
    first_stage(w, true);
    do {
        if (w.last_n >= kMaxBuilt || !build_stage(w)) return CTO_E_NO_CONVERGENCE;
    } while (!same_stage(w));
    const int64_t N = w.last_n;
    const Walk r = walk(w, len, kMaxRounds, [&](int64_t) { return N; }, rows, cap);
    if (!r.ok || r.last != w.a) return CTO_E_NO_CONVERGENCE;
    totals(r, w, cap, S, gap, o);
    return CTO_OK;
}

}  // namespace

int gap_path(const Canon &p, OfferRow *rows, int64_t cap, OfferTotals *o) {
    // States, cutoffs and offers are measured above the gap (y = gain - a in [0, L]), so a
    // spread that is tiny against the gap keeps its digits; scaled by a power of two.
    int e = 0;
    (void)std::frexp(p.len, &e);
    const double S = std::ldexp(1.0, std::min(e, 1023));  // exact: L / S in (1/2, 1]
    if (p.rounds == 0 && p.db == 1.0) {  // patient responder: offer the gap to all at once
        o->regime = kPathClosed;
        o->rounds_used = 1;
        o->rows_written = std::min<int64_t>(1, cap);
        if (cap > 0) rows[0] = {0.0, 0.0, 1.0, 1.0};
        o->agreement_probability = o->expected_round = 1.0;
        o->offerer_value = p.a;
        o->opening_offer = o->last_cutoff = 0.0;
        o->responder_value = 0.5 * p.len;
        return CTO_OK;
    }
    Work w;
    w.H = p.len / S, w.ds = p.ds, w.db = p.db;
    w.gap = std::min(p.a / S, 1e300);  // beyond that the sure part decides alone
    w.lin = (1.0 - p.ds) * w.gap;
    const double len = w.H;
    const int st = p.rounds > 0 ? finite_gap(w, len, p.rounds, rows, cap, S, p.a, o)
                                : endless_gap(w, len, rows, cap, S, p.a, o);
    if (st != CTO_OK) return st;
    for (int64_t t = 0; t < o->rows_written; ++t) rows[t].offer *= S, rows[t].cutoff *= S;
    return CTO_OK;
}

}  // namespace cto::core::offers_detail
