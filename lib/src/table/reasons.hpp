// Why a catalogue function gives what it gives, in words: the reason behind cto_explain,
// and the pieces the reasons of share_range and share_swing reuse (range_reasons.hpp).
#ifndef CTO_TABLE_REASONS_HPP
#define CTO_TABLE_REASONS_HPP

#include <cstddef>

#include "rows.hpp"
#include "text.hpp"

namespace cto::table {

// Evaluates row r at args (every argument as a double, as cto_call takes them) and writes
// into text (at most size bytes, NUL-terminated, truncated if needed) the reason for the
// outcome: which argument is wrong and how, why there is no deal or no single answer, a
// value that is valid but looks like a slip, or "ok".  Returns the function's status.
int explain(const Row &r, const double *args, char *text, size_t size);

// "<label> = <v> is outside the usual <low> to <high>: <what it suggests>" when argument
// j of r has a plausible range and v is not inside it; else "".
Str slip_note(const Row &r, int j, const char *label, double v);

// The clause of the function's status text that starts with `status` ("indeterminate
// (both factors 1): NaN"), up to the next ';', or "".
Str status_clause(const Row &r, const char *status);

// "indeterminate: many splits are equilibria, ..." with the function's own clause.
Str indeterminate_reason(const Row &r);

}  // namespace cto::table

#endif  // CTO_TABLE_REASONS_HPP
