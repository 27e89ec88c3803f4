/* design.c: ensemble designs (design.h). Grids with linear or logarithmic spacing;
 * random samples and Latin hypercubes (McKay, Beckman & Conover 1979, Technometrics
 * 21:239) from GSL's Mersenne Twister; the Sobol low-discrepancy sequence (Sobol 1967,
 * USSR Comput. Math. Math. Phys. 7:86; GSL's gsl_qrng_sobol, after Bratley & Fox 1988,
 * ACM TOMS 14:88); and the Saltelli design A, B, AB^(i) (Saltelli et al. 2010, Comput.
 * Phys. Commun. 181:259, section 4). Unit-cube coordinates become parameter values
 * through each axis's inverse CDF. */
#include "volev/design.h"

#include <math.h>
#include <stdlib.h>

#include <gsl/gsl_cdf.h>
#include <gsl/gsl_qrng.h>
#include <gsl/gsl_randist.h>
#include <gsl/gsl_rng.h>

/* Unit-cube coordinates are kept this far from 0 and 1 so that normal quantiles stay
 * finite (a Sobol point may have coordinates exactly 0). */
#define U_EDGE 1e-12

/* u clamped to [U_EDGE, 1 - U_EDGE]. */
static double clamp_u(double u)
{
    if (!(u >= U_EDGE))
        return U_EDGE;
    if (u > 1.0 - U_EDGE)
        return 1.0 - U_EDGE;
    return u;
}

double vl_axis_grid_value(const vl_axis *a, long j)
{
    if (a->points <= 1 || j <= 0)
        return a->from;
    if (j >= a->points - 1)
        return a->to;   /* exact end point, no rounding through the spacing formula */
    double t = (double)j / (double)(a->points - 1);
    if (a->spacing == VL_SPACING_LOG) {
        /* x_j = from (to/from)^(j/(points-1)): equal ratios between neighbours */
        double lf = log(a->from), lt = log(a->to);
        return exp(lf + t * (lt - lf));
    }
    /* x_j = from + (to - from) j/(points-1): equal steps */
    return a->from + t * (a->to - a->from);
}

/* Standard normal truncated to [za, zb] with za >= 0 (upper tail): quantile at u.
 * Works with upper-tail probabilities Q(z) = 1 - Phi(z), which keep their precision
 * in the tail. Where Q(za) underflows (za beyond about 37) the truncated density
 * exp(-z^2/2) is proportional to exp(-za (z - za)) to first order in z - za, an
 * exponential of rate za truncated at zb - za, inverted in closed form. */
static double upper_tail_quantile(double za, double zb, double u)
{
    double qa = gsl_cdf_ugaussian_Q(za), qb = gsl_cdf_ugaussian_Q(zb);
    if (qa > 0.0 && qa > qb)
        return gsl_cdf_ugaussian_Qinv(qa - u * (qa - qb));
    if (za > 0.0)   /* z = za - ln(1 - u (1 - exp(-za (zb - za)))) / za */
        return za - log1p(u * expm1(-za * (zb - za))) / za;
    return za + u * (zb - za);   /* degenerate interval: flat density */
}

/* Quantile at u of the normal (mean, sd) restricted to [low, high]:
 * F^-1(u) = mean + sd Phi^-1(Phi(za) + u (Phi(zb) - Phi(za))), z = (x - mean)/sd
 * (inverse-transform sampling of a truncated distribution, common practice). */
static double trunc_normal_quantile(const vl_axis *a, double u)
{
    double za = (a->low - a->mean) / a->sd, zb = (a->high - a->mean) / a->sd, z;
    if (za >= 0.0)
        z = upper_tail_quantile(za, zb, u);
    else if (zb <= 0.0)   /* lower tail: mirror image of an upper tail */
        z = -upper_tail_quantile(-zb, -za, 1.0 - u);
    else {
        double pa = gsl_cdf_ugaussian_P(za), pb = gsl_cdf_ugaussian_P(zb);
        z = gsl_cdf_ugaussian_Pinv(pa + u * (pb - pa));
    }
    double x = a->mean + a->sd * z;
    return fmin(fmax(x, a->low), a->high);   /* rounding never leaves the bounds */
}

