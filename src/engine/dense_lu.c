/* dense_lu.c: a direct linear solver for CVODE (integrate_internal.h) on its dense
 * matrix: LU factorisation with partial pivoting and the two triangular solves, the
 * column-oriented algorithm of LINPACK's DGEFA/DGESL (Dongarra et al. 1979, LINPACK
 * Users' Guide, SIAM) in the operation order of SUNDIALS's own dense solver, so the
 * results are the same to the bit. It exists because Debian's libsundials is built
 * without optimisation: its dense solves cost about 10 000 instructions for a 19 x 19
 * system, this one compiled with the project's flags a few hundred (docs/performance.md
 * section 12). */
#include <math.h>
#include <stdlib.h>

#include <nvector/nvector_serial.h>
#include <sunmatrix/sunmatrix_dense.h>

#include "integrate_internal.h"

typedef struct {
    sunindextype n;
    sunindextype *pivot;
    sunindextype last; /* 0, or the 1-based column of a zero pivot */
} lu_content;

#define CONTENT(S) ((lu_content *)(S)->content)

static SUNLinearSolver_Type lu_type(SUNLinearSolver s)
{
    (void)s;
    return SUNLINEARSOLVER_DIRECT;
}

static SUNLinearSolver_ID lu_id(SUNLinearSolver s)
{
    (void)s;
    return SUNLINEARSOLVER_CUSTOM;
}

static int lu_initialize(SUNLinearSolver s)
{
    CONTENT(s)->last = 0;
    return SUNLS_SUCCESS;
}

/* Factor the n x n column array a in place (L below the diagonal with unit diagonal, U
 * on and above it) with row interchanges p; 0, or the 1-based column of a zero pivot. */
static sunindextype factor(realtype **a, sunindextype n, sunindextype *p)
{
    for (sunindextype k = 0; k < n; k++) {
        realtype *ck = a[k];
        sunindextype l = k;
        for (sunindextype i = k + 1; i < n; i++)
            if (fabs(ck[i]) > fabs(ck[l]))
                l = i;
        p[k] = l;
        if (ck[l] == 0.0)
            return k + 1;
        if (l != k)
            for (sunindextype j = 0; j < n; j++) {
                realtype t = a[j][l];
                a[j][l] = a[j][k];
                a[j][k] = t;
            }
        realtype mult = 1.0 / ck[k];
        for (sunindextype i = k + 1; i < n; i++)
            ck[i] *= mult;
        for (sunindextype j = k + 1; j < n; j++) {
            realtype *cj = a[j], akj = cj[k];
            if (akj != 0.0)
                for (sunindextype i = k + 1; i < n; i++)
                    cj[i] -= akj * ck[i];
        }
    }
    return 0;
}

/* Solve with the factors of factor(): b is overwritten by the solution. */
static void substitute(realtype **a, sunindextype n, const sunindextype *p, realtype *b)
{
    for (sunindextype k = 0; k < n; k++)
        if (p[k] != k) {
            realtype t = b[k];
            b[k] = b[p[k]];
            b[p[k]] = t;
        }
    for (sunindextype k = 0; k < n - 1; k++) {
        const realtype *ck = a[k];
        realtype bk = b[k];
        for (sunindextype i = k + 1; i < n; i++)
            b[i] -= ck[i] * bk;
    }
    for (sunindextype k = n - 1; k > 0; k--) {
        const realtype *ck = a[k];
        b[k] /= ck[k];
        realtype bk = b[k];
        for (sunindextype i = 0; i < k; i++)
            b[i] -= ck[i] * bk;
    }
    b[0] /= a[0][0];
}

/* A zero pivot is recoverable for CVODE: it retries with a smaller step. */
static int lu_setup(SUNLinearSolver s, SUNMatrix m)
{
    lu_content *c = CONTENT(s);
    c->last = factor(SM_COLS_D(m), c->n, c->pivot);
    return c->last > 0 ? SUNLS_LUFACT_FAIL : SUNLS_SUCCESS;
}

static int lu_solve(SUNLinearSolver s, SUNMatrix m, N_Vector x, N_Vector b, realtype tol)
{
    (void)tol;
    lu_content *c = CONTENT(s);
    realtype *xd = NV_DATA_S(x), *bd = NV_DATA_S(b);
    for (sunindextype i = 0; i < c->n; i++)
        xd[i] = bd[i];
    substitute(SM_COLS_D(m), c->n, c->pivot, xd);
    return SUNLS_SUCCESS;
}

static sunindextype lu_lastflag(SUNLinearSolver s) { return CONTENT(s)->last; }

static int lu_free(SUNLinearSolver s)
{
    if (!s)
        return SUNLS_SUCCESS;
    if (s->content) {
        free(CONTENT(s)->pivot);
        free(s->content);
        s->content = NULL;
    }
    SUNLinSolFreeEmpty(s);
    return SUNLS_SUCCESS;
}

SUNLinearSolver vl_dense_lu_new(sunindextype n, SUNContext ctx)
{
    SUNLinearSolver s = SUNLinSolNewEmpty(ctx);
    lu_content *c = calloc(1, sizeof *c);
    sunindextype *p = calloc((size_t)(n > 0 ? n : 1), sizeof *p);
    if (!s || !c || !p) {
        free(c);
        free(p);
        if (s)
            SUNLinSolFreeEmpty(s);
        return NULL;
    }
    c->n = n;
    c->pivot = p;
    s->content = c;
    s->ops->gettype = lu_type;
    s->ops->getid = lu_id;
    s->ops->initialize = lu_initialize;
    s->ops->setup = lu_setup;
    s->ops->solve = lu_solve;
    s->ops->lastflag = lu_lastflag;
    s->ops->free = lu_free;
    return s;
}
