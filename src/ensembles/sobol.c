/* sobol.c: variance-based sensitivity indices (design.h). First-order indices by the
 * estimator of Saltelli et al. 2010 (Comput. Phys. Commun. 181:259, Table 2 b), total
 * indices by that of Jansen 1999 (Comput. Phys. Commun. 117:35; Saltelli et al. 2010
 * Table 2 f), both on the A, B, AB^(i) blocks of a Saltelli design; percentile
 * bootstrap intervals (Efron & Tibshirani 1993, An Introduction to the Bootstrap,
 * ch. 13) over the blocks; and the interpolated quantile of sorted data. */
#include "volev/design.h"

#include <limits.h>
#include <math.h>
#include <stdint.h>
#include <stdlib.h>

#include <gsl/gsl_rng.h>
#include <gsl/gsl_sort_double.h>

double vl_quantile_sorted(const double *sorted, size_t n, double p)
{
    if (n == 0 || isnan(p))
        return NAN;
    if (p <= 0.0)
        return sorted[0];
    if (p >= 1.0)
        return sorted[n - 1];
    /* Hyndman & Fan 1996 (Am. Stat. 50:361) type 7, as GSL:
     * h = p (n - 1), Q = (1 - d) x_[h] + d x_[h]+1 with d = h - floor(h). */
    double h = p * (double)(n - 1);
    size_t lo = (size_t)h;
    double d = h - (double)lo;
    if (lo + 1 >= n)
        return sorted[n - 1];
    return (1.0 - d) * sorted[lo] + d * sorted[lo + 1];
}

/* Indices over the blocks idx[0..m) of y (block width k + 2: A, B, AB^(1..k)):
 * fills s1[k] and st[k] and returns V, the variance of the f(A), f(B) values (divisor
 * 2m); returns 0 (s1, st untouched) if those values are all equal. Outputs are centred
 * on their mean first: S_i's numerator f(B)(f(AB_i) - f(A)) has expectation
 * independent of a shift of f, but a large common offset inflates its variance. */
static double estimate(const double *y, size_t k, const long *idx, long m, double *s1,
                       double *st)
{
    size_t w = k + 2;
    double sum = 0.0, lo = INFINITY, hi = -INFINITY;
    for (long b = 0; b < m; b++) {
        const double *blk = y + (size_t)idx[b] * w;
        sum += blk[0] + blk[1];
        lo = fmin(lo, fmin(blk[0], blk[1]));
        hi = fmax(hi, fmax(blk[0], blk[1]));
    }
    if (!(hi > lo))
        return 0.0;
    double mean = sum / (2.0 * (double)m), v = 0.0;
    for (size_t i = 0; i < k; i++)
        s1[i] = st[i] = 0.0;
    for (long b = 0; b < m; b++) {
        const double *blk = y + (size_t)idx[b] * w;
        double fa = blk[0] - mean, fb = blk[1] - mean;
        v += fa * fa + fb * fb;
        for (size_t i = 0; i < k; i++) {
            double fab = blk[2 + i] - mean;
            s1[i] += fb * (fab - fa);          /* Saltelli et al. 2010, Table 2 b */
            st[i] += (fa - fab) * (fa - fab);  /* Jansen 1999, Table 2 f */
        }
    }
    v /= 2.0 * (double)m;
    for (size_t i = 0; i < k; i++) {
        s1[i] = s1[i] / (double)m / v;
        st[i] = st[i] / (2.0 * (double)m) / v;
    }
    return v;
}

/* Percentile interval at level conf of the finite values among col[0..nb) (sorted in
 * place after compaction); lo = hi = est if none is finite. */
static void percentile_interval(double *col, long nb, double conf, double est, double *lo,
                                double *hi)
{
    size_t nf = 0;
    for (long b = 0; b < nb; b++)
        if (isfinite(col[b]))
            col[nf++] = col[b];
    if (nf == 0) {
        *lo = *hi = est;
        return;
    }
    gsl_sort(col, 1, nf);
    *lo = vl_quantile_sorted(col, nf, 0.5 * (1.0 - conf));
    *hi = vl_quantile_sorted(col, nf, 0.5 * (1.0 + conf));
}

/* The arguments' checks: an axis and a sample at least, sizes that fit in memory
 * arithmetic, bootstrap >= 0, 0 < confidence < 1. */
static int check_args(long n, size_t k, long bootstrap, double confidence, vl_status *st)
{
    if (k == 0 || n < 1)
        return vl_fail(st, VL_ERR_INPUT, "", 0,
                       "Sobol indices need at least one axis and one sample (k = %zu, n = %ld)",
                       k, n);
    if ((size_t)n > SIZE_MAX / sizeof(long) / (k + 2))
        return vl_fail(st, VL_ERR_INPUT, "", 0, "Sobol indices: n = %ld is too large", n);
    if (bootstrap < 0)
        return vl_fail(st, VL_ERR_INPUT, "", 0,
                       "Sobol indices: expected bootstrap >= 0 (got %ld)", bootstrap);
    if (!(confidence > 0.0 && confidence < 1.0))
        return vl_fail(st, VL_ERR_INPUT, "", 0,
                       "Sobol indices: expected 0 < confidence < 1 (got %g)", confidence);
    if ((size_t)bootstrap > SIZE_MAX / sizeof(double) / (2 * k))
        return vl_fail(st, VL_ERR_INPUT, "", 0,
                       "Sobol indices: %ld bootstrap resamples is too many", bootstrap);
    return VL_OK;
}

