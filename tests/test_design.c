/* test_design.c: ensemble designs and Sobol indices (src/ensembles/design.c, src/ensembles/sobol.c).
 * Tags: [C] computed from the stated formula; [V] read in the cited source. */
#include <limits.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include <gsl/gsl_cdf.h>
#include <gsl/gsl_math.h>
#include <gsl/gsl_qrng.h>
#include <gsl/gsl_randist.h>
#include <gsl/gsl_sort_double.h>
#include <gsl/gsl_statistics_double.h>

#include "suites.h"
#include "volev/design.h"

/* A grid axis. */
static vl_axis grid_axis(const char *key, int spacing, double from, double to, long points)
{
    vl_axis a;
    memset(&a, 0, sizeof a);
    snprintf(a.key, sizeof a.key, "%s", key);
    a.line = 7;
    a.spacing = spacing;
    a.from = from;
    a.to = to;
    a.points = points;
    return a;
}

/* A sampled axis: bounds for (log-)uniform and truncated normal, mean/sd for normals. */
static vl_axis dist_axis(const char *key, int dist, double low, double high, double mean,
                         double sd)
{
    vl_axis a;
    memset(&a, 0, sizeof a);
    snprintf(a.key, sizeof a.key, "%s", key);
    a.line = 11;
    a.dist = dist;
    a.low = low;
    a.high = high;
    a.mean = mean;
    a.sd = sd;
    return a;
}

/* Generate a design into a fresh array; fails the test on error. */
static double *generate(int design, const vl_axis *axes, size_t k, long n, unsigned long seed,
                        long *members)
{
    vl_status st;
    vl_status_clear(&st);
    long m = vl_design_size(design, axes, k, n, &st);
    ck_assert_msg(m > 0, "vl_design_size: %s", st.msg);
    double *x = malloc((size_t)m * k * sizeof *x);
    ck_assert_ptr_nonnull(x);
    int rc = vl_design_generate(design, axes, k, n, seed, x, &st);
    ck_assert_msg(rc == VL_OK, "vl_design_generate: %s", st.msg);
    *members = m;
    return x;
}

START_TEST(test_grid_values)
{
    vl_axis lin = grid_axis("a.lin", VL_SPACING_LINEAR, 0.0, 1.0, 5);
    for (long j = 0; j < 5; j++)   /* [C] 0, 0.25, ..., 1: exact in binary */
        ck_assert_double_eq(vl_axis_grid_value(&lin, j), 0.25 * (double)j);

    vl_axis lg = grid_axis("a.log", VL_SPACING_LOG, 1e-3, 1e3, 7);
    ck_assert_double_eq(vl_axis_grid_value(&lg, 0), 1e-3);   /* exact end points (spec) */
    ck_assert_double_eq(vl_axis_grid_value(&lg, 6), 1e3);
    for (long j = 0; j < 7; j++)   /* [C] 10^(-3 + j): one decade per step */
        ck_assert_rel(vl_axis_grid_value(&lg, j), pow(10.0, -3.0 + (double)j), 1e-13);
    for (long j = 1; j < 7; j++)   /* [C] increasing from `from` to `to` */
        ck_assert(vl_axis_grid_value(&lg, j) > vl_axis_grid_value(&lg, j - 1));

    vl_axis down = grid_axis("a.down", VL_SPACING_LINEAR, 3.0, -3.0, 4);
    ck_assert_double_eq(vl_axis_grid_value(&down, 3), -3.0);   /* [C] descending grid */
    ck_assert_double_eq(vl_axis_grid_value(&down, 1), 1.0);    /* [C] 3 - 6/3 */

    vl_axis one = grid_axis("a.one", VL_SPACING_LOG, 2.0, 50.0, 1);
    ck_assert_double_eq(vl_axis_grid_value(&one, 0), 2.0);   /* spec: 1 point is `from` */
}
END_TEST

START_TEST(test_grid_design)
{
    vl_axis ax[3] = {grid_axis("p.a", VL_SPACING_LINEAR, 1.0, 3.0, 3),
                     grid_axis("p.b", VL_SPACING_LOG, 10.0, 100.0, 2),
                     grid_axis("p.c", VL_SPACING_LINEAR, 5.0, 5.0, 1)};
    long m;
    double *x = generate(VL_DESIGN_GRID, ax, 3, 0, 0, &m);
    ck_assert_int_eq(m, 6);   /* [C] 3 x 2 x 1 */
    /* [C] last axis fastest: (1,10) (1,100) (2,10) (2,100) (3,10) (3,100) */
    const double want[6][2] = {{1, 10}, {1, 100}, {2, 10}, {2, 100}, {3, 10}, {3, 100}};
    for (int r = 0; r < 6; r++) {
        ck_assert_double_eq(x[r * 3 + 0], want[r][0]);
        ck_assert_double_eq(x[r * 3 + 1], want[r][1]);
        ck_assert_double_eq(x[r * 3 + 2], 5.0);
    }
    free(x);
}
END_TEST

