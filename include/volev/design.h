/* design.h: ensemble designs (grids, random and Latin-hypercube samples, Sobol
 * sequences, the Saltelli design) and variance-based sensitivity (Sobol indices by
 * the Saltelli and Jansen estimators, with bootstrap intervals). Pure computation:
 * no files, no printing. Implementations: src/ensembles/design.c, src/ensembles/sobol.c. */
#ifndef VOLEV_DESIGN_H
#define VOLEV_DESIGN_H

#include <stddef.h>

#include "volev/status.h"

enum vl_spacing { VL_SPACING_LINEAR, VL_SPACING_LOG };
enum vl_dist { VL_DIST_UNIFORM, VL_DIST_LOG_UNIFORM, VL_DIST_NORMAL, VL_DIST_TRUNC_NORMAL };
enum vl_design_kind { VL_DESIGN_GRID, VL_DESIGN_RANDOM, VL_DESIGN_LHS, VL_DESIGN_SOBOL, VL_DESIGN_SALTELLI };
/* Names of the design kinds, grid spacings and distributions as a scenario's sweep
 * group writes them, in enum order ('|'-separated: vl_choice_index, vl_choice_name). */
#define VL_DESIGN_CHOICES "grid|random|latin_hypercube|sobol|saltelli"
#define VL_SPACING_CHOICES "linear|log"
#define VL_DIST_CHOICES "uniform|log_uniform|normal|truncated_normal"

/* Largest dimension of GSL's Sobol generator (gsl_qrng_sobol): a sobol design takes
 * at most this many axes, a saltelli design half as many. */
#define VL_DESIGN_SOBOL_DIM_MAX 40
/* Largest number of members of any design. */
#define VL_DESIGN_MEMBERS_MAX 100000000L

typedef struct vl_axis {
    char key[128];            /* scenario key the axis sets, e.g. "inventory.surface_water_to" */
    int line;                 /* line in the scenario file (messages), 0 if unknown */
    /* grid axes */
    int spacing;              /* enum vl_spacing */
    double from, to;          /* first and last grid value (log: both > 0) */
    long points;              /* >= 1 (1: just `from`) */
    /* sampled axes */
    int dist;                 /* enum vl_dist */
    double low, high;         /* uniform / log-uniform bounds; truncated-normal bounds */
    double mean, sd;          /* normal / truncated normal (sd > 0) */
} vl_axis;

/* Grid value j (0 <= j < points): linear or logarithmic spacing from `from` to `to`
 * inclusive; exact end points. */
double vl_axis_grid_value(const vl_axis *a, long j);

/* Inverse CDF of the axis distribution at u in (0,1): uniform, log-uniform, normal
 * (gsl_cdf_gaussian_Pinv), truncated normal (inverse CDF restricted to [low, high]). */
double vl_axis_quantile(const vl_axis *a, double u);

/* Checks an axis's fields for the design kind (grid needs spacing/from/to/points with
 * points >= 1, log needs from,to > 0; sampled needs low < high for uniform/log-uniform
 * (log: low > 0), sd > 0 for normal, low < high and sd > 0 for truncated normal; all
 * values finite). On error fails st with VL_ERR_INPUT, file `file`, the axis line, and
 * a message naming the key and what was expected. */
int vl_axis_check(const vl_axis *a, int design, const char *file, vl_status *st);

/* Members of a design: grid: product of points (fail with VL_ERR_INPUT if it exceeds
 * 1e8 or overflows); random, latin_hypercube, sobol: n; saltelli: n (k + 2).
 * Every kind needs k >= 1, sampled kinds n >= 1, sobol k <= 40, saltelli 2k <= 40,
 * and no kind more than VL_DESIGN_MEMBERS_MAX members.
 * Returns -1 and fills st on error. */
long vl_design_size(int design, const vl_axis *axes, size_t k, long n, vl_status *st);

/* Fills x (members x k, row-major, members from vl_design_size) with parameter values.
 * grid: last axis varies fastest. random: gsl_rng_mt19937 seeded with `seed`, one
 *   uniform per axis per member in member order, mapped through vl_axis_quantile.
 * latin_hypercube: per axis, a random permutation of the n strata, u = (stratum +
 *   uniform)/n, from a gsl_rng_mt19937 seeded with `seed`, then vl_axis_quantile.
 * sobol: gsl_qrng_sobol of dimension k (k <= 40); the first point of the Sobol
 *   sequence (all zeros) is left out, as is common practice -- GSL's generator never
 *   returns it (its first output is (1/2, ..., 1/2)), so member j is GSL's output j;
 *   u is clamped to [1e-12, 1 - 1e-12] so normal quantiles are finite.
 * saltelli: gsl_qrng_sobol of dimension 2k (2k <= 40), zero point left out as for
 *   sobol; row j (GSL's output j) gives
 *   A_j = first k coordinates, B_j = last k; member rows j*(k+2)+0 = A_j, +1 = B_j,
 *   +2+i = AB_j^(i) = A_j with column i taken from B_j (Saltelli et al. 2010, Comput.
 *   Phys. Commun. 181:259). The axes are checked first (vl_axis_check, no file name).
 * Note: GSL's mt19937 treats seed 0 as its default seed 4357.
 * Returns VL_OK or fails st. Deterministic for a given input. */
int vl_design_generate(int design, const vl_axis *axes, size_t k, long n, unsigned long seed,
                       double *x, vl_status *st);

typedef struct vl_sobol_index {
    double s1, s1_lo, s1_hi;   /* first-order index and its bootstrap interval */
    double st, st_lo, st_hi;   /* total index and its bootstrap interval */
} vl_sobol_index;

/* Sobol indices from the outputs y of a saltelli design, in member order (n (k+2)
 * values); out has k entries. First order: Saltelli et al. 2010 (their eq. b, Table 2):
 *   S_i = (1/n) sum_j f(B)_j (f(AB_i)_j - f(A)_j) / V;
 * total: Jansen 1999 (Saltelli et al. 2010 Table 2 f):
 *   ST_i = (1/(2n)) sum_j (f(A)_j - f(AB_i)_j)^2 / V;
 * V = variance of all f(A) and f(B) values together (divisor 2n). Outputs are centred
 * on the mean of the f(A) and f(B) values before the sums (common practice; it leaves
 * the expectations unchanged and reduces the estimators' variance). A block j with any
 * non-finite value is dropped (*n_used counts the blocks kept; fail with
 * VL_ERR_NUMERIC if fewer than 2 remain or V == 0). Confidence intervals: `bootstrap`
 * resamples (>= 0; 0 gives lo = hi = the estimate) of the kept blocks with replacement
 * (gsl_rng_mt19937 seeded with `seed`), percentile interval at level `confidence`
 * (0 < confidence < 1); resamples with zero variance are left out of the interval. */
int vl_sobol_indices(const double *y, long n, size_t k, long bootstrap, double confidence,
                     unsigned long seed, vl_sobol_index *out, long *n_used, vl_status *st);

/* Quantile p in [0,1] of n sorted finite values (linear interpolation between order
 * statistics, as gsl_stats_quantile_from_sorted_data); NAN for n == 0 or p NaN;
 * p outside [0,1] is clamped. */
double vl_quantile_sorted(const double *sorted, size_t n, double p);

#endif
