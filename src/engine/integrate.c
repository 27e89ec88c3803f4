/* integrate.c: one history with GSL's multistep BDF stepper (gsl_odeiv2_step_msbdf,
 * stiff-capable) and a finite-difference Jacobian. The regime is a mode held fixed
 * within a step; after every step the conditions are classified, and a change of
 * regime or a newly exhausted reservoir is located by bisection (re-integrating from
 * the step's start), logged as an event, and the stepper is reset there, so no step
 * straddles a discontinuity of the right-hand side. */
#include "volev/integrate.h"

#include <float.h>
#include <pthread.h>
#include <signal.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_odeiv2.h>

#include "volev/units.h"

/* A stop request from a signal handler (vl_integrate_request_stop). */
static volatile sig_atomic_t stop_sig;

void vl_integrate_request_stop(int sig) { stop_sig = sig ? sig : -1; }

int vl_integrate_stop_signal(void) { return stop_sig; }


typedef struct {
    const vl_model *m;
    vl_work *w;                /* the run's workspace */
    int regime;
    long rhs_calls;
    double f0[VL_NRES], f1[VL_NRES], yt[VL_NRES];
} ctx_t;

static int all_finite(const double *v, size_t n)
{
    for (size_t i = 0; i < n; i++)
        if (!isfinite(v[i]))
            return 0;
    return 1;
}

static int rhs(double t, const double y[], double f[], void *pv)
{
    ctx_t *c = pv;
    c->rhs_calls++;
    vl_model_rhs(c->m, c->w, t, y, c->regime, f, NULL, NULL);
    return all_finite(f, VL_NRES) ? GSL_SUCCESS : GSL_EBADFUNC;
}

/* Forward-difference Jacobian; increments scale with each reservoir's floor band. */
static int jac(double t, const double y[], double *dfdy, double dfdt[], void *pv)
{
    ctx_t *c = pv;
    double sq = sqrt(DBL_EPSILON);
    if (rhs(t, y, c->f0, c) != GSL_SUCCESS)
        return GSL_EBADFUNC;
    memcpy(c->yt, y, sizeof c->yt);
    for (int j = 0; j < VL_NRES; j++) {
        if (j >= VL_R_SPACE_H && j <= VL_R_SPACE_D) { /* no process reads space */
            for (int i = 0; i < VL_NRES; i++)
                dfdy[i * VL_NRES + j] = 0.0;
            continue;
        }
        double h = sq * fmax(fabs(y[j]), vl_reservoir_floor(j));
        c->yt[j] = y[j] + h;
        if (rhs(t, c->yt, c->f1, c) != GSL_SUCCESS)
            return GSL_EBADFUNC;
        c->yt[j] = y[j];
        for (int i = 0; i < VL_NRES; i++)
            dfdy[i * VL_NRES + j] = (c->f1[i] - c->f0[i]) / h;
    }
    /* backward in time, so a tabulated star is never asked beyond the run's end */
    double ht = sq * fmax(fabs(t), VL_YR);
    if (rhs(t - ht, y, c->f1, c) != GSL_SUCCESS)
        return GSL_EBADFUNC;
    for (int i = 0; i < VL_NRES; i++)
        dfdt[i] = (c->f0[i] - c->f1[i]) / ht;
    return GSL_SUCCESS;
}

/* An integrator: a GSL driver owning step, control and evolve (msbdf reaches its
 * control through the driver, so one is needed even when stepping by hand). */
typedef struct {
    gsl_odeiv2_system sys;
    gsl_odeiv2_driver *drv;
    gsl_odeiv2_step *step;
    gsl_odeiv2_control *ctrl;
    gsl_odeiv2_evolve *ev;
} stepper_t;