/* Working memory of one computation. */
typedef struct {
    long *keep, *pick;   /* kept blocks; a resample of them */
    double *s1, *st;     /* k indices of one estimate */
    double *bs;          /* bootstrap estimates: 2k columns of `bootstrap` values */
    gsl_rng *r;
} workspace;

/* Allocates ws for n blocks, k axes and `bootstrap` resamples; 0 on success. */
static int ws_alloc(workspace *ws, long n, size_t k, long bootstrap)
{
    ws->keep = malloc((size_t)n * sizeof *ws->keep);
    ws->pick = malloc((size_t)n * sizeof *ws->pick);
    ws->s1 = malloc(k * sizeof *ws->s1);
    ws->st = malloc(k * sizeof *ws->st);
    ws->bs = bootstrap > 0 ? malloc((size_t)bootstrap * 2 * k * sizeof *ws->bs) : NULL;
    ws->r = bootstrap > 0 ? gsl_rng_alloc(gsl_rng_mt19937) : NULL;
    return !ws->keep || !ws->pick || !ws->s1 || !ws->st ||
           (bootstrap > 0 && (!ws->bs || !ws->r));
}

/* Frees what ws_alloc allocated (also after a partial failure). */
static void ws_free(workspace *ws)
{
    free(ws->keep);
    free(ws->pick);
    free(ws->s1);
    free(ws->st);
    free(ws->bs);
    gsl_rng_free(ws->r);
}

/* The blocks (width w) of y whose outputs are all finite, into keep; their count. Blocks
 * with any non-finite output are dropped whole: the estimators pair a block's values. */
static long finite_blocks(const double *y, long n, size_t w, long *keep)
{
    long m = 0;
    for (long j = 0; j < n; j++) {
        const double *blk = y + (size_t)j * w;
        size_t c = 0;
        while (c < w && isfinite(blk[c]))
            c++;
        if (c == w)
            keep[m++] = j;
    }
    return m;
}

/* Bootstrap: resample the m kept blocks with replacement and re-estimate. ws->bs holds
 * 2k columns of `bootstrap` values each (S1 of axis i in column i, ST in column k + i;
 * resample b of column c at c * bootstrap + b), sorted per column; the percentile
 * intervals go into out. */
static void bootstrap_intervals(const double *y, size_t k, long m, long bootstrap,
                                double confidence, unsigned long seed, workspace *ws,
                                vl_sobol_index *out)
{
    gsl_rng_set(ws->r, seed);
    for (long b = 0; b < bootstrap; b++) {
        for (long j = 0; j < m; j++)
            ws->pick[j] = ws->keep[gsl_rng_uniform_int(ws->r, (unsigned long)m)];
        double vb = estimate(y, k, ws->pick, m, ws->s1, ws->st);
        for (size_t i = 0; i < k; i++) {
            /* a resample whose f(A), f(B) are all equal has no defined index */
            ws->bs[i * (size_t)bootstrap + (size_t)b] = vb > 0.0 ? ws->s1[i] : NAN;
            ws->bs[(k + i) * (size_t)bootstrap + (size_t)b] = vb > 0.0 ? ws->st[i] : NAN;
        }
    }
    for (size_t i = 0; i < k; i++) {
        percentile_interval(ws->bs + i * (size_t)bootstrap, bootstrap, confidence, out[i].s1,
                            &out[i].s1_lo, &out[i].s1_hi);
        percentile_interval(ws->bs + (k + i) * (size_t)bootstrap, bootstrap, confidence,
                            out[i].st, &out[i].st_lo, &out[i].st_hi);
    }
}

/* The estimates over the finite blocks, then their bootstrap intervals. */
static int indices(const double *y, long n, size_t k, long bootstrap, double confidence,
                   unsigned long seed, workspace *ws, vl_sobol_index *out, long *n_used,
                   vl_status *st)
{
    long m = finite_blocks(y, n, k + 2, ws->keep);
    if (n_used)
        *n_used = m;
    if (m < 2)
        return vl_fail(st, VL_ERR_NUMERIC, "", 0,
                       "Sobol indices: %ld of %ld samples have finite outputs, need at least 2",
                       m, n);
    double v = estimate(y, k, ws->keep, m, ws->s1, ws->st);
    if (!(v > 0.0) || !isfinite(v))
        return vl_fail(st, VL_ERR_NUMERIC, "", 0,
                       v > 0.0 ? "Sobol indices: the output variance is not finite"
                               : "Sobol indices: the output does not vary (variance 0)");
    for (size_t i = 0; i < k; i++) {
        out[i].s1 = out[i].s1_lo = out[i].s1_hi = ws->s1[i];
        out[i].st = out[i].st_lo = out[i].st_hi = ws->st[i];
    }
    if (bootstrap > 0)
        bootstrap_intervals(y, k, m, bootstrap, confidence, seed, ws, out);
    return VL_OK;
}

int vl_sobol_indices(const double *y, long n, size_t k, long bootstrap, double confidence,
                     unsigned long seed, vl_sobol_index *out, long *n_used, vl_status *st)
{
    if (n_used)
        *n_used = 0;
    int rc = check_args(n, k, bootstrap, confidence, st);
    if (rc)
        return rc;
    workspace ws;
    if (ws_alloc(&ws, n, k, bootstrap))
        rc = vl_fail(st, VL_ERR_INTERNAL, "", 0, "out of memory (Sobol indices)");
    else
        rc = indices(y, n, k, bootstrap, confidence, seed, &ws, out, n_used, st);
    ws_free(&ws);
    return rc;
}
