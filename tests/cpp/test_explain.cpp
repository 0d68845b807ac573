// cto_explain: the reason in words for every status and every argument kind.  The
// expected texts are the project's own wording (the contract of the reason function);
// the thresholds of a typed percentage are common practice, no source.
#include <catch2/catch.hpp>

#include <cmath>
#include <string>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace {

struct Reason {
    int status;
    std::string text;
};

Reason explain(const char *name, std::vector<double> args) {
    const cto_function_info *f = cto_function_find(name);
    REQUIRE(f != nullptr);
    REQUIRE(args.size() == static_cast<size_t>(f->n_args));
    char buf[512];
    const int st = cto_explain(f->id, args.data(), buf, sizeof buf);
    // The status is the function's own (as cto_call gives it).
    std::vector<double> out(static_cast<size_t>(f->n_outputs));
    CHECK(st == cto_call(f->id, args.data(), out.data(), nullptr));
    return {st, buf};
}

const double kNaN = std::nan("");
const double kInf = INFINITY;

}  // namespace

TEST_CASE("explain: ok, and a valid value that looks like a slip", "[explain]") {
    CHECK(explain("share", {0.9, 0.95, 1, 1}).text == "ok");
    const Reason r = explain("share_from_rates", {8, 0.05, 30, 1, 1, 365, 0});
    CHECK(r.status == CTO_OK);
    CHECK(r.text == "ok, but own_rate = 8 is outside the usual 0 to 1: above 100% a year: a "
                    "percentage typed as a whole number? (8% is 0.08)");
    CHECK(explain("share_from_rates", {0.08, 0.05, 5000, 1, 1, 365, 0}).text.find(
              "days = 5000 is outside the usual 0 to 3650") != std::string::npos);
    CHECK(explain("solve", {0.9, 0.95, 0.6, 0, 0, 0, 0, -kInf, -kInf, 1, 1})
              .text.find("breakdown_prob = 0.6 is outside the usual 0 to 0.5") !=
          std::string::npos);
}

TEST_CASE("explain: invalid arguments of every kind name the argument and the rule",
          "[explain]") {
    CHECK(explain("share", {1.2, 0.95, 1, 1}).text == "own_factor = 1.2 is outside 0 to 1");
    CHECK(explain("share", {kNaN, 0.95, 1, 1}).text == "own_factor is empty or not a number");
    CHECK(explain("share", {0.9, 0.95, kInf, 1}).text == "surplus = infinity is not a finite number");
    CHECK(explain("share_from_rates", {-0.1, 0.05, 30, 1, 1, 365, 0}).text ==
          "own_rate = -0.1 is below 0");
    CHECK(explain("share_from_rates", {0.1, 0.05, 30, 1, 1, 0, 0}).text ==
          "basis = 0 must be above 0");
    CHECK(explain("share", {0.9, 0.95, 1, 2}).text ==
          "own_opens = 2 must be TRUE or FALSE (1 or 0)");
    CHECK(explain("group_share", {0.9, 3.5, 0, 1}).text == "parties = 3.5 must be a whole number");
    CHECK(explain("group_share", {0.9, 0, 0, 1}).text == "parties = 0 must be at least 1");
    CHECK(explain("risk_averse_share", {0.9, 0.95, 0.5, 0.5, 5, 0, 0, 0, 1, 1}).text ==
          "utility = 5 must be one of: power, exponential");
    CHECK(explain("solve", {0.9, 0.95, 0, 0, 0, 0, 0, kInf, -kInf, 1, 1}).text ==
          "own_outside = infinity is not a finite number");
    // A value fine by its kind that breaks a rule joining it to another argument.
    const Reason r = explain("screening_profit", {1, 2, 0.5, 0.9, 0.9});
    CHECK(r.status == CTO_E_INVALID);
    CHECK(r.text == "low_value = 2 does not fit: it must be at most high_value");
    // An observed share no own factor can produce (as opener own gets at least
    // 1 - other_factor: Rubinstein 1982 with own's factor from 0 to 1).
    const Reason u = explain("implied_factor", {0.02, 0.95, 1});
    CHECK(u.status == CTO_E_INVALID);
    CHECK(u.text.rfind("observed_share = 0.02 does not fit: no own factor from 0 to 1", 0) == 0);
}

