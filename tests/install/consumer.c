/* Built against an installed counteroffer (find_package or pkg-config). */
#include <math.h>
#include <stdio.h>
#include <counteroffer/counteroffer.h>

int main(void) {
    double v = 0;
    /* Rubinstein (1982): equal factors 0.5 -> the opener gets 2/3. */
    if (cto_share(0.5, 0.5, 1, 1, &v) != CTO_OK || fabs(v - 2.0 / 3.0) > 1e-15) return 1;
    if (cto_version_number() != CTO_VERSION_NUMBER) return 1;
    printf("consumer: share %.17g, library %s\n", v, cto_version_string());
    return 0;
}
