/* The public header compiles on its own as strict C99 (built with -std=c99 -pedantic-errors). */
#include "counteroffer/counteroffer.h"

int cto_header_c99_probe(void);
int cto_header_c99_probe(void) {
    cto_solve_input in;
    cto_solve_outcome out;
    cto_batch_report rep;
    in.size = sizeof in;
    out.size = sizeof out;
    rep.size = sizeof rep;
    return (int)(in.size + out.size + rep.size) + CTO_OK + CTO_VERSION_NUMBER;
}
