// cto_range_explain and cto_swing_explain: the reason in words for every invalid index
// of share_range (0..13 the inputs, 14..20 the options, 21 a struct size) and for every
// status.  The rules worded are those of docs/models/ranges.md "Inputs, options, outputs"
// (the engine's checks); the expected texts are the project's own wording, its contract
// in docs/models/ranges.md "Reasons in words"; the model's own reasons are cto_explain's
// (tests/cpp/test_explain.cpp); the plausible ranges are common practice, no source.
#include <catch2/catch.hpp>

#include <cmath>
#include <cstdint>
#include <cstring>
#include <string>

#include "counteroffer/counteroffer.h"
#include "range/types.hpp"
#include "table/range_reasons.hpp"

namespace {

const double kNaN = std::nan("");
const double kInf = INFINITY;

// A valid deal: rates 8% and 5%, offers 30 days apart, surplus 100, own opens; the
// other side's rate uniform on 4% to 6% (one uncertain input).
cto_range_input deal() {
    cto_range_input in;
    std::memset(&in, 0, sizeof in);
    in.size = sizeof in;
    const double v[CTO_RANGE_INPUTS] = {0.08, 0.05, 30, 0, 0, 0, 0, 0, -kInf, -kInf,
                                        100, 1, 365, 0};
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j)
        in.arg[j] = cto_range_arg{CTO_RANGE_FIXED, v[j], v[j], v[j]};
    in.arg[1] = cto_range_arg{CTO_RANGE_UNIFORM, 0.04, 0.0, 0.06};
    return in;
}

// Small, fast options (the reasons do not depend on the sample size).
cto_range_options quick() {
    cto_range_options opt;
    cto_range_default_options(&opt);
    opt.replicates = 4;
    opt.log2_start = 6;
    opt.log2_max = 8;
    opt.digits = 2;
    return opt;
}

struct Reason {
    int status;
    int bad;
    std::string text;
};

// The reason from a run inside cto_range_explain; the same text and status from the
// outcome of cto_share_range passed in (worded without running again).
Reason range_reason(const cto_range_input &in, const cto_range_options &opt) {
    char text[768];
    const int st = cto_range_explain(&in, &opt, nullptr, text, sizeof text);
    cto_range_outcome out;
    out.size = sizeof out;
    CHECK(cto_share_range(&in, &opt, &out) == st);
    char again[768];
    CHECK(cto_range_explain(&in, &opt, &out, again, sizeof again) == st);
    CHECK(std::string(again) == text);
    return {st, out.bad, text};
}

Reason swing_reason(const cto_range_input &in) {
    char text[768];
    const int st = cto_swing_explain(&in, nullptr, text, sizeof text);
    cto_swing_outcome out;
    out.size = sizeof out;
    CHECK(cto_share_swing(&in, &out) == st);
    char again[768];
    CHECK(cto_swing_explain(&in, &out, again, sizeof again) == st);
    CHECK(std::string(again) == text);
    return {st, out.bad, text};
}

// An invalid input j: the engine names it, the reason says the text.
void check_input(const cto_range_input &in, int j, const std::string &want) {
    const Reason r = range_reason(in, quick());
    INFO("input " << j << ": " << r.text);
    CHECK(r.status == CTO_E_INVALID);
    CHECK(r.bad == j);
    CHECK(r.text == want);
    const Reason s = swing_reason(in);  // the swing checks its inputs alike
    CHECK(s.status == CTO_E_INVALID);
    CHECK(s.bad == j);
    CHECK(s.text == want);
}

void check_option(const cto_range_options &opt, int bad, const std::string &want) {
    const Reason r = range_reason(deal(), opt);
    INFO("option index " << bad << ": " << r.text);
    CHECK(r.status == CTO_E_INVALID);
    CHECK(r.bad == bad);
    CHECK(r.text == want);
}

cto_range_arg uni(double lo, double hi) { return {CTO_RANGE_UNIFORM, lo, 0.0, hi}; }
cto_range_arg tri(double lo, double m, double hi) { return {CTO_RANGE_TRIANGULAR, lo, m, hi}; }
cto_range_arg pert(double lo, double m, double hi) { return {CTO_RANGE_PERT, lo, m, hi}; }
cto_range_arg fixed(double v) { return {CTO_RANGE_FIXED, v, v, v}; }

}  // namespace

