/* integrate.c: one history (integrate.h), layered like a stepper driver: take a step
 * (stepper.c: CVODE, one step at a time), emit the rows of the output ages the step
 * passed from its interpolant, handle the events its root functions (events.c) found,
 * keep the run's statistics. The regime is a mode held fixed between events; at an
 * event the stepper is re-initialised, so no step straddles a discontinuity of the
 * right-hand side. */
#include "volev/integrate.h"

#include <math.h>
#include <pthread.h>
#include <signal.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include <gsl/gsl_errno.h>

#include "integrate_internal.h"
#include "volev/invariants.h"
#include "volev/reservoir.h"
#include "volev/units.h"

/* A stop request from a signal handler (vl_integrate_request_stop). */
static volatile sig_atomic_t stop_sig;

void vl_integrate_request_stop(int sig) { stop_sig = sig ? sig : -1; }

int vl_integrate_stop_signal(void) { return stop_sig; }

/* One run in progress: the model, its sink and statistics, the ODE and its stepper,
 * the state, the output ages (the next one: k), and the flux columns at the last
 * accepted point (the channel budget). */
typedef struct {
    const vl_model *m;
    const vl_run_sink *sink;
    vl_run_stats *stats;
    vl_ode *ode;
    vl_stepper *s;
    double t, y[VL_NSTATE];
    double *tout;
    size_t nout, k;
    long window_end, slow_windows; /* the stall watch */
    double window_t;
    double prev[VL_MAX_COLUMNS], now[VL_MAX_COLUMNS];
    vl_guard guard;  /* the physical invariants (invariants.h) */
    double cpu0_s;   /* the thread's CPU time at the start (the work bound) */
    double dip_restarted[VL_NRES]; /* each reservoir's dip at its last stale-dip restart,
                                      kg (0: none since it was last at or above zero) */
} runner_t;

/* CPU time of the calling thread, s (a sweep runs one member per thread). */
static double thread_cpu_s(void)
{
    struct timespec ts;
    if (clock_gettime(CLOCK_THREAD_CPUTIME_ID, &ts) != 0)
        return 0.0;
    return (double)ts.tv_sec + 1e-9 * (double)ts.tv_nsec;
}

/* Emit an output row at (t, y) under the run's regime. */
static int emit_row(runner_t *r, double t, const double *y, vl_status *st)
{
    double dydt[VL_NSTATE];
    vl_env env;
    double *cols = calloc(r->m->ncolumns ? r->m->ncolumns : 1, sizeof *cols);
    if (!cols)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    vl_model_rhs(r->m, r->ode->w, t, y, r->ode->regime, dydt, cols, &env);
    if (vl_guard_row(&r->guard, t, y, dydt, &env, cols, r->m->col_name, r->m->ncolumns, st) !=
        VL_OK) {
        free(cols);
        return st->code;
    }
    for (int i = 0; i < VL_NRES; i++)
        if (y[i] < r->stats->min_mass_kg)
            r->stats->min_mass_kg = y[i];
    r->stats->env_last = env;
    double written[VL_NSTATE]; /* the files hold no dip (invariants.h, vl_written_state) */
    vl_written_state(y, written);
    int rc = r->sink->row ? r->sink->row(r->sink->ctx, t, written, dydt, &env, cols, st) : VL_OK;
    free(cols);
    return rc;
}

static int emit_event(runner_t *r, double t, const char *name, const char *detail, vl_status *st)
{
    r->stats->events++;
    return r->sink->event ? r->sink->event(r->sink->ctx, t, name, detail, st) : VL_OK;
}

static const char *const onset_name[VL_NREGIMES] = {
    "ocean_lost", "freeze", "temperate_onset", "moist_greenhouse_onset", "runaway_onset",
    "surface_melted"};
static const char *const end_name[VL_NREGIMES] = {
    "water_returned", "thaw", "temperate_end", "moist_greenhouse_end", "runaway_end",
    "solidified"};

/* Whether the surface holds liquid water or ice in regime r (an ocean can form). */
static int has_ocean(int r)
{
    return r == VL_REGIME_FROZEN || r == VL_REGIME_TEMPERATE || r == VL_REGIME_MOIST;
}

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
    /* the steam of a molten or runaway surface rains out into an ocean */
    if (rc == VL_OK && (old == VL_REGIME_MAGMA || old == VL_REGIME_RUNAWAY) && has_ocean(new))
        rc = emit_event(r, t, "ocean_condensed", detail, st);
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

/* The time spent since t0 in the regime in force, and the trapezoid step of the channel
 * budget over the accepted step; prev becomes now. */