START_TEST(test_design_size)
{
    vl_status st;
    vl_status_clear(&st);
    vl_axis u = dist_axis("s.u", VL_DIST_UNIFORM, 0, 1, 0, 0);
    vl_axis three[3] = {u, u, u};
    /* spec: random/LHS/sobol n members, saltelli n (k + 2) [C: 100 x 5] */
    ck_assert_int_eq(vl_design_size(VL_DESIGN_RANDOM, three, 3, 100, &st), 100);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_LHS, three, 3, 100, &st), 100);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_SOBOL, three, 3, 100, &st), 100);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_SALTELLI, three, 3, 100, &st), 500);

    /* [C] 1e4 x 1e4 = 1e8, the largest grid allowed (spec: fail above 1e8) */
    vl_axis g[2] = {grid_axis("g.a", VL_SPACING_LINEAR, 0, 1, 10000),
                    grid_axis("g.b", VL_SPACING_LINEAR, 0, 1, 10000)};
    ck_assert_int_eq(vl_design_size(VL_DESIGN_GRID, g, 2, 0, &st), 100000000L);
    g[1].points = 10001;   /* [C] 1.0001e8 > 1e8 */
    ck_assert_int_eq(vl_design_size(VL_DESIGN_GRID, g, 2, 0, &st), -1);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "g.b"));

    /* [C] LONG_MAX/2 x 3 overflows a long: must be refused, not wrapped */
    vl_status_clear(&st);
    g[0].points = LONG_MAX / 2;
    g[1].points = 3;
    ck_assert_int_eq(vl_design_size(VL_DESIGN_GRID, g, 2, 0, &st), -1);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    g[0].points = LONG_MAX;
    g[1].points = LONG_MAX;
    ck_assert_int_eq(vl_design_size(VL_DESIGN_GRID, g, 2, 0, &st), -1);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);

    /* [C] saltelli n (k + 2) overflowing a long is refused too */
    vl_status_clear(&st);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_SALTELLI, three, 3, LONG_MAX / 4, &st), -1);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    /* no axes, or no samples: nothing to run */
    ck_assert_int_eq(vl_design_size(VL_DESIGN_RANDOM, three, 0, 10, &st), -1);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_RANDOM, three, 3, 0, &st), -1);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
}
END_TEST

