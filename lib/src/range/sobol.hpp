// Sobol' points in natural order from the Joe & Kuo (2008) direction numbers.
//
// Sobol' (1967) defines a digital sequence in base 2: coordinate j of point i is the XOR
// of the direction numbers v_{j,k} over the bits k - 1 set in i.  This file follows the
// specification in docs/models/ranges.md ("The generator", step 1 and 2):
//   * 32-bit direction numbers; dimension 1 (j = 0) is v_k = 2^(32-k);
//   * dimension j >= 2 takes row j of Joe & Kuo (2008), file new-joe-kuo-6.21201, with the
//     recurrence of Bratley & Fox (1988), s.2:
//         m_k = 2 a_1 m_{k-1} ^ 4 a_2 m_{k-2} ^ ... ^ 2^(s-1) a_{s-1} m_{k-s+1}
//               ^ 2^s m_{k-s} ^ m_{k-s},                       v_k = m_k 2^(32-k);
//   * natural order: point i (0-based) is the same in every implementation (a Gray-code
//     generator yields the same set in the order i ^ (i >> 1)).
// Everything is unsigned integer arithmetic, so the points are identical on every
// platform.  The table is built at compile time; nothing here has state.
#ifndef CTO_RANGE_SOBOL_HPP
#define CTO_RANGE_SOBOL_HPP

#include <cstdint>

namespace cto::core::range {

inline constexpr int kSobolDims = 64;  // dimensions tabulated (share_range needs 14)
inline constexpr int kSobolBits = 32;  // digits per coordinate; at most 2^32 points

// v_{j,k} for the 0-based dimension j < kSobolDims and digit k = 1..32.
uint32_t sobol_direction(int j, int k);

// Coordinate j (0-based) of point i (natural order), as a 32-bit integer whose most
// significant bit is the first base-2 digit.  Requires i < 2^32 and j < kSobolDims.
uint32_t sobol_point(uint64_t i, int j);

// The steps between consecutive points in natural order, dimension j < kSobolDims:
// X_i = X_{i-1} ^ sobol_steps(j)[ctz(i)] for 1 <= i < 2^32 (the bits that change from
// i - 1 to i are the lowest ctz(i) + 1 bits, so the step is v_1 ^ ... ^ v_{ctz(i)+1}).
const uint32_t *sobol_steps(int j);

}  // namespace cto::core::range

#endif  // CTO_RANGE_SOBOL_HPP
