// The combined model (core::solve) against backward induction over the finite game:
// tests/reference/game_tree/solve_game_tree.csv, written by
// tests/reference/game_tree/generate.py from the game's rules (game_tree.py: responder
// accepts, rejects or walks away; proposer makes an acceptable offer or none; breakdown,
// status-quo income and discounting after each rejection), in 50-digit arithmetic over
// horizons T and T+1 with (a_A a_B)^(T/2) <= 1e-45.  Sources of the game: Rubinstein
// (1982); Binmore, Rubinstein & Wolinsky (1986); Shaked & Sutton (1984); Osborne &
// Rubinstein (1990) ch.3; Muthoo (1999) chs.4-6.
//
// Every row: the status, whether a deal is rational, whether it comes one round late and
// which walk-away option binds must agree exactly (except the decisions of rows the
// generator marks as ties: some round-0 or round-1 margin of the induction within 1e-12
// of the money scale, where double rounding decides; their values are still checked); each value within 1e-13 x scale, scale = the largest of |surplus|, each side's
// value of perpetual disagreement and each walk-away value (the money the model adds and
// subtracts).
#include <catch2/catch.hpp>

#include <cmath>
#include <fstream>
#include <iomanip>
#include <iostream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "models/combined.hpp"

#include "test_csv.hpp"

namespace {

double num(const std::string &s) { return std::strtod(s.c_str(), nullptr); }
long double lnum(const std::string &s) { return std::strtold(s.c_str(), nullptr); }

// The value of perpetual disagreement, as the generator defines it (for the scale only).
double wait_value(double d, double p, double b, double g) {
    const double a = (1 - p) * d;
    return a == 1.0 ? g : (p * b + (1 - p) * (1 - d) * g) / (1 - a);
}

struct Tally {
    size_t rows = 0, ties = 0, failures = 0;
    long double worst[6] = {0, 0, 0, 0, 0, 0};
    std::map<std::string, int> paths;
};

}  // namespace

TEST_CASE("solve agrees with backward induction over the game tree", "[game_tree][combined]") {
    std::ifstream in(std::string(CTO_REFERENCE_DIR) + "/game_tree/solve_game_tree.csv");
    REQUIRE(in.good());
    std::string line;
    std::getline(in, line);
    REQUIRE(cto_test::split_csv(line).size() == 24);
    Tally t;
    const char *names[6] = {"own_share", "other_share", "own_delay_loss", "other_delay_loss",
                            "opening_advantage", "(unused)"};
    while (std::getline(in, line)) {
        if (line.empty()) continue;
        const auto f = cto_test::split_csv(line);
        REQUIRE(f.size() == 24);
        cto::core::SolveIn si{num(f[0]), num(f[1]), num(f[2]), num(f[3]), num(f[4]), num(f[5]),
                              num(f[6]), num(f[7]), num(f[8]), num(f[9]), f[10] == "1"};
        cto::core::SolveOut o;
        int bad = -2;
        const int st = cto::core::solve(si, &o, &bad);
        ++t.rows;
        t.paths[f[21]]++;
        const bool tie = f[20] == "1";
        t.ties += tie;
        double scale = std::fmax(std::fabs(si.surplus),
                                 std::fmax(std::fabs(wait_value(si.own_factor, si.p, si.own_fallback, si.own_inside)),
                                           std::fabs(wait_value(si.other_factor, si.p, si.other_fallback, si.other_inside))));
        for (double w : {si.own_outside, si.other_outside})
            if (std::isfinite(w)) scale = std::fmax(scale, std::fabs(w));
        std::ostringstream why;
        const int want_st = f[11] == "ok" ? CTO_OK : CTO_E_NO_DEAL;
        if (!tie) {
            if (st != want_st) why << "status " << st << " want " << f[11] << "; ";
            if (o.rational != (f[15] == "1")) why << "rational; ";
            if (o.delayed != (f[16] == "1")) why << "delayed; ";
            if (st == CTO_OK && o.binding != std::stoi(f[14])) why << "binding " << o.binding << " want " << f[14] << "; ";
        }
        const double got[5] = {o.own_share, o.other_share, o.own_delay_loss, o.other_delay_loss,
                               o.opening_advantage};
        for (int k = 0; k < 5; ++k) {
            const long double want = lnum(f[12 + (k < 2 ? k : k + 3)]);
            const long double err = std::fabs(static_cast<long double>(got[k]) - want) / scale;
            if (!(err <= 1e-13L)) why << names[k] << " " << std::setprecision(17) << got[k] << " want " << f[12 + (k < 2 ? k : k + 3)] << "; ";
            if (err > t.worst[k] || std::isnan(static_cast<double>(err))) t.worst[k] = err;
        }
        if (!why.str().empty()) {
            if (++t.failures <= 12) std::cout << "  FAIL game tree: " << why.str() << " row: " << line << "\n";
        }
    }
    std::cout << "game tree: " << t.rows << " rows (" << t.ties << " ties), failures " << t.failures << "; worst error / scale:";
    for (int k = 0; k < 5; ++k) std::cout << " " << names[k] << " " << std::setprecision(3) << static_cast<double>(t.worst[k]);
    std::cout << "\n  round-0/round-1 decisions:";
    for (const auto &kv : t.paths) std::cout << " " << kv.first << " " << kv.second;
    std::cout << "\n";
    CHECK(t.rows >= 3000);
    CHECK(t.failures == 0);
    // every round-0/round-1 decision pattern of the game is present
    for (const char *p : {"agree/agree", "agree/walk", "agree/reject", "walk/agree", "walk/walk",
                          "walk/reject", "reject/agree", "reject/walk", "reject/reject"})
        CHECK(t.paths[p] >= 10);
}
