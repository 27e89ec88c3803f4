/* sundials_kernels.c: the vector and matrix operations CVODE spends its own time in
 * (linear sums, scaling, weighted RMS norms; copying the Jacobian and forming I - gamma J),
 * compiled with the project's flags and installed in the operation tables of the vectors
 * and the matrix the stepper makes (integrate_internal.h). Debian's libsundials is built
 * without optimisation, and these few loops were a sixth of an hz_fit run
 * (docs/performance.md section 12). Every result is the one SUNDIALS's serial vector and
 * dense matrix give, to the bit: the same arithmetic in the same order, including the
 * serial vector's special cases that round differently (a (x + y) when a = b, a (x - y)
 * when a = -b). */
#include <math.h>

#include <nvector/nvector_serial.h>
#include <sunmatrix/sunmatrix_dense.h>

#include "integrate_internal.h"

/* z = a x + b y. */
static void linear_sum(realtype a, N_Vector x, realtype b, N_Vector y, N_Vector z)
{
    sunindextype n = NV_LENGTH_S(x);
    const realtype *xd = NV_DATA_S(x), *yd = NV_DATA_S(y);
    realtype *zd = NV_DATA_S(z);
    int unit = a == 1.0 || a == -1.0 || b == 1.0 || b == -1.0;
    if (!unit && a == b)
        for (sunindextype i = 0; i < n; i++)
            zd[i] = a * (xd[i] + yd[i]);
    else if (!unit && a == -b)
        for (sunindextype i = 0; i < n; i++)
            zd[i] = a * (xd[i] - yd[i]);
    else
        for (sunindextype i = 0; i < n; i++)
            zd[i] = a * xd[i] + b * yd[i];
}

/* z = c x (c = 1 and c = -1 give the copy and the negation exactly). */
static void scale(realtype c, N_Vector x, N_Vector z)
{
    sunindextype n = NV_LENGTH_S(x);
    const realtype *xd = NV_DATA_S(x);
    realtype *zd = NV_DATA_S(z);
    for (sunindextype i = 0; i < n; i++)
        zd[i] = c * xd[i];
}

/* The sum of (x_i w_i)^2. */
static realtype weighted_squares(N_Vector x, N_Vector w)
{
    sunindextype n = NV_LENGTH_S(x);
    const realtype *xd = NV_DATA_S(x), *wd = NV_DATA_S(w);
    realtype sum = 0.0;
    for (sunindextype i = 0; i < n; i++) {
        realtype p = xd[i] * wd[i];
        sum += p * p;
    }
    return sum;
}

static realtype wrms_norm(N_Vector x, N_Vector w)
{
    return sqrt(weighted_squares(x, w) / (realtype)NV_LENGTH_S(x));
}

void vl_kernels_vector(N_Vector v)
{
    v->ops->nvlinearsum = linear_sum;
    v->ops->nvscale = scale;
    v->ops->nvwsqrsumlocal = weighted_squares;
    v->ops->nvwrmsnorm = wrms_norm;
}

/* B = A (same shape: both are the stepper's). */
static int mat_copy(SUNMatrix a, SUNMatrix b)
{
    sunindextype n = SM_COLUMNS_D(a), m = SM_ROWS_D(a);
    realtype **ac = SM_COLS_D(a), **bc = SM_COLS_D(b);
    for (sunindextype j = 0; j < n; j++)
        for (sunindextype i = 0; i < m; i++)
            bc[j][i] = ac[j][i];
    return SUNMAT_SUCCESS;
}

/* A = c A + I. */
static int mat_scale_add_identity(realtype c, SUNMatrix a)
{
    sunindextype n = SM_COLUMNS_D(a), m = SM_ROWS_D(a);
    realtype **ac = SM_COLS_D(a);
    for (sunindextype j = 0; j < n; j++) {
        for (sunindextype i = 0; i < m; i++)
            ac[j][i] *= c;
        ac[j][j] += 1.0;
    }
    return SUNMAT_SUCCESS;
}

/* A new matrix of a's shape with these kernels (a dense matrix's own clone would come
 * with the library's). */
static SUNMatrix mat_clone(SUNMatrix a)
{
    SUNMatrix b = SUNDenseMatrix(SUNDenseMatrix_Rows(a), SUNDenseMatrix_Columns(a), a->sunctx);
    if (b)
        vl_kernels_matrix(b);
    return b;
}

void vl_kernels_matrix(SUNMatrix m)
{
    m->ops->clone = mat_clone;
    m->ops->copy = mat_copy;
    m->ops->scaleaddi = mat_scale_add_identity;
}
