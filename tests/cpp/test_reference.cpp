// The core against the 50-digit reference tables in tests/reference (written by
// tests/reference/generate.py with mpmath from methods independent of the library's
// closed forms: backward induction, root finding on the stationary conditions, numerical
// maximisation and differentiation, enumeration; see tests/reference/README.md for each
// table's method and published source).
//
// Every row is evaluated through the table-driven interface (cto_function_find + cto_call)
// with all arguments as written in the table.  The status must match exactly; NaN is
// expected exactly where the table says nan; otherwise the value must agree with the
// 25-digit expected value to
//   relative error <= 1e-15, or
//   for the functions whose result is a sum of signed money terms (no-deal value plus a
//   share of the surplus above it: breakdown, outside and inside options, solve, deadline,
//   Nash, risk-averse; the stake in delay_cost; implied_factor, whose result is a
//   fraction), when |expected| < scale: absolute error <= 1e-15 x scale, where scale is
//   |surplus| (|stake| for delay_cost, 1 for implied_factor).
// Integer outputs of solve (binding, rational) must match exactly.  Expected values below
// the smallest normal double (DBL_MIN) are compared relative to DBL_MIN, since a double
// result there has lost relative precision by gradual underflow.
#include <catch2/catch.hpp>

#include <cerrno>
#include <cfloat>
#include <cmath>
#include <cstdlib>
#include <fstream>
#include <iomanip>
#include <iostream>
#include <map>
#include <set>
#include <sstream>
#include <string>
#include <vector>

#include "counteroffer/counteroffer.h"
#include "reference_tables.inc"
#include "test_csv.hpp"

#ifndef CTO_REFERENCE_DIR
#error "CTO_REFERENCE_DIR must name the directory of the reference tables"
#endif