static void account(runner_t *r, double t0)
{
    double dt = r->t - t0;
    r->stats->time_in_regime_s[r->ode->regime] += dt;
    double dh = vl_reservoir_dh(r->y, VL_R_WATER);
    if (!isnan(dh))
        r->stats->water_dh_last = dh;
    for (size_t c = 0; c < r->m->ncolumns; c++) {
        r->stats->channel_kg[c] += 0.5 * (r->prev[c] + r->now[c]) * dt;
        r->prev[c] = r->now[c];
    }
}

/* Steps per stall window, and the windows in a row that make a stall. */
#define STALL_WINDOW 1000
#define STALL_WINDOWS 5

/* A stall: STALL_WINDOWS windows of STALL_WINDOW steps in a row, each advancing less
 * than 1e-7 of the age (a right-hand side that is not smooth at the level of the
 * tolerances holds the steps at a few days, and the run would go on for hours). */
static int stalled(runner_t *r, vl_status *st)
{
    if (r->stats->steps < r->window_end)
        return VL_OK;
    r->window_end = r->stats->steps + STALL_WINDOW;
    r->slow_windows = r->t - r->window_t < 1e-7 * r->t ? r->slow_windows + 1 : 0;
    r->window_t = r->t;
    if (r->slow_windows < STALL_WINDOWS)
        return VL_OK;
    return vl_fail(st, VL_ERR_NUMERIC, NULL, 0,
                   "integration stalled at age %.6g yr: %d steps advanced less than %.3g yr "
                   "(a right-hand side that is not smooth at the tolerances; a looser "
                   "run.abs_tolerance_kg may pass it)",
                   r->t / VL_YR, STALL_WINDOW * STALL_WINDOWS, 1e-7 * STALL_WINDOWS * r->t / VL_YR);
}

/* The run's work bound: right-hand-side evaluations (run.max_rhs_evaluations) and, when
 * set, the thread's CPU time (run.max_cpu_s): a run that stops progressing ends with a
 * message instead of holding a sweep for ever. */
static int work_bound(runner_t *r, vl_status *st)
{
    const vl_run_params *rp = &r->m->sc->run;
    if (r->ode->rhs_calls > rp->max_rhs)
        return vl_fail(st, VL_ERR_NUMERIC, NULL, 0,
                       "work bound reached: more than run.max_rhs_evaluations = %ld "
                       "right-hand-side evaluations by age %.6g yr (%ld steps; raise the "
                       "bound if the run is progressing)",
                       rp->max_rhs, r->t / VL_YR, r->stats->steps);
    if (rp->max_cpu_s > 0.0) {
        double used = thread_cpu_s() - r->cpu0_s;
        if (used > rp->max_cpu_s)
            return vl_fail(st, VL_ERR_NUMERIC, NULL, 0,
                           "work bound reached: more than run.max_cpu_s = %g s of CPU time "
                           "by age %.6g yr (%ld steps)",
                           rp->max_cpu_s, r->t / VL_YR, r->stats->steps);
    }
    return VL_OK;
}

/* One accepted step (or up to a root within it), with the stop request, the step limit,
 * the work bound and the physical invariants checked. */
static int step(runner_t *r, int *root, vl_status *st)
{
    const vl_run_params *rp = &r->m->sc->run;
    int rc = vl_stepper_step(r->s, &r->t, r->y, root, &r->stats->restarts, st);
    if (rc != VL_OK)
        return rc;
    r->stats->steps = vl_stepper_steps(r->s);
    if (stop_sig)
        return vl_fail(st, VL_ERR_STOPPED, NULL, 0, "stopped at age %.6g yr (signal %d)",
                       r->t / VL_YR, (int)stop_sig);
    if (r->stats->steps > rp->max_steps)
        return vl_fail(st, VL_ERR_NUMERIC, NULL, 0,
                       "more than run.max_steps = %ld steps by age %.6g yr", rp->max_steps,
                       r->t / VL_YR);
    if (work_bound(r, st) != VL_OK || vl_guard_state(&r->guard, r->t, r->y, st) != VL_OK)
        return st->code;
    return stalled(r, st);
}

/* The rows of every output age up to the current point, from CVODE's interpolant over
 * the last step (the age of the point itself: its state). */
static int emit_outputs(runner_t *r, vl_status *st)
{
    double yk[VL_NSTATE];
    int rc = VL_OK;
    for (; rc == VL_OK && r->k < r->nout && r->tout[r->k] <= r->t; r->k++) {
        if (r->tout[r->k] == r->t)
            rc = emit_row(r, r->t, r->y, st);
        else if ((rc = vl_stepper_dense(r->s, r->tout[r->k], yk, st)) == VL_OK)
            rc = emit_row(r, r->tout[r->k], yk, st);
    }
    return rc;
}

