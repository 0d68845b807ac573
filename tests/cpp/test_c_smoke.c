/* A plain C program linked to the shared library: the ABI works from C, the runtime
 * version agrees with the header, and every catalogue function can be called. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "counteroffer/counteroffer.h"

static int failures = 0;
#define EXPECT(cond)                                                     \
    do {                                                                 \
        if (!(cond)) {                                                   \
            fprintf(stderr, "%s:%d: expectation failed: %s\n", __FILE__, \
                    __LINE__, #cond);                                    \
            ++failures;                                                  \
        }                                                                \
    } while (0)

int main(void) {
    double v = 0.0;
    size_t i;
    EXPECT(cto_version_number() == CTO_VERSION_NUMBER);
    EXPECT(strcmp(cto_version_string(), CTO_VERSION_STRING) == 0);
    /* Rubinstein (1982): equal factors 0.5, opener gets 1/(1+d) = 2/3 (check value 9 of
       test_published.cpp). */
    EXPECT(cto_share(0.5, 0.5, 1.0, 1, &v) == CTO_OK);
    EXPECT(fabs(v - 2.0 / 3.0) < 1e-15);
    EXPECT(cto_share(0.5, 0.5, 1.0, 1, NULL) == CTO_E_INVALID);
    EXPECT(cto_share(NAN, 0.5, 1.0, 1, &v) == CTO_E_INVALID && isnan(v));
    EXPECT(cto_function_count() >= 20);
    for (i = 0; i < cto_function_count(); ++i) {
        const cto_function_info *f = cto_function_at(i);
        EXPECT(f != NULL && f->size == sizeof(cto_function_info));
        EXPECT(f != NULL && cto_function_find(f->name) == f);
    }
    printf("%d passed, %d failed\n", failures ? 0 : 1, failures ? 1 : 0);
    return failures ? 1 : 0;
}
