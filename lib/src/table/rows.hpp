// The catalogue table: one row per function, generated from lib/functions/*.toml
// (lib/gen/gen_core.py): its description for cto_function_info, its table thunk (all
// arguments as doubles) and its strided loop.
#ifndef CTO_TABLE_ROWS_HPP
#define CTO_TABLE_ROWS_HPP

#include <cstddef>

#include "strided.hpp"

namespace cto::table {

struct Row {
    cto_function_info info;
    Thunk thunk;
    Loop loop;
    const double (*plausible)[3];  // per argument: (has a range, low, high)
    const char *const *slip;       // per argument: what a value outside it suggests
    const char *const *rule;       // per argument: its rule joining other arguments, or ""
    const char *const *const *words;  // per output: words for its codes, or nullptr
    bool no_deal_nan;              // the result is NaN, not a payoff, without a deal
};

// The row of catalogue id, or nullptr.
const Row *row(int id);
size_t row_count();

}  // namespace cto::table

#endif  // CTO_TABLE_ROWS_HPP