/* A root at the current point: account for the time up to it, log the exhausted
 * reservoirs and the regime change, emit its row and restart the stepper there under
 * the new regime. A root that calls for nothing new is passed by. */
static int handle_event(runner_t *r, double t0, vl_status *st)
{
    vl_ode *ode = r->ode;
    vl_signature s = vl_events_at(ode, r->t, r->y, r->now);
    s.exhausted |= vl_stepper_exhausted(r->s, ode->armed);
    account(r, t0);
    if (vl_events_same(s, ode->regime))
        return VL_OK;
    int rc = VL_OK;
    for (int q = 0; q < VL_NRES && rc == VL_OK; q++)
        if (s.exhausted >> q & 1UL)
            rc = emit_event(r, r->t, "reservoir_exhausted", vl_reservoir_name(q), st);
    ode->armed &= ~s.exhausted;
    if (s.regime != ode->regime && rc == VL_OK) {
        int old = ode->regime;
        ode->regime = vl_events_settle(ode, r->t, r->y, s.regime);
        ode->hold_until = r->t + r->m->sc->run.event_tol_s;
        ode->g_valid = 0;
        rc = log_regime_change(r, r->t, old, ode->regime, st);
    }
    if (rc == VL_OK)
        rc = emit_row(r, r->t, r->y, st);
    vl_events_signature(ode, r->t, r->y, ode->regime, 0, r->prev); /* the new regime's fluxes */
    if (rc == VL_OK)
        rc = vl_stepper_restart(r->s, r->t, r->y, fmax(r->m->sc->run.event_tol_s, 1e-9 * r->t),
                                st);
    return rc;
}

/* A dip the step history carries on against the reservoir's own tendency: below zero by
 * more than its tolerance, still falling along CVODE's polynomial fast enough to fall by
 * another tolerance within the run's present age, while the right-hand side there lowers
 * it at less than half that rate (or raises it). That is a Newton
 * iteration that converged falsely on a stale Jacobian: one from before the reservoir
 * emptied, stiff in it (a sink with a lifetime of days), makes the corrections of its
 * component vanishingly small, so the steps follow the predictor's slope and the dip
 * grows for as long as the Jacobian is kept (campaign seed 1 member 12: atm_o2 fell at a
 * steady 4.8e-8 kg/s for a gigayear after H2 had oxidised it, to -1.7e9 kg, while its
 * tendency was +4e-14 kg/s; issue 18). The stepper restarts there, as after an event: a
 * fresh history and Jacobian, from which the dip follows its tendency. Rare (only with a
 * reservoir that deep below zero) and one evaluation to tell. Once restarted for a dip,
 * a reservoir restarts the stepper again only when it has sunk to twice that depth
 * (until it is back at zero or above): a dip that only hovers at its tolerance, where
 * nothing refills it, restarted the stepper every four steps, each time from a trial step
 * of a year, and a dry 0.08-Earth-mass planet (campaign seed 3 member 6: H2 at -1e3 kg,
 * its source and sink of 1e-6 kg/s switched by water crossing zero) took 2e6 evaluations
 * to reach 641 Myr. The doubling still bounds the dip: ten restarts span the invariant's
 * thousand tolerances. */
static int stale_dip(runner_t *r, vl_status *st)
{
    int deep = 0;
    for (int q = 0; q < VL_NRES; q++) {
        if (r->y[q] >= 0.0)
            r->dip_restarted[q] = 0.0;
        deep |= r->y[q] < -vl_guard_dip_tolerance(&r->guard, q);
    }
    if (!deep)
        return VL_OK;
    double slope[VL_NSTATE], f[VL_NSTATE];
    if (vl_stepper_slope(r->s, r->t, slope, st) != VL_OK)
        return st->code;
    r->ode->rhs_calls++;
    vl_model_rhs(r->m, r->ode->w, r->t, r->y, r->ode->regime, f, NULL, NULL);
    for (int q = 0; q < VL_NRES; q++) {
        double tol = vl_guard_dip_tolerance(&r->guard, q);
        if (r->y[q] < -tol && r->y[q] < 2.0 * r->dip_restarted[q] && -slope[q] * r->t > tol &&
            f[q] > 0.5 * slope[q]) {
            r->dip_restarted[q] = r->y[q];
            r->stats->restarts++;
            return vl_stepper_restart(r->s, r->t, r->y,
                                      fmax(r->m->sc->run.event_tol_s, 1e-9 * r->t), st);
        }
    }
    return VL_OK;
}