static int stepper_init(stepper_t *s, ctx_t *c, const vl_run_params *rp)
{
    double scale[VL_NRES];
    for (int i = 0; i < VL_NRES; i++)
        scale[i] = vl_reservoir_floor(i) / 1e3;
    s->sys = (gsl_odeiv2_system){rhs, jac, VL_NRES, c};
    s->drv = gsl_odeiv2_driver_alloc_scaled_new(&s->sys, gsl_odeiv2_step_msbdf, VL_YR,
                                                rp->abs_tol_kg, rp->rel_tol, 1.0, 0.0, scale);
    if (!s->drv)
        return 0;
    s->step = s->drv->s;
    s->ctrl = s->drv->c;
    s->ev = s->drv->e;
    return 1;
}

static void stepper_free(stepper_t *s)
{
    if (s->drv)
        gsl_odeiv2_driver_free(s->drv);
}

static void stepper_reset(stepper_t *s)
{
    gsl_odeiv2_evolve_reset(s->ev);
    gsl_odeiv2_step_reset(s->step);
}

/* Advance (t, y) to exactly t1 under the current regime. */
static int advance_to(stepper_t *s, double *t, double t1, double *h, double *y, long *steps,
                      vl_status *st)
{
    while (*t < t1) {
        int rc = gsl_odeiv2_evolve_apply(s->ev, s->ctrl, s->step, s->drv->sys, t, t1, h, y);
        if (rc != GSL_SUCCESS || !all_finite(y, VL_NRES))
            return vl_fail(st, VL_ERR_NUMERIC, NULL, 0,
                           "integration failed at age %.6g yr: %s", *t / VL_YR,
                           rc != GSL_SUCCESS ? gsl_strerror(rc) : "non-finite state");
        if (steps)
            (*steps)++;
    }
    return VL_OK;
}

/* What the integrator watches for: the regime the conditions call for and the set of
 * reservoirs newly below their floor. */
typedef struct {
    int regime;
    unsigned long exhausted; /* bit r: reservoir r below its floor and armed */
} signature_t;

/* The signature at (t, y); with cols (m->ncolumns) also the process flux columns. */
static signature_t signature(const vl_model *m, vl_work *w, double t, const double *y, int regime,
                             unsigned long armed, double *cols)
{
    vl_env env;
    signature_t s = {0, 0};
    if (cols) {
        double dydt[VL_NRES];
        vl_model_rhs(m, w, t, y, regime, dydt, cols, &env);
    } else {
        vl_model_env(m, w, t, y, regime, &env);
    }
    s.regime = vl_model_classify(m, w, y, &env);
    if (s.regime != regime) {
        /* take a change only to a regime consistent with itself: where the regime in force
         * calls for another that, evaluated in its own right, calls straight back (the
         * boundary moves with the regime, e.g. the ocean's CO2 uptake shifts the runaway
         * limit), keep the one in force instead of switching back and forth every
         * event tolerance (docs/model.md section 6) */
        vl_env other;
        vl_model_env(m, w, t, y, s.regime, &other);
        if (vl_model_classify(m, w, y, &other) == regime)
            s.regime = regime;
    }
    for (int r = 0; r < VL_NRES; r++)
        if ((armed >> r & 1UL) && y[r] < vl_reservoir_floor(r))
            s.exhausted |= 1UL << r;
    return s;
}

static int same(signature_t a, int regime)
{
    return a.regime == regime && a.exhausted == 0;
}

typedef struct {
    const vl_model *m;
    const vl_run_sink *sink;
    vl_run_stats *stats;
    ctx_t *c;
} runner_t;

/* Emit an output row at (t, y) under the context's regime. */
static int emit_row(runner_t *r, double t, const double *y, vl_status *st)
{
    double dydt[VL_NRES];
    vl_env env;
    double *cols = calloc(r->m->ncolumns ? r->m->ncolumns : 1, sizeof *cols);
    if (!cols)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    vl_model_rhs(r->m, r->c->w, t, y, r->c->regime, dydt, cols, &env);
    for (int i = 0; i < VL_NRES; i++)
        if (y[i] < r->stats->min_mass_kg)
            r->stats->min_mass_kg = y[i];
    r->stats->env_last = env;
    int rc = r->sink->row ? r->sink->row(r->sink->ctx, t, y, dydt, &env, cols, st) : VL_OK;
    free(cols);
    return rc;
}

