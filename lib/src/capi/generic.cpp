// The generic entry points that drive the wrappers: cto_call (one element, every argument
// as a double) and cto_call_strided (n elements through the function's strided loop).
#include "../table/reasons.hpp"
#include "../table/rows.hpp"

using cto::table::Row;
using cto::table::row;
using cto::table::Tally;

extern "C" {

CTO_API int cto_call(int id, const double *args, double *outputs, int *bad_arg) {
    if (bad_arg) *bad_arg = -1;
    const Row *r = row(id);
    if (!r || !args || !outputs) return CTO_E_INVALID;
    try {
        return r->thunk(args, outputs, bad_arg);
    } catch (...) {
        for (int k = 0; k < r->info.n_outputs; ++k) outputs[k] = cto::core::kNaN;
        return CTO_E_INTERNAL;
    }
}

CTO_API int cto_call_strided(int id, size_t n, const char *const *args,
                             const ptrdiff_t *arg_strides, char *const *outputs,
                             const ptrdiff_t *output_strides, signed char *statuses,
                             ptrdiff_t status_stride, cto_batch_report *report) {
    const Row *r = row(id);
    if (!r || !args || !arg_strides || !outputs || !output_strides) return CTO_E_INVALID;
    if (report && report->size < sizeof(cto_batch_report)) return CTO_E_INVALID;
    for (int j = 0; j < r->info.n_args; ++j)
        if (!args[j] && n > 0) return CTO_E_INVALID;
    for (int k = 0; k < r->info.n_outputs; ++k)
        if (!outputs[k] && n > 0) return CTO_E_INVALID;
    Tally t;
    try {
        r->loop(n, args, arg_strides, outputs, output_strides, statuses, status_stride, t);
    } catch (...) {
        return CTO_E_INTERNAL;
    }
    if (report) {
        for (int s = 0; s < CTO_REPORT_SLOTS; ++s) {
            report->count[s] = t.count[s];
            report->first_index[s] = t.first[s];
        }
        report->first_bad_arg = t.first_bad;
    }
    return CTO_OK;
}

CTO_API int cto_explain(int id, const double *args, char *text, size_t size) {
    const Row *r = row(id);
    if (!r || !args) {
        if (text && size > 0) {
            const char msg[] = "unknown function or no arguments";
            const size_t n = sizeof msg - 1 < size - 1 ? sizeof msg - 1 : size - 1;
            for (size_t i = 0; i < n; ++i) text[i] = msg[i];
            text[n] = '\0';
        }
        return CTO_E_INVALID;
    }
    try {
        return cto::table::explain(*r, args, text, size);
    } catch (...) {  // nothing here throws; a defect is reported, never propagated
        if (text && size > 0) text[0] = '\0';
        return CTO_E_INTERNAL;
    }
}

}  // extern "C"
