// The catalogue table and its lookup (cto_function_count / _at / _find).  The rows come
// from the generated catalogue_rows.inc; nothing here lists a function by hand.
#include "rows.hpp"

#include <cmath>
#include <cstring>

#include "../capi/adapters.hpp"
#include "../models.hpp"
#include "convert.hpp"

namespace cto::table {
namespace {

namespace core = cto::core;
namespace entry = cto::entry;
constexpr double kInf = core::kInf;

// Block kernels, in the table's calling convention (arguments in catalogue order).
namespace block {
inline bool share_block(size_t m, const double *const *a, double *const *o) {
    return core::share_block(m, a[0], a[1], a[2], a[3], o[0]);
}
}  // namespace block

#include "catalogue_rows.inc"

}  // namespace

CTO_BLOCK_KERNELS

namespace {

#define CTO_N_OF(arr) static_cast<int>(sizeof(arr) / sizeof(arr[0]))
#define CTO_ROW(id, name, calc, summary, formula, source, statuses)                          \
    Row{{sizeof(cto_function_info), id, #name, calc, summary, formula, source, statuses,      \
         CTO_N_OF(kArgs_##name), kArgs_##name, CTO_N_OF(kOutputs_##name), kOutputs_##name}, \
        t_##name,                                                                            \
        strided<t_##name, CTO_N_OF(kArgs_##name), CTO_N_OF(kOutputs_##name)>, kPlausible_##name, kSlip_##name, kRule_##name, kWords_##name, kNoDealNan_##name},

const Row kRows[] = {CTO_CATALOGUE_ROWS};
constexpr size_t kCount = sizeof(kRows) / sizeof(kRows[0]);

}  // namespace

const Row *row(int id) {
    if (id < 0 || static_cast<size_t>(id) >= kCount) return nullptr;
    return &kRows[id];
}
size_t row_count() { return kCount; }

}  // namespace cto::table

extern "C" {

CTO_API size_t cto_function_count(void) { return cto::table::row_count(); }

CTO_API const cto_function_info *cto_function_at(size_t index) {
    const cto::table::Row *r = cto::table::row(index < cto::table::row_count() ? static_cast<int>(index) : -1);
    return r ? &r->info : nullptr;
}

CTO_API int cto_arg_plausible_range(int function_id, int arg_index, double *low, double *high) {
    const cto::table::Row *r = cto::table::row(function_id);
    const bool known = r && arg_index >= 0 && arg_index < r->info.n_args;
    const bool has = known && r->plausible[arg_index][0] != 0.0;
    if (low) *low = has ? r->plausible[arg_index][1] : cto::core::kNaN;
    if (high) *high = has ? r->plausible[arg_index][2] : cto::core::kNaN;
    return has ? CTO_OK : CTO_E_INVALID;
}

CTO_API const char *cto_output_word(int function_id, int output_index, double code) {
    const cto::table::Row *r = cto::table::row(function_id);
    if (!r || output_index < 0 || output_index >= r->info.n_outputs) return nullptr;
    const char *const *w = r->words[output_index];
    if (!w || !(code >= 0.0) || code != std::floor(code)) return nullptr;
    for (double k = 0.0; *w; ++w, k += 1.0)
        if (k == code) return *w;
    return nullptr;
}

CTO_API const cto_function_info *cto_function_find(const char *name) {
    if (!name) return nullptr;
    for (size_t i = 0; i < cto::table::row_count(); ++i) {
        const cto::table::Row *r = cto::table::row(static_cast<int>(i));
        if (std::strcmp(r->info.name, name) == 0) return &r->info;
    }
    return nullptr;
}

}  // extern "C"
