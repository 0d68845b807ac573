// counteroffer._core: the C ABI of the counteroffer library as NumPy ufuncs.
//
// Nothing here knows any model.  For every row of the library's function table
// (cto_function_count / cto_function_at) two ufuncs are built with the NumPy C API:
//   <name>          n_args float64 inputs -> n_outputs float64 outputs
//   <name>_status   the same plus one int8 output: each element's status code
// Their inner loop is one call of cto_call_strided, the library's own strided loop;
// NumPy runs it with the GIL released (float64 loops need no Python API).  The
// per-status counts of cto_batch_report, and the value of the first invalid
// argument, are added to a thread-local tally that the Python layer resets before
// and reads after each ufunc call, to apply its error policy once per call.
// NumPy runs a ufunc's inner loop on the calling thread, so a thread-local tally
// belongs to exactly one call at a time.  A long loop is split over a few threads
// (set_num_threads); their reports are merged into the calling thread's tally.
#include <Python.h>

#include <pybind11/pybind11.h>
#include <pybind11/stl.h>

#include <numpy/arrayobject.h>
#include <numpy/ufuncobject.h>

#include <algorithm>
#include <array>
#include <atomic>
#include <cfenv>
#include <cstring>
#include <string>
#include <thread>
#include <vector>

#include "counteroffer/counteroffer.h"

namespace py = pybind11;