TEST_CASE("range reasons: 0 own_rate, refused by the model at the modes and at a low",
          "[range_reasons]") {
    // The model's own rule (a rate is at least 0), as cto_explain words it.
    cto_range_input in = deal();
    in.arg[0] = fixed(-0.1);
    check_input(in, 0, "own_rate = -0.1 is below 0");
    in.arg[0] = uni(-0.02, 0.05);
    check_input(in, 0, "own_rate at its low: own_rate = -0.02 is below 0");
}

TEST_CASE("range reasons: 1 other_rate, a low above its high", "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[1] = uni(0.12, 0.08);
    check_input(in, 1, "other_rate: low 0.12 is above high 0.08");
}

TEST_CASE("range reasons: 2 days, a mode outside its range", "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[2] = tri(20, 50, 40);
    check_input(in, 2, "days: mode 50 is outside low 20 to high 40");
    in.arg[2] = pert(20, 10, 40);
    check_input(in, 2, "days: mode 10 is outside low 20 to high 40");
}

TEST_CASE("range reasons: 3 breakdown_prob, refused by the model at its high and mode",
          "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[3] = pert(0.1, 0.2, 1.5);
    check_input(in, 3, "breakdown_prob at its high: breakdown_prob = 1.5 is outside 0 to 1");
    in.arg[3] = tri(0.1, 1.2, 1.5);
    check_input(in, 3, "breakdown_prob at its mode: breakdown_prob = 1.2 is outside 0 to 1");
    in.arg[3] = uni(0.5, 2.5);  // a uniform range's "mode" is its midpoint, 1.5
    check_input(in, 3, "breakdown_prob at its midpoint: breakdown_prob = 1.5 is outside 0 to 1");
}

TEST_CASE("range reasons: 4 own_fallback, an end that is not a number", "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[4] = uni(kNaN, 5);
    check_input(in, 4, "own_fallback: low is empty or not a number");
    in.arg[4] = tri(0, kNaN, 5);
    check_input(in, 4, "own_fallback: mode is empty or not a number");
}

TEST_CASE("range reasons: 5 other_fallback, an infinite end", "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[5] = uni(0, kInf);
    check_input(in, 5, "other_fallback: high = infinity is not a finite number");
}

TEST_CASE("range reasons: 6 own_inside, an unknown kind", "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[6] = cto_range_arg{7, 0, 0, 0};
    check_input(in, 6,
                "own_inside: kind 7 is not one of 0 (fixed), 1 (uniform), 2 (triangular), "
                "3 (PERT)");
}

TEST_CASE("range reasons: 7 other_inside, a fixed value that is not a number",
          "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[7] = fixed(kNaN);
    check_input(in, 7, "other_inside is empty or not a number");
}

TEST_CASE("range reasons: 8 own_outside, a range too wide for double arithmetic",
          "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[8] = uni(-1e308, 1e308);
    check_input(in, 8,
                "own_outside: the range -1e+308 to 1e+308 is too wide (high - low is not a "
                "finite number)");
}

TEST_CASE("range reasons: 9 other_outside, +infinity refused by the model", "[range_reasons]") {
    // -infinity is "absent"; +infinity is no walk-away value (the model's rule).
    cto_range_input in = deal();
    in.arg[9] = fixed(kInf);
    check_input(in, 9, "other_outside = infinity is not a finite number");
}

TEST_CASE("range reasons: 10 surplus, beyond the model's range of money", "[range_reasons]") {
    // The combined model refuses money amounts beyond DBL_MAX/64 (docs/models/combined.md),
    // blaming the surplus; here at the high end of its range.
    cto_range_input in = deal();
    in.arg[10] = pert(50, 100, 1e307);
    const Reason r = range_reason(in, quick());
    CHECK(r.status == CTO_E_INVALID);
    CHECK(r.bad == 10);
    INFO(r.text);
    CHECK(r.text.rfind("surplus at its high: surplus = 1e+307 does not fit", 0) == 0);
    // Another input's end can make the surplus too large: that end is named.
    in = deal();
    in.arg[4] = uni(0, 4e306);  // its midpoint 2e306 is fine, its high is not
    const Reason j = range_reason(in, quick());
    CHECK(j.bad == 10);
    INFO(j.text);
    CHECK(j.text.rfind("with own_fallback at its high 4e+306 (the others at their modes): "
                       "surplus = 100 does not fit",
                       0) == 0);
}

