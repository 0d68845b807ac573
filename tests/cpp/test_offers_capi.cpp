// Repeated offers through the C ABI: the rows entry point, the totals-only entry point and
// the scalar functions agree with each other; the two-round case against the 50-digit
// reference row of tests/reference/private/offer_path.csv (backward induction by first-
// order conditions; docs/models/private-information.md s.2.2: P(agreement) = 15/26, opening offer
// 0.465384615..., E[round | agreement] = 1.7333...).
#include <catch2/catch.hpp>

#include <cmath>
#include <vector>

#include "counteroffer/counteroffer.h"

TEST_CASE("offers through the C ABI: rows, totals and scalars agree", "[offers_capi]") {
    std::vector<cto_offer_row> rows(8);
    cto_offer_outcome t;
    t.size = sizeof t;
    REQUIRE(cto_offer_path_rows(0, 1, 0.9, 0.9, 2, 0, CTO_OFFERER_SELLER, rows.data(), 8, &t) ==
            CTO_OK);
    CHECK(t.rows_written == 2);
    CHECK(t.rounds_used == 2);
    CHECK(t.agreement_probability == Approx(15.0 / 26.0).epsilon(1e-14));
    CHECK(t.opening_offer == Approx(0.4653846153846153896737972).epsilon(1e-14));
    CHECK(t.expected_round == Approx(1.73333333333333337280793).epsilon(1e-14));
    CHECK(rows[0].offer == t.opening_offer);
    CHECK(rows[1].cumulative_probability == Approx(t.agreement_probability).epsilon(1e-15));
    CHECK(rows[0].round_probability + rows[1].round_probability ==
          Approx(t.agreement_probability).epsilon(1e-15));
    // The totals-only entry point and the scalars: the same numbers.
    cto_offer_outcome u;
    u.size = sizeof u;
    REQUIRE(cto_offer_path(0, 1, 0.9, 0.9, 2, 0, CTO_OFFERER_SELLER, &u) == CTO_OK);
    CHECK(u.agreement_probability == t.agreement_probability);
    CHECK(u.rows_written == 0);
    double v = NAN;
    REQUIRE(cto_agreement_probability(0, 1, 0.9, 0.9, 2, 0, CTO_OFFERER_SELLER, &v) == CTO_OK);
    CHECK(v == t.agreement_probability);
    REQUIRE(cto_expected_agreement_round(0, 1, 0.9, 0.9, 2, 0, CTO_OFFERER_SELLER, &v) == CTO_OK);
    CHECK(v == t.expected_round);
    REQUIRE(cto_opening_offer(0, 1, 0.9, 0.9, 2, 0, CTO_OFFERER_SELLER, &v) == CTO_OK);
    CHECK(v == t.opening_offer);
    // Through the table: the same totals, by name.
    const cto_function_info *f = cto_function_find("offer_path");
    REQUIRE(f != nullptr);
    const double args[7] = {0, 1, 0.9, 0.9, 2, 0, 0};
    std::vector<double> o(static_cast<size_t>(f->n_outputs));
    REQUIRE(cto_call(f->id, args, o.data(), nullptr) == CTO_OK);
    CHECK(o[0] == t.agreement_probability);
    CHECK(std::string(f->outputs[0].name) == "agreement_probability");
}

TEST_CASE("offers through the C ABI: a short buffer, no buffer, bad structs", "[offers_capi]") {
    // A buyer of value 1 buying from a seller whose cost is uniform on [0, 1] (the mirror
    // case, procurement): five offers, room for one row.
    cto_offer_row one[1];
    cto_offer_outcome t;
    t.size = sizeof t;
    REQUIRE(cto_offer_path_rows(0, 1, 0.9, 0.9, 5, 1, CTO_OFFERER_BUYER, one, 1, &t) == CTO_OK);
    CHECK(t.rows_written == 1);
    CHECK(t.rounds_used == 5);
    cto_offer_outcome n;
    n.size = sizeof n;
    REQUIRE(cto_offer_path_rows(0, 1, 0.9, 0.9, 5, 1, CTO_OFFERER_BUYER, nullptr, 5, &n) == CTO_OK);
    CHECK(n.rows_written == 0);
    CHECK(n.agreement_probability == t.agreement_probability);
    n.size = 8;
    CHECK(cto_offer_path_rows(0, 1, 0.9, 0.9, 5, 0, 0, nullptr, 0, &n) == CTO_E_INVALID);
    CHECK(cto_offer_path(0, 1, 0.9, 0.9, 5, 0, 0, nullptr) == CTO_E_INVALID);
    n.size = sizeof n;
    CHECK(cto_offer_path(1, 0, 0.9, 0.9, 5, 0, 0, &n) == CTO_E_INVALID);  // low above high
    CHECK(std::isnan(n.agreement_probability));
}

TEST_CASE("offers through the C ABI: a deadline beyond 10^7 offers is refused, not computed",
          "[offers_capi]") {
    // The path costs O(rounds); a cell must never hold Calc for minutes (the add-in's rule:
    // never hang Calc).  10^7 offers is the documented limit.
    double v = 0.0;
    int bad = -1;
    const cto_function_info *f = cto_function_find("agreement_probability");
    REQUIRE(f != nullptr);
    const double args[7] = {0, 1, 0.9, 0.9, 1e12, 0, 0};
    CHECK(cto_call(f->id, args, &v, &bad) == CTO_E_INVALID);
    CHECK(bad == 4);
    CHECK(cto_agreement_probability(0, 1, 0.9, 0.9, INT64_MAX, 0, 0, &v) == CTO_E_INVALID);
    CHECK(cto_agreement_probability(0, 1, 0.9, 0.9, 10000000, 0, 0, &v) == CTO_OK);
}
