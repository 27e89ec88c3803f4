/* numfmt.c: "%.Pg" without printf's arbitrary-precision arithmetic (numfmt.h). The
 * digits are the integer nearest v * 10^k for the k that puts P digits before the
 * point; with 10^k exact (|k| <= 22) the product or quotient carries one rounding, an
 * error below 10^P * 2^-53, so the nearest integer is certain unless the fraction lies
 * within TIE_MARGIN of one half: then snprintf decides. */
#include "volev/numfmt.h"

#include <math.h>
#include <stdio.h>
#include <string.h>

/* 10^0 .. 10^22: every one exact in binary64. */
static const double pow10_exact[23] = {1e0,  1e1,  1e2,  1e3,  1e4,  1e5,  1e6,  1e7,
                                       1e8,  1e9,  1e10, 1e11, 1e12, 1e13, 1e14, 1e15,
                                       1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};

/* a * 10^k with one rounding, or -1 when 10^|k| is not exact. */
static double scale(double a, int k)
{
    if (k >= 0 && k <= 22)
        return a * pow10_exact[k];
    if (k < 0 && k >= -22)
        return a / pow10_exact[-k];
    return -1.0;
}

/* The P-digit integer of a (> 0, finite) and its decimal exponent; 0 when it cannot be
 * told exactly. */
static int digits_of(double a, int prec, unsigned long long *digits, int *exp10)
{
    double lo = pow10_exact[prec - 1] - 0.5, hi = pow10_exact[prec] - 0.5;
    double margin = pow10_exact[prec] * 1e-15;
    int e = (int)floor(log10(a));
    double x = scale(a, prec - 1 - e);
    /* at a decade's edge the rounding that picks the exponent is itself a tie */
    if (fabs(x - lo) < margin || fabs(x - hi) < margin)
        return 0;
    if (x >= 0.0 && x < lo)
        x = scale(a, prec - 1 - --e);
    else if (x >= hi)
        x = scale(a, prec - 1 - ++e);
    if (x < 0.0 || x < lo || x >= hi)
        return 0;
    double fl = floor(x), frac = x - fl;
    if (fabs(frac - 0.5) < margin)
        return 0;
    *digits = (unsigned long long)fl + (frac > 0.5);
    *exp10 = e;
    return 1;
}

/* Append the exponent part "e+XX" (at least two digits). */
static int put_exponent(char *p, int e)
{
    int n = 0;
    p[n++] = 'e';
    p[n++] = e < 0 ? '-' : '+';
    unsigned u = (unsigned)(e < 0 ? -e : e);
    char tmp[8];
    int k = 0;
    do {
        tmp[k++] = (char)('0' + u % 10);
        u /= 10;
    } while (u);
    if (k < 2)
        tmp[k++] = '0';
    while (k)
        p[n++] = tmp[--k];
    return n;
}

/* The text of sign, digits d[0..nd) (no trailing zeros) and exponent e in %g's form. */
static int compose(char *out, int neg, const char *d, int nd, int e, int prec)
{
    int n = 0;
    if (neg)
        out[n++] = '-';
    if (e < -4 || e >= prec) {
        out[n++] = d[0];
        if (nd > 1) {
            out[n++] = '.';
            memcpy(out + n, d + 1, (size_t)(nd - 1));
            n += nd - 1;
        }
        return n + put_exponent(out + n, e);
    }
    if (e < 0) {
        out[n++] = '0';
        out[n++] = '.';
        for (int i = 0; i < -e - 1; i++)
            out[n++] = '0';
        memcpy(out + n, d, (size_t)nd);
        return n + nd;
    }
    for (int i = 0; i <= e; i++)
        out[n++] = i < nd ? d[i] : '0';
    if (nd > e + 1) {
        out[n++] = '.';
        memcpy(out + n, d + e + 1, (size_t)(nd - e - 1));
        n += nd - e - 1;
    }
    return n;
}

int vl_format_g(char *buf, size_t n, int prec, double v)
{
    unsigned long long dig;
    int e;
    if (prec < 1 || prec > VL_NUMFMT_MAX_PREC || !isfinite(v) || v == 0.0 ||
        !digits_of(fabs(v), prec, &dig, &e))
        return snprintf(buf, n, "%.*g", prec, v);
    char d[VL_NUMFMT_MAX_PREC + 1];
    for (int i = prec - 1; i >= 0; i--) {
        d[i] = (char)('0' + dig % 10);
        dig /= 10;
    }
    int nd = prec;
    while (nd > 1 && d[nd - 1] == '0')
        nd--;
    char out[48];
    int len = compose(out, signbit(v) != 0, d, nd, e, prec);
    if ((size_t)len >= n)
        return snprintf(buf, n, "%.*g", prec, v);
    memcpy(buf, out, (size_t)len);
    buf[len] = '\0';
    return len;
}
