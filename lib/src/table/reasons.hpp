// Why a catalogue function gives what it gives, in words: the reason behind cto_explain.
#ifndef CTO_TABLE_REASONS_HPP
#define CTO_TABLE_REASONS_HPP

#include <cstddef>

#include "rows.hpp"

namespace cto::table {

// Evaluates row r at args (every argument as a double, as cto_call takes them) and writes
// into text (at most size bytes, NUL-terminated, truncated if needed) the reason for the
// outcome: which argument is wrong and how, why there is no deal or no single answer, a
// value that is valid but looks like a slip, or "ok".  Returns the function's status.
int explain(const Row &r, const double *args, char *text, size_t size);

}  // namespace cto::table

#endif  // CTO_TABLE_REASONS_HPP