START_TEST(test_reproducible)
{
    vl_axis ax[3] = {dist_axis("r.u", VL_DIST_UNIFORM, -1, 2, 0, 0),
                     dist_axis("r.n", VL_DIST_NORMAL, 0, 0, 5, 2),
                     dist_axis("r.l", VL_DIST_LOG_UNIFORM, 1e-2, 1e2, 0, 0)};
    const int kinds[2] = {VL_DESIGN_RANDOM, VL_DESIGN_LHS};
    for (int d = 0; d < 2; d++) {
        long m1, m2, m3;
        double *x1 = generate(kinds[d], ax, 3, 200, 42, &m1);
        double *x2 = generate(kinds[d], ax, 3, 200, 42, &m2);
        double *x3 = generate(kinds[d], ax, 3, 200, 43, &m3);
        size_t bytes = (size_t)m1 * 3 * sizeof *x1;
        ck_assert_int_eq(memcmp(x1, x2, bytes), 0);   /* spec: same seed, same sample */
        ck_assert_int_ne(memcmp(x1, x3, bytes), 0);   /* spec: another seed differs */
        free(x1);
        free(x2);
        free(x3);
    }

    /* Sobol: deterministic, and the all-zero first point of the Sobol sequence is left
     * out. GSL never returns that point, so member j is GSL's output j and member 0 is
     * the sequence's second point. Uniform axes on [0, 1] map u to itself. */
    vl_axis u[4];
    for (int i = 0; i < 4; i++)
        u[i] = dist_axis("r.unit", VL_DIST_UNIFORM, 0, 1, 0, 0);
    long m1, m2;
    double *s1 = generate(VL_DESIGN_SOBOL, u, 4, 64, 1, &m1);
    double *s2 = generate(VL_DESIGN_SOBOL, u, 4, 64, 99, &m2);   /* seed unused */
    ck_assert_int_eq(memcmp(s1, s2, (size_t)m1 * 4 * sizeof *s1), 0);   /* spec */
    gsl_qrng *q = gsl_qrng_alloc(gsl_qrng_sobol, 4);
    double p[4];
    for (long j = 0; j < m1; j++) {
        gsl_qrng_get(q, p);
        for (int i = 0; i < 4; i++) {   /* member j is GSL's output j */
            ck_assert_double_eq(s1[j * 4 + i], p[i]);
            ck_assert(p[i] > 0.0);   /* the zero point never appears */
        }
    }
    /* [C] the Sobol sequence is x_0 = 0, then x_n = x_{n-1} XOR v_c(n-1) (Gray-code
     * order, Antonov & Saleev 1979; Bratley & Fox 1988) with c(0) = 1 and every first
     * direction number v_1 = 1/2: the second point is (1/2, ..., 1/2). GSL's first
     * output is that point, so the all-zero first point is already left out. */
    for (int i = 0; i < 4; i++)
        ck_assert_double_eq(s1[i], 0.5);
    gsl_qrng_free(q);
    free(s1);
    free(s2);

    /* Saltelli layout: A_j and B_j from GSL's 2k-dimensional output j; AB^(i) is A
     * with column i from B (Saltelli et al. 2010, section 4). */
    long ms;
    double *x = generate(VL_DESIGN_SALTELLI, u, 3, 32, 0, &ms);
    ck_assert_int_eq(ms, 32 * 5);   /* [C] n (k + 2) */
    q = gsl_qrng_alloc(gsl_qrng_sobol, 6);
    double p6[6];
    for (long j = 0; j < 32; j++) {
        gsl_qrng_get(q, p6);
        const double *blk = x + j * 5 * 3;
        for (int i = 0; i < 3; i++) {
            ck_assert_double_eq(blk[0 * 3 + i], fmax(p6[i], 1e-12));       /* A_j */
            ck_assert_double_eq(blk[1 * 3 + i], fmax(p6[3 + i], 1e-12));   /* B_j */
            for (int c = 0; c < 3; c++)   /* AB_j^(i) */
                ck_assert_double_eq(blk[(2 + i) * 3 + c], c == i ? blk[3 + c] : blk[c]);
        }
    }
    gsl_qrng_free(q);
    free(x);
}
END_TEST

/* Sample mean and standard deviation of column c of x (m rows, k columns). */
static void column_stats(const double *x, long m, size_t k, size_t c, double *mean, double *sd)
{
    *mean = gsl_stats_mean(x + c, k, (size_t)m);
    *sd = gsl_stats_sd_m(x + c, k, (size_t)m, *mean);
}

