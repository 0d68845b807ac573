// Repeated offers to a responder of unknown value (sections s.2.x are those of
// docs/models/private-information.md): check values F1-F23 (deadline) and I1-I18 (no
// deadline), 15 digits, from the recursion and closed forms at 50 digits, confirmed by
// numerical backward induction at 50 digits (Chebyshev collocation of every stage,
// first-order conditions by root finding; it does not use the recursion), without a
// deadline by one such stage applied to the stationary solution and by the recursion at
// T = 3000, and by a Monte Carlo of 4 x 10^6 buyer types choosing their best round on the
// path; the closed forms of s.2.2 and s.2.3 kept as an independent code path, the edge
// cases of s.2.6 with their statuses, and bad input.
//
// Sources beside each check: Sobel & Takahashi (1983) for the finite-horizon linear
// equilibrium; Stokey (1981), Gul, Sonnenschein & Wilson (1986) and Fudenberg & Tirole
// (1991) ch. 10 for the stationary one; Fudenberg, Levine & Tirole (1985) for the gap case
// (all from memory).  Values print 15 significant digits, so they
// are compared to 5e-15 relative (1e-15 where the value is exact).
#include <catch2/catch.hpp>

#include <cmath>
#include <vector>

#include "models/offers.hpp"

using namespace cto::core;

