// addin_gen: writes the Calc add-in's generated sources from the library's catalogue
// table (cto_function_count / cto_function_at), so a new catalogue row needs no
// hand-written add-in code.  The functions that are not catalogue rows (DEALRANGE,
// DEALRANGEOUTCOME, DEALSWING, DEALOFFERPATH: src/range_args.h) take their arguments'
// text from the catalogue too; DEALREASON is written out here.
//
//   addin_gen OUTDIR [--test-build]
//
// --test-build adds the diagnostic DEALCALLPROBE (the call-overhead probe the sheet
// tests and the add-in benchmark use).  It is for the test build of the extension
// (counteroffer-test.oxt) only: the shipped counteroffer.oxt has no such function in
// its interface, its Function Wizard data or its library (addin/README.md).
//
// writes into OUTDIR:
//   XDealFunctions.idl   the UNO interface and service (one method per function)
//   CalcAddIns.xcu       Function Wizard metadata: names, descriptions, category
//   deal_methods_decl.inc  C++ declarations of the interface methods
//   deal_methods_def.inc   C++ definitions: each forwards to the generic evaluator
//   deal_functions.txt   one line per Calc function: Calc name, method, category,
//                        arguments as name=label (an optional name ends with ?)
//                        (read by the sheet tests to check the metadata)
//
// The stored names (service org.counteroffer.DealFunctions, method get<CamelName>)
// are part of every saved spreadsheet: see addin/README.md before changing them.
#include <counteroffer/counteroffer.h>

#include "../src/range_args.h"

#include <cctype>
#include <cstdio>
#include <fstream>
#include <iostream>
#include <set>
#include <sstream>
#include <string>
#include <vector>

namespace {

const char *const kService = "org.counteroffer.DealFunctions";
// The caution that results are model estimates, not advice, stands once, in the
// extension's description (addin/pkg/description-en.txt), not in every function.

// Every method of the interface: one per catalogue function, one "outcome" form
// for each function with more than one output, the functions that are not catalogue
// rows, and (test build only) the call-overhead probe.
struct Method {
    std::string method;     // IDL method name, e.g. getShare
    std::string calc;       // Calc display name, e.g. DEALSHARE
    std::string desc;       // Function Wizard description
    std::string category;   // Calc programmatic category
    std::vector<std::string> params, labels, helps;
    std::vector<bool> optional; // optional: `any`; required: sequence<sequence<any>>
    int id;                 // catalogue id, or -1 for the probe and the reason function
    bool outcome;           // array of every output
    bool reason = false;    // DEALREASON: a function name and its arguments (varargs)
    std::string call;       // a function that is not a catalogue row: the glue's call
};

std::string camel(const std::string &snake) {
    std::string r;
    bool up = true;
    for (char c : snake) {
        if (c == '_') {
            up = true;
            continue;
        }
        r += up ? static_cast<char>(std::toupper(static_cast<unsigned char>(c))) : c;
        up = false;
    }
    return r;
}

std::string xml(const std::string &s) {
    std::string r;
    for (char c : s) {
        switch (c) {
        case '&': r += "&amp;"; break;
        case '<': r += "&lt;"; break;
        case '>': r += "&gt;"; break;
        case '"': r += "&quot;"; break;
        default: r += c;
        }
    }
    return r;
}

// Identifiers that UNO IDL reserves; a catalogue argument with such a name gets the
// suffix "Arg" in the IDL (the xcu uses the same spelling).
bool idl_reserved(const std::string &s) {
    static const std::set<std::string> kw = {
        "any", "attribute", "boolean", "bound", "byte", "char", "const", "constants",
        "constrained", "double", "enum", "exception", "float", "get", "hyper", "in",
        "inout", "interface", "long", "maybeambiguous", "maybedefault", "maybevoid",
        "module", "needs", "observes", "oneway", "optional", "out", "property",
        "published", "raises", "readonly", "removable", "sequence", "service", "set",
        "short", "singleton", "string", "struct", "transient", "type", "typedef",
        "unsigned", "void", "TRUE", "FALSE"};
    return kw.count(s) != 0;
}

// First letter upper case, no trailing full stop (the caller adds punctuation).
std::string sentence(std::string s) {
    while (!s.empty() && (s.back() == '.' || s.back() == ' ')) s.pop_back();
    if (!s.empty()) s[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(s[0])));
    return s;
}