START_TEST(test_distributions)
{
    const long n = 20000;
    /* Normal: mean 3, sd 2, random sampling. Standard errors [C]: mean sd/sqrt(n) =
     * 0.014, sd about sd/sqrt(2n) = 0.010; tolerances are 4 standard errors. */
    vl_axis nrm = dist_axis("d.n", VL_DIST_NORMAL, 0, 0, 3.0, 2.0);
    long m;
    double *x = generate(VL_DESIGN_RANDOM, &nrm, 1, n, 7, &m);
    double mean, sd;
    column_stats(x, m, 1, 0, &mean, &sd);
    ck_assert_msg(fabs(mean - 3.0) < 4 * 2.0 / sqrt((double)n), "normal mean %g", mean);
    ck_assert_msg(fabs(sd - 2.0) < 4 * 2.0 / sqrt(2.0 * (double)n), "normal sd %g", sd);
    /* Phi^-1(0.975) = 1.959964 (standard normal tables, common practice) */
    ck_assert_rel(vl_axis_quantile(&nrm, 0.975), 3.0 + 2.0 * 1.959964, 1e-6);
    free(x);

    /* Log-uniform on [1e-2, 1e4]: median sqrt(low high) = 10 [C: ln x uniform, median at
     * the mid-point of the logs]. Exact at u = 1/2; in a sample of n the median of
     * log10 x has standard error about 6/(2 sqrt(n)) = 0.021 [C]; tolerance 0.1. */
    vl_axis lu = dist_axis("d.lu", VL_DIST_LOG_UNIFORM, 1e-2, 1e4, 0, 0);
    ck_assert_rel(vl_axis_quantile(&lu, 0.5), sqrt(1e-2 * 1e4), 1e-12);
    x = generate(VL_DESIGN_RANDOM, &lu, 1, n + 1, 3, &m);
    gsl_sort(x, 1, (size_t)m);
    double med = gsl_stats_median_from_sorted_data(x, 1, (size_t)m);
    ck_assert_msg(fabs(log10(med) - 1.0) < 0.1, "log-uniform median %g", med);
    for (long j = 0; j < m; j++)
        ck_assert(x[j] >= 1e-2 && x[j] <= 1e4);   /* spec: within the bounds */
    free(x);

    /* Truncated normal N(0,1) on [0, 10]: [C] with Z = Phi(b) - Phi(a) and
     * int z phi dz = -phi, int z^2 phi dz = Phi - z phi: mean (phi(a) - phi(b))/Z =
     * phi(0)/(1/2) = sqrt(2/pi) = 0.79788 (phi(10) ~ 8e-23 is negligible), variance
     * 1 + (a phi(a) - b phi(b))/Z - mean^2 = 1 - 2/pi, sd 0.6028. Latin hypercube
     * sample; tolerance 0.02 (a random sample's standard error is 0.004 [C]). */
    vl_axis tn = dist_axis("d.tn", VL_DIST_TRUNC_NORMAL, 0.0, 10.0, 0.0, 1.0);
    x = generate(VL_DESIGN_LHS, &tn, 1, n, 5, &m);
    column_stats(x, m, 1, 0, &mean, &sd);
    ck_assert_msg(fabs(mean - sqrt(2.0 / M_PI)) < 0.02, "truncated normal mean %g", mean);
    ck_assert_msg(fabs(sd - sqrt(1.0 - 2.0 / M_PI)) < 0.02, "truncated normal sd %g", sd);
    for (long j = 0; j < m; j++)
        ck_assert(x[j] >= 0.0 && x[j] <= 10.0);   /* spec: stays within bounds */
    free(x);
    /* [C] a symmetric truncation has its median at the mean */
    vl_axis sym = dist_axis("d.sym", VL_DIST_TRUNC_NORMAL, 4.0, 6.0, 5.0, 3.0);
    ck_assert(fabs(vl_axis_quantile(&sym, 0.5) - 5.0) < 1e-12);
    /* far tails (Q(40) underflows to 0): finite, within bounds, increasing in u */
    vl_axis far[2] = {dist_axis("d.far", VL_DIST_TRUNC_NORMAL, 40.0, 41.0, 0.0, 1.0),
                      dist_axis("d.far2", VL_DIST_TRUNC_NORMAL, -41.0, -40.0, 0.0, 1.0)};
    for (int a = 0; a < 2; a++) {
        double prev = -INFINITY;
        for (int i = 1; i < 100; i++) {
            double v = vl_axis_quantile(&far[a], i / 100.0);
            ck_assert(isfinite(v) && v >= far[a].low && v <= far[a].high && v >= prev);
            prev = v;
        }
    }
    /* [C] upper tail [40, 41]: density ~ exp(-40 (z - 40)), median 40 + ln 2 / 40 */
    ck_assert_rel(vl_axis_quantile(&far[0], 0.5), 40.0 + log(2.0) / 40.0, 1e-3);
    ck_assert_rel(vl_axis_quantile(&far[1], 0.5), -40.0 - log(2.0) / 40.0, 1e-3);

    /* Latin hypercube (McKay et al. 1979): each axis has exactly one sample in each of
     * the n equal-probability strata. */
    vl_axis ax[3] = {dist_axis("d.u1", VL_DIST_UNIFORM, 0.0, 1.0, 0, 0),
                     dist_axis("d.u2", VL_DIST_UNIFORM, -3.0, 7.0, 0, 0),
                     dist_axis("d.u3", VL_DIST_UNIFORM, 10.0, 11.0, 0, 0)};
    const long nl = 1000;
    x = generate(VL_DESIGN_LHS, ax, 3, nl, 11, &m);
    int *count = calloc((size_t)nl, sizeof *count);
    ck_assert_ptr_nonnull(count);
    for (size_t i = 0; i < 3; i++) {
        memset(count, 0, (size_t)nl * sizeof *count);
        for (long j = 0; j < m; j++) {
            double u = (x[(size_t)j * 3 + i] - ax[i].low) / (ax[i].high - ax[i].low);
            long s = (long)floor(u * (double)nl);
            ck_assert(s >= 0 && s < nl);
            count[s]++;
        }
        for (long s = 0; s < nl; s++)
            ck_assert_msg(count[s] == 1, "axis %zu stratum %ld has %d samples", i, s, count[s]);
    }
    free(count);
    free(x);
}
END_TEST

