// counteroffer._structs: the struct entry points of the C ABI that are not rows of the
// function table -- cto_share_range, cto_share_swing (ranges under uncertainty) and
// cto_offer_path_rows (the offer path, a row per round).  Types are converted and
// nothing else: every check is the library's, and its status, `bad` index and reason in
// words (cto_range_explain, cto_swing_explain on the outcome) are returned as they are
// for the Python layer to apply its error policy.
// The library runs with the GIL released (it allocates nothing Python owns).
#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <algorithm>
#include <cstdint>
#include <cstring>
#include <limits>
#include <stdexcept>
#include <string>
#include <tuple>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace py = pybind11;

namespace {

// The longest reason in words kept (the library cuts a longer one).
constexpr size_t kReasonSize = 1024;

// (kind, low, mode, high) per input, in the catalogue order of solve_from_rates.
using ArgTuple = std::tuple<int, double, double, double>;

cto_range_input make_input(const std::vector<ArgTuple> &args) {
    if (args.size() != CTO_RANGE_INPUTS)
        throw py::value_error("share_range takes " + std::to_string(CTO_RANGE_INPUTS) +
                              " inputs, got " + std::to_string(args.size()));
    cto_range_input in;
    std::memset(&in, 0, sizeof in);
    in.size = sizeof in;
    for (size_t j = 0; j < args.size(); ++j) {
        in.arg[j].kind = std::get<0>(args[j]);
        in.arg[j].low = std::get<1>(args[j]);
        in.arg[j].mode = std::get<2>(args[j]);
        in.arg[j].high = std::get<3>(args[j]);
    }
    return in;
}

py::dict estimate(const cto_range_estimate &e) {
    py::dict d;
    d["value"] = e.value;
    d["se"] = e.se;
    d["half_width"] = e.half_width;
    d["digits"] = e.digits;
    return d;
}

// Options left as None keep the library's defaults (cto_range_default_options).
py::dict share_range(const std::vector<ArgTuple> &args, const std::vector<double> &probs,
                     std::uint64_t seed, int replicates, int digits, int log2_start,
                     int log2_max, int threads) {
    const cto_range_input in = make_input(args);
    cto_range_options opt;
    cto_range_default_options(&opt);
    // More than the struct holds is the library's "probabilities" error (it reads none of
    // them then): the count is passed as given, the values that fit are stored.
    const size_t n = std::min<size_t>(probs.size(), std::numeric_limits<int>::max());
    opt.n_probs = static_cast<int>(n);
    for (size_t k = 0; k < n && k < CTO_RANGE_MAX_PROBS; ++k) opt.probs[k] = probs[k];
    opt.seed = seed;
    opt.replicates = replicates;
    opt.digits = digits;
    opt.log2_start = log2_start;
    opt.log2_max = log2_max;
    opt.threads = threads;
    cto_range_outcome out;
    std::memset(&out, 0, sizeof out);
    out.size = sizeof out;
    char reason[kReasonSize];
    {
        py::gil_scoped_release release;
        cto_share_range(&in, &opt, &out);
        cto_range_explain(&in, &opt, &out, reason, sizeof reason);
    }
    py::dict d;
    d["status"] = out.status;
    d["bad"] = out.bad;
    d["reason"] = std::string(reason);
    d["spec_version"] = out.spec_version;
    py::list p, own, other;
    for (int k = 0; k < out.n_probs && k < CTO_RANGE_MAX_PROBS; ++k) {
        p.append(out.probs[k]);
        own.append(estimate(out.own[k]));
        other.append(estimate(out.other[k]));
    }
    d["probabilities"] = p;
    d["own"] = own;
    d["other"] = other;
    d["own_mean"] = estimate(out.own_mean);
    d["other_mean"] = estimate(out.other_mean);
    d["p_rational"] = estimate(out.p_rational);
    d["p_own_binds"] = estimate(out.p_own_binds);
    d["p_other_binds"] = estimate(out.p_other_binds);
    d["edge_fraction"] = estimate(out.edge_fraction);
    d["points_per_replicate"] = out.points_per_replicate;
    d["replicates"] = out.replicates;
    d["log2_used"] = out.log2_used;
    d["dimension"] = out.dimension;
    return d;
}

py::dict share_swing(const std::vector<ArgTuple> &args) {
    const cto_range_input in = make_input(args);
    cto_swing_outcome out;
    std::memset(&out, 0, sizeof out);
    out.size = sizeof out;
    char reason[kReasonSize];
    {
        py::gil_scoped_release release;
        cto_share_swing(&in, &out);
        cto_swing_explain(&in, &out, reason, sizeof reason);
    }
    py::dict d;
    d["status"] = out.status;
    d["bad"] = out.bad;
    d["reason"] = std::string(reason);
    d["base"] = out.base;
    d["base_status"] = out.base_status;
    py::list rows;
    for (int k = 0; k < out.n_rows && k < CTO_RANGE_INPUTS; ++k) {
        const cto_swing_row &r = out.row[k];
        rows.append(py::make_tuple(r.input, r.at_low, r.at_high, r.swing, r.status_low,
                                   r.status_high));
    }
    d["rows"] = rows;
    return d;
}

// The offer path with up to `capacity` rows: (status, totals dict, rows as a list of
// (offer, cutoff, round_probability, cumulative_probability)).
py::tuple offer_path_rows(double low, double high, double offerer_factor,
                          double responder_factor, std::int64_t rounds, double known_value,
                          int offerer, std::int64_t capacity) {
    if (capacity < 0) throw py::value_error("capacity must be at least 0");
    std::vector<cto_offer_row> rows(static_cast<size_t>(capacity));
    cto_offer_outcome out;
    std::memset(&out, 0, sizeof out);
    out.size = sizeof out;
    int st;
    {
        py::gil_scoped_release release;
        st = cto_offer_path_rows(low, high, offerer_factor, responder_factor, rounds, known_value,
                                 offerer, capacity ? rows.data() : nullptr, capacity, &out);
    }
    py::dict t;
    t["regime"] = out.regime;
    t["rounds_used"] = out.rounds_used;
    t["rows_written"] = out.rows_written;
    t["stages"] = out.stages;
    t["pieces"] = out.pieces;
    t["agreement_probability"] = out.agreement_probability;
    t["expected_round"] = out.expected_round;
    t["offerer_value"] = out.offerer_value;
    t["responder_value"] = out.responder_value;
    t["opening_offer"] = out.opening_offer;
    t["last_cutoff"] = out.last_cutoff;
    py::list r;
    const std::int64_t n = std::max<std::int64_t>(0, std::min(out.rows_written, capacity));
    for (std::int64_t i = 0; i < n; ++i) {
        const cto_offer_row &w = rows[static_cast<size_t>(i)];
        r.append(py::make_tuple(w.offer, w.cutoff, w.round_probability, w.cumulative_probability));
    }
    return py::make_tuple(st, t, r);
}

}  // namespace