bool write_file(const std::string &path, const std::string &text) {
    std::ofstream f(path, std::ios::binary);
    f << text;
    f.close();
    if (!f) {
        std::cerr << "addin_gen: cannot write " << path << "\n";
        return false;
    }
    return true;
}

std::string default_text(const cto_arg_info &a) {
    std::ostringstream s;
    if (a.kind == CTO_ARG_BOOL) return a.default_value != 0.0 ? "TRUE" : "FALSE";
    if (a.kind == CTO_ARG_CHOICE && a.choices) {
        const long k = static_cast<long>(a.default_value);
        long i = 0;
        for (const char *const *c = a.choices; *c; ++c, ++i)
            if (i == k) return std::string("\"") + *c + "\"";
    }
    if (a.kind == CTO_ARG_OPTIONAL) return "none";
    s << a.default_value;
    return s.str();
}

// Whether function f can give "no deal": its statuses name no_deal, or it has the
// statuses of another function ("as share_from_rates") that does.
bool no_deal_possible(const cto_function_info *f, int depth = 0) {
    const std::string st = f && f->statuses ? f->statuses : "";
    if (st.find("no_deal") != std::string::npos) return true;
    if (depth > 8 || st.rfind("as ", 0) != 0) return false;
    size_t end = 3;
    while (end < st.size() && (std::isalnum(static_cast<unsigned char>(st[end])) || st[end] == '_'))
        ++end;
    return no_deal_possible(cto_function_find(st.substr(3, end - 3).c_str()), depth + 1);
}

// What a cell shows for "no deal", in plain words, for every function that can give it
// (where #N/A is explained in the Function Wizard; addin/README.md "Error values").
std::string no_deal_text(const cto_function_info *f) {
    if (!no_deal_possible(f)) return "";
    std::string s = " Shows #N/A when no deal is rational for both sides (DEALREASON says why";
    if (f->n_outputs > 1 && f->calc_name && *f->calc_name)
        s += std::string("; ") + f->calc_name + "OUTCOME shows the values without a deal";
    return s + ").";
}
const char *const kNoDealOutcomeText =
    " A case with no rational deal still fills its row: the values without a deal, and "
    "#VALUE! in a column that has no value without one.";

// The method of catalogue function f, with its arguments' Function Wizard text.
// "binding (none, ours, theirs or both)": an output and, when it is coded, its words.
std::string output_legend(const cto_function_info *f, int k) {
    std::string s = f->outputs[k].name;
    std::vector<std::string> words;
    for (double code = 0.0; const char *w = cto_output_word(f->id, k, code); code += 1.0)
        words.push_back(w);
    if (words.empty()) return s;
    s += " (";
    for (size_t i = 0; i < words.size(); ++i)
        s += (i == 0 ? "" : i + 1 == words.size() ? " or " : ", ") + words[i];
    return s + ")";
}

// What the cell shows: the summary, and the first output when the function has several
// (its help up to a ";": what follows is the no-deal case, which the cell shows as #N/A
// and the outcome form as values, see no_deal_text).
std::string returns_text(const cto_function_info *f) {
    std::string s = sentence(f->summary ? f->summary : "") + ".";
    if (f->n_outputs > 1) {
        std::string help = f->outputs[0].help ? f->outputs[0].help : "";
        if (no_deal_possible(f)) help = help.substr(0, help.find(';'));
        s += " Returns " + std::string(f->outputs[0].name) + ": " + help +
             " (the whole outcome: " + f->calc_name + "OUTCOME).";
    }
    return s;
}

// Argument a of a catalogue function, with its Function Wizard text; `also` is added to
// the help before the default (the ways a range function takes it).
void add_arg(Method &m, const cto_arg_info &a, const std::string &also = "") {
    // UNO IDL allows no lower-case letter after an underscore: ownFactor.
    std::string p = camel(a.name);
    p[0] = static_cast<char>(std::tolower(static_cast<unsigned char>(p[0])));
    if (idl_reserved(p)) p += "Arg";
    m.params.push_back(p);
    m.optional.push_back(a.has_default != 0);
    m.labels.push_back(a.label ? a.label : a.name);
    std::string h = sentence(a.help ? a.help : "") + also;
    if (a.has_default) {
        if (h.find("default") == std::string::npos) h += " (default " + default_text(a) + ")";
        h += ". Optional.";
    } else {
        h += ". Required.";
    }
    m.helps.push_back(h);
}