/* Ishigami & Homma 1990 (Proc. ISUMA '90, IEEE, p. 398):
 * f = sin x1 + a sin^2 x2 + b x3^4 sin x1. */
static double ishigami(const double *x, double a, double b)
{
    double s2 = sin(x[1]);
    return sin(x[0]) + a * s2 * s2 + b * pow(x[2], 4.0) * sin(x[0]);
}

START_TEST(test_ishigami)
{
    const double a = 7.0, b = 0.1, pi4 = pow(M_PI, 4.0), pi8 = pow(M_PI, 8.0);
    /* Closed form (Ishigami & Homma 1990; also Saltelli et al. 2010 — from memory):
     * V = a^2/8 + b pi^4/5 + b^2 pi^8/18 + 1/2, V1 = (1 + b pi^4/5)^2 / 2, V2 = a^2/8,
     * V3 = 0, VT3 = V13 = 8 b^2 pi^8/225. [C] re-derived for x ~ U(-pi, pi):
     * E sin^2 = 1/2, E sin^4 = 3/8, E x^4 = pi^4/5, E x^8 = pi^8/9; V1 = (1 + b E x3^4)^2
     * E sin^2 x1; V2 = a^2 (3/8 - 1/4); V13 = b^2 (pi^8/9 - pi^8/25)/2; their sum is V
     * (1/50 + 8/225 = 1/18). */
    double v = a * a / 8.0 + b * pi4 / 5.0 + b * b * pi8 / 18.0 + 0.5;
    double v1 = 0.5 * (1.0 + b * pi4 / 5.0) * (1.0 + b * pi4 / 5.0);
    double v2 = a * a / 8.0;
    double vt3 = 8.0 * b * b * pi8 / 225.0;
    double s1 = v1 / v, s2 = v2 / v, st3 = vt3 / v;
    double st1 = (v1 + vt3) / v;   /* [C] x1 interacts only with x3: VT1 = V1 + V13 */
    /* The quoted values 0.314, 0.442, 0.244 (Saltelli et al. 2010, from memory) are
     * these rounded to 3 decimals. */
    ck_assert(fabs(s1 - 0.314) <= 5e-4);
    ck_assert(fabs(s2 - 0.442) <= 5e-4);
    ck_assert(fabs(st3 - 0.244) <= 5e-4);

    vl_axis ax[3];
    const char *keys[3] = {"ish.x1", "ish.x2", "ish.x3"};
    for (int i = 0; i < 3; i++)   /* x_i ~ U(-pi, pi) (Ishigami & Homma 1990) */
        ax[i] = dist_axis(keys[i], VL_DIST_UNIFORM, -M_PI, M_PI, 0, 0);
    const long n = 8192;   /* 2^13: a power of 2 suits the Sobol sequence (common practice) */
    long m;
    double *x = generate(VL_DESIGN_SALTELLI, ax, 3, n, 0, &m);
    double *y = malloc((size_t)m * sizeof *y);
    ck_assert_ptr_nonnull(y);
    for (long r = 0; r < m; r++)
        y[r] = ishigami(x + r * 3, a, b);

    vl_status st;
    vl_status_clear(&st);
    vl_sobol_index idx[3];
    long used = 0;
    int rc = vl_sobol_indices(y, n, 3, 500, 0.95, 12345, idx, &used, &st);
    ck_assert_msg(rc == VL_OK, "%s", st.msg);
    ck_assert_int_eq(used, n);
    /* Tolerance 0.03 absolute, from the sampling error: the bootstrap, which treats
     * the blocks as independent, puts the standard errors at n = 2^13 near 0.01 (S1,
     * S3, ST3) and 0.015 (ST1) [C: 95 % half-widths about 0.02 and 0.03, checked
     * below]; quasi-random blocks do better than independent ones (common practice;
     * observed errors here are below 0.001, and 0.03 for independent samples). */
    const double tol = 0.03;
    ck_assert_msg(fabs(idx[0].s1 - s1) < tol, "S1 = %g [%g, %g]", idx[0].s1, idx[0].s1_lo,
                  idx[0].s1_hi);
    ck_assert_msg(fabs(idx[1].s1 - s2) < tol, "S2 = %g", idx[1].s1);
    ck_assert_msg(fabs(idx[2].s1) < tol, "S3 = %g", idx[2].s1);   /* V3 = 0 */
    ck_assert_msg(fabs(idx[2].st - st3) < tol, "ST3 = %g [%g, %g]", idx[2].st, idx[2].st_lo,
                  idx[2].st_hi);
    ck_assert_msg(fabs(idx[0].st - st1) < tol, "ST1 = %g", idx[0].st);   /* [C] above */
    ck_assert_msg(fabs(idx[1].st - s2) < tol, "ST2 = %g", idx[1].st);   /* [C] no interaction */
    /* the 95 % bootstrap intervals contain the analytic values */
    ck_assert_msg(idx[0].s1_lo <= s1 && s1 <= idx[0].s1_hi, "S1 %g not in [%g, %g]", s1,
                  idx[0].s1_lo, idx[0].s1_hi);
    ck_assert_msg(idx[2].st_lo <= st3 && st3 <= idx[2].st_hi, "ST3 %g not in [%g, %g]", st3,
                  idx[2].st_lo, idx[2].st_hi);
    for (int i = 0; i < 3; i++) {   /* [C] ordered ends; half-widths as stated above */
        ck_assert(idx[i].s1_lo <= idx[i].s1_hi && idx[i].st_lo <= idx[i].st_hi);
        double h1 = 0.5 * (idx[i].s1_hi - idx[i].s1_lo), ht = 0.5 * (idx[i].st_hi - idx[i].st_lo);
        ck_assert_msg(h1 > 0.005 && h1 < 0.04 && ht > 0.002 && ht < 0.04,
                      "axis %d half-widths %g %g", i, h1, ht);
    }

    /* The same inputs give the same indices and intervals (seeded bootstrap). */
    vl_sobol_index again[3];
    ck_assert_int_eq(vl_sobol_indices(y, n, 3, 500, 0.95, 12345, again, &used, &st), VL_OK);
    ck_assert_int_eq(memcmp(idx, again, sizeof idx), 0);

    /* No bootstrap: lo = hi = the estimate (spec). */
    ck_assert_int_eq(vl_sobol_indices(y, n, 3, 0, 0.9, 1, again, &used, &st), VL_OK);
    for (int i = 0; i < 3; i++) {
        ck_assert_double_eq(again[i].s1, idx[i].s1);
        ck_assert(again[i].s1_lo == again[i].s1 && again[i].s1_hi == again[i].s1);
        ck_assert(again[i].st_lo == again[i].st && again[i].st_hi == again[i].st);
    }

    /* A block with a non-finite output is dropped whole (spec). */
    y[5 * 10 + 3] = NAN;
    y[5 * 20 + 0] = INFINITY;
    ck_assert_int_eq(vl_sobol_indices(y, n, 3, 0, 0.9, 1, again, &used, &st), VL_OK);
    ck_assert_int_eq(used, n - 2);
    ck_assert(fabs(again[0].s1 - s1) < tol);
    free(x);
    free(y);
}
END_TEST