TEST_CASE("range reasons: 11 own_opens and 13 continuous must be fixed 0 or 1",
          "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[11] = uni(0, 1);
    check_input(in, 11, "own_opens must be a fixed 0 or 1 (FALSE or TRUE), not a range");
    in.arg[11] = fixed(0.5);
    check_input(in, 11, "own_opens = 0.5 must be a fixed 0 or 1 (FALSE or TRUE)");
    in = deal();
    in.arg[13] = fixed(2);
    check_input(in, 13, "continuous = 2 must be a fixed 0 or 1 (FALSE or TRUE)");
    in.arg[13] = fixed(kNaN);
    check_input(in, 13,
                "continuous is empty or not a number: it must be a fixed 0 or 1 (FALSE or TRUE)");
}

TEST_CASE("range reasons: 12 basis, refused by the model", "[range_reasons]") {
    cto_range_input in = deal();
    in.arg[12] = fixed(0);
    check_input(in, 12, "basis = 0 must be above 0");
}

TEST_CASE("range reasons: 14 probabilities", "[range_reasons]") {
    cto_range_options opt = quick();
    opt.n_probs = 1;
    opt.probs[0] = 1.0;
    check_option(opt, 14, "probability 1 is not strictly between 0 and 1");
    opt = quick();
    opt.probs[2] = 0.0;
    check_option(opt, 14,
                 "probability 0 (number 3 of the 3 given) is not strictly between 0 and 1");
    opt.probs[2] = kNaN;
    check_option(opt, 14, "probability (number 3 of the 3 given) is empty or not a number");
    opt = quick();
    opt.n_probs = 0;
    check_option(opt, 14, "probabilities: none given (1 to 32 are needed)");
    opt.n_probs = 40;
    check_option(opt, 14, "probabilities: 40 given, at most 32");
}

TEST_CASE("range reasons: 15 seed, never refused by the library", "[range_reasons]") {
    // Every 64-bit seed is valid (docs: "seed (any 64-bit integer)"), so index 15 comes
    // only from a wrapper that cannot turn a value into one; its words are still defined.
    cto_range_options opt = quick();
    for (uint64_t seed : {uint64_t{0}, ~uint64_t{0}}) {
        opt.seed = seed;
        CHECK(range_reason(deal(), opt).text == "ok");
    }
    cto::core::range::RangeIn in;
    const cto_range_input d = deal();
    std::memcpy(&in, &d, sizeof in);
    cto::core::range::RangeOptions co;
    std::memcpy(&co, &opt, sizeof co);
    cto::core::range::RangeOut out{};
    out.status = CTO_E_INVALID;
    out.bad = cto::core::range::kBadSeed;
    char text[256];
    cto::table::range_reason(in, co, out, text, sizeof text);
    CHECK(std::string(text) == "seed: a whole number from 0 to 2^64 - 1 is needed");
}

TEST_CASE("range reasons: 16 replicates", "[range_reasons]") {
    cto_range_options opt = quick();
    opt.replicates = 1;
    check_option(opt, 16,
                 "replicates = 1: at least 2 (the error bars come from the spread between "
                 "replicates)");
    opt.replicates = 300;
    check_option(opt, 16, "replicates = 300: at most 256");
}

TEST_CASE("range reasons: 17 digits", "[range_reasons]") {
    cto_range_options opt = quick();
    for (int d : {0, 16}) {
        opt.digits = d;
        check_option(opt, 17,
                     "digits = " + std::to_string(d) +
                         ": 1 to 15 significant digits can be targeted");
    }
    opt.digits = 15;  // the limit itself is valid (the engine's check and the words agree)
    CHECK(range_reason(deal(), opt).status != CTO_E_INVALID);
}

TEST_CASE("range reasons: 18 log2_start", "[range_reasons]") {
    cto_range_options opt = quick();
    opt.log2_start = 0;
    check_option(opt, 18,
                 "log2_start = 0: 1 to 24 (the first sample has 2^log2_start points per "
                 "replicate)");
}

TEST_CASE("range reasons: 19 log2_max", "[range_reasons]") {
    cto_range_options opt = quick();
    opt.log2_max = 5;
    check_option(opt, 19, "log2_max = 5 is below log2_start = 6");
    opt.log2_max = 25;
    check_option(opt, 19, "log2_max = 25: at most 24");
    opt.replicates = 32;
    opt.log2_max = 20;  // 32 x 2^20 = 2^25 draws: above the cap of 2^24
    check_option(opt, 19,
                 "replicates x 2^log2_max = 32 x 2^20 is above 2^24 draws in all (the cap on "
                 "working memory): lower log2_max to 19 or replicates to 16");
}

