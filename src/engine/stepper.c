/* stepper.c: one history's ODE integrator (integrate_internal.h): GSL's multistep BDF
 * (gsl_odeiv2_step_msbdf, stiff-capable) over the model's right-hand side with a
 * finite-difference Jacobian, per-reservoir absolute scales (floor / 1e3; the mantle's
 * potential temperature: TP_ABS_K) and the run's tolerances. */
#include <float.h>
#include <math.h>
#include <string.h>

#include <gsl/gsl_errno.h>

#include "integrate_internal.h"
#include "volev/units.h"

/* Absolute accuracy asked of the mantle's potential temperature, K, and the size it
 * counts as for the Jacobian's increments. */
#define TP_ABS_K 1e-3
#define TP_SIZE_K 1.0

/* Size of state component j below which its Jacobian increment stops shrinking. */
static double component_size(int j) { return j < VL_NRES ? vl_reservoir_floor(j) : TP_SIZE_K; }

int vl_stepper_finite(const double *v, size_t n)
{
    for (size_t i = 0; i < n; i++)
        if (!isfinite(v[i]))
            return 0;
    return 1;
}

static int rhs(double t, const double y[], double f[], void *pv)
{
    vl_ode *c = pv;
    c->rhs_calls++;
    vl_model_rhs(c->m, c->w, t, y, c->regime, f, NULL, NULL);
    return vl_stepper_finite(f, VL_NSTATE) ? GSL_SUCCESS : GSL_EBADFUNC;
}

/* Forward-difference Jacobian; increments scale with each reservoir's floor band. */
static int jac(double t, const double y[], double *dfdy, double dfdt[], void *pv)
{
    vl_ode *c = pv;
    double sq = sqrt(DBL_EPSILON);
    if (rhs(t, y, c->f0, c) != GSL_SUCCESS)
        return GSL_EBADFUNC;
    memcpy(c->yt, y, sizeof c->yt);
    for (int j = 0; j < VL_NSTATE; j++) {
        /* no process reads space; a mantle that never was molten has no temperature */
        if ((j >= VL_R_SPACE_H && j <= VL_R_SPACE_D) || (j == VL_S_MANTLE_TP && y[j] == 0.0)) {
            for (int i = 0; i < VL_NSTATE; i++)
                dfdy[i * VL_NSTATE + j] = 0.0;
            continue;
        }
        double h = sq * fmax(fabs(y[j]), component_size(j));
        c->yt[j] = y[j] + h;
        if (rhs(t, c->yt, c->f1, c) != GSL_SUCCESS)
            return GSL_EBADFUNC;
        c->yt[j] = y[j];
        for (int i = 0; i < VL_NSTATE; i++)
            dfdy[i * VL_NSTATE + j] = (c->f1[i] - c->f0[i]) / h;
    }
    /* backward in time, so a tabulated star is never asked beyond the run's end */
    double ht = sq * fmax(fabs(t), VL_YR);
    if (rhs(t - ht, y, c->f1, c) != GSL_SUCCESS)
        return GSL_EBADFUNC;
    for (int i = 0; i < VL_NSTATE; i++)
        dfdt[i] = (c->f0[i] - c->f1[i]) / ht;
    return GSL_SUCCESS;
}

int vl_stepper_init(vl_stepper *s, vl_ode *ode, const vl_run_params *rp)
{
    double scale[VL_NSTATE];
    for (int i = 0; i < VL_NRES; i++)
        scale[i] = vl_reservoir_floor(i) / 1e3;
    scale[VL_S_MANTLE_TP] = TP_ABS_K / rp->abs_tol_kg;
    s->sys = (gsl_odeiv2_system){rhs, jac, VL_NSTATE, ode};
    s->drv = gsl_odeiv2_driver_alloc_scaled_new(&s->sys, gsl_odeiv2_step_msbdf, VL_YR,
                                                rp->abs_tol_kg, rp->rel_tol, 1.0, 0.0, scale);
    if (!s->drv)
        return 0;
    s->step = s->drv->s;
    s->ctrl = s->drv->c;
    s->ev = s->drv->e;
    return 1;
}

void vl_stepper_free(vl_stepper *s)
{
    if (s->drv)
        gsl_odeiv2_driver_free(s->drv);
}

void vl_stepper_reset(vl_stepper *s)
{
    gsl_odeiv2_evolve_reset(s->ev);
    gsl_odeiv2_step_reset(s->step);
}

static int failed(vl_status *st, double t, int rc)
{
    return vl_fail(st, VL_ERR_NUMERIC, NULL, 0, "integration failed at age %.6g yr: %s",
                   t / VL_YR, rc != GSL_SUCCESS ? gsl_strerror(rc) : "non-finite state");
}

int vl_stepper_advance_to(vl_stepper *s, double *t, double t1, double *h, double *y,
                          long *steps, vl_status *st)
{
    while (*t < t1) {
        int rc = gsl_odeiv2_evolve_apply(s->ev, s->ctrl, s->step, s->drv->sys, t, t1, h, y);
        if (rc != GSL_SUCCESS || !vl_stepper_finite(y, VL_NSTATE))
            return failed(st, *t, rc);
        if (steps)
            (*steps)++;
    }
    return VL_OK;
}

int vl_stepper_step(vl_stepper *s, double *t, double t1, double *h, double *y, long *restarts,
                    vl_status *st)
{
    double t0 = *t, y0[VL_NSTATE];
    memcpy(y0, y, sizeof y0);
    int rc = gsl_odeiv2_evolve_apply(s->ev, s->ctrl, s->step, s->drv->sys, t, t1, h, y);
    for (int retry = 0; retry < 8 && (rc != GSL_SUCCESS || !vl_stepper_finite(y, VL_NSTATE));
         retry++) {
        *t = t0;
        memcpy(y, y0, sizeof y0);
        vl_stepper_reset(s);
        *h = fmax(*h, 1.0) * 1e-2;
        (*restarts)++;
        rc = gsl_odeiv2_evolve_apply(s->ev, s->ctrl, s->step, s->drv->sys, t, t1, h, y);
    }
    if (rc != GSL_SUCCESS || !vl_stepper_finite(y, VL_NSTATE))
        return failed(st, t0, rc);
    return VL_OK;
}