Method catalogue_method(const cto_function_info *f) {
    Method m;
    m.method = "get" + camel(f->name);
    m.calc = f->calc_name;
    m.desc = returns_text(f) + no_deal_text(f) +
             " Source: " + (f->source ? f->source : "") + ".";
    m.category = "Financial";
    m.id = f->id;
    m.outcome = false;
    for (int j = 0; j < f->n_args; ++j) add_arg(m, f->args[j]);
    return m;
}

// The array form of a function with several outputs: every output as a column.
Method outcome_method(const cto_function_info *f, const Method &m) {
    Method o = m;
    o.method += "Outcome";
    o.calc += "OUTCOME";
    std::string outs;
    for (int k = 0; k < f->n_outputs; ++k) outs += std::string(k ? ", " : "") + output_legend(f, k);
    o.desc = sentence(f->summary ? f->summary : "") +
             "; array form, one row per case with the columns " + outs +
             " (enter as a matrix formula)." + (no_deal_possible(f) ? kNoDealOutcomeText : "") +
             " Source: " + (f->source ? f->source : "") + ".";
    o.outcome = true;
    return o;
}

// The call-overhead probe (test build only), with the argument shape of DEALSHARE (two
// required, two optional), so that comparing the two measures the add-in's own work and
// not Calc's cost per parameter.
Method probe_method() {
    Method probe;
    probe.method = "getCallProbe";
    probe.calc = "DEALCALLPROBE";
    probe.desc = "Diagnostic: returns its first argument after the same argument "
                 "conversion as every DEAL function, with the argument shape of DEALSHARE; "
                 "measures the cost of an add-in call.";
    probe.category = "Add-In";
    probe.params = {"value", "other", "third", "fourth"};
    probe.optional = {false, false, true, true};
    probe.labels = {"Value", "Other", "Third", "Fourth"};
    probe.helps = {"Any number; returned unchanged. Required.",
                   "Any number; converted and ignored. Required.",
                   "Any number; converted and ignored (default 1). Optional.",
                   "Any number; converted and ignored (default 1). Optional."};
    probe.id = -1;
    probe.outcome = false;
    return probe;
}

// DEALREASON: a function's name, then its arguments (varargs).
Method reason_method() {
    Method why;
    why.method = "getReason";
    why.calc = "DEALREASON";
    why.desc = "Why a DEAL function gives its result, in words: which argument is wrong and "
               "how (Err:502), why there is no deal (#N/A) or no single answer (#NUM!), a "
               "valid value that looks like a slip (a rate typed as 8 for 8%), or ok. Give "
               "the function's name, then the same arguments. For DEALRANGE, "
               "DEALRANGEOUTCOME and DEALSWING also which part of a range is wrong and why "
               "the precision was not reached (Err:523). Source: the library's argument "
               "rules and statuses.";
    why.category = "Financial";
    why.params = {"functionName", "arguments"};
    why.optional = {false, true};
    why.labels = {"Function", "Arguments"};
    why.helps = {"Name of a DEAL function as text, e.g. \"DEALSOLVE\" or \"DEALRANGE\". Required.",
                 "The arguments of that function, in its order; left out: its defaults. "
                 "Optional."};
    why.id = -1;
    why.outcome = false;
    why.reason = true;
    return why;
}

// The catalogue's description of the argument called `name`: the first one with a
// default, else the first (a walk-away value is required in DEALOUTSIDE, optional in the
// combined model whose inputs the range functions take); the glue's rule
// (src/ranges.hxx catalogue_arg).  nullptr when no function has it.
const cto_arg_info *catalogue_arg(const char *name) {
    const cto_arg_info *first = nullptr;
    for (size_t i = 0; i < cto_function_count(); ++i) {
        const cto_function_info *f = cto_function_at(i);
        for (int j = 0; f && j < f->n_args; ++j) {
            const cto_arg_info &a = f->args[j];
            if (!a.name || std::string(a.name) != name) continue;
            if (a.has_default) return &a;
            if (!first) first = &a;
        }
    }
    return first;
}