double vl_axis_quantile(const vl_axis *a, double u)
{
    switch (a->dist) {
    case VL_DIST_UNIFORM:   /* F^-1(u) = low + u (high - low) */
        return a->low + u * (a->high - a->low);
    case VL_DIST_LOG_UNIFORM: {   /* ln x uniform: F^-1(u) = low (high/low)^u */
        double ll = log(a->low), lh = log(a->high);
        return exp(ll + u * (lh - ll));
    }
    case VL_DIST_NORMAL:   /* F^-1(u) = mean + sd Phi^-1(u) */
        return a->mean + gsl_cdf_gaussian_Pinv(u, a->sd);
    case VL_DIST_TRUNC_NORMAL:
        return trunc_normal_quantile(a, u);
    default:
        return NAN;
    }
}

/* 1 if the design kind samples its axes from distributions. */
static int sampled(int design)
{
    return design == VL_DESIGN_RANDOM || design == VL_DESIGN_LHS || design == VL_DESIGN_SOBOL
           || design == VL_DESIGN_SALTELLI;
}

/* A grid axis: linear or log spacing, finite ends, at least one point, ends > 0 for log. */
static int check_grid(const vl_axis *a, const char *f, vl_status *st)
{
    if (a->spacing != VL_SPACING_LINEAR && a->spacing != VL_SPACING_LOG)
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: expected a spacing of linear or log", a->key);
    if (!isfinite(a->from) || !isfinite(a->to))
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: expected finite from and to (got %g, %g)", a->key, a->from,
                       a->to);
    if (a->points < 1)
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: expected at least 1 grid point (got %ld)", a->key, a->points);
    if (a->spacing == VL_SPACING_LOG && !(a->from > 0.0 && a->to > 0.0))
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: log spacing needs from > 0 and to > 0 (got %g, %g)", a->key,
                       a->from, a->to);
    return VL_OK;
}

/* A uniform or log-uniform axis: finite low < high, and low > 0 for log-uniform. */
static int check_uniform(const vl_axis *a, const char *f, vl_status *st)
{
    const char *name = a->dist == VL_DIST_UNIFORM ? "uniform" : "log-uniform";
    if (!isfinite(a->low) || !isfinite(a->high) || !(a->low < a->high))
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: %s distribution needs finite low < high (got %g, %g)", a->key,
                       name, a->low, a->high);
    if (a->dist == VL_DIST_LOG_UNIFORM && !(a->low > 0.0))
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: log-uniform distribution needs low > 0 (got %g)", a->key,
                       a->low);
    return VL_OK;
}

/* A normal or truncated-normal axis: finite mean, sd > 0; truncated: finite low < high. */
static int check_normal(const vl_axis *a, const char *f, vl_status *st)
{
    const char *name = a->dist == VL_DIST_NORMAL ? "normal" : "truncated normal";
    if (!isfinite(a->mean) || !isfinite(a->sd) || !(a->sd > 0.0))
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: %s distribution needs a finite mean and sd > 0 (got %g, %g)",
                       a->key, name, a->mean, a->sd);
    if (a->dist == VL_DIST_TRUNC_NORMAL
        && (!isfinite(a->low) || !isfinite(a->high) || !(a->low < a->high)))
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: truncated normal distribution needs finite low < high "
                       "(got %g, %g)",
                       a->key, a->low, a->high);
    return VL_OK;
}

int vl_axis_check(const vl_axis *a, int design, const char *file, vl_status *st)
{
    const char *f = file ? file : "";
    if (design == VL_DESIGN_GRID)
        return check_grid(a, f, st);
    if (!sampled(design))
        return vl_fail(st, VL_ERR_INTERNAL, f, a->line, "%s: unknown design kind %d", a->key,
                       design);
    switch (a->dist) {
    case VL_DIST_UNIFORM:
    case VL_DIST_LOG_UNIFORM: return check_uniform(a, f, st);
    case VL_DIST_NORMAL:
    case VL_DIST_TRUNC_NORMAL: return check_normal(a, f, st);
    default:
        return vl_fail(st, VL_ERR_INPUT, f, a->line,
                       "%s: expected a distribution of uniform, log-uniform, normal or "
                       "truncated normal",
                       a->key);
    }
}

