/* test_numfmt.c: vl_format_g (src/output/numfmt.c) against the C library's own "%.Pg"
 * (ISO/IEC 9899:2018 7.21.6.1; glibc converts exactly): the same bytes for random bit
 * patterns, random magnitudes, decimal fractions, exact ties and values one ulp either
 * side of a tie or of a decade's edge, at every precision it takes. */
#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <string.h>

#include "suites.h"
#include "volev/numfmt.h"

/* xorshift64: a fixed, portable sequence (Marsaglia 2003, J. Stat. Softw. 8(14)). */
static uint64_t next(uint64_t *s)
{
    *s ^= *s << 13;
    *s ^= *s >> 7;
    *s ^= *s << 17;
    return *s;
}

/* Fails the test unless vl_format_g writes what snprintf writes for v at prec. */
static void same(double v, int prec)
{
    char want[64], got[64];
    snprintf(want, sizeof want, "%.*g", prec, v);
    int n = vl_format_g(got, sizeof got, prec, v);
    ck_assert_msg(strcmp(want, got) == 0 && n == (int)strlen(want), "%%.%dg of %a: %s, not %s",
                  prec, v, got, want);
}

/* v and its neighbours one ulp either side, both signs, at every precision. */
static void around(double v)
{
    double w[3] = {nextafter(v, 0.0), v, nextafter(v, INFINITY)};
    for (int k = 0; k < 3; k++)
        for (int p = 1; p <= VL_NUMFMT_MAX_PREC; p++) {
            same(w[k], p);
            same(-w[k], p);
        }
}

START_TEST(random_bits)
{
    uint64_t s = 88172645463325252ULL;
    for (int i = 0; i < 200000; i++) {
        uint64_t r = next(&s);
        double v;
        memcpy(&v, &r, sizeof v);
        same(v, 10);
        same(v, 1 + i % VL_NUMFMT_MAX_PREC);
    }
}
END_TEST

START_TEST(random_magnitudes)
{
    uint64_t s = 2463534242ULL;
    for (int i = 0; i < 200000; i++) {
        double mant = ldexp((double)(next(&s) >> 11), -53);
        double v = mant * pow(10.0, (int)(next(&s) % 70) - 35);
        same(v, 10);
        same(-v, 1 + i % VL_NUMFMT_MAX_PREC);
    }
}
END_TEST

/* Decimal ties: d.ddd5 x 10^k, the case where a one-rounding shortcut could err. */
START_TEST(ties_and_edges)
{
    static const double ties[] = {0.5, 1.5, 2.5, 0.05, 0.15, 0.25, 0.35, 9.5, 99.5, 0.0099995,
                                  0.00095, 1.00000000005, 2.00000000015, 12345678905.0,
                                  9999999999.5, 999999999.95, 1e-5, 1e-4, 1e10, 1e12, 123456.5};
    for (size_t i = 0; i < sizeof ties / sizeof ties[0]; i++)
        for (int e = -30; e <= 30; e += 6)
            around(ties[i] * pow(10.0, e));
    for (int e = -320; e <= 308; e++) /* every decade's edge, subnormals included */
        around(pow(10.0, e));
    static const double special[] = {0.0, DBL_MIN, DBL_MAX, 5e-324, INFINITY, NAN, 4570000000.0};
    for (size_t i = 0; i < sizeof special / sizeof special[0]; i++)
        around(special[i]);
}
END_TEST

Suite *vl_suite_numfmt(void)
{
    Suite *s = suite_create("numfmt");
    TCase *tc = tcase_create("core");
    tcase_add_test(tc, random_bits);
    tcase_add_test(tc, random_magnitudes);
    tcase_add_test(tc, ties_and_edges);
    suite_add_tcase(s, tc);
    return s;
}