namespace {

static_assert(sizeof(npy_intp) == sizeof(ptrdiff_t), "npy_intp must match ptrdiff_t");
constexpr int kMaxOperands = 32;  // NPY_MAXARGS is 32 on NumPy 1.x, 64 on 2.x

struct Tally {
    unsigned long long count[CTO_REPORT_SLOTS] = {};
    int bad_arg = -1;
    double bad_value = 0.0;
};
thread_local Tally g_tally;

struct LoopData {
    int id;
    int nin;
    int nout;
};

// Worker threads per ufunc call (the library is stateless and thread-safe, so a long
// loop is split into contiguous pieces, one per thread, and their reports merged).
std::atomic<int> g_threads{1};
constexpr size_t kMinPerThread = size_t{1} << 15;  // below this a thread costs more than it saves

struct Piece {
    size_t start = 0;
    size_t n = 0;
    int rc = CTO_OK;
    cto_batch_report rep{};
};

void run_piece(const LoopData *d, char **args, const npy_intp *steps, const ptrdiff_t *as,
               const ptrdiff_t *os, signed char *st, ptrdiff_t ss, Piece &p) noexcept {
    std::array<const char *, kMaxOperands> a{};
    std::array<char *, kMaxOperands> o{};
    const ptrdiff_t start = static_cast<ptrdiff_t>(p.start);
    for (int j = 0; j < d->nin; ++j) a[static_cast<size_t>(j)] = args[j] + start * steps[j];
    for (int k = 0; k < d->nout; ++k)
        o[static_cast<size_t>(k)] = args[d->nin + k] + start * steps[d->nin + k];
    std::memset(&p.rep, 0, sizeof p.rep);
    p.rep.size = sizeof p.rep;
    p.rc = cto_call_strided(d->id, p.n, a.data(), as, o.data(), os, st ? st + start * ss : nullptr,
                            ss, &p.rep);
}

// Shared body of both loops; `with_status` adds the int8 status operand.
template <bool with_status>
void inner_loop(char **args, const npy_intp *dims, const npy_intp *steps, void *data) {
    const LoopData *d = static_cast<const LoopData *>(data);
    const size_t n = static_cast<size_t>(dims[0]);
    std::array<ptrdiff_t, kMaxOperands> as{};
    std::array<ptrdiff_t, kMaxOperands> os{};
    for (int j = 0; j < d->nin; ++j) as[static_cast<size_t>(j)] = steps[j];
    for (int k = 0; k < d->nout; ++k) os[static_cast<size_t>(k)] = steps[d->nin + k];
    signed char *st = nullptr;
    ptrdiff_t ss = 0;
    if (with_status) {
        st = reinterpret_cast<signed char *>(args[d->nin + d->nout]);
        ss = steps[d->nin + d->nout];
    }
    size_t pieces = static_cast<size_t>(std::max(1, g_threads.load(std::memory_order_relaxed)));
    pieces = std::max<size_t>(1, std::min(pieces, n / kMinPerThread));
    std::vector<Piece> part(pieces);
    for (size_t p = 0; p < pieces; ++p) {
        part[p].start = n * p / pieces;
        part[p].n = n * (p + 1) / pieces - part[p].start;
    }
    std::vector<std::thread> workers;
    workers.reserve(pieces - 1);
    size_t inline_from = 1;
    for (size_t p = 1; p < pieces; ++p) {
        try {
            workers.emplace_back(run_piece, d, args, steps, as.data(), os.data(), st, ss,
                                 std::ref(part[p]));
            inline_from = p + 1;
        } catch (...) {  // no thread available: run the rest on this thread
            break;
        }
    }
    run_piece(d, args, steps, as.data(), os.data(), st, ss, part[0]);
    for (size_t p = inline_from; p < pieces; ++p)
        run_piece(d, args, steps, as.data(), os.data(), st, ss, part[p]);
    for (std::thread &w : workers) w.join();
    // The library reports every problem through statuses; the floating-point flags its
    // arithmetic raises on the way (NaN compared, inf produced and rejected) carry no
    // information, and NumPy would turn them into RuntimeWarnings after the loop.
    std::feclearexcept(FE_ALL_EXCEPT);
    Tally &t = g_tally;
    for (const Piece &p : part) {
        if (p.rc != CTO_OK) {  // a defect (bad id or pointer): every element is internal
            t.count[CTO_E_INTERNAL] += p.n;
            continue;
        }
        for (int s = 0; s < CTO_REPORT_SLOTS; ++s) t.count[s] += p.rep.count[s];
        if (p.rep.count[CTO_E_INVALID] > 0 && t.bad_arg < 0 && p.rep.first_bad_arg >= 0 &&
            p.rep.first_bad_arg < d->nin) {
            const int j = p.rep.first_bad_arg;
            const ptrdiff_t i = static_cast<ptrdiff_t>(p.start + p.rep.first_index[CTO_E_INVALID]);
            double v;
            std::memcpy(&v, args[j] + i * steps[j], sizeof v);
            t.bad_arg = j;
            t.bad_value = v;
        }
    }
}

// Storage that NumPy keeps pointers to for the life of the process.
struct UfuncStorage {
    PyUFuncGenericFunction funcs[1];
    void *data[1];
    std::vector<char> types;
    LoopData loop;
    std::string name;
    std::string doc;
};

py::object make_ufunc(const cto_function_info *f, bool with_status) {
    auto *s = new UfuncStorage;  // owned by the ufunc for the life of the process
    s->loop = LoopData{f->id, f->n_args, f->n_outputs};
    s->funcs[0] = with_status ? &inner_loop<true> : &inner_loop<false>;
    s->data[0] = &s->loop;
    s->types.assign(static_cast<size_t>(f->n_args + f->n_outputs), static_cast<char>(NPY_DOUBLE));
    if (with_status) s->types.push_back(static_cast<char>(NPY_INT8));
    s->doc = std::string(f->summary) + " (raw ufunc: no defaults, no error policy; use "
             "counteroffer." + f->name + ")";
    s->name = std::string(f->name) + (with_status ? "_status" : "");
    PyObject *u = PyUFunc_FromFuncAndData(
        s->funcs, s->data, s->types.data(), 1, f->n_args,
        f->n_outputs + (with_status ? 1 : 0), PyUFunc_None, s->name.c_str(),
        s->doc.c_str(), 0);
    if (!u) throw py::error_already_set();
    return py::reinterpret_steal<py::object>(u);
}

py::dict arg_dict(const cto_arg_info &a) {
    py::dict d;
    d["name"] = a.name;
    d["label"] = a.label;
    d["help"] = a.help;
    d["kind"] = a.kind;
    d["has_default"] = a.has_default != 0;
    d["default"] = a.default_value;
    d["min_count"] = a.min_count;
    py::list choices;
    if (a.choices)
        for (const char *const *c = a.choices; *c; ++c) choices.append(*c);
    d["choices"] = choices;
    return d;
}

py::list output_words(int id, int k);

py::list catalogue() {
    py::list out;
    const size_t n = cto_function_count();
    for (size_t i = 0; i < n; ++i) {
        const cto_function_info *f = cto_function_at(i);
        if (!f) break;
        py::dict d;
        d["id"] = f->id;
        d["name"] = f->name;
        d["calc_name"] = f->calc_name;
        d["summary"] = f->summary;
        d["formula"] = f->formula;
        d["source"] = f->source;
        d["statuses"] = f->statuses;
        py::list args;
        for (int j = 0; j < f->n_args; ++j) args.append(arg_dict(f->args[j]));
        d["args"] = args;
        py::list outs;
        for (int k = 0; k < f->n_outputs; ++k) {
            py::dict o;
            o["name"] = f->outputs[k].name;
            o["help"] = f->outputs[k].help;
            o["words"] = output_words(f->id, k);
            outs.append(o);
        }
        d["outputs"] = outs;
        out.append(d);
    }
    return out;
}

// One evaluation with every argument given: (status, bad_arg, outputs).
py::tuple call(int id, const std::vector<double> &args) {
    if (id < 0 || static_cast<size_t>(id) >= cto_function_count())
        throw py::index_error("no catalogue function with id " + std::to_string(id));
    const cto_function_info *f = cto_function_at(static_cast<size_t>(id));
    if (static_cast<int>(args.size()) != f->n_args)
        throw py::type_error(std::string(f->name) + " takes " + std::to_string(f->n_args) +
                             " arguments, got " + std::to_string(args.size()));
    std::vector<double> outs(static_cast<size_t>(f->n_outputs));
    int bad = -1;
    const int st = cto_call(id, args.data(), outs.data(), &bad);
    py::tuple o(outs.size());
    for (size_t k = 0; k < outs.size(); ++k) o[k] = outs[k];
    return py::make_tuple(st, bad, o);
}

void tally_reset() { g_tally = Tally{}; }

// (low, high) outside which a valid value of argument `j` of function `id` looks like a
// typing slip (cto_arg_plausible_range), or None when the argument has no such range.
py::object arg_plausible_range(int id, int j) {
    double lo = 0.0, hi = 0.0;
    if (cto_arg_plausible_range(id, j, &lo, &hi) != CTO_OK) return py::none();
    return py::make_tuple(lo, hi);
}

// The words of a coded output (cto_output_word for codes 0, 1, ... until there is none);
// empty for an output that is a number.
py::list output_words(int id, int k) {
    py::list words;
    for (int code = 0; code < 64; ++code) {
        const char *w = cto_output_word(id, k, static_cast<double>(code));
        if (!w) break;
        words.append(w);
    }
    return words;
}

// Why function `id` gives what it gives for these arguments (cto_explain): (status, text).
py::tuple explain(int id, const std::vector<double> &args) {
    if (id < 0 || static_cast<size_t>(id) >= cto_function_count())
        throw py::index_error("no catalogue function with id " + std::to_string(id));
    const cto_function_info *f = cto_function_at(static_cast<size_t>(id));
    if (static_cast<int>(args.size()) != f->n_args)
        throw py::type_error(std::string(f->name) + " takes " + std::to_string(f->n_args) +
                             " arguments, got " + std::to_string(args.size()));
    std::array<char, 1024> text{};
    const int st = cto_explain(id, args.data(), text.data(), text.size());
    return py::make_tuple(st, std::string(text.data()));
}

py::tuple tally_take() {
    const Tally t = g_tally;
    g_tally = Tally{};
    py::tuple counts(CTO_REPORT_SLOTS);
    for (size_t s = 0; s < CTO_REPORT_SLOTS; ++s) counts[s] = t.count[s];
    return py::make_tuple(counts, t.bad_arg, t.bad_value);
}

}  // namespace

