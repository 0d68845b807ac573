/*
 * deal_comparison: a deal comparison printed from the C interface.
 *
 * Fictional scenario (invented companies): Aldermoor Foods weighs three acquisition
 * targets.  For each, the deal team has estimated the synergy to be split (money, in
 * millions), both sides' annual cost of capital, the days between offers, the chance
 * that talks collapse after each rejected offer, and what each side falls back on.
 *
 * Results are model estimates under the stated assumptions (alternating offers,
 * Rubinstein 1982; breakdown risk, Binmore, Rubinstein & Wolinsky 1986; walk-away
 * options, Muthoo 1999 ch.5), not financial, legal or tax advice.
 */
#include <stdio.h>

#include "counteroffer/counteroffer.h"

typedef struct {
    const char *name;
    double synergy;          /* money to split, millions                         */
    double our_rate;         /* our annual cost of capital                       */
    double their_rate;       /* the target owners' annual cost of capital        */
    double days;             /* days between offers                              */
    double breakdown;        /* chance talks collapse after a rejected offer     */
    double our_fallback;     /* our value if talks collapse                      */
    double their_fallback;   /* theirs                                           */
    double their_walkaway;   /* their best rival bid (walk-away value)           */
} candidate;

static int check(int status, const char *what) {
    if (status != CTO_OK && status != CTO_E_NO_DEAL) {
        fprintf(stderr, "deal_comparison: %s: %s\n", what, cto_status_message(status));
        return 1;
    }
    return 0;
}

int main(void) {
    const candidate c[] = {
        {"Brackenfield Dairy", 120.0, 0.08, 0.12, 21, 0.04, 0.0, 5.0, 40.0},
        {"Coldharbour Mills", 95.0, 0.08, 0.07, 14, 0.02, 0.0, 10.0, 0.0},
        {"Dunmere Bakeries", 140.0, 0.08, 0.15, 30, 0.08, 0.0, 0.0, 65.0},
    };
    const int n = (int)(sizeof c / sizeof c[0]);
    int failures = 0, best = -1, i;
    double best_ours = -1.0;

    if (cto_version_number() != CTO_VERSION_NUMBER) {
        fprintf(stderr, "deal_comparison: library %s does not match header %s\n",
                cto_version_string(), CTO_VERSION_STRING);
        return 1;
    }
    printf("Aldermoor Foods: split of acquisition synergies (fictional scenario, millions)\n\n");
    printf("%-20s %8s %8s %8s %10s %10s %8s %-8s\n", "target", "synergy", "ours", "theirs",
           "our delay", "their dly", "opener+", "binding");
    for (i = 0; i < n; ++i) {
        double d_ours = 0, d_theirs = 0, delay_ours = 0, delay_theirs = 0, first = 0;
        cto_solve_input in;
        cto_solve_outcome out;
        static const char *binds[] = {"none", "ours", "theirs", "both"};
        failures += check(cto_round_factor(c[i].our_rate, c[i].days, 365, 0, &d_ours), "factor");
        failures += check(cto_round_factor(c[i].their_rate, c[i].days, 365, 0, &d_theirs), "factor");
        in.size = sizeof in;
        in.own_factor = d_ours;
        in.other_factor = d_theirs;
        in.breakdown_prob = c[i].breakdown;
        in.own_fallback = c[i].our_fallback;
        in.other_fallback = c[i].their_fallback;
        in.own_inside = 0;
        in.other_inside = 0;
        in.own_outside = 0;
        in.has_own_outside = 0;
        in.other_outside = c[i].their_walkaway;
        in.has_other_outside = c[i].their_walkaway > 0;
        in.surplus = c[i].synergy;
        in.own_opens = 1;
        out.size = sizeof out;
        failures += check(cto_solve(&in, &out), "solve");
        /* What one more round of delay would cost each side on its agreed share. */
        failures += check(cto_delay_cost(d_ours, out.own_share, c[i].breakdown,
                                         c[i].our_fallback, &delay_ours), "delay cost");
        failures += check(cto_delay_cost(d_theirs, out.other_share, c[i].breakdown,
                                         c[i].their_fallback, &delay_theirs), "delay cost");
        failures += check(cto_first_mover_advantage(d_ours, d_theirs, c[i].synergy, &first),
                          "first mover");
        printf("%-20s %8.1f %8.2f %8.2f %10.3f %10.3f %8.3f %-8s\n", c[i].name, c[i].synergy,
               out.own_share, out.other_share, delay_ours, delay_theirs, first,
               out.binding >= 0 && out.binding <= 3 ? binds[out.binding] : "?");
        if (out.deal_rational && out.own_share > best_ours) {
            best_ours = out.own_share;
            best = i;
        }
    }
    if (best >= 0)
        printf("\nLargest estimated share for Aldermoor: %s (%.2f million).\n", c[best].name,
               best_ours);
    printf("\nours/theirs: equilibrium split of the synergy when Aldermoor opens; our delay /\n"
           "their dly: expected value each side loses if agreement slips one round; opener+:\n"
           "the first-mover advantage; binding: whose walk-away value constrains the split.\n"
           "Model estimates under the stated assumptions, not financial, legal or tax advice.\n");
    return failures ? 1 : 0;
}
