// Repeated offers checked against the game itself:
//  - responders choose their best round: for 400,000 types on a midpoint grid, each type
//    compares d_r^(t-1) x (its gain at the offer of round t) over the computed path and
//    agrees in its best round (indifferent types agree; the method of the Monte Carlo
//    over buyer types that confirmed the check values of test_offers_published.cpp, on a
//    grid instead of random draws); the shares per round, the agreement probability, the
//    expected round
//    and both values must match the library's totals;
//  - the offerer's best response in the two-round game, solved by brute force in the
//    mirror case's own terms (a buyer offering to sellers of unknown cost: the marginal
//    cost is indifferent between the two offers; the last offer maximises the buyer's
//    margin on the remaining costs), without the reduction the library uses;
//  - mirror symmetry (a fact of the model: reversing money maps one case onto the other),
//    probabilities in [0, 1] and monotone cumulative probabilities on random inputs.
#include <catch2/catch.hpp>

#include <algorithm>
#include <cmath>
#include <random>
#include <vector>

#include "models/offers.hpp"

using namespace cto::core;

namespace {

struct Path {
    int status;
    OfferTotals t;
    std::vector<OfferRow> rows;
};

Path run(double lo, double hi, double ds, double db, int64_t T, double known, int who, int64_t cap) {
    Path p;
    p.rows.resize(static_cast<size_t>(cap));
    p.status = offer_path(lo, hi, ds, db, T, known, who, p.rows.data(), cap, &p.t, nullptr);
    return p;
}

// Each responder type picks its best round on the path; returns the aggregate outcome.
struct Choice {
    std::vector<double> share;  // per round
    double agree = 0, round = 0, offerer = 0, responder = 0;
};
Choice choose(const Path &p, double lo, double hi, double ds, double db, double known, int who) {
    const size_t R = static_cast<size_t>(p.t.rows_written);
    Choice c;
    c.share.assign(R, 0.0);
    const int N = 400000;
    std::vector<double> dr(R), dofr(R);
    for (size_t t = 0; t < R; ++t) {
        dr[t] = std::pow(db, static_cast<double>(t));
        dofr[t] = std::pow(ds, static_cast<double>(t));
    }
    for (int i = 0; i < N; ++i) {
        const double x = lo + (hi - lo) * (i + 0.5) / N;  // value (seller offers) or cost
        double best = 0.0;
        size_t at = R;
        for (size_t t = 0; t < R; ++t) {
            const double gain = who == kOffererSeller ? x - p.rows[t].offer : p.rows[t].offer - x;
            const double v = dr[t] * gain;
            if (gain >= 0 && (at == R ? v >= 0 : v > best)) best = v, at = t;
        }
        if (at == R) continue;
        c.share[at] += 1.0 / N;
        c.responder += best / N;
        const double margin = who == kOffererSeller ? p.rows[at].offer - known : known - p.rows[at].offer;
        c.offerer += dofr[at] * margin / N;
    }
    for (size_t t = 0; t < R; ++t) {
        c.agree += c.share[t];
        c.round += (static_cast<double>(t) + 1.0) * c.share[t];
    }
    c.round /= c.agree;
    return c;
}

void check_choice(double lo, double hi, double ds, double db, int64_t T, double known, int who) {
    const Path p = run(lo, hi, ds, db, T, known, who, T > 0 ? T : 400);  // 400: tail below 1e-40
    INFO("path " << lo << " " << hi << " " << ds << " " << db << " T=" << T << " known " << known
                 << " offerer " << who);
    REQUIRE(p.status == CTO_OK);
    const Choice c = choose(p, lo, hi, ds, db, known, who);
    const double scale = hi - lo;
    for (size_t t = 0; t < c.share.size(); ++t)
        CHECK(std::fabs(c.share[t] - p.rows[t].round_probability) <= 1e-5);
    CHECK(std::fabs(c.agree - p.t.agreement_probability) <= 1e-5);
    CHECK(std::fabs(c.round - p.t.expected_round) <= 1e-4 * p.t.expected_round);
    CHECK(std::fabs(c.offerer - p.t.offerer_value) <= 1e-5 * scale);
    CHECK(std::fabs(c.responder - p.t.responder_value) <= 1e-5 * scale);
}

// Two rounds, a buyer of value u offering to sellers of cost ~ U[lo, hi], solved in cost
// terms by brute force.  After a first offer q1 the costs below K agree, where K is
// indifferent: q1 - K = d_r (q2(K) - K); the last offer maximises (u - q)(q - K) on
// [K, hi]: q2(K) = min(hi, (u + K)/2).  Returns the buyer's value of q1.
double procurement_value(double lo, double hi, double dof, double dr, double u, double q1) {
    auto q2 = [&](double K) { return std::min(hi, std::max(K, 0.5 * (u + K))); };
    // Sellers of cost x agree at once iff q1 - x >= dr (q2(x) - x): true for low x.
    auto agrees = [&](double x) { return q1 - x >= dr * (q2(x) - x); };
    double a = lo, b = hi;
    double K;
    if (!agrees(lo)) K = lo;
    else if (agrees(hi)) K = hi;
    else {
        for (int i = 0; i < 200; ++i) {
            const double m = 0.5 * (a + b);
            (agrees(m) ? a : b) = m;
        }
        K = a;
    }
    const double L = hi - lo, q = q2(K);
    return (u - q1) * (K - lo) / L + dof * (u - q) * (q - K) / L;
}

}  // namespace