const cto_function_info *catalogue_function(const char *name) {
    for (size_t i = 0; i < cto_function_count(); ++i) {
        const cto_function_info *f = cto_function_at(i);
        if (f && f->name && std::string(f->name) == name) return f;
    }
    return nullptr;
}

const char *const kRangeSources =
    "Source: Sobol' (1967) points with Joe & Kuo (2008) direction numbers, Owen (1995, 1997) "
    "scrambling, quantiles by Hyndman & Fan (1996) definition 7; PERT: Malcolm, Roseboom, "
    "Clark & Fazar (1959), Vose (2008); the model: Rubinstein (1982), Muthoo (1999) chs.3-6.";

// The 14 inputs of share_range (src/range_args.h) with the catalogue's text; false when
// the table lacks one.
bool add_range_inputs(Method &m) {
    for (const char *name : cto_addin::kRangeInputNames) {
        const cto_arg_info *a = catalogue_arg(name);
        if (!a) {
            std::cerr << "addin_gen: no catalogue argument " << name << "\n";
            return false;
        }
        add_arg(m, *a, a->kind == CTO_ARG_BOOL
                           ? "; a single value"
                           : "; one cell (fixed), or 2 cells (low, high: uniform) or 3 cells "
                             "(low, mode, high: see Shape)");
    }
    return true;
}

// DEALRANGE (outcome: DEALRANGEOUTCOME): share_range in Calc (src/ranges.hxx).
bool range_method(bool outcome, Method &m) {
    m.method = outcome ? "getShareRangeOutcome" : "getShareRange";
    m.calc = outcome ? "DEALRANGEOUTCOME" : "DEALRANGE";
    m.desc = outcome
        ? "Every output of DEALRANGE as an array (enter as a matrix formula), a row per output "
          "with the columns label, estimate, 95% half-width, significant digits: own share at "
          "each probability (default 0.1, 0.5, 0.9), other share at each, both means, the "
          "probabilities of a rational deal and of each walk-away value binding, the edge "
          "fraction, points per replicate, replicates, uncertain inputs, status (ok or "
          "precision not reached) and spec version. "
        : "Own share at a probability (a quantile of the split) when inputs are known only as "
          "ranges, by randomized quasi-Monte Carlo with a fixed seed (the same numbers on every "
          "recalculation); a range of probabilities gives an array. Err:523 when a quantile "
          "misses the digit target (DEALRANGEOUTCOME shows the estimate and its error bar). ";
    m.desc += kRangeSources;
    m.category = "Financial";
    m.id = -1;
    m.outcome = outcome;
    m.call = outcome ? "share_range(args, true)" : "share_range(args, false)";
    if (!add_range_inputs(m)) return false;
    for (const cto_addin::ExtraArg &e : cto_addin::kRangeExtra) {
        m.params.push_back(e.param);
        m.optional.push_back(true);
        m.labels.push_back(e.label);
        m.helps.push_back(sentence(e.help) + ". Optional.");
    }
    return true;
}

// DEALSWING: share_swing in Calc.
bool swing_method(Method &m) {
    m.method = "getShareSwing";
    m.calc = "DEALSWING";
    m.desc = "One-at-a-time swing of each uncertain input (a tornado): an array, a row per "
             "uncertain input, largest swing first, with the columns input name, own share at "
             "its low, own share at its high (the other inputs at their modes; enter as a matrix "
             "formula). It ignores interactions, which DEALRANGE includes. An end without a "
             "rational deal shows #N/A. Source: one-way "
             "sensitivity, Howard (1988), Clemen & Reilly (2014) ch.5; the model: Rubinstein "
             "(1982), Muthoo (1999) chs.3-6.";
    m.category = "Financial";
    m.id = -1;
    m.outcome = true;
    m.call = "share_swing(args)";
    return add_range_inputs(m);
}