START_TEST(test_sobol_degenerate)
{
    vl_status st;
    vl_status_clear(&st);
    vl_sobol_index idx[2];
    long used = -1;
    double y[4 * 4];   /* n = 4 blocks of k + 2 = 4 */
    for (int i = 0; i < 16; i++)
        y[i] = 2.5;   /* constant output: V = 0 (spec: VL_ERR_NUMERIC) */
    ck_assert_int_eq(vl_sobol_indices(y, 4, 2, 10, 0.9, 1, idx, &used, &st), VL_ERR_NUMERIC);
    ck_assert_int_eq(used, 4);
    for (int i = 0; i < 16; i++)
        y[i] = i < 12 ? NAN : (double)i;   /* one finite block left (spec: need 2) */
    ck_assert_int_eq(vl_sobol_indices(y, 4, 2, 10, 0.9, 1, idx, &used, &st), VL_ERR_NUMERIC);
    ck_assert_int_eq(used, 1);
    /* bad bootstrap settings */
    for (int i = 0; i < 16; i++)
        y[i] = (double)(i % 5);
    ck_assert_int_eq(vl_sobol_indices(y, 4, 2, -1, 0.9, 1, idx, &used, &st), VL_ERR_INPUT);
    ck_assert_int_eq(vl_sobol_indices(y, 4, 2, 10, 1.0, 1, idx, &used, &st), VL_ERR_INPUT);
    ck_assert_int_eq(vl_sobol_indices(y, 4, 2, 10, 0.0, 1, idx, &used, &st), VL_ERR_INPUT);
    ck_assert_int_eq(vl_sobol_indices(y, 4, 2, 10, 0.9, 1, idx, &used, &st), VL_OK);

    /* [C] f = x1 exactly (k = 2, hand-made blocks): AB^(1) carries B's x1, AB^(2) A's.
     * Blocks (A, B, AB1, AB2) = (0, 1, 1, 0) and (1, 0, 0, 1): mean 1/2, V = 1/4;
     * S1_1 = (1/2)[(1/2)(1) + (-1/2)(-1)]/V = 2, S1_2 = 0; ST_1 = (1/4)(1 + 1)/V = 2,
     * ST_2 = 0. (Two blocks is far too few: the values only test the arithmetic.) */
    const double yy[8] = {0, 1, 1, 0, 1, 0, 0, 1};
    ck_assert_int_eq(vl_sobol_indices(yy, 2, 2, 0, 0.9, 1, idx, &used, &st), VL_OK);
    ck_assert_double_eq_tol(idx[0].s1, 2.0, 1e-15);
    ck_assert_double_eq_tol(idx[1].s1, 0.0, 1e-15);
    ck_assert_double_eq_tol(idx[0].st, 2.0, 1e-15);
    ck_assert_double_eq_tol(idx[1].st, 0.0, 1e-15);
}
END_TEST

