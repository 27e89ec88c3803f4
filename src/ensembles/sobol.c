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

int vl_sobol_indices(const double *y, long n, size_t k, long bootstrap, double confidence,
                     unsigned long seed, vl_sobol_index *out, long *n_used, vl_status *st)
{
    if (n_used)
        *n_used = 0;
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

    size_t w = k + 2;
    long *keep = malloc((size_t)n * sizeof *keep);
    long *pick = malloc((size_t)n * sizeof *pick);
    double *s1 = malloc(k * sizeof *s1), *stt = malloc(k * sizeof *stt);
    double *bs = bootstrap > 0 ? malloc((size_t)bootstrap * 2 * k * sizeof *bs) : NULL;
    gsl_rng *r = bootstrap > 0 ? gsl_rng_alloc(gsl_rng_mt19937) : NULL;
    int rc = VL_OK;
    if (!keep || !pick || !s1 || !stt || (bootstrap > 0 && (!bs || !r))) {
        rc = vl_fail(st, VL_ERR_INTERNAL, "", 0, "out of memory (Sobol indices)");
        goto done;
    }

    /* Blocks with any non-finite output are dropped whole: the estimators pair the
     * values of a block. */
    long m = 0;
    for (long j = 0; j < n; j++) {
        const double *blk = y + (size_t)j * w;
        size_t c = 0;
        while (c < w && isfinite(blk[c]))
            c++;
        if (c == w)
            keep[m++] = j;
    }
    if (n_used)
        *n_used = m;
    if (m < 2) {
        rc = vl_fail(st, VL_ERR_NUMERIC, "", 0,
                     "Sobol indices: %ld of %ld samples have finite outputs, need at least 2",
                     m, n);
        goto done;
    }
    double v = estimate(y, k, keep, m, s1, stt);
    if (!(v > 0.0) || !isfinite(v)) {
        rc = vl_fail(st, VL_ERR_NUMERIC, "", 0,
                     v > 0.0 ? "Sobol indices: the output variance is not finite"
                             : "Sobol indices: the output does not vary (variance 0)");
        goto done;
    }
    for (size_t i = 0; i < k; i++) {
        out[i].s1 = out[i].s1_lo = out[i].s1_hi = s1[i];
        out[i].st = out[i].st_lo = out[i].st_hi = stt[i];
    }
    if (bootstrap == 0)
        goto done;

    /* Bootstrap: resample the kept blocks with replacement and re-estimate. bs holds
     * 2k columns of `bootstrap` values each (S1 of axis i in column i, ST in column
     * k + i; resample b of column c at c * bootstrap + b), sorted per column. */
    gsl_rng_set(r, seed);
    for (long b = 0; b < bootstrap; b++) {
        for (long j = 0; j < m; j++)
            pick[j] = keep[gsl_rng_uniform_int(r, (unsigned long)m)];
        double vb = estimate(y, k, pick, m, s1, stt);
        for (size_t i = 0; i < k; i++) {
            /* a resample whose f(A), f(B) are all equal has no defined index */
            bs[i * (size_t)bootstrap + (size_t)b] = vb > 0.0 ? s1[i] : NAN;
            bs[(k + i) * (size_t)bootstrap + (size_t)b] = vb > 0.0 ? stt[i] : NAN;
        }
    }
    for (size_t i = 0; i < k; i++) {
        percentile_interval(bs + i * (size_t)bootstrap, bootstrap, confidence, out[i].s1,
                            &out[i].s1_lo, &out[i].s1_hi);
        percentile_interval(bs + (k + i) * (size_t)bootstrap, bootstrap, confidence,
                            out[i].st, &out[i].st_lo, &out[i].st_hi);
    }

done:
    free(keep);
    free(pick);
    free(s1);
    free(stt);
    free(bs);
    gsl_rng_free(r);
    return rc;
}