static int emit_event(runner_t *r, double t, const char *name, const char *detail, vl_status *st)
{
    r->stats->events++;
    return r->sink->event ? r->sink->event(r->sink->ctx, t, name, detail, st) : VL_OK;
}

static const char *const onset_name[VL_NREGIMES] = {
    "ocean_lost", "freeze", "temperate_onset", "moist_greenhouse_onset", "runaway_onset"};
static const char *const end_name[VL_NREGIMES] = {
    "water_returned", "thaw", "temperate_end", "moist_greenhouse_end", "runaway_end"};

/* Log the regime change old -> new: the end of the old regime, then the new one's onset
 * (temperate has no named onset or end: it is the reference state). */
static int log_regime_change(runner_t *r, double t, int old, int new, vl_status *st)
{
    char detail[128];
    snprintf(detail, sizeof detail, "%s -> %s", vl_regime_name(old), vl_regime_name(new));
    int rc = VL_OK;
    if (old != VL_REGIME_TEMPERATE)
        rc = emit_event(r, t, end_name[old], detail, st);
    if (rc == VL_OK && new != VL_REGIME_TEMPERATE)
        rc = emit_event(r, t, onset_name[new], detail, st);
    return rc;
}

/* Output ages: log-spaced and linear in age between start and end, merged, unique. */
static double *output_times(const vl_run_params *rp, size_t *n)
{
    size_t nl = (size_t)rp->log_points, nn = (size_t)rp->linear_points;
    double *t = malloc((nl + nn + 2) * sizeof *t);
    if (!t)
        return NULL;
    size_t k = 0;
    t[k++] = rp->start_s;
    for (size_t i = 1; i <= nl; i++)
        t[k++] = rp->start_s * pow(rp->end_s / rp->start_s, (double)i / (double)nl);
    for (size_t i = 1; i <= nn; i++)
        t[k++] = rp->start_s + (rp->end_s - rp->start_s) * (double)i / (double)nn;
    t[k++] = rp->end_s;
    for (size_t i = 1; i < k; i++) /* insertion sort: k is small */
        for (size_t j = i; j > 0 && t[j - 1] > t[j]; j--) {
            double tmp = t[j];
            t[j] = t[j - 1];
            t[j - 1] = tmp;
        }
    size_t u = 0;
    for (size_t i = 0; i < k; i++) {
        if (t[i] > rp->end_s)
            t[i] = rp->end_s;
        if (u == 0 || t[i] > t[u - 1] * (1.0 + 1e-12))
            t[u++] = t[i];
    }
    t[u - 1] = rp->end_s;
    *n = u;
    return t;
}

/* Locate the first time in (t0, t1] where the signature departs from the regime,
 * by bisection with re-integration from (t0, y0). On return (t1, y1) is the located
 * point (just after the change) and *sig its signature. */
static int locate(runner_t *r, stepper_t *sub, double t0, const double *y0, double *t1,
                  double *y1, unsigned long armed, signature_t *sig, vl_status *st)
{
    const vl_run_params *rp = &r->m->sc->run;
    double ta = t0, ya[VL_NRES], ym[VL_NRES];
    memcpy(ya, y0, sizeof ya);
    while (*t1 - ta > rp->event_tol_s && *t1 - ta > 1e-12 * *t1) {
        double tm = ta + 0.5 * (*t1 - ta), t = ta, h = 0.1 * (tm - ta);
        memcpy(ym, ya, sizeof ym);
        stepper_reset(sub);
        int rc = advance_to(sub, &t, tm, &h, ym, NULL, st);
        if (rc != VL_OK)
            return rc;
        signature_t s = signature(r->m, r->c->w, tm, ym, r->c->regime, armed, NULL);
        if (same(s, r->c->regime)) {
            ta = tm;
            memcpy(ya, ym, sizeof ya);
        } else {
            *t1 = tm;
            memcpy(y1, ym, sizeof ym);
            *sig = s;
        }
    }
    return VL_OK;
}

