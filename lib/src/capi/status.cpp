// Status names and messages, and the runtime version.
#include "../core.hpp"

extern "C" {

CTO_API const char *cto_status_name(int status) {
    switch (status) {
        case CTO_OK: return "ok";
        case CTO_E_INVALID: return "invalid";
        case CTO_E_NO_DEAL: return "no_deal";
        case CTO_E_INDETERMINATE: return "indeterminate";
        case CTO_E_NO_CONVERGENCE: return "no_convergence";
        case CTO_E_INTERNAL: return "internal";
        case CTO_E_PRECISION: return "precision_not_reached";
        default: return "unknown";
    }
}

CTO_API const char *cto_status_message(int status) {
    switch (status) {
        case CTO_OK: return "success: the output is the model's value";
        case CTO_E_INVALID:
            return "invalid argument (NaN, infinite or outside its domain): the output is NaN";
        case CTO_E_NO_DEAL:
            return "no rational deal (the surplus does not exceed what the parties get "
                   "without one): the output is own's no-deal payoff";
        case CTO_E_INDETERMINATE:
            return "indeterminate (many equilibria, e.g. both parties infinitely patient): "
                   "the output is NaN";
        case CTO_E_NO_CONVERGENCE:
            return "the numerical method did not converge: the output is NaN";
        case CTO_E_INTERNAL: return "internal error in the library: the output is NaN";
        case CTO_E_PRECISION:
            return "precision not reached: the estimates are reported with their error bars, "
                   "but some requested quantile is short of the digit target at the largest "
                   "sample size";
        default: return "unknown status code";
    }
}

CTO_API unsigned cto_version_number(void) { return CTO_VERSION_NUMBER; }
CTO_API const char *cto_version_string(void) { return CTO_VERSION_STRING; }

}  // extern "C"