PYBIND11_MODULE(_structs, m) {
    m.doc() = "counteroffer's struct entry points: ranges, swing, offer path rows (internal)";
    m.attr("E_PRECISION") = CTO_E_PRECISION;
    m.attr("RANGE_FIXED") = CTO_RANGE_FIXED;
    m.attr("RANGE_UNIFORM") = CTO_RANGE_UNIFORM;
    m.attr("RANGE_TRIANGULAR") = CTO_RANGE_TRIANGULAR;
    m.attr("RANGE_PERT") = CTO_RANGE_PERT;
    m.attr("RANGE_INPUTS") = CTO_RANGE_INPUTS;
    m.attr("RANGE_MAX_PROBS") = CTO_RANGE_MAX_PROBS;
    cto_range_options d;
    cto_range_default_options(&d);
    py::dict defaults;
    py::list probs;
    for (int k = 0; k < d.n_probs; ++k) probs.append(d.probs[k]);
    defaults["probabilities"] = py::tuple(probs);
    defaults["seed"] = d.seed;
    defaults["replicates"] = d.replicates;
    defaults["digits"] = d.digits;
    defaults["log2_start"] = d.log2_start;
    defaults["log2_max"] = d.log2_max;
    defaults["threads"] = d.threads;
    m.attr("RANGE_DEFAULTS") = defaults;
    m.def("share_range", &share_range, py::arg("args"), py::arg("probabilities"),
          py::arg("seed"), py::arg("replicates"), py::arg("digits"), py::arg("log2_start"),
          py::arg("log2_max"), py::arg("threads"),
          "cto_share_range: args are 14 (kind, low, mode, high); a dict of the outcome "
          "with the reason in words (cto_range_explain)");
    m.def("share_swing", &share_swing, py::arg("args"),
          "cto_share_swing: a dict with status, bad, reason, base and the rows "
          "(input, at_low, at_high, swing, status_low, status_high)");
    m.def("offer_path_rows", &offer_path_rows, py::arg("private_low"), py::arg("private_high"),
          py::arg("offerer_factor"), py::arg("responder_factor"), py::arg("rounds"),
          py::arg("known_value"), py::arg("offerer"), py::arg("capacity"),
          "cto_offer_path_rows: (status, totals, rows)");
}