TEST_CASE("explain: no deal, indeterminate, unknown function, a short buffer", "[explain]") {
    // Walk-away values 70 and 60 against a surplus of 100: both walk, no deal.
    const Reason nd = explain("solve", {0.9, 0.95, 0, 0, 0, 0, 0, 70, 60, 100, 1});
    CHECK(nd.status == CTO_E_NO_DEAL);
    CHECK(nd.text == "no rational deal (#N/A in Calc): the surplus 100 does not exceed what the "
                     "parties get without a deal (own 70, other 60); the result is own's "
                     "no-deal payoff");
    const Reason zero = explain("share", {0.9, 0.95, 0, 1});
    CHECK(zero.status == CTO_E_NO_DEAL);
    CHECK(zero.text.find("the surplus 0 does not exceed") != std::string::npos);
    const Reason ind = explain("share", {1, 1, 1, 1});
    CHECK(ind.status == CTO_E_INDETERMINATE);
    CHECK(ind.text.rfind("indeterminate: many splits are equilibria", 0) == 0);
    CHECK(ind.text.find("both factors 1") != std::string::npos);

    const double a[1] = {0};
    char buf[64];
    CHECK(cto_explain(-1, a, buf, sizeof buf) == CTO_E_INVALID);
    CHECK(std::string(buf) == "unknown function or no arguments");
    CHECK(cto_explain(0, nullptr, nullptr, 0) == CTO_E_INVALID);
    const cto_function_info *f = cto_function_find("share");
    const double args[4] = {1.2, 0.95, 1, 1};
    char small[10];
    CHECK(cto_explain(f->id, args, small, sizeof small) == CTO_E_INVALID);
    CHECK(std::string(small) == "own_facto");
}

TEST_CASE("output words: solve's binding and rational codes", "[explain]") {
    // The codes are the header's CTO_BINDS_* constants; the words are the project's own.
    const cto_function_info *f = cto_function_find("solve");
    REQUIRE(f != nullptr);
    CHECK(std::string(cto_output_word(f->id, 2, CTO_BINDS_NONE)) == "none");
    CHECK(std::string(cto_output_word(f->id, 2, CTO_BINDS_OWN)) == "ours");
    CHECK(std::string(cto_output_word(f->id, 2, CTO_BINDS_OTHER)) == "theirs");
    CHECK(std::string(cto_output_word(f->id, 2, CTO_BINDS_BOTH)) == "both");
    CHECK(std::string(cto_output_word(f->id, 3, 1.0)) == "yes");
    CHECK(std::string(cto_output_word(f->id, 3, 0.0)) == "no");
    CHECK(cto_output_word(f->id, 2, 4.0) == nullptr);
    CHECK(cto_output_word(f->id, 2, std::nan("")) == nullptr);
    CHECK(cto_output_word(f->id, 2, 1.5) == nullptr);
    CHECK(cto_output_word(f->id, 0, 0.0) == nullptr);  // own_share is not coded
    CHECK(cto_output_word(f->id, 9, 0.0) == nullptr);
    CHECK(cto_output_word(-1, 0, 0.0) == nullptr);
}

TEST_CASE("explain: no deal for a result without a value without a deal", "[explain]") {
    // A seller whose cost (2) is above every value the buyer may have ([0, 1]): no type
    // gains (docs/models/private-information.md s.2.6), and the opening offer has no value.
    const Reason r = explain("opening_offer", {0, 1, 0.9, 0.9, 2, 2, 0});
    CHECK(r.status == CTO_E_NO_DEAL);
    CHECK(r.text.find("without a deal this result has no value") != std::string::npos);
    CHECK(r.text.find("own nan") == std::string::npos);
}