// DEALOFFERPATH: the rows of offer_path (src/offers.hxx).
bool offer_path_method(Method &m) {
    const cto_function_info *f = catalogue_function(cto_addin::kOfferPathFunction);
    if (!f) {
        std::cerr << "addin_gen: no catalogue function " << cto_addin::kOfferPathFunction << "\n";
        return false;
    }
    m.method = "getOfferPath";
    m.calc = cto_addin::kOfferPathCalc;
    m.desc = "Repeated offers to a side of unknown value: an array, a row per round with the "
             "columns round, offer, cutoff, probability of agreement in that round, probability "
             "of agreement by that round (at most " +
             std::to_string(cto_addin::kOfferPathMaxRows) +
             " rows: the first rounds; enter as a matrix formula)." +
             no_deal_text(f) + " Source: " +
             std::string(f->source ? f->source : "") + ".";
    m.category = "Financial";
    m.id = -1;
    m.outcome = true;
    m.call = "offer_path(args)";
    for (int j = 0; j < f->n_args; ++j) add_arg(m, f->args[j]);
    return true;
}

std::vector<Method> collect(bool test_build) {
    std::vector<Method> ms;
    const size_t n = cto_function_count();
    for (size_t i = 0; i < n; ++i) {
        const cto_function_info *f = cto_function_at(i);
        // A function without a Calc name of its own (its Calc form is another function's,
        // e.g. trade_probability is DEALTRADE, the first output of double_auction).
        if (!f || !f->name || !f->calc_name || !*f->calc_name) continue;
        ms.push_back(catalogue_method(f));
        if (f->n_outputs > 1) ms.push_back(outcome_method(f, ms.back()));
    }
    Method range, range_outcome, swing, path;
    if (!range_method(false, range) || !range_method(true, range_outcome) ||
        !swing_method(swing) || !offer_path_method(path))
        return {};
    for (Method *m : {&range, &range_outcome, &swing, &path}) ms.push_back(*m);
    if (test_build) ms.push_back(probe_method());
    ms.push_back(reason_method());
    return ms;
}

std::string make_idl(const std::vector<Method> &ms) {
    std::ostringstream s;
    s << "// Generated by addin_gen from the counteroffer catalogue table. Do not edit.\n"
         "// The module, interface, service and method names are stored in saved\n"
         "// spreadsheets and are stable (addin/README.md).\n"
         "module org { module counteroffer {\n"
         "interface XDealFunctions : com::sun::star::uno::XInterface\n{\n";
    for (const Method &m : ms) {
        if (m.reason) {
            s << "    any " << m.method << "([in] string " << m.params[0]
              << ", [in] sequence< any > " << m.params[1] << ")\n"
              << "        raises(com::sun::star::lang::IllegalArgumentException);\n";
            continue;
        }
        s << "    any " << m.method << "(";
        for (size_t j = 0; j < m.params.size(); ++j)
            s << (j ? ", " : "") << "[in] " << (m.optional[j] ? "any " : "sequence< sequence< any > > ")
              << m.params[j];
        s << ")\n        raises(com::sun::star::lang::IllegalArgumentException,\n"
             "               com::sun::star::sheet::NoConvergenceException);\n";
    }
    s << "};\nservice DealFunctions : XDealFunctions;\n}; };\n";
    return s.str();
}

std::string make_xcu(const std::vector<Method> &ms) {
    std::ostringstream s;
    s << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n"
         "<!-- Generated by addin_gen from the counteroffer catalogue table. Do not edit. -->\n"
         "<oor:component-data xmlns:oor=\"http://openoffice.org/2001/registry\"\n"
         "    xmlns:xs=\"http://www.w3.org/2001/XMLSchema\"\n"
         "    oor:name=\"CalcAddIns\" oor:package=\"org.openoffice.Office\">\n"
         " <node oor:name=\"AddInInfo\">\n"
      << "  <node oor:name=\"" << kService << "\" oor:op=\"replace\">\n"
      << "   <node oor:name=\"AddInFunctions\">\n";
    for (const Method &m : ms) {
        s << "    <node oor:name=\"" << m.method << "\" oor:op=\"replace\">\n"
          << "     <prop oor:name=\"DisplayName\"><value xml:lang=\"en-US\">" << xml(m.calc)
          << "</value></prop>\n"
          << "     <prop oor:name=\"Description\"><value xml:lang=\"en-US\">" << xml(m.desc)
          << "</value></prop>\n"
          << "     <prop oor:name=\"Category\"><value>" << m.category << "</value></prop>\n"
          << "     <node oor:name=\"Parameters\">\n";
        for (size_t j = 0; j < m.params.size(); ++j) {
            s << "      <node oor:name=\"" << m.params[j] << "\" oor:op=\"replace\">\n"
              << "       <prop oor:name=\"DisplayName\"><value xml:lang=\"en-US\">"
              << xml(m.labels[j]) << "</value></prop>\n"
              << "       <prop oor:name=\"Description\"><value xml:lang=\"en-US\">"
              << xml(m.helps[j]) << "</value></prop>\n"
              << "      </node>\n";
        }
        s << "     </node>\n    </node>\n";
    }
    s << "   </node>\n  </node>\n </node>\n</oor:component-data>\n";
    return s.str();
}

