// double_auction against the 50-digit reference table tests/reference/private/
// double_auction.csv, written by tests/reference/private/generate_private.py from methods
// independent of the polygon algorithm: Gauss-Legendre quadrature of the equilibrium
// strategies used as black boxes (trade boundary and kinks found by bisection), the
// second-best threshold as the root of a quadrature H, and a best-response test on grids
// (the model: Chatterjee & Samuelson 1983; Myerson & Satterthwaite 1983).
//
// Tolerance: relative error <= 1e-14, or absolute error <= 1e-14 x D (D = b_hi - s_lo, the
// money scale) for values smaller than D.  The status and the regime must match exactly,
// NaN must be returned exactly where the table says nan.  The worst error per output is
// printed.
#include <catch2/catch.hpp>

#include <cmath>
#include <fstream>
#include <iostream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "models/trade.hpp"
#include "test_csv.hpp"

#ifndef CTO_REFERENCE_DIR
#error "CTO_REFERENCE_DIR must name the directory of the reference tables"
#endif

namespace {

using cto_test::read_csv;

int status_of(const std::string &s) {
    if (s == "ok") return CTO_OK;
    if (s == "no_deal") return CTO_E_NO_DEAL;
    if (s == "indeterminate") return CTO_E_INDETERMINATE;
    if (s == "invalid") return CTO_E_INVALID;
    return -1;
}

int regime_of(const std::string &s) {
    const std::map<std::string, int> m = {{"none", cto::core::kTradeNone},
                                          {"one_price", cto::core::kTradeOnePrice},
                                          {"triangle", cto::core::kTradeTriangle},
                                          {"clamped", cto::core::kTradeClamped},
                                          {"posted_ask", cto::core::kTradePostedAsk},
                                          {"posted_bid", cto::core::kTradePostedBid}};
    const auto it = m.find(s);
    return it == m.end() ? -1 : it->second;
}

}  // namespace

TEST_CASE("double_auction against the 50-digit reference table", "[trade][reference]") {
    std::vector<std::string> head;
    const auto rows = read_csv(std::string(CTO_REFERENCE_DIR) + "/private/double_auction.csv", &head);
    REQUIRE(rows.size() >= 50);
    REQUIRE(head.size() >= 17);
    std::map<std::string, double> worst;
    for (const auto &r : rows) {
        const double slo = std::stod(r[0]), shi = std::stod(r[1]), blo = std::stod(r[2]),
                     bhi = std::stod(r[3]), k = std::stod(r[4]);
        INFO("row " << r[0] << "," << r[1] << "," << r[2] << "," << r[3] << "," << r[4]);
        cto::core::TradeOut o;
        int bad = 0;
        const int st = cto::core::double_auction(slo, shi, blo, bhi, k, &o, &bad);
        CHECK(st == status_of(r[5]));
        CHECK(o.regime == regime_of(r[6]));
        const double got[] = {o.trade_probability, o.total_gain, o.buyer_gain,
                              o.seller_gain, o.expected_price, o.first_best_gain,
                              o.first_best_probability, o.second_best_gain,
                              o.second_best_threshold, o.second_best_probability};
        const double scale = std::fabs(bhi - slo);  // D (its size on no-deal rows)
        for (size_t j = 0; j < 10; ++j) {
            const std::string &name = head[7 + j];
            const std::string &want_s = r[7 + j];
            INFO(name << ": got " << got[j] << ", want " << want_s);
            if (want_s == "nan") {
                CHECK(std::isnan(got[j]));
                continue;
            }
            const long double want = std::stold(want_s);
            const long double err = std::fabs(static_cast<long double>(got[j]) - want);
            const long double mag = std::fabs(want);
            const double e = err == 0 ? 0.0 : static_cast<double>(mag >= scale ? err / mag : err / scale);
            CHECK(e <= 1e-14);
            worst[name] = std::max(worst[name], e);
        }
    }
    std::cout << "double_auction worst error (relative, or absolute / D below D):\n";
    for (const auto &w : worst) std::cout << "  " << w.first << ": " << w.second << "\n";
}
