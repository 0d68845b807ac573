// offer_path against the 50-digit reference table tests/reference/private/offer_path.csv,
// written by tests/reference/private/generate_private.py from methods independent of the
// library's recursions and closed forms: numerical backward induction by first-order
// conditions with degree-8 Chebyshev interpolation of each stage (in value space for
// seller offers and, written separately, in cost space for the mirror case), the
// stationary equilibrium as the fixed point of one such stage, and a Monte Carlo of
// 4 x 10^6 responder types choosing their best round on each path (the model:
// Sobel & Takahashi 1983; Stokey 1981; Gul, Sonnenschein & Wilson 1986).  The gap rows
// (the last 16) come from a separate mpmath implementation of the piecewise recursion
// whose envelope is cut at every pairwise crossing of the candidates, each stage checked
// by direct maximisation of the stage objective at random states (golden section, no
// candidates), and the same Monte Carlo (Fudenberg, Levine & Tirole 1985).
//
// Tolerance: relative error <= 1e-14, or absolute error <= 1e-14 x (private_high -
// private_low) for money below that scale.  The worst error per output is printed.
#include <catch2/catch.hpp>

#include <cmath>
#include <fstream>
#include <iostream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "test_csv.hpp"
#include "models/offers.hpp"

#ifndef CTO_REFERENCE_DIR
#error "CTO_REFERENCE_DIR must name the directory of the reference tables"
#endif

namespace {

using cto_test::read_csv;

}  // namespace

TEST_CASE("offer_path against the 50-digit reference table", "[offers][reference]") {
    std::vector<std::string> head;
    const auto rows = read_csv(std::string(CTO_REFERENCE_DIR) + "/private/offer_path.csv", &head);
    REQUIRE(rows.size() >= 50);
    REQUIRE(head.size() >= 16);
    std::map<std::string, double> worst;
    for (const auto &r : rows) {
        const double lo = std::stod(r[0]), hi = std::stod(r[1]), ds = std::stod(r[2]),
                     db = std::stod(r[3]), known = std::stod(r[5]);
        const int64_t T = std::stoll(r[4]);
        const int who = std::stoi(r[6]);
        INFO("row " << r[0] << "," << r[1] << "," << r[2] << "," << r[3] << "," << r[4] << ","
                    << r[5] << "," << r[6]);
        cto::core::OfferRow path[2];
        cto::core::OfferTotals t;
        const int st = cto::core::offer_path(lo, hi, ds, db, T, known, who, path, 2, &t, nullptr);
        REQUIRE(st == CTO_OK);
        REQUIRE(r[7] == "ok");
        const double got[] = {t.opening_offer, t.agreement_probability, t.expected_round,
                              t.offerer_value, t.responder_value,
                              t.rows_written > 1 ? path[1].offer : NAN, path[0].cutoff,
                              t.rows_written > 1 ? path[1].cutoff : NAN};
        const double scale = hi - lo;
        for (size_t j = 0; j < 8; ++j) {
            const std::string &name = head[8 + j];
            const std::string &want_s = r[8 + j];
            INFO(name << ": got " << got[j] << ", want " << want_s);
            if (want_s == "nan") {
                CHECK(std::isnan(got[j]));
                continue;
            }
            const long double want = std::stold(want_s);
            const long double err = std::fabs(static_cast<long double>(got[j]) - want);
            const long double mag = std::fabs(want);
            const bool money = j != 1 && j != 2;
            const double e = err == 0 ? 0.0
                             : static_cast<double>(money && mag < scale ? err / scale : err / mag);
            CHECK(e <= 1e-14);
            worst[name] = std::max(worst[name], e);
        }
    }
    std::cout << "offer_path worst error (relative, or absolute / (high - low) below it):\n";
    for (const auto &w : worst) std::cout << "  " << w.first << ": " << w.second << "\n";
}