/* Step to the run's end: rows at the output ages in passing, events at the roots. */
static int advance(runner_t *r, vl_status *st)
{
    int rc = VL_OK;
    while (rc == VL_OK && r->t < r->m->sc->run.end_s) {
        double t0 = r->t;
        int root = 0;
        rc = step(r, &root, st);
        if (rc == VL_OK)
            rc = emit_outputs(r, st);
        if (rc != VL_OK)
            break;
        if (root) {
            rc = handle_event(r, t0, st);
        } else {
            vl_events_at(r->ode, r->t, r->y, r->now);
            account(r, t0);
            rc = stale_dip(r, st);
        }
    }
    return rc;
}

/* The history from the initial state at run.start to run.end. */
static int run_loop(runner_t *r, vl_status *st)
{
    const vl_run_params *rp = &r->m->sc->run;
    if (!(r->tout = output_times(rp, &r->nout)))
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    r->k = 1;
    r->t = rp->start_s;
    vl_model_initial_state(r->m, r->y);
    vl_guard_init(&r->guard, rp, r->y);
    r->cpu0_s = thread_cpu_s();
    vl_ledger_totals(r->y, r->stats->totals0);
    vl_redox_pools(r->y, &r->stats->redox0);
    r->ode->regime = vl_events_settle(r->ode, r->t, r->y, VL_REGIME_TEMPERATE);
    r->ode->armed = vl_events_rearm(r->y, 0);
    r->ode->hold_until = r->t;
    int rc = emit_event(r, r->t, "start", vl_regime_name(r->ode->regime), st);
    if (rc == VL_OK)
        rc = emit_row(r, r->t, r->y, st);
    vl_events_signature(r->ode, r->t, r->y, r->ode->regime, 0, r->prev);
    if (rc == VL_OK)
        rc = vl_stepper_init(r->s, r->ode, rp, r->t, r->y, st);
    if (rc == VL_OK)
        rc = advance(r, st);
    if (rc == VL_OK)
        rc = emit_event(r, r->t, "end", vl_regime_name(r->ode->regime), st);
    if (r->s->cv)
        r->stats->jacobians = vl_stepper_jacobians(r->s);
    vl_stepper_free(r->s);
    vl_written_state(r->y, r->stats->y_final); /* as the files hold it */
    vl_ledger_totals(r->y, r->stats->totals1);
    vl_written_totals(r->y, r->stats->written1);
    r->stats->overshoot_tolerances = r->guard.row_dip_tol;
    vl_redox_pools(r->y, &r->stats->redox1);
    free(r->tout);
    return rc;
}

/* The run with its workspace in place (vl_integrate owns it). */
static int run_with(const vl_model *m, vl_ode *ode, const vl_run_sink *sink,
                    vl_run_stats *stats, vl_status *st)
{
    vl_stepper s = {0};
    int rc;
    if (!(ode->w = vl_work_new(m, st))) {
        rc = st->code;
    } else {
        runner_t *r = calloc(1, sizeof *r);
        if (!r) {
            rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
        } else {
            *r = (runner_t){.m = m, .sink = sink, .stats = stats, .ode = ode, .s = &s};
            rc = run_loop(r, st);
            free(r);
        }
        vl_climate_work_stats(vl_work_climate(ode->w), &stats->climate_nodes,
                              &stats->climate_build_s);
        vl_work_free(ode->w);
    }
    return rc;
}

/* Errors come back as return codes; GSL's default handler (for the roots and
 * interpolation of the physics) would abort. */
static void gsl_quiet(void) { gsl_set_error_handler_off(); }

int vl_integrate(const vl_model *m, const vl_run_sink *sink, vl_run_stats *stats, vl_status *st)
{
    struct timespec w0, w1;
    clock_gettime(CLOCK_MONOTONIC, &w0);
    static pthread_once_t quiet = PTHREAD_ONCE_INIT; /* GSL's handler is process-wide */
    pthread_once(&quiet, gsl_quiet);
    memset(stats, 0, sizeof *stats);
    stats->min_mass_kg = HUGE_VAL;
    if (m->ncolumns > VL_MAX_COLUMNS)
        return vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "more than %d output columns", VL_MAX_COLUMNS);
    vl_ode *ode = calloc(1, sizeof *ode);
    int rc;
    if (!ode) {
        rc = vl_fail(st, VL_ERR_INTERNAL, NULL, 0, "out of memory");
    } else {
        ode->m = m;
        rc = run_with(m, ode, sink, stats, st);
        stats->rhs_calls = ode->rhs_calls;
    }
    free(ode);
    clock_gettime(CLOCK_MONOTONIC, &w1);
    stats->wall_s = (double)(w1.tv_sec - w0.tv_sec) + 1e-9 * (double)(w1.tv_nsec - w0.tv_nsec);
    return rc;
}