/* Sobol-generator dimension the design needs per axis (sobol 1, saltelli 2), or 0. */
static size_t sobol_dims_per_axis(int design)
{
    return design == VL_DESIGN_SOBOL ? 1 : design == VL_DESIGN_SALTELLI ? 2 : 0;
}

long vl_design_size(int design, const vl_axis *axes, size_t k, long n, vl_status *st)
{
    if (design != VL_DESIGN_GRID && !sampled(design)) {
        vl_fail(st, VL_ERR_INTERNAL, "", 0, "unknown design kind %d", design);
        return -1;
    }
    if (k == 0) {
        vl_fail(st, VL_ERR_INPUT, "", 0, "a design needs at least one axis");
        return -1;
    }
    if (design == VL_DESIGN_GRID) {
        long size = 1;
        for (size_t i = 0; i < k; i++) {
            if (axes[i].points < 1) {
                vl_fail(st, VL_ERR_INPUT, "", axes[i].line,
                        "%s: expected at least 1 grid point (got %ld)", axes[i].key,
                        axes[i].points);
                return -1;
            }
            /* size * points > MAX, tested without forming the product (no overflow) */
            if (axes[i].points > VL_DESIGN_MEMBERS_MAX / size) {
                vl_fail(st, VL_ERR_INPUT, "", axes[i].line,
                        "the grid has more than %ld members (at axis %s, %ld points)",
                        VL_DESIGN_MEMBERS_MAX, axes[i].key, axes[i].points);
                return -1;
            }
            size *= axes[i].points;
        }
        return size;
    }
    size_t per = sobol_dims_per_axis(design);
    if (per > 0 && k * per > VL_DESIGN_SOBOL_DIM_MAX) {
        size_t kmax = VL_DESIGN_SOBOL_DIM_MAX / per;
        vl_fail(st, VL_ERR_INPUT, "", axes[kmax].line,
                "%s: the %s design takes at most %zu axes (GSL's Sobol sequence has %d "
                "dimensions), got %zu",
                axes[kmax].key, design == VL_DESIGN_SOBOL ? "sobol" : "saltelli", kmax,
                VL_DESIGN_SOBOL_DIM_MAX, k);
        return -1;
    }
    if (n < 1) {
        vl_fail(st, VL_ERR_INPUT, "", 0, "a sampled design needs at least 1 sample (got %ld)",
                n);
        return -1;
    }
    long rows = design == VL_DESIGN_SALTELLI ? (long)k + 2 : 1;
    if (n > VL_DESIGN_MEMBERS_MAX / rows) {
        vl_fail(st, VL_ERR_INPUT, "", 0, "the design has more than %ld members (n = %ld)",
                VL_DESIGN_MEMBERS_MAX, n);
        return -1;
    }
    return n * rows;
}

/* Grid: member m's index on axis i, last axis fastest (mixed-radix digits of m). */
static void fill_grid(const vl_axis *axes, size_t k, long members, double *x)
{
    for (long m = 0; m < members; m++) {
        long rest = m;
        for (size_t i = k; i-- > 0;) {
            long j = rest % axes[i].points;
            rest /= axes[i].points;
            x[(size_t)m * k + i] = vl_axis_grid_value(&axes[i], j);
        }
    }
}

/* Random: independent uniforms, member by member, axis by axis. */
static void fill_random(gsl_rng *r, const vl_axis *axes, size_t k, long n, double *x)
{
    for (long m = 0; m < n; m++)
        for (size_t i = 0; i < k; i++)
            x[(size_t)m * k + i] = vl_axis_quantile(&axes[i], clamp_u(gsl_rng_uniform_pos(r)));
}

/* Latin hypercube (McKay et al. 1979): on each axis the n equal-probability strata are
 * assigned to members by a random permutation, and each member gets a uniform point
 * inside its stratum: u = (perm_j + U)/n. */