namespace {

constexpr long double kTol = 1e-15L;

struct Table {
    std::string name;
    std::vector<std::string> header;
    std::vector<std::vector<std::string>> rows;  // fields of each data row
    bool found = false;
};

Table read_table(const std::string &name) {
    Table t;
    t.name = name;
    std::ifstream in(std::string(CTO_REFERENCE_DIR) + "/" + name + ".csv");
    if (!in) return t;
    t.found = true;
    std::string line;
    if (std::getline(in, line)) t.header = cto_test::split_csv(line);
    while (std::getline(in, line)) {
        if (line.empty()) continue;
        t.rows.push_back(cto_test::split_csv(line));
    }
    return t;
}

bool parse_double(const std::string &s, double *v) {
    errno = 0;
    char *end = nullptr;
    *v = std::strtod(s.c_str(), &end);
    return end != s.c_str() && *end == '\0';
}

bool parse_long_double(const std::string &s, long double *v) {
    char *end = nullptr;
    *v = std::strtold(s.c_str(), &end);
    return end != s.c_str() && *end == '\0';
}

int status_code(const std::string &s) {
    if (s == "ok") return CTO_OK;
    if (s == "invalid") return CTO_E_INVALID;
    if (s == "no_deal") return CTO_E_NO_DEAL;
    if (s == "indeterminate") return CTO_E_INDETERMINATE;
    if (s == "no_convergence") return CTO_E_NO_CONVERGENCE;
    return -1;
}

// The argument whose magnitude sets the absolute tolerance near zero, or "" when the
// function is held to relative error only; "1" means a scale of 1.
std::string scale_argument(const std::string &fn) {
    static const std::map<std::string, std::string> m = {
        {"breakdown_share", "surplus"}, {"outside_option_share", "surplus"},
        {"inside_option_share", "surplus"}, {"solve", "surplus"}, {"solve_from_rates", "surplus"},
        {"deadline_share", "surplus"}, {"nash_share", "surplus"},
        {"risk_averse_share", "surplus"}, {"delay_cost", "stake"},
        {"implied_factor", "1"}};
    const auto it = m.find(fn);
    return it == m.end() ? std::string() : it->second;
}

std::string row_text(const Table &t, size_t r) {
    std::ostringstream os;
    const auto &row = t.rows[r];
    for (size_t j = 0; j < row.size() && j < t.header.size(); ++j) {
        if (t.header[j] == "source") continue;
        os << (j ? ", " : "") << t.header[j] << "=" << row[j];
    }
    return os.str();
}

struct Result {
    size_t rows = 0;
    long double worst = 0.0L;  // worst error used for the decision (relative, or abs/scale)
    size_t worst_row = 0;
    std::string worst_kind = "relative";
    std::vector<std::string> failures;
};

// The number of argument columns: those before "status".
size_t arg_columns(const Table &t) {
    for (size_t j = 0; j < t.header.size(); ++j)
        if (t.header[j] == "status") return j;
    return t.header.size();
}

Result check_table(const cto_function_info *f, const Table &t) {
    Result res;
    res.rows = t.rows.size();
    // A table may hold the first outputs only (outputs appended later are checked by the
    // function's own tests) and leave out trailing arguments with defaults (appended
    // later: the table's rows take their defaults); the caller checked the header.
    const size_t na = arg_columns(t), no = t.header.size() - na - 2;
    const std::string scale_arg = scale_argument(f->name);
    size_t scale_col = na;
    for (size_t j = 0; j < na; ++j)
        if (scale_arg == f->args[j].name) scale_col = j;
    for (size_t r = 0; r < t.rows.size(); ++r) {
        const auto &row = t.rows[r];
        std::ostringstream why;
        if (row.size() != na + 2 + no) {
            why << "has " << row.size() << " fields, expected " << (na + 2 + no);
            res.failures.push_back("line " + std::to_string(r + 2) + ": " + why.str());
            continue;
        }
        std::vector<double> args(static_cast<size_t>(f->n_args));
        bool ok = true;
        for (size_t j = 0; j < na; ++j) ok = ok && parse_double(row[j], &args[j]);
        for (size_t j = na; j < args.size(); ++j) args[j] = f->args[j].default_value;
        const int want_status = status_code(row[na]);
        std::vector<long double> want(no);
        for (size_t k = 0; k < no; ++k) ok = ok && parse_long_double(row[na + 1 + k], &want[k]);
        if (!ok || want_status < 0) {
            res.failures.push_back("line " + std::to_string(r + 2) + ": unreadable row: " + row_text(t, r));
            continue;
        }
        std::vector<double> got(static_cast<size_t>(f->n_outputs), -12345.0);
        int bad = -2;
        const int st = cto_call(f->id, args.data(), got.data(), &bad);
        long double scale = 0.0L;
        if (scale_arg == "1") scale = 1.0L;
        else if (scale_col < na) scale = std::fabs(static_cast<long double>(args[scale_col]));
        bool row_ok = st == want_status;
        if (!row_ok) why << "status " << cto_status_name(st) << ", expected " << row[na] << "; ";
        for (size_t k = 0; k < no; ++k) {
            const long double w = want[k];
            const long double g = got[k];
            const std::string oname = f->outputs[k].name;
            const bool integer_output = oname == "binding" || oname == "rational" ||
                                        oname == "delayed";
            if (std::isnan(w)) {
                if (!std::isnan(g)) {
                    row_ok = false;
                    why << oname << " = " << std::setprecision(17) << got[k] << ", expected nan; ";
                }
                continue;
            }
            if (!std::isfinite(g)) {
                row_ok = false;
                why << oname << " = " << got[k] << ", expected " << row[na + 1 + k] << "; ";
                continue;
            }
            if (integer_output) {
                if (g != w) {
                    row_ok = false;
                    why << oname << " = " << got[k] << ", expected " << row[na + 1 + k] << "; ";
                }
                continue;
            }
            const long double diff = std::fabs(g - w);
            // Below the smallest normal double a result cannot keep its relative
            // precision (gradual underflow): the denominator is floored at DBL_MIN.
            const long double den = std::fmax(std::fabs(w), static_cast<long double>(DBL_MIN));
            long double err = diff / den;
            std::string kind = "relative";
            if (err > kTol && scale > 0.0L && std::fabs(w) < scale) {
                err = diff / scale;  // absolute error in units of the scale
                kind = "absolute/" + scale_arg;
            }
            if (err > res.worst || (r == 0 && k == 0)) {
                if (err > res.worst) {
                    res.worst = err;
                    res.worst_row = r;
                    res.worst_kind = kind + " (" + oname + ")";
                }
            }
            if (!(err <= kTol)) {
                row_ok = false;
                why << oname << " = " << std::setprecision(17) << got[k] << ", expected "
                    << row[na + 1 + k] << " (" << kind << " error " << std::setprecision(3)
                    << static_cast<double>(err) << "); ";
            }
        }
        if (!row_ok)
            res.failures.push_back("line " + std::to_string(r + 2) + ": " + why.str() +
                                   "inputs: " + row_text(t, r));
    }
    return res;
}

}  // namespace

TEST_CASE("reference tables: complete, headers in catalogue order", "[reference]") {
    // Source: the catalogue (lib/functions, docs/reference/functions.md) fixes names and
    // argument order; the generator writes every argument with defaults filled in, then
    // status, outputs and source.
    size_t total = 0;
    const size_t n = cto_function_count();
    REQUIRE(n >= 20);
    for (size_t i = 0; i < n; ++i) {
        const cto_function_info *f = cto_function_at(i);
        REQUIRE(f != nullptr);
        INFO("function " << f->name);
        REQUIRE(cto_function_find(f->name) == f);
        if (const char *ext = external_reference(f->name)) {
            // Another layout, checked by the function's own tests: it must exist.
            std::ifstream in(std::string(CTO_REFERENCE_DIR) + "/" + ext);
            CHECK(in.good());
            continue;
        }
        const Table t = read_table(f->name);
        CHECK(t.found);
        // Arguments, status, the first outputs (all, or those a table was written with
        // before more were appended), source.
        std::vector<std::string> want;
        const int n_args = static_cast<int>(arg_columns(t));
        CHECK(n_args <= f->n_args);
        for (int j = 0; j < n_args && j < f->n_args; ++j) want.push_back(f->args[j].name);
        for (int j = n_args; j < f->n_args; ++j) CHECK(f->args[j].has_default);  // left out
        want.push_back("status");
        const int n_cols = static_cast<int>(t.header.size()) - n_args - 2;
        CHECK(n_cols >= 1);
        CHECK(n_cols <= f->n_outputs);
        for (int k = 0; k < n_cols && k < f->n_outputs; ++k) want.push_back(f->outputs[k].name);
        want.push_back("source");
        CHECK(t.header == want);
        CHECK(t.rows.size() >= 100);
        // every status the table uses is one of the five names
        std::set<std::string> statuses;
        for (const auto &row : t.rows)
            if (row.size() > static_cast<size_t>(n_args)) statuses.insert(row[static_cast<size_t>(n_args)]);
        for (const auto &s : statuses) CHECK(status_code(s) >= 0);
        total += t.rows.size();
    }
    std::cout << "reference tables: " << total << " rows over " << n << " functions\n";
    CHECK(total >= 2000);
}