std::string make_decl(const std::vector<Method> &ms) {
    std::ostringstream s;
    s << "// Generated by addin_gen. Do not edit.\n";
    for (const Method &m : ms) {
        if (m.reason) {
            s << "css::uno::Any SAL_CALL " << m.method
              << "(const OUString &a0, const css::uno::Sequence<css::uno::Any> &a1) override;\n";
            continue;
        }
        s << "css::uno::Any SAL_CALL " << m.method << "(";
        for (size_t j = 0; j < m.params.size(); ++j)
            s << (j ? ", " : "") << (m.optional[j] ? "const css::uno::Any &a" : "const Mixed &a") << j;
        s << ") override;\n";
    }
    return s.str();
}

std::string make_def(const std::vector<Method> &ms) {
    std::ostringstream s;
    s << "// Generated by addin_gen. Do not edit.\n";
    for (const Method &m : ms) {
        if (m.reason) {
            s << "css::uno::Any SAL_CALL DealFunctions::" << m.method
              << "(const OUString &a0, const css::uno::Sequence<css::uno::Any> &a1)\n{\n"
              << "    return reason(a0, a1);\n}\n";
            continue;
        }
        s << "css::uno::Any SAL_CALL DealFunctions::" << m.method << "(";
        for (size_t j = 0; j < m.params.size(); ++j)
            s << (j ? ", " : "") << (m.optional[j] ? "const css::uno::Any &a" : "const Mixed &a") << j;
        s << ")\n{\n    const Arg args[] = {";
        for (size_t j = 0; j < m.params.size(); ++j) s << (j ? ", " : "") << "Arg(a" << j << ")";
        s << "};\n";
        if (!m.call.empty())
            s << "    return " << m.call << ";\n";
        else if (m.id < 0)
            s << "    return probe(args);\n";
        else
            s << "    return evaluate(" << m.id << ", args, " << m.params.size() << ", "
              << (m.outcome ? "true" : "false") << ");\n";
        s << "}\n";
    }
    return s.str();
}

std::string make_list(const std::vector<Method> &ms) {
    std::ostringstream s;
    for (const Method &m : ms) {
        s << m.calc << "\t" << m.method << "\t" << m.category;
        for (size_t j = 0; j < m.params.size(); ++j)
            s << "\t" << m.params[j] << (m.optional[j] ? "?" : "") << "=" << m.labels[j];
        s << "\n";
    }
    return s.str();
}

} // namespace

int main(int argc, char **argv) {
    const bool test_build = argc == 3 && std::string(argv[2]) == "--test-build";
    if (argc != 2 && !test_build) {
        std::cerr << "usage: addin_gen OUTDIR [--test-build]\n";
        return 2;
    }
    if (cto_version_number() != CTO_VERSION_NUMBER) {
        std::cerr << "addin_gen: library version differs from the header\n";
        return 1;
    }
    const std::vector<Method> ms = collect(test_build);
    if (ms.size() < 2) {
        std::cerr << "addin_gen: the catalogue table is empty\n";
        return 1;
    }
    const std::string d = argv[1];
    const bool ok = write_file(d + "/XDealFunctions.idl", make_idl(ms)) &&
                    write_file(d + "/CalcAddIns.xcu", make_xcu(ms)) &&
                    write_file(d + "/deal_methods_decl.inc", make_decl(ms)) &&
                    write_file(d + "/deal_methods_def.inc", make_def(ms)) &&
                    write_file(d + "/deal_functions.txt", make_list(ms));
    return ok ? 0 : 1;
}