PYBIND11_MODULE(_core, m) {
    if (_import_array() < 0 || _import_umath() < 0) throw py::error_already_set();
    m.doc() = "counteroffer's C library as NumPy ufuncs (internal; use the counteroffer package)";

    m.attr("HEADER_VERSION") = CTO_VERSION_STRING;
    m.attr("REPORT_SLOTS") = CTO_REPORT_SLOTS;
    // The header's constants under their C names without the CTO_ prefix.
    m.attr("OK") = CTO_OK;
    m.attr("E_INVALID") = CTO_E_INVALID;
    m.attr("E_NO_DEAL") = CTO_E_NO_DEAL;
    m.attr("E_INDETERMINATE") = CTO_E_INDETERMINATE;
    m.attr("E_NO_CONVERGENCE") = CTO_E_NO_CONVERGENCE;
    m.attr("E_INTERNAL") = CTO_E_INTERNAL;
    m.attr("ARG_REAL") = CTO_ARG_REAL;
    m.attr("ARG_UNIT") = CTO_ARG_UNIT;
    m.attr("ARG_NONNEG") = CTO_ARG_NONNEG;
    m.attr("ARG_POSITIVE") = CTO_ARG_POSITIVE;
    m.attr("ARG_BOOL") = CTO_ARG_BOOL;
    m.attr("ARG_COUNT") = CTO_ARG_COUNT;
    m.attr("ARG_CHOICE") = CTO_ARG_CHOICE;
    m.attr("ARG_OPTIONAL") = CTO_ARG_OPTIONAL;
    m.attr("BINDS_NONE") = CTO_BINDS_NONE;
    m.attr("BINDS_OWN") = CTO_BINDS_OWN;
    m.attr("BINDS_OTHER") = CTO_BINDS_OTHER;
    m.attr("BINDS_BOTH") = CTO_BINDS_BOTH;
    m.def("arg_plausible_range", &arg_plausible_range, py::arg("id"), py::arg("arg_index"),
          "(low, high) outside which a valid value looks like a typing slip, or None "
          "(cto_arg_plausible_range)");
    m.def("explain", &explain, py::arg("id"), py::arg("args"),
          "why a function gives what it gives for every argument, in words: (status, text) "
          "(cto_explain)");

    m.def("version", [] { return std::string(cto_version_string()); },
          "the library's runtime version string");
    m.def("status_name", [](int s) { return std::string(cto_status_name(s)); }, py::arg("status"),
          "short name of a status code");
    m.def("status_message", [](int s) { return std::string(cto_status_message(s)); },
          py::arg("status"), "one sentence on what a status code means for the output");
    m.def("catalogue", &catalogue, "the library's function table as a list of dicts");
    m.def("call", &call, py::arg("id"), py::arg("args"),
          "evaluate one catalogue function with every argument: (status, bad_arg, outputs)");
    g_threads.store(static_cast<int>(std::max(1u, std::min(8u, std::thread::hardware_concurrency()))));
    m.def("set_num_threads", [](int k) {
        if (k < 1) throw py::value_error("set_num_threads: n = " + std::to_string(k) +
                                         " is invalid (at least 1)");
        return g_threads.exchange(k);
    }, py::arg("n"), "threads per ufunc call for long loops; returns the previous number");
    m.def("get_num_threads", [] { return g_threads.load(); },
          "threads per ufunc call for long loops");
    m.def("tally_reset", &tally_reset, "clear this thread's status tally");
    m.def("tally_take", &tally_take,
          "this thread's status tally since the last reset: (counts, bad_arg, bad_value); "
          "clears it");

    py::dict ufuncs;
    py::dict status_ufuncs;
    const size_t n = cto_function_count();
    for (size_t i = 0; i < n; ++i) {
        const cto_function_info *f = cto_function_at(i);
        if (!f || f->n_args + f->n_outputs + 1 > kMaxOperands) continue;
        ufuncs[f->name] = make_ufunc(f, false);
        status_ufuncs[f->name] = make_ufunc(f, true);
    }
    m.attr("ufuncs") = ufuncs;
    m.attr("status_ufuncs") = status_ufuncs;
}