TEST_CASE("Responders choose their best round on the computed path", "[offers]") {
    check_choice(0, 1, 0.9, 0.9, 5, 0, kOffererSeller);        // check values F6-F10
    check_choice(10, 110, 0.9, 0.7, 6, 30, kOffererSeller);    // F18-F21, c > v_lo
    check_choice(0, 1, 0.9, 0.9, 0, 0, kOffererSeller);        // no deadline
    check_choice(0, 1, 0.95, 0.8, 12, 0, kOffererSeller);
    // The mirror case: sellers of unknown cost choose the best of the buyer's offers.
    check_choice(0, 1, 0.9, 0.9, 5, 1, kOffererBuyer);
    check_choice(40, 140, 0.8, 0.95, 7, 120, kOffererBuyer);   // u < hi: some never sell
    check_choice(40, 140, 0.9, 0.7, 0, 140, kOffererBuyer);
}

TEST_CASE("Mirror case: the buyer's opening offer beats every other (two rounds, brute force)", "[offers]") {
    const double cases[][5] = {{0, 1, 0.9, 0.9, 1}, {40, 140, 0.8, 0.95, 120}, {0, 1, 0.5, 0.2, 0.7},
                               {10, 20, 0.99, 0.99, 20}};
    for (const auto &c : cases) {
        const double lo = c[0], hi = c[1], dof = c[2], dr = c[3], u = c[4];
        INFO("case " << lo << " " << hi << " " << dof << " " << dr << " u=" << u);
        const Path p = run(lo, hi, dof, dr, 2, u, kOffererBuyer, 2);
        REQUIRE(p.status == CTO_OK);
        const double lib = procurement_value(lo, hi, dof, dr, u, p.t.opening_offer);
        CHECK(std::fabs(lib - p.t.offerer_value) <= 1e-12 * (hi - lo));
        double best = -INFINITY, arg = 0;
        for (int i = 0; i <= 20000; ++i) {
            const double q1 = lo + (u - lo) * i / 20000.0;
            const double v = procurement_value(lo, hi, dof, dr, u, q1);
            if (v > best) best = v, arg = q1;
        }
        CHECK(lib >= best - 1e-12 * (hi - lo));               // no grid offer does better
        CHECK(std::fabs(arg - p.t.opening_offer) <= 2e-4 * (hi - lo));  // and it is near
    }
}

TEST_CASE("Offer path properties on random inputs, mirror symmetry", "[offers]") {
    std::mt19937_64 rng(19830611);
    std::uniform_real_distribution<double> u(-1, 1), f(0, 1);
    for (int n = 0; n < 3000; ++n) {
        const double a = u(rng), b = u(rng), lo = std::min(a, b), hi = std::max(a, b);
        const double c = u(rng) * 0.5 + 0.5 * hi;  // often above lo: no gap
        const double ds = n % 9 == 0 ? 1.0 : f(rng), db = n % 7 == 0 ? 0.0 : f(rng);
        const int64_t T = n % 3 == 0 ? 0 : 1 + static_cast<int64_t>(f(rng) * 40);
        if (T == 0 && ds == 1.0) continue;
        if (c < lo) continue;  // the gap case has its own tests
        INFO("case " << lo << " " << hi << " " << ds << " " << db << " " << T << " " << c);
        const Path s = run(lo, hi, ds, db, T, c, kOffererSeller, 64);
        // Mirror: a buyer of value -c facing costs in [-hi, -lo] is the same game with money
        // reversed (offers and cutoffs change sign; probabilities and values are equal).
        const Path m = run(-hi, -lo, ds, db, T, -c, kOffererBuyer, 64);
        REQUIRE(s.status == m.status);
        if (s.status != CTO_OK) continue;
        CHECK(m.t.opening_offer == -s.t.opening_offer);
        CHECK(m.t.agreement_probability == s.t.agreement_probability);
        CHECK(m.t.offerer_value == s.t.offerer_value);
        CHECK(m.t.responder_value == s.t.responder_value);
        double prev = 0;
        for (int64_t t = 0; t < s.t.rows_written; ++t) {
            const OfferRow &r = s.rows[static_cast<size_t>(t)];
            CHECK(m.rows[static_cast<size_t>(t)].offer == -r.offer);
            CHECK(r.round_probability >= 0.0);
            CHECK(r.cumulative_probability <= 1.0);
            CHECK(r.cumulative_probability >= prev);
            CHECK(r.offer >= c);  // never below cost
            prev = r.cumulative_probability;
        }
        CHECK(s.t.agreement_probability >= 0.0);
        CHECK(s.t.agreement_probability <= 1.0 + 1e-15);
        CHECK(s.t.expected_round >= 1.0);
        CHECK(s.t.offerer_value >= 0.0);
        CHECK(s.t.responder_value >= 0.0);
        // Values never exceed the gains there are: E[(v - c)+] = (hi - c)^2 / (2 (hi - lo)).
        const double fb = (hi - c) * (hi - c) / (2 * (hi - lo));
        CHECK(s.t.offerer_value + s.t.responder_value <= fb * (1 + 1e-14));
    }
}
