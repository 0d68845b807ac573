// Thread safety: every catalogue function called from two threads at once gives exactly
// the results of a serial run (the library keeps no state).  Run under ThreadSanitizer
// in CI (scripts/test.d/10-core.sh), where a data race fails the test.
#include <catch2/catch.hpp>

#include <cstring>
#include <random>
#include <thread>
#include <vector>

#include "counteroffer/counteroffer.h"
#include "test_support.hpp"

TEST_CASE("two threads calling every function agree with a serial run", "[threads]") {
    struct Case {
        int id;
        std::vector<double> args;
    };
    std::vector<Case> cases;
    std::mt19937_64 rng(99);
    std::uniform_real_distribution<double> u(0.85, 1.0);
    for (size_t f = 0; f < cto_function_count(); ++f) {
        const cto_function_info *fi = cto_function_at(f);
        for (int k = 0; k < 200; ++k) {
            auto a = cto_test::base_args(fi);
            for (int j = 0; j < fi->n_args; ++j)
                if (fi->args[j].kind == CTO_ARG_UNIT || fi->args[j].kind == CTO_ARG_REAL)
                    a[static_cast<size_t>(j)] *= u(rng);
            cases.push_back({fi->id, a});
        }
    }
    auto run = [&](size_t begin, size_t step, std::vector<double> &out, std::vector<int> &st) {
        for (size_t i = begin; i < cases.size(); i += step) {
            double o[CTO_MAX_OUTPUTS];
            st[i] = cto_call(cases[i].id, cases[i].args.data(), o, nullptr);
            out[i] = o[0];
        }
    };
    std::vector<double> serial(cases.size()), parallel(cases.size());
    std::vector<int> sst(cases.size()), pst(cases.size());
    run(0, 1, serial, sst);
    // Both threads run over all cases, interleaved differently, writing disjoint slots.
    std::vector<double> second(cases.size());
    std::vector<int> second_st(cases.size());
    std::thread t1([&] { run(0, 1, parallel, pst); });
    std::thread t2([&] {
        for (size_t i = cases.size(); i-- > 0;) {
            double o[CTO_MAX_OUTPUTS];
            second_st[i] = cto_call(cases[i].id, cases[i].args.data(), o, nullptr);
            second[i] = o[0];
        }
    });
    t1.join();
    t2.join();
    for (size_t i = 0; i < cases.size(); ++i) {
        INFO("case " << i << " function " << cto_function_at(static_cast<size_t>(cases[i].id))->name);
        CHECK(pst[i] == sst[i]);
        CHECK(second_st[i] == sst[i]);
        CHECK(std::memcmp(&parallel[i], &serial[i], sizeof(double)) == 0);
        CHECK(std::memcmp(&second[i], &serial[i], sizeof(double)) == 0);
    }
}
