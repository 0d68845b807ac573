// cto_solve and cto_solve_rates through their structs: a caller built against 1.0 (a
// smaller outcome struct) still works and nothing past its size is written; the appended
// fields are written for a full-size struct; the rate form equals cto_solve on the
// factors cto_round_factor gives (the same model; docs/models/combined.md).
#include <catch2/catch.hpp>

#include <cmath>
#include <cstddef>
#include <cstring>

#include "counteroffer/counteroffer.h"

namespace {

cto_solve_input deal() {
    cto_solve_input in;
    std::memset(&in, 0, sizeof in);
    in.size = sizeof in;
    in.own_factor = 0.97;
    in.other_factor = 0.95;
    in.breakdown_prob = 0.02;
    in.own_fallback = 10;
    in.other_fallback = 5;
    in.other_outside = 30;
    in.has_other_outside = 1;
    in.surplus = 100;
    in.own_opens = 1;
    return in;
}

}  // namespace

TEST_CASE("solve: a 1.0-sized outcome struct is accepted and not overrun", "[solve_capi]") {
    const cto_solve_input in = deal();
    unsigned char buf[sizeof(cto_solve_outcome)];
    std::memset(buf, 0xAB, sizeof buf);
    cto_solve_outcome *out = reinterpret_cast<cto_solve_outcome *>(buf);
    out->size = offsetof(cto_solve_outcome, delayed);  // the 1.0 layout ends here
    REQUIRE(cto_solve(&in, out) == CTO_OK);
    CHECK(std::isfinite(out->own_share));
    for (size_t i = offsetof(cto_solve_outcome, delayed); i < sizeof buf; ++i)
        CHECK(buf[i] == 0xAB);
    out->size = offsetof(cto_solve_outcome, delayed) - 1;
    CHECK(cto_solve(&in, out) == CTO_E_INVALID);
}

TEST_CASE("solve: the appended fields and the rate form", "[solve_capi]") {
    const cto_solve_input in = deal();
    cto_solve_outcome a;
    a.size = sizeof a;
    a.own_delay_loss = a.other_delay_loss = a.opening_advantage = NAN;
    REQUIRE(cto_solve(&in, &a) == CTO_OK);
    CHECK(std::isfinite(a.own_delay_loss));
    CHECK(std::isfinite(a.other_delay_loss));
    CHECK(std::isfinite(a.opening_advantage));
    CHECK((a.delayed == 0 || a.delayed == 1));

    // Rates and days that give the same factors through cto_round_factor.
    cto_solve_rates_input r;
    std::memset(&r, 0, sizeof r);
    r.size = sizeof r;
    r.own_rate = 0.10;
    r.other_rate = 0.25;
    r.days = 30;
    r.breakdown_prob = in.breakdown_prob;
    r.own_fallback = in.own_fallback;
    r.other_fallback = in.other_fallback;
    r.other_outside = in.other_outside;
    r.has_other_outside = 1;
    r.surplus = in.surplus;
    r.own_opens = 1;
    r.basis = 365;
    cto_solve_input f = in;
    REQUIRE(cto_round_factor(r.own_rate, r.days, r.basis, 0, &f.own_factor) == CTO_OK);
    REQUIRE(cto_round_factor(r.other_rate, r.days, r.basis, 0, &f.other_factor) == CTO_OK);
    cto_solve_outcome b, c;
    b.size = c.size = sizeof b;
    REQUIRE(cto_solve_rates(&r, &b) == CTO_OK);
    REQUIRE(cto_solve(&f, &c) == CTO_OK);
    CHECK(b.own_share == Approx(c.own_share).epsilon(1e-13));
    CHECK(b.other_share == Approx(c.other_share).epsilon(1e-13));
    CHECK(b.binding == c.binding);
    CHECK(b.deal_rational == c.deal_rational);
    // Bad input names nothing through the struct but gives invalid and NaN shares.
    r.days = -1;
    CHECK(cto_solve_rates(&r, &b) == CTO_E_INVALID);
    CHECK(std::isnan(b.own_share));
    CHECK(cto_solve_rates(nullptr, &b) == CTO_E_INVALID);
}