namespace {

double rel(double got, double want) {
    return want == 0.0 ? std::fabs(got) : std::fabs(got - want) / std::fabs(want);
}
constexpr double k15 = 5e-15;

#define CHECK_REL(got, want, tol)                              \
    do {                                                       \
        INFO(#got << " = " << (got) << ", want " << (want));   \
        CHECK(rel((got), (want)) <= (tol));                    \
    } while (0)

struct Path {
    int status;
    OfferTotals t;
    std::vector<OfferRow> rows;
};

Path seller_path(double lo, double hi, double ds, double db, int64_t T, double c, int64_t cap = 64) {
    Path p;
    p.rows.resize(static_cast<size_t>(cap));
    int bad = 99;
    p.status = offer_path(lo, hi, ds, db, T, c, kOffererSeller, p.rows.data(), cap, &p.t, &bad);
    if (p.status != CTO_E_INVALID) CHECK(bad == -1);
    return p;
}

}  // namespace

TEST_CASE("Offer path, finite deadline, no gap: check values F1-F23", "[offers][published]") {
    Path p = seller_path(0, 1, 0.9, 0.9, 1, 0);  // F1: T = 1, monopoly price (v_hi + c)/2
    CHECK_REL(p.rows[0].offer, 0.5, 1e-15);
    p = seller_path(0, 1, 0.9, 0.9, 2, 0);  // F2-F5
    REQUIRE(p.status == CTO_OK);
    CHECK_REL(p.t.opening_offer, 0.465384615384615, k15);
    CHECK_REL(p.rows[1].offer, 0.423076923076923, k15);
    CHECK_REL(p.t.agreement_probability, 0.576923076923077, k15);
    CHECK_REL(p.t.expected_round, 1.73333333333333, k15);
    p = seller_path(0, 1, 0.9, 0.9, 5, 0);  // F6-F10
    CHECK_REL(p.t.opening_offer, 0.385188673303304, k15);
    CHECK_REL(p.t.agreement_probability, 0.757187031189550, k15);
    CHECK_REL(p.t.expected_round, 3.10864988938172, k15);
    CHECK_REL(p.t.offerer_value, 0.192594336651652, k15);
    CHECK_REL(p.t.responder_value, 0.211108495022522, k15);
    p = seller_path(0, 1, 0.9, 0.9, 10, 0);  // F11-F13
    CHECK_REL(p.t.opening_offer, 0.307615227753177, k15);
    CHECK_REL(p.t.agreement_probability, 0.917727515832928, k15);
    CHECK_REL(p.t.expected_round, 4.07796877979888, k15);
    CHECK_REL(seller_path(0, 1, 0.95, 0.8, 5, 0).t.opening_offer, 0.488527683948160, k15);  // F14
    CHECK_REL(seller_path(0, 1, 0.8, 0.95, 5, 0).t.agreement_probability, 0.800519257642776, k15);  // F15
    CHECK_REL(seller_path(0, 1, 0.99, 0.5, 8, 0).t.offerer_value, 0.362926484085430, k15);  // F16
    CHECK_REL(seller_path(0, 1, 0.5, 0.99, 12, 0).t.opening_offer, 0.0188550646291472, k15);  // F17
    p = seller_path(10, 110, 0.9, 0.7, 6, 30);  // F18-F21: cost above the lowest value
    CHECK_REL(p.t.opening_offer, 69.2431572289441, k15);
    CHECK_REL(p.t.agreement_probability, 0.696604153374927, k15);
    CHECK_REL(p.t.offerer_value, 15.6972628915776, k15);
    CHECK_REL(p.t.responder_value, 9.97846811675731, k15);
    CHECK_REL(seller_path(0, 1, 0.9, 0, 4, 0).t.opening_offer, 0.732113144758735, k15);  // F22
    CHECK_REL(seller_path(0, 1, 0, 0.9, 4, 0).t.opening_offer, 0.128187500000000, k15);  // F23
}

TEST_CASE("Offer path, no deadline, no gap: check values I1-I18", "[offers][published]") {
    Path p = seller_path(0, 1, 0.9, 0.9, 0, 0);
    REQUIRE(p.status == CTO_OK);
    CHECK(p.t.rounds_used == -1);
    CHECK_REL(p.rows[0].cutoff, 0.759746926647958, k15);  // I1: mu
    CHECK_REL(p.t.opening_offer, 0.240253073352042, k15);  // I2: lambda
    CHECK_REL(p.t.offerer_value, 0.120126536676021, k15);  // I3
    CHECK_REL(p.t.responder_value, 0.319810194985968, k15);  // I4
    CHECK_REL(p.t.expected_round, 4.16227766016838, k15);  // I5
    p = seller_path(0, 1, 0.95, 0.8, 0, 0);
    CHECK_REL(p.rows[0].cutoff, 0.817256002368443, k15);  // I6
    CHECK_REL(p.t.opening_offer, 0.472135954999579, k15);  // I7
    CHECK_REL(p.t.responder_value, 0.171292114454936, k15);  // I8
    p = seller_path(0, 1, 0.8, 0.95, 0, 0);
    CHECK_REL(p.t.opening_offer, 0.100560403924040, k15);  // I9
    CHECK_REL(p.t.responder_value, 0.421284585601381, k15);  // I10
    CHECK_REL(seller_path(0, 1, 0.5, 0.5, 0, 0).t.opening_offer, 0.414213562373095, k15);  // I11
    p = seller_path(0, 1, 0.99, 0.99, 0, 0);
    CHECK_REL(p.t.expected_round, 11.0, 1e-15);  // I12
    CHECK_REL(p.t.responder_value, 0.431818181818182, k15);  // I13
    CHECK_REL(seller_path(0, 1, 0.9, 0, 0, 0).t.offerer_value, 0.379873463323979, k15);  // I14
    CHECK_REL(seller_path(0, 1, 0, 0.9, 0, 0).t.opening_offer, 0.0909090909090909, k15);  // I15
    p = seller_path(10, 110, 0.9, 0.7, 0, 30);
    CHECK_REL(p.t.opening_offer, 68.9466384404110, k15);  // I16
    CHECK_REL(p.t.offerer_value, 15.5786553761644, k15);  // I17
    CHECK_REL(p.t.responder_value, 10.1409105290182, k15);  // I18
    CHECK_REL(p.t.agreement_probability, 0.8, 1e-15);  // P(ever) = H/L (s.2.6)
}

TEST_CASE("Offer path closed forms of s.2.2 against the recursion", "[offers]") {
    // T = 2 (s.2.2): m_2 = (1 - d_b/2)/(2 - d_b - d_s/2), l_2 = (1 - d_b/2)^2/(2 - d_b - d_s/2).
    for (double ds : {0.0, 0.3, 0.9, 1.0}) {
        for (double db : {0.0, 0.5, 0.95, 1.0}) {
            const double den = 2 - db - ds / 2, m2 = (1 - db / 2) / den, l2 = (1 - db / 2) * m2;
            Path p = seller_path(2, 7, ds, db, 2, 2);  // H = 5
            INFO("ds " << ds << " db " << db);
            CHECK_REL(p.t.opening_offer, 2 + 5 * l2, 2e-15);
            CHECK_REL(p.rows[1].offer, 2 + m2 * 5 / 2, 2e-15);
        }
    }
    // d_b = 0 (myopic buyer): l_n = A_(n-1)/A_n, A_n = ((1+s)^(n+1) - (1-s)^(n+1))/(2s),
    // s = sqrt(1 - d_s); its values at 50 digits for d_s = 0.9, n = 2, 5 and
    // d_s = 0.99, n = 10: 0.645161290322581, 0.745657568238213, 0.884125002157506.
    const double want[] = {0.645161290322581, 0.745657568238213, 0.884125002157506};
    const double dss[] = {0.9, 0.9, 0.99};
    const int ns[] = {2, 5, 10};
    for (int i = 0; i < 3; ++i) {
        const double s = std::sqrt(1 - dss[i]);
        auto A = [&](int n) { return (std::pow(1 + s, n + 1) - std::pow(1 - s, n + 1)) / (2 * s); };
        CHECK_REL(A(ns[i] - 1) / A(ns[i]), want[i], k15);
        CHECK_REL(seller_path(0, 1, dss[i], 0, ns[i], 0).t.opening_offer, want[i], 1e-14);
    }
    // d_s = 0 (myopic seller): m_n = 1/2, l_n = l* + (d_b/2)^(n-1)(1/2 - l*),
    // l* = (1 - d_b)/(2 - d_b); special values 0.275, 0.107684375, 0.0107754313070552.
    const double wz[] = {0.275, 0.107684375, 0.0107754313070552};
    const double dbs[] = {0.9, 0.9, 0.99};
    for (int i = 0; i < 3; ++i) {
        const double ls = (1 - dbs[i]) / (2 - dbs[i]);
        CHECK_REL(ls + std::pow(dbs[i] / 2, ns[i] - 1) * (0.5 - ls), wz[i], k15);
        Path p = seller_path(0, 1, 0, dbs[i], ns[i], 0);
        CHECK_REL(p.t.opening_offer, wz[i], 1e-14);
        CHECK_REL(p.rows[0].cutoff, 0.5, 1e-15);
    }
}

TEST_CASE("Offer path, no deadline: stationary closed form of s.2.3", "[offers]") {
    // mu = 1/(1 + sqrt(1 - d_s)), lambda = (1 - d_b) mu/(1 - d_b mu); p_t = c + lambda mu^(t-1) H;
    // E[round | agreement] = 1/(1 - mu); seller value lambda H^2/(2L);
    // buyer value H^2 (1 - mu)((1 + mu)/2 - lambda)/((1 - d_b mu^2) L).
    for (double ds : {0.0, 0.5, 0.9, 0.999}) {
        for (double db : {0.0, 0.6, 0.99}) {
            const double mu = 1 / (1 + std::sqrt(1 - ds)), lam = (1 - db) * mu / (1 - db * mu);
            const double H = 80, L = 100;  // v in [10, 110], c = 30
            Path p = seller_path(10, 110, ds, db, 0, 30, 8);
            INFO("ds " << ds << " db " << db);
            CHECK_REL(p.t.opening_offer, 30 + lam * H, 1e-14);
            CHECK_REL(p.rows[3].offer, 30 + lam * std::pow(mu, 3) * H, 1e-13);
            CHECK_REL(p.t.expected_round, 1 / (1 - mu), 1e-13);
            CHECK_REL(p.t.offerer_value, lam * H * H / (2 * L), 1e-14);
            CHECK_REL(p.t.responder_value,
                      H * H * (1 - mu) * ((1 + mu) / 2 - lam) / ((1 - db * mu * mu) * L), 1e-13);
        }
    }
    // Coase limit (s.2.3): d = exp(-r Delta), r = 0.1, Delta = 1e-6: 1 - mu = 3.16128e-4,
    // expected calendar delay Delta/(1 - mu) = 3.16328e-3 (the closed form
    // 1 - mu = s/(1 + s), s = sqrt(1 - d), evaluated at 50 digits).
    const double d = std::exp(-0.1 * 1e-6);
    Path p = seller_path(0, 1, d, d, 0, 0, 1);
    CHECK(std::fabs(1 - p.rows[0].cutoff - 3.16128e-4) < 5e-10);
    CHECK(std::fabs(1e-6 * p.t.expected_round - 3.16328e-3) < 5e-9);
}

TEST_CASE("Offer path: the long deadline tends to no deadline (no gap)", "[offers]") {
    // s.2.3: l_T, m_T converge to lambda, mu as T grows (the deadline equilibria tend to
    // the stationary one).
    for (double ds : {0.5, 0.9, 0.97}) {
        for (double db : {0.0, 0.7, 0.95}) {
            const Path inf = seller_path(0, 1, ds, db, 0, 0, 4);
            const Path fin = seller_path(0, 1, ds, db, 4000, 0, 4);
            INFO("ds " << ds << " db " << db);
            CHECK_REL(fin.t.opening_offer, inf.t.opening_offer, 1e-13);
            CHECK_REL(fin.t.offerer_value, inf.t.offerer_value, 1e-13);
            CHECK_REL(fin.t.responder_value, inf.t.responder_value, 1e-13);
            CHECK_REL(fin.t.expected_round, inf.t.expected_round, 1e-12);
            CHECK_REL(fin.t.agreement_probability, inf.t.agreement_probability, 1e-13);
            CHECK_REL(fin.rows[3].offer, inf.rows[3].offer, 1e-13);
            // and a longer deadline serves more types (no gap: P(by T) increases in T)
            CHECK(seller_path(0, 1, ds, db, 5, 0).t.agreement_probability <
                  seller_path(0, 1, ds, db, 6, 0).t.agreement_probability);
        }
    }
}

TEST_CASE("Offer path edge cases of s.2.6 and their statuses", "[offers]") {
    // v_hi <= c: no type values the good above cost: no deal, probabilities and values 0.
    Path p = seller_path(0, 1, 0.9, 0.9, 3, 1.0);
    CHECK(p.status == CTO_E_NO_DEAL);
    CHECK(p.t.agreement_probability == 0.0);
    CHECK(p.t.offerer_value == 0.0);
    CHECK(p.t.responder_value == 0.0);
    CHECK(p.t.rows_written == 0);
    CHECK(std::isnan(p.t.expected_round));
    CHECK(std::isnan(p.t.opening_offer));
    double x = -1;
    CHECK(agreement_probability(0, 1, 0.9, 0.9, 3, 1.0, kOffererSeller, &x, nullptr) == CTO_E_NO_DEAL);
    CHECK(x == 0.0);
    // v_lo = v_hi: complete information, one offer at the value, accepted.
    p = seller_path(0.7, 0.7, 0.9, 0.9, 0, 0.2);
    CHECK(p.status == CTO_OK);
    CHECK(p.t.regime == kPathKnown);
    CHECK(p.rows[0].offer == 0.7);
    CHECK(p.rows[0].round_probability == 1.0);
    CHECK_REL(p.t.offerer_value, 0.5, 1e-15);
    CHECK(seller_path(0.7, 0.7, 0.9, 0.9, 0, 0.7).status == CTO_E_NO_DEAL);
    // d_b = 1 < d_s's complement, no deadline: price at cost at once, timing indeterminate;
    // seller value 0, buyer value E[(v - c)+] = H^2/(2L) (s.2.6).
    p = seller_path(0, 2, 0.9, 1.0, 0, 0.5);
    CHECK(p.status == CTO_E_INDETERMINATE);
    CHECK(p.t.offerer_value == 0.0);
    CHECK_REL(p.t.responder_value, 1.5 * 1.5 / 4, 1e-15);
    CHECK(p.t.opening_offer == 0.5);
    CHECK(std::isnan(p.t.expected_round));
    CHECK(opening_offer(0, 2, 0.9, 1.0, 0, 0.5, kOffererSeller, &x, nullptr) == CTO_E_INDETERMINATE);
    CHECK(std::isnan(x));
    // d_s = 1 with no deadline: the price never falls in finite time; rejected (index 2).
    int bad = -1;
    OfferTotals t;
    CHECK(offer_path(0, 1, 1.0, 0.9, 0, 0, kOffererSeller, nullptr, 0, &t, &bad) == CTO_E_INVALID);
    CHECK(bad == 2);
    // ... but a finite deadline is fine, even with both factors 1 (buyers wait to the end:
    // every earlier cutoff is the top, the last round is the one-round monopoly).
    p = seller_path(0, 1, 1.0, 1.0, 4, 0);
    CHECK(p.status == CTO_OK);
    CHECK(p.rows[0].round_probability == 0.0);
    CHECK_REL(p.rows[3].offer, 0.5, 1e-15);
    CHECK_REL(p.t.agreement_probability, 0.5, 1e-15);
    // T = 1: the monopoly price max(v_lo, (v_hi + c)/2) (no gap here: (1 + 0.2)/2).
    CHECK_REL(seller_path(0.1, 1, 0.9, 0.9, 1, 0.2).t.opening_offer, 0.6, 1e-15);
}

TEST_CASE("Offer path invalid input: status, argument index, NaN totals", "[offers]") {
    const double nan = NAN, inf = INFINITY;
    struct Bad {
        double lo, hi, ds, db;
        int64_t T;
        double c;
        int who, index;
    };
    const Bad cases[] = {
        {nan, 1, .9, .9, 2, 0, 0, 0},   {0, inf, .9, .9, 2, 0, 0, 1},  {1, 0, .9, .9, 2, 0, 0, 1},
        {0, 1, -.1, .9, 2, 0, 0, 2},    {0, 1, nan, .9, 2, 0, 0, 2},  {0, 1, .9, 1.1, 2, 0, 0, 3},
        {0, 1, .9, .9, -1, 0, 0, 4},    {0, 1, .9, .9, 2, nan, 0, 5}, {0, 1, .9, .9, 2, 0, 2, 6},
        {0, 1, .9, .9, 2, 0, -1, 6},    {0, 1, 1.0, .9, 0, 0, 1, 2},
        {-1.5e308, 1.5e308, .9, .9, 2, 0, 0, 1}, {0, 1e308, .9, .9, 2, -1e308, 0, 5},
        {1, 0, 2.0, .9, -3, nan, 7, 1},  // the first invalid argument is reported
    };
    for (const Bad &c : cases) {
        INFO("case " << c.lo << " " << c.hi << " " << c.ds << " " << c.db << " " << c.T << " "
                     << c.c << " " << c.who);
        OfferRow rows[3] = {{1, 1, 1, 1}, {1, 1, 1, 1}, {1, 1, 1, 1}};
        OfferTotals t;
        int bad = -7;
        CHECK(offer_path(c.lo, c.hi, c.ds, c.db, c.T, c.c, c.who, rows, 3, &t, &bad) == CTO_E_INVALID);
        CHECK(bad == c.index);
        CHECK(t.rows_written == 0);
        const double f[] = {t.agreement_probability, t.expected_round, t.offerer_value,
                            t.responder_value, t.opening_offer, t.last_cutoff};
        for (double v : f) CHECK(std::isnan(v));
        double x = 0;
        bad = -7;
        CHECK(agreement_probability(c.lo, c.hi, c.ds, c.db, c.T, c.c, c.who, &x, &bad) == CTO_E_INVALID);
        CHECK(bad == c.index);
        CHECK(std::isnan(x));
        CHECK(expected_agreement_round(c.lo, c.hi, c.ds, c.db, c.T, c.c, c.who, &x, &bad) == CTO_E_INVALID);
        CHECK(std::isnan(x));
        CHECK(opening_offer(c.lo, c.hi, c.ds, c.db, c.T, c.c, c.who, &x, &bad) == CTO_E_INVALID);
        CHECK(std::isnan(x));
    }
}