TEST_CASE("range reasons: 20 threads", "[range_reasons]") {
    cto_range_options opt = quick();
    opt.threads = -1;
    check_option(opt, 20, "threads = -1: 0 to 64 (0 or 1: the calling thread only)");
    opt.threads = 65;
    check_option(opt, 20, "threads = 65: 0 to 64 (0 or 1: the calling thread only)");
    opt.threads = 64;  // the limit itself is valid
    CHECK(range_reason(deal(), opt).status == CTO_OK);
}

TEST_CASE("range reasons: 21 a struct that is NULL or too small", "[range_reasons]") {
    cto_range_input in = deal();
    cto_range_options opt = quick();
    char text[256];
    in.size = 8;
    CHECK(cto_range_explain(&in, &opt, nullptr, text, sizeof text) == CTO_E_INVALID);
    CHECK(std::string(text) == "in->size = 8 is below sizeof(cto_range_input) = " +
                                   std::to_string(sizeof(cto_range_input)) +
                                   ": set it to sizeof(cto_range_input) before the call");
    CHECK(cto_swing_explain(&in, nullptr, text, sizeof text) == CTO_E_INVALID);
    CHECK(std::string(text).rfind("in->size = 8 is below", 0) == 0);
    in.size = sizeof in;
    CHECK(cto_range_explain(&in, nullptr, nullptr, text, sizeof text) == CTO_E_INVALID);
    CHECK(std::string(text) ==
          "opt is NULL: pass a cto_range_options with size = sizeof(cto_range_options)");
    CHECK(cto_range_explain(nullptr, &opt, nullptr, text, sizeof text) == CTO_E_INVALID);
    CHECK(std::string(text) ==
          "in is NULL: pass a cto_range_input with size = sizeof(cto_range_input)");
    cto_range_outcome out;
    out.size = 16;
    CHECK(cto_range_explain(&in, &opt, &out, text, sizeof text) == CTO_E_INVALID);
    CHECK(std::string(text).rfind("out->size = 16 is below sizeof(cto_range_outcome)", 0) == 0);
    // A short buffer is cut and terminated; no buffer at all is allowed.
    char small[8];
    CHECK(cto_range_explain(nullptr, &opt, nullptr, small, sizeof small) == CTO_E_INVALID);
    CHECK(std::string(small) == "in is N");
    CHECK(cto_range_explain(nullptr, &opt, nullptr, nullptr, 0) == CTO_E_INVALID);
}

TEST_CASE("range reasons: ok, and a range end that looks like a typed percentage",
          "[range_reasons]") {
    const Reason ok = range_reason(deal(), quick());
    CHECK(ok.status == CTO_OK);
    CHECK(ok.text == "ok");
    CHECK(swing_reason(deal()).text == "ok");
    // Valid (a 800% rate is computed), but outside the usual 0 to 1 a year.
    cto_range_input in = deal();
    in.arg[1] = tri(0.04, 0.06, 8);
    const std::string slip =
        "ok, but other_rate high = 8 is outside the usual 0 to 1: above 100% a year: a "
        "percentage typed as a whole number? (8% is 0.08)";
    CHECK(range_reason(in, quick()).text == slip);
    CHECK(swing_reason(in).text == slip);
    in = deal();
    in.arg[2] = fixed(5000);
    CHECK(range_reason(in, quick()).text.rfind(
              "ok, but days = 5000 is outside the usual 0 to 3650", 0) == 0);
}

TEST_CASE("range reasons: indeterminate draws", "[range_reasons]") {
    // Both rates 0 and no breakdown risk: every split is an equilibrium (the combined
    // model's indeterminate case, docs/models/combined.md).
    cto_range_input in = deal();
    in.arg[0] = fixed(0);
    in.arg[1] = fixed(0);
    in.arg[10] = uni(50, 150);
    const Reason r = range_reason(in, quick());
    CHECK(r.status == CTO_E_INDETERMINATE);
    CHECK(r.text ==
          "indeterminate: many splits are equilibria, so there is no single answer "
          "(indeterminate (both rates 0 or days 0, no breakdown): NaN shares) at the modes");
}

