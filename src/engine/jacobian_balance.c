/* jacobian_balance.c: finite-difference Jacobian columns made to conserve every element
 * (integrate_internal.h).
 *
 * Why: every evaluation of the right-hand side conserves each element (b_e . f = 0 for
 * the element ledger's row b_e, flux.h), so the exact Jacobian does too (b_e^T J = 0),
 * and then every Newton correction of the BDF step, M^{-1} r with M = I - gamma J,
 * keeps the element totals of the predictor exactly: b_e^T M = b_e^T. A finite-difference
 * column (f(y + h e_j) - f(y)) / h does not: each entry carries the round-off of its
 * row, about DBL_EPSILON x (the row's gross tendency) / h. For a small reservoir next to
 * a large flow the increment h is small and that round-off is large: with 3e7 kg of H2
 * (h = 0.45 kg) beside a surface water losing 1e10 kg/s to photolysis, the water entry
 * of the H2 column is uncertain by about 2e-16 x 1e10 / 0.45 = 5e-6 /s while the true
 * entry is of order 1e-7 /s; times gamma (1e6-1e7 s) the column creates or destroys
 * hydrogen in every Newton correction, and the step keeps what its convergence test
 * leaves, of the order of a tenth of the local tolerance of the largest reservoir.
 * Campaign member 65 (issue 18) gained 2.9e10 kg of hydrogen (1.1e-8 of its 2.7e18 kg)
 * in its first year that way, member 70 1e-8 of its deuterium.
 *
 * How: the column's element imbalances c_e = b_e . col are removed by the weighted
 * least-squares correction col -= W B lambda with (B^T W B) lambda = c, B the active
 * components' element fractions and W the squared gross tendency of each component at
 * the column's evaluation (the entry's round-off scale): the smallest change, in units of
 * each entry's own uncertainty, that makes B^T col = 0 (the constrained least-squares
 * estimate, e.g. Golub & Van Loan 2013, Matrix Computations, 4th ed., section 6.2,
 * from memory). An entry without round-off (a row no process wrote) is left alone. The
 * system is at most VL_NELEMENTS square and may be singular (water alone carries H and O
 * in one ratio); it is scaled to a unit diagonal and solved by GSL's singular value
 * decomposition with the small singular values dropped, which solves it exactly because
 * c lies in its range (an entry of zero weight is an exact zero and adds nothing to c). */
#include <math.h>

#include <gsl/gsl_linalg.h>

#include "integrate_internal.h"
#include "model_internal.h"
#include "volev/flux.h"

/* Singular values below this fraction of the largest are taken as zero. */
#define SV_CUT 1e-12

/* The gross tendency of every state component at w's last evaluation (kg/s): the sum of
 * the magnitudes of the process rows that may write it, in the rows' own summation order
 * (rhs.c), so that the result does not depend on the order processes are registered in
 * (tests/test_contract.c). */
static void gross_rows(const vl_model *m, const vl_work *w, double *gross)
{
    for (int r = 0; r < VL_NRES; r++) {
        double s = 0.0;
        const size_t *who = w->touch + (size_t)r * m->nproc;
        for (size_t k = 0; k < w->ntouch[r]; k++)
            s += fabs(w->rows[who[k]][r]);
        gross[r] = s;
    }
}

/* lambda = A^+ c for the symmetric positive semi-definite n x n matrix a (overwritten),
 * through its singular value decomposition. 0 on success. */
