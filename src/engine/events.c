/* events.c: the event watch of a history (integrate_internal.h). The regime is a mode
 * held fixed within a step; after every step the conditions are classified, and a
 * change of regime or a newly exhausted reservoir is located by bisection
 * (re-integrating from the step's start). */
#include <string.h>

#include "integrate_internal.h"

vl_signature vl_events_signature(const vl_ode *ode, double t, const double *y, int regime,
                                 unsigned long armed, double *cols)
{
    const vl_model *m = ode->m;
    vl_env env;
    vl_signature s = {0, 0};
    if (cols) {
        double dydt[VL_NSTATE];
        vl_model_rhs(m, ode->w, t, y, regime, dydt, cols, &env);
    } else {
        vl_model_env(m, ode->w, t, y, regime, &env);
    }
    s.regime = vl_model_classify(m, ode->w, y, &env);
    if (s.regime != regime) {
        /* take a change only to a regime consistent with itself: where the regime in force
         * calls for another that, evaluated in its own right, calls straight back (the
         * boundary moves with the regime, e.g. the ocean's CO2 uptake shifts the runaway
         * limit), keep the one in force instead of switching back and forth every
         * event tolerance (docs/model.md section 6) */
        vl_env other;
        vl_model_env(m, ode->w, t, y, s.regime, &other);
        if (vl_model_classify(m, ode->w, y, &other) == regime)
            s.regime = regime;
    }
    for (int r = 0; r < VL_NRES; r++)
        if ((armed >> r & 1UL) && y[r] < vl_reservoir_floor(r))
            s.exhausted |= 1UL << r;
    return s;
}

int vl_events_same(vl_signature sig, int regime)
{
    return sig.regime == regime && sig.exhausted == 0;
}

int vl_events_settle(const vl_ode *ode, double t, const double *y, int regime)
{
    for (int pass = 0; pass < 4; pass++) {
        vl_signature s = vl_events_signature(ode, t, y, regime, 0, NULL);
        if (s.regime == regime)
            break;
        regime = s.regime;
    }
    return regime;
}

unsigned long vl_events_rearm(const double *y, unsigned long armed)
{
    for (int r = 0; r < VL_NRES; r++)
        if (y[r] > 100.0 * vl_reservoir_floor(r))
            armed |= 1UL << r;
    return armed;
}

int vl_events_locate(const vl_ode *ode, vl_stepper *sub, double t0, const double *y0,
                     double *t1, double *y1, unsigned long armed, vl_signature *sig,
                     vl_status *st)
{
    const vl_run_params *rp = &ode->m->sc->run;
    double ta = t0, ya[VL_NSTATE], ym[VL_NSTATE];
    memcpy(ya, y0, sizeof ya);
    while (*t1 - ta > rp->event_tol_s && *t1 - ta > 1e-12 * *t1) {
        double tm = ta + 0.5 * (*t1 - ta), t = ta, h = 0.1 * (tm - ta);
        memcpy(ym, ya, sizeof ym);
        vl_stepper_reset(sub);
        int rc = vl_stepper_advance_to(sub, &t, tm, &h, ym, NULL, st);
        if (rc != VL_OK)
            return rc;
        vl_signature s = vl_events_signature(ode, tm, ym, ode->regime, armed, NULL);
        if (vl_events_same(s, ode->regime)) {
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