TEST_CASE("range reasons: precision not reached", "[range_reasons]") {
    // Six digits of a spread-out quantile are out of reach at 2^8 points per replicate.
    cto_range_options opt = quick();
    opt.digits = 6;
    opt.n_probs = 1;
    opt.probs[0] = 0.5;
    const Reason r = range_reason(deal(), opt);
    REQUIRE(r.status == CTO_E_PRECISION);
    INFO(r.text);
    CHECK(r.text.rfind("precision not reached: 6 significant digits not reached at 2^8 points "
                       "per replicate (4 replicates): own share at p = 0.5 has ",
                       0) == 0);
    CHECK(r.text.find(" at 95%)") != std::string::npos);
    const std::string advice =
        "; ask for fewer digits or raise log2_max (up to 22 with 4 replicates)";
    REQUIRE(r.text.size() > advice.size());
    CHECK(r.text.substr(r.text.size() - advice.size()) == advice);
    // At the cap (16 x 2^20 draws): only fewer digits help.  Worded from an outcome, as
    // running to the cap takes seconds.
    cto::core::range::RangeIn in;
    const cto_range_input d = deal();
    std::memcpy(&in, &d, sizeof in);
    cto::core::range::RangeOptions co;
    cto_range_options dflt;
    cto_range_default_options(&dflt);
    std::memcpy(&co, &dflt, sizeof co);
    cto::core::range::RangeOut out{};
    out.status = CTO_E_PRECISION;
    out.bad = -1;
    out.n_probs = 1;
    out.probs[0] = 0.5;
    out.own[0] = {0.4, 1e-4, 2e-3, 2};
    out.replicates = 16;
    out.log2_used = 20;
    char text[512];
    cto::table::range_reason(in, co, out, text, sizeof text);
    CHECK(std::string(text) ==
          "precision not reached: 3 significant digits not reached at 2^20 points per replicate "
          "(16 replicates): own share at p = 0.5 has 2 (0.4 +/- 0.002 at 95%); ask for fewer "
          "digits (16 x 2^20 draws is the most the cap of 2^24 allows)");
}

TEST_CASE("range reasons: working memory not available", "[range_reasons]") {
    // A failed allocation cannot be provoked here: the words for the outcome.
    cto::core::range::RangeIn in;
    const cto_range_input d = deal();
    std::memcpy(&in, &d, sizeof in);
    cto::core::range::RangeOptions co{};
    cto::core::range::RangeOut out{};
    out.status = CTO_E_INTERNAL;
    char text[256];
    cto::table::range_reason(in, co, out, text, sizeof text);
    CHECK(std::string(text) ==
          "working memory for the draws could not be allocated (16 bytes x replicates x "
          "2^log2_max at most): lower log2_max or replicates");
}

TEST_CASE("range reasons: every input the engine refuses gets a reason of its own",
          "[range_reasons]") {
    // The words are derived from the engine's verdict, never a second set of rules: over
    // a grid of kinds and special values in every slot, each invalid index has a specific
    // reason naming that input (none of the fallbacks used when no part of a range
    // explains the verdict, or when no probe point shows the model's refusal).
    const double vals[] = {kNaN, -kInf, kInf, -1e308, -1, 0, 0.5, 1, 2, 1e308};
    const cto_function_info *f = cto_function_find("solve_from_rates");
    REQUIRE(f != nullptr);
    REQUIRE(f->n_args == CTO_RANGE_INPUTS);
    int invalid = 0;
    for (int j = 0; j < CTO_RANGE_INPUTS; ++j)
        for (int kind = -1; kind <= 4; ++kind)
            for (double lo : vals)
                for (double hi : {kNaN, 0.0, 1.0, 1e308}) {
                    cto_range_input in = deal();
                    in.arg[j] = cto_range_arg{kind, lo, kind == CTO_RANGE_FIXED ? lo : 0.5, hi};
                    const Reason r = swing_reason(in);
                    if (r.status != CTO_E_INVALID) continue;
                    ++invalid;
                    INFO("slot " << j << " kind " << kind << " low " << lo << " high " << hi
                                 << ": " << r.text);
                    REQUIRE(r.bad >= 0);
                    // The input refused is named (first, or after the point where the
                    // model refuses it: a huge walk-away value makes the surplus too large).
                    CHECK(r.text.find(f->args[r.bad].name) != std::string::npos);
                    CHECK(r.text.find("not a valid range") == std::string::npos);
                    CHECK(r.text.find(" is invalid") == std::string::npos);
                    CHECK(r.text.find("drawn inside") == std::string::npos);
                }
    CHECK(invalid > 1000);
}