/* Expect vl_axis_check to fail with VL_ERR_INPUT, the file, the line and the key. */
static void expect_bad_axis(const vl_axis *a, int design)
{
    vl_status st;
    vl_status_clear(&st);
    ck_assert_int_eq(vl_axis_check(a, design, "sweep.cfg", &st), VL_ERR_INPUT);
    ck_assert_msg(strstr(st.msg, a->key) != NULL, "message without the key: %s", st.msg);
    ck_assert_str_eq(st.file, "sweep.cfg");
    ck_assert_int_eq(st.line, a->line);
    /* generation refuses it as well */
    double x[64];
    vl_status_clear(&st);
    ck_assert_int_eq(vl_design_generate(design, a, 1, 4, 1, x, &st), VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, a->key));
}

START_TEST(test_axis_errors)
{
    vl_status st;
    vl_status_clear(&st);
    vl_axis ok = dist_axis("e.ok", VL_DIST_TRUNC_NORMAL, 0, 1, 5, 1);
    ck_assert_int_eq(vl_axis_check(&ok, VL_DESIGN_LHS, "f", &st), VL_OK);
    /* mean outside [low, high] is a legitimate truncated normal */
    ck_assert_int_eq(vl_axis_check(&ok, VL_DESIGN_SALTELLI, "f", &st), VL_OK);

    vl_axis a = dist_axis("e.uniform_equal", VL_DIST_UNIFORM, 2.0, 2.0, 0, 0);
    expect_bad_axis(&a, VL_DESIGN_RANDOM);                     /* low >= high */
    a = dist_axis("e.uniform_reversed", VL_DIST_UNIFORM, 3.0, 2.0, 0, 0);
    expect_bad_axis(&a, VL_DESIGN_LHS);
    a = dist_axis("e.loguniform_zero", VL_DIST_LOG_UNIFORM, 0.0, 2.0, 0, 0);
    expect_bad_axis(&a, VL_DESIGN_SOBOL);                      /* log with 0 */
    a = dist_axis("e.normal_sd0", VL_DIST_NORMAL, 0, 0, 1.0, 0.0);
    expect_bad_axis(&a, VL_DESIGN_RANDOM);                     /* sd <= 0 */
    a = dist_axis("e.normal_sdneg", VL_DIST_NORMAL, 0, 0, 1.0, -1.0);
    expect_bad_axis(&a, VL_DESIGN_SALTELLI);
    a = dist_axis("e.tn_bounds", VL_DIST_TRUNC_NORMAL, 1.0, 1.0, 1.0, 1.0);
    expect_bad_axis(&a, VL_DESIGN_LHS);
    a = dist_axis("e.tn_sd", VL_DIST_TRUNC_NORMAL, 0.0, 1.0, 1.0, 0.0);
    expect_bad_axis(&a, VL_DESIGN_LHS);
    a = dist_axis("e.nan_mean", VL_DIST_NORMAL, 0, 0, NAN, 1.0);
    expect_bad_axis(&a, VL_DESIGN_RANDOM);                     /* non-finite */
    a = dist_axis("e.inf_high", VL_DIST_UNIFORM, 0, INFINITY, 0, 0);
    expect_bad_axis(&a, VL_DESIGN_RANDOM);
    a = dist_axis("e.bad_dist", 17, 0, 1, 0, 1);
    expect_bad_axis(&a, VL_DESIGN_RANDOM);

    vl_axis g = grid_axis("e.grid_log0", VL_SPACING_LOG, 0.0, 10.0, 3);
    expect_bad_axis(&g, VL_DESIGN_GRID);                       /* log with 0 */
    g = grid_axis("e.grid_logneg", VL_SPACING_LOG, 1.0, -10.0, 3);
    expect_bad_axis(&g, VL_DESIGN_GRID);
    g = grid_axis("e.grid_points0", VL_SPACING_LINEAR, 0.0, 10.0, 0);
    expect_bad_axis(&g, VL_DESIGN_GRID);
    g = grid_axis("e.grid_nan", VL_SPACING_LINEAR, NAN, 10.0, 3);
    expect_bad_axis(&g, VL_DESIGN_GRID);

    /* k too large: GSL's Sobol generator has 40 dimensions, so sobol takes 40 axes and
     * saltelli 20 (spec); the message names the first axis over the limit. */
    vl_axis many[41];
    for (int i = 0; i < 41; i++) {
        many[i] = dist_axis("", VL_DIST_UNIFORM, 0, 1, 0, 0);
        snprintf(many[i].key, sizeof many[i].key, "e.axis%02d", i);
        many[i].line = 100 + i;
    }
    double *x = malloc(4 * 41 * sizeof *x);
    ck_assert_ptr_nonnull(x);
    vl_status_clear(&st);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_SOBOL, many, 40, 4, &st), 4);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_SOBOL, many, 41, 4, &st), -1);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "e.axis40"));
    ck_assert_int_eq(st.line, 140);
    ck_assert_int_eq(vl_design_generate(VL_DESIGN_SOBOL, many, 41, 4, 0, x, &st), VL_ERR_INPUT);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_SALTELLI, many, 20, 1, &st), 22);
    ck_assert_int_eq(vl_design_size(VL_DESIGN_SALTELLI, many, 21, 1, &st), -1);
    ck_assert_int_eq(st.code, VL_ERR_INPUT);
    ck_assert_ptr_nonnull(strstr(st.msg, "e.axis20"));
    ck_assert_int_eq(vl_design_generate(VL_DESIGN_SALTELLI, many, 21, 1, 0, x, &st),
                     VL_ERR_INPUT);
    /* random and Latin hypercube designs have no such limit */
    ck_assert_int_eq(vl_design_generate(VL_DESIGN_LHS, many, 41, 4, 0, x, &st), VL_OK);
    free(x);
}
END_TEST