/* Settle the regime at (t, y): classify until it no longer changes (at most 4 passes). */
static int settle_regime(const vl_model *m, vl_work *w, double t, const double *y, int regime)
{
    for (int pass = 0; pass < 4; pass++) {
        signature_t s = signature(m, w, t, y, regime, 0, NULL);
        if (s.regime == regime)
            break;
        regime = s.regime;
    }
    return regime;
}

/* Trapezoid step of the channel budget; prev becomes now. */
static void accumulate(vl_run_stats *s, size_t n, double *prev, const double *now, double dt)
{
    for (size_t c = 0; c < n; c++) {
        s->channel_kg[c] += 0.5 * (prev[c] + now[c]) * dt;
        prev[c] = now[c];
    }
}

/* Reservoirs worth watching for exhaustion: those well above their floor at the start.
 * Each is logged once: a trace species hovering near empty would otherwise fill the
 * event log. */
static unsigned long rearm(const double *y, unsigned long armed)
{
    for (int r = 0; r < VL_NRES; r++)
        if (y[r] > 100.0 * vl_reservoir_floor(r))
            armed |= 1UL << r;
    return armed;
}

static int run_loop(runner_t *r, stepper_t *main_s, stepper_t *sub, vl_status *st)
{
    const vl_model *m = r->m;
    const vl_run_params *rp = &m->sc->run;
    size_t nout;
    double *tout = output_times(rp, &nout);
    if (!tout)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    double y[VL_NRES], y0[VL_NRES], t = rp->start_s;
    vl_model_initial_state(m, y);
    vl_ledger_totals(y, r->stats->totals0);
    r->c->regime = settle_regime(m, r->c->w, t, y, VL_REGIME_TEMPERATE);
    unsigned long armed = rearm(y, 0);
    int rc = emit_event(r, t, "start", vl_regime_name(r->c->regime), st);
    if (rc == VL_OK)
        rc = emit_row(r, t, y, st);
    double h = fmin(1e3 * VL_YR, 1e-3 * (rp->end_s - rp->start_s));
    /* flux columns at the last accepted point, for the channel budget */
    double prev[VL_MAX_COLUMNS], now[VL_MAX_COLUMNS];
    signature(m, r->c->w, t, y, r->c->regime, 0, prev);
    for (size_t k = 1; k < nout && rc == VL_OK; k++) {
        while (t < tout[k] && rc == VL_OK) {
            double t0 = t;
            memcpy(y0, y, sizeof y0);
            rc = gsl_odeiv2_evolve_apply(main_s->ev, main_s->ctrl, main_s->step, main_s->drv->sys,
                                         &t, tout[k], &h, y);
            /* a stiff drain reaching a reservoir's floor can stall the Newton iteration
             * on a stale Jacobian: restart the stepper (fresh Jacobian, first order)
             * from the last accepted point with a smaller step, a few times */
            for (int retry = 0; retry < 8 && (rc != GSL_SUCCESS || !all_finite(y, VL_NRES));
                 retry++) {
                t = t0;
                memcpy(y, y0, sizeof y0);
                stepper_reset(main_s);
                h = fmax(h, 1.0) * 1e-2;
                r->stats->restarts++;
                rc = gsl_odeiv2_evolve_apply(main_s->ev, main_s->ctrl, main_s->step,
                                             main_s->drv->sys, &t, tout[k], &h, y);
            }
            if (rc != GSL_SUCCESS || !all_finite(y, VL_NRES)) {
                rc = vl_fail(st, VL_ERR_NUMERIC, NULL, 0, "integration failed at age %.6g yr: %s",
                             t0 / VL_YR, rc != GSL_SUCCESS ? gsl_strerror(rc) : "non-finite state");
                break;
            }
            if (stop_sig) {
                rc = vl_fail(st, VL_ERR_STOPPED, NULL, 0, "stopped at age %.6g yr (signal %d)",
                             t / VL_YR, (int)stop_sig);
                break;
            }
            if (++r->stats->steps > rp->max_steps) {
                rc = vl_fail(st, VL_ERR_NUMERIC, NULL, 0,
                             "more than run.max_steps = %ld steps by age %.6g yr", rp->max_steps,
                             t / VL_YR);
                break;
            }
            signature_t s = signature(m, r->c->w, t, y, r->c->regime, armed, now);
            if (!same(s, r->c->regime)) {
                rc = locate(r, sub, t0, y0, &t, y, armed, &s, st);
                if (rc != VL_OK)
                    break;
                r->stats->time_in_regime_s[r->c->regime] += t - t0;
                signature(m, r->c->w, t, y, r->c->regime, 0, now);
                accumulate(r->stats, m->ncolumns, prev, now, t - t0);
                for (int q = 0; q < VL_NRES && rc == VL_OK; q++)
                    if (s.exhausted >> q & 1UL)
                        rc = emit_event(r, t, "reservoir_exhausted", vl_reservoir_name(q), st);
                armed &= ~s.exhausted;
                if (s.regime != r->c->regime && rc == VL_OK) {
                    int old = r->c->regime;
                    r->c->regime = settle_regime(m, r->c->w, t, y, s.regime);
                    rc = log_regime_change(r, t, old, r->c->regime, st);
                }
                if (rc == VL_OK)
                    rc = emit_row(r, t, y, st);
                signature(m, r->c->w, t, y, r->c->regime, 0, prev); /* the new regime's fluxes */
                stepper_reset(main_s);
                h = fmax(rp->event_tol_s, 1e-9 * t);
            } else {
                r->stats->time_in_regime_s[r->c->regime] += t - t0;
                accumulate(r->stats, m->ncolumns, prev, now, t - t0);
            }
        }
        if (rc == VL_OK && t >= tout[k])
            rc = emit_row(r, t, y, st);
    }
    if (rc == VL_OK)
        rc = emit_event(r, t, "end", vl_regime_name(r->c->regime), st);
    memcpy(r->stats->y_final, y, sizeof y);
    vl_ledger_totals(y, r->stats->totals1);
    free(tout);
    return rc;
}