static int pseudo_solve(double *a, const double *c, double *lambda, size_t n)
{
    double vbuf[VL_NELEMENTS * VL_NELEMENTS], sbuf[VL_NELEMENTS], wbuf[VL_NELEMENTS];
    gsl_matrix_view A = gsl_matrix_view_array(a, n, n);
    gsl_matrix_view V = gsl_matrix_view_array(vbuf, n, n);
    gsl_vector_view S = gsl_vector_view_array(sbuf, n), W = gsl_vector_view_array(wbuf, n);
    if (gsl_linalg_SV_decomp(&A.matrix, &V.matrix, &S.vector, &W.vector))
        return 1;
    double cut = SV_CUT * sbuf[0];
    for (size_t i = 0; i < n; i++) /* A = U S V^T: lambda = V S^+ U^T c */
        if (!(sbuf[i] > cut))
            sbuf[i] = 0.0;
    for (size_t k = 0; k < n; k++)
        lambda[k] = 0.0;
    for (size_t i = 0; i < n; i++) {
        if (sbuf[i] == 0.0)
            continue;
        double u = 0.0;
        for (size_t k = 0; k < n; k++)
            u += a[k * n + i] * c[k];
        u /= sbuf[i];
        for (size_t k = 0; k < n; k++)
            lambda[k] += vbuf[k * n + i] * u;
    }
    return 0;
}

/* The same for the element system a lambda = c, scaled to a unit diagonal first (the
 * elements' weights differ by many orders of magnitude: unscaled, the singular value cut
 * would drop a scarce element's equation); an element no weighted reservoir carries
 * (zero diagonal) gets lambda = 0. */
static int scaled_solve(double *a, const double *c, double *lambda)
{
    enum { N = VL_NELEMENTS };
    double sc[N], cs[N], mu[N];
    for (int e = 0; e < N; e++)
        sc[e] = a[e * N + e] > 0.0 ? 1.0 / sqrt(a[e * N + e]) : 0.0;
    for (int e = 0; e < N; e++) {
        cs[e] = sc[e] * c[e];
        for (int q = 0; q < N; q++)
            a[e * N + q] *= sc[e] * sc[q];
    }
    if (pseudo_solve(a, cs, mu, N))
        return 1;
    for (int e = 0; e < N; e++)
        lambda[e] = sc[e] * mu[e];
    return 0;
}

/* One correction of col with the weights w of the active components (0 for a row no
 * process wrote); 0 when there was nothing to correct or the solve failed. */
static int correct(const vl_ode *c, const double *w, double *col)
{
    double imb[VL_NELEMENTS] = {0}, a[VL_NELEMENTS * VL_NELEMENTS] = {0};
    int off = 0;
    for (int k = 0; k < c->na; k++) {
        int r = c->idx[k];
        if (r >= VL_NRES)
            continue;
        for (int e = 0; e < VL_NELEMENTS; e++) {
            double fe = vl_reservoir_element_fraction(r, e);
            imb[e] += fe * col[k];
            for (int q = 0; q < VL_NELEMENTS; q++)
                a[e * VL_NELEMENTS + q] += w[k] * fe * vl_reservoir_element_fraction(r, q);
        }
    }
    for (int e = 0; e < VL_NELEMENTS; e++)
        off |= imb[e] != 0.0;
    double lambda[VL_NELEMENTS];
    if (!off || scaled_solve(a, imb, lambda))
        return 0;
    for (int k = 0; k < c->na; k++) {
        int r = c->idx[k];
        if (r >= VL_NRES || w[k] == 0.0)
            continue;
        double s = 0.0;
        for (int e = 0; e < VL_NELEMENTS; e++)
            s += vl_reservoir_element_fraction(r, e) * lambda[e];
        col[k] -= w[k] * s;
    }
    return 1;
}

void vl_jacobian_balance(const vl_ode *c, double *col)
{
    double gross[VL_NRES], w[VL_NSTATE], scale = 0.0;
    gross_rows(c->m, c->w, gross);
    for (int k = 0; k < c->na; k++)
        if (c->idx[k] < VL_NRES)
            scale = fmax(scale, gross[c->idx[k]]);
    if (!(scale > 0.0))
        return;
    for (int k = 0; k < c->na; k++) {
        double g = c->idx[k] < VL_NRES ? gross[c->idx[k]] / scale : 0.0;
        w[k] = g * g;
    }
    /* a second pass removes what the first one's own round-off left (iterative
     * refinement, e.g. Higham 2002, Accuracy and Stability of Numerical Algorithms,
     * chapter 12, from memory) */
    if (correct(c, w, col))
        correct(c, w, col);
}
