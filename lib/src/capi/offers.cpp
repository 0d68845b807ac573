// cto_offer_path_rows: offer_path with the caller's buffer of rows per round (the
// totals-only cto_offer_path is generated from its definition).
#include <cstring>

#include "adapters.hpp"

namespace core = cto::core;


extern "C" {

CTO_API int cto_offer_path_rows(double private_low, double private_high,
                                double offerer_factor, double responder_factor,
                                int64_t rounds, double known_value, int offerer,
                                cto_offer_row *rows, int64_t capacity,
                                cto_offer_outcome *out) {
    if (!out || out->size < sizeof(cto_offer_outcome)) return CTO_E_INVALID;
    if (capacity < 0 || (capacity > 0 && !rows)) capacity = 0;
    try {
        core::OfferTotals t;
        const int st = core::offer_path(private_low, private_high, offerer_factor,
                                        responder_factor, rounds, known_value, offerer, rows,
                                        capacity, &t, nullptr);
        out->regime = t.regime;
        out->reserved = 0;
        out->rounds_used = t.rounds_used;
        out->rows_written = t.rows_written;
        out->stages = t.stages;
        out->pieces = t.pieces;
        out->agreement_probability = t.agreement_probability;
        out->expected_round = t.expected_round;
        out->offerer_value = t.offerer_value;
        out->responder_value = t.responder_value;
        out->opening_offer = t.opening_offer;
        out->last_cutoff = t.last_cutoff;
        return st;
    } catch (...) {
        out->agreement_probability = out->expected_round = core::kNaN;
        return CTO_E_INTERNAL;
    }
}

}  // extern "C"
