/* numfmt.h: fast conversion of a double to text, to the byte what printf's "%.Pg" writes
 * (ISO/IEC 9899:2018 7.21.6.1: P significant digits, trailing zeros removed, the
 * exponent form when the decimal exponent is below -4 or at least P). Output rows
 * write tens of thousands of numbers per run; glibc's exact conversion costs about
 * 2500 instructions a number, this one a few hundred, and it hands every case it cannot
 * decide exactly (a value within round-off of a rounding tie, a scale beyond 10^22,
 * NaN, infinities) to snprintf. */
#ifndef VOLEV_NUMFMT_H
#define VOLEV_NUMFMT_H

#include <stddef.h>

/* The largest precision vl_format_g takes. */
#define VL_NUMFMT_MAX_PREC 12

/* Write v as snprintf(buf, n, "%.*g", prec, v) would (1 <= prec <= VL_NUMFMT_MAX_PREC;
 * n >= 32 always suffices); returns the length written. */
int vl_format_g(char *buf, size_t n, int prec, double v);

#endif