START_TEST(test_quantile)
{
    const double v[5] = {1, 2, 3, 4, 5};
    /* [C] h = p (n - 1), linear between order statistics (Hyndman & Fan 1996 type 7) */
    ck_assert_double_eq(vl_quantile_sorted(v, 5, 0.0), 1.0);
    ck_assert_double_eq(vl_quantile_sorted(v, 5, 1.0), 5.0);
    ck_assert_double_eq(vl_quantile_sorted(v, 5, 0.5), 3.0);
    ck_assert_double_eq(vl_quantile_sorted(v, 5, 0.25), 2.0);
    ck_assert_double_eq_tol(vl_quantile_sorted(v, 5, 0.1), 1.4, 1e-15);   /* h = 0.4 */
    const double w[4] = {-2.0, 0.5, 0.5, 10.0};
    ck_assert_double_eq_tol(vl_quantile_sorted(w, 4, 0.9), 7.15, 1e-14);  /* h = 2.7 */
    ck_assert_double_eq(vl_quantile_sorted(w, 1, 0.3), -2.0);              /* one value */
    ck_assert(isnan(vl_quantile_sorted(w, 0, 0.5)));                       /* spec */
    /* same as gsl_stats_quantile_from_sorted_data (spec) */
    for (int i = 0; i <= 20; i++) {
        double p = i / 20.0;
        ck_assert_double_eq_tol(vl_quantile_sorted(w, 4, p),
                                gsl_stats_quantile_from_sorted_data(w, 1, 4, p), 1e-14);
    }
}
END_TEST

Suite *vl_suite_design(void)
{
    Suite *s = suite_create("design");
    TCase *tc = tcase_create("design");
    tcase_add_test(tc, test_grid_values);
    tcase_add_test(tc, test_grid_design);
    tcase_add_test(tc, test_design_size);
    tcase_add_test(tc, test_reproducible);
    tcase_add_test(tc, test_distributions);
    tcase_add_test(tc, test_ishigami);
    tcase_add_test(tc, test_sobol_degenerate);
    tcase_add_test(tc, test_axis_errors);
    tcase_add_test(tc, test_quantile);
    suite_add_tcase(s, tc);
    return s;
}
