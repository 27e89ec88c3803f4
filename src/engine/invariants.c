/* invariants.c: the physical-invariant guard and the conservation figures of the written
 * state (invariants.h; docs/hardening.md, "Physical invariants"). */
#include "volev/invariants.h"

#include <math.h>
#include <string.h>

#include "volev/flux.h"
#include "volev/units.h"

double vl_reservoir_abs_tol(const vl_run_params *rp, int r)
{
    return rp->abs_tol_kg * vl_reservoir_floor(r) / 1e3;
}

double vl_element_resolution(const vl_run_params *rp, int el)
{
    double a = 0.0;
    for (int r = 0; r < VL_NRES; r++)
        a = fmax(a, vl_reservoir_abs_tol(rp, r) * vl_reservoir_element_fraction(r, el));
    return a;
}

/* 1 when reservoir r holds element el only (its whole mass is el). */
static int pure(int r, int el) { return vl_reservoir_element_fraction(r, el) > 1.0 - 1e-12; }

/* Take kg of element el out of the reservoirs that hold el alone, in proportion to what
 * each holds; returns what could not be taken (they held less). */
static double take_element(double *w, int el, double kg)
{
    double held = 0.0;
    for (int r = 0; r < VL_NRES; r++)
        if (pure(r, el) && w[r] > 0.0)
            held += w[r];
    if (!(held > 0.0))
        return kg;
    double share = kg < held ? kg / held : 1.0;
    for (int r = 0; r < VL_NRES; r++)
        if (pure(r, el) && w[r] > 0.0)
            w[r] -= w[r] * share;
    return kg < held ? 0.0 : kg - held;
}

void vl_written_state(const double *y, double *w)
{
    memcpy(w, y, VL_NSTATE * sizeof *w);
    double owed[VL_NELEMENTS] = {0};
    for (int r = 0; r < VL_NRES; r++)
        if (y[r] < 0.0) {
            for (int el = 0; el < VL_NELEMENTS; el++)
                owed[el] += -y[r] * vl_reservoir_element_fraction(r, el);
            w[r] = 0.0;
        }
    for (int el = 0; el < VL_NELEMENTS; el++)
        if (owed[el] > 0.0)
            take_element(w, el, owed[el]);
}

void vl_written_totals(const double *y, double out[VL_NELEMENTS])
{
    double w[VL_NSTATE];
    vl_written_state(y, w);
    vl_ledger_totals(w, out);
}

double vl_residual(const vl_run_params *rp, int el, double t0, double t1)
{
    double scale = fmax(t0, VL_RESOLUTION_SCALE * vl_element_resolution(rp, el));
    return fabs(t1 - t0) / scale;
}

void vl_guard_init(vl_guard *g, const vl_run_params *rp, const double *y0)
{
    memset(g, 0, sizeof *g);
    g->rp = *rp;
    for (int r = 0; r < VL_NRES; r++)
        g->held[r] = y0[r] > 0.0 ? y0[r] : 0.0;
    vl_ledger_totals(y0, g->raw0);
    vl_written_totals(y0, g->written0);
}

double vl_guard_dip_tolerance(const vl_guard *g, int r)
{
    return vl_reservoir_abs_tol(&g->rp, r) + g->rp.rel_tol * g->held[r];
}

/* Record the invariant broken at t_s (the message names it after the age). */
static int broken(vl_status *st, double t_s, const char *what, const char *name, double v)
{
    return vl_fail(st, VL_ERR_NUMERIC, NULL, 0, "physical invariant broken at age %.6g yr: %s%s (%.6g)",
                   t_s / VL_YR, what, name, v);
}

/* The first of n values that is not finite, or -1. */
static int first_nonfinite(const double *v, size_t n)
{
    for (size_t i = 0; i < n; i++)
        if (!isfinite(v[i]))
            return (int)i;
    return -1;
}

static const char *state_name(int i)
{
    return i < VL_NRES ? vl_reservoir_name(i) : "mantle_potential_temperature";
}

/* Dips: each reservoir's depth below zero against its tolerance (held updated first:
 * a reservoir's own past, not this point, sets the scale). The deepest, in tolerances,
 * into *worst. */
static int dips(vl_guard *g, double t_s, const double *y, double *worst, vl_status *st)
{
    *worst = 0.0;
    for (int r = 0; r < VL_NRES; r++) {
        if (y[r] > g->held[r])
            g->held[r] = y[r];
        if (y[r] >= 0.0)
            continue;
        double depth = -y[r] / vl_guard_dip_tolerance(g, r);
        if (depth > *worst)
            *worst = depth;
        if (depth > VL_DIP_TOLERANCES) {
            char what[160];
            snprintf(what, sizeof what,
                     "a reservoir below zero by more than %g times its tolerance (%.3g kg): ",
                     VL_DIP_TOLERANCES, vl_guard_dip_tolerance(g, r));
            return broken(st, t_s, what, vl_reservoir_name(r), y[r]);
        }
    }
    return VL_OK;
}

/* Residuals of every element as integrated against the start. */
static int residuals(const vl_guard *g, double t_s, const double *y, vl_status *st)
{
    double now[VL_NELEMENTS];
    vl_ledger_totals(y, now);
    for (int el = 0; el < VL_NELEMENTS; el++) {
        double res = vl_residual(&g->rp, el, g->raw0[el], now[el]);
        if (!(res <= VL_RESIDUAL_LIMIT)) {
            char what[96];
            snprintf(what, sizeof what, "conservation residual above %g of element ",
                     VL_RESIDUAL_LIMIT);
            return broken(st, t_s, what, vl_element_name(el), res);
        }
    }
    return VL_OK;
}

int vl_guard_state(vl_guard *g, double t_s, const double *y, vl_status *st)
{
    int i = first_nonfinite(y, VL_NSTATE);
    if (i >= 0)
        return broken(st, t_s, "a non-finite state: ", state_name(i), y[i]);
    double worst;
    if (dips(g, t_s, y, &worst, st) != VL_OK)
        return st->code;
    return residuals(g, t_s, y, st);
}

int vl_guard_row(vl_guard *g, double t_s, const double *y, const double *dydt,
                 const vl_env *env, const double *cols, const char *const *col_names,
                 size_t ncols, vl_status *st)
{
    int i = first_nonfinite(y, VL_NSTATE);
    if (i >= 0)
        return broken(st, t_s, "a non-finite state: ", state_name(i), y[i]);
    if ((i = first_nonfinite(dydt, VL_NSTATE)) >= 0)
        return broken(st, t_s, "a non-finite tendency: ", state_name(i), dydt[i]);
    if ((i = first_nonfinite(cols, ncols)) >= 0)
        return broken(st, t_s, "a non-finite flux column: ", col_names[i], cols[i]);
    if (!(env->t_surf_k > 0.0)) /* NaN included */
        return broken(st, t_s, "surface temperature not above 0 K", "", env->t_surf_k);
    if (!(env->p_surf_pa >= 0.0) || !isfinite(env->p_surf_pa))
        return broken(st, t_s, "surface pressure negative or not finite (Pa)", "",
                      env->p_surf_pa);
    double worst;
    if (dips(g, t_s, y, &worst, st) != VL_OK)
        return st->code;
    if (worst > g->row_dip_tol)
        g->row_dip_tol = worst;
    return residuals(g, t_s, y, st);
}

