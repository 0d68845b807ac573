// Why share_range and share_swing give what they give, in words: the reasons behind
// cto_range_explain and cto_swing_explain (docs/models/ranges.md "Reasons in words").
//
// Nothing here decides whether an input is valid: the engine does (lib/src/range/), and
// its outcome's status and invalid index `bad` are what these functions word.  For the
// index they name the input by its argument name in solve_from_rates' definition and
// say which part of the range is wrong; where the model itself refuses a value, they
// find the point the engine probes (the modes, then each uncertain input's low and high
// with the others at their modes) and give the model's own reason there, as cto_explain
// words it (table/reasons.hpp).  A valid run's range ends are checked against the
// plausible ranges of solve_from_rates' arguments, as cto_explain checks a call's.
#ifndef CTO_TABLE_RANGE_REASONS_HPP
#define CTO_TABLE_RANGE_REASONS_HPP

#include <cstddef>

#include "../range/types.hpp"

namespace cto::table {

// The reason for `out`, the outcome share_range wrote for inputs `in` and options `opt`.
void range_reason(const core::range::RangeIn &in, const core::range::RangeOptions &opt,
                  const core::range::RangeOut &out, char *text, size_t size);

// The reason for `out`, the outcome share_swing wrote for inputs `in`.
void swing_reason(const core::range::RangeIn &in, const core::range::SwingOut &out,
                  char *text, size_t size);

// A struct the entry points could not read (invalid index 21): `name` ("in", "opt",
// "out") of C type `type` is NULL, or its size field `given` is below `need`.
void size_reason(const char *name, const char *type, bool null, size_t given, size_t need,
                 char *text, size_t size);

}  // namespace cto::table

#endif  // CTO_TABLE_RANGE_REASONS_HPP