static int fill_lhs(gsl_rng *r, const vl_axis *axes, size_t k, long n, double *x,
                    vl_status *st)
{
    long *perm = malloc((size_t)n * sizeof *perm);
    if (!perm)
        return vl_fail(st, VL_ERR_INTERNAL, "", 0, "out of memory (Latin hypercube of %ld)", n);
    for (size_t i = 0; i < k; i++) {
        for (long j = 0; j < n; j++)
            perm[j] = j;
        gsl_ran_shuffle(r, perm, (size_t)n, sizeof *perm);
        for (long j = 0; j < n; j++) {
            double u = ((double)perm[j] + gsl_rng_uniform(r)) / (double)n;
            x[(size_t)j * k + i] = vl_axis_quantile(&axes[i], clamp_u(u));
        }
    }
    free(perm);
    return VL_OK;
}

/* Sobol and Saltelli designs from one gsl_qrng_sobol stream of dimension dim. The
 * first point of the Sobol sequence, all zeros, is left out (common practice: it lies
 * on a corner of the cube and would map to the lower bound, or -inf for a normal
 * axis). GSL's generator already never returns it: its first output is the sequence's
 * second point (1/2, ..., 1/2) (checked against GSL 2.7.1 in tests/test_design.c), so
 * every point it returns is used. */
static int fill_sobol(int design, const vl_axis *axes, size_t k, long n, double *x,
                      vl_status *st)
{
    size_t dim = design == VL_DESIGN_SALTELLI ? 2 * k : k;
    gsl_qrng *q = gsl_qrng_alloc(gsl_qrng_sobol, (unsigned int)dim);
    double *p = malloc(dim * sizeof *p);
    if (!q || !p) {
        gsl_qrng_free(q);
        free(p);
        return vl_fail(st, VL_ERR_INTERNAL, "", 0, "out of memory (Sobol sequence)");
    }
    int rc = 0;
    for (long j = 0; j < n; j++) {
        rc = gsl_qrng_get(q, p);
        if (rc != 0)
            break;
        if (design == VL_DESIGN_SOBOL) {
            for (size_t i = 0; i < k; i++)
                x[(size_t)j * k + i] = vl_axis_quantile(&axes[i], clamp_u(p[i]));
            continue;
        }
        /* Saltelli et al. 2010, section 4: A_j = p[0..k), B_j = p[k..2k);
         * rows A_j, B_j, then AB_j^(i) = A_j with column i from B_j. */
        size_t w = k + 2;
        double *blk = x + (size_t)j * w * k;
        for (size_t i = 0; i < k; i++) {
            double va = vl_axis_quantile(&axes[i], clamp_u(p[i]));
            double vb = vl_axis_quantile(&axes[i], clamp_u(p[k + i]));
            for (size_t r = 0; r < w; r++)
                blk[r * k + i] = (r == 1 || r == 2 + i) ? vb : va;
        }
    }
    gsl_qrng_free(q);
    free(p);
    if (rc != 0)
        return vl_fail(st, VL_ERR_INTERNAL, "", 0, "the Sobol generator failed (code %d)", rc);
    return VL_OK;
}

int vl_design_generate(int design, const vl_axis *axes, size_t k, long n, unsigned long seed,
                       double *x, vl_status *st)
{
    long members = vl_design_size(design, axes, k, n, st);
    if (members < 0)
        return st->code;
    for (size_t i = 0; i < k; i++)
        if (vl_axis_check(&axes[i], design, NULL, st) != VL_OK)
            return st->code;
    if (design == VL_DESIGN_GRID) {
        fill_grid(axes, k, members, x);
        return VL_OK;
    }
    if (design == VL_DESIGN_SOBOL || design == VL_DESIGN_SALTELLI)
        return fill_sobol(design, axes, k, n, x, st);
    gsl_rng *r = gsl_rng_alloc(gsl_rng_mt19937);
    if (!r)
        return vl_fail(st, VL_ERR_INTERNAL, "", 0, "out of memory (random generator)");
    gsl_rng_set(r, seed);
    int rc = VL_OK;
    if (design == VL_DESIGN_RANDOM)
        fill_random(r, axes, k, n, x);
    else
        rc = fill_lhs(r, axes, k, n, x, st);
    gsl_rng_free(r);
    return rc;
}
