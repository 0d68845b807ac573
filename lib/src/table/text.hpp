// Fixed-size texts for the reasons in words (table/reasons.cpp, table/range_reasons.cpp):
// no allocation, numbers written locale-independently.
#ifndef CTO_TABLE_TEXT_HPP
#define CTO_TABLE_TEXT_HPP

#include <charconv>
#include <cmath>
#include <cstddef>
#include <cstring>

namespace cto::table {

// A fixed-size text without allocation: appends are cut at the capacity.
class Str {
public:
    Str() { buf_[0] = '\0'; }
    Str(const char *s) {  // NOLINT: implicit on purpose
        buf_[0] = '\0';
        *this += s;
    }
    Str &operator+=(const char *s) {
        for (; s && *s && len_ < kCap - 1; ++s) buf_[len_++] = *s;
        buf_[len_] = '\0';
        return *this;
    }
    Str &operator+=(const Str &o) { return *this += o.c_str(); }
    friend Str operator+(Str a, const Str &b) { return a += b; }
    friend Str operator+(Str a, const char *b) { return a += b; }
    bool empty() const { return len_ == 0; }
    const char *c_str() const { return buf_; }
    size_t size() const { return len_; }

private:
    static constexpr size_t kCap = 768;
    char buf_[kCap];
    size_t len_ = 0;
};

// A number in shortest form up to `digits` significant digits; NaN and infinities in words.
inline Str num(double v, int digits = 10) {
    if (std::isnan(v)) return "empty or not a number";
    if (std::isinf(v)) return v > 0 ? "infinity" : "-infinity";
    char buf[32];
    const auto res =
        std::to_chars(buf, buf + sizeof buf - 1, v, std::chars_format::general, digits);
    *res.ptr = '\0';
    return buf;
}

inline Str whole(long long v) {
    char buf[32];
    const auto res = std::to_chars(buf, buf + sizeof buf - 1, v);
    *res.ptr = '\0';
    return buf;
}

// Writes s into text (at most size bytes, NUL-terminated, cut if longer).
inline void copy_out(const Str &s, char *text, size_t size) {
    if (!text || size == 0) return;
    const size_t n = s.size() < size - 1 ? s.size() : size - 1;
    std::memcpy(text, s.c_str(), n);
    text[n] = '\0';
}

}  // namespace cto::table

#endif  // CTO_TABLE_TEXT_HPP