/* Errors come back as return codes; GSL's default handler would abort. */
static void gsl_quiet(void) { gsl_set_error_handler_off(); }

int vl_integrate(const vl_model *m, const vl_run_sink *sink, vl_run_stats *stats, vl_status *st)
{
    struct timespec w0, w1;
    clock_gettime(CLOCK_MONOTONIC, &w0);
    static pthread_once_t quiet = PTHREAD_ONCE_INIT; /* GSL's handler is process-wide */
    pthread_once(&quiet, gsl_quiet);
    memset(stats, 0, sizeof *stats);
    stats->min_mass_kg = HUGE_VAL;
    ctx_t *c = calloc(1, sizeof *c);
    stepper_t main_s = {0}, sub = {0};
    int rc;
    if (m->ncolumns > VL_MAX_COLUMNS) {
        free(c);
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "more than %d flux columns", VL_MAX_COLUMNS);
    }
    if (!c || !stepper_init(&main_s, c, &m->sc->run) || !stepper_init(&sub, c, &m->sc->run)) {
        rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    } else if (!(c->w = vl_work_new(m, st))) {
        rc = st->code;
    } else {
        c->m = m;
        runner_t r = {m, sink, stats, c};
        rc = run_loop(&r, &main_s, &sub, st);
        vl_climate_work_stats(vl_work_climate(c->w), &stats->climate_nodes,
                              &stats->climate_build_s);
        vl_work_free(c->w);
    }
    stats->rhs_calls = c ? c->rhs_calls : 0;
    stepper_free(&main_s);
    stepper_free(&sub);
    free(c);
    clock_gettime(CLOCK_MONOTONIC, &w1);
    stats->wall_s = (double)(w1.tv_sec - w0.tv_sec) + 1e-9 * (double)(w1.tv_nsec - w0.tv_nsec);
    return rc;
}