TEST_CASE("reference tables: every row within 1e-15 of the 50-digit value", "[reference]") {
    const size_t n = cto_function_count();
    size_t total_fail = 0;
    // The accuracy report (function, rows, worst error, kind), from which
    // lib/gen/gen_accuracy.py writes the README's accuracy table.
    std::ofstream report(CTO_ACCURACY_REPORT);
    report << "function\trows\tworst\tkind\n";
    for (size_t i = 0; i < n; ++i) {
        const cto_function_info *f = cto_function_find(cto_function_at(i)->name);
        REQUIRE(f != nullptr);
        if (external_reference(f->name)) continue;  // checked by the function's own tests
        const Table t = read_table(f->name);
        if (!t.found || arg_columns(t) > static_cast<size_t>(f->n_args) ||
            t.header.size() < arg_columns(t) + 3 ||
            t.header.size() > arg_columns(t) + static_cast<size_t>(f->n_outputs) + 2) {
            FAIL_CHECK("table " << f->name << " missing or with a wrong header");
            continue;
        }
        const Result r = check_table(f, t);
        std::cout << std::left << std::setw(22) << f->name << std::right << std::setw(5) << r.rows
                  << " rows, worst error " << std::setprecision(3) << std::scientific
                  << static_cast<double>(r.worst) << std::defaultfloat << " " << r.worst_kind
                  << " at line " << (r.worst_row + 2) << ", failures " << r.failures.size() << "\n";
        report << f->name << "\t" << r.rows << "\t" << std::setprecision(3) << std::scientific
               << static_cast<double>(r.worst) << std::defaultfloat << "\t" << r.worst_kind << "\n";
        size_t shown = 0;
        for (const auto &msg : r.failures) {
            if (shown++ < 12) std::cout << "  FAIL " << f->name << " " << msg << "\n";
        }
        if (r.failures.size() > 12)
            std::cout << "  ... " << (r.failures.size() - 12) << " more failures in " << f->name << "\n";
        INFO("function " << f->name << ": " << r.failures.size() << " rows outside tolerance");
        CHECK(r.failures.empty());
        total_fail += r.failures.size();
    }
    std::cout << "reference tables: " << total_fail << " rows outside tolerance\n";
}

TEST_CASE("reference checker: flags a value 1e-14 off, a wrong status and a missing NaN", "[reference]") {
    // The checker itself must be able to fail: perturb copies of real rows.
    const cto_function_info *f = cto_function_find("share");
    REQUIRE(f != nullptr);
    const Table t = read_table("share");
    REQUIRE(t.found);
    const size_t na = static_cast<size_t>(f->n_args);
    size_t ok_row = t.rows.size(), nan_row = t.rows.size();
    for (size_t r = 0; r < t.rows.size(); ++r) {
        long double w = 0.0L;
        if (t.rows[r][na] == "ok" && parse_long_double(t.rows[r][na + 1], &w) && w > 0.01L &&
            ok_row == t.rows.size())
            ok_row = r;
        if (t.rows[r][na] == "indeterminate" && nan_row == t.rows.size()) nan_row = r;
    }
    REQUIRE(ok_row < t.rows.size());
    REQUIRE(nan_row < t.rows.size());
    Table one = t;
    one.rows = {t.rows[ok_row]};
    CHECK(check_table(f, one).failures.empty());
    long double w = 0.0L;
    REQUIRE(parse_long_double(one.rows[0][na + 1], &w));
    std::ostringstream os;
    os << std::setprecision(25) << w * (1.0L + 1e-14L);
    one.rows[0][na + 1] = os.str();
    CHECK(check_table(f, one).failures.size() == 1);
    one.rows = {t.rows[ok_row]};
    one.rows[0][na] = "no_deal";
    CHECK(check_table(f, one).failures.size() == 1);
    one.rows = {t.rows[nan_row]};
    CHECK(check_table(f, one).failures.empty());
    one.rows[0][na + 1] = "0.5";
    CHECK(check_table(f, one).failures.size() == 1);
}
